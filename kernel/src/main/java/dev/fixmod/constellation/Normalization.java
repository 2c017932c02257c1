package dev.fixmod.constellation;

import dev.fixmod.names.TradeNamed;

/**
 * How a constellation's points are scaled. Averages use the symbol probabilities.
 *
 * <table class="striped">
 *   <caption>Scale applied to square 16-QAM on the grid ±1, ±3 (E_s = 10, 4 bits)</caption>
 *   <thead><tr><th>mode</th><th>condition after scaling</th><th>factor</th></tr></thead>
 *   <tbody>
 *     <tr><td>none</td><td>odd-integer grid kept</td><td>1</td></tr>
 *     <tr><td>unit-energy</td><td>E_s = 1</td><td>1/√10</td></tr>
 *     <tr><td>unit-bit-energy</td><td>E_b = E_s/k = 1</td><td>√(4/10)</td></tr>
 *     <tr><td>unit-peak</td><td>max |s| = 1</td><td>1/√18</td></tr>
 *   </tbody>
 * </table>
 */
public enum Normalization implements TradeNamed {
    NONE("none"),
    UNIT_ENERGY("unit-energy"),
    UNIT_BIT_ENERGY("unit-bit-energy"),
    UNIT_PEAK("unit-peak");

    private final String tradeName;

    Normalization(String tradeName) {
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

    /** The mode of the given name (case-insensitive; {@code _} accepted for {@code -}). */
    public static Normalization fromName(String name) {
        return TradeNamed.parse(Normalization.class, name, "normalization");
    }
}
