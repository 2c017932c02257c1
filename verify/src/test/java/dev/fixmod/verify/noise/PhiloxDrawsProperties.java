package dev.fixmod.verify.noise;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.LongRange;

/** The interleaved two-block draw loop the ziggurat uses gives exactly the draws of the checked one-block fill. */
class PhiloxDrawsProperties {

    @Property(tries = 300)
    void interleavedDrawsEqualTheOneBlockFill(@ForAll @LongRange(min = 0, max = Long.MAX_VALUE - 100) long first,
                                             @ForAll @IntRange(min = 0, max = 40) int length,
                                             @ForAll @LongRange(min = 0, max = StreamKey.MAX) long seed,
                                             @ForAll @LongRange(min = 0, max = StreamKey.MAX) long stream) {
        StreamKey key = StreamKey.of(seed, stream);
        long[] expected = new long[length + 2];
        long[] actual = new long[length + 2];
        Philox4x32.fillDraws(expected, 1, length, key, first);
        int[] scratch = {-1, -1, -1, -1}; // leftovers of an earlier use must not leak into the draws
        Philox4x32.draws(actual, 1, length, key, first, scratch);
        assertArrayEquals(expected, actual);
    }
}
