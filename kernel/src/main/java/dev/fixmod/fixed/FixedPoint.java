package dev.fixmod.fixed;

/**
 * Exact operations on raw integer codes. Every operation computes its result exactly in a 64-bit intermediate, then
 * brings it into an explicit result format with one {@link Rounding} and one {@link Overflow} mode, counting overflow
 * events on the caller's {@link OverflowCounter}. Except for {@link #quantize}, all operations are integer-only.
 */
public final class FixedPoint {

    private static final double TWO_POW_62 = 0x1p62;

    private FixedPoint() {
    }

    /**
     * The code of {@code x} in {@code format}: {@code x · 2^n} rounded by {@code rounding}, then fitted by
     * {@code overflow}. Exact for every finite double (the oracle is {@code BigDecimal}).
     *
     * @throws IllegalArgumentException if {@code x} is NaN or infinite: such values have no code
     */
    public static long quantize(double x, QFormat format, Rounding rounding, Overflow overflow, OverflowCounter counter) {
        if (Double.isNaN(x) || Double.isInfinite(x)) {
            throw new IllegalArgumentException("cannot quantize " + x + " to " + format + ": only finite values have a code");
        }
        double scaled = Math.scalb(x, format.fractionalBits()); // exact: scaling up by 2^n cannot lose bits
        if (!(Math.abs(scaled) < TWO_POW_62)) {
            // Far out of range (possibly beyond the double range once scaled). Such an x is a multiple of 2^(10-n),
            // so its IEEE remainder modulo 2^(W-n) is exact and scales to an integer code.
            counter.record();
            if (overflow == Overflow.WRAP) {
                double reduced = Math.IEEEremainder(x, Math.scalb(1.0, format.wordLength() - format.fractionalBits()));
                return Overflow.wrapBits((long) Math.scalb(reduced, format.fractionalBits()), format);
            }
            OverflowCounter ignored = OverflowCounter.unnamed();
            return overflow.apply(x > 0 ? Long.MAX_VALUE : Long.MIN_VALUE, format, ignored);
        }
        long integral = (long) rounding.roundToIntegral(scaled);
        return overflow.apply(integral, format, counter);
    }

    /**
     * Fits an exact intermediate {@code value} with {@code valueFractionalBits} fractional bits into {@code to}:
     * shifts right with {@code rounding} (or left, exactly), then applies {@code overflow}.
     */
    public static long fit(long value, int valueFractionalBits, QFormat to, Rounding rounding, Overflow overflow,
                           OverflowCounter counter) {
        int shift = valueFractionalBits - to.fractionalBits();
        long aligned;
        if (shift > 0) {
            // Beyond 62 bits the quotient lies in (-1, 1): its sign and inexactness decide every mode alike.
            aligned = shift > 62 ? rounding.shiftRight(Long.signum(value), 2) : rounding.shiftRight(value, shift);
        } else if (shift < 0) {
            int left = -shift;
            if (value != 0 && (left > 62 || Math.abs(value) > (Long.MAX_VALUE >> (left + 1)))) {
                aligned = value > 0 ? Long.MAX_VALUE / 2 : Long.MIN_VALUE / 2; // certainly out of range
            } else {
                aligned = value << left;
            }
        } else {
            aligned = value;
        }
        return overflow.apply(aligned, to, counter);
    }

    /** Converts a code of {@code from} into {@code to} (rounding when fractional bits are dropped). */
    public static long requantize(long code, QFormat from, QFormat to, Rounding rounding, Overflow overflow,
                                  OverflowCounter counter) {
        return fit(code, from.fractionalBits(), to, rounding, overflow, counter);
    }

    /** {@code a + b}, exact, then fitted into {@code to}. */
    public static long add(long a, QFormat fa, long b, QFormat fb, QFormat to, Rounding rounding, Overflow overflow,
                           OverflowCounter counter) {
        int frac = Math.max(fa.fractionalBits(), fb.fractionalBits());
        long sum = (a << (frac - fa.fractionalBits())) + (b << (frac - fb.fractionalBits()));
        return fit(sum, frac, to, rounding, overflow, counter);
    }

    /** {@code a − b}, exact, then fitted into {@code to}. */
    public static long subtract(long a, QFormat fa, long b, QFormat fb, QFormat to, Rounding rounding,
                                Overflow overflow, OverflowCounter counter) {
        int frac = Math.max(fa.fractionalBits(), fb.fractionalBits());
        long difference = (a << (frac - fa.fractionalBits())) - (b << (frac - fb.fractionalBits()));
        return fit(difference, frac, to, rounding, overflow, counter);
    }

    /**
     * {@code a · b}, exact (fractional bits add up), then fitted into {@code to}. Use
     * {@link #productFormat} for the format that holds every product without rounding or overflow.
     */
    public static long multiply(long a, QFormat fa, long b, QFormat fb, QFormat to, Rounding rounding,
                                Overflow overflow, OverflowCounter counter) {
        return fit(a * b, fa.fractionalBits() + fb.fractionalBits(), to, rounding, overflow, counter);
    }

    /** {@code −a} in {@code format}; negating the most negative code is an overflow handled by {@code overflow}. */
    public static long negate(long a, QFormat format, Overflow overflow, OverflowCounter counter) {
        return overflow.apply(-a, format, counter);
    }

    /** {@code |a|} in {@code format}; the magnitude of the most negative code is an overflow. */
    public static long abs(long a, QFormat format, Overflow overflow, OverflowCounter counter) {
        return overflow.apply(Math.abs(a), format, counter);
    }

    /** Clamps {@code a} to {@code [low, high]}, counting an event when it had to act. */
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
     * one more integer bit than the larger integer part.
     *
     * @throws IllegalArgumentException if that needs more than {@value QFormat#MAX_WORD_LENGTH} bits
     */
    public static QFormat sumFormat(QFormat a, QFormat b) {
        int frac = Math.max(a.fractionalBits(), b.fractionalBits());
        int integer = Math.max(a.integerBits(), b.integerBits()) + 1;
        return grown(a.isSigned() || b.isSigned(), integer, frac, "sum", a, b);
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
}
