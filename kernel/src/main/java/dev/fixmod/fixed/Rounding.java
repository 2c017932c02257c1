package dev.fixmod.fixed;

import java.util.Arrays;
import java.util.Locale;
import java.util.stream.Collectors;

/**
 * How a value that falls between two codes becomes one of them. Each mode is named by the trade name used in the
 * command line, the specification files and the reports ({@link #tradeName()}).
 *
 * <p>The table gives the code chosen for a value expressed in LSBs (i.e. the value divided by the LSB):
 *
 * <table class="striped">
 *   <caption>Results of rounding to an integer number of LSBs</caption>
 *   <thead><tr><th>value (LSB)</th><th>floor</th><th>ceil</th><th>toward-zero</th><th>half-up</th><th>half-away</th><th>half-even</th></tr></thead>
 *   <tbody>
 *     <tr><td>2.5</td><td>2</td><td>3</td><td>2</td><td>3</td><td>3</td><td>2</td></tr>
 *     <tr><td>1.6</td><td>1</td><td>2</td><td>1</td><td>2</td><td>2</td><td>2</td></tr>
 *     <tr><td>1.5</td><td>1</td><td>2</td><td>1</td><td>2</td><td>2</td><td>2</td></tr>
 *     <tr><td>1.1</td><td>1</td><td>2</td><td>1</td><td>1</td><td>1</td><td>1</td></tr>
 *     <tr><td>1.0</td><td>1</td><td>1</td><td>1</td><td>1</td><td>1</td><td>1</td></tr>
 *     <tr><td>0.5</td><td>0</td><td>1</td><td>0</td><td>1</td><td>1</td><td>0</td></tr>
 *     <tr><td>−0.0</td><td>0</td><td>0</td><td>0</td><td>0</td><td>0</td><td>0</td></tr>
 *     <tr><td>−0.5</td><td>−1</td><td>0</td><td>0</td><td>0</td><td>−1</td><td>0</td></tr>
 *     <tr><td>−1.1</td><td>−2</td><td>−1</td><td>−1</td><td>−1</td><td>−1</td><td>−1</td></tr>
 *     <tr><td>−1.5</td><td>−2</td><td>−1</td><td>−1</td><td>−1</td><td>−2</td><td>−2</td></tr>
 *     <tr><td>−2.5</td><td>−3</td><td>−2</td><td>−2</td><td>−2</td><td>−3</td><td>−2</td></tr>
 *     <tr><td>−128.5 (Q7.0)</td><td>−129 → overflow</td><td>−128</td><td>−128</td><td>−128</td><td>−129 → overflow</td><td>−128</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>Rounding never overflows by itself; a result outside the target format is then handled by the chosen
 * {@link Overflow} mode (last row: −128.5 LSB rounds to −129 under {@code floor}, one below the most negative code of
 * an 8-bit word).
 *
 * <p><b>Beware the JDK names.</b> {@link java.math.RoundingMode#HALF_UP} rounds ties away from zero: it is our
 * {@link #HALF_AWAY}, not our {@link #HALF_UP}. Our {@code half-up} (ties toward +∞, "add half an LSB then drop the
 * LSBs", the usual RTL idiom) has no single JDK mode; its {@code BigDecimal} oracle is {@code floor(x + ½)}.
 *
 * <table class="striped">
 *   <caption>BigDecimal oracle of each mode</caption>
 *   <thead><tr><th>mode</th><th>java.math.RoundingMode</th></tr></thead>
 *   <tbody>
 *     <tr><td>floor</td><td>FLOOR</td></tr>
 *     <tr><td>ceil</td><td>CEILING</td></tr>
 *     <tr><td>toward-zero</td><td>DOWN</td></tr>
 *     <tr><td>half-up</td><td>none: FLOOR applied to x + 0.5</td></tr>
 *     <tr><td>half-away</td><td>HALF_UP</td></tr>
 *     <tr><td>half-even</td><td>HALF_EVEN</td></tr>
 *   </tbody>
 * </table>
 */
