package dev.fixmod.verify.vectors;

import static org.junit.jupiter.api.Assertions.assertEquals;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;

/** The fast 9-decimal formatter of reference.csv agrees with JDK BigDecimal's exact half-even rounding. */
class Fixed9Properties {

    @Property(tries = 2000)
    void agreesWithBigDecimalOnTypicalValues(@ForAll @DoubleRange(min = -1e4, max = 1e4) double x) {
        assertEquals(SetFiles.slowFixed9(x), SetFiles.fixed9(x));
    }

    @Property(tries = 2000)
    void agreesWithBigDecimalAcrossBinades(@ForAll @IntRange(min = -1074, max = 40) int exponent,
            @ForAll @IntRange(min = 0, max = (1 << 30) - 1) int low, @ForAll boolean negative) {
        double x = Math.scalb(1.0 + low / (double) (1 << 30), exponent) * (negative ? -1 : 1);
        assertEquals(SetFiles.slowFixed9(x), SetFiles.fixed9(x));
    }

    @Property(tries = 1000)
    void agreesWithBigDecimalOnExactTies(@ForAll @IntRange(min = -2_000_000, max = 2_000_000) int k) {
        // k/2 · 10^-9 rounded to 10^-9: the doubles nearest to these ties sit on either side; both paths must agree.
        double x = (k + 0.5) / 1e9;
        assertEquals(SetFiles.slowFixed9(x), SetFiles.fixed9(x));
        double y = Math.scalb((double) (2 * k + 1), -1); // exact half-integers, far above the 9th decimal
        assertEquals(SetFiles.slowFixed9(y), SetFiles.fixed9(y));
    }
}
