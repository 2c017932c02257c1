package dev.fixmod.bits;

import java.util.Objects;

/**
 * Conversions between unpacked bit arrays (one bit, 0 or 1, per byte, first in time first), packed bytes and
 * symbol labels. Packing is MSB first: the first bit in time is the most significant bit of the first byte, and a
 * last, partial byte is padded with zeros in its low bits. A label of k bits carries b0 … b(k−1) with b0, the first
 * in time, as its most significant bit (the label bit order of DESIGN.md).
 *
 * <table class="striped">
 *   <caption>Examples</caption>
 *   <thead><tr><th>bits (first in time first)</th><th>packed</th><th>labels, k = 3</th></tr></thead>
 *   <tbody>
 *     <tr><td>1 0 1 1 0 0 0 0</td><td>0xB0</td><td>5, 4, (2 bits left)</td></tr>
 *     <tr><td>1 0 1 0 1 1</td><td>0xAC</td><td>5, 3</td></tr>
 *     <tr><td>1</td><td>0x80</td><td>—</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>All methods take arrays with offsets and counts, allocate nothing, and read their arguments in the order of
 * {@link System#arraycopy}: source, source offset, destination, destination offset, count.
 *
 * <p>The block methods check their input as they go. The per-sample loops of mappers and slicers check a whole
 * region first ({@link #requireBits}, {@link #requireLabels}) and then convert one label at a time with the
 * unchecked, integer-only {@link #bitsToLabel} and {@link #labelToBits}.
 */
public final class BitPacking {

    /** The largest label width: labels are non-negative {@code int}s. */
    public static final int MAX_BITS_PER_LABEL = 31;

    private BitPacking() {
    }

    /**
     * The number of bytes that {@code bitCount} packed bits occupy.
     *
     * @throws IllegalArgumentException if {@code bitCount} is negative
     */
    public static int packedLength(int bitCount) {
        if (bitCount < 0) {
            throw new IllegalArgumentException("bit count must be >= 0, got " + bitCount);
        }
        return (int) ((bitCount + 7L) >>> 3);
    }

    /**
     * Packs {@code bitCount} bits from {@code bits[bitOffset ..]} into {@link #packedLength(int)} bytes from
     * {@code packed[packedOffset]}, MSB first.
     *
     * @throws IllegalArgumentException naming the index of the first element that is not 0 or 1
     * @throws IndexOutOfBoundsException if a range does not lie within its array
     */
    public static void pack(byte[] bits, int bitOffset, byte[] packed, int packedOffset, int bitCount) {
        int bytes = packedLength(bitCount);
        Objects.checkFromIndexSize(bitOffset, bitCount, bits.length);
        Objects.checkFromIndexSize(packedOffset, bytes, packed.length);
        int b = bitOffset;
        int p = packedOffset;
        for (int full = bitCount >>> 3; full > 0; full--, b += 8) {
            int v = bits[b] << 7 | bits[b + 1] << 6 | bits[b + 2] << 5 | bits[b + 3] << 4
                    | bits[b + 4] << 3 | bits[b + 5] << 2 | bits[b + 6] << 1 | bits[b + 7];
            int any = bits[b] | bits[b + 1] | bits[b + 2] | bits[b + 3]
                    | bits[b + 4] | bits[b + 5] | bits[b + 6] | bits[b + 7];
            if ((any & ~1) != 0) {
                throw notABit(bits, b, 8);
            }
            packed[p++] = (byte) v;
        }
        int rest = bitCount & 7;
        if (rest != 0) {
            int v = 0;
            for (int j = 0; j < rest; j++) {
                int bit = bits[b + j];
                if ((bit & ~1) != 0) {
                    throw notABit(bits, b, rest);
                }
                v |= bit << (7 - j);
            }
            packed[p] = (byte) v;
        }
    }

    /**
     * Unpacks {@code bitCount} bits, MSB first, from {@code packed[packedOffset ..]} into
     * {@code bits[bitOffset ..]}; padding bits of a last partial byte are ignored.
     *
     * @throws IndexOutOfBoundsException if a range does not lie within its array
     */
    public static void unpack(byte[] packed, int packedOffset, byte[] bits, int bitOffset, int bitCount) {
        int bytes = packedLength(bitCount);
        Objects.checkFromIndexSize(packedOffset, bytes, packed.length);
        Objects.checkFromIndexSize(bitOffset, bitCount, bits.length);
        int b = bitOffset;
        int p = packedOffset;
        for (int full = bitCount >>> 3; full > 0; full--) {
            int v = packed[p++];
            bits[b++] = (byte) (v >>> 7 & 1);
            bits[b++] = (byte) (v >>> 6 & 1);
            bits[b++] = (byte) (v >>> 5 & 1);
            bits[b++] = (byte) (v >>> 4 & 1);
            bits[b++] = (byte) (v >>> 3 & 1);
            bits[b++] = (byte) (v >>> 2 & 1);
            bits[b++] = (byte) (v >>> 1 & 1);
            bits[b++] = (byte) (v & 1);
        }
        int rest = bitCount & 7;
        if (rest != 0) {
            int v = packed[p];
            for (int j = 0; j < rest; j++) {
                bits[b++] = (byte) (v >>> (7 - j) & 1);
            }
        }
    }

