package org.evanesce.io.run;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.evanesce.io.casefile.model.FluxSpec;
import org.evanesce.io.plan.FluxPlan;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.record.BeamProfile;
import org.evanesce.solver.reference.AngularSpectrum;
import org.evanesce.solver.reference.PlanarStack;

/**
 * Normalised flux per frequency from a finished run and its incident-power run: T through each
 * transmitted line, R through each reflected line, the absorptance A = 1 − R − T when there is one
 * line of each, and, for a layered scene, the transfer-matrix values beside them with the difference.
 *
 * @param columns  the value columns after wavelength, frequency and angle, in order
 * @param rows     one per frequency
 * @param incident what the rows' incident values are ({@link Incident#POWER} or {@link Incident#SPECTRAL_ENERGY})
 * @param warnings what a reader should know about the numbers (e.g. a reference that did not converge), in words
 */
public record FluxResults(List<String> columns, List<Row> rows, Incident incident, List<String> warnings) {

    /** The column saying whether the beam's angular-spectrum reference converged (1) or not (0). */
    public static final String CONVERGED_COLUMN = "beam_reference_converged";

    /**
     * What the incident line's value means. Both are for the source's amplitude as the case states
     * it, summed over the incident line's length, per metre along z.
     */
    public enum Incident {
        /** A continuous wave: the time-averaged power through the incident line, W/m. */
        POWER("incident_power_w_per_m", "W/m", "time-averaged power of the incident wave through the incident line, per "
                + "metre along z, for the source's amplitude as stated (a continuous wave, transformed over whole settled "
                + "periods: 4 x DFT flux / (D_E D_H), D the duration of the transformed samples)"),
        /** A pulse: the energy through the incident line per hertz of positive frequency, J/(m·Hz). */
        SPECTRAL_ENERGY("incident_energy_j_per_m_hz", "J/(m Hz)", "energy of the incident pulse that crosses the "
                + "incident line per hertz of positive frequency, per metre along z, for the source's amplitude as "
                + "stated (4 x DFT flux, by Parseval's theorem; its integral over frequency is the pulse's energy)");

        /** The flux.csv column and summary.json key. */
        public final String column;
        /** The unit in words. */
        public final String unit;
        /** The definition, for summary.json. */
        public final String definition;

        Incident(String column, String unit, String definition) {
            this.column = column;
            this.unit = unit;
            this.definition = definition;
        }
    }

    /** Where the normalisation comes from, written into summary.json and the command's output. */
    public static final String METHOD = "T = flux of the run's fields through the line in the incident direction / incident "
            + "power; R = flux of (run's fields − incident-power run's fields) against the incident direction / incident power; "
            + "the incident power is the incident-power run's flux through a line just ahead of the source; the incident-power run "
            + "is the same grid, source, boundaries and number of steps with the whole domain filled with the plane wave's "
            + "medium. A = 1 − R − T.";

    /**
     * @param frequency     Hz
     * @param wavelength    vacuum wavelength, m
     * @param angleDegrees  angle of incidence in the plane wave's medium at this frequency
     * @param incident      the incident line's power (W/m) or energy per hertz (J/(m·Hz)), see {@link Incident}
     * @param values        the value columns in order (NaN where not defined)
     */
    public record Row(double frequency, double wavelength, double angleDegrees, double incident, double[] values) { }

    /** A line carrying less than this fraction of the incident power gets no centroid or width. */
    static final double MIN_BEAM_POWER = 1e-3;

    /** Computes the table (a beam's references on this thread). */
    public static FluxResults of(FluxPlan plan, Polarization pol) {
        return of(plan, pol, BeamReferences.of(plan, pol, 1));
    }

