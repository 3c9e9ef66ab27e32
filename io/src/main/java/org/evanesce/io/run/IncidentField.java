package org.evanesce.io.run;

import java.util.Locale;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.model.MaterialSpec;
import org.evanesce.io.casefile.model.SignalSpec;
import org.evanesce.io.casefile.model.SourceSpec;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.io.plan.FieldPlan;
import org.evanesce.io.plan.PlaneWaves;
import org.evanesce.io.plan.SteadyState;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.source.GaussianPulse;
import org.evanesce.solver.source.GridWave;
import org.evanesce.solver.source.TotalFieldBox;
import org.evanesce.solver.source.PlaneSheetAmplitude;
import org.evanesce.solver.source.RampedContinuous;

/**
 * The amplitude |E_inc| of the incident electric field at each frequency of a run's maps, in the maps' unit (V·s/m:
 * the transform Σ E(t) e^{i2πft} Δt of the incident wave), which {@code maps.normalise: incident} divides them by.
 *
 * <ul>
 *   <li>A plane wave: the wave the sheet launches into its medium on the grid (the same at every point of an
 *   unbounded grid of that medium): amplitude × |G(f)| × the grid's launch factor
 *   ({@link PlaneSheetAmplitude}: |Ez| per sheet current for s, √(|Ex|² + |Ey|²) on the nodes for p; it tends to
 *   1/(2n cos θ(f)) and 1/(2 cos θ(f)) as the cells shrink, θ(f) the angle at that frequency).</li>
 *   <li>A Gaussian beam: its peak, at the waist centre, in its medium unbounded: amplitude × |G(f)| for s (Ez
 *   there is the amplitude by construction), amplitude × |G(f)| × ⟨cos α⟩ / n for p (η0Hz there is the amplitude; each plane-wave
 *   component of the beam has |E| = η0|H|/n, and at the waist centre they add with the weight cos α of their angle
 *   from the axis: {@link #meanCosine}, 1 − 1/(k w0)² to leading order, 0.45 % below 1 for a 1 µm waist in glass at
 *   633 nm). The beam is exact at the signal's centre frequency; a pulse's other frequencies carry the
 *   centre frequency's profile, so away from it |E_inc| is the injected amplitude, not the waist's.</li>
 *   <li>A plane-wave box: the wave it lights its inside with, the grid's own plane wave in the medium it comes from
 *   ({@link GridWave}; in layers the bottom or top layer's): amplitude × |G(f)| for s (Ez is the amplitude), amplitude
 *   × |G(f)| × √(|Ex|² + |Ey|²)/|η0Hz| for p, Ex and Ey by the grid's own ratios averaged onto the nodes as the maps are
 *   (factors cos(k̃xΔ/2), cos(k̃yΔ/2)); this tends to amplitude/n as the cells shrink.</li>
 * </ul>
 * |G(f)| is the source signal's transform: a pulse's closed form ({@link GaussianPulse#amplitudeSpectrum}), a
 * ramped wave's sum over the maps' window (whole periods in the steady state: about half the window's length).
 *
 * @param amplitude  |E_inc| per map frequency, V·s/m, in the map's order
 * @param definition one sentence saying what was divided by, for the files' metadata
 */
public record IncidentField(double[] amplitude, String definition) {

    /** The reference's name in labels and attributes. */
    public static final String SYMBOL = "|E_inc|";

    public IncidentField {
        amplitude = amplitude.clone();
    }

    @Override
    public double[] amplitude() {
        return amplitude.clone();
    }

