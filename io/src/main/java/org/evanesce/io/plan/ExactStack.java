package org.evanesce.io.plan;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.evanesce.geometry.GridSpec;
import org.evanesce.io.casefile.model.BoundarySpec;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.model.FluxSpec;
import org.evanesce.io.casefile.text.Diagnostic;
import org.evanesce.io.casefile.model.SourceSpec;
import org.evanesce.io.plan.grid.GridPlan;
import org.evanesce.solver.grid.Courant;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.reference.PlanarStack;

/**
 * A case's layered stack as the exact plane-wave reference reads it ({@code flux.transfer_matrix}), found
 * without building the grid's materials or the simulation: the fit command evaluates it for every trial
 * parameter set, where planning the whole run each time would cost seconds.
 *
 * @param stack        the stack at a vacuum wavelength, m, from the source's medium in its direction
 * @param polarization the case's
 * @param wavelength   the case's design wavelength (vacuum), m: a pulse's centre frequency is the middle of its band in
 *                     frequency, a little off the wavelength the case names
 * @param angle        the source's angle of incidence (at its centre frequency), in the medium at its line, rad
 * @param waist        a Gaussian beam's waist, m (NaN for a plane wave)
 * @param waistDistance a Gaussian beam's distance along its axis from its waist to the first interface, m, positive
 *                     when the waist lies before it (as {@code AngularSpectrum.GaussianBeam} takes it; NaN for a plane
 *                     wave)
 * @param media        the case's materials the wave crosses, by name: the incidence medium, one per layer of the
 *                     stack, the exit medium
 * @param permittivity which permittivity the stack's dispersive materials take
 * @param cellSize     the case's cell size, m
 * @param courant      the case's Courant number (its {@code numerics.courant} or the program's default)
 */
public record ExactStack(java.util.function.DoubleFunction<PlanarStack> stack, Polarization polarization,
                         double wavelength, double angle, double waist, double waistDistance, List<String> media,
                         FluxSpec.ReferencePermittivity permittivity, double cellSize, double courant) {

    public ExactStack {
        media = List.copyOf(media);
    }

    /** The time step of the case's run, Δt = SΔ/c0 as the planner sets it, s: the discrete permittivity's. */
    public double timeStep() {
        return Courant.timeStep(courant, cellSize);
    }

    /**
     * Reads the stack of a case with one plane wave or Gaussian beam over horizontal layers, with each metal's
     * continuous ε(ω) (what fits and tolerance studies use).
     *
     * @throws PlanException naming the case's line when it has no such source or is not layered
     */
    public static ExactStack of(CaseSpec spec) throws PlanException {
        return of(spec, FluxSpec.ReferencePermittivity.CONTINUOUS);
    }

    /**
     * The same with each metal's continuous ε(ω) or its discrete ε_d(ω, Δt) at the time step of the case's run (the
     * grid the case's {@code grid} and {@code numerics.courant} give, as the planner derives it).
     *
     * @throws PlanException naming the case's line when it has no such source or is not layered
     */
    public static ExactStack of(CaseSpec spec, FluxSpec.ReferencePermittivity permittivity) throws PlanException {
        List<Diagnostic> errors = new ArrayList<>();
        Optional<SourceSpec.Launched> launched = PlaneWaves.launched(spec);
        if (launched.isEmpty()) {
            errors.add(new Diagnostic(Diagnostic.Severity.ERROR, spec.polarization().at(), "sources",
                    "the case has no plane_wave or gaussian_beam source, so it has no exact plane-wave answer; expected one "
                            + "of them over horizontal layers"));
            throw new PlanException(errors);
        }
        SourceSpec.Launched w = launched.get();
        GridPlan r = CasePlanner.grid(spec);
        boolean periodic = spec.boundary(Side.LEFT) instanceof BoundarySpec.Periodic;
        // the same grid and interior as CasePlanner's, so that the layers are read where a run reads them
        GridSpec grid = r.solverGrid(periodic);
        int[] interior = {r.pmlCells(Side.LEFT), r.pmlCells(Side.BOTTOM), grid.nx() - r.pmlCells(Side.RIGHT),
            grid.ny() - r.pmlCells(Side.TOP)};
        // the same cell size, Courant number and time step as CasePlanner's
        double dx = r.cellSize().si();
        double courant = spec.numerics().courant().map(v -> v.si()).orElse(Courant.DEFAULT);
        Optional<FluxPlan.Exact> exact = FluxPlanner.transferMatrix(spec, grid, w, interior, errors, permittivity,
                Courant.timeStep(courant, dx), false);
        if (exact.isEmpty() || !errors.isEmpty()) {
            throw new PlanException(errors);
        }
        FluxPlan.Exact x = exact.get();
        double waist = Double.NaN;
        double distance = Double.NaN;
        if (w instanceof SourceSpec.GaussianBeamSource b) {
            // as the run's beam reference (io.run.BeamReference.beam) places the waist
            double direction = b.direction().value().sign();
            distance = (x.firstInterface() - b.waistAt().y().si()) * direction / Math.cos(b.angle().si());
            waist = b.waist().si();
        }
        return new ExactStack(x.stack(), spec.polarization().value(), spec.designWavelength().si(), w.angle().si(), waist,
                distance, x.media(), permittivity, dx, courant);
    }
}
