package org.evanesce.solver;

import static org.junit.jupiter.api.Assertions.assertAll;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.evanesce.geometry.CellRegion;
import org.evanesce.geometry.Material;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.solver.boundary.Boundary;
import org.evanesce.solver.boundary.PmlParameters;
import org.evanesce.solver.grid.Component;
import org.evanesce.solver.grid.Polarization;
import org.evanesce.solver.grid.Precision;
import org.evanesce.solver.record.Probe;
import org.evanesce.solver.source.Source;
import org.evanesce.solver.source.TimeSignal;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.function.Executable;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Reflection from the CPML with its default grading, measured against a larger-domain reference
 * run: the method of A. Taflove &amp; S. C. Hagness, Computational Electrodynamics, 3rd ed. (2005),
 * ch. 7 (chapter number from memory). A point source radiates a broadband pulse in a small domain
 * closed by 12-layer CPMLs on all sides; the same source radiates in a reference domain that
 * extends the small one by {@link #PAD} cells on every side, so far that nothing its walls send back
 * reaches the probes within the {@link #STEPS}-step record. At each probe the reflection is
 * <pre>
 *   max over t |F_test(t) − F_ref(t)|  /  max over t |F_ref(t)|
 * </pre>
 * in field amplitude, reported in dB (20 log10). The CPML is the convolutional, complex-frequency
 * shifted PML of J. A. Roden &amp; S. D. Gedney, Microwave Opt. Technol. Lett. 27, 334 (2000); its
 * frequency shift α is what lets the layer absorb the evanescent near field of a source close to
 * it (J.-P. Bérenger, "Evanescent waves in PMLs", IEEE TAP 47 (1999)).
 *
 * <p>Geometry (cells, test-domain indices): the left PML face is at node {@link #LAYERS}; the
 * source sits {@link #SOURCE_DEPTH} cells in front of it; the probes sit {@link #PROBE_DEPTH}
 * cells in front of it, one on the source's row (the specular path via the face is normal) and
 * one {@code SOURCE_DEPTH + PROBE_DEPTH} rows off it (the specular path meets the face at 45°).
 * The other three faces are {@link #MARGIN} cells from the source, so the left face dominates;
 * every reflection the small domain makes, from any face, still counts in the error.
 * With the glass half-space (n = 1.5) the source is in the glass {@link #GLASS_ABOVE_SOURCE} cells
 * below the flat interface, which runs into the left and right PMLs; the 45° probe is then below
 * the source, so its path stays in glass, and the reference domain has the half-space extended.
 * s: Ez point source, Ez probed; p: Hz point source, Hz probed.
 *
 * <p>When this test was written the default grading measured −95 dB (normal) and −98 dB (45°) in
 * vacuum and −90 to −92 dB with the glass half-space, in float and in double alike; the same
 * measurement with a bare PEC wall gives about 0 dB ({@link #measurementSeesTheReflectionOfABareWall}).
 * Doubling {@link #PAD} changed none of these digits, so the reference is long enough.
 */
class PmlReflectionTest {

    /** The requirement of the issue: reflection at most −60 dB (1e-3 in field amplitude) with 12 layers. */
    private static final double MAX_REFLECTION_DB = -60.0;
    /**
     * Floor for the control run with a bare PEC wall: |r| = 1 there, so the measured ratio is of
     * order 1 (it measured +1.9 dB at the normal probe and −0.9 dB at the 45° probe; the 2D pulse
     * changes shape with distance, so it is not exactly 1). −20 dB is far below that and far above
     * any working PML's result.
     */
    private static final double BARE_WALL_MIN_DB = -20.0;
    private static final int LAYERS = 12;
    private static final double DX = 20e-9;
    private static final double COURANT = 0.5;
    /** Cells from the source to the left PML face ("a modest distance"). */
    private static final int SOURCE_DEPTH = 20;
    /** Cells from the probes to the left PML face. */
    private static final int PROBE_DEPTH = 2;
    /** Cells from the source to the other three faces of the small domain. */
    private static final int MARGIN = 60;
    /** Rows from the source up to the glass interface (glass case). */
    private static final int GLASS_ABOVE_SOURCE = 3;
    private static final double GLASS_INDEX = 1.5;
    /**
     * Record length. The pulse lasts about 12τ ≈ 200 steps and the reflection from the left face
     * arrives between steps 100 and 250; the rest of the record catches the slow 2D tail, the late,
     * low-frequency part of the PML's reflection and the waves the glass interface guides along
     * itself (common practice: record until the field has died down; here the difference had
     * fallen below −130 dB of the peak by step 750).
     */
    private static final int STEPS = 1000;
    /**
     * Cells of vacuum that the reference adds on each side. A wave that leaves the source at t = 0
     * and comes back from a reference wall travels at least 2·PAD cells, which light covers in
     * 2·PAD/S steps; that exceeds {@link #STEPS} by a 20-cell margin for the Yee scheme's
     * (exponentially small) faster-than-light precursor.
     */
    private static final int PAD = (int) Math.ceil(0.5 * (COURANT * STEPS + 20));
    /** Vacuum wavelengths the pulse covers, in cells: its spectrum is above e^−2 of its peak from 40 to 10 cells. */
    private static final double LONGEST_WAVELENGTH_CELLS = 40;
    private static final double SHORTEST_WAVELENGTH_CELLS = 10;

    enum Medium {
        VACUUM("vacuum"), GLASS("glass half-space n = 1.5 crossing the layer");

        final String label;

        Medium(String label) {
            this.label = label;
        }
    }

    /** A probe's name and place in the small domain. */
    private record Site(String name, int i, int j) { }

    /** The relative reflection measured at one probe. */
    private record Measured(Site site, double ratio) {
        double decibels() {
            return 20 * Math.log10(ratio);
        }
    }

    @ParameterizedTest(name = "{0} polarization, {1}, {2}")
    @CsvSource({"S, VACUUM, FLOAT", "P, VACUUM, FLOAT", "S, GLASS, FLOAT", "P, GLASS, FLOAT",
            "S, VACUUM, DOUBLE", "P, VACUUM, DOUBLE", "S, GLASS, DOUBLE", "P, GLASS, DOUBLE"})
    void reflectionFromTwelveLayersIsBelowMinusSixtyDecibels(Polarization pol, Medium medium, Precision precision) {
        List<Executable> checks = new ArrayList<>();
        for (Measured m : measure(pol, medium, PmlParameters.defaults(LAYERS), precision)) {
            String ctx = describe(pol, medium, precision, m) + String.format(", limit %.0f dB", MAX_REFLECTION_DB);
            checks.add(() -> assertTrue(m.decibels() <= MAX_REFLECTION_DB, ctx));
        }
        assertAll(checks);
    }

    /**
     * Control: the same measurement must see a reflection where there certainly is one. A layer
     * with σ = 0 (and κ = 1, α = 0) is plain vacuum backed by the PEC wall, which reflects fully.
     */
    @Test
    void measurementSeesTheReflectionOfABareWall() {
        PmlParameters bare = new PmlParameters(LAYERS, 3.0, 0.0, 1.0, 0.0);
        List<Executable> checks = new ArrayList<>();
        for (Measured m : measure(Polarization.S, Medium.VACUUM, bare, Precision.FLOAT)) {
            String ctx = describe(Polarization.S, Medium.VACUUM, Precision.FLOAT, m)
                    + String.format(" with a bare PEC wall (σ = 0): expected above %.0f dB", BARE_WALL_MIN_DB);
            checks.add(() -> assertTrue(m.decibels() >= BARE_WALL_MIN_DB, ctx));
        }
        assertAll(checks);
    }

    private static String describe(Polarization pol, Medium medium, Precision precision, Measured m) {
        return String.format("%s polarization, %s incidence, %s, %s, grid %d×%d (reference %d×%d), %d CPML layers, "
                        + "%d steps, probe (%d, %d): reflection %.1f dB (ratio %.3g)",
                pol, m.site().name(), medium.label, precision, nx(), ny(), nx() + 2 * PAD, ny() + 2 * PAD,
                LAYERS, STEPS, m.site().i(), m.site().j(), m.decibels(), m.ratio());
    }

    private static int nx() {
        return 2 * LAYERS + SOURCE_DEPTH + MARGIN + 1;
    }

    private static int ny() {
        return 2 * LAYERS + 2 * MARGIN + 1;
    }

    /** Runs the small and the reference domain once each and returns the reflection at every probe. */
    private static List<Measured> measure(Polarization pol, Medium medium, PmlParameters pml, Precision precision) {
        int si = LAYERS + SOURCE_DEPTH;
        int sj = LAYERS + MARGIN;
        int pi = LAYERS + PROBE_DEPTH;
        int off = SOURCE_DEPTH + PROBE_DEPTH;
        List<Site> sites = List.of(new Site("normal", pi, sj),
                new Site("45°", pi, medium == Medium.GLASS ? sj - off : sj + off));
        double[][] test = record(pol, medium, pml, precision, 0, nx(), ny(), si, sj, sites);
        double[][] ref = record(pol, medium, pml, precision, PAD, nx() + 2 * PAD, ny() + 2 * PAD, si, sj, sites);
        List<Measured> out = new ArrayList<>();
        for (int p = 0; p < sites.size(); p++) {
            double err = 0;
            double peak = 0;
            for (int n = 0; n < STEPS; n++) {
                err = Math.max(err, Math.abs(test[p][n] - ref[p][n]));
                peak = Math.max(peak, Math.abs(ref[p][n]));
            }
            out.add(new Measured(sites.get(p), err / peak));
        }
        return out;
    }

    /** One run; positions are given in small-domain indices and shifted by {@code offset} into this grid. */
    private static double[][] record(Polarization pol, Medium medium, PmlParameters pml, Precision precision,
                                     int offset, int nx, int ny, int si, int sj, List<Site> sites) {
        MaterialGrid.Builder g = MaterialGrid.builder(nx, ny, DX, Material.VACUUM);
        if (medium == Medium.GLASS) {
            // point sampling: every site at or below the half-row above the interface row is glass
            g.paint(CellRegion.below(offset + sj + GLASS_ABOVE_SOURCE + 0.5), Material.ofIndex("glass", GLASS_INDEX));
        }
        Component c = pol == Polarization.S ? Component.EZ : Component.HZ;
        double c0 = PhysicalConstants.C0;
        double fLow = c0 / (LONGEST_WAVELENGTH_CELLS * DX);
        double fHigh = c0 / (SHORTEST_WAVELENGTH_CELLS * DX);
        // centre mid-band, band edges at ±2σ of the Gaussian spectrum
        TimeSignal pulse = TimeSignal.gaussianPulse(0.5 * (fLow + fHigh), 0.25 * (fHigh - fLow));
        Simulation.Builder b = Simulation.builder(g.build()).polarization(pol).precision(precision).courant(COURANT)
                .boundaries(new Boundary.Pml(pml)).threads(2)
                .source(Source.point(c, nx, offset + si, offset + sj, 1.0, pulse));
        List<Probe> probes = new ArrayList<>();
        for (Site s : sites) {
            Probe p = new Probe(c, offset + s.i(), offset + s.j());
            probes.add(p);
            b.listener(p);
        }
        try (Simulation sim = b.build()) {
            sim.run(STEPS);
        }
        double[][] out = new double[sites.size()][];
        for (int p = 0; p < sites.size(); p++) {
            out[p] = probes.get(p).values();
        }
        return out;
    }
}
