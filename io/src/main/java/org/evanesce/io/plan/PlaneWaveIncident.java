package org.evanesce.io.plan;

import java.util.Optional;
import org.evanesce.geometry.Material;
import org.evanesce.io.casefile.model.FluxSpec;
import org.evanesce.io.casefile.model.MaterialSpec;
import org.evanesce.io.casefile.model.SourceSpec;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.source.GaussianPulse;
import org.evanesce.solver.source.PlaneWaveResponse;
import org.evanesce.solver.source.Source;

/**
 * Whether a plane wave's incident-power run can be computed instead of stepped ({@link PlaneWaveResponse}): a
 * {@code plane_wave} (its sheet alone, no other source) in a lossless, non-dispersive medium, Bloch-periodic left and
 * right sides, PMLs at the top and bottom (the computation stands for a grid open above and below), a pulse (a ramped
 * wave keeps the strip: see {@link PlaneWaveResponse} on its switch-on) whose spectrum is negligible at the grazing
 * frequency of its in-plane wavenumber ({@link #CUTOFF_LEVEL}), and {@code incident_run: auto}.
 */
final class PlaneWaveIncident {

    private PlaneWaveIncident() {
    }

    /**
     * The pulse's amplitude spectrum at the one-dimensional problem's cut-off ({@link PlaneWaveResponse#cutoff}),
     * relative to its peak, above which the incident-power run is stepped: the stepped runs' windows end while what the
     * pulse put near the cut-off still lingers on the lines, which the computation does not hold. Measured against the
     * stepped strip (PlaneWaveIncidentTest): 2.2e-4 there moved T and R by 1.9e-5, 0.2 moved the incident power by 1.8 %.
     */
    static final double CUTOFF_LEVEL = 1e-4;

    /** The computation, or empty when the incident-power run must be stepped (on the strip or the whole grid). */
    static Optional<PlaneWaveResponse> of(FluxSpec f, SourceSpec.Launched w, MaterialSpec medium, Material gridMedium,
                                         IncidentKey.Setup setup, int nx, double cellSize, double dt) {
        if (f.incidentRun().value() != FluxSpec.IncidentRun.AUTO || !(w instanceof SourceSpec.PlaneWave)
                || medium.isDispersive() || gridMedium.conductivity() != 0 || !setup.sheets().isEmpty()
                || !(setup.sides().get(Side.LEFT) instanceof Boundary.Bloch b)
                || !(setup.sides().get(Side.RIGHT) instanceof Boundary.Bloch)
                || !(setup.sides().get(Side.TOP) instanceof Boundary.Pml)
                || !(setup.sides().get(Side.BOTTOM) instanceof Boundary.Pml)) {
            return Optional.empty();
        }
        double kappa = b.wavenumber() * cellSize;
        if (!PlaneWaveResponse.supported(setup.polarization(), setup.sources(), nx, kappa)) {
            return Optional.empty();
        }
        double eps = gridMedium.relativePermittivity();
        double fc = PlaneWaveResponse.cutoff(setup.precision(), setup.courant(), eps, kappa, dt);
        for (Source src : setup.sources()) {
            GaussianPulse p = (GaussianPulse) src.signal();
            if (!(p.amplitudeSpectrum(fc) <= CUTOFF_LEVEL * p.amplitudeSpectrum(p.carrierFrequency()))) {
                return Optional.empty();
            }
        }
        return Optional.of(new PlaneWaveResponse(setup.polarization(), setup.precision(), setup.courant(),
                gridMedium.relativePermittivity(), kappa, nx, setup.sources()));
    }
}
