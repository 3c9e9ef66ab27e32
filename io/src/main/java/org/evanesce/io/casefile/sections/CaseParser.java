package org.evanesce.io.casefile.sections;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.dispersion.WavelengthBand;
import org.evanesce.io.casefile.sections.Context.Expect;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Quantity;
import org.evanesce.io.casefile.expr.Suggest;
import org.evanesce.io.casefile.expr.Units;
import org.evanesce.io.casefile.model.BoundarySpec;
import org.evanesce.io.casefile.model.DomainSpec;
import org.evanesce.io.casefile.model.FluxSpec;
import org.evanesce.io.casefile.model.GridRequest;
import org.evanesce.io.casefile.model.LibraryMaterial;
import org.evanesce.io.casefile.model.MapsSpec;
import org.evanesce.io.casefile.model.MaterialSpec;
import org.evanesce.io.casefile.model.NumericsSpec;
import org.evanesce.io.casefile.model.OutputSpec;
import org.evanesce.io.casefile.model.PolarizationChoice;
import org.evanesce.io.casefile.model.Point;
import org.evanesce.io.casefile.model.ProbeSpec;
import org.evanesce.io.casefile.model.ShapeSpec;
import org.evanesce.io.casefile.model.SignalSpec;
import org.evanesce.io.casefile.model.SourceSpec;
import org.evanesce.io.casefile.model.StopSpec;
import org.evanesce.io.casefile.model.SurfacesSpec;
import org.evanesce.io.casefile.model.SweepSpec;
import org.evanesce.io.casefile.text.Located;
import org.evanesce.io.casefile.text.Scalar;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.text.Value;
import org.evanesce.solver.grid.Courant;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;
import org.snakeyaml.engine.v2.nodes.MappingNode;
import org.snakeyaml.engine.v2.nodes.Node;
import org.snakeyaml.engine.v2.nodes.ScalarNode;

/**
 * Walks a composed case file section by section into the spec records. Problems are collected in
 * the {@link Context}; a part that could not be read stays null and the readers that need it skip
 * it, so every independent problem in the sections is still found. {@link Sections} assembles the
 * finished spec; the cross-section checks run on that, never on this class's state.
 */
final class CaseParser {

    /** A Courant number below this gets a warning: the steps multiply for no useful gain in accuracy. */
    static final double SMALL_COURANT = 0.05;
    /** PML thickness when a side says just {@code pml}, in cells. */
    static final int DEFAULT_PML_CELLS = 16;

    private static final Map<String, Precision> PRECISIONS = ordered("float", Precision.FLOAT, "double", Precision.DOUBLE);
    private static final Map<String, Component> COMPONENTS = new LinkedHashMap<>();

    static {
        for (Component c : Component.values()) {
            COMPONENTS.put(c.name().toLowerCase(Locale.ROOT), c);
        }
    }

    private final Context ctx;
    private final ShapeReader shapeReader;
    private final SignalReader signalReader;

    // the parts read so far; null when missing or wrong
    String title;
    Polarization polarization;
    SourcePosition polarizationAt;
    /** s, p or both; {@link #polarization} is the first run's (s for both). */
    PolarizationChoice polarizationChoice;
    Value designWavelength;
    DomainSpec domain;
    final Map<String, MaterialSpec> defined = new LinkedHashMap<>();
    final Map<String, MaterialSpec> used = new LinkedHashMap<>();
    boolean materialsComplete = true;
    /** Names whose definitions failed: references to them are not reported again. */
    final Set<String> failedMaterials = new HashSet<>();
    /** False when the materials section is not a mapping at all, so no reference can be checked. */
    boolean materialsReadable = true;
    final List<ShapeSpec> shapes = new ArrayList<>();
    final List<String> shapePaths = new ArrayList<>();
    boolean shapesComplete = true;
    GridRequest grid;
    /** The resolution as written is multiplied by this (an accuracy study's finer levels); 1 normally. */
    double resolutionScale = 1;
    /** The grid's nodes are moved by this fraction of a cell (an accuracy study's offset runs); 0 normally. */
    double gridOffset;
    SourcePosition resolutionAt;
    final Map<Side, BoundarySpec> boundaries = new EnumMap<>(Side.class);
    final List<SourceSpec> sources = new ArrayList<>();
    final List<String> sourcePaths = new ArrayList<>();
    boolean sourcesComplete = true;
    final List<ProbeSpec> probes = new ArrayList<>();
    final List<String> probePaths = new ArrayList<>();
    final Map<Side, String> boundaryPaths = new EnumMap<>(Side.class);
    FluxSpec flux;
    SurfacesSpec surfaces;
    MapsSpec maps;
    boolean mapsFailed;
    OutputSpec output;
    StopSpec stop;
    NumericsSpec numerics;
    SweepSpec sweep;