    /**
     * Groups {@code labelCount · bitsPerLabel} bits from {@code bits[bitOffset ..]} into labels: label j is made of
     * bits {@code j·k … j·k + k − 1}, the first of them its most significant bit.
     *
     * @throws IllegalArgumentException if {@code bitsPerLabel} is outside 1..31, or naming the index of the first
     *                                  element that is not 0 or 1
     * @throws IndexOutOfBoundsException if a range does not lie within its array
     */
    public static void bitsToLabels(byte[] bits, int bitOffset, int[] labels, int labelOffset, int labelCount,
                                    int bitsPerLabel) {
        int bitCount = bitCount(labelCount, bitsPerLabel);
        Objects.checkFromIndexSize(bitOffset, bitCount, bits.length);
        Objects.checkFromIndexSize(labelOffset, labelCount, labels.length);
        int b = bitOffset;
        for (int j = 0; j < labelCount; j++) {
            int label = 0;
            int any = 0;
            for (int i = 0; i < bitsPerLabel; i++) {
                int bit = bits[b + i];
                any |= bit;
                label = label << 1 | bit;
            }
            if ((any & ~1) != 0) {
                throw notABit(bits, b, bitsPerLabel);
            }
            labels[labelOffset + j] = label;
            b += bitsPerLabel;
        }
    }

    /**
     * Spreads {@code labelCount} labels from {@code labels[labelOffset ..]} into {@code labelCount · bitsPerLabel}
     * bits from {@code bits[bitOffset]}, most significant bit of each label first.
     *
     * @throws IllegalArgumentException if {@code bitsPerLabel} is outside 1..31, or naming the first label that
     *                                  does not fit {@code bitsPerLabel} bits
     * @throws IndexOutOfBoundsException if a range does not lie within its array
     */
    public static void labelsToBits(int[] labels, int labelOffset, byte[] bits, int bitOffset, int labelCount,
                                    int bitsPerLabel) {
        int bitCount = bitCount(labelCount, bitsPerLabel);
        Objects.checkFromIndexSize(labelOffset, labelCount, labels.length);
        Objects.checkFromIndexSize(bitOffset, bitCount, bits.length);
        int b = bitOffset;
        for (int j = 0; j < labelCount; j++) {
            int label = labels[labelOffset + j];
            if (label >>> bitsPerLabel != 0) {
                throw new IllegalArgumentException("labels[" + (labelOffset + j) + "] = " + label + " does not fit "
                        + bitsPerLabel + " bits (0.." + ((1L << bitsPerLabel) - 1) + ")");
            }
            labelToBits(label, bits, b, bitsPerLabel);
            b += bitsPerLabel;
        }
    }

    /**
     * The label of the {@code bitsPerLabel} bits from {@code bits[bitOffset]}, the first of them its most significant
     * bit. Unchecked: the caller has checked the region, e.g. with {@link #requireBits}.
     */
    public static int bitsToLabel(byte[] bits, int bitOffset, int bitsPerLabel) {
        int label = 0;
        for (int j = 0; j < bitsPerLabel; j++) {
            label = (label << 1) | bits[bitOffset + j];
        }
        return label;
    }

    /**
     * Writes the {@code bitsPerLabel} bits of {@code label} from {@code bits[bitOffset]}, most significant first.
     * Unchecked: the caller has checked that the label fits and the region lies within {@code bits}.
     */
    public static void labelToBits(int label, byte[] bits, int bitOffset, int bitsPerLabel) {
        for (int j = 0; j < bitsPerLabel; j++) {
            bits[bitOffset + j] = (byte) ((label >>> (bitsPerLabel - 1 - j)) & 1);
        }
    }

    /**
     * Requires every label of the region to lie in {@code 0..m−1}, the labels of an {@code m}-point constellation.
     *
     * @throws IllegalArgumentException naming the first bad index and value
     */
    public static void requireLabels(int[] labels, int offset, int count, int m) {
        for (int n = offset; n < offset + count; n++) {
            if (labels[n] < 0 || labels[n] >= m) {
                throw new IllegalArgumentException("label " + labels[n] + " at index " + n + " is outside 0.." + (m - 1)
                        + " of a " + m + "-point constellation");
            }
        }
    }

    /**
     * Requires every bit of the region to be 0 or 1.
     *
     * @throws IllegalArgumentException naming the first bad index and value
     */
    public static void requireBits(byte[] bits, int offset, int count) {
        for (int n = offset; n < offset + count; n++) {
            if (bits[n] != 0 && bits[n] != 1) {
                throw new IllegalArgumentException("bit at index " + n + " is " + bits[n]
                        + "; unpacked bits are one byte each, 0 or 1");
            }
        }
    }

    private static int bitCount(int labelCount, int bitsPerLabel) {
        if (bitsPerLabel < 1 || bitsPerLabel > MAX_BITS_PER_LABEL) {
            throw new IllegalArgumentException("bits per label must be 1.." + MAX_BITS_PER_LABEL + ", got "
                    + bitsPerLabel);
        }
        if (labelCount < 0) {
            throw new IllegalArgumentException("label count must be >= 0, got " + labelCount);
        }
        long bitCount = (long) labelCount * bitsPerLabel;
        if (bitCount > Integer.MAX_VALUE) {
            throw new IllegalArgumentException(labelCount + " labels of " + bitsPerLabel
                    + " bits exceed the largest array");
        }
        return (int) bitCount;
    }

    private static IllegalArgumentException notABit(byte[] bits, int from, int count) {
        for (int i = from; i < from + count; i++) {
            if ((bits[i] & ~1) != 0) {
                return new IllegalArgumentException("bits[" + i + "] = " + bits[i] + ": a bit must be 0 or 1");
            }
        }
        throw new AssertionError("no invalid bit in " + from + ".." + (from + count - 1));
    }
}
