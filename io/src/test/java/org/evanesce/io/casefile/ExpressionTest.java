package org.evanesce.io.casefile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import java.util.Set;
import org.evanesce.io.casefile.expr.Dimension;
import org.evanesce.io.casefile.expr.Expression;
import org.evanesce.io.casefile.expr.ExpressionException;
import org.evanesce.io.casefile.expr.Quantity;
import org.evanesce.io.casefile.expr.Units;
import org.junit.jupiter.api.Test;

/** Expressions: arithmetic, units, functions and the dimension rules, without a case file around them. */
class ExpressionTest {

    /** Relative tolerance for values that pass through a few floating-point operations. */
    private static final double REL = 1e-14;

    private static final Map<String, Quantity> PARAMS = Map.of(
            "gap", new Quantity(0.2e-6, Dimension.LENGTH),
            "n", Quantity.plain(1.5),
            "theta", new Quantity(Math.toRadians(30), Dimension.ANGLE));

    private static Quantity eval(String text) throws ExpressionException {
        return Expression.parse(text).evaluate((name, offset) -> {
            Quantity q = PARAMS.get(name);
            if (q == null) {
                throw new ExpressionException(offset, "undefined parameter '" + name + "'");
            }
            return q;
        });
    }

    private static void assertQuantity(double expected, Dimension d, String text) throws ExpressionException {
        Quantity q = eval(text);
        assertEquals(d, q.dimension(), text);
        assertEquals(expected, q.value(), Math.abs(expected) * REL, text);
    }

    private static ExpressionException failure(String text) {
        return assertThrows(ExpressionException.class, () -> eval(text), text);
    }

    @Test
    void numbersAndUnits() throws ExpressionException {
        assertQuantity(0.2e-6, Dimension.LENGTH, "0.2 um");
        assertQuantity(633e-9, Dimension.LENGTH, "633nm");
        assertQuantity(1.5e-3, Dimension.LENGTH, "1.5 mm");
        assertQuantity(2, Dimension.LENGTH, "2 m");
        assertQuantity(100e-15, Dimension.TIME, "100 fs");
        assertQuantity(2e-12, Dimension.TIME, "2 ps");
        assertQuantity(474e12, Dimension.FREQUENCY, "474 THz");
        assertQuantity(Math.PI / 6, Dimension.ANGLE, "30 deg");
        assertQuantity(5e6, Dimension.CONDUCTIVITY, "5e6 S/m");
        assertQuantity(1e-4, Dimension.NONE, "1e-4");
        assertQuantity(0.5, Dimension.NONE, ".5");
        // one rounding only: 10 um is the double nearest 1e-5
        assertEquals(1e-5, eval("10 um").value(), 0.0);
        assertEquals(1.2e-5, eval("12 um").value(), 0.0);
    }

    @Test
    void arithmeticAndPrecedence() throws ExpressionException {
        assertQuantity(0.2e-6 / 2 + 1e-6, Dimension.LENGTH, "gap/2 + 1 um");
        assertQuantity(-0.2e-6, Dimension.LENGTH, "-gap");
        assertQuantity(0.2e-6, Dimension.LENGTH, "--gap");
        assertQuantity((1.5 + 1) * 2, Dimension.NONE, "(n + 1) * 2");
        assertQuantity(1.5 + 1 * 2, Dimension.NONE, "n + 1 * 2");
        assertQuantity(3e-6, Dimension.LENGTH, "(1 + 2) um");
        assertQuantity(4, Dimension.NONE, "2 \u00d7 2");
        assertQuantity(0, Dimension.NONE, "2 \u2212 2");
        assertQuantity(1.0 / 2e-6, new Dimension(-1, 0, 0, 0), "1/2 um"); // the unit binds to its number
        assertQuantity(0.2e-6 * 0.2e-6, new Dimension(2, 0, 0, 0), "gap*gap");
        assertQuantity(0.2 / 1.0, Dimension.NONE, "gap / um");
        assertQuantity(Math.PI, Dimension.NONE, "pi");
    }

