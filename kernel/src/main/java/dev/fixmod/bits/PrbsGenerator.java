package dev.fixmod.bits;

import java.util.Objects;

/**
 * Generates one {@link Prbs} sequence from a seed, many bits per step.
 *
 * <p>Why it is fast and still the plain shift register: squaring in GF(2) turns the recurrence
 * {@code y(k) = y(k−m) ⊕ y(k−n)} into {@code y(k) = y(k−2m) ⊕ y(k−2n)}, and so on. With the largest such
 * {@code L = n·2^j <= 64} and {@code M = m·2^j}, the last L bits (one {@code long}) determine the next M bits at
 * once: {@code (h ⊕ h >>> (L−M))} masked to M bits. The first L bits come from the one-bit-per-step register.
 */
public final class PrbsGenerator implements BitSource {
    private final Prbs prbs;
    private final long seed;
    private final int chunkBits;
    private final int lag;
    private final long historyMask;
    private final long chunkMask;
    private final int invert;
    /** The last L bits produced (before inversion), the most recent in bit 0. */
    private long history;
    /** Bits produced but not yet delivered: the next one is bit {@code pendingCount − 1}. */
    private long pending;
    private int pendingCount;

    PrbsGenerator(Prbs prbs, long seed) {
        this.prbs = prbs;
        this.seed = seed;
        int n = prbs.degree();
        int m = prbs.tap();
        int doublings = 0;
        while (n << (doublings + 1) <= 64) {
            doublings++;
        }
        int historyBits = n << doublings;
        this.chunkBits = m << doublings;
        this.lag = historyBits - chunkBits;
        this.historyMask = historyBits == 64 ? -1L : (1L << historyBits) - 1;
        this.chunkMask = (1L << chunkBits) - 1;
        this.invert = prbs.inverted() ? 1 : 0;
        long h = seed; // y(0) … y(n−1), y(n−1) in bit 0
        for (int k = n; k < historyBits; k++) {
            h = h << 1 | ((h >>> (m - 1) ^ h >>> (n - 1)) & 1); // y(k) = y(k−m) ⊕ y(k−n)
        }
        this.history = h & historyMask;
        this.pending = history;
        this.pendingCount = historyBits;
    }

    /** The sequence this generator produces. */
    public Prbs prbs() {
        return prbs;
    }

    /** The seed it started from. */
    public long seed() {
        return seed;
    }

    @Override
    public void fill(byte[] bits, int offset, int length) {
        Objects.checkFromIndexSize(offset, length, bits.length);
        int i = offset;
        int end = offset + length;
        while (i < end) {
            if (pendingCount == 0) {
                long next = (history ^ history >>> lag) & chunkMask;
                history = (history << chunkBits | next) & historyMask;
                pending = next;
                pendingCount = chunkBits;
            }
            int take = Math.min(pendingCount, end - i);
            for (int t = 0; t < take; t++) {
                pendingCount--;
                bits[i++] = (byte) ((int) (pending >>> pendingCount) & 1 ^ invert);
            }
        }
    }

    /** E.g. {@code prbs-23 (x^23 + x^18 + 1, inverted, seed 0x7fffff)}. */
    @Override
    public String toString() {
        return prbs + " (" + prbs.polynomial() + (prbs.inverted() ? ", inverted" : "") + ", seed 0x"
                + Long.toHexString(seed) + ")";
    }
}
