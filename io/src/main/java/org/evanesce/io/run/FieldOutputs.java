package org.evanesce.io.run;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.GridSpec;
import org.evanesce.io.output.hdf5.FieldDataset;
import org.evanesce.io.output.hdf5.Hdf5Writer;
import org.evanesce.io.output.hdf5.Xdmf;
import org.evanesce.io.output.image.FieldPicture;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.record.Nodes;
import org.evanesce.solver.record.Snapshots;
import org.evanesce.solver.record.StepView;

/**
 * Field files of a run: `fields` (the fields at the last step), `field_frames` (one HDF5 file per
 * frame and one XDMF time series) and `permittivity`, all on the nodes of the output region, with
 * a PNG per component for `fields`. Attributes on every dataset: component, unit, cell size,
 * origin, time, polarization, and where the values sit (averaged onto the nodes).
 *
 * <p>Dataset names say what they hold (docs/outputs.md): a field component is {@code E_z}, {@code H_x},
 * ... ({@link #datasetName}), the imaginary part of a complex (Bloch-periodic) field adds
 * {@code _imaginary}, the permittivity at a component's sites is {@code relative_permittivity_z} (x, y).
 */
public final class FieldOutputs {

    /** Electric fields are stored in V/m; magnetic ones as η0·H, also in V/m (docs/architecture.md). */
    static String unit(Component c) {
        return c.electric ? "V/m" : "V/m (eta0*H)";
    }

    /**
     * The unit of a component's Fourier transform X(f) = Σ F(t) e^{i2πft} Δt: the field's unit times seconds,
     * V·s/m for E and for the stored η0·H (H itself would be in A·s/m); ASCII, like the other attributes.
     */
    static String transformUnit(Component c) {
        return c.electric ? TRANSFORM_UNIT : TRANSFORM_UNIT + " (eta0*H)";
    }

    /** The unit of a transformed electric field (and of |E| of the transforms): volt seconds per metre. */
    static final String TRANSFORM_UNIT = "V*s/m";

    /** "Ez", "Hx", ...: the component as pictures and titles write it. */
    static String name(Component c) {
        String n = c.name().toLowerCase(Locale.ROOT);
        return n.substring(0, 1).toUpperCase(Locale.ROOT) + n.substring(1);
    }

    /** "E_z", "H_x", ...: the component's dataset name, also its {@code component} attribute. */
    public static String datasetName(Component c) {
        return c.name().substring(0, 1) + "_" + axis(c);
    }

    /** "x", "y" or "z": the component's axis. */
    static String axis(Component c) {
        return c.name().substring(1).toLowerCase(Locale.ROOT);
    }

    /** Suffix of the dataset holding the imaginary part of a complex field. */
    static final String IMAGINARY = "_imaginary";

    private FieldOutputs() {
    }

    /** The region's grid: its first node and size. */
    static GridSpec regionGrid(CasePlan plan, int[] box) {
        GridSpec g = plan.grid();
        return new GridSpec(g.x0() + box[0] * g.cellSize(), g.y0() + box[1] * g.cellSize(), g.cellSize(), box[2] - box[0],
                box[3] - box[1]);
    }

    static Map<String, Object> attributes(CasePlan plan, GridSpec r, Component c, String quantity) {
        Map<String, Object> a = new LinkedHashMap<>();
        a.put("component", datasetName(c));
        a.put("quantity", quantity);
        a.put("unit", unit(c));
        a.put("cell_size_m", r.cellSize());
        a.put("origin_m", new double[] {r.x0(), r.y0()});
        a.put("polarization", plan.spec().polarization().value().name().toLowerCase(Locale.ROOT));
        a.put("sites", "averaged onto the cell nodes x0 + i*cell_size, y0 + j*cell_size");
        return a;
    }

    static Map<String, Object> fileAttributes(CasePlan plan) {
        Map<String, Object> a = new LinkedHashMap<>();
        a.put("program", "evanesce");
        a.put("case_file", plan.spec().source());
        a.put("caution", RunOutputs.CAUTION);
        return a;
    }

