package dev.fixmod.demap;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.constellation.Constellation;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.DoubleRange;

/** The laws between the floating-point soft demappers. */
class SoftDemapperProperties {

    @Provide
    Arbitrary<Constellation> separable() {
        return Arbitraries.of(DemapFixtures.SEPARABLE);
    }

    @Provide
    Arbitrary<Constellation> gray() {
        return Arbitraries.of(DemapFixtures.GRAY_SEPARABLE);
    }

    @Provide
    Arbitrary<Constellation> any() {
        return Arbitraries.of(DemapFixtures.ALL);
    }

    /** A sample spread over the constellation and somewhat beyond it. */
    private static double sample(Constellation c, double u) {
        return u * (1.5 * DemapFixtures.peak(c) + 0.5);
    }

    private static double[] llr(SoftDemapper d, double re, double im) {
        double[] out = new double[d.bitsPerSymbol()];
        d.llr(re, im, out, 0);
        return out;
    }

    @Property(tries = 200)
    void perAxisMaxLogEqualsExhaustiveMaxLog(@ForAll("separable") Constellation c,
                                              @ForAll @DoubleRange(min = -1, max = 1) double u,
                                              @ForAll @DoubleRange(min = -1, max = 1) double v,
                                              @ForAll @DoubleRange(min = 0.01, max = 10) double n0) {
        // Separability: |y − s|² = (yI − sI)² + (yQ − sQ)², and each bit lives on one axis (common practice).
        double re = sample(c, u);
        double im = sample(c, v);
        LlrOptions o = LlrOptions.of(n0);
        double[] a = llr(new PerAxisMaxLogDemapper(c, o), re, im);
        double[] e = llr(new MaxLogDemapper(c, o), re, im);
        double scale = 2 * Math.pow(Math.abs(re) + Math.abs(im) + DemapFixtures.peak(c), 2) / n0;
        for (int b = 0; b < a.length; b++) {
            // 1e-9 relative, with a floor for the exhaustive form's cancellation of the other axis's term.
            assertEquals(e[b], a[b], 1e-9 * Math.abs(e[b]) + 1e-13 * scale, c.name() + " bit " + b);
        }
    }

    @Property(tries = 200)
    void logMapStaysWithinLnHalfMOfMaxLog(@ForAll("any") Constellation c,
                                          @ForAll @DoubleRange(min = -1, max = 1) double u,
                                          @ForAll @DoubleRange(min = -1, max = 1) double v,
                                          @ForAll @DoubleRange(min = 0.01, max = 10) double n0) {
        // max_i a_i <= ln Σ e^{a_i} <= max_i a_i + ln n for n = M/2 terms per half, so the two LLRs differ by at most
        // ln(M/2) (the textbook bound of the max-log approximation; common practice, no source).
        double re = sample(c, u);
        double im = sample(c, v);
        LlrOptions o = LlrOptions.of(n0);
        double[] exact = llr(new LogMapDemapper(c, o), re, im);
        double[] approx = llr(new MaxLogDemapper(c, o), re, im);
        double bound = Math.log(c.size() / 2.0);
        for (int b = 0; b < exact.length; b++) {
            assertTrue(Math.abs(exact[b] - approx[b]) <= bound + 1e-9 * (1 + Math.abs(exact[b])),
                    c.name() + " bit " + b + ": log-MAP " + exact[b] + ", max-log " + approx[b] + ", bound " + bound);
        }
    }

    @Property(tries = 200)
    void foldedLinearKeepsTheSignAndNeverExceedsMaxLog(@ForAll("gray") Constellation c,
                                                       @ForAll @DoubleRange(min = -1, max = 1) double u,
                                                       @ForAll @DoubleRange(min = -1, max = 1) double v,
                                                       @ForAll @DoubleRange(min = 0.01, max = 10) double n0) {
        // The documented behaviour of FoldedLinearDemapper: same slope as max-log between zero crossings, shallower
        // elsewhere.
        double re = sample(c, u);
        double im = sample(c, v);
        LlrOptions o = LlrOptions.of(n0);
        double[] folded = llr(new FoldedLinearDemapper(c, o), re, im);
        double[] maxLog = llr(new PerAxisMaxLogDemapper(c, o), re, im);
        for (int b = 0; b < folded.length; b++) {
            double tol = 1e-9 * (1 + Math.abs(maxLog[b]));
            assertTrue(folded[b] * maxLog[b] >= -tol * tol, c.name() + " bit " + b + " sign");
            assertTrue(Math.abs(folded[b]) <= Math.abs(maxLog[b]) + tol, c.name() + " bit " + b + " magnitude: folded "
                    + folded[b] + ", max-log " + maxLog[b]);
        }
    }

    @Property(tries = 200)
    void mirroringTheSampleNegatesExactlyTheBitsTheMirrorFlips(@ForAll("any") Constellation c,
                                                             @ForAll @DoubleRange(min = -1, max = 1) double u,
                                                             @ForAll @DoubleRange(min = -1, max = 1) double v,
                                                             @ForAll @DoubleRange(min = 0.05, max = 5) double n0) {
        // If mirroring the constellation (re → −re) maps every label s to s XOR mask, then P(b|−y) = P(b ⊕ mask_b|y):
        // LLRs of masked bits are odd in yI, the others even (common practice, no source).
        int mask = DemapFixtures.mirrorMask(c);
        if (mask < 0) {
            return; // not symmetric under this mirror: nothing to state
        }
        double re = sample(c, u);
        double im = sample(c, v);
        LlrOptions o = LlrOptions.of(n0);
        int k = c.bitsPerSymbol();
        for (SoftAlgorithm algorithm : SoftAlgorithm.values()) {
            SoftDemapper d;
            try {
                d = SoftDemapper.create(algorithm, c, o);
            } catch (IllegalArgumentException notApplicable) {
                continue;
            }
            double[] at = llr(d, re, im);
            double[] mirrored = llr(d, -re, im);
            for (int b = 0; b < k; b++) {
                double parity = ((mask >>> (k - 1 - b)) & 1) == 1 ? -1 : 1;
                // Exact for the max-log forms; log-MAP sums in another order, and segment boundaries may round apart.
                assertEquals(parity * at[b], mirrored[b], 1e-12 * (1 + Math.abs(at[b])),
                        algorithm + " " + c.name() + " bit " + b);
            }
        }
    }

    @Property(tries = 200)
    void oneInstanceServesManySamplesAndTheBatchMatchesSingleCalls(@ForAll("any") Constellation c,
                                                                  @ForAll @DoubleRange(min = -1, max = 1) double u,
                                                                  @ForAll @DoubleRange(min = -1, max = 1) double v) {
        LlrOptions o = new LlrOptions(0.3, LlrSign.ONE_POSITIVE, true);
        for (SoftAlgorithm algorithm : SoftAlgorithm.values()) {
            SoftDemapper d;
            try {
                d = SoftDemapper.create(algorithm, c, o);
            } catch (IllegalArgumentException notApplicable) {
                continue;
            }
            int k = d.bitsPerSymbol();
            double[] re = {sample(c, u), sample(c, v), 0.0};
            double[] im = {sample(c, v), sample(c, -u), sample(c, u)};
            double[] batch = new double[2 + 3 * k];
            d.llr(re, im, 0, 3, batch, 2);
            for (int n = 0; n < 3; n++) {
                double[] single = llr(d, re[n], im[n]);
                for (int b = 0; b < k; b++) {
                    assertEquals(single[b], batch[2 + n * k + b], 0.0, algorithm + " sample " + n + " bit " + b);
                }
            }
        }
    }
}
