package dev.fixmod.demap;

import dev.fixmod.bits.BitPacking;
import dev.fixmod.constellation.Constellation;
import dev.fixmod.map.ArrayRegions;

/**
 * A hard-decision slicer on floating-point samples: the reference of each {@link FixedSlicer} method
 * ({@link FloatAxisSlicer}, {@link FloatSectorSlicer}, {@link FloatNearestSlicer}), with the same decisions and the
 * same tie rule, documented with examples on {@link FixedSlicer}: a sample on a boundary is decided as if moved an
 * infinitesimal step toward +I (toward +Q on a boundary parallel to the I axis). Decisions are by minimum
 * distance, the maximum-likelihood decision for equiprobable symbols; symbol probabilities are not used.
 *
 * <p>Batch calls take the stream index of their first symbol (π/2-BPSK turns odd symbols by +90°), refuse NaN and
 * infinite samples before writing anything, and allocate nothing.
 */
public abstract sealed class FloatSlicer permits FloatAxisSlicer, FloatNearestSlicer, FloatSectorSlicer {
    private final Constellation constellation;
    private final int bitsPerSymbol;
    private final boolean alternates;

    FloatSlicer(Constellation constellation) {
        this.constellation = constellation;
        this.bitsPerSymbol = constellation.bitsPerSymbol();
        this.alternates = constellation.alternatesQuarterTurn();
    }

    /** The label decided for a finite sample of even ({@code odd == false}) or odd index. */
    abstract int decide(double re, double im, boolean odd);

    /** The constellation whose labels are decided. */
    public final Constellation constellation() {
        return constellation;
    }

    /**
     * The label decided for one sample.
     *
     * @param symbolIndex the sample's index in the stream (its parity matters for π/2-BPSK only)
     * @throws IllegalArgumentException if the sample is NaN or infinite or the index is negative
     */
    public final int slice(double re, double im, long symbolIndex) {
        if (!Double.isFinite(re) || !Double.isFinite(im)) {
            throw new IllegalArgumentException("sample (" + re + ", " + im + ") is not finite; a slicer decides"
                    + " finite samples only");
        }
        ArrayRegions.requireSymbolIndex(symbolIndex);
        return decide(re, im, alternates && (symbolIndex & 1) != 0);
    }

    /**
     * Writes the labels decided for {@code count} samples from {@code offset} to {@code labels} from
     * {@code labelOffset}.
     *
     * @throws IllegalArgumentException if a region does not fit its array or a sample is NaN or infinite
     */
    public final void sliceLabels(double[] re, double[] im, int offset, int count, long firstSymbol, int[] labels,
                                  int labelOffset) {
        requireInput(re, im, offset, count, firstSymbol);
        ArrayRegions.require("labels", labels.length, labelOffset, count);
        for (int n = 0; n < count; n++) {
            labels[labelOffset + n] = decide(re[offset + n], im[offset + n], alternates && ((firstSymbol + n) & 1) != 0);
        }
    }

    /**
     * Writes the k bits (b0 first, one byte 0 or 1 each) of the labels decided for {@code count} samples.
     *
     * @throws IllegalArgumentException if a region does not fit its array or a sample is NaN or infinite
     */
    public final void sliceBits(double[] re, double[] im, int offset, int count, long firstSymbol, byte[] bits,
                                int bitOffset) {
        requireInput(re, im, offset, count, firstSymbol);
        ArrayRegions.require("bits", bits.length, bitOffset, (long) count * bitsPerSymbol);
        for (int n = 0; n < count; n++) {
            int label = decide(re[offset + n], im[offset + n], alternates && ((firstSymbol + n) & 1) != 0);
            BitPacking.labelToBits(label, bits, bitOffset + n * bitsPerSymbol, bitsPerSymbol);
        }
    }

    private static void requireInput(double[] re, double[] im, int offset, int count, long firstSymbol) {
        ArrayRegions.require("input re", re.length, offset, count);
        ArrayRegions.require("input im", im.length, offset, count);
        ArrayRegions.requireSymbolIndex(firstSymbol);
        for (int n = offset; n < offset + count; n++) {
            if (!Double.isFinite(re[n]) || !Double.isFinite(im[n])) {
                throw new IllegalArgumentException("sample at index " + n + " is (" + re[n] + ", " + im[n]
                        + "); a slicer decides finite samples only");
            }
        }
    }
}
