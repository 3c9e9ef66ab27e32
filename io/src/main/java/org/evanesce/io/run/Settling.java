package org.evanesce.io.run;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.evanesce.io.casefile.model.FluxSpec;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Units;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.io.plan.FieldPlan;
import org.evanesce.io.plan.FluxPlan;
import org.evanesce.io.plan.SteadyState;
import org.evanesce.solver.record.FluxLine;

/**
 * Whether a finished run's transforms (flux, maps) cover the whole response, judged from what the
 * run measured (docs/architecture.md: a result is right, or flagged):
 *
 * <ul>
 * <li>pulses: the field energy inside the PMLs must have decayed to the asked fraction of its largest value
 *     ({@code until: {energy_below, latest}}), or to {@link #FIXED_LENGTH_FRACTION} for a run of fixed length
 *     ({@code until: time} or {@code steps}) with flux or maps; the flux normalisation's incident-power run the same;</li>
 * <li>a continuous (ramped) wave: the normalised flux, and the maps' middle row, must not change between
 *     the two halves of the transform window by more than {@link SteadyState#TOLERANCE}, and maps must be
 *     transformed over such a window at all.</li>
 * </ul>
 *
 * A fixed-length run with neither flux nor maps (time series, snapshots) is not judged: {@code settled}
 * is null, the energy fraction is still reported.
 *
 * @param settled        true, false, or null when not judged
 * @param rule           the rule applied, in words
 * @param energyFraction the field energy at the end over its largest value (NaN if not measured)
 * @param incidentPowerRunEnergyFraction the same for the incident-power run (NaN without one)
 * @param steadyChange   a continuous wave's largest change between the window's halves (NaN otherwise)
 * @param steadyChanges  each quantity's change between the halves, by name (flux.csv's column names,
 *                       {@code incident_power}, {@code maps}); empty without a continuous wave's window
 * @param warnings       what to tell the user, one sentence each (empty when settled)
 */
