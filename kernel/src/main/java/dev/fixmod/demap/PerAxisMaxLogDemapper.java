package dev.fixmod.demap;

import dev.fixmod.constellation.AxisLayout;
import dev.fixmod.constellation.Constellation;
import dev.fixmod.map.DatapathCost;

/**
 * Per-dimension max-log for separable constellations (PAM, square and rectangular QAM, any labeling of the axes).
 * Each label bit is carried by one axis only, and the other axis's distance term is the same for both bit values, so
 * the exhaustive max-log reduces to one axis:
 * {@code L(b) = (min_{l: b=1} (y − l)² − min_{l: b=0} (y − l)²)/N0}, times the {@link LlrSign} factor, with {@code y}
 * the sample's I or Q part and {@code l} that axis's levels. The result equals {@link MaxLogDemapper} (uniform priors).
 *
 * <p>It is evaluated in closed form by segment: between consecutive midpoints of same-bit levels the nearest bit-0
 * level {@code l0} and bit-1 level {@code l1} are fixed and {@code L = (l0 − l1)(2y − l0 − l1)/N0}. A binary search
 * over the doubled midpoints finds the segment. For Gray 16-QAM on the grid ±1, ±3 this gives, per axis and with
 * fixmod's labels (level −3 ↦ 00, −1 ↦ 01, +1 ↦ 11, +3 ↦ 10):
 *
 * <table class="striped">
 *   <caption>Per-axis max-log of Gray 16-QAM, in units of 1/N0 (zero-positive)</caption>
 *   <thead><tr><th>region of y</th><th>first bit of the axis</th><th>second bit of the axis</th></tr></thead>
 *   <tbody>
 *     <tr><td>y &lt; −2</td><td>−8(y + 1)</td><td>4(|y| − 2)</td></tr>
 *     <tr><td>−2 ≤ y ≤ 2</td><td>−4y</td><td>4(|y| − 2)</td></tr>
 *     <tr><td>y &gt; 2</td><td>−8(y − 1)</td><td>4(|y| − 2)</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>This demapper keeps no scratch, so one instance may be shared between threads (the other demappers may not).
 */
public final class PerAxisMaxLogDemapper extends SoftDemapper {
    private final int[] axis;
    private final double[][] boundaries;
    /** Per bit and segment: {@code sign·(l0 − l1)/N0}. */
    private final double[][] gain;
    /** Per bit and segment: {@code l0 + l1}. */
    private final double[][] offset;

    public PerAxisMaxLogDemapper(Constellation constellation, LlrOptions options) {
        super(SoftAlgorithm.MAX_LOG_PER_AXIS, constellation, options);
        AxisLayout layout = AxisSegments.requireSeparable(constellation, options, SoftAlgorithm.MAX_LOG_PER_AXIS);
        AxisSegments.BitPlaces places = new AxisSegments.BitPlaces(layout);
        double[][] levels = {layout.iLevels(), layout.qLevels()};
        int[] axisBits = {layout.iBits().length, layout.qBits().length};
        double invN0 = 1.0 / options.n0();
        int sign = options.sign().factor();
        this.axis = places.axis;
        this.boundaries = new double[bitsPerSymbol][];
        this.gain = new double[bitsPerSymbol][];
        this.offset = new double[bitsPerSymbol][];
        for (int b = 0; b < bitsPerSymbol; b++) {
            double[] lv = levels[axis[b]];
            AxisSegments seg = AxisSegments.of(lv, axisBits[axis[b]], places.position[b]);
            boundaries[b] = seg.boundaries;
            int n = seg.zeroLevel.length;
            gain[b] = new double[n];
            offset[b] = new double[n];
            for (int s = 0; s < n; s++) {
                double l0 = lv[seg.zeroLevel[s]];
                double l1 = lv[seg.oneLevel[s]];
                gain[b][s] = sign * (l0 - l1) * invN0;
                offset[b][s] = l0 + l1;
            }
        }
    }

    @Override
    void compute(double yRe, double yIm, double[] llr, int llrOffset) {
        for (int b = 0; b < bitsPerSymbol; b++) {
            double twoY = 2 * (axis[b] == 0 ? yRe : yIm);
            int s = AxisSegments.segmentOf(boundaries[b], twoY);
            llr[llrOffset + b] = gain[b][s] * (twoY - offset[b][s]) + 0.0; // + 0.0 turns −0.0 into 0.0
        }
    }

    /**
     * Per bit: the binary search over the segment boundaries, one subtraction and one multiplication; tables: the
     * boundaries and two constants per segment.
     */
    @Override
    public DatapathCost cost() {
        DatapathCost total = DatapathCost.ZERO;
        for (int b = 0; b < bitsPerSymbol; b++) {
            int n = gain[b].length;
            total = total.plus(new DatapathCost(1, 1, AxisSegments.searchComparisons(n - 1),
                    (long) DOUBLE_BITS * (n - 1 + 2 * n)));
        }
        return total;
    }
}
