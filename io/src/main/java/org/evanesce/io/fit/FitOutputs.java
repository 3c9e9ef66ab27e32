package org.evanesce.io.fit;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.evanesce.io.casefile.expr.Units;
import org.evanesce.io.output.Json;
import org.evanesce.io.output.RunFolder;
import org.evanesce.io.output.image.LinePlot;

/** Writes a fit's results: fit.json (for programs), fit.csv (data, model, residual) and fit.png. */
final class FitOutputs {

    /** What the files say about the model, in words. */
    static final String MODEL = "transfer matrix: the plane-wave response of the case's layered stack (Born & Wolf, Principles "
            + "of Optics, 7th ed., section 1.6)";

    private FitOutputs() {
    }

    static void write(RunFolder rf, Path caseFile, MeasuredCurve curve, List<FreeParameter> free, CurveFit.Result r,
                      String caution) throws IOException {
        write(rf, caseFile, curve, free, r, caution, MODEL);
    }

    /** The same for a fit with the model {@code model} (in words). */
    static void write(RunFolder rf, Path caseFile, MeasuredCurve curve, List<FreeParameter> free, CurveFit.Result r,
                      String caution, String model) throws IOException {
        Map<String, Object> json = json(caseFile, curve, free, r, caution);
        json.put("model", model);
        rf.writeText("fit.json", Json.write(json));
        rf.writeText("fit.csv", csv(curve, r));
        LinePlot.writeStacked(rf.dir().resolve("fit.png"), plot(curve, r).toArray(LinePlot[]::new));
    }

    static Map<String, Object> json(Path caseFile, MeasuredCurve curve, List<FreeParameter> free, CurveFit.Result r,
                                    String caution) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("case", caseFile.toString());
        m.put("data", curve.file().toString());
        m.put("model", MODEL);
        m.put("measured", curve.measured().name());
        m.put("swept", curve.swept());
        m.put("swept_unit", curve.unit());
        m.put("points", curve.size());
        m.put("uncertainties_given", curve.u() != null);
        m.put("errors_scaled_by_reduced_chi_square", curve.u() == null);
        List<Object> params = new ArrayList<>();
        for (int k = 0; k < free.size(); k++) {
            FreeParameter f = free.get(k);
            Map<String, Object> p = new LinkedHashMap<>();
            p.put("name", f.name());
            p.put("value", r.values()[k]);
            p.put("standard_error", r.errors()[k]);
            p.put("si_unit", f.dimension().siUnit());
            p.put("low", f.low());
            p.put("high", f.high());
            p.put("shown", Units.format(r.values()[k], f.dimension()) + " ± " + Units.format(r.errors()[k], f.dimension()));
            params.add(p);
        }
        m.put("free", params);
        List<Object> corr = new ArrayList<>();
        for (double[] row : r.correlation()) {
            List<Object> l = new ArrayList<>();
            for (double v : row) {
                l.add(v);
            }
            corr.add(l);
        }
        m.put("correlation", corr);
        m.put("chi_square", r.chiSquare());
        m.put("degrees_of_freedom", r.dof());
        m.put("reduced_chi_square", r.reducedChiSquare());
        m.put("iterations", r.iterations());
        m.put("evaluations", r.evaluations());
        m.put("warnings", r.warnings());
        m.put("caution", caution);
        return m;
    }

    static String csv(MeasuredCurve curve, CurveFit.Result r) {
        StringBuilder sb = new StringBuilder();
        String x = curve.swept() + (curve.unit().isEmpty() ? "" : "_" + curve.unit());
        String y = curve.measured().name();
        sb.append(x).append(',').append(y).append(curve.u() != null ? ",u" : "").append(',').append(y).append("_model,residual")
                .append(curve.u() != null ? ",residual_over_u" : "").append('\n');
        for (int i = 0; i < curve.size(); i++) {
            double res = curve.y()[i] - r.model()[i];
            sb.append(num(curve.inFileUnit(i))).append(',').append(num(curve.y()[i]));
            if (curve.u() != null) {
                sb.append(',').append(num(curve.u()[i]));
            }
            sb.append(',').append(num(r.model()[i])).append(',').append(num(res));
            if (curve.u() != null) {
                sb.append(',').append(num(res / curve.u()[i]));
            }
            sb.append('\n');
        }
        return sb.toString();
    }

    private static List<LinePlot> plot(MeasuredCurve curve, CurveFit.Result r) {
        int n = curve.size();
        double[] x = new double[n];
        double[] res = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = curve.inFileUnit(i);
            res[i] = curve.y()[i] - r.model()[i];
        }
        double largest = 0;
        for (double v : res) {
            largest = Math.max(largest, Math.abs(v));
        }
        // residuals of a good fit are small: shown in thousandths so that the axis has readable ticks
        boolean milli = largest > 0 && largest < 0.05;
        if (milli) {
            for (int i = 0; i < n; i++) {
                res[i] *= 1e3;
            }
        }
        String xTitle = curve.swept() + (curve.unit().isEmpty() ? "" : " (" + curve.unit() + ")");
        String y = curve.measured().name();
        LinePlot top = LinePlot.builder().title("measured " + y + " and the fitted model (reduced chi-square "
                        + String.format(Locale.ROOT, "%.3g", r.reducedChiSquare()) + ")")
                .series("measured", x, curve.y(), LinePlot.Style.MARKERS)
                .series("model", x, r.model(), LinePlot.Style.LINES)
                .xTitle(xTitle).yTitle(y).plotSize(640, 360).build();
        LinePlot bottom = LinePlot.builder().title("residual: measured - model")
                .series("residual", x, res, LinePlot.Style.LINES_AND_MARKERS)
                .xTitle(xTitle).yTitle(y + " residual" + (milli ? " x 1000" : "")).plotSize(640, 160).build();
        return List.of(top, bottom);
    }

    private static String num(double v) {
        return String.format(Locale.ROOT, "%.9g", v);
    }
}
