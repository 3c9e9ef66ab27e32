package org.evanesce.geometry.dispersion;

import java.util.ArrayList;
import java.util.List;
import org.evanesce.geometry.Complex;

/**
 * A validated table of measured complex indices n + iκ against vacuum wavelength, each row with the
 * source line it came from. Rows are kept in the given order, which must be strictly monotonic in
 * wavelength (increasing, or decreasing as in tables by photon energy).
 *
 * @param name a label for messages (e.g. the file name)
 * @param rows the rows (copied)
 */
public record NkTable(String name, List<Row> rows) {

    /** Fewest rows a table may have: the smallest model fitted (ε∞ + one Drude term) has 3 parameters. */
    public static final int MIN_ROWS = 4;

    /**
     * One measurement.
     *
     * @param wavelength vacuum wavelength in metres
     * @param n          real part of the index
     * @param k          extinction coefficient κ (≥ 0 in a passive medium, exp(−iωt))
     * @param line       source line (1-based), for messages
     */
    public record Row(double wavelength, double n, double k, int line) {

        /** ε = (n + iκ)². */
        public Complex permittivity() {
            return new Complex(n, k).square();
        }

        public double omega() {
            return Spectral.omegaOfWavelength(wavelength);
        }
    }

    /**
     * Checks every row and the order.
     *
     * @throws MaterialDataException naming the first row at fault: a wavelength not finite and
     *         positive, n or κ not finite, κ &lt; 0 (gain, not a passive material), n &lt; 0, n and κ
     *         both zero, wavelengths out of order or repeated, or fewer than {@link #MIN_ROWS} rows
     */
    public NkTable {
        if (name == null || name.isBlank()) {
            throw new IllegalArgumentException("table name must not be blank");
        }
        rows = List.copyOf(rows);
        for (Row r : rows) {
            if (!(r.wavelength() > 0) || Double.isInfinite(r.wavelength())) {
                throw new MaterialDataException(r.line(), "wavelength", String.format(
                        "%s, line %d: wavelength %g m must be finite and > 0", name, r.line(), r.wavelength()));
            }
            if (!Double.isFinite(r.n()) || r.n() < 0) {
                throw new MaterialDataException(r.line(), "n", String.format(
                        "%s, line %d: n = %g must be finite and >= 0", name, r.line(), r.n()));
            }
            if (!Double.isFinite(r.k()) || r.k() < 0) {
                throw new MaterialDataException(r.line(), "k", String.format(
                        "%s, line %d: k = %g must be finite and >= 0 (k < 0 is gain, not a passive material)",
                        name, r.line(), r.k()));
            }
            if (r.n() == 0 && r.k() == 0) {
                throw new MaterialDataException(r.line(), "n", String.format(
                        "%s, line %d: n and k are both 0, which is no material", name, r.line()));
            }
        }
        if (rows.size() < MIN_ROWS) {
            int line = rows.isEmpty() ? 0 : rows.get(rows.size() - 1).line();
            throw new MaterialDataException(line, "", String.format(
                    "%s: %d rows, at least %d are needed to fit a model", name, rows.size(), MIN_ROWS));
        }
        boolean increasing = rows.get(1).wavelength() > rows.get(0).wavelength();
        for (int i = 1; i < rows.size(); i++) {
            Row a = rows.get(i - 1);
            Row b = rows.get(i);
            boolean ok = increasing ? b.wavelength() > a.wavelength() : b.wavelength() < a.wavelength();
            if (!ok) {
                String what = b.wavelength() == a.wavelength() ? "repeats the wavelength of line " + a.line()
                        : "is out of order (the table's wavelengths " + (increasing ? "increase" : "decrease")
                                + " before it)";
                throw new MaterialDataException(b.line(), "wavelength", String.format(
                        "%s, line %d: wavelength %g m %s; rows must be strictly increasing or strictly decreasing"
                                + " in wavelength", name, b.line(), b.wavelength(), what));
            }
        }
    }

    /** The rows whose wavelength lies in the band, in the table's order. */
    public List<Row> rowsIn(WavelengthBand band) {
        List<Row> out = new ArrayList<>();
        for (Row r : rows) {
            if (band.contains(r.wavelength())) {
                out.add(r);
            }
        }
        return out;
    }

    /** The band from the shortest to the longest wavelength of the table. */
    public WavelengthBand span() {
        double a = rows.get(0).wavelength();
        double b = rows.get(rows.size() - 1).wavelength();
        return new WavelengthBand(Math.min(a, b), Math.max(a, b));
    }
}
