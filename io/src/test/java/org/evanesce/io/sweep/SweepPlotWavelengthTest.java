package org.evanesce.io.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import org.evanesce.io.Cli;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code sweep --plot-wavelength}: a finished sweep's plot redrawn at another of its flux wavelengths by
 * {@code --merge-only} (which rows are drawn is SweepPlotTest's), and the values refused.
 */
class SweepPlotWavelengthTest {

    @TempDir
    Path dir;

    @Test
    void mergeOnlyRedrawsThePlotAtTheAskedWavelength() throws IOException {
        Path c = SweepCases.write(dir, "gap.yaml", SweepCases.gapCase("""
                sweep:
                  parameters:
                    gap: [100 nm, 200 nm]
                """));
        Path out = dir.resolve("sw");
        Cli.Outcome run = Cli.run("sweep", c.toString(), "--out", out.toString());
        assertEquals(0, run.code(), () -> run.toString());
        byte[] design = Files.readAllBytes(out.resolve("sweep.png"));
        byte[] csv = Files.readAllBytes(out.resolve("sweep.csv"));
        Cli.Outcome at640 = Cli.run("sweep", c.toString(), "--out", out.toString(), "--merge-only", "--plot-wavelength", "640nm");
        assertEquals(0, at640.code(), () -> at640.toString());
        assertFalse(Arrays.equals(design, Files.readAllBytes(out.resolve("sweep.png"))), "the plot at 640 nm differs from 633 nm's");
        assertTrue(Arrays.equals(csv, Files.readAllBytes(out.resolve("sweep.csv"))), "sweep.csv does not depend on the plot");
        Cli.Outcome again = Cli.run("sweep", c.toString(), "--out", out.toString(), "--merge-only");
        assertEquals(0, again.code(), () -> again.toString());
        assertTrue(Arrays.equals(design, Files.readAllBytes(out.resolve("sweep.png"))), "without the option: the design wavelength's");
    }

    @Test
    void refusesAValueThatIsNotAPositiveLength() throws IOException {
        Path c = SweepCases.write(dir, "gap.yaml", SweepCases.gapCase(SweepCases.FOUR_POINTS));
        for (String bad : new String[] {"640", "0nm", "red"}) {
            Cli.Outcome o = Cli.run("sweep", c.toString(), "--out", dir.resolve("none").toString(), "--merge-only",
                    "--plot-wavelength", bad);
            assertEquals(2, o.code(), () -> bad + ": " + o);
            assertTrue(o.err().contains("--plot-wavelength") && o.err().contains("'" + bad + "'"), () -> bad + ": " + o);
            assertFalse(Files.exists(dir.resolve("none")), bad + ": nothing written");
        }
    }
}
