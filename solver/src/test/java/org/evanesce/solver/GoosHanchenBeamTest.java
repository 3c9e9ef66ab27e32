package org.evanesce.solver;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import org.evanesce.geometry.Complex;
import org.evanesce.geometry.GridSpec;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.Rasterizer;
import org.evanesce.geometry.Scene;
import org.evanesce.geometry.Smoothing;
import org.evanesce.geometry.shape.HalfPlane;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.record.BeamProfile;
import org.evanesce.solver.record.FluxLine;
import org.evanesce.solver.reference.AngularSpectrum;
import org.evanesce.solver.reference.PlanarStack;
import org.evanesce.solver.source.GaussianBeam;
import org.evanesce.solver.source.RampedContinuous;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * The lateral (Goos–Hänchen) shift of a totally reflected Gaussian beam, simulated: a beam of waist
 * 20 wavelengths in glass (n = 1.5) meets the interface with vacuum at 45°, its waist on the
 * interface; the reflected beam's centroid, read from the flux density on a line in the glass
 * below, is compared with the specular one. Issue #5: within 5 % of Artmann's stationary-phase
 * shift, D_s = λ0 tan θ / (π √(n1² sin²θ − n2²)), D_p = D_s·m²/((1 + m²) sin²θ − m²), m = n2/n1
 * (K. Artmann, Ann. Physik 2, 87 (1948); the forms as reviewed by R. H. Renard, J. Opt. Soc. Am. 54,
 * 1190 (1964), from memory, and checked in GoosHanchenTest against the transfer matrix), and within
 * 3 % of the angular-spectrum shift of the same beam ({@link AngularSpectrum}). Measured at 24 cells
 * per wavelength in the glass: s +0.3 % / +0.02 %, p +1.0 % / +0.6 % (at 16: p +3.3 % / +2.8 %, the
 * field normal to the interface converging more slowly).
 */
class GoosHanchenBeamTest {

    private static final double WAVELENGTH = 633e-9;
    private static final double N1 = 1.5;
    private static final double THETA = Math.toRadians(45);
    private static final int CPW = 24;
    private static final int PML = 16;
    /** Issue #5. */
    private static final double ARTMANN_TOL = 0.05;
    private static final double SPECTRUM_TOL = 0.03;
    private static final int PERIODS = 20;

    @ParameterizedTest
    @EnumSource(Polarization.class)
    void reflectedBeamIsShiftedByArtmannsAmount(Polarization pol) {
        double dx = WAVELENGTH / (N1 * CPW);
        double waist = 20 * WAVELENGTH;
        double footprint = waist / Math.cos(THETA);
        int belowLine = PML + 6;
        int sheetRow = belowLine + 6;
        int interfaceRow = sheetRow + 20;
        int ny = interfaceRow + 40 + PML;
        double yInterface = (interfaceRow + 0.5) * dx; // half-way between nodes
        // the reflected beam crosses the lower line (interfaceRow − belowLine cells lower) that far to the right
        double drift = (yInterface - (belowLine + 0.5) * dx) * Math.tan(THETA);
        double xWaist = PML * dx + 3.5 * footprint;
        int nx = (int) Math.ceil((xWaist + drift + 3.5 * footprint) / dx) + PML;
        double f = PhysicalConstants.C0 / WAVELENGTH;
        double courant = 0.5;
        double dt = courant * dx / PhysicalConstants.C0;
        Map<Side, Boundary> sides = new EnumMap<>(Side.class);
        for (Side s : Side.values()) {
            sides.put(s, Boundary.pml(PML));
        }
        Scene scene = Scene.builder(Material.ofIndex("glass", N1))
                .add(new HalfPlane(0, yInterface, 0, -1), Material.VACUUM).build();
        MaterialGrid grid = Rasterizer.rasterize(scene, new GridSpec(0, 0, dx, nx, ny), Smoothing.ANISOTROPIC);
        double ramp = 10 / f;
        RampedContinuous signal = new RampedContinuous(f, ramp);
        GaussianBeam.Spec beam = new GaussianBeam.Spec(pol, waist, xWaist, yInterface, THETA, true, N1 * N1, 1, signal);
        FluxLine line = new FluxLine(pol, belowLine, PML, nx - PML, f);
        double settle = 3 * ramp + 3 * ny * dx * N1 / PhysicalConstants.C0;
        long steps = (long) Math.ceil((settle + PERIODS / f) / dt);
        line.window(steps * dt - PERIODS / f, steps * dt + 1e-6 / f);
        Simulation.Builder b = Simulation.builder(grid).polarization(pol).courant(courant).listener(line);
        sides.forEach(b::boundary);
        List.copyOf(GaussianBeam.sheets(beam, sides, nx, ny, 0, 0, dx, dt, sheetRow)).forEach(b::incident);
        try (Simulation sim = b.build()) {
            sim.run(steps);
        }
        BeamProfile reflected = BeamProfile.of(line, 0, dx, 0);
        double specular = xWaist + drift;
        // the line is below the sheet: it sees the scattered field, here the reflected beam only; flux is downward
        double shift = reflected.centroid() - specular;

        double kappa = Math.sqrt(N1 * N1 * Math.sin(THETA) * Math.sin(THETA) - 1);
        double ds = WAVELENGTH * Math.tan(THETA) / (Math.PI * kappa);
        double m = 1 / N1;
        double artmann = pol == Polarization.S ? ds
                : ds * m * m / ((1 + m * m) * Math.sin(THETA) * Math.sin(THETA) - m * m);
        PlanarStack stack = PlanarStack.interfaceBetween(N1, Complex.real(1.0));
        AngularSpectrum.Result as = AngularSpectrum.of(stack, pol, new AngularSpectrum.GaussianBeam(waist, THETA, WAVELENGTH),
                1 << 15, 12 * footprint);
        String ctx = String.format("%s, waist 20 λ, 45°, %d cells/λ in glass (%d x %d cells): shift %.4f λ, Artmann %.4f λ "
                + "(%+.2f %%), angular spectrum %.4f λ (%+.2f %%); reflected power %.4e", pol, CPW, nx, ny, shift / WAVELENGTH,
                artmann / WAVELENGTH, 100 * (shift / artmann - 1), as.reflectedShift() / WAVELENGTH,
                100 * (shift / as.reflectedShift() - 1), reflected.total());
        if (Boolean.getBoolean("evanesce.printTables")) {
            System.out.println(ctx);
        }
        assertTrue(Math.abs(shift / artmann - 1) < ARTMANN_TOL, ctx);
        assertTrue(Math.abs(shift / as.reflectedShift() - 1) < SPECTRUM_TOL, ctx);
    }
}
