package dev.fixmod.verify.theory;

import java.util.Arrays;

/**
 * Accumulates the standard estimate of the generalized mutual information (GMI) of bit-metric decoding from LLRs and
 * the bits that were sent, for uniform bits:
 * GMI = Σ_j (1 − E[log2(1 + exp(−(1 − 2b)·L))]) bits per symbol, j over the k label bit positions, L the LLR of bit
 * b (sign convention L = ln P(b=0|y) − ln P(b=1|y), so a correct confident LLR costs almost nothing and a wrong one
 * costs about |L|/ln 2 bits). The LLRs are taken as they are (scale 1); {@link LlrHistogram} also finds the best
 * scale for integer LLR codes.
 *
 * <p>Samples arrive in time order, b0 first: the i-th LLR added (over all calls) belongs to bit position i mod k,
 * so chunks need not end on a symbol boundary. Sums are compensated (Neumaier), so billions of samples do not drift.
 * A result depends on the order of the chunks only in its last bits; a parallel caller merges estimators in a fixed
 * order, or uses {@link LlrHistogram}, whose integer counts merge exactly.
 *
 * <table class="striped">
 *   <caption>Examples (k = 1)</caption>
 *   <thead><tr><th>samples</th><th>GMI</th></tr></thead>
 *   <tbody>
 *     <tr><td>b = 0, L = +∞ (or b = 1, L = −∞)</td><td>1</td></tr>
 *     <tr><td>L = 0 for every bit</td><td>0</td></tr>
 *     <tr><td>consistent Gaussian L ~ N(±σ²/2, σ²)</td><td>→ {@link Capacity#jFunction J(σ)}</td></tr>
 *     <tr><td>confident and wrong</td><td>negative (the LLRs are worse than none)</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>Not thread-safe: one estimator per worker.
 */
public final class GmiEstimator {
    private static final double LN2 = StrictMath.log(2.0);

    private final int bitsPerSymbol;
    private final double[] sum;
    private final double[] compensation;
    private final long[] count;
    private long position;

    public GmiEstimator(int bitsPerSymbol) {
        if (bitsPerSymbol < 1 || bitsPerSymbol > 30) {
            throw new IllegalArgumentException("bits per symbol must be in 1..30, got " + bitsPerSymbol);
        }
        this.bitsPerSymbol = bitsPerSymbol;
        this.sum = new double[bitsPerSymbol];
        this.compensation = new double[bitsPerSymbol];
        this.count = new long[bitsPerSymbol];
    }

    /**
     * Adds {@code length} LLRs {@code llr[llrOffset…]} with the bits sent {@code bits[bitOffset…]} (each 0 or 1).
     */
    public void add(double[] llr, int llrOffset, byte[] bits, int bitOffset, int length) {
        checkRange(llr.length, llrOffset, length, "LLR");
        checkRange(bits.length, bitOffset, length, "bit");
        int j = (int) (position % bitsPerSymbol);
        for (int i = 0; i < length; i++) {
            int bit = bits[bitOffset + i];
            double l = llr[llrOffset + i];
            if ((bit & ~1) != 0) {
                throw new IllegalArgumentException("bit " + (bitOffset + i) + " is " + bit + "; bits must be 0 or 1");
            }
            if (Double.isNaN(l)) {
                throw new IllegalArgumentException("LLR " + (llrOffset + i) + " is NaN");
            }
            accumulate(j, Capacity.softplus(bit == 0 ? -l : l));
            count[j]++;
            if (++j == bitsPerSymbol) {
                j = 0;
            }
        }
        position += length;
    }

    /** Forgets every sample: the estimator is as new. */
    public void reset() {
        Arrays.fill(sum, 0.0);
        Arrays.fill(compensation, 0.0);
        Arrays.fill(count, 0);
        position = 0;
    }

    /** Adds the sums of {@code other} (same k, a whole number of symbols so far) into this one. */
    public void merge(GmiEstimator other) {
        if (other.bitsPerSymbol != bitsPerSymbol) {
            throw new IllegalArgumentException("cannot merge a GMI estimate of " + other.bitsPerSymbol
                    + " bits per symbol into one of " + bitsPerSymbol);
        }
        if (position % bitsPerSymbol != 0 || other.position % bitsPerSymbol != 0) {
            throw new IllegalArgumentException("GMI estimates merge only after whole symbols; positions are "
                    + position + " and " + other.position + " bits");
        }
        for (int j = 0; j < bitsPerSymbol; j++) {
            accumulate(j, other.sum[j]);
            accumulate(j, other.compensation[j]);
            count[j] += other.count[j];
        }
        position += other.position;
    }

    public int bitsPerSymbol() {
        return bitsPerSymbol;
    }

    /** The samples seen at bit position j. */
    public long count(int bitPosition) {
        return count[checkPosition(bitPosition)];
    }

    /** 1 − E[log2(1 + exp(−(1 − 2b)·L))] for bit position j, in bits. */
    public double gmi(int bitPosition) {
        int j = checkPosition(bitPosition);
        if (count[j] == 0) {
            throw new IllegalStateException("no LLRs seen yet for bit position " + j);
        }
        return 1 - (sum[j] + compensation[j]) / count[j] / LN2;
    }

    /** The GMI in bits per symbol: the sum over the k bit positions. */
    public double gmi() {
        double total = 0;
        for (int j = 0; j < bitsPerSymbol; j++) {
            total += gmi(j);
        }
        return total;
    }

    private void accumulate(int j, double value) {
        // Neumaier's compensated sum.
        double s = sum[j];
        double t = s + value;
        compensation[j] += Math.abs(s) >= Math.abs(value) ? (s - t) + value : (value - t) + s;
        sum[j] = t;
    }

    private int checkPosition(int bitPosition) {
        if (bitPosition < 0 || bitPosition >= bitsPerSymbol) {
            throw new IllegalArgumentException("bit position must be in 0.." + (bitsPerSymbol - 1) + ", got "
                    + bitPosition);
        }
        return bitPosition;
    }

    static void checkRange(int arrayLength, int offset, int length, String what) {
        if (offset < 0 || length < 0 || offset > arrayLength - length) {
            throw new IllegalArgumentException(what + " range [" + offset + ", " + offset + " + " + length
                    + ") lies outside an array of " + arrayLength);
        }
    }
}
