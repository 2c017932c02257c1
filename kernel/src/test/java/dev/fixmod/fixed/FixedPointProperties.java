package dev.fixmod.fixed;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.From;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.Size;

/**
 * Laws of the fixed-point model over 16- to 32-bit formats, each checked against the exact oracle (JDK BigDecimal /
 * BigInteger, see {@link Oracle}) or stated from the definitions of the modes.
 */
class FixedPointProperties {

    /** A format and a double to quantize into it. */
    record Sample(QFormat format, double x) {
    }

    /** Two operands with their formats and a result format. */
    record Operands(long a, QFormat fa, long b, QFormat fb, QFormat to) {
    }

    // ---- quantize --------------------------------------------------------------------------------------------

    @Property(tries = 400)
    void quantizeMatchesTheOracleInEveryMode(@ForAll("samples") Sample s) {
        // Source: JDK BigDecimal (exact value of the double, explicit mode mapping in Oracle).
        Oracle.Result[] all = Oracle.fitAllModes(new BigDecimal(s.x()), s.format());
        OverflowCounter counter = new OverflowCounter("test");
        for (Rounding r : Rounding.values()) {
            for (Overflow o : Overflow.values()) {
                counter.reset();
                long code = FixedPoint.quantize(s.x(), s.format(), r, o, counter);
                Expect.same(all[Oracle.index(r, o)], code, counter.events(),
                        () -> "quantize(" + s.x() + ", " + s.format() + ", " + r + ", " + o + ")");
            }
        }
    }

    @Property(tries = 300)
    void roundToIntegralMatchesTheOracleForAnyFiniteDouble(@ForAll("anyFinite") double x) {
        for (Rounding r : Rounding.values()) {
            BigDecimal expected = new BigDecimal(Oracle.round(new BigDecimal(x), r));
            double got = r.roundToIntegral(x);
            assertEquals(0, expected.compareTo(new BigDecimal(got)), r + " " + x);
            assertEquals(0L, Double.doubleToRawLongBits(got) & Long.MIN_VALUE & (got == 0 ? -1 : 0),
                    "never -0.0: " + r + " " + x);
        }
    }

    // ---- exact operations ------------------------------------------------------------------------------------

    @Property(tries = 300)
    void addMatchesTheOracle(@ForAll("operands") Operands p) {
        BigDecimal exact = Oracle.real(p.a(), p.fa().fractionalBits()).add(Oracle.real(p.b(), p.fb().fractionalBits()));
        checkAllModes(exact, p.to(), (r, o, c) -> FixedPoint.add(p.a(), p.fa(), p.b(), p.fb(), p.to(), r, o, c),
                "add " + p);
    }

    @Property(tries = 300)
    void subtractMatchesTheOracle(@ForAll("operands") Operands p) {
        BigDecimal exact = Oracle.real(p.a(), p.fa().fractionalBits())
                .subtract(Oracle.real(p.b(), p.fb().fractionalBits()));
        checkAllModes(exact, p.to(), (r, o, c) -> FixedPoint.subtract(p.a(), p.fa(), p.b(), p.fb(), p.to(), r, o, c),
                "subtract " + p);
    }

    @Property(tries = 300)
    void multiplyMatchesTheOracle(@ForAll("operands") Operands p) {
        BigDecimal exact = Oracle.real(p.a(), p.fa().fractionalBits())
                .multiply(Oracle.real(p.b(), p.fb().fractionalBits()));
        checkAllModes(exact, p.to(), (r, o, c) -> FixedPoint.multiply(p.a(), p.fa(), p.b(), p.fb(), p.to(), r, o, c),
                "multiply " + p);
    }

    @Property(tries = 300)
    void requantizeMatchesTheOracle(@ForAll("operands") Operands p) {
        checkAllModes(Oracle.real(p.a(), p.fa().fractionalBits()), p.to(),
                (r, o, c) -> FixedPoint.requantize(p.a(), p.fa(), p.to(), r, o, c), "requantize " + p);
    }

