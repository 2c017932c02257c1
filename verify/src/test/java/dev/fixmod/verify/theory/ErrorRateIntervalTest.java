package dev.fixmod.verify.theory;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.math.MathContext;
import org.apache.commons.math3.distribution.ChiSquaredDistribution;
import org.apache.commons.math3.stat.interval.ClopperPearsonInterval;
import org.apache.commons.math3.stat.interval.ConfidenceInterval;
import org.junit.jupiter.api.Test;

class ErrorRateIntervalTest {
    private static final MathContext MC = new MathContext(40);

    @Test
    void zeroErrorsGiveTheTextbookUpperBound() {
        // x = 0: upper = 1 − (α/2)^(1/n) (Clopper and Pearson 1934; the "3.69/n" two-sided 95 % rule, from memory).
        for (long n : new long[] {1, 10, 1000, 1_000_000_000_000L}) {
            ErrorRateInterval ci = ErrorRateInterval.clopperPearson(0, n, 0.95);
            assertEquals(0, ci.lower(), 0);
            assertEquals(1 - Math.pow(0.025, 1.0 / n), ci.upper(), 1e-12 * ci.upper() + 1e-15, "n = " + n);
        }
        assertEquals(3.689 / 1e12, ErrorRateInterval.clopperPearson(0, 1_000_000_000_000L, 0.95).upper(), 1e-15);
    }

    @Test
    void allErrorsMirrorTheZeroCase() {
        ErrorRateInterval ci = ErrorRateInterval.clopperPearson(20, 20, 0.9);
        assertEquals(Math.pow(0.05, 1.0 / 20), ci.lower(), 1e-14);
        assertEquals(1, ci.upper(), 0);
        assertEquals(1, ci.estimate(), 0);
    }

    @Test
    void interiorBoundsSolveTheBinomialTailEquations() {
        // Definition: P(X ≥ x | p_lower) = α/2 and P(X ≤ x | p_upper) = α/2, X ~ Binomial(n, p); the tails are
        // summed exactly in JDK BigDecimal from the returned double bounds.
        int[][] cases = {{1, 10}, {3, 20}, {7, 50}, {49, 50}, {25, 60}};
        for (int[] c : cases) {
            int x = c[0];
            int n = c[1];
            for (double confidence : new double[] {0.9, 0.95, 0.99}) {
                ErrorRateInterval ci = ErrorRateInterval.clopperPearson(x, n, confidence);
                double halfAlpha = (1 - confidence) / 2;
                double upperTail = binomialTail(n, ci.lower(), x, n);
                double lowerTail = binomialTail(n, ci.upper(), 0, x);
                assertEquals(halfAlpha, upperTail, halfAlpha * 1e-9, x + "/" + n + " lower");
                assertEquals(halfAlpha, lowerTail, halfAlpha * 1e-9, x + "/" + n + " upper");
            }
        }
    }

    private static double binomialTail(int n, double p, int from, int to) {
        BigDecimal bp = new BigDecimal(p);
        BigDecimal bq = BigDecimal.ONE.subtract(bp);
        BigDecimal sum = BigDecimal.ZERO;
        BigDecimal choose = BigDecimal.ONE;
        for (int i = 0; i <= n; i++) {
            if (i > 0) {
                choose = choose.multiply(BigDecimal.valueOf(n - i + 1)).divide(BigDecimal.valueOf(i), MC);
            }
            if (i >= from && i <= to) {
                sum = sum.add(choose.multiply(bp.pow(i, MC), MC).multiply(bq.pow(n - i, MC), MC), MC);
            }
        }
        return sum.doubleValue();
    }

    @Test
    void agreesWithCommonsMathInTheInterior() {
        // Commons Math's ClopperPearsonInterval uses the F-distribution form; ours the Beta form.
        ConfidenceInterval cm = new ClopperPearsonInterval().createInterval(1000, 17, 0.95);
        ErrorRateInterval ours = ErrorRateInterval.clopperPearson(17, 1000, 0.95);
        assertEquals(cm.getLowerBound(), ours.lower(), 1e-9 * ours.lower());
        assertEquals(cm.getUpperBound(), ours.upper(), 1e-9 * ours.upper());
    }

    @Test
    void largeCountsApproachThePoissonInterval() {
        // For n → ∞ with x fixed the binomial interval tends to Garwood's Poisson interval
        // [χ²(α/2; 2x)/2, χ²(1 − α/2; 2x + 2)/2] / n (Garwood, Biometrika 28, 1936), here from Commons Math's
        // chi-squared quantiles; relative difference of order x/n.
        long n = 10_000_000_000L;
        int x = 100;
        ErrorRateInterval ci = ErrorRateInterval.clopperPearson(x, n, 0.95);
        double lower = new ChiSquaredDistribution(null, 2.0 * x, 1e-300).inverseCumulativeProbability(0.025) / 2 / n;
        double upper = new ChiSquaredDistribution(null, 2.0 * x + 2, 1e-300).inverseCumulativeProbability(0.975) / 2 / n;
        assertEquals(lower, ci.lower(), lower * 1e-6);
        assertEquals(upper, ci.upper(), upper * 1e-6);
        assertTrue(ci.contains(ci.estimate()));
    }

    @Test
    void badInputIsNamed() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> ErrorRateInterval.clopperPearson(5, 4, 0.95));
        assertEquals("errors must be in 0..4 (the trials), got 5", e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> ErrorRateInterval.clopperPearson(0, 0, 0.95));
        assertThrows(IllegalArgumentException.class, () -> ErrorRateInterval.clopperPearson(1, 4, 1.0));
        assertThrows(IllegalArgumentException.class, () -> new ErrorRateInterval(1, 4, 0.5, 0.2, 0.95));
    }
}
