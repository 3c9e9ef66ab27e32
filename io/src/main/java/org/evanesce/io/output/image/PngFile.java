package org.evanesce.io.output.image;

import java.awt.image.BufferedImage;
import java.io.DataInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Iterator;
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
