package org.evanesce.solver.source;

import java.util.EnumMap;
import java.util.Map;
import org.evanesce.geometry.Complex;
import org.evanesce.solver.farfield.ContourPoints;
import org.evanesce.solver.farfield.NearToFarField;
import org.evanesce.solver.farfield.SurfaceSamples;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.record.StepListener;
import org.evanesce.solver.record.StepView;

/**
 * Running DFTs of a polarization's three components round a rectangle of nodes, brought to the nodes (Yee
 * neighbours averaged, second order) and handed to {@link NearToFarField} on the trapezoid rule: the test-side
 * recorder of the scattering tests.
 */
final class ContourDfts implements StepListener {

    private final Polarization pol;
    private final int iL, jB, iR, jT;
    private final double dx, originX, originY;
    private final Map<Component, BoxRuns.Watch> watches = new EnumMap<>(Component.class);

    /**
     * @param originX x of the far field's origin (the scatterer's centre), m; node (i, j) is at (iΔ, jΔ)
     */
    ContourDfts(Polarization pol, int iL, int jB, int iR, int jT, double dx, double originX, double originY, double f,
                long from, long to) {
        this.pol = pol;
        this.iL = iL;
        this.jB = jB;
        this.iR = iR;
        this.jT = jT;
        this.dx = dx;
        this.originX = originX;
        this.originY = originY;
        for (Component c : pol.components()) {
            watches.put(c, new BoxRuns.Watch(c, iL - 1, jB - 1, iR + 1, jT + 1, f, from, to));
        }
    }

    @Override
    public void afterStep(StepView v) {
        for (BoxRuns.Watch w : watches.values()) {
            w.afterStep(v);
        }
    }

    private Complex p(Component c, int i, int j) {
        return watches.get(c).phasor(i, j);
    }

    /** A component's phasor brought to node (i, j). */
    Complex atNode(Component c, int i, int j) {
        return switch (c) {
            case EZ -> p(c, i, j);
            case HX, EY -> p(c, i, j - 1).plus(p(c, i, j)).times(0.5);
            case HY, EX -> p(c, i - 1, j).plus(p(c, i, j)).times(0.5);
            case HZ -> p(c, i - 1, j - 1).plus(p(c, i, j - 1)).plus(p(c, i - 1, j)).plus(p(c, i, j)).times(0.25);
        };
    }

    /** The far field of what crosses the rectangle, in a medium of index n. */
    NearToFarField farField(double wavelength, double index) {
        SurfaceSamples[] uv = samples();
        return new NearToFarField(pol, wavelength, index, uv[0], uv[1]);
    }

    /** The net power (W/m) the recorded field carries out of the rectangle, in any media. */
    double outwardPower() {
        SurfaceSamples[] uv = samples();
        return org.evanesce.solver.farfield.SurfaceFlux.outwardPower(pol, uv[0], uv[1]);
    }

    /** {U, V_t} at the rectangle's nodes. */
    private SurfaceSamples[] samples() {
        ContourPoints pts = ContourPoints.rectangle(iL * dx - originX, jB * dx - originY, iR * dx - originX,
                jT * dx - originY, dx, ContourPoints.Rule.TRAPEZOID);
        int n = pts.size();
        double[][] u = new double[2][n];
        double[][] vx = new double[2][n];
        double[][] vy = new double[2][n];
        boolean s = pol == Polarization.S;
        for (int q = 0; q < n; q++) {
            int i = (int) Math.round((pts.x()[q] + originX) / dx);
            int j = (int) Math.round((pts.y()[q] + originY) / dx);
            Complex a = atNode(s ? Component.EZ : Component.HZ, i, j);
            Complex bx = atNode(s ? Component.HX : Component.EX, i, j);
            Complex by = atNode(s ? Component.HY : Component.EY, i, j);
            u[0][q] = a.re();
            u[1][q] = a.im();
            vx[0][q] = bx.re();
            vx[1][q] = bx.im();
            vy[0][q] = by.re();
            vy[1][q] = by.im();
        }
        return new SurfaceSamples[] {pts.scalar(u[0], u[1]), pts.tangential(vx[0], vx[1], vy[0], vy[1])};
    }
}
