package org.evanesce.io.run;

import java.util.Arrays;

/**
 * The curves of one beam plot, on one scale: the simulated flux density across a line divided by the
 * incident beam's peak flux density (so a loss shows as a lower curve, not hidden by scaling each curve to
 * its own peak), the reference (already relative to its own incident beam's peak) where there is one, and
 * their difference, simulated − reference, at the simulated samples. Only the part of the line within
 * {@link #HALF_WIDTHS} of the beam's 1/e² half-widths of its centroid is kept, clipped to the line.
 *
 * @param x          the simulated samples' positions, um, inside the range
 * @param simulated  flux density / incident peak at x, with the sign that makes the line's total positive
 * @param referenceX the reference's positions, um, inside the range; empty without a reference
 * @param reference  the reference at referenceX, relative to its incident peak; empty without a reference
 * @param differenceX where the difference is given, um: the simulated samples the reference covers
 * @param difference simulated − reference (linearly interpolated) at differenceX
 * @param low        the plot's x range, um
 * @param high       the plot's x range, um
 */
record BeamSeries(double[] x, double[] simulated, double[] referenceX, double[] reference, double[] differenceX,
        double[] difference, double low, double high) {

    /** The x range, in 1/e² half-widths (the second-moment width, {@code BeamProfile.width}) each side of the centroid. */
    static final double HALF_WIDTHS = 3;

    /**
     * Builds the curves.
     *
     * @param xm           the line's sample positions, m, increasing
     * @param weight       the simulated flux density at xm (any sign: a line the beam crosses towards −y has a negative one)
     * @param incidentPeak the incident beam's peak flux density, in the weight's units; &gt; 0
     * @param centroid     the beam's centroid on the line, m (NaN: the whole line is shown)
     * @param width        the beam's 1/e² half-width on the line, m (NaN or not positive: the whole line is shown)
     * @param refXm        the reference's positions, m, increasing; null or empty without a reference
     * @param refRelative  the reference's flux density relative to its own incident beam's peak at refXm
     */
    static BeamSeries of(double[] xm, double[] weight, double incidentPeak, double centroid, double width, double[] refXm,
            double[] refRelative) {
        if (xm.length != weight.length || xm.length < 2 || !(incidentPeak > 0) || Double.isInfinite(incidentPeak)) {
            throw new IllegalArgumentException(String.format("beam plot: need at least 2 samples with as many weights and an "
                    + "incident peak > 0; got %d positions, %d weights, peak %g", xm.length, weight.length, incidentPeak));
        }
        double first = xm[0] * 1e6;
        double last = xm[xm.length - 1] * 1e6;
        double low = first;
        double high = last;
        if (Double.isFinite(centroid) && Double.isFinite(width) && width > 0) {
            low = Math.max(first, (centroid - HALF_WIDTHS * width) * 1e6);
            high = Math.min(last, (centroid + HALF_WIDTHS * width) * 1e6);
            if (!(high > low)) { // a centroid off the line: show the whole line
                low = first;
                high = last;
            }
        }
        double sum = 0;
        for (double w : weight) {
            sum += w;
        }
        double sign = sum < 0 ? -1 : 1;
        double[] x = new double[xm.length];
        double[] y = new double[xm.length];
        int n = 0;
        for (int k = 0; k < xm.length; k++) {
            double xu = xm[k] * 1e6;
            if (xu >= low && xu <= high) {
                x[n] = xu;
                y[n++] = sign * weight[k] / incidentPeak;
            }
        }
        x = Arrays.copyOf(x, n);
        y = Arrays.copyOf(y, n);
        double[] rx = new double[0];
        double[] ry = new double[0];
        double[] dx = new double[0];
        double[] dy = new double[0];
        if (refXm != null && refXm.length > 1) {
            if (refRelative.length != refXm.length) {
                throw new IllegalArgumentException(String.format("beam plot: %d reference positions but %d values",
                        refXm.length, refRelative.length));
            }
            rx = new double[refXm.length];
            ry = new double[refXm.length];
            int m = 0;
            for (int j = 0; j < refXm.length; j++) {
                double xu = refXm[j] * 1e6;
                if (xu >= low && xu <= high) {
                    rx[m] = xu;
                    ry[m++] = refRelative[j];
                }
            }
            rx = Arrays.copyOf(rx, m);
            ry = Arrays.copyOf(ry, m);
            dx = new double[n];
            dy = new double[n];
            int d = 0;
            double r0 = refXm[0] * 1e6;
            double r1 = refXm[refXm.length - 1] * 1e6;
            double step = (r1 - r0) / (refXm.length - 1);
            for (int k = 0; k < n; k++) {
                if (x[k] >= r0 && x[k] <= r1) {
                    // linear interpolation between the reference's uniform samples
                    double s = (x[k] - r0) / step;
                    int j = Math.min((int) Math.floor(s), refXm.length - 2);
                    double f = s - j;
                    dx[d] = x[k];
                    dy[d++] = y[k] - ((1 - f) * refRelative[j] + f * refRelative[j + 1]);
                }
            }
            dx = Arrays.copyOf(dx, d);
            dy = Arrays.copyOf(dy, d);
        }
        return new BeamSeries(x, y, rx, ry, dx, dy, low, high);
    }
}
