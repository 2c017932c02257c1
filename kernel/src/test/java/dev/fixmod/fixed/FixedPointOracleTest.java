package dev.fixmod.fixed;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Exhaustive comparison of the fixed-point model with its exact oracle (JDK BigDecimal / BigInteger, see
 * {@link Oracle}) over small formats: every code of every 6- and 8-bit format, every tie, points between codes and
 * beyond the range, every rounding and overflow mode.
 */
class FixedPointOracleTest {

    private static final List<QFormat> SMALL = new ArrayList<>();

    static {
        SMALL.addAll(Expect.formatsOfWord(6));
        SMALL.addAll(Expect.formatsOfWord(8));
    }

    @Test
    void quantizeMatchesBigDecimalOnEverySmallFormat() {
        // Source: JDK BigDecimal (exact) via Oracle.quantize.
        OverflowCounter counter = new OverflowCounter("test");
        int checked = 0;
        for (QFormat f : SMALL) {
            List<Double> xs = new ArrayList<>();
            for (long c = f.minCode() - 3; c <= f.maxCode() + 3; c++) {
                for (int eighth = 0; eighth < 8; eighth++) {
                    double x = Math.scalb(c * 8.0 + eighth, -3 - f.fractionalBits()); // exact
                    xs.add(x);
                }
                double tie = Math.scalb(c + 0.5, -f.fractionalBits());
                xs.add(Math.nextUp(tie));
                xs.add(Math.nextDown(tie));
            }
            for (double x : new double[] {-0.0, Double.MIN_VALUE, -Double.MIN_VALUE, Double.MIN_NORMAL, 1e300,
                    -1e300, Double.MAX_VALUE, -Double.MAX_VALUE, 0x1p62, -0x1p62, 0x1p63, -0x1p63, 0x1p64 + 0x1p12}) {
                xs.add(x);
            }
            for (double x : xs) {
                Oracle.Result[] all = Oracle.fitAllModes(new BigDecimal(x), f);
                for (Rounding r : Rounding.values()) {
                    for (Overflow o : Overflow.values()) {
                        Oracle.Result expected = all[Oracle.index(r, o)];
                        counter.reset();
                        long code = FixedPoint.quantize(x, f, r, o, counter);
                        Expect.same(expected, code, counter.events(), () -> "quantize(" + x + ", " + f + ", " + r
                                + ", " + o + ")");
                        checked++;
                    }
                }
            }
        }
        assertTrue(checked > 200_000, "checked " + checked);
    }

    @Test
    void requantizeFromWiderFormatsMatchesBigDecimal() {
        // Source: JDK BigDecimal (exact): every code of 10-bit formats into every 6- and 8-bit format.
        List<QFormat> sources = List.of(QFormat.parse("Q2.7"), QFormat.parse("Q0.9"), QFormat.parse("UQ3.7"),
                QFormat.parse("UQ10.0"));
        OverflowCounter counter = new OverflowCounter("test");
        for (QFormat from : sources) {
            for (long code = from.minCode(); code <= from.maxCode(); code++) {
                BigDecimal value = Oracle.real(code, from.fractionalBits());
                for (QFormat to : SMALL) {
                    Oracle.Result[] all = Oracle.fitAllModes(value, to);
                    for (Rounding r : Rounding.values()) {
                        for (Overflow o : Overflow.values()) {
                            Oracle.Result expected = all[Oracle.index(r, o)];
                            counter.reset();
                            long got = FixedPoint.requantize(code, from, to, r, o, counter);
                            long c = code;
                            Expect.same(expected, got, counter.events(), () -> "requantize(" + c + ", " + from
                                    + " -> " + to + ", " + r + ", " + o + ")");
                        }
                    }
                }
            }
        }
    }

