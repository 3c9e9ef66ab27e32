package org.evanesce.solver;

/** Test helper: the discrete Fourier transform of a sampled signal at one frequency, exp(−iωt) convention. */
final class Dft {

    private Dft() {
    }

    /** X(f) = Σ x(t) e^{+i2πft}; returns {re, im}. */
    static double[] at(double[] x, double[] t, double f) {
        double re = 0;
        double im = 0;
        double w = 2 * Math.PI * f;
        for (int n = 0; n < x.length; n++) {
            re += x[n] * Math.cos(w * t[n]);
            im += x[n] * Math.sin(w * t[n]);
        }
        return new double[] {re, im};
    }

    static double[] div(double[] a, double[] b) {
        double d = b[0] * b[0] + b[1] * b[1];
        return new double[] {(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d};
    }

    static double[] mul(double[] a, double[] b) {
        return new double[] {a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]};
    }

    static double[] expi(double phase) {
        return new double[] {Math.cos(phase), Math.sin(phase)};
    }

    static double abs(double[] a) {
        return Math.hypot(a[0], a[1]);
    }

    static double[] sub(double[] a, double[] b) {
        return new double[] {a[0] - b[0], a[1] - b[1]};
    }
}
