package dev.fixmod.demap;

import dev.fixmod.names.TradeNamed;

/**
 * Whether a fixed-point LLR datapath multiplies its metric by the noise scale constant, so that its output is an LLR
 * in nats, or emits the metric itself (a decoder that is insensitive to a common positive factor, such as min-sum,
 * does not need the multiplier).
 *
 * <table class="striped">
 *   <caption>The scale constant K and what the output code means</caption>
 *   <thead><tr><th>scaling</th><th>max-log, max-log-per-axis (metric D = d1 − d0)</th>
 *       <th>folded-linear (metric f, in units of the input)</th><th>output code × LSB</th></tr></thead>
 *   <tbody>
 *     <tr><td>{@code noise-scaled}</td><td>K = 1/N0</td><td>K = 4A/N0 (A: half the level spacing)</td>
 *         <td>the LLR in nats</td></tr>
 *     <tr><td>{@code unscaled}</td><td>none</td><td>none</td><td>the metric: {@code N0·L} for max-log,
 *         {@code N0·L/(4A)} for folded-linear</td></tr>
 *   </tbody>
 * </table>
 */
public enum LlrScaling implements TradeNamed {
    /** Multiply by the quantized noise scale constant K; the output is the LLR in nats. */
    NOISE_SCALED("noise-scaled"),
    /** No multiplier; the output is the metric, a positive multiple of the LLR. */
    UNSCALED("unscaled");

    private final String tradeName;

    LlrScaling(String tradeName) {
        this.tradeName = tradeName;
    }

    @Override
    public String tradeName() {
        return tradeName;
    }

    @Override
    public String toString() {
        return tradeName;
    }

    /**
     * The scaling of the given trade name (case-insensitive; {@code _} accepted for {@code -}).
     *
     * @throws IllegalArgumentException naming the text and listing the accepted names
     */
    public static LlrScaling fromName(String name) {
        return TradeNamed.parse(LlrScaling.class, name, "LLR scaling");
    }

    /** The accepted names, comma separated. */
    public static String names() {
        return TradeNamed.names(LlrScaling.class);
    }
}
