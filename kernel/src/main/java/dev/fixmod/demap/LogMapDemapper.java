package dev.fixmod.demap;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.map.DatapathCost;

/**
 * Exact log-MAP: {@code L(b) = ln Σ_{s: b=0} e^{μ(s)} − ln Σ_{s: b=1} e^{μ(s)}} with
 * {@code μ(s) = −|y − s|²/N0 (+ ln p(s) with priors)}, times the {@link LlrSign} factor.
 *
 * <p>The sums are evaluated as a numerically stable log-sum-exp: every term is taken relative to a maximum, so
 * nothing overflows and the larger sum is at least 1. When the smaller half's best metric lies within 600 nats of
 * the overall best, the M exponentials {@code e^{μ(s) − max}} are computed once and shared by all bits (terms that
 * underflow are below {@code e^{−145}} of their half and cannot change a double); otherwise that bit's halves are
 * summed each relative to their own maximum. A half whose symbols all have probability 0 gives an infinite LLR.
 * {@link StrictMath} is used for {@code exp} and {@code log}, so results are identical on every JVM.
 *
 * <p>Not thread-safe: holds M-entry scratch arrays.
 */
public final class LogMapDemapper extends ExhaustiveDemapper {
    /** Below this gap (nats) between a half's best metric and the overall best, the shared exponentials suffice. */
    private static final double SHARED_RANGE = 600.0;

    private final double[] metric;
    private final double[] relative;

    public LogMapDemapper(Constellation constellation, LlrOptions options) {
        super(SoftAlgorithm.LOG_MAP, constellation, options);
        int m = constellation.size();
        this.metric = new double[m];
        this.relative = new double[m];
    }

    @Override
    void compute(double yRe, double yIm, boolean odd, double[] llr, int llrOffset) {
        double[] re = odd ? oddRe : this.re;
        double[] im = odd ? oddIm : this.im;
        int m = metric.length;
        double best = Double.NEGATIVE_INFINITY;
        for (int s = 0; s < m; s++) {
            double dr = yRe - re[s];
            double di = yIm - im[s];
            double mu = -(dr * dr + di * di) * invN0;
            if (priors) {
                mu += logPrior[s];
            }
            metric[s] = mu;
            best = Math.max(best, mu);
        }
        for (int s = 0; s < m; s++) {
            relative[s] = StrictMath.exp(metric[s] - best);
        }
        double sign = options.sign().factor();
        for (int b = 0; b < bitsPerSymbol; b++) {
            int[] zeros = partition.zeros[b];
            int[] ones = partition.ones[b];
            double max0 = max(zeros);
            double max1 = max(ones);
            double l;
            if (max0 == Double.NEGATIVE_INFINITY) {
                l = Double.NEGATIVE_INFINITY;
            } else if (max1 == Double.NEGATIVE_INFINITY) {
                l = Double.POSITIVE_INFINITY;
            } else if (Math.min(max0, max1) - best > -SHARED_RANGE) {
                l = StrictMath.log(sum(zeros) / sum(ones));
            } else {
                l = logSumExp(zeros, max0) - logSumExp(ones, max1);
            }
            llr[llrOffset + b] = sign * l + 0.0; // + 0.0 turns −0.0 into 0.0
        }
    }

    /**
     * Per point: two differences, two squares, a sum, the 1/N0 product, the prior, the running maximum and the
     * offset from it. Per bit: the two halves' maxima, the range check, the two sums and one division (counted as a
     * multiplication) before the logarithm. The path that shares the M exponentials is counted.
     */
    @Override
    public DatapathCost cost() {
        long m = metric.length;
        long k = bitsPerSymbol;
        long perPointAdds = 3 + (priors ? 1 : 0) + 1;
        return new DatapathCost(3 * m + k, perPointAdds * m + k * (m - 2) + k, m + k * (m - 2) + 2 * k,
                DOUBLE_BITS * (2 * m + (priors ? m : 0)));
    }

    /** M exponentials and one logarithm per bit, on the path that shares the exponentials. */
    @Override
    public long transcendentals() {
        return metric.length + bitsPerSymbol;
    }

    private double max(int[] labels) {
        double max = Double.NEGATIVE_INFINITY;
        for (int s : labels) {
            max = Math.max(max, metric[s]);
        }
        return max;
    }

    private double sum(int[] labels) {
        double sum = 0;
        for (int s : labels) {
            sum += relative[s];
        }
        return sum;
    }

    private double logSumExp(int[] labels, double max) {
        double sum = 0;
        for (int s : labels) {
            sum += StrictMath.exp(metric[s] - max);
        }
        return max + StrictMath.log(sum);
    }
}
