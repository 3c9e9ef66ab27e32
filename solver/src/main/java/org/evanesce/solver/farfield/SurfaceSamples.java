package org.evanesce.solver.farfield;

/**
 * A complex scalar sampled at the points of a contour: the field U along z (Ez for s, η0·Hz for p) or the
 * tangential in-plane field V_t (η0·H_t for s, E_t for p; t̂ = ẑ × n̂) — whichever the consumer asks for. Complex
 * amplitudes with time dependence exp(−iωt), in V/m (H stored as η0·H, docs/architecture.md). Made by
 * {@link ContourPoints#scalar} or {@link ContourPoints#tangential}; the arrays are copied in and out.
 *
 * @param points where the values are, with normals and weights
 * @param re     real parts, one per point
 * @param im     imaginary parts
 */
public record SurfaceSamples(ContourPoints points, double[] re, double[] im) {

    public SurfaceSamples {
        if (points == null) {
            throw new IllegalArgumentException("surface samples: points must not be null");
        }
        if (re.length != points.size() || im.length != points.size()) {
            throw new IllegalArgumentException(String.format(
                    "surface samples: need %d real and imaginary parts (one per point), got %d and %d", points.size(),
                    re.length, im.length));
        }
        for (int j = 0; j < re.length; j++) {
            if (!Double.isFinite(re[j]) || !Double.isFinite(im[j])) {
                throw new IllegalArgumentException(String.format("surface sample %d is not finite: %g%+gi", j, re[j],
                        im[j]));
            }
        }
        re = re.clone();
        im = im.clone();
    }

    @Override
    public double[] re() {
        return re.clone();
    }

    @Override
    public double[] im() {
        return im.clone();
    }

    /** The number of samples. */
    public int size() {
        return re.length;
    }
}
