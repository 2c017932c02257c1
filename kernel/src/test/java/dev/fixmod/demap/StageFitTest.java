package dev.fixmod.demap;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import dev.fixmod.testing.IntegerOnlyBytecode;
import org.junit.jupiter.api.Test;

class StageFitTest {

    @Test
    void thePerSampleFitIsIntegerOnly() {
        IntegerOnlyBytecode.assertIntegerOnly(StageFit.class, "fit");
    }

    @Test
    void roundsTiesAsEachModeSays() {
        // Q3.0 from 2 fractional bits: codes 10, 9, -10, -9 are 2.5, 2.25, -2.5, -2.25 (common practice, no source:
        // the rounding table of the fixed package's Rounding documentation).
        long[] values = {10, 9, -10, -9};
        long[][] expected = {
                {2, 2, -3, -3},   // floor
                {3, 3, -2, -2},   // ceil
                {2, 2, -2, -2},   // toward-zero
                {3, 2, -2, -2},   // half-up
                {3, 2, -3, -2},   // half-away
                {2, 2, -2, -2},   // half-even
        };
        Rounding[] modes = {Rounding.FLOOR, Rounding.CEIL, Rounding.TOWARD_ZERO, Rounding.HALF_UP, Rounding.HALF_AWAY,
                Rounding.HALF_EVEN};
        for (int m = 0; m < modes.length; m++) {
            StageFit fit = new StageFit(new Quantizer(QFormat.signed(3, 0), modes[m], Overflow.SATURATE), 2);
            for (int v = 0; v < values.length; v++) {
                assertEquals(expected[m][v], fit.fit(values[v], OverflowCounter.unnamed()),
                        modes[m] + " of " + values[v] + "/4");
            }
        }
    }

    @Test
    void countsEachSaturation() {
        OverflowCounter counter = OverflowCounter.unnamed();
        StageFit fit = new StageFit(new Quantizer(QFormat.signed(3, 0), Rounding.HALF_EVEN, Overflow.SYMMETRIC_SATURATE),
                0);
        assertEquals(7, fit.fit(100, counter));
        assertEquals(-7, fit.fit(-8, counter));
        assertEquals(-7, fit.fit(-7, counter));
        assertEquals(2, counter.events());
    }
}
