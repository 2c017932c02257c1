package dev.fixmod.constellation;

/**
 * The ideal (floating-point, noise-free) figures of a constellation that every quantization loss is measured
 * against. Immutable; computed once by {@link #of}. Averages are weighted by the symbol probabilities; geometric
 * figures (d_min, neighbours, peak) consider all M points, since a receiver's decisions do. For π/2-BPSK they are the
 * figures of one symbol (the quarter turn between symbols changes no distance within a symbol).
 *
 * <table class="striped">
 *   <caption>Definitions, and their values for square 16-QAM on the grid ±1, ±3 (from the closed forms)</caption>
 *   <thead><tr><th>figure</th><th>definition</th><th>16-QAM</th></tr></thead>
 *   <tbody>
 *     <tr><td>E_s</td><td>Σ p(s)|s|²</td><td>10</td></tr>
 *     <tr><td>E_b</td><td>E_s / k, k = log2 M (as in Eb/N0 = Es/N0 − 10 log10 k)</td><td>2.5</td></tr>
 *     <tr><td>d_min, d_min²</td><td>min over distinct points of |s − s'|</td><td>2, 4</td></tr>
 *     <tr><td>neighbours</td><td>per point: other points at distance d_min; average: Σ p(s)·N(s)</td>
 *         <td>2, 3 or 4; average 3</td></tr>
 *     <tr><td>ε (power efficiency)</td><td>d_min² / E_b</td><td>1.6</td></tr>
 *     <tr><td>SNR loss vs BPSK</td><td>10 log10(4/ε) dB (BPSK has ε = 4)</td><td>3.98 dB</td></tr>
 *     <tr><td>PAPR</td><td>10 log10(max|s|² / E_s) dB, of the points (before pulse shaping)</td><td>2.55 dB</td></tr>
 *     <tr><td>Gray penalty</td><td>Σ_s p(s) Σ_{s'∈N(s)} d_H(label, label') / Σ_s p(s) N(s): the average number of
 *         differing bits over nearest-neighbour pairs (pairs weighed equally if every point that has a neighbour
 *         at d_min has probability 0)</td><td>1</td></tr>
 *     <tr><td>entropy</td><td>−Σ p log2 p bits/symbol (exactly k when equiprobable)</td><td>4</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>With this Gray penalty G, the high-SNR bit error rate is about (G·N̄/k)·Q(d_min/√(2N0)).
 *
 * <p><b>Equal distances.</b> Two squared distances count as equal when they differ by at most
 * {@value #EQUAL_DISTANCE_TOLERANCE} relative to d_min²: points computed with cos/sin or scaled by an irrational
 * normalization carry rounding errors of a few ulps (about 1e−16 relative), while genuinely different distances in
 * any practical constellation differ by far more than 1e−9.
 *
 * <p><b>Bandwidth efficiency</b> is that of a passband linear modulation (I/Q on a carrier) at symbol rate 1/T,
 * carrying k bits per symbol: rectangular pulses with first-null bandwidth 2/T give η = k/2 bit/s/Hz; raised-cosine
 * pulses with roll-off α occupy (1+α)/T, η = k/(1+α); the Nyquist minimum (α = 0) is η = k. A real (baseband) PAM
 * signal would need half these bandwidths.
 */
public final class Metrics {
    /** Relative tolerance within which two squared distances count as equal. */
    public static final double EQUAL_DISTANCE_TOLERANCE = 1e-9;

    private final int size;
    private final int bitsPerSymbol;
    private final double averageEnergy;
    private final double peakEnergy;
    private final double minDistanceSquared;
    private final int[] neighbours;
    private final double averageNeighbours;
    private final double grayPenalty;
    private final double entropy;

    private Metrics(Constellation c) {
        size = c.size();
        bitsPerSymbol = c.bitsPerSymbol();
        averageEnergy = c.averageEnergy();
        peakEnergy = c.peakEnergy();
        double[] re = c.realParts();
        double[] im = c.imaginaryParts();
        minDistanceSquared = minDistanceSquared(re, im);
        double limit = minDistanceSquared * (1 + EQUAL_DISTANCE_TOLERANCE);
        neighbours = new int[size];
        int[] hamming = new int[size];
        for (int a = 0; a < size; a++) {
            for (int b = a + 1; b < size; b++) {
                double dr = re[a] - re[b];
                double di = im[a] - im[b];
                if (dr * dr + di * di <= limit) {
                    int d = Integer.bitCount(a ^ b);
                    neighbours[a]++;
                    neighbours[b]++;
                    hamming[a] += d;
                    hamming[b] += d;
                }
            }
        }
        double weightedNeighbours = 0;
        double weightedHamming = 0;
        double h = 0;
        for (int label = 0; label < size; label++) {
            double p = c.probability(label);
            weightedNeighbours += p * neighbours[label];
            weightedHamming += p * hamming[label];
            if (p > 0) {
                h -= p * StrictMath.log(p);
            }
        }
        averageNeighbours = weightedNeighbours;
        if (weightedNeighbours > 0) {
            grayPenalty = weightedHamming / weightedNeighbours;
        } else {
            // every point with a neighbour at d_min has probability 0: weigh the pairs equally instead
            long pairs = 0;
            long bits = 0;
            for (int label = 0; label < size; label++) {
                pairs += neighbours[label];
                bits += hamming[label];
            }
            grayPenalty = (double) bits / pairs;
        }
        entropy = c.isUniform() ? bitsPerSymbol : h / StrictMath.log(2);
    }

