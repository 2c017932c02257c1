package dev.fixmod.demap;

import java.util.Arrays;

/**
 * The fold structure of one axis of a Gray-labelled PAM/QAM on equally spaced symmetric levels
 * {@code ±A, ±3A, …, ±(L−1)A}, {@code L = 2^m}. Fold 0 is {@code f0 = y}; fold {@code j ≥ 1} is
 * {@code fj = 2^(m−j)·A − |f(j−1)|}. A sub-label bit belongs to fold {@code j} when, at every level, the bit is 0
 * exactly where {@code polarity·fj > 0}; binary-reflected Gray and its bit-inverted variants (e.g. the 3GPP and
 * IEEE 802.11 mappings) have one such fold per bit. Anything else is rejected.
 */
final class FoldedAxis {
    /** Relative tolerance on the levels' deviation from the ideal grid (normalized constellations are not exact). */
    private static final double GRID_TOLERANCE = 1e-9;

    /** m, the number of bits on the axis. */
    final int bits;
    /** A: half the spacing of adjacent levels. */
    final double halfSpacing;
    /** Per sub-label bit (0 = most significant): its fold. */
    final int[] fold;
    /** Per sub-label bit: +1 if the bit is 0 where its fold is positive, −1 if it is 1 there. */
    final int[] polarity;

    private FoldedAxis(int bits, double halfSpacing, int[] fold, int[] polarity) {
        this.bits = bits;
        this.halfSpacing = halfSpacing;
        this.fold = fold;
        this.polarity = polarity;
    }

    /**
     * The fold structure of an axis with {@code bits} bits and {@code levels} indexed by sub-label.
     *
     * @param what names the axis in messages, e.g. "qam16 axis I"
     * @throws IllegalArgumentException if the levels are not an equally spaced symmetric grid or the labeling is not
     *                                  Gray along the axis
     */
    static FoldedAxis of(double[] levels, int bits, String what) {
        int count = levels.length;
        if (bits == 0) {
            return new FoldedAxis(0, 0.0, new int[0], new int[0]);
        }
        Integer[] order = new Integer[count];
        for (int i = 0; i < count; i++) {
            order[i] = i;
        }
        Arrays.sort(order, (a, b) -> Double.compare(levels[a], levels[b]));
        double low = levels[order[0]];
        double high = levels[order[count - 1]];
        double a = (high - low) / (2.0 * (count - 1));
        double tolerance = GRID_TOLERANCE * a * count;
        for (int n = 0; n < count; n++) {
            double ideal = (2 * n - count + 1) * a;
            if (Math.abs(levels[order[n]] - ideal) > tolerance) {
                throw new IllegalArgumentException(SoftAlgorithm.FOLDED_LINEAR + " needs equally spaced levels"
                        + " symmetric about 0 (±A, ±3A, …); " + what + " has level " + levels[order[n]] + " where "
                        + ideal + " was expected: use max-log-per-axis");
            }
        }
        int[][] folds = new int[bits][count];
        for (int n = 0; n < count; n++) {
            int g = 2 * n - count + 1;
            folds[0][n] = g;
            for (int j = 1; j < bits; j++) {
                g = (1 << (bits - j)) - Math.abs(g);
                folds[j][n] = g;
            }
        }
        int[] fold = new int[bits];
        int[] polarity = new int[bits];
        boolean[] used = new boolean[bits];
        for (int p = 0; p < bits; p++) {
            fold[p] = -1;
            for (int j = 0; j < bits && fold[p] < 0; j++) {
                for (int pol = 1; pol >= -1; pol -= 2) {
                    if (!used[j] && matches(order, bits, p, folds[j], pol)) {
                        fold[p] = j;
                        polarity[p] = pol;
                        used[j] = true;
                        break;
                    }
                }
            }
            if (fold[p] < 0) {
                throw new IllegalArgumentException(SoftAlgorithm.FOLDED_LINEAR + " needs a Gray labeling along each"
                        + " axis; bit " + p + " of " + what + " follows no fold: use max-log-per-axis");
            }
        }
        return new FoldedAxis(bits, a, fold, polarity);
    }

    private static boolean matches(Integer[] order, int bits, int position, int[] fold, int polarity) {
        for (int n = 0; n < order.length; n++) {
            int bit = (order[n] >>> (bits - 1 - position)) & 1;
            boolean zeroExpected = polarity * fold[n] > 0;
            if ((bit == 0) != zeroExpected) {
                return false;
            }
        }
        return true;
    }

    /** The fold constant {@code 2^(m−j)·A} of fold {@code j ≥ 1}. */
    double threshold(int j) {
        return Math.scalb(halfSpacing, bits - j);
    }
}
