package dev.fixmod.map;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Constellations;
import dev.fixmod.constellation.Family;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import org.junit.jupiter.api.Test;

class MapperTest {
    private static final Quantizer Q3_4 = new Quantizer(QFormat.parse("Q3.4"), Rounding.HALF_EVEN, Overflow.SATURATE);

    @Test
    void bitsAreReadB0FirstAsTheMostSignificantBitOfTheLabel() {
        // DESIGN.md convention: b0 is first in time and the MSB of the label. IEEE 802.11-2020 Table 17-10 (16-QAM):
        // b0 b1 select I with 00 → −3, 01 → −1, 11 → +1, 10 → +3; b2 b3 select Q alike (from memory of the table).
        FloatMapper mapper = new FloatMapper(Constellations.qam(16, true));
        byte[] bits = {1, 0, 0, 1, /* */ 0, 1, 1, 1};
        double[] re = new double[2];
        double[] im = new double[2];
        mapper.mapBits(bits, 0, 2, 0, re, im, 0);
        assertArrayEquals(new double[] {3, -1}, re);
        assertArrayEquals(new double[] {-1, 1}, im);
    }

    @Test
    void fixedMapperReadsTheRomAndMatchesTheFloatMapper() {
        Constellation qam = Constellations.qam(16, true);
        FixedMapper fixed = new FixedMapper(ConstellationRom.of(qam, Q3_4));
        int[] labels = {0, 5, 10, 15, 9};
        int[] i = new int[7];
        int[] q = new int[7];
        fixed.mapLabels(labels, 1, 4, 0, i, q, 2);
        double[] re = new double[4];
        double[] im = new double[4];
        new FloatMapper(qam).mapLabels(labels, 1, 4, 0, re, im, 0);
        for (int n = 0; n < 4; n++) {
            assertEquals(re[n] * 16, i[n + 2]); // Q3.4: a code is the value times 2^4
            assertEquals(im[n] * 16, q[n + 2]);
        }
        assertEquals(0, i[0]);
        assertEquals(0, i[6]);
    }

    @Test
    void piOverTwoBpskTurnsOddSymbolsByTheStreamIndex() {
        // TS 38.211 §5.1.1: d(i) = e^{jπ(i mod 2)/2}/√2 · [(1 − 2b(i)) + j(1 − 2b(i))].
        double a = 1 / StrictMath.sqrt(2);
        Constellation pi2 = Constellation.ofLabelled("bpsk", Family.PSK, "nr", new double[] {a, -a},
                new double[] {a, -a}, null, null).withAlternatingQuarterTurn("pi2bpsk");
        byte[] bits = {0, 0, 1, 1};
        double[] re = new double[4];
        double[] im = new double[4];
        new FloatMapper(pi2).mapBits(bits, 0, 4, 0, re, im, 0);
        for (int n = 0; n < 4; n++) {
            double sign = 1 - 2 * bits[n];
            double angle = StrictMath.PI / 2 * (n % 2);
            // e^{jθ}(1 + j)·s/√2, expanded: re = s(cos θ − sin θ)/√2, im = s(sin θ + cos θ)/√2
            assertEquals(sign * a * (StrictMath.cos(angle) - StrictMath.sin(angle)), re[n], 1e-15);
            assertEquals(sign * a * (StrictMath.sin(angle) + StrictMath.cos(angle)), im[n], 1e-15);
        }
        // A chunk starting at an odd stream index turns its first symbol.
        double[] chunkRe = new double[1];
        double[] chunkIm = new double[1];
        new FloatMapper(pi2).mapBits(bits, 1, 1, 1, chunkRe, chunkIm, 0);
        assertEquals(re[1], chunkRe[0]);
        assertEquals(im[1], chunkIm[0]);
        int[] i = new int[4];
        int[] q = new int[4];
        FixedMapper fixed = new FixedMapper(ConstellationRom.of(pi2, Q3_4));
        fixed.mapBits(bits, 0, 4, 0, i, q, 0);
        assertArrayEquals(new int[] {11, -11, -11, 11}, i); // round(16/√2) = round(11.31)
        assertArrayEquals(new int[] {11, 11, -11, -11}, q);
    }

    @Test
    void aTurnedPointOnTheIAxisHasNoNegativeZero() {
        // DESIGN.md: outputs never show a signed zero. BPSK ±1 turned by +90° lies on the Q axis: I must be +0.0.
        double[] re = new double[2];
        double[] im = new double[2];
        new FloatMapper(dev.fixmod.constellation.Catalogue.resolve("pi2bpsk")).mapLabels(new int[] {0, 0}, 0, 2, 0,
                re, im, 0);
        assertEquals(1.0, re[0]);
        assertEquals(0x0L, Double.doubleToRawLongBits(re[1]), "+0.0, not -0.0");
        assertEquals(1.0, im[1]);
    }

    @Test
    void badInputIsRefusedBeforeAnythingIsWritten() {
        FixedMapper fixed = new FixedMapper(ConstellationRom.of(Constellations.qam(4, true), Q3_4));
        int[] i = {7, 7, 7};
        int[] q = {7, 7, 7};
        IllegalArgumentException label = assertThrows(IllegalArgumentException.class,
                () -> fixed.mapLabels(new int[] {0, 1, 4}, 0, 3, 0, i, q, 0));
        assertEquals("label 4 at index 2 is outside 0..3 of a 4-point constellation", label.getMessage());
        IllegalArgumentException bit = assertThrows(IllegalArgumentException.class,
                () -> fixed.mapBits(new byte[] {0, 1, 1, 2}, 0, 2, 0, i, q, 0));
        assertEquals("bit at index 3 is 2; unpacked bits are one byte each, 0 or 1", bit.getMessage());
        IllegalArgumentException length = assertThrows(IllegalArgumentException.class,
                () -> fixed.mapLabels(new int[] {0, 1, 2}, 0, 3, 0, i, new int[2], 0));
        assertTrue(length.getMessage().startsWith("output Q: offset 0 and count 3 do not fit an array of length 2"),
                length.getMessage());
        assertThrows(IllegalArgumentException.class, () -> fixed.mapBits(new byte[5], 0, 3, 0, i, q, 0));
        assertThrows(IllegalArgumentException.class, () -> fixed.mapLabels(new int[3], 0, 3, -1, i, q, 0));
        assertArrayEquals(new int[] {7, 7, 7}, i);
        assertArrayEquals(new int[] {7, 7, 7}, q);
        FloatMapper floating = new FloatMapper(Constellations.qam(4, true));
        double[] re = {5, 5};
        assertThrows(IllegalArgumentException.class,
                () -> floating.mapLabels(new int[] {0, -1}, 0, 2, 0, re, new double[2], 0));
        assertArrayEquals(new double[] {5, 5}, re);
    }

    @Test
    void mappingCostIsTheRomAndTheNegationOfOddSymbols() {
        ConstellationRom qam = ConstellationRom.of(Constellations.qam(16, true), Q3_4);
        assertEquals(new DatapathCost(0, 0, 0, 16 * 2 * 8), new FixedMapper(qam).cost());
    }
}
