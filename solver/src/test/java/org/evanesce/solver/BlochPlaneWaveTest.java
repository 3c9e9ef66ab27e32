package org.evanesce.solver;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.record.Probe;
import org.evanesce.solver.source.Source;
import org.evanesce.solver.source.TimeSignal;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * An oblique plane wave with Bloch-periodic boundaries along x (J. A. Roden et al., IEEE Trans.
 * Microwave Theory Tech. 46, 420 (1998); A. Aminian &amp; Y. Rahmat-Samii, IEEE TAP 54, 1818 (2006):
 * a fixed in-plane wavenumber kx). A line source with amplitudes e^{i kx x} launches a wave whose
 * normal wavenumber must obey the 2D Yee dispersion relation
 * sin²(ωΔt/2)/S² = sin²(kxΔ/2) + sin²(kyΔ/2) (Taflove &amp; Hagness ch. 4, from memory), and whose
 * field must carry the Bloch phase e^{i kx Δ} from one column to the next exactly.
 */
class BlochPlaneWaveTest {

    private static final int NX = 30;
    private static final int NY = 480;
    private static final int SOURCE_ROW = 60;
    private static final int ROW_A = 150;
    private static final int ROW_B = 330;
    private static final double DX = 25e-9;
    private static final double S = 0.5;
    /** Phase-velocity agreement: the CPML's −90 dB reflections and the finite record, with margin. */
    private static final double TOLERANCE = 1e-4;
    /** The column-to-column Bloch phase is exact up to float rounding of the two parts. */
    private static final double PHASE_TOLERANCE = 1e-5;

    @ParameterizedTest(name = "{0} {1}, {2} degrees")
    @CsvSource({"S, FLOAT, 45", "P, FLOAT, 45", "S, DOUBLE, 60", "P, FLOAT, 30"})
    void obliquePlaneWaveFollowsTheYeeDispersionRelation(Polarization pol, Precision precision, double degrees) {
        double cellsPerWavelength = 20;
        double omega = 2 * Math.PI * S / cellsPerWavelength; // rad per step
        double k0 = 2 * Math.PI / cellsPerWavelength; // rad per cell
        double kx = k0 * Math.sin(Math.toRadians(degrees));
        double f = PhysicalConstants.C0 / (cellsPerWavelength * DX);
        Component c = pol == Polarization.S ? Component.EZ : Component.HZ;
        MaterialGrid grid = MaterialGrid.builder(NX, NY, DX, Material.VACUUM).build();
        Probe a = new Probe(c, 7, ROW_A);
        Probe b = new Probe(c, 7, ROW_B);
        Probe a2 = new Probe(c, 8, ROW_A);
        try (Simulation s = Simulation.builder(grid).polarization(pol).precision(precision).courant(S)
                .boundary(Side.LEFT, Boundary.bloch(kx / DX)).boundary(Side.RIGHT, Boundary.bloch(kx / DX))
                .boundary(Side.BOTTOM, Boundary.pml(40)).boundary(Side.TOP, Boundary.pml(40))
                .threads(2).minCellsPerThread(1)
                .source(Source.blochRow(c, NX, SOURCE_ROW, 0.0, DX, kx / DX, TimeSignal.gaussianPulse(f, f / 20)))
                .listener(a).listener(b).listener(a2).build()) {
            s.run(8000);
        }
        double[] xa = complexDft(a, f);
        double[] xb = complexDft(b, f);
        double[] xa2 = complexDft(a2, f);
        double expected = 2 * Math.asin(Math.sqrt(Math.pow(Math.sin(omega / 2) / S, 2) - Math.pow(Math.sin(kx / 2), 2)));
        double dphi = Math.atan2(Dft.div(xb, xa)[1], Dft.div(xb, xa)[0]);
        int d = ROW_B - ROW_A;
        // resolve the whole turns with the expected value
        double turns = Math.rint((expected * d - dphi) / (2 * Math.PI));
        double ky = (dphi + 2 * Math.PI * turns) / d;
        String ctx = String.format("%s %s %g°, grid %d×%d: ky = %.8f rad/cell, Yee %.8f, continuum %.8f", pol, precision,
                degrees, NX, NY, ky, expected, Math.sqrt(k0 * k0 - kx * kx));
        assertEquals(expected, ky, TOLERANCE * expected, ctx);
        double[] step = Dft.div(xa2, xa);
        double phase = Math.atan2(step[1], step[0]);
        assertEquals(kx, phase, PHASE_TOLERANCE, ctx + ": column-to-column phase");
        assertEquals(1.0, Dft.abs(step), PHASE_TOLERANCE, ctx + ": column-to-column amplitude");
        assertTrue(Dft.abs(xa) > 0, ctx);
    }

    /** X(f) = Σ (re + i im) e^{i2πft}. */
    private static double[] complexDft(Probe p, double f) {
        double[] re = p.values();
        double[] im = p.imagValues();
        double[] t = p.times();
        double w = 2 * Math.PI * f;
        double xr = 0;
        double xi = 0;
        for (int n = 0; n < re.length; n++) {
            double c = Math.cos(w * t[n]);
            double s = Math.sin(w * t[n]);
            xr += re[n] * c - im[n] * s;
            xi += re[n] * s + im[n] * c;
        }
        return new double[] {xr, xi};
    }
}
