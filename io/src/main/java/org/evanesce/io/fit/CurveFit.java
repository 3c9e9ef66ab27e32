package org.evanesce.io.fit;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.evanesce.io.casefile.expr.Units;
import org.hipparchus.exception.MathIllegalArgumentException;
import org.hipparchus.exception.MathIllegalStateException;
import org.hipparchus.linear.Array2DRowRealMatrix;
import org.hipparchus.linear.ArrayRealVector;
import org.hipparchus.linear.RealMatrix;
import org.hipparchus.linear.RealVector;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresBuilder;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresOptimizer;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresProblem;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LevenbergMarquardtOptimizer;
import org.hipparchus.util.Pair;

/**
 * Least-squares fit of the model to a measured curve with Hipparchus's Levenberg–Marquardt optimiser
 * (K. Levenberg 1944; D. W. Marquardt 1963; W. H. Press et al., <i>Numerical Recipes</i>, 3rd ed.
 * (2007), §15.5). The optimiser works on each parameter mapped onto [0, 1] between its bounds (so
 * that a gap in metres and a detector's gain are equally scaled) and clamped there; derivatives are
 * central differences of 1e-6 of the bounds' span. Residuals are weighted by 1/u where the curve
 * gives standard uncertainties. The covariance is (JᵀJ)⁻¹ at the optimum (Press et al. §15.5.2),
 * scaled by the reduced χ² when the curve has no uncertainties (they are then estimated from the
 * scatter).
 */
final class CurveFit {

    /** Step of the central differences, in units of the bounds' span. */
    static final double STEP = 1e-6;
    /** Correlations above this (in magnitude) are reported as parameters the data cannot tell apart (common practice). */
    static final double TOO_CORRELATED = 0.95;
    /** A value this close to a bound, in units of the span, is reported as sitting on it. */
    static final double ON_BOUND = 1e-4;
    /** Evaluations of the model (each one point set with its derivatives) before the fit gives up. */
    static final int MAX_EVALUATIONS = 400;

    /**
     * What the fit found.
     *
     * @param values      best values, SI
     * @param errors      their standard errors, SI (NaN where the covariance is singular)
     * @param correlation the correlation matrix
     * @param model       the model at the best values, per point
     * @param chiSquare   Σ((data − model)/u)², or Σ(data − model)² without uncertainties
     * @param dof         points − free parameters
     * @param iterations  of the optimiser
     * @param evaluations of the model with its derivatives
     * @param warnings    what the reader must know about the result
     */
    record Result(double[] values, double[] errors, double[][] correlation, double[] model, double chiSquare, int dof,
                  int iterations, int evaluations, List<String> warnings) {

        double reducedChiSquare() {
            return chiSquare / dof;
        }
    }

    private CurveFit() {
    }

    /** Refuses a fit that cannot start: too few points, or a starting value outside its bounds. */
    static double[] check(FitModel model, MeasuredCurve curve, List<FreeParameter> free) throws IOException, FitInputException {
        int n = curve.size();
        int np = free.size();
        if (n <= np) {
            throw new FitInputException(String.format(Locale.ROOT, "%s: %d point(s) for %d free parameter(s); a fit needs more points "
                    + "than free parameters", curve.file(), n, np));
        }
        double[] start = model.start();
        double[] q0 = new double[np];
        for (int k = 0; k < np; k++) {
            FreeParameter f = free.get(k);
            if (start[k] < f.low() || start[k] > f.high()) {
                throw new FitInputException(String.format(Locale.ROOT, "--free %s: the fit starts from the case's %s = %s, outside "
                        + "the bounds; widen them or set a starting value with --set", f.written(), f.name(),
                        Units.format(start[k], f.dimension())));
            }
            q0[k] = (start[k] - f.low()) / f.span();
        }
        return q0;
    }