    /**
     * The incident field of the plan's plane wave or Gaussian beam at the maps' frequencies; the case's checks have
     * made sure there is one, the only source, propagating at each of them.
     */
    public static IncidentField of(CasePlan plan) {
        FieldPlan.Maps maps = plan.fields().maps().orElseThrow();
        CaseSpec spec = plan.spec();
        if (PlaneWaves.launched(spec).isEmpty() && plan.lightBoxes().size() == 1) {
            return ofBox(plan, maps, plan.lightBoxes().get(0));
        }
        SourceSpec.Launched w = PlaneWaves.launched(spec).orElseThrow(() -> new IllegalStateException(
                "maps relative to the incident field without a plane wave or Gaussian beam (the checks refuse this)"));
        MaterialSpec medium = PlaneWaves.medium(spec, w);
        Polarization pol = spec.polarization().value();
        double dt = plan.dt();
        double dx = plan.grid().cellSize();
        int count = maps.map().frequencyCount();
        double[] out = new double[count];
        for (int q = 0; q < count; q++) {
            double f = maps.map().frequency(q);
            double g = signalSpectrum(w.signal(), f, dt, maps.steady().orElse(null));
            if (w instanceof SourceSpec.PlaneWave) {
                double eps = plan.gridPermittivity().getOrDefault(medium.name(), medium.relativePermittivity().si());
                double launch = PlaneSheetAmplitude.electricPerCurrent(pol, spec.numerics().precision().value(),
                        PhysicalConstants.C0 * dt / dx, eps, PlaneWaves.launchedKx(spec) * dx, 2 * Math.PI * f * dt);
                out[q] = w.amplitude().si() * g * launch;
            } else {
                double kw = 2 * Math.PI * f / PhysicalConstants.C0 * medium.index() * ((SourceSpec.GaussianBeamSource) w).waist().si();
                out[q] = w.amplitude().si() * g * (pol == Polarization.S ? 1 : meanCosine(kw) / medium.index());
            }
        }
        String what = w instanceof SourceSpec.PlaneWave
                ? String.format(Locale.ROOT, "the plane wave's electric field amplitude in %s (n = %s) as the grid launches "
                        + "it, at each wavelength", medium.name(), org.evanesce.io.casefile.expr.Units.number(medium.index()))
                : String.format(Locale.ROOT, "the Gaussian beam's electric field amplitude at its waist centre in %s (n = %s)%s",
                        medium.name(), org.evanesce.io.casefile.expr.Units.number(medium.index()),
                        pol == Polarization.S ? "" : ", amplitude / n times the mean cosine of its "
                        + "angular spectrum");
        return new IncidentField(out, what + ", times the source signal's transform at that wavelength (docs/outputs.md)");
    }

    /** The incident field of a plane-wave box (the case's only source; the checks make sure). */
    private static IncidentField ofBox(CasePlan plan, FieldPlan.Maps maps, TotalFieldBox box) {
        SourceSpec.PlaneWaveBox pb = plan.spec().sources().stream().filter(SourceSpec.PlaneWaveBox.class::isInstance)
                .map(SourceSpec.PlaneWaveBox.class::cast).findFirst().orElseThrow();
        Polarization pol = plan.spec().polarization().value();
        double dt = plan.dt();
        double dx = plan.grid().cellSize();
        double eps = box.incidenceMediumPermittivity();
        double[] out = new double[maps.map().frequencyCount()];
        for (int q = 0; q < out.length; q++) {
            double f = maps.map().frequency(q);
            double g = signalSpectrum(pb.signal(), f, dt, maps.steady().orElse(null));
            out[q] = box.spec().amplitude() * g * (pol == Polarization.S ? 1
                    : boxElectricPerMagnetic(eps, box.spec().direction(), 2 * Math.PI * f, dx, dt));
        }
        String what = String.format(Locale.ROOT, "the plane-wave box's incident electric field amplitude in the medium it "
                + "comes from (n = %s) as the grid carries it, at each wavelength", org.evanesce.io.casefile.expr.Units.number(
                Math.sqrt(eps)));
        return new IncidentField(out, what + ", times the source signal's transform at that wavelength (docs/outputs.md)");
    }

