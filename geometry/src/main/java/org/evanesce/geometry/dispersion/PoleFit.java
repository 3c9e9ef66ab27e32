package org.evanesce.geometry.dispersion;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import org.evanesce.geometry.Complex;
import org.hipparchus.exception.MathIllegalStateException;
import org.hipparchus.linear.Array2DRowRealMatrix;
import org.hipparchus.linear.ArrayRealVector;
import org.hipparchus.linear.RealMatrix;
import org.hipparchus.linear.RealVector;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresBuilder;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresProblem;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LevenbergMarquardtOptimizer;
import org.hipparchus.util.Pair;

/**
 * Fits a passive Drude–Lorentz model (ε∞ ≥ 1, one Drude term, and as few Lorentz terms as needed,
 * at most {@link #MAX_LORENTZ}) to a table of measured n, κ over a band of wavelengths, and refuses
 * a fit whose worst error exceeds a tolerance, naming the wavelengths where it fails.
 *
 * <h2>Method</h2>
 * Constrained non-linear least squares (K. Levenberg 1944, D. W. Marquardt 1963; W. H. Press et al.,
 * <i>Numerical Recipes</i>, 3rd ed. (2007), ch. 15) with Hipparchus's Levenberg–Marquardt optimiser.
 * The residuals are (ε_model − ε_data)/|ε_data| (real and imaginary parts) at every row in the band.
 * The constraints ε∞ ≥ 1, ωp², γ, W, ω0 ≥ 0 hold by construction, by fitting u, a, b, c, d, e in
 * <pre>
 *     ε(x) = 1 + u² − a²/(x² + i b² x) + Σ c²/(d² − x² − i e² x),   x = ω/ω_s
 * </pre>
 * (ω_s the band's geometric-mean frequency): so every fitted model is passive and stable on the
 * grid at the vacuum Courant limit ({@link AdeCoefficients}). The model grows one Lorentz term at a
 * time, each new term started at several resonances (every few data frequencies, and beyond the
 * band on both sides) from the previous best, until the worst error meets the tolerance; each
 * candidate is then refined towards the smallest worst error by re-weighting the residuals
 * (C. L. Lawson's iteration for minimax approximation, 1961, as commonly practised: the weights are
 * multiplied by each row's error and the least-squares fit repeated). Vector fitting (B. Gustavsen
 * &amp; A. Semlyen, IEEE Trans. Power Deliv. 14, 1052 (1999)) was not used: its poles come with
 * complex residues, which are not Lorentz terms and would need another kind of auxiliary equation.
 *
 * <h2>Error measure</h2>
 * The error at a row is |ε_model − ε_data| / |ε_data|, the relative error of the complex
 * permittivity; the fit's error is its largest value over the rows in the band.
 */
public final class PoleFit {

    /** Most Lorentz terms a fit may use (each costs the engine 2 values per metal cell). */
    public static final int MAX_LORENTZ = 4;
    /** A default tolerance on the worst relative permittivity error. */
    public static final double DEFAULT_TOLERANCE = 0.05;

    private static final int REWEIGHTINGS = 8;
    /** Candidates per model size refined towards minimax. */
    private static final int REFINED = 2;
    private static final double[] EPS_INF_STARTS = {1.5, 4, 9};
    /** Evaluations allowed to one least-squares solve (a start that needs more is left where it got to). */
    private static final int MAX_EVALUATIONS = 1000;

    /** The error at one row of the table. */
    public record RowError(NkTable.Row row, Complex fitted, double error) {
    }

    /**
     * A fit that met its tolerance.
     *
     * @param material   the fitted model (passive; ε∞ ≥ 1)
     * @param band       the band fitted
     * @param tolerance  the tolerance it met
     * @param worstError the largest row error in the band
     * @param worst      the row where it occurs
     * @param errors     every row's error, in the table's order
     */
    public record Result(DispersiveMaterial material, WavelengthBand band, double tolerance, double worstError,
                         RowError worst, List<RowError> errors) {
        public Result {
            errors = List.copyOf(errors);
        }

        /** The fit with its provenance: fitted by this class to {@code data} (e.g. the table's file), valid over the band. */
        public SourcedMaterial sourced(String key, String data) {
            return new SourcedMaterial(key, material, "Drude-Lorentz model fitted by evanesce (PoleFit, "
                    + material.lorentz().size() + " Lorentz terms)", data, band, String.format(Locale.ROOT,
                    "worst relative error of epsilon over the band %.3g at %.4g nm (tolerance %.3g)", worstError,
                    worst.row().wavelength() * 1e9, tolerance));
        }
    }

