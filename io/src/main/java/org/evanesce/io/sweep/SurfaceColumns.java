package org.evanesce.io.sweep;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * A point's surfaces.csv joined to its flux table for the merged sweep table: with no flux.csv the surfaces' rows
 * are the table; with both, and the same wavelengths row by row, the surfaces' value columns are appended to the
 * flux rows; with different wavelengths the surfaces' columns are appended to a row of their own per wavelength.
 */
final class SurfaceColumns {

    /** The table's columns that say where a row is (not values to plot). */
    private static final List<String> KEYS = List.of("wavelength_nm", "frequency_THz");

    private SurfaceColumns() {
    }

    /**
     * @param header   the flux table's header (empty without flux.csv); replaced by the joined one
     * @param rows     its rows; replaced by the joined ones
     * @param plotted  the columns the sweep's plot shows; the surfaces' value columns are added when it is empty
     */
    static void join(Path dir, List<String> header, List<String[]> rows, List<String> plotted) throws IOException {
        Path file = dir.resolve("surfaces.csv");
        if (!Files.isRegularFile(file)) {
            return;
        }
        List<String> lines = Files.readAllLines(file, StandardCharsets.UTF_8);
        List<String> sh = List.of(lines.get(0).split(",", -1));
        List<String[]> sr = new ArrayList<>();
        for (String l : lines.subList(1, lines.size())) {
            if (!l.isEmpty()) {
                sr.add(l.split(",", -1));
            }
        }
        if (plotted.isEmpty()) {
            for (String c : sh) {
                if (!KEYS.contains(c) && !c.endsWith("_w_per_m") && !c.endsWith("_j_per_m_hz")) {
                    plotted.add(c);
                }
            }
        }
        if (header.isEmpty()) {
            header.addAll(sh);
            rows.addAll(sr);
            return;
        }
        int wl = header.indexOf("wavelength_nm");
        boolean same = wl >= 0 && rows.size() == sr.size();
        for (int k = 0; same && k < rows.size(); k++) {
            same = rows.get(k)[wl].equals(sr.get(k)[0]);
        }
        List<Integer> values = new ArrayList<>();
        for (int c = 0; c < sh.size(); c++) {
            if (!KEYS.contains(sh.get(c)) && !header.contains(sh.get(c))) {
                values.add(c);
            }
        }
        int width = header.size();
        for (int c : values) {
            header.add(sh.get(c));
        }
        List<String[]> out = new ArrayList<>();
        if (same) {
            for (int k = 0; k < rows.size(); k++) {
                out.add(append(rows.get(k), width, sr.get(k), values));
            }
        } else {
            out.addAll(rows);
            for (String[] r : sr) {
                String[] lead = new String[width];
                java.util.Arrays.fill(lead, "");
                if (wl >= 0) {
                    lead[wl] = r[0];
                }
                out.add(append(lead, width, r, values));
            }
        }
        rows.clear();
        rows.addAll(out);
    }

    private static String[] append(String[] row, int width, String[] from, List<Integer> values) {
        String[] r = java.util.Arrays.copyOf(row, width + values.size());
        for (int k = row.length; k < width; k++) {
            r[k] = "";
        }
        for (int k = 0; k < values.size(); k++) {
            int c = values.get(k);
            r[width + k] = c < from.length ? from[c] : "";
        }
        return r;
    }
}