    CaseParser(Context ctx) {
        this.ctx = ctx;
        this.shapeReader = new ShapeReader(ctx, materialPaths);
        this.signalReader = new SignalReader(ctx);
    }

    /** The polarization as the file has it, or as {@code --set polarization=VALUE} replaces it. */
    private void readPolarization(Node pol, String set) {
        if (set == null) {
            polarizationChoice = ctx.choice(pol, "polarization", PolarizationChoice.BY_NAME);
            polarizationAt = ctx.pos(pol);
        } else {
            polarizationAt = SourcePosition.commandLine(PolarizationChoice.KEY, set);
            polarizationChoice = PolarizationChoice.of(set);
            if (polarizationChoice == null) {
                ctx.error(polarizationAt, "polarization", "unknown choice '" + Suggest.shown(set.strip()) + "'"
                        + Suggest.didYouMean(set.strip(), PolarizationChoice.BY_NAME.keySet()) + ", expected one of "
                        + String.join(", ", PolarizationChoice.BY_NAME.keySet()));
            }
        }
        polarization = polarizationChoice == null ? null : polarizationChoice.runs().get(0);
    }

    private static <T> Map<String, T> ordered(Object... kv) {
        Map<String, T> m = new LinkedHashMap<>();
        for (int k = 0; k < kv.length; k += 2) {
            @SuppressWarnings("unchecked")
            T v = (T) kv[k + 1];
            m.put((String) kv[k], v);
        }
        return m;
    }

    void parse(Node root, Map<String, String> overrides) {
        SweepReader sweepReader = new SweepReader(ctx);
        MapView top = MapView.of(ctx, sweepReader.take(root), Schema.ROOT, "", ctx.pos(root));
        if (top == null) {
            return;
        }
        Node t = top.get("title");
        if (t != null) {
            title = ctx.text(t, "title");
        }
        // --set polarization=VALUE replaces the key's value; every other override is a parameter's
        Map<String, String> parameterOverrides = new LinkedHashMap<>(overrides);
        String polarizationSet = parameterOverrides.remove(PolarizationChoice.KEY);
        ctx.parameters.read(top.get("parameters"), parameterOverrides);
        sweep = sweepReader.read();

        Node pol = top.require("polarization", "s (Ez, Hx, Hy), p (Hz, Ex, Ey) or both (an s run and a p run)");
        if (pol != null) {
            readPolarization(pol, polarizationSet);
        }
        readSources(top.require("sources", "a list of sources"));
        readDesignWavelength(top);
        // flux and maps before the materials: a metal's model is checked (or fitted) over the run's band
        flux = new FluxReader(ctx).read(top.get("flux"), top.has("flux") ? top.keyAt("flux") : top.at(), centreFrequency());
        maps = new OutputReader(ctx).readMaps(top.get("maps"), top.has("maps") ? top.keyAt("maps") : top.at(), centreFrequency());
        mapsFailed = top.has("maps") && maps == null;
        readMaterials(top.get("materials"));
        Node d = top.require("domain", "a mapping with width and height");
        if (d != null) {
            readDomain(MapView.of(ctx, d, Schema.DOMAIN, "domain", top.keyAt("domain")));
        }
        readShapes(top.get("shapes"));
        resolveUsedMaterials();
        Node r = top.require("grid", "a mapping with cell or cells_per_wavelength");
        if (r != null) {
            resolutionAt = top.keyAt("grid");
            readResolution(MapView.of(ctx, r, Schema.GRID, "grid", resolutionAt));
        }
        readBoundaries(top.get("boundaries"), top.has("boundaries") ? top.keyAt("boundaries") : top.at());
        readProbes(top.get("probes"));
        surfaces = new SurfacesReader(ctx).read(top.get("surfaces"), top.has("surfaces") ? top.keyAt("surfaces") : top.at(),
                centreFrequency(), sources.stream().anyMatch(x -> x instanceof SourceSpec.Launched
                        || x instanceof SourceSpec.PlaneWaveBox));
        Node o = top.get("output");
        readOutput(o == null ? null : MapView.of(ctx, o, Schema.OUTPUT, "output", top.keyAt("output")));
        Node s = top.require("until", "a mapping with time, steps or latest (and energy_below)");
        if (s != null) {
            readUntil(MapView.of(ctx, s, Schema.UNTIL, "until", top.keyAt("until")));
        }
        Node n = top.get("numerics");
        readNumerics(n == null ? null : MapView.of(ctx, n, Schema.NUMERICS, "numerics", top.keyAt("numerics")), top.at());
    }

    // ---------------------------------------------------------------- design wavelength

