package dev.fixmod.verify.loss;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.fixed.QFormat;
import org.junit.jupiter.api.Test;

/**
 * The internal stages of the fixed LLR datapath in the loss analysis: their word-length sweeps follow the documented
 * rule, and the metric stage's overflow events appear exactly when its integer bits fall below the range the input
 * codes can reach, a bound this test computes on its own from the constellation and the input format.
 */
class StageSweepTest {

    /** 16-QAM filling a Q2.5 input (back-off 0 dB), at low Eb/N0 so that clipped samples reach the input's corners. */
    static final String METRIC_SPEC = "{\"constellation\": \"qam16\","
            + " \"demapper\": {\"input\": {\"format\": \"Q2.5\"}, \"back-off-db\": 0,"
            + " \"llr\": {\"format\": \"Q4.1\"}METRIC},"
            + " \"noise\": {\"eb-n0-db\": [0, 3], \"seed\": 9},"
            + " \"simulation\": {\"target-errors\": 1, \"min-bits\": 32768, \"max-bits\": 32768,"
            + " \"chunk-symbols\": 1024},"
            + " \"targets\": {\"ber\": 0.05, \"gmi\": 2.0, \"loss-budget-db\": 0.5}SWEEP}";

    /**
     * The largest metric D = d1 − d0 (max-log: the squared distance to the nearest point whose bit is 1 minus that to
     * the nearest whose bit is 0) over every input code pair and bit, in the input's code units squared, both signs:
     * {max, −min}. The reference points are the constellation times the gain g = maxValue / max|coordinate| (back-off
     * 0 dB) rounded half-even to the input format, as the loss analysis documents its receive ROM.
     */
    static long[] metricExtremes(Constellation c, QFormat in) {
        double peak = 0;
        for (int l = 0; l < c.size(); l++) {
            peak = Math.max(peak, Math.max(Math.abs(c.re(l)), Math.abs(c.im(l))));
        }
        double g = in.maxValue() / peak;
        long[] pi = new long[c.size()];
        long[] pq = new long[c.size()];
        for (int l = 0; l < c.size(); l++) {
            pi[l] = (long) Math.rint(Math.scalb(g * c.re(l), in.fractionalBits()));
            pq[l] = (long) Math.rint(Math.scalb(g * c.im(l), in.fractionalBits()));
        }
        int k = c.bitsPerSymbol();
        long max = Long.MIN_VALUE;
        long min = Long.MAX_VALUE;
        for (long i = in.minCode(); i <= in.maxCode(); i++) {
            for (long q = in.minCode(); q <= in.maxCode(); q++) {
                for (int b = 0; b < k; b++) {
                    long d0 = Long.MAX_VALUE;
                    long d1 = Long.MAX_VALUE;
                    for (int l = 0; l < c.size(); l++) {
                        long d = (i - pi[l]) * (i - pi[l]) + (q - pq[l]) * (q - pq[l]);
                        if (((l >>> (k - 1 - b)) & 1) == 0) {
                            d0 = Math.min(d0, d);
                        } else {
                            d1 = Math.min(d1, d);
                        }
                    }
                    max = Math.max(max, d1 - d0);
                    min = Math.min(min, d1 - d0);
                }
            }
        }
        return new long[] {max, -min};
    }

    @Test
    void metricOverflowsAppearBelowTheRangeTheInputCanReach() {
        String spec = METRIC_SPEC.replace("METRIC", "").replace("SWEEP",
                ", \"sweep\": [{\"parameter\": \"metric-word-length\", \"values\": [3, 4, 5, 6, 7, 8, 9]}]");
        LossAnalysis a = LossFixtures.analyse(spec, 2);
        Design base = a.run().spec().base();
        QFormat in = base.input().format();
        long[] extremes = metricExtremes(base.constellation(), in);
        // A metric stage Qm.0 rounds D (LSB 2^-2f in codes squared) half-even to an integer, then saturates to
        // [-2^m, 2^m - 1]: the fewest integer bits that never overflow follow from the rounded extremes.
        double top = Math.rint(Math.scalb((double) extremes[0], -2 * in.fractionalBits()));
        double bottom = Math.rint(Math.scalb((double) extremes[1], -2 * in.fractionalBits()));
        int needed = 0;
        while ((1L << needed) - 1 < top || (1L << needed) < bottom) {
            needed++;
        }
        System.err.println("16-QAM in Q2.5 at back-off 0 dB: |metric| reaches " + top + "; " + needed
                + " integer bits needed, the kernel's range analysis asks for "
                + a.designs().get(0).range().metricIntegerBitsNoOverflow());
        assertTrue(a.designs().get(0).range().metricIntegerBitsNoOverflow() >= needed,
                "the kernel's range analysis must not ask for fewer integer bits than the input can reach");
        assertTrue(needed >= 4, "the test needs room below the bound, got " + needed);
        long previous = Long.MAX_VALUE;
        int below = 0;
        for (LossAnalysis.SizingRow row : a.sizing().get(0).rows()) {
            LossAnalysis.DesignFigures f = a.designs().get(row.design());
            int integerBits = f.range().stages().metric().format().integerBits();
            // metric-word-length W below the suggested range keeps no fractional bit: Q(W-1).0
            assertEquals(QFormat.signed(Integer.parseInt(row.value()) - 1, 0), f.range().stages().metric().format());
            long events = f.overflows().metric();
            if (integerBits >= needed) {
                assertEquals(0, events, "metric " + f.range().stages().metric().format() + " holds every input");
            } else {
                below++;
                assertTrue(events > 0, "metric " + f.range().stages().metric().format() + " below the bound of "
                        + needed + " integer bits shows overflow events");
                assertTrue(events < previous, "fewer integer bits, more events: " + events + " after " + previous);
                previous = events;
            }
        }
        assertTrue(below >= 2, "at least two stages below the bound were tried");
        // The markdown report shows the per-design range table with the events of the narrowest stage.
        String md = new LossReport(a).markdown();
        LossAnalysis.DesignFigures narrow = a.designs().get(a.sizing().get(0).rows().get(0).design());
        assertTrue(md.contains("| " + narrow.index() + " | Q2.0 | " + narrow.range().metricIntegerBitsNoOverflow()
                + " | " + narrow.overflows().metric() + " ("), md);
    }

