package org.evanesce.io.fit;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.BasicFileAttributes;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.evanesce.io.casefile.CaseFileException;
import org.evanesce.io.casefile.CaseText;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Quantity;
import org.evanesce.io.casefile.expr.Units;

/**
 * A measured curve read from a CSV file: a header row naming the swept quantity with its unit
 * ({@code angle (deg)}, {@code wavelength (nm)} or a case parameter such as {@code gap (nm)}), the
 * measured quantity ({@code R} or {@code T}) and optionally {@code u}, the standard uncertainty of
 * each measured value; then one row per point. Lines starting with {@code #} and blank lines are
 * skipped. Every refusal names the file, line and column.
 *
 * @param file     where it was read
 * @param swept    the first column's name: {@code angle}, {@code wavelength} or a case parameter
 * @param unit     its unit as written (empty for a plain number)
 * @param scale    SI value of one {@code unit}
 * @param measured R or T
 * @param x        the swept values, SI (rad, m, or the parameter's unit)
 * @param y        the measured values
 * @param u        their standard uncertainties, or null when the file gives none
 * @param lines    the file's line number of each point
 */
public record MeasuredCurve(Path file, String swept, String unit, Quantity scale, Measured measured, double[] x,
                            double[] y, double[] u, int[] lines) {

    /** The largest data file read (a measured curve has at most some thousands of rows). */
    public static final int MAX_BYTES = 8 << 20;

    /** Which response the curve holds. */
    public enum Measured {
        R, T
    }

    private static final Pattern HEADER = Pattern.compile("\\s*([A-Za-z_][A-Za-z0-9_]*)\\s*(?:\\(\\s*([^)]*?)\\s*\\))?\\s*");

    public MeasuredCurve {
        x = x.clone();
        y = y.clone();
        u = u == null ? null : u.clone();
        lines = lines.clone();
    }

    /** Number of points. */
    public int size() {
        return x.length;
    }

    /** The swept value of point k in the unit the file used. */
    public double inFileUnit(int k) {
        return x[k] / scale.value();
    }

    /**
     * Reads and checks a curve file.
     *
     * @throws IOException   the file cannot be opened (missing, no permission)
     * @throws FitInputException what is wrong with it, with its line and column
     */
    public static MeasuredCurve read(Path file) throws IOException, FitInputException {
        String name = file.toString();
        BasicFileAttributes a = Files.readAttributes(file, BasicFileAttributes.class);
        if (!a.isRegularFile()) {
            throw new FitInputException(name + ": is not a regular file; give the path of a CSV file of measured values");
        }
        byte[] bytes;
        try (InputStream in = Files.newInputStream(file)) {
            bytes = in.readNBytes(MAX_BYTES + 1);
        }
        if (bytes.length > MAX_BYTES) {
            throw new FitInputException(String.format(Locale.ROOT, "%s: is more than %d bytes (%d MiB), the limit for a measured "
                    + "curve", name, MAX_BYTES, MAX_BYTES >> 20));
        }
        String text;
        try {
            text = CaseText.decode(bytes, name);
        } catch (CaseFileException e) {
            throw new FitInputException(e.diagnostics().get(0).toString());
        }
        return parse(file, text);
    }

    /** Parses the text of a curve file (see the class comment). */
    static MeasuredCurve parse(Path file, String text) throws FitInputException {
        String name = file.toString();
        String[] rows = text.split("\r?\n", -1);
        int headerLine = -1;
        String[] header = null;
        List<double[]> points = new ArrayList<>();
        List<Integer> at = new ArrayList<>();
        for (int n = 0; n < rows.length; n++) {
            String row = rows[n];
            if (row.isBlank() || row.stripLeading().startsWith("#")) {
                continue;
            }
            String[] cells = row.split(",", -1);
            if (header == null) {
                header = cells;
                headerLine = n + 1;
                if (cells.length < 2 || cells.length > 3) {
                    throw new FitInputException(String.format(Locale.ROOT, "%s:%d:1: the header has %d column(s); expected 2 or "
                            + "3: the swept quantity with its unit, R or T, and optionally u (e.g. 'angle (deg),R,u')", name,
                            n + 1, cells.length));
                }
                continue;
            }
            if (cells.length != header.length) {
                throw new FitInputException(String.format(Locale.ROOT, "%s:%d:1: the row has %d cell(s) but the header (line %d) "
                        + "has %d", name, n + 1, cells.length, headerLine, header.length));
            }
            double[] v = new double[cells.length];
            int column = 1;
            for (int c = 0; c < cells.length; c++) {
                String cell = cells[c].strip();
                try {
                    v[c] = Double.parseDouble(cell);
                } catch (NumberFormatException e) {
                    v[c] = Double.NaN;
                }
                if (!Double.isFinite(v[c]) || cell.isEmpty()) {
                    throw new FitInputException(String.format(Locale.ROOT, "%s:%d:%d: '%s' in column '%s' is not a finite number",
                            name, n + 1, column, shown(cell), header[c].strip()));
                }
                column += cells[c].length() + 1;
            }
            points.add(v);
            at.add(n + 1);
        }
        if (header == null) {
            throw new FitInputException(name + ": holds no header and no data; expected a header such as 'angle (deg),R' and "
                    + "one row per measured point");
        }
        Matcher m = HEADER.matcher(header[0]);
        if (!m.matches()) {
            throw new FitInputException(String.format(Locale.ROOT, "%s:%d:1: '%s' is not a swept quantity; expected a name with its "
                    + "unit in parentheses, e.g. 'angle (deg)', 'wavelength (nm)' or a case parameter such as 'gap (nm)'", name,
                    headerLine, shown(header[0].strip())));
        }
        String swept = m.group(1);
        String unit = m.group(2) == null ? "" : m.group(2);
        Quantity scale;
        if (unit.isEmpty()) {
            scale = Quantity.plain(1);
        } else if (Units.isUnit(unit)) {
            scale = Units.unit(unit);
        } else {
            throw new FitInputException(String.format(Locale.ROOT, "%s:%d:1: unknown unit '%s' in '%s'; expected one of %s", name,
                    headerLine, shown(unit), header[0].strip(), String.join(", ", Units.all().keySet())));
        }
        if (swept.equals("angle") && !scale.dimension().equals(Dimension.ANGLE)
                || swept.equals("wavelength") && !scale.dimension().equals(Dimension.LENGTH)) {
            throw new FitInputException(String.format(Locale.ROOT, "%s:%d:1: '%s' needs %s unit, got '%s'", name, headerLine,
                    swept, swept.equals("angle") ? "an angle (deg or rad)" : "a length (nm, um, ...)", unit));
        }
        Measured measured;
        String second = header[1].strip();
        try {
            measured = Measured.valueOf(second);
        } catch (IllegalArgumentException e) {
            throw new FitInputException(String.format(Locale.ROOT, "%s:%d:%d: the second column is '%s'; expected R (reflectance) or "
                    + "T (transmittance)", name, headerLine, header[0].length() + 2, shown(second)));
        }
        if (header.length == 3 && !header[2].strip().equals("u")) {
            throw new FitInputException(String.format(Locale.ROOT, "%s:%d:%d: the third column is '%s'; expected u (the standard "
                    + "uncertainty of each measured value)", name, headerLine, header[0].length() + header[1].length() + 3,
                    shown(header[2].strip())));
        }
        int n = points.size();
        double[] x = new double[n];
        double[] y = new double[n];
        double[] u = header.length == 3 ? new double[n] : null;
        int[] lines = new int[n];
        for (int k = 0; k < n; k++) {
            double[] v = points.get(k);
            x[k] = v[0] * scale.value();
            y[k] = v[1];
            lines[k] = at.get(k);
            int yColumn = rows[lines[k] - 1].indexOf(',') + 2;
            if (!(y[k] >= 0 && y[k] <= 1)) {
                throw new FitInputException(String.format(Locale.ROOT, "%s:%d:%d: %s = %s is outside [0, 1]; expected a fraction of "
                        + "the incident power (not percent)", name, lines[k], yColumn, measured, Units.number(y[k])));
            }
            if (u != null) {
                u[k] = v[2];
                if (!(u[k] > 0)) {
                    throw new FitInputException(String.format(Locale.ROOT, "%s:%d:%d: u = %s; a standard uncertainty must be positive",
                            name, lines[k], rows[lines[k] - 1].lastIndexOf(',') + 2, Units.number(u[k])));
                }
            }
            if (k >= 2 && Math.signum(x[k] - x[k - 1]) != Math.signum(x[1] - x[0]) || k == 1 && x[1] == x[0]) {
                throw new FitInputException(String.format(Locale.ROOT, "%s:%d:1: %s = %s breaks the order of the rows above (each "
                        + "row's %s must be %s than the last, as from line %d); expected a monotonic scan", name, lines[k], swept,
                        Units.number(v[0]), swept, x[1] > x[0] ? "larger" : "smaller", lines[0]));
            }
        }
        return new MeasuredCurve(file, swept, unit, scale, measured, x, y, u, lines);
    }

    private static String shown(String s) {
        return s.length() > 40 ? s.substring(0, 40) + "..." : s;
    }
}