    private void readDesignWavelength(MapView top) {
        String key = top.oneOf(true, "design_wavelength", "design_frequency");
        Node wl = top.get("design_wavelength");
        Node fr = top.get("design_frequency");
        if (key == null && (wl != null || fr != null)) {
            return; // both given: reported
        }
        if (wl != null) {
            designWavelength = ctx.positive(wl, "design_wavelength", Expect.LENGTH);
        } else if (fr != null) {
            Value f = ctx.positive(fr, "design_frequency", Expect.FREQUENCY);
            designWavelength = f == null ? null : new Value(PhysicalConstants.C0 / f.si(), f.at());
            if (designWavelength != null && Double.isInfinite(designWavelength.si())) {
                ctx.error(f.at(), "design_frequency", Units.format(f.si(), Dimension.FREQUENCY) + " gives a wavelength too large "
                        + "for a number; expected an optical frequency");
                designWavelength = null;
            }
        } else if (!sources.isEmpty() && sourcesComplete) {
            SignalSpec first = sources.get(0).signal();
            designWavelength = new Value(first.wavelength(), first.frequency().at());
            ctx.note(first.frequency().at(), "design_wavelength", "not given; materials are evaluated and cells counted at "
                    + Units.format(designWavelength.si(), Dimension.LENGTH) + ", the first source's wavelength");
        }
    }

    // ---------------------------------------------------------------- materials

    private void readMaterials(Node node) {
        if (node == null || Context.isNull(node)) {
            return;
        }
        if (!(node instanceof MappingNode m)) {
            ctx.error(ctx.pos(node), "materials", "expected a mapping of names to materials such as 'film: {index: 1.38}', got "
                    + Context.describe(node));
            materialsComplete = false;
            materialsReadable = false;
            return;
        }
        for (var t : m.getValue()) {
            String name = MapView.keyText(ctx, t.getKeyNode(), "materials");
            if (name == null) {
                materialsComplete = false;
                continue;
            }
            SourcePosition at = ctx.pos(t.getKeyNode());
            String path = "materials." + name;
            if (!ParameterTable.NAME.matcher(name).matches()) {
                ctx.error(at, path, "a material name is letters, digits and '_', starting with a letter or '_'");
                materialsComplete = false;
                failedMaterials.add(name);
                continue;
            }
            if (LibraryMaterial.byName(name) != null) {
                ctx.error(at, path, "'" + Suggest.shown(name) + "' is a built-in material; use it directly or choose another name");
                materialsComplete = false;
                continue;
            }
            if (defined.containsKey(name)) {
                ctx.error(at, path, "duplicate material, first defined at line " + defined.get(name).at().line());
                continue;
            }
            MaterialSpec spec = readMaterial(MapView.of(ctx, t.getValueNode(), Schema.MATERIAL, path, at), name, at);
            if (spec == null) {
                materialsComplete = false;
                failedMaterials.add(name);
            } else {
                defined.put(name, spec);
            }
        }
    }

    private MaterialSpec readMaterial(MapView v, String name, SourcePosition at) {
        if (v == null) {
            return null;
        }
        if (v.has("perfect_conductor")) {
            return readPerfectConductor(v, name, at);
        }
        if (MetalReader.isMetal(v)) {
            MetalReader.Pending metal = new MetalReader(ctx).read(v, name, at);
            WavelengthBand band = RunBand.of(designWavelength, sources, flux, maps);
            return metal == null || band == null ? null : metal.resolve(band);
        }
        String how = v.oneOf(false, "index", "permittivity", "library");
        Node c = v.get("conductivity");
        Value sigma = c == null ? new Value(0, at) : ctx.value(c, v.path("conductivity"), Expect.CONDUCTIVITY);
        if (sigma != null && sigma.si() < 0) {
            ctx.error(sigma.at(), v.path("conductivity"), "a negative conductivity (" + Units.format(sigma.si(), Dimension.CONDUCTIVITY)
                    + ") is gain: the fields would grow without limit; expected 0 S/m or more");
            sigma = null;
        }
        Value eps = null;
        LibraryMaterial lib = null;
        if ("index".equals(how)) {
            Value n = ctx.positive(v.get("index"), v.path("index"), Expect.PLAIN);
            eps = n == null ? null : new Value(n.si() * n.si(), n.at());
        } else if ("permittivity".equals(how)) {
            eps = ctx.value(v.get("permittivity"), v.path("permittivity"), Expect.PLAIN);
            if (eps != null && !(eps.si() > 0)) {
                ctx.error(eps.at(), v.path("permittivity"), "must be positive, got " + Units.number(eps.si()) + (eps.si() < 0
                        ? "; a metal's negative permittivity depends on frequency: give drude/lorentz terms, a library metal "
                                + "(library: gold), or its measured index (index: 0.18+3.43i at 633 nm); docs/case-file.md, \"Metals\""
                        : ""));
                eps = null;
            }
        } else if ("library".equals(how)) {
            Node ln = v.get("library");
            lib = library(ln, v.path("library"));
            if (lib != null && designWavelength != null) {
                eps = libraryPermittivity(lib, ctx.pos(ln), v.path("library"));
            }
        }
        if (eps == null || sigma == null) {
            return null;
        }
        return new MaterialSpec(name, eps, sigma, Optional.ofNullable(lib), at);
    }

