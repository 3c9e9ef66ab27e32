package org.evanesce.io.casefile.sections;

import org.evanesce.io.casefile.model.MaterialSpec;
import org.evanesce.io.casefile.model.MetalSpec;
import org.evanesce.io.casefile.text.Scalar;
import org.evanesce.io.casefile.text.SourcePosition;
import org.evanesce.io.casefile.text.Value;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.InvalidPathException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.evanesce.geometry.dispersion.MaterialDataException;
import org.evanesce.geometry.dispersion.NkTable;
import org.evanesce.geometry.dispersion.PoleFit;
import org.evanesce.geometry.dispersion.SourcedMaterial;
import org.evanesce.geometry.dispersion.WavelengthBand;
import org.evanesce.io.casefile.sections.Context.Expect;

/**
 * A material given by a table of measured n, k against wavelength in a CSV file beside the case
 * ({@code table: gold.csv}), fitted with {@link PoleFit} over the run's band.
 *
 * <p>The file: lines starting with {@code #} and blank lines are skipped; the first other line is the
 * header {@code wavelength_nm,n,k} (or {@code wavelength_um,n,k}); every further line holds three numbers
 * separated by commas. The path is relative to the case file's folder and may not leave it (no absolute
 * paths, no {@code ..} above it, no link pointing out of it).
 */
final class NkTableReader {

    /** The largest table read, bytes: far more than any measured table (a few hundred rows). */
    static final long MAX_BYTES = 1L << 20;

    private final Context ctx;
    private final String caseFile;

    NkTableReader(Context ctx, String caseFile) {
        this.ctx = ctx;
        this.caseFile = caseFile;
    }

    MetalReader.Pending read(MapView v, String name, SourcePosition at) {
        String path = v.path("table");
        Scalar s = ctx.scalar(v.get("table"), path, "a CSV file beside the case, such as gold_nk.csv");
        double tol = PoleFit.DEFAULT_TOLERANCE;
        if (v.has("fit_tolerance")) {
            Value t = ctx.positive(v.get("fit_tolerance"), v.path("fit_tolerance"), Expect.PLAIN);
            if (t == null) {
                return null;
            }
            tol = t.si();
        }
        if (s == null) {
            return null;
        }
        Path file = locate(s, path);
        if (file == null) {
            return null;
        }
        NkTable table = parse(file, s.text().strip(), s.start(), path);
        if (table == null) {
            return null;
        }
        double tolerance = tol;
        return band -> fit(name, table, band, tolerance, file.toString(), s.start(), path, at);
    }

    /** The file inside the case's folder tree, or null after reporting. */
    private Path locate(Scalar s, String path) {
        String text = s.text().strip();
        Path rel;
        try {
            rel = Path.of(text);
        } catch (InvalidPathException e) {
            ctx.error(s.start(), path, "'" + text + "' is not a file name: " + e.getReason());
            return null;
        }
        if (rel.isAbsolute()) {
            ctx.error(s.start(), path, "'" + text + "' is an absolute path; give the table's path relative to the case file's "
                    + "folder, inside it");
            return null;
        }
        Path caseDir = Path.of(caseFile).toAbsolutePath().normalize().getParent();
        Path file = caseDir.resolve(rel).normalize();
        if (!file.startsWith(caseDir)) {
            ctx.error(s.start(), path, "'" + text + "' lies outside the case file's folder " + caseDir + "; put the table in it "
                    + "or below it");
            return null;
        }
        if (!Files.isRegularFile(file)) {
            ctx.error(s.start(), path, "no file '" + text + "' beside the case (looked for " + file + ")");
            return null;
        }
        try {
            if (!file.toRealPath().startsWith(caseDir.toRealPath())) {
                ctx.error(s.start(), path, "'" + text + "' is a link to a file outside the case file's folder; copy the table "
                        + "into the folder");
                return null;
            }
            if (Files.size(file) > MAX_BYTES) {
                ctx.error(s.start(), path, String.format("'%s' is %d bytes, more than the %d a table of n, k may have",
                        text, Files.size(file), MAX_BYTES));
                return null;
            }
        } catch (IOException e) {
            ctx.error(s.start(), path, "'" + text + "' cannot be read: " + e.getMessage());
            return null;
        }
        return file;
    }

