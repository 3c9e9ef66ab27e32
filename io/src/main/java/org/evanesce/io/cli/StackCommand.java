package org.evanesce.io.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import java.util.function.ToDoubleFunction;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.evanesce.geometry.Complex;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Units;
import org.evanesce.io.casefile.model.FluxSpec.ReferencePermittivity;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.reference.Evanescent;
import org.evanesce.solver.reference.PlanarStack;
import picocli.CommandLine.Command;
import picocli.CommandLine.ITypeConverter;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;
import picocli.CommandLine.TypeConversionException;

/**
 * {@code evanesce stack}: a designer's calculator for the exact plane-wave reflectance, transmittance and
 * absorptance of a layer stack ({@link PlanarStack}), over a range of angles, one layer's thickness, or
 * wavelengths. Numbers only; nothing is written to disk.
 */
@Command(name = "stack", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class, sortOptions = false,
        description = {
            "Plane-wave R, T and A of a stack of layers between two media, exact (characteristic matrix), at any angle "
                    + "including beyond the critical angle, for s and p polarization.",
            "Indices are n (1.5), n+ki (1.5+0.01i) or n,k (0.2,3.4), with k >= 0 for absorption, or a library material "
                    + "by name, evaluated at each wavelength: a metal (gold, gold-jc, silver, aluminium, copper, chromium, "
                    + "titanium) or a dielectric (water, borosilicate_crown, fused_silica, air, vacuum), e.g. --layer gold:50nm; "
                    + "the table names each one's model and its permittivity (the model's continuous one, or with "
                    + "--permittivity discrete the one a run's time stepping realises). Lengths carry a unit "
                    + "(nm, um, mm, m). One of --angle, --wavelength or --thickness may be a range FROM:TO:STEP.",
            "Columns: the swept value; per polarization R, T, A and the phases of r and t in degrees (r and t are "
                    + "amplitude ratios of E for s and of H for p; r at the first interface, t from the first interface "
                    + "to the last); depth_nm, the 1/e amplitude depth of the evanescent field in the first layer (or "
                    + "the exit medium) when beyond the critical angle."})
public final class StackCommand implements Callable<Integer> {

    /** Width of a table column: the longest header, phase_r_s_deg. */
    private static final int COLUMN = 13;

    /** A sweep longer than this is almost certainly a mistyped step. */
    static final int MAX_ROWS = 100_000;
    /** Wavelengths accepted: 1 pm to 1 km, far beyond optics either way, so that k0 and its products stay finite. */
    static final double MIN_WAVELENGTH = 1e-12;
    static final double MAX_WAVELENGTH = 1e3;
    /** Indices accepted: n and k up to 1e4 and |n + ki| from 1e-4, so that their products with k0 stay finite. */
    static final double MAX_INDEX = 1e4;
    static final double MIN_INDEX = 1e-4;

    /** Which polarizations to print. */
    enum Choice {
        S, P, BOTH
    }

    @Spec
    private CommandSpec spec;

    @Option(names = "--case", paramLabel = "FILE",
            description = "Take the stack from a case file (its layers under its plane wave or beam, as "
                    + "flux.transfer_matrix reads them, each material's index at each wavelength), and its design wavelength "
                    + "and source angle as the defaults of --wavelength and --angle; instead of --incident, --layer, --exit.")
    private java.nio.file.Path caseFile;

    @Option(names = "--set", paramLabel = "NAME=VALUE", mapFallbackValue = "",
            description = "With --case: override a parameter of the case, e.g. --set gap=250nm; repeat for several.")
    private java.util.Map<String, String> overrides = new java.util.LinkedHashMap<>();

    @Option(names = "--incident", paramLabel = "INDEX|NAME", converter = MediumConverter.class,
            description = "Index of the incidence medium (transparent: a real index, or a library dielectric such as "
                    + "borosilicate_crown).")
    private StackMedium incident;

    @Option(names = "--layer", paramLabel = "INDEX|NAME:THICKNESS", converter = LayerConverter.class,
            description = "A layer, e.g. 1.0:200nm or gold:50nm (a library material); repeat for more, from the incidence "
                    + "side. Layers are numbered from 1.")
    private List<StackMedium.Layer> layers = new ArrayList<>();

