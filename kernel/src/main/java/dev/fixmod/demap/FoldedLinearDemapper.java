package dev.fixmod.demap;

import dev.fixmod.constellation.AxisLayout;
import dev.fixmod.constellation.Constellation;
import dev.fixmod.map.DatapathCost;

/**
 * The folded-linear approximation used in hardware, for Gray-labelled PAM, square and rectangular QAM on equally
 * spaced levels {@code ±A, ±3A, …, ±(2^m − 1)A} per axis: per axis, {@code f0 = y} and
 * {@code fj = 2^(m−j)·A − |f(j−1)|}, and each bit's LLR is {@code ±(4A/N0)·fj} for its fold j (the sign follows the
 * labeling and the {@link LlrSign}). That is max-log's slope of {@code 4A/N0} everywhere, so it equals max-log
 * wherever the nearest levels with bit 0 and bit 1 are adjacent, and only there. For 16-QAM per axis it is
 * {@code L ∝ y} and {@code L ∝ 2A − |y|}, for 64-QAM {@code y}, {@code 4A − |y|}, {@code 2A − |4A − |y||}.
 *
 * <p>Where it departs from per-axis max-log, with {@code u = |y|/A} and the shortfall {@code |max-log| − |folded|}
 * in units of {@code 4A²/N0} (one level step at the inner slope); folds run from 0 (the sign bit) to m−1:
 *
 * <table class="striped">
 *   <caption>Folded-linear versus max-log on one axis (zero shortfall wherever "equal")</caption>
 *   <thead><tr><th>levels per axis</th><th>fold</th><th>equal for</th>
 *       <th>largest shortfall for u ≤ L−1 (folded / max-log there)</th><th>shortfall for u &gt; L−1</th></tr></thead>
 *   <tbody>
 *     <tr><td>4 (16-QAM)</td><td>0</td><td>u ≤ 2</td><td>1 at u = 3 (3/4)</td><td>u − 2</td></tr>
 *     <tr><td>4 (16-QAM)</td><td>1</td><td>all u</td><td>0</td><td>0</td></tr>
 *     <tr><td>8 (64-QAM)</td><td>0</td><td>u ≤ 2</td><td>9 at u = 7 (7/16)</td><td>3u − 12</td></tr>
 *     <tr><td>8 (64-QAM)</td><td>1</td><td>2 ≤ u ≤ 6</td><td>2 − u for u &lt; 2: 2 at u = 0 (2/3); 1 at u = 7 (3/4)</td>
 *         <td>u − 6</td></tr>
 *     <tr><td>8 (64-QAM)</td><td>2</td><td>all u</td><td>0</td><td>0</td></tr>
 *     <tr><td>16 (256-QAM)</td><td>0</td><td>u ≤ 2</td><td>49 at u = 15 (15/64)</td><td>7u − 56</td></tr>
 *     <tr><td>16 (256-QAM)</td><td>1</td><td>6 ≤ u ≤ 10</td><td>12 at u = 0 (2/5); 9 at u = 15 (7/16)</td>
 *         <td>3u − 36</td></tr>
 *     <tr><td>16 (256-QAM)</td><td>2</td><td>2 ≤ u ≤ 6, 10 ≤ u ≤ 14</td>
 *         <td>2 at u = 0 and u = 8 (2/3); 1 at u = 15 (3/4)</td><td>u − 14</td></tr>
 *     <tr><td>16 (256-QAM)</td><td>3</td><td>all u</td><td>0</td><td>0</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>So the last fold is exact, the sign bit is exact only inside {@code |y| ≤ 2A} and falls to {@code 1/2^(m−1)} of
 * max-log far out, and the middle folds depart near 0 and near their own fold points, where the nearest level with
 * the opposite bit is more than one step away. For 16-QAM only the sign bit departs, and only beyond {@code 2A}.
 * The sign of every LLR agrees with max-log everywhere (folding keeps each zero crossing), so hard decisions are
 * unchanged; only magnitudes are too small, never too large. A test recomputes this table from the max-log closed
 * form.
 *
 * <p>Not thread-safe: holds per-axis fold scratch.
 */
public final class FoldedLinearDemapper extends SoftDemapper {
    private final int[] axis;
    private final int[] fold;
    private final double[] gain;
    private final double[][] thresholds;
    private final double[][] folds;

    public FoldedLinearDemapper(Constellation constellation, LlrOptions options) {
        super(SoftAlgorithm.FOLDED_LINEAR, constellation, options);
        AxisLayout layout = AxisSegments.requireSeparable(constellation, options, SoftAlgorithm.FOLDED_LINEAR);
        AxisSegments.BitPlaces places = new AxisSegments.BitPlaces(layout);
        FoldedAxis[] axes = {
            FoldedAxis.of(layout.iLevels(), layout.iBits().length, constellation.name() + " axis I"),
            FoldedAxis.of(layout.qLevels(), layout.qBits().length, constellation.name() + " axis Q")};
        this.axis = places.axis;
        this.fold = new int[bitsPerSymbol];
        this.gain = new double[bitsPerSymbol];
        for (int b = 0; b < bitsPerSymbol; b++) {
            FoldedAxis fa = axes[axis[b]];
            int p = places.position[b];
            fold[b] = fa.fold[p];
            gain[b] = options.sign().factor() * fa.polarity[p] * 4 * fa.halfSpacing / options.n0();
        }
        this.thresholds = new double[2][];
        this.folds = new double[2][];
        for (int x = 0; x < 2; x++) {
            thresholds[x] = new double[axes[x].bits];
            for (int j = 1; j < axes[x].bits; j++) {
                thresholds[x][j] = axes[x].threshold(j);
            }
            folds[x] = new double[axes[x].bits];
        }
    }

    @Override
    void compute(double yRe, double yIm, double[] llr, int llrOffset) {
        fold(yRe, thresholds[0], folds[0]);
        fold(yIm, thresholds[1], folds[1]);
        for (int b = 0; b < bitsPerSymbol; b++) {
            llr[llrOffset + b] = gain[b] * folds[axis[b]][fold[b]] + 0.0; // + 0.0 turns −0.0 into 0.0
        }
    }

    /**
     * Per fold after the first: an absolute value and a subtraction (two additions); per bit: one multiplication by
     * its gain. Tables: the fold constants and the gains.
     */
    @Override
    public DatapathCost cost() {
        long folds = Math.max(0, thresholds[0].length - 1) + Math.max(0, thresholds[1].length - 1);
        return new DatapathCost(bitsPerSymbol, 2 * folds, 0, DOUBLE_BITS * (folds + bitsPerSymbol));
    }

    private static void fold(double y, double[] threshold, double[] out) {
        if (out.length == 0) {
            return;
        }
        out[0] = y;
        for (int j = 1; j < out.length; j++) {
            out[j] = threshold[j] - Math.abs(out[j - 1]);
        }
    }
}
