package org.evanesce.io.plan;

import java.util.List;
import java.util.Map;
import org.evanesce.io.casefile.text.Diagnostic;
import org.evanesce.io.casefile.model.SourceSpec;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Units;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.source.TimeSignal;
import org.evanesce.solver.source.TotalFieldBox;

/** Turns a case's {@code plane_wave_box} into a solver {@link TotalFieldBox} on the rasterised grid. */
final class BoxPlanner {

    private BoxPlanner() {
    }

    /**
     * The box on the nodes nearest its corners, or null with an error added (a box that does not fit inside the
     * walls and PML, a background neither homogeneous nor layered along y, a grid too coarse for the wave).
     */
    static TotalFieldBox plan(SourceSpec.PlaneWaveBox pb, String path, MaterialGrid grid, Map<Side, Boundary> sides,
                              double courant, TimeSignal signal, List<Diagnostic> errors) {
        double dx = grid.cellSize();
        int ia = CasePlanner.nearest(pb.from().x().si(), grid.x0(), dx, 0);
        int ib = CasePlanner.nearest(pb.to().x().si(), grid.x0(), dx, 0);
        int ja = CasePlanner.nearest(pb.from().y().si(), grid.y0(), dx, 0);
        int jb = CasePlanner.nearest(pb.to().y().si(), grid.y0(), dx, 0);
        double[] ref = pb.referencePoint();
        try {
            TotalFieldBox.Spec spec = new TotalFieldBox.Spec(pb.component().value().polarization, pb.heading().si(),
                    pb.amplitude().si(), signal, ref[0], ref[1]);
            return TotalFieldBox.plan(spec, grid, sides, courant, Math.min(ia, ib), Math.min(ja, jb), Math.max(ia, ib),
                    Math.max(ja, jb));
        } catch (IllegalArgumentException e) {
            errors.add(new Diagnostic(Diagnostic.Severity.ERROR, pb.at(), path, String.format("the box from (%s, %s) to "
                    + "(%s, %s) cannot be used: %s", length(pb.from().x().si()), length(pb.from().y().si()),
                    length(pb.to().x().si()), length(pb.to().y().si()), e.getMessage())));
            return null;
        }
    }

    private static String length(double v) {
        return Units.format(v, Dimension.LENGTH);
    }
}
