package dev.fixmod.demap;

import dev.fixmod.fixed.FixedPoint;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import dev.fixmod.map.ArrayRegions;
import dev.fixmod.map.Codes;
import dev.fixmod.map.DatapathCost;
import java.util.Objects;

/**
 * Brings received I/Q codes to a target average energy (1 for a unit-energy demapper) block by block, in integer
 * arithmetic only, as an AGC ahead of a demapper does: estimate the block's power, take an integer reciprocal square
 * root, multiply.
 *
 * <p>Method, per block of N = 2^L samples:
 * <ol>
 *   <li>Power: {@code E = Σ (I² + Q²)} exactly in a 64-bit accumulator (codes of the input format Qm.n; the mean
 *       power is {@code E · 2^(−2n−L)}: dividing by N is a shift).</li>
 *   <li>Normalization: {@code E = m · 2^e} with a 16-bit mantissa {@code m ∈ [2^14, 2^16)} (dropping the LSBs of E, a
 *       truncation) and {@code e − L} even, so that the square root of the power splits into
 *       {@code √m · 2^((e−2n−L)/2)} exactly.</li>
 *   <li>Reciprocal square root of {@code u = m/2^14 ∈ [1, 4)}: a 48-entry table indexed by the top 6 bits of m holds
 *       {@code y0 = round(2^16/√u)} at each interval's centre; one Newton step
 *       {@code y1 = y0·(3 − u·y0²)/2} (shifts round half-up) squares the table's relative error (about 1.6 % at most
 *       before, 0.04 % after).</li>
 *   <li>Gain: {@code G = y1 · T}, with {@code T = round(√E_target · 2^15)} quantized once, and each code becomes
 *       {@code I·G} scaled by the power of two the exponents give, then rounded and fitted into the output format by
 *       the output quantizer, one overflow event per code that does not fit.</li>
 * </ol>
 * An all-zero block stays zero. The gain of a block against the ideal floating-point normalization
 * {@code √(E_target / P)} is {@link #gainErrorDb}; {@link #worstGainErrorDb()} bounds it over every possible power
 * (measured: 0.0030 dB for a target of 1, 0.0033 dB for 0.5; the Newton step always errs low).
 * The per-sample path is integer-only (checked by a bytecode test).
 */
public final class BlockNormalizer {
    private static final int MANTISSA_LOW_BIT = 14;
    private static final int INDEX_SHIFT = 10;
    private static final int INDEX_BASE = 1 << (MANTISSA_LOW_BIT - INDEX_SHIFT);
    private static final int RSQRT_BITS = 16;
    private static final int TARGET_BITS = 15;
    private static final long[] RSQRT_TABLE = rsqrtTable();

    private final QFormat input;
    private final int blockLength;
    private final int blockShift;
    private final double targetEnergy;
    private final long targetCode;
    private final Quantizer output;

    /**
     * @param input        the format of the received codes (signed); its word length W must satisfy
     *                     {@code 2W − 1 + L <= 63} so the power accumulator cannot overflow
     * @param blockLength  N, a power of two from 1 to 2^20
     * @param targetEnergy the average energy the output should have, e.g. 1; in {@code (0, 2^16]}
     * @param output       the output format (signed, at most 32 bits), rounding and overflow
     * @throws IllegalArgumentException naming the parameter that is out of range
     */
    public BlockNormalizer(QFormat input, int blockLength, double targetEnergy, Quantizer output) {
        this.input = Objects.requireNonNull(input, "input");
        this.output = Objects.requireNonNull(output, "output");
        if (blockLength < 1 || blockLength > 1 << 20 || Integer.bitCount(blockLength) != 1) {
            throw new IllegalArgumentException("block length must be a power of two from 1 to 2^20, got "
                    + blockLength);
        }
        int shift = Integer.numberOfTrailingZeros(blockLength);
        if (!input.isSigned() || 2 * input.wordLength() - 1 + shift > 63) {
            throw new IllegalArgumentException("the power of a block of " + blockLength + " samples of "
                    + input.describe() + " does not fit a 64-bit accumulator; the input must be signed with at most "
                    + (63 - shift + 1) / 2 + " bits");
        }
        if (!output.format().isSigned() || output.format().wordLength() > 32) {
            throw new IllegalArgumentException("the output of a normalizer must be a signed format of at most 32"
                    + " bits, got " + output.format().describe());
        }
        if (!(targetEnergy > 0) || targetEnergy > 65536) {
            throw new IllegalArgumentException("target energy must be in (0, 65536], got " + targetEnergy);
        }
        this.blockLength = blockLength;
        this.blockShift = shift;
        this.targetEnergy = targetEnergy;
        this.targetCode = (long) Rounding.HALF_EVEN.roundToIntegral(StrictMath.sqrt(targetEnergy) * (1 << TARGET_BITS));
    }

