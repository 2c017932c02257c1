package dev.fixmod.demap;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Constellations;
import dev.fixmod.constellation.Normalization;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import dev.fixmod.map.ConstellationRom;
import dev.fixmod.testing.IntegerOnlyBytecode;
import java.util.Arrays;
import org.junit.jupiter.api.Test;

class FixedSoftDemapperTest {
    /** 16-QAM on the grid ±1, ±3 in Q3.4 (codes −128 … 127, LSB 1/16): levels are exact codes ±16, ±48. */
    private static final ConstellationRom GRID16 = ConstellationRom.of(Constellations.qam(16, true),
            new Quantizer(QFormat.signed(3, 4), Rounding.HALF_EVEN, Overflow.SATURATE));
    private static final LlrOptions N0_HALF = LlrOptions.of(0.5);
    private static final Quantizer OUT = new Quantizer(QFormat.signed(5, 1), Rounding.HALF_EVEN,
            Overflow.SYMMETRIC_SATURATE);

    private static FixedLlrSpec lossless(SoftAlgorithm algorithm, ConstellationRom rom, LlrOptions o) {
        return FixedLlrSpec.suggested(algorithm, rom, o, OUT.format());
    }

    @Test
    void thePerSampleMethodsAreIntegerOnly() {
        // DESIGN.md: the fixed-point per-sample path performs no floating-point operation; calls into the kernel
        // (Quantizer.fit, Rounding, Overflow) are followed by the checker.
        IntegerOnlyBytecode.assertIntegerOnly(FixedSoftDemapper.class, "llr", "compute", "finish");
        IntegerOnlyBytecode.assertIntegerOnly(FixedPerAxisMaxLogDemapper.class, "prepare", "metric");
        IntegerOnlyBytecode.assertIntegerOnly(FixedMaxLogDemapper.class, "prepare", "metric", "nearest");
        IntegerOnlyBytecode.assertIntegerOnly(FixedFoldedLinearDemapper.class, "prepare", "metric", "fold");
        IntegerOnlyBytecode.assertIntegerOnly(AxisSegments.class, "segmentOfCode");
        // The check can fail: the construction-time scale constant is a double.
        assertFalse(IntegerOnlyBytecode.floatingPointUses(FixedSoftDemapper.class, "scaleConstant").isEmpty());
    }

    @Test
    void aWorkedExampleOnTheOddGrid() {
        // Per axis, first bit of Gray 16-QAM: L = -8(y - 1)/N0 for y > 2 (MaxLogClosedFormTest); y = 2.5 (code 40),
        // N0 = 0.5: L = -24, i.e. -48 in Q5.1, inside the range. Second bit: 4(|y| - 2)/N0 = 4. Q axis y = -0.25:
        // first bit -4y/N0 = 2, second 4(0.25 - 2)/N0 = -14. K = 2 is exact in the suggested UQ2.14.
        for (SoftAlgorithm a : new SoftAlgorithm[] {SoftAlgorithm.MAX_LOG, SoftAlgorithm.MAX_LOG_PER_AXIS}) {
            FixedSoftDemapper d = FixedSoftDemapper.create(a, GRID16, N0_HALF, lossless(a, GRID16, N0_HALF));
            int[] llr = new int[4];
            d.llr(40, -4, llr, 0);
            assertArrayEquals(new int[] {-48, 8, 4, -28}, llr, a.tradeName());
            FixedLlrTrace.Bit first = d.trace(40, -4).bits().get(0);
            assertEquals(-24.0, first.value("scale").real(), 0.0);
        }
        // Folded-linear: the sign bit is -(4A/N0)·y = -20 beyond 2A (max-log says -24), the others agree.
        FixedSoftDemapper folded = new FixedFoldedLinearDemapper(GRID16, N0_HALF,
                lossless(SoftAlgorithm.FOLDED_LINEAR, GRID16, N0_HALF));
        int[] llr = new int[4];
        folded.llr(40, -4, llr, 0);
        assertArrayEquals(new int[] {-40, 8, 4, -28}, llr);
        FixedLlrTrace.Bit second = folded.trace(40, -4).bits().get(1);
        assertEquals(2.0 - 2.5, second.value("fold1").real(), 0.0); // 2A − |y|
    }

