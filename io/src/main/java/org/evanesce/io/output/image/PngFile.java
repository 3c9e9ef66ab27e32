package org.evanesce.io.output.image;

import java.awt.image.BufferedImage;
import java.io.DataInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Iterator;
import java.util.zip.CRC32;
import java.util.zip.Deflater;
import javax.imageio.IIOImage;
import javax.imageio.ImageIO;
import javax.imageio.ImageTypeSpecifier;
import javax.imageio.ImageWriter;
import javax.imageio.metadata.IIOMetadata;
import javax.imageio.metadata.IIOMetadataNode;
import javax.imageio.stream.ImageOutputStream;
import javax.imageio.stream.MemoryCacheImageOutputStream;
import org.evanesce.io.output.SafeFiles;

/**
 * Writes images as PNG files atomically, for every picture this package draws. Each carries a
 * text chunk {@code Software: evanesce} (PNG specification, ISO/IEC 15948, tEXt chunk), so the
 * program can tell its own pictures from a user's file of the same name.
 */
public final class PngFile {

    /** The keyword and value of the text chunk every picture carries. */
    static final String KEYWORD = "Software";
    static final String SOFTWARE = "evanesce";

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
        if (img.getType() == BufferedImage.TYPE_INT_RGB && img.getRaster().getParent() == null) {
            byte[] png = rgb(img);
            SafeFiles.write(target, out -> out.write(png));
            return target;
        }
        Iterator<ImageWriter> writers = ImageIO.getImageWritersByFormatName("png");
        if (!writers.hasNext()) {
            throw new IOException("no PNG writer in this Java runtime; cannot write " + target);
        }
        ImageWriter writer = writers.next();
        try {
            SafeFiles.write(target, out -> {
                try (ImageOutputStream ios = new MemoryCacheImageOutputStream(out)) {
                    writer.setOutput(ios);
                    writer.write(null, new IIOImage(img, null, marked(writer, img)), null);
                }
            });
        } finally {
            writer.dispose();
        }
        return target;
    }

    /**
     * The PNG of an image of type {@code TYPE_INT_RGB}: 8-bit truecolour without interlacing, the text
     * chunk above, each row filtered by its difference to the row above ("Up", filter type 2) and the rows
     * compressed together (zlib, RFC 1950/1951) (PNG specification, ISO/IEC 15948: 11.2.2 IHDR, 9.2 filter
     * types, 11.3.4.3 tEXt). Written here rather than by {@code javax.imageio}, whose general writer (every
     * colour type and bit depth) the JIT compiles anew in each process at a cost far above the encoding:
     * a sweep writes two pictures per point.
     */
    static byte[] rgb(BufferedImage img) {
        // a whole image (no parent raster): its pixels start at 0, one row every scanline stride
        int w = img.getWidth();
        int h = img.getHeight();
        int[] px = ((java.awt.image.DataBufferInt) img.getRaster().getDataBuffer()).getData();
        int stride = ((java.awt.image.SinglePixelPackedSampleModel) img.getSampleModel()).getScanlineStride();
        byte[] rows = new byte[h * (1 + 3 * w)];
        int o = 0;
        for (int y = 0; y < h; y++) {
            rows[o++] = 2; // the row above the first is zeros (9.2), so "Up" leaves the first row as it is
            int row = y * stride;
            int above = row - stride;
            for (int x = 0; x < w; x++) {
                int c = px[row + x];
                int a = y == 0 ? 0 : px[above + x];
                rows[o++] = (byte) ((c >>> 16) - (a >>> 16));
                rows[o++] = (byte) ((c >>> 8) - (a >>> 8));
                rows[o++] = (byte) (c - a);
            }
        }
        java.io.ByteArrayOutputStream out = new java.io.ByteArrayOutputStream(rows.length / 8 + 256);
        out.writeBytes(SIGNATURE);
        ByteBuffer ihdr = ByteBuffer.allocate(13).putInt(w).putInt(h).put((byte) 8).put((byte) 2).put((byte) 0).put((byte) 0)
                .put((byte) 0);
        chunk(out, "IHDR", ihdr.array(), 13);
        byte[] text = (KEYWORD + "\0" + SOFTWARE).getBytes(StandardCharsets.ISO_8859_1);
        chunk(out, "tEXt", text, text.length);
        Deflater deflater = new Deflater(Deflater.DEFAULT_COMPRESSION);
        try {
            deflater.setInput(rows);
            deflater.finish();
            byte[] buf = new byte[Math.max(1024, rows.length / 4)];
            java.io.ByteArrayOutputStream idat = new java.io.ByteArrayOutputStream(buf.length);
            while (!deflater.finished()) {
                int n = deflater.deflate(buf);
                idat.write(buf, 0, n);
            }
            byte[] z = idat.toByteArray();
            chunk(out, "IDAT", z, z.length);
        } finally {
            deflater.end();
        }
        chunk(out, "IEND", new byte[0], 0);
        return out.toByteArray();
    }

    /** A chunk: length, type, data and the CRC-32 of type and data (ISO/IEC 15948, 5.3). */
    private static void chunk(java.io.ByteArrayOutputStream out, String type, byte[] data, int length) {
        byte[] t = type.getBytes(StandardCharsets.US_ASCII);
        CRC32 crc = new CRC32();
        crc.update(t);
        crc.update(data, 0, length);
        out.writeBytes(ByteBuffer.allocate(4).putInt(length).array());
        out.writeBytes(t);
        out.write(data, 0, length);
        out.writeBytes(ByteBuffer.allocate(4).putInt((int) crc.getValue()).array());
    }

    private static IIOMetadata marked(ImageWriter writer, BufferedImage img) throws IOException {
        IIOMetadata meta = writer.getDefaultImageMetadata(ImageTypeSpecifier.createFromRenderedImage(img), null);
        IIOMetadataNode entry = new IIOMetadataNode("tEXtEntry");
        entry.setAttribute("keyword", KEYWORD);
        entry.setAttribute("value", SOFTWARE);
        IIOMetadataNode text = new IIOMetadataNode("tEXt");
        text.appendChild(entry);
        IIOMetadataNode root = new IIOMetadataNode("javax_imageio_png_1.0");
        root.appendChild(text);
        meta.mergeTree("javax_imageio_png_1.0", root);
        return meta;
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
