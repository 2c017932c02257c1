package dev.fixmod.demap;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.fixmod.constellation.Catalogue;
import dev.fixmod.constellation.Constellations;
import dev.fixmod.constellation.Labeling;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import dev.fixmod.map.ConstellationRom;
import dev.fixmod.map.DatapathCost;
import org.junit.jupiter.api.Test;

/** The operation counts of each slicer, derived by hand from the datapaths their documentation describes. */
class SlicerCostTest {
    private static final Quantizer Q2_5 = new Quantizer(QFormat.parse("Q2.5"), Rounding.HALF_EVEN, Overflow.SATURATE);

    @Test
    void perAxisSixteenQam() {
        // Two binary searches over 4 levels (2 compares each); 3 + 3 thresholds of 8 bits, 4 + 4 sub-labels of 2 bits.
        FixedSlicer slicer = new FixedAxisSlicer(ConstellationRom.of(Catalogue.resolve("qam16"), Q2_5));
        assertEquals(new DatapathCost(0, 0, 4, 6 * 8 + 8 * 2), slicer.cost());
    }

    @Test
    void nearestPointSixteenQam() {
        // Per point 2 squarings, 2 subtractions and an addition; 15 compares; the ROM (16 × 2 × 8) and 16 labels × 4.
        FixedSlicer slicer = new FixedNearestSlicer(ConstellationRom.of(Catalogue.resolve("qam16"), Q2_5));
        assertEquals(new DatapathCost(32, 48, 15, 256 + 64), slicer.cost());
    }

    @Test
    void sectorEightPskOnTheAxesAndDiagonalsNeedsNoMultiplier() {
        // Points at 22.5° + n·45°: boundaries at 0°, 45°, …: the root tests the I axis (Q ≥ 0), then the Q axis, then
        // a diagonal (I ± Q: one addition); slopes 0 and ±1 are wiring. 4 lines × 16-bit slopes + 8 labels × 3 bits.
        FixedSlicer aligned = new FixedSectorSlicer(Constellations.pskDegrees(8, 22.5, Labeling.GRAY),
                QFormat.parse("Q1.14"), Slicers.DEFAULT_SECTOR_COEFFICIENTS);
        assertEquals(new DatapathCost(0, 1, 3, 4 * 16 + 8 * 3), aligned.cost());
        // Points at n·45°: every boundary has the slope tan(22.5°) or its inverse: one multiplication per test.
        FixedSlicer offset = new FixedSectorSlicer(Constellations.pskDegrees(8, 0, Labeling.GRAY),
                QFormat.parse("Q1.14"), Slicers.DEFAULT_SECTOR_COEFFICIENTS);
        assertEquals(new DatapathCost(3, 3, 3, 4 * 16 + 8 * 3), offset.cost());
    }

    @Test
    void theFactoryPicksTheCheapestExactMethod() {
        ConstellationRom qam = ConstellationRom.of(Catalogue.resolve("qam64"), Q2_5);
        assertEquals(FixedAxisSlicer.class, Slicers.fixedFor(qam).getClass());
        assertEquals(FixedSectorSlicer.class,
                Slicers.fixedFor(ConstellationRom.of(Catalogue.resolve("psk8"), Q2_5)).getClass());
        assertEquals(FixedSectorSlicer.class,
                Slicers.fixedFor(ConstellationRom.of(Catalogue.resolve("nr:pi2bpsk"), Q2_5)).getClass());
        assertEquals(FixedNearestSlicer.class,
                Slicers.fixedFor(ConstellationRom.of(Catalogue.resolve("cqam32"), Q2_5)).getClass());
        assertEquals(FloatAxisSlicer.class, Slicers.floatFor(Catalogue.resolve("rqam32")).getClass());
        assertEquals(FloatNearestSlicer.class, Slicers.floatFor(Catalogue.resolve("apsk32")).getClass());
    }

    @Test
    void blockNormalizer() {
        // Per symbol: 2 squares + 2 gain products, 2 accumulations + 2 rounding adds, 4 saturation compares; per block
        // of 64 the reciprocal square root (4 multiplies, 4 adds) rounds up to one of each per symbol. Tables: 48
        // entries of 17 bits and the 24-bit target constant.
        BlockNormalizer normalizer = new BlockNormalizer(QFormat.parse("Q3.12"), 64, 1.0,
                new Quantizer(QFormat.parse("Q2.13"), Rounding.HALF_UP, Overflow.SATURATE));
        assertEquals(new DatapathCost(5, 5, 4, 48 * 17 + 24), normalizer.cost());
    }
}
