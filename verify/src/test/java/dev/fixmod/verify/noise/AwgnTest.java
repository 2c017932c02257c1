package dev.fixmod.verify.noise;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.lang.management.ManagementFactory;
import org.apache.commons.math3.stat.correlation.PearsonsCorrelation;
import org.apache.commons.math3.stat.descriptive.moment.Variance;
import org.junit.jupiter.api.Test;

class AwgnTest {

    @Test
    void eachDimensionHasVarianceHalfN0AndIAndQAreUncorrelated() {
        int n = 100_000;
        double n0 = 0.5;
        double[] i = new double[n];
        double[] q = new double[n];
        new Awgn(n0, Gaussian.ZIGGURAT).fill(i, 0, q, 0, n, StreamKey.of(1, 2), 0);
        // DESIGN.md convention: N0 is the complex noise power, N0/2 per real dimension. Sample variance
        // (Commons Math) within 5 standard errors, se = (N0/2)·sqrt(2/n) for a normal population.
        double se = n0 / 2 * Math.sqrt(2.0 / n);
        assertEquals(n0 / 2, new Variance().evaluate(i), 5 * se, "var I");
        assertEquals(n0 / 2, new Variance().evaluate(q), 5 * se, "var Q");
        // Independent dimensions: Pearson correlation (Commons Math) within 5/sqrt(n) of zero.
        assertEquals(0.0, new PearsonsCorrelation().correlation(i, q), 5 / Math.sqrt(n), "corr(I, Q)");
    }

    @Test
    void complexSampleMTakesGaussians2mAnd2mPlus1() {
        StreamKey key = StreamKey.of(44, 0);
        int n = 2500; // longer than one internal chunk
        double[] i = new double[n + 3];
        double[] q = new double[n + 1];
        Awgn awgn = new Awgn(2.0, Gaussian.BOX_MULLER);
        awgn.fill(i, 3, q, 1, n, key, 1000);
        assertEquals(1.0, awgn.sigma());
        double[] z = new double[2 * n];
        Gaussian.BOX_MULLER.fill(z, 0, 2 * n, key, 2000);
        for (int k = 0; k < n; k++) {
            assertEquals(z[2 * k], i[3 + k], "I of sample " + (1000 + k));
            assertEquals(z[2 * k + 1], q[1 + k], "Q of sample " + (1000 + k));
        }
        Awgn scaled = new Awgn(0.1, Gaussian.BOX_MULLER);
        double[] i1 = new double[1];
        double[] q1 = new double[1];
        scaled.fill(i1, 0, q1, 0, 1, key, 1000);
        assertEquals(StrictMath.sqrt(0.05) * z[0], i1[0]);
        assertEquals(StrictMath.sqrt(0.05) * z[1], q1[0]);
    }

    @Test
    void aReusedInstanceAllocatesNothingPerFill() {
        // HotSpot's per-thread allocation counter; without it there is nothing to measure.
        assumeTrue(ManagementFactory.getThreadMXBean() instanceof com.sun.management.ThreadMXBean bean
                && bean.isThreadAllocatedMemorySupported() && bean.isThreadAllocatedMemoryEnabled());
        com.sun.management.ThreadMXBean bean = (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        double[] i = new double[2500];
        double[] q = new double[2500];
        StreamKey key = StreamKey.of(3, 12);
        for (Gaussian method : Gaussian.values()) {
            Awgn awgn = new Awgn(0.5, method);
            // Lengths past one internal chunk, odd (a partial Philox block at the end) and from an odd index; the
            // ziggurat's retry path runs on about 2.8 % of its samples, dozens of times per fill.
            int[] lengths = {2500, 1, 1023, 77};
            awgn.fill(i, 0, q, 0, 2500, key, 0); // sizes the scratch
            long base = bean.getCurrentThreadAllocatedBytes();
            long empty = bean.getCurrentThreadAllocatedBytes() - base; // what reading the counter costs, if anything
            long before = bean.getCurrentThreadAllocatedBytes();
            for (int round = 0; round < 3; round++) {
                for (int length : lengths) {
                    awgn.fill(i, 0, q, 0, length, key, 1 + round * 5000L);
                }
            }
            long bytes = bean.getCurrentThreadAllocatedBytes() - before;
            assertEquals(empty, bytes, method + ": bytes allocated by 12 fills of a sized instance");
        }
    }

    @Test
    void rejectsBadNoisePower() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> new Awgn(-1e-3, Gaussian.ZIGGURAT));
        assertEquals("N0 (complex noise power) must be finite and >= 0, got -0.001", e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> new Awgn(Double.NaN, Gaussian.ZIGGURAT));
        assertThrows(IllegalArgumentException.class, () -> new Awgn(Double.POSITIVE_INFINITY, Gaussian.ZIGGURAT));
        double[] i = new double[4];
        double[] q = new double[4];
        new Awgn(0.0, Gaussian.ZIGGURAT).fill(i, 0, q, 0, 4, StreamKey.of(0, 0), 0);
        for (int k = 0; k < 4; k++) {
            assertEquals(0.0, Math.abs(i[k]));
            assertEquals(0.0, Math.abs(q[k]));
        }
    }
}