public enum Rounding {
    /** Toward −∞: two's complement truncation, the LSBs are dropped. */
    FLOOR("floor"),
    /** Toward +∞. */
    CEIL("ceil"),
    /** Toward zero: the magnitude is truncated. */
    TOWARD_ZERO("toward-zero"),
    /** To nearest, ties toward +∞: add half an LSB, then floor. */
    HALF_UP("half-up"),
    /** To nearest, ties away from zero. */
    HALF_AWAY("half-away"),
    /** To nearest, ties to the even code (convergent rounding). */
    HALF_EVEN("half-even");

    private final String tradeName;

    Rounding(String tradeName) {
        this.tradeName = tradeName;
    }

    /** The name used on the command line, in specification files and in reports, e.g. {@code half-up}. */
    public String tradeName() {
        return tradeName;
    }

    @Override
    public String toString() {
        return tradeName;
    }

    /**
     * The mode of the given trade name (case-insensitive; {@code _} accepted for {@code -}).
     *
     * @throws IllegalArgumentException naming the text and listing the accepted names
     */
    public static Rounding fromName(String name) {
        String key = name == null ? "" : name.trim().toLowerCase(Locale.ROOT).replace('_', '-');
        for (Rounding r : values()) {
            if (r.tradeName.equals(key)) {
                return r;
            }
        }
        throw new IllegalArgumentException("unknown rounding '" + name + "'; expected one of " + names());
    }

    /** The accepted names, comma separated. */
    public static String names() {
        return Arrays.stream(values()).map(Rounding::tradeName).collect(Collectors.joining(", "));
    }

    /**
     * Divides {@code value} by {@code 2^shift} and rounds the quotient to an integer by this mode; integer-only and
     * exact. A {@code shift} of 0 returns {@code value}. Requires {@code 0 <= shift <= 62} and
     * {@code |value| < 2^62}.
     */
    public long shiftRight(long value, int shift) {
        if (shift == 0) {
            return value;
        }
        long floor = value >> shift;
        long remainder = value - (floor << shift);
        if (remainder == 0) {
            return floor;
        }
        long half = 1L << (shift - 1);
        switch (this) {
            case FLOOR:
                return floor;
            case CEIL:
                return floor + 1;
            case TOWARD_ZERO:
                return value < 0 ? floor + 1 : floor;
            case HALF_UP:
                return remainder >= half ? floor + 1 : floor;
            case HALF_AWAY:
                if (remainder != half) {
                    return remainder > half ? floor + 1 : floor;
                }
                return value < 0 ? floor : floor + 1;
            case HALF_EVEN:
                if (remainder != half) {
                    return remainder > half ? floor + 1 : floor;
                }
                return (floor & 1) == 0 ? floor : floor + 1;
            default:
                throw new AssertionError(this);
        }
    }

    /**
     * Rounds a finite double to an integral double by this mode; exact for every finite input. Used once when
     * constants and stimulus are quantized, never in a per-sample fixed-point path.
     */
    public double roundToIntegral(double x) {
        if (Double.isNaN(x) || Double.isInfinite(x)) {
            throw new IllegalArgumentException("cannot round " + x + ": only finite values have a code");
        }
        double floor = Math.floor(x);
        if (floor == x) {
            return x + 0.0; // turns -0.0 into +0.0
        }
        // Sign of (x - floor) - 1/2, computed without rounding error: x - floor is exact for x > 0 and
        // ceil(x) - x is exact for x < 0 (Sterbenz), whereas x - floor can round for tiny negative x.
        int vsHalf = x > 0 ? Double.compare(x - floor, 0.5) : Double.compare(0.5, Math.ceil(x) - x);
        switch (this) {
            case FLOOR:
                return floor;
            case CEIL:
                return floor + 1;
            case TOWARD_ZERO:
                return x < 0 ? floor + 1 : floor;
            case HALF_UP:
                return vsHalf >= 0 ? floor + 1 : floor;
            case HALF_AWAY:
                if (vsHalf != 0) {
                    return vsHalf > 0 ? floor + 1 : floor;
                }
                return x < 0 ? floor : floor + 1;
            case HALF_EVEN:
                if (vsHalf != 0) {
                    return vsHalf > 0 ? floor + 1 : floor;
                }
                return Math.IEEEremainder(floor, 2.0) == 0.0 ? floor : floor + 1;
            default:
                throw new AssertionError(this);
        }
    }
}
