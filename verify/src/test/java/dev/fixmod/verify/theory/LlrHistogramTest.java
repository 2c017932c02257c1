package dev.fixmod.verify.theory;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class LlrHistogramTest {
    private static final double LSB = 0.125;

    /** Codes round(scale·L/LSB) saturated to [−127, 127] (a Q4.3-like 8-bit LLR word; our own scenario). */
    private static int[] quantize(double[] llr, double scale) {
        int[] codes = new int[llr.length];
        for (int i = 0; i < llr.length; i++) {
            codes[i] = (int) Math.max(-127, Math.min(127, Math.rint(scale * llr[i] / LSB)));
        }
        return codes;
    }

    @Test
    void equalsThePerSampleEstimatorOnTheSameCodes() {
        double[] sigma = {1.2, 2.4};
        int n = 2 * 20_000;
        double[] llr = new double[n];
        byte[] bits = new byte[n];
        GmiEstimatorTest.consistentGaussian(3, sigma, llr, bits);
        int[] codes = quantize(llr, 1);
        LlrHistogram histogram = new LlrHistogram(2, -127, 127);
        histogram.add(codes, 0, bits, 0, n);
        double[] values = new double[n];
        for (int i = 0; i < n; i++) {
            values[i] = codes[i] * LSB;
        }
        GmiEstimator direct = new GmiEstimator(2);
        direct.add(values, 0, bits, 0, n);
        assertEquals(direct.gmi(), histogram.gmi(LSB), 1e-12);
    }

    @Test
    void bestScaleUndoesAMisscaledDemapper() {
        // LLRs halved before quantization (a demapper that drops a factor 2): the best scale is about 2·LSB and
        // recovers J(σ) up to quantization and sampling error (standard error below 2e-3).
        double sigma = 2.0;
        int n = 100_000;
        double[] llr = new double[n];
        byte[] bits = new byte[n];
        GmiEstimatorTest.consistentGaussian(8, new double[] {sigma}, llr, bits);
        LlrHistogram histogram = new LlrHistogram(1, -127, 127);
        histogram.add(quantize(llr, 0.5), 0, bits, 0, n);
        double best = histogram.bestScale(LSB);
        assertEquals(2 * LSB, best, 0.1 * LSB);
        assertTrue(histogram.gmi(best) > histogram.gmi(LSB));
        assertEquals(Capacity.jFunction(sigma), histogram.gmi(best), 1e-2);
    }

    @Test
    void mergeIsExact() {
        int n = 3000;
        double[] llr = new double[n];
        byte[] bits = new byte[n];
        GmiEstimatorTest.consistentGaussian(21, new double[] {1, 2, 3}, llr, bits);
        int[] codes = quantize(llr, 1);
        LlrHistogram whole = new LlrHistogram(3, -127, 127);
        whole.add(codes, 0, bits, 0, n);
        LlrHistogram a = new LlrHistogram(3, -127, 127);
        LlrHistogram b = new LlrHistogram(3, -127, 127);
        a.add(codes, 0, bits, 0, 1500);
        b.add(codes, 1500, bits, 1500, 1500);
        a.merge(b);
        for (int j = 0; j < 3; j++) {
            for (int bit = 0; bit < 2; bit++) {
                for (int c = -127; c <= 127; c++) {
                    assertEquals(whole.count(j, bit, c), a.count(j, bit, c));
                }
            }
        }
        assertEquals(whole.gmi(LSB), a.gmi(LSB), 0);
    }

    @Test
    void neverWrongLlrsPushTheScaleUp() {
        LlrHistogram histogram = new LlrHistogram(1, -4, 4);
        histogram.add(new int[] {3, -2, 4}, 0, new byte[] {0, 1, 0}, 0, 3);
        double best = histogram.bestScale(LSB);
        assertTrue(best > 10 * LSB, "best scale " + best);
        assertEquals(1, histogram.gmi(best), 1e-12);
    }

    @Test
    void badInputIsNamed() {
        LlrHistogram histogram = new LlrHistogram(2, -8, 7);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> histogram.add(new int[] {9}, 0, new byte[] {0}, 0, 1));
        assertEquals("LLR code 0 is 9, outside [-8, 7]", e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> new LlrHistogram(2, 5, 4));
        assertThrows(IllegalArgumentException.class, () -> histogram.merge(new LlrHistogram(2, -8, 8)));
        assertThrows(IllegalStateException.class, () -> histogram.gmi(1));
        assertThrows(IllegalArgumentException.class, () -> histogram.bestScale(0));
    }
}