    @Test
    void aStageGivenInTheBaseDesignIsTheSweptStage() {
        // demapper.metric {"format": "Q4.0"} and metric-word-length 5 are the same datapath: identical figures.
        String given = METRIC_SPEC.replace("METRIC", ", \"metric\": {\"format\": \"Q4.0\"}").replace("SWEEP", "");
        String swept = METRIC_SPEC.replace("METRIC", "").replace("SWEEP",
                ", \"sweep\": [{\"parameter\": \"metric-word-length\", \"values\": [5]}]");
        LossSpec g = LossSpecReader.parse(given, "given.json");
        LossSpec w = LossSpecReader.parse(swept, "swept.json");
        Design d = w.sweeps().get(0).designs().get(0);
        assertEquals(g.base().describe(), d.describe());
        assertEquals(g.base().llrSpec(g.base().receiveRom(), g.smallestN0()),
                d.llrSpec(d.receiveRom(), w.smallestN0()));
        LossAnalysis a = LossFixtures.analyse(given, 2);
        LossAnalysis b = LossFixtures.analyse(swept, 2);
        LossAnalysis.DesignFigures fa = a.designs().get(0);
        LossAnalysis.DesignFigures fb = b.designs().get(1);
        assertTrue(fa.overflows().metric() > 0);
        assertEquals(fa.overflows(), fb.overflows());
        assertEquals(fa.lossGmiDb(), fb.lossGmiDb());
        assertEquals(fa.points().get(1).fixedGmi(), fb.points().get(1).fixedGmi());
        // The base's range sentence no longer claims that its metric cannot overflow.
        String md = new LossReport(a).markdown();
        assertTrue(md.contains("Range analysis: metric stage Q4.0 (signed, 5-bit word, 0 fractional bits, range [-16,"
                + " 15], LSB 1) has fewer integer bits than the " + fa.range().metricIntegerBitsNoOverflow()
                + " with which no input code can overflow it;"), md);
    }

    @Test
    void stageWordLengthsFollowTheDocumentedTable() {
        // The table of SweepParameter's documentation, row by row.
        QFormat metric = QFormat.parse("Q6.18");
        QFormat k = QFormat.parse("UQ3.13");
        assertEquals(QFormat.parse("Q6.18"), SweepParameter.stageWord(metric, 25));
        assertEquals(QFormat.parse("Q6.5"), SweepParameter.stageWord(metric, 12));
        assertEquals(QFormat.parse("Q6.0"), SweepParameter.stageWord(metric, 7));
        assertEquals(QFormat.parse("Q4.0"), SweepParameter.stageWord(metric, 5));
        assertEquals(QFormat.parse("Q6.25"), SweepParameter.stageWord(metric, 32));
        assertEquals(QFormat.parse("UQ3.5"), SweepParameter.stageWord(k, 8));
        assertEquals(QFormat.parse("UQ2.0"), SweepParameter.stageWord(k, 2));
        for (int w = 2; w <= 32; w++) {
            assertEquals(w, SweepParameter.stageWord(metric, w).wordLength());
            assertEquals(w, SweepParameter.stageWord(k, w).wordLength());
        }
    }

    @Test
    void scaleStagesAreSweptFromTheDesignsOwnStages() {
        String spec = METRIC_SPEC.replace("METRIC", "").replace("SWEEP",
                ", \"sweep\": [{\"parameter\": \"scale-constant-word-length\", \"values\": [10, 16, 20]},"
                        + " {\"parameter\": \"scale-word-length\", \"values\": [6, 12, 16]}]");
        LossSpec s = LossSpecReader.parse(spec, "test.json");
        Design base = s.base();
        var suggested = base.llrSpec(base.receiveRom(), s.smallestN0());
        // The value equal to the suggestion is the base design itself (one design, simulated once).
        assertSame(base, s.sweeps().get(0).designs().get(1), "K's suggested word is 16 bits");
        for (int i = 0; i < 3; i++) {
            Design k = s.sweeps().get(0).designs().get(i);
            int w = Integer.parseInt(s.sweeps().get(0).values().get(i));
            QFormat f = k.llrSpec(k.receiveRom(), s.smallestN0()).scaleConstant();
            assertEquals(w, f.wordLength());
            assertEquals(suggested.scaleConstant().integerBits(), f.integerBits());
            Design p = s.sweeps().get(1).designs().get(i);
            QFormat sf = p.llrSpec(p.receiveRom(), s.smallestN0()).scale().format();
            w = Integer.parseInt(s.sweeps().get(1).values().get(i));
            assertEquals(w, sf.wordLength());
            assertEquals(Math.min(w - 1, suggested.scale().format().integerBits()), sf.integerBits());
        }
    }
}