    /** A fit refused because its worst error exceeds the tolerance; names the rows where it fails. */
    public static final class RefusedException extends IllegalArgumentException {

        private static final long serialVersionUID = 1L;

        private final transient List<RowError> failures;
        private final double worstError;

        RefusedException(String message, List<RowError> failures, double worstError) {
            super(message);
            this.failures = List.copyOf(failures);
            this.worstError = worstError;
        }

        /** The rows whose error exceeds the tolerance, in the table's order. */
        public List<RowError> failures() {
            return failures;
        }

        /** The best worst error reached. */
        public double worstError() {
            return worstError;
        }
    }

    private PoleFit() {
    }

    /**
     * Fits the rows of {@code table} inside {@code band}.
     *
     * @param name      the fitted material's name
     * @param tolerance largest accepted relative permittivity error, &gt; 0
     * @throws IllegalArgumentException if the band is not inside the table's span
     * @throws MaterialDataException    if fewer than {@link NkTable#MIN_ROWS} rows lie in the band
     * @throws RefusedException         if no model with up to {@link #MAX_LORENTZ} Lorentz terms meets
     *                                  the tolerance
     */
    public static Result fit(String name, NkTable table, WavelengthBand band, double tolerance) {
        if (!(tolerance > 0)) {
            throw new IllegalArgumentException(String.format("fit tolerance %g must be > 0", tolerance));
        }
        if (!table.span().contains(band)) {
            throw new IllegalArgumentException(String.format(
                    "%s: the band %s is not inside the table's wavelengths %s", table.name(), band, table.span()));
        }
        List<NkTable.Row> rows = table.rowsIn(band);
        if (rows.size() < NkTable.MIN_ROWS) {
            throw new MaterialDataException(0, "", String.format(
                    "%s: %d rows lie in the band %s, at least %d are needed to fit a model",
                    table.name(), rows.size(), band, NkTable.MIN_ROWS));
        }
        Problem pr = new Problem(rows);
        double[] best = null;
        double bestWorst = Double.POSITIVE_INFINITY;
        double[] previous = null;
        // no more parameters (3 + 3 per Lorentz term) than residuals (2 per row)
        int maxLorentz = Math.min(MAX_LORENTZ, (2 * rows.size() - 3) / 3);
        for (int nl = 0; nl <= maxLorentz; nl++) {
            // plain least squares from every start; the best few are then refined towards minimax
            List<double[]> fits = new ArrayList<>();
            for (double[] start : starts(pr, previous, nl)) {
                fits.add(pr.solve(start, pr.unitWeights()));
            }
            fits.sort((p, q) -> Double.compare(pr.worst(p), pr.worst(q)));
            double[] found = null;
            double foundWorst = Double.POSITIVE_INFINITY;
            for (double[] p0 : fits.subList(0, Math.min(REFINED, fits.size()))) {
                double[] p = pr.refine(p0);
                double w = pr.worst(p);
                if (w < foundWorst) {
                    foundWorst = w;
                    found = p;
                }
            }
            if (found == null) {
                break; // every start diverged; keep the best smaller model
            }
            previous = found;
            if (foundWorst < bestWorst) {
                bestWorst = foundWorst;
                best = found;
            }
            if (bestWorst <= tolerance) {
                break;
            }
        }
        if (best == null) {
            throw new RefusedException(String.format("%s: no finite Drude-Lorentz fit over the band %s",
                    table.name(), band), List.of(), Double.POSITIVE_INFINITY);
        }
        DispersiveMaterial m = pr.material(name, best);
        List<RowError> errors = new ArrayList<>();
        RowError worst = null;
        for (NkTable.Row r : rows) {
            Complex f = m.permittivity(r.omega());
            Complex d = r.permittivity();
            RowError e = new RowError(r, f, f.minus(d).abs() / d.abs());
            errors.add(e);
            if (worst == null || e.error() > worst.error()) {
                worst = e;
            }
        }
        if (worst.error() > tolerance) {
            List<RowError> failing = new ArrayList<>();
            StringBuilder where = new StringBuilder();
            for (RowError e : errors) {
                if (e.error() > tolerance) {
                    failing.add(e);
                    where.append(where.length() == 0 ? "" : ", ")
                            .append(String.format("%.4g nm (line %d: %.3g)", e.row().wavelength() * 1e9,
                                    e.row().line(), e.error()));
                }
            }
            throw new RefusedException(String.format(
                    "%s: no passive model with one Drude and up to %d Lorentz terms fits the band %s within %.3g"
                            + " (relative error of ε); the best fit misses at %s", table.name(), maxLorentz,
                    band, tolerance, where), failing, worst.error());
        }
        return new Result(m, band, tolerance, worst.error(), worst, errors);
    }

