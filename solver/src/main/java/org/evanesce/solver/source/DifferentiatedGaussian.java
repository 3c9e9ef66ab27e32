package org.evanesce.solver.source;

/** See {@link TimeSignal#differentiatedGaussian}. */
public record DifferentiatedGaussian(double width) implements TimeSignal {

    public DifferentiatedGaussian {
        if (!(width > 0) || Double.isInfinite(width)) {
            throw new IllegalArgumentException(String.format("Gaussian width %g s must be finite and > 0", width));
        }
    }

    @Override
    public double value(double t) {
        double u = (t - 6 * width) / width;
        return -u * Math.exp(0.5 - 0.5 * u * u);
    }
}