    /** {@code perfect_conductor: true}, alone: no other key describes such a material. */
    private MaterialSpec readPerfectConductor(MapView v, String name, SourcePosition at) {
        Node pn = v.get("perfect_conductor");
        Boolean b = ctx.choice(pn, v.path("perfect_conductor"), FluxReader.BOOLEANS);
        boolean ok = b != null;
        if (b != null && !b) {
            ctx.error(ctx.pos(pn), v.path("perfect_conductor"), "'false' describes no material: leave the key out and give "
                    + "index, permittivity or library");
            ok = false;
        }
        for (String k : List.of("index", "permittivity", "library", "conductivity", "drude", "lorentz", "table",
                "fit_tolerance")) {
            if (v.has(k)) {
                ctx.error(v.keyAt(k), v.path(k), "a perfect conductor takes no other key (it has no field inside and "
                        + "no permittivity or conductivity to give); remove '" + k + "' or 'perfect_conductor'");
                ok = false;
            }
        }
        return ok ? MaterialSpec.perfectConductor(name, at) : null;
    }

    private LibraryMaterial library(Node node, String path) {
        Map<String, LibraryMaterial> names = new LinkedHashMap<>();
        for (LibraryMaterial m : LibraryMaterial.values()) {
            names.put(m.caseName(), m);
        }
        return ctx.choice(node, path, names);
    }

    private Value libraryPermittivity(LibraryMaterial lib, SourcePosition at, String path) {
        double wl = designWavelength.si();
        if (!lib.covers(wl)) {
            ctx.warn(at, path, String.format("%s's fit covers %s to %s; the design wavelength %s lies outside it", lib.caseName(),
                    Units.format(lib.minWavelength(), Dimension.LENGTH), Units.format(lib.maxWavelength(), Dimension.LENGTH),
                    Units.format(wl, Dimension.LENGTH)));
        }
        double n = lib.index(wl);
        return new Value(n * n, at);
    }

    /**
     * Collects the materials the scene uses and reports names that are neither defined nor built
     * in, for every reference written (also in shapes that failed for other reasons).
     */
    private void resolveUsedMaterials() {
        for (Map.Entry<Located<String>, String> e : materialPaths.entrySet()) {
            Located<String> ref = e.getKey();
            String name = ref.value();
            if (used.containsKey(name)) {
                continue;
            }
            MaterialSpec m = defined.get(name);
            LibraryMaterial lib = LibraryMaterial.byName(name);
            if (m != null) {
                used.put(name, m);
            } else if (lib != null) {
                if (designWavelength != null) {
                    used.put(name, new MaterialSpec(name, libraryPermittivity(lib, ref.at(), e.getValue()),
                            new Value(0, ref.at()), Optional.of(lib), ref.at()));
                } else {
                    materialsComplete = false;
                }
            } else {
                materialsComplete = false;
                if (materialsReadable && !failedMaterials.contains(name)) {
                    List<String> known = new ArrayList<>(defined.keySet());
                    for (LibraryMaterial l : LibraryMaterial.values()) {
                        known.add(l.caseName());
                    }
                    ctx.error(ref.at(), e.getValue(), "unknown material '" + Suggest.shown(name) + "'" + Suggest.didYouMean(name, known)
                            + "; define it under materials or use one of " + String.join(", ", known));
                }
            }
        }
        for (MaterialSpec m : defined.values()) {
            if (!used.containsKey(m.name()) && shapesComplete && domain != null) {
                ctx.note(m.at(), "materials." + m.name(), "defined but not used by any shape or the background");
            }
        }
    }

    /** Every material reference written, in file order, with its key path. */
    private final Map<Located<String>, String> materialPaths = new LinkedHashMap<>();

    private Located<String> materialRef(Node node, String path) {
        return shapeReader.materialRef(node, path);
    }

    // ---------------------------------------------------------------- domain, shapes

    private void readDomain(MapView v) {
        if (v == null) {
            return;
        }
        Value w = ctx.positive(v.require("width", "a length such as 10 um"), v.path("width"), Expect.LENGTH);
        Value h = ctx.positive(v.require("height", "a length such as 10 um"), v.path("height"), Expect.LENGTH);
        Node b = v.get("background");
        Located<String> bg = b == null ? new Located<>(LibraryMaterial.VACUUM.caseName(), v.at()) : materialRef(b, v.path("background"));
        if (b == null) {
            materialPaths.put(bg, v.path("background"));
        }
        if (w != null && h != null && bg != null) {
            domain = new DomainSpec(w, h, bg);
        }
    }

