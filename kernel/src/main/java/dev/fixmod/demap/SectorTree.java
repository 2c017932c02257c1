package dev.fixmod.demap;

/**
 * The binary search of the PSK sector slicers, stored as a heap: node h (1 ≤ h < M) covers a contiguous range of
 * sectors and tests the line through the boundary ray in its middle; children 2h (the clockwise half) and 2h+1 (the
 * counter-clockwise half); leaf h ≥ M is sector h − M. The root's line splits the plane into two half-planes of M/2
 * sectors; every further node splits an arc of at most 180° that the sample is already known to lie in, so log2 M
 * sign tests decide the sector without any angle being computed.
 *
 * <p>Each node tests {@code a·I + b·Q >= 0} with its line's normal (a, b) oriented toward +I (or toward +Q when
 * a = 0): a sample on the line goes to the larger-I side, the tie rule of {@link FixedSlicer}.
 * {@link #upperIfNonNegative} says whether that side is the counter-clockwise half.
 *
 * @param <T> {@code double[]} or {@code long[]}: the constants' type
 */
final class SectorTree<T> {
    final T a;
    final T b;
    final boolean[] upperIfNonNegative;

    private SectorTree(T a, T b, boolean[] upperIfNonNegative) {
        this.a = a;
        this.b = b;
        this.upperIfNonNegative = upperIfNonNegative;
    }

    /** The boundary index (0..M−1) tested at node h: the ray between the two halves of its sector range. */
    static int boundaryAt(int h, int m) {
        int depth = 31 - Integer.numberOfLeadingZeros(h);
        int length = m >> depth;
        int lo = (h - (1 << depth)) * length;
        return lo + length / 2 - 1;
    }

    /** A tree from the left normals of the M/2 lines (boundary j + M/2 is line j's opposite ray). */
    static SectorTree<double[]> ofDoubles(int m, double[][] lines) {
        double[] a = new double[m];
        double[] b = new double[m];
        boolean[] upper = new boolean[m];
        for (int h = 1; h < m; h++) {
            int boundary = boundaryAt(h, m);
            double sign = boundary < m / 2 ? 1 : -1;
            double na = sign * lines[boundary % (m / 2)][0] + 0.0;
            double nb = sign * lines[boundary % (m / 2)][1] + 0.0;
            boolean towardPlusI = na > 0 || (na == 0 && nb > 0);
            a[h] = towardPlusI ? na : -na;
            b[h] = towardPlusI ? nb : -nb;
            upper[h] = towardPlusI;
        }
        return new SectorTree<>(a, b, upper);
    }

    /** Whether normal (a, b) points toward +I, or toward +Q when a = 0: the side that takes a sample on its line. */
    static boolean pointsTowardPlusI(long a, long b) {
        return a > 0 || (a == 0 && b > 0);
    }

    /** A tree from the quantized left normals of the M/2 lines. */
    static SectorTree<long[]> ofCodes(int m, long[][] lines) {
        long[] a = new long[m];
        long[] b = new long[m];
        boolean[] upper = new boolean[m];
        for (int h = 1; h < m; h++) {
            int boundary = boundaryAt(h, m);
            long sign = boundary < m / 2 ? 1 : -1;
            long na = sign * lines[boundary % (m / 2)][0];
            long nb = sign * lines[boundary % (m / 2)][1];
            boolean towardPlusI = pointsTowardPlusI(na, nb);
            a[h] = towardPlusI ? na : -na;
            b[h] = towardPlusI ? nb : -nb;
            upper[h] = towardPlusI;
        }
        return new SectorTree<>(a, b, upper);
    }
}
