package dev.fixmod.demap;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.map.ArrayRegions;
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
 * <h2>π/2-BPSK</h2>
 *
 * <p>A constellation that {@linkplain Constellation#alternatesQuarterTurn() turns odd-index symbols by +90°}
 * (3GPP TS 38.211 §5.1.1) is demapped by the methods that take the stream index of the sample ({@code symbolIndex})
 * or of a batch's first sample ({@code firstSymbol}, as the slicers and mappers take it): a sample of odd index is
 * compared with the turned points {@code (re, im) → (−im, re)}, exactly as the mapper emits them. The methods
 * without an index refuse such a constellation (a batch that continues a stream would silently get the wrong
 * parity); for every other constellation the index is checked ({@code >= 0}) and otherwise irrelevant. Only
 * {@code log-map} and {@code max-log} apply, and they agree: with one point per bit value, both give the exact
 * {@code L = (|y − s1|² − |y − s0|²)/N0}. The per-axis algorithms are refused, since the turn moves the bit from one
 * axis to the other.
 *
 * <table class="striped">
 *   <caption>π/2-BPSK LLRs, N0 = 1, zero-positive ({@code nr:pi2bpsk} unit energy: even points ±a(1 + j), odd
 *   points ±a(−1 + j), a = 1/√2, b = 0 ↦ +; {@code pi2bpsk}: even ±1, odd ±j)</caption>
 *   <thead><tr><th>constellation</th><th>symbol index</th><th>sample (I, Q)</th><th>LLR</th><th>why</th></tr></thead>
 *   <tbody>
 *     <tr><td>nr:pi2bpsk</td><td>0 (even)</td><td>(a, a)</td><td>4</td><td>4a(I + Q): on the point of b = 0</td></tr>
 *     <tr><td>nr:pi2bpsk</td><td>1 (odd)</td><td>(a, a)</td><td>0</td><td>4a(Q − I): on the odd boundary Q = I</td></tr>
 *     <tr><td>nr:pi2bpsk</td><td>1 (odd)</td><td>(−a, a)</td><td>4</td><td>on the turned point of b = 0</td></tr>
 *     <tr><td>nr:pi2bpsk</td><td>0 (even)</td><td>(0.5, −0.5)</td><td>0</td><td>on the even boundary I + Q = 0</td></tr>
 *     <tr><td>nr:pi2bpsk</td><td>0 (even)</td><td>(1, 0)</td><td>2√2 ≈ 2.828</td><td>4a·I</td></tr>
 *     <tr><td>nr:pi2bpsk</td><td>7 (odd)</td><td>(1, 0)</td><td>−2√2</td><td>−4a·I: nearer the odd point of b = 1,
 *         a(1 − j)</td></tr>
 *     <tr><td>pi2bpsk</td><td>2 (even)</td><td>(0.25, 3)</td><td>1</td><td>4I: Q carries no information</td></tr>
 *     <tr><td>pi2bpsk</td><td>3 (odd)</td><td>(0.25, 3)</td><td>12</td><td>4Q</td></tr>
 *   </tbody>
 * </table>
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
    private final boolean alternates;

    SoftDemapper(SoftAlgorithm algorithm, Constellation constellation, LlrOptions options) {
        this.algorithm = algorithm;
        this.constellation = Objects.requireNonNull(constellation, "constellation");
        this.options = Objects.requireNonNull(options, "options");
        Checks.requireAxisFreeForQuarterTurn(algorithm, constellation);
        this.bitsPerSymbol = constellation.bitsPerSymbol();
        this.alternates = constellation.alternatesQuarterTurn();
        // Odd symbols of a turned constellation leave the I axis even when the even ones lie on it.
        this.oneDimensional = !alternates && isOneDimensional(constellation);
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
     * @throws IllegalArgumentException if the sample is not finite, the output does not fit, or the constellation
     *                                  turns odd symbols (π/2-BPSK: use {@link #llr(double, double, long, double[],
     *                                  int)})
     */
    public final void llr(double re, double im, double[] llr, int llrOffset) {
        if (alternates) {
            throw Checks.streamIndexNeeded(constellation);
        }
        llr(re, im, 0, llr, llrOffset);
    }

    /**
     * Writes the k LLRs of the sample {@code (re, im)} to {@code llr[llrOffset …]}.
     *
     * @param symbolIndex the sample's index in the stream ({@code >= 0}; its parity matters for π/2-BPSK only)
     * @throws IllegalArgumentException if the sample is not finite, the output does not fit or the index is negative
     */
    public final void llr(double re, double im, long symbolIndex, double[] llr, int llrOffset) {
        Checks.notNull(llr, "LLR");
        Checks.range("LLR output", llr.length, llrOffset, bitsPerSymbol);
        ArrayRegions.requireSymbolIndex(symbolIndex);
        if (!Double.isFinite(re)) {
            throw Checks.notFinite("I", 0, re);
        }
        if (!Double.isFinite(im)) {
            throw Checks.notFinite("Q", 0, im);
        }
        compute(re, im, alternates && (symbolIndex & 1) != 0, llr, llrOffset);
    }

    /**
     * Writes the LLRs of {@code count} samples {@code (re[offset + n], im[offset + n])} to
     * {@code llr[llrOffset + n·k …]}. {@code im} may be {@code null} for a one-dimensional constellation.
     *
     * @throws IllegalArgumentException if an array is missing or too short, a sample is not finite, or the
     *                                  constellation turns odd symbols (π/2-BPSK: use {@link #llr(double[], double[],
     *                                  int, int, long, double[], int)}); nothing is written then
     */
    public final void llr(double[] re, double[] im, int offset, int count, double[] llr, int llrOffset) {
        if (alternates) {
            throw Checks.streamIndexNeeded(constellation);
        }
        llr(re, im, offset, count, 0, llr, llrOffset);
    }

    /**
     * Writes the LLRs of {@code count} samples {@code (re[offset + n], im[offset + n])}, of stream indices
     * {@code firstSymbol + n}, to {@code llr[llrOffset + n·k …]}. {@code im} may be {@code null} for a
     * one-dimensional constellation (never for π/2-BPSK, whose odd symbols lie on the Q axis).
     *
     * @param firstSymbol the stream index of the first sample ({@code >= 0}; parity matters for π/2-BPSK only)
     * @throws IllegalArgumentException if an array is missing or too short, a sample is not finite or the index is
     *                                  negative; nothing is written then
     */
    public final void llr(double[] re, double[] im, int offset, int count, long firstSymbol, double[] llr,
                          int llrOffset) {
        Checks.notNull(re, "I sample");
        Checks.notNull(llr, "LLR");
        Checks.range("I samples", re.length, offset, count);
        ArrayRegions.requireSymbolIndex(firstSymbol);
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
            compute(re[offset + n], hasQ ? im[offset + n] : 0.0, alternates && ((firstSymbol + n) & 1) != 0, llr,
                    llrOffset + n * bitsPerSymbol);
        }
    }

    /** The real parts of the points turned by +90°, {@code −im}, as the mapper emits them (never −0.0). */
    static double[] turnedRe(double[] im) {
        double[] re = new double[im.length];
        for (int s = 0; s < im.length; s++) {
            re[s] = -im[s] + 0.0;
        }
        return re;
    }

    private static boolean isOneDimensional(Constellation constellation) {
        for (int label = 0; label < constellation.size(); label++) {
            if (constellation.im(label) != 0.0) {
                return false;
            }
        }
        return true;
    }

    /** The LLRs of one validated sample of an even symbol (of any symbol unless π/2-BPSK). */
    abstract void compute(double re, double im, double[] llr, int llrOffset);

    /**
     * The LLRs of one validated sample; {@code odd} is true only for an odd-index symbol of π/2-BPSK, which only the
     * exhaustive demappers accept (they override this).
     */
    void compute(double re, double im, boolean odd, double[] llr, int llrOffset) {
        compute(re, im, llr, llrOffset);
    }

    @Override
    public String toString() {
        return algorithm + " demapper for " + constellation.name() + ", N0 " + options.n0() + ", " + options.sign();
    }
}
