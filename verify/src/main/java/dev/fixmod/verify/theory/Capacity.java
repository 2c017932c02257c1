package dev.fixmod.verify.theory;

import dev.fixmod.constellation.Constellation;
import java.util.Arrays;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ConcurrentMap;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegrator;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegratorFactory;

/**
 * Capacities of the complex AWGN channel y = x + z, z of power N0 (N0/2 per real dimension), in bits per channel
 * use, at a linear E_s/N0 (not dB):
 *
 * <table class="striped">
 *   <caption>What each rate means</caption>
 *   <thead><tr><th>method</th><th>rate</th></tr></thead>
 *   <tbody>
 *     <tr><td>{@link #shannon}</td><td>log2(1 + E_s/N0): Gaussian input, the ceiling of every other rate</td></tr>
 *     <tr><td>{@link #codedModulation}</td><td>I(X;Y) = H(X) − H(X|Y) with the constellation's own symbol
 *         probabilities: the rate of ideal coded modulation on that constellation</td></tr>
 *     <tr><td>{@link #bitInterleaved}</td><td>H(X) − Σ_j H(B_j|Y), the rate of bit-metric decoding of the label
 *         bits b0…b(k−1) (b0 = MSB): for uniform symbols this is Σ_j I(B_j;Y), the BICM capacity of Caire,
 *         Taricco and Biglieri (IEEE Trans. IT 44(3), 1998); with shaped symbols it is the BMD rate of Böcherer
 *         (2014). Never above {@link #codedModulation}; close to it under Gray labeling.</td></tr>
 *     <tr><td>{@link #jFunction}</td><td>I(B;L) for a consistent Gaussian LLR L ~ N(±σ²/2, σ²)</td></tr>
 *   </tbody>
 * </table>
 *
 * <p><b>Quadrature.</b> The expectation over the noise is a product Gauss–Hermite rule over I and Q (Commons Math
 * {@link GaussIntegratorFactory#hermite}), {@value #DEFAULT_POINTS} points per dimension unless told otherwise.
 * The rule is least accurate at the knee of a curve, where the rate approaches log2 M. Measured against adaptive
 * Gauss–Legendre integration of the one-dimensional PAM integrals over −6…40 dB (square QAM is two PAMs, so its error
 * is twice the per-axis one):
 *
 * <table class="striped">
 *   <caption>Largest error per real dimension, in bits (CM and BICM alike)</caption>
 *   <thead><tr><th>points</th><th>2-PAM</th><th>4-PAM</th><th>8-PAM</th><th>16-PAM</th><th>32-PAM</th></tr></thead>
 *   <tbody>
 *     <tr><td>32 (default)</td><td>3.2e−5</td><td>4.9e−5</td><td>5.5e−5</td><td>6.2e−5</td><td>≈ 7e−5</td></tr>
 *     <tr><td>64</td><td>1.3e−6</td><td>2.0e−6</td><td>2.4e−6</td><td>2.8e−6</td><td>2.9e−6</td></tr>
 *     <tr><td>100</td><td>1.2e−7</td><td>1.8e−7</td><td>2.6e−7</td><td>2.7e−7</td><td>2.5e−7</td></tr>
 *   </tbody>
 * </table>
 *
 * (32 points: 0.2 dB grid, 32-PAM estimated from a 1 dB grid; 64 and 100 points: 1 dB grid.) At 32 points an error
 * of 1e−4 bit moves a rate curve by well under 0.01 dB. Cost: 2·M²·N exponentials plus M²·N² multiply-adds (BICM:
 * times k); 256-QAM takes a fraction of a second. The constellation is scaled to its E_s; the π/2-BPSK quarter turn
 * does not change any rate and is ignored. Every exp and log is {@link StrictMath}, so
 * results are identical on every JVM.
 */
public final class Capacity {
    /** Gauss–Hermite points per real dimension by default. */
    public static final int DEFAULT_POINTS = 32;
    /** The largest rule offered: Commons Math computes its Hermite nodes in double precision. */
    public static final int MAX_POINTS = 100;

    private static final double LN2 = StrictMath.log(2.0);
    private static final ConcurrentMap<Integer, double[][]> RULES = new ConcurrentHashMap<>();

    private Capacity() {
    }

