package org.evanesce.io.run;

import java.io.IOException;
import java.nio.file.Path;
import java.util.Locale;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.io.output.RunFolder;
import org.evanesce.io.output.image.LinePlot;

/**
 * Writes a case's surface results: surfaces.csv; per far-field contour farfield-NAME.csv with a polar plot
 * (farfield-NAME-polar.png: each wavelength's pattern over its own peak, as the distance from the centre) and a
 * plot in dB against angle (farfield-NAME-db.png); per exit spectrum exit-NAME.csv and exit-NAME-db.png.
 */
public final class SurfaceOutputs {

    /** The dB plots show this many decibels below each curve's peak. */
    static final double DB_RANGE = 40;
    /** Points on the polar plot's guide circles. */
    private static final int CIRCLE_POINTS = 181;

    private SurfaceOutputs() {
    }

    public static void write(SurfaceResults r, RunFolder rf) throws IOException {
        rf.writeText("surfaces.csv", r.csv());
        Path dir = rf.dir();
        double[] f = r.plan().frequencies();
        for (SurfaceResults.Pattern p : r.farFields()) {
            rf.writeText("farfield-" + p.name() + ".csv", r.patternCsv(p));
            LinePlot.Builder polar = LinePlot.builder().title("far field " + p.name() + (p.widths() ? ": scattering width / peak"
                    : ": power per radian / peak"))
                    .xTitle("x").yTitle("y").xRange(-1.1, 1.1).yRange(-1.1, 1.1).plotSize(520, 520);
            for (double radius : new double[] {0.5, 1.0}) {
                double[] cx = new double[CIRCLE_POINTS];
                double[] cy = new double[CIRCLE_POINTS];
                for (int k = 0; k < CIRCLE_POINTS; k++) {
                    double a = 2 * Math.PI * k / (CIRCLE_POINTS - 1);
                    cx[k] = radius * Math.cos(a);
                    cy[k] = radius * Math.sin(a);
                }
                polar.series(radius == 1 ? "peak" : "half peak", cx, cy, LinePlot.Style.LINES, 0xB8B8B8);
            }
            LinePlot.Builder db = LinePlot.builder().title("far field " + p.name() + " (dB below each peak)")
                    .xTitle("angle from +x (deg)").yTitle(p.widths() ? "scattering width (dB)" : "power per radian (dB)").xRange(0, 360).yRange(-DB_RANGE, 1);
            int n = p.anglesDegrees().length;
            for (int q = 0; q < f.length; q++) {
                double peak = peak(p.values()[q]);
                double[] x = new double[n + 1];
                double[] y = new double[n + 1];
                double[] a = new double[n + 1];
                double[] d = new double[n + 1];
                for (int k = 0; k <= n; k++) {
                    double v = p.values()[q][k % n] / peak;
                    double ang = Math.toRadians(k == n ? 360 : p.anglesDegrees()[k]);
                    x[k] = v * Math.cos(ang);
                    y[k] = v * Math.sin(ang);
                    a[k] = Math.toDegrees(ang);
                    d[k] = Math.max(-DB_RANGE, 10 * Math.log10(Math.max(v, 1e-300)));
                }
                String name = wavelength(f[q]);
                polar.series(name, x, y, LinePlot.Style.LINES, LinePlot.PALETTE.get(q % LinePlot.PALETTE.size()));
                db.series(name, a, d, LinePlot.Style.LINES, LinePlot.PALETTE.get(q % LinePlot.PALETTE.size()));
            }
            polar.build().writePng(dir.resolve("farfield-" + p.name() + "-polar.png"));
            db.build().writePng(dir.resolve("farfield-" + p.name() + "-db.png"));
        }
        for (SurfaceResults.Spectrum s : r.exits()) {
            rf.writeText("exit-" + s.name() + ".csv", r.spectrumCsv(s));
            LinePlot.Builder db = LinePlot.builder().title("exit spectrum " + s.name() + " (dB below each peak)")
                    .xTitle("angle from the exit normal in the exit medium (deg)")
                    .yTitle(s.orders() ? "power of each order (dB)" : "power per radian (dB)")
                    .xRange(-90, 90).yRange(-DB_RANGE, 1);
            for (int q = 0; q < f.length; q++) {
                double[] a = s.anglesDegrees().get(q);
                double[] v = s.perRadian().get(q);
                double peak = peak(v);
                double[] d = new double[v.length];
                for (int k = 0; k < v.length; k++) {
                    d[k] = Math.max(-DB_RANGE, 10 * Math.log10(Math.max(v[k] / peak, 1e-300)));
                }
                db.series(wavelength(f[q]), a, d, s.orders() ? LinePlot.Style.MARKERS : LinePlot.Style.LINES,
                        LinePlot.PALETTE.get(q % LinePlot.PALETTE.size()));
            }
            db.build().writePng(dir.resolve("exit-" + s.name() + "-db.png"));
        }
    }

    private static double peak(double[] v) {
        double m = 0;
        for (double x : v) {
            m = Math.max(m, Math.abs(x));
        }
        return m > 0 ? m : 1;
    }

    private static String wavelength(double f) {
        return String.format(Locale.ROOT, "%.1f nm", PhysicalConstants.C0 / f * 1e9);
    }
}
