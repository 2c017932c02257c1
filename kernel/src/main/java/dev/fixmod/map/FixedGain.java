package dev.fixmod.map;

import dev.fixmod.fixed.FixedPoint;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import java.util.Objects;

/**
 * Multiplies I/Q codes by a constant gain quantized once into a coefficient format: the normalization multiplier
 * behind a mapper (e.g. K_MOD = 1/√10 of 16-QAM on the ±1, ±3 grid) or ahead of a demapper (a known 1/√E_s). The
 * product of a W_in-bit code and the coefficient is exact; it is then brought into the output format by the output
 * quantizer's rounding and overflow, one event counted per code that did not fit.
 *
 * <table class="striped">
 *   <caption>Example: gain 1/√10 in a Q0.15 coefficient (half-even), input Q2.0 (grid codes −3 … 3), output Q15
 *   half-up saturate</caption>
 *   <thead><tr><th>input code</th><th>exact product (2^−15)</th><th>output code</th><th>value</th></tr></thead>
 *   <tbody>
 *     <tr><td>1</td><td>10362</td><td>10362</td><td>0.316223 (ideal 0.316228)</td></tr>
 *     <tr><td>3</td><td>31086</td><td>31086</td><td>0.948669 (ideal 0.948683)</td></tr>
 *     <tr><td>−3</td><td>−31086</td><td>−31086</td><td>−0.948669</td></tr>
 *     <tr><td>−4</td><td>−41448</td><td>−32768, 1 overflow event</td><td>−1</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>The residual error of the quantized constant against the ideal gain is {@link #gainErrorDb()}. The per-sample
 * methods are integer-only (checked by a bytecode test).
 */
public final class FixedGain {
    private final double gain;
    private final Quantizer coefficient;
    private final QFormat input;
    private final Quantizer output;
    private final long coefficientCode;
    private final int productFractionalBits;

    /**
     * @param gain        the ideal gain, finite and {@code > 0}
     * @param coefficient the format, rounding and overflow the constant is quantized with
     * @param input       the format of the codes the gain multiplies (signed, at most 32 bits)
     * @param output      the format of the results (signed, at most 32 bits) and how they get there
     * @throws IllegalArgumentException if the gain is not finite and positive, overflows the coefficient format or
     *                                  quantizes to 0, or a format is unsupported
     */
    public FixedGain(double gain, Quantizer coefficient, QFormat input, Quantizer output) {
        this.coefficient = Objects.requireNonNull(coefficient, "coefficient");
        this.input = Objects.requireNonNull(input, "input");
        this.output = Objects.requireNonNull(output, "output");
        if (!(gain > 0) || !Double.isFinite(gain)) {
            throw new IllegalArgumentException("gain must be finite and > 0, got " + gain);
        }
        requireSignedInt("input", input);
        requireSignedInt("output", output.format());
        QFormat cf = coefficient.format();
        if (input.wordLength() - 1 + cf.wordLength() - (cf.isSigned() ? 1 : 0) > 62) {
            throw new IllegalArgumentException("the product of " + input + " and " + cf + " needs more than 63 bits;"
                    + " use shorter words");
        }
        OverflowCounter counter = OverflowCounter.unnamed();
        long code = coefficient.quantize(gain, counter);
        if (counter.events() > 0) {
            throw new IllegalArgumentException("gain " + gain + " does not fit the coefficient format "
                    + cf.describe() + "; use more integer bits");
        }
        if (code == 0) {
            throw new IllegalArgumentException("gain " + gain + " quantizes to 0 in " + cf.describe()
                    + "; use more fractional bits");
        }
        this.gain = gain;
        this.coefficientCode = code;
        this.productFractionalBits = input.fractionalBits() + cf.fractionalBits();
    }

    private static void requireSignedInt(String role, QFormat format) {
        if (!format.isSigned() || format.wordLength() > 32) {
            throw new IllegalArgumentException("the " + role + " of a gain must be a signed format of at most 32 bits,"
                    + " got " + format.describe());
        }
    }

    /** The ideal gain. */
    public double idealGain() {
        return gain;
    }

    /** The gain the datapath applies: the coefficient code times its LSB. */
    public double quantizedGain() {
        return coefficient.format().toDouble(coefficientCode);
    }

    /** {@code 20·log10(quantized / ideal)} in dB: the residual gain error of the quantized constant. */
    public double gainErrorDb() {
        return 20 * StrictMath.log10(quantizedGain() / gain);
    }

    /** The coefficient's integer code, e.g. 10362 for 1/√10 in Q0.15. */
    public long coefficientCode() {
        return coefficientCode;
    }

    public Quantizer coefficient() {
        return coefficient;
    }

    public QFormat inputFormat() {
        return input;
    }

    public Quantizer output() {
        return output;
    }

    /**
     * The cost per symbol (I and Q): two multiplies (none for a power-of-two coefficient), two rounding increments
     * when bits are dropped by a rounding other than floor, two comparisons per code for a saturating output, and the
     * coefficient's bits.
     */
    public DatapathCost cost() {
        long magnitude = Math.abs(coefficientCode);
        boolean shiftOnly = Long.bitCount(magnitude) == 1;
        boolean rounds = productFractionalBits > output.format().fractionalBits() && output.rounding() != Rounding.FLOOR;
        boolean saturates = output.overflow() != Overflow.WRAP;
        return new DatapathCost(shiftOnly ? 0 : 2, rounds ? 2 : 0, saturates ? 4 : 0,
                coefficient.format().wordLength());
    }

    /**
     * The gained code of {@code code} (a code of the input format), counting an event on {@code counter} if it did
     * not fit the output format. Integer-only.
     */
    public int apply(int code, OverflowCounter counter) {
        return (int) FixedPoint.fit(code * coefficientCode, productFractionalBits, output.format(), output.rounding(),
                output.overflow(), counter);
    }

    /**
     * Applies the gain to {@code count} I/Q pairs from {@code offset} and writes them from {@code outOffset}; the
     * output may be the input arrays (in place).
     *
     * @throws IllegalArgumentException if a region does not fit its array or an input code lies outside the input
     *                                  format
     */
    public void apply(int[] i, int[] q, int offset, int count, int[] outI, int[] outQ, int outOffset,
                      OverflowCounter counter) {
        ArrayRegions.require("input I", i.length, offset, count);
        ArrayRegions.require("input Q", q.length, offset, count);
        ArrayRegions.require("output I", outI.length, outOffset, count);
        ArrayRegions.require("output Q", outQ.length, outOffset, count);
        Codes.requireCodes("input I", i, offset, count, input);
        Codes.requireCodes("input Q", q, offset, count, input);
        for (int n = 0; n < count; n++) {
            outI[outOffset + n] = apply(i[offset + n], counter);
            outQ[outOffset + n] = apply(q[offset + n], counter);
        }
    }
}