    /** Samples of a model that {@link #refit} fits. */
    public static final int REFIT_SAMPLES = 24;

    /**
     * A model with as few terms as the tolerance allows that follows {@code material} over a band:
     * the model sampled at {@link #REFIT_SAMPLES} frequencies spaced evenly across the band, fitted
     * like a measured table (errors relative to the original model). Rakić's metals have five
     * Lorentz terms for 0.1–6 eV; over a run's band one or two usually do, which cuts the engine's
     * state per metal cell (1 + N_D + 2 N_L values) and its memory traffic.
     */
    public static Result refit(DispersiveMaterial material, WavelengthBand band, double tolerance) {
        double wLow = Spectral.omegaOfWavelength(band.longest());
        double wHigh = Spectral.omegaOfWavelength(band.shortest());
        List<NkTable.Row> rows = new ArrayList<>();
        for (int i = 0; i < REFIT_SAMPLES; i++) {
            double lambda = i == 0 ? band.longest() : i == REFIT_SAMPLES - 1 ? band.shortest()
                    : Spectral.wavelengthOfOmega(wLow + (wHigh - wLow) * i / (REFIT_SAMPLES - 1));
            Complex n = material.permittivityAtWavelength(lambda).sqrtUpper();
            rows.add(new NkTable.Row(lambda, n.re(), n.im(), i + 1));
        }
        return fit(material.name(), new NkTable(material.name() + " (model sampled)", rows), band, tolerance);
    }

    /** Starting points for a model with nl Lorentz terms. */
    private static List<double[]> starts(Problem pr, double[] previous, int nl) {
        List<double[]> out = new ArrayList<>();
        if (nl == 0) {
            for (double einf : EPS_INF_STARTS) {
                out.add(pr.drudeStart(einf));
            }
            return out;
        }
        double[] resid = pr.residualIm(previous);
        int m = pr.x.length;
        List<Double> resonances = new ArrayList<>();
        int stride = Math.max(1, m / 6);
        for (int i = 0; i < m; i += stride) {
            resonances.add(pr.x[i]);
        }
        resonances.add(0.5 * pr.xMin);
        resonances.add(1.6 * pr.xMax);
        resonances.add(3 * pr.xMax);
        double scale = 0;
        for (double r : resid) {
            scale = Math.max(scale, Math.abs(r));
        }
        scale = Math.max(scale, 0.1);
        for (double x0 : resonances) {
            double gamma = 0.3 * x0;
            double[] p = Arrays.copyOf(previous, previous.length + 3);
            p[previous.length] = Math.sqrt(scale * gamma * x0);
            p[previous.length + 1] = x0;
            p[previous.length + 2] = Math.sqrt(gamma);
            out.add(p);
        }
        return out;
    }

    /** The least-squares problem over the rows of a band, in scaled frequency x = ω/ω_s. */
    private static final class Problem {
        final double omegaScale;
        final double[] x;
        final double[] dataRe;
        final double[] dataIm;
        final double[] norm;
        final double xMin;
        final double xMax;

