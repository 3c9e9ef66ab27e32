package org.evanesce.io.run;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.evanesce.geometry.Complex;
import org.evanesce.solver.grid.Polarization;
import org.junit.jupiter.api.Test;

/**
 * The factor that turns a transmitted profile |U|² into a flux density relative to the incident one: the exit
 * medium's Re Q over the incidence medium's. Against the transmittance of a plane wave through one interface,
 * T = (n2 cos θt)/(n1 cos θi) |t_E|² (E. Hecht, "Optics", 4th ed., 2002, eqs. 4.60 to 4.62; from memory), with
 * U = E for s and U = H = (n/η0) E for p, so that the factor is (n2 cos θt)/(n1 cos θi) for s and
 * (n1 cos θt)/(n2 cos θi) for p.
 */
class BeamPlotsTest {

    /** A square root and a few products in double precision. */
    static final double ROUND_OFF = 1e-14;

    @Test
    void transmittedFluxFactorIsHechtsTransmittanceFactor() {
        double n1 = 1.5;
        double n2 = 1.33;
        for (double deg : new double[] {0, 20, 40}) {
            double ti = Math.toRadians(deg);
            double sinI = n1 * Math.sin(ti);
            double tt = Math.asin(sinI / n2);
            double s = BeamPlots.admittance(Polarization.S, Complex.real(n2), sinI).re()
                    / BeamPlots.admittance(Polarization.S, Complex.real(n1), sinI).re();
            double p = BeamPlots.admittance(Polarization.P, Complex.real(n2), sinI).re()
                    / BeamPlots.admittance(Polarization.P, Complex.real(n1), sinI).re();
            assertEquals(n2 * Math.cos(tt) / (n1 * Math.cos(ti)), s, ROUND_OFF, "s at " + deg + " deg");
            assertEquals(n1 * Math.cos(tt) / (n2 * Math.cos(ti)), p, ROUND_OFF, "p at " + deg + " deg");
        }
        // beyond the critical angle the exit side carries no flux: Re Q = 0
        double sinI = n1 * Math.sin(Math.toRadians(70));
        assertEquals(0, BeamPlots.admittance(Polarization.S, Complex.real(n2), sinI).re(), ROUND_OFF, "evanescent, s");
        assertEquals(0, BeamPlots.admittance(Polarization.P, Complex.real(n2), sinI).re(), ROUND_OFF, "evanescent, p");
    }
}