    @Option(names = "--exit", paramLabel = "INDEX|NAME", converter = MediumConverter.class,
            description = "Index of the exit medium (may absorb), or a library material such as water.")
    private StackMedium exit;

    @Option(names = "--wavelength", paramLabel = "LENGTH|FROM:TO:STEP", converter = LengthSweep.class,
            description = "Vacuum wavelength, e.g. 633nm, or a range 400nm:800nm:10nm (indices are taken as constant "
                    + "over it, except a case's materials, evaluated at each wavelength).")
    private Sweep wavelength;

    @Option(names = "--angle", paramLabel = "DEG|FROM:TO:STEP", converter = AngleSweep.class,
            description = "Angle of incidence in the incidence medium, degrees in [0, 90), or a range 40:70:1 "
                    + "(default: 0, or the case's source angle).")
    private Sweep angle;

    @Option(names = "--thickness", paramLabel = "LAYER:FROM:TO:STEP", converter = ThicknessSweep.class,
            description = "Sweep the thickness of layer LAYER (from 1), e.g. 1:0:1um:10nm; it replaces that "
                    + "layer's thickness.")
    private ThicknessRange thickness;

    @Option(names = "--polarization", paramLabel = "s|p|both", defaultValue = "both",
            description = "s (E normal to the plane of incidence), p (H normal to it) or both (default: ${DEFAULT-VALUE}).")
    private Choice polarization;

    @Option(names = "--csv", description = "Print CSV (one header row) instead of a table.")
    private boolean csv;

    @Option(names = "--permittivity", paramLabel = "continuous|discrete", converter = StackPermittivity.KindConverter.class,
            description = "A metal's permittivity: continuous, the model's ε(ω) (default), or discrete, the ε_d(ω, Δt) that "
                    + "a run's time stepping realises at time step Δt (from --case's grid, --time-step, or --cell and "
                    + "--courant), as flux.transfer_matrix uses by default; other media are the same either way.")
    private ReferencePermittivity permittivityKind;

    @Option(names = "--time-step", paramLabel = "DURATION", converter = StackPermittivity.TimeConverter.class,
            description = "With --permittivity discrete: the run's time step, e.g. 0.00834fs.")
    private Double timeStep;

    @Option(names = "--cell", paramLabel = "LENGTH", converter = StackPermittivity.CellConverter.class,
            description = "With --permittivity discrete: the run's cell size, e.g. 5nm; the time step is "
                    + "courant * cell / c0.")
    private Double cell;

    @Option(names = "--courant", paramLabel = "S", converter = StackPermittivity.NumberConverter.class,
            description = "With --cell: the run's Courant number c0 * dt / cell (default 0.5, the program's).")
    private Double courant;

    /** Which permittivity the metals take, with the discrete one's time step. */
    private StackPermittivity permittivity;

    /** The values of a swept (or single) quantity, in SI (m or rad). */
    record Sweep(String text, List<Double> values) {
        boolean isRange() {
            return text.contains(":");
        }
    }

    /** A thickness sweep of layer {@code layer} (from 1). */
    record ThicknessRange(String text, int layer, List<Double> values) {
    }

    private enum Variable {
        ANGLE("angle_deg"), WAVELENGTH("wavelength_nm"), THICKNESS("thickness_nm");

        final String column;

