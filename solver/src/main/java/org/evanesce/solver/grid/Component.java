package org.evanesce.solver.grid;

/**
 * A field component and its place on the Yee cell, in cell units relative to node (i, j):
 * Ez (0, 0), Hx (0, ½), Hy (½, 0) for s; Hz (½, ½), Ex (½, 0), Ey (0, ½) for p.
 * H is stored scaled by the vacuum impedance (η0·H, in V/m), so E and H have similar magnitudes.
 */
public enum Component {
    EZ(Polarization.S, true, 0.0, 0.0),
    HX(Polarization.S, false, 0.0, 0.5),
    HY(Polarization.S, false, 0.5, 0.0),
    HZ(Polarization.P, false, 0.5, 0.5),
    EX(Polarization.P, true, 0.5, 0.0),
    EY(Polarization.P, true, 0.0, 0.5);

    public final Polarization polarization;
    /** True for electric components (sampled at whole time steps), false for magnetic (half steps). */
    public final boolean electric;
    /** Offset of the component's site from the node along x, in cells. */
    public final double dx;
    /** Offset of the component's site from the node along y, in cells. */
    public final double dy;

    Component(Polarization polarization, boolean electric, double dx, double dy) {
        this.polarization = polarization;
        this.electric = electric;
        this.dx = dx;
        this.dy = dy;
    }
}
