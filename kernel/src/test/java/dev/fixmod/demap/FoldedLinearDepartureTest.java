package dev.fixmod.demap;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Constellations;
import dev.fixmod.constellation.Normalization;
import org.junit.jupiter.api.Test;

/**
 * Recomputes the departure table of {@link FoldedLinearDemapper}'s documentation from the per-axis max-log closed
 * form (itself checked against the literature in {@link MaxLogClosedFormTest}): shortfall
 * {@code |max-log| − |folded|} in units of {@code 4A²/N0}, as a function of {@code u = |y|/A}.
 */
class FoldedLinearDepartureTest {

    /** {levels, fold, u, shortfall} rows taken from the documented table. */
    private static final double[][] TABLE = {
        {4, 0, 2, 0}, {4, 0, 3, 1}, {4, 0, 10, 8}, {4, 1, 0, 0}, {4, 1, 3, 0}, {4, 1, 20, 0},
        {8, 0, 2, 0}, {8, 0, 7, 9}, {8, 0, 10, 18}, {8, 1, 0, 2}, {8, 1, 2, 0}, {8, 1, 6, 0}, {8, 1, 7, 1},
        {8, 1, 10, 4}, {8, 2, 0, 0}, {8, 2, 7, 0}, {8, 2, 30, 0},
        {16, 0, 2, 0}, {16, 0, 15, 49}, {16, 0, 20, 84}, {16, 1, 0, 12}, {16, 1, 6, 0}, {16, 1, 10, 0},
        {16, 1, 15, 9}, {16, 1, 20, 24}, {16, 2, 0, 2}, {16, 2, 2, 0}, {16, 2, 6, 0}, {16, 2, 8, 2},
        {16, 2, 10, 0}, {16, 2, 14, 0}, {16, 2, 15, 1}, {16, 2, 20, 6}, {16, 3, 0, 0}, {16, 3, 15, 0},
    };

    @Test
    void theDocumentedDepartureTableHolds() {
        double n0 = 0.37;
        for (double[] row : TABLE) {
            int levels = (int) row[0];
            Constellation c = Constellations.qam(levels * levels, true).normalized(Normalization.UNIT_ENERGY);
            double a = minimumMagnitude(c.axes().iLevels()); // the inner level is A
            LlrOptions options = LlrOptions.of(n0);
            double[] ml = new double[c.bitsPerSymbol()];
            double[] fl = new double[c.bitsPerSymbol()];
            for (double sign : new double[] {1, -1}) {
                double y = sign * row[2] * a;
                new PerAxisMaxLogDemapper(c, options).llr(y, 0.0, ml, 0);
                new FoldedLinearDemapper(c, options).llr(y, 0.0, fl, 0);
                int bit = (int) row[1]; // fixmod's Gray QAM: I bit j of the axis is fold j
                double unit = 4 * a * a / n0;
                double shortfall = (Math.abs(ml[bit]) - Math.abs(fl[bit])) / unit;
                assertEquals(row[3], shortfall, 1e-9, levels + " levels, fold " + bit + ", u = " + row[2] * sign);
                assertTrue(ml[bit] * fl[bit] >= 0, "same sign");
            }
        }
    }

    private static double minimumMagnitude(double[] levels) {
        double min = Double.POSITIVE_INFINITY;
        for (double l : levels) {
            min = Math.min(min, Math.abs(l));
        }
        return min;
    }
}
