package dev.fixmod.verify.theory;

import static dev.fixmod.verify.theory.GaussianTail.q;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Constellations;
import dev.fixmod.constellation.Normalization;
import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.junit.jupiter.api.Test;

class ErrorRatesTest {
    @Test
    void bpskReachesTenToTheMinusFiveAt9Point59Db() {
        // Handbook value: BPSK (and Gray QPSK per bit) needs Eb/N0 ≈ 9.6 dB for Pb = 1e-5 (Sklar, Digital
        // Communications; Proakis, Digital Communications); 9.59 dB to two decimals, from memory.
        double db = SnrAtTarget.errorRate(x -> ErrorRates.bpskBer(Snr.fromDb(x)), 1e-5, 0, 20);
        assertEquals(9.59, db, 0.005);
        // Closed-form inverse: Eb/N0 = Q^-1(p)²/2.
        double inverse = GaussianTail.inverseQ(1e-5);
        assertEquals(Snr.toDb(inverse * inverse / 2), db, 1e-8);
        assertEquals(9.59, SnrAtTarget.errorRate(x -> ErrorRates.qpskGrayBer(Snr.fromDb(x)), 1e-5, 0, 20), 0.005);
    }

    @Test
    void grayQpskBerEqualsTheRegionSumOverItsLabels() {
        // Independent method: exact BER from the decision-region probabilities of the kernel's Gray QPSK (Es = 2Eb).
        Constellation qpsk = Constellations.qam(4, true);
        for (double db = -5; db <= 14; db += 1.5) {
            double ebN0 = Snr.fromDb(db);
            double exact = ErrorRates.separableBer(qpsk, 2 * ebN0);
            assertEquals(exact, ErrorRates.qpskGrayBer(ebN0), exact * 1e-12, db + " dB");
        }
    }

    @Test
    void sixteenQamSerMatchesTwoDimensionalIntegrationOverDecisionRegions() {
        // Independent method: integrate the 2-D Gaussian density over each point's decision region with nested
        // Commons Math Gauss–Legendre integrators (16-QAM on ±1, ±3, thresholds at 0 and ±2; open sides cut at
        // 14σ beyond the last threshold, where the density is below 1e−40).
        for (double db : new double[] {4, 10, 16}) {
            double esN0 = Snr.fromDb(db);
            double sigma = Math.sqrt(10 / esN0 / 2);
            double[] lo = {Double.NEGATIVE_INFINITY, -2, 0, 2};
            double[] hi = {-2, 0, 2, Double.POSITIVE_INFINITY};
            double[] level = {-3, -1, 1, 3};
            double correct = 0;
            for (int a = 0; a < 4; a++) {
                for (int b = 0; b < 4; b++) {
                    correct += gaussianMassOverBox(level[a], level[b], sigma,
                            cut(lo[a], sigma), cut(hi[a], sigma), cut(lo[b], sigma), cut(hi[b], sigma)) / 16;
                }
            }
            double ser = 1 - correct;
            assertEquals(ser, ErrorRates.squareQamSer(16, esN0), Math.max(ser * 1e-7, 1e-13), db + " dB");
        }
    }

    private static double cut(double edge, double sigma) {
        return Double.isInfinite(edge) ? Math.signum(edge) * (2 + 14 * sigma) : edge;
    }

    private static double gaussianMassOverBox(double cx, double cy, double sigma, double x0, double x1, double y0,
                                              double y1) {
        IterativeLegendreGaussIntegrator inner = new IterativeLegendreGaussIntegrator(12, 1e-11, 1e-16);
        IterativeLegendreGaussIntegrator outer = new IterativeLegendreGaussIntegrator(12, 1e-10, 1e-15);
        double norm = 1 / (2 * Math.PI * sigma * sigma);
        return outer.integrate(10_000_000, x -> inner.integrate(10_000_000,
                y -> norm * Math.exp(-((x - cx) * (x - cx) + (y - cy) * (y - cy)) / (2 * sigma * sigma)), y0, y1),
                x0, x1);
    }

