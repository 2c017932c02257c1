package dev.fixmod.demap;

import java.util.Arrays;

/**
 * The order in which the nearest-point slicers scan the points: by decreasing I, then decreasing Q. With the best
 * replaced only by a strictly smaller distance, the first point scanned wins among equidistant ones, which realizes
 * the tie rule of {@link FixedSlicer}.
 */
final class ScanOrder {
    private ScanOrder() {
    }

    /** The labels of the points {@code (x[label], y[label])} by decreasing x, then decreasing y. */
    static int[] of(double[] x, double[] y) {
        Integer[] order = new Integer[x.length];
        for (int n = 0; n < order.length; n++) {
            order[n] = n;
        }
        Arrays.sort(order, (a, b) -> x[a] != x[b] ? Double.compare(x[b], x[a]) : Double.compare(y[b], y[a]));
        int[] labels = new int[order.length];
        for (int n = 0; n < labels.length; n++) {
            labels[n] = order[n];
        }
        return labels;
    }
}
