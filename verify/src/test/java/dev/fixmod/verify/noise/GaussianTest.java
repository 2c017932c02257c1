package dev.fixmod.verify.noise;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.special.Erf;
import org.apache.commons.math3.stat.descriptive.moment.Kurtosis;
import org.apache.commons.math3.stat.descriptive.moment.Mean;
import org.apache.commons.math3.stat.descriptive.moment.Skewness;
import org.apache.commons.math3.stat.descriptive.moment.Variance;
import org.apache.commons.math3.stat.inference.KolmogorovSmirnovTest;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;
import org.junit.jupiter.api.Test;

/**
 * Chunk and thread independence, and statistical sanity against Apache Commons Math (reference library). Every
 * stream here has a fixed key, so each statistical check gives the same verdict on every run: it cannot flake,
 * and the bounds (several standard errors) were not tuned to the observed values.
 */
class GaussianTest {

    private static final int N = 100_000;

    private static double[] samples(Gaussian method, StreamKey key, long first, int n) {
        double[] out = new double[n];
        method.fill(out, 0, n, key, first);
        return out;
    }

    @ParameterizedTest
    @EnumSource(Gaussian.class)
    void randomChunksGiveTheSameSamplesAsOneFill(Gaussian method) {
        StreamKey key = StreamKey.of(123, 4);
        double[] whole = samples(method, key, 5, 20_000);
        double[] chunked = new double[whole.length];
        SplittableRandom random = new SplittableRandom(8);
        int done = 0;
        while (done < whole.length) {
            int len = Math.min(whole.length - done, random.nextInt(1, 300));
            method.fill(chunked, done, len, key, 5 + done);
            done += len;
        }
        assertArrayEquals(whole, chunked);
        assertEquals(whole[777], method.sample(key, 5 + 777));
    }

    @ParameterizedTest
    @EnumSource(Gaussian.class)
    void twoThreadsGiveTheSameSamplesAsOne(Gaussian method) throws Exception {
        StreamKey key = StreamKey.of(5, 77);
        double[] one = samples(method, key, 0, 50_001);
        double[] two = new double[one.length];
        ExecutorService pool = Executors.newFixedThreadPool(2);
        try {
            Future<?> a = pool.submit(() -> method.fill(two, 0, 25_001, key, 0));
            Future<?> b = pool.submit(() -> method.fill(two, 25_001, 25_000, key, 25_001));
            a.get();
            b.get();
        } finally {
            pool.shutdown();
        }
        assertArrayEquals(one, two);
    }

    @ParameterizedTest
    @EnumSource(Gaussian.class)
    void kolmogorovSmirnovAgainstCommonsMathNormal(Gaussian method) {
        double[] z = samples(method, StreamKey.of(2024, 1), 0, N);
        // Reference: Commons Math NormalDistribution(0, 1) and its KolmogorovSmirnovTest.
        double p = new KolmogorovSmirnovTest().kolmogorovSmirnovTest(new NormalDistribution(null, 0, 1), z, false);
        assertTrue(p > 0.001, method + ": KS p-value " + p);
    }

    @ParameterizedTest
    @EnumSource(Gaussian.class)
    void firstFourMomentsAreThoseOfTheStandardNormal(Gaussian method) {
        double[] z = samples(method, StreamKey.of(31, 41), 0, N);
        // Bounds: 5 standard errors of each estimator for a normal population (handbook: se(mean) = 1/sqrt(n),
        // se(var) = sqrt(2/n), se(skew) ~ sqrt(6/n), se(excess kurtosis) ~ sqrt(24/n)).
        assertEquals(0.0, new Mean().evaluate(z), 5 / Math.sqrt(N), "mean");
        assertEquals(1.0, new Variance().evaluate(z), 5 * Math.sqrt(2.0 / N), "variance");
        assertEquals(0.0, new Skewness().evaluate(z), 5 * Math.sqrt(6.0 / N), "skewness");
        assertEquals(0.0, new Kurtosis().evaluate(z), 5 * Math.sqrt(24.0 / N), "excess kurtosis");
    }

