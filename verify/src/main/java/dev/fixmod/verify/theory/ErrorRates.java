package dev.fixmod.verify.theory;

import static dev.fixmod.verify.theory.GaussianTail.q;

import dev.fixmod.constellation.AxisLayout;
import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Metrics;
import java.util.Arrays;
import org.apache.commons.math3.analysis.UnivariateFunction;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegrator;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegratorFactory;

/**
 * Symbol and bit error rates on the complex AWGN channel with ideal coherent minimum-distance detection. SNR
 * arguments are linear power ratios, not dB (convert with {@link Snr#fromDb}); E_s is the average symbol energy
 * (weighted by the symbol probabilities), N0 the complex noise power, N0/2 per real dimension.
 *
 * <table class="striped">
 *   <caption>Which method gives what</caption>
 *   <thead><tr><th>method</th><th>kind</th><th>source</th></tr></thead>
 *   <tbody>
 *     <tr><td>{@link #pamSer}, {@link #squareQamSer}</td><td>exact closed form</td><td>Proakis, Digital
 *         Communications, 5th ed., §4.3</td></tr>
 *     <tr><td>{@link #pskSer}</td><td>exact, Craig's integral, numerically (relative 1e−12)</td><td>J. W. Craig, MILCOM 1991</td></tr>
 *     <tr><td>{@link #bpskBer}, {@link #qpskGrayBer}</td><td>exact closed form</td><td>Proakis §4.3</td></tr>
 *     <tr><td>{@link #separableSer}, {@link #separableBer}</td><td>exact for any labeling and any symbol
 *         probabilities, by summing per-axis decision-region probabilities</td><td>from the definition</td></tr>
 *     <tr><td>{@link #grayBerFromSer}, {@link #squareQamGrayBerApproximation},
 *         {@link #pskGrayBerApproximation}</td><td>Gray approximations, tight at high SNR</td><td>common practice
 *         (e.g. Proakis §4.3)</td></tr>
 *     <tr><td>{@link #nearestNeighbourUnionBound}</td><td>N̄·Q(d_min/√(2N0)): an upper bound for PAM, square QAM
 *         and PSK, an approximation in general</td><td>Proakis §4.2</td></tr>
 *     <tr><td>{@link #pairwiseUnionBound}</td><td>Σ_i p_i Σ_{j≠i} Q(d_ij/√(2N0)): an upper bound for any
 *         constellation</td><td>Proakis §4.2</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>Edge cases: E_s/N0 = 0 gives the error rate of guessing, e.g. SER = 1 − 1/M for PAM, QAM and PSK; E_s/N0 = +∞
 * gives 0. These are engineering models of ideal receivers, not conformance figures.
 */
public final class ErrorRates {
    /** Craig's integral: relative agreement of two successive composite sums. */
    private static final double PSK_RELATIVE_ACCURACY = 1e-12;
    /** 2^14 panels of 16 nodes resolve the integrand's peak (width ~ 1/√(E_s/N0)) beyond 60 dB. */
    private static final int PSK_MAX_PANELS = 1 << 14;
    private static final double[] LEGENDRE_NODES;
    private static final double[] LEGENDRE_WEIGHTS;

    static {
        GaussIntegrator rule = new GaussIntegratorFactory().legendre(16);
        LEGENDRE_NODES = new double[rule.getNumberOfPoints()];
        LEGENDRE_WEIGHTS = new double[rule.getNumberOfPoints()];
        for (int i = 0; i < LEGENDRE_NODES.length; i++) {
            LEGENDRE_NODES[i] = rule.getPoint(i);
            LEGENDRE_WEIGHTS[i] = rule.getWeight(i);
        }
    }

    private ErrorRates() {
    }

    /** M-PAM SER = 2(1 − 1/M)·Q(√(6·(E_s/N0)/(M² − 1))). */
    public static double pamSer(int m, double esN0) {
        requireOrder(m, 2, "PAM");
        requireSnr(esN0);
        return 2.0 * (1.0 - 1.0 / m) * q(StrictMath.sqrt(6.0 * esN0 / ((double) m * m - 1.0)));
    }