    private void readShapes(Node node) {
        if (node == null || Context.isNull(node)) {
            return;
        }
        List<Node> items = ctx.list(node, "shapes", "shapes such as '- disk: {...}'");
        if (items == null) {
            shapesComplete = false;
            return;
        }
        for (int k = 0; k < items.size(); k++) {
            KindEntry e = KindEntry.read(ctx, items.get(k), Schema.SHAPES, "shapes[" + k + "]");
            ShapeSpec s = e == null ? null : shapeReader.read(e);
            if (s == null) {
                shapesComplete = false;
            } else {
                shapes.add(s);
                shapePaths.add(e.path());
            }
        }
    }

    // ---------------------------------------------------------------- grid and boundaries

    /** Records the grid the case asks for; planning derives the cells from it. */
    private void readResolution(MapView v) {
        if (v == null) {
            return;
        }
        String how = v.oneOf(false, "cell", "cells_per_wavelength");
        if ("cell".equals(how)) {
            Value cell = ctx.positive(v.get("cell"), v.path("cell"), Expect.LENGTH);
            if (cell != null) {
                grid = new GridRequest(Optional.of(cell), Optional.empty(), resolutionScale, gridOffset);
            }
        } else if ("cells_per_wavelength".equals(how)) {
            Value n = ctx.positive(v.get("cells_per_wavelength"), v.path("cells_per_wavelength"), Expect.PLAIN);
            if (n != null) {
                grid = new GridRequest(Optional.empty(), Optional.of(n), resolutionScale, gridOffset);
            }
        }
    }

    private Point point(MapView v, String key) {
        Node n = v.require(key, "a point [x, y]");
        return n == null ? null : ctx.point(n, v.path(key));
    }

    private static String fmtLength(double m) {
        return Units.format(m, Dimension.LENGTH);
    }

    private void readBoundaries(Node node, SourcePosition at) {
        Map<Side, BoundarySpec> sides = new EnumMap<>(Side.class);
        Map<Side, String> paths = new EnumMap<>(Side.class);
        BoundarySpec all = null;
        boolean ok = true;
        if (node != null) {
            MapView v = MapView.of(ctx, node, Schema.BOUNDARIES, "boundaries", at);
            if (v == null) {
                return;
            }
            Node a = v.get("all");
            if (a != null) {
                all = boundary(a, "boundaries.all");
                ok &= all != null;
            }
            for (Side side : Side.values()) {
                String key = side.name().toLowerCase(Locale.ROOT);
                Node s = v.get(key);
                if (s != null) {
                    BoundarySpec b = boundary(s, v.path(key));
                    ok &= b != null;
                    if (b != null) {
                        sides.put(side, b);
                        paths.put(side, v.path(key));
                    }
                }
            }
        }
        if (!ok) {
            return;
        }
        for (Side side : Side.values()) {
            if (!sides.containsKey(side)) {
                paths.put(side, all != null ? "boundaries.all" : "boundaries");
                if (all != null) {
                    sides.put(side, all);
                } else {
                    sides.put(side, BoundarySpec.Pml.ofCells(DEFAULT_PML_CELLS, at));
                }
            }
        }
        if (sides.size() == Side.values().length && !periodicPairs(sides, paths)) {
            return;
        }
        if (sides.size() == Side.values().length) {
            boundaries.putAll(sides);
            boundaryPaths.putAll(paths);
        }
    }

    /** Periodic sides come as the left and right pair; false (errors reported) otherwise. */
    private boolean periodicPairs(Map<Side, BoundarySpec> sides, Map<Side, String> paths) {
        boolean ok = true;
        for (Side side : new Side[] {Side.BOTTOM, Side.TOP}) {
            if (sides.get(side) instanceof BoundarySpec.Periodic p) {
                ctx.error(p.at(), paths.get(side), "the " + side.name().toLowerCase(Locale.ROOT) + " side cannot be periodic: "
                        + "periodic sides are the left and right pair, along the interfaces; expected pec, pmc or pml here");
                ok = false;
            }
        }
        boolean left = sides.get(Side.LEFT) instanceof BoundarySpec.Periodic;
        boolean right = sides.get(Side.RIGHT) instanceof BoundarySpec.Periodic;
        if (left != right) {
            Side lone = left ? Side.LEFT : Side.RIGHT;
            ctx.error(sides.get(lone).at(), paths.get(lone), "a periodic side needs its partner: make both left and right "
                    + "periodic, or neither");
            ok = false;
        }
        return ok;
    }

