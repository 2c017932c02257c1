package dev.fixmod.demap;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.map.DatapathCost;
import java.util.Objects;

/**
 * A floating-point soft demapper: the LLR of each of the k label bits of a received complex sample, in the order
 * b0 … b(k−1), under the {@link LlrOptions} it was built with.
 *
 * <p>Inputs are the I and Q parts in two arrays sharing an offset; the LLRs of sample {@code n} are written at
 * {@code llr[llrOffset + n·k + b]}. For a one-dimensional (PAM) constellation the Q array may be {@code null}.
 * The batch method validates the whole batch first (array bounds, every sample finite) and writes nothing if any
 * check fails. Neither method allocates.
 *
 * <p>Instances hold preallocated scratch and are <b>not thread-safe</b>: use one instance per thread. They are cheap
 * to build once per noise power.
 */
public abstract class SoftDemapper {
    private final SoftAlgorithm algorithm;
    final Constellation constellation;
    final LlrOptions options;
    final int bitsPerSymbol;
    private final boolean oneDimensional;

    SoftDemapper(SoftAlgorithm algorithm, Constellation constellation, LlrOptions options) {
        this.algorithm = algorithm;
        this.constellation = Objects.requireNonNull(constellation, "constellation");
        this.options = Objects.requireNonNull(options, "options");
        if (constellation.alternatesQuarterTurn()) {
            throw new IllegalArgumentException(constellation.name() + " turns odd symbols by +90°: derotate them by"
                    + " −90° before demapping and use the plain two-point constellation");
        }
        this.bitsPerSymbol = constellation.bitsPerSymbol();
        this.oneDimensional = isOneDimensional(constellation);
    }

    /**
     * The demapper of {@code algorithm} for {@code constellation}.
     *
     * @throws IllegalArgumentException if the algorithm does not apply to the constellation (see {@link SoftAlgorithm})
     */
    public static SoftDemapper create(SoftAlgorithm algorithm, Constellation constellation, LlrOptions options) {
        switch (algorithm) {
            case LOG_MAP:
                return new LogMapDemapper(constellation, options);
            case MAX_LOG:
                return new MaxLogDemapper(constellation, options);
            case MAX_LOG_PER_AXIS:
                return new PerAxisMaxLogDemapper(constellation, options);
            case FOLDED_LINEAR:
                return new FoldedLinearDemapper(constellation, options);
            default:
                throw new AssertionError(algorithm);
        }
    }

    public final SoftAlgorithm algorithm() {
        return algorithm;
    }

    public final Constellation constellation() {
        return constellation;
    }

    public final LlrOptions options() {
        return options;
    }

    /** k, the number of LLRs per sample. */
    public final int bitsPerSymbol() {
        return bitsPerSymbol;
    }

    /**
     * The arithmetic of one received sample as this implementation performs it (constants counted as 64-bit table
     * entries): an estimate for comparing algorithms, not a synthesis result. Exponentials and logarithms are not
     * in it; see {@link #transcendentals}.
     */
    public abstract DatapathCost cost();

    /** The number of {@code exp} and {@code log} evaluations per sample (0 except for log-MAP). */
    public long transcendentals() {
        return 0;
    }

    /** 64 bits per stored double constant. */
    static final int DOUBLE_BITS = 64;

    /**
     * Writes the k LLRs of the sample {@code (re, im)} to {@code llr[llrOffset …]}.
     *
     * @throws IllegalArgumentException if the sample is not finite or the output does not fit
     */
    public final void llr(double re, double im, double[] llr, int llrOffset) {
        Checks.notNull(llr, "LLR");
        Checks.range("LLR output", llr.length, llrOffset, bitsPerSymbol);
        if (!Double.isFinite(re)) {
            throw Checks.notFinite("I", 0, re);
        }
        if (!Double.isFinite(im)) {
            throw Checks.notFinite("Q", 0, im);
        }
        compute(re, im, llr, llrOffset);
    }

    /**
     * Writes the LLRs of {@code count} samples {@code (re[offset + n], im[offset + n])} to
     * {@code llr[llrOffset + n·k …]}. {@code im} may be {@code null} for a one-dimensional constellation.
     *
     * @throws IllegalArgumentException if an array is missing or too short, or a sample is not finite; nothing is
     *                                  written then
     */
    public final void llr(double[] re, double[] im, int offset, int count, double[] llr, int llrOffset) {
        Checks.notNull(re, "I sample");
        Checks.notNull(llr, "LLR");
        Checks.range("I samples", re.length, offset, count);
        boolean hasQ = im != null;
        if (!hasQ && !oneDimensional) {
            throw new IllegalArgumentException("Q sample array is missing (null); only a one-dimensional"
                    + " constellation may omit it, and " + constellation.name() + " is two-dimensional");
        }
        if (hasQ) {
            Checks.range("Q samples", im.length, offset, count);
        }
        if (llrOffset < 0 || count > (llr.length - llrOffset) / bitsPerSymbol) {
            throw new IllegalArgumentException("LLR output: " + count + " samples of " + bitsPerSymbol
                    + " LLRs from offset " + llrOffset + " do not fit an array of length " + llr.length);
        }
        for (int n = 0; n < count; n++) {
            if (!Double.isFinite(re[offset + n])) {
                throw Checks.notFinite("I", offset + n, re[offset + n]);
            }
            if (hasQ && !Double.isFinite(im[offset + n])) {
                throw Checks.notFinite("Q", offset + n, im[offset + n]);
            }
        }
        for (int n = 0; n < count; n++) {
            compute(re[offset + n], hasQ ? im[offset + n] : 0.0, llr, llrOffset + n * bitsPerSymbol);
        }
    }

    private static boolean isOneDimensional(Constellation constellation) {
        for (int label = 0; label < constellation.size(); label++) {
            if (constellation.im(label) != 0.0) {
                return false;
            }
        }
        return true;
    }

    /** The LLRs of one validated sample. */
    abstract void compute(double re, double im, double[] llr, int llrOffset);

    @Override
    public String toString() {
        return algorithm + " demapper for " + constellation.name() + ", N0 " + options.n0() + ", " + options.sign();
    }
}
