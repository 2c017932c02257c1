package dev.fixmod.verify.theory;

import java.util.OptionalDouble;
import java.util.function.DoubleUnaryOperator;
import org.apache.commons.math3.analysis.solvers.BrentSolver;

/**
 * The SNR (dB) at which a curve meets a target: an error rate falling to a target BER/SER, or a rate (capacity,
 * GMI, bits per channel use) rising to a target. The loss report's implementation loss is the difference of two of
 * these: SNR_fixed(target) − SNR_float(target).
 *
 * <p>Sampled curves are interpolated piecewise linearly: error rates as log10(rate) against dB (the straight-ish
 * shape of waterfall curves), rates linearly against dB. The <em>first</em> crossing in increasing SNR counts, so a
 * noisy Monte Carlo curve that wobbles back over the target later does not move the answer. Error-rate points of 0
 * (no errors counted) carry no log-domain information and are skipped.
 *
 * <table class="striped">
 *   <caption>Examples, SNR {0, 1, 2} dB</caption>
 *   <thead><tr><th>call</th><th>result</th></tr></thead>
 *   <tbody>
 *     <tr><td>{@code errorRate(snr, {1e-2, 1e-4, 1e-6}, 1e-3)}</td><td>0.5 dB (midway in log10)</td></tr>
 *     <tr><td>{@code errorRate(snr, {1e-2, 0, 1e-6}, 1e-3)}</td><td>0.5 dB (the 0 is skipped)</td></tr>
 *     <tr><td>{@code errorRate(snr, {1e-2, 1e-3, 1e-6}, 1e-3)}</td><td>1 dB (met exactly at a point)</td></tr>
 *     <tr><td>{@code errorRate(snr, {1e-4, 1e-5, 1e-6}, 1e-3)}</td><td>empty: below target before the data start</td></tr>
 *     <tr><td>{@code errorRate(snr, {1e-2, 5e-3, 2e-3}, 1e-3)}</td><td>empty: target not reached</td></tr>
 *     <tr><td>{@code rate(snr, {1.0, 1.5, 2.0}, 1.25)}</td><td>0.5 dB</td></tr>
 *   </tbody>
 * </table>
 */
public final class SnrAtTarget {
    private static final int MAX_EVALUATIONS = 500;

    private SnrAtTarget() {
    }

    /**
     * Where a sampled error-rate curve first falls to {@code target} (0 &lt; target &lt; 1), interpolating log10 of the
     * rate linearly in dB; empty if the curve is already below the target at its first usable point or never gets
     * there.
     */
    public static OptionalDouble errorRate(double[] snrDb, double[] errorRate, double target) {
        checkCurve(snrDb, errorRate, "error rate");
        checkErrorRateTarget(target);
        for (int i = 0; i < errorRate.length; i++) {
            if (!(errorRate[i] >= 0 && errorRate[i] <= 1)) {
                throw new IllegalArgumentException("error rate at point " + i + " (" + snrDb[i] + " dB) is "
                        + errorRate[i] + "; error rates must be in [0, 1]");
            }
        }
        double logTarget = StrictMath.log10(target);
        int previous = -1;
        for (int i = 0; i < errorRate.length; i++) {
            if (errorRate[i] == 0) {
                continue;
            }
            if (errorRate[i] <= target) {
                if (errorRate[i] == target) {
                    return OptionalDouble.of(snrDb[i]);
                }
                if (previous < 0) {
                    return OptionalDouble.empty();
                }
                double y0 = StrictMath.log10(errorRate[previous]);
                double y1 = StrictMath.log10(errorRate[i]);
                return OptionalDouble.of(interpolate(snrDb[previous], y0, snrDb[i], y1, logTarget));
            }
            previous = i;
        }
        return OptionalDouble.empty();
    }

