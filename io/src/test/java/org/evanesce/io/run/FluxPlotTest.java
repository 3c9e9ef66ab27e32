package org.evanesce.io.run;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import javax.imageio.ImageIO;
import org.evanesce.io.output.image.LinePlot;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** flux.png: which flux.csv columns are drawn, and how (the numbers themselves are FluxResults'). */
class FluxPlotTest {

    /** The plotted values are copied from the table, so they must agree exactly (only the nm conversion rounds). */
    private static final double COPIED = 1e-12;

    @TempDir
    Path tmp;

    private static final List<String> PLANE = List.of("R_front", "R_front_exact", "R_front_diff", "T_back", "T_back_exact",
            "T_back_diff", "A", "A_exact", "A_diff");

    /** Rows listed out of wavelength order, as a case may list its wavelengths. */
    private static FluxResults plane() {
        return new FluxResults(PLANE, List.of(
                new FluxResults.Row(4.7e14, 640e-9, 45, 1, new double[] {0.62, 0.63, -0.01, 0.38, 0.37, 0.01, 0, 0, 0}),
                new FluxResults.Row(4.8e14, 620e-9, 44, 1, new double[] {0.60, 0.61, -0.01, 0.40, 0.39, 0.01, 0, 0, 0})),
                FluxResults.Incident.SPECTRAL_ENERGY, List.of());
    }

    private static LinePlot.Series named(LinePlot p, String name) {
        return p.series().stream().filter(s -> s.name().equals(name)).findFirst().orElseThrow(() -> new AssertionError(
                "no series " + name + " in " + p.series().stream().map(LinePlot.Series::name).toList()));
    }

    @Test
    void drawsEachValueAsMarkersAndItsExactValueAsALineInTheSameColourAlongWavelength() {
        LinePlot p = FluxPlot.plot(plane(), "gap");
        assertEquals(List.of("R_front simulated", "R_front_exact", "T_back simulated", "T_back_exact", "A simulated", "A_exact"),
                p.series().stream().map(LinePlot.Series::name).toList(), "the _diff columns are not drawn");
        LinePlot.Series t = named(p, "T_back simulated");
        LinePlot.Series te = named(p, "T_back_exact");
        assertArrayEquals(new double[] {620, 640}, t.x(), COPIED, "sorted by wavelength, in nm");
        assertArrayEquals(new double[] {0.40, 0.38}, t.y(), COPIED);
        assertArrayEquals(new double[] {0.39, 0.37}, te.y(), COPIED);
        assertEquals(LinePlot.Style.MARKERS, t.style());
        assertEquals(LinePlot.Style.LINES, te.style());
        assertEquals(t.rgb(), te.rgb(), "a value and its exact curve share a colour");
        assertTrue(named(p, "R_front simulated").rgb() != t.rgb(), "R and T differ in colour");
    }

    @Test
    void aBeamIsDrawnAgainstItsAngularSpectrumValueNotThePlaneWave() {
        FluxResults r = new FluxResults(List.of("T_back", "T_back_plane_wave", "T_back_beam", "T_back_diff",
                "centroid_back_um"), List.of(new FluxResults.Row(4.7e14, 640e-9, 45, 1, new double[] {0.3, 0.5, 0.31, -0.01, 2})),
                FluxResults.Incident.SPECTRAL_ENERGY, List.of());
        LinePlot p = FluxPlot.plot(r, "");
        assertEquals(List.of("T_back simulated", "T_back_beam"), p.series().stream().map(LinePlot.Series::name).toList());
        assertEquals(LinePlot.Style.MARKERS, named(p, "T_back_beam").style(), "one wavelength: the exact value as a marker");
        assertArrayEquals(new double[] {0.31}, named(p, "T_back_beam").y(), COPIED);
    }

    @Test
    void writesAReadablePngOfThePlotsSizeAndNothingWithoutRtOrA() throws IOException {
        assertTrue(FluxPlot.write(plane(), "gap", tmp));
        BufferedImage img = ImageIO.read(tmp.resolve(FluxPlot.FILE).toFile());
        assertNotNull(img, "flux.png reads back as an image");
        BufferedImage expected = FluxPlot.plot(plane(), "gap").render();
        assertEquals(expected.getWidth(), img.getWidth());
        assertEquals(expected.getHeight(), img.getHeight());

        Path other = Files.createDirectory(tmp.resolve("surface-only"));
        FluxResults none = new FluxResults(List.of("centroid_back_um"), List.of(new FluxResults.Row(4.7e14, 640e-9, 45, 1,
                new double[] {2})), FluxResults.Incident.POWER, List.of());
        assertFalse(FluxPlot.write(none, "", other));
        assertFalse(Files.exists(other.resolve(FluxPlot.FILE)));
    }
}