    /** {@code pec}, {@code pmc}, {@code pml}, {@code pml 20} (cells) or {@code pml 1.2 um}. */
    private BoundarySpec boundary(Node node, String path) {
        Scalar s = ctx.scalar(node, path, "pec, pmc, pml, 'pml 20' (cells), 'pml 1 um' or periodic");
        if (s == null) {
            return null;
        }
        String text = s.text();
        int space = 0;
        while (space < text.length() && !Character.isWhitespace(text.charAt(space))) {
            space++;
        }
        String word = text.substring(0, space);
        String rest = text.substring(space).strip();
        switch (word) {
            case "periodic":
                if (!rest.isEmpty()) {
                    ctx.error(s.positionAt(space), path, "periodic takes no thickness, got '" + Suggest.shown(rest) + "'");
                    return null;
                }
                return new BoundarySpec.Periodic(s.start());
            case "pec":
            case "pmc":
                if (!rest.isEmpty()) {
                    ctx.error(s.positionAt(space), path, word + " takes no thickness, got '" + Suggest.shown(rest) + "'");
                    return null;
                }
                return word.equals("pec") ? new BoundarySpec.Pec(s.start()) : new BoundarySpec.Pmc(s.start());
            case "pml": {
                if (rest.isEmpty()) {
                    return BoundarySpec.Pml.ofCells(DEFAULT_PML_CELLS, s.start());
                }
                int from = text.indexOf(rest, space);
                Scalar thick = s.from(from);
                Quantity q = ctx.quantity(thick, path);
                if (q == null) {
                    return null;
                }
                if (q.dimension().isNone()) {
                    if (q.value() != Math.rint(q.value()) || q.value() < 1) {
                        ctx.error(thick.start(), path, "a PML thickness in cells must be a whole number of at least 1, got "
                                + Units.number(q.value()) + " (write a length such as 1 um for a thickness in metres)");
                        return null;
                    }
                    return BoundarySpec.Pml.ofCells((int) Math.min(q.value(), Integer.MAX_VALUE), s.start());
                } else if (q.dimension().equals(Dimension.LENGTH)) {
                    if (!(q.value() > 0)) {
                        ctx.error(thick.start(), path, "a PML thickness must be positive, got " + q);
                        return null;
                    }
                    return BoundarySpec.Pml.ofThickness(new Value(q.value(), thick.start()), s.start());
                } else {
                    ctx.error(thick.start(), path, "got " + q + " (" + q.dimension().describe()
                            + "), expected a PML thickness in cells (a whole number) or a length such as 1 um");
                    return null;
                }
            }
            default:
                ctx.error(s.start(), path, "unknown boundary '" + Suggest.shown(word) + "'" + Suggest.didYouMean(word, List.of("pec", "pmc", "pml", "periodic"))
                        + ", expected pec, pmc, pml, 'pml 20' (cells), 'pml 1 um' or periodic (left and right)");
                return null;
        }
    }

    // ---------------------------------------------------------------- sources and signals

    private void readSources(Node node) {
        if (node == null) {
            sourcesComplete = false;
            return;
        }
        List<Node> items = ctx.list(node, "sources", "sources such as '- point: {...}'");
        if (items == null) {
            sourcesComplete = false;
            return;
        }
        if (items.isEmpty()) {
            ctx.error(ctx.pos(node), "sources", "a case needs at least one source");
            sourcesComplete = false;
        }
        for (int k = 0; k < items.size(); k++) {
            KindEntry e = KindEntry.read(ctx, items.get(k), Schema.SOURCES, "sources[" + k + "]");
            SourceSpec s = e == null ? null : readSource(e);
            if (s == null) {
                sourcesComplete = false;
            } else {
                sources.add(s);
                sourcePaths.add(e.path());
            }
        }
    }

    private SourceSpec readSource(KindEntry e) {
        if (e.kind().equals("plane_wave") || e.kind().equals("gaussian_beam")) {
            return new LaunchReader(ctx, signalReader).read(e, polarization);
        }
        if (e.kind().equals("plane_wave_box")) {
            return new BoxReader(ctx, signalReader).read(e, polarization);
        }
        boolean line = e.kind().equals("line");
        MapView v = e.view(ctx, line ? Schema.LINE_SOURCE : Schema.POINT_SOURCE);
        if (v == null) {
            return null;
        }
        Located<Component> comp = component(v, "component");
        Value amp = SourceParts.amplitude(ctx, v);
        SignalSpec signal = SourceParts.signal(ctx, signalReader, v, "pulse: {wavelength: 633 nm, bandwidth: 50 nm}");
        if (!line) {
            Point at = point(v, "at");
            return at == null || comp == null || amp == null || signal == null ? null
                    : new SourceSpec.PointSource(at, comp, amp, signal, e.at());
        }
        Point from = point(v, "from");
        Point to = point(v, "to");
        Value angle = SourceParts.angle(ctx, v);
        Node wn = v.get("waist");
        Value waist = wn == null ? null : ctx.positive(wn, v.path("waist"), Expect.LENGTH);
        if (from != null && to != null) {
            boolean horizontal = from.y().si() == to.y().si();
            boolean vertical = from.x().si() == to.x().si();
            if (horizontal && vertical) {
                ctx.error(to.at(), v.path("to"), "a line source needs two different end points; use a point source for one point");
                return null;
            }
            if (!horizontal && !vertical) {
                ctx.error(to.at(), v.path("to"), String.format("a line source must be horizontal or vertical; from (%s, %s) to (%s, %s) is neither",
                        fmtLength(from.x().si()), fmtLength(from.y().si()), fmtLength(to.x().si()), fmtLength(to.y().si())));
                return null;
            }
        }
        if (from == null || to == null || comp == null || amp == null || angle == null || (wn != null && waist == null) || signal == null) {
            return null;
        }
        return new SourceSpec.LineSource(from, to, comp, amp, angle, Optional.ofNullable(waist), signal, e.at());
    }

