package dev.fixmod.verify.theory;

import org.apache.commons.math3.analysis.solvers.BrentSolver;
import org.apache.commons.math3.special.Erf;

/**
 * The Gaussian tail function Q(x) = P(Z &gt; x) for a standard normal Z, computed as ½·erfc(x/√2) with Commons
 * Math's {@link Erf#erfc}, which stays accurate in relative terms deep in the tail (it evaluates the regularized
 * incomplete gamma function, not 1 − erf). Commons Math computes in pure Java ({@code FastMath}), so results are the
 * same on every JVM.
 *
 * <table class="striped">
 *   <caption>Examples</caption>
 *   <thead><tr><th>x</th><th>Q(x)</th></tr></thead>
 *   <tbody>
 *     <tr><td>−∞</td><td>1</td></tr>
 *     <tr><td>0</td><td>0.5</td></tr>
 *     <tr><td>1</td><td>0.158655…</td></tr>
 *     <tr><td>4.753424…</td><td>1e−6</td></tr>
 *     <tr><td>≥ 38.5</td><td>0 (below the smallest double)</td></tr>
 *   </tbody>
 * </table>
 */
public final class GaussianTail {
    /** Above this argument Q underflows to zero; also the bracket of the inverse. */
    private static final double LARGEST_ARGUMENT = 38.0;
    private static final double SMALLEST_INVERTIBLE = q(LARGEST_ARGUMENT);
    private static final int MAX_EVALUATIONS = 200;

    private GaussianTail() {
    }

    /** Q(x) = ½·erfc(x/√2). */
    public static double q(double x) {
        if (Double.isNaN(x)) {
            throw new IllegalArgumentException("Q(x) needs a number, got NaN");
        }
        if (Double.isInfinite(x)) {
            return x > 0 ? 0.0 : 1.0;
        }
        return 0.5 * Erf.erfc(x / StrictMath.sqrt(2.0));
    }

    /**
     * The x with Q(x) = p, for 0 &lt; p &lt; 1. Commons Math's {@code erfcInv} forms 1 − p and so loses every digit
     * below p ≈ 1e−16; this solves ln Q(x) = ln p instead (Brent's method), relative accuracy about 1e−14.
     */
    public static double inverseQ(double p) {
        if (!(p > 0 && p < 1)) {
            throw new IllegalArgumentException("inverse Q needs a probability strictly between 0 and 1, got " + p);
        }
        if (p > 0.5) {
            return -inverseQ(1 - p);
        }
        if (p == 0.5) {
            return 0;
        }
        if (p < SMALLEST_INVERTIBLE) {
            throw new IllegalArgumentException("inverse Q: probability " + p + " is below Q(" + LARGEST_ARGUMENT
                    + ") = " + SMALLEST_INVERTIBLE + ", the smallest this inverts");
        }
        double logP = StrictMath.log(p);
        BrentSolver solver = new BrentSolver(1e-15, 1e-16, 0);
        return solver.solve(MAX_EVALUATIONS, x -> StrictMath.log(q(x)) - logP, 0, LARGEST_ARGUMENT);
    }
}
