package org.evanesce.solver.source;

import org.evanesce.geometry.Complex;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.GridSpec;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.Rasterizer;
import org.evanesce.geometry.Scene;
import org.evanesce.geometry.Smoothing;
import org.evanesce.geometry.shape.Ellipse;
import org.evanesce.geometry.shape.HalfPlane;
import org.evanesce.solver.Simulation;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Courant;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.reference.LineDipoleEmission;

/**
 * Set-up of {@link EvanescentParticleTest}: glass (index {@link #N_GLASS}) below a face, air above, a layered
 * total-field box lit from the glass at {@link #THETA}, and either a small weakly lossy disk in the air (the
 * particle) or a line dipole where its centre would be. A closed contour round the box, in the scattered-field
 * region, gives the power the particle (or the dipole) sends out, up into the air and down into the glass alike;
 * the particle's own sites give the power it absorbs. All lengths scale with the resolution {@code res} (cells
 * per vacuum wavelength), so that the same scene can be run coarse and fine; heights move by whole cells, so that
 * the particle is rasterised the same at every height.
 */
final class ParticleRuns {

    static final double LAMBDA = 600e-9;
    static final double F = PhysicalConstants.C0 / LAMBDA;
    static final double N_GLASS = 1.5;
    /** Angle of incidence in the glass, beyond the critical angle 41.8°. */
    static final double THETA = Math.toRadians(60);
    /** The particle: index 1.5 with Im ε = 0.1, enough loss to measure and too little to matter to its scattering. */
    static final double PARTICLE_EPS = N_GLASS * N_GLASS;
    static final double PARTICLE_IM_EPS = 0.1;
    /** Particle radius, m: 16 nm, λ/37 (k0a = 0.17): the dipole limit. */
    static final double RADIUS = 16e-9;
    /** Run length in periods (ramp 3), and the last periods taken into the DFTs (30 periods gave the same figures). */
    static final int PERIODS = 20;
    static final int DFT_PERIODS = 4;

    final int res;
    final double dx;
    final int half, below, above, contour = 3, margin = 5 + BoxRuns.PML;
    final int nx, ny, i0, j0;
    final double faceY, cx;

    /** A layout with {@code res} cells per vacuum wavelength (60 or more). */
    ParticleRuns(int res) {
        this.res = res;
        this.dx = LAMBDA / res;
        int scale = res / 60;
        half = 26 * scale;
        below = 10 * scale;
        above = 40 * scale;
        nx = 2 * (half + contour + margin) + 1;
        ny = below + above + 2 * (contour + margin) + 1;
        i0 = contour + margin;
        j0 = contour + margin;
        faceY = (j0 + below) * dx;
        cx = (i0 + half) * dx;
    }

    /** The outcome of one run. */
    record Powers(double scattered, double absorbed) {
    }

    /** The particle's centre {@code h} cells above the face, lit by the box. */
    Powers particle(Polarization pol, int h) {
        double sigma = PARTICLE_IM_EPS * 2 * Math.PI * F * PhysicalConstants.EPS0;
        Scene scene = Scene.builder(Material.ofIndex("air", 1.0))
                .add(new HalfPlane(0, faceY, 0, 1), Material.ofIndex("glass", N_GLASS))
                .add(Ellipse.disk(cx + 0.3 * dx, faceY + h * dx, RADIUS), new Material("particle", PARTICLE_EPS, sigma))
                .build();
        MaterialGrid grid = Rasterizer.rasterize(scene, new GridSpec(0, 0, dx, nx, ny), Smoothing.ANISOTROPIC);
        double period = 1 / F;
        TotalFieldBox box = TotalFieldBox.plan(new TotalFieldBox.Spec(pol, Math.PI / 2 - THETA, 1.0,
                TimeSignal.rampedContinuous(F, 3 * period), cx, faceY), grid, BoxRuns.sides(), Courant.DEFAULT, i0, j0,
                i0 + 2 * half, j0 + below + above);
        int r = (int) Math.ceil(RADIUS / dx) + 2;
        int pi = i0 + half;
        int pj = j0 + below + h;
        Simulation.Builder b = BoxRuns.builder(grid, pol, Precision.DOUBLE, box, 1);
        ContourDfts c = contour(b, pol);
        BoxRuns.Watch[] inside = new BoxRuns.Watch[2];
        int k = 0;
        for (Component e : pol.components()) {
            if (e.electric) {
                inside[k] = new BoxRuns.Watch(e, pi - r, pj - r, pi + r, pj + r, F, from(), steps());
                b.listener(inside[k++]);
            }
        }
        try (Simulation sim = b.build()) {
            sim.run(steps());
        }
        double absorbed = 0;
        for (BoxRuns.Watch w : inside) {
            if (w != null) {
                absorbed += absorbed(grid, w);
            }
        }
        return new Powers(c.outwardPower(), absorbed);
    }

