package dev.fixmod.demap;

import dev.fixmod.constellation.Constellation;

/**
 * Exhaustive max-log: {@code L(b) = max_{s: b=0} μ(s) − max_{s: b=1} μ(s)} over all M symbols, with
 * {@code μ(s) = −|y − s|²/N0 (+ ln p(s) with priors)}, times the {@link LlrSign} factor. Without priors this is
 * {@code (min_{b=1} |y − s|² − min_{b=0} |y − s|²)/N0}. It applies to every constellation, and is the reference the
 * per-axis closed form is checked against. A half whose symbols all have probability 0 gives an infinite LLR.
 *
 * <p>Not thread-safe: holds an M-entry scratch array.
 */
public final class MaxLogDemapper extends SoftDemapper {
    private final double[] re;
    private final double[] im;
    private final double[] logPrior;
    private final boolean priors;
    private final double invN0;
    private final BitPartition partition;
    private final double[] distance;

    public MaxLogDemapper(Constellation constellation, LlrOptions options) {
        super(SoftAlgorithm.MAX_LOG, constellation, options);
        int m = constellation.size();
        this.re = constellation.realParts();
        this.im = constellation.imaginaryParts();
        this.priors = options.usesPriors(constellation);
        this.logPrior = new double[m];
        for (int label = 0; label < m; label++) {
            logPrior[label] = priors ? StrictMath.log(constellation.probability(label)) : 0.0;
        }
        this.invN0 = 1.0 / options.n0();
        this.partition = new BitPartition(bitsPerSymbol);
        this.distance = new double[m];
    }

    @Override
    void compute(double yRe, double yIm, double[] llr, int llrOffset) {
        for (int s = 0; s < distance.length; s++) {
            double dr = yRe - re[s];
            double di = yIm - im[s];
            distance[s] = dr * dr + di * di;
        }
        double sign = options.sign().factor();
        for (int b = 0; b < bitsPerSymbol; b++) {
            double l;
            if (priors) {
                l = bestMetric(partition.zeros[b]) - bestMetric(partition.ones[b]);
            } else {
                l = (nearest(partition.ones[b]) - nearest(partition.zeros[b])) * invN0;
            }
            llr[llrOffset + b] = sign * l + 0.0; // + 0.0 turns −0.0 into 0.0
        }
    }

    private double nearest(int[] labels) {
        double min = Double.POSITIVE_INFINITY;
        for (int s : labels) {
            min = Math.min(min, distance[s]);
        }
        return min;
    }

    private double bestMetric(int[] labels) {
        double max = Double.NEGATIVE_INFINITY;
        for (int s : labels) {
            max = Math.max(max, logPrior[s] - distance[s] * invN0);
        }
        return max;
    }
}