    @Test
    void addSubtractMultiplyMatchBigDecimalOnEveryPairOfCodes() {
        // Source: JDK BigDecimal (exact sums, differences, products), every pair of codes of a 6-bit and a 5-bit
        // format, signed and unsigned mixed.
        QFormat[][] pairs = {
            {QFormat.parse("Q2.3"), QFormat.parse("Q0.4")},
            {QFormat.parse("UQ3.3"), QFormat.parse("Q2.2")},
            {QFormat.parse("Q5.0"), QFormat.parse("UQ0.5")},
            {QFormat.parse("UQ6.0"), QFormat.parse("UQ2.3")},
        };
        OverflowCounter counter = new OverflowCounter("test");
        for (QFormat[] pair : pairs) {
            QFormat fa = pair[0];
            QFormat fb = pair[1];
            QFormat narrow = QFormat.parse("Q2.2"); // rounding and overflow both active
            for (long a = fa.minCode(); a <= fa.maxCode(); a++) {
                for (long b = fb.minCode(); b <= fb.maxCode(); b++) {
                    BigDecimal ra = Oracle.real(a, fa.fractionalBits());
                    BigDecimal rb = Oracle.real(b, fb.fractionalBits());
                    for (int op = 0; op < 3; op++) {
                        BigDecimal exact = op == 0 ? ra.add(rb) : op == 1 ? ra.subtract(rb) : ra.multiply(rb);
                        QFormat grown = op == 0 ? FixedPoint.sumFormat(fa, fb)
                                : op == 1 ? FixedPoint.differenceFormat(fa, fb) : FixedPoint.productFormat(fa, fb);
                        // The grown format holds every exact result: all its modes agree with the exact value.
                        Oracle.Result inGrown = Oracle.fitAllModes(exact, grown)[0];
                        assertEquals(0, exact.compareTo(Oracle.real(inGrown.code(), grown.fractionalBits())));
                        assertTrue(!inGrown.event());
                        for (QFormat to : new QFormat[] {grown, narrow}) {
                            Oracle.Result[] all = Oracle.fitAllModes(exact, to);
                            for (Rounding r : Rounding.values()) {
                                for (Overflow o : Overflow.values()) {
                                    Oracle.Result expected = all[Oracle.index(r, o)];
                                    counter.reset();
                                    long got = op == 0 ? FixedPoint.add(a, fa, b, fb, to, r, o, counter)
                                            : op == 1 ? FixedPoint.subtract(a, fa, b, fb, to, r, o, counter)
                                            : FixedPoint.multiply(a, fa, b, fb, to, r, o, counter);
                                    long ca = a;
                                    long cb = b;
                                    int cop = op;
                                    Expect.same(expected, got, counter.events(), () -> "op" + cop + "(" + ca + " "
                                            + fa + ", " + cb + " " + fb + " -> " + to + ", " + r + ", " + o + ")");
                                }
                            }
                        }
                    }
                }
            }
        }
    }

    @Test
    void negateAndAbsMatchTheOracleOnEvery8BitCode() {
        OverflowCounter counter = new OverflowCounter("test");
        for (QFormat f : Expect.formatsOfWord(8)) {
            for (long a = f.minCode(); a <= f.maxCode(); a++) {
                BigDecimal ra = Oracle.real(a, f.fractionalBits());
                for (Overflow o : Overflow.values()) {
                    long c = a;
                    counter.reset();
                    long neg = FixedPoint.negate(a, f, o, counter);
                    Expect.same(Oracle.fit(ra.negate(), f, Rounding.FLOOR, o), neg, counter.events(),
                            () -> "negate(" + c + ", " + f + ", " + o + ")");
                    counter.reset();
                    long abs = FixedPoint.abs(a, f, o, counter);
                    Expect.same(Oracle.fit(ra.abs(), f, Rounding.FLOOR, o), abs, counter.events(),
                            () -> "abs(" + c + ", " + f + ", " + o + ")");
                }
            }
        }
    }

    @Test
    void shiftRightMatchesBigDecimalIncludingTheExtremesOfLong() {
        long[] extremes = {Long.MIN_VALUE, Long.MIN_VALUE + 1, Long.MAX_VALUE, Long.MAX_VALUE - 1, -1, 1,
            1L << 62, -(1L << 62), (1L << 62) + 1, -(1L << 62) - 1};
        for (Rounding r : Rounding.values()) {
            for (long v = -700; v <= 700; v++) {
                for (int shift = 0; shift <= 11; shift++) {
                    long expected = Oracle.round(Oracle.real(v, shift), r).longValueExact();
                    assertEquals(expected, r.shiftRight(v, shift), r + " " + v + " >> " + shift);
                }
            }
            for (long v : extremes) {
                for (int shift = 0; shift <= 63; shift++) {
                    long expected = Oracle.round(Oracle.real(v, shift), r).longValueExact();
                    assertEquals(expected, r.shiftRight(v, shift), r + " " + v + " >> " + shift);
                }
            }
        }
        assertThrows(IllegalArgumentException.class, () -> Rounding.FLOOR.shiftRight(1, 64));
        assertThrows(IllegalArgumentException.class, () -> Rounding.FLOOR.shiftRight(1, -1));
    }

