package dev.fixmod.verify.theory;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Constellations;
import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.junit.jupiter.api.Test;

class CapacityTest {
    /** Largest Gauss–Hermite error, per real dimension, measured for the default rule (see Capacity's notes). */
    private static final double DEFAULT_RULE_ERROR_PER_DIMENSION = 6e-5;

    @Test
    void shannonCapacityOfTheComplexChannel() {
        // C = log2(1 + Es/N0) for the complex AWGN channel (Shannon 1948; Proakis §6.5).
        assertEquals(1, Capacity.shannon(1), 1e-15);
        assertEquals(2, Capacity.shannon(3), 1e-15);
        assertEquals(0, Capacity.shannon(0), 0);
        assertEquals(Math.log1p(1000) / Math.log(2), Capacity.shannon(1000), 1e-13);
    }

    @Test
    void bpskCapacityAtUnitSignalToNoisePerDimension() {
        // BI-AWGN capacity at P/σ² = 1 (0 dB per real dimension) is about 0.486 bit (from memory). Under the N0
        // convention (σ² = N0/2) that is Es/N0 = 1/2, i.e. −3.01 dB.
        Constellation bpsk = Constellations.psk(2, 0, true);
        assertEquals(0.486, Capacity.codedModulation(bpsk, 0.5), 5e-4);
        // Independent 1-D integration, at −3.01 dB and at Es/N0 = 0 dB (0.7215 bit).
        for (double esN0 : new double[] {0.5, 1, 3}) {
            double reference = PamReference.rate(Constellations.pam(2, true), esN0, false);
            assertEquals(reference, Capacity.codedModulation(bpsk, esN0), DEFAULT_RULE_ERROR_PER_DIMENSION,
                    "Es/N0 = " + esN0);
            assertEquals(reference, Capacity.bitInterleaved(bpsk, esN0), DEFAULT_RULE_ERROR_PER_DIMENSION,
                    "Es/N0 = " + esN0);
            assertEquals(reference, Capacity.codedModulation(bpsk, esN0, Capacity.MAX_POINTS), 5e-7,
                    "Es/N0 = " + esN0);
        }
    }

    @Test
    void jFunctionIsTheBpskCapacityAndMatchesItsKnownApproximation() {
        // BPSK on AWGN gives the consistent Gaussian LLR with σ² = 8·Es/N0 (common practice, no source), so
        // J(√(8·Es/N0)) is the BPSK capacity; here against the 1-D integration.
        for (double esN0 : new double[] {0.1, 0.5, 2}) {
            double reference = PamReference.rate(Constellations.pam(2, true), esN0, false);
            assertEquals(reference, Capacity.jFunction(Math.sqrt(8 * esN0)), 1e-7, "Es/N0 = " + esN0);
        }
        // Direct integration of the definition, independent of the Hermite rule.
        IterativeLegendreGaussIntegrator integrator = new IterativeLegendreGaussIntegrator(16, 1e-13, 1e-17);
        for (double sigma : new double[] {0.3, 1, 2.5, 6}) {
            double mean = sigma * sigma / 2;
            double expected = 0;
            for (int piece = 0; piece < 24; piece++) {
                double a = mean - 12 * sigma + sigma * piece;
                expected += integrator.integrate(10_000_000, l -> Math.exp(-(l - mean) * (l - mean) / (2 * sigma * sigma))
                        / (Math.sqrt(2 * Math.PI) * sigma) * Math.log1p(Math.exp(-l)) / Math.log(2), a, a + sigma);
            }
            assertEquals(1 - expected, Capacity.jFunction(sigma), 1e-7, "sigma " + sigma);
        }
        // Brännström, Rasmussen, Grant (IEEE Trans. IT 51(3), 2005) approximation
        // J(σ) ≈ (1 − 2^(−H1·σ^(2·H2)))^H3, H1 = 0.3073, H2 = 0.8935, H3 = 1.1064 (constants from memory).
        for (double sigma = 0.2; sigma < 10; sigma += 0.2) {
            double approx = Math.pow(1 - Math.pow(2, -0.3073 * Math.pow(sigma, 2 * 0.8935)), 1.1064);
            assertEquals(approx, Capacity.jFunction(sigma), 1e-3, "sigma " + sigma);
        }
        assertEquals(0, Capacity.jFunction(0), 1e-15);
    }

    @Test
    void squareQamIsTwoPamsAndMatchesTheOneDimensionalIntegrals() {
        // Square QAM with uniform symbols is a product of two √M-PAMs, each at half the symbol energy, and with
        // axis-separate labels (the kernel's) both rates add: C_QAM(Es/N0) = 2·C_PAM(Es/N0 / 2).
        for (boolean gray : new boolean[] {true, false}) {
            Constellation qam = Constellations.qam(16, gray);
            Constellation pam = Constellations.pam(4, gray);
            for (double db : gray ? new double[] {-5, 5, 12, 18, 24, 30} : new double[] {0, 15}) {
                double esN0 = Snr.fromDb(db);
                double cm = 2 * PamReference.rate(pam, esN0 / 2, false);
                double bicm = 2 * PamReference.rate(pam, esN0 / 2, true);
                double tolerance = 2 * DEFAULT_RULE_ERROR_PER_DIMENSION;
                assertEquals(cm, Capacity.codedModulation(qam, esN0), tolerance, "CM " + qam + " " + db + " dB");
                assertEquals(bicm, Capacity.bitInterleaved(qam, esN0), tolerance, "BICM " + qam + " " + db + " dB");
            }
        }
    }

