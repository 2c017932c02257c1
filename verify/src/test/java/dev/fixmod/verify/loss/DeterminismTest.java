package dev.fixmod.verify.loss;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;

import java.util.List;
import org.junit.jupiter.api.Test;

/** Results do not depend on the thread count (per-chunk streams, reduction and stopping in chunk order). */
class DeterminismTest {
    static final String SPEC = "{\"constellation\": \"qam16\", \"noise\": {\"eb-n0-db\": [4, 8], \"seed\": 3},"
            + " \"simulation\": {\"target-errors\": 150, \"min-bits\": 8000, \"max-bits\": 60000,"
            + " \"chunk-symbols\": 256}, \"targets\": {\"gmi\": 3.4},"
            + " \"sweep\": [{\"parameter\": \"llr-word-length\", \"values\": [4, 6]}]}";

    @Test
    void oneAndTwoThreadsGiveIdenticalPoints() {
        List<PointResult> one = LossFixtures.simulate(SPEC, 1);
        List<PointResult> two = LossFixtures.simulate(SPEC, 2);
        List<PointResult> three = LossFixtures.simulate(SPEC, 3);
        assertEquals(one, two);
        assertEquals(one, three);
        // The stopping rule was exercised: the 8 dB point stops at the error target before max-bits, after whole chunks.
        PointResult high = one.get(1);
        assertNotEquals(60000, high.bits());
        assertEquals(0, high.symbols() % 256);
    }

    @Test
    void histogramReplayGivesTheSameCounts() {
        PointResult p = LossFixtures.simulate(SPEC, 2).get(0);
        var h = p.llrHistogram();
        int width = p.maxCode() - p.minCode() + 1;
        long[] counts = new long[p.histogram().length];
        for (int j = 0; j < p.bitsPerSymbol(); j++) {
            for (int b = 0; b < 2; b++) {
                for (int c = p.minCode(); c <= p.maxCode(); c++) {
                    counts[(j * 2 + b) * width + c - p.minCode()] = h.count(j, b, c);
                }
            }
        }
        assertArrayEquals(p.histogram(), counts);
    }
}
