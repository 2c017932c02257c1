package dev.fixmod.fixed;

/**
 * Exact operations on raw integer codes. Every operation computes its result exactly (in 64 bits, or 128 bits where
 * 32-bit unsigned operands need more), then brings it into an explicit result format with one {@link Rounding} and
 * one {@link Overflow} mode, recording overflow events on the caller's {@link OverflowCounter}. Operands must be codes
 * of their formats. Except for {@link #quantize}, all operations are integer-only and allocate nothing.
 *
 * <table class="striped">
 *   <caption>Examples with half-up and saturate; * marks an overflow event</caption>
 *   <thead><tr><th>operation</th><th>result</th><th>why</th></tr></thead>
 *   <tbody>
 *     <tr><td>{@code quantize(0.3, Q0.7)}</td><td>38</td><td>0.3 · 128 = 38.4</td></tr>
 *     <tr><td>{@code requantize(255, Q3.8 → Q3.4)}</td><td>16</td><td>255 / 16 = 15.9375 (0.99609375 → 1.0)</td></tr>
 *     <tr><td>{@code multiply(-32768, Q15, -32768, Q15 → Q1.30)}</td><td>1073741824</td>
 *         <td>(−1)·(−1) = 1 = 2^30 LSB needs the product format's extra integer bit</td></tr>
 *     <tr><td>{@code multiply(-32768, Q15, -32768, Q15 → Q15)}</td><td>32767*</td>
 *         <td>1.0 is not a Q15 value</td></tr>
 *     <tr><td>{@code negate(-128, Q7.0)}</td><td>127*</td><td>+128 is not a Q7.0 code</td></tr>
 *   </tbody>
 * </table>
 */
public final class FixedPoint {

    private static final double TWO_POW_62 = 0x1p62;

    private FixedPoint() {
    }

    /**
     * The code of {@code x} in {@code format}: {@code x · 2^n} rounded by {@code rounding}, then fitted by
     * {@code overflow}. Exact for every finite double, including subnormals, {@code -0.0} (code 0) and values far
     * beyond the range (saturated, or wrapped modulo {@code 2^W} exactly).
     *
     * @throws IllegalArgumentException if {@code x} is NaN or infinite: such values have no code
     */
    public static long quantize(double x, QFormat format, Rounding rounding, Overflow overflow,
                                OverflowCounter counter) {
        if (Double.isNaN(x) || Double.isInfinite(x)) {
            throw new IllegalArgumentException("cannot quantize " + x + " to " + format
                    + ": only finite values have a code");
        }
        double scaled = Math.scalb(x, format.fractionalBits()); // exact: scaling up by 2^n cannot lose bits
        if (Math.abs(scaled) < TWO_POW_62) {
            return overflow.apply((long) rounding.roundToIntegral(scaled), format, counter);
        }
        // Far out of range, possibly even beyond the double range once scaled. Such an x·2^n is an integer, so its
        // IEEE remainder modulo 2^(W-n) (always exact) scales to an integer congruent to x·2^n modulo 2^W: the low
        // bits that wrapping keeps.
        double reduced = Math.IEEEremainder(x, Math.scalb(1.0, format.wordLength() - format.fractionalBits()));
        return overflow.beyond(x < 0, (long) Math.scalb(reduced, format.fractionalBits()), format, counter);
    }

