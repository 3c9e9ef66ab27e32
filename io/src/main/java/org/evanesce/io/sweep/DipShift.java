package org.evanesce.io.sweep;

import static org.evanesce.io.sweep.TableText.e;
import static org.evanesce.io.sweep.TableText.plain;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;
import org.evanesce.geometry.Complex;

/**
 * A sensor's sensitivity from two separate sweeps over the same angles that differ in one material's index:
 * per wavelength, other swept parameters and flux column, the shift of the interpolated minimum (the dip) per
 * refractive-index unit, (θ_B − θ_A)/(n_B − n_A) in degrees, from the two sweeps' sweep-extrema.csv.
 *
 * <p>What differs is found from the first point's run.json of each sweep: every material's permittivity at the
 * run's wavelengths, the case's parameters, its grid, boundaries, sources and the rest of the resolved case.
 * Exactly one material must differ, and it must be a non-dispersive one (an index or a permittivity, not a
 * metal); a parameter may differ beside it only when its value is that material's index (or permittivity) at
 * the design wavelength in both sweeps, i.e. when it is how the index was changed. Anything else that differs
 * is refused, as are sweeps whose swept parameters (names, kinds, values), wavelengths or flux columns differ.
 * The index of the material at each wavelength is Re √ε of what the run recorded.
 */
public final class DipShift {

    public static final String CSV = "dip-shift.csv";
    public static final String JSON = "dip-shift.json";
    /** Relative agreement of a parameter's value with the material's index for the parameter to be that index. */
    private static final double SAME_NUMBER = 1e-9;
    /** At most this many rows are printed; the rest are in the file. */
    private static final int PRINTED = 12;

    /** Two sweeps that cannot be compared, with the reason. */
    public static final class Mismatch extends Exception {
        private static final long serialVersionUID = 1L;

        public Mismatch(String message) {
            super(message);
        }
    }

    /**
     * One row: a dip of each sweep and the shift.
     *
     * @param a      the dip of the first sweep
     * @param b      the dip of the second
     * @param indexA the material's index at the wavelength in the first sweep
     * @param indexB the same in the second
     */
    public record Row(SweepDips.Dip a, SweepDips.Dip b, double indexA, double indexB) {
        /** Degrees per refractive-index unit; NaN where the index is the same at this wavelength. */
        public double shiftDegPerIndexUnit() {
            return indexB == indexA ? Double.NaN : Math.toDegrees(b.angleRad() - a.angleRad()) / (indexB - indexA);
        }

        public boolean bracketed() {
            return a.bracketed() && b.bracketed();
        }
    }

    /**
     * The comparison's outcome.
     *
     * @param material   the material whose index differs
     * @param parameter  the parameter that carries it, or null when the case files differ there
     * @param rows       one per dip of the first sweep, in its order
     * @param notes      what the user should know (also written to dip-shift.json)
     */
    public record Result(SweepDips a, SweepDips b, String material, String parameter, List<Row> rows, List<String> notes) { }

    private DipShift() {
    }

