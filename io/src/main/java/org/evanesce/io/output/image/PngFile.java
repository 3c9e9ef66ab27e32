package org.evanesce.io.output.image;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.util.Iterator;
import java.util.concurrent.ThreadLocalRandom;
import javax.imageio.ImageIO;
import javax.imageio.ImageWriter;
import javax.imageio.stream.ImageOutputStream;
import javax.imageio.stream.MemoryCacheImageOutputStream;

/** Writes images as PNG files atomically, for every picture this package draws. */
final class PngFile {

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
        Path dir = target.getParent();
        Files.createDirectories(dir);
        Path tmp = dir.resolve("." + target.getFileName() + "."
                + Long.toHexString(ThreadLocalRandom.current().nextLong() & Long.MAX_VALUE) + ".tmp");
        try {
            Iterator<ImageWriter> writers = ImageIO.getImageWritersByFormatName("png");
            if (!writers.hasNext()) {
                throw new IOException("no PNG writer in this Java runtime; cannot write " + target);
            }
            ImageWriter writer = writers.next();
            try (OutputStream out = Files.newOutputStream(tmp, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE);
                    ImageOutputStream ios = new MemoryCacheImageOutputStream(out)) {
                writer.setOutput(ios);
                writer.write(img);
            } finally {
                writer.dispose();
            }
            try {
                Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
            } catch (AtomicMoveNotSupportedException e) {
                Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING);
            }
        } finally {
            Files.deleteIfExists(tmp);
        }
        return target;
    }
}