    /** Computes the table with a beam's references already computed ({@link BeamReferences}). */
    public static FluxResults of(FluxPlan plan, Polarization pol, BeamReferences references) {
        List<String> columns = new ArrayList<>();
        int transmitted = 0;
        int reflected = 0;
        for (FluxPlan.Line l : plan.lines()) {
            boolean t = l.spec().measures().value() == FluxSpec.Measure.TRANSMITTED;
            transmitted += t ? 1 : 0;
            reflected += t ? 0 : 1;
        }
        boolean absorptance = transmitted == 1 && reflected == 1;
        boolean exact = plan.exact().isPresent();
        boolean beam = plan.beam().isPresent();
        // a plane wave: value, exact, diff; a beam: value, plane wave at its axis's angle, the beam (angular
        // spectrum), diff against the beam
        List<String> suffixes = !exact ? List.of() : beam ? List.of("_plane_wave", "_beam", "_diff") : List.of("_exact", "_diff");
        for (FluxPlan.Line l : plan.lines()) {
            String c = label(l);
            columns.add(c);
            suffixes.forEach(x -> columns.add(c + x));
        }
        if (absorptance) {
            columns.add("A");
            suffixes.forEach(x -> columns.add("A" + x));
        }
        if (exact && beam) {
            columns.add(CONVERGED_COLUMN);
        }
        if (beam) {
            for (FluxPlan.Line l : plan.lines()) {
                columns.add("centroid_" + l.spec().name().value() + "_um");
                columns.add("width_" + l.spec().name().value() + "_um");
                columns.add("angle_" + l.spec().name().value() + "_deg");
                if (exact && l.spec().measures().value() == FluxSpec.Measure.REFLECTED) {
                    columns.add("shift_" + l.spec().name().value() + "_um");
                    columns.add("shift_" + l.spec().name().value() + "_beam_um");
                }
            }
        }
        List<Row> rows = new ArrayList<>();
        List<String> warnings = new ArrayList<>();
        double dx = plan.cellSize();
        int dir = plan.direction();
        for (int q = 0; q < plan.frequencies().length; q++) {
            double wl = plan.wavelength(q);
            // the ratios use the DFT fluxes as they are; the incident value gets its own units
            double incident = dir * plan.incident().flux(q, dx);
            double incidentValue = dir * (plan.continuous() ? plan.incident().meanPower(q, dx)
                    : plan.incident().spectralEnergy(q, dx));
            PlanarStack stack = exact ? plan.exact().get().stack().apply(wl) : null;
            PlanarStack.Response r = !exact ? null : beam ? stack.atAngle(pol, wl, plan.angle(q))
                    : stack.atTransverseWavenumber(pol, wl, plan.kx());
            AngularSpectrum.Converged reference = exact && beam ? references.at(q) : null;
            // a reference that did not converge is not printed: its columns stay empty (NaN)
            AngularSpectrum.Result as = reference == null || !reference.converged() ? null : reference.result();
            if (reference != null && !reference.converged()) {
                warnings.add(BeamReference.notConverged(reference, wl));
            }
            if (reference != null && q == plan.frequencies().length / 2) { // once, at the middle frequency
                for (FluxPlan.Line l : BeamReference.reflectedLines(plan)) {
                    String w = BeamReference.lineLengthWarning(plan, stack, pol, wl, reference, l);
                    if (w != null) {
                        warnings.add(w);
                    }
                }
            }
            double[] v = new double[columns.size()];
            int k = 0;
            double sum = 0;
            for (FluxPlan.Line l : plan.lines()) {
                boolean t = l.spec().measures().value() == FluxSpec.Measure.TRANSMITTED;
                double value = t ? dir * l.run().flux(q, dx) / incident
                        : -dir * l.run().flux(q, dx, l.reference()) / incident;
                sum += value;
                v[k++] = value;
                if (exact) {
                    double e = t ? r.transmittance() : r.reflectance();
                    v[k++] = e;
                    if (beam) {
                        double b = as == null ? Double.NaN : t ? as.transmittance() : as.reflectance();
                        v[k++] = b;
                        e = b;
                    }
                    v[k++] = value - e;
                }
            }
            if (absorptance) {
                v[k++] = 1 - sum;
                if (exact) {
                    v[k++] = r.absorptance();
                    double e = r.absorptance();
                    if (beam) {
                        e = as == null ? Double.NaN : 1 - as.reflectance() - as.transmittance();
                        v[k++] = e;
                    }
                    v[k++] = 1 - sum - e;
                }
            }
            if (exact && beam) {
                v[k++] = as != null ? 1 : 0;
            }
            if (beam) {
                for (FluxPlan.Line l : plan.lines()) {
                    boolean t = l.spec().measures().value() == FluxSpec.Measure.TRANSMITTED;
                    BeamProfile p = BeamProfile.of(l.run(), t ? null : l.reference(), q, dx, plan.gridX0());
                    // a line that sees next to no power (an evanescent tail) has no beam to locate
                    boolean seen = Math.abs(p.total()) > MIN_BEAM_POWER * Math.abs(incident);
                    v[k++] = seen ? p.centroid() * 1e6 : Double.NaN;
                    v[k++] = seen ? p.width() * 1e6 : Double.NaN;
                    v[k++] = seen ? outgoingAngle(plan, l, t, q, p.centroid()) : Double.NaN;
                    if (exact && !t) {
                        double baseline = BeamReference.gridSpecular(plan, q, l.y(),
                                BeamReference.specularOnLine(plan, reference, l));
                        v[k++] = seen ? (p.centroid() - baseline) * 1e6 : Double.NaN;
                        v[k++] = as == null ? Double.NaN : BeamReference.reflectedShift(plan, reference, l) * 1e6;
                    }
                }
            }
            rows.add(new Row(plan.frequencies()[q], wl, Math.toDegrees(plan.angle(q)), incidentValue, v));
        }
        if (exact && beam && !Double.isNaN(plan.exact().get().differsAt())) {
            warnings.add(stackDiffers(plan.exact().get()));
        }
        return new FluxResults(List.copyOf(columns), List.copyOf(rows),
                plan.continuous() ? Incident.POWER : Incident.SPECTRAL_ENERGY, List.copyOf(warnings));
    }