public record Settling(Boolean settled, String rule, double energyFraction, double incidentPowerRunEnergyFraction,
                       double steadyChange, Map<String, Double> steadyChanges, List<String> warnings) {

    /**
     * The energy fraction a fixed-length pulse run with flux or maps must reach to count as settled.
     * Measured on cases/gap-tunnelling-plane-wave.yaml (run shortened with --set duration): a run ending with
     * 5.1e-6 of the largest energy left had A = 1 − R − T = 9e-4 (exact 0) and T off by 2.5e-4, one ending with
     * 2.9e-3 left had A = 0.027; the error goes as about 0.4 √fraction, so 1e-5 keeps it near 1e-3, a fifth of the
     * discretisation error at 20 cells per wavelength (0.005, README). A warning threshold, so ten times looser than
     * the default energy fraction of {@code until: {latest: ...}} ({@link org.evanesce.io.casefile.model.StopSpec#DEFAULT_ENERGY_FRACTION},
     * which aims at errors below 1e-4): a run flagged here is off by about 1e-3 or more, one that
     * reaches the default by some 1e-4 or less.
     */
    public static final double FIXED_LENGTH_FRACTION = 1e-5;

    /**
     * A ramp this long (in periods) keeps the grazing part of a plane wave's switch-on small: the plane wave
     * totally reflected at 45° of docs/case-file.md (`until`) settled to 6.5e-5 with 10 periods, not below 6e-4 with 5.
     */
    static final int LONG_RAMP_PERIODS = 10;

    /** The continuous source's ramp in periods (0 without one). */
    private static double ramp(CasePlan plan) {
        return plan.spec().sources().stream().map(x -> x.signal())
                .filter(x -> x instanceof org.evanesce.io.casefile.model.SignalSpec.RampedWave)
                .map(x -> (org.evanesce.io.casefile.model.SignalSpec.RampedWave) x)
                .mapToDouble(w -> w.rampTime().si() * w.frequency().si()).max().orElse(0);
    }

    public Settling {
        steadyChanges = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(steadyChanges));
        warnings = List.copyOf(warnings);
    }

    /** Judges a finished run; {@code flux} may be null. */
    public static Settling of(CasePlan plan, CaseRunner.Result r, FluxResults flux) {
        boolean continuous = plan.continuous();
        boolean maps = plan.fields().maps().isPresent();
        boolean hasFlux = plan.flux().isPresent();
        double fraction = r.energyFraction();
        double incidentRunFraction = r.incidentPowerRunEnergyFraction();
        List<String> warn = new ArrayList<>();
        String end = Units.format(r.steps() * plan.dt(), Dimension.TIME, 3);
        if (continuous) {
            if (!hasFlux && !maps) {
                return new Settling(null, "not judged: a continuous wave without flux or maps (time series and snapshots "
                        + "are taken when asked)", fraction, incidentRunFraction, Double.NaN, Map.of(), warn);
            }
            Map<String, Double> changes = new LinkedHashMap<>();
            if (hasFlux && plan.flux().get().steady().isPresent()) {
                changes.putAll(fluxChanges(plan.flux().get()));
            }
            FieldPlan.Maps m = maps ? plan.fields().maps().get() : null;
            if (m != null && m.continuousUnwindowed()) {
                warn.add("the maps of a continuous wave were transformed over the whole run, switch-on included, because "
                        + "the case has several sources (no one period to window): they are not steady-state maps; "
                        + "use a single continuous source, or pulses");
            }
            if (m != null && m.monitor().size() == 2) {
                changes.put("maps", mapChange(m.monitor()));
            }
            String what = null;
            double change = 0;
            for (Map.Entry<String, Double> e : changes.entrySet()) {
                if (!(e.getValue() <= change)) {
                    change = e.getValue();
                    what = e.getKey();
                }
            }
            SteadyState w = hasFlux ? plan.flux().get().steady().map(FluxPlan.Steady::window).orElse(null)
                    : m != null ? m.steady().orElse(null) : null;
            String rule = String.format(Locale.ROOT, "continuous wave: the normalised flux (and the maps' middle row) may "
                    + "change by at most %.3g between the two halves of the transform window", SteadyState.TOLERANCE);
            if (w != null && change > SteadyState.TOLERANCE) {
                warn.add(String.format(Locale.ROOT, "the results did not settle: %s changed by %.3g between the two halves of "
                        + "the transform window (%s), more than the tolerance %.3g; the continuous wave had not reached its "
                        + "steady state, so flux%s are biased; run longer (until.time, or until.latest; e.g. twice %s)%s",
                        describe(what), change, w.describe(), SteadyState.TOLERANCE, maps ? " and maps" : "", end,
                        plan.flux().isPresent() && plan.flux().get().kx() != 0 && ramp(plan) < LONG_RAMP_PERIODS - 1e-6
                                ? String.format(Locale.ROOT, ", or give the wave a ramp of %d periods or more (a plane wave "
                                + "at an oblique angle settles slowly after a short ramp; docs/case-file.md, until)",
                                LONG_RAMP_PERIODS) : ""));
            }
            return new Settling(warn.isEmpty(), rule, fraction, incidentRunFraction, w == null ? Double.NaN : change, changes, warn);
        }
        boolean decayStop = plan.stop() instanceof CasePlan.Stop.Decay;
        if (!decayStop && !hasFlux && !maps) {
            return new Settling(null, "not judged: a run of fixed length without flux or maps (time series and snapshots "
                    + "are taken when asked)", fraction, incidentRunFraction, Double.NaN, Map.of(), warn);
        }
        double asked = decayStop ? ((CasePlan.Stop.Decay) plan.stop()).fraction() : FIXED_LENGTH_FRACTION;
        String rule = String.format(Locale.ROOT, "the field energy inside the PMLs must decay to %.3g of its largest value "
                + "by the end of the run%s", asked, hasFlux ? ", in the case's run and in the incident-power run" : "");
        boolean ok = decayStop ? !r.stoppedByLimit() : !(fraction > asked);
        if (!ok) {
            String what = hasFlux && maps ? "flux and maps" : hasFlux ? "the flux" : maps ? "the maps" : null;
            warn.add(String.format(Locale.ROOT, "the results did not settle: the run ended at %s with the field energy still "
                    + "at %.3g of its largest value (%s %.3g); %s; run longer (%s)", end, fraction,
                    decayStop ? "the case asks for energy below" : "settled means below", asked,
                    what == null ? "the fields had not decayed as the case asks"
                            : "the transforms miss what had not yet passed, so " + what + " can be far off",
                    decayStop ? "raise until.latest" : "a longer until.time, or until: {latest: ...}, which runs until the energy "
                            + "falls below " + org.evanesce.io.casefile.model.StopSpec.DEFAULT_ENERGY_FRACTION));
        }
        if (hasFlux && incidentRunFraction > asked) {
            warn.add(String.format(Locale.ROOT, "the flux normalisation did not settle: the incident-power run "
                    + "ended at %s with its field energy still at %.3g of its largest value (settled means below "
                    + "%.3g), so the incident power and every T and R are off; run longer", end, incidentRunFraction, asked));
        }
        return new Settling(warn.isEmpty(), rule, fraction, incidentRunFraction, Double.NaN, Map.of(), warn);
    }

    /**
     * The change of each normalised flux between the window's halves, largest over the frequencies: every
     * line's T or R (absolute), and the incident power (relative to itself).
     */
    static Map<String, Double> fluxChanges(FluxPlan plan) {
        FluxPlan.Steady st = plan.steady().orElseThrow();
        double dx = plan.cellSize();
        int dir = plan.direction();
        Map<String, Double> out = new LinkedHashMap<>();
        for (int q = 0; q < plan.frequencies().length; q++) {
            double[] inc = {dir * st.incident()[0].flux(q, dx), dir * st.incident()[1].flux(q, dx)};
            for (int k = 0; k < plan.lines().size(); k++) {
                boolean t = plan.lines().get(k).spec().measures().value() == FluxSpec.Measure.TRANSMITTED;
                double[] x = new double[2];
                for (int h = 0; h < 2; h++) {
                    FluxLine run = st.run().get(k)[h];
                    x[h] = t ? dir * run.flux(q, dx) / inc[h] : -dir * run.flux(q, dx, st.reference().get(k)[h]) / inc[h];
                }
                out.merge(FluxResults.label(plan.lines().get(k)), Math.abs(x[1] - x[0]), Settling::larger);
            }
            // per sample pair: the halves' whole periods may hold a step more or less (the ratios above cancel it)
            long[] n0 = st.incident()[0].samples();
            long[] n1 = st.incident()[1].samples();
            out.merge(INCIDENT, Math.abs(inc[1] / inc[0] * ((double) n0[0] * n0[1]) / ((double) n1[0] * n1[1]) - 1),
                    Settling::larger);
        }
        return out;
    }

    private static final String INCIDENT = "incident_power";

    /** The larger, NaN counting as larger than anything. */
    private static Double larger(Double a, Double b) {
        return a > b || Double.isNaN(a) ? a : b;
    }

    private static String describe(String what) {
        return what.equals(INCIDENT) ? "the incident power (relative change)"
                : what.equals("maps") ? "the mapped fields on the region's middle row (relative change)" : what;
    }

    /**
     * The relative change of the transformed E and H on a map's monitor row between its halves, each half
     * per sample transformed (largest over frequencies): |late − early| / |late| over the row.
     */
    static double mapChange(List<FluxLine> halves) {
        FluxLine a = halves.get(0);
        FluxLine b = halves.get(1);
        long[] na = a.samples();
        long[] nb = b.samples();
        double worst = 0;
        for (int q = 0; q < a.frequencyCount(); q++) {
            double diff = 0;
            double norm = 0;
            for (int c = 0; c < 2; c++) {
                double[][] x = c == 0 ? a.electricTransform(q) : a.magneticTransform(q);
                double[][] y = c == 0 ? b.electricTransform(q) : b.magneticTransform(q);
                for (int part = 0; part < 2; part++) {
                    for (int i = 0; i < x[part].length; i++) {
                        double late = y[part][i] / nb[c];
                        double d = late - x[part][i] / na[c];
                        diff += d * d;
                        norm += late * late;
                    }
                }
            }
            worst = Math.max(worst, norm > 0 ? Math.sqrt(diff / norm) : 0);
        }
        return worst;
    }

    /** The "settling" object of run.json and summary.json. */
    public Map<String, Object> record() {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("settled", settled);
        m.put("rule", rule);
        m.put("energy_fraction", energyFraction);
        m.put("incident_power_run_energy_fraction", incidentPowerRunEnergyFraction);
        m.put("steady_state_change", steadyChange);
        m.put("steady_state_changes", steadyChanges.isEmpty() ? null : new LinkedHashMap<>(steadyChanges));
        m.put("steady_state_tolerance", Double.isNaN(steadyChange) ? null : SteadyState.TOLERANCE);
        return m;
    }
}
