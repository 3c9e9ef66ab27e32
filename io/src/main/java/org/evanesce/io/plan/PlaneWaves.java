package org.evanesce.io.plan;

import java.util.Optional;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.model.MaterialSpec;
import org.evanesce.io.casefile.model.SourceSpec;

/** The case's plane wave (at most one, the case file's checks ensure) and the quantities derived from it. */
public final class PlaneWaves {

    private PlaneWaves() {
    }

    static Optional<SourceSpec.PlaneWave> of(CaseSpec spec) {
        return spec.sources().stream().filter(s -> s instanceof SourceSpec.PlaneWave).map(s -> (SourceSpec.PlaneWave) s)
                .findFirst();
    }

    /** The case's plane wave or Gaussian beam (at most one). */
    public static Optional<SourceSpec.Launched> launched(CaseSpec spec) {
        return spec.sources().stream().filter(s -> s instanceof SourceSpec.Launched).map(s -> (SourceSpec.Launched) s)
                .findFirst();
    }

    /** The material along the launching line (for a beam, where its axis crosses it). */
    public static MaterialSpec medium(CaseSpec spec, SourceSpec.Launched w) {
        double x = w instanceof SourceSpec.GaussianBeamSource b ? b.axisAtLine() : 0;
        return spec.materials().get(spec.materialAt(x, w.y().si()));
    }

    /** The in-plane wavenumber of the case's plane wave or beam (its axis), n k0 sin θ at the centre frequency, rad/m. */
    public static double launchedKx(CaseSpec spec) {
        return launched(spec).map(w -> 2 * Math.PI * w.signal().frequency().si() / PhysicalConstants.C0
                * medium(spec, w).index() * Math.sin(w.angle().si())).orElse(0.0);
    }

    /** kx = n k0 sin θ at the signal's centre frequency, rad/m; 0 without a plane wave. */
    static double kx(CaseSpec spec) {
        return of(spec).isPresent() ? launchedKx(spec) : 0.0;
    }
}