    /**
     * Where a sampled rate curve (bits per channel use) first rises to {@code target}, interpolating linearly in dB;
     * empty if it is already above the target at its first point or never gets there.
     */
    public static OptionalDouble rate(double[] snrDb, double[] rate, double target) {
        checkCurve(snrDb, rate, "rate");
        if (!Double.isFinite(target)) {
            throw new IllegalArgumentException("target rate must be finite, got " + target);
        }
        for (int i = 0; i < rate.length; i++) {
            if (!Double.isFinite(rate[i])) {
                throw new IllegalArgumentException("rate at point " + i + " (" + snrDb[i] + " dB) is " + rate[i]
                        + "; rates must be finite");
            }
            if (rate[i] >= target) {
                if (rate[i] == target) {
                    return OptionalDouble.of(snrDb[i]);
                }
                if (i == 0) {
                    return OptionalDouble.empty();
                }
                return OptionalDouble.of(interpolate(snrDb[i - 1], rate[i - 1], snrDb[i], rate[i], target));
            }
        }
        return OptionalDouble.empty();
    }

    /**
     * The SNR in [lowDb, highDb] at which a continuous, decreasing error-rate function of SNR in dB equals
     * {@code target}, by Brent's method on log10(rate) − log10(target) (absolute accuracy 1e−9 dB). E.g. the
     * E_b/N0 that BPSK needs for a BER of 1e−5: {@code errorRate(db -> ErrorRates.bpskBer(Snr.fromDb(db)), 1e-5,
     * 0, 20)} ≈ 9.59 dB.
     */
    public static double errorRate(DoubleUnaryOperator errorRateOfDb, double target, double lowDb, double highDb) {
        checkErrorRateTarget(target);
        double logTarget = StrictMath.log10(target);
        // A rate that underflows to 0 is held at 1e−400 so the solver sees a finite, still decreasing function.
        return solve(db -> Math.max(StrictMath.log10(errorRateOfDb.applyAsDouble(db)), -400) - logTarget, lowDb,
                highDb, "error rate " + target);
    }

    /** The SNR in [lowDb, highDb] at which a continuous, increasing rate function of SNR in dB equals {@code target}. */
    public static double rate(DoubleUnaryOperator rateOfDb, double target, double lowDb, double highDb) {
        if (!Double.isFinite(target)) {
            throw new IllegalArgumentException("target rate must be finite, got " + target);
        }
        return solve(db -> rateOfDb.applyAsDouble(db) - target, lowDb, highDb, "rate " + target);
    }

    private static double solve(DoubleUnaryOperator f, double lowDb, double highDb, String what) {
        if (!(Double.isFinite(lowDb) && Double.isFinite(highDb) && lowDb < highDb)) {
            throw new IllegalArgumentException("SNR search range must be finite with low < high, got [" + lowDb
                    + ", " + highDb + "] dB");
        }
        double atLow = f.applyAsDouble(lowDb);
        double atHigh = f.applyAsDouble(highDb);
        if (Double.isNaN(atLow) || Double.isNaN(atHigh) || Math.signum(atLow) * Math.signum(atHigh) > 0) {
            throw new IllegalArgumentException("the curve does not reach " + what + " between " + lowDb + " and "
                    + highDb + " dB; widen the SNR range");
        }
        BrentSolver solver = new BrentSolver(1e-14, 1e-9, 0);
        return solver.solve(MAX_EVALUATIONS, f::applyAsDouble, lowDb, highDb);
    }

    private static double interpolate(double x0, double y0, double x1, double y1, double y) {
        return x0 + (y - y0) / (y1 - y0) * (x1 - x0);
    }

    private static void checkErrorRateTarget(double target) {
        if (!(target > 0 && target < 1)) {
            throw new IllegalArgumentException("target error rate must be in (0, 1), e.g. 1e-4, got " + target);
        }
    }

    private static void checkCurve(double[] snrDb, double[] values, String what) {
        if (snrDb.length != values.length) {
            throw new IllegalArgumentException(snrDb.length + " SNR points but " + values.length + " " + what
                    + " values; they must pair up");
        }
        if (snrDb.length == 0) {
            throw new IllegalArgumentException("a " + what + " curve needs at least one point");
        }
        for (int i = 0; i < snrDb.length; i++) {
            if (!Double.isFinite(snrDb[i])) {
                throw new IllegalArgumentException("SNR at point " + i + " is " + snrDb[i] + "; it must be finite");
            }
            if (i > 0 && !(snrDb[i] > snrDb[i - 1])) {
                throw new IllegalArgumentException("SNR points must increase strictly: point " + i + " (" + snrDb[i]
                        + " dB) follows " + snrDb[i - 1] + " dB");
            }
        }
    }
}
