package org.evanesce.solver.reference;

import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.factory.LinearSolverFactory_DDRM;
import org.ejml.interfaces.linsol.LinearSolverDense;

/**
 * A least-squares fit of an exponential decay m(s) = A e^{−s/L} to magnitudes m_i &gt; 0 sampled at
 * distances s_i, e.g. |E| along the normal beyond a totally reflecting interface.
 *
 * <p>The fit is linear in ln m = ln A − s/L, solved by QR with weights w_i = m_i². Why m²: for additive noise
 * δ of variance σ² on m, δ(ln m) ≈ δ/m, so var(ln m_i) ≈ σ²/m_i² and the inverse-variance weights are ∝ m_i²;
 * unweighted, the noisy far tail (small m, where ln m scatters most) would pull the slope. Only the weights'
 * ratios matter, so their common scale is left unknown and estimated from the residuals.
 *
 * <p>With the slope β = −1/L, the standard error of the slope for a weighted straight-line fit whose
 * variance scale is estimated from the fit (W. H. Press et al., Numerical Recipes, 3rd ed. (2007), sec. 15.2;
 * P. R. Bevington &amp; D. K. Robinson, Data Reduction and Error Analysis, 3rd ed., ch. 6; from memory) is
 * <pre>
 *     σ_β = sqrt( [(XᵀWX)⁻¹]_ββ · χ²/(n − 2) ),   χ² = Σ w_i r_i²,   r_i = ln m_i − (ln A − s_i/L),
 * </pre>
 * X having rows (1, s_i); and σ_L = L² σ_β to first order (|dL/dβ| = 1/β²). A ripple that is not
 * independent from sample to sample makes σ_L an estimate only.
 *
 * @param length            L, the distance over which the fitted magnitude falls by 1/e, in the distances' unit (m)
 * @param lengthUncertainty σ_L, standard uncertainty of L from the residuals (0 for an exact exponential, up to rounding)
 * @param amplitude         A, the fitted magnitude at s = 0, in the magnitudes' unit
 * @param points            n, the number of samples
 * @param rmsResidual       sqrt(Σ r_i² / n), unweighted, in ln m: about the rms relative misfit of the magnitudes
 */
public record DecayFit(double length, double lengthUncertainty, double amplitude, int points, double rmsResidual) {

    /**
     * Fits A e^{−s/L} to (s_i, m_i).
     *
     * @param distances  s_i, finite, not all equal (m); not modified
     * @param magnitudes m_i, finite and &gt; 0, as many as distances, at least 3; not modified
     * @throws IllegalArgumentException for fewer than 3 points, unequal lengths, a non-finite distance, a
     *         magnitude that is not finite and positive (naming its index), all distances equal, or
     *         magnitudes that do not decay (fitted slope of ln m ≥ 0)
     */
    public static DecayFit fit(double[] distances, double[] magnitudes) {
        int n = distances.length;
        if (magnitudes.length != n) {
            throw new IllegalArgumentException(String.format("decay fit: %d distances but %d magnitudes", n, magnitudes.length));
        }
        if (n < 3) {
            throw new IllegalArgumentException(String.format("decay fit needs at least 3 points, got %d", n));
        }
        double mMax = 0;
        for (int k = 0; k < n; k++) {
            if (!Double.isFinite(distances[k])) {
                throw new IllegalArgumentException(String.format("decay fit: distance %d is %g m, not finite", k, distances[k]));
            }
            if (!(magnitudes[k] > 0) || Double.isInfinite(magnitudes[k])) {
                throw new IllegalArgumentException(String.format(
                        "decay fit: magnitude %d is %g; magnitudes must be finite and > 0", k, magnitudes[k]));
            }
            mMax = Math.max(mMax, magnitudes[k]);
        }
        // scaled weights √w_i = m_i/max m (no underflow for tiny fields); distances centred on their weighted
        // mean and scaled to [−1, 1] so that the two columns are well conditioned
        double[] sw = new double[n];
        double sumW = 0;
        double sumWs = 0;
        for (int k = 0; k < n; k++) {
            sw[k] = magnitudes[k] / mMax;
            sumW += sw[k] * sw[k];
            sumWs += sw[k] * sw[k] * distances[k];
        }
        double centre = sumWs / sumW;
        double scale = 0;
        for (double s : distances) {
            scale = Math.max(scale, Math.abs(s - centre));
        }
        if (!(scale > 0)) {
            throw new IllegalArgumentException(String.format("decay fit: all %d distances equal %g m", n, distances[0]));
        }
        DMatrixRMaj x = new DMatrixRMaj(n, 2);
        DMatrixRMaj y = new DMatrixRMaj(n, 1);
        double[] u = new double[n];
        double[] lnm = new double[n];
        for (int k = 0; k < n; k++) {
            u[k] = (distances[k] - centre) / scale;
            lnm[k] = Math.log(magnitudes[k] / mMax);
            x.set(k, 0, sw[k]);
            x.set(k, 1, sw[k] * u[k]);
            y.set(k, 0, sw[k] * lnm[k]);
        }
        LinearSolverDense<DMatrixRMaj> qr = LinearSolverFactory_DDRM.leastSquares(n, 2);
        DMatrixRMaj xCopy = x.copy(); // the solver may overwrite its input
        if (!qr.setA(xCopy)) {
            throw new IllegalArgumentException("decay fit: the weighted design matrix is singular");
        }
        DMatrixRMaj ab = new DMatrixRMaj(2, 1);
        qr.solve(y, ab);
        double a = ab.get(0, 0);
        double b = ab.get(1, 0);
        double beta = b / scale;
        if (!(beta < 0)) {
            throw new IllegalArgumentException(String.format(
                    "decay fit: the magnitudes do not decay (fitted slope of ln m %g per unit distance)", beta));
        }
        double chi2 = 0;
        double sumR2 = 0;
        for (int k = 0; k < n; k++) {
            double r = lnm[k] - (a + b * u[k]);
            chi2 += sw[k] * sw[k] * r * r;
            sumR2 += r * r;
        }
        DMatrixRMaj normal = new DMatrixRMaj(2, 2);
        CommonOps_DDRM.multTransA(x, x, normal);
        if (!CommonOps_DDRM.invert(normal)) {
            throw new IllegalArgumentException("decay fit: the normal equations are singular");
        }
        double sigmaB = Math.sqrt(normal.get(1, 1) * chi2 / (n - 2));
        double length = -1 / beta;
        double sigmaL = length * length * sigmaB / scale;
        double amplitude = mMax * Math.exp(a - beta * centre);
        return new DecayFit(length, sigmaL, amplitude, n, Math.sqrt(sumR2 / n));
    }
}
