package dev.fixmod.verify.loss;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.demap.FixedLlrSpec;
import dev.fixmod.demap.FixedSoftDemapper;
import dev.fixmod.demap.LlrOptions;
import dev.fixmod.demap.LlrScaling;
import dev.fixmod.demap.LlrSign;
import dev.fixmod.demap.SoftAlgorithm;
import dev.fixmod.demap.SoftDemapper;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import dev.fixmod.map.ConstellationRom;
import java.util.Objects;

/**
 * One design point of the receive chain whose loss is measured: the transmit ROM, the receiver's input quantizer and
 * gain, the fixed LLR datapath, and the floating-point reference demapper it is compared with.
 *
 * <p>The received sample is multiplied by the gain g before the input quantizer. Without a back-off g = 1; with a
 * back-off of B dB the largest coordinate of the constellation sits B dB below the input format's largest value:
 * g = maxValue · 10^(−B/20) / max|coordinate|. The datapath's reference points are the constellation times g in the
 * input format, and its noise power is N0·g² (in input units) divided by the LLR scale s, so the output code c stands
 * for the LLR c·LSB/s nats (noise-scaled) — s spreads the LLRs over more codes.
 *
 * <p>The internal stages of the datapath ({@code metric}, {@code scaleConstant}, {@code scale}) are either given or
 * {@code null}: a {@code null} stage is the kernel's suggestion ({@link FixedLlrSpec#suggested}) for this design,
 * sized for the smallest N0 of the run, with this design's rounding. An unscaled datapath has neither scale constant
 * nor scale stage (both {@code null}).
 *
 * @param backOffDb            the input back-off in dB, or NaN for gain 1
 * @param metric               the metric stage, or {@code null} for the suggested one
 * @param scaleConstant        the format of K, or {@code null} for the suggested one (or none: unscaled)
 * @param scale                the product stage metric × K, or {@code null} for the suggested one (or none: unscaled)
 * @param llrScale             s &gt; 0, the factor applied to the LLR before the output quantizer
 * @param rounding             the rounding of the constants (receive ROM, K, fold constants) and of every suggested
 *                             stage; a given stage keeps its own ({@link #withRounding} sets them all)
 */
