package dev.fixmod.verify.loss;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.verify.theory.ErrorRateInterval;
import dev.fixmod.verify.theory.GaussianTail;
import dev.fixmod.verify.theory.Snr;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * π/2-BPSK through the loss analysis: the simulation turns odd symbols and tells both demappers each symbol's index,
 * and the analysis's input figures see both axes.
 */
class Pi2BpskLossTest {

    /** Chunks of an odd number of symbols, so that chunks start on both parities (a lost index would show). */
    private static String spec(String constellation, long bits) {
        return "{\"constellation\": \"" + constellation + "\","
                + " \"demapper\": {\"input\": {\"format\": \"Q2.13\"}, \"llr\": {\"format\": \"Q7.4\"}},"
                + " \"noise\": {\"eb-n0-db\": [4.0, 6.8], \"seed\": 11},"
                + " \"simulation\": {\"target-errors\": 1000000, \"min-bits\": " + bits + ", \"max-bits\": " + bits
                + ", \"chunk-symbols\": 4095}, \"targets\": {\"gmi\": 0.5}}";
    }

    @Test
    void theBitErrorRateIsBpsksClosedFormForBothMappings() {
        // Proakis, Digital Communications, 5th ed., §4.3: antipodal signalling has P_b = Q(sqrt(2 Eb/N0)); the turn of
        // π/2-BPSK (3GPP TS 38.211 §5.1.1) multiplies both points by j, which changes no distance, so its P_b is the
        // same, on the diagonal points of nr:pi2bpsk and on the real-axis ones of pi2bpsk alike.
        for (String c : new String[] {"nr:pi2bpsk", "pi2bpsk"}) {
            List<PointResult> r = LossFixtures.simulate(spec(c, 120_000), 2);
            for (int i = 0; i < 2; i++) {
                double eb = i == 0 ? 4.0 : 6.8;
                double theory = GaussianTail.q(StrictMath.sqrt(2 * Snr.fromDb(eb)));
                assertWithin(r.get(i).floatBitErrors(), r.get(i).bits(), theory, c + " float at " + eb + " dB");
                assertWithin(r.get(i).fixedBitErrors(), r.get(i).bits(), theory, c + " fixed at " + eb + " dB");
            }
        }
    }

    private static void assertWithin(long errors, long trials, double theory, String what) {
        ErrorRateInterval i = ErrorRateInterval.clopperPearson(errors, trials, 0.99);
        assertTrue(i.contains(theory), what + ": theory " + theory + " outside the 99% interval [" + i.lower() + ", "
                + i.upper() + "] of " + errors + "/" + trials);
    }

    @Test
    void theInputQuantizerIsSizedForBothAxes() {
        // A uniform quantizer adds LSB²/12 of granular noise per quantized real dimension (common practice, no
        // source). BPSK on the I axis needs one quantizer; pi2bpsk puts its odd symbols on Q, so both are needed and
        // the granular SQNR is 10·log10(2) dB lower at the same signal energy.
        LossAnalysis bpsk = LossFixtures.analyse(spec("bpsk", 20_000), 2);
        LossAnalysis turned = LossFixtures.analyse(spec("pi2bpsk", 20_000), 2);
        double one = bpsk.designs().get(0).input().sqnrGranularDb();
        double two = turned.designs().get(0).input().sqnrGranularDb();
        assertEquals(10 * StrictMath.log10(2), one - two, 1e-9);
        // The measured SQNR agrees with the model once Q is quantized too (it would be 3 dB off otherwise).
        assertEquals(two, turned.designs().get(0).input().sqnrMeasuredDb(), 0.5);
    }
}