    /**
     * √(|Ex|² + |Ey|²)/|η0Hz| of the grid's p plane wave along {@code direction} (radians) in a medium of relative
     * permittivity ε, Ex and Ey averaged onto the nodes: the {@link GridWave#ratio} factors times cos(k̃xΔ/2) and
     * cos(k̃yΔ/2) (the mean of the two sites either side). Tends to 1/√ε as Δ → 0.
     *
     * @param omega rad/s
     * @param dx    Δ, m
     * @param dt    Δt, s
     */
    static double boxElectricPerMagnetic(double eps, double direction, double omega, double dx, double dt) {
        double courant = PhysicalConstants.C0 * dt / dx;
        double k = GridWave.wavenumber(eps, direction, omega, dx, courant);
        if (Double.isNaN(k)) {
            throw new IllegalArgumentException(String.format("the grid (cell %g m) carries no wave of %g Hz in a medium of "
                    + "permittivity %g; refine the grid", dx, omega / (2 * Math.PI), eps));
        }
        double kx = k * Math.cos(direction);
        double ky = k * Math.sin(direction);
        double w = Math.sin(omega * dt / 2);
        double ex = GridWave.ratio(org.evanesce.solver.grid.Component.EX, kx, ky, eps, dx, courant, w) * Math.cos(kx * dx / 2);
        double ey = GridWave.ratio(org.evanesce.solver.grid.Component.EY, kx, ky, eps, dx, courant, w) * Math.cos(ky * dx / 2);
        return Math.hypot(ex, ey);
    }

    /**
     * Midpoints of the quadrature in {@link #meanCosine}: the square root's ends at |kx| = k limit it to an error of
     * order N^−1.5 (about 4e-6) for a beam as narrow as a wavelength, and to nothing visible for wider beams, whose
     * weight there is e^{−(k w0)²/4}.
     */
    static final int QUADRATURE_POINTS = 4096;

    /**
     * ⟨cos α⟩ over the angular spectrum of a 2D Gaussian beam of waist w0 at the waist centre: its field e^{−x²/w0²}
     * has the plane-wave spectrum e^{−kx²w0²/4} (Goodman, Introduction to Fourier Optics, 3rd ed. 2005, sec. 3.10, the
     * angular spectrum), each component's E is η0H/n at the angle α = asin(kx/k) from the axis, and at the waist
     * centre every component has the same phase, so |E| = (η0|H|/n)·∫ e^{−kx²w0²/4} cos α dkx / ∫ e^{−kx²w0²/4} dkx
     * (the propagating part, |kx| &lt; k). It is 1 − 1/(k w0)² to leading order.
     *
     * @param kw0 k·w0, the wavenumber in the medium times the waist
     */
    static double meanCosine(double kw0) {
        double num = 0;
        double den = 0;
        for (int k = 0; k < QUADRATURE_POINTS; k++) {
            // midpoints on u = kx/k in (−1, 1)
            double u = -1 + (k + 0.5) * 2.0 / QUADRATURE_POINTS;
            double weight = Math.exp(-0.25 * u * u * kw0 * kw0);
            num += weight * Math.sqrt(1 - u * u);
            den += weight;
        }
        return num / den;
    }

    /** |G(f)|, s: the source signal's transform at f over the maps' window. */
    static double signalSpectrum(SignalSpec signal, double f, double dt, SteadyState window) {
        if (signal instanceof SignalSpec.Pulse p) {
            return new GaussianPulse(p.frequency().si(), p.spectrumSigma()).amplitudeSpectrum(f);
        }
        if (!(signal instanceof SignalSpec.RampedWave r) || window == null) {
            throw new IllegalStateException("the incident field of a " + signal.kind() + " signal"
                    + (window == null ? " without a steady-state window" : "") + " (the checks refuse this)");
        }
        RampedContinuous g = new RampedContinuous(r.frequency().si(), r.rampTime().si());
        double end = window.end() + 1e-6 * window.period();
        double omega = 2 * Math.PI * f;
        double re = 0;
        double im = 0;
        for (long n = (long) Math.ceil(window.start() / dt); n * dt < end; n++) {
            double t = n * dt;
            if (t < window.start()) {
                continue;
            }
            double v = g.value(t);
            re += v * Math.cos(omega * t);
            im += v * Math.sin(omega * t);
        }
        return Math.hypot(re, im) * dt;
    }
}
