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
import org.evanesce.io.casefile.MapsSpec;
import org.evanesce.io.casefile.SourceSpec;
import org.evanesce.io.output.hdf5.FieldDataset;
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
 * frequency, averaged onto the nodes, and |E|), maps.xmf, the pictures, and the decay-length fits.
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

    /** Writes the maps and their pictures into {@code dir}; returns the decay fits. */
    public static List<Decay> write(CasePlan plan, Path dir) throws IOException {
        FieldPlan.Maps maps = plan.fields().maps().orElseThrow();
        FieldMap fm = maps.map();
        int[] box = maps.box();
        GridSpec r = FieldOutputs.regionGrid(plan, box);
        Polarization pol = plan.spec().polarization().value();
        int[] ids = FieldOutputs.ids(plan, box);
        List<FieldDataset> sets = new ArrayList<>();
        List<Xdmf.Grid> grids = new ArrayList<>();
        List<Decay> decays = new ArrayList<>();
        double decades = maps.spec().logDecades().si();
        // the permittivity beside the maps, once for all frequencies
        List<FieldDataset> permittivity = FieldOutputs.permittivity(plan, box, "relative permittivity on the grid");
        sets.addAll(permittivity);
        for (int q = 0; q < fm.frequencyCount(); q++) {
            double f = fm.frequency(q);
            double wl = PhysicalConstants.C0 / f;
            String tag = String.format(Locale.ROOT, "%.2fnm", wl * 1e9);
            List<Xdmf.Attribute> attrs = new ArrayList<>();
            double[] e2 = new double[r.nx() * r.ny()];
            for (Component c : pol.components()) {
                double[][] t = fm.transform(c, q);
                double[] re = Nodes.average(c, t[0], r.nx(), r.ny());
                double[] im = Nodes.average(c, t[1], r.nx(), r.ny());
                for (String part : List.of("real", "imag")) {
                    Map<String, Object> a = FieldOutputs.attributes(plan, r, c, "Fourier transform, " + part + " part");
                    a.put("unit", FieldOutputs.unit(c) + " s");
                    a.put("frequency_hz", f);
                    a.put("wavelength_m", wl);
                    FieldDataset d = new FieldDataset(FieldOutputs.name(c) + "_" + part + "_" + tag, part.equals("real") ? re : im,
                            r.nx(), r.ny(), Precision.FLOAT, a);
                    sets.add(d);
                    attrs.add(Xdmf.Attribute.of(FieldOutputs.name(c) + "_" + part, "maps.h5", d));
                }
                if (c.electric) {
                    for (int k = 0; k < e2.length; k++) {
                        e2[k] += re[k] * re[k] + im[k] * im[k];
                    }
                }
                if (c == (pol == Polarization.S ? Component.EZ : Component.HZ)) {
                    FieldPicture.of(re, r, FieldOutputs.name(c), FieldOutputs.unit(c) + " s", FieldPicture.Quantity.REAL)
                            .outlines(ids).title(String.format(Locale.ROOT, "Re %s at %.2f nm", FieldOutputs.name(c), wl * 1e9))
                            .writePng(dir.resolve("map-" + c.name().toLowerCase(Locale.ROOT) + "-" + tag + ".png"));
                }
            }
            for (FieldDataset eps : permittivity) {
                attrs.add(Xdmf.Attribute.of(eps.name(), "maps.h5", eps));
            }
            double[] mag = new double[e2.length];
            for (int k = 0; k < e2.length; k++) {
                mag[k] = Math.sqrt(e2[k]);
            }
            Map<String, Object> a = FieldOutputs.attributes(plan, r, pol == Polarization.S ? Component.EZ : Component.EX,
                    "magnitude of the transformed electric field |E|");
            a.put("unit", "V/m s");
            a.put("frequency_hz", f);
            a.put("wavelength_m", wl);
            FieldDataset d = new FieldDataset("E_magnitude_" + tag, mag, r.nx(), r.ny(), Precision.FLOAT, a);
            sets.add(d);
            attrs.add(Xdmf.Attribute.of("E_magnitude", "maps.h5", d));
            grids.add(new Xdmf.Grid("map " + tag, r.nx(), r.ny(), r.x0(), r.y0(), r.cellSize(), attrs));
            FieldPicture.of(mag, r, "E", "V/m s", FieldPicture.Quantity.MAGNITUDE).outlines(ids).logScale(decades)
                    .title(String.format(Locale.ROOT, "|E| at %.2f nm, log scale", wl * 1e9))
                    .writePng(dir.resolve("map-E-" + tag + "-log.png"));
            for (MapsSpec.DecayLine line : maps.spec().decay()) {
                try {
                    decays.add(new Decay(line.name().value(), wl, fit(plan, line, mag, r), planeWave(plan, line, f), null));
                } catch (IllegalArgumentException e) {
                    decays.add(new Decay(line.name().value(), wl, null, planeWave(plan, line, f), e.getMessage()));
                }
            }
        }
        sets.add(FieldOutputs.materialIds(plan, box, Map.of("log_decades", decades)));
        Hdf5Writer.write(dir.resolve("maps.h5"), FieldOutputs.fileAttributes(plan), sets);
        FieldOutputs.writeText(dir.resolve("maps.xmf"), Xdmf.spatial("frequency-domain maps", grids));
        return decays;
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