    /** The table, or null after reporting (errors name the CSV file and line). */
    NkTable parse(Path file, String shown, SourcePosition from, String path) {
        List<String> lines;
        try {
            lines = Files.readAllLines(file, StandardCharsets.UTF_8);
        } catch (IOException e) {
            ctx.error(from, path, "'" + shown + "' cannot be read as UTF-8 text: " + e.getMessage());
            return null;
        }
        String src = file.toString();
        double unit = 0;
        List<NkTable.Row> rows = new ArrayList<>();
        for (int k = 0; k < lines.size(); k++) {
            String line = lines.get(k).strip();
            int no = k + 1;
            if (line.isEmpty() || line.startsWith("#")) {
                continue;
            }
            String[] cells = line.split("\\s*,\\s*", -1);
            if (unit == 0) {
                String header = String.join(",", cells).toLowerCase(Locale.ROOT);
                if (header.equals("wavelength_nm,n,k")) {
                    unit = 1e-9;
                } else if (header.equals("wavelength_um,n,k")) {
                    unit = 1e-6;
                } else {
                    ctx.error(new SourcePosition(src, no, 1), path, "expected the header 'wavelength_nm,n,k' (or "
                            + "'wavelength_um,n,k') as the first line that is not a comment, got '" + shorten(line) + "'");
                    return null;
                }
                continue;
            }
            if (cells.length != 3) {
                ctx.error(new SourcePosition(src, no, 1), path, String.format("expected 3 numbers (wavelength, n, k) separated "
                        + "by commas, got %d field%s: '%s'", cells.length, cells.length == 1 ? "" : "s", shorten(line)));
                return null;
            }
            double[] x = new double[3];
            String[] names = {unit == 1e-9 ? "wavelength_nm" : "wavelength_um", "n", "k"};
            for (int c = 0; c < 3; c++) {
                try {
                    x[c] = Double.parseDouble(cells[c]);
                } catch (NumberFormatException e) {
                    x[c] = Double.NaN;
                }
                if (!Double.isFinite(x[c])) {
                    ctx.error(new SourcePosition(src, no, column(lines.get(k), c)), path, String.format(
                            "column %s: '%s' is not a finite number", names[c], shorten(cells[c])));
                    return null;
                }
            }
            rows.add(new NkTable.Row(x[0] * unit, x[1], x[2], no));
        }
        if (unit == 0) {
            ctx.error(new SourcePosition(src, Math.max(1, lines.size()), 1), path, "the file has no header and no rows; "
                    + "expected the header 'wavelength_nm,n,k' and at least " + NkTable.MIN_ROWS + " rows");
            return null;
        }
        try {
            return new NkTable(shown, rows);
        } catch (MaterialDataException e) {
            int line = e.line() > 0 ? e.line() : Math.max(1, lines.size());
            ctx.error(new SourcePosition(src, line, 1), path, e.getMessage());
            return null;
        }
    }

    private MaterialSpec fit(String name, NkTable table, WavelengthBand band, double tolerance, String src, SourcePosition at,
            String path, SourcePosition definedAt) {
        WavelengthBand span = table.span();
        if (!span.contains(band)) {
            ctx.error(at, path, String.format("the table '%s' covers %s but the run's band is %s; give rows over the whole band",
                    table.name(), span, band));
            return null;
        }
        WavelengthBand fitBand = widened(table, band);
        PoleFit.Result r;
        try {
            r = PoleFit.fit(name, table, fitBand, tolerance);
        } catch (PoleFit.RefusedException e) {
            StringBuilder where = new StringBuilder();
            for (PoleFit.RowError f : e.failures()) {
                where.append(where.length() == 0 ? "" : ", ").append(String.format(Locale.ROOT, "%.4g nm (line %d: error %.3g)",
                        f.row().wavelength() * 1e9, f.row().line(), f.error()));
            }
            ctx.error(at, path, String.format(Locale.ROOT, "no passive Drude-Lorentz model with up to %d Lorentz terms fits "
                    + "'%s' over %s within the tolerance %.3g (relative error of ε; best worst error %.3g); it fails at %s; "
                    + "check those rows, narrow the run's band or raise fit_tolerance", PoleFit.MAX_LORENTZ, table.name(), fitBand,
                    tolerance, e.worstError(), where));
            return null;
        } catch (IllegalArgumentException e) {
            ctx.error(at, path, e.getMessage());
            return null;
        }
        ctx.note(at, path, String.format(Locale.ROOT, "%s: fitted %d Drude and %d Lorentz terms to the %d rows of '%s' over %s; "
                + "worst relative error of ε %.3g at %.4g nm (tolerance %.3g)", name, r.material().drude().size(),
                r.material().lorentz().size(), table.rowsIn(fitBand).size(), table.name(), fitBand, r.worstError(),
                r.worst().row().wavelength() * 1e9, tolerance));
        SourcedMaterial m = r.sourced(name, "n, k table " + src);
        return new MaterialSpec(name, new Value(r.material().epsInfinity(), definedAt), new Value(r.material().conductivity(),
                definedAt), Optional.empty(), definedAt, Optional.of(new MetalSpec(new SourcedMaterial(name,
                r.material().withName(name), m.citation(), m.fittedTo(), m.validity(), m.notes()), MetalSpec.Kind.TABLE)));
    }

    /**
     * The band fitted: the run's band out to the table rows at or beyond each end, then one row more on each
     * side (as the table allows) until at least {@link NkTable#MIN_ROWS} rows lie in it.
     */
    static WavelengthBand widened(NkTable table, WavelengthBand band) {
        List<Double> wl = new ArrayList<>();
        for (NkTable.Row r : table.rows()) {
            wl.add(r.wavelength());
        }
        wl.sort(Double::compare);
        int lo = 0;
        while (lo + 1 < wl.size() && wl.get(lo + 1) <= band.shortest()) {
            lo++;
        }
        int hi = wl.size() - 1;
        while (hi - 1 >= 0 && wl.get(hi - 1) >= band.longest()) {
            hi--;
        }
        while (hi - lo + 1 < NkTable.MIN_ROWS && (lo > 0 || hi < wl.size() - 1)) {
            if (lo > 0) {
                lo--;
            }
            if (hi - lo + 1 < NkTable.MIN_ROWS && hi < wl.size() - 1) {
                hi++;
            }
        }
        return new WavelengthBand(wl.get(lo), wl.get(hi));
    }

    /** 1-based column of field {@code c} of a comma-separated line. */
    private static int column(String line, int c) {
        int col = 0;
        for (int k = 0; k < c; k++) {
            col = line.indexOf(',', col) + 1;
        }
        while (col < line.length() && Character.isWhitespace(line.charAt(col))) {
            col++;
        }
        return col + 1;
    }

    private static String shorten(String s) {
        return s.length() > 60 ? s.substring(0, 57) + "..." : s;
    }
}
