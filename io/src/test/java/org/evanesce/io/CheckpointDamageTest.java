package org.evanesce.io;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.DataInputStream;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import java.util.stream.Stream;
import java.util.zip.CRC32C;
import org.evanesce.io.cli.ExitCode;
import org.evanesce.io.output.SafeFiles;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Issue 13: a checkpoint that is cut short, random bytes, or sound but of another set-up is set aside
 * as {@code NAME.checkpoint.corrupt-N} with a warning and the run starts over (never a bare
 * end-of-file error), giving the results of an uninterrupted run byte for byte. The checkpoint comes
 * from a run that failed on a (simulated) full disk after its stepping: the fault leaves the
 * checkpoint, and an intact one lets the next run continue.
 */
class CheckpointDamageTest {

    @TempDir
    Path tmp;

    /** A plane wave through a gap (as in the sweep tests): a fraction of a second with its incident-power run. */
    private static final String GAP = """
            design_wavelength: 633 nm
            polarization: s
            domain: {width: 0.1 um, height: 3.2 um, background: glass}
            grid: {cells_per_wavelength: 20}
            materials:
              glass: {index: 1.5}
              gap_vacuum: {index: 1.0}
            shapes:
              - layer_stack: {start: [0, -75 nm], layers: [{material: gap_vacuum, thickness: 150 nm}]}
            boundaries: {left: periodic, right: periodic, bottom: pml 0.5 um, top: pml 0.5 um}
            sources:
              - plane_wave: {y: -0.7 um, direction: up, angle: 45 deg, signal: {pulse: {wavelength: 633 nm, bandwidth: 20 nm}}}
            flux:
              wavelengths: [633 nm, 640 nm]
              lines:
                - {name: front, y: -0.95 um, measures: reflected}
                - {name: back, y: 0.7 um, measures: transmitted}
            until: {energy_below: 1e-6, latest: 400 fs}
            """;

    private static final byte[] MAGIC = "evanesce run checkpoint 2\n".getBytes(java.nio.charset.StandardCharsets.US_ASCII);

    @Test
    void damagedCheckpointsAreSetAsideAndTheRunStartsOver() throws IOException {
        Path c = Files.writeString(tmp.resolve("gap.yaml"), GAP);
        Path whole = tmp.resolve("whole");
        assertEquals(ExitCode.OK, Cli.run("run", c.toString(), "--out", whole.toString(), "--checkpoint-minutes", "0").code());
        byte[] expected = Files.readAllBytes(whole.resolve("flux.csv"));

        // a run that fails on a full disk once its stepping (and the checkpoint after it) is done
        Path failed = tmp.resolve("failed");
        System.setProperty(SafeFiles.NO_SPACE_PROPERTY, "/flux\\.csv$");
        Cli.Outcome f;
        try {
            f = Cli.run("run", c.toString(), "--out", failed.toString());
        } finally {
            System.clearProperty(SafeFiles.NO_SPACE_PROPERTY);
        }
        assertEquals(ExitCode.RUN_FAILED, f.code(), f::toString);
        Path ck = tmp.resolve("failed.checkpoint");
        assertTrue(Files.isRegularFile(ck), "the checkpoint survives the fault: " + f);
        byte[] sound = Files.readAllBytes(ck);

        byte[] random = new byte[sound.length];
        new Random(13).nextBytes(random);
        byte[][] damaged = {
            Arrays.copyOf(sound, sound.length / 2),   // cut short
            Arrays.copyOf(sound, 40),                 // cut inside the header
            random,                                   // not a checkpoint at all
            flipped(sound),                           // one byte changed: the check sum catches it
            new byte[0],
        };
        for (int k = 0; k < damaged.length; k++) {
            Path out = tmp.resolve("d" + k);
            Path file = tmp.resolve("d" + k + ".checkpoint");
            Files.write(file, damaged[k]);
            Cli.Outcome o = Cli.run("run", c.toString(), "--out", out.toString());
            String what = "damage " + k + ": " + o;
            assertEquals(ExitCode.OK, o.code(), what);
            assertTrue(o.out().contains("set aside as d" + k + ".checkpoint.corrupt-1"), what);
            assertFalse(o.out().contains("continued from the checkpoint"), what);
            assertArrayEquals(damaged[k], Files.readAllBytes(tmp.resolve("d" + k + ".checkpoint.corrupt-1")), "kept as it was");
            assertArrayEquals(expected, Files.readAllBytes(out.resolve("flux.csv")), what);
            assertFalse(Files.exists(file), "the new run's checkpoint is removed when it has finished");
        }

        // sound, but of another grid (its nx changed, the check sum made right): set aside, planned anew
        Path out = tmp.resolve("other");
        Files.write(tmp.resolve("other.checkpoint"), otherGrid(sound));
        Cli.Outcome o = Cli.run("run", c.toString(), "--out", out.toString());
        assertEquals(ExitCode.OK, o.code(), o::toString);
        assertTrue(o.out().contains("did not fit this run") && o.out().contains("other.checkpoint.corrupt-1"), o::toString);
        assertArrayEquals(expected, Files.readAllBytes(out.resolve("flux.csv")));

        // the intact one continues
        Cli.Outcome resumed = Cli.run("run", c.toString(), "--out", failed.toString());
        assertEquals(ExitCode.OK, resumed.code(), resumed::toString);
        assertTrue(resumed.out().contains("continued from the checkpoint at step"), resumed::toString);
        assertArrayEquals(expected, Files.readAllBytes(failed.resolve("flux.csv")));
        try (Stream<Path> s = Files.list(tmp)) {
            assertEquals(List.of(), s.map(p -> p.getFileName().toString()).filter(n -> n.startsWith(".")).toList(),
                    "no temporaries left");
        }
    }

    private static byte[] flipped(byte[] b) {
        byte[] out = b.clone();
        out[out.length / 2] ^= 0x10;
        return out;
    }

    /**
     * The checkpoint with the simulation's nx plus one and a new check sum. Layout (Checkpoints): magic,
     * identity (UTF), peak, energy (doubles), ended (boolean), reason (UTF), wall (double), then the
     * simulation's magic (UTF) and nx (int); at the end the byte count and the CRC-32C (longs).
     */
    private static byte[] otherGrid(byte[] sound) throws IOException {
        byte[] b = sound.clone();
        DataInputStream in = new DataInputStream(new ByteArrayInputStream(b));
        in.readFully(new byte[MAGIC.length]);
        in.readUTF();
        in.readDouble();
        in.readDouble();
        in.readBoolean();
        in.readUTF();
        in.readDouble();
        in.readUTF();
        int at = b.length - in.available();
        ByteBuffer.wrap(b, at, 4).putInt(in.readInt() + 1);
        CRC32C crc = new CRC32C();
        crc.update(b, 0, b.length - 16);
        ByteBuffer.wrap(b, b.length - 8, 8).putLong(crc.getValue());
        return b;
    }
}