    /**
     * The power (W/m) a line dipole along {@code axis} radiates with its centre {@code h} cells above the face,
     * under the particle's centre: an Ez point source (Z), or a pair of Ex (X) or Ey (Y) sources either side of
     * that node, half each.
     */
    double dipole(LineDipoleEmission.Axis axis, int h) {
        Scene scene = Scene.builder(Material.ofIndex("air", 1.0))
                .add(new HalfPlane(0, faceY, 0, 1), Material.ofIndex("glass", N_GLASS)).build();
        MaterialGrid grid = Rasterizer.rasterize(scene, new GridSpec(0, 0, dx, nx, ny), Smoothing.ANISOTROPIC);
        int pi = i0 + half;
        int pj = j0 + below + h;
        TimeSignal g = TimeSignal.rampedContinuous(F, 3 / F);
        Source s = switch (axis) {
            case Z -> Source.point(Component.EZ, nx, pi, pj, 1.0, g);
            case X -> new Source(Component.EX, new int[] {pj * nx + pi - 1, pj * nx + pi}, new double[] {0.5, 0.5}, g);
            case Y -> new Source(Component.EY, new int[] {(pj - 1) * nx + pi, pj * nx + pi}, new double[] {0.5, 0.5}, g);
        };
        Polarization pol = axis == LineDipoleEmission.Axis.Z ? Polarization.S : Polarization.P;
        Simulation.Builder b = Simulation.builder(grid).polarization(pol).precision(Precision.DOUBLE).threads(1)
                .minCellsPerThread(64).source(s);
        BoxRuns.sides().forEach(b::boundary);
        ContourDfts c = contour(b, pol);
        try (Simulation sim = b.build()) {
            sim.run(steps());
        }
        return c.outwardPower();
    }

    private ContourDfts contour(Simulation.Builder b, Polarization pol) {
        ContourDfts c = new ContourDfts(pol, i0 - contour, j0 - contour,
                i0 + 2 * half + contour, j0 + below + above + contour, dx, cx, faceY, F, from(), steps());
        b.listener(c);
        return c;
    }

    private long perPeriod() {
        return Math.round(1 / F / Courant.timeStep(Courant.DEFAULT, dx));
    }

    private long steps() {
        return PERIODS * perPeriod();
    }

    private long from() {
        return steps() - DFT_PERIODS * perPeriod();
    }

    /** ½ Σ σ |E|² Δ² over the watched sites of one electric component: the time-averaged power absorbed there. */
    private double absorbed(MaterialGrid grid, BoxRuns.Watch w) {
        FieldSite site = FieldSite.valueOf(w.c.name());
        double p = 0;
        for (int j = w.j0; j <= w.j1; j++) {
            for (int i = w.i0; i <= w.i1; i++) {
                double sigma = grid.material(site, i, j).conductivity();
                if (sigma != 0) {
                    Complex e = w.phasor(i, j);
                    p += 0.5 * sigma * e.norm() * dx * dx;
                }
            }
        }
        return p;
    }
}
