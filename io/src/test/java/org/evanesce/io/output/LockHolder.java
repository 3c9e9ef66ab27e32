package org.evanesce.io.output;

import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;

/**
 * A child process for {@link LeftoversTest}: takes the lock on the file named by its argument, prints
 * "locked", and holds it until its standard input closes (or it is killed), as a run on another host
 * holds the lock of the folder it writes.
 */
public final class LockHolder {

    private LockHolder() {
    }

    public static void main(String[] args) throws Exception {
        try (FileChannel ch = FileChannel.open(Path.of(args[0]), StandardOpenOption.WRITE)) {
            FileLock lock = ch.lock();
            System.out.println("locked");
            System.out.flush();
            while (System.in.read() >= 0) {
                // wait for the parent to close our input
            }
            lock.release();
        }
    }
}