    @Test
    void regionSumsAgreeWithTheClosedForms() {
        // Proakis 5th ed. §4.3 closed forms vs the per-axis region sums on the kernel's constellations.
        for (int m : new int[] {4, 16, 64, 256}) {
            Constellation qam = Constellations.qam(m, true);
            for (double db = -10; db <= 35; db += 5) {
                double closed = ErrorRates.squareQamSer(m, Snr.fromDb(db));
                assertEquals(closed, ErrorRates.separableSer(qam, Snr.fromDb(db)), closed * 1e-9, m + "-QAM " + db);
            }
        }
        for (int m : new int[] {2, 4, 8}) {
            Constellation pam = Constellations.pam(m, false);
            for (double db = -10; db <= 30; db += 5) {
                double closed = ErrorRates.pamSer(m, Snr.fromDb(db));
                assertEquals(closed, ErrorRates.separableSer(pam, Snr.fromDb(db)), closed * 1e-9, m + "-PAM " + db);
            }
        }
    }

    @Test
    void sixteenQamGrayBerMatchesTheHandDerivedExpression() {
        // Gray 4-PAM per axis (labels 00, 01, 11, 10 on −3, −1, 1, 3), summing Hamming distances over the decision
        // regions: Pb = (3Q(1/σ) + 2Q(3/σ) − Q(5/σ))/4, σ² = N0/2, Es = 10; the same expression as Cho and Yoon,
        // IEEE Trans. Commun. 50(7), 2002, for 16-QAM (from memory).
        Constellation qam16 = Constellations.qam(16, true);
        for (double db = 0; db <= 24; db += 3) {
            double esN0 = Snr.fromDb(db);
            double s = Math.sqrt(10 / esN0 / 2);
            double expected = (3 * q(1 / s) + 2 * q(3 / s) - q(5 / s)) / 4;
            assertEquals(expected, ErrorRates.separableBer(qam16, esN0), expected * 1e-12, db + " dB");
        }
    }

    @Test
    void craigIntegralEqualsTheClosedFormsForTwoAndFourPoints() {
        // Craig (MILCOM 1991): M = 2 gives Q(√(2Es/N0)); M = 4 gives 2Q(a) − Q(a)², a = √(Es/N0) (Proakis §4.3).
        for (double db = -10; db <= 25; db += 2.5) {
            double esN0 = Snr.fromDb(db);
            double bpsk = q(Math.sqrt(2 * esN0));
            assertEquals(bpsk, ErrorRates.pskSer(2, esN0), bpsk * 1e-10, "M=2 " + db);
            double a = q(Math.sqrt(esN0));
            double qpsk = 2 * a - a * a;
            assertEquals(qpsk, ErrorRates.pskSer(4, esN0), qpsk * 1e-10, "M=4 " + db);
        }
    }

    @Test
    void higherOrderPskSitsUnderItsTwoHalfPlaneBoundAndMeetsItAtHighSnr() {
        // Proakis §4.3: P_M ≈ 2Q(√(2Es/N0)·sin(π/M)) at high SNR, and it bounds P_M from above (two half-planes).
        for (int m : new int[] {8, 16, 32}) {
            for (double db = 0; db <= 40; db += 4) {
                double esN0 = Snr.fromDb(db);
                double bound = 2 * q(Math.sqrt(2 * esN0) * Math.sin(Math.PI / m));
                double ser = ErrorRates.pskSer(m, esN0);
                // At high SNR the two differ by the tiny overlap of the half-planes: allow quadrature rounding.
                assertTrue(ser <= bound * (1 + 1e-10), m + "-PSK " + db + " dB: " + ser + " > " + bound);
                if (bound < 1e-6 && bound > 1e-290) {
                    assertEquals(1, ser / bound, 1e-3, m + "-PSK " + db + " dB");
                }
            }
            assertEquals(bound(m), ErrorRates.nearestNeighbourUnionBound(Constellations.psk(m, 0.1, true), 100),
                    bound(m) * 1e-9);
        }
    }

    private static double bound(int m) {
        return 2 * q(Math.sqrt(200) * Math.sin(Math.PI / m));
    }

