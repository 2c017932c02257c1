package dev.fixmod.demap;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.map.DatapathCost;

/**
 * Exhaustive max-log: {@code L(b) = max_{s: b=0} μ(s) − max_{s: b=1} μ(s)} over all M symbols, with
 * {@code μ(s) = −|y − s|²/N0 (+ ln p(s) with priors)}, times the {@link LlrSign} factor. Without priors this is
 * {@code (min_{b=1} |y − s|² − min_{b=0} |y − s|²)/N0}. It applies to every constellation, and is the reference the
 * per-axis closed form is checked against. A half whose symbols all have probability 0 gives an infinite LLR.
 *
 * <p>Not thread-safe: holds an M-entry scratch array.
 */
public final class MaxLogDemapper extends ExhaustiveDemapper {
    /** Per point: the squared distance, or with priors the metric {@code ln p(s) − d/N0}. */
    private final double[] distance;

    public MaxLogDemapper(Constellation constellation, LlrOptions options) {
        super(SoftAlgorithm.MAX_LOG, constellation, options);
        this.distance = new double[constellation.size()];
    }

    @Override
    void compute(double yRe, double yIm, boolean odd, double[] llr, int llrOffset) {
        double[] re = odd ? oddRe : this.re;
        double[] im = odd ? oddIm : this.im;
        for (int s = 0; s < distance.length; s++) {
            double dr = yRe - re[s];
            double di = yIm - im[s];
            double d = dr * dr + di * di;
            distance[s] = priors ? logPrior[s] - d * invN0 : d;
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
            max = Math.max(max, distance[s]);
        }
        return max;
    }

    /**
     * Per point: two differences, two squares and a sum (with priors also the 1/N0 product and the prior). Per bit:
     * the two halves' minima, their difference and (without priors) the 1/N0 product.
     */
    @Override
    public DatapathCost cost() {
        long m = distance.length;
        long k = bitsPerSymbol;
        if (priors) {
            return new DatapathCost(3 * m, 4 * m + k, k * (m - 2), DOUBLE_BITS * 3 * m);
        }
        return new DatapathCost(2 * m + k, 3 * m + k, k * (m - 2), DOUBLE_BITS * 2 * m);
    }
}
