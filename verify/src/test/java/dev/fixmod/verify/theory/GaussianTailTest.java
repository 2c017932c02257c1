package dev.fixmod.verify.theory;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.junit.jupiter.api.Test;

class GaussianTailTest {
    @Test
    void matchesTabulatedValues() {
        // Standard normal tail table (e.g. Abramowitz & Stegun, Table 26.1, as 1 − P(x)); values from memory.
        double[][] table = {
            {1, 0.158655253931457}, {2, 0.0227501319481792}, {3, 1.34989803163009e-3},
            {4, 3.16712418331199e-5}, {5, 2.86651571879194e-7}, {6, 9.86587645037698e-10},
        };
        for (double[] row : table) {
            assertEquals(row[1], GaussianTail.q(row[0]), row[1] * 1e-12, "Q(" + row[0] + ")");
        }
        assertEquals(0.5, GaussianTail.q(0), 0);
        assertEquals(1 - 0.158655253931457, GaussianTail.q(-1), 1e-15);
    }

    @Test
    void matchesNumericalIntegrationOfTheDensity() {
        // Independent method: integrate the standard normal density with Commons Math's Gauss–Legendre integrator.
        IterativeLegendreGaussIntegrator integrator = new IterativeLegendreGaussIntegrator(16, 1e-13, 1e-300);
        for (double x : new double[] {0.3, 1.7, 3.5, 7.0, 12.0}) {
            double tail = integrator.integrate(1_000_000,
                    t -> StrictMath.exp(-t * t / 2) / StrictMath.sqrt(2 * StrictMath.PI), x, x + 30);
            assertEquals(tail, GaussianTail.q(x), tail * 1e-11, "Q(" + x + ")");
        }
    }

    @Test
    void inverseMatchesKnownQuantilesAndRoundTrips() {
        // Q^-1(1e-5) = 4.26489 and Q^-1(1e-6) = 4.75342: standard normal quantile tables (from memory).
        assertEquals(4.26489, GaussianTail.inverseQ(1e-5), 1e-5);
        assertEquals(4.75342, GaussianTail.inverseQ(1e-6), 1e-5);
        for (double p : new double[] {1e-300, 1e-20, 1e-9, 0.01, 0.3, 0.5, 0.7, 0.999999}) {
            double x = GaussianTail.inverseQ(p);
            assertEquals(p, GaussianTail.q(x), p * 1e-12, "Q(Q^-1(" + p + "))");
        }
    }

    @Test
    void edgesAndBadInput() {
        assertEquals(0, GaussianTail.q(Double.POSITIVE_INFINITY), 0);
        assertEquals(1, GaussianTail.q(Double.NEGATIVE_INFINITY), 0);
        assertEquals(0, GaussianTail.q(40), 0);
        assertThrows(IllegalArgumentException.class, () -> GaussianTail.q(Double.NaN));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> GaussianTail.inverseQ(0));
        assertTrue(e.getMessage().contains("strictly between 0 and 1"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> GaussianTail.inverseQ(1));
        assertThrows(IllegalArgumentException.class, () -> GaussianTail.inverseQ(Double.MIN_VALUE));
    }
}
