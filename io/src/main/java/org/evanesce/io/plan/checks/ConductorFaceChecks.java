package org.evanesce.io.plan.checks;

import java.util.List;
import org.evanesce.io.casefile.model.CaseSpec;
import org.evanesce.io.casefile.model.MaterialSpec;
import org.evanesce.io.casefile.model.ShapeSpec;
import org.evanesce.io.casefile.text.KeyPaths;
import org.evanesce.io.casefile.text.Located;
import org.evanesce.solver.grid.Polarization;

/**
 * A perfect conductor's curved or tilted faces in p polarization: the grid draws a perfect conductor as a
 * staircase (docs/case-file.md, "Perfect conductors"), and with E across the faces the staircase's error is
 * first order in the cell with a large constant (PecCylinderTest: a conducting cylinder of size parameter 2 is
 * +56 % in forward scattering width at 30 cells per wavelength, +6.2 % at 180, within 2 % only at about 720).
 * Faces along the grid axes are exact, and in s (E along the faces) the same cylinder is within 2 % at 120, so
 * only p with a face off the axes is warned about, once per shape.
 */
final class ConductorFaceChecks {

    /** A rotation within this of a multiple of 90 degrees counts as along the axes, rad (round-off of written angles). */
    static final double AXIS_TOLERANCE = 1e-9;

    private final CaseSpec spec;
    private final KeyPaths paths;
    private final CaseChecks checks;

    ConductorFaceChecks(CaseSpec spec, KeyPaths paths, CaseChecks checks) {
        this.spec = spec;
        this.paths = paths;
        this.checks = checks;
    }

    void run() {
        if (spec.polarization().value() != Polarization.P) {
            return;
        }
        for (int k = 0; k < spec.shapes().size(); k++) {
            ShapeSpec s = spec.shapes().get(k);
            String conductor = conductor(s.materials());
            if (conductor != null && !alongAxes(s)) {
                checks.warn(s.at(), paths.shapes().get(k), String.format("the perfect conductor %s has faces off the grid's axes "
                        + "and the run is in p polarization: its faces are a staircase, first order in the cell with a large "
                        + "error in p (a conducting cylinder's scattering width is +6 %% forward at 180 cells per wavelength and "
                        + "within 2 %% only at about 720); treat scattered power and far fields from it as doubtful, or check "
                        + "them by refining the cell (docs/case-file.md, 'Perfect conductors')", conductor));
            }
        }
    }

    private String conductor(List<Located<String>> materials) {
        for (Located<String> m : materials) {
            MaterialSpec ms = spec.materials().get(m.value());
            if (ms != null && ms.isPerfectConductor()) {
                return m.value();
            }
        }
        return null;
    }

    private static boolean alongAxes(ShapeSpec s) {
        if (s instanceof ShapeSpec.Rectangle r) {
            return quarterTurn(r.rotation().si());
        }
        if (s instanceof ShapeSpec.HalfPlane h) {
            return quarterTurn(h.inward().si());
        }
        if (s instanceof ShapeSpec.LayerStack st) {
            return quarterTurn(st.rotation().si());
        }
        if (s instanceof ShapeSpec.Polygon p) {
            double[][] c = p.placedCorners();
            for (int i = 0; i < c.length; i++) {
                double[] a = c[i];
                double[] b = c[(i + 1) % c.length];
                double dx = Math.abs(b[0] - a[0]);
                double dy = Math.abs(b[1] - a[1]);
                if (Math.min(dx, dy) > AXIS_TOLERANCE * Math.max(dx, dy)) {
                    return false;
                }
            }
            return true;
        }
        return false; // disks and ellipses
    }

    private static boolean quarterTurn(double radians) {
        double q = radians / (Math.PI / 2);
        return Math.abs(q - Math.rint(q)) < AXIS_TOLERANCE;
    }
}
