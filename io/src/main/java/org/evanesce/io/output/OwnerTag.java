package org.evanesce.io.output;

import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.channels.OverlappingFileLockException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.Locale;
import java.util.Optional;
import java.util.concurrent.ThreadLocalRandom;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Who wrote a temporary file or folder: the host (8 hex digits of a hash of its name), the process id
 * and a random part, written into every temporary name as {@code HOST-PID-RANDOM}. A later run uses it
 * to decide whether a leftover is provably abandoned: on the same host, when that process no longer
 * runs; on another host (a file system shared by cluster nodes), when the lock its writer held on the
 * leftover's lock file is free again (the system releases a process's locks when it ends, also on
 * SIGKILL). Anything else counts as alive and is left alone.
 *
 * @param host   8 hex digits naming the host
 * @param pid    the writing process
 * @param random distinguishes the names one process makes
 */
public record OwnerTag(String host, long pid, String random) {

    /** {@code HOST-PID-RANDOM} inside a name. */
    public static final String PATTERN = "([0-9a-f]{8})-(\\d{1,19})-([0-9a-z]{1,16})";
    private static final Pattern WHOLE = Pattern.compile(PATTERN);

    private static final String HOST = hostHash();

    /** Whether the writer of a leftover may still be at work. */
    public enum Liveness { ALIVE, ENDED, UNKNOWN }

    /** A new tag of this process. */
    public static OwnerTag mine() {
        return new OwnerTag(HOST, ProcessHandle.current().pid(),
                Long.toString(ThreadLocalRandom.current().nextLong() & Long.MAX_VALUE, 36));
    }

    /** Reads a tag from its text ({@code HOST-PID-RANDOM}); empty when it is not one. */
    public static Optional<OwnerTag> parse(String text) {
        Matcher m = WHOLE.matcher(text);
        if (!m.matches()) {
            return Optional.empty();
        }
        try {
            return Optional.of(new OwnerTag(m.group(1), Long.parseLong(m.group(2)), m.group(3)));
        } catch (NumberFormatException e) {
            return Optional.empty();
        }
    }

    /** {@code HOST-PID-RANDOM}. */
    public String text() {
        return host + "-" + pid + "-" + random;
    }

    /** Whether the tag was made on this host. */
    public boolean thisHost() {
        return HOST.equals(host);
    }

    /**
     * Whether the writer may still be at work. On this host the process table decides; elsewhere
     * {@code lockFile} (the leftover's lock, held by its writer while it works) does: free means the
     * writer has ended.
     *
     * @param lockFile the lock file of the leftover, or null when it has none
     */
    public Liveness liveness(Path lockFile) {
        if (thisHost()) {
            if (pid == ProcessHandle.current().pid()) {
                return Liveness.ALIVE;
            }
            return ProcessHandle.of(pid).map(ProcessHandle::isAlive).orElse(false) ? Liveness.ALIVE : Liveness.ENDED;
        }
        if (lockFile == null || !Files.isRegularFile(lockFile, LinkOption.NOFOLLOW_LINKS)) {
            return Liveness.UNKNOWN;
        }
        // never a lock file of this process (tags of this host are decided above), so closing the channel
        // cannot release a lock this process holds
        try (FileChannel ch = FileChannel.open(lockFile, StandardOpenOption.WRITE, LinkOption.NOFOLLOW_LINKS)) {
            FileLock lock = ch.tryLock();
            if (lock == null) {
                return Liveness.ALIVE;
            }
            lock.release();
            return Liveness.ENDED;
        } catch (OverlappingFileLockException e) {
            return Liveness.ALIVE;
        } catch (IOException e) {
            return Liveness.UNKNOWN;
        }
    }

    /** 8 hex digits of the host's name (from the kernel where it is there to read, else the network name). */
    private static String hostHash() {
        String name = null;
        try {
            Path p = Path.of("/proc/sys/kernel/hostname");
            if (Files.isReadable(p)) {
                name = Files.readString(p, StandardCharsets.UTF_8).strip();
            }
        } catch (IOException | RuntimeException e) {
            name = null;
        }
        if (name == null || name.isEmpty()) {
            try {
                name = java.net.InetAddress.getLocalHost().getHostName();
            } catch (IOException | RuntimeException e) {
                name = "unknown-host";
            }
        }
        int h = 0x811c9dc5;
        for (byte b : name.getBytes(StandardCharsets.UTF_8)) {
            h = (h ^ (b & 0xff)) * 0x01000193;
        }
        return String.format(Locale.ROOT, "%08x", h);
    }
}