    /** The centre frequency of the case's plane wave or beam, else of its first source; null when unknown. */
    private Value centreFrequency() {
        for (SourceSpec s : sources) {
            if (s instanceof SourceSpec.Launched) {
                return s.signal().frequency();
            }
        }
        return sources.isEmpty() ? null : sources.get(0).signal().frequency();
    }

    /** A field component of the case's polarization; the z component when absent. */
    private Located<Component> component(MapView v, String key) {
        Node n = v.get(key);
        if (n == null) {
            return polarization == null ? null
                    : new Located<>(polarization == Polarization.S ? Component.EZ : Component.HZ, v.at());
        }
        Component c = ctx.choice(n, v.path(key), COMPONENTS);
        if (c == null || polarization == null) {
            return null;
        }
        if (c.polarization != polarization) {
            List<String> own = new ArrayList<>();
            for (Component o : polarization.components()) {
                own.add(o.name().toLowerCase(Locale.ROOT));
            }
            ctx.error(ctx.pos(n), v.path(key), String.format("%s belongs to %s polarization but the case is %s (line %d); use %s",
                    c.name().toLowerCase(Locale.ROOT), c.polarization.name().toLowerCase(Locale.ROOT),
                    polarization.name().toLowerCase(Locale.ROOT), polarizationAt.line(), String.join(", ", own)));
            return null;
        }
        return new Located<>(c, ctx.pos(n));
    }

    // ---------------------------------------------------------------- probes, output, until, numerics

    private void readProbes(Node node) {
        if (node == null || Context.isNull(node)) {
            return;
        }
        List<Node> items = ctx.list(node, "probes", "probes {name, at, component}");
        if (items == null) {
            return;
        }
        Map<String, ProbeSpec> names = new HashMap<>();
        for (int k = 0; k < items.size(); k++) {
            String path = "probes[" + k + "]";
            MapView v = MapView.of(ctx, items.get(k), Schema.PROBE, path, ctx.pos(items.get(k)));
            if (v == null) {
                continue;
            }
            Node nn = v.get("name");
            Located<String> name;
            if (nn == null) {
                name = new Located<>("probe" + (k + 1), v.at());
            } else {
                String text = ctx.text(nn, v.path("name"));
                if (text == null) {
                    continue;
                }
                if (!text.matches(Schema.NAME)) {
                    ctx.error(ctx.pos(nn), v.path("name"), "a probe name heads columns of probes.csv: at most " + Schema.NAME_LENGTH
                            + " letters, digits, '_', '-' and '.', got '" + Suggest.shown(text) + "'");
                    continue;
                }
                name = new Located<>(text, ctx.pos(nn));
            }
            if (names.containsKey(name.value())) {
                ctx.error(name.at(), v.path("name"), "duplicate probe name '" + Suggest.shown(name.value()) + "', first used at line "
                        + names.get(name.value()).name().at().line());
                continue;
            }
            Point at = point(v, "at");
            Located<Component> comp = component(v, "component");
            if (at != null && comp != null) {
                ProbeSpec p = new ProbeSpec(name, at, comp, v.at());
                names.put(name.value(), p);
                probes.add(p);
                probePaths.add(path);
            }
        }
    }

    private void readOutput(MapView v) {
        output = new OutputReader(ctx).readOutput(v, !probes.isEmpty(), polarization);
    }

