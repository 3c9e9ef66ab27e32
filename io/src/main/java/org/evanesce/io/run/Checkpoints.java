package org.evanesce.io.run;

import java.io.BufferedInputStream;
import java.io.DataInputStream;
import java.io.DataOutputStream;
import java.io.FilterOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.function.Consumer;
import java.util.zip.CRC32C;
import org.evanesce.io.output.Faults;
import org.evanesce.io.output.Leftovers;
import org.evanesce.io.output.SafeFiles;
import org.evanesce.solver.Simulation;

/**
 * Where and how often a run saves its state, and reading it back.
 *
 * <p>The file: a magic line, the run's identity (a hash of the case file's text, the overrides and
 * the program version: a checkpoint of anything else is ignored and later overwritten), the stopping
 * rule's state (largest energy so far, last energy, and, once the stepping has ended, why it ended
 * and its wall time), then the simulation's own state ({@link Simulation#saveState}), and last the
 * byte count and a CRC-32C of everything before. Written whole through {@link SafeFiles} (a new
 * temporary file, flushed to the disk, renamed), so a kill while saving leaves the previous
 * checkpoint intact.
 *
 * <p>A file that is not a checkpoint of this version, is cut short or fails its check sum is set
 * aside as {@code FILE.corrupt-N} with a warning and the run starts over; so is one that passes the
 * check but does not fit the run (then {@link Unusable} is thrown: the simulation may be half
 * restored, and the caller plans the run again).
 */
public final class Checkpoints {

    /** Steps between checks of the wall clock when the run stops after a fixed number of steps. */
    static final int CHUNK = 64;
    private static final byte[] MAGIC = "evanesce run checkpoint 2\n".getBytes(StandardCharsets.US_ASCII);
    /** Byte count (8) and CRC-32C (8) at the end. */
    private static final int TRAILER = 16;

    /** The checkpoint passed its check sum but did not fit this run; it was set aside and the run must be planned anew. */
    public static final class Unusable extends RuntimeException {
        private static final long serialVersionUID = 1L;

        Unusable(String message, Throwable cause) {
            super(message, cause);
        }
    }

    /**
     * What a checkpoint held besides the simulation's state.
     *
     * @param reason      why the stepping ended, or null while it had not
     * @param wallSeconds wall time of the stepping so far
     */
    record State(double peak, double energy, String reason, double wallSeconds) { }

    private final Path file;
    private final double intervalSeconds;
    private final String identity;
    private final Consumer<String> warnings;

    /**
     * @param file            the checkpoint file
     * @param intervalSeconds least wall time between checkpoints
     * @param identity        the run's identity
     * @param warnings        receives warnings and notes for the user (one line each)
     */
    public Checkpoints(Path file, double intervalSeconds, String identity, Consumer<String> warnings) {
        this.file = file.toAbsolutePath().normalize();
        this.intervalSeconds = intervalSeconds;
        this.identity = identity;
        this.warnings = warnings;
    }

    public Path file() {
        return file;
    }

    public double intervalSeconds() {
        return intervalSeconds;
    }

    boolean due(long lastSaveNanos) {
        return (System.nanoTime() - lastSaveNanos) * 1e-9 >= intervalSeconds;
    }

