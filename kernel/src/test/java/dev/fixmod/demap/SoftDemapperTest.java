package dev.fixmod.demap;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.constellation.Catalogue;
import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Constellations;
import dev.fixmod.map.DatapathCost;
import java.util.Arrays;
import org.junit.jupiter.api.Test;

class SoftDemapperTest {
    private static final Constellation QAM16 = Constellations.qam(16, true);

    @Test
    void esN0InDecibelsGivesTheNoisePower() {
        // N0 = Es / 10^(Es/N0 / 10): 16-QAM on the grid ±1, ±3 has Es = 10 (handbook value, e.g. Proakis).
        assertEquals(1.0, LlrOptions.fromEsN0Db(QAM16, 10.0, LlrSign.ZERO_POSITIVE, true).n0(), 1e-15);
        assertEquals(10.0, LlrOptions.fromEsN0Db(QAM16, 0.0, LlrSign.ZERO_POSITIVE, true).n0(), 1e-15);
        assertEquals(10.0, LlrOptions.of(1.0).esN0Db(QAM16), 1e-12);
    }

    @Test
    void badNoisePowersAndNamesAreRefusedWithTheReason() {
        for (double n0 : new double[] {0.0, -1.0, Double.NaN, Double.POSITIVE_INFINITY}) {
            IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> LlrOptions.of(n0));
            assertTrue(e.getMessage().contains("N0 must be finite and > 0"), e.getMessage());
        }
        assertThrows(IllegalArgumentException.class,
                () -> LlrOptions.fromEsN0Db(QAM16, Double.NaN, LlrSign.ZERO_POSITIVE, true));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> LlrSign.fromName("positive"));
        assertEquals("unknown LLR sign 'positive'; expected one of zero-positive, one-positive", e.getMessage());
        assertEquals(LlrSign.ONE_POSITIVE, LlrSign.fromName("ONE_positive"));
        assertEquals(SoftAlgorithm.MAX_LOG_PER_AXIS, SoftAlgorithm.fromName("max-log-per-axis"));
        assertEquals(LlrScaling.UNSCALED, LlrScaling.fromName("unscaled"));
    }

    @Test
    void aNonFiniteSampleIsRefusedAndNothingIsWritten() {
        SoftDemapper d = new MaxLogDemapper(QAM16, LlrOptions.of(1.0));
        double[] out = new double[12];
        Arrays.fill(out, 42.0);
        double[] re = {0.5, 1.0, Double.NaN};
        double[] im = {0.5, 1.0, 0.0};
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> d.llr(re, im, 0, 3, out, 0));
        assertEquals("received sample I at index 2 is NaN; samples must be finite numbers", e.getMessage());
        double[] untouched = new double[12];
        Arrays.fill(untouched, 42.0);
        assertArrayEquals(untouched, out, "no partial output");
        assertThrows(IllegalArgumentException.class, () -> d.llr(0.0, Double.NEGATIVE_INFINITY, out, 0));
    }

    @Test
    void mismatchedArraysAreRefusedBeforeAnythingIsComputed() {
        SoftDemapper d = new LogMapDemapper(QAM16, LlrOptions.of(1.0));
        double[] out = new double[8];
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> d.llr(new double[3], new double[2], 0, 3, out, 0));
        assertEquals("Q samples: offset 0 and count 3 do not fit an array of length 2", e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> d.llr(new double[3], new double[3], 0, 3, out, 0));
        assertEquals("LLR output: 3 samples of 4 LLRs from offset 0 do not fit an array of length 8", e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> d.llr(new double[3], null, 0, 3, new double[12], 0));
        assertTrue(e.getMessage().startsWith("Q sample array is missing"), e.getMessage());
        // A PAM may omit Q.
        SoftDemapper pam = new PerAxisMaxLogDemapper(Constellations.pam(4, true), LlrOptions.of(1.0));
        double[] two = new double[2];
        pam.llr(new double[] {0.5}, null, 0, 1, two, 0);
        assertEquals(-2.0, two[0], 1e-15); // -4y/N0 inside |y| <= 2 (MaxLogClosedFormTest)
    }

    @Test
    void algorithmsThatDoNotApplySayWhatToUseInstead() {
        Constellation psk8 = Constellations.psk(8, 0.0, true);
        LlrOptions o = LlrOptions.of(1.0);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> new PerAxisMaxLogDemapper(psk8, o));
        assertTrue(e.getMessage().contains("needs a separable constellation") && e.getMessage().contains("max-log"),
                e.getMessage());
        e = assertThrows(IllegalArgumentException.class,
                () -> new FoldedLinearDemapper(Constellations.qam(16, false), o));
        assertTrue(e.getMessage().contains("needs a Gray labeling"), e.getMessage());
        Constellation shaped = Catalogue.resolve("qam16", Catalogue.Options.DEFAULT.withShaping(0.1));
        e = assertThrows(IllegalArgumentException.class, () -> new PerAxisMaxLogDemapper(shaped, o));
        assertTrue(e.getMessage().contains("assumes equiprobable symbols"), e.getMessage());
        new PerAxisMaxLogDemapper(shaped, new LlrOptions(1.0, LlrSign.ZERO_POSITIVE, false)); // priors off: fine
        e = assertThrows(IllegalArgumentException.class,
                () -> new PerAxisMaxLogDemapper(Catalogue.resolve("pi2bpsk"), o));
        assertTrue(e.getMessage().contains("needs a separable constellation")
                && e.getMessage().contains("use max-log"), e.getMessage());
    }

    @Test
    void foldedLinearAcceptsGrayVariantsWithInvertedBits() {
        // The 3GPP 16-QAM bit order (b0, b2 on I, bit 0 on the positive side) is Gray with inverted bits: it folds.
        Constellation nr = Catalogue.resolve("nr:qam16");
        SoftDemapper folded = new FoldedLinearDemapper(nr, LlrOptions.of(0.5));
        SoftDemapper maxLog = new PerAxisMaxLogDemapper(nr, LlrOptions.of(0.5));
        double[] a = new double[4];
        double[] b = new double[4];
        folded.llr(0.2, -0.4, a, 0); // inside |y| <= 2A on both axes: equal (FoldedLinearDemapper's table)
        maxLog.llr(0.2, -0.4, b, 0);
        assertArrayEquals(b, a, 1e-12);
        assertTrue(a[0] > 0, "3GPP: b0 = 0 on the positive I side (TS 38.211 clause 5.1.4)");
    }

    @Test
    void costsGrowAsEachAlgorithmIsDocumented() {
        LlrOptions o = LlrOptions.of(1.0);
        for (int m : new int[] {16, 64, 256}) {
            Constellation c = Constellations.qam(m, true);
            int k = c.bitsPerSymbol();
            DatapathCost exhaustive = new MaxLogDemapper(c, o).cost();
            DatapathCost perAxis = new PerAxisMaxLogDemapper(c, o).cost();
            DatapathCost folded = new FoldedLinearDemapper(c, o).cost();
            // Exhaustive: two squares per point plus one 1/N0 product per bit; k(M − 2) comparisons.
            assertEquals(2L * m + k, exhaustive.multiplies());
            assertEquals((long) k * (m - 2), exhaustive.compares());
            assertEquals(k, perAxis.multiplies());
            assertEquals(k, folded.multiplies());
            assertEquals(0, folded.compares());
            assertEquals(m + k, new LogMapDemapper(c, o).transcendentals());
        }
    }
}