    /** Compares the sweeps and computes the shifts. */
    public static Result compare(SweepDips a, SweepDips b) throws Mismatch {
        String na = a.dir().toString();
        String nb = b.dir().toString();
        if (!a.parameters().equals(b.parameters())) {
            throw new Mismatch("the swept parameters differ: " + na + " sweeps " + describe(a.parameters()) + ", " + nb + " sweeps "
                    + describe(b.parameters()) + "; expected the same angles (and other swept values) in both sweeps");
        }
        Set<String> onlyA = new TreeSet<>(names(a.dips().keySet()));
        onlyA.removeAll(names(b.dips().keySet()));
        Set<String> onlyB = new TreeSet<>(names(b.dips().keySet()));
        onlyB.removeAll(names(a.dips().keySet()));
        if (!a.dips().keySet().equals(b.dips().keySet())) {
            throw new Mismatch("the sweeps' wavelengths or flux columns differ (in " + na + " only: " + (onlyA.isEmpty() ? "none"
                    : String.join(", ", onlyA)) + "; in " + nb + " only: " + (onlyB.isEmpty() ? "none" : String.join(", ", onlyB))
                    + "); expected the same flux wavelengths and lines in both cases");
        }
        Map<String, Object> ca = a.resolvedCase();
        Map<String, Object> cb = b.resolvedCase();
        List<String> other = new ArrayList<>();
        Set<String> keys = new TreeSet<>(ca.keySet());
        keys.addAll(cb.keySet());
        for (String k : keys) {
            if (!k.equals("materials") && !k.equals("parameters") && !k.equals("title") && !Objects.equals(ca.get(k), cb.get(k))) {
                other.add("the case's " + k + " (" + brief(ca.get(k)) + " against " + brief(cb.get(k)) + ")");
            }
        }
        Map<String, Object> ma = map(ca.get("materials"));
        Map<String, Object> mb = map(cb.get("materials"));
        List<String> materials = new ArrayList<>();
        Set<String> all = new TreeSet<>(ma.keySet());
        all.addAll(mb.keySet());
        for (String m : all) {
            if (!ma.containsKey(m) || !mb.containsKey(m)) {
                other.add("the material " + m + " (in " + (ma.containsKey(m) ? na : nb) + " only)");
            } else if (!Objects.equals(ma.get(m), mb.get(m))) {
                materials.add(m);
            }
        }
        Map<String, Object> pa = map(ca.get("parameters"));
        Map<String, Object> pb = map(cb.get("parameters"));
        Set<String> swept = new TreeSet<>(a.parameters().stream().map(SweepDips.Parameter::name).toList());
        List<String> parameters = new ArrayList<>();
        Set<String> pall = new TreeSet<>(pa.keySet());
        pall.addAll(pb.keySet());
        for (String p : pall) {
            if (!swept.contains(p) && !Objects.equals(pa.get(p), pb.get(p))) {
                parameters.add(p);
            }
        }
        if (materials.size() > 1) {
            throw new Mismatch("more than one material differs between the sweeps: " + String.join(", ", materials)
                    + "; expected the index of one material changed, everything else the same");
        }
        if (materials.isEmpty()) {
            throw new Mismatch("no material differs between the sweeps" + (parameters.isEmpty() && other.isEmpty() ? ""
                    : " (what differs: " + String.join(", ", parametersDiffer(parameters, pa, pb, other)) + ")")
                    + "; expected the index of one material changed, everything else the same (e.g. evanesce sweep CASE "
                    + "--set n_water=1.3421 --out B beside a sweep with n_water=1.3321)");
        }
        String material = materials.get(0);
        other.addAll(gridDifferences(map(a.runJson().get("grid")), map(b.runJson().get("grid")), material));
        Map<String, Object> ea = map(ma.get(material));
        Map<String, Object> eb = map(mb.get(material));
        if (!Boolean.FALSE.equals(ea.get("dispersive")) || !Boolean.FALSE.equals(eb.get("dispersive"))) {
            throw new Mismatch("the material " + material + " differs, but it is dispersive (a metal model) in at least one "
                    + "sweep; a shift per refractive-index unit needs a plain index or permittivity changed");
        }
        double design = number(ca.get("design_wavelength_m"));
        String carrier = null;
        for (String p : parameters) {
            double va = number(pa.get(p));
            double vb = number(pb.get(p));
            if (carrier == null && isIndex(va, ea, design) && isIndex(vb, eb, design)) {
                carrier = p;
            } else {
                other.add("the parameter " + p + " (" + pa.get(p) + " against " + pb.get(p) + ")");
            }
        }
        if (!other.isEmpty()) {
            throw new Mismatch("besides the material " + material + " (" + indexWords(ea, design) + " against "
                    + indexWords(eb, design) + "), " + String.join(", ", other) + " differ" + (other.size() == 1 ? "s" : "")
                    + "; expected only one material's index changed between the two sweeps");
        }
        List<String> notes = new ArrayList<>();
        if (!Objects.equals(a.caseSha256(), b.caseSha256())) {
            notes.add("the sweeps ran different case files (" + a.caseFile() + ", " + b.caseFile() + "); compared what their "
                    + "first points' run.json record (parameters, materials' permittivities, grid, boundaries, sources, probes); "
                    + "a shape's size written without a parameter is not recorded there: make sure nothing else was edited");
        }
        List<Row> rows = new ArrayList<>();
        for (Map.Entry<String, SweepDips.Dip> e : a.dips().entrySet()) {
            SweepDips.Dip da = e.getValue();
            SweepDips.Dip db = b.dips().get(e.getKey());
            double wl = number(da.wavelengthNm()) * 1e-9;
            rows.add(new Row(da, db, index(ea, wl, material, a), index(eb, wl, material, b)));
        }
        if (rows.stream().anyMatch(r -> !r.bracketed())) {
            notes.add(rows.stream().filter(r -> !r.bracketed()).count() + " of " + rows.size() + " dips lie at an end of the "
                    + "angle range in one sweep or both (bracketed_a/_b false): their shift is not the dip's; widen the angle range");
        }
        return new Result(a, b, material, carrier, rows, notes);
    }