        Variable(String column) {
            this.column = column;
        }
    }

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        try {
            permittivity = StackPermittivity.ofOptions(permittivityKind, timeStep, cell, courant, caseFile != null);
        } catch (IllegalArgumentException x) {
            throw usage(x.getMessage());
        }
        java.util.function.DoubleFunction<PlanarStack> fromCase = caseFile == null ? null : fromCase(out);
        if (fromCase == null) {
            for (Object[] o : new Object[][] {{incident, "--incident"}, {exit, "--exit"}, {wavelength, "--wavelength"}}) {
                if (o[0] == null) {
                    throw usage("missing " + o[1] + " (or give --case FILE to take the stack from a case file)");
                }
            }
            if (!overrides.isEmpty()) {
                throw usage("--set overrides a case's parameters; give it with --case FILE");
            }
            if (angle == null) {
                angle = new AngleSweep().convert("0");
            }
        }
        if (incident.metal() != null || incident.index(wavelength.values().get(0)).im() != 0) {
            throw usage("--incident " + incident.text() + ": the incidence medium must be transparent (a real index, k = 0, "
                    + "or a library dielectric): an angle of incidence and an incident power are only defined there");
        }
        int ranges = (angle.isRange() ? 1 : 0) + (wavelength.isRange() ? 1 : 0) + (thickness != null ? 1 : 0);
        if (ranges > 1) {
            throw usage("more than one range given (--angle " + angle.text() + ", --wavelength " + wavelength.text()
                    + (thickness != null ? ", --thickness " + thickness.text() : "")
                    + "): sweep one of them and give the others single values");
        }
        for (double a : angle.values()) {
            if (!(a >= 0 && a < Math.PI / 2)) {
                throw usage(String.format(Locale.ROOT, "--angle %s: %s deg is outside [0, 90) deg", angle.text(),
                        Units.number(Math.toDegrees(a))));
            }
        }
        for (double w : wavelength.values()) {
            if (!(w >= MIN_WAVELENGTH && w <= MAX_WAVELENGTH)) {
                throw usage("--wavelength " + wavelength.text() + ": " + Units.format(w, Dimension.LENGTH) + " is outside "
                        + "the wavelengths this calculator accepts, 1 pm to 1 km");
            }
        }
        checkNyquist();
        if (thickness != null && thickness.layer() > layers.size()) {
            throw usage(String.format(Locale.ROOT, "--thickness %s: there is no layer %d; the stack has %d layer(s) "
                    + "(--layer), numbered from 1", thickness.text(), thickness.layer(), layers.size()));
        }
        PlanarStack stack = fromCase != null ? fromCase.apply(wavelength.values().get(0))
                : stackAt(wavelength.values().get(0));
        Variable variable = thickness != null ? Variable.THICKNESS : wavelength.isRange() ? Variable.WAVELENGTH
                : Variable.ANGLE;
        List<Double> values = switch (variable) {
            case THICKNESS -> thickness.values();
            case WAVELENGTH -> wavelength.values();
            case ANGLE -> angle.values();
        };
        List<Polarization> pols = switch (polarization) {
            case S -> List.of(Polarization.S);
            case P -> List.of(Polarization.P);
            case BOTH -> List.of(Polarization.S, Polarization.P);
        };
        Complex gap = stack.index(1); // the first layer, or the exit medium when there are none

