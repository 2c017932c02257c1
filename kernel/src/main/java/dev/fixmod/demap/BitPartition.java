package dev.fixmod.demap;

/** For each label bit, the labels whose bit is 0 and those whose bit is 1 (b0 = MSB of the label). */
final class BitPartition {
    /** {@code zeros[b]}: the labels with bit b = 0, ascending. */
    final int[][] zeros;
    /** {@code ones[b]}: the labels with bit b = 1, ascending. */
    final int[][] ones;

    BitPartition(int bitsPerSymbol) {
        int m = 1 << bitsPerSymbol;
        zeros = new int[bitsPerSymbol][m / 2];
        ones = new int[bitsPerSymbol][m / 2];
        for (int b = 0; b < bitsPerSymbol; b++) {
            int z = 0;
            int o = 0;
            for (int label = 0; label < m; label++) {
                if (bit(label, b, bitsPerSymbol) == 0) {
                    zeros[b][z++] = label;
                } else {
                    ones[b][o++] = label;
                }
            }
        }
    }

    /** Bit b of {@code label}, counting b0 as the most significant of k bits. */
    static int bit(int label, int b, int bitsPerSymbol) {
        return (label >>> (bitsPerSymbol - 1 - b)) & 1;
    }
}
