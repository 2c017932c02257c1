package dev.fixmod.map;

/**
 * The hardware cost of one fixed-point datapath stage per symbol: how many multiplications, additions (subtractions,
 * negations and rounding increments count as additions), comparisons (including the two of a saturation) and how many
 * bits of constant tables (ROMs, thresholds, coefficients) it needs. Multiplications by 0 or a power of two are
 * wiring or shifts and are not counted. Where the operations depend on the sample (a search tree), the count is the
 * longest path. These are operation counts of the modelled datapath, an estimate for sizing, not a synthesis result.
 *
 * <table class="striped">
 *   <caption>Examples</caption>
 *   <thead><tr><th>stage</th><th>multiplies</th><th>adds</th><th>compares</th><th>tableBits</th></tr></thead>
 *   <tbody>
 *     <tr><td>16-point I/Q ROM of 12-bit codes</td><td>0</td><td>0</td><td>0</td><td>16·2·12 = 384</td></tr>
 *     <tr><td>gain by a 16-bit constant on I and Q, half-up, saturate</td><td>2</td><td>2</td><td>4</td><td>16</td></tr>
 *     <tr><td>ROM followed by the gain ({@link #plus})</td><td>2</td><td>2</td><td>4</td><td>400</td></tr>
 *   </tbody>
 * </table>
 *
 * @param multiplies multiplications per symbol (by constants other than 0 and ±2^k, or of two variables)
 * @param adds       additions, subtractions, negations and rounding increments per symbol
 * @param compares   magnitude comparisons per symbol
 * @param tableBits  bits of constant tables and coefficients the stage stores
 */
public record DatapathCost(long multiplies, long adds, long compares, long tableBits) {

    /** The cost of a stage that does nothing. */
    public static final DatapathCost ZERO = new DatapathCost(0, 0, 0, 0);

    public DatapathCost {
        if (multiplies < 0 || adds < 0 || compares < 0 || tableBits < 0) {
            throw new IllegalArgumentException("datapath costs are counts >= 0, got " + multiplies + " multiplies, "
                    + adds + " adds, " + compares + " compares, " + tableBits + " table bits");
        }
    }

    /** The cost of this stage followed by {@code other}: every count adds up, tables too. */
    public DatapathCost plus(DatapathCost other) {
        return new DatapathCost(multiplies + other.multiplies, adds + other.adds, compares + other.compares,
                tableBits + other.tableBits);
    }

    /**
     * The cost of doing this stage's operations {@code times} times per symbol with the same tables (e.g. once per
     * bit, or once per candidate point): operations scale, table bits do not.
     */
    public DatapathCost repeated(long times) {
        if (times < 0) {
            throw new IllegalArgumentException("a stage repeats >= 0 times per symbol, got " + times);
        }
        return new DatapathCost(multiplies * times, adds * times, compares * times, tableBits);
    }

    /** E.g. {@code 2 multiplies, 2 adds, 4 compares, 16 table bits}. */
    @Override
    public String toString() {
        return multiplies + " multiplies, " + adds + " adds, " + compares + " compares, " + tableBits + " table bits";
    }
}
