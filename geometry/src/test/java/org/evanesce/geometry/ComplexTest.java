package org.evanesce.geometry;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** The complex-number record: arithmetic identities and the square-root branches (common practice). */
class ComplexTest {

    private static final double ROUNDING = 1e-15;

    private static void assertClose(Complex expected, Complex actual) {
        assertTrue(expected.minus(actual).abs() <= ROUNDING * Math.max(1, expected.abs()),
                () -> "expected " + expected + ", got " + actual);
    }

    @Test
    void arithmetic() {
        Complex a = Complex.of(1.5, -0.25);
        Complex b = Complex.of(-0.75, 2);
        assertClose(Complex.of(0.75, 1.75), a.plus(b));
        assertClose(Complex.of(-1.125 + 0.5, 3 + 0.1875), a.times(b));
        assertClose(a, a.times(b).divide(b));
        assertClose(a, a.divide(b).times(b));
        assertClose(Complex.of(0.25, 1.5), a.timesI());
        assertClose(Complex.of(-1.5, 0.25), a.negate());
        assertClose(Complex.ONE, b.times(b.reciprocal()));
        assertEquals(Math.hypot(1.5, 0.25), a.abs(), 0);
        assertEquals(1.5 * 1.5 + 0.25 * 0.25, a.norm(), 1e-15);
        assertClose(Complex.of(0, 1), Complex.polar(1, Math.PI / 2));
        // Euler: e^{iπ} = −1; sin² + cos² = 1 for a complex argument
        assertClose(Complex.real(-1), Complex.of(0, Math.PI).exp());
        Complex z = Complex.of(0.7, 1.3);
        assertClose(Complex.ONE, z.sin().square().plus(z.cos().square()));
        assertThrows(ArithmeticException.class, () -> a.divide(Complex.ZERO));
        // Smith's division neither overflows nor underflows where the naive formula would
        assertClose(Complex.of(1, 0), Complex.of(1e300, 1e300).divide(Complex.of(1e300, 1e300)));
    }

    @Test
    void squareRootBranches() {
        // principal root: Re ≥ 0
        assertClose(Complex.of(0, 2), Complex.real(-4).sqrt());
        assertClose(Complex.of(1, 1), Complex.of(0, 2).sqrt());
        assertClose(Complex.of(1, -1), Complex.of(0, -2).sqrt());
        // the normal-wavenumber branch: Im ≥ 0, and the positive root of a positive real number
        assertClose(Complex.real(3), Complex.real(9).sqrtUpper());
        assertClose(Complex.of(0, 3), Complex.real(-9).sqrtUpper());
        assertClose(Complex.of(0, 3), Complex.of(-9, -0.0).sqrtUpper());
        assertClose(Complex.of(-1, 1), Complex.of(0, -2).sqrtUpper());
        assertEquals(Complex.ZERO, Complex.ZERO.sqrtUpper());
        for (double re = -3; re <= 3; re += 0.37) {
            for (double im = -3; im <= 3; im += 0.41) {
                Complex z = Complex.of(re, im);
                Complex w = z.sqrtUpper();
                assertTrue(w.im() >= 0, z + " -> " + w);
                assertClose(z, w.square());
                assertTrue(z.sqrt().re() >= 0, z + " principal");
                assertClose(z, z.sqrt().square());
            }
        }
    }

    @Test
    void printsInTheFormTheCommandLineReads() {
        assertEquals("1.5+0.01i", Complex.of(1.5, 0.01).toString());
        assertEquals("0.2-3.4i", Complex.of(0.2, -3.4).toString());
    }
}
