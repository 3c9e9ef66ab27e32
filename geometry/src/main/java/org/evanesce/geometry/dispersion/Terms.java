package org.evanesce.geometry.dispersion;

/** Shared argument checks of the dispersion terms. */
final class Terms {

    private Terms() {
    }

    static void checkRate(String what, double value) {
        if (!(value >= 0) || Double.isInfinite(value)) {
            throw new IllegalArgumentException(String.format("%s %g rad/s must be finite and >= 0", what, value));
        }
    }
}
