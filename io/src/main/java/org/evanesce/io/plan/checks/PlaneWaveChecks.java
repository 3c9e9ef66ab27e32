package org.evanesce.io.plan.checks;

import java.util.ArrayList;
import java.util.List;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Units;
import org.evanesce.io.casefile.model.BoundarySpec;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.model.FluxSpec;
import org.evanesce.io.casefile.model.MaterialSpec;
import org.evanesce.io.casefile.model.SignalSpec;
import org.evanesce.io.casefile.model.SourceSpec;
import org.evanesce.io.casefile.text.KeyPaths;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.text.Value;
import org.evanesce.solver.grid.Side;

/**
 * Checks of a launched source (plane wave or Gaussian beam) and the flux lines normalised by it:
 * periodic sides for a plane wave and none for a beam, one transparent material along the
 * launching line (for a beam, along the part of it the beam crosses), one launched source as the
 * only source when flux is asked for, lines inside the interior and off the launching row, and
 * frequencies at which the wave propagates in its medium and carries power.
 */
final class PlaneWaveChecks {

    /** Below this fraction of the pulse's peak power a frequency's incident power is mostly round-off (common practice). */
    static final double MIN_SPECTRAL_POWER = 1e-4;
    /** Sample points along the launching line when checking that it lies in one material. */
    static final int LINE_SAMPLES = 257;

    private final CaseSpec spec;
    private final KeyPaths paths;
    private final CaseChecks checks;

    PlaneWaveChecks(CaseSpec spec, KeyPaths paths, CaseChecks checks) {
        this.spec = spec;
        this.paths = paths;
        this.checks = checks;
    }

    private void error(SourcePosition at, String path, String message) {
        checks.error(at, path, message);
    }

    private void warn(SourcePosition at, String path, String message) {
        checks.warn(at, path, message);
    }

    private static String fmt(double metres) {
        return Units.format(metres, Dimension.LENGTH);
    }

    void run() {
        List<Integer> waves = new ArrayList<>();
        for (int k = 0; k < spec.sources().size(); k++) {
            if (spec.sources().get(k) instanceof SourceSpec.Launched) {
                waves.add(k);
            }
        }
        boolean periodic = spec.boundaries().get(Side.LEFT) instanceof BoundarySpec.Periodic;
        for (int n = 0; n < waves.size(); n++) {
            int k = waves.get(n);
            SourceSpec.Launched w = (SourceSpec.Launched) spec.sources().get(k);
            if (w instanceof SourceSpec.PlaneWave && !periodic) {
                error(w.at(), paths.sources().get(k), "a plane wave spans the whole width and needs periodic left and right "
                        + "sides; expected boundaries: {left: periodic, right: periodic}");
            }
            if (w instanceof SourceSpec.GaussianBeamSource && periodic) {
                error(w.at(), paths.sources().get(k), "periodic sides would repeat the beam side by side; a Gaussian beam "
                        + "needs absorbing (pml) or mirror (pec, pmc) left and right sides");
            }
            if (n > 0) {
                error(w.at(), paths.sources().get(k), "a case has at most one plane wave or Gaussian beam (it sets the "
                        + "incident power and angle); the first is " + paths.sources().get(waves.get(0)));
            }
        }
        MaterialSpec medium = null;
        SourceSpec.Launched wave = null;
        if (!waves.isEmpty()) {
            wave = (SourceSpec.Launched) spec.sources().get(waves.get(0));
            medium = launchMedium(wave, paths.sources().get(waves.get(0)));
        }
        new MapNormaliseChecks(spec, paths, checks).run(wave, medium);
        if (spec.flux().isEmpty()) {
            return;
        }
        FluxSpec flux = spec.flux().get();
        if (wave == null) {
            error(flux.at(), "flux", "flux lines are normalised by the incident power of a plane wave or a Gaussian "
                    + "beam; add a plane_wave or gaussian_beam source");
            return;
        }
        for (int k = 0; k < spec.sources().size(); k++) {
            if (!(spec.sources().get(k) instanceof SourceSpec.Launched)) {
                error(spec.sources().get(k).at(), paths.sources().get(k), "with flux lines the plane wave or beam must be the "
                        + "only source: the incident power is measured from it alone");
            }
        }
        lines(wave, flux);
        if (medium != null) {
            frequencies(wave, medium, flux);
        }
    }

