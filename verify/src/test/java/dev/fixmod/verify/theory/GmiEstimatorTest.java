package dev.fixmod.verify.theory;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.junit.jupiter.api.Test;

class GmiEstimatorTest {
    /** Consistent Gaussian LLRs L = (1 − 2b)·(σ²/2 + σ·n), n standard normal, for random bits (our own scenario). */
    static void consistentGaussian(long seed, double[] sigmaByPosition, double[] llr, byte[] bits) {
        Random random = new Random(seed);
        int k = sigmaByPosition.length;
        for (int i = 0; i < llr.length; i++) {
            double sigma = sigmaByPosition[i % k];
            bits[i] = (byte) random.nextInt(2);
            double magnitude = sigma * sigma / 2 + sigma * random.nextGaussian();
            llr[i] = bits[i] == 0 ? magnitude : -magnitude;
        }
    }

    @Test
    void consistentGaussianLlrsGiveTheJFunction() {
        // The estimate of a consistent Gaussian LLR converges on J(σ) (ten Brink, IEEE Trans. Commun. 49(10), 2001,
        // from memory); 200 000 samples per position: standard error below 2e-3.
        double[] sigma = {1.0, 2.0, 3.5};
        int n = 3 * 200_000;
        double[] llr = new double[n];
        byte[] bits = new byte[n];
        consistentGaussian(11, sigma, llr, bits);
        GmiEstimator estimator = new GmiEstimator(3);
        estimator.add(llr, 0, bits, 0, n);
        double sum = 0;
        for (int j = 0; j < 3; j++) {
            assertEquals(Capacity.jFunction(sigma[j]), estimator.gmi(j), 6e-3, "position " + j);
            assertEquals(200_000, estimator.count(j));
            sum += estimator.gmi(j);
        }
        assertEquals(sum, estimator.gmi(), 1e-12);
    }

    @Test
    void chunksNeedNotEndOnSymbolsAndMergeAfterWholeSymbols() {
        double[] sigma = {1.5, 2.5};
        int n = 2 * 5000;
        double[] llr = new double[n];
        byte[] bits = new byte[n];
        consistentGaussian(5, sigma, llr, bits);
        GmiEstimator whole = new GmiEstimator(2);
        whole.add(llr, 0, bits, 0, n);
        GmiEstimator chunked = new GmiEstimator(2);
        for (int start = 0; start < n; start += 7) {
            chunked.add(llr, start, bits, start, Math.min(7, n - start));
        }
        assertEquals(whole.gmi(0), chunked.gmi(0), 0);
        assertEquals(whole.gmi(1), chunked.gmi(1), 0);
        GmiEstimator first = new GmiEstimator(2);
        GmiEstimator second = new GmiEstimator(2);
        first.add(llr, 0, bits, 0, n / 2);
        second.add(llr, n / 2, bits, n / 2, n / 2);
        first.merge(second);
        assertEquals(whole.gmi(), first.gmi(), 1e-12);
        GmiEstimator odd = new GmiEstimator(2);
        odd.add(llr, 0, bits, 0, 3);
        assertThrows(IllegalArgumentException.class, () -> whole.merge(odd));
    }

    @Test
    void edgeCasesOfTheEstimate() {
        GmiEstimator perfect = new GmiEstimator(1);
        perfect.add(new double[] {Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY}, 0, new byte[] {0, 1}, 0, 2);
        assertEquals(1, perfect.gmi(), 0);
        GmiEstimator erased = new GmiEstimator(1);
        erased.add(new double[] {0, 0, -0.0}, 0, new byte[] {0, 1, 1}, 0, 3);
        assertEquals(0, erased.gmi(), 1e-15);
        GmiEstimator wrong = new GmiEstimator(1);
        wrong.add(new double[] {-10}, 0, new byte[] {0}, 0, 1);
        // log2(1 + e^10) = 14.43 bits lost on one bit.
        assertEquals(1 - Math.log1p(Math.exp(10)) / Math.log(2), wrong.gmi(), 1e-12);
        assertTrue(wrong.gmi() < 0);
    }

    @Test
    void badInputIsNamed() {
        GmiEstimator estimator = new GmiEstimator(2);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> estimator.add(new double[] {1}, 0, new byte[] {2}, 0, 1));
        assertEquals("bit 0 is 2; bits must be 0 or 1", e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> estimator.add(new double[] {Double.NaN}, 0, new byte[] {0}, 0, 1));
        assertThrows(IllegalArgumentException.class, () -> estimator.add(new double[2], 1, new byte[2], 0, 2));
        assertThrows(IllegalStateException.class, estimator::gmi);
        assertThrows(IllegalArgumentException.class, () -> estimator.gmi(2));
        assertThrows(IllegalArgumentException.class, () -> new GmiEstimator(0));
    }
}
