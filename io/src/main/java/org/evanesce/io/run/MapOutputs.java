package org.evanesce.io.run;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.evanesce.geometry.GridSpec;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.io.casefile.model.MapsSpec;
import org.evanesce.io.casefile.model.SourceSpec;
import org.evanesce.io.output.hdf5.AxisDataset;
import org.evanesce.io.output.hdf5.FieldDataset;
import org.evanesce.io.output.hdf5.FieldStack;
import org.evanesce.io.output.hdf5.Hdf5Dataset;
import org.evanesce.io.output.hdf5.Hdf5Writer;
import org.evanesce.io.output.hdf5.Xdmf;
import org.evanesce.io.output.image.FieldPicture;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.io.plan.FieldPlan;
import org.evanesce.io.plan.PlaneWaves;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.record.FieldMap;
import org.evanesce.solver.record.Nodes;
import org.evanesce.solver.reference.DecayFit;

/**
 * The frequency-domain maps of a run: maps.h5 (real and imaginary parts of every component at each
 * frequency, averaged onto the nodes, and |E|, each a stack over the wavelengths that the index dataset
 * {@code wavelength_m} names), maps.xmf, the pictures, and the decay-length fits.
 */
public final class MapOutputs {

    private MapOutputs() {
    }

    /**
     * One decay fit.
     *
     * @param name        the line's name
     * @param wavelength  vacuum wavelength, m
     * @param fit         the fitted decay
     * @param planeWave   λ0 / (2π √(n1² sin²θ − n2²)) for the case's plane wave or beam, NaN where it does not apply
     * @param problem     why there is no fit (the field does not decay along the line, or is zero), else null
     */
    public record Decay(String name, double wavelength, DecayFit fit, double planeWave, String problem) { }

    /** Name of the index dataset of maps.h5: the vacuum wavelength of each layer of the map stacks, m. */
    public static final String WAVELENGTH = "wavelength_m";
    /** Name of the index dataset of maps.h5: the frequency of each layer, Hz. */
    public static final String FREQUENCY = "frequency_hz";
    /** Name of the stack of |E| in maps.h5. */
    public static final String MAGNITUDE = "E_magnitude";
    /** Name of the dataset of maps.h5 with {@code normalise: incident}: |E_inc| per layer, V·s/m. */
    public static final String INCIDENT = "incident_field_amplitude";
    /** The attribute of a stack divided by the incident field: what it was divided by ("|E_inc|"). */
    public static final String RELATIVE_TO = "relative_to";

    /** v times s, in place; returns v. */
    private static double[] scaled(double[] v, double s) {
        if (s != 1) {
            for (int k = 0; k < v.length; k++) {
                v[k] *= s;
            }
        }
        return v;
    }

    /** The dataset names of a component's transform: "E_z_real", "E_z_imaginary". */
    public static String partName(Component c, boolean real) {
        return FieldOutputs.datasetName(c) + (real ? "_real" : FieldOutputs.IMAGINARY);
    }

    /** The wavelength as picture file names carry it: "633.00nm". */
    public static String pictureTag(double wavelength) {
        return String.format(Locale.ROOT, "%.2fnm", wavelength * 1e9);
    }

