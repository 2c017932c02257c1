package dev.fixmod.verify.noise;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.math.BigInteger;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class Philox4x32Test {

    private static int[] encrypt(int c0, int c1, int c2, int c3, int k0, int k1) {
        int[] out = new int[4];
        Philox4x32.encrypt(c0, c1, c2, c3, k0, k1, out, 0);
        return out;
    }

    // Source: the known-answer vectors of Random123 (Salmon et al., SC'11), file tests/kat_vectors, lines
    // "philox4x32 10 <ctr0..3> <key0..1> <out0..3>". Read as quoted verbatim by several independent public
    // projects (not from the upstream file itself); they also match the values recalled from memory in our brief.
    @Test
    void publishedKnownAnswersAllZero() {
        assertArrayEquals(new int[] {0x6627e8d5, 0xe169c58d, 0xbc57ac4c, 0x9b00dbd8},
                encrypt(0, 0, 0, 0, 0, 0));
    }

    @Test
    void publishedKnownAnswersAllOnes() {
        assertArrayEquals(new int[] {0x408f276d, 0x41c83b0e, 0xa20bc7c6, 0x6d5451fd},
                encrypt(-1, -1, -1, -1, -1, -1));
    }

    @Test
    void publishedKnownAnswersPiDigits() {
        assertArrayEquals(new int[] {0xd16cfe09, 0x94fdcceb, 0x5001e420, 0x24126ea1},
                encrypt(0x243f6a88, 0x85a308d3, 0x13198a2e, 0x03707344, 0xa4093822, 0x299f31d0));
    }

    /**
     * An independent transcription of the SC'11 paper's definition: arbitrary-precision products, the round-r key
     * written in closed form k + r·W mod 2^32 instead of being bumped, and the output permutation spelled out.
     */
    private static long[] reference(long[] ctr, long[] key) {
        BigInteger mod = BigInteger.ONE.shiftLeft(32);
        BigInteger m0 = BigInteger.valueOf(0xD2511F53L);
        BigInteger m1 = BigInteger.valueOf(0xCD9E8D57L);
        long[] x = ctr.clone();
        for (int r = 0; r < 10; r++) {
            long rk0 = (key[0] + r * 0x9E3779B9L) % (1L << 32);
            long rk1 = (key[1] + r * 0xBB67AE85L) % (1L << 32);
            BigInteger[] prod0 = m0.multiply(BigInteger.valueOf(x[0])).divideAndRemainder(mod);
            BigInteger[] prod1 = m1.multiply(BigInteger.valueOf(x[2])).divideAndRemainder(mod);
            long hi0 = prod0[0].longValueExact();
            long lo0 = prod0[1].longValueExact();
            long hi1 = prod1[0].longValueExact();
            long lo1 = prod1[1].longValueExact();
            x = new long[] {hi1 ^ x[1] ^ rk0, lo1, hi0 ^ x[3] ^ rk1, lo0};
        }
        return x;
    }

    @Test
    void referenceTranscriptionReproducesThePublishedVectors() {
        // Guards the oracle itself with the same Random123 vectors as above.
        assertArrayEquals(new long[] {0x6627e8d5L, 0xe169c58dL, 0xbc57ac4cL, 0x9b00dbd8L},
                reference(new long[4], new long[2]));
        assertArrayEquals(new long[] {0xd16cfe09L, 0x94fdccebL, 0x5001e420L, 0x24126ea1L},
                reference(new long[] {0x243f6a88L, 0x85a308d3L, 0x13198a2eL, 0x03707344L},
                        new long[] {0xa4093822L, 0x299f31d0L}));
    }

    @Test
    void agreesWithTheIndependentTranscriptionOnRandomCountersAndKeys() {
        SplittableRandom random = new SplittableRandom(20240611L);
        for (int t = 0; t < 2000; t++) {
            long[] ctr = {random.nextLong(1L << 32), random.nextLong(1L << 32), random.nextLong(1L << 32),
                random.nextLong(1L << 32)};
            long[] key = {random.nextLong(1L << 32), random.nextLong(1L << 32)};
            long[] want = reference(ctr, key);
            int[] got = encrypt((int) ctr[0], (int) ctr[1], (int) ctr[2], (int) ctr[3], (int) key[0], (int) key[1]);
            for (int j = 0; j < 4; j++) {
                assertEquals(want[j], got[j] & 0xFFFF_FFFFL, "word " + j + " of trial " + t);
            }
        }
    }

    @Test
    void blockUsesTheDocumentedKeyAndCounterLayout() {
        // Layout of noise-algorithm.md: key = (seed, stream), counter = (index low, index high, 0, 0).
        StreamKey key = StreamKey.of(0xa4093822L, 0x299f31d0L);
        long counter = 0x05a308d3_243f6a88L;
        assertArrayEquals(encrypt(0x243f6a88, 0x05a308d3, 0, 0, 0xa4093822, 0x299f31d0),
                Philox4x32.block(key, counter));
        // Word 2 of the counter is the draw word (0 for primary blocks, 1, 2, ... for Gaussian retries).
        int[] retry = new int[4];
        Philox4x32.block(key, counter, 0x13198a2e, retry, 0);
        assertArrayEquals(encrypt(0x243f6a88, 0x05a308d3, 0x13198a2e, 0, 0xa4093822, 0x299f31d0), retry);
    }

    @Test
    void otherStreamsAndSeedsGiveOtherBlocks() {
        StreamKey key = StreamKey.of(1, 2);
        assertArrayEquals(encrypt(5, 0, 0, 0, 1, 3), Philox4x32.block(key.withStream(3), 5));
        assertEquals(StreamKey.of(1, 3), key.withStream(3));
    }

    @Test
    void wordAndDrawFillsFollowTheBlocks() {
        StreamKey key = StreamKey.of(7, 3);
        int[] words = new int[41];
        Philox4x32.fillWords(words, 1, 38, key, 10);
        long[] draws = new long[19];
        Philox4x32.fillDraws(draws, 0, 19, key, 5);
        for (int w = 10; w < 48; w++) {
            assertEquals(Philox4x32.block(key, w >>> 2)[w & 3], words[1 + w - 10], "word " + w);
        }
        for (int j = 5; j < 24; j++) {
            int[] b = Philox4x32.block(key, j >>> 1);
            int h = j & 1;
            long expected = (b[2 * h] & 0xFFFF_FFFFL) | ((long) b[2 * h + 1] << 32);
            assertEquals(expected, draws[j - 5], "draw " + j);
        }
        assertEquals(0, words[0]);
        assertEquals(0, words[40]);
    }

    @Test
    void rejectsBadSlicesAndIndices() {
        StreamKey key = StreamKey.of(1, 2);
        IllegalArgumentException slice = assertThrows(IllegalArgumentException.class,
                () -> Philox4x32.fillWords(new int[4], 2, 3, key, 0));
        assertEquals("out: offset 2 and length 3 do not fit an array of length 4 (need 0 <= offset, 0 <= length,"
                + " offset + length <= array length)", slice.getMessage());
        assertThrows(IllegalArgumentException.class, () -> Philox4x32.fillDraws(new long[2], 0, 2, key,
                Long.MAX_VALUE));
        assertThrows(IllegalArgumentException.class, () -> Philox4x32.block(key, -1));
        IllegalArgumentException seed = assertThrows(IllegalArgumentException.class, () -> StreamKey.of(1L << 32, 0));
        assertEquals("seed must be 0..4294967295 (an unsigned 32-bit number), got 4294967296", seed.getMessage());
    }
}
