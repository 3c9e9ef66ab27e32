package org.evanesce.solver.reference;

import java.util.function.DoubleUnaryOperator;

/**
 * Composite Gauss–Legendre quadrature for the tests: nodes and weights of the m-point rule by Newton's method on
 * the Legendre polynomial P_m (three-term recurrence), W. H. Press et al., <i>Numerical Recipes</i>, 3rd ed.,
 * 2007, sec. 4.6 (routine gauleg); exact for polynomials of degree 2m − 1 on each panel.
 */
public final class GaussLegendre {

    private final double[] nodes;
    private final double[] weights;

    /** The m-point rule on [−1, 1]. */
    public GaussLegendre(int m) {
        nodes = new double[m];
        weights = new double[m];
        for (int i = 0; i < (m + 1) / 2; i++) {
            double z = Math.cos(Math.PI * (i + 0.75) / (m + 0.5));
            double pp;
            double dz;
            do {
                double p1 = 1;
                double p2 = 0;
                for (int j = 1; j <= m; j++) {
                    double p3 = p2;
                    p2 = p1;
                    p1 = ((2.0 * j - 1) * z * p2 - (j - 1.0) * p3) / j;
                }
                pp = m * (z * p1 - p2) / (z * z - 1);
                dz = p1 / pp;
                z -= dz;
            } while (Math.abs(dz) > 1e-15);
            nodes[i] = -z;
            nodes[m - 1 - i] = z;
            weights[i] = 2 / ((1 - z * z) * pp * pp);
            weights[m - 1 - i] = weights[i];
        }
    }

    /** ∫_a^b f dx with the rule on each of {@code panels} equal panels. */
    public double integrate(DoubleUnaryOperator f, double a, double b, int panels) {
        double h = (b - a) / panels;
        double sum = 0;
        for (int p = 0; p < panels; p++) {
            double mid = a + (p + 0.5) * h;
            for (int i = 0; i < nodes.length; i++) {
                sum += weights[i] * f.applyAsDouble(mid + 0.5 * h * nodes[i]);
            }
        }
        return sum * 0.5 * h;
    }
}