    /** The warning for a beam whose layers change within its footprint (see {@link FluxPlan.Exact#differsAt}). */
    static String stackDiffers(FluxPlan.Exact e) {
        return String.format(java.util.Locale.ROOT, "the layers under the beam change within %.0f footprints of its axis "
                + "(at x = %.4g um they are not those at x = %.4g um, where the axis meets the first interface): the "
                + "plane-wave and beam references (the _plane_wave, _beam and _diff columns, shift_*_beam_um) describe "
                + "the stack at x = %.4g um alone and are doubtful as the answer for this scene",
                FluxPlan.Exact.FOOTPRINTS_CHECKED, e.differsAt() * 1e6, e.column() * 1e6, e.column() * 1e6);
    }

    /** Zero padding of a line's field before its plane-wave spectrum is taken: a finer kx grid for the mean. */
    static final int SPECTRUM_OVERSAMPLING = 4;

    /**
     * The beam's mean direction on a line, degrees from the normal towards +x: the power-weighted mean
     * kx of the line's angular spectrum (the FFT of its transformed E, the scattered part for a
     * reflected line) over n k0 in the material at the beam's centroid.
     */
    static double outgoingAngle(FluxPlan plan, FluxPlan.Line l, boolean transmitted, int q, double centroid) {
        double[][] e = l.run().electricTransform(q);
        if (!transmitted) {
            double[][] r = l.reference().electricTransform(q);
            for (int k = 0; k < e[0].length; k++) {
                e[0][k] -= r[0][k];
                e[1][k] -= r[1][k];
            }
        }
        double dx = plan.cellSize();
        double first = plan.gridX0() + (l.run().firstCell() + l.run().electricComponent().dx) * dx;
        double kx = BeamProfile.PlaneWaveSpectrum.finiteLine(first, dx, e[0], e[1], SPECTRUM_OVERSAMPLING).meanWavenumber();
        double k = plan.indexAt().applyAsDouble(centroid, l.y()) * 2 * Math.PI / plan.wavelength(q);
        return Math.abs(kx) < k ? Math.toDegrees(Math.asin(kx / k)) : Double.NaN;
    }

