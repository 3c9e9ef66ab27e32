package org.evanesce.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import io.jhdf.HdfFile;
import io.jhdf.api.Dataset;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import org.evanesce.geometry.Complex;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.geometry.dispersion.MetalLibrary;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * The permittivity maps of a run with a metal (permittivity.h5 and maps.h5): the complex relative permittivity at
 * the design wavelength as a real and an imaginary dataset, a gold site showing the library model's ε(633 nm) and a
 * conductive glass site its σ/(ε0 ω) (Jackson, Classical Electrodynamics, 3rd ed., sec. 7.5: ε = ε_b + iσ/(ε0 ω) for
 * exp(−iωt)); and a run without a metal left as it was, one real dataset per component.
 */
class MetalPermittivityMapTest {

    /** Deep inside one material every site holds the same value, so the nodes' average is that value to rounding. */
    private static final double ROUNDING = 1e-12;
    private static final double WAVELENGTH = 633e-9;
    private static final double SIGMA = 1e4;

    /** Lossy glass below y = 0, gold above (p: Ex, Ey; s: Ez), a few steps of a point source. */
    private static final String CASE = """
            design_wavelength: 633 nm
            polarization: POL
            domain: {width: 40 nm, height: 600 nm, background: lossy}
            grid: {cells_per_wavelength: 633 nm / (1.5 * 5 nm)}
            materials:
              lossy: {permittivity: 2.25, conductivity: 1e4 S/m}
              METAL
            shapes:
              - half_plane: {through: [0, 0], fill: above, material: top}
            boundaries: {left: periodic, right: periodic, all: pml 100 nm}
            sources:
              - point: {at: [0, -100 nm], signal: {pulse: {wavelength: 633 nm, bandwidth: 20 nm}}}
            maps:
              wavelengths: 633 nm
              region: {from: [-20 nm, -150 nm], to: [20 nm, 150 nm]}
            output: {write: [permittivity]}
            until: {time: 2 fs}
            """;

    @ParameterizedTest(name = "{0}")
    @ValueSource(strings = {"p", "s"})
    void goldSitesHoldTheModelsPermittivityAtTheDesignWavelength(String pol, @TempDir Path tmp) throws IOException {
        Path out = run(tmp, CASE.replace("POL", pol).replace("METAL", "top: {library: gold}"));
        Complex gold = MetalLibrary.get("gold").material().permittivityAtWavelength(WAVELENGTH);
        double omega = 2 * Math.PI * PhysicalConstants.C0 / WAVELENGTH;
        Complex lossy = new Complex(2.25, SIGMA / (PhysicalConstants.EPS0 * omega));
        for (String file : new String[] {"permittivity.h5", "maps.h5"}) {
            try (HdfFile h = new HdfFile(out.resolve(file))) {
                for (String axis : pol.equals("p") ? new String[] {"x", "y"} : new String[] {"z"}) {
                    String name = "relative_permittivity_" + axis;
                    Dataset re = h.getDatasetByPath("/" + name);
                    Dataset im = h.getDatasetByPath("/" + name + "_imaginary");
                    assertEquals("imaginary", im.getAttribute("part").getData(), file + " " + name);
                    assertEquals(WAVELENGTH, (double) im.getAttribute("wavelength_m").getData(), 0, file + " " + name);
                    double cell = ((Number) re.getAttribute("cell_size_m").getData()).doubleValue();
                    double y0 = ((double[]) re.getAttribute("origin_m").getData())[1];
                    double[][] vr = (double[][]) re.getData();
                    double[][] vi = (double[][]) im.getData();
                    int goldNodes = 0;
                    int glassNodes = 0;
                    for (int j = 0; j < vr.length; j++) {
                        double y = y0 + j * cell;
                        Complex want = y > 2 * cell ? gold : y < -2 * cell ? lossy : null;
                        if (want == null) {
                            continue;
                        }
                        goldNodes += want == gold ? 1 : 0;
                        glassNodes += want == lossy ? 1 : 0;
                        for (int i = 0; i < vr[j].length; i++) {
                            String at = String.format(Locale.ROOT, "%s %s, %s at node (%d, %d), y = %.4g nm", file, pol, name,
                                    i, j, y * 1e9);
                            assertEquals(want.re(), vr[j][i], ROUNDING * Math.abs(want.re()), at + ": real part");
                            assertEquals(want.im(), vi[j][i], ROUNDING * Math.abs(want.im()), at + ": imaginary part");
                        }
                    }
                    assertTrue(goldNodes > 5 && glassNodes > 5, file + " " + name + ": rows in each material");
                }
            }
        }
        String xmf = Files.readString(out.resolve("permittivity.xmf"));
        assertTrue(xmf.contains("relative_permittivity_" + (pol.equals("p") ? "x" : "z") + "_imaginary"), xmf);
    }

    @ParameterizedTest(name = "{0}")
    @ValueSource(strings = {"p", "s"})
    void withoutAMetalTheMapHoldsTheRealPermittivityAlone(String pol, @TempDir Path tmp) throws IOException {
        Path out = run(tmp, CASE.replace("POL", pol).replace("METAL", "top: {index: 1.0}"));
        try (HdfFile h = new HdfFile(out.resolve("permittivity.h5"))) {
            for (String axis : pol.equals("p") ? new String[] {"x", "y"} : new String[] {"z"}) {
                assertFalse(h.getChildren().containsKey("relative_permittivity_" + axis + "_imaginary"), pol);
                Dataset re = h.getDatasetByPath("/relative_permittivity_" + axis);
                assertFalse(re.getAttributes().containsKey("part"), pol);
                double[][] v = (double[][]) re.getData();
                assertEquals(2.25, v[1][1], 0, "the glass's εr, its conductivity left to summary.json");
                assertEquals(1.0, v[v.length - 2][1], 0, "vacuum");
            }
        }
    }

    private static Path run(Path dir, String text) throws IOException {
        Path file = dir.resolve("metal.yaml");
        Files.writeString(file, text);
        Path out = dir.resolve("out");
        Cli.Outcome o = Cli.run("run", file.toString(), "--out", out.toString());
        assertEquals(0, o.code(), o::toString);
        return out;
    }
}
