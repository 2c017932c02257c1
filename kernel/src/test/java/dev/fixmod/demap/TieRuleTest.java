package dev.fixmod.demap;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Constellations;
import dev.fixmod.constellation.Family;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import dev.fixmod.map.ConstellationRom;
import org.junit.jupiter.api.Test;

/**
 * The examples of the tie rule table in {@link FixedSlicer}'s documentation, checked in float and in fixed point on
 * the per-axis or sector slicer, and on the nearest-point slicer wherever the points lie exactly on the code grid (then
 * every method has the same boundaries; PSK points from cos/sin are rounded irrational numbers, whose distances do
 * not tie exactly). The rule is this project's own (common practice in RTL: compare with >=); the labels follow from
 * the Gray labelings of {@link Constellations}.
 */
class TieRuleTest {
    private static final Quantizer Q3_4 = new Quantizer(QFormat.parse("Q3.4"), Rounding.HALF_EVEN, Overflow.SATURATE);
    private static final Quantizer Q1_6 = new Quantizer(QFormat.parse("Q1.6"), Rounding.HALF_EVEN, Overflow.SATURATE);

    /** Checks the float and fixed slicers of every applicable method on one sample. */
    private static void decides(Constellation c, Quantizer input, double re, double im, int expectedLabel) {
        QFormat f = input.format();
        int i = (int) Math.scalb(re, f.fractionalBits());
        int q = (int) Math.scalb(im, f.fractionalBits());
        assertEquals(re, f.toDouble(i), "the example must lie on the code grid");
        assertEquals(im, f.toDouble(q), "the example must lie on the code grid");
        ConstellationRom rom = ConstellationRom.of(c, input);
        String where = c.name() + " at (" + re + ", " + im + ")";
        if (rom.maxErrorLsb() == 0) {
            assertEquals(expectedLabel, new FloatNearestSlicer(c).slice(re, im, 0), "float nearest, " + where);
            assertEquals(expectedLabel, new FixedNearestSlicer(rom).slice(i, q, 0), "fixed nearest, " + where);
        }
        if (c.isSeparable()) {
            assertEquals(expectedLabel, new FloatAxisSlicer(c).slice(re, im, 0), "float axis, " + where);
            assertEquals(expectedLabel, new FixedAxisSlicer(rom).slice(i, q, 0), "fixed axis, " + where);
        }
        if (c.family() == Family.PSK) {
            assertEquals(expectedLabel, new FloatSectorSlicer(c).slice(re, im, 0), "float sector, " + where);
            assertEquals(expectedLabel, new FixedSectorSlicer(c, f, Slicers.DEFAULT_SECTOR_COEFFICIENTS)
                    .slice(i, q, 0), "fixed sector, " + where);
        }
    }

    @Test
    void fourPam() {
        Constellation pam = Constellations.pam(4, true); // −3, −1, +1, +3 ↔ 00, 01, 11, 10
        decides(pam, Q3_4, 2.0, 0, 0b10);
        decides(pam, Q3_4, 0.0, 0, 0b11);
        decides(pam, Q3_4, -2.0, 0, 0b01);
        decides(pam, Q3_4, -2.0625, 0, 0b00);
        decides(pam, Q3_4, -8.0, 0, 0b00);
        decides(pam, Q3_4, 7.9375, 0, 0b10);
    }

    @Test
    void sixteenQam() {
        Constellation qam = Constellations.qam(16, true);
        decides(qam, Q3_4, 0, 0, 0b1111);
        decides(qam, Q3_4, 2, -2, 0b1001);
        decides(qam, Q3_4, -8, -8, 0b0000);
    }

    @Test
    void psk() {
        Constellation qpsk = Constellations.psk(4, StrictMath.PI / 4, true);
        // The same QPSK with radius √2/2, on the code grid: the nearest-point slicers then tie exactly too.
        Constellation exactQpsk = Constellation.ofLabelled("qpsk-grid", Family.PSK, "gray",
                new double[] {0.5, -0.5, 0.5, -0.5}, new double[] {0.5, 0.5, -0.5, -0.5}, null, null);
        for (Constellation c : new Constellation[] {qpsk, exactQpsk}) {
            decides(c, Q1_6, 0, 0.5, 0b00);
            decides(c, Q1_6, -0.5, 0, 0b01);
            decides(c, Q1_6, 0, 0, 0b00);
        }
        decides(Constellations.psk(8, 0, true), Q1_6, 0, 0, 0b000);
        Constellation offset8 = Constellations.psk(8, StrictMath.PI / 8, true);
        decides(offset8, Q1_6, 0.5, 0.5, 0b000);
        decides(offset8, Q1_6, -1, -1, 0b111);
    }

    /** The examples of the on-boundary table in {@link FixedSlicer#onBoundary}'s documentation. */
    @Test
    void boundaryExamples() {
        Constellation pam = Constellations.pam(4, true);
        ConstellationRom pamRom = ConstellationRom.of(pam, Q3_4);
        FixedAxisSlicer pamAxis = new FixedAxisSlicer(pamRom);
        assertEquals(true, pamAxis.onBoundary(32, 0, 0), "4-PAM at 2.0");
        assertEquals(false, pamAxis.onBoundary(31, 0, 0), "4-PAM at 1.9375");
        ConstellationRom qamRom = ConstellationRom.of(Constellations.qam(16, true), Q3_4);
        assertEquals(true, new FixedAxisSlicer(qamRom).onBoundary(0, 8, 0), "16-QAM at (0, 0.5), per axis");
        assertEquals(true, new FixedNearestSlicer(qamRom).onBoundary(0, 8, 0), "16-QAM at (0, 0.5), nearest");
        assertEquals(true, new FixedNearestSlicer(qamRom).onBoundary(0, 0, 0), "16-QAM at (0, 0), nearest");
        Constellation qpsk = Constellations.psk(4, StrictMath.PI / 4, true);
        assertEquals(false, new FixedSectorSlicer(qpsk, Q1_6.format(), Slicers.DEFAULT_SECTOR_COEFFICIENTS)
                .onBoundary(32, 32, 0), "QPSK at (0.5, 0.5)");
        Constellation psk8 = Constellations.psk(8, 0, true);
        assertEquals(true, new FixedSectorSlicer(psk8, Q1_6.format(), Slicers.DEFAULT_SECTOR_COEFFICIENTS)
                .onBoundary(0, 0, 0), "8-PSK at the origin");
    }
}