    @Test
    void guessingAtZeroSnrAndNothingAtInfiniteSnr() {
        // SER at Es/N0 = 0 is that of a uniform guess, 1 − 1/M (common practice, no source).
        assertEquals(1 - 1.0 / 8, ErrorRates.pamSer(8, 0), 1e-15);
        assertEquals(1 - 1.0 / 64, ErrorRates.squareQamSer(64, 0), 1e-15);
        assertEquals(1 - 1.0 / 16, ErrorRates.pskSer(16, 0), 1e-12);
        assertEquals(1 - 1.0 / 16, ErrorRates.separableSer(Constellations.qam(16, true), 0), 1e-15);
        assertEquals(0, ErrorRates.squareQamSer(16, Double.POSITIVE_INFINITY), 0);
        assertEquals(0, ErrorRates.pskSer(8, Double.POSITIVE_INFINITY), 0);
        assertEquals(0, ErrorRates.separableBer(Constellations.qam(16, true), Double.POSITIVE_INFINITY), 0);
    }

    @Test
    void grayApproximationsApproachTheExactBer() {
        // The nearest-neighbour Gray approximations are asymptotically exact (common practice, e.g. Proakis §4.3).
        for (int m : new int[] {16, 64, 256}) {
            Constellation qam = Constellations.qam(m, true);
            double esN0 = Snr.fromDb(10 * Math.log10(m) + 14);
            double exact = ErrorRates.separableBer(qam, esN0);
            assertEquals(1, ErrorRates.squareQamGrayBerApproximation(m, esN0) / exact, 1e-3, m + "-QAM");
            assertEquals(1, ErrorRates.grayBerFromSer(ErrorRates.squareQamSer(m, esN0), qam.bitsPerSymbol()) / exact,
                    1e-3, m + "-QAM Ps/k");
        }
        // M = 4: the PSK approximation is exact, Q(√(Es/N0)); M = 2 is BPSK.
        assertEquals(q(Math.sqrt(5)), ErrorRates.pskGrayBerApproximation(4, 5), 1e-16);
        assertEquals(ErrorRates.bpskBer(5), ErrorRates.pskGrayBerApproximation(2, 5), 0);
        assertEquals(0.25, ErrorRates.grayBerFromSer(1, 4), 0);
    }

    @Test
    void nearestNeighbourBoundOfQamIsTheTextbookExpression() {
        // Square QAM: d_min² = 6Es/(M−1), N̄ = 4(1 − 1/√M) (Proakis §4.3), so N̄·Q(√(3Es/N0/(M−1))).
        for (int m : new int[] {4, 16, 64, 1024}) {
            Constellation qam = Constellations.qam(m, m != 64).normalized(Normalization.UNIT_PEAK);
            double esN0 = Snr.fromDb(15);
            double expected = 4 * (1 - 1 / Math.sqrt(m)) * q(Math.sqrt(3 * esN0 / (m - 1)));
            assertEquals(expected, ErrorRates.nearestNeighbourUnionBound(qam, esN0), expected * 1e-9, m + "-QAM");
        }
    }

    @Test
    void pairwiseUnionBoundOfBpskIsExact() {
        // Two points: the union has one term, so the bound is the exact SER Q(√(2Es/N0)).
        assertEquals(q(Math.sqrt(6)), ErrorRates.pairwiseUnionBound(Constellations.pam(2, true), 3), 1e-17);
    }

    @Test
    void shapedProbabilitiesWeightTheRegionSums() {
        // 4-PAM with the outer points never sent: only the inner points' errors count, each with two neighbours.
        // Gray labels by level −3, −1, 1, 3 are 0, 1, 3, 2, so labels 1 and 3 are the inner points.
        Constellation pam = Constellations.pam(4, true).withProbabilities(new double[] {0, 0.5, 0, 0.5});
        double esN0 = 2;  // Es = 1 on the ±1, ±3 grid: σ = √(1/2/2) = 0.5, half-distance 1.
        double perAxis = 2 * q(1 / 0.5);
        assertEquals(perAxis, ErrorRates.separableSer(pam, esN0), 1e-16);
    }

    @Test
    void badInputIsNamed() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> ErrorRates.separableBer(Constellations.psk(8, 0, true), 1));
        assertTrue(e.getMessage().contains("not separable"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> ErrorRates.pamSer(4, -1));
        assertTrue(e.getMessage().contains("not dB"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> ErrorRates.squareQamSer(32, 1));
        assertThrows(IllegalArgumentException.class, () -> ErrorRates.pskSer(6, 1));
        assertThrows(IllegalArgumentException.class, () -> ErrorRates.grayBerFromSer(1.5, 2));
    }
}