    @Test
    void everyStageCountsItsOverflowEvents() {
        // A 4-bit integer output (codes −7 … 7 with symmetric saturation) holds 4 and 2 but not −24, −14 (first
        // sample) nor −16, −16 (second sample, at the origin: 4(0 − 2)/N0 on both second bits): four events.
        Quantizer narrow = new Quantizer(QFormat.signed(3, 0), Rounding.HALF_EVEN, Overflow.SYMMETRIC_SATURATE);
        FixedLlrSpec spec = lossless(SoftAlgorithm.MAX_LOG_PER_AXIS, GRID16, N0_HALF).withOutput(narrow);
        FixedSoftDemapper d = new FixedPerAxisMaxLogDemapper(GRID16, N0_HALF, spec);
        int[] llr = new int[8];
        d.llr(new int[] {40, 0}, new int[] {-4, 0}, 0, 2, llr, 0);
        assertArrayEquals(new int[] {-7, 4, 2, -7, 0, -7, 0, -7}, llr);
        assertEquals(0, d.counters().get(0).events());
        assertEquals(4, d.counters().get(2).events());
        assertEquals("llr-output", d.counters().get(2).stage());
        assertTrue(d.trace(40, -4).bits().get(0).value("output").overflowed());
        d.resetCounters();
        assertEquals(0, d.counters().get(2).events());
        // A metric stage of 4 bits (Q2.1: −4 … 3.5) clips D = N0·L = −12 and −7 (first and last bit), not 2 and 1.
        FixedLlrSpec tight = new FixedLlrSpec(Rounding.HALF_EVEN,
                new Quantizer(QFormat.signed(2, 1), Rounding.HALF_EVEN, Overflow.SATURATE), LlrScaling.NOISE_SCALED,
                spec.scaleConstant(), spec.scale(), OUT);
        FixedSoftDemapper m = new FixedMaxLogDemapper(GRID16, N0_HALF, tight);
        m.llr(40, -4, llr, 0);
        assertEquals(2, m.counters().get(0).events());
        assertEquals(-16, llr[0]); // the clipped metric −4 times K = 2: −8 nats, code −16 in Q5.1
        assertEquals(-16, llr[3]);
    }

    @Test
    void badCodesAndArraysAreRefusedAndNothingIsWritten() {
        FixedSoftDemapper d = new FixedMaxLogDemapper(GRID16, N0_HALF, lossless(SoftAlgorithm.MAX_LOG, GRID16, N0_HALF));
        int[] out = new int[8];
        Arrays.fill(out, 99);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> d.llr(new int[] {0, 200}, new int[] {0, 0}, 0, 2, out, 0));
        assertEquals("received I code 200 at index 1 is outside Q3.4 (codes -128 … 127)", e.getMessage());
        int[] untouched = new int[8];
        Arrays.fill(untouched, 99);
        assertArrayEquals(untouched, out);
        e = assertThrows(IllegalArgumentException.class, () -> d.llr(new int[2], new int[1], 0, 2, out, 0));
        assertEquals("Q codes: offset 0 and count 2 do not fit an array of length 1", e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> d.llr(new int[2], null, 0, 2, out, 0));
        assertTrue(e.getMessage().startsWith("Q code array is missing"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> d.llr(0, 0, new int[3], 0));
        assertTrue(e.getMessage().startsWith("LLR output: 1 samples of 4 LLR codes"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> d.trace(0, -129));
    }

    @Test
    void formatsTooNarrowOrInconsistentAreRefusedWithTheReason() {
        // The ROM refuses an input format that cannot hold the levels (map's ConstellationRom).
        assertThrows(IllegalArgumentException.class, () -> ConstellationRom.of(Constellations.qam(16, true),
                new Quantizer(QFormat.signed(0, 7), Rounding.HALF_EVEN, Overflow.SATURATE)));
        // Wider than 30 bits: squared distances would not be exact.
        ConstellationRom wide = ConstellationRom.normalized(Constellations.qam(16, true), Normalization.UNIT_ENERGY,
                new Quantizer(QFormat.signed(1, 30), Rounding.HALF_EVEN, Overflow.SATURATE));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> new FixedMaxLogDemapper(wide, N0_HALF, lossless(SoftAlgorithm.MAX_LOG, GRID16, N0_HALF)));
        assertTrue(e.getMessage().contains("at most 30"), e.getMessage());
        // K = 2 does not fit UQ0.8.
        FixedLlrSpec base = lossless(SoftAlgorithm.MAX_LOG, GRID16, N0_HALF);
        FixedLlrSpec smallK = new FixedLlrSpec(Rounding.HALF_EVEN, base.metric(), LlrScaling.NOISE_SCALED,
                QFormat.unsigned(0, 8), base.scale(), OUT);
        e = assertThrows(IllegalArgumentException.class, () -> new FixedMaxLogDemapper(GRID16, N0_HALF, smallK));
        assertTrue(e.getMessage().startsWith("scale constant K = 2.0 does not fit UQ0.8"), e.getMessage());
        // K = 1/1000 rounds to 0 in UQ2.6.
        FixedLlrSpec coarseK = new FixedLlrSpec(Rounding.HALF_EVEN, base.metric(), LlrScaling.NOISE_SCALED,
                QFormat.unsigned(2, 6), base.scale(), OUT);
        e = assertThrows(IllegalArgumentException.class,
                () -> new FixedMaxLogDemapper(GRID16, LlrOptions.of(1000), coarseK));
        assertTrue(e.getMessage().contains("rounds to 0"), e.getMessage());
        // A metric format that cannot hold the fold constant 2A = 2.
        FixedLlrSpec tinyMetric = new FixedLlrSpec(Rounding.HALF_EVEN,
                new Quantizer(QFormat.signed(0, 4), Rounding.HALF_EVEN, Overflow.SATURATE), LlrScaling.NOISE_SCALED,
                QFormat.unsigned(4, 8), base.scale(), OUT);
        e = assertThrows(IllegalArgumentException.class,
                () -> new FixedFoldedLinearDemapper(GRID16, N0_HALF, tinyMetric));
        assertTrue(e.getMessage().contains("too narrow for the fold constant 2.0"), e.getMessage());
        // Spec consistency.
        assertThrows(IllegalArgumentException.class, () -> new FixedLlrSpec(Rounding.HALF_EVEN, base.metric(),
                LlrScaling.UNSCALED, base.scaleConstant(), base.scale(), OUT));
        assertThrows(IllegalArgumentException.class, () -> new FixedLlrSpec(Rounding.HALF_EVEN, base.metric(),
                LlrScaling.NOISE_SCALED, null, null, OUT));
        assertThrows(IllegalArgumentException.class, () -> FixedLlrSpec.unscaled(Rounding.HALF_EVEN, base.metric(),
                new Quantizer(QFormat.unsigned(4, 0), Rounding.HALF_EVEN, Overflow.SATURATE)));
        e = assertThrows(IllegalArgumentException.class,
                () -> FixedSoftDemapper.create(SoftAlgorithm.LOG_MAP, GRID16, N0_HALF, base));
        assertTrue(e.getMessage().startsWith("log-map has no fixed-point datapath"), e.getMessage());
        Constellation psk = Constellations.psk(8, 0.0, true);
        ConstellationRom pskRom = ConstellationRom.of(psk,
                new Quantizer(QFormat.signed(1, 10), Rounding.HALF_EVEN, Overflow.SATURATE));
        e = assertThrows(IllegalArgumentException.class, () -> new FixedPerAxisMaxLogDemapper(pskRom, N0_HALF, base));
        assertTrue(e.getMessage().contains("needs a separable constellation"), e.getMessage());
        new FixedMaxLogDemapper(pskRom, N0_HALF, lossless(SoftAlgorithm.MAX_LOG, pskRom, N0_HALF)); // any: fine
    }