    @Test
    void functions() throws ExpressionException {
        assertQuantity(0.2e-6, Dimension.LENGTH, "sqrt(gap*gap)");
        assertQuantity(Math.sqrt(2), Dimension.NONE, "sqrt(2)");
        assertQuantity(0.5, Dimension.NONE, "sin(30)"); // a plain number is degrees
        assertQuantity(0.5, Dimension.NONE, "sin(theta)");
        assertQuantity(0.5, Dimension.NONE, "cos(60 deg)");
        assertQuantity(1, Dimension.NONE, "tan((pi/4) rad)"); // "pi/4 rad" would be pi/(4 rad)
        assertQuantity(Math.asin(1 / 1.5), Dimension.ANGLE, "asin(1/n)");
        assertQuantity(Math.PI / 3, Dimension.ANGLE, "acos(0.5)");
        assertQuantity(Math.PI / 4, Dimension.ANGLE, "atan(1)");
        assertQuantity(Math.PI / 4, Dimension.ANGLE, "atan2(1 um, 1000 nm)");
        assertQuantity(1e-6, Dimension.LENGTH, "max(gap, 1 um, 0.5 um)");
        assertQuantity(0.2e-6, Dimension.LENGTH, "min(gap, 1 um)");
        assertQuantity(0.2e-6, Dimension.LENGTH, "abs(-gap)");
    }

    @Test
    void dimensionErrors() {
        ExpressionException e = failure("gap + 1");
        assertEquals("cannot add a length (200 nm) and a plain number (1); both sides of '+' must be of the same kind", e.getMessage());
        assertEquals(4, e.offset());
        assertEquals("cannot subtract a plain number (30) and an angle (30 deg); both sides of '-' must be of the same kind",
                failure("30 - theta").getMessage());
        assertEquals("sqrt of a length has no unit we know (200 nm)", failure("sqrt(gap)").getMessage());
        assertEquals("sin needs an angle, got a length (200 nm)", failure("sin(gap)").getMessage());
        assertEquals("asin needs a value between -1 and 1, got 1.5", failure("asin(n)").getMessage());
        assertEquals("min needs arguments of one kind, got a length (200 nm) and a plain number (1)", failure("min(gap, 1)").getMessage());
        assertEquals("division by zero", failure("gap / (n - 1.5)").getMessage());
    }

    @Test
    void syntaxErrorsNameTheirPlace() {
        ExpressionException e = failure("0.2 nmm");
        assertEquals(4, e.offset());
        assertTrue(e.getMessage().startsWith("unknown unit 'nmm' (did you mean 'nm'?); units: nm, um, mm, m, fs,"), e.getMessage());
        e = failure("2 gap");
        assertEquals(2, e.offset());
        assertTrue(e.getMessage().startsWith("'gap' is not a unit; units: "), e.getMessage());
        assertTrue(e.getMessage().endsWith("(to multiply by a parameter write '*')"), e.getMessage());
        e = failure("sqr(2)");
        assertEquals(0, e.offset());
        assertTrue(e.getMessage().startsWith("unknown function 'sqr' (did you mean 'sqrt'?)"), e.getMessage());
        assertEquals("missing ')' for the '(' at character 1", failure("(1 + 2").getMessage());
        assertEquals("unbalanced ')'", failure("1 + 2)").getMessage());
        assertEquals("the expression ends where a value was expected", failure("1 +").getMessage());
        assertEquals("empty value", failure("").getMessage());
        assertEquals("unexpected '#'", failure("1 + #").getMessage());
        assertEquals("atan2 takes 2 arguments, got 1", failure("atan2(1)").getMessage());
        assertEquals("sqrt is a function; write sqrt(...)", failure("sqrt").getMessage());
        assertEquals("undefined parameter 'gapp'", failure("gapp/2").getMessage());
    }

    @Test
    void parameterNamesAndReservedWords() throws ExpressionException {
        assertEquals(Set.of("gap", "n"), Expression.parse("gap * sqrt(n) + 2 um / n").parameterNames());
        assertTrue(Expression.isReserved("um"));
        assertTrue(Expression.isReserved("sin"));
        assertTrue(Expression.isReserved("pi"));
        assertFalse(Expression.isReserved("gap"));
    }

    @Test
    void formatting() {
        assertEquals("633 nm", Units.format(633e-9, Dimension.LENGTH));
        assertEquals("1.5 um", Units.format(1.5e-6, Dimension.LENGTH));
        assertEquals("-2 mm", Units.format(-2e-3, Dimension.LENGTH));
        assertEquals("100 fs", Units.format(100e-15, Dimension.TIME));
        assertEquals("474 THz", Units.format(474e12, Dimension.FREQUENCY));
        assertEquals("45 deg", Units.format(Math.PI / 4, Dimension.ANGLE));
        assertEquals("1e-30", Units.number(1e-30));
        assertEquals("1.23457e+10", Units.number(12345678901.0));
    }
}