    static Result fit(FitModel model, MeasuredCurve curve, List<FreeParameter> free) throws IOException, FitInputException {
        int n = curve.size();
        int np = free.size();
        double[] q0 = check(model, curve, free);
        double[] weight = new double[n];
        for (int i = 0; i < n; i++) {
            weight[i] = curve.u() == null ? 1 : 1 / curve.u()[i];
        }
        double[] target = new double[n];
        for (int i = 0; i < n; i++) {
            target[i] = curve.y()[i] * weight[i];
        }
        List<String> warnings = new ArrayList<>();
        LeastSquaresProblem problem = new LeastSquaresBuilder()
                .start(q0)
                .target(target)
                .model(point -> jacobian(model, free, point.toArray(), weight))
                .parameterValidator(point -> {
                    RealVector v = point.copy();
                    for (int k = 0; k < v.getDimension(); k++) {
                        v.setEntry(k, Math.max(0, Math.min(1, v.getEntry(k))));
                    }
                    return v;
                })
                .maxEvaluations(MAX_EVALUATIONS)
                .maxIterations(MAX_EVALUATIONS)
                .build();
        LeastSquaresOptimizer.Optimum opt;
        try {
            opt = new LevenbergMarquardtOptimizer().optimize(problem);
        } catch (UncheckedIOException e) {
            throw e.getCause();
        } catch (Failed e) {
            throw e.input;
        } catch (MathIllegalStateException e) {
            throw new FitInputException(String.format(Locale.ROOT, "the fit did not converge within %d evaluations of the model; "
                    + "narrow the bounds or start closer (with --set)", MAX_EVALUATIONS));
        }
        double[] q = opt.getPoint().toArray();
        double[] values = new double[np];
        for (int k = 0; k < np; k++) {
            values[k] = free.get(k).low() + q[k] * free.get(k).span();
        }
        double chi2 = opt.getChiSquare();
        int dof = n - np;
        double[] errors = new double[np];
        double[][] corr = new double[np][np];
        try {
            RealMatrix c = opt.getCovariances(1e-14);
            double s = curve.u() == null ? chi2 / dof : 1;
            for (int k = 0; k < np; k++) {
                errors[k] = Math.sqrt(c.getEntry(k, k) * s) * free.get(k).span();
                for (int l = 0; l < np; l++) {
                    corr[k][l] = c.getEntry(k, l) / Math.sqrt(c.getEntry(k, k) * c.getEntry(l, l));
                }
            }
        } catch (MathIllegalArgumentException e) {
            java.util.Arrays.fill(errors, Double.NaN);
            for (double[] row : corr) {
                java.util.Arrays.fill(row, Double.NaN);
            }
            warnings.add("the data do not determine every free parameter (the fit's curvature matrix is singular): no standard "
                    + "errors; fix some parameters or measure over a wider range");
        }
        for (int k = 0; k < np; k++) {
            FreeParameter f = free.get(k);
            if (q[k] < ON_BOUND || q[k] > 1 - ON_BOUND) {
                warnings.add(String.format(Locale.ROOT, "%s = %s sits on its %s bound: the best value may lie beyond it (widen the "
                        + "bounds), and its standard error means little", f.name(), Units.format(values[k], f.dimension()),
                        q[k] < 0.5 ? "lower" : "upper"));
            }
            for (int l = k + 1; l < np; l++) {
                if (Math.abs(corr[k][l]) > TOO_CORRELATED) {
                    warnings.add(String.format(Locale.ROOT, "%s and %s are correlated (%.3f): the data can hardly tell them apart; fix "
                            + "one of them, or measure over a wider range", f.name(), free.get(l).name(), corr[k][l]));
                }
            }
        }
        if (curve.u() != null && dof > 0 && chi2 / dof > 3) {
            warnings.add(String.format(Locale.ROOT, "reduced chi-square %.3g: the model misses the data by more than their stated "
                    + "uncertainties (a missing parameter, a wrong case, or uncertainties too small); the standard errors are "
                    + "not scaled by it", chi2 / dof));
        }
        return new Result(values, errors, corr, model.values(values), chi2, dof, opt.getIterations(), opt.getEvaluations(),
                warnings);
    }

    /** Bad input met while evaluating, carried through the optimiser. */
    private static final class Failed extends RuntimeException {
        private static final long serialVersionUID = 1L;
        private final transient FitInputException input;

        Failed(FitInputException input) {
            super(input.getMessage(), null, false, false);
            this.input = input;
        }
    }

    private static Pair<RealVector, RealMatrix> jacobian(FitModel model, List<FreeParameter> free, double[] q, double[] weight) {
        int np = q.length;
        try {
            double[] f0 = model.values(physical(free, q));
            int n = f0.length;
            double[][] jac = new double[n][np];
            for (int k = 0; k < np; k++) {
                double lo = Math.max(0, q[k] - model.kind().step);
                double hi = Math.min(1, q[k] + model.kind().step);
                double[] a = q.clone();
                double[] b = q.clone();
                a[k] = lo;
                b[k] = hi;
                double[] fa = model.values(physical(free, a));
                double[] fb = model.values(physical(free, b));
                for (int i = 0; i < n; i++) {
                    jac[i][k] = weight[i] * (fb[i] - fa[i]) / (hi - lo);
                }
            }
            double[] v = new double[n];
            for (int i = 0; i < n; i++) {
                v[i] = weight[i] * f0[i];
            }
            return new Pair<>(new ArrayRealVector(v, false), new Array2DRowRealMatrix(jac, false));
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        } catch (FitInputException e) {
            throw new Failed(e);
        }
    }

    private static double[] physical(List<FreeParameter> free, double[] q) {
        double[] p = new double[q.length];
        for (int k = 0; k < q.length; k++) {
            p[k] = free.get(k).low() + q[k] * free.get(k).span();
        }
        return p;
    }
}
