package dev.fixmod.verify.loss;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/** The rows of the {@link Numbers} Javadoc table, and the SVG coordinate form. */
class NumbersTest {
    @Test
    void javadocExamples() {
        assertEquals("0.045", Numbers.fixed(0.0449999, 3));
        assertEquals("0.00", Numbers.fixed(-0.0001, 2));
        assertEquals("1.23e-4", Numbers.sci(0.000123456, 3));
        assertEquals("0", Numbers.sci(0, 3));
        assertEquals("0.1", Numbers.plain(0.1));
        assertEquals("n/a", Numbers.fixed(Double.NaN, 2));
        assertEquals("n/a", Numbers.sci(Double.POSITIVE_INFINITY, 2));
        // Rounding carries into the exponent: 9.996e-3 to three digits is 1.00e-2.
        assertEquals("1.00e-2", Numbers.sci(0.009996, 3));
    }

    @Test
    void svgCoordinatesHaveTwoDecimals() {
        assertEquals("12.35", Charts.twoDecimals(12.345001));
        assertEquals("-0.50", Charts.twoDecimals(-0.5));
        assertEquals("0.00", Charts.twoDecimals(-0.001));
        assertEquals("3.05", Charts.twoDecimals(3.05));
    }
}