    /**
     * What differs in run.json's grid: any entry, but in {@code relative_permittivity_on_grid} (each material's
     * permittivity as the grid holds it) the material whose index was changed.
     */
    private static List<String> gridDifferences(Map<String, Object> ga, Map<String, Object> gb, String material) {
        List<String> out = new ArrayList<>();
        Set<String> keys = new TreeSet<>(ga.keySet());
        keys.addAll(gb.keySet());
        for (String k : keys) {
            if (k.equals("relative_permittivity_on_grid")) {
                Map<String, Object> ea = new TreeMap<>(map(ga.get(k)));
                Map<String, Object> eb = new TreeMap<>(map(gb.get(k)));
                ea.remove(material);
                eb.remove(material);
                if (!ea.equals(eb)) {
                    out.add("the grid's " + k + " (" + brief(ea) + " against " + brief(eb) + ", " + material + " aside)");
                }
            } else if (!Objects.equals(ga.get(k), gb.get(k))) {
                out.add("the grid's " + k + " (" + brief(ga.get(k)) + " against " + brief(gb.get(k)) + ")");
            }
        }
        return out;
    }

    private static List<String> parametersDiffer(List<String> parameters, Map<String, Object> pa, Map<String, Object> pb,
                                                 List<String> other) {
        List<String> out = new ArrayList<>();
        parameters.forEach(p -> out.add("the parameter " + p + " (" + pa.get(p) + " against " + pb.get(p) + ")"));
        out.addAll(other);
        return out;
    }

    /** Whether a parameter's value is the material's index or permittivity at the design wavelength. */
    private static boolean isIndex(double value, Map<String, Object> material, double wavelength) {
        Complex eps = epsilon(material, wavelength);
        if (eps == null || !Double.isFinite(value)) {
            return false;
        }
        double n = eps.sqrtUpper().re();
        return Math.abs(value - n) <= SAME_NUMBER * Math.abs(n) || Math.abs(value - eps.re()) <= SAME_NUMBER * Math.abs(eps.re());
    }

    private static String indexWords(Map<String, Object> material, double wavelength) {
        Complex eps = epsilon(material, wavelength);
        return eps == null ? "?" : String.format(Locale.ROOT, "n = %.6g", eps.sqrtUpper().re());
    }

    /** Re √ε of the material at the wavelength, as the run recorded it. */
    private static double index(Map<String, Object> material, double wavelength, String name, SweepDips s) throws Mismatch {
        Complex eps = epsilon(material, wavelength);
        if (eps == null) {
            throw new Mismatch(s.runJsonPath() + ": the material " + name + " has no permittivity recorded at "
                    + String.format(Locale.ROOT, "%.6g nm", wavelength * 1e9) + " (expected one per flux wavelength)");
        }
        return eps.sqrtUpper().re();
    }

    /** The recorded ε at the wavelength (within 1e-9 relative), or null. */
    private static Complex epsilon(Map<String, Object> material, double wavelength) {
        if (!(material.get("permittivity") instanceof List<?> list)) {
            return null;
        }
        for (Object o : list) {
            if (o instanceof Map<?, ?> e && Math.abs(number(e.get("wavelength_m")) - wavelength) <= 1e-9 * wavelength) {
                return new Complex(number(e.get("epsilon_real")), number(e.get("epsilon_imaginary")));
            }
        }
        return null;
    }

    /** The CSV table. */
    public static String csv(Result r) {
        StringBuilder sb = new StringBuilder("wavelength_nm");
        SweepDips s = r.a();
        for (int k = 0; k < s.parameters().size(); k++) {
            if (k != s.angle()) {
                sb.append(',').append(SweepMerge.quote(s.parameters().get(k).name()));
            }
        }
        sb.append(",column,material,index_a,index_b,dip_a_deg,dip_b_deg,value_a,value_b,bracketed_a,bracketed_b,"
                + "shift_deg_per_index_unit\n");
        for (Row row : r.rows()) {
            sb.append(row.a().wavelengthNm());
            row.a().others().forEach(t -> sb.append(',').append(SweepMerge.quote(t)));
            sb.append(',').append(row.a().column()).append(',').append(SweepMerge.quote(r.material())).append(',')
                    .append(e(row.indexA())).append(',').append(e(row.indexB())).append(',')
                    .append(e(Math.toDegrees(row.a().angleRad()))).append(',').append(e(Math.toDegrees(row.b().angleRad())))
                    .append(',').append(e(row.a().value())).append(',').append(e(row.b().value())).append(',')
                    .append(row.a().bracketed()).append(',').append(row.b().bracketed()).append(',')
                    .append(e(row.shiftDegPerIndexUnit())).append('\n');
        }
        return sb.toString();
    }

