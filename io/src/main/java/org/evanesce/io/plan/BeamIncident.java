package org.evanesce.io.plan;

import java.util.Optional;
import org.evanesce.geometry.Material;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.model.FluxSpec;
import org.evanesce.io.casefile.model.MaterialSpec;
import org.evanesce.io.casefile.model.SignalSpec;
import org.evanesce.io.casefile.model.SourceSpec;
import org.evanesce.io.casefile.model.SurfacesSpec;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.source.IncidentSheet;
import org.evanesce.solver.source.SheetResponse;

/**
 * Whether a case's incident-power run can be computed instead of stepped ({@link SheetResponse}): a pulsed
 * Gaussian beam (its sheets alone, no other source) in a lossless, non-dispersive medium, PMLs on all four sides
 * (the computation stands for an unbounded grid), no surfaces section (surfaces add recorders of their own to the
 * incident-power run) and {@code incident_run: auto}. The same for the incident norm of a {@code surfaces} section in a
 * case without a flux section ({@link #forSurfaces}): its one recorder is the incident line.
 */
final class BeamIncident {

    private BeamIncident() {
    }

    /** The computation, or empty when the incident-power run must be stepped. */
    static Optional<SheetResponse> of(CaseSpec spec, FluxSpec f, SourceSpec.Launched w, MaterialSpec medium,
                                      Material gridMedium, IncidentKey.Setup setup, int nx) {
        if (f.incidentRun().value() != FluxSpec.IncidentRun.AUTO || spec.surfaces().isPresent()) {
            return Optional.empty();
        }
        return sheets(w, medium, gridMedium, setup, nx);
    }

    /**
     * The computation for the incident line of a {@code surfaces} section normalised by the incident power, in a case
     * without a flux section (with one, the norm rides on the flux section's incident-power run), or empty.
     */
    static Optional<SheetResponse> forSurfaces(CaseSpec spec, SourceSpec.Launched w, MaterialSpec medium,
                                               Material gridMedium, IncidentKey.Setup setup, int nx) {
        SurfacesSpec s = spec.surfaces().orElseThrow();
        if (spec.flux().isPresent() || s.incidentRun().value() != FluxSpec.IncidentRun.AUTO
                || s.normalise().value() != SurfacesSpec.Normalise.INCIDENT) {
            return Optional.empty();
        }
        return sheets(w, medium, gridMedium, setup, nx);
    }

    private static Optional<SheetResponse> sheets(SourceSpec.Launched w, MaterialSpec medium, Material gridMedium,
                                                 IncidentKey.Setup setup, int nx) {
        if (!(w instanceof SourceSpec.GaussianBeamSource) || !(w.signal() instanceof SignalSpec.Pulse)
                || !setup.sources().isEmpty() || setup.sheets().isEmpty() || medium.isDispersive()
                || gridMedium.conductivity() != 0 || setup.sides().size() != 4) {
            return Optional.empty();
        }
        for (Boundary b : setup.sides().values()) {
            if (!(b instanceof Boundary.Pml)) {
                return Optional.empty();
            }
        }
        for (IncidentSheet s : setup.sheets()) {
            if (!SheetResponse.supported(setup.polarization(), s, nx)) {
                return Optional.empty();
            }
        }
        return Optional.of(new SheetResponse(setup.polarization(), setup.precision(), setup.courant(),
                gridMedium.relativePermittivity(), nx, setup.sheets()));
    }
}
