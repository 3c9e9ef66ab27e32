package org.evanesce.io.run;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.io.casefile.model.SurfacesSpec;
import org.evanesce.io.output.Scientific;
import org.evanesce.io.plan.SurfacePlan;
import org.evanesce.solver.farfield.LineSpectrum;
import org.evanesce.solver.farfield.NearToFarField;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.record.FluxLine;

/**
 * The powers of a case's {@code surfaces} section from a finished run (and its reference run): per frequency the
 * flux through each segment, the net power out of each box, each far-field contour's radiated total (and its net
 * flux, which a lossless homogeneous outside makes equal) and each exit spectrum's outgoing power and the part within
 * its numerical aperture, all divided by the norm; the far-field patterns and exit spectra per angle.
 *
 * @param columns     the value columns of surfaces.csv after wavelength and frequency, in order
 * @param rows        per frequency: the values of the columns (NaN where undefined)
 * @param norm        per frequency the norm in absolute units (W/m or J/(m·Hz)); 1 for absolute powers
 * @param farFields   per far-field contour, its pattern
 * @param exits       per exit spectrum, its angular distribution
 * @param continuous  whether the values are time averages of a continuous wave (else energies per hertz)
 */
public record SurfaceResults(SurfacePlan plan, List<String> columns, double[][] rows, double[] norm,
                             List<Pattern> farFields, List<Spectrum> exits, boolean continuous) {

    /**
     * Zero padding of an exit line's samples (finer angles) when the sides are not periodic; one period of periodic
     * sides is transformed as it is, its plane waves being exactly the Bloch orders.
     */
    static final int OVERSAMPLING = 4;

    /**
     * A far-field pattern: at each angle (degrees from +x, counter-clockwise) and frequency, the power per radian
     * over the norm (1/rad; W/(m·rad) or J/(m·Hz·rad) for absolute powers), or with a plane-wave box's incident norm
     * ({@code widths}) the scattering width σ(φ) = 2π (power per radian)/intensity, m; {@code total} is the power over
     * the norm (the scattering width C_sca = (1/2π)∫σ dφ, m, with widths); {@code extinction} the extinction width
     * from the optical theorem, m, or null where it does not apply.
     */
    public record Pattern(String name, double[] anglesDegrees, double[][] values, double[] total, boolean widths,
                          double[] extinction) { }

    /**
     * An exit spectrum: per frequency the bins' angles in the exit medium (degrees from the exit normal, positive
     * towards +x) and the outgoing power per radian over the norm; with periodic sides ({@code orders}) each bin is
     * one Bloch order, a single plane wave, and {@code perRadian} holds its power over the norm instead.
     */
    public record Spectrum(String name, List<double[]> anglesDegrees, List<double[]> perRadian, double[] outgoing,
                           double[] aperture, double numericalAperture, boolean orders) { }

    /** Computes the table and patterns on the caller's thread. */
    public static SurfaceResults of(SurfacePlan p) {
        return of(p, 1);
    }

    /**
     * Computes the table and patterns, the far-field transforms of up to {@code threads} wavelengths at once (each
     * wavelength's values are computed by the same code whichever thread takes it, so they do not depend on the
     * number).
     */
    public static SurfaceResults of(SurfacePlan p, int threads) {
        int nf = p.frequencies().length;
        double dx = p.cellSize();
        double[] factor = new double[nf];
        double[] norm = new double[nf];
        double scale = absoluteScale(p);
        for (int q = 0; q < nf; q++) {
            if (p.widths()) {
                // a plane-wave box: absolute powers over its wave's intensity, widths in metres
                double intensity = p.boxWave().orElseThrow().intensity();
                factor[q] = scale / intensity;
                norm[q] = intensity;
                continue;
            }
            double n = p.incidentLine().isPresent() ? p.incidentLine().get().flux(q, dx) * p.incidentDirection()
                    : p.sourceBox().isPresent() ? p.sourceBox().get().outward(q, dx) : Double.NaN;
            boolean absolute = p.normalise() == SurfacesSpec.Normalise.ABSOLUTE;
            factor[q] = absolute ? scale : 1 / n;
            norm[q] = absolute ? 1 : n * scale;
        }
        List<String> columns = new ArrayList<>();
        List<double[]> values = new ArrayList<>();
        for (SurfacePlan.Segment s : p.segments()) {
            columns.add(s.spec().name().value());
            double[] v = new double[nf];
            for (int q = 0; q < nf; q++) {
                v[q] = segmentFlux(s.line(), q, dx, p.polarization()) * factor[q];
            }
            values.add(v);
        }
        for (SurfacePlan.Box b : p.boxes()) {
            columns.add(b.spec().name().value() + "_out");
            double[] v = new double[nf];
            for (int q = 0; q < nf; q++) {
                v[q] = b.box().outward(q, dx) * factor[q];
            }
            values.add(v);
        }
        List<Pattern> patterns = new ArrayList<>();
        for (SurfacePlan.FarField f : p.farFields()) {
            int na = f.spec().angles().value();
            double[] deg = new double[na];
            for (int a = 0; a < na; a++) {
                deg[a] = 360.0 * a / na;
            }
            double[][] per = new double[nf][na];
            double[] total = new double[nf];
            double[] net = new double[nf];
            double[] ext = new double[nf];
            boolean theorem = opticalTheorem(p, f);
            // each wavelength's transform on its own (they share nothing), several at once on the run's threads
            WorkShare.each(nf, threads, q -> {
                NearToFarField ff = f.contour().farField(q, f.index(), p.gridX0(), p.gridY0(), dx, f.originX(), f.originY());
                for (int a = 0; a < na; a++) {
                    per[q][a] = ff.powerPerRadian(Math.toRadians(deg[a])) * factor[q] * (p.widths() ? 2 * Math.PI : 1);
                }
                total[q] = ff.radiatedPower() * factor[q];
                net[q] = f.contour().box().outward(q, dx) * factor[q];
                ext[q] = theorem ? extinctionWidth(p, f, ff, q) : Double.NaN;
            });
            columns.add(f.spec().name().value() + "_far_total");
            values.add(total);
            columns.add(f.spec().name().value() + "_net_out");
            values.add(net);
            if (theorem) {
                // C_ext − C_sca is not written as an absorption: it is the small difference of two widths, each with the
                // grid's error (0.1-0.3 % of C_sca apart for a lossless rod at 30 cells per wavelength); a box inside the
                // plane-wave box measures absorption directly
                columns.add(f.spec().name().value() + "_extinction");
                values.add(ext);
            }
            patterns.add(new Pattern(f.spec().name().value(), deg, per, total, p.widths(), theorem ? ext : null));
        }
        List<Spectrum> spectra = new ArrayList<>();
        for (SurfacePlan.Exit e : p.exits()) {
            double[] out = new double[nf];
            double[] ap = new double[nf];
            List<double[]> angles = new ArrayList<>();
            List<double[]> per = new ArrayList<>();
            double na = e.spec().numericalAperture() == null ? Double.NaN : e.spec().numericalAperture().si();
            for (int q = 0; q < nf; q++) {
                LineSpectrum ls = spectrum(e, q, dx, p.polarization(), e.periodic() ? 1 : OVERSAMPLING);
                out[q] = ls.outgoingPower() * factor[q];
                double[] th = ls.angles();
                double[] d = ls.outgoingPerRadian();
                double half = Double.isNaN(na) ? Double.NaN : na >= e.index() ? Math.PI / 2 : Math.asin(na / e.index());
                double within = 0;
                for (int b = 0; b < d.length; b++) {
                    if (e.periodic()) {
                        // one period: each bin is one Bloch order, a single plane wave; its power, not a density
                        d[b] *= ls.binWidth() / (e.index() * 2 * Math.PI
                                * e.line().frequency(q) / PhysicalConstants.C0 * Math.cos(th[b]));
                        within += Math.abs(th[b]) <= half ? d[b] : 0;
                    }
                    d[b] *= factor[q];
                    th[b] = Math.toDegrees(th[b]);
                }
                ap[q] = Double.isNaN(na) ? Double.NaN : (e.periodic() ? within : ls.powerWithinAperture(na)) * factor[q];
                angles.add(th);
                per.add(d);
            }
            columns.add(e.spec().name().value() + "_out");
            values.add(out);
            if (!Double.isNaN(na)) {
                columns.add(e.spec().name().value() + "_within_na");
                values.add(ap);
            }
            spectra.add(new Spectrum(e.spec().name().value(), angles, per, out, ap, na, e.periodic()));
        }
        double[][] rows = new double[nf][columns.size()];
        for (int c = 0; c < columns.size(); c++) {
            for (int q = 0; q < nf; q++) {
                rows[q][c] = values.get(c)[q];
            }
        }
        return new SurfaceResults(p, columns, rows, norm, patterns, spectra, p.continuous());
    }

    /**
     * Whether a contour's extinction follows from the optical theorem: widths from a plane-wave box whose homogeneous
     * background is the contour's medium (one incident plane wave in it).
     */
    private static boolean opticalTheorem(SurfacePlan p, SurfacePlan.FarField f) {
        return p.boxWave().map(w -> !w.box().layered() && w.medium().equals(f.medium())).orElse(false);
    }

    /**
     * C_ext = −(4/k) Re[F(φ_i)/U_i(0)], m (optical theorem; Bohren &amp; Huffman 1983, §8.4), F the far amplitude
     * from the transforms and U_i(0) the incident phasor at the contour's origin in the same units: a transform over
     * whole periods of duration D holds ½ Û D (FluxLine), D = D_E for s (U = Ez) and D_H for p (U = η0·Hz).
     */
    private static double extinctionWidth(SurfacePlan p, SurfacePlan.FarField f, NearToFarField ff, int q) {
        FluxLine side = f.contour().box().sides()[0];
        long[] n = side.samples();
        // meanPowerScale = 4/(D_E D_H) with D = samples · Δt
        double dt = Math.sqrt(4 / (side.meanPowerScale() * n[0] * n[1]));
        double duration = (p.polarization() == Polarization.S ? n[0] : n[1]) * dt;
        org.evanesce.geometry.Complex incident = p.boxWave().orElseThrow().box()
                .zPhasorAt(f.originX(), f.originY(), side.frequency(q)).times(0.5 * duration);
        return ff.extinctionWidth(p.boxWave().orElseThrow().box().spec().direction(), incident);
    }

    /** The exit line's plane-wave spectrum at frequency q. */
    static LineSpectrum spectrum(SurfacePlan.Exit e, int q, double dx, Polarization pol, int oversampling) {
        FluxLine line = e.line();
        double[][] el = line.electricTransform(q);
        double[][] mg = line.magneticTransform(q);
        double[][] u = pol == Polarization.S ? el : mg;
        double[][] v = pol == Polarization.S ? mg : el;
        double wl = PhysicalConstants.C0 / line.frequency(q);
        return LineSpectrum.of(pol, wl, e.index(), e.exit(), e.firstPosition(), dx, u[0], u[1], v[0], v[1],
                e.blochWavenumber(), oversampling);
    }

    /** The factor from "DFT flux" to absolute units: 4/(D_E D_H) for a continuous wave, 4 (Parseval) for a pulse. */
    private static double absoluteScale(SurfacePlan p) {
        if (!p.continuous()) {
            return 4;
        }
        FluxLine any = p.segments().isEmpty() ? null : p.segments().get(0).line();
        if (any == null && !p.boxes().isEmpty()) {
            any = p.boxes().get(0).box().sides()[0];
        }
        if (any == null && !p.farFields().isEmpty()) {
            any = p.farFields().get(0).contour().box().sides()[0];
        }
        if (any == null) {
            any = p.exits().get(0).line();
        }
        return any.meanPowerScale();
    }

    /** A segment's flux along +x (vertical) or +y, the ends weighted ½ for p (the trapezoid rule, as a box's sides). */
    static double segmentFlux(FluxLine line, int q, double dx, Polarization pol) {
        double[] d = line.fluxDensity(q);
        double s = 0;
        for (int c = 0; c < d.length; c++) {
            s += (pol == Polarization.P && (c == 0 || c == d.length - 1) ? 0.5 : 1.0) * d[c];
        }
        return s * dx;
    }

    /** What the values are, in words (summary.json). */
    public String unit() {
        if (plan.widths()) {
            return "widths in m: powers over the incident intensity (far-field patterns: the scattering width sigma(phi) "
                    + "= 2 pi x power per radian / intensity, m)";
        }
        return switch (plan.normalise()) {
            case INCIDENT -> "fractions of the incident power (angular densities per radian)";
            case SOURCE -> "fractions of the power the sources radiate into their own medium (angular densities per radian)";
            case ABSOLUTE -> continuous ? "W per metre of z (angular densities W/(m rad))"
                    : "J per metre of z per Hz (angular densities J/(m Hz rad))";
        };
    }

    /** The norm's method, in words (summary.json). */
    public String method() {
        if (plan.widths()) {
            SurfacePlan.BoxWave w = plan.boxWave().orElseThrow();
            return String.format(Locale.ROOT, "divided by the intensity of the plane_wave_box's incident wave in %s (n = %s): "
                    + "%s, computed from the box's amplitude; the time-averaged powers are 4 x DFT flux / (D_E D_H)",
                    w.medium(), number(w.index()), plan.polarization() == Polarization.S ? "A^2 n / (2 eta0)"
                    : "A^2 / (2 n eta0)");
        }
        return switch (plan.normalise()) {
            case INCIDENT -> plan.computedIncident().isPresent()
                    ? "divided by the incident power: the flux through a line just ahead of the beam in an unbounded grid "
                    + "filled with " + plan.normMedium().orElse("the launching medium") + ", computed from the beam's sheets "
                    + "(the grid's own update in the frequency domain; no incident-power run)"
                    : "divided by the incident power: the flux through a line just ahead of the plane wave or beam in "
                    + "the incident-power run (the same grid, sources and steps with the domain filled with "
                    + plan.normMedium().orElse("the launching medium") + ")";
            case SOURCE -> "divided by the power the point and line sources radiate into their own medium, measured: the net "
                    + "power out of a box " + org.evanesce.io.plan.SurfacePlan.SOURCE_MARGIN + " cells clear of every source site in a run of the same grid, sources and steps with the domain "
                    + "filled with " + plan.normMedium().orElse("the sources' medium");
            case ABSOLUTE -> continuous ? "absolute: time-averaged power for the stated amplitudes, 4 x DFT flux / (D_E D_H)"
                    : "absolute: energy per hertz of positive frequency for the stated amplitudes, 4 x DFT flux (Parseval)";
        };
    }

    /** surfaces.csv: wavelength_nm, frequency_THz, the value columns, and the norm in absolute units. */
    public String csv() {
        StringBuilder sb = new StringBuilder("wavelength_nm,frequency_THz");
        for (String c : columns) {
            sb.append(',').append(c);
        }
        String normColumn = normColumn();
        if (normColumn != null) {
            sb.append(',').append(normColumn);
        }
        sb.append('\n');
        double[] f = plan.frequencies();
        for (int q = 0; q < f.length; q++) {
            sb.append(String.format(Locale.ROOT, "%.6f,%.6f", PhysicalConstants.C0 / f[q] * 1e9, f[q] * 1e-12));
            for (double v : rows[q]) {
                sb.append(',').append(number(v));
            }
            if (normColumn != null) {
                sb.append(',').append(number(norm[q]));
            }
            sb.append('\n');
        }
        return sb.toString();
    }

    /** The norm's column name with its unit, or null for absolute powers. */
    private String normColumn() {
        if (plan.normalise() == SurfacesSpec.Normalise.ABSOLUTE) {
            return null;
        }
        if (plan.widths()) {
            return "incident_intensity_w_per_m2";
        }
        String what = plan.normalise() == SurfacesSpec.Normalise.INCIDENT ? "incident" : "source";
        return what + (continuous ? "_power_w_per_m" : "_energy_j_per_m_hz");
    }

    /** A value as "%.9e" writes it ({@link Scientific}), or nothing where it is not finite. */
    static String number(double v) {
        return Double.isFinite(v) ? Scientific.format(v, 9) : "";
    }

    /** The table of one far-field pattern: angle_deg, then one column per wavelength (σ in m with widths). */
    public String patternCsv(Pattern p) {
        StringBuilder sb = new StringBuilder("angle_deg");
        double[] f = plan.frequencies();
        for (double fq : f) {
            sb.append(String.format(Locale.ROOT, p.widths() ? ",sigma_m_%.3fnm" : ",per_radian_%.3fnm",
                    PhysicalConstants.C0 / fq * 1e9));
        }
        sb.append('\n');
        for (int a = 0; a < p.anglesDegrees().length; a++) {
            sb.append(String.format(Locale.ROOT, "%.6f", p.anglesDegrees()[a]));
            for (int q = 0; q < f.length; q++) {
                sb.append(',').append(number(p.values()[q][a]));
            }
            sb.append('\n');
        }
        return sb.toString();
    }

    /** The table of one exit spectrum: wavelength_nm, angle_deg, per_radian, one row per bin and wavelength. */
    public String spectrumCsv(Spectrum s) {
        StringBuilder sb = new StringBuilder(s.orders() ? "wavelength_nm,angle_deg,power\n"
                : "wavelength_nm,angle_deg,per_radian\n");
        double[] f = plan.frequencies();
        for (int q = 0; q < f.length; q++) {
            double[] a = s.anglesDegrees().get(q);
            double[] d = s.perRadian().get(q);
            for (int b = 0; b < a.length; b++) {
                sb.append(String.format(Locale.ROOT, "%.6f,%.6f,%s%n", PhysicalConstants.C0 / f[q] * 1e9, a[b], number(d[b])));
            }
        }
        return sb.toString();
    }

    /** The summary.json section. */
    public Map<String, Object> summary() {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("normalise", plan.normalise().caseName());
        m.put("method", method());
        m.put("unit", unit());
        plan.normMedium().ifPresent(x -> m.put("norm_medium", x));
        List<Double> wl = new ArrayList<>();
        List<Double> fr = new ArrayList<>();
        for (double f : plan.frequencies()) {
            wl.add(PhysicalConstants.C0 / f);
            fr.add(f);
        }
        m.put("wavelengths_m", wl);
        m.put("frequencies_hz", fr);
        if (normColumn() != null) {
            m.put(normColumn(), list(norm));
        }
        List<Map<String, Object>> cols = new ArrayList<>();
        for (int c = 0; c < columns.size(); c++) {
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("column", columns.get(c));
            double[] v = new double[rows.length];
            for (int q = 0; q < rows.length; q++) {
                v[q] = rows[q][c];
            }
            e.put("values", list(v));
            cols.add(e);
        }
        m.put("columns", cols);
        List<Map<String, Object>> ff = new ArrayList<>();
        for (int k = 0; k < farFields.size(); k++) {
            SurfacePlan.FarField f = plan.farFields().get(k);
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("name", f.spec().name().value());
            e.put("medium", f.medium());
            e.put("contour_m", List.of(f.left(), f.bottom(), f.right(), f.top()));
            e.put("origin_m", List.of(f.originX(), f.originY()));
            Pattern pt = farFields.get(k);
            e.put("total", list(pt.total()));
            if (pt.widths()) {
                e.put("scattering_width_m", list(pt.total()));
            }
            if (pt.extinction() != null) {
                e.put("extinction_width_m", list(pt.extinction()));
            }
            e.put("file", "farfield-" + f.spec().name().value() + ".csv");
            ff.add(e);
        }
        m.put("far_fields", ff);
        List<Map<String, Object>> ex = new ArrayList<>();
        for (int k = 0; k < exits.size(); k++) {
            SurfacePlan.Exit x = plan.exits().get(k);
            Spectrum s = exits.get(k);
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("name", x.spec().name().value());
            e.put("medium", x.medium());
            e.put("y_m", x.y());
            e.put("towards", x.spec().towards().value().caseName());
            e.put("outgoing", list(s.outgoing()));
            if (!Double.isNaN(s.numericalAperture())) {
                e.put("numerical_aperture", s.numericalAperture());
                e.put("within_numerical_aperture", list(s.aperture()));
            }
            e.put("file", "exit-" + x.spec().name().value() + ".csv");
            ex.add(e);
        }
        m.put("exit_spectra", ex);
        return m;
    }

    private static List<Double> list(double[] v) {
        List<Double> out = new ArrayList<>();
        for (double x : v) {
            out.add(Double.isFinite(x) ? x : null);
        }
        return out;
    }
}
