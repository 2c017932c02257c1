package dev.fixmod.demap;

import dev.fixmod.names.TradeNamed;

/**
 * The soft demapping algorithms. Each is named by the trade name used on the command line, in specifications and in
 * manifests.
 *
 * <table class="striped">
 *   <caption>What each algorithm computes and where it applies</caption>
 *   <thead><tr><th>name</th><th>bit LLR</th><th>constellations</th><th>float</th><th>fixed point</th></tr></thead>
 *   <tbody>
 *     <tr><td>{@code log-map}</td><td>exact: log-sum-exp over all symbols</td><td>any</td><td>yes</td><td>no</td></tr>
 *     <tr><td>{@code max-log}</td><td>max over all symbols (exhaustive)</td><td>any</td><td>yes</td>
 *         <td>yes (the bit-exact reference)</td></tr>
 *     <tr><td>{@code max-log-per-axis}</td><td>max-log in closed form on one axis</td>
 *         <td>separable: PAM, square and rectangular QAM, any labeling</td><td>yes</td><td>yes</td></tr>
 *     <tr><td>{@code folded-linear}</td><td>repeated absolute-value folding, scaled like max-log</td>
 *         <td>Gray-labelled PAM and QAM on equally spaced symmetric levels</td><td>yes</td><td>yes</td></tr>
 *   </tbody>
 * </table>
 */
public enum SoftAlgorithm implements TradeNamed {
    /** Exact log-MAP. */
    LOG_MAP("log-map"),
    /** Exhaustive max-log over all M symbols. */
    MAX_LOG("max-log"),
    /** Per-dimension max-log in piecewise-linear closed form; equal to {@link #MAX_LOG} for separable constellations. */
    MAX_LOG_PER_AXIS("max-log-per-axis"),
    /** The hardware approximation by absolute-value folds; equal to max-log in the inner regions only. */
    FOLDED_LINEAR("folded-linear");

    private final String tradeName;

    SoftAlgorithm(String tradeName) {
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
     * The algorithm of the given trade name (case-insensitive; {@code _} accepted for {@code -}).
     *
     * @throws IllegalArgumentException naming the text and listing the accepted names
     */
    public static SoftAlgorithm fromName(String name) {
        return TradeNamed.parse(SoftAlgorithm.class, name, "soft demapping algorithm");
    }

    /** The accepted names, comma separated. */
    public static String names() {
        return TradeNamed.names(SoftAlgorithm.class);
    }
}