public record Design(Constellation constellation, Quantizer mapper, Quantizer input, double backOffDb,
                     SoftAlgorithm algorithm, SoftAlgorithm reference, LlrScaling scaling, Quantizer metric,
                     QFormat scaleConstant, Quantizer scale, Quantizer llr, double llrScale, Rounding rounding) {

    /** The widest LLR word: the fixed GMI keeps a histogram over every code. */
    public static final int MAX_LLR_WORD_LENGTH = 12;

    public Design {
        Objects.requireNonNull(constellation, "constellation");
        Objects.requireNonNull(mapper, "mapper");
        Objects.requireNonNull(input, "input");
        Objects.requireNonNull(algorithm, "algorithm");
        Objects.requireNonNull(reference, "reference");
        Objects.requireNonNull(scaling, "scaling");
        Objects.requireNonNull(llr, "llr");
        Objects.requireNonNull(rounding, "rounding");
        if (!(llrScale > 0) || !Double.isFinite(llrScale)) {
            throw new IllegalArgumentException("LLR scale must be finite and > 0, got " + llrScale);
        }
        if (!Double.isNaN(backOffDb) && (backOffDb < -20 || backOffDb > 60)) {
            throw new IllegalArgumentException("back-off " + backOffDb + " dB is out of range; expected -20 to 60 dB");
        }
        if (llr.format().wordLength() > MAX_LLR_WORD_LENGTH) {
            throw new IllegalArgumentException("LLR format " + llr.format() + " has " + llr.format().wordLength()
                    + " bits; loss analysis takes at most " + MAX_LLR_WORD_LENGTH + " (a histogram over every code)");
        }
        if (algorithm == SoftAlgorithm.LOG_MAP) {
            throw new IllegalArgumentException("log-map has no fixed-point datapath; expected max-log, max-log-per-axis"
                    + " or folded-linear (log-map may be the float reference)");
        }
        if (scaling == LlrScaling.UNSCALED && (scaleConstant != null || scale != null)) {
            throw new IllegalArgumentException("an unscaled datapath has no scale constant or scale stage; use"
                    + " noise-scaled");
        }
    }

    /** The receiver gain g applied before the input quantizer. */
    public double gain() {
        if (Double.isNaN(backOffDb)) {
            return 1.0;
        }
        double peak = 0;
        for (int label = 0; label < constellation.size(); label++) {
            peak = Math.max(peak, Math.max(Math.abs(constellation.re(label)), Math.abs(constellation.im(label))));
        }
        return input.format().maxValue() * StrictMath.pow(10.0, -backOffDb / 20.0) / peak;
    }

    /** The transmit table: the constellation quantized by the mapper stage. */
    public ConstellationRom transmitRom() {
        return ConstellationRom.of(constellation, mapper);
    }

    /** The datapath's reference points: the constellation times the gain in the input format, rounded as constants. */
    public ConstellationRom receiveRom() {
        return new ConstellationRom(constellation, gain(), new Quantizer(input.format(), rounding, input.overflow()));
    }

    /** The input stage: what the received samples go through. */
    public Quantizer inputQuantizer() {
        return input;
    }

    /** The options of the fixed datapath for complex noise power {@code n0} at the channel (before the gain). */
    public LlrOptions fixedOptions(double n0) {
        double g = gain();
        return new LlrOptions(n0 * g * g / llrScale, LlrSign.ZERO_POSITIVE, false);
    }

    /**
     * The stage formats: the given stages, and for the others {@link FixedLlrSpec#suggested} sized for the largest
     * scale constant (the smallest N0 of the run) with this design's rounding; the output is the LLR stage.
     */
    public FixedLlrSpec llrSpec(ConstellationRom rx, double smallestN0) {
        FixedLlrSpec s = suggestedLlrSpec(rx, smallestN0);
        Quantizer m = metric != null ? metric : new Quantizer(s.metric().format(), rounding, s.metric().overflow());
        if (scaling == LlrScaling.UNSCALED) {
            return FixedLlrSpec.unscaled(rounding, m, llr);
        }
        return new FixedLlrSpec(rounding, m, LlrScaling.NOISE_SCALED,
                scaleConstant != null ? scaleConstant : s.scaleConstant(),
                scale != null ? scale : new Quantizer(s.scale().format(), rounding, s.scale().overflow()), llr);
    }

    /** The kernel's suggestion for this design: its range analysis (a metric stage that cannot overflow). */
    public FixedLlrSpec suggestedLlrSpec(ConstellationRom rx, double smallestN0) {
        return FixedLlrSpec.suggested(algorithm, rx, fixedOptions(smallestN0), llr.format());
    }

    /** The fixed datapath at channel noise power {@code n0}. */
    public FixedSoftDemapper fixedDemapper(ConstellationRom rx, FixedLlrSpec spec, double n0) {
        return FixedSoftDemapper.create(algorithm, rx, fixedOptions(n0), spec);
    }

    /** The float reference at channel noise power {@code n0}, on the ideal constellation. */
    public SoftDemapper floatDemapper(double n0) {
        return SoftDemapper.create(reference, constellation, new LlrOptions(n0, LlrSign.ZERO_POSITIVE, false));
    }

    /** The LLR in nats that one output code stands for. */
    public double llrPerCode(FixedSoftDemapper datapath) {
        QFormat out = datapath.spec().output().format();
        double perCode = out.lsb() / llrScale;
        return datapath.spec().isScaled() ? perCode : perCode * datapath.idealScaleConstant();
    }

    /** A one-line description for tables; internal stages appear only where given (else they are suggested). */
    public String describe() {
        return "in " + input.format() + (Double.isNaN(backOffDb) ? "" : " back-off " + Numbers.fixed(backOffDb, 2)
                + " dB") + ", " + algorithm + (metric == null ? "" : ", metric " + metric.format())
                + (scaleConstant == null ? "" : ", scale constant " + scaleConstant)
                + (scale == null ? "" : ", scale " + scale.format()) + ", LLR " + llr.format() + " scale "
                + Numbers.plain(llrScale) + ", " + rounding;
    }

    public Design withInput(Quantizer q) {
        return new Design(constellation, mapper, q, backOffDb, algorithm, reference, scaling, metric, scaleConstant,
                scale, llr, llrScale, rounding);
    }

    public Design withBackOffDb(double b) {
        return new Design(constellation, mapper, input, b, algorithm, reference, scaling, metric, scaleConstant,
                scale, llr, llrScale, rounding);
    }

    public Design withAlgorithm(SoftAlgorithm a) {
        return new Design(constellation, mapper, input, backOffDb, a, reference, scaling, metric, scaleConstant,
                scale, llr, llrScale, rounding);
    }

    public Design withMetric(Quantizer q) {
        return new Design(constellation, mapper, input, backOffDb, algorithm, reference, scaling, q, scaleConstant,
                scale, llr, llrScale, rounding);
    }

    public Design withScaleConstant(QFormat f) {
        return new Design(constellation, mapper, input, backOffDb, algorithm, reference, scaling, metric, f, scale,
                llr, llrScale, rounding);
    }

    public Design withScale(Quantizer q) {
        return new Design(constellation, mapper, input, backOffDb, algorithm, reference, scaling, metric,
                scaleConstant, q, llr, llrScale, rounding);
    }

    public Design withLlr(Quantizer q) {
        return new Design(constellation, mapper, input, backOffDb, algorithm, reference, scaling, metric,
                scaleConstant, scale, q, llrScale, rounding);
    }

    public Design withLlrScale(double s) {
        return new Design(constellation, mapper, input, backOffDb, algorithm, reference, scaling, metric,
                scaleConstant, scale, llr, s, rounding);
    }

    /** Every receive stage (input, given internal stages, output) and the constants rounded with {@code r}. */
    public Design withRounding(Rounding r) {
        return new Design(constellation, mapper, rounded(input, r), backOffDb, algorithm, reference, scaling,
                metric == null ? null : rounded(metric, r), scaleConstant, scale == null ? null : rounded(scale, r),
                rounded(llr, r), llrScale, r);
    }

    private static Quantizer rounded(Quantizer q, Rounding r) {
        return new Quantizer(q.format(), r, q.overflow());
    }
}
