package dev.fixmod.map;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.constellation.Constellations;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import java.math.BigDecimal;
import java.math.RoundingMode;
import org.junit.jupiter.api.Test;

class FixedGainTest {
    private static final Quantizer COEFFICIENT = new Quantizer(QFormat.parse("Q15"), Rounding.HALF_EVEN,
            Overflow.SATURATE);
    private static final Quantizer OUT_Q15 = new Quantizer(QFormat.parse("Q15"), Rounding.HALF_UP, Overflow.SATURATE);

    @Test
    void kModOfSixteenQamOnTheIntegerGrid() {
        // IEEE 802.11-2020 §17.3.5.8: 16-QAM points on ±1, ±3 are multiplied by K_MOD = 1/√10 (from memory).
        FixedGain gain = new FixedGain(1 / StrictMath.sqrt(10), COEFFICIENT, QFormat.parse("Q2.0"), OUT_Q15);
        assertEquals(10362, gain.coefficientCode());
        OverflowCounter counter = new OverflowCounter("gain");
        assertEquals(10362, gain.apply(1, counter));
        assertEquals(31086, gain.apply(3, counter));
        assertEquals(-31086, gain.apply(-3, counter));
        assertEquals(0, counter.events());
        assertEquals(-32768, gain.apply(-4, counter));
        assertEquals(1, counter.events());
        // Residual error of the constant: 20·log10(10362/32768 · √10), computed independently with BigDecimal.
        double ratio = new BigDecimal(10362).divide(new BigDecimal(32768)).doubleValue() * StrictMath.sqrt(10);
        assertEquals(20 * Math.log10(ratio), gain.gainErrorDb(), 1e-12);
        assertTrue(gain.gainErrorDb() < 0 && gain.gainErrorDb() > -0.0002);
    }

    @Test
    void theProductIsRoundedByTheOutputQuantizer() {
        // 0.3 in Q15 = 9830 (half-even of 9830.4); 5 · 9830 = 49150 in 2^-15 units, into Q3.4: 49150 / 2^11 = 23.999
        FixedGain gain = new FixedGain(0.3, COEFFICIENT, QFormat.parse("Q3.0"),
                new Quantizer(QFormat.parse("Q3.4"), Rounding.FLOOR, Overflow.SATURATE));
        OverflowCounter counter = OverflowCounter.unnamed();
        long oracle = BigDecimal.valueOf(5L * 9830).divide(BigDecimal.valueOf(1 << 11), 0, RoundingMode.FLOOR)
                .longValueExact();
        assertEquals(oracle, gain.apply(5, counter));
        long negative = BigDecimal.valueOf(-5L * 9830).divide(BigDecimal.valueOf(1 << 11), 0, RoundingMode.FLOOR)
                .longValueExact();
        assertEquals(-24, negative);
        assertEquals(negative, gain.apply(-5, counter));
        assertEquals(0, counter.events());
    }

    @Test
    void mapperFollowedByGainCostsBoth() {
        ConstellationRom grid = ConstellationRom.of(Constellations.qam(16, true),
                new Quantizer(QFormat.parse("Q2.0"), Rounding.HALF_EVEN, Overflow.SATURATE));
        FixedGain gain = new FixedGain(1 / StrictMath.sqrt(10), COEFFICIENT, grid.format(), OUT_Q15);
        // Exact product into Q15: no rounding add; saturation: two compares per code.
        assertEquals(new DatapathCost(2, 0, 4, 16 * 2 * 3 + 16), new FixedMapper(grid).cost().plus(gain.cost()));
        FixedGain half = new FixedGain(0.5, COEFFICIENT, grid.format(), OUT_Q15);
        assertEquals(0, half.cost().multiplies(), "a power of two is a shift");
    }

    @Test
    void batchChecksCodesAndRegionsFirst() {
        FixedGain gain = new FixedGain(0.5, COEFFICIENT, QFormat.parse("Q2.0"), OUT_Q15);
        int[] out = {9, 9};
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> gain.apply(new int[] {1, 4}, new int[] {0, 0}, 0, 2, out, out, 0, OverflowCounter.unnamed()));
        assertEquals("input I: code 4 at index 1 is outside Q2.0 (codes -4 .. 3)", e.getMessage());
        assertThrows(IllegalArgumentException.class,
                () -> gain.apply(new int[] {1, 2}, new int[] {0}, 0, 2, out, out, 0, OverflowCounter.unnamed()));
        assertArrayEquals(new int[] {9, 9}, out);
    }

    @Test
    void unusableConstantsAreRefused() {
        QFormat in = QFormat.parse("Q2.0");
        IllegalArgumentException big = assertThrows(IllegalArgumentException.class,
                () -> new FixedGain(1.5, COEFFICIENT, in, OUT_Q15));
        assertTrue(big.getMessage().contains("does not fit the coefficient format"), big.getMessage());
        IllegalArgumentException tiny = assertThrows(IllegalArgumentException.class,
                () -> new FixedGain(1e-6, COEFFICIENT, in, OUT_Q15));
        assertTrue(tiny.getMessage().contains("quantizes to 0"), tiny.getMessage());
        assertThrows(IllegalArgumentException.class, () -> new FixedGain(-0.5, COEFFICIENT, in, OUT_Q15));
        assertThrows(IllegalArgumentException.class, () -> new FixedGain(Double.NaN, COEFFICIENT, in, OUT_Q15));
    }
}
