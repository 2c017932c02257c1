package dev.fixmod.verify.compare;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** The HDL proof's golden model is the max-log LLR of NR 16-QAM, integer for integer. */
class NrQam16LlrModelTest {
    @Test
    void metricsAreTheMaxLogDistanceDifferences() {
        // 3GPP TS 38.211 5.1.3 (16QAM): I = (1 - 2 b0)(2 - (1 - 2 b2)) / sqrt(10): b0 = 0 on the positive side,
        // b2 = 0 on the inner level A = 1/sqrt(10), b2 = 1 on the outer level 3A. Max-log LLR (Proakis, Digital
        // Communications, soft-output demodulation; common practice): L = (min_{b=1} (y-s)^2 - min_{b=0} (y-s)^2)/N0.
        // With the levels quantized to A and 3A codes, that difference is 4A times the model's metric, exactly.
        long a = NrQam16LlrModel.A;
        long[] zeroSign = {a, 3 * a};
        long[] oneSign = {-a, -3 * a};
        long[] zeroMag = {a, -a};
        long[] oneMag = {3 * a, -3 * a};
        for (long y = NrQam16LlrModel.INPUT.minCode(); y <= NrQam16LlrModel.INPUT.maxCode(); y++) {
            assertEquals(minSq(y, oneSign) - minSq(y, zeroSign), 4 * a * NrQam16LlrModel.signMetric(y), "y=" + y);
            assertEquals(minSq(y, oneMag) - minSq(y, zeroMag), 4 * a * NrQam16LlrModel.magnitudeMetric(y), "y=" + y);
        }
    }

    private static long minSq(long y, long[] levels) {
        long best = Long.MAX_VALUE;
        for (long s : levels) {
            best = Math.min(best, (y - s) * (y - s));
        }
        return best;
    }

    @Test
    void innerLevelIsTheNearestCodeOfOneOverRootTen() {
        // TS 38.211 5.1.3: inner level 1/sqrt(10); in Q1.6 (LSB 1/64) its nearest code is 20 (20.24...).
        assertEquals(Math.round(64 / Math.sqrt(10)), NrQam16LlrModel.A);
    }

    @Test
    void stimulusCoversEveryInputCodeOnBothAxes() {
        long[] stim = NrQam16LlrModel.stimulus();
        java.util.Set<Long> is = new java.util.HashSet<>();
        java.util.Set<Long> qs = new java.util.HashSet<>();
        for (long w : stim) {
            is.add(NrQam16LlrModel.IN_LAYOUT.field(0).extract(w));
            qs.add(NrQam16LlrModel.IN_LAYOUT.field(1).extract(w));
        }
        assertEquals(256, is.size());
        assertEquals(256, qs.size());
        // The halved rounding tie 40 * 11 / 16 = 27.5 (|y| = 0, magnitude bit) rounds up to 28 under half-up.
        assertEquals(28, NrQam16LlrModel.golden().scale(40));
        assertTrue(NrQam16LlrModel.golden().scale(10_000) == 31 && NrQam16LlrModel.golden().scale(-10_000) == -31);
    }
}
