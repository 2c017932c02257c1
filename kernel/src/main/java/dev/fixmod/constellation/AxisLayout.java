package dev.fixmod.constellation;

import java.util.Arrays;

/**
 * The separable structure of a PAM or rectangular QAM constellation: which label bits the I axis carries, which the
 * Q axis carries, and the amplitude each axis takes for each of its sub-labels. This is what lets a slicer decide each
 * axis with integer thresholds and a demapper compute per-dimension LLRs.
 *
 * <p>Bit positions count from b0, the first bit in time and the most significant bit of the label. The first entry
 * of {@link #iBits()} is the most significant bit of the I sub-label. Example, 3GPP TS 38.211 16-QAM: I carries
 * b0, b2 ({@code iBits = {0, 2}}), Q carries b1, b3. A PAM constellation has no Q bits and one Q level, 0.
 */
public final class AxisLayout {
    private final int[] iBits;
    private final int[] qBits;
    private final double[] iLevels;
    private final double[] qLevels;

    /**
     * @param iBits   label bit positions carried by I, most significant sub-label bit first
     * @param qBits   label bit positions carried by Q (empty for PAM)
     * @param iLevels I amplitude indexed by I sub-label (length 2^iBits.length)
     * @param qLevels Q amplitude indexed by Q sub-label (length 2^qBits.length; {0} for PAM)
     */
    public AxisLayout(int[] iBits, int[] qBits, double[] iLevels, double[] qLevels) {
        this.iBits = iBits.clone();
        this.qBits = qBits.clone();
        this.iLevels = Constellation.positiveZeros(iLevels);
        this.qLevels = Constellation.positiveZeros(qLevels);
        int k = iBits.length + qBits.length;
        boolean[] seen = new boolean[k];
        for (int b : concat(iBits, qBits)) {
            if (b < 0 || b >= k || seen[b]) {
                throw new IllegalArgumentException("axis bit positions " + Arrays.toString(iBits) + " / "
                        + Arrays.toString(qBits) + " must be a permutation of 0.." + (k - 1));
            }
            seen[b] = true;
        }
        if (iLevels.length != 1 << iBits.length || qLevels.length != 1 << qBits.length) {
            throw new IllegalArgumentException("axis levels must number 2^bits per axis: I has " + iLevels.length
                    + " for " + iBits.length + " bits, Q has " + qLevels.length + " for " + qBits.length + " bits");
        }
        checkDistinctFinite(iLevels, "I");
        checkDistinctFinite(qLevels, "Q");
    }

    private static void checkDistinctFinite(double[] levels, String axis) {
        double[] sorted = levels.clone();
        Arrays.sort(sorted);
        for (int i = 0; i < sorted.length; i++) {
            if (!Double.isFinite(sorted[i])) {
                throw new IllegalArgumentException(axis + " axis level " + sorted[i] + " is not finite");
            }
            if (i > 0 && sorted[i] == sorted[i - 1]) {
                throw new IllegalArgumentException(axis + " axis level " + sorted[i] + " appears twice");
            }
        }
    }

    private static int[] concat(int[] a, int[] b) {
        int[] all = Arrays.copyOf(a, a.length + b.length);
        System.arraycopy(b, 0, all, a.length, b.length);
        return all;
    }

    public int bitsPerSymbol() {
        return iBits.length + qBits.length;
    }

    public int[] iBits() {
        return iBits.clone();
    }

    public int[] qBits() {
        return qBits.clone();
    }

    public double[] iLevels() {
        return iLevels.clone();
    }

    public double[] qLevels() {
        return qLevels.clone();
    }

    public double iLevel(int subLabel) {
        return iLevels[subLabel];
    }

    public double qLevel(int subLabel) {
        return qLevels[subLabel];
    }

    /** Whether this is a one-dimensional (PAM) layout. */
    public boolean isOneDimensional() {
        return qBits.length == 0;
    }

    /** The label whose I sub-label is {@code subI} and Q sub-label is {@code subQ}. */
    public int compose(int subI, int subQ) {
        return compose(iBits, qBits, subI, subQ);
    }

    private static int compose(int[] iBits, int[] qBits, int subI, int subQ) {
        int k = iBits.length + qBits.length;
        int label = 0;
        for (int j = 0; j < iBits.length; j++) {
            int bit = (subI >>> (iBits.length - 1 - j)) & 1;
            label |= bit << (k - 1 - iBits[j]);
        }
        for (int j = 0; j < qBits.length; j++) {
            int bit = (subQ >>> (qBits.length - 1 - j)) & 1;
            label |= bit << (k - 1 - qBits[j]);
        }
        return label;
    }

    /** The I sub-label of {@code label}. */
    public int subLabelI(int label) {
        return extract(label, iBits);
    }

    /** The Q sub-label of {@code label}. */
    public int subLabelQ(int label) {
        return extract(label, qBits);
    }

    private int extract(int label, int[] positions) {
        int k = bitsPerSymbol();
        int sub = 0;
        for (int position : positions) {
            sub = (sub << 1) | ((label >>> (k - 1 - position)) & 1);
        }
        return sub;
    }

    /**
     * The layout of points that are separable, or {@code null}. Points are separable when flipping any one label bit
     * changes only I or only Q (never both) for every label; then I depends only on the bits that change it and Q
     * only on the others. Bits are listed in increasing position, so the lowest-numbered I bit is the most significant
     * bit of the I sub-label (as in 3GPP TS 38.211, where I carries b0, b2, …).
     *
     * @param re real parts by label, M = 2^k of them, distinct points assumed
     * @param im imaginary parts by label
     */
    static AxisLayout detect(double[] re, double[] im) {
        int m = re.length;
        int k = Integer.numberOfTrailingZeros(m);
        int[] iBits = new int[k];
        int[] qBits = new int[k];
        int ni = 0;
        int nq = 0;
        for (int position = 0; position < k; position++) {
            int mask = 1 << (k - 1 - position);
            boolean changesRe = false;
            boolean changesIm = false;
            for (int label = 0; label < m; label++) {
                changesRe |= re[label] != re[label ^ mask];
                changesIm |= im[label] != im[label ^ mask];
            }
            if (changesRe == changesIm) {
                return null;
            }
            if (changesRe) {
                iBits[ni++] = position;
            } else {
                qBits[nq++] = position;
            }
        }
        int[] iPositions = Arrays.copyOf(iBits, ni);
        int[] qPositions = Arrays.copyOf(qBits, nq);
        double[] iLevels = new double[1 << ni];
        double[] qLevels = new double[1 << nq];
        for (int sub = 0; sub < iLevels.length; sub++) {
            iLevels[sub] = re[compose(iPositions, qPositions, sub, 0)];
        }
        for (int sub = 0; sub < qLevels.length; sub++) {
            qLevels[sub] = im[compose(iPositions, qPositions, 0, sub)];
        }
        return new AxisLayout(iPositions, qPositions, iLevels, qLevels);
    }

    /** This layout with every level multiplied by {@code factor}. */
    public AxisLayout scaled(double factor) {
        double[] i = iLevels.clone();
        double[] q = qLevels.clone();
        for (int n = 0; n < i.length; n++) {
            i[n] *= factor;
        }
        for (int n = 0; n < q.length; n++) {
            q[n] *= factor;
        }
        return new AxisLayout(iBits, qBits, i, q);
    }
}
