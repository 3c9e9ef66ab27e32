package org.evanesce.io.run;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import org.evanesce.io.output.image.LinePlot;

/**
 * {@code flux.png}: the run's R, T and A against wavelength (nm), the simulated values as markers and,
 * where flux.csv has them, the exact values as a line in the same colour: {@code X_beam} for a Gaussian
 * beam (the angular-spectrum value the difference is taken against), else {@code X_exact} (transfer
 * matrix). With a single wavelength the exact value is drawn as a marker too. The numbers are those
 * of {@link FluxResults}, so the plot and flux.csv agree.
 */
public final class FluxPlot {

    /** The file name in the results folder. */
    public static final String FILE = "flux.png";

    private FluxPlot() {
    }

    /** The value columns plotted: each transmitted (T_) and reflected (R_) line and A, in flux.csv order. */
    static List<String> plotted(List<String> columns) {
        return columns.stream().filter(c -> (c.startsWith("T_") || c.startsWith("R_") || c.equals("A"))
                && !c.endsWith("_exact") && !c.endsWith("_diff") && !c.endsWith("_beam") && !c.endsWith("_plane_wave")).toList();
    }

    /** The exact column drawn beside value column {@code c}: {@code c_beam}, else {@code c_exact}; null when neither. */
    public static String exactColumn(List<String> columns, String c) {
        return columns.contains(c + "_beam") ? c + "_beam" : columns.contains(c + "_exact") ? c + "_exact" : null;
    }

    /** The plot, or null when the table has no R, T or A column. */
    static LinePlot plot(FluxResults r, String title) {
        List<String> values = plotted(r.columns());
        if (values.isEmpty() || r.rows().isEmpty()) {
            return null;
        }
        List<FluxResults.Row> rows = new ArrayList<>(r.rows());
        rows.sort(Comparator.comparingDouble(FluxResults.Row::wavelength));
        double[] x = rows.stream().mapToDouble(w -> w.wavelength() * 1e9).toArray();
        LinePlot.Builder b = LinePlot.builder()
                .title((title == null || title.isBlank() ? "flux" : title) + ": R, T, A against wavelength")
                .xTitle("wavelength (nm)").yTitle("flux / incident power");
        int colour = 0;
        for (String c : values) {
            int rgb = LinePlot.PALETTE.get(colour++ % LinePlot.PALETTE.size());
            b.series(c + " simulated", x, column(r, rows, c), LinePlot.Style.MARKERS, rgb);
            String exact = exactColumn(r.columns(), c);
            if (exact != null) {
                b.series(exact, x, column(r, rows, exact), x.length > 1 ? LinePlot.Style.LINES : LinePlot.Style.MARKERS, rgb);
            }
        }
        return b.build();
    }

    private static double[] column(FluxResults r, List<FluxResults.Row> rows, String c) {
        int at = r.columns().indexOf(c);
        return rows.stream().mapToDouble(w -> w.values()[at]).toArray();
    }

    /** Writes flux.png into the folder when there is something to plot; whether it did. */
    public static boolean write(FluxResults r, String title, Path dir) throws IOException {
        LinePlot p = plot(r, title);
        if (p == null) {
            return false;
        }
        p.writePng(dir.resolve(FILE));
        return true;
    }
}