    private static long[] rsqrtTable() {
        int entries = (1 << (MANTISSA_LOW_BIT + 2 - INDEX_SHIFT)) - INDEX_BASE;
        long[] table = new long[entries];
        for (int index = 0; index < entries; index++) {
            double centre = (index + INDEX_BASE + 0.5) / INDEX_BASE;
            table[index] = (long) Rounding.HALF_EVEN.roundToIntegral((1 << RSQRT_BITS) / StrictMath.sqrt(centre));
        }
        return table;
    }

    public QFormat inputFormat() {
        return input;
    }

    public Quantizer output() {
        return output;
    }

    public int blockLength() {
        return blockLength;
    }

    public double targetEnergy() {
        return targetEnergy;
    }

    /**
     * Normalizes {@code count} I/Q pairs from {@code offset}, block by block, into {@code outI}/{@code outQ} from
     * {@code outOffset} (the output may be the input arrays).
     *
     * @throws IllegalArgumentException if a region does not fit its array, {@code count} is not a multiple of the
     *                                  block length, or a code lies outside the input format
     */
    public void normalize(int[] i, int[] q, int offset, int count, int[] outI, int[] outQ, int outOffset,
                          OverflowCounter counter) {
        ArrayRegions.require("input I", i.length, offset, count);
        ArrayRegions.require("input Q", q.length, offset, count);
        ArrayRegions.require("output I", outI.length, outOffset, count);
        ArrayRegions.require("output Q", outQ.length, outOffset, count);
        if (count % blockLength != 0) {
            throw new IllegalArgumentException("count " + count + " is not a multiple of the block length "
                    + blockLength);
        }
        Codes.requireCodes("input I", i, offset, count, input);
        Codes.requireCodes("input Q", q, offset, count, input);
        QFormat out = output.format();
        for (int start = 0; start < count; start += blockLength) {
            long energy = blockEnergy(i, q, offset + start);
            long gain = gain(energy);
            int fractionalBits = fractionalBits(energy);
            for (int n = start; n < start + blockLength; n++) {
                outI[outOffset + n] = (int) FixedPoint.fit(i[offset + n] * gain, fractionalBits, out,
                        output.rounding(), output.overflow(), counter);
                outQ[outOffset + n] = (int) FixedPoint.fit(q[offset + n] * gain, fractionalBits, out,
                        output.rounding(), output.overflow(), counter);
            }
        }
    }

    private long blockEnergy(int[] i, int[] q, int from) {
        long energy = 0;
        for (int n = from; n < from + blockLength; n++) {
            energy += (long) i[n] * i[n] + (long) q[n] * q[n];
        }
        return energy;
    }

    /** The exponent e of {@code energy = m · 2^e}, m in [2^14, 2^16), e − L even. */
    private int exponent(long energy) {
        int top = 63 - Long.numberOfLeadingZeros(energy);
        int e = top - MANTISSA_LOW_BIT;
        return ((e - blockShift) & 1) == 0 ? e : e - 1;
    }

    /** The gain mantissa G ≈ √E_target · 2^16 / √u of a block's energy (0 for an all-zero block). */
    private long gain(long energy) {
        if (energy == 0) {
            return 0;
        }
        int e = exponent(energy);
        return gainOfMantissa(e >= 0 ? energy >> e : energy << -e);
    }

