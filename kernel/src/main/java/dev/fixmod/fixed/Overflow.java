package dev.fixmod.fixed;

import dev.fixmod.names.TradeNamed;

/**
 * What happens to an integer result that lies outside its format's codes. Every mode records one event on the
 * stage's {@link OverflowCounter} for each value that did not fit (and, for {@code symmetric-saturate}, for each most
 * negative code it replaced). The test {@code DocTablesTest} checks every row of these tables against the code.
 *
 * <table class="striped">
 *   <caption>Results for a signed 8-bit word, Q7.0 (codes −128 … 127); * marks an overflow event</caption>
 *   <thead><tr><th>value</th><th>saturate</th><th>symmetric-saturate</th><th>wrap</th></tr></thead>
 *   <tbody>
 *     <tr><td>127</td><td>127</td><td>127</td><td>127</td></tr>
 *     <tr><td>128</td><td>127*</td><td>127*</td><td>−128*</td></tr>
 *     <tr><td>300</td><td>127*</td><td>127*</td><td>44*</td></tr>
 *     <tr><td>−127</td><td>−127</td><td>−127</td><td>−127</td></tr>
 *     <tr><td>−128</td><td>−128</td><td>−127*</td><td>−128</td></tr>
 *     <tr><td>−129</td><td>−128*</td><td>−127*</td><td>127*</td></tr>
 *     <tr><td>−300</td><td>−128*</td><td>−127*</td><td>−44*</td></tr>
 *   </tbody>
 * </table>
 *
 * <table class="striped">
 *   <caption>Results for an unsigned 8-bit word, UQ8.0 (codes 0 … 255); * marks an overflow event</caption>
 *   <thead><tr><th>value</th><th>saturate</th><th>symmetric-saturate</th><th>wrap</th></tr></thead>
 *   <tbody>
 *     <tr><td>255</td><td>255</td><td>255</td><td>255</td></tr>
 *     <tr><td>256</td><td>255*</td><td>255*</td><td>0*</td></tr>
 *     <tr><td>300</td><td>255*</td><td>255*</td><td>44*</td></tr>
 *     <tr><td>0</td><td>0</td><td>0</td><td>0</td></tr>
 *     <tr><td>−1</td><td>0*</td><td>0*</td><td>255*</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>For an unsigned format {@code symmetric-saturate} is the same as {@code saturate}.
 */
public enum Overflow implements TradeNamed {
    /** Clamp to the nearest representable code. */
    SATURATE("saturate"),
    /** Clamp to {@code [−max, max]}: the most negative code is never produced, so negating a result is safe. */
    SYMMETRIC_SATURATE("symmetric-saturate"),
    /** Keep the low W bits: two's complement arithmetic modulo {@code 2^W}. */
    WRAP("wrap");

    private final String tradeName;

    Overflow(String tradeName) {
        this.tradeName = tradeName;
    }

    /** The name used on the command line, in specification files and in reports. */
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
    public static Overflow fromName(String name) {
        return TradeNamed.parse(Overflow.class, name, "overflow");
    }

    /** The accepted names, comma separated. */
    public static String names() {
        return TradeNamed.names(Overflow.class);
    }

    /**
     * Brings {@code value} into {@code format}'s codes by this mode, recording an event on {@code counter} when it
     * had to act.
     */
    public long apply(long value, QFormat format, OverflowCounter counter) {
        if (value >= lowestResult(format) && value <= format.maxCode()) {
            return value;
        }
        return beyond(value < 0, value, format, counter);
    }

    /** The smallest code this mode ever returns in {@code format}: {@code −max} for symmetric-saturate on a signed format. */
    public long lowestResult(QFormat format) {
        return this == SYMMETRIC_SATURATE && format.isSigned() ? -format.maxCode() : format.minCode();
    }

    /**
     * Handles a value known to be outside the codes this mode returns, given only its sign and its low 64 bits
     * (all that saturation and wrapping need); lets callers handle exact values wider than a {@code long}.
     */
    long beyond(boolean negative, long lowBits, QFormat format, OverflowCounter counter) {
        counter.record();
        return switch (this) {
            case SATURATE -> negative ? format.minCode() : format.maxCode();
            case SYMMETRIC_SATURATE -> negative ? lowestResult(format) : format.maxCode();
            case WRAP -> wrapBits(lowBits, format);
        };
    }

    /** The low W bits of {@code value}, read as a code of {@code format} (sign-extended if signed). */
    static long wrapBits(long value, QFormat format) {
        int unused = 64 - format.wordLength();
        return format.isSigned() ? (value << unused) >> unused : (value << unused) >>> unused;
    }
}
