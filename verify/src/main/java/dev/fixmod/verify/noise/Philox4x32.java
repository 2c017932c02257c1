package dev.fixmod.verify.noise;

/**
 * The Philox4x32-10 counter-based generator (Salmon, Moraes, Dror, Shaw, "Parallel random numbers: as easy as
 * 1, 2, 3", SC'11): a keyed bijection of a 128-bit counter, so the block at any counter is computed directly,
 * without stepping through the ones before it.
 *
 * <p>One round maps counter words (c0, c1, c2, c3) with key words (k0, k1) to
 * <pre>
 *   (hi(M1·c2) ^ c1 ^ k0,  lo(M1·c2),  hi(M0·c0) ^ c3 ^ k1,  lo(M0·c0))
 * </pre>
 * where {@code hi}/{@code lo} are the upper/lower 32 bits of the 64-bit product, M0 = 0xD2511F53,
 * M1 = 0xCD9E8D57. Ten rounds; before each round after the first the key is bumped: k0 += 0x9E3779B9,
 * k1 += 0xBB67AE85 (mod 2^32).
 *
 * <p>fixmod's layout (the contract a testbench reproduces, see {@code noise-algorithm.md}): key = (seed, stream)
 * of the {@link StreamKey}; counter = (block index low word, block index high word, draw word, 0). The draw word is
 * 0 for the primary blocks that {@link #block}, {@link #fillWords} and {@link #fillDraws} address; the Gaussian
 * sampler's retries use the same index with draw word 1, 2, …. Word 3 is reserved and always 0.
 *
 * <p>A 64-bit draw {@code j} is made of the words {@code 2h} (low half) and {@code 2h + 1} (high half) of block
 * {@code j >>> 1}, where {@code h = j & 1}.
 */
public final class Philox4x32 {

    /** Rounds per block. */
    public static final int ROUNDS = 10;

    /** The largest block index, draw index and word index accepted (counters are non-negative longs). */
    public static final long MAX_INDEX = Long.MAX_VALUE;

    static final int M0 = 0xD2511F53;
    static final int M1 = 0xCD9E8D57;
    static final int W0 = 0x9E3779B9;
    static final int W1 = 0xBB67AE85;

    private static final long LOW = 0xFFFF_FFFFL;

    private Philox4x32() {
    }

    /**
     * The raw bijection: encrypts counter (c0, c1, c2, c3) under key (k0, k1) and stores the four output words at
     * {@code out[offset … offset + 3]}. This is the function the published known-answer vectors specify.
     */
    public static void encrypt(int c0, int c1, int c2, int c3, int k0, int k1, int[] out, int offset) {
        Checks.slice("out", out.length, offset, 4);
        for (int round = 0; round < ROUNDS; round++) {
            if (round > 0) {
                k0 += W0;
                k1 += W1;
            }
            long p0 = (M0 & LOW) * (c0 & LOW);
            long p1 = (M1 & LOW) * (c2 & LOW);
            int n0 = (int) (p1 >>> 32) ^ c1 ^ k0;
            int n2 = (int) (p0 >>> 32) ^ c3 ^ k1;
            c1 = (int) p1;
            c3 = (int) p0;
            c0 = n0;
            c2 = n2;
        }
        out[offset] = c0;
        out[offset + 1] = c1;
        out[offset + 2] = c2;
        out[offset + 3] = c3;
    }

    /** The primary block at {@code counter} of {@code key}: four words at {@code out[offset … offset + 3]}. */
    public static void block(StreamKey key, long counter, int[] out, int offset) {
        if (counter < 0) {
            throw new IllegalArgumentException("block counter must be 0.." + MAX_INDEX + ", got " + counter);
        }
        block(key, counter, 0, out, offset);
    }

    /** The primary block at {@code counter} of {@code key} as a new array (for spot checks; loops use the fills). */
    public static int[] block(StreamKey key, long counter) {
        int[] out = new int[4];
        block(key, counter, out, 0);
        return out;
    }

    /** The block of the given draw word; {@code drawWord} 0 is the primary space, others serve retries. */
    static void block(StreamKey key, long counter, int drawWord, int[] out, int offset) {
        encrypt((int) counter, (int) (counter >>> 32), drawWord, 0, key.k0(), key.k1(), out, offset);
    }