    /**
     * Fits an exact intermediate {@code value · 2^-valueFractionalBits} into {@code to}: shifts right with
     * {@code rounding} (or left, exactly), then applies {@code overflow}. Any {@code valueFractionalBits} is accepted,
     * negative ones included.
     */
    public static long fit(long value, int valueFractionalBits, QFormat to, Rounding rounding, Overflow overflow,
                           OverflowCounter counter) {
        long shift = (long) valueFractionalBits - to.fractionalBits();
        if (shift == 0) {
            return overflow.apply(value, to, counter);
        }
        if (shift > 0) {
            if (shift <= 63) {
                return overflow.apply(rounding.shiftRight(value, (int) shift), to, counter);
            }
            return roundWide(value >> 63, value, shift, to, rounding, overflow, counter);
        }
        long left = -shift;
        if (value == 0) {
            return overflow.apply(0, to, counter);
        }
        if (left <= 62 && (value << left) >> left == value) {
            return overflow.apply(value << left, to, counter);
        }
        // |value · 2^left| >= 2^63: beyond every format; its low 64 bits are value << left (0 from 64 on).
        return overflow.beyond(value < 0, left < 64 ? value << left : 0, to, counter);
    }

    /**
     * Converts a code of {@code from} into {@code to}, rounding when fractional bits are dropped.
     *
     * @throws IllegalArgumentException if {@code code} is not a code of {@code from}
     */
    public static long requantize(long code, QFormat from, QFormat to, Rounding rounding, Overflow overflow,
                                  OverflowCounter counter) {
        from.requireCode(code, "code");
        return fit(code, from.fractionalBits(), to, rounding, overflow, counter);
    }

    /**
     * {@code a + b}, exact, then fitted into {@code to}. {@link #sumFormat} is the format that holds every sum.
     *
     * @throws IllegalArgumentException if {@code a} or {@code b} is not a code of its format
     */
    public static long add(long a, QFormat fa, long b, QFormat fb, QFormat to, Rounding rounding, Overflow overflow,
                           OverflowCounter counter) {
        return addOrSubtract(a, fa, b, fb, false, to, rounding, overflow, counter);
    }

    /**
     * {@code a − b}, exact, then fitted into {@code to}. {@link #differenceFormat} is the format that holds every
     * difference.
     *
     * @throws IllegalArgumentException if {@code a} or {@code b} is not a code of its format
     */
    public static long subtract(long a, QFormat fa, long b, QFormat fb, QFormat to, Rounding rounding,
                                Overflow overflow, OverflowCounter counter) {
        return addOrSubtract(a, fa, b, fb, true, to, rounding, overflow, counter);
    }

    private static long addOrSubtract(long a, QFormat fa, long b, QFormat fb, boolean subtract, QFormat to,
                                      Rounding rounding, Overflow overflow, OverflowCounter counter) {
        fa.requireCode(a, "a");
        fb.requireCode(b, "b");
        int frac = Math.max(fa.fractionalBits(), fb.fractionalBits());
        int da = frac - fa.fractionalBits();
        int db = frac - fb.fractionalBits();
        if (fa.wordLength() + da <= 62 && fb.wordLength() + db <= 62) {
            // Both aligned operands lie within ±2^62, so their sum or difference fits a long.
            long sum = subtract ? (a << da) - (b << db) : (a << da) + (b << db);
            return fit(sum, frac, to, rounding, overflow, counter);
        }
        // Aligning a 32-bit operand by up to 32 bits can need 64 bits: work in 128 (hi:lo).
        long aLo = a << da;
        long aHi = da == 0 ? a >> 63 : a >> (64 - da);
        long bLo = b << db;
        long bHi = db == 0 ? b >> 63 : b >> (64 - db);
        long lo;
        long hi;
        if (subtract) {
            lo = aLo - bLo;
            hi = aHi - bHi - (Long.compareUnsigned(aLo, bLo) < 0 ? 1 : 0);
        } else {
            lo = aLo + bLo;
            hi = aHi + bHi + (Long.compareUnsigned(lo, aLo) < 0 ? 1 : 0);
        }
        return fitWide(hi, lo, frac, to, rounding, overflow, counter);
    }

