package org.evanesce.io.output.image;

import java.awt.image.BufferedImage;
import java.io.DataInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import org.evanesce.io.output.SafeFiles;

/**
 * Writes images as PNG files atomically, for every picture this package draws. Each carries a
 * text chunk {@code Software: evanesce} (PNG specification, ISO/IEC 15948, tEXt chunk), so the
 * program can tell its own pictures from a user's file of the same name.
 *
 * <p>The encoding is this class's own (PNG specification, ISO/IEC 15948:2004: 8-bit RGB, no interlace, each row
 * filtered by whichever of None, Sub and Up gives the smallest sum of absolute differences, the specification's
 * suggested heuristic (sec. 12.8) over three of its five filters, then zlib-deflated at its fastest level): the image writer of the Java
 * runtime took about 0.1 s per far-field plot in a fresh JVM, converting every pixel through the image's sample
 * model and trying all five filters, and its set-up loads a registry of image formats. PngFileTest reads the
 * files back with that runtime's reader.
 */
public final class PngFile {

    /** The keyword and value of the text chunk every picture carries. */
    static final String KEYWORD = "Software";
    static final String SOFTWARE = "evanesce";
    /**
     * zlib's compression level: its fastest. The plots are mostly flat colour, so level 1 already shrinks them about
     * 90-fold; zlib's default (6) made them half the size at two to three times the deflate CPU (a sweep point's
     * flux.png, 1109 x 546: 19.8 kB in 3.9 ms against 9.1 kB in 13.1 ms; its preview, 630 x 697: 14.7 kB in 3.4 ms
     * against 7.0 kB in 8.8 ms), about 2 % of a 20-point gap sweep's CPU. The pixels are the same at any level.
     */
    static final int LEVEL = 1;

    private PngFile() {
    }

    /**
     * Writes {@code img} under a temporary name in the same folder and renames it onto
     * {@code file} when complete, replacing an earlier file of that name; after a failure no
     * temporary file is left. Missing parent folders are created.
     *
     * @return the absolute path written
     */
    static Path write(BufferedImage img, Path file) throws IOException {
        Path target = file.toAbsolutePath().normalize();
        Files.createDirectories(target.getParent());
        byte[] png = encode(img);
        SafeFiles.write(target, out -> out.write(png));
        return target;
    }

    /** The PNG file of {@code img} (its RGB; any alpha is dropped), with the text chunk. */
    public static byte[] encode(BufferedImage img) throws IOException {
        int w = img.getWidth();
        int h = img.getHeight();
        int[] px = rgb(img);
        java.io.ByteArrayOutputStream file = new java.io.ByteArrayOutputStream(w * h / 8 + 1024);
        file.write(SIGNATURE);
        java.nio.ByteBuffer header = java.nio.ByteBuffer.allocate(13);
        header.putInt(w).putInt(h).put((byte) 8).put((byte) 2).put((byte) 0).put((byte) 0).put((byte) 0);
        chunk(file, "IHDR", header.array(), header.array().length);
        byte[] text = (KEYWORD + "\0" + SOFTWARE).getBytes(StandardCharsets.ISO_8859_1);
        chunk(file, "tEXt", text, text.length);
        java.io.ByteArrayOutputStream data = new java.io.ByteArrayOutputStream(w * h / 8 + 1024);
        java.util.zip.Deflater deflater = new java.util.zip.Deflater(LEVEL);
        try (java.util.zip.DeflaterOutputStream z = new java.util.zip.DeflaterOutputStream(data, deflater, 1 << 16)) {
            int n = 3 * w;
            byte[] previous = new byte[n];
            byte[] row = new byte[n];
            byte[][] filtered = new byte[3][1 + n];
            for (int y = 0; y < h; y++) {
                for (int x = 0; x < w; x++) {
                    int c = px[y * w + x];
                    row[3 * x] = (byte) (c >>> 16);
                    row[3 * x + 1] = (byte) (c >>> 8);
                    row[3 * x + 2] = (byte) c;
                }
                z.write(filtered[filter(row, previous, filtered)]);
                byte[] t = previous;
                previous = row;
                row = t;
            }
        } finally {
            deflater.end();
        }
        byte[] idat = data.toByteArray();
        chunk(file, "IDAT", idat, idat.length);
        chunk(file, "IEND", new byte[0], 0);
        return file.toByteArray();
    }

