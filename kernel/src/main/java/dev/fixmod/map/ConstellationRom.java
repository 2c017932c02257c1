package dev.fixmod.map;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Normalization;
import dev.fixmod.fixed.FixedPoint;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import java.util.Arrays;
import java.util.HashMap;
import java.util.Map;
import java.util.Objects;

/**
 * A constellation quantized once into fixed-point I/Q codes, stored by label: the table a hardware mapper reads, and
 * the reference points of the fixed-point slicers. Each coordinate is {@code scale · re(label)} (resp. {@code im})
 * quantized by one {@link Quantizer}: its format, rounding and overflow mode. The overflow events of that
 * construction are counted and kept ({@link #overflowCount()}).
 *
 * <p>A format too narrow for the constellation is refused rather than silently distorting it:
 *
 * <table class="striped">
 *   <caption>What the construction accepts (rounding half-even, overflow saturate)</caption>
 *   <thead><tr><th>constellation</th><th>format</th><th>result</th></tr></thead>
 *   <tbody>
 *     <tr><td>BPSK ±1</td><td>Q15</td><td>−32768, 32767; one overflow event (+1 is one LSB above the top code)</td></tr>
 *     <tr><td>16-QAM, unit energy (levels ±0.316, ±0.949)</td><td>Q15</td><td>±10362, ±31086; no event</td></tr>
 *     <tr><td>16-QAM on the grid ±1, ±3</td><td>Q1.14</td><td>refused: ±3 saturates to ±2, more than one LSB away</td></tr>
 *     <tr><td>64-QAM, unit energy</td><td>Q1.1</td><td>refused: levels 0.772 and 1.080 both round to code 2</td></tr>
 *     <tr><td>BPSK ±1</td><td>Q15 with wrap</td><td>refused: +1 wraps to −32768</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>The rule: every code must lie within one LSB of its ideal value (rounding alone is never further; only an
 * overflow is), and no two labels may share a code pair. A point just one LSB past the top code, as +1.0 in Q15, is
 * saturated and counted: the usual idiom. The format must be signed, of at most 32 bits.
 *
 * <p>For π/2-BPSK ({@link Constellation#alternatesQuarterTurn()}) the symbols of odd index are the even-index codes
 * turned by +90°, integer-exact: {@code (I, Q) → (−Q, I)}. The negation is fitted by the same overflow mode (the
 * most negative code has no exact negative) and obeys the same one-LSB rule; {@link #oddICode}/{@link #oddQCode}
 * hold the result. A hardware mapper computes it with one negation; the table stores only the even-index codes.
 *
 * <p>Instances are immutable values: equal quantizers, codes and alternation make equal ROMs.
 */
public final class ConstellationRom {
    private final Constellation constellation;
    private final double scale;
    private final Quantizer quantizer;
    private final int[] iCodes;
    private final int[] qCodes;
    private final int[] oddICodes;
    private final int[] oddQCodes;
    private final long overflowCount;
    private final double maxErrorLsb;

    /**
     * Quantizes {@code scale ·} each point of {@code constellation} by {@code quantizer}.
     *
     * @param scale the factor applied before quantization, finite and {@code > 0}, e.g. a normalization constant
     * @throws IllegalArgumentException if the scale is not finite and positive, or the format is unsigned, wider than
     *                                  32 bits or too narrow (see the class description)
     */
    public ConstellationRom(Constellation constellation, double scale, Quantizer quantizer) {
        this.constellation = Objects.requireNonNull(constellation, "constellation");
        this.quantizer = Objects.requireNonNull(quantizer, "quantizer");
        if (!(scale > 0) || !Double.isFinite(scale)) {
            throw new IllegalArgumentException("ROM scale must be finite and > 0, got " + scale);
        }
        QFormat format = quantizer.format();
        if (!format.isSigned() || format.wordLength() > 32) {
            throw new IllegalArgumentException("a constellation ROM needs a signed format of at most 32 bits, got "
                    + format.describe());
        }
        this.scale = scale;
        int m = constellation.size();
        iCodes = new int[m];
        qCodes = new int[m];
        OverflowCounter counter = new OverflowCounter("rom");
        double worst = 0;
        for (int label = 0; label < m; label++) {
            double re = scale * constellation.re(label);
            double im = scale * constellation.im(label);
            iCodes[label] = code(re, counter, label, "I");
            qCodes[label] = code(im, counter, label, "Q");
            worst = Math.max(worst, Math.max(errorLsb(iCodes[label], re), errorLsb(qCodes[label], im)));
        }
        requireDistinct(iCodes, qCodes, "");
        if (constellation.alternatesQuarterTurn()) {
            oddICodes = new int[m];
            oddQCodes = iCodes.clone();
            for (int label = 0; label < m; label++) {
                oddICodes[label] = (int) quantizer.overflow().apply(-(long) qCodes[label], format, counter);
                double ideal = -scale * constellation.im(label);
                double error = errorLsb(oddICodes[label], ideal);
                if (error > 1.0) {
                    throw tooNarrow(label, "I of the +90° turned point", ideal, oddICodes[label]);
                }
                worst = Math.max(worst, error);
            }
            requireDistinct(oddICodes, oddQCodes, " (odd symbols)");
        } else {
            oddICodes = iCodes;
            oddQCodes = qCodes;
        }
        this.overflowCount = counter.events();
        this.maxErrorLsb = worst;
    }

    /** The ROM of {@code constellation} as given (scale 1). */
    public static ConstellationRom of(Constellation constellation, Quantizer quantizer) {
        return new ConstellationRom(constellation, 1.0, quantizer);
    }