        List<String> head = new ArrayList<>();
        head.add(variable.column);
        for (Polarization p : pols) {
            String s = p == Polarization.S ? "s" : "p";
            head.addAll(List.of("R_" + s, "T_" + s, "A_" + s, "phase_r_" + s + "_deg", "phase_t_" + s + "_deg"));
        }
        head.add("depth_nm");
        // every row is computed before anything is printed, so a refused row leaves no partial table
        List<String> rows = new ArrayList<>();
        for (double value : values) {
            PlanarStack st = variable == Variable.THICKNESS ? stack.withThickness(thickness.layer() - 1, value)
                    : variable == Variable.WAVELENGTH ? (fromCase != null ? fromCase.apply(value) : stackAt(value)) : stack;
            double lambda = variable == Variable.WAVELENGTH ? value : wavelength.values().get(0);
            double theta = variable == Variable.ANGLE ? value : angle.values().get(0);
            List<String> row = new ArrayList<>();
            row.add(csv ? csvNumber(shown(variable, value)) : Units.number(shown(variable, value)));
            for (Polarization p : pols) {
                PlanarStack.Response resp = response(st, p, lambda, theta, variable, value);
                double phaseR = Math.toDegrees(resp.r().arg());
                double phaseT = Math.toDegrees(resp.t().arg());
                if (csv) {
                    row.addAll(List.of(csvNumber(resp.reflectance()), csvNumber(resp.transmittance()),
                            csvNumber(resp.absorptance()), csvNumber(phaseR), csvNumber(phaseT)));
                } else {
                    row.addAll(List.of(cell("%.6g", resp.reflectance()), cell("%.6g", resp.transmittance()),
                            cell("%.6f", resp.absorptance()), cell("%.3f", phaseR), cell("%.3f", phaseT)));
                }
            }
            Complex g = st.index(1); // at this row's wavelength
            boolean beyond = g.im() == 0 && Evanescent.isBeyondCritical(st.incidentIndex(), g.re(), theta);
            double depth = beyond ? Evanescent.amplitudeDepth(st.incidentIndex(), g.re(), theta, lambda) : Double.NaN;
            row.add(beyond ? (csv ? csvNumber(depth * 1e9) : cell("%.2f", depth * 1e9)) : csv ? "" : "-");
            rows.add(csv ? String.join(",", row) : tableRow(row));
        }
        // the library materials' models: above the table, or on standard error beside CSV (which stays plain)
        List<String> models = libraryLines();
        if (hasMetal() || permittivityKind != null) {
            models.add(0, permittivity.line(hasMetal()));
        }
        if (csv) {
            models.forEach(spec.commandLine().getErr()::println);
            out.println(String.join(",", head));
        } else {
            printHeader(out, stack, gap);
            models.forEach(out::println);
            out.println(tableRow(head));
        }
        rows.forEach(out::println);
        return ExitCode.OK;
    }

    /**
     * Reads the case's stack and sets the options it fills: the incidence and exit media and the layers (at the
     * first wavelength), the wavelength and angle unless given. Prints which case and parameters were read.
     */
    private java.util.function.DoubleFunction<PlanarStack> fromCase(PrintWriter out) {
        if (incident != null || exit != null || !layers.isEmpty()) {
            throw usage("--case " + caseFile + " gives the stack; leave out --incident, --layer and --exit");
        }
        org.evanesce.io.plan.ExactStack e;
        org.evanesce.io.casefile.model.CaseSpec caseSpec;
        try {
            caseSpec = org.evanesce.io.plan.CaseLoader.read(caseFile, overrides).spec();
            e = org.evanesce.io.plan.ExactStack.of(caseSpec, permittivityKind == null ? ReferencePermittivity.CONTINUOUS
                    : permittivityKind);
        } catch (java.nio.file.NoSuchFileException x) {
            throw usage(caseFile + ": no such file");
        } catch (java.io.IOException x) {
            throw usage(caseFile + ": cannot read: " + x.getMessage());
        } catch (org.evanesce.io.casefile.CaseFileException x) {
            // one line per error, as `run` and `check` print them, then the one-line summary
            x.diagnostics().forEach(spec.commandLine().getErr()::println);
            throw usage(x.errors().size() + " error(s) in " + caseFile + "; nothing was computed");
        } catch (org.evanesce.io.plan.PlanException x) {
            x.diagnostics().forEach(spec.commandLine().getErr()::println);
            throw usage(x.diagnostics().size() + " error(s) in " + caseFile + "; nothing was computed");
        }
        if (wavelength == null) {
            wavelength = new Sweep(Units.format(e.wavelength(), Dimension.LENGTH), List.of(e.wavelength()));
        }
        if (angle == null) {
            angle = new Sweep(Units.number(Math.toDegrees(e.angle())), List.of(e.angle()));
        }
        if (e.permittivity() == ReferencePermittivity.DISCRETE) {
            permittivity = StackPermittivity.ofGrid(e.cellSize(), e.courant(), "the case's grid: cell "
                    + Units.format(e.cellSize(), Dimension.LENGTH) + ", Courant number " + Units.number(e.courant()));
        }
        checkNyquist();
        PlanarStack first = e.stack().apply(wavelength.values().get(0));
        // a case's metal is named with its model, as a library metal typed in; other media by their index
        List<String> media = e.media();
        incident = caseMedium(caseSpec, media.get(0), Complex.real(first.incidentIndex()));
        exit = caseMedium(caseSpec, media.get(media.size() - 1), first.exitIndex());
        layers = new ArrayList<>();
        for (int k = 0; k < first.layers().size(); k++) {
            PlanarStack.Layer l = first.layers().get(k);
            layers.add(new StackMedium.Layer(caseMedium(caseSpec, media.get(k + 1), l.index()), l.thickness()));
        }
        if (!csv) {
            out.println("case: " + caseFile + (overrides.isEmpty() ? "" : " with " + overrides) + " (the layers under its "
                    + "source, as flux.transfer_matrix reads them; the case's polarization is "
                    + e.polarization().toString().toLowerCase(Locale.ROOT) + ")");
        }
        return e.stack();
    }

    /** Refuses a time step of the discrete permittivity beyond the grid's Nyquist limit at any of the wavelengths. */
    private void checkNyquist() {
        try {
            permittivity.checkNyquist(wavelength.values());
        } catch (IllegalArgumentException x) {
            throw usage(x.getMessage());
        }
    }

    /** A case's medium: its model for a metal, else the index the case's stack gives it. */
    private static StackMedium caseMedium(org.evanesce.io.casefile.model.CaseSpec caseSpec, String name, Complex index) {
        var m = caseSpec.materials().get(name);
        return m != null && m.isDispersive() ? StackMedium.ofModel(m.dispersion().orElseThrow().model())
                : StackMedium.of(index);
    }

    /** The stack of the options at vacuum wavelength {@code wl}, m: library materials evaluated there. */
    private PlanarStack stackAt(double wl) {
        double dt = permittivity.metalTimeStep();
        List<PlanarStack.Layer> at = new ArrayList<>();
        for (StackMedium.Layer l : layers) {
            at.add(new PlanarStack.Layer(l.medium().index(wl, dt), l.thickness()));
        }
        return new PlanarStack(incident.index(wl).re(), at, exit.index(wl, dt));
    }

    /** Whether a medium of the stack is a metal (a library metal, or a case's dispersive material). */
    private boolean hasMetal() {
        return incident.metal() != null || exit.metal() != null || layers.stream().anyMatch(l -> l.medium().metal() != null);
    }

    /** One line per library material of the options: its model, and its ε at the first and last wavelength. */
    private List<String> libraryLines() {
        List<Double> w = wavelength.values();
        double first = w.get(0);
        double last = w.get(w.size() - 1);
        double dt = permittivity.metalTimeStep();
        List<String> lines = new ArrayList<>();
        if (incident.isLibrary()) {
            lines.add(incident.describe("incident", first, last, dt));
        }
        for (int k = 0; k < layers.size(); k++) {
            if (layers.get(k).medium().isLibrary()) {
                lines.add(layers.get(k).medium().describe("layer " + (k + 1), first, last, dt));
            }
        }
        if (exit.isLibrary()) {
            lines.add(exit.describe("exit", first, last, dt));
        }
        return lines;
    }

    /**
     * One row's response; a calculation that fails or does not give finite numbers (values at the edge of
     * what doubles hold, an angle so close to 90 degrees that the wave no longer propagates) is refused.
     */
    private PlanarStack.Response response(PlanarStack st, Polarization p, double lambda, double theta, Variable variable,
                                          double value) {
        String at = variable.column.replaceFirst("_(deg|nm)$", "") + " " + Units.number(shown(variable, value))
                + (variable == Variable.ANGLE ? " deg" : " nm");
        PlanarStack.Response resp;
        try {
            resp = st.atAngle(p, lambda, theta);
        } catch (ArithmeticException | IllegalArgumentException e) {
            throw usage("at " + at + " the plane-wave calculation cannot be done: " + e.getMessage()
                    + "; check that the indices, thicknesses, wavelength and angle are what you meant");
        }
        double[] all = {resp.reflectance(), resp.transmittance(), resp.absorptance(), resp.r().re(), resp.r().im(),
            resp.t().re(), resp.t().im()};
        for (double v : all) {
            if (!Double.isFinite(v)) {
                throw usage("at " + at + " the plane-wave calculation gives no finite result (the numbers leave the range of "
                        + "doubles); check that the indices, thicknesses, wavelength and angle are what you meant");
            }
        }
        return resp;
    }

    private void printHeader(PrintWriter out, PlanarStack stack, Complex gap) {
        StringBuilder s = new StringBuilder("stack: incident ").append(incident.isLibrary() ? incident.name() + ", " : "")
                .append("n = ").append(index(Complex.real(stack.incidentIndex())));
        for (int k = 0; k < stack.layers().size(); k++) {
            PlanarStack.Layer l = stack.layers().get(k);
            StackMedium m = layers.get(k).medium();
            s.append(" | layer ").append(k + 1).append(": ").append(m.isLibrary() ? m.name() + ", " : "")
                    .append("n = ").append(index(l.index())).append(", ");
            s.append(thickness != null && thickness.layer() == k + 1 ? "swept"
                    : Units.format(l.thickness(), Dimension.LENGTH));
        }
        s.append(" | exit ").append(exit.isLibrary() ? exit.name() + ", " : "")
                .append(stack.exitIndex().equals(org.evanesce.io.plan.LayeredProfile.PERFECT_CONDUCTOR_INDEX)
                        ? "a perfect conductor, stand-in " : "")
                .append("n = ").append(index(stack.exitIndex()));
        out.println(s);
        StringBuilder w = new StringBuilder();
        if (!wavelength.isRange()) {
            w.append("wavelength ").append(Units.format(wavelength.values().get(0), Dimension.LENGTH)).append("; ");
        }
        if (!angle.isRange()) {
            w.append("angle ").append(Units.number(Math.toDegrees(angle.values().get(0)))).append(" deg; ");
        }
        String into = stack.layers().isEmpty() ? "the exit medium" : "layer 1";
        if (gap.im() == 0 && gap.re() < stack.incidentIndex()) {
            w.append("critical angle into ").append(into).append(": ")
                    .append(Units.number(Math.toDegrees(Evanescent.criticalAngle(stack.incidentIndex(), gap.re()))))
                    .append(" deg");
        } else {
            w.append("no critical angle into ").append(into);
        }
        out.println(w);
        out.println("r, t: amplitude ratios of E (s) and H (p); r at the first interface, t from the first interface "
                + "to the last; phases in degrees");
    }

    /** Columns of at least {@value #COLUMN} characters, right-aligned but the first, two spaces apart. */
    private static String tableRow(List<String> cells) {
        StringBuilder line = new StringBuilder(String.format(Locale.ROOT, "%-" + COLUMN + "s", cells.get(0)));
        for (int c = 1; c < cells.size(); c++) {
            line.append("  ").append(String.format(Locale.ROOT, "%" + COLUMN + "s", cells.get(c)));
        }
        return line.toString().stripTrailing();
    }

    private static String index(Complex n) {
        return n.im() == 0 ? Units.number(n.re()) : Units.number(n.re()) + "+" + Units.number(n.im()) + "i";
    }

    private static double shown(Variable v, double si) {
        return v == Variable.ANGLE ? Math.toDegrees(si) : si * 1e9;
    }

    /** A table cell; a rounding-sized negative value never prints as "-0.000". */
    private static String cell(String format, double v) {
        String s = String.format(Locale.ROOT, format, v);
        return s.matches("-0\\.0*") ? s.substring(1) : s;
    }

    /** Up to 15 significant digits, trailing zeros removed: what a program reading the CSV needs. */
    static String csvNumber(double v) {
        if (v == 0) {
            return "0";
        }
        String s = String.format(Locale.ROOT, "%.15g", v);
        int e = s.indexOf('e');
        String mantissa = e < 0 ? s : s.substring(0, e);
        String exponent = e < 0 ? "" : s.substring(e).replaceFirst("e([+-])0*(\\d)", "e$1$2");
        if (mantissa.indexOf('.') >= 0) {
            mantissa = mantissa.replaceAll("0+$", "").replaceAll("\\.$", "");
        }
        return mantissa + exponent;
    }

    private ParameterException usage(String message) {
        return new ParameterException(spec.commandLine(), message);
    }

    // ---- parsing: each converter's message names the value and what was expected; picocli adds the option

    private static final String NUMBER = "(?:\\d+(?:\\.\\d*)?|\\.\\d+)(?:[eE][+-]?\\d+)?";
    private static final Pattern REAL = Pattern.compile("\\s*([+-]?" + NUMBER + ")\\s*");
    private static final Pattern N_PLUS_KI = Pattern.compile("\\s*([+-]?" + NUMBER + ")\\s*([+-])\\s*(" + NUMBER + ")\\s*[iI]\\s*");
    private static final Pattern N_COMMA_K = Pattern.compile("\\s*([+-]?" + NUMBER + ")\\s*,\\s*([+-]?" + NUMBER + ")\\s*");
    private static final Pattern LENGTH = Pattern.compile("\\s*(" + NUMBER + ")\\s*(nm|um|µm|mm|m)\\s*");
    private static final Pattern ANGLE = Pattern.compile("\\s*([+-]?" + NUMBER + ")\\s*(?:deg)?\\s*");

    /** A complex index: {@code 1.5}, {@code 1.5+0.01i} or {@code 1.5,0.01} (n, k), with n, k ≥ 0 and not both zero. */
    static Complex parseIndex(String text) {
        double n;
        double k;
        Matcher m;
        if ((m = REAL.matcher(text)).matches()) {
            n = Double.parseDouble(m.group(1));
            k = 0;
        } else if ((m = N_PLUS_KI.matcher(text)).matches()) {
            n = Double.parseDouble(m.group(1));
            k = Double.parseDouble(m.group(3)) * (m.group(2).equals("-") ? -1 : 1);
        } else if ((m = N_COMMA_K.matcher(text)).matches()) {
            n = Double.parseDouble(m.group(1));
            k = Double.parseDouble(m.group(2));
        } else {
            throw new TypeConversionException("'" + text + "' is not an index; expected n (1.5), n+ki (1.5+0.01i) or n,k (0.2,3.4)");
        }
        if (!Double.isFinite(n) || !Double.isFinite(k) || n < 0 || k < 0 || (n == 0 && k == 0)) {
            throw new TypeConversionException("'" + text + "': expected an index n + ki with n >= 0 and k >= 0 "
                    + "(k > 0 absorbs; gain is not supported), not zero");
        }
        if (n > MAX_INDEX || k > MAX_INDEX || Math.hypot(n, k) < MIN_INDEX) {
            throw new TypeConversionException("'" + text + "': expected n and k of at most 1e4 and |n + ki| of at least 1e-4 "
                    + "(optical materials lie far inside)");
        }
        return Complex.of(n, k);
    }

    /** A length with a unit (nm, um, µm, mm, m), or a bare 0; SI metres. */
    static double parseLength(String text) {
        Matcher m = LENGTH.matcher(text);
        if (m.matches()) {
            double v = Units.times(Double.parseDouble(m.group(1)), m.group(2).equals("µm") ? "um" : m.group(2)).value();
            if (Double.isFinite(v)) {
                return v;
            }
        } else if (REAL.matcher(text).matches() && Double.parseDouble(text.strip()) == 0) {
            return 0;
        }
        throw new TypeConversionException("'" + text + "' is not a length; expected a number with a unit "
                + "(nm, um, mm, m), e.g. 200nm");
    }

    /** An angle in degrees (an optional {@code deg} suffix), in radians. */
    static double parseAngle(String text) {
        Matcher m = ANGLE.matcher(text);
        if (!m.matches()) {
            throw new TypeConversionException("'" + text + "' is not an angle; expected degrees, e.g. 45 or 45deg");
        }
        return Math.toRadians(Double.parseDouble(m.group(1)));
    }

    /** FROM:TO:STEP (or a single value) with the given element parser; STEP > 0, at most {@link #MAX_ROWS} values. */
    static List<Double> parseRange(String text, ToDoubleFunction<String> element, String unitHint) {
        String[] parts = text.split(":", -1);
        if (parts.length == 1) {
            return List.of(element.applyAsDouble(parts[0]));
        }
        if (parts.length != 3) {
            throw new TypeConversionException("'" + text + "' is neither a single value nor a range FROM:TO:STEP"
                    + unitHint);
        }
        double from = part(text, parts[0], element);
        double to = part(text, parts[1], element);
        double step = part(text, parts[2], element);
        if (!(step > 0)) {
            throw new TypeConversionException("'" + text + "': the step '" + parts[2] + "' must be > 0" + unitHint);
        }
        double span = Math.abs(to - from);
        double count = Math.floor(span / step * (1 + 1e-12)) + 1;
        if (count > MAX_ROWS) {
            throw new TypeConversionException(String.format(Locale.ROOT,
                    "'%s' has %.0f values; at most %d (a larger step?)", text, count, MAX_ROWS));
        }
        double sign = to >= from ? 1 : -1;
        List<Double> values = new ArrayList<>();
        for (int i = 0; i < (int) count; i++) {
            values.add(i == count - 1 && Math.abs(from + sign * i * step - to) <= 1e-9 * step ? to : from + sign * i * step);
        }
        return List.copyOf(values);
    }

    /** One part of a compound value, its message prefixed by the whole value. */
    private static double part(String whole, String part, ToDoubleFunction<String> parser) {
        try {
            return parser.applyAsDouble(part);
        } catch (TypeConversionException e) {
            throw new TypeConversionException("'" + whole + "': " + e.getMessage());
        }
    }

    static final class MediumConverter implements ITypeConverter<StackMedium> {
        @Override
        public StackMedium convert(String value) {
            return StackMedium.parse(value);
        }
    }

    static final class LayerConverter implements ITypeConverter<StackMedium.Layer> {
        @Override
        public StackMedium.Layer convert(String value) {
            String[] parts = value.split(":", -1);
            if (parts.length != 2) {
                throw new TypeConversionException("'" + value + "' is not a layer; expected INDEX:THICKNESS or NAME:THICKNESS, "
                        + "e.g. 1.0:200nm, 0.2,3.4:50nm or gold:50nm");
            }
            StackMedium medium;
            try {
                medium = StackMedium.parse(parts[0]);
            } catch (TypeConversionException e) {
                throw new TypeConversionException("'" + value + "': " + e.getMessage());
            }
            return new StackMedium.Layer(medium, part(value, parts[1], StackCommand::parseLength));
        }
    }

    static final class LengthSweep implements ITypeConverter<Sweep> {
        @Override
        public Sweep convert(String value) {
            return new Sweep(value, parseRange(value, StackCommand::parseLength, " (lengths with a unit, e.g. 400nm:800nm:10nm)"));
        }
    }

    static final class AngleSweep implements ITypeConverter<Sweep> {
        @Override
        public Sweep convert(String value) {
            return new Sweep(value, parseRange(value, StackCommand::parseAngle, " (degrees, e.g. 40:70:1)"));
        }
    }

    static final class ThicknessSweep implements ITypeConverter<ThicknessRange> {
        @Override
        public ThicknessRange convert(String value) {
            int colon = value.indexOf(':');
            String hint = "expected LAYER:FROM:TO:STEP with the layer number from 1 and lengths with a unit, "
                    + "e.g. 1:0:1um:10nm";
            if (colon < 0 || value.split(":", -1).length != 4) {
                throw new TypeConversionException("'" + value + "' is not a thickness sweep; " + hint);
            }
            int layer;
            try {
                layer = Integer.parseInt(value.substring(0, colon).strip());
            } catch (NumberFormatException e) {
                throw new TypeConversionException("'" + value + "': '" + value.substring(0, colon) + "' is not a layer "
                        + "number; " + hint);
            }
            if (layer < 1) {
                throw new TypeConversionException("'" + value + "': layer " + layer + " must be >= 1; " + hint);
            }
            try {
                return new ThicknessRange(value, layer,
                        parseRange(value.substring(colon + 1), StackCommand::parseLength, " (" + hint + ")"));
            } catch (TypeConversionException e) {
                String inner = "'" + value.substring(colon + 1) + "'";
                String m = e.getMessage();
                throw new TypeConversionException("'" + value + "'" + (m.startsWith(inner) ? m.substring(inner.length())
                        : ": " + m));
            }
        }
    }
}
