package dev.fixmod.demap;

import java.util.Arrays;
import java.util.TreeSet;

/**
 * The cells of one axis: the segment boundaries of every bit the axis carries, merged into one ascending list, so
 * that one search per sample and axis serves all of its bits. Cell {@code c} is where exactly {@code c} of the merged
 * boundaries lie at or below the doubled coordinate; since each bit's boundaries are among them, the cell fixes each
 * bit's segment ({@link #segments}).
 *
 * <p>The search is a direct index instead of a binary search: a bucket of a uniform grid over the boundaries gives a
 * lower bound on the count, and at most {@link #steps} comparisons with the boundaries themselves finish it. The grid
 * only makes the search fast (constant time when the boundaries are about evenly spaced, as the levels of QAM and
 * PAM make them); the comparisons make it exact for any values, since the bucket is a non-decreasing function of the
 * coordinate:
 *
 * <table class="striped">
 *   <caption>Examples: boundaries −2, 0, 2 (a Gray 8-PAM bit's), doubled coordinate t</caption>
 *   <thead><tr><th>t</th><th>cell</th></tr></thead>
 *   <tbody>
 *     <tr><td>−100, −2.0000000000000004</td><td>0</td></tr>
 *     <tr><td>−2 (on a boundary: counted)</td><td>1</td></tr>
 *     <tr><td>−1e−300, −0.0</td><td>1, 2 (−0.0 ≤ 0)</td></tr>
 *     <tr><td>2, 1e300</td><td>3</td></tr>
 *   </tbody>
 * </table>
 */
final class AxisCells {
    /** Buckets per boundary tried, fewest first, until no bucket holds more than {@link #PAIR} boundaries. */
    private static final int[] BUCKETS_PER_BOUNDARY = {2, 4, 8, 16, 32};
    /** The comparisons of the fast path: exactly two, straight-line. */
    private static final int PAIR = 2;

    /** The merged boundaries, ascending and distinct. */
    private final double[] bounds;
    private final int count;
    private final double low;
    private final double scale;
    private final int lastBucket;
    /** Per bucket: the number of boundaries whose bucket is lower, a lower bound on the count of any t in it. */
    private final int[] start;
    /** The most boundaries in one bucket: the comparisons that finish a count. */
    final int steps;
    /**
     * At {@code r·buckets + k}: the r-th boundary of bucket k, or NaN where the bucket has fewer ("NaN ≤ t" holds for
     * no t); at least {@link #PAIR} rows. The comparisons of a count read one bucket's entries, so they do not wait
     * for each other.
     */
    private final double[] within;

    private AxisCells(double[] ascending) {
        this.count = ascending.length;
        this.bounds = ascending;
        this.low = count == 0 ? 0.0 : ascending[0];
        double span = count < 2 ? 0.0 : ascending[count - 1] - low;
        double bestScale = 0.0;
        int[] bestStart = {0};
        int bestSteps = count;
        if (count > PAIR && span < Double.POSITIVE_INFINITY) {
            for (int perBoundary : BUCKETS_PER_BOUNDARY) {
                int buckets = perBoundary * count;
                double s = (buckets - 1) / span;
                int[] occupancy = new int[buckets];
                int most = 0;
                for (double b : ascending) {
                    most = Math.max(most, ++occupancy[bucket(b, low, s, buckets - 1)]);
                }
                if (most < bestSteps) {
                    bestScale = s;
                    bestSteps = most;
                    bestStart = new int[buckets];
                    for (int k = 1; k < buckets; k++) {
                        bestStart[k] = bestStart[k - 1] + occupancy[k - 1];
                    }
                }
                if (bestSteps <= PAIR) {
                    break;
                }
            }
        }
        this.scale = bestScale;
        this.start = bestStart;
        this.lastBucket = bestStart.length - 1;
        this.steps = bestSteps;
        int buckets = bestStart.length;
        this.within = new double[Math.max(steps, PAIR) * buckets];
        Arrays.fill(within, Double.NaN);
        for (int i = 0; i < count; i++) {
            int k = bucket(ascending[i], low, scale, lastBucket);
            within[(i - bestStart[k]) * buckets + k] = ascending[i];
        }
    }

    /** The cells of the union of {@code boundaryLists} (each ascending; values may repeat across lists). */
    static AxisCells of(double[]... boundaryLists) {
        TreeSet<Double> merged = new TreeSet<>();
        for (double[] list : boundaryLists) {
            for (double b : list) {
                // −0.0 and 0.0 compare equal with <=; keep one of them.
                merged.add(b + 0.0);
            }
        }
        return new AxisCells(merged.stream().mapToDouble(Double::doubleValue).toArray());
    }

    /** The number of merged boundaries. */
    int boundaries() {
        return count;
    }

    /**
     * The bucket of {@code t}: non-decreasing in {@code t} (a subtraction, a product by a scale ≥ 0, a saturating
     * truncation and clamping, each non-decreasing), which is all exactness needs. With scale 0 an infinite {@code t}
     * gives NaN, which the cast turns into bucket 0, the only one then.
     */
    private static int bucket(double t, double low, double scale, int lastBucket) {
        int k = (int) ((t - low) * scale);
        return k < 0 ? 0 : Math.min(k, lastBucket);
    }

    /** The cell of doubled coordinate {@code twoY} (not NaN): the number of merged boundaries at or below it. */
    int cellOf(double twoY) {
        int k = bucket(twoY, low, scale, lastBucket);
        // Lower buckets hold only boundaries below twoY, higher ones only boundaries above it: what is left to count
        // is in bucket k.
        int c = start[k] + (within[k] <= twoY ? 1 : 0) + (within[start.length + k] <= twoY ? 1 : 0);
        for (int r = PAIR, at = PAIR * start.length + k; r < steps; r++, at += start.length) {
            c += within[at] <= twoY ? 1 : 0;
        }
        return c;
    }

    /**
     * Per cell: the segment of a bit whose boundaries are {@code bitBoundaries} (ascending, each one of the merged
     * boundaries), i.e. how many of them lie at or below any coordinate of the cell.
     */
    int[] segments(double[] bitBoundaries) {
        int[] segment = new int[count + 1];
        int s = 0;
        for (int c = 1; c <= count; c++) {
            while (s < bitBoundaries.length && bitBoundaries[s] <= bounds[c - 1]) {
                s++;
            }
            segment[c] = s;
        }
        return segment;
    }
}
