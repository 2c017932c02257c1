package dev.fixmod.bits;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;

import java.util.List;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.Size;

/** Laws of the bit sources: chunking never changes the stream; any seed follows the plain shift register. */
class PrbsProperties {

    @Property(tries = 200)
    void fillingInChunksGivesTheSameStream(@ForAll Prbs prbs, @ForAll @Size(max = 20)
            List<@IntRange(max = 200) Integer> chunks) {
        int total = chunks.stream().mapToInt(Integer::intValue).sum();
        byte[] once = new byte[total];
        prbs.generator().fill(once, 0, total);
        byte[] pieces = new byte[total];
        PrbsGenerator g = prbs.generator();
        int at = 0;
        for (int c : chunks) {
            g.fill(pieces, at, c);
            at += c;
        }
        assertArrayEquals(once, pieces);
    }

    @Property(tries = 200)
    void anySeedFollowsTheStraightforwardShiftRegister(@ForAll Prbs prbs, @ForAll long anySeed) {
        // Reference: ShiftRegister (O.150 wording, from memory), one clock per bit.
        long seed = 1 + Math.floorMod(anySeed, prbs.period()); // 1 .. 2^n - 1
        byte[] expected = new ShiftRegister(prbs, seed).next(500);
        byte[] got = new byte[500];
        prbs.generator(seed).fill(got, 0, 500);
        assertArrayEquals(expected, got, prbs + " seed " + seed);
    }

    @Property(tries = 100)
    void repeatingPatternsRepeatAcrossCalls(@ForAll @Size(min = 1, max = 9) List<@IntRange(max = 1) Integer> pattern,
                                            @ForAll @IntRange(max = 40) int first, @ForAll @IntRange(max = 40) int second) {
        byte[] p = new byte[pattern.size()];
        for (int i = 0; i < p.length; i++) {
            p[i] = pattern.get(i).byteValue();
        }
        BitSource source = BitSource.repeating(p);
        byte[] bits = new byte[first + second];
        source.fill(bits, 0, first);
        source.fill(bits, first, second);
        for (int i = 0; i < bits.length; i++) {
            if (bits[i] != p[i % p.length]) {
                throw new AssertionError("bit " + i + " of " + pattern);
            }
        }
    }
}
