package dev.fixmod.verify.theory;

import dev.fixmod.constellation.Constellation;
import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;

/**
 * Test reference, independent of the Gauss–Hermite rule under test: the coded-modulation and bit-metric rates of a
 * one-dimensional constellation (real parts only) on real Gaussian noise of variance N0/2, by adaptive Gauss–Legendre
 * integration (Commons Math) over ±12σ around each point, in 48 pieces (each to 1e−12 relative or 1e−14 absolute). Straight from the definitions
 * I(X;Y) = H(X) − H(X|Y) and H(X) − Σ_j H(B_j|Y).
 */
final class PamReference {
    private PamReference() {
    }

    static double rate(Constellation c, double esN0, boolean bitwise) {
        int m = c.size();
        int k = c.bitsPerSymbol();
        double n0 = c.averageEnergy() / esN0;
        double sigma = Math.sqrt(n0 / 2);
        double entropy = 0;
        for (int s = 0; s < m; s++) {
            double p = c.probability(s);
            if (p > 0) {
                entropy -= p * Math.log(p) / Math.log(2);
            }
        }
        IterativeLegendreGaussIntegrator integrator = new IterativeLegendreGaussIntegrator(16, 1e-12, 1e-14);
        double conditional = 0;
        for (int i = 0; i < m; i++) {
            if (c.probability(i) == 0) {
                continue;
            }
            int sent = i;
            double xi = c.re(i);
            double lo = -12 * sigma;
            double hi = 12 * sigma;
            int pieces = 48;
            double expected = 0;
            for (int piece = 0; piece < pieces; piece++) {
                double a = lo + (hi - lo) * piece / pieces;
                double b = lo + (hi - lo) * (piece + 1) / pieces;
                expected += integrator.integrate(100_000_000, z -> {
                    double density = Math.exp(-z * z / (2 * sigma * sigma)) / (Math.sqrt(2 * Math.PI) * sigma);
                    double y = xi + z;
                    // Likelihoods relative to the sent point's, to stay in range.
                    double[] weight = new double[m];
                    double all = 0;
                    for (int j = 0; j < m; j++) {
                        double d = y - c.re(j);
                        weight[j] = c.probability(j) * Math.exp(-(d * d - z * z) / n0);
                        all += weight[j];
                    }
                    double loss;
                    if (!bitwise) {
                        loss = Math.log(all / weight[sent]);
                    } else {
                        loss = 0;
                        for (int bit = 0; bit < k; bit++) {
                            double same = 0;
                            for (int j = 0; j < m; j++) {
                                if ((((j ^ sent) >>> (k - 1 - bit)) & 1) == 0) {
                                    same += weight[j];
                                }
                            }
                            loss += Math.log(all / same);
                        }
                    }
                    return density * loss / Math.log(2);
                }, a, b);
            }
            conditional += c.probability(i) * expected;
        }
        return entropy - conditional;
    }
}
