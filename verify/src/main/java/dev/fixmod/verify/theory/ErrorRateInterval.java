package dev.fixmod.verify.theory;

import org.apache.commons.math3.distribution.BetaDistribution;

/**
 * A counted error rate with its exact (Clopper–Pearson) two-sided confidence interval: the set of rates p for which
 * neither binomial tail of the observed count falls below (1 − confidence)/2. With α = 1 − confidence, x errors in
 * n trials,
 *
 * <table class="striped">
 *   <caption>Bounds (Clopper and Pearson, Biometrika 26, 1934; Beta form as in Brown, Cai and DasGupta, Statist. Sci.
 *   16, 2001)</caption>
 *   <thead><tr><th>case</th><th>lower</th><th>upper</th></tr></thead>
 *   <tbody>
 *     <tr><td>x = 0</td><td>0</td><td>1 − (α/2)^(1/n) (≈ 3.69/n at 95 %)</td></tr>
 *     <tr><td>0 &lt; x &lt; n</td><td>Beta quantile B(α/2; x, n − x + 1)</td><td>B(1 − α/2; x + 1, n − x)</td></tr>
 *     <tr><td>x = n</td><td>(α/2)^(1/n)</td><td>1</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>Counts are {@code long}: Monte Carlo runs count far more than 2^31 bits. Commons Math's own
 * {@code ClopperPearsonInterval} takes {@code int} counts and fails at x = 0 and x = n, so the interior bounds come
 * from {@link BetaDistribution} quantiles (relative accuracy about 1e−12) and the edges from their closed forms.
 *
 * @param errors     observed errors x, 0 ≤ x ≤ n
 * @param trials     trials n ≥ 1
 * @param lower      lower bound, in [0, 1]
 * @param upper      upper bound, in [lower, 1]
 * @param confidence two-sided confidence level, in (0, 1), e.g. 0.95
 */
public record ErrorRateInterval(long errors, long trials, double lower, double upper, double confidence) {
    /** Absolute accuracy asked of the Beta quantile solver; its relative accuracy (1e−14) then governs. */
    private static final double QUANTILE_ACCURACY = 1e-300;

    public ErrorRateInterval {
        checkCounts(errors, trials, confidence);
        if (!(lower >= 0 && lower <= upper && upper <= 1)) {
            throw new IllegalArgumentException("interval bounds must satisfy 0 <= lower <= upper <= 1, got ["
                    + lower + ", " + upper + "]");
        }
    }

    private static void checkCounts(long errors, long trials, double confidence) {
        if (trials < 1) {
            throw new IllegalArgumentException("an error-rate interval needs at least one trial, got " + trials);
        }
        if (errors < 0 || errors > trials) {
            throw new IllegalArgumentException("errors must be in 0.." + trials + " (the trials), got " + errors);
        }
        if (!(confidence > 0 && confidence < 1)) {
            throw new IllegalArgumentException("confidence must be in (0, 1), e.g. 0.95, got " + confidence);
        }
    }

    /** The Clopper–Pearson interval of {@code errors} in {@code trials} at the given two-sided confidence. */
    public static ErrorRateInterval clopperPearson(long errors, long trials, double confidence) {
        checkCounts(errors, trials, confidence);
        double halfAlpha = (1 - confidence) / 2;
        double x = errors;
        double n = trials;
        // (α/2)^(1/n) via exp(ln(α/2)/n), and 1 − that via expm1, keep their digits for large n.
        double edge = StrictMath.log(halfAlpha) / n;
        double lower = errors == 0 ? 0
                : errors == trials ? StrictMath.exp(edge)
                : new BetaDistribution(null, x, n - x + 1, QUANTILE_ACCURACY).inverseCumulativeProbability(halfAlpha);
        double upper = errors == trials ? 1
                : errors == 0 ? -StrictMath.expm1(edge)
                : new BetaDistribution(null, x + 1, n - x, QUANTILE_ACCURACY).inverseCumulativeProbability(1 - halfAlpha);
        return new ErrorRateInterval(errors, trials, lower, upper, confidence);
    }

    /** The point estimate x/n. */
    public double estimate() {
        return (double) errors / trials;
    }

    /** Whether {@code rate} lies in [lower, upper]. */
    public boolean contains(double rate) {
        return rate >= lower && rate <= upper;
    }
}
