package dev.fixmod.verify.noise;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.LongRange;

class GaussianProperties {

    /** Law: a sample depends only on (key, index), never on how the index range is split. */
    @Property(tries = 200)
    void splittingARangeNeverChangesTheSamples(@ForAll Gaussian method,
            @ForAll @LongRange(min = 0, max = StreamKey.MAX) long seed,
            @ForAll @LongRange(min = 0, max = StreamKey.MAX) long stream,
            @ForAll @LongRange(min = 0, max = Long.MAX_VALUE - 200) long first,
            @ForAll @IntRange(min = 0, max = 150) int length,
            @ForAll @IntRange(min = 0, max = 150) int cutAt) {
        StreamKey key = StreamKey.of(seed, stream);
        int cut = Math.min(cutAt, length);
        double[] whole = new double[length];
        method.fill(whole, 0, length, key, first);
        double[] parts = new double[length];
        method.fill(parts, cut, length - cut, key, first + cut);
        method.fill(parts, 0, cut, key, first);
        assertArrayEquals(whole, parts);
        if (length > 0) {
            assertEquals(whole[length - 1], method.sample(key, first + length - 1));
        }
    }

    /** Law: the same for raw draws, which the uniform and Gaussian samplers are built on. */
    @Property(tries = 200)
    void drawsAreIndexable(@ForAll @LongRange(min = 0, max = Long.MAX_VALUE - 50) long first,
            @ForAll @IntRange(min = 1, max = 50) int length) {
        StreamKey key = StreamKey.of(1, 1);
        long[] whole = new long[length];
        Philox4x32.fillDraws(whole, 0, length, key, first);
        long[] last = new long[1];
        Philox4x32.fillDraws(last, 0, 1, key, first + length - 1);
        assertEquals(whole[length - 1], last[0]);
    }
}
