package org.evanesce.io.output.image;

/**
 * Tick values and labels along one axis or colour bar: the nicest ticks on [lo, hi], at most
 * {@code maxCount} of them, whose labels do not crowd each other at the package's text scale.
 */
record TickAxis(double[] values, String[] labels) {

    /** Text scale and capital height of the plots' labels. */
    private static final int SCALE = 2;
    private static final int CAP = PixelFont.CAP_HEIGHT * SCALE;

    /**
     * @param pixelsPerUnit pixels per unit of the values
     * @param across        labels side by side (x axis) rather than stacked (y axis, bar)
     */
    static TickAxis of(double lo, double hi, double pixelsPerUnit, int maxCount, boolean across) {
        double step = Ticks.step(lo, hi, maxCount);
        while (true) {
            double[] v = Ticks.values(lo, hi, step);
            if (v.length == 0) {
                double[] one = Ticks.nearestMiddle(lo, hi, step);
                return new TickAxis(one, new String[] {Ticks.single(one[0])});
            }
            String[] labels = Ticks.labels(v, step);
            int need = CAP + 16;
            if (across) {
                int w = 0;
                for (String s : labels) {
                    w = Math.max(w, PixelFont.width(s, SCALE));
                }
                need = w + 2 * PixelFont.ADVANCE * SCALE;
            }
            if (v.length == 1 || step * pixelsPerUnit >= need) {
                return new TickAxis(v, labels);
            }
            step = Ticks.next(step);
        }
    }
}
