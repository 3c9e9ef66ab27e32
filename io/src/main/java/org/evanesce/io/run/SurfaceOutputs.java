package org.evanesce.io.run;

import java.io.IOException;
import java.nio.file.Path;
import java.util.Locale;
import org.evanesce.geometry.FieldSite;
import org.evanesce.geometry.MaterialGrid;
import org.evanesce.geometry.PhysicalConstants;
import org.evanesce.io.output.RunFolder;
import org.evanesce.io.output.image.LinePlot;
import org.evanesce.io.output.image.OutlineInset;
import org.evanesce.io.plan.CasePlan;
import org.evanesce.io.plan.SurfacePlan;
import org.evanesce.solver.grid.Polarization;

/**
 * Writes a case's surface results: surfaces.csv; per far-field contour farfield-NAME.csv with a polar plot
 * (farfield-NAME-polar.png: each wavelength's pattern over its own peak, as the distance from the centre) and a
 * plot in dB against angle (farfield-NAME-db.png), each with the scene round the contour drawn beside it (material
 * outlines, the contour dashed); per exit spectrum exit-NAME.csv and exit-NAME-db.png.
 */
public final class SurfaceOutputs {

    /** The dB plots show this many decibels below each curve's peak. */
    static final double DB_RANGE = 40;
    /** The scene drawn beside a far-field plot reaches this fraction of the contour's size beyond it on each side. */
    static final double INSET_MARGIN = 0.25;
    /** Points on the polar plot's guide circles. */
    private static final int CIRCLE_POINTS = 181;

    private SurfaceOutputs() {
    }

    /**
     * @param plan the case's plan: its material grid gives the scene drawn beside each far-field plot (the contour's
     *             surroundings with their material outlines, the contour dashed)
     */
    public static void write(SurfaceResults r, RunFolder rf, CasePlan plan) throws IOException {
        rf.writeText("surfaces.csv", r.csv());
        Path dir = rf.dir();
        double[] f = r.plan().frequencies();
        for (int c = 0; c < r.farFields().size(); c++) {
            SurfaceResults.Pattern p = r.farFields().get(c);
            OutlineInset inset = inset(plan, r.plan(), r.plan().farFields().get(c));
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
            inset.writeBeside(polar.build(), dir.resolve("farfield-" + p.name() + "-polar.png"));
            inset.writeBeside(db.build(), dir.resolve("farfield-" + p.name() + "-db.png"));
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

    /** The scene round a contour: the contour and a margin of {@link #INSET_MARGIN} of its size on each side. */
    static OutlineInset inset(CasePlan plan, SurfacePlan sp, SurfacePlan.FarField f) {
        double dx = sp.cellSize();
        double margin = INSET_MARGIN * Math.max(f.right() - f.left(), f.top() - f.bottom());
        int nx = plan.grid().nx();
        int ny = plan.grid().ny();
        int i0 = Math.max(0, (int) Math.floor((f.left() - margin - sp.gridX0()) / dx));
        int j0 = Math.max(0, (int) Math.floor((f.bottom() - margin - sp.gridY0()) / dx));
        int i1 = Math.min(nx, (int) Math.ceil((f.right() + margin - sp.gridX0()) / dx) + 1);
        int j1 = Math.min(ny, (int) Math.ceil((f.top() + margin - sp.gridY0()) / dx) + 1);
        // only the cells under the drawing's pixels are read (FieldOutputs.ids's material site)
        FieldSite site = plan.spec().polarization().value() == Polarization.S ? FieldSite.EZ : FieldSite.EX;
        MaterialGrid m = plan.materials();
        int ci = i0;
        int cj = j0;
        double x0 = sp.gridX0() + i0 * dx;
        double y0 = sp.gridY0() + j0 * dx;
        double[] mark = {(f.left() - x0) / dx, (f.bottom() - y0) / dx, (f.right() - x0) / dx, (f.top() - y0) / dx};
        return new OutlineInset((i, j) -> m.id(site, ci + i, cj + j), i1 - i0, j1 - j0, mark, "scene, contour dashed");
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