    /** The metrics of {@code constellation} as it is (normalize first if the scale matters to you). */
    public static Metrics of(Constellation constellation) {
        return new Metrics(constellation);
    }

    /** Smallest squared distance between two points. */
    static double minDistanceSquared(double[] re, double[] im) {
        double min = Double.POSITIVE_INFINITY;
        for (int a = 0; a < re.length; a++) {
            for (int b = a + 1; b < re.length; b++) {
                double dr = re[a] - re[b];
                double di = im[a] - im[b];
                min = Math.min(min, dr * dr + di * di);
            }
        }
        return min;
    }

    /** M. */
    public int size() {
        return size;
    }

    /** k = log2 M. */
    public int bitsPerSymbol() {
        return bitsPerSymbol;
    }

    /** E_s = Σ p(s)|s|². */
    public double averageEnergy() {
        return averageEnergy;
    }

    /** E_b = E_s / k. */
    public double bitEnergy() {
        return averageEnergy / bitsPerSymbol;
    }

    /** max |s|². */
    public double peakEnergy() {
        return peakEnergy;
    }

    /** d_min. */
    public double minDistance() {
        return StrictMath.sqrt(minDistanceSquared);
    }

    /** d_min². */
    public double minDistanceSquared() {
        return minDistanceSquared;
    }

    /** The number of other points at distance d_min from the point of {@code label}. */
    public int neighbours(int label) {
        return neighbours[label];
    }

    /** Nearest-neighbour counts by label (a copy). */
    public int[] neighbourCounts() {
        return neighbours.clone();
    }

    /** Σ p(s)·N(s): the probability-weighted average number of nearest neighbours. */
    public double averageNeighbours() {
        return averageNeighbours;
    }

    /** ε = d_min² / E_b. */
    public double powerEfficiency() {
        return minDistanceSquared / bitEnergy();
    }

    /** 10·log10(4/ε): the extra Eb/N0 this constellation needs over BPSK for the same d_min-limited error rate. */
    public double snrLossVsBpskDb() {
        return 10 * StrictMath.log10(4 / powerEfficiency());
    }

    /** 10·log10(max|s|² / E_s) of the points. */
    public double paprDb() {
        return 10 * StrictMath.log10(peakEnergy / averageEnergy);
    }

    /** Average number of differing label bits over nearest-neighbour pairs (1 for a Gray labeling). */
    public double grayPenalty() {
        return grayPenalty;
    }

    /** −Σ p log2 p in bits per symbol; exactly k for equiprobable symbols. */
    public double entropy() {
        return entropy;
    }

    /** k/2 bit/s/Hz: rectangular pulses, first-null bandwidth 2/T. */
    public double bandwidthEfficiencyFirstNull() {
        return bitsPerSymbol / 2.0;
    }

    /** k/(1+α) bit/s/Hz: raised-cosine pulses of roll-off α in [0, 1], occupied bandwidth (1+α)/T. */
    public double bandwidthEfficiency(double rolloff) {
        if (!(rolloff >= 0 && rolloff <= 1)) {
            throw new IllegalArgumentException("roll-off must be in [0, 1], got " + rolloff);
        }
        return bitsPerSymbol / (1 + rolloff);
    }

    /** k bit/s/Hz: the Nyquist minimum bandwidth 1/T. */
    public double bandwidthEfficiencyNyquist() {
        return bitsPerSymbol;
    }

    @Override
    public String toString() {
        return "Metrics[M=" + size + ", k=" + bitsPerSymbol + ", Es=" + averageEnergy + ", dmin2=" + minDistanceSquared
                + ", eps=" + powerEfficiency() + ", neighbours=" + averageNeighbours + ", grayPenalty=" + grayPenalty + "]";
    }
}