    /**
     * {@code a · b}, exact (fractional bits add up), then fitted into {@code to}. {@link #productFormat} is the
     * format that holds every product without rounding or overflow.
     *
     * @throws IllegalArgumentException if {@code a} or {@code b} is not a code of its format
     */
    public static long multiply(long a, QFormat fa, long b, QFormat fb, QFormat to, Rounding rounding,
                                Overflow overflow, OverflowCounter counter) {
        fa.requireCode(a, "a");
        fb.requireCode(b, "b");
        int frac = fa.fractionalBits() + fb.fractionalBits();
        if (fa.wordLength() + fb.wordLength() <= 63) {
            return fit(a * b, frac, to, rounding, overflow, counter); // |a·b| < 2^63
        }
        // Two 32-bit unsigned codes (or 32 × 31 bits): the product can need 64 bits unsigned.
        return fitWide(Math.multiplyHigh(a, b), a * b, frac, to, rounding, overflow, counter);
    }

    /**
     * {@code −a} in {@code format}. Negating the most negative code (or any non-zero code of an unsigned format) is
     * an overflow handled by {@code overflow}: saturate gives the largest code, wrap gives {@code a} back.
     *
     * @throws IllegalArgumentException if {@code a} is not a code of {@code format}
     */
    public static long negate(long a, QFormat format, Overflow overflow, OverflowCounter counter) {
        format.requireCode(a, "a");
        return overflow.apply(-a, format, counter);
    }

    /**
     * {@code |a|} in {@code format}; the magnitude of the most negative code is an overflow handled by
     * {@code overflow}.
     *
     * @throws IllegalArgumentException if {@code a} is not a code of {@code format}
     */
    public static long abs(long a, QFormat format, Overflow overflow, OverflowCounter counter) {
        format.requireCode(a, "a");
        return overflow.apply(Math.abs(a), format, counter);
    }

    /**
     * Clamps {@code a} to {@code [low, high]}, recording an event when it had to act (a limiter stage, e.g. an LLR
     * clipped to ±L before a narrower output).
     *
     * @throws IllegalArgumentException if {@code low > high}
     */
    public static long clamp(long a, long low, long high, OverflowCounter counter) {
        if (low > high) {
            throw new IllegalArgumentException("clamp bounds reversed: low " + low + " > high " + high);
        }
        if (a < low) {
            counter.record();
            return low;
        }
        if (a > high) {
            counter.record();
            return high;
        }
        return a;
    }

    /**
     * The format of the exact sum of any code of {@code a} and any code of {@code b}: the larger fractional part and
     * one more integer bit than the larger integer part; signed if either is.
     *
     * @throws IllegalArgumentException if that needs more than {@value QFormat#MAX_WORD_LENGTH} bits
     */
    public static QFormat sumFormat(QFormat a, QFormat b) {
        int frac = Math.max(a.fractionalBits(), b.fractionalBits());
        int integer = Math.max(a.integerBits(), b.integerBits()) + 1;
        return grown(a.isSigned() || b.isSigned(), integer, frac, "sum", a, b);
    }

    /**
     * The format of the exact difference {@code a − b} of any codes: always signed; the larger fractional part; the
     * larger integer part, plus one unless both are unsigned (then {@code a − b} lies in {@code (−2^mb, 2^ma)}).
     *
     * @throws IllegalArgumentException if that needs more than {@value QFormat#MAX_WORD_LENGTH} bits
     */
    public static QFormat differenceFormat(QFormat a, QFormat b) {
        int frac = Math.max(a.fractionalBits(), b.fractionalBits());
        boolean bothUnsigned = !a.isSigned() && !b.isSigned();
        int integer = Math.max(a.integerBits(), b.integerBits()) + (bothUnsigned ? 0 : 1);
        return grown(true, integer, frac, "difference", a, b);
    }

