package dev.fixmod.demap;

import java.util.Arrays;

/**
 * One axis of a separable constellation for the per-axis slicers: the sub-labels sorted by ascending level, so that a
 * level index (the number of thresholds at or below a sample) gives the sub-label.
 */
final class AxisLevels {
    private AxisLevels() {
    }

    /** The sub-labels ordered by ascending {@code levels[subLabel]}. */
    static int[] subLabelsByAscendingLevel(double[] levels) {
        Integer[] order = new Integer[levels.length];
        for (int n = 0; n < order.length; n++) {
            order[n] = n;
        }
        Arrays.sort(order, (a, b) -> Double.compare(levels[a], levels[b]));
        int[] sorted = new int[order.length];
        for (int n = 0; n < order.length; n++) {
            sorted[n] = order[n];
        }
        return sorted;
    }

    /** ceil(log2 count): the comparisons of a binary search among {@code count} levels. */
    static int searchDepth(int count) {
        return 32 - Integer.numberOfLeadingZeros(count - 1);
    }
}