    @Test
    void theJdkHalfUpIsOurHalfAwayNotOurHalfUp() {
        // Source: java.math.RoundingMode documentation (HALF_UP: "round towards nearest neighbor unless both
        // neighbors are equidistant, in which case round up", i.e. away from zero): -2.5 -> -3.
        BigDecimal minusTwoAndAHalf = new BigDecimal("-2.5");
        assertEquals(-3, minusTwoAndAHalf.setScale(0, RoundingMode.HALF_UP).intValueExact());
        assertEquals(-3.0, Rounding.HALF_AWAY.roundToIntegral(-2.5));
        assertEquals(-2.0, Rounding.HALF_UP.roundToIntegral(-2.5)); // ties toward +infinity
    }

    @Test
    void wideIntermediatesOf32BitUnsignedFormatsAreExact() {
        // The exact product of two UQ0.32 codes needs 64 bits unsigned and the aligned sum of UQ32.0 and UQ0.32
        // needs 65: both exceed a signed long. Source: JDK BigDecimal (exact).
        QFormat uq032 = QFormat.parse("UQ0.32");
        QFormat uq320 = QFormat.parse("UQ32.0");
        long max = uq032.maxCode();
        OverflowCounter counter = new OverflowCounter("test");
        for (Rounding r : Rounding.values()) {
            for (Overflow o : Overflow.values()) {
                for (QFormat to : new QFormat[] {uq032, QFormat.parse("Q0.31"), uq320, QFormat.parse("UQ1.31")}) {
                    for (long a : new long[] {max, max - 1, 1L << 31, (1L << 31) + 1, 0x9E3779B9L}) {
                        for (long b : new long[] {max, 1L << 31, (1L << 31) - 1, 0x7F4A7C15L}) {
                            BigDecimal ra = Oracle.real(a, 32);
                            BigDecimal rb = Oracle.real(b, 32);
                            counter.reset();
                            long got = FixedPoint.multiply(a, uq032, b, uq032, to, r, o, counter);
                            Expect.same(Oracle.fit(ra.multiply(rb), to, r, o), got, counter.events(),
                                    () -> "multiply(" + a + ", " + b + " -> " + to + ", " + r + ", " + o + ")");
                            BigDecimal big = Oracle.real(a, 0);
                            counter.reset();
                            got = FixedPoint.add(a, uq320, b, uq032, to, r, o, counter);
                            Expect.same(Oracle.fit(big.add(rb), to, r, o), got, counter.events(),
                                    () -> "add(" + a + ", " + b + " -> " + to + ", " + r + ", " + o + ")");
                            counter.reset();
                            got = FixedPoint.subtract(b, uq032, a, uq320, to, r, o, counter);
                            Expect.same(Oracle.fit(rb.subtract(big), to, r, o), got, counter.events(),
                                    () -> "subtract(" + b + ", " + a + " -> " + to + ", " + r + ", " + o + ")");
                        }
                    }
                }
            }
        }
    }

    @Test
    void fitHandlesAnyShiftIncludingTiesBeyond63Bits() {
        // Long.MIN_VALUE * 2^-64 is exactly -1/2: a tie. Source: JDK BigDecimal.
        OverflowCounter counter = new OverflowCounter("test");
        QFormat q70 = QFormat.parse("Q7.0");
        for (Rounding r : Rounding.values()) {
            for (Overflow o : Overflow.values()) {
                for (long v : new long[] {Long.MIN_VALUE, Long.MAX_VALUE, -1, 1, 0, 3L << 61}) {
                    for (int frac : new int[] {-200, -70, -64, -63, -57, -1, 0, 1, 62, 63, 64, 65, 66, 127, 128, 500}) {
                        counter.reset();
                        long got = FixedPoint.fit(v, frac, q70, r, o, counter);
                        Expect.same(Oracle.fit(Oracle.real(v, frac), q70, r, o), got, counter.events(),
                                () -> "fit(" + v + ", " + frac + " -> Q7.0, " + r + ", " + o + ")");
                    }
                }
            }
        }
    }

