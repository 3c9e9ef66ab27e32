package org.evanesce.solver.kernel;

import java.io.DataInput;
import java.io.DataOutput;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;

/**
 * Writes and reads arrays of a run's state exactly (the IEEE bits, little-endian), with their length,
 * for checkpoints: a restored run continues bit for bit.
 */
public final class StateIO {

    /** Values per chunk when copying through a byte buffer. */
    private static final int CHUNK = 1 << 16;

    private StateIO() {
    }

    public static void write(DataOutput out, float[] a) throws IOException {
        out.writeInt(a.length);
        ByteBuffer b = ByteBuffer.allocate(Math.min(a.length, CHUNK) * Float.BYTES).order(ByteOrder.LITTLE_ENDIAN);
        for (int k = 0; k < a.length; k += CHUNK) {
            int n = Math.min(CHUNK, a.length - k);
            b.clear();
            b.asFloatBuffer().put(a, k, n);
            out.write(b.array(), 0, n * Float.BYTES);
        }
    }

    public static void write(DataOutput out, double[] a) throws IOException {
        out.writeInt(a.length);
        ByteBuffer b = ByteBuffer.allocate(Math.min(a.length, CHUNK) * Double.BYTES).order(ByteOrder.LITTLE_ENDIAN);
        for (int k = 0; k < a.length; k += CHUNK) {
            int n = Math.min(CHUNK, a.length - k);
            b.clear();
            b.asDoubleBuffer().put(a, k, n);
            out.write(b.array(), 0, n * Double.BYTES);
        }
    }

    /** Reads into {@code a}, which must have the length written. */
    public static void read(DataInput in, float[] a) throws IOException {
        length(in, a.length);
        byte[] bytes = new byte[Math.min(a.length, CHUNK) * Float.BYTES];
        for (int k = 0; k < a.length; k += CHUNK) {
            int n = Math.min(CHUNK, a.length - k);
            in.readFully(bytes, 0, n * Float.BYTES);
            ByteBuffer.wrap(bytes, 0, n * Float.BYTES).order(ByteOrder.LITTLE_ENDIAN).asFloatBuffer().get(a, k, n);
        }
    }

    /** Reads into {@code a}, which must have the length written. */
    public static void read(DataInput in, double[] a) throws IOException {
        length(in, a.length);
        byte[] bytes = new byte[Math.min(a.length, CHUNK) * Double.BYTES];
        for (int k = 0; k < a.length; k += CHUNK) {
            int n = Math.min(CHUNK, a.length - k);
            in.readFully(bytes, 0, n * Double.BYTES);
            ByteBuffer.wrap(bytes, 0, n * Double.BYTES).order(ByteOrder.LITTLE_ENDIAN).asDoubleBuffer().get(a, k, n);
        }
    }

    private static void length(DataInput in, int expected) throws IOException {
        int n = in.readInt();
        if (n != expected) {
            throw new IOException("checkpoint holds an array of " + n + " values where this run has " + expected
                    + ": it belongs to another case or grid");
        }
    }
}
