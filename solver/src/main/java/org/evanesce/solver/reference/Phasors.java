package org.evanesce.solver.reference;

import org.evanesce.geometry.Complex;
import org.evanesce.solver.grid.Polarization;

/**
 * The complex amplitudes (time dependence exp(−iωt)) of the three field components of one in-plane polarization at
 * one point, in the project's units: E in V/m and H stored as η0·H, also in V/m (docs/architecture.md), per unit amplitude of
 * whatever source produced them.
 *
 * <p>{@code u} is the component along z: Ez for s, η0·Hz for p; ({@code vx}, {@code vy}) is the in-plane vector:
 * (η0·Hx, η0·Hy) for s, (Ex, Ey) for p. The named accessors return the component of that name, or zero for a
 * component the polarization does not carry.
 *
 * @param polarization s (Ez, Hx, Hy) or p (Hz, Ex, Ey)
 * @param u            Ez (s) or η0·Hz (p)
 * @param vx           η0·Hx (s) or Ex (p)
 * @param vy           η0·Hy (s) or Ey (p)
 */
public record Phasors(Polarization polarization, Complex u, Complex vx, Complex vy) {

    public Phasors {
        if (polarization == null || u == null || vx == null || vy == null) {
            throw new IllegalArgumentException("phasors: polarization and components must not be null");
        }
    }

    public Phasors plus(Phasors o) {
        if (o.polarization != polarization) {
            throw new IllegalArgumentException("phasors: cannot add " + o.polarization + " to " + polarization);
        }
        return new Phasors(polarization, u.plus(o.u), vx.plus(o.vx), vy.plus(o.vy));
    }

    public Phasors minus(Phasors o) {
        return plus(o.times(Complex.real(-1)));
    }

    public Phasors times(Complex f) {
        return new Phasors(polarization, u.times(f), vx.times(f), vy.times(f));
    }

    public Complex ez() {
        return polarization == Polarization.S ? u : Complex.ZERO;
    }

    /** η0·Hx. */
    public Complex hx() {
        return polarization == Polarization.S ? vx : Complex.ZERO;
    }

    /** η0·Hy. */
    public Complex hy() {
        return polarization == Polarization.S ? vy : Complex.ZERO;
    }

    /** η0·Hz. */
    public Complex hz() {
        return polarization == Polarization.P ? u : Complex.ZERO;
    }

    public Complex ex() {
        return polarization == Polarization.P ? vx : Complex.ZERO;
    }

    public Complex ey() {
        return polarization == Polarization.P ? vy : Complex.ZERO;
    }
}