    /**
     * The one transparent material along the launching line (a beam's: over
     * {@link SourceSpec.GaussianBeamSource#reach()} either side of its axis), or null (errors reported).
     */
    private MaterialSpec launchMedium(SourceSpec.Launched w, String path) {
        double y = w.y().si();
        if (!spec.domain().contains(0, y)) {
            error(w.y().at(), path + ".y", String.format("the launching line at y = %s lies outside the domain (y from %s "
                    + "to %s)", fmt(y), fmt(spec.domain().yMin()), fmt(spec.domain().yMax())));
            return null;
        }
        double from = spec.domain().xMin();
        double to = spec.domain().xMax();
        if (w instanceof SourceSpec.GaussianBeamSource b) {
            double reach = b.reach();
            double[] in = checks.interior();
            if (b.axisAtLine() - reach < in[0] || b.axisAtLine() + reach > in[2]) {
                warn(b.waistAt().at(), path, String.format("the beam meets its launching line at x = %s and reaches "
                        + "%s either side (%s footprints), beyond the interior (x from %s to %s): the beam is cut "
                        + "where the line ends; widen the domain or move the beam", fmt(b.axisAtLine()), fmt(reach),
                        Units.number(SourceSpec.GaussianBeamSource.SPAN_FOOTPRINTS), fmt(in[0]), fmt(in[2])));
            }
            from = Math.max(from, b.axisAtLine() - reach);
            to = Math.min(to, b.axisAtLine() + reach);
            if (!(from < to)) {
                error(b.waistAt().at(), path + ".waist_at", String.format("the beam's axis crosses its launching line at "
                        + "x = %s, outside the domain (x from %s to %s)", fmt(b.axisAtLine()), fmt(spec.domain().xMin()),
                        fmt(spec.domain().xMax())));
                return null;
            }
        }
        String first = null;
        for (int q = 0; q < LINE_SAMPLES; q++) {
            double x = from + (to - from) * q / (LINE_SAMPLES - 1);
            String m = spec.materialAt(x, y);
            if (first == null) {
                first = m;
            } else if (!m.equals(first)) {
                error(w.y().at(), path + ".y", String.format("the launching line at y = %s crosses %s (at x = %s) and %s "
                        + "(at x = %s)%s; it must lie in one material", fmt(y), first, fmt(from), m, fmt(x),
                        w instanceof SourceSpec.GaussianBeamSource ? String.format(" within %s beam footprints of the axis",
                                Units.number(SourceSpec.GaussianBeamSource.SPAN_FOOTPRINTS)) : ""));
                return null;
            }
        }
        MaterialSpec m = spec.materials().get(first);
        if (m != null && m.isDispersive()) {
            error(w.y().at(), path + ".y", String.format("the launching line lies in %s, a dispersive (metal) material; the "
                    + "incident medium must be a transparent dielectric for its angle and power to be defined", m.name()));
            return null;
        }
        if (m != null && m.conductivity().si() != 0) {
            error(w.y().at(), path + ".y", String.format("the launching line lies in %s, which conducts (%s); the incident "
                    + "medium must be transparent for its angle and power to be defined", m.name(), m.isPerfectConductor()
                    ? "a perfect conductor" : Units.number(m.conductivity().si()) + " S/m"));
            return null;
        }
        return m;
    }

    private void lines(SourceSpec.Launched w, FluxSpec flux) {
        double cell = checks.cell();
        for (int k = 0; k < flux.lines().size(); k++) {
            FluxSpec.Line line = flux.lines().get(k);
            String path = "flux.lines[" + k + "].y";
            double y = line.y().si();
            double[] in = checks.interior();
            if (y <= in[1] || y >= in[3] - cell) {
                error(line.y().at(), path, String.format("the line at y = %s must lie inside the interior, between its bottom "
                        + "and one cell below its top (y from %s to %s)", fmt(y), fmt(in[1]), fmt(in[3] - cell)));
                continue;
            }
            double gap = (y - w.y().si()) * w.direction().value().sign();
            if (Math.abs(gap) < 1.5 * cell) {
                error(line.y().at(), path, String.format("the line at y = %s is within 1.5 cells (%s) of the plane wave's "
                        + "launching line at y = %s; move it at least %s away", fmt(y), fmt(1.5 * cell), fmt(w.y().si()),
                        fmt(2 * cell)));
            } else if (gap < 0 && line.measures().value() == FluxSpec.Measure.TRANSMITTED) {
                warn(line.y().at(), path, String.format("the line at y = %s lies behind the source (launched %s from y = %s) "
                        + "but measures 'transmitted'; it sees the wave the source sends backwards (did you mean 'reflected'?)",
                        fmt(y), w.direction().value().name().toLowerCase(java.util.Locale.ROOT), fmt(w.y().si())));
            }
        }
    }

    private void frequencies(SourceSpec.Launched w, MaterialSpec medium, FluxSpec flux) {
        double n = medium.index();
        double centre = w.signal().frequency().si();
        double sin = Math.sin(w.angle().si());
        for (int k = 0; k < flux.frequencies().size(); k++) {
            Value f = flux.frequencies().get(k);
            double s = sin * centre / f.si();
            // formatted only for a message (a sweep checks every point's frequencies)
            java.util.function.Supplier<String> what = () -> String.format("%s (%s)",
                    Units.format(PhysicalConstants.C0 / f.si(), Dimension.LENGTH), Units.format(f.si(), Dimension.FREQUENCY));
            if (w instanceof SourceSpec.PlaneWave && Math.abs(s) >= 1) {
                double fMin = Math.abs(sin) * centre;
                error(f.at(), "flux", String.format("at %s the plane wave's in-plane wavenumber exceeds the wavenumber in %s "
                        + "(n = %s): no incident wave propagates there; expected frequencies above %s (wavelengths below %s)",
                        what.get(), medium.name(), Units.number(n), Units.format(fMin, Dimension.FREQUENCY),
                        Units.format(PhysicalConstants.C0 / fMin, Dimension.LENGTH)));
                continue;
            }
            if (w.signal() instanceof SignalSpec.Pulse pulse) {
                double x = (f.si() - centre) / pulse.spectrumSigma();
                if (Math.exp(-x * x) < MIN_SPECTRAL_POWER) {
                    warn(f.at(), "flux", String.format("at %s the pulse carries %.1e of its peak power; the normalised flux "
                            + "there is unreliable (widen the bandwidth or move the frequency towards %s)", what.get(), Math.exp(-x * x),
                            Units.format(PhysicalConstants.C0 / centre, Dimension.LENGTH)));
                }
            } else if (Math.abs(f.si() / centre - 1) > 1e-9) {
                warn(f.at(), "flux", String.format("at %s: a ramped wave carries only its own frequency (%s); other frequencies "
                        + "see only its switch-on", what.get(), Units.format(centre, Dimension.FREQUENCY)));
            }
        }
    }
}
