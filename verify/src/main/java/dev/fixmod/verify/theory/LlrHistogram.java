package dev.fixmod.verify.theory;

import java.util.Arrays;
import org.apache.commons.math3.optim.MaxEval;
import org.apache.commons.math3.optim.nonlinear.scalar.GoalType;
import org.apache.commons.math3.optim.univariate.BrentOptimizer;
import org.apache.commons.math3.optim.univariate.SearchInterval;
import org.apache.commons.math3.optim.univariate.UnivariateObjectiveFunction;
import org.apache.commons.math3.optim.univariate.UnivariatePointValuePair;

/**
 * Counts integer LLR codes per (bit position, bit sent, code), for the GMI of a fixed-point demapper. A code c
 * stands for the LLR c·scale (scale = the LSB in natural-log units). Because only integer counts are kept, the
 * histogram merges exactly (any chunking, any thread count, the same counts), and the GMI evaluated from it equals
 * the per-sample {@link GmiEstimator} on the values c·scale up to floating-point summation order, while costing one
 * logarithm per distinct code instead of one per sample.
 *
 * <p>A fixed-point LLR often carries an unknown scale (max-log metrics, a noise variance folded into a constant), and
 * the GMI of a mismatched decoder is the supremum over a common scale s of the estimate at s (Kaplan and Shamai
 * 1993; Alvarado et al., J. Lightw. Technol. 36(2), 2018). {@link #bestScale} finds it: the estimate is concave in s,
 * so Brent's method on log s finds the single maximum.
 *
 * <p>Samples arrive in time order, b0 first, as for {@link GmiEstimator}. Not thread-safe: one histogram per worker,
 * then {@link #merge}.
 */
public final class LlrHistogram {
    private static final double LN2 = StrictMath.log(2.0);
    /** Best-scale search: from 1e−4 to 1e4 times the reference scale. */
    private static final double SEARCH_DECADES = 4;
    private static final int MAX_EVALUATIONS = 400;

    private final int bitsPerSymbol;
    private final int minCode;
    private final int maxCode;
    /** counts[(j·2 + b)·width + (c − minCode)]. */
    private final long[] counts;
    private final int width;
    private long position;

    /** A histogram for k bit positions and codes in [minCode, maxCode] (e.g. a QFormat's minCode and maxCode). */
    public LlrHistogram(int bitsPerSymbol, int minCode, int maxCode) {
        if (bitsPerSymbol < 1 || bitsPerSymbol > 30) {
            throw new IllegalArgumentException("bits per symbol must be in 1..30, got " + bitsPerSymbol);
        }
        long w = (long) maxCode - minCode + 1;
        if (w < 1 || w > (1 << 20)) {
            throw new IllegalArgumentException("LLR code range [" + minCode + ", " + maxCode + "] must hold 1 to 2^20"
                    + " codes (LLR words up to 20 bits)");
        }
        this.bitsPerSymbol = bitsPerSymbol;
        this.minCode = minCode;
        this.maxCode = maxCode;
        this.width = (int) w;
        this.counts = new long[bitsPerSymbol * 2 * width];
    }

    /** Adds {@code length} codes {@code codes[codeOffset…]} with the bits sent {@code bits[bitOffset…]} (0 or 1). */
    public void add(int[] codes, int codeOffset, byte[] bits, int bitOffset, int length) {
        GmiEstimator.checkRange(codes.length, codeOffset, length, "LLR code");
        GmiEstimator.checkRange(bits.length, bitOffset, length, "bit");
        int j = (int) (position % bitsPerSymbol);
        for (int i = 0; i < length; i++) {
            int bit = bits[bitOffset + i];
            int c = codes[codeOffset + i];
            if ((bit & ~1) != 0) {
                throw new IllegalArgumentException("bit " + (bitOffset + i) + " is " + bit + "; bits must be 0 or 1");
            }
            if (c < minCode || c > maxCode) {
                throw new IllegalArgumentException("LLR code " + (codeOffset + i) + " is " + c + ", outside ["
                        + minCode + ", " + maxCode + "]");
            }
            counts[(j * 2 + bit) * width + (c - minCode)]++;
            if (++j == bitsPerSymbol) {
                j = 0;
            }
        }
        position += length;
    }