        Problem(List<NkTable.Row> rows) {
            int m = rows.size();
            double lo = Double.POSITIVE_INFINITY;
            double hi = 0;
            for (NkTable.Row r : rows) {
                lo = Math.min(lo, r.omega());
                hi = Math.max(hi, r.omega());
            }
            omegaScale = Math.sqrt(lo * hi);
            x = new double[m];
            dataRe = new double[m];
            dataIm = new double[m];
            norm = new double[m];
            for (int i = 0; i < m; i++) {
                NkTable.Row r = rows.get(i);
                x[i] = r.omega() / omegaScale;
                Complex e = r.permittivity();
                dataRe[i] = e.re();
                dataIm[i] = e.im();
                norm[i] = e.abs();
            }
            xMin = lo / omegaScale;
            xMax = hi / omegaScale;
        }

        /** ε∞ = einf and a Drude term through the lowest-frequency row. */
        double[] drudeStart(double einf) {
            int i = 0;
            for (int k = 1; k < x.length; k++) {
                if (x[k] < x[i]) {
                    i = k;
                }
            }
            double u = einf - dataRe[i];
            double a2;
            double b2;
            if (u > 0) {
                b2 = x[i] * Math.max(dataIm[i], 0) / u;
                a2 = x[i] * x[i] * (u * u + dataIm[i] * dataIm[i]) / u;
            } else {
                a2 = 0.01;
                b2 = 0.1;
            }
            return new double[] {Math.sqrt(einf - 1), Math.sqrt(a2), Math.sqrt(Math.max(b2, 1e-4))};
        }

        /** ε of the model with parameters p at row i, and its derivatives into jRe/jIm (may be null). */
        double[] eval(double[] p, int i, double[] jRe, double[] jIm) {
            double xi = x[i];
            double u = p[0];
            double a = p[1];
            double b = p[2];
            double re = 1 + u * u;
            double im = 0;
            if (jRe != null) {
                jRe[0] = 2 * u;
                jIm[0] = 0;
            }
            // Drude: −a²/D, D = x² + i b² x
            double dr = xi * xi;
            double di = b * b * xi;
            double dd = dr * dr + di * di;
            // 1/D = (dr − i di)/dd
            double invRe = dr / dd;
            double invIm = -di / dd;
            re += -a * a * invRe;
            im += -a * a * invIm;
            if (jRe != null) {
                jRe[1] = -2 * a * invRe;
                jIm[1] = -2 * a * invIm;
                // ∂/∂b = a² (2 i b x)/D²
                double inv2Re = invRe * invRe - invIm * invIm;
                double inv2Im = 2 * invRe * invIm;
                double f = a * a * 2 * b * xi;
                jRe[2] = -f * inv2Im;
                jIm[2] = f * inv2Re;
            }
            int nl = (p.length - 3) / 3;
            for (int t = 0; t < nl; t++) {
                int o = 3 + 3 * t;
                double c = p[o];
                double d = p[o + 1];
                double e = p[o + 2];
                double lr = d * d - xi * xi;
                double li = -e * e * xi;
                double ll = lr * lr + li * li;
                double lInvRe = lr / ll;
                double lInvIm = -li / ll;
                re += c * c * lInvRe;
                im += c * c * lInvIm;
                if (jRe != null) {
                    jRe[o] = 2 * c * lInvRe;
                    jIm[o] = 2 * c * lInvIm;
                    double l2Re = lInvRe * lInvRe - lInvIm * lInvIm;
                    double l2Im = 2 * lInvRe * lInvIm;
                    // ∂/∂d = −c² 2d / L²
                    jRe[o + 1] = -c * c * 2 * d * l2Re;
                    jIm[o + 1] = -c * c * 2 * d * l2Im;
                    // ∂/∂e = c² (2 i e x) / L²
                    double f = c * c * 2 * e * xi;
                    jRe[o + 2] = -f * l2Im;
                    jIm[o + 2] = f * l2Re;
                }
            }
            return new double[] {re, im};
        }

        double[] errors(double[] p) {
            double[] err = new double[x.length];
            for (int i = 0; i < x.length; i++) {
                double[] v = eval(p, i, null, null);
                err[i] = Math.hypot(v[0] - dataRe[i], v[1] - dataIm[i]) / norm[i];
            }
            return err;
        }

