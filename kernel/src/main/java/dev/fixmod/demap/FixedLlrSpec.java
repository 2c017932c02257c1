package dev.fixmod.demap;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import dev.fixmod.map.ConstellationRom;
import java.util.Objects;

/**
 * The number formats of a fixed-point LLR datapath, stage by stage. Every width is explicit; every stage that can
 * overflow has its own {@link Quantizer} and its own overflow counter. The input format is the one of the
 * {@link ConstellationRom} the datapath is built on: the received codes and the reference points share it.
 *
 * <table class="striped">
 *   <caption>Stages, in order</caption>
 *   <thead><tr><th>stage</th><th>field</th><th>holds</th><th>counter</th></tr></thead>
 *   <tbody>
 *     <tr><td>input</td><td>the ROM's format</td><td>the I and Q codes and the ROM's points (at most 30 bits, so
 *         every squared distance is exact in 64 bits)</td><td>— (codes outside are rejected)</td></tr>
 *     <tr><td>metric</td><td>{@code metric}</td><td>max-log: {@code D = d1 − d0} (exact in 64 bits with twice the
 *         input's fractional bits, then fitted); folded-linear: each fold {@code fj}</td><td>{@code llr-metric}</td></tr>
 *     <tr><td>scale constant</td><td>{@code scaleConstant}</td><td>K (1/N0 or 4A/N0), quantized once with
 *         {@code constantRounding} (so are the fold constants)</td><td>— (a K that does not fit is rejected)</td></tr>
 *     <tr><td>scale</td><td>{@code scale}</td><td>the exact product metric × K, fitted</td><td>{@code llr-scale}</td></tr>
 *     <tr><td>output</td><td>{@code output}</td><td>the LLR word, typically 4–8 bits, symmetric saturation</td>
 *         <td>{@code llr-output}</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>With {@link LlrScaling#UNSCALED} the scale constant and scale stage are absent ({@code null}) and the metric goes
 * straight to the output stage.
 *
 * @param constantRounding how the fold constants and K are quantized at construction
 * @param metric           the metric stage
 * @param scaling          whether K is applied
 * @param scaleConstant    format of K; {@code null} when unscaled
 * @param scale            the product stage; {@code null} when unscaled
 * @param output           the output stage
 */