    @Test
    void moreHermitePointsConvergeOnTheReference() {
        // Where the default rule is least accurate for 4-PAM (the knee, about 15 dB per dimension).
        Constellation pam = Constellations.pam(4, true);
        double esN0 = Snr.fromDb(15);
        double reference = PamReference.rate(pam, esN0, false);
        assertEquals(reference, Capacity.codedModulation(pam, esN0, 64), 1e-6);
        assertEquals(reference, Capacity.codedModulation(pam, esN0, 100), 5e-7);
    }

    @Test
    void shapedSymbolsAreHonoured() {
        // 8-PAM with a Maxwell–Boltzmann-like shape p ∝ exp(−0.05·x²) on ±1, ±3, ±5, ±7 (our own scenario):
        // compared with the 1-D integrals that use the same probabilities.
        Constellation uniform = Constellations.pam(8, true);
        double[] p = new double[8];
        double total = 0;
        for (int label = 0; label < 8; label++) {
            p[label] = Math.exp(-0.05 * uniform.re(label) * uniform.re(label));
            total += p[label];
        }
        for (int label = 0; label < 8; label++) {
            p[label] /= total;
        }
        Constellation shaped = uniform.withProbabilities(p);
        for (double db : new double[] {5, 12, 20}) {
            double esN0 = Snr.fromDb(db);
            assertEquals(PamReference.rate(shaped, esN0, false), Capacity.codedModulation(shaped, esN0, 64), 2e-5,
                    "CM " + db);
            assertEquals(PamReference.rate(shaped, esN0, true), Capacity.bitInterleaved(shaped, esN0, 64), 2e-5,
                    "BMD " + db);
        }
        // A point that is never sent removes itself: CM of 4-PAM with two zero-probability points is that of the
        // remaining pair, 1 bit at high SNR, 0 when only one point is left.
        Constellation one = Constellations.pam(4, true).withProbabilities(new double[] {1, 0, 0, 0});
        assertEquals(0, Capacity.codedModulation(one, 10), 0);
        assertEquals(0, Capacity.bitInterleaved(one, 10), 0);
        Constellation two = Constellations.pam(4, true).withProbabilities(new double[] {0.5, 0, 0.5, 0});
        assertEquals(1, Capacity.codedModulation(two, 1000), 1e-12);
    }

    @Test
    void highSnrApproachesLog2M() {
        // A constellation-constrained capacity tends to log2 M (common practice, no source).
        Constellation qam16 = Constellations.qam(16, true);
        for (double db : new double[] {30, 35, 40}) {
            assertEquals(4, Capacity.codedModulation(qam16, Snr.fromDb(db)), 1e-3, "CM " + db);
            assertEquals(4, Capacity.bitInterleaved(qam16, Snr.fromDb(db)), 1e-3, "BICM " + db);
        }
        assertEquals(3, Capacity.codedModulation(Constellations.psk(8, 0, true), Snr.fromDb(35)), 1e-6);
    }

    @Test
    void grayLabellingLosesLittleAndNaturalLabellingMore() {
        // BICM ≤ CM always; Gray labelling keeps BICM close to CM at medium and high SNR (Caire, Taricco and
        // Biglieri 1998, Fig. 4-5 type curves; qualitative, from memory).
        double esN0 = Snr.fromDb(12);
        double cm = Capacity.codedModulation(Constellations.qam(16, true), esN0);
        double gray = Capacity.bitInterleaved(Constellations.qam(16, true), esN0);
        double natural = Capacity.bitInterleaved(Constellations.qam(16, false), esN0);
        assertTrue(gray <= cm && natural < gray, cm + " " + gray + " " + natural);
        assertTrue(cm - gray < 0.01, "Gray gap " + (cm - gray));
        assertTrue(cm - natural > 0.05, "natural gap " + (cm - natural));
    }

    @Test
    void pskRuleConvergence() {
        // PSK is not separable: compare the default rule with the 100-point rule.
        for (int m : new int[] {8, 16}) {
            Constellation psk = Constellations.psk(m, 0, true);
            for (double db : new double[] {0, 10, 20}) {
                double esN0 = Snr.fromDb(db);
                assertEquals(Capacity.codedModulation(psk, esN0, 100), Capacity.codedModulation(psk, esN0), 2e-5);
            }
        }
    }

    @Test
    void scaleOfTheConstellationDoesNotMatter() {
        double a = Capacity.bitInterleaved(Constellations.qam(16, true), 7);
        double b = Capacity.bitInterleaved(Constellations.qam(16, true).scaled(0.01), 7);
        assertEquals(a, b, 1e-12);
    }

    @Test
    void badInputIsNamed() {
        Constellation qpsk = Constellations.qam(4, true);
        assertThrows(IllegalArgumentException.class, () -> Capacity.codedModulation(qpsk, -1));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> Capacity.codedModulation(qpsk, 1, 101));
        assertTrue(e.getMessage().contains("2..100"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> Capacity.bitInterleaved(qpsk, Double.POSITIVE_INFINITY));
        assertThrows(IllegalArgumentException.class, () -> Capacity.jFunction(-1));
        assertEquals(0, Capacity.codedModulation(qpsk, 0), 0);
    }
}