    /**
     * Square M-QAM SER = 1 − (1 − P)², P the SER of √M-PAM at half the symbol energy:
     * P = 2(1 − 1/√M)·Q(√(3·(E_s/N0)/(M − 1))). Evaluated as 2P − P² so it keeps its digits at high SNR.
     */
    public static double squareQamSer(int m, double esN0) {
        requireOrder(m, 4, "square QAM");
        if (Integer.numberOfTrailingZeros(m) % 2 != 0) {
            throw new IllegalArgumentException("square QAM needs an even number of bits per symbol, got M = " + m);
        }
        requireSnr(esN0);
        double axis = pamSer(1 << (Integer.numberOfTrailingZeros(m) / 2), esN0 / 2);
        return 2 * axis - axis * axis;
    }

    /**
     * M-PSK SER by Craig's form P = (1/π)·∫_0^{(M−1)π/M} exp(−(E_s/N0)·sin²(π/M)/sin²θ) dθ, integrated by a
     * composite 16-point Gauss–Legendre rule (nodes from Commons Math) whose number of panels doubles until two
     * successive sums agree to a relative 1e−12. The range is split at π/2, where the integrand peaks, so each piece
     * is monotone.
     */
    public static double pskSer(int m, double esN0) {
        requireOrder(m, 2, "PSK");
        requireSnr(esN0);
        if (esN0 == Double.POSITIVE_INFINITY) {
            return 0;
        }
        double s = StrictMath.sin(StrictMath.PI / m);
        double a = esN0 * s * s;
        UnivariateFunction f = theta -> {
            double sinTheta = StrictMath.sin(theta);
            return StrictMath.exp(-a / (sinTheta * sinTheta));
        };
        double upper = (m - 1) * StrictMath.PI / m;
        double half = StrictMath.PI / 2;
        double sum = compositeLegendre(f, 0, half);
        if (upper > half) {
            sum += compositeLegendre(f, half, upper);
        }
        return sum / StrictMath.PI;
    }

    /**
     * ∫_lo^hi f by the 16-point Gauss–Legendre rule on 2, 4, 8, … equal panels until two successive sums agree.
     * Commons Math's IterativeLegendreGaussIntegrator would do, but it builds its rules in BigDecimal on first use,
     * which costs seconds.
     */
    private static double compositeLegendre(UnivariateFunction f, double lo, double hi) {
        double previous = Double.NaN;
        for (int panels = 2; panels <= PSK_MAX_PANELS; panels *= 2) {
            double width = (hi - lo) / panels;
            double sum = 0;
            for (int p = 0; p < panels; p++) {
                double centre = lo + (p + 0.5) * width;
                double panel = 0;
                for (int i = 0; i < LEGENDRE_NODES.length; i++) {
                    panel += LEGENDRE_WEIGHTS[i] * f.value(centre + 0.5 * width * LEGENDRE_NODES[i]);
                }
                sum += 0.5 * width * panel;
            }
            if (Math.abs(sum - previous) <= PSK_RELATIVE_ACCURACY * Math.abs(sum)) {
                return sum;
            }
            previous = sum;
        }
        return previous;
    }

    /** BPSK BER = Q(√(2·E_b/N0)). */
    public static double bpskBer(double ebN0) {
        requireSnr(ebN0);
        return q(StrictMath.sqrt(2 * ebN0));
    }

    /** Gray-labelled QPSK BER = Q(√(2·E_b/N0)): each bit sees a BPSK channel of its own. */
    public static double qpskGrayBer(double ebN0) {
        return bpskBer(ebN0);
    }

    /** Gray approximation P_b ≈ P_s/k: at high SNR a symbol error is almost always to a neighbour, one bit off. */
    public static double grayBerFromSer(double ser, int bitsPerSymbol) {
        if (!(ser >= 0 && ser <= 1)) {
            throw new IllegalArgumentException("symbol error rate must be in [0, 1], got " + ser);
        }
        if (bitsPerSymbol < 1) {
            throw new IllegalArgumentException("bits per symbol must be >= 1, got " + bitsPerSymbol);
        }
        return ser / bitsPerSymbol;
    }