    @Test
    void operandsOutsideTheirFormatAreRejectedWithAMessage() {
        QFormat q70 = QFormat.parse("Q7.0");
        OverflowCounter counter = new OverflowCounter("test");
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> FixedPoint.add(300, q70, 1, q70, q70, Rounding.FLOOR, Overflow.WRAP, counter));
        assertEquals("a = 300 is not a code of Q7.0 (codes -128..127)", e.getMessage());
        e = assertThrows(IllegalArgumentException.class,
                () -> FixedPoint.multiply(1, q70, -129, q70, q70, Rounding.FLOOR, Overflow.WRAP, counter));
        assertEquals("b = -129 is not a code of Q7.0 (codes -128..127)", e.getMessage());
        assertThrows(IllegalArgumentException.class,
                () -> FixedPoint.requantize(128, q70, q70, Rounding.FLOOR, Overflow.WRAP, counter));
        assertThrows(IllegalArgumentException.class, () -> FixedPoint.negate(-129, q70, Overflow.WRAP, counter));
    }

    @Test
    void nanAndInfinityAreRejectedNeverCoded() {
        QFormat q15 = QFormat.parse("Q15");
        OverflowCounter counter = new OverflowCounter("test");
        for (double bad : new double[] {Double.NaN, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY}) {
            IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                    () -> FixedPoint.quantize(bad, q15, Rounding.HALF_EVEN, Overflow.SATURATE, counter));
            assertEquals("cannot quantize " + bad + " to Q0.15: only finite values have a code", e.getMessage());
        }
        Quantizer quantizer = new Quantizer(q15, Rounding.HALF_UP, Overflow.SATURATE);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> quantizer.quantize(
                new double[] {0.5, Double.NaN}, 0, new long[2], 0, 2, counter));
        assertEquals("value at index 1 is NaN: only finite values have a code in Q0.15", e.getMessage());
        assertEquals(0, counter.events());
    }

    @Test
    void clampCountsOnlyWhenItActs() {
        OverflowCounter counter = new OverflowCounter("llr-clip");
        assertEquals(5, FixedPoint.clamp(5, -7, 7, counter));
        assertEquals(7, FixedPoint.clamp(8, -7, 7, counter));
        assertEquals(-7, FixedPoint.clamp(-100, -7, 7, counter));
        assertEquals(-7, FixedPoint.clamp(-7, -7, 7, counter));
        assertEquals(2, counter.events());
        assertThrows(IllegalArgumentException.class, () -> FixedPoint.clamp(0, 1, -1, counter));
    }

    @Test
    void quantizerBatchEqualsOneByOneAndReadsItsOwnText() {
        Quantizer q = Quantizer.parse("Q3.8 half-up saturate");
        assertEquals(new Quantizer(QFormat.parse("Q3.8"), Rounding.HALF_UP, Overflow.SATURATE), q);
        assertEquals(q, Quantizer.parse(q.toString()));
        double[] x = {0.1, -8.5, 7.999, 9.0, -0.001953125, 1e10};
        long[] codes = new long[x.length + 2];
        OverflowCounter batch = new OverflowCounter("batch");
        q.quantize(x, 0, codes, 1, x.length, batch);
        OverflowCounter single = new OverflowCounter("single");
        for (int i = 0; i < x.length; i++) {
            assertEquals(q.quantize(x[i], single), codes[i + 1]);
        }
        assertEquals(single.events(), batch.events());
        // 7.999 · 2^8 = 2047.744 rounds to 2048; with -8.5, 9.0 and 1e10 four values leave [-2048, 2047].
        assertEquals(4, batch.events());
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Quantizer.parse("Q3.8"));
        assertTrue(e.getMessage().startsWith("'Q3.8' is not a quantizer"), e.getMessage());
    }
}