    /**
     * A sink writing each frame to {@code frames/frame-STEP.h5} at once and remembering its XDMF entry.
     *
     * @param index receives each frame's grid, in order
     */
    public static Snapshots.Sink frameSink(CasePlan plan, Path dir, List<Xdmf.Grid> index) {
        int[] box = plan.fields().box();
        GridSpec r = regionGrid(plan, box);
        List<Component> comps = plan.fields().components();
        return (step, times, re, im) -> {
            Path frames = dir.resolve("frames");
            Files.createDirectories(frames);
            String file = String.format(Locale.ROOT, "frame-%09d.h5", step);
            List<FieldDataset> sets = new ArrayList<>();
            List<Xdmf.Attribute> attrs = new ArrayList<>();
            for (int c = 0; c < comps.size(); c++) {
                Map<String, Object> a = attributes(plan, r, comps.get(c), "field");
                a.put("time_s", times[c]);
                a.put("step", step);
                FieldDataset d = new FieldDataset(datasetName(comps.get(c)), re[c], r.nx(), r.ny(), Precision.FLOAT,
                        part(a, im != null ? "real" : null));
                sets.add(d);
                attrs.add(Xdmf.Attribute.of(d.name(), "frames/" + file, d));
                if (im != null) {
                    FieldDataset di = new FieldDataset(datasetName(comps.get(c)) + IMAGINARY, im[c], r.nx(), r.ny(),
                            Precision.FLOAT, part(a, "imaginary"));
                    sets.add(di);
                    attrs.add(Xdmf.Attribute.of(di.name(), "frames/" + file, di));
                }
            }
            Hdf5Writer.write(frames.resolve(file), fileAttributes(plan), sets);
            index.add(new Xdmf.Grid("frame " + step, times[0], r.nx(), r.ny(), r.x0(), r.y0(), r.cellSize(), attrs));
        };
    }

    /** Writes frames.xmf: the time series of the frames written. */
    public static void writeFrameIndex(Path dir, List<Xdmf.Grid> index) throws IOException {
        if (!index.isEmpty()) {
            writeText(dir.resolve("frames.xmf"), Xdmf.temporal("field frames", index));
        }
    }

    /** fields.h5, fields.xmf and field-COMPONENT.png: the fields at the end of the run. */
    public static void writeFields(CasePlan plan, StepView v, Path dir) throws IOException {
        int[] box = plan.fields().box();
        GridSpec r = regionGrid(plan, box);
        List<Component> comps = plan.fields().components();
        List<FieldDataset> sets = new ArrayList<>();
        List<Xdmf.Attribute> attrs = new ArrayList<>();
        boolean bloch = periodic(plan);
        int[] ids = ids(plan, box);
        for (Component c : comps) {
            double[] raw = new double[r.nx() * r.ny()];
            double[] rawIm = bloch ? new double[raw.length] : null;
            for (int j = 0; j < r.ny(); j++) {
                for (int i = 0; i < r.nx(); i++) {
                    raw[j * r.nx() + i] = v.field(c, box[0] + i, box[1] + j);
                    if (bloch) {
                        rawIm[j * r.nx() + i] = v.fieldImag(c, box[0] + i, box[1] + j);
                    }
                }
            }
            double[] nodes = Nodes.average(c, raw, r.nx(), r.ny());
            Map<String, Object> a = attributes(plan, r, c, "field");
            a.put("time_s", v.time(c));
            a.put("step", v.stepCount());
            FieldDataset d = new FieldDataset(datasetName(c), nodes, r.nx(), r.ny(), Precision.FLOAT, part(a, bloch ? "real" : null));
            sets.add(d);
            attrs.add(Xdmf.Attribute.of(d.name(), "fields.h5", d));
            if (bloch) {
                FieldDataset di = new FieldDataset(datasetName(c) + IMAGINARY, Nodes.average(c, rawIm, r.nx(), r.ny()), r.nx(),
                        r.ny(), Precision.FLOAT, part(a, "imaginary"));
                sets.add(di);
                attrs.add(Xdmf.Attribute.of(di.name(), "fields.h5", di));
            }
            FieldPicture.of(nodes, r, name(c), unit(c), FieldPicture.Quantity.REAL).outlines(ids)
                    .title(String.format(Locale.ROOT, "%s at t = %.4g fs", name(c), v.time(c) * 1e15))
                    .writePng(dir.resolve("field-" + c.name().toLowerCase(Locale.ROOT) + ".png"));
        }
        Hdf5Writer.write(dir.resolve("fields.h5"), fileAttributes(plan), sets);
        writeText(dir.resolve("fields.xmf"), Xdmf.spatial("fields", List.of(
                new Xdmf.Grid("fields", r.nx(), r.ny(), r.x0(), r.y0(), r.cellSize(), attrs))));
    }