    /**
     * Writes the maps and their pictures into {@code dir}; returns the decay fits. maps.h5 holds each
     * component's transform as two stacks, {@code E_z_real} and {@code E_z_imaginary} (shape
     * {@code [wavelengths][ny][nx]}), |E| as the stack {@code E_magnitude}, the index datasets
     * {@code wavelength_m} and {@code frequency_hz} that give each layer's wavelength and frequency, the
     * permittivity and {@code material_id}.
     */
    public static List<Decay> write(CasePlan plan, Path dir) throws IOException {
        FieldPlan.Maps maps = plan.fields().maps().orElseThrow();
        FieldMap fm = maps.map();
        int[] box = maps.box();
        GridSpec r = FieldOutputs.regionGrid(plan, box);
        Polarization pol = plan.spec().polarization().value();
        List<Component> comps = List.of(pol.components());
        int[] ids = FieldOutputs.ids(plan, box);
        int count = fm.frequencyCount();
        double[] frequencies = new double[count];
        double[] wavelengths = new double[count];
        List<List<double[]>> real = new ArrayList<>();
        List<List<double[]>> imag = new ArrayList<>();
        for (int c = 0; c < comps.size(); c++) {
            real.add(new ArrayList<>());
            imag.add(new ArrayList<>());
        }
        List<double[]> magnitudes = new ArrayList<>();
        List<Decay> decays = new ArrayList<>();
        double decades = maps.spec().logDecades().si();
        IncidentField incident = maps.spec().normalise().value() == MapsSpec.Normalise.INCIDENT ? IncidentField.of(plan) : null;
        String per = incident == null ? null : IncidentField.SYMBOL;
        String over = incident == null ? "" : "/" + IncidentField.SYMBOL;
        for (int q = 0; q < count; q++) {
            double f = fm.frequency(q);
            double wl = PhysicalConstants.C0 / f;
            frequencies[q] = f;
            wavelengths[q] = wl;
            String tag = pictureTag(wl);
            double scale = incident == null ? 1 : 1 / incident.amplitude()[q];
            double[] e2 = new double[r.nx() * r.ny()];
            for (int ci = 0; ci < comps.size(); ci++) {
                Component c = comps.get(ci);
                double[][] t = fm.transform(c, q);
                double[] re = scaled(Nodes.average(c, t[0], r.nx(), r.ny()), scale);
                double[] im = scaled(Nodes.average(c, t[1], r.nx(), r.ny()), scale);
                real.get(ci).add(re);
                imag.get(ci).add(im);
                if (c.electric) {
                    for (int k = 0; k < e2.length; k++) {
                        e2[k] += re[k] * re[k] + im[k] * im[k];
                    }
                }
                if (c == (pol == Polarization.S ? Component.EZ : Component.HZ)) {
                    // eta0*Hz is stored in the electric field's unit; relative to |E_inc| the unit is gone, the name keeps eta0
                    String shown = per != null && !c.electric ? "eta0*" + FieldOutputs.name(c) : FieldOutputs.name(c);
                    FieldPicture.of(re, r, shown, FieldOutputs.transformUnit(c), FieldPicture.Quantity.REAL)
                            .relativeTo(per).outlines(ids)
                            .title(String.format(Locale.ROOT, "Re %s%s at %.2f nm", shown, over, wl * 1e9))
                            .writePng(dir.resolve("map-" + c.name().toLowerCase(Locale.ROOT) + "-" + tag + ".png"));
                }
            }
            double[] mag = new double[e2.length];
            for (int k = 0; k < e2.length; k++) {
                mag[k] = Math.sqrt(e2[k]);
            }
            magnitudes.add(mag);
            FieldPicture.of(mag, r, "E", FieldOutputs.TRANSFORM_UNIT, FieldPicture.Quantity.MAGNITUDE).relativeTo(per).outlines(ids)
                    .logScale(decades).title(String.format(Locale.ROOT, "|E|%s at %.2f nm, log scale", over, wl * 1e9))
                    .writePng(dir.resolve("map-E-" + tag + "-log.png"));
            for (MapsSpec.DecayLine line : maps.spec().decay()) {
                try {
                    decays.add(new Decay(line.name().value(), wl, fit(plan, line, mag, r), planeWave(plan, line, f), null));
                } catch (IllegalArgumentException e) {
                    decays.add(new Decay(line.name().value(), wl, null, planeWave(plan, line, f), e.getMessage()));
                }
            }
        }
        List<Hdf5Dataset> sets = new ArrayList<>();
        sets.add(new AxisDataset(WAVELENGTH, wavelengths, Map.of("quantity", "vacuum wavelength of each map", "unit", "m")));
        sets.add(new AxisDataset(FREQUENCY, frequencies, Map.of("quantity", "frequency of each map", "unit", "Hz")));
        List<FieldStack> stacks = new ArrayList<>();
        for (int ci = 0; ci < comps.size(); ci++) {
            Component c = comps.get(ci);
            for (boolean isReal : new boolean[] {true, false}) {
                String part = isReal ? "real" : "imaginary";
                Map<String, Object> a = stackAttributes(plan, r, c, "Fourier transform, " + part + " part", FieldOutputs.transformUnit(c),
                        incident);
                a.put("part", part);
                stacks.add(new FieldStack(partName(c, isReal), isReal ? real.get(ci) : imag.get(ci), r.nx(), r.ny(),
                        Precision.FLOAT, a));
            }
        }
        stacks.add(new FieldStack(MAGNITUDE, magnitudes, r.nx(), r.ny(), Precision.FLOAT, stackAttributes(plan, r,
                pol == Polarization.S ? Component.EZ : Component.EX, "magnitude of the transformed electric field |E|", FieldOutputs.TRANSFORM_UNIT,
                incident)));
        sets.addAll(stacks);
        if (incident != null) {
            sets.add(new AxisDataset(INCIDENT, incident.amplitude(), Map.of("quantity", "amplitude of the incident electric field "
                    + "|E_inc| at each wavelength, which the map stacks are divided by: " + incident.definition(), "unit",
                    FieldOutputs.TRANSFORM_UNIT)));
        }
        // the permittivity beside the maps, once for all wavelengths
        List<FieldDataset> permittivity = FieldOutputs.permittivity(plan, box, "relative permittivity on the grid");
        sets.addAll(permittivity);
        sets.add(FieldOutputs.materialIds(plan, box, Map.of("log_decades", decades)));
        List<Xdmf.Grid> grids = new ArrayList<>();
        for (int q = 0; q < count; q++) {
            List<Xdmf.Attribute> attrs = new ArrayList<>();
            for (FieldStack st : stacks) {
                attrs.add(Xdmf.Attribute.of(st.name(), "maps.h5", st, q));
            }
            for (FieldDataset eps : permittivity) {
                attrs.add(Xdmf.Attribute.of(eps.name(), "maps.h5", eps));
            }
            grids.add(new Xdmf.Grid(String.format(Locale.ROOT, "map at %.2f nm", wavelengths[q] * 1e9), r.nx(), r.ny(), r.x0(),
                    r.y0(), r.cellSize(), attrs));
        }
        Hdf5Writer.write(dir.resolve("maps.h5"), FieldOutputs.fileAttributes(plan), sets);
        FieldOutputs.writeText(dir.resolve("maps.xmf"), Xdmf.spatial(incident == null ? "frequency-domain maps"
                : "frequency-domain maps relative to the incident field " + IncidentField.SYMBOL, grids));
        return decays;
    }