    /**
     * Fills filtered[0..2] with the row under the filters None, Sub and Up (each led by its type byte) and returns the
     * one with the smallest sum of |filtered byte| (bytes read as signed), the first on a tie.
     */
    private static int filter(byte[] row, byte[] previous, byte[][] filtered) {
        int n = row.length;
        byte[] none = filtered[0];
        byte[] sub = filtered[1];
        byte[] up = filtered[2];
        none[0] = 0;
        sub[0] = 1;
        up[0] = 2;
        long sumNone = 0;
        long sumSub = 0;
        long sumUp = 0;
        for (int k = 0; k < n; k++) {
            byte b = row[k];
            byte s = (byte) (b - (k >= 3 ? row[k - 3] : 0));
            byte u = (byte) (b - previous[k]);
            none[k + 1] = b;
            sub[k + 1] = s;
            up[k + 1] = u;
            sumNone += Math.abs(b);
            sumSub += Math.abs(s);
            sumUp += Math.abs(u);
        }
        int best = 0;
        long least = sumNone;
        if (sumSub < least) {
            best = 1;
            least = sumSub;
        }
        if (sumUp < least) {
            best = 2;
        }
        return best;
    }

    /** A chunk: length, type, the first {@code n} bytes of data, CRC-32 of type and data. */
    private static void chunk(java.io.ByteArrayOutputStream out, String type, byte[] data, int n) {
        byte[] t = type.getBytes(StandardCharsets.US_ASCII);
        java.util.zip.CRC32 crc = new java.util.zip.CRC32();
        crc.update(t);
        crc.update(data, 0, n);
        java.nio.ByteBuffer b = java.nio.ByteBuffer.allocate(12 + n);
        b.putInt(n).put(t).put(data, 0, n).putInt((int) crc.getValue());
        out.write(b.array(), 0, b.capacity());
    }

    /** The image's pixels as 0xRRGGBB, rows of its width: its own array where it is a plain {@code TYPE_INT_RGB}. */
    private static int[] rgb(BufferedImage img) {
        int w = img.getWidth();
        int h = img.getHeight();
        if (img.getType() == BufferedImage.TYPE_INT_RGB
                && img.getRaster().getDataBuffer() instanceof java.awt.image.DataBufferInt d
                && img.getRaster().getSampleModel() instanceof java.awt.image.SinglePixelPackedSampleModel m
                && m.getScanlineStride() == w && d.getOffset() == 0 && img.getRaster().getSampleModelTranslateX() == 0
                && img.getRaster().getSampleModelTranslateY() == 0 && d.getData().length == w * h) {
            return d.getData();
        }
        return img.getRGB(0, 0, w, h, null, 0, w);
    }

    private static final byte[] SIGNATURE = {(byte) 0x89, 'P', 'N', 'G', '\r', '\n', 0x1a, '\n'};

    /**
     * Whether {@code file} is a PNG this program wrote (it carries the text chunk above before its
     * image data). Reads only the chunk headers and text chunks; false for anything else, including
     * a file that cannot be read.
     */
    public static boolean writtenByUs(Path file) {
        try (InputStream in = Files.newInputStream(file); DataInputStream d = new DataInputStream(in)) {
            byte[] sig = d.readNBytes(SIGNATURE.length);
            if (!Arrays.equals(sig, SIGNATURE)) {
                return false;
            }
            while (true) {
                int length = d.readInt();
                byte[] type = d.readNBytes(4);
                String t = new String(type, StandardCharsets.US_ASCII);
                if (length < 0 || t.equals("IDAT") || t.equals("IEND")) {
                    return false;
                }
                if (t.equals("tEXt") && length <= 1024) {
                    String kv = new String(d.readNBytes(length), StandardCharsets.ISO_8859_1);
                    if (kv.equals(KEYWORD + "\0" + SOFTWARE)) {
                        return true;
                    }
                } else {
                    d.skipNBytes(length);
                }
                d.skipNBytes(4);
            }
        } catch (IOException e) {
            // EOFException included: a truncated file is not one of ours
            return false;
        }
    }
}
