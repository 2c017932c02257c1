package dev.fixmod.demap;

import dev.fixmod.fixed.FixedPoint;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;

/**
 * One datapath stage's {@link Quantizer#fit} for a fixed number of incoming fractional bits, with its constants worked
 * out once: the same result and the same overflow events as {@link FixedPoint#fit}, integer-only and without a branch
 * on the rounding decision. The rounding of {@code v / 2^s} (0 &lt; s ≤ 63) adds to {@code floor = v >> s} the carry
 * {@code (rem + c + oddWeight·(floor & 1) + negWeight·sign) >>> s} of unsigned 64-bit arithmetic, where
 * {@code rem = v mod 2^s}, {@code sign} is 1 for a negative {@code v}, and {@code half = 2^(s−1)}:
 *
 * <table class="striped">
 *   <caption>Carry constants per rounding (the sum stays below 2^(s+1), so the carry is 0 or 1)</caption>
 *   <thead><tr><th>rounding</th><th>c</th><th>oddWeight</th><th>negWeight</th><th>carry is 1 when</th></tr></thead>
 *   <tbody>
 *     <tr><td>floor</td><td>0</td><td>0</td><td>0</td><td>never</td></tr>
 *     <tr><td>ceil</td><td>2^s − 1</td><td>0</td><td>0</td><td>rem ≠ 0</td></tr>
 *     <tr><td>toward-zero</td><td>0</td><td>0</td><td>2^s − 1</td><td>v &lt; 0 and rem ≠ 0</td></tr>
 *     <tr><td>half-up</td><td>half</td><td>0</td><td>0</td><td>rem ≥ half</td></tr>
 *     <tr><td>half-away</td><td>half</td><td>0</td><td>−1</td><td>rem &gt; half, or rem = half and v ≥ 0</td></tr>
 *     <tr><td>half-even</td><td>half − 1</td><td>1</td><td>0</td><td>rem &gt; half, or rem = half and floor odd</td></tr>
 *   </tbody>
 * </table>
 *
 * Values outside the stage's codes go to {@link Overflow#apply}, which counts the event; shifts outside 1..63 go to
 * {@link FixedPoint#fit} itself.
 */
final class StageFit {
    private final Quantizer stage;
    private final int fromFractionalBits;
    private final int shift;
    private final boolean fast;
    private final long mask;
    private final long c;
    private final long oddWeight;
    private final long negWeight;
    private final long lowest;
    private final long highest;

    StageFit(Quantizer stage, int fromFractionalBits) {
        this.stage = stage;
        this.fromFractionalBits = fromFractionalBits;
        QFormat to = stage.format();
        long s = (long) fromFractionalBits - to.fractionalBits();
        this.fast = s >= 0 && s <= 63;
        this.shift = fast ? (int) s : 0;
        this.mask = shift == 0 ? 0 : (1L << shift) - 1;
        long half = shift == 0 ? 0 : 1L << (shift - 1);
        Rounding r = stage.rounding();
        this.c = shift == 0 ? 0 : switch (r) {
            case FLOOR, TOWARD_ZERO -> 0;
            case CEIL -> mask;
            case HALF_UP, HALF_AWAY -> half;
            case HALF_EVEN -> half - 1;
        };
        this.oddWeight = shift != 0 && r == Rounding.HALF_EVEN ? 1 : 0;
        this.negWeight = shift == 0 ? 0 : r == Rounding.TOWARD_ZERO ? mask : r == Rounding.HALF_AWAY ? -1 : 0;
        this.lowest = stage.overflow().lowestResult(to);
        this.highest = to.maxCode();
    }

    long fit(long value, OverflowCounter counter) {
        if (!fast) {
            return stage.fit(value, fromFractionalBits, counter);
        }
        long floor = value >> shift;
        long carry = ((value & mask) + c + oddWeight * (floor & 1) + negWeight * (value >>> 63)) >>> shift;
        long rounded = floor + carry;
        if (rounded < lowest || rounded > highest) {
            return stage.overflow().apply(rounded, stage.format(), counter);
        }
        return rounded;
    }
}