    /** Word {@code w} (of the primary space) is word {@code w & 3} of block {@code w >>> 2}. */
    public static void fillWords(int[] out, int offset, int length, StreamKey key, long firstWord) {
        Checks.slice("out", out.length, offset, length);
        Checks.indices("word", firstWord, length, MAX_INDEX);
        int[] block = new int[4];
        long w = firstWord;
        int end = offset + length;
        int pos = offset;
        while (pos < end) {
            block(key, w >>> 2, 0, block, 0);
            for (int j = (int) (w & 3); j < 4 && pos < end; j++) {
                out[pos++] = block[j];
                w++;
            }
        }
    }

    /** Fills 64-bit draws {@code firstDraw … firstDraw + length − 1} (layout in the class comment). */
    public static void fillDraws(long[] out, int offset, int length, StreamKey key, long firstDraw) {
        Checks.slice("out", out.length, offset, length);
        Checks.indices("draw", firstDraw, length, MAX_INDEX);
        drawsOneBlockAtATime(out, offset, length, key, firstDraw, new int[4]);
    }

    private static void drawsOneBlockAtATime(long[] out, int offset, int length, StreamKey key, long firstDraw,
                                             int[] block) {
        long j = firstDraw;
        int end = offset + length;
        int pos = offset;
        while (pos < end) {
            block(key, j >>> 1, 0, block, 0);
            if ((j & 1) == 0) {
                out[pos++] = join(block[0], block[1]);
                j++;
            }
            if (pos < end) {
                out[pos++] = join(block[2], block[3]);
                j++;
            }
        }
    }

    /**
     * {@link #fillDraws} without its checks, two blocks per step with their rounds interleaved: the ten rounds of one
     * block are a chain of dependent multiplications, and a second independent chain fills the multiplier's idle
     * cycles. The same words as {@link #fillDraws}; callers have checked the slice and the indices. {@code block}
     * is scratch for a partial block at either end.
     */
    static void draws(long[] out, int offset, int length, StreamKey key, long firstDraw, int[] block) {
        int k0 = key.k0();
        int k1 = key.k1();
        int pos = offset;
        int end = offset + length;
        long j = firstDraw;
        if ((j & 1) != 0 && pos < end) {
            block(key, j >>> 1, 0, block, 0);
            out[pos++] = join(block[2], block[3]);
            j++;
        }
        while (end - pos >= 4) {
            long p = j >>> 1;
            long q = p + 1;
            int a0 = (int) p;
            int a1 = (int) (p >>> 32);
            int a2 = 0;
            int a3 = 0;
            int b0 = (int) q;
            int b1 = (int) (q >>> 32);
            int b2 = 0;
            int b3 = 0;
            int r0 = k0;
            int r1 = k1;
            for (int round = 0; round < ROUNDS; round++) {
                if (round > 0) {
                    r0 += W0;
                    r1 += W1;
                }
                long pa0 = (M0 & LOW) * (a0 & LOW);
                long pa1 = (M1 & LOW) * (a2 & LOW);
                long pb0 = (M0 & LOW) * (b0 & LOW);
                long pb1 = (M1 & LOW) * (b2 & LOW);
                int na0 = (int) (pa1 >>> 32) ^ a1 ^ r0;
                int na2 = (int) (pa0 >>> 32) ^ a3 ^ r1;
                int nb0 = (int) (pb1 >>> 32) ^ b1 ^ r0;
                int nb2 = (int) (pb0 >>> 32) ^ b3 ^ r1;
                a1 = (int) pa1;
                a3 = (int) pa0;
                a0 = na0;
                a2 = na2;
                b1 = (int) pb1;
                b3 = (int) pb0;
                b0 = nb0;
                b2 = nb2;
            }
            out[pos] = join(a0, a1);
            out[pos + 1] = join(a2, a3);
            out[pos + 2] = join(b0, b1);
            out[pos + 3] = join(b2, b3);
            pos += 4;
            j += 4;
        }
        if (pos < end) {
            drawsOneBlockAtATime(out, pos, end - pos, key, j, block);
        }
    }

    /** The 64-bit value whose low half is {@code lo} and high half is {@code hi}. */
    static long join(int lo, int hi) {
        return ((long) hi << 32) | (lo & LOW);
    }
}
