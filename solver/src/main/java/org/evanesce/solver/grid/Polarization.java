package org.evanesce.solver.grid;

/**
 * In-plane polarization of a 2D run (fields uniform along z).
 * <ul>
 * <li>{@link #S}: electric field along z, perpendicular to the plane of incidence (Ez, Hx, Hy).</li>
 * <li>{@link #P}: magnetic field along z, electric field in the plane of incidence (Hz, Ex, Ey).</li>
 * </ul>
 */
public enum Polarization {
    S, P;

    /** The three field components that this polarization carries. */
    public Component[] components() {
        return this == S ? new Component[] {Component.EZ, Component.HX, Component.HY}
                         : new Component[] {Component.HZ, Component.EX, Component.EY};
    }
}