    /**
     * The stopping rule: a fixed time or number of steps, or the field energy falling below a fraction of its
     * largest value ({@link StopSpec#DEFAULT_ENERGY_FRACTION} unless given) with a latest time.
     */
    private void readUntil(MapView v) {
        if (v == null) {
            return;
        }
        Node fn = v.get("energy_below");
        if (fn != null && !v.has("time") && !v.has("steps") && !v.has("latest") && !v.writtenAsOld("latest")) {
            ctx.error(v.at(), v.path("latest"), "missing, expected a time such as 2 ps that ends the run if the field energy "
                    + "never falls below energy_below");
            return;
        }
        String how = v.oneOf(false, "time", "steps", "latest");
        if (how == null) {
            return;
        }
        if (fn != null && !"latest".equals(how)) {
            ctx.error(v.keyAt("energy_below"), v.path("energy_below"), "energy_below goes with latest only; with " + how
                    + " the run length is already fixed");
            return;
        }
        switch (how) {
            case "time": {
                Value t = ctx.positive(v.get("time"), v.path("time"), Expect.TIME);
                stop = t == null ? null : new StopSpec.AfterTime(t);
                break;
            }
            case "steps": {
                Node n = v.get("steps");
                Long steps = ctx.whole(n, v.path("steps"), 1);
                if (steps != null && steps > StopSpec.MAX_STEPS) {
                    ctx.error(ctx.pos(n), v.path("steps"), String.format("%d steps is more than the limit of %d", steps, StopSpec.MAX_STEPS));
                    steps = null;
                }
                stop = steps == null ? null : new StopSpec.AfterSteps(new Located<>(steps, ctx.pos(n)));
                break;
            }
            default: {
                Value latest = ctx.positive(v.get("latest"), v.path("latest"), Expect.TIME);
                Value fraction = fn == null ? (latest == null ? null : new Value(StopSpec.DEFAULT_ENERGY_FRACTION, latest.at()))
                        : ctx.value(fn, v.path("energy_below"), Expect.PLAIN);
                if (fraction != null && !(fraction.si() > 0 && fraction.si() < 1)) {
                    ctx.error(fraction.at(), v.path("energy_below"), "the energy fraction must lie between 0 and 1 (exclusive), got "
                            + Units.number(fraction.si()));
                    fraction = null;
                }
                stop = fraction == null || latest == null ? null : new StopSpec.WhenEnergyBelow(fraction, latest);
            }
        }
    }

    private void readNumerics(MapView v, SourcePosition top) {
        if (v == null) {
            numerics = new NumericsSpec(new Located<>(Precision.FLOAT, top), Optional.empty(), Optional.empty(), Optional.empty());
            return;
        }
        Node pn = v.get("precision");
        Precision p = pn == null ? Precision.FLOAT : ctx.choice(pn, v.path("precision"), PRECISIONS);
        Located<Precision> precision = p == null ? null : new Located<>(p, pn == null ? v.at() : ctx.pos(pn));
        Node tn = v.get("threads");
        Optional<Located<Integer>> threads = Optional.empty();
        boolean ok = true;
        boolean auto = tn instanceof ScalarNode sc && sc.getValue().equals("auto");
        if (tn != null && !auto) {
            Long t = ctx.whole(tn, v.path("threads"), 1);
            if (t != null && t > 4096) {
                ctx.error(ctx.pos(tn), v.path("threads"), "at most 4096 threads, got " + t);
                t = null;
            }
            ok = t != null;
            threads = t == null ? Optional.empty() : Optional.of(new Located<>(t.intValue(), ctx.pos(tn)));
        }
        Node cn = v.get("courant");
        Optional<Value> courant = Optional.empty();
        if (cn != null) {
            Value s = ctx.value(cn, v.path("courant"), Expect.PLAIN);
            double limit = Courant.LIMIT_2D;
            if (s != null && !(s.si() > 0 && s.si() < limit)) {
                ctx.error(s.at(), v.path("courant"), "must lie between 0 and the 2D stability limit 1/sqrt(2) = "
                        + Units.number(limit) + " (exclusive), got " + Units.number(s.si()));
                s = null;
            }
            if (s != null && s.si() < SMALL_COURANT) {
                ctx.warn(s.at(), v.path("courant"), String.format("a Courant number of %s makes the run take %s times the steps of the "
                        + "default 0.5 for little gain in accuracy (the cell size sets it); expected about 0.5",
                        Units.number(s.si()), Units.number(0.5 / s.si())));
            }
            ok &= s != null;
            courant = Optional.ofNullable(s);
        }
        Node dn = v.get("dispersion_correction");
        Optional<Located<Boolean>> correction = Optional.empty();
        if (dn != null) {
            Boolean b = ctx.choice(dn, v.path("dispersion_correction"), FluxReader.BOOLEANS);
            ok &= b != null;
            correction = b == null ? Optional.empty() : Optional.of(new Located<>(b, ctx.pos(dn)));
            if (Boolean.TRUE.equals(b) && sources.stream().noneMatch(x -> x instanceof SourceSpec.Launched) && sourcesComplete) {
                ctx.error(ctx.pos(dn), v.path("dispersion_correction"), "the correction is made for the frequency and in-plane "
                        + "wavenumber of a plane wave or a beam's axis, and the case has neither; expected false, or a "
                        + "plane_wave or gaussian_beam source");
                ok = false;
            }
        }
        if (precision != null && ok) {
            numerics = new NumericsSpec(precision, threads, courant, correction);
        }
    }
}
