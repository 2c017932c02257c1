package dev.fixmod.verify.loss;

import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * GMI-based implementation loss of the LLR word length for Gray 16-QAM with a 16-bit input: 8-bit LLRs cost
 * almost nothing, 3-bit LLRs clearly cost (5–6 LLR bits usually suffice ahead of a modern decoder: common practice,
 * no source). The same seed gives every design the same bits and noise (common random numbers), so the small
 * difference is measurable with few samples.
 */
class LlrWordLengthTest {

    private static double loss(String llr) {
        String spec = "{\"constellation\": \"qam16\","
                + " \"demapper\": {\"input\": {\"format\": \"Q2.13\"}, \"llr\": {\"format\": \"" + llr + "\"}},"
                + " \"noise\": {\"eb-n0-db\": [2, 3, 4, 5, 6], \"seed\": 11},"
                + " \"simulation\": {\"target-errors\": 1, \"min-bits\": 80000, \"max-bits\": 80000,"
                + " \"chunk-symbols\": 2048}, \"targets\": {\"gmi\": 3.2}}";
        return LossFixtures.analyse(spec, 2).designs().get(0).lossGmiDb();
    }

    @Test
    void eightBitLlrsAreFreeAndThreeBitLlrsAreNot() {
        double eight = loss("Q5.2");
        double three = loss("Q2.0");
        System.err.println("16-QAM, 16-bit input: GMI loss with 8-bit LLRs (Q5.2) " + eight + " dB, 3-bit (Q2.0) "
                + three + " dB");
        assertTrue(Math.abs(eight) < 0.05, "8-bit LLR loss " + eight + " dB");
        assertTrue(three > 0.3, "3-bit LLR loss " + three + " dB should be clearly larger");
    }
}
