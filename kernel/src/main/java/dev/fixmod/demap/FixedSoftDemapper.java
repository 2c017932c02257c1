package dev.fixmod.demap;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.fixed.FixedPoint;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import dev.fixmod.map.ArrayRegions;
import dev.fixmod.map.ConstellationRom;
import dev.fixmod.map.DatapathCost;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * A bit-exact fixed-point LLR datapath: integer I and Q codes in, one integer LLR code per label bit out, through the
 * stages of a {@link FixedLlrSpec} (metric → scale → output). The per-sample methods are integer-only, as an FPGA or
 * MCU would compute them; every constant (segment tables, fold constants, K) is derived once at construction. A test
 * inspects their bytecode to keep it so.
 *
 * <p>The reference points are a {@link ConstellationRom}: the same quantized constellation the fixed mapper emits and
 * the fixed slicers decide against, so an LLR's zero crossing lies exactly on the slicer's threshold. The input codes
 * share the ROM's format (at most {@value #MAX_INPUT_WORD_LENGTH} bits). Noise power and the levels' half-spacing A are
 * in the units of those codes' real values, i.e. of the ROM's scaled constellation.
 *
 * <p>The {@link LlrSign} is applied to the exact metric before any rounding. Each stage counts its overflow events on
 * its own {@link OverflowCounter} ({@code llr-metric}, {@code llr-scale}, {@code llr-output}); they accumulate across
 * calls until {@link #resetCounters}. The LLRs of sample {@code n} go to {@code llr[llrOffset + n·k + b]}. The batch
 * method validates every code first and writes nothing if one lies outside the input format.
 *
 * <p>π/2-BPSK ({@link Constellation#alternatesQuarterTurn()}) goes through the methods that take the stream index of
 * the sample or of a batch's first sample, as {@link SoftDemapper} documents; an odd-index sample is compared with
 * the ROM's turned codes ({@link ConstellationRom#oddICode}, {@link ConstellationRom#oddQCode}): the points the fixed
 * mapper emits for odd symbols. Only {@code max-log} applies; the methods without an index refuse π/2-BPSK. For
 * {@code nr:pi2bpsk} the metric is exact, {@code D = ±(d1 − d0) = ±2·(s0 − s1)·y} in the codes' units (the
 * {@code |s|²} terms cancel when the two codes have equal magnitude), so the LLR departs from the float value only
 * by the ROM's rounding of a and the stage roundings: the bound of the other constellations.
 *
 * <table class="striped">
 *   <caption>π/2-BPSK examples ({@code nr:pi2bpsk} unit energy in Q1.6: a = 1/√2 → code 45 (LSB 1/64); unscaled,
 *   metric Q9.12, output Q9.12, zero-positive; the output code is D in units of 2^−12)</caption>
 *   <thead><tr><th>symbol index</th><th>codes (I, Q)</th><th>metric D = d1 − d0</th><th>why</th></tr></thead>
 *   <tbody>
 *     <tr><td>0 (even)</td><td>(45, 45)</td><td>4·45·90 = 16200</td><td>4·45·(I + Q): on the b = 0 point</td></tr>
 *     <tr><td>1 (odd)</td><td>(45, 45)</td><td>0</td><td>4·45·(Q − I): on the odd boundary</td></tr>
 *     <tr><td>1 (odd)</td><td>(−45, 45)</td><td>16200</td><td>on the turned b = 0 point (−45, 45)</td></tr>
 *     <tr><td>2 (even)</td><td>(−128, −128) (most negative codes)</td><td>−46080</td>
 *         <td>4·45·(−256): no overflow in a wide metric stage</td></tr>
 *     <tr><td>3 (odd)</td><td>(10, −3)</td><td>−2340</td><td>4·45·(−13)</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>Instances hold scratch and counters and are <b>not thread-safe</b>: use one per thread and
 * {@link OverflowCounter#add merge} the counters afterwards.
 */
public abstract class FixedSoftDemapper {
    /** Stage names, as reports show them. */
    public static final String METRIC_STAGE = "llr-metric";
    public static final String SCALE_STAGE = "llr-scale";
    public static final String OUTPUT_STAGE = "llr-output";
    /** The widest input word: squared distances (and their sums and differences) stay exact in 64 bits. */
    public static final int MAX_INPUT_WORD_LENGTH = 30;

    private final SoftAlgorithm algorithm;
    final ConstellationRom reference;
    final QFormat input;
    final Constellation constellation;
    final LlrOptions options;
    final FixedLlrSpec spec;
    final int bitsPerSymbol;
    private final double idealScale;
    private final long scaleCode;
    private final boolean scaled;
    private final int productFractionalBits;
    private final boolean oneDimensional;
    private final boolean alternates;
    private final StageFit scaleFit;
    private final StageFit outputFit;
    private final OverflowCounter metricCounter = new OverflowCounter(METRIC_STAGE);
    private final OverflowCounter scaleCounter = new OverflowCounter(SCALE_STAGE);
    private final OverflowCounter outputCounter = new OverflowCounter(OUTPUT_STAGE);

    FixedSoftDemapper(SoftAlgorithm algorithm, ConstellationRom reference, LlrOptions options, FixedLlrSpec spec) {
        this.algorithm = algorithm;
        this.reference = Objects.requireNonNull(reference, "reference ROM");
        this.input = reference.format();
        if (input.wordLength() > MAX_INPUT_WORD_LENGTH) {
            throw new IllegalArgumentException("input format " + input + " has " + input.wordLength() + " bits; the"
                    + " LLR datapaths take at most " + MAX_INPUT_WORD_LENGTH + " (squared distances must be exact in 64"
                    + " bits)");
        }
        this.constellation = FixedLevels.effective(reference);
        Checks.requireAxisFreeForQuarterTurn(algorithm, constellation);
        this.alternates = constellation.alternatesQuarterTurn();
        this.options = Objects.requireNonNull(options, "options");
        this.spec = Objects.requireNonNull(spec, "spec");
        this.bitsPerSymbol = constellation.bitsPerSymbol();
        boolean flat = true;
        for (int label = 0; label < constellation.size(); label++) {
            flat &= constellation.im(label) == 0.0;
        }
        // Odd symbols of a turned constellation leave the I axis even when the even ones lie on it.
        this.oneDimensional = flat && !alternates;
        if (options.usesPriors(constellation)) {
            throw new IllegalArgumentException("the fixed-point datapaths assume equiprobable symbols, but "
                    + constellation.name() + " has non-uniform probabilities: turn priors off");
        }
        this.idealScale = FixedLevels.scaleValue(algorithm, constellation, options);
        this.scaled = spec.isScaled();
        if (scaled) {
            OverflowCounter fit = OverflowCounter.unnamed();
            QFormat kf = spec.scaleConstant();
            this.scaleCode = FixedPoint.quantize(idealScale, kf, spec.constantRounding(), Overflow.SATURATE, fit);
            if (fit.events() > 0) {
                throw new IllegalArgumentException("scale constant K = " + idealScale + " does not fit "
                        + kf.describe() + "; add integer bits");
            }
            if (scaleCode == 0) {
                throw new IllegalArgumentException("scale constant K = " + idealScale + " rounds to 0 in "
                        + kf.describe() + "; add fractional bits");
            }
            this.productFractionalBits = spec.metric().format().fractionalBits() + kf.fractionalBits();
        } else {
            this.scaleCode = 1;
            this.productFractionalBits = spec.metric().format().fractionalBits();
        }
        this.scaleFit = scaled ? new StageFit(spec.scale(), productFractionalBits) : null;
        this.outputFit = new StageFit(spec.output(), scaled ? spec.scale().format().fractionalBits()
                : productFractionalBits);
    }

    /**
     * The datapath of {@code algorithm} ({@code max-log}, {@code max-log-per-axis} or {@code folded-linear}).
     *
     * @throws IllegalArgumentException if the algorithm has no fixed-point datapath, does not apply to the
     *                                  constellation, or the formats are too narrow for it
     */
    public static FixedSoftDemapper create(SoftAlgorithm algorithm, ConstellationRom reference, LlrOptions options,
                                           FixedLlrSpec spec) {
        switch (algorithm) {
            case MAX_LOG:
                return new FixedMaxLogDemapper(reference, options, spec);
            case MAX_LOG_PER_AXIS:
                return new FixedPerAxisMaxLogDemapper(reference, options, spec);
            case FOLDED_LINEAR:
                return new FixedFoldedLinearDemapper(reference, options, spec);
            case LOG_MAP:
            default:
                FixedLevels.requireFixedAlgorithm(algorithm);
                throw new AssertionError(algorithm);
        }
    }

    public final SoftAlgorithm algorithm() {
        return algorithm;
    }

    /** The reference points and input format. */
    public final ConstellationRom reference() {
        return reference;
    }

    /** The format of the I and Q codes: the ROM's. */
    public final QFormat inputFormat() {
        return input;
    }

    /** The constellation in the units of the input codes (the ROM's constellation times its scale). */
    public final Constellation constellation() {
        return constellation;
    }

    public final LlrOptions options() {
        return options;
    }

    public final FixedLlrSpec spec() {
        return spec;
    }

    /** k, the number of LLR codes per sample. */
    public final int bitsPerSymbol() {
        return bitsPerSymbol;
    }

    /** The exact scale constant K the datapath approximates (1/N0 or 4A/N0), whether or not it is applied. */
    public final double idealScaleConstant() {
        return idealScale;
    }

    /** The code of K in the scale constant format; 1 when unscaled. */
    public final long scaleConstantCode() {
        return scaleCode;
    }

    /** The real value of the quantized K; 1 when unscaled. */
    public final double scaleConstant() {
        return scaled ? spec.scaleConstant().toDouble(scaleCode) : 1.0;
    }

    /** The overflow counters, in stage order: metric, scale (always 0 events when unscaled), output. */
    public final List<OverflowCounter> counters() {
        return List.of(metricCounter, scaleCounter, outputCounter);
    }

    /**
     * The operations of one sample through this datapath, in the units of {@link DatapathCost}: the metric front end
     * (see each datapath), then per bit the multiplication by K and the scale and output stages. A stage costs one
     * addition when it drops fractional bits with a rounding other than {@code floor}, and two comparisons unless it
     * wraps. Table bits include K. The sign is free: hardware multiplies by −K instead.
     */
    public final DatapathCost cost() {
        DatapathCost perBit;
        long kBits = 0;
        if (scaled) {
            perBit = new DatapathCost(1, 0, 0, 0)
                    .plus(stage(spec.scale(), productFractionalBits))
                    .plus(stage(spec.output(), spec.scale().format().fractionalBits()));
            kBits = spec.scaleConstant().wordLength();
        } else {
            perBit = stage(spec.output(), productFractionalBits);
        }
        return frontCost().plus(perBit.repeated(bitsPerSymbol)).plus(new DatapathCost(0, 0, 0, kBits));
    }

    /** The cost of fitting a value with {@code fromFractionalBits} fractional bits through {@code stage}. */
    static DatapathCost stage(Quantizer stage, int fromFractionalBits) {
        boolean rounds = fromFractionalBits > stage.format().fractionalBits() && stage.rounding() != Rounding.FLOOR;
        return new DatapathCost(0, rounds ? 1 : 0, stage.overflow() == Overflow.WRAP ? 0 : 2, 0);
    }

    /** The cost of {@link #prepare} and every bit's {@link #metric}, metric stage included, with their tables. */
    abstract DatapathCost frontCost();

    /** Sets every stage's event count to 0. */
    public final void resetCounters() {
        metricCounter.reset();
        scaleCounter.reset();
        outputCounter.reset();
    }

    /**
     * Writes the k LLR codes of the sample {@code (iCode, qCode)} to {@code llr[llrOffset …]}. Integer-only.
     *
     * @throws IllegalArgumentException if a code lies outside the input format, the output does not fit, or the
     *                                  constellation turns odd symbols (π/2-BPSK: use {@link #llr(int, int, long,
     *                                  int[], int)})
     */
    public final void llr(int iCode, int qCode, int[] llr, int llrOffset) {
        if (alternates) {
            throw Checks.streamIndexNeeded(constellation);
        }
        llr(iCode, qCode, 0, llr, llrOffset);
    }

    /**
     * Writes the k LLR codes of the sample {@code (iCode, qCode)} to {@code llr[llrOffset …]}. Integer-only.
     *
     * @param symbolIndex the sample's index in the stream ({@code >= 0}; its parity matters for π/2-BPSK only)
     * @throws IllegalArgumentException if a code lies outside the input format, the output does not fit or the
     *                                  index is negative
     */
    public final void llr(int iCode, int qCode, long symbolIndex, int[] llr, int llrOffset) {
        if (llr == null || llrOffset < 0 || llrOffset > llr.length - bitsPerSymbol) {
            throw outputDoesNotFit(llr, llrOffset, 1);
        }
        ArrayRegions.requireSymbolIndex(symbolIndex);
        checkCode("I", 0, iCode);
        checkCode("Q", 0, qCode);
        compute(iCode, qCode, alternates && (symbolIndex & 1) != 0, llr, llrOffset);
    }

    /**
     * Writes the LLR codes of {@code count} samples {@code (i[offset + n], q[offset + n])} to
     * {@code llr[llrOffset + n·k …]}. {@code q} may be {@code null} for a one-dimensional constellation. Integer-only.
     *
     * @throws IllegalArgumentException if an array is missing or too short, a code lies outside the input format, or
     *                                  the constellation turns odd symbols (π/2-BPSK: use {@link #llr(int[], int[],
     *                                  int, int, long, int[], int)}); nothing is written then
     */
    public final void llr(int[] i, int[] q, int offset, int count, int[] llr, int llrOffset) {
        if (alternates) {
            throw Checks.streamIndexNeeded(constellation);
        }
        llr(i, q, offset, count, 0, llr, llrOffset);
    }

    /**
     * Writes the LLR codes of {@code count} samples {@code (i[offset + n], q[offset + n])}, of stream indices
     * {@code firstSymbol + n}, to {@code llr[llrOffset + n·k …]}. {@code q} may be {@code null} for a
     * one-dimensional constellation (never for π/2-BPSK). Integer-only.
     *
     * @param firstSymbol the stream index of the first sample ({@code >= 0}; parity matters for π/2-BPSK only)
     * @throws IllegalArgumentException if an array is missing or too short, a code lies outside the input format or
     *                                  the index is negative; nothing is written then
     */
    public final void llr(int[] i, int[] q, int offset, int count, long firstSymbol, int[] llr, int llrOffset) {
        ArrayRegions.requireSymbolIndex(firstSymbol);
        Checks.notNull(i, "I code");
        Checks.range("I codes", i.length, offset, count);
        if (q == null && !oneDimensional) {
            throw new IllegalArgumentException("Q code array is missing (null); only a one-dimensional constellation"
                    + " may omit it, and " + constellation.name() + " is two-dimensional");
        }
        if (q != null) {
            Checks.range("Q codes", q.length, offset, count);
        }
        if (llr == null || llrOffset < 0 || count > (llr.length - llrOffset) / bitsPerSymbol) {
            throw outputDoesNotFit(llr, llrOffset, count);
        }
        for (int n = 0; n < count; n++) {
            checkCode("I", offset + n, i[offset + n]);
            if (q != null) {
                checkCode("Q", offset + n, q[offset + n]);
            }
        }
        // The fast paths know nothing of parity; π/2-BPSK takes the per-sample path.
        if (alternates || !computeBatch(i, q, offset, count, llr, llrOffset)) {
            for (int n = 0; n < count; n++) {
                compute(i[offset + n], q == null ? 0 : q[offset + n], alternates && ((firstSymbol + n) & 1) != 0, llr,
                        llrOffset + n * bitsPerSymbol);
            }
        }
    }

    private IllegalArgumentException outputDoesNotFit(int[] llr, int llrOffset, int count) {
        return new IllegalArgumentException("LLR output: " + count + " samples of " + bitsPerSymbol
                + " LLR codes from offset " + llrOffset + " do not fit "
                + (llr == null ? "a missing (null) array" : "an array of length " + llr.length));
    }

    private void checkCode(String axis, int index, int code) {
        if (code < input.minCode() || code > input.maxCode()) {
            throw Checks.codeOutside(axis, index, code, input);
        }
    }

    /**
     * The intermediate values of every bit for one sample; the LLRs are those {@link #llr(int, int, int[], int)}
     * returns. Uses its own counters, so the datapath's counters are untouched. Allocates: for debugging only.
     *
     * @throws IllegalArgumentException if a code lies outside the input format or the constellation turns odd
     *                                  symbols (π/2-BPSK: use {@link #trace(int, int, long)})
     */
    public final FixedLlrTrace trace(int iCode, int qCode) {
        if (alternates) {
            throw Checks.streamIndexNeeded(constellation);
        }
        return trace(iCode, qCode, 0);
    }

    /**
     * The intermediate values of every bit for one sample of stream index {@code symbolIndex}; the LLRs are those
     * {@link #llr(int, int, long, int[], int)} returns. Allocates: for debugging only.
     *
     * @throws IllegalArgumentException if a code lies outside the input format or the index is negative
     */
    public final FixedLlrTrace trace(int iCode, int qCode, long symbolIndex) {
        ArrayRegions.requireSymbolIndex(symbolIndex);
        checkCode("I", 0, iCode);
        checkCode("Q", 0, qCode);
        OverflowCounter m = OverflowCounter.unnamed();
        OverflowCounter s = OverflowCounter.unnamed();
        OverflowCounter o = OverflowCounter.unnamed();
        List<FixedLlrTrace.Bit> bits = new ArrayList<>();
        prepare(iCode, qCode, alternates && (symbolIndex & 1) != 0, m);
        for (int b = 0; b < bitsPerSymbol; b++) {
            List<FixedLlrTrace.Value> values = new ArrayList<>();
            describe(b, iCode, qCode, values);
            long before = m.events();
            long metric = metric(b, iCode, qCode, m);
            values.add(FixedLlrTrace.Value.code("metric", metric, spec.metric().format().fractionalBits(),
                    m.events() > before || values.stream().anyMatch(FixedLlrTrace.Value::overflowed)));
            long product = metric;
            if (scaled) {
                values.add(FixedLlrTrace.Value.code("scale-constant", scaleCode,
                        spec.scaleConstant().fractionalBits(), false));
                long sb = s.events();
                product = spec.scale().fit(metric * scaleCode, productFractionalBits, s);
                values.add(FixedLlrTrace.Value.code("scale", product, spec.scale().format().fractionalBits(),
                        s.events() > sb));
            }
            long ob = o.events();
            long out = spec.output().fit(product, scaled ? spec.scale().format().fractionalBits()
                    : productFractionalBits, o);
            values.add(FixedLlrTrace.Value.code("output", out, spec.output().format().fractionalBits(),
                    o.events() > ob));
            bits.add(new FixedLlrTrace.Bit(b, axisOf(b), values, (int) out));
        }
        return new FixedLlrTrace(iCode, qCode, bits);
    }

    private void compute(int iCode, int qCode, boolean odd, int[] llr, int llrOffset) {
        prepare(iCode, qCode, odd, metricCounter);
        for (int b = 0; b < bitsPerSymbol; b++) {
            // An output format has at most 32 signed bits: the code fits an int.
            llr[llrOffset + b] = (int) finish(metric(b, iCode, qCode, metricCounter));
        }
    }

    private long finish(long metric) {
        return finish(metric, scaleCounter, outputCounter);
    }

    /** The scale and output stages of one bit's metric, counting on the given counters. */
    final long finish(long metric, OverflowCounter scale, OverflowCounter output) {
        if (scaled) {
            return outputFit.fit(scaleFit.fit(metric * scaleCode, scale), output);
        }
        return outputFit.fit(metric, output);
    }

    /**
     * A faster way to the same codes and counts for a validated batch, if the datapath has one; returns whether it
     * handled the batch (the default has none).
     */
    boolean computeBatch(int[] i, int[] q, int offset, int count, int[] llr, int llrOffset) {
        return false;
    }

    /** The stage counters, for subclasses that tally a batch's events themselves. */
    final OverflowCounter metricCounter() {
        return metricCounter;
    }

    final OverflowCounter scaleCounter() {
        return scaleCounter;
    }

    final OverflowCounter outputCounter() {
        return outputCounter;
    }

    /** Per-sample work shared by all bits (distances, folds); integer-only. */
    abstract void prepare(long iCode, long qCode, OverflowCounter metric);

    /**
     * {@link #prepare(long, long, OverflowCounter)} for a symbol of even or odd index; {@code odd} is true only for
     * π/2-BPSK, which only the exhaustive datapath accepts (it overrides this). Integer-only.
     */
    void prepare(long iCode, long qCode, boolean odd, OverflowCounter metric) {
        prepare(iCode, qCode, metric);
    }

    /** Bit {@code b}'s metric code after the metric stage, with the LLR sign applied; integer-only. */
    abstract long metric(int b, long iCode, long qCode, OverflowCounter metric);

    /** Appends bit {@code b}'s values before the metric stage (after {@link #prepare}). */
    abstract void describe(int b, long iCode, long qCode, List<FixedLlrTrace.Value> into);

    /** {@code I}, {@code Q} or {@code IQ}. */
    abstract String axisOf(int b);

    @Override
    public String toString() {
        return "fixed " + algorithm + " datapath for " + constellation.name() + " (input " + input + ", " + spec + ")";
    }
}