    @Property(tries = 300)
    void negateAndAbsMatchTheOracle(@ForAll("operands") Operands p) {
        BigDecimal ra = Oracle.real(p.a(), p.fa().fractionalBits());
        OverflowCounter counter = new OverflowCounter("test");
        for (Overflow o : Overflow.values()) {
            counter.reset();
            long neg = FixedPoint.negate(p.a(), p.fa(), o, counter);
            Expect.same(Oracle.fit(ra.negate(), p.fa(), Rounding.FLOOR, o), neg, counter.events(), () -> "negate " + p);
            counter.reset();
            long abs = FixedPoint.abs(p.a(), p.fa(), o, counter);
            Expect.same(Oracle.fit(ra.abs(), p.fa(), Rounding.FLOOR, o), abs, counter.events(), () -> "abs " + p);
        }
    }

    @Property(tries = 300)
    void fitMatchesTheOracleForAnyLongAndAnyShift(@ForAll long value, @ForAll @IntRange(min = -80, max = 150) int frac,
                                                  @ForAll("formats") QFormat to) {
        checkAllModes(Oracle.real(value, frac), to, (r, o, c) -> FixedPoint.fit(value, frac, to, r, o, c),
                "fit(" + value + ", " + frac + " -> " + to + ")");
    }

    @Property(tries = 300)
    void shiftRightMatchesTheOracle(@ForAll long value, @ForAll @IntRange(min = 0, max = 63) int shift) {
        for (Rounding r : Rounding.values()) {
            assertEquals(Oracle.round(Oracle.real(value, shift), r).longValueExact(), r.shiftRight(value, shift),
                    r + " " + value + " >> " + shift);
        }
    }

    @Property(tries = 200)
    void exactFormatsHoldEveryResult(@ForAll("narrowOperands") Operands p) {
        // Bit growth (common practice, no source): the grown formats need neither rounding nor overflow. Operands
        // of 8 to 15 bits, so that the grown formats (up to 32 bits) exist.
        OverflowCounter counter = new OverflowCounter("test");
        List<QFormat> grown = List.of(FixedPoint.sumFormat(p.fa(), p.fb()), FixedPoint.differenceFormat(p.fa(), p.fb()));
        long sum = FixedPoint.add(p.a(), p.fa(), p.b(), p.fb(), grown.get(0), Rounding.FLOOR, Overflow.WRAP, counter);
        long diff = FixedPoint.subtract(p.a(), p.fa(), p.b(), p.fb(), grown.get(1), Rounding.FLOOR, Overflow.WRAP,
                counter);
        assertEquals(0, counter.events(), p.toString());
        BigDecimal ra = Oracle.real(p.a(), p.fa().fractionalBits());
        BigDecimal rb = Oracle.real(p.b(), p.fb().fractionalBits());
        assertEquals(0, ra.add(rb).compareTo(Oracle.real(sum, grown.get(0).fractionalBits())));
        assertEquals(0, ra.subtract(rb).compareTo(Oracle.real(diff, grown.get(1).fractionalBits())));
    }

    // ---- overflow laws ---------------------------------------------------------------------------------------

    @Property(tries = 300)
    void wrapIsTwosComplementModulo2PowW(@ForAll long value, @ForAll @IntRange(min = -40, max = 100) int frac,
                                         @ForAll("formats") QFormat to) {
        // Definition of wrap; oracle: BigInteger mod 2^W of the exactly rounded value.
        BigInteger modulus = BigInteger.ONE.shiftLeft(to.wordLength());
        for (Rounding r : Rounding.values()) {
            BigInteger exact = Oracle.round(Oracle.timesPowerOfTwo(Oracle.real(value, frac), to.fractionalBits()), r);
            long got = FixedPoint.fit(value, frac, to, r, Overflow.WRAP, OverflowCounter.unnamed());
            assertTrue(to.contains(got), got + " in " + to);
            assertEquals(BigInteger.ZERO, BigInteger.valueOf(got).subtract(exact).mod(modulus),
                    "wrap " + value + " / 2^" + frac + " -> " + to + " " + r);
        }
    }

