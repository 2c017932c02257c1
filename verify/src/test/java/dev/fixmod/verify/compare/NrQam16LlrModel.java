package dev.fixmod.verify.compare;

import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Rounding;

/**
 * The Java twin of verify/src/test/hdl/nr16qam_llr.v, built from the kernel's rounding and overflow modes: per-axis
 * max-log LLRs of NR 16-QAM (3GPP TS 38.211 5.1.3) from Q1.6 inputs to Q5.0 outputs. Its arithmetic is that of the
 * Verilog file's header comment; the variants mirror the Verilog parameters a test flips to break the design.
 */
final class NrQam16LlrModel {
    static final QFormat INPUT = QFormat.parse("Q1.6");
    static final QFormat LLR = QFormat.parse("Q5.0");
    static final WordLayout IN_LAYOUT = WordLayout.parse("i:Q1.6,q:Q1.6");
    static final WordLayout LLR_LAYOUT = WordLayout.parse("llr0:Q5.0,llr1:Q5.0,llr2:Q5.0,llr3:Q5.0");
    /** round(64 / sqrt(10)) = round(20.24): the inner level 1/sqrt(10) of TS 38.211 5.1.3 in Q1.6. */
    static final int A = 20;
    static final int T = 2 * A;
    static final int GAIN = 11;
    static final int SHIFT = 4;

    private final Rounding rounding;
    private final int satHi;

    NrQam16LlrModel(Rounding rounding, int satHi) {
        this.rounding = rounding;
        this.satHi = satHi;
    }

    static NrQam16LlrModel golden() {
        return new NrQam16LlrModel(Rounding.HALF_UP, 31);
    }

    static long signMetric(long y) {
        return y > T ? 2 * y - T : y < -T ? 2 * y + T : y;
    }

    static long magnitudeMetric(long y) {
        return T - Math.abs(y);
    }

    long scale(long metric) {
        long r = rounding.shiftRight(metric * GAIN, SHIFT);
        if (satHi == LLR.maxCode()) {
            return Overflow.SYMMETRIC_SATURATE.apply(r, LLR, OverflowCounter.unnamed());
        }
        return Math.max(-LLR.maxCode(), Math.min(satHi, r));
    }

    /** The LLR word {llr0, llr1, llr2, llr3} of one input word {i, q}. */
    long llrWord(long inputWord) {
        long i = IN_LAYOUT.field(0).extract(inputWord);
        long q = IN_LAYOUT.field(1).extract(inputWord);
        return LLR_LAYOUT.pack(scale(signMetric(i)), scale(signMetric(q)), scale(magnitudeMetric(i)),
                scale(magnitudeMetric(q)));
    }

    /** The stimulus: every I code once and every Q code once per pass, two passes in different orders. */
    static long[] stimulus() {
        long[] words = new long[512];
        for (int n = 0; n < words.length; n++) {
            int pass = n >> 8;
            long i = (byte) ((n * (pass == 0 ? 1 : 77) + 128) & 0xFF);
            long q = (byte) ((n * (pass == 0 ? 37 : 91) + 3) & 0xFF);
            words[n] = IN_LAYOUT.pack(i, q);
        }
        return words;
    }
}
