package org.evanesce.io;

import java.util.List;
import org.evanesce.geometry.Complex;
import org.evanesce.geometry.GridSpec;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.Rasterizer;
import org.evanesce.geometry.Scene;
import org.evanesce.geometry.Smoothing;
import org.evanesce.geometry.shape.Slab;
import org.evanesce.solver.DispersionCorrection;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.grid.Side;
import org.evanesce.solver.record.FluxLine;
import org.evanesce.solver.reference.PlanarStack;
import org.evanesce.solver.source.Source;
import org.evanesce.solver.source.TimeSignal;

/**
 * Frustrated total internal reflection of an exact plane wave, for the accuracy study: a gap of
 * index 1.0 between two half-spaces of index 1.5 at a given angle in the glass, simulated with
 * Bloch-periodic sides (fixed in-plane wavenumber kx), a complex plane-wave line source, PML above
 * and below, and flux lines below and above the gap; the set-up of the solver's
 * {@code GapTunnellingTest}. T is the flux above the gap over that of an all-glass incident-power run
 * with the same source (made once per instance); R is the flux of the difference between the two
 * runs' fields below the gap. The exact answer is the transfer matrix of the same stack
 * ({@link PlanarStack}).
 *
 * <p>With {@code corrected} the glass and the gap get the permittivities of the solver's
 * {@code DispersionCorrection} for this kx and frequency, as case files with a plane wave do by
 * default; without it the materials are as written.
 *
 * <p>One instance is one polarization, angle, resolution and choice of correction; {@link #measure}
 * may be called from several threads (each run is single-threaded and independent).
 */
final class GapStudy {

    static final double WAVELENGTH = 633e-9;
    static final double N_GLASS = 1.5;
    static final double COURANT = 0.5;
    private static final int NX = 16;
    private static final int PML = 30;

    /** One gap: the simulated T and R and the exact T. */
    record Point(double gapWavelengths, double gapCells, double t, double r, double exact) {
        double error() {
            return t - exact;
        }
    }

    private record Run(FluxLine top, FluxLine bottom) { }

    final Polarization pol;
    final double degrees;
    final int cellsPerWavelength;
    final boolean corrected;
    /** Cell size, m: {@code cellsPerWavelength} cells per wavelength in the glass. */
    final double dx;
    private final double kx;
    private final double f;
    private Run reference;

    GapStudy(Polarization pol, double degrees, int cellsPerWavelength, boolean corrected) {
        this.pol = pol;
        this.degrees = degrees;
        this.cellsPerWavelength = cellsPerWavelength;
        this.corrected = corrected;
        this.dx = WAVELENGTH / (N_GLASS * cellsPerWavelength);
        this.kx = 2 * Math.PI / WAVELENGTH * N_GLASS * Math.sin(Math.toRadians(degrees));
        this.f = PhysicalConstants.C0 / WAVELENGTH;
    }

    /** The exact plane-wave transmittance through a gap of {@code gapWavelengths} vacuum wavelengths. */
    double exact(double gapWavelengths) {
        PlanarStack stack = new PlanarStack(N_GLASS,
                List.of(new PlanarStack.Layer(Complex.real(1.0), gapWavelengths * WAVELENGTH)), Complex.real(N_GLASS));
        return stack.atTransverseWavenumber(pol, WAVELENGTH, kx).transmittance();
    }

    /** Simulates one gap (thickness in vacuum wavelengths, &gt; 0) against the shared incident-power run. */
    Point measure(double gapWavelengths) {
        double d = gapWavelengths * WAVELENGTH;
        Run ref = reference();
        Run s = run(d);
        double t = s.top.flux(0, dx) / ref.top.flux(0, dx);
        double r = -s.bottom.flux(0, dx, ref.bottom) / ref.bottom.flux(0, dx);
        return new Point(gapWavelengths, d / dx, t, r, exact(gapWavelengths));
    }

    private synchronized Run reference() {
        if (reference == null) {
            reference = run(0);
        }
        return reference;
    }

    /** A run with a gap of thickness d (none when d = 0) starting 0.3 cells above a node. */
    private Run run(double d) {
        int source = PML + 10;
        int bottomLine = source + 20;
        double gapStart = bottomLine + 30.3;
        int gapCells = (int) Math.ceil(d / dx);
        int topLine = (int) gapStart + gapCells + 30;
        int ny = topLine + 20 + PML;
        double dt = COURANT * dx / PhysicalConstants.C0;
        double omega = 2 * Math.PI * f;
        Material glass = corrected
                ? new Material("glass", DispersionCorrection.permittivity(N_GLASS * N_GLASS, kx, omega, dx, dt), 0)
                : Material.ofIndex("glass", N_GLASS);
        Material gap = corrected ? new Material("gap", DispersionCorrection.permittivity(1.0, kx, omega, dx, dt), 0)
                : Material.VACUUM;
        Scene.Builder sb = Scene.builder(glass);
        if (d > 0) {
            sb.add(new Slab(0, gapStart * dx, 0, 1, d), gap);
        }
        MaterialGrid grid = Rasterizer.rasterize(sb.build(), new GridSpec(0, 0, dx, NX, ny), Smoothing.ANISOTROPIC);
        Component c = pol == Polarization.S ? Component.EZ : Component.HZ;
        FluxLine top = new FluxLine(pol, topLine, 0, NX, f);
        FluxLine bottom = new FluxLine(pol, bottomLine, 0, NX, f);
        // narrow band: every frequency near f is beyond the critical angle at this kx
        TimeSignal pulse = TimeSignal.gaussianPulse(f, f / 25);
        try (Simulation s = Simulation.builder(grid).polarization(pol).precision(Precision.FLOAT).courant(COURANT)
                .boundary(Side.LEFT, Boundary.bloch(kx)).boundary(Side.RIGHT, Boundary.bloch(kx))
                .boundary(Side.BOTTOM, Boundary.pml(PML)).boundary(Side.TOP, Boundary.pml(PML))
                .threads(1)
                .source(Source.blochRow(c, NX, source, 0.0, dx, kx, pulse))
                .listener(top).listener(bottom).build()) {
            // the pulse lasts 12τ, τ = 1/(2π·f/25); then the slowest part crosses the grid
            double periods = 12 * 25 / (2 * Math.PI);
            s.run((long) (periods / (f * s.dt())) + 6L * ny);
        }
        return new Run(top, bottom);
    }

    /** Least-squares slope of log(error) against log(cell size). */
    static double fittedOrder(int[] cellsPerWavelength, double[] err) {
        int n = cellsPerWavelength.length;
        double sx = 0;
        double sy = 0;
        double sxx = 0;
        double sxy = 0;
        for (int q = 0; q < n; q++) {
            double x = Math.log(1.0 / cellsPerWavelength[q]);
            double y = Math.log(err[q]);
            sx += x;
            sy += y;
            sxx += x * x;
            sxy += x * y;
        }
        return (n * sxy - sx * sy) / (n * sxx - sx * sx);
    }
}
