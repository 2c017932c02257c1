package dev.fixmod.map;

/**
 * Conversions between labels and unpacked bits (one byte 0 or 1 per bit, b0 first: the most significant bit of the
 * label), and the checks of both. Integer-only, for the per-sample paths of mappers and demappers.
 */
public final class Labels {
    private Labels() {
    }

    /** The label of the {@code k} bits from {@code bits[offset]}, b0 (first) as the most significant bit. */
    public static int fromBits(byte[] bits, int offset, int k) {
        int label = 0;
        for (int j = 0; j < k; j++) {
            label = (label << 1) | bits[offset + j];
        }
        return label;
    }

    /** Writes the {@code k} bits of {@code label} from {@code bits[offset]}, most significant (b0) first. */
    public static void toBits(int label, int k, byte[] bits, int offset) {
        for (int j = 0; j < k; j++) {
            bits[offset + j] = (byte) ((label >>> (k - 1 - j)) & 1);
        }
    }

    /**
     * Requires every label of the region to lie in {@code 0..m−1}.
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
}
