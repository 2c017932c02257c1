package dev.fixmod.verify.noise;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.LongRange;

class AwgnProperties {

    /** Law: an instance's reused work arrays carry nothing from one fill to the next. */
    @Property(tries = 200)
    void aReusedInstanceGivesTheSamplesOfAFreshOne(@ForAll Gaussian method,
            @ForAll @LongRange(min = 0, max = StreamKey.MAX) long seed,
            @ForAll @LongRange(min = 0, max = Awgn.MAX_INDEX - 3000) long first,
            @ForAll @IntRange(min = 0, max = 3000) int earlierLength,
            @ForAll @LongRange(min = 0, max = Awgn.MAX_INDEX - 3000) long earlierFirst,
            @ForAll @IntRange(min = 0, max = 1500) int length) {
        Awgn reused = new Awgn(0.7, method);
        double[] scratchI = new double[earlierLength];
        double[] scratchQ = new double[earlierLength];
        reused.fill(scratchI, 0, scratchQ, 0, earlierLength, StreamKey.of(seed ^ 1, 9), earlierFirst);
        double[] i = new double[length];
        double[] q = new double[length];
        reused.fill(i, 0, q, 0, length, StreamKey.of(seed, 4), first);
        double[] freshI = new double[length];
        double[] freshQ = new double[length];
        new Awgn(0.7, method).fill(freshI, 0, freshQ, 0, length, StreamKey.of(seed, 4), first);
        assertArrayEquals(freshI, i);
        assertArrayEquals(freshQ, q);
    }
}
