package org.evanesce.io.plan;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.evanesce.geometry.GridSpec;
import org.evanesce.io.casefile.model.BoundarySpec;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.text.Diagnostic;
import org.evanesce.io.casefile.model.SourceSpec;
import org.evanesce.io.plan.grid.GridPlan;
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
 */
public record ExactStack(java.util.function.DoubleFunction<PlanarStack> stack, Polarization polarization,
                         double wavelength, double angle, double waist, double waistDistance) {

    /** A plane wave's stack. */
    public ExactStack(java.util.function.DoubleFunction<PlanarStack> stack, Polarization polarization, double wavelength,
                      double angle) {
        this(stack, polarization, wavelength, angle, Double.NaN, Double.NaN);
    }

    /**
     * Reads the stack of a case with one plane wave or Gaussian beam over horizontal layers.
     *
     * @throws PlanException naming the case's line when it has no such source or is not layered
     */
    public static ExactStack of(CaseSpec spec) throws PlanException {
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
        Optional<FluxPlan.Exact> exact = FluxPlanner.transferMatrix(spec, grid, w, interior, errors, 0, false);
        if (exact.isEmpty() || !errors.isEmpty()) {
            throw new PlanException(errors);
        }
        if (w instanceof SourceSpec.GaussianBeamSource b) {
            // as the run's beam reference (io.run.BeamReference.beam) places the waist
            double direction = b.direction().value().sign();
            double distance = (exact.get().firstInterface() - b.waistAt().y().si()) * direction / Math.cos(b.angle().si());
            return new ExactStack(exact.get().stack(), spec.polarization().value(), spec.designWavelength().si(),
                    w.angle().si(), b.waist().si(), distance);
        }
        return new ExactStack(exact.get().stack(), spec.polarization().value(), spec.designWavelength().si(), w.angle().si());
    }
}