    /** The record of what was compared. */
    public static Map<String, Object> record(Result r, String version, String caution) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("program", "evanesce");
        m.put("schema", "evanesce-dip-shift-1");
        m.put("version", version);
        List<Object> sweeps = new ArrayList<>();
        for (SweepDips s : List.of(r.a(), r.b())) {
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("folder", s.dir().toAbsolutePath().toString());
            e.put("case_file", s.caseFile());
            e.put("case_sha256", s.caseSha256());
            e.put("set", s.set());
            e.put("run_json", s.runJsonPath().toAbsolutePath().toString());
            sweeps.add(e);
        }
        m.put("sweeps", sweeps);
        m.put("angle_parameter", r.a().angleParameter().name());
        m.put("material", r.material());
        m.put("parameter", r.parameter());
        m.put("shift", "(dip_b - dip_a) / (index_b - index_a) in degrees per refractive-index unit; the dips from each "
                + "sweep's sweep-extrema.csv; index = Re sqrt(eps) of the material at the wavelength, as each run recorded it");
        m.put("notes", r.notes());
        m.put("caution", caution);
        return m;
    }

    /**
     * The printed table: the rows whose dips lie inside the range in both sweeps and whose columns vary by at least
     * {@link SweepExtrema#PRINTED_DEPTH} over it (at most {@value #PRINTED}), and what is left out.
     */
    public static String summary(Result r) {
        StringBuilder sb = new StringBuilder();
        SweepDips.Parameter angle = r.a().angleParameter();
        sb.append(String.format(Locale.ROOT, "dip shift per refractive-index unit of %s%s, against the swept angle %s "
                + "(both dips inside the range):%n", r.material(), r.parameter() == null ? "" : " (parameter " + r.parameter() + ")",
                angle.name()));
        int printed = 0;
        int more = 0;
        int shallow = 0;
        for (Row row : r.rows()) {
            if (!row.bracketed()) {
                continue;
            }
            if (!(row.a().span() >= SweepExtrema.PRINTED_DEPTH && row.b().span() >= SweepExtrema.PRINTED_DEPTH)) {
                shallow++;
                continue;
            }
            if (printed++ >= PRINTED) {
                more++;
                continue;
            }
            String others = row.a().others().isEmpty() ? "" : ", " + String.join(", ", row.a().others());
            sb.append(String.format(Locale.ROOT, "  %s (%s nm%s): n %.6g -> %.6g, dip %.4f -> %.4f deg (%s %.4g -> %.4g): "
                    + "%.4g deg per unit%n", row.a().column(), plain(row.a().wavelengthNm()), others, row.indexA(), row.indexB(),
                    Math.toDegrees(row.a().angleRad()), Math.toDegrees(row.b().angleRad()), row.a().column(), row.a().value(),
                    row.b().value(), row.shiftDegPerIndexUnit()));
        }
        if (printed == 0) {
            sb.append(String.format(Locale.ROOT, "  none: no column has its dip inside the angle range in both sweeps%n"));
        }
        long ends = r.rows().stream().filter(x -> !x.bracketed()).count();
        if (more > 0 || ends > 0 || shallow > 0) {
            sb.append(String.format(Locale.ROOT, "  (%d more, %d with a dip at an end of the range, %d whose column varies by less "
                    + "than %.0e over the range (within the simulation's accuracy: noise can make such dips): in %s)%n", more, ends,
                    shallow, SweepExtrema.PRINTED_DEPTH, CSV));
        }
        return sb.toString();
    }

    private static Set<String> names(Set<String> keys) {
        Set<String> out = new TreeSet<>();
        for (String k : keys) {
            String[] f = k.split("\u0000", -1);
            out.add(f[f.length - 1] + " at " + plain(f[0]) + " nm");
        }
        return out;
    }

    private static String describe(List<SweepDips.Parameter> ps) {
        List<String> out = new ArrayList<>();
        for (SweepDips.Parameter p : ps) {
            List<String> v = p.values();
            out.add(p.name() + " " + (v.size() <= 4 ? v.toString() : "[" + v.get(0) + ", " + v.get(1) + ", ... " + v.get(v.size() - 1)
                    + "] (" + v.size() + " values)"));
        }
        return String.join(", ", out);
    }

    private static String brief(Object o) {
        String s = String.valueOf(o);
        return s.length() <= 80 ? s : s.substring(0, 77) + "...";
    }

    @SuppressWarnings("unchecked")
    private static Map<String, Object> map(Object o) {
        return o instanceof Map<?, ?> m ? (Map<String, Object>) m : Map.of();
    }

    private static double number(Object o) {
        if (o instanceof Number n) {
            return n.doubleValue();
        }
        try {
            return o == null ? Double.NaN : Double.parseDouble(String.valueOf(o).strip());
        } catch (NumberFormatException e) {
            return Double.NaN;
        }
    }

}