    /** permittivity.h5 and permittivity.xmf: εr at each component's sites, averaged onto the nodes, and material ids. */
    public static void writePermittivity(CasePlan plan, Path dir) throws IOException {
        int[] box = plan.fields().box();
        GridSpec r = regionGrid(plan, box);
        List<FieldDataset> sets = new ArrayList<>(permittivity(plan, box, "relative permittivity"));
        sets.add(materialIds(plan, box, Map.of()));
        List<Xdmf.Attribute> attrs = new ArrayList<>();
        for (FieldDataset d : sets) {
            attrs.add(Xdmf.Attribute.of(d.name(), "permittivity.h5", d));
        }
        Hdf5Writer.write(dir.resolve("permittivity.h5"), fileAttributes(plan), sets);
        writeText(dir.resolve("permittivity.xmf"), Xdmf.spatial("permittivity", List.of(
                new Xdmf.Grid("permittivity", r.nx(), r.ny(), r.x0(), r.y0(), r.cellSize(), attrs))));
    }

    /**
     * With Bloch-periodic sides the fields are complex: {@code part} "real" or "imaginary" is added to a copy
     * of {@code a} (the physical field is the real part); null leaves {@code a} as it is.
     */
    static Map<String, Object> part(Map<String, Object> a, String part) {
        if (part == null) {
            return a;
        }
        Map<String, Object> out = new LinkedHashMap<>(a);
        out.put("part", part);
        return out;
    }

    /** Name of the permittivity at component {@code c}'s sites: {@code relative_permittivity_z} (x, y). */
    static String permittivityName(Component c) {
        return "relative_permittivity_" + axis(c);
    }