    /**
     * The format of the exact product of any code of {@code a} and any code of {@code b}. For two signed formats this
     * is {@code Q(ma+mb+1).(na+nb)}: the extra integer bit holds (most negative)², e.g. Q15 × Q15 → Q1.30.
     *
     * @throws IllegalArgumentException if that needs more than {@value QFormat#MAX_WORD_LENGTH} bits
     */
    public static QFormat productFormat(QFormat a, QFormat b) {
        int frac = a.fractionalBits() + b.fractionalBits();
        boolean signed = a.isSigned() || b.isSigned();
        int integer = a.integerBits() + b.integerBits() + (a.isSigned() && b.isSigned() ? 1 : 0);
        return grown(signed, integer, frac, "product", a, b);
    }

    private static QFormat grown(boolean signed, int integer, int frac, String what, QFormat a, QFormat b) {
        int word = (signed ? 1 : 0) + integer + frac;
        if (word > QFormat.MAX_WORD_LENGTH) {
            throw new IllegalArgumentException("the exact " + what + " of " + a + " and " + b + " needs " + word
                    + " bits, more than " + QFormat.MAX_WORD_LENGTH + "; give an explicit narrower result format");
        }
        return signed ? QFormat.signed(integer, frac) : QFormat.unsigned(integer, frac);
    }

    /** {@link #fit} for an exact 128-bit value {@code hi:lo} (two's complement), |value| &lt; 2^66 here. */
    private static long fitWide(long hi, long lo, int fractionalBits, QFormat to, Rounding rounding,
                                Overflow overflow, OverflowCounter counter) {
        if (hi == lo >> 63) {
            return fit(lo, fractionalBits, to, rounding, overflow, counter);
        }
        long shift = (long) fractionalBits - to.fractionalBits();
        if (shift <= 0) {
            // |value| >= 2^63 before an exact left shift: beyond every format.
            return overflow.beyond(hi < 0, -shift < 64 ? lo << -shift : 0, to, counter);
        }
        return roundWide(hi, lo, shift, to, rounding, overflow, counter);
    }

    /**
     * Rounds the 128-bit value {@code hi:lo · 2^-shift} (shift &gt;= 1, |value| &lt; 2^126) and fits it: the same
     * decision as {@link Rounding#shiftRight}, spread over two words.
     */
    private static long roundWide(long hi, long lo, long shift, QFormat to, Rounding rounding, Overflow overflow,
                                  OverflowCounter counter) {
        if (shift >= 128) {
            // |quotient| < 1/4: only the sign matters, as it does for the stand-in (−1, 0 or 1) / 4.
            long sign = hi < 0 ? -1 : (hi | lo) != 0 ? 1 : 0;
            hi = sign >> 63;
            lo = sign;
            shift = 2;
        }
        int s = (int) shift;
        long qLo;
        long qHi;
        long remHi;
        long remLo;
        long halfHi;
        long halfLo;
        if (s < 64) {
            qLo = (lo >>> s) | (hi << (64 - s));
            qHi = hi >> s;
            remHi = 0;
            remLo = lo & ((1L << s) - 1);
            halfHi = 0;
            halfLo = 1L << (s - 1);
        } else if (s == 64) {
            qLo = hi;
            qHi = hi >> 63;
            remHi = 0;
            remLo = lo;
            halfHi = 0;
            halfLo = Long.MIN_VALUE; // 2^63 read unsigned
        } else {
            int t = s - 64;
            qLo = hi >> t;
            qHi = hi >> 63;
            remHi = hi & ((1L << t) - 1);
            remLo = lo;
            halfHi = 1L << (t - 1);
            halfLo = 0;
        }
        if ((remHi | remLo) != 0) {
            int vsHalf = remHi != halfHi ? Long.compareUnsigned(remHi, halfHi) : Long.compareUnsigned(remLo, halfLo);
            if (rounding.roundsUp(hi < 0, vsHalf, (qLo & 1) != 0)) {
                qLo++;
                if (qLo == 0) {
                    qHi++;
                }
            }
        }
        if (qHi == qLo >> 63) {
            return overflow.apply(qLo, to, counter);
        }
        return overflow.beyond(qHi < 0, qLo, to, counter);
    }
}