    /**
     * Gray square M-QAM, P_b ≈ (4/k)(1 − 1/√M)·Q(√(3·(E_s/N0)/(M − 1))): the nearest-neighbour term of the exact
     * Gray BER (common practice; the exact value is {@link #separableBer}).
     */
    public static double squareQamGrayBerApproximation(int m, double esN0) {
        requireOrder(m, 4, "square QAM");
        int k = Integer.numberOfTrailingZeros(m);
        if (k % 2 != 0) {
            throw new IllegalArgumentException("square QAM needs an even number of bits per symbol, got M = " + m);
        }
        requireSnr(esN0);
        double side = 1 << (k / 2);
        return 4.0 / k * (1 - 1 / side) * q(StrictMath.sqrt(3 * esN0 / (m - 1.0)));
    }

    /**
     * Gray M-PSK, P_b ≈ (2/k)·Q(√(2·E_s/N0)·sin(π/M)) for M ≥ 4 (exact for M = 4); BPSK's exact Q(√(2·E_s/N0))
     * for M = 2.
     */
    public static double pskGrayBerApproximation(int m, double esN0) {
        requireOrder(m, 2, "PSK");
        requireSnr(esN0);
        if (m == 2) {
            return bpskBer(esN0);
        }
        int k = Integer.numberOfTrailingZeros(m);
        return 2.0 / k * q(StrictMath.sqrt(2 * esN0) * StrictMath.sin(StrictMath.PI / m));
    }

    /** N̄·Q(√(d_min²/(2N0))) with the constellation scaled to its E_s (d_min and N̄ weighted by the probabilities). */
    public static double nearestNeighbourUnionBound(Constellation constellation, double esN0) {
        requireSnr(esN0);
        Metrics metrics = Metrics.of(constellation);
        double minimumAtUnitEnergy = StrictMath.sqrt(metrics.minDistanceSquared() / metrics.averageEnergy());
        return metrics.averageNeighbours() * q(minimumAtUnitEnergy * StrictMath.sqrt(esN0 / 2));
    }

    /** Σ_i p_i Σ_{j≠i} Q(d_ij/√(2N0)) at E_s = 1 and N0 = 1/(E_s/N0). Cost M² evaluations of Q. */
    public static double pairwiseUnionBound(Constellation constellation, double esN0) {
        requireSnr(esN0);
        double[] re = constellation.realParts();
        double[] im = constellation.imaginaryParts();
        double scale = esN0 / (2 * constellation.averageEnergy());
        double sum = 0;
        for (int i = 0; i < re.length; i++) {
            double p = constellation.probability(i);
            if (p == 0) {
                continue;
            }
            double row = 0;
            for (int j = 0; j < re.length; j++) {
                if (j != i) {
                    row += q(StrictMath.sqrt(squaredDistance(re, im, i, j) * scale));
                }
            }
            sum += p * row;
        }
        return sum;
    }

    /**
     * Exact SER of a separable constellation (PAM, square or rectangular QAM, any level spacing) under per-axis
     * minimum-distance decisions (thresholds midway between adjacent levels), any symbol probabilities:
     * SER = Σ p(s)·(e_I + e_Q − e_I·e_Q), e the per-axis error probabilities of s.
     */
    public static double separableSer(Constellation constellation, double esN0) {
        AxisLayout axes = requireSeparable(constellation);
        requireSnr(esN0);
        double sigma = perDimensionSigma(constellation, esN0);
        double[][] transitionI = axisTransitions(axes.iLevels(), sigma);
        double[][] transitionQ = axisTransitions(axes.qLevels(), sigma);
        double sum = 0;
        for (int label = 0; label < constellation.size(); label++) {
            double eI = errorOf(transitionI, axes.subLabelI(label));
            double eQ = errorOf(transitionQ, axes.subLabelQ(label));
            sum += constellation.probability(label) * (eI + eQ - eI * eQ);
        }
        return sum;
    }

    /**
     * Exact BER of a separable constellation under per-axis minimum-distance decisions, for its own labeling (Gray
     * or not) and symbol probabilities: the expected Hamming distance between the sent and the decided sub-labels,
     * summed over both axes, divided by k.
     */
    public static double separableBer(Constellation constellation, double esN0) {
        AxisLayout axes = requireSeparable(constellation);
        requireSnr(esN0);
        double sigma = perDimensionSigma(constellation, esN0);
        double[] marginalI = new double[axes.iLevels().length];
        double[] marginalQ = new double[axes.qLevels().length];
        for (int label = 0; label < constellation.size(); label++) {
            marginalI[axes.subLabelI(label)] += constellation.probability(label);
            marginalQ[axes.subLabelQ(label)] += constellation.probability(label);
        }
        double bitErrors = expectedBitErrors(axisTransitions(axes.iLevels(), sigma), marginalI)
                + expectedBitErrors(axisTransitions(axes.qLevels(), sigma), marginalQ);
        return bitErrors / constellation.bitsPerSymbol();
    }