    void save(Simulation sim, double peak, double energy, String reason, double wallSeconds) {
        try {
            SafeFiles.write(file, os -> {
                Summing sum = new Summing(os);
                DataOutputStream out = new DataOutputStream(sum);
                out.write(MAGIC);
                out.writeUTF(identity);
                out.writeDouble(peak);
                out.writeDouble(energy);
                out.writeBoolean(reason != null);
                out.writeUTF(reason == null ? "" : reason);
                out.writeDouble(wallSeconds);
                out.flush();
                sim.saveState(sum);
                sum.flush();
                DataOutputStream tail = new DataOutputStream(os);
                tail.writeLong(sum.count);
                tail.writeLong(sum.crc.getValue());
                tail.flush();
            });
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /**
     * Restores {@code sim} from the file when it holds this run's checkpoint; null otherwise (no file, a
     * checkpoint of another case, or a damaged one, which is set aside). Removes temporaries of
     * checkpoints that stopped runs were writing.
     *
     * @throws Unusable when the checkpoint was sound but did not fit; {@code sim} may then be half restored
     */
    State restore(Simulation sim) {
        try {
            for (String line : Leftovers.clean(file.getParent(), file.getFileName().toString())) {
                warnings.accept("note: " + line);
            }
        } catch (IOException e) {
            warnings.accept("note: could not look for leftovers beside " + file + ": " + Faults.sentence(e));
        }
        if (!Files.exists(file, LinkOption.NOFOLLOW_LINKS)) {
            return null;
        }
        String problem = check();
        if (problem != null) {
            setAside(problem);
            return null;
        }
        try (InputStream is = new BufferedInputStream(Files.newInputStream(file, LinkOption.NOFOLLOW_LINKS), 1 << 16);
                DataInputStream in = new DataInputStream(is)) {
            in.readFully(new byte[MAGIC.length]);
            if (!identity.equals(in.readUTF())) {
                warnings.accept("note: " + file + " is a checkpoint of another case, other --set values or another version; "
                        + "this run starts from the beginning and will overwrite it");
                return null;
            }
            double peak = in.readDouble();
            double energy = in.readDouble();
            boolean ended = in.readBoolean();
            String reason = in.readUTF();
            double wall = in.readDouble();
            sim.restoreState(in);
            return new State(peak, energy, ended ? reason : null, wall);
        } catch (IOException | RuntimeException e) {
            Path aside = setAside("it does not fit this run: " + e.getMessage());
            throw new Unusable("the checkpoint " + file + " did not fit this run (" + e.getMessage() + "); it was set aside as "
                    + aside.getFileName(), e);
        }
    }

    /** Why the file is not a sound checkpoint of this version, or null when it is. */
    private String check() {
        if (!Files.isRegularFile(file, LinkOption.NOFOLLOW_LINKS)) {
            return "it is not a plain file";
        }
        try (InputStream is = new BufferedInputStream(Files.newInputStream(file, LinkOption.NOFOLLOW_LINKS), 1 << 16)) {
            long size = Files.size(file);
            byte[] head = is.readNBytes(MAGIC.length);
            if (!Arrays.equals(head, MAGIC)) {
                return "it is not a checkpoint of this version of evanesce";
            }
            if (size < MAGIC.length + TRAILER) {
                return "it is cut short (" + size + " bytes)";
            }
            CRC32C crc = new CRC32C();
            crc.update(head);
            long left = size - TRAILER - MAGIC.length;
            byte[] buf = new byte[1 << 16];
            while (left > 0) {
                int n = is.read(buf, 0, (int) Math.min(buf.length, left));
                if (n < 0) {
                    return "it is cut short";
                }
                crc.update(buf, 0, n);
                left -= n;
            }
            DataInputStream tail = new DataInputStream(is);
            long count = tail.readLong();
            long sum = tail.readLong();
            if (count != size - TRAILER) {
                return "it is cut short or damaged: " + size + " bytes, and its last bytes do not record that length";
            }
            if (sum != crc.getValue()) {
                return "its check sum does not match (the file is damaged)";
            }
            return null;
        } catch (IOException e) {
            return "it cannot be read: " + Faults.sentence(e);
        }
    }

    /** Renames the file to the first free {@code FILE.corrupt-N} and warns; returns the new name. */
    private Path setAside(String why) {
        for (int k = 1; ; k++) {
            Path aside = file.resolveSibling(file.getFileName() + ".corrupt-" + k);
            if (Files.exists(aside, LinkOption.NOFOLLOW_LINKS)) {
                continue;
            }
            try {
                Files.move(file, aside);
            } catch (java.nio.file.FileAlreadyExistsException e) {
                continue;
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
            warnings.accept("warning: the checkpoint " + file + " cannot be used (" + why + "); it was set aside as "
                    + aside.getFileName() + " and the run starts from the beginning");
            return aside;
        }
    }

    /** Removes the checkpoint (after the run's results are in place). */
    public void delete() throws IOException {
        Files.deleteIfExists(file);
    }

    /** Counts the bytes written through it and sums them (CRC-32C). */
    private static final class Summing extends FilterOutputStream {
        final CRC32C crc = new CRC32C();
        long count;

        Summing(OutputStream out) {
            super(out);
        }

        @Override
        public void write(int b) throws IOException {
            out.write(b);
            crc.update(b);
            count++;
        }

        @Override
        public void write(byte[] b, int off, int len) throws IOException {
            out.write(b, off, len);
            crc.update(b, off, len);
            count += len;
        }
    }
}