    /**
     * εr on the grid at each electric component's sites over the box, averaged onto the nodes:
     * relative_permittivity_z (s); relative_permittivity_x, relative_permittivity_y (p). A dielectric-only run writes
     * each material's εr (its conductivity is in summary.json). A run with a dispersive material (a metal) writes the
     * complex relative permittivity at the design wavelength instead, as two datasets: the real part under the same
     * name and the imaginary part under {@code relative_permittivity_z_imaginary} (x, y); a metal's sites (and its face
     * averages: the arithmetic mean along a face, the harmonic one across it) hold its model's ε(ω) there, a conductive material's the term σ/(ε0ω) in the imaginary part.
     */
    static List<FieldDataset> permittivity(CasePlan plan, int[] box, String quantity) {
        GridSpec r = regionGrid(plan, box);
        List<FieldDataset> out = new ArrayList<>();
        java.util.Map<Integer, org.evanesce.geometry.dispersion.DispersiveMaterial> metals = plan.builder().dispersiveMaterials();
        // a metal face's sites across it hold its materials in series (1/eps = sum f/eps_k), stepped as such
        java.util.Map<Integer, org.evanesce.geometry.dispersion.SeriesMaterial> series = plan.builder().seriesMaterials();
        double wavelength = plan.spec().designWavelength().si();
        double omega = 2 * Math.PI * org.evanesce.geometry.PhysicalConstants.C0 / wavelength;
        for (Component c : plan.spec().polarization().value().components()) {
            if (!c.electric) {
                continue;
            }
            FieldSite site = c == Component.EZ ? FieldSite.EZ : c == Component.EX ? FieldSite.EX : FieldSite.EY;
            double[] eps = new double[r.nx() * r.ny()];
            double[] epsIm = metals.isEmpty() && series.isEmpty() ? null : new double[eps.length];
            for (int j = 0; j < r.ny(); j++) {
                for (int i = 0; i < r.nx(); i++) {
                    int k = j * r.nx() + i;
                    org.evanesce.geometry.Material m = plan.materials().material(site, box[0] + i, box[1] + j);
                    if (m.isPerfectConductor()) { // no permittivity: NaN, the pictures' missing-value colour
                        eps[k] = Double.NaN;
                        if (epsIm != null) {
                            epsIm[k] = Double.NaN;
                        }
                        continue;
                    }
                    if (epsIm == null) {
                        eps[k] = m.relativePermittivity();
                        continue;
                    }
                    int id = plan.materials().id(site, box[0] + i, box[1] + j);
                    org.evanesce.geometry.dispersion.DispersiveMaterial d = metals.get(id);
                    org.evanesce.geometry.dispersion.SeriesMaterial sm = series.get(id);
                    org.evanesce.geometry.Complex e = d != null ? d.permittivity(omega) : sm != null ? sm.permittivity(omega)
                            : org.evanesce.geometry.dispersion.DispersiveMaterial.of(m).permittivity(omega);
                    eps[k] = e.re();
                    epsIm[k] = e.im();
                }
            }
            if (epsIm == null) {
                Map<String, Object> a = attributes(plan, r, c, quantity);
                a.put("unit", "1");
                out.add(new FieldDataset(permittivityName(c),
                        Nodes.average(c, eps, r.nx(), r.ny()), r.nx(), r.ny(), Precision.DOUBLE, a));
                continue;
            }
            for (boolean real : new boolean[] {true, false}) {
                String part = real ? "real" : "imaginary";
                Map<String, Object> a = attributes(plan, r, c, String.format(Locale.ROOT, "%s, %s part of the complex "
                        + "relative permittivity at the design wavelength %.2f nm (metals: the model's epsilon(omega); the "
                        + "grid's discrete value is in summary.json)", quantity, part, wavelength * 1e9));
                a.put("unit", "1");
                a.put("part", part);
                a.put("wavelength_m", wavelength);
                out.add(new FieldDataset(permittivityName(c) + (real ? "" : IMAGINARY),
                        Nodes.average(c, real ? eps : epsIm, r.nx(), r.ny()), r.nx(), r.ny(), Precision.DOUBLE, a));
            }
        }
        return out;
    }

    /** The material ids of {@link #ids} as a dataset, the materials' names in its attribute, plus {@code extra} attributes. */
    static FieldDataset materialIds(CasePlan plan, int[] box, Map<String, Object> extra) {
        GridSpec r = regionGrid(plan, box);
        int[] ids = ids(plan, box);
        double[] idv = new double[ids.length];
        for (int k = 0; k < ids.length; k++) {
            idv[k] = ids[k];
        }
        Map<String, Object> a = attributes(plan, r, plan.spec().polarization().value() == Polarization.S ? Component.EZ
                : Component.EX, "material id");
        a.put("unit", "1");
        a.put("materials", String.join(", ", plan.materials().materials().stream().map(m -> m.name()).toList()));
        a.putAll(extra);
        return new FieldDataset("material_id", idv, r.nx(), r.ny(), Precision.DOUBLE, a);
    }

    /** Whether the run has Bloch-periodic sides (complex fields). */
    public static boolean periodic(CasePlan plan) {
        return plan.spec().boundary(org.evanesce.solver.grid.Side.LEFT) instanceof org.evanesce.io.casefile.model.BoundarySpec.Periodic;
    }

    /** Material ids at the z component's site (s) or Ex's (p) over the box, for outlines. */
    static int[] ids(CasePlan plan, int[] box) {
        FieldSite site = plan.spec().polarization().value() == Polarization.S ? FieldSite.EZ : FieldSite.EX;
        int w = box[2] - box[0];
        int h = box[3] - box[1];
        int[] out = new int[w * h];
        for (int j = 0; j < h; j++) {
            for (int i = 0; i < w; i++) {
                out[j * w + i] = plan.materials().id(site, box[0] + i, box[1] + j);
            }
        }
        return out;
    }

    static void writeText(Path file, String text) throws IOException {
        org.evanesce.io.output.SafeFiles.writeString(file, text);
    }
}