public record FixedLlrSpec(Rounding constantRounding, Quantizer metric, LlrScaling scaling, QFormat scaleConstant,
                           Quantizer scale, Quantizer output) {

    /** Magnitude bits the product metric × K may need at most, so that it is exact in a long. */
    private static final int MAX_PRODUCT_MAGNITUDE_BITS = 61;

    public FixedLlrSpec {
        Objects.requireNonNull(constantRounding, "constant rounding");
        Objects.requireNonNull(metric, "metric stage");
        Objects.requireNonNull(scaling, "scaling");
        Objects.requireNonNull(output, "output stage");
        if (!metric.format().isSigned() || !output.format().isSigned()) {
            throw new IllegalArgumentException("metric and output formats must be signed (LLRs take both signs), got "
                    + metric.format() + " and " + output.format());
        }
        if (scaling == LlrScaling.NOISE_SCALED) {
            if (scaleConstant == null || scale == null) {
                throw new IllegalArgumentException("a noise-scaled datapath needs a scale constant format and a scale"
                        + " stage; use unscaled to leave them out");
            }
            if (!scale.format().isSigned()) {
                throw new IllegalArgumentException("scale stage format " + scale.format() + " must be signed");
            }
            int magnitude = magnitudeBits(metric.format()) + magnitudeBits(scaleConstant);
            if (magnitude > MAX_PRODUCT_MAGNITUDE_BITS) {
                throw new IllegalArgumentException("metric " + metric.format() + " times scale constant "
                        + scaleConstant + " needs " + magnitude + " magnitude bits; at most "
                        + MAX_PRODUCT_MAGNITUDE_BITS + " are supported");
            }
        } else if (scaleConstant != null || scale != null) {
            throw new IllegalArgumentException("an unscaled datapath has no scale constant or scale stage; give"
                    + " null for both or use noise-scaled");
        }
    }

    private static int magnitudeBits(QFormat f) {
        return f.isSigned() ? f.wordLength() - 1 : f.wordLength();
    }

    /** An unscaled datapath: the metric goes straight to the output. */
    public static FixedLlrSpec unscaled(Rounding constantRounding, Quantizer metric, Quantizer output) {
        return new FixedLlrSpec(constantRounding, metric, LlrScaling.UNSCALED, null, null, output);
    }

    /** Whether the metric is multiplied by K. */
    public boolean isScaled() {
        return scaling == LlrScaling.NOISE_SCALED;
    }

    /** This specification with another output stage. */
    public FixedLlrSpec withOutput(Quantizer newOutput) {
        return new FixedLlrSpec(constantRounding, metric, scaling, scaleConstant, scale, newOutput);
    }

    /**
     * A starting point for {@code algorithm} on {@code reference}: a metric stage wide enough never to overflow
     * for any input code (and exact where 32 bits allow), a 16-bit unsigned scale constant with as many fractional
     * bits as K leaves, a scale stage with 2 integer and 4 fractional guard bits over the output, {@code half-even}
     * rounding throughout (symmetric, so LLR odd symmetry survives), saturation inside and symmetric saturation at
     * the output.
     *
     * @throws IllegalArgumentException if the algorithm has no fixed-point datapath or does not apply
     */
    public static FixedLlrSpec suggested(SoftAlgorithm algorithm, ConstellationRom reference, LlrOptions options,
                                         QFormat output) {
        Rounding rounding = Rounding.HALF_EVEN;
        Constellation constellation = FixedLevels.effective(reference);
        Checks.requireAxisFreeForQuarterTurn(algorithm, constellation);
        QFormat input = reference.format();
        FixedLevels.Bounds bounds = FixedLevels.bounds(algorithm, constellation, input);
        int valueFrac = algorithm == SoftAlgorithm.FOLDED_LINEAR ? input.fractionalBits() : 2 * input.fractionalBits();
        // Integer bits that hold the bound, then as many of the exact fractional bits as 32 bits leave.
        int integerBits = Math.max(0, 64 - Long.numberOfLeadingZeros((long) Math.ceil(bounds.metric())));
        int frac = Math.min(valueFrac, QFormat.MAX_WORD_LENGTH - 1 - integerBits);
        if (frac < 0) {
            throw new IllegalArgumentException("the metric of " + constellation.name() + " from input " + input
                    + " needs " + integerBits + " integer bits, more than a 32-bit word holds; narrow the input");
        }
        Quantizer metric = new Quantizer(QFormat.signed(integerBits, frac), rounding, Overflow.SATURATE);
        double k = FixedLevels.scaleValue(algorithm, constellation, options);
        int kInteger = Math.max(0, 64 - Long.numberOfLeadingZeros((long) Math.floor(k)));
        QFormat kFormat = QFormat.unsigned(kInteger, Math.max(0, 16 - kInteger));
        if (rounding.roundToIntegral(Math.scalb(k, kFormat.fractionalBits())) > kFormat.maxCode()) {
            // K just below a power of two (e.g. 0.9999999999999998) rounds up past the format: one more integer bit.
            kFormat = QFormat.unsigned(kInteger + 1, Math.max(0, 15 - kInteger));
        }
        int scaleInteger = Math.min(output.integerBits() + 2, QFormat.MAX_WORD_LENGTH - 1);
        int scaleFrac = Math.min(output.fractionalBits() + 4, QFormat.MAX_WORD_LENGTH - 1 - scaleInteger);
        Quantizer scale = new Quantizer(QFormat.signed(scaleInteger, scaleFrac), rounding, Overflow.SATURATE);
        return new FixedLlrSpec(rounding, metric, LlrScaling.NOISE_SCALED, kFormat, scale,
                new Quantizer(output, rounding, Overflow.SYMMETRIC_SATURATE));
    }

    @Override
    public String toString() {
        return "constants " + constantRounding + ", metric " + metric
                + (isScaled() ? ", scale constant " + scaleConstant + ", scale " + scale : ", unscaled")
                + ", output " + output;
    }
}