        double worst(double[] p) {
            double w = 0;
            for (double e : errors(p)) {
                w = Math.max(w, e);
            }
            return Double.isNaN(w) ? Double.POSITIVE_INFINITY : w;
        }

        /** Im(ε_data − ε_model) at each row. */
        double[] residualIm(double[] p) {
            double[] r = new double[x.length];
            for (int i = 0; i < x.length; i++) {
                r[i] = dataIm[i] - eval(p, i, null, null)[1];
            }
            return r;
        }

        /** A least-squares fit from p0, then re-weighted fits towards the smallest worst error. */
        double[] unitWeights() {
            double[] w = new double[x.length];
            Arrays.fill(w, 1);
            return w;
        }

        /** Re-weighted least-squares fits from p0 (already a least-squares fit) towards the smallest worst error. */
        double[] refine(double[] p0) {
            double[] weights = unitWeights();
            double[] p = p0;
            double[] best = p;
            double bestWorst = worst(p);
            for (int it = 0; it < REWEIGHTINGS && Double.isFinite(bestWorst); it++) {
                double[] err = errors(p);
                double sum = 0;
                for (int i = 0; i < x.length; i++) {
                    weights[i] *= Math.max(err[i], 1e-12);
                    sum += weights[i];
                }
                for (int i = 0; i < x.length; i++) {
                    weights[i] *= x.length / sum;
                }
                p = solve(p, weights);
                double w = worst(p);
                if (w < bestWorst) {
                    bestWorst = w;
                    best = p;
                }
            }
            return best;
        }

        double[] solve(double[] p0, double[] weights) {
            int m = x.length;
            int np = p0.length;
            // the best point evaluated, kept in case the optimiser stops at its evaluation limit
            double[] bestSeen = p0.clone();
            double[] bestCost = {Double.POSITIVE_INFINITY};
            LeastSquaresProblem problem = new LeastSquaresBuilder()
                    .start(p0)
                    .target(new double[2 * m])
                    .model(point -> {
                        double[] p = point.toArray();
                        double[] value = new double[2 * m];
                        double[][] jac = new double[2 * m][np];
                        double[] jr = new double[np];
                        double[] ji = new double[np];
                        for (int i = 0; i < m; i++) {
                            double s = Math.sqrt(weights[i]) / norm[i];
                            double[] v = eval(p, i, jr, ji);
                            value[2 * i] = s * (v[0] - dataRe[i]);
                            value[2 * i + 1] = s * (v[1] - dataIm[i]);
                            for (int q = 0; q < np; q++) {
                                jac[2 * i][q] = s * jr[q];
                                jac[2 * i + 1][q] = s * ji[q];
                            }
                        }
                        double cost = 0;
                        for (double v : value) {
                            cost += v * v;
                        }
                        if (cost < bestCost[0]) {
                            bestCost[0] = cost;
                            System.arraycopy(p, 0, bestSeen, 0, np);
                        }
                        return new Pair<RealVector, RealMatrix>(new ArrayRealVector(value, false),
                                new Array2DRowRealMatrix(jac, false));
                    })
                    .maxEvaluations(MAX_EVALUATIONS)
                    .maxIterations(MAX_EVALUATIONS)
                    .build();
            try {
                return new LevenbergMarquardtOptimizer().optimize(problem).getPoint().toArray();
            } catch (MathIllegalStateException e) {
                // no convergence within the limit: the best point reached is judged like any other
                return bestSeen;
            }
        }

        DispersiveMaterial material(String name, double[] p) {
            double ws = omegaScale;
            List<DrudeTerm> drude = List.of(new DrudeTerm(Math.abs(p[1]) * ws, p[2] * p[2] * ws));
            List<LorentzTerm> lorentz = new ArrayList<>();
            for (int o = 3; o < p.length; o += 3) {
                lorentz.add(new LorentzTerm(p[o] * p[o] * ws * ws, Math.abs(p[o + 1]) * ws, p[o + 2] * p[o + 2] * ws));
            }
            return new DispersiveMaterial(name, 1 + p[0] * p[0], 0, drude, lorentz);
        }
    }
}