    @Test
    void thePerAxisTableIsSmallerThanTheExhaustiveSearch() {
        for (int m : new int[] {16, 64, 256}) {
            ConstellationRom rom = ConstellationRom.normalized(Constellations.qam(m, true), Normalization.UNIT_ENERGY,
                    new Quantizer(QFormat.signed(2, 9), Rounding.HALF_EVEN, Overflow.SATURATE));
            FixedSoftDemapper perAxis = new FixedPerAxisMaxLogDemapper(rom, N0_HALF,
                    lossless(SoftAlgorithm.MAX_LOG_PER_AXIS, rom, N0_HALF));
            FixedSoftDemapper exhaustive = new FixedMaxLogDemapper(rom, N0_HALF,
                    lossless(SoftAlgorithm.MAX_LOG, rom, N0_HALF));
            assertTrue(perAxis.cost().multiplies() < exhaustive.cost().multiplies(), "M = " + m);
            assertTrue(perAxis.cost().compares() < exhaustive.cost().compares(), "M = " + m);
            // The exhaustive table is the ROM: M points × 2 coordinates × 12 bits, plus the 16-bit K.
            assertEquals(2L * m * 12 + 16, exhaustive.cost().tableBits());
        }
    }

    /**
     * Regression: a K one ulp below a power of two (1/N0 = 0.9999999999999998 and its kin) rounds up to the power
     * itself, one code past a format sized by K's integer part; the suggestion must widen K's format by one integer
     * bit there, and everywhere hold the rounded K.
     */
    @Test
    void theSuggestedScaleConstantHoldsKJustBelowAPowerOfTwo() {
        for (int p = -3; p <= 6; p++) {
            // N0 one ulp above 2^-p: K = 1/N0 falls an ulp or two below 2^p (p = 0 gives the case that failed).
            double n0 = Math.nextUp(Math.scalb(1.0, -p));
            double k = 1.0 / n0;
            assertTrue(k < Math.scalb(1.0, p) && k > Math.scalb(1.0 - 1e-15, p), "K = " + k);
            FixedLlrSpec spec = lossless(SoftAlgorithm.MAX_LOG, GRID16, LlrOptions.of(n0));
            QFormat kFormat = spec.scaleConstant();
            double rounded = Rounding.HALF_EVEN.roundToIntegral(Math.scalb(k, kFormat.fractionalBits()));
            assertTrue(rounded <= kFormat.maxCode(), "K = " + k + " rounds to code " + rounded + ", past "
                    + kFormat.describe());
            assertEquals(16, kFormat.wordLength(), "K stays a 16-bit constant: " + kFormat.describe());
        }
    }
}