    /** T_name for a transmitted line, R_name for a reflected one. */
    static String label(FluxPlan.Line l) {
        return (l.spec().measures().value() == FluxSpec.Measure.TRANSMITTED ? "T_" : "R_") + l.spec().name().value();
    }

    /** flux.csv: a header row, then one row per frequency. */
    public String csv() {
        StringBuilder sb = new StringBuilder("wavelength_nm,frequency_thz,angle_deg");
        for (String c : columns) {
            sb.append(',').append(c);
        }
        sb.append(',').append(incident.column).append('\n');
        for (Row r : rows) {
            sb.append(String.format(Locale.ROOT, "%.6f,%.6f,%.6f", r.wavelength() * 1e9, r.frequency() * 1e-12, r.angleDegrees()));
            for (int k = 0; k < columns.size(); k++) {
                double x = r.values()[k];
                String f = columns.get(k).equals(CONVERGED_COLUMN) ? "%.0f" : "%.9f";
                sb.append(',').append(Double.isFinite(x) ? String.format(Locale.ROOT, f, x) : "");
            }
            sb.append(String.format(Locale.ROOT, ",%.9e%n", r.incident()));
        }
        return sb.toString();
    }

    /** The "flux" part of summary.json. */
    public Map<String, Object> summary(FluxPlan plan) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("method", plan.computed().isPresent() && plan.beam().isPresent() ? METHOD + " For this pulsed Gaussian beam "
                + "the incident-power run was computed, not stepped: its lines' transforms are those the beam's sheets give "
                + "in an unbounded grid of the incident medium (incident_power_obtained says how)."
                : plan.computed().isPresent() ? METHOD + " For this plane wave the incident-power run was computed, not "
                + "stepped: its lines' transforms are those the plane wave's sheet gives in a grid of the incident medium "
                + "with the same periodic sides, open above and below (incident_power_obtained says how)." : METHOD);
        Map<String, Object> wave = new LinkedHashMap<>();
        wave.put("medium", plan.medium());
        wave.put("medium_index", plan.mediumIndex());
        wave.put("direction", plan.direction() > 0 ? "up" : "down");
        if (plan.beam().isPresent()) {
            var b = plan.beam().get();
            wave.put("waist_m", b.waist().si());
            wave.put("waist_at_m", new double[] {b.waistAt().x().si(), b.waistAt().y().si()});
            wave.put("angle_deg", Math.toDegrees(b.angle().si()));
            m.put("gaussian_beam", wave);
            if (plan.exact().isPresent()) {
                m.put("beam_reference", "X_plane_wave: the plane wave at the beam's angle through the stack under the beam "
                        + "(read along x = " + plan.exact().get().column() + " m, where the axis meets the first interface); "
                        + "X_beam: the same beam through that stack by its angular spectrum (no edges); X_diff = simulated − "
                        + "X_beam. X_beam − X_plane_wave is the part due to the beam's angular spread, X_diff the part due to "
                        + "edges and geometry (and the grid). shift_name_um: the simulated reflected centroid minus "
                        + "where the incident beam itself lies after the same path on the grid (its centroids in the "
                        + "incident-power run on the incident line and on a line at the mirror image of the reflected line "
                        + "through the interface" + (plan.path().isPresent() ? ", y = " + plan.path().get().y() + " m"
                        : ": none fitted, so the angular spectrum's incident beam mirrored on the line") + ", carried along "
                        + "its straight path), so that the grid's effect on the beam's direction is not counted as shift; "
                        + "shift_name_beam_um: the angular spectrum's on the same line (flux-weighted, carried from "
                        + "the interface to the line, so a reflected beam leaving at a slightly different mean angle is "
                        + "compared where it is measured), its reflected centroid minus that of its incident beam sent "
                        + "back unchanged by a perfect mirror: the same baseline, which for a narrow beam is not the "
                        + "geometric distance times tan(angle)");
                Map<String, Object> conv = new LinkedHashMap<>();
                conv.put("method", "the beam's angular spectrum is sampled over a window of " + BeamReference.WINDOW_FOOTPRINTS
                        + " footprints (waist / cos angle), then the window and the number of samples are doubled together "
                        + "until the sample spacing in kx is at most half the half-width of the narrowest resonance of the "
                        + "stack inside the beam's spectrum (a peak of |t|^2) and R, T and each reflected centroid change by "
                        + "less than the tolerances from one doubling to the next; beam_reference_converged is false (and "
                        + "the X_beam, X_diff and shift_*_beam_um values null) where that needs more than the largest "
                        + "sampling");
                conv.put("power_tolerance", BeamReference.POWER_TOLERANCE);
                conv.put("shift_tolerance_footprints", BeamReference.SHIFT_TOLERANCE_FOOTPRINTS);
                conv.put("largest_sampling", BeamReference.MAX_SAMPLES);
                m.put("beam_reference_convergence", conv);
                double differs = plan.exact().get().differsAt();
                m.put("beam_reference_stack_differs_at_x_m", Double.isNaN(differs) ? null : differs);
            }
        } else {
            wave.put("in_plane_wavenumber_rad_per_m", plan.kx());
            m.put("plane_wave", wave);
        }
        m.put("incident_line_y_m", plan.incidentY());
        plan.path().ifPresent(p -> m.put("path_line_y_m", p.y()));
        Map<String, Object> inc = new LinkedHashMap<>();
        inc.put("key", incident.column);
        inc.put("unit", incident.unit);
        inc.put("definition", incident.definition);
        inc.put("line_length_m", plan.lineLength());
        inc.put("source_amplitude", plan.sourceAmplitude());
        inc.put("source_amplitude_meaning", plan.beam().isPresent()
                ? "the beam's z field (Ez for s, eta0*Hz for p) at the waist centre, V/m"
                : "the sheet's current density times eta0 (s: electric current along z, eta0*J_s; p: magnetic current "
                        + "along z, M_s), V/m; in a lossless medium of index n the sheet launches a plane wave each way "
                        + "with E amplitude a/(2 n cos(theta)) (s) or a/(2 cos(theta)) (p)");
        m.put("incident", inc);
        List<Object> lines = new ArrayList<>();
        for (FluxPlan.Line l : plan.lines()) {
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("name", l.spec().name().value());
            e.put("measures", l.spec().measures().value().caseName());
            e.put("column", label(l));
            e.put("y_m", l.y());
            lines.add(e);
        }
        m.put("lines", lines);
        m.put("transfer_matrix", plan.exact().isPresent()
                ? "the exact plane-wave values of the layered scene (characteristic matrix, Born & Wolf sec. 1.6) with the "
                        + "same materials, evaluated at each frequency's in-plane wavenumber; *_diff = simulated − exact"
                : null);
        // which permittivity the references give a metal (flux.reference_permittivity), and the discrete one's time step
        m.put("reference_permittivity", plan.exact().map(e -> e.permittivity().caseName()).orElse(null));
        m.put("reference_time_step_s", plan.exact().filter(e -> e.permittivity() == FluxSpec.ReferencePermittivity.DISCRETE)
                .map(e -> (Object) e.timeStep()).orElse(null));
        List<Object> rowsOut = new ArrayList<>();
        for (Row r : rows) {
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("wavelength_m", r.wavelength());
            e.put("frequency_hz", r.frequency());
            e.put("angle_deg", r.angleDegrees());
            for (int k = 0; k < columns.size(); k++) {
                e.put(columns.get(k), columns.get(k).equals(CONVERGED_COLUMN) ? (Object) (r.values()[k] == 1)
                        : (Object) r.values()[k]);
            }
            e.put(incident.column, r.incident());
            rowsOut.add(e);
        }
        m.put("frequencies", rowsOut);
        return m;
    }
}