    /** log2(1 + E_s/N0). */
    public static double shannon(double esN0) {
        ErrorRates.requireSnr(esN0);
        return StrictMath.log1p(esN0) / LN2;
    }

    /** Constellation-constrained capacity I(X;Y), {@value #DEFAULT_POINTS} Gauss–Hermite points per dimension. */
    public static double codedModulation(Constellation constellation, double esN0) {
        return codedModulation(constellation, esN0, DEFAULT_POINTS);
    }

    /** Constellation-constrained capacity I(X;Y) with {@code points} Gauss–Hermite points per dimension. */
    public static double codedModulation(Constellation constellation, double esN0, int points) {
        return rate(constellation, esN0, points, false);
    }

    /** Bit-metric decoding (BICM) rate, {@value #DEFAULT_POINTS} Gauss–Hermite points per dimension. */
    public static double bitInterleaved(Constellation constellation, double esN0) {
        return bitInterleaved(constellation, esN0, DEFAULT_POINTS);
    }

    /** Bit-metric decoding (BICM) rate with {@code points} Gauss–Hermite points per dimension. */
    public static double bitInterleaved(Constellation constellation, double esN0, int points) {
        return rate(constellation, esN0, points, true);
    }

    /**
     * J(σ) = 1 − E[log2(1 + e^−L)], L ~ N(σ²/2, σ²): the mutual information between a uniform bit and its LLR
     * when the LLR is consistent Gaussian (as for BPSK on AWGN, where σ² = 8·E_s/N0). One-dimensional
     * Gauss–Hermite rule of {@value #MAX_POINTS} points. J(0) = 0, J increases to 1.
     */
    public static double jFunction(double sigma) {
        if (!(sigma >= 0) || sigma == Double.POSITIVE_INFINITY) {
            throw new IllegalArgumentException("J(sigma) needs a finite sigma >= 0, got " + sigma);
        }
        double[][] rule = rule(MAX_POINTS);
        double[] t = rule[0];
        double[] w = rule[1];
        double sum = 0;
        for (int i = 0; i < t.length; i++) {
            double llr = sigma * sigma / 2 + StrictMath.sqrt(2.0) * sigma * t[i];
            sum += w[i] * softplus(-llr);
        }
        return 1 - sum / StrictMath.sqrt(StrictMath.PI) / LN2;
    }

    /**
     * ln(1 + e^x) without overflow or loss of small values: {@code x + log1p(exp(−x))} for x &gt; 0, else
     * {@code log1p(exp(x))}, with StrictMath. For an argument e &lt; 2^−29 of log1p the result is written out as
     * fdlibm's log1p (which StrictMath is specified to be) computes it, e − e·e·0.5 (e itself below 2^−54), the same
     * double without the native call; a test compares it with {@code StrictMath.log1p}. Confident LLRs (|x| above
     * about 20 nats) all take that path.
     */
    static double softplus(double x) {
        double e = StrictMath.exp(x > 0 ? -x : x);
        double log1p = e < TINY ? (e < NEGLIGIBLE ? e : e - e * e * 0.5) : StrictMath.log1p(e);
        return x > 0 ? x + log1p : log1p;
    }

    /** 2^−29 and 2^−54: fdlibm's log1p returns e − e·e·0.5 below the first and e below the second. */
    static final double TINY = 0x1p-29;
    static final double NEGLIGIBLE = 0x1p-54;

