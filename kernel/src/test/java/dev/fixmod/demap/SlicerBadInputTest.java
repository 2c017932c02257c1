package dev.fixmod.demap;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.constellation.Catalogue;
import dev.fixmod.constellation.Constellation;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import dev.fixmod.map.ConstellationRom;
import org.junit.jupiter.api.Test;

/** Bad input gives one clear IllegalArgumentException and leaves the outputs untouched. */
class SlicerBadInputTest {
    private static final Quantizer Q2_5 = new Quantizer(QFormat.parse("Q2.5"), Rounding.HALF_EVEN, Overflow.SATURATE);

    @Test
    void nanAndInfiniteSamplesAreRefusedBeforeAnythingIsWritten() {
        FloatSlicer slicer = Slicers.floatFor(Catalogue.resolve("qam16"));
        int[] labels = {-7, -7, -7};
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> slicer.sliceLabels(
                new double[] {0.1, 0.2, Double.NaN}, new double[3], 0, 3, 0, labels, 0));
        assertEquals("sample at index 2 is (NaN, 0.0); a slicer decides finite samples only", e.getMessage());
        assertArrayEquals(new int[] {-7, -7, -7}, labels);
        byte[] bits = new byte[12];
        assertThrows(IllegalArgumentException.class, () -> slicer.sliceBits(new double[3],
                new double[] {0, Double.NEGATIVE_INFINITY, 0}, 0, 3, 0, bits, 0));
        assertArrayEquals(new byte[12], bits);
        assertThrows(IllegalArgumentException.class, () -> slicer.slice(Double.NaN, 0, 0));
    }

    @Test
    void mismatchedLengthsAndCodesOutsideTheFormatAreRefused() {
        FixedSlicer slicer = Slicers.fixedFor(ConstellationRom.of(Catalogue.resolve("qam16"), Q2_5));
        int[] labels = {-7, -7};
        IllegalArgumentException lengths = assertThrows(IllegalArgumentException.class,
                () -> slicer.sliceLabels(new int[2], new int[1], 0, 2, 0, labels, 0));
        assertTrue(lengths.getMessage().startsWith("input Q: offset 0 and count 2 do not fit an array of length 1"),
                lengths.getMessage());
        IllegalArgumentException range = assertThrows(IllegalArgumentException.class,
                () -> slicer.sliceLabels(new int[] {0, 128}, new int[2], 0, 2, 0, labels, 0));
        assertEquals("input I: code 128 at index 1 is outside Q2.5 (codes -128 .. 127)", range.getMessage());
        assertThrows(IllegalArgumentException.class, () -> slicer.sliceLabels(new int[2], new int[2], 0, 2, 0,
                new int[1], 0));
        assertThrows(IllegalArgumentException.class, () -> slicer.sliceLabels(new int[2], new int[2], 0, 2, -1,
                labels, 0));
        assertThrows(IllegalArgumentException.class, () -> slicer.slice(0, -129, 0));
        assertArrayEquals(new int[] {-7, -7}, labels);
    }

    @Test
    void slicersThatDoNotApplyAreRefusedWithTheAlternative() {
        Constellation apsk = Catalogue.resolve("apsk16");
        IllegalArgumentException axis = assertThrows(IllegalArgumentException.class, () -> new FloatAxisSlicer(apsk));
        assertTrue(axis.getMessage().contains("not separable"), axis.getMessage());
        IllegalArgumentException sector = assertThrows(IllegalArgumentException.class,
                () -> new FloatSectorSlicer(Catalogue.resolve("qam16")));
        assertTrue(sector.getMessage().contains("is not a PSK constellation"), sector.getMessage());
        assertThrows(IllegalArgumentException.class,
                () -> new FixedAxisSlicer(ConstellationRom.of(apsk, Q2_5)));
    }

    @Test
    void formatsTooNarrowOrTooCoarseAreRefused() {
        Constellation psk32 = Catalogue.resolve("psk32");
        IllegalArgumentException coarse = assertThrows(IllegalArgumentException.class, () -> new FixedSectorSlicer(
                psk32, QFormat.parse("Q1.14"), new Quantizer(QFormat.parse("Q1.2"), Rounding.HALF_EVEN,
                        Overflow.SATURATE)));
        assertTrue(coarse.getMessage().contains("too coarse"), coarse.getMessage());
        IllegalArgumentException noIntegerBit = assertThrows(IllegalArgumentException.class,
                () -> new FixedSectorSlicer(psk32, QFormat.parse("Q1.14"), new Quantizer(QFormat.parse("Q15"),
                        Rounding.HALF_EVEN, Overflow.SATURATE)));
        assertTrue(noIntegerBit.getMessage().contains("integer bit"), noIntegerBit.getMessage());
        IllegalArgumentException wide = assertThrows(IllegalArgumentException.class, () -> new FixedNearestSlicer(
                ConstellationRom.of(Catalogue.resolve("qam16"), new Quantizer(QFormat.parse("Q1.30"),
                        Rounding.HALF_EVEN, Overflow.SATURATE))));
        assertTrue(wide.getMessage().contains("at most 30 bits"), wide.getMessage());
        // Thresholds that would collide: unit-energy 64-QAM levels 0.772 and 1.080 both become code 2 in Q1.1.
        IllegalArgumentException collide = assertThrows(IllegalArgumentException.class,
                () -> new FixedAxisSlicer(ConstellationRom.of(Catalogue.resolve("qam64"),
                        new Quantizer(QFormat.parse("Q1.1"), Rounding.HALF_EVEN, Overflow.SATURATE))));
        assertTrue(collide.getMessage().contains("would collide"), collide.getMessage());
    }
}