    private static double expectedBitErrors(double[][] transition, double[] marginal) {
        double sum = 0;
        for (int sent = 0; sent < marginal.length; sent++) {
            double row = 0;
            for (int decided = 0; decided < marginal.length; decided++) {
                if (decided != sent) {
                    row += transition[sent][decided] * Integer.bitCount(sent ^ decided);
                }
            }
            sum += marginal[sent] * row;
        }
        return sum;
    }

    /** The error probability of sub-label s, summed from the other regions so it keeps its digits at high SNR. */
    private static double errorOf(double[][] transition, int s) {
        double e = 0;
        for (int t = 0; t < transition.length; t++) {
            if (t != s) {
                e += transition[s][t];
            }
        }
        return e;
    }

    /**
     * P(decide sub-label t | sent sub-label s) on one axis with Gaussian noise of deviation σ and thresholds midway
     * between adjacent sorted levels. The diagonal is 1 − Σ of the rest.
     */
    private static double[][] axisTransitions(double[] levelBySubLabel, double sigma) {
        int n = levelBySubLabel.length;
        Integer[] order = new Integer[n];
        for (int i = 0; i < n; i++) {
            order[i] = i;
        }
        Arrays.sort(order, (a, b) -> Double.compare(levelBySubLabel[a], levelBySubLabel[b]));
        double[] lower = new double[n];
        double[] upper = new double[n];
        for (int r = 0; r < n; r++) {
            int sub = order[r];
            lower[sub] = r == 0 ? Double.NEGATIVE_INFINITY
                    : (levelBySubLabel[order[r - 1]] + levelBySubLabel[sub]) / 2;
            upper[sub] = r == n - 1 ? Double.POSITIVE_INFINITY
                    : (levelBySubLabel[sub] + levelBySubLabel[order[r + 1]]) / 2;
        }
        double[][] p = new double[n][n];
        for (int s = 0; s < n; s++) {
            double v = levelBySubLabel[s];
            double rest = 0;
            for (int t = 0; t < n; t++) {
                if (t == s) {
                    continue;
                }
                // Region t lies wholly on one side of v: integrate from its near edge to its far edge.
                double pt = lower[t] >= v
                        ? q(standardized(lower[t] - v, sigma)) - q(standardized(upper[t] - v, sigma))
                        : q(standardized(v - upper[t], sigma)) - q(standardized(v - lower[t], sigma));
                p[s][t] = pt;
                rest += pt;
            }
            p[s][s] = 1 - rest;
        }
        return p;
    }

    /** distance/σ, keeping an infinite edge infinite when σ is infinite too (E_s/N0 = 0). */
    private static double squaredDistance(double[] re, double[] im, int i, int j) {
        double dr = re[i] - re[j];
        double di = im[i] - im[j];
        return dr * dr + di * di;
    }

    private static double standardized(double distance, double sigma) {
        return Double.isInfinite(distance) ? distance : distance / sigma;
    }

    private static double perDimensionSigma(Constellation constellation, double esN0) {
        return StrictMath.sqrt(constellation.averageEnergy() / esN0 / 2);
    }

    private static AxisLayout requireSeparable(Constellation constellation) {
        AxisLayout axes = constellation.axes();
        if (axes == null) {
            throw new IllegalArgumentException(constellation.name() + " is not separable (no axis layout); the exact"
                    + " per-axis error rates apply to PAM and rectangular QAM only");
        }
        return axes;
    }

    private static void requireOrder(int m, int min, String family) {
        if (m < min || Integer.bitCount(m) != 1) {
            throw new IllegalArgumentException(family + " order must be a power of two >= " + min + ", got " + m);
        }
    }

    static void requireSnr(double ratio) {
        if (!(ratio >= 0)) {
            throw new IllegalArgumentException("SNR must be a linear power ratio >= 0 (not dB), got " + ratio);
        }
    }
}