    @Property(tries = 300)
    void symmetricSaturateNeverEmitsTheMostNegativeCode(@ForAll("operands") Operands p,
                                                        @ForAll("samples") Sample s) {
        OverflowCounter c = OverflowCounter.unnamed();
        Overflow sym = Overflow.SYMMETRIC_SATURATE;
        for (Rounding r : Rounding.values()) {
            long[] results = {
                FixedPoint.add(p.a(), p.fa(), p.b(), p.fb(), p.to(), r, sym, c),
                FixedPoint.subtract(p.a(), p.fa(), p.b(), p.fb(), p.to(), r, sym, c),
                FixedPoint.multiply(p.a(), p.fa(), p.b(), p.fb(), p.to(), r, sym, c),
                FixedPoint.requantize(p.a(), p.fa(), p.to(), r, sym, c),
            };
            for (long v : results) {
                assertTrue(p.to().contains(v));
                if (p.to().isSigned()) {
                    assertNotEquals(p.to().minCode(), v, p + " " + r);
                }
            }
            long q = FixedPoint.quantize(s.x(), s.format(), r, sym, c);
            if (s.format().isSigned()) {
                assertNotEquals(s.format().minCode(), q, s + " " + r);
            }
        }
        long n = FixedPoint.negate(p.a(), p.fa(), sym, c);
        long a = FixedPoint.abs(p.a(), p.fa(), sym, c);
        if (p.fa().isSigned()) {
            assertNotEquals(p.fa().minCode(), n);
            assertNotEquals(p.fa().minCode(), a);
        }
    }

    @Property(tries = 100)
    void theCounterCountsExactlyTheOutOfRangeResults(@ForAll @Size(min = 1, max = 60) List<@From("samples") Sample> samples) {
        // One counter per mode across a whole batch: its total equals the number of results that, by the oracle,
        // fell outside the codes the mode may return.
        int modes = Rounding.values().length * Overflow.values().length;
        OverflowCounter[] counters = new OverflowCounter[modes];
        long[] expected = new long[modes];
        for (int i = 0; i < modes; i++) {
            counters[i] = new OverflowCounter("stage " + i);
        }
        for (Sample s : samples) {
            Oracle.Result[] all = Oracle.fitAllModes(new BigDecimal(s.x()), s.format());
            for (Rounding r : Rounding.values()) {
                for (Overflow o : Overflow.values()) {
                    int i = Oracle.index(r, o);
                    FixedPoint.quantize(s.x(), s.format(), r, o, counters[i]);
                    expected[i] += all[i].event() ? 1 : 0;
                }
            }
        }
        for (int i = 0; i < modes; i++) {
            assertEquals(expected[i], counters[i].events(), "mode pair " + i);
        }
    }

    @Property(tries = 200)
    void requantizingIntoAWiderFormatAndBackIsTheIdentity(@ForAll("operands") Operands p) {
        // Common practice, no source: widening both integer and fractional parts is exact, so narrowing back with
        // any mode returns the code.
        QFormat f = p.fa();
        int extraFrac = Math.min(3, QFormat.MAX_WORD_LENGTH - f.wordLength());
        int extraInt = Math.min(2, QFormat.MAX_WORD_LENGTH - f.wordLength() - extraFrac);
        QFormat wide = f.isSigned() ? QFormat.signed(f.integerBits() + extraInt, f.fractionalBits() + extraFrac)
                : QFormat.unsigned(f.integerBits() + extraInt, f.fractionalBits() + extraFrac);
        OverflowCounter counter = new OverflowCounter("test");
        for (Rounding r : Rounding.values()) {
            long up = FixedPoint.requantize(p.a(), f, wide, r, Overflow.WRAP, counter);
            assertEquals(p.a(), FixedPoint.requantize(up, wide, f, r, Overflow.WRAP, counter));
        }
        assertEquals(0, counter.events());
    }

    // ---- helpers ---------------------------------------------------------------------------------------------

    interface Op {
        long apply(Rounding r, Overflow o, OverflowCounter c);
    }

    private static void checkAllModes(BigDecimal exact, QFormat to, Op op, String what) {
        Oracle.Result[] all = Oracle.fitAllModes(exact, to);
        OverflowCounter counter = new OverflowCounter("test");
        for (Rounding r : Rounding.values()) {
            for (Overflow o : Overflow.values()) {
                counter.reset();
                long got = op.apply(r, o, counter);
                Expect.same(all[Oracle.index(r, o)], got, counter.events(), () -> what + " " + r + " " + o);
            }
        }
    }

