package dev.fixmod.map;

import dev.fixmod.bits.BitPacking;
import dev.fixmod.constellation.Constellation;
import java.util.Objects;

/**
 * Maps labels or bits to complex symbols in floating point: the reference the fixed-point mapper is measured
 * against. The points are the constellation's as given; normalize it first ({@link Constellation#normalized}).
 * For π/2-BPSK the symbols of odd index are turned by +90°: {@code (re, im) → (−im, re)}.
 *
 * <p>Batch calls take the index of their first symbol in the stream ({@code firstSymbol}), which decides the
 * rotation parity, so a long stream can be mapped in chunks with the same result. They check all their input before
 * writing anything and allocate nothing.
 */
public final class FloatMapper {
    private final Constellation constellation;
    private final double[] re;
    private final double[] im;
    private final int bitsPerSymbol;
    private final boolean alternates;

    public FloatMapper(Constellation constellation) {
        this.constellation = Objects.requireNonNull(constellation, "constellation");
        this.re = constellation.realParts();
        this.im = constellation.imaginaryParts();
        this.bitsPerSymbol = constellation.bitsPerSymbol();
        this.alternates = constellation.alternatesQuarterTurn();
    }

    public Constellation constellation() {
        return constellation;
    }

    /**
     * Writes the symbols of {@code labels[labelOffset .. labelOffset+count)} to {@code outRe}/{@code outIm} from
     * {@code outOffset}.
     *
     * @param firstSymbol the stream index of the first symbol (its parity selects π/2-BPSK's rotation)
     * @throws IllegalArgumentException if a region does not fit its array or a label is outside {@code 0..M−1}
     */
    public void mapLabels(int[] labels, int labelOffset, int count, long firstSymbol, double[] outRe, double[] outIm,
                          int outOffset) {
        ArrayRegions.require("labels", labels.length, labelOffset, count);
        ArrayRegions.require("output re", outRe.length, outOffset, count);
        ArrayRegions.require("output im", outIm.length, outOffset, count);
        ArrayRegions.requireSymbolIndex(firstSymbol);
        BitPacking.requireLabels(labels, labelOffset, count, re.length);
        for (int n = 0; n < count; n++) {
            int label = labels[labelOffset + n];
            put(label, alternates && ((firstSymbol + n) & 1) != 0, outRe, outIm, outOffset + n);
        }
    }

    /**
     * Maps {@code count} symbols of k unpacked bits each (values 0 or 1, b0 first: the most significant bit of the
     * label) from {@code bits[bitOffset]} on.
     *
     * @throws IllegalArgumentException if a region does not fit its array or a bit is neither 0 nor 1
     */
    public void mapBits(byte[] bits, int bitOffset, int count, long firstSymbol, double[] outRe, double[] outIm,
                        int outOffset) {
        ArrayRegions.require("bits", bits.length, bitOffset, (long) count * bitsPerSymbol);
        ArrayRegions.require("output re", outRe.length, outOffset, count);
        ArrayRegions.require("output im", outIm.length, outOffset, count);
        ArrayRegions.requireSymbolIndex(firstSymbol);
        BitPacking.requireBits(bits, bitOffset, count * bitsPerSymbol);
        for (int n = 0; n < count; n++) {
            int label = BitPacking.bitsToLabel(bits, bitOffset + n * bitsPerSymbol, bitsPerSymbol);
            put(label, alternates && ((firstSymbol + n) & 1) != 0, outRe, outIm, outOffset + n);
        }
    }

    private void put(int label, boolean turned, double[] outRe, double[] outIm, int at) {
        if (turned) {
            outRe[at] = -im[label] + 0.0; // a point on the I axis turns onto the Q axis: +0.0, never −0.0
            outIm[at] = re[label];
        } else {
            outRe[at] = re[label];
            outIm[at] = im[label];
        }
    }
}
