package dev.fixmod.demap;

import dev.fixmod.constellation.AxisLayout;
import dev.fixmod.constellation.Constellation;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * The piecewise-linear closed form of one bit's per-axis max-log metric, derived from the axis levels.
 *
 * <p>On one axis, {@code D(y) = min_{l: b=1} (y − l)² − min_{l: b=0} (y − l)²}. The nearest level of a sorted set
 * changes only at the midpoints of consecutive members, so the midpoints of the bit-0 levels and of the bit-1 levels
 * split the axis into segments; on each, the nearest bit-0 level {@code l0} and bit-1 level {@code l1} are fixed and
 * {@code D(y) = (l0 − l1)·(2y − l0 − l1)}, a straight line. Boundaries are kept doubled ({@code l_a + l_b}, compared
 * with {@code 2y}) so integer codes stay exact; {@code D} is continuous, so a sample on a boundary gets the same value
 * from either side.
 */
final class AxisSegments {
    /** Doubled boundaries {@code l_a + l_b}, ascending and distinct; segment {@code s} is where {@code 2y} has exactly
     * {@code s} boundaries at or below it. */
    final double[] boundaries;
    /** Per segment: the sub-label of the nearest level whose bit is 0. */
    final int[] zeroLevel;
    /** Per segment: the sub-label of the nearest level whose bit is 1. */
    final int[] oneLevel;

    private AxisSegments(double[] boundaries, int[] zeroLevel, int[] oneLevel) {
        this.boundaries = boundaries;
        this.zeroLevel = zeroLevel;
        this.oneLevel = oneLevel;
    }

    /**
     * The segments of sub-label bit {@code position} (0 = most significant of {@code bits}) of an axis whose levels,
     * indexed by sub-label, are {@code levels} (distinct).
     */
    static AxisSegments of(double[] levels, int bits, int position) {
        Integer[] order = new Integer[levels.length];
        for (int i = 0; i < order.length; i++) {
            order[i] = i;
        }
        Arrays.sort(order, (a, b) -> Double.compare(levels[a], levels[b]));
        List<Integer> zeros = new ArrayList<>();
        List<Integer> ones = new ArrayList<>();
        for (int sub : order) {
            (((sub >>> (bits - 1 - position)) & 1) == 0 ? zeros : ones).add(sub);
        }
        double[] z = boundariesOf(zeros, levels);
        double[] o = boundariesOf(ones, levels);
        // Merge the two ascending boundary lists; walking past a set's boundary moves its nearest level up by one.
        List<Double> merged = new ArrayList<>();
        List<Integer> zeroLevel = new ArrayList<>();
        List<Integer> oneLevel = new ArrayList<>();
        int i = 0;
        int j = 0;
        zeroLevel.add(zeros.get(0));
        oneLevel.add(ones.get(0));
        while (i < z.length || j < o.length) {
            double next = Math.min(i < z.length ? z[i] : Double.POSITIVE_INFINITY, j < o.length ? o[j] : Double.POSITIVE_INFINITY);
            while (i < z.length && z[i] == next) {
                i++;
            }
            while (j < o.length && o[j] == next) {
                j++;
            }
            merged.add(next);
            zeroLevel.add(zeros.get(i));
            oneLevel.add(ones.get(j));
        }
        return new AxisSegments(merged.stream().mapToDouble(Double::doubleValue).toArray(),
                zeroLevel.stream().mapToInt(Integer::intValue).toArray(),
                oneLevel.stream().mapToInt(Integer::intValue).toArray());
    }

    private static double[] boundariesOf(List<Integer> ascending, double[] levels) {
        double[] b = new double[ascending.size() - 1];
        for (int n = 0; n < b.length; n++) {
            b[n] = levels[ascending.get(n)] + levels[ascending.get(n + 1)];
        }
        return b;
    }

    /**
     * The segment of doubled code {@code twoY}: the number of {@code boundaries} at or below it; integer-only. A
     * binary search whose steps select with a conditional move instead of a branch: noisy samples make the branch
     * unpredictable, and a mispredicted branch costs more than the whole step.
     */
    static int segmentOfCode(long[] boundaries, long twoY) {
        int n = boundaries.length;
        if (n == 0) {
            return 0;
        }
        int base = 0;
        while (n > 1) {
            int half = n >>> 1;
            base = boundaries[base + half] <= twoY ? base + half : base;
            n -= half;
        }
        return boundaries[base] <= twoY ? base + 1 : base;
    }

    /** The number of comparisons a binary search makes on {@code n} boundaries: ⌈log2(n + 1)⌉. */
    static int searchComparisons(int n) {
        return 32 - Integer.numberOfLeadingZeros(n);
    }

    /**
     * Where each label bit lives in a separable layout: {@code axis[b]} is 0 for I, 1 for Q, and {@code position[b]}
     * is the bit's position in that axis's sub-label (0 = most significant).
     */
    static final class BitPlaces {
        final int[] axis;
        final int[] position;

        BitPlaces(AxisLayout layout) {
            int k = layout.bitsPerSymbol();
            axis = new int[k];
            position = new int[k];
            int[] iBits = layout.iBits();
            int[] qBits = layout.qBits();
            for (int j = 0; j < iBits.length; j++) {
                axis[iBits[j]] = 0;
                position[iBits[j]] = j;
            }
            for (int j = 0; j < qBits.length; j++) {
                axis[qBits[j]] = 1;
                position[qBits[j]] = j;
            }
        }
    }

    /** The layout of a constellation the per-axis demappers accept, or a message saying why not. */
    static AxisLayout requireSeparable(Constellation constellation, LlrOptions options, SoftAlgorithm algorithm) {
        AxisLayout layout = constellation.axes();
        if (layout == null) {
            throw new IllegalArgumentException(algorithm + " needs a separable constellation (PAM, square or"
                    + " rectangular QAM); " + constellation.name() + " is not: use max-log or log-map");
        }
        if (options.usesPriors(constellation)) {
            throw new IllegalArgumentException(algorithm + " assumes equiprobable symbols, but " + constellation.name()
                    + " has non-uniform probabilities: turn priors off or use max-log or log-map");
        }
        return layout;
    }
}
