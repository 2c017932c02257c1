package dev.fixmod.fixed;

import dev.fixmod.names.TradeNamed;

/**
 * How a value that falls between two codes becomes one of them. Each mode is named by the trade name used in the
 * command line, the specification files and the reports ({@link #tradeName()}).
 *
 * <p>The tables give the integer chosen for a value expressed in LSBs (the value divided by the LSB). The test
 * {@code DocTablesTest} checks every row against the code, so the tables cannot drift from it.
 *
 * <table class="striped">
 *   <caption>Rounding a value to an integer number of LSBs</caption>
 *   <thead><tr><th>value (LSB)</th><th>floor</th><th>ceil</th><th>toward-zero</th><th>half-up</th><th>half-away</th><th>half-even</th></tr></thead>
 *   <tbody>
 *     <tr><td>2.5</td><td>2</td><td>3</td><td>2</td><td>3</td><td>3</td><td>2</td></tr>
 *     <tr><td>1.6</td><td>1</td><td>2</td><td>1</td><td>2</td><td>2</td><td>2</td></tr>
 *     <tr><td>1.5</td><td>1</td><td>2</td><td>1</td><td>2</td><td>2</td><td>2</td></tr>
 *     <tr><td>1.1</td><td>1</td><td>2</td><td>1</td><td>1</td><td>1</td><td>1</td></tr>
 *     <tr><td>1.0</td><td>1</td><td>1</td><td>1</td><td>1</td><td>1</td><td>1</td></tr>
 *     <tr><td>0.5</td><td>0</td><td>1</td><td>0</td><td>1</td><td>1</td><td>0</td></tr>
 *     <tr><td>0.25</td><td>0</td><td>1</td><td>0</td><td>0</td><td>0</td><td>0</td></tr>
 *     <tr><td>−0.0</td><td>0</td><td>0</td><td>0</td><td>0</td><td>0</td><td>0</td></tr>
 *     <tr><td>−0.25</td><td>−1</td><td>0</td><td>0</td><td>0</td><td>0</td><td>0</td></tr>
 *     <tr><td>−0.5</td><td>−1</td><td>0</td><td>0</td><td>0</td><td>−1</td><td>0</td></tr>
 *     <tr><td>−1.1</td><td>−2</td><td>−1</td><td>−1</td><td>−1</td><td>−1</td><td>−1</td></tr>
 *     <tr><td>−1.5</td><td>−2</td><td>−1</td><td>−1</td><td>−1</td><td>−2</td><td>−2</td></tr>
 *     <tr><td>−1.6</td><td>−2</td><td>−1</td><td>−1</td><td>−2</td><td>−2</td><td>−2</td></tr>
 *     <tr><td>−2.5</td><td>−3</td><td>−2</td><td>−2</td><td>−2</td><td>−3</td><td>−2</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>Rounding never overflows by itself; a result outside the target format is then handled by the chosen
 * {@link Overflow} mode. At the ends of a format's range the two combine as follows:
 *
 * <table class="striped">
 *   <caption>Quantizing to Q7.0 (codes −128 … 127) with saturate; * marks an overflow event</caption>
 *   <thead><tr><th>value (LSB)</th><th>floor</th><th>ceil</th><th>toward-zero</th><th>half-up</th><th>half-away</th><th>half-even</th></tr></thead>
 *   <tbody>
 *     <tr><td>127.75</td><td>127</td><td>127*</td><td>127</td><td>127*</td><td>127*</td><td>127*</td></tr>
 *     <tr><td>127.5</td><td>127</td><td>127*</td><td>127</td><td>127*</td><td>127*</td><td>127*</td></tr>
 *     <tr><td>127.25</td><td>127</td><td>127*</td><td>127</td><td>127</td><td>127</td><td>127</td></tr>
 *     <tr><td>−128.0</td><td>−128</td><td>−128</td><td>−128</td><td>−128</td><td>−128</td><td>−128</td></tr>
 *     <tr><td>−128.25</td><td>−128*</td><td>−128</td><td>−128</td><td>−128</td><td>−128</td><td>−128</td></tr>
 *     <tr><td>−128.5</td><td>−128*</td><td>−128</td><td>−128</td><td>−128</td><td>−128*</td><td>−128</td></tr>
 *     <tr><td>−128.75</td><td>−128*</td><td>−128</td><td>−128</td><td>−128*</td><td>−128*</td><td>−128*</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>(127.5 under {@code half-even} goes to the even 128, one above the largest code; −128.5 goes to the even −128.)
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
public enum Rounding implements TradeNamed {
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
    @Override
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
        return TradeNamed.parse(Rounding.class, name, "rounding");
    }

    /** The accepted names, comma separated. */
    public static String names() {
        return TradeNamed.names(Rounding.class);
    }

    /**
     * Divides {@code value} by {@code 2^shift} and rounds the quotient to an integer by this mode: the integer-only
     * core of requantization, exact for every {@code long}. A {@code shift} of 0 returns {@code value}.
     *
     * @throws IllegalArgumentException if {@code shift} is outside 0..63
     */
    public long shiftRight(long value, int shift) {
        if (shift == 0) {
            return value;
        }
        if (shift < 0 || shift > 63) {
            throw new IllegalArgumentException("shift must be 0..63, got " + shift);
        }
        long floor = value >> shift;
        long remainder = value & ((1L << shift) - 1);
        if (remainder == 0) {
            return floor;
        }
        long half = 1L << (shift - 1);
        return roundsUp(value < 0, Long.compare(remainder, half), (floor & 1) != 0) ? floor + 1 : floor;
    }

    /**
     * Rounds a finite double to an integral double by this mode; exact for every finite input, and never returns
     * {@code -0.0}. Used when constants and stimulus are quantized, never in a per-sample fixed-point path.
     *
     * @throws IllegalArgumentException if {@code x} is NaN or infinite
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
        // An inexact x has |x| < 2^52, so its floor fits a long.
        int vsHalf = x > 0 ? Double.compare(x - floor, 0.5) : Double.compare(0.5, Math.ceil(x) - x);
        return roundsUp(x < 0, vsHalf, ((long) floor & 1) != 0) ? floor + 1 : floor;
    }

    /**
     * The one decision that defines each mode, shared by every rounding path: whether an inexact quotient goes to
     * {@code floor + 1} instead of {@code floor}.
     *
     * @param negative  whether the exact value is negative
     * @param vsHalf    the sign of (exact value − floor) − ½: negative below a tie, 0 on a tie, positive above
     * @param floorOdd  whether {@code floor} is odd
     */
    boolean roundsUp(boolean negative, int vsHalf, boolean floorOdd) {
        return switch (this) {
            case FLOOR -> false;
            case CEIL -> true;
            case TOWARD_ZERO -> negative;
            case HALF_UP -> vsHalf >= 0;
            case HALF_AWAY -> vsHalf > 0 || (vsHalf == 0 && !negative);
            case HALF_EVEN -> vsHalf > 0 || (vsHalf == 0 && floorOdd);
        };
    }
}
