package dev.fixmod.demap;

import dev.fixmod.names.TradeNamed;

/**
 * Which bit value a positive LLR favours. fixmod's convention is {@link #ZERO_POSITIVE},
 * {@code L(b) = ln P(b=0|y) − ln P(b=1|y)}; {@link #ONE_POSITIVE} is its negation, for devices that use the opposite.
 * Every vector manifest records the sign that was used.
 *
 * <table class="striped">
 *   <caption>LLR of one bit for the same received sample</caption>
 *   <thead><tr><th>P(b=0|y)</th><th>P(b=1|y)</th><th>zero-positive</th><th>one-positive</th></tr></thead>
 *   <tbody>
 *     <tr><td>0.9</td><td>0.1</td><td>+2.197</td><td>−2.197</td></tr>
 *     <tr><td>0.5</td><td>0.5</td><td>0</td><td>0</td></tr>
 *     <tr><td>0.1</td><td>0.9</td><td>−2.197</td><td>+2.197</td></tr>
 *     <tr><td>1</td><td>0</td><td>+∞</td><td>−∞</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>The fixed-point datapaths apply the sign to the exact metric, before any rounding, so a {@code one-positive}
 * output is the exact negation of a {@code zero-positive} one only when every stage rounds symmetrically
 * ({@code half-even}, {@code half-away}, {@code toward-zero}) and saturates symmetrically.
 */
public enum LlrSign implements TradeNamed {
    /** {@code L = ln P(b=0|y) − ln P(b=1|y)}: positive means "0" is more likely (fixmod's convention). */
    ZERO_POSITIVE("zero-positive", 1),
    /** {@code L = ln P(b=1|y) − ln P(b=0|y)}: positive means "1" is more likely. */
    ONE_POSITIVE("one-positive", -1);

    private final String tradeName;
    private final int factor;

    LlrSign(String tradeName, int factor) {
        this.tradeName = tradeName;
        this.factor = factor;
    }

    /** The name used on the command line, in specifications and in manifests. */
    @Override
    public String tradeName() {
        return tradeName;
    }

    /** {@code +1} for {@code zero-positive}, {@code −1} for {@code one-positive}. */
    public int factor() {
        return factor;
    }

    @Override
    public String toString() {
        return tradeName;
    }

    /**
     * The sign of the given trade name (case-insensitive; {@code _} accepted for {@code -}).
     *
     * @throws IllegalArgumentException naming the text and listing the accepted names
     */
    public static LlrSign fromName(String name) {
        return TradeNamed.parse(LlrSign.class, name, "LLR sign");
    }

    /** The accepted names, comma separated. */
    public static String names() {
        return TradeNamed.names(LlrSign.class);
    }
}