    @Provide
    Arbitrary<QFormat> formats() {
        return Arbitraries.integers().between(16, 32).flatMap(w -> Arbitraries.of(true, false).flatMap(signed ->
                Arbitraries.integers().between(0, signed ? w - 1 : w).map(n ->
                        signed ? QFormat.signedWord(w, n) : QFormat.unsignedWord(w, n))));
    }

    @Provide
    Arbitrary<Sample> samples() {
        return formats().flatMap(f -> Arbitraries.frequencyOf(
                net.jqwik.api.Tuple.of(6, nearCodes(f)),
                net.jqwik.api.Tuple.of(1, special()),
                net.jqwik.api.Tuple.of(1, anyFinite())).map(x -> new Sample(f, x)));
    }

    /** Codes just inside and outside the range, ties at half an LSB, one ulp either side, points in between. */
    private static Arbitrary<Double> nearCodes(QFormat f) {
        Arbitrary<Long> codes = Arbitraries.longs().between(f.minCode() - 2, f.maxCode() + 2);
        Arbitrary<Integer> kinds = Arbitraries.integers().between(0, 6);
        Arbitrary<Double> fractions = Arbitraries.doubles().between(0, 1);
        return Combinators.combine(codes, kinds, fractions).as((c, kind, u) -> {
            double onCode = Math.scalb((double) c, -f.fractionalBits()); // exact: |c| < 2^34
            double tie = Math.scalb(c + 0.5, -f.fractionalBits()); // exact
            return switch (kind) {
                case 0 -> onCode;
                case 1 -> tie;
                case 2 -> Math.nextUp(tie);
                case 3 -> Math.nextDown(tie);
                case 4 -> Math.nextUp(onCode);
                case 5 -> Math.nextDown(onCode);
                default -> Math.scalb(c + u, -f.fractionalBits());
            };
        });
    }

    /** -0.0, subnormals, the smallest normal, huge values, the ends of the double range. */
    private static Arbitrary<Double> special() {
        return Arbitraries.oneOf(
                Arbitraries.of(-0.0, 0.0, Double.MIN_VALUE, -Double.MIN_VALUE, Double.MIN_NORMAL,
                        Math.nextDown(Double.MIN_NORMAL), -Double.MIN_NORMAL, Double.MAX_VALUE, -Double.MAX_VALUE,
                        1e300, -1e300, 0x1p62, -0x1p62, Math.nextDown(0x1p62), 0x1p63, -0x1p63, 0x1p64, 0x1p100),
                Arbitraries.longs().between(1, (1L << 52) - 1).map(Double::longBitsToDouble), // subnormals
                Arbitraries.longs().between(1, (1L << 52) - 1).map(bits -> -Double.longBitsToDouble(bits)));
    }

    @Provide
    Arbitrary<Double> anyFinite() {
        // Every bit pattern except NaN and infinity: all exponents, subnormals, both zeros.
        return Arbitraries.longs().map(Double::longBitsToDouble).filter(Double::isFinite);
    }

    @Provide
    Arbitrary<Operands> operands() {
        return Combinators.combine(formats(), formats(), formats()).flatAs((fa, fb, to) ->
                Combinators.combine(codesOf(fa), codesOf(fb)).as((a, b) -> new Operands(a, fa, b, fb, to)));
    }

    @Provide
    Arbitrary<Operands> narrowOperands() {
        Arbitrary<QFormat> narrow = Arbitraries.integers().between(8, 15).flatMap(w ->
                Arbitraries.of(true, false).flatMap(signed -> Arbitraries.integers().between(0, signed ? w - 1 : w)
                        .map(n -> signed ? QFormat.signedWord(w, n) : QFormat.unsignedWord(w, n))));
        return Combinators.combine(narrow, narrow).flatAs((fa, fb) ->
                Combinators.combine(codesOf(fa), codesOf(fb)).as((a, b) -> new Operands(a, fa, b, fb, fa)));
    }

    private static Arbitrary<Long> codesOf(QFormat f) {
        // Edge cases of the range (most negative, largest, 0, ±1) come from jqwik's edge-case generation.
        return Arbitraries.longs().between(f.minCode(), f.maxCode());
    }
}