    @Test
    void zigguratAndBoxMullerHaveTheSameMomentsButDifferentNumbers() {
        StreamKey key = StreamKey.of(8, 9);
        double[] zig = samples(Gaussian.ZIGGURAT, key, 0, N);
        double[] bm = samples(Gaussian.BOX_MULLER, key, 0, N);
        // Two independent estimates: the difference has sqrt(2) times one estimator's standard error.
        double s = Math.sqrt(2.0);
        assertEquals(new Variance().evaluate(bm), new Variance().evaluate(zig), 5 * s * Math.sqrt(2.0 / N));
        assertEquals(new Kurtosis().evaluate(bm), new Kurtosis().evaluate(zig), 5 * s * Math.sqrt(24.0 / N));
        assertNotEquals(bm[0], zig[0]);
    }

    @ParameterizedTest
    @EnumSource(Gaussian.class)
    void tailFrequenciesMatchTheNormalTail(Gaussian method) {
        int n = 1_000_000;
        double[] z = samples(method, StreamKey.of(3, 5), 0, n);
        NormalDistribution normal = new NormalDistribution(null, 0, 1);
        // The ziggurat's base-strip threshold R and two further points; expected counts from Commons Math.
        for (double t : new double[] {2.0, Ziggurat.R, 4.0}) {
            long beyond = 0;
            for (double v : z) {
                beyond += Math.abs(v) > t ? 1 : 0;
            }
            double p = 2 * normal.cumulativeProbability(-t);
            double expected = n * p;
            double sd = Math.sqrt(n * p * (1 - p));
            assertEquals(expected, beyond, 5 * sd + 1, method + ": samples beyond |" + t + "|");
        }
    }

    @Test
    void zigguratTablesHaveEqualLayerAreas() {
        // Marsaglia & Tsang's construction: every layer has area V; the base strip is R·f(R) plus the tail
        // ∫_R^∞ exp(−x²/2) dx = sqrt(π/2)·erfc(R/√2) (tail integral via Commons Math Erf.erfc).
        double[] x = Ziggurat.X;
        double[] y = Ziggurat.Y;
        double tail = Math.sqrt(Math.PI / 2) * Erf.erfc(Ziggurat.R / Math.sqrt(2));
        assertEquals(Ziggurat.V, Ziggurat.R * Ziggurat.f(Ziggurat.R) + tail, 1e-12, "base strip");
        assertEquals(0.0, y[0]);
        for (int i = 0; i < Ziggurat.LAYERS - 1; i++) {
            // Equal by construction, up to rounding of the recursion.
            assertEquals(Ziggurat.V, x[i] * (y[i + 1] - y[i]), 1e-15, "layer " + i);
            assertTrue(x[i + 1] < x[i], "edges decrease at " + i);
        }
        // The top layer closes at the peak (height up to f(0) = 1): the one condition that tests the published
        // R and V themselves. They have 13 significant digits, amplified through 126 steps of the recursion:
        // closure holds to about 1e-9 relative (the bound leaves a factor of ~8), not to rounding level.
        int top = Ziggurat.LAYERS - 1;
        assertEquals(Ziggurat.V, x[top] * (1.0 - y[top]), 1e-8 * Ziggurat.V, "top layer");
        assertEquals(1.0, y[Ziggurat.LAYERS]);
        assertEquals(0.0, x[Ziggurat.LAYERS]);
    }

    @Test
    void namesAndBadInput() {
        assertEquals(Gaussian.ZIGGURAT, Gaussian.fromName(" Ziggurat "));
        assertEquals(Gaussian.BOX_MULLER, Gaussian.fromName("box-muller"));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Gaussian.fromName("polar"));
        assertEquals("unknown Gaussian method 'polar'; expected box-muller or ziggurat", e.getMessage());
        IllegalArgumentException idx = assertThrows(IllegalArgumentException.class,
                () -> Gaussian.ZIGGURAT.fill(new double[3], 0, 3, StreamKey.of(0, 0), Long.MAX_VALUE - 1));
        assertEquals("3 Gaussian samples from index 9223372036854775806 would pass the largest index"
                + " 9223372036854775807", idx.getMessage());
        assertEquals("first Gaussian sample index must be 0..9223372036854775807, got -1",
                assertThrows(IllegalArgumentException.class, () -> Gaussian.BOX_MULLER.fill(new double[1], 0, 1,
                        StreamKey.of(0, 0), -1)).getMessage());
        double[] last = new double[2];
        Gaussian.ZIGGURAT.fill(last, 0, 2, StreamKey.of(0, 0), Long.MAX_VALUE - 1);
        assertTrue(Double.isFinite(last[0]) && Double.isFinite(last[1]));
    }
}