    /**
     * A stack's attributes: those of a field dataset, and what indexes its first axis; relative to the incident field
     * (not null), the unit 1 and {@code relative_to} naming what each layer was divided by.
     */
    private static Map<String, Object> stackAttributes(CasePlan plan, GridSpec r, Component c, String quantity, String unit,
                                                       IncidentField incident) {
        Map<String, Object> a = FieldOutputs.attributes(plan, r, c, incident == null ? quantity
                : quantity + ", divided by the incident field's amplitude " + IncidentField.SYMBOL + " (dataset " + INCIDENT + ")");
        a.put("unit", incident == null ? unit : "1");
        if (incident != null) {
            a.put(RELATIVE_TO, IncidentField.SYMBOL);
        }
        a.put("axes", "wavelength, y, x");
        a.put("wavelength_index", WAVELENGTH);
        return a;
    }

    /** |E| sampled every cell along the line (bilinear between nodes), fitted by A e^{−s/L}. */
    static DecayFit fit(CasePlan plan, MapsSpec.DecayLine line, double[] mag, GridSpec r) {
        double length = line.length();
        int n = Math.max(3, (int) Math.floor(length / r.cellSize()) + 1);
        double[] s = new double[n];
        double[] m = new double[n];
        for (int k = 0; k < n; k++) {
            double t = n == 1 ? 0 : (double) k / (n - 1);
            double x = line.from().x().si() + t * (line.to().x().si() - line.from().x().si());
            double y = line.from().y().si() + t * (line.to().y().si() - line.from().y().si());
            s[k] = t * length;
            m[k] = bilinear(mag, r, x, y);
        }
        return DecayFit.fit(s, m);
    }

    static double bilinear(double[] v, GridSpec r, double x, double y) {
        double fi = Math.min(Math.max((x - r.x0()) / r.cellSize(), 0), r.nx() - 1.000001);
        double fj = Math.min(Math.max((y - r.y0()) / r.cellSize(), 0), r.ny() - 1.000001);
        int i = (int) fi;
        int j = (int) fj;
        double a = fi - i;
        double b = fj - j;
        int w = r.nx();
        return (1 - a) * (1 - b) * v[j * w + i] + a * (1 - b) * v[j * w + i + 1] + (1 - a) * b * v[(j + 1) * w + i]
                + a * b * v[(j + 1) * w + i + 1];
    }

    /** The plane-wave decay length for the case's plane wave or beam at frequency f, NaN where it does not apply. */
    static double planeWave(CasePlan plan, MapsSpec.DecayLine line, double f) {
        SourceSpec.Launched w = PlaneWaves.launched(plan.spec()).orElse(null);
        if (w == null) {
            return Double.NaN;
        }
        double k0 = 2 * Math.PI * f / PhysicalConstants.C0;
        // a plane wave keeps its kx at every frequency; a beam keeps its axis
        double kx = w instanceof SourceSpec.PlaneWave ? PlaneWaves.launchedKx(plan.spec())
                : k0 * PlaneWaves.medium(plan.spec(), w).index() * Math.sin(w.angle().si());
        double n2 = plan.spec().materials().get(plan.spec().materialAt(line.from().x().si(), line.from().y().si())).index();
        double q = kx * kx - n2 * n2 * k0 * k0;
        return q > 0 ? 1 / Math.sqrt(q) : Double.NaN;
    }

    /** The decay fits for summary.json. */
    public static List<Object> summary(List<Decay> decays) {
        List<Object> out = new ArrayList<>();
        for (Decay d : decays) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("name", d.name());
            m.put("wavelength_m", d.wavelength());
            m.put("plane_wave_decay_length_m", d.planeWave());
            if (d.fit() == null) {
                m.put("no_fit", d.problem());
            } else {
                m.put("decay_length_m", d.fit().length());
                m.put("decay_length_uncertainty_m", d.fit().lengthUncertainty());
                m.put("points", d.fit().points());
                m.put("rms_residual_of_ln_magnitude", d.fit().rmsResidual());
                m.put("relative_difference", Double.isFinite(d.planeWave()) ? d.fit().length() / d.planeWave() - 1 : Double.NaN);
            }
            out.add(m);
        }
        return out;
    }
}