    private static double rate(Constellation constellation, double esN0, int points, boolean bitwise) {
        ErrorRates.requireSnr(esN0);
        if (points < 2 || points > MAX_POINTS) {
            throw new IllegalArgumentException("Gauss-Hermite points per dimension must be in 2.." + MAX_POINTS
                    + ", got " + points);
        }
        if (esN0 == Double.POSITIVE_INFINITY) {
            throw new IllegalArgumentException("capacity at infinite SNR is the entropy of the symbols; give a finite"
                    + " E_s/N0");
        }
        int m = constellation.size();
        int k = constellation.bitsPerSymbol();
        int[] label = new int[m];
        double[] prob = new double[m];
        int n = 0;
        double entropy = 0;
        for (int s = 0; s < m; s++) {
            double p = constellation.probability(s);
            if (p > 0) {
                label[n] = s;
                prob[n] = p;
                entropy -= p * StrictMath.log(p);
                n++;
            }
        }
        entropy /= LN2;
        if (esN0 == 0) {
            return 0;
        }
        // Distances in units of √N0 at E_s = 1: u = (x_i − x_j)/√N0.
        double scale = StrictMath.sqrt(esN0 / constellation.averageEnergy());
        double[] re = new double[n];
        double[] im = new double[n];
        for (int a = 0; a < n; a++) {
            re[a] = constellation.re(label[a]) * scale;
            im[a] = constellation.im(label[a]) * scale;
        }
        double[][] rule = rule(points);
        double[] t = rule[0];
        double[] w = rule[1];
        int nodes = t.length;
        // p(y|x_j)/p(y|x_i) with y = x_i + √N0·(t_a + i·t_b) and u = (x_i − x_j)/√N0 factors into
        // exp(−u_r² − 2u_r·t_a) · exp(−u_i² − 2u_i·t_b): 2·M·N exponentials per sent point instead of M·N².
        // Each factor is at most exp(t²) (≤ e^180 for 100 nodes), so neither overflows; one that underflows is
        // negligible beside the sent point's own term p_i.
        double[] alongI = new double[nodes * n];
        double[] alongQ = new double[nodes * n];
        double[] same = new double[k];
        double[] other = new double[k];
        double expectedLoss = 0;
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                double ur = re[i] - re[j];
                double ui = im[i] - im[j];
                for (int a = 0; a < nodes; a++) {
                    alongI[a * n + j] = StrictMath.exp(-ur * ur - 2 * ur * t[a]);
                    alongQ[a * n + j] = prob[j] * StrictMath.exp(-ui * ui - 2 * ui * t[a]);
                }
            }
            double sent = 0;
            for (int a = 0; a < nodes; a++) {
                for (int b = 0; b < nodes; b++) {
                    double loss = bitwise
                            ? bitwiseLoss(alongI, a * n, alongQ, b * n, same, other, label, prob[i], i, k, n)
                            : symbolLoss(alongI, a * n, alongQ, b * n, prob[i], i, n);
                    sent += w[a] * w[b] * loss;
                }
            }
            expectedLoss += prob[i] * sent;
        }
        return entropy - expectedLoss / StrictMath.PI / LN2;
    }

    /** −ln P(x_i | y) = ln(1 + Σ_{j≠i} p_j·p(y|x_j) / (p_i·p(y|x_i))). */
    private static double symbolLoss(double[] alongI, int rowI, double[] alongQ, int rowQ, double pi, int i, int n) {
        double rest = 0;
        for (int j = 0; j < n; j++) {
            if (j != i) {
                rest += alongI[rowI + j] * alongQ[rowQ + j];
            }
        }
        return StrictMath.log1p(rest / pi);
    }

    /** Σ_bits −ln P(b_j(x_i) | y) = Σ_bits ln(1 + S_other/S_same), both sums kept apart so small ones keep digits. */
    private static double bitwiseLoss(double[] alongI, int rowI, double[] alongQ, int rowQ, double[] same,
                                      double[] other, int[] label, double pi, int i, int k, int n) {
        Arrays.fill(same, pi);
        Arrays.fill(other, 0);
        int sentLabel = label[i];
        for (int j = 0; j < n; j++) {
            if (j == i) {
                continue;
            }
            double v = alongI[rowI + j] * alongQ[rowQ + j];
            int differ = label[j] ^ sentLabel;
            for (int bit = 0; bit < k; bit++) {
                if (((differ >>> (k - 1 - bit)) & 1) == 0) {
                    same[bit] += v;
                } else {
                    other[bit] += v;
                }
            }
        }
        double loss = 0;
        for (int bit = 0; bit < k; bit++) {
            loss += StrictMath.log1p(other[bit] / same[bit]);
        }
        return loss;
    }

    /** Nodes and weights of the n-point Gauss–Hermite rule, ∫ e^{−t²} f(t) dt ≈ Σ w_i f(t_i); built once per n. */
    private static double[][] rule(int n) {
        return RULES.computeIfAbsent(n, size -> {
            GaussIntegrator hermite = new GaussIntegratorFactory().hermite(size);
            double[] t = new double[size];
            double[] w = new double[size];
            for (int i = 0; i < size; i++) {
                t[i] = hermite.getPoint(i);
                w[i] = hermite.getWeight(i);
            }
            return new double[][] {t, w};
        });
    }
}
