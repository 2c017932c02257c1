package dev.fixmod.demap;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Constellations;
import dev.fixmod.constellation.Normalization;
import java.math.BigDecimal;
import org.junit.jupiter.api.Test;

/**
 * Exact log-MAP against an independent evaluation of the definition of the bit LLR,
 * {@code L(b) = ln P(b=0|y) − ln P(b=1|y)} with Gaussian likelihoods {@code e^{−|y−s|²/N0}} (common practice, e.g.
 * the bit metrics of bit-interleaved coded modulation), computed by {@link BigDecimalLlr} at 50 digits.
 */
class LogMapReferenceTest {

    @Test
    void theBigDecimalSeriesReproduceWellKnownConstants() {
        // e and ln 2 to 30 digits (well-known constants, from memory).
        assertEquals(new BigDecimal("2.71828182845904523536028747135"),
                BigDecimalLlr.exp(BigDecimal.ONE).setScale(29, java.math.RoundingMode.HALF_EVEN));
        assertEquals(new BigDecimal("0.693147180559945309417232121458"),
                BigDecimalLlr.ln(BigDecimal.valueOf(2)).setScale(30, java.math.RoundingMode.HALF_EVEN));
        BigDecimal x = new BigDecimal("-700.25");
        assertTrue(BigDecimalLlr.ln(BigDecimalLlr.exp(x)).subtract(x).abs().compareTo(new BigDecimal("1e-40")) < 0,
                "ln(exp(x)) = x far below the double range");
    }

    @Test
    void sixteenQamAtSeveralSamplesAndNoiseLevels() {
        Constellation qam16 = Constellations.qam(16, true).normalized(Normalization.UNIT_ENERGY);
        double[][] samples = {{0.1, -0.3}, {1.2, 0.9}, {-3.0, 2.5}, {0.0, 0.0}, {0.3162, -0.9487}};
        for (double n0 : new double[] {1.0, 0.1, 0.01}) {
            for (double[] y : samples) {
                check(qam16, y[0], y[1], n0, true);
            }
        }
    }

    @Test
    void eightPskAndSixtyFourQamFarOutAtLowNoise() {
        // At N0 = 1e-3 a 64-QAM metric spans thousands of nats: the weaker half falls outside the shared range of
        // exponentials, so this also exercises the per-half log-sum-exp.
        check(Constellations.psk(8, 0.0, true), 0.7, 0.2, 0.5, true);
        check(Constellations.psk(8, 0.0, true), -0.05, 0.9, 0.02, true);
        Constellation qam64 = Constellations.qam(64, true).normalized(Normalization.UNIT_ENERGY);
        check(qam64, 0.5, -0.9, 1e-3, true);
        check(qam64, 2.5, 2.5, 1e-3, true);
        check(qam64, -0.02, 0.7, 0.3, true);
    }

    @Test
    void nonUniformPriorsEnterAsLogProbabilities() {
        // A shaped 16-QAM of our own: p(s) proportional to exp(-0.1|s|^2) on the odd grid (a demo scenario).
        Constellation grid = Constellations.qam(16, true);
        double[] p = new double[16];
        double sum = 0;
        for (int s = 0; s < 16; s++) {
            p[s] = StrictMath.exp(-0.1 * (grid.re(s) * grid.re(s) + grid.im(s) * grid.im(s)));
            sum += p[s];
        }
        for (int s = 0; s < 16; s++) {
            p[s] /= sum;
        }
        Constellation shaped = grid.withProbabilities(p);
        check(shaped, 1.7, -2.2, 2.0, true);
        check(shaped, 0.4, 3.1, 0.5, true);
        check(shaped, 0.4, 3.1, 0.5, false);
    }

    private static void check(Constellation c, double re, double im, double n0, boolean priors) {
        LogMapDemapper d = new LogMapDemapper(c, new LlrOptions(n0, LlrSign.ZERO_POSITIVE, priors));
        double[] got = new double[c.bitsPerSymbol()];
        d.llr(re, im, got, 0);
        double[] want = BigDecimalLlr.llr(c, re, im, n0, priors && !c.isUniform());
        int k = got.length;
        for (int b = 0; b < k; b++) {
            // Doubles carry the metrics: the error scales with the larger of the two halves' best metrics.
            double[] best = {Double.POSITIVE_INFINITY, Double.POSITIVE_INFINITY};
            for (int s = 0; s < c.size(); s++) {
                double dr = re - c.re(s);
                double di = im - c.im(s);
                int bit = (s >>> (k - 1 - b)) & 1;
                best[bit] = Math.min(best[bit], (dr * dr + di * di) / n0);
            }
            double tolerance = 1e-12 * (1 + Math.abs(want[b]) + Math.max(best[0], best[1]));
            assertEquals(want[b], got[b], tolerance, c.name() + " y=(" + re + ", " + im + ") N0=" + n0 + " bit " + b);
        }
        LogMapDemapper flipped = new LogMapDemapper(c, new LlrOptions(n0, LlrSign.ONE_POSITIVE, priors));
        double[] negated = new double[got.length];
        flipped.llr(re, im, negated, 0);
        for (int b = 0; b < got.length; b++) {
            assertTrue(-got[b] == negated[b], "one-positive is the exact negation, bit " + b);
        }
    }
}