    /** G = round(y1 · T / 2^15) for the mantissa m in [2^14, 2^16). */
    private long gainOfMantissa(long m) {
        long y0 = RSQRT_TABLE[(int) (m >> INDEX_SHIFT) - INDEX_BASE];
        long uy2 = roundedShift(m * y0 * y0, MANTISSA_LOW_BIT + RSQRT_BITS);
        long y1 = roundedShift(y0 * ((3L << RSQRT_BITS) - uy2), RSQRT_BITS + 1);
        return roundedShift(y1 * targetCode, TARGET_BITS);
    }

    /** The fractional bits of {@code code · G}: R + 7 + (e − L)/2 (the input's n cancels out). */
    private int fractionalBits(long energy) {
        return energy == 0 ? 0 : RSQRT_BITS + MANTISSA_LOW_BIT / 2 + (exponent(energy) - blockShift) / 2;
    }

    private static long roundedShift(long value, int shift) {
        return (value + (1L << (shift - 1))) >> shift;
    }

    /**
     * {@code 20·log10(g / g_ideal)} in dB for the block of samples from {@code offset}: g is the gain the datapath
     * applies, {@code g_ideal = √(E_target / P)} with P the block's exact mean power.
     *
     * @throws IllegalArgumentException if the region does not hold a block, a code lies outside the input format, or
     *                                  the block is all zero (it has no gain)
     */
    public double gainErrorDb(int[] i, int[] q, int offset) {
        ArrayRegions.require("input I", i.length, offset, blockLength);
        ArrayRegions.require("input Q", q.length, offset, blockLength);
        Codes.requireCodes("input I", i, offset, blockLength, input);
        Codes.requireCodes("input Q", q, offset, blockLength, input);
        long energy = blockEnergy(i, q, offset);
        if (energy == 0) {
            throw new IllegalArgumentException("an all-zero block has no gain to compare");
        }
        double applied = Math.scalb((double) gain(energy), input.fractionalBits() - fractionalBits(energy));
        double power = Math.scalb((double) energy, -2 * input.fractionalBits() - blockShift);
        return 20 * StrictMath.log10(applied / StrictMath.sqrt(targetEnergy / power));
    }

    /**
     * The largest |gain error| in dB over every block power: the table, the Newton step, the target constant and the
     * truncation of the power to its 16-bit mantissa together (computed exhaustively over the mantissas, each taken
     * at both ends of the powers it stands for).
     */
    public double worstGainErrorDb() {
        double worst = 0;
        double sqrtTarget = StrictMath.sqrt(targetEnergy);
        for (long m = 1L << MANTISSA_LOW_BIT; m < 1L << (MANTISSA_LOW_BIT + 2); m++) {
            double applied = Math.scalb((double) gainOfMantissa(m), -RSQRT_BITS);
            for (long end = m; end <= m + 1; end++) {
                double ideal = sqrtTarget / StrictMath.sqrt(Math.scalb((double) end, -MANTISSA_LOW_BIT));
                worst = Math.max(worst, Math.abs(20 * StrictMath.log10(applied / ideal)));
            }
        }
        return worst;
    }

    /**
     * Per symbol: two squares and two accumulations, two multiplications by the gain with their rounding and
     * saturation; once per block (amortized, rounded up): the reciprocal square root (three multiplications, a
     * subtraction, two roundings) and the target multiplication. Tables: the 48-entry reciprocal square root table and
     * the target constant.
     */
    public DatapathCost cost() {
        long perBlockMultiplies = 4;
        long perBlockAdds = 4;
        boolean rounds = output.rounding() != Rounding.FLOOR;
        boolean saturates = output.overflow() != Overflow.WRAP;
        long tableBits = (long) RSQRT_TABLE.length * (RSQRT_BITS + 1) + (TARGET_BITS + 9);
        return new DatapathCost(4 + ceilDiv(perBlockMultiplies, blockLength),
                2 + (rounds ? 2 : 0) + ceilDiv(perBlockAdds, blockLength), saturates ? 4 : 0, tableBits);
    }

    private static long ceilDiv(long a, long b) {
        return (a + b - 1) / b;
    }
}
