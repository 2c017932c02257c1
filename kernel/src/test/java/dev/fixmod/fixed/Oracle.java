package dev.fixmod.fixed;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.RoundingMode;

/**
 * The exact oracle for the fixed-point model, built on JDK {@code BigDecimal} and {@code BigInteger} only and
 * sharing no code with the model: real values are exact decimals, each rounding mode is mapped explicitly to its
 * {@code BigDecimal} counterpart and each overflow mode is written out from its definition.
 */
final class Oracle {

    /** A code and whether the stage had to record an overflow event for it. */
    record Result(long code, boolean event) {
    }

    private static final BigDecimal HALF = new BigDecimal("0.5");

    private Oracle() {
    }

    /** The exact real value of {@code code · 2^-fractionalBits}. */
    static BigDecimal real(long code, int fractionalBits) {
        return timesPowerOfTwo(new BigDecimal(code), -fractionalBits);
    }

    /** {@code v · 2^k}, exact: 2^-k is the terminating decimal 5^k · 10^-k. */
    static BigDecimal timesPowerOfTwo(BigDecimal v, int k) {
        return v.multiply(powerOfTwo(k));
    }

    private static final int CACHED = 600;
    private static final BigDecimal[] POWERS = new BigDecimal[2 * CACHED + 1];

    private static BigDecimal powerOfTwo(int k) {
        if (Math.abs(k) > CACHED) {
            return exactPowerOfTwo(k);
        }
        BigDecimal p = POWERS[k + CACHED];
        if (p == null) {
            p = exactPowerOfTwo(k);
            POWERS[k + CACHED] = p;
        }
        return p;
    }

    private static BigDecimal exactPowerOfTwo(int k) {
        return k >= 0 ? new BigDecimal(BigInteger.ONE.shiftLeft(k))
                : new BigDecimal(BigInteger.valueOf(5).pow(-k), -k); // 2^-k = 5^k / 10^k
    }

    /**
     * Rounds to an integer. Mapping of our trade names to the JDK (source: java.math.RoundingMode documentation):
     * floor = FLOOR, ceil = CEILING, toward-zero = DOWN, half-away = HALF_UP (the JDK's HALF_UP rounds ties away
     * from zero), half-even = HALF_EVEN; half-up (ties toward +inf) has no JDK mode: FLOOR of (x + 1/2).
     */
    static BigInteger round(BigDecimal x, Rounding rounding) {
        BigDecimal r = switch (rounding) {
            case FLOOR -> x.setScale(0, RoundingMode.FLOOR);
            case CEIL -> x.setScale(0, RoundingMode.CEILING);
            case TOWARD_ZERO -> x.setScale(0, RoundingMode.DOWN);
            case HALF_AWAY -> x.setScale(0, RoundingMode.HALF_UP);
            case HALF_EVEN -> x.setScale(0, RoundingMode.HALF_EVEN);
            case HALF_UP -> x.add(HALF).setScale(0, RoundingMode.FLOOR);
        };
        return r.toBigIntegerExact();
    }

    /** Brings an exact integer into {@code format} by the definition of each overflow mode. */
    static Result overflow(BigInteger v, QFormat format, Overflow overflow) {
        BigInteger min = BigInteger.valueOf(format.minCode());
        BigInteger max = BigInteger.valueOf(format.maxCode());
        switch (overflow) {
            case SATURATE:
                if (v.compareTo(max) > 0) {
                    return new Result(max.longValueExact(), true);
                }
                if (v.compareTo(min) < 0) {
                    return new Result(min.longValueExact(), true);
                }
                return new Result(v.longValueExact(), false);
            case SYMMETRIC_SATURATE:
                BigInteger low = format.isSigned() ? max.negate() : min;
                if (v.compareTo(max) > 0) {
                    return new Result(max.longValueExact(), true);
                }
                if (v.compareTo(low) < 0) {
                    return new Result(low.longValueExact(), true);
                }
                return new Result(v.longValueExact(), false);
            case WRAP:
                // Two's complement modulo 2^W: the residue in [0, 2^W), moved to [-2^(W-1), 2^(W-1)) if signed.
                BigInteger modulus = BigInteger.ONE.shiftLeft(format.wordLength());
                BigInteger r = v.mod(modulus);
                if (format.isSigned() && r.testBit(format.wordLength() - 1)) {
                    r = r.subtract(modulus);
                }
                boolean outside = v.compareTo(min) < 0 || v.compareTo(max) > 0;
                return new Result(r.longValueExact(), outside);
            default:
                throw new AssertionError(overflow);
        }
    }

    /** The code of the exact real {@code value} in {@code format}. */
    static Result fit(BigDecimal value, QFormat format, Rounding rounding, Overflow overflow) {
        BigInteger integral = round(timesPowerOfTwo(value, format.fractionalBits()), rounding);
        return overflow(integral, format, overflow);
    }

    /**
     * {@link #fit} for every mode at once (each rounding computed once), indexed by
     * {@code rounding.ordinal() * Overflow.values().length + overflow.ordinal()}.
     */
    static Result[] fitAllModes(BigDecimal value, QFormat format) {
        Overflow[] overflows = Overflow.values();
        Result[] results = new Result[Rounding.values().length * overflows.length];
        BigDecimal scaled = timesPowerOfTwo(value, format.fractionalBits());
        for (Rounding r : Rounding.values()) {
            BigInteger integral = round(scaled, r);
            for (Overflow o : overflows) {
                results[r.ordinal() * overflows.length + o.ordinal()] = overflow(integral, format, o);
            }
        }
        return results;
    }

    /** The index of a mode pair in {@link #fitAllModes}. */
    static int index(Rounding r, Overflow o) {
        return r.ordinal() * Overflow.values().length + o.ordinal();
    }

    /** The code of the double {@code x} (exact binary value via {@code new BigDecimal(double)}). */
    static Result quantize(double x, QFormat format, Rounding rounding, Overflow overflow) {
        return fit(new BigDecimal(x), format, rounding, overflow);
    }
}
