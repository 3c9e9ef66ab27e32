package org.evanesce.io;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/** Reads what an example's run wrote (probes.csv, flux.csv, run.json) for {@link ExamplePhysicsTest}. */
final class ExampleOutputs {

    private ExampleOutputs() {
    }

    /** One probe's samples: times in seconds and values. */
    record Probe(String name, double[] time, double[] value) {

        /** Largest |value|. */
        double peak() {
            double m = 0;
            for (double v : value) {
                m = Math.max(m, Math.abs(v));
            }
            return m;
        }

        /** Sum of the squared values (proportional to the pulse's energy at the probe; the time step is common). */
        double energy() {
            double e = 0;
            for (double v : value) {
                e += v * v;
            }
            return e;
        }

        /** The first sample time at which |value| reaches {@code fraction} of the peak. */
        double onset(double fraction) {
            double level = fraction * peak();
            for (int n = 0; n < time.length; n++) {
                if (Math.abs(value[n]) >= level) {
                    return time[n];
                }
            }
            return Double.NaN;
        }

        /** |Σ value(t) exp(2πi f t)|: the magnitude of the (unscaled) Fourier transform at frequency f. */
        double spectrum(double frequency) {
            return spectrum(frequency, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY);
        }

        /** As {@link #spectrum(double)}, over the samples with from &lt; t ≤ to only. */
        double spectrum(double frequency, double from, double to) {
            double re = 0;
            double im = 0;
            for (int n = 0; n < time.length; n++) {
                if (time[n] <= from || time[n] > to) {
                    continue;
                }
                double phase = 2 * Math.PI * frequency * time[n];
                re += value[n] * Math.cos(phase);
                im += value[n] * Math.sin(phase);
            }
            return Math.hypot(re, im);
        }
    }

    /** The probe {@code name} of a run's probes.csv (columns "NAME time (s)", "NAME COMP (...)"). */
    static Probe probe(Path out, String name) throws IOException {
        List<String> lines = Files.readAllLines(out.resolve("probes.csv"));
        String[] head = lines.get(0).split(",");
        int col = -1;
        for (int c = 0; c < head.length; c++) {
            if (head[c].equals(name + " time (s)")) {
                col = c;
            }
        }
        assertTrue(col >= 0, "no probe '" + name + "' in " + out.resolve("probes.csv") + ": " + lines.get(0));
        List<double[]> rows = new ArrayList<>();
        for (String line : lines.subList(1, lines.size())) {
            String[] cells = line.split(",");
            rows.add(new double[] {Double.parseDouble(cells[col]), Double.parseDouble(cells[col + 1])});
        }
        double[] t = new double[rows.size()];
        double[] v = new double[rows.size()];
        for (int n = 0; n < t.length; n++) {
            t[n] = rows.get(n)[0];
            v[n] = rows.get(n)[1];
        }
        return new Probe(name, t, v);
    }

    /** The value of {@code column} in the flux.csv row of the given wavelength (nm, to 1e-6). */
    static double flux(Path out, double wavelengthNm, String column) throws IOException {
        return table(out, "flux.csv", wavelengthNm, column);
    }

    /** The value of {@code column} in the surfaces.csv row of the given wavelength (nm, to 1e-6). */
    static double surfaces(Path out, double wavelengthNm, String column) throws IOException {
        return table(out, "surfaces.csv", wavelengthNm, column);
    }

    /** A table whose first column is the wavelength in nm: the value of {@code column} in the given row. */
    private static double table(Path out, String file, double wavelengthNm, String column) throws IOException {
        List<String> lines = Files.readAllLines(out.resolve(file)).stream().filter(l -> !l.isBlank()).toList();
        List<String> head = List.of(lines.get(0).split(",", -1));
        int c = head.indexOf(column);
        assertTrue(c >= 0, "no column " + column + " in " + out.resolve(file) + ": " + head);
        for (String line : lines.subList(1, lines.size())) {
            String[] cells = line.split(",", -1);
            if (Math.abs(Double.parseDouble(cells[0]) - wavelengthNm) < 1e-6) {
                return Double.parseDouble(cells[c]);
            }
        }
        throw new AssertionError("no row for " + wavelengthNm + " nm in " + out.resolve(file));
    }

    /**
     * Where run.json says a probe ({@code "name": NAME ... "site_m": [x, y]}) or the first source's first
     * site ({@code "first_site_m": [x, y]}) lies on the grid, in metres.
     */
    static double[] site(Path out, String probeName) throws IOException {
        String json = Files.readString(out.resolve("run.json"));
        String pattern = probeName == null
                ? "\"first_site_m\":\\s*\\[([^,\\]]+),\\s*([^\\]]+)\\]"
                : "\"name\":\\s*\"" + Pattern.quote(probeName) + "\"[^}]*?\"site_m\":\\s*\\[([^,\\]]+),\\s*([^\\]]+)\\]";
        Matcher m = Pattern.compile(pattern).matcher(json);
        assertTrue(m.find(), "no site for " + (probeName == null ? "the source" : probeName) + " in run.json");
        return new double[] {Double.parseDouble(m.group(1).trim()), Double.parseDouble(m.group(2).trim())};
    }
}
