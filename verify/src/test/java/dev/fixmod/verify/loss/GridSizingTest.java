package dev.fixmod.verify.loss;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Two-parameter grids: every combination is the design the one-parameter path builds for it (so its loss is the one
 * a one-parameter sweep around that design measures, on the same noise), and the recommendation is the cheapest
 * combination within the budget: fewest bits, then least loss.
 */
class GridSizingTest {

    /** A small Gray 16-QAM case; INPUT is the input format, SWEEP the sweep list. */
    static final String SPEC = "{\"constellation\": \"qam16\","
            + " \"demapper\": {\"input\": {\"format\": \"INPUT\"}, \"llr\": {\"format\": \"Q3.1\"}},"
            + " \"noise\": {\"eb-n0-db\": [2, 4, 6, 8], \"seed\": 5},"
            + " \"simulation\": {\"target-errors\": 1, \"min-bits\": 16384, \"max-bits\": 16384,"
            + " \"chunk-symbols\": 1024},"
            + " \"targets\": {\"ber\": 0.02, \"gmi\": 3.0, \"loss-budget-db\": 0.35}, \"sweep\": [SWEEP]}";

    static final List<String> INPUT_WORDS = List.of("5", "6", "8");
    static final List<String> LLR_WORDS = List.of("4", "5", "6");

    @Test
    void theGridsChoiceIsTheCheapestOfTheOneParameterSweepsLosses() {
        String grid = "{\"grid\": [{\"parameter\": \"input-word-length\", \"values\": [5, 6, 8]},"
                + " {\"parameter\": \"llr-word-length\", \"values\": [4, 5, 6]}]}";
        LossAnalysis a = LossFixtures.analyse(SPEC.replace("INPUT", "Q2.5").replace("SWEEP", grid), 2);
        LossAnalysis.GridSizing g = a.grids().get(0);
        assertEquals(List.of("input-word-length", "llr-word-length"), g.parameters());
        assertEquals(9, g.rows().size());
        // The same combinations measured the established way: one run per input format (integer bits 2 kept),
        // each sweeping the LLR word length around it.
        double budget = a.run().spec().targets().budgetDb();
        int expected = -1;
        double expectedLoss = Double.NaN;
        int expectedBits = Integer.MAX_VALUE;
        for (int i = 0; i < INPUT_WORDS.size(); i++) {
            int w = Integer.parseInt(INPUT_WORDS.get(i));
            String sweep = "{\"parameter\": \"llr-word-length\", \"values\": [4, 5, 6]}";
            LossAnalysis one = LossFixtures.analyse(SPEC.replace("INPUT", "Q2." + (w - 3)).replace("SWEEP", sweep), 2);
            List<LossAnalysis.SizingRow> rows = one.sizing().get(0).rows();
            for (int j = 0; j < LLR_WORDS.size(); j++) {
                LossAnalysis.GridRow cell = g.rows().get(i * LLR_WORDS.size() + j);
                assertEquals(List.of(INPUT_WORDS.get(i), LLR_WORDS.get(j)), cell.values());
                assertEquals(rows.get(j).lossGmiDb(), cell.lossGmiDb(), "GMI loss of " + cell.values());
                assertEquals(rows.get(j).lossBerDb(), cell.lossBerDb(), "BER loss of " + cell.values());
                int bits = w + Integer.parseInt(LLR_WORDS.get(j));
                assertEquals(bits, cell.bits());
                double loss = rows.get(j).lossGmiDb();
                boolean within = Double.isFinite(loss) && loss <= budget;
                assertEquals(within, cell.withinBudget(), cell.values().toString());
                if (within && (bits < expectedBits || (bits == expectedBits && loss < expectedLoss))) {
                    expected = i * LLR_WORDS.size() + j;
                    expectedBits = bits;
                    expectedLoss = loss;
                }
            }
        }
        System.err.println("16-QAM grid input-word-length x llr-word-length: choose " + g.rows().get(g.chosen())
                .values() + ", " + expectedBits + " bits, GMI loss " + expectedLoss + " dB");
        assertTrue(expected >= 0, "the case has a combination within the budget");
        assertEquals(expected, g.chosen());
        // The choice is not the largest combination: the grid saves bits over the widest design.
        assertTrue(expectedBits < 8 + 6, "expected a cheaper choice than the widest, got " + expectedBits);
        String md = new LossReport(a).markdown();
        assertTrue(md.contains("### grid input-word-length × llr-word-length: choose input-word-length = "
                + g.rows().get(expected).values().get(0) + ", llr-word-length = " + g.rows().get(expected).values()
                .get(1)), md);
        String csv = new LossReport(a).sizingCsv();
        assertEquals(1 + 9, csv.split("\n").length, csv);
        assertTrue(csv.contains("\ngrid,input-word-length," + g.rows().get(expected).values().get(0)
                + ",llr-word-length," + g.rows().get(expected).values().get(1) + ","), csv);
    }

    @Test
    void combinationsSharedWithSweepsAreOneDesignAndTheAxesOrderDoesNotMatter() {
        String sweeps = "{\"parameter\": \"input-word-length\", \"values\": [5, 8]},"
                + " {\"grid\": [{\"parameter\": \"metric-word-length\", \"values\": [8, 12]},"
                + " {\"parameter\": \"input-word-length\", \"values\": [5, 8]}]},"
                + " {\"grid\": [{\"parameter\": \"input-word-length\", \"values\": [5, 8]},"
                + " {\"parameter\": \"metric-word-length\", \"values\": [8, 12]}]}";
        LossSpec s = LossSpecReader.parse(SPEC.replace("INPUT", "Q2.5").replace("SWEEP", sweeps), "test.json");
        LossRun run = new LossRun(s);
        LossSpec.Grid stageFirst = s.grids().get(0);
        LossSpec.Grid stageLast = s.grids().get(1);
        for (int i = 0; i < 2; i++) {
            for (int j = 0; j < 2; j++) {
                // the stage is sized last in both: for the combination's input format
                assertEquals(stageFirst.designs().get(i * 2 + j), stageLast.designs().get(j * 2 + i));
            }
        }
        // base + input 5 (8 is the base) + 4 combinations, each listed once although the grids repeat them
        assertEquals(1 + 1 + 4, run.designs().size());
        assertEquals(6 * 4, run.pointCount());
    }

    @Test
    void aGridOfOnlyOneWidthAndASettingPicksTheLeastLossAmongTheCheapest() {
        String grid = "{\"grid\": [{\"parameter\": \"llr-scale\", \"values\": [0.5, 1, 2]},"
                + " {\"parameter\": \"llr-word-length\", \"values\": [4, 5]}]}";
        LossAnalysis a = LossFixtures.analyse(SPEC.replace("INPUT", "Q2.7").replace("SWEEP", grid), 2);
        LossAnalysis.GridSizing g = a.grids().get(0);
        assertTrue(g.chosen() >= 0, g.reason());
        LossAnalysis.GridRow chosen = g.rows().get(g.chosen());
        for (LossAnalysis.GridRow r : g.rows()) {
            // the LLR scale sets no width: the cost is the LLR word alone
            assertEquals(Integer.parseInt(r.values().get(1)), r.bits());
            if (r.withinBudget()) {
                assertTrue(chosen.bits() <= r.bits(), chosen + " vs " + r);
                if (r.bits() == chosen.bits()) {
                    assertTrue(chosen.lossGmiDb() <= r.lossGmiDb(), chosen + " vs " + r);
                }
            }
        }
    }
}
