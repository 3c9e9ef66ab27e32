package org.evanesce.io.run;

import java.io.DataInputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import org.evanesce.solver.Simulation;

/**
 * Where and how often a run saves its state, and reading it back.
 *
 * <p>The file: the run's identity (a hash of the case file's text, the overrides and the program
 * version: a checkpoint of anything else is ignored), the stopping rule's state (largest energy so
 * far, last energy, and, once the stepping has ended, why it ended and its wall time), then the
 * simulation's own state ({@link Simulation#saveState}). Written to a temporary name and renamed, so
 * a kill while saving leaves the previous checkpoint intact.
 *
 * @param file            the checkpoint file
 * @param intervalSeconds least wall time between checkpoints
 * @param identity        the run's identity
 */
public record Checkpoints(Path file, double intervalSeconds, String identity) {

    /** Steps between checks of the wall clock when the run stops after a fixed number of steps. */
    static final int CHUNK = 64;
    /** 2: flux lines also keep the duration of their samples (a checkpoint of format 1 is ignored). */
    private static final String MAGIC = "evanesce run checkpoint 2";

    /**
     * What a checkpoint held besides the simulation's state.
     *
     * @param reason      why the stepping ended, or null while it had not
     * @param wallSeconds wall time of the stepping so far
     */
    record State(double peak, double energy, String reason, double wallSeconds) { }

    boolean due(long lastSaveNanos) {
        return (System.nanoTime() - lastSaveNanos) * 1e-9 >= intervalSeconds;
    }

    void save(Simulation sim, double peak, double energy, String reason, double wallSeconds) {
        Path tmp = file.resolveSibling(file.getFileName() + ".part");
        try {
            try (OutputStream os = Files.newOutputStream(tmp); DataOutputStream out = new DataOutputStream(os)) {
                out.writeUTF(MAGIC);
                out.writeUTF(identity);
                out.writeDouble(peak);
                out.writeDouble(energy);
                out.writeBoolean(reason != null);
                out.writeUTF(reason == null ? "" : reason);
                out.writeDouble(wallSeconds);
                out.flush();
                sim.saveState(os);
                os.flush();
            }
            Files.move(tmp, file, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
        } catch (IOException e) {
            throw new UncheckedIOException("writing the checkpoint " + file + ": " + e.getMessage(), e);
        }
    }

    /** Restores {@code sim} from the file when it holds this run's checkpoint; null otherwise. */
    State restore(Simulation sim) {
        if (!Files.isRegularFile(file)) {
            return null;
        }
        try (InputStream is = Files.newInputStream(file); DataInputStream in = new DataInputStream(is)) {
            if (!MAGIC.equals(in.readUTF()) || !identity.equals(in.readUTF())) {
                return null;
            }
            double peak = in.readDouble();
            double energy = in.readDouble();
            boolean ended = in.readBoolean();
            String reason = in.readUTF();
            double wall = in.readDouble();
            sim.restoreState(is);
            return new State(peak, energy, ended ? reason : null, wall);
        } catch (IOException e) {
            throw new UncheckedIOException("reading the checkpoint " + file + " (delete it to start over): " + e.getMessage(), e);
        }
    }

    /** Removes the checkpoint (after the run's results are in place). */
    void delete() throws IOException {
        Files.deleteIfExists(file);
    }
}