    /** Forgets every code: the histogram is as new. */
    public void reset() {
        Arrays.fill(counts, 0);
        position = 0;
    }

    /** Adds the counts of {@code other} (same k and code range, whole symbols so far). */
    public void merge(LlrHistogram other) {
        if (other.bitsPerSymbol != bitsPerSymbol || other.minCode != minCode || other.maxCode != maxCode) {
            throw new IllegalArgumentException("cannot merge an LLR histogram of " + other.bitsPerSymbol
                    + " bits and codes [" + other.minCode + ", " + other.maxCode + "] into one of " + bitsPerSymbol
                    + " bits and codes [" + minCode + ", " + maxCode + "]");
        }
        if (position % bitsPerSymbol != 0 || other.position % bitsPerSymbol != 0) {
            throw new IllegalArgumentException("LLR histograms merge only after whole symbols; positions are "
                    + position + " and " + other.position + " bits");
        }
        for (int i = 0; i < counts.length; i++) {
            counts[i] += other.counts[i];
        }
        position += other.position;
    }

    /** How often code c was seen at bit position j with bit b sent. */
    public long count(int bitPosition, int bit, int code) {
        if (bitPosition < 0 || bitPosition >= bitsPerSymbol || (bit & ~1) != 0 || code < minCode || code > maxCode) {
            throw new IllegalArgumentException("no histogram cell for bit position " + bitPosition + ", bit " + bit
                    + ", code " + code);
        }
        return counts[(bitPosition * 2 + bit) * width + (code - minCode)];
    }

    /** GMI in bits per symbol with code c read as the LLR c·scale. */
    public double gmi(double scale) {
        if (!(scale >= 0) || scale == Double.POSITIVE_INFINITY) {
            throw new IllegalArgumentException("LLR scale must be finite and >= 0, got " + scale);
        }
        double total = 0;
        for (int j = 0; j < bitsPerSymbol; j++) {
            long n = 0;
            double penalty = 0;
            for (int bit = 0; bit < 2; bit++) {
                int row = (j * 2 + bit) * width;
                for (int i = 0; i < width; i++) {
                    long count = counts[row + i];
                    if (count != 0) {
                        double llr = (minCode + i) * scale;
                        penalty += count * Capacity.softplus(bit == 0 ? -llr : llr);
                        n += count;
                    }
                }
            }
            if (n == 0) {
                throw new IllegalStateException("no LLR codes seen yet for bit position " + j);
            }
            total += 1 - penalty / n / LN2;
        }
        return total;
    }

    /**
     * The scale s in [referenceScale·1e−4, referenceScale·1e4] that maximizes {@link #gmi(double)}; the GMI there
     * is {@code gmi(bestScale(referenceScale))}. If the LLRs are never wrong, the GMI keeps rising towards k with s
     * and a scale where it has reached k to double precision comes back.
     */
    public double bestScale(double referenceScale) {
        if (!(referenceScale > 0) || referenceScale == Double.POSITIVE_INFINITY) {
            throw new IllegalArgumentException("reference LLR scale must be finite and > 0, got " + referenceScale);
        }
        double logRef = StrictMath.log(referenceScale);
        double span = SEARCH_DECADES * StrictMath.log(10.0);
        BrentOptimizer optimizer = new BrentOptimizer(1e-10, 1e-12);
        UnivariatePointValuePair best = optimizer.optimize(new MaxEval(MAX_EVALUATIONS), GoalType.MAXIMIZE,
                new UnivariateObjectiveFunction(logS -> gmi(StrictMath.exp(logS))),
                new SearchInterval(logRef - span, logRef + span, logRef));
        return StrictMath.exp(best.getPoint());
    }
}
