package dev.fixmod.map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class DatapathCostTest {
    @Test
    void stagesInSeriesAddUp() {
        // The examples of the DatapathCost javadoc: a 16-point ROM of 12-bit I/Q codes, then a 16-bit gain.
        DatapathCost rom = new DatapathCost(0, 0, 0, 16 * 2 * 12);
        DatapathCost gain = new DatapathCost(2, 2, 4, 16);
        assertEquals(new DatapathCost(2, 2, 4, 400), rom.plus(gain));
        assertEquals(rom, rom.plus(DatapathCost.ZERO));
    }

    @Test
    void repetitionScalesOperationsButSharesTables() {
        DatapathCost distance = new DatapathCost(2, 3, 1, 384);
        assertEquals(new DatapathCost(32, 48, 16, 384), distance.repeated(16));
        assertEquals(new DatapathCost(0, 0, 0, 384), distance.repeated(0));
    }

    @Test
    void negativeCountsAreRefused() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> new DatapathCost(0, -1, 0, 0));
        assertTrue(e.getMessage().contains("-1 adds"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> DatapathCost.ZERO.repeated(-2));
    }
}
