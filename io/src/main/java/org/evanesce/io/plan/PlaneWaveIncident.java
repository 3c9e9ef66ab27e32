package org.evanesce.io.plan;

import java.util.Optional;
import org.evanesce.geometry.Material;
import org.evanesce.io.casefile.model.FluxSpec;
import org.evanesce.io.casefile.model.MaterialSpec;
import org.evanesce.io.casefile.model.SourceSpec;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.source.PlaneWaveResponse;

/**
 * Whether a plane wave's incident-power run can be computed instead of stepped ({@link PlaneWaveResponse}): a
 * {@code plane_wave} (its sheet alone, no other source) in a lossless, non-dispersive medium, Bloch-periodic left and
 * right sides, PMLs at the top and bottom (the computation stands for a grid open above and below), a pulse or a
 * ramped wave, and {@code incident_run: auto}.
 */
final class PlaneWaveIncident {

    private PlaneWaveIncident() {
    }

    /** The computation, or empty when the incident-power run must be stepped (on the strip or the whole grid). */
    static Optional<PlaneWaveResponse> of(FluxSpec f, SourceSpec.Launched w, MaterialSpec medium, Material gridMedium,
                                         IncidentKey.Setup setup, int nx, double cellSize) {
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
        return Optional.of(new PlaneWaveResponse(setup.polarization(), setup.precision(), setup.courant(),
                gridMedium.relativePermittivity(), kappa, nx, setup.sources()));
    }
}
