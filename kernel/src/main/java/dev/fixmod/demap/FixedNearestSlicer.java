package dev.fixmod.demap;

import dev.fixmod.map.ConstellationRom;
import dev.fixmod.map.DatapathCost;

/**
 * The fixed-point minimum-distance slicer for any constellation: exact integer squared distances
 * {@code (I − a)² + (Q − b)²} to every point {@code (a, b)} of a {@link ConstellationRom} in the input format, the
 * smallest winning. The points are scanned by decreasing I, then Q, and the best is replaced only by a strictly
 * smaller distance: among equidistant points the largest I, then the largest Q wins (the tie rule of
 * {@link FixedSlicer}). On square and rectangular QAM it decides exactly as {@link FixedAxisSlicer} on the same ROM.
 *
 * <p>The input word is at most 30 bits, so that a squared distance of two codes fits 63 bits.
 */
public final class FixedNearestSlicer extends FixedSlicer {
    private final ConstellationRom reference;
    private final int[] evenI;
    private final int[] evenQ;
    private final int[] evenLabels;
    private final int[] oddI;
    private final int[] oddQ;
    private final int[] oddLabels;

    /**
     * @param reference the constellation's points quantized into the input format of the slicer
     * @throws IllegalArgumentException if the input word is longer than 30 bits
     */
    public FixedNearestSlicer(ConstellationRom reference) {
        super(reference.constellation(), reference.format());
        if (reference.format().wordLength() > 30) {
            throw new IllegalArgumentException("the nearest-point slicer takes input words of at most 30 bits (a"
                    + " squared distance must fit 63 bits), got " + reference.format().describe());
        }
        this.reference = reference;
        int m = reference.size();
        double[] ei = new double[m];
        double[] eq = new double[m];
        double[] oi = new double[m];
        double[] oq = new double[m];
        for (int label = 0; label < m; label++) {
            ei[label] = reference.iCode(label);
            eq[label] = reference.qCode(label);
            oi[label] = reference.oddICode(label);
            oq[label] = reference.oddQCode(label);
        }
        evenLabels = ScanOrder.of(ei, eq);
        evenI = permute(ei, evenLabels);
        evenQ = permute(eq, evenLabels);
        oddLabels = ScanOrder.of(oi, oq);
        oddI = permute(oi, oddLabels);
        oddQ = permute(oq, oddLabels);
    }

    private static int[] permute(double[] codes, int[] labels) {
        int[] p = new int[labels.length];
        for (int n = 0; n < labels.length; n++) {
            p[n] = (int) codes[labels[n]];
        }
        return p;
    }

    /** The reference ROM. */
    public ConstellationRom reference() {
        return reference;
    }

    /**
     * Per point two subtractions, two squarings and one addition, then M − 1 comparisons; tables: the ROM and the
     * labels in scan order (plus the negation of π/2-BPSK's odd symbols).
     */
    @Override
    public DatapathCost cost() {
        int m = reference.size();
        return new DatapathCost(2, 3, 0, 0).repeated(m)
                .plus(new DatapathCost(0, reference.alternatesQuarterTurn() ? 1 : 0, m - 1,
                        reference.tableBits() + (long) m * reference.bitsPerSymbol()));
    }

    @Override
    int decide(int i, int q, boolean odd) {
        int[] x = odd ? oddI : evenI;
        int[] y = odd ? oddQ : evenQ;
        int best = 0;
        long bestDistance = Long.MAX_VALUE;
        for (int n = 0; n < x.length; n++) {
            long d = squaredDistance(i, q, x[n], y[n]);
            if (d < bestDistance) {
                bestDistance = d;
                best = n;
            }
        }
        return (odd ? oddLabels : evenLabels)[best];
    }

    @Override
    boolean onBoundary(int i, int q, boolean odd) {
        int[] x = odd ? oddI : evenI;
        int[] y = odd ? oddQ : evenQ;
        long bestDistance = Long.MAX_VALUE;
        int atBest = 0;
        for (int n = 0; n < x.length; n++) {
            long d = squaredDistance(i, q, x[n], y[n]);
            if (d < bestDistance) {
                bestDistance = d;
                atBest = 1;
            } else if (d == bestDistance) {
                atBest++;
            }
        }
        return atBest > 1;
    }

    private static long squaredDistance(int i, int q, int pointI, int pointQ) {
        long di = (long) i - pointI;
        long dq = (long) q - pointQ;
        return di * di + dq * dq;
    }
}
