package org.evanesce.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.evanesce.io.cli.ExitCode;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A layered scene written with rectangles exactly the domain's width, between periodic sides: the layers must
 * reach across the seam. Frustrated total reflection across a 250 nm air gap between glass blocks (n = 1.6) at
 * 50 degrees, 780 nm, s polarization, against the closed form of Zhu, Yu, Hawley and Roy, Am. J. Phys. 54, 601
 * (1986) ({@link PlaneWaveRunTest#tunnelling}). The domain's width, 500 nm, is not a whole number of the 24.375 nm
 * cells 20 per wavelength would give, so the cell shrinks to 500/21 nm and the period stays 500 nm.
 */
class PeriodicSeamTest {

    @TempDir
    Path tmp;

    /**
     * |A| in a lossless scene. Measured 1.3e-5; with the seam's pixels half air (before the rectangles' periodic
     * images) it was -0.030 at 20 cells per wavelength and -0.015 at 40, and with the period 511.875 nm (the grid
     * one cell wider than the domain) -0.041.
     */
    static final double A_TOLERANCE = 2e-4;
    /** T against the closed form, relative. Measured +2.7e-3 at 20 cells per wavelength (-7e-4 at 40). */
    static final double T_TOLERANCE = 1e-2;

    static final String CASE = """
            title: air gap between two glass blocks written as full-width rectangles
            parameters:
              gap: 250 nm
              wl: 780 nm
            design_wavelength: wl
            polarization: s
            domain: {width: 0.5 um, height: 4 um, background: air}
            grid: {cells_per_wavelength: 20}
            materials:
              glass: {index: 1.6}
            shapes:
              - rectangle: {centre: [0, -1.2 um - gap/2], size: [0.5 um, 2.4 um], material: glass}
              - rectangle: {centre: [0, 1.2 um + gap/2], size: [0.5 um, 2.4 um], material: glass}
            boundaries: {left: periodic, right: periodic, bottom: pml 0.6 um, top: pml 0.6 um}
            sources:
              - plane_wave: {y: -1.3 um, angle: 50 deg, signal: {pulse: {wavelength: wl, bandwidth: 60 nm}}}
            flux:
              wavelengths: wl
              lines:
                - {name: t, y: 1.2 um, measures: transmitted}
                - {name: r, y: -1.0 um, measures: reflected}
            until: {energy_below: 1e-6, latest: 400 fs}
            """;

    @Test
    void fullWidthRectanglesAreLayersAcrossTheSeam() throws IOException {
        Path c = tmp.resolve("gap.yaml");
        Files.writeString(c, CASE);
        Path out = tmp.resolve("out");
        Cli.Outcome o = Cli.run("run", c.toString(), "--out", out.toString());
        assertEquals(ExitCode.OK, o.code(), o::toString);
        assertTrue(o.err().contains("cell size 23.8095 nm instead of 24.375 nm, so that the periodic width (500 nm) is a "
                + "whole number of cells (21)"), o.err());
        PlaneWaveRunTest.FluxCsv f = PlaneWaveRunTest.FluxCsv.read(out.resolve("flux.csv"));
        double t = f.at(780e-9, "T_t");
        double r = f.at(780e-9, "R_r");
        assertEquals(0, 1 - r - t, A_TOLERANCE, o::toString);
        double exact = PlaneWaveRunTest.tunnelling("s", 1.6, 1.0, 250e-9, Math.toRadians(50), 780e-9);
        assertEquals(exact, t, T_TOLERANCE * exact, "T against Zhu et al. 1986");
    }
}
