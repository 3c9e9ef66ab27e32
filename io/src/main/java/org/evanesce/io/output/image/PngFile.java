package org.evanesce.io.output.image;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Iterator;
import javax.imageio.ImageIO;
import javax.imageio.ImageWriter;
import javax.imageio.stream.ImageOutputStream;
import javax.imageio.stream.MemoryCacheImageOutputStream;
import org.evanesce.io.output.SafeFiles;

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
                    writer.write(img);
                }
            });
        } finally {
            writer.dispose();
        }
        return target;
    }
}