    /** The ROM of {@code constellation} scaled by its {@link Constellation#normalizationFactor} for {@code mode}. */
    public static ConstellationRom normalized(Constellation constellation, Normalization mode, Quantizer quantizer) {
        return new ConstellationRom(constellation, constellation.normalizationFactor(mode), quantizer);
    }

    private int code(double x, OverflowCounter counter, int label, String axis) {
        long code = FixedPoint.quantize(x, quantizer.format(), quantizer.rounding(), quantizer.overflow(), counter);
        if (errorLsb(code, x) > 1.0) {
            throw tooNarrow(label, axis, x, code);
        }
        return (int) code;
    }

    private double errorLsb(long code, double x) {
        return Math.abs(code - Math.scalb(x, quantizer.format().fractionalBits()));
    }

    private IllegalArgumentException tooNarrow(int label, String axis, double x, long code) {
        QFormat f = quantizer.format();
        return new IllegalArgumentException(constellation.name() + " does not fit " + quantizer + ": " + axis
                + " of label " + label + " is " + x + " but becomes code " + code + " (" + f.toDouble(code)
                + "), more than one LSB away; the range of " + f.describe()
                + " is too narrow: use more integer bits, a smaller scale or saturation instead of wrap");
    }

    private void requireDistinct(int[] i, int[] q, String which) {
        Map<Long, Integer> seen = new HashMap<>();
        for (int label = 0; label < i.length; label++) {
            Integer other = seen.put(((long) i[label] << 32) | (q[label] & 0xFFFF_FFFFL), label);
            if (other != null) {
                throw new IllegalArgumentException(constellation.name() + " does not fit " + quantizer + which
                        + ": labels " + other + " and " + label + " both become codes (" + i[label] + ", " + q[label]
                        + "); " + quantizer.format().describe() + " is too coarse (the points, and any slicer"
                        + " thresholds between them, would collide): use more fractional bits");
            }
        }
    }

    /** The constellation as given, before scaling. */
    public Constellation constellation() {
        return constellation;
    }

    /** The factor applied before quantization. */
    public double scale() {
        return scale;
    }

    public Quantizer quantizer() {
        return quantizer;
    }

    /** The format of every code. */
    public QFormat format() {
        return quantizer.format();
    }

    /** M. */
    public int size() {
        return iCodes.length;
    }

    /** k = log2 M. */
    public int bitsPerSymbol() {
        return constellation.bitsPerSymbol();
    }

    /** The I code of {@code label} (of an even-index symbol for π/2-BPSK). */
    public int iCode(int label) {
        return iCodes[label];
    }

    /** The Q code of {@code label} (of an even-index symbol for π/2-BPSK). */
    public int qCode(int label) {
        return qCodes[label];
    }

    /** The I codes by label (a copy). */
    public int[] iCodes() {
        return iCodes.clone();
    }

    /** The Q codes by label (a copy). */
    public int[] qCodes() {
        return qCodes.clone();
    }

    /** The I code of {@code label} for a symbol of odd index: {@code −qCode} for π/2-BPSK, else {@link #iCode}. */
    public int oddICode(int label) {
        return oddICodes[label];
    }

    /** The Q code of {@code label} for a symbol of odd index: {@code iCode} for π/2-BPSK, else {@link #qCode}. */
    public int oddQCode(int label) {
        return oddQCodes[label];
    }

    /** Whether odd-index symbols are turned by +90° (π/2-BPSK). */
    public boolean alternatesQuarterTurn() {
        return constellation.alternatesQuarterTurn();
    }

    /** The overflow events of the construction (saturated or negated codes), 0 for a ROM that fits. */
    public long overflowCount() {
        return overflowCount;
    }

    /** The largest distance of a code from its ideal value, in LSBs (at most 1 by construction). */
    public double maxErrorLsb() {
        return maxErrorLsb;
    }

    /**
     * The average energy of the codes against the ideal (scaled) average energy, {@code 10·log10(E_codes/E_ideal)} in
     * dB, weighted by the symbol probabilities: the residual gain error of normalizing through the ROM.
     */
    public double gainErrorDb() {
        QFormat f = quantizer.format();
        double codes = 0;
        for (int label = 0; label < iCodes.length; label++) {
            double i = f.toDouble(iCodes[label]);
            double q = f.toDouble(qCodes[label]);
            codes += constellation.probability(label) * (i * i + q * q);
        }
        return 10 * StrictMath.log10(codes / (scale * scale * constellation.averageEnergy()));
    }

    /** The ROM size in bits: M entries of an I and a Q code. */
    public long tableBits() {
        return 2L * iCodes.length * quantizer.format().wordLength();
    }

    /** The cost of mapping one symbol through this ROM: a lookup, plus the negation of π/2-BPSK's odd symbols. */
    public DatapathCost mappingCost() {
        return new DatapathCost(0, alternatesQuarterTurn() ? 1 : 0, 0, tableBits());
    }

    int[] iTable(boolean odd) {
        return odd ? oddICodes : iCodes;
    }

    int[] qTable(boolean odd) {
        return odd ? oddQCodes : qCodes;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof ConstellationRom r && r.quantizer.equals(quantizer) && Arrays.equals(r.iCodes, iCodes)
                && Arrays.equals(r.qCodes, qCodes) && r.alternatesQuarterTurn() == alternatesQuarterTurn();
    }

    @Override
    public int hashCode() {
        return Objects.hash(quantizer, Arrays.hashCode(iCodes), Arrays.hashCode(qCodes), alternatesQuarterTurn());
    }

    /** E.g. {@code qam16 ROM, Q15 half-even saturate, scale 0.316..., 0 overflow events}. */
    @Override
    public String toString() {
        return constellation.name() + " ROM, " + quantizer + ", scale " + scale + ", " + overflowCount
                + " overflow events";
    }
}
