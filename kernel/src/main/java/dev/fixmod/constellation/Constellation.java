package dev.fixmod.constellation;

import java.util.Arrays;
import java.util.Objects;

/**
 * An immutable constellation of M = 2^k points, stored by label: {@code re(label)}, {@code im(label)}. Label bit b0 is
 * the first bit in time and the most significant bit of the label. Validation lives here and only here: M a power of
 * two, labels a permutation of 0..M−1, distinct finite points, probabilities that are finite, non-negative and sum to 1
 * within {@value #PROBABILITY_SUM_TOLERANCE}.
 *
 * <p>A separable constellation (PAM, square and rectangular QAM, BPSK, QPSK at 45°, any user grid whose I depends on
 * some label bits and Q on the others) carries its {@link AxisLayout}, which the per-axis slicers and per-dimension
 * demappers need; it is found from the points when the factory does not give it. π/2-BPSK is stored as its even-index
 * constellation with {@link #alternatesQuarterTurn()} set: symbols of odd index are rotated by +90°; it has no axis
 * layout because the rotation moves its bit from one axis to the other.
 *
 * <p>A coordinate of −0.0 is stored as +0.0, so tables, hex words and text outputs never show a signed zero.
 */
public final class Constellation {
    /** Tolerance on the sum of probabilities: loose enough for probabilities printed with 10 digits. */
    public static final double PROBABILITY_SUM_TOLERANCE = 1e-9;

    /**
     * A normalization factor within this distance of 1 is applied as exactly 1, so a constellation that is already at
     * its target (PSK on the unit circle, the published 3GPP and IEEE points, anything normalized once) is kept bit for
     * bit instead of being moved by an ulp. No Q format shorter than 40 bits can see the difference.
     */
    public static final double UNIT_FACTOR_TOLERANCE = 1e-12;

    private final String name;
    private final Family family;
    private final String labeling;
    private final int bitsPerSymbol;
    private final double[] re;
    private final double[] im;
    private final double[] probability;
    private final boolean uniform;
    private final AxisLayout axes;
    private final boolean alternatesQuarterTurn;

    private Constellation(String name, Family family, String labeling, double[] re, double[] im, double[] probability,
                          AxisLayout axes, boolean alternatesQuarterTurn) {
        this.name = Objects.requireNonNull(name, "name");
        this.family = Objects.requireNonNull(family, "family");
        this.labeling = Objects.requireNonNull(labeling, "labeling");
        int m = re.length;
        if (m < 2 || Integer.bitCount(m) != 1) {
            throw new IllegalArgumentException(name + ": the number of points must be a power of two >= 2, got " + m);
        }
        if (im.length != m) {
            throw new IllegalArgumentException(name + ": " + m + " real parts but " + im.length + " imaginary parts");
        }
        this.bitsPerSymbol = Integer.numberOfTrailingZeros(m);
        this.re = positiveZeros(re);
        this.im = positiveZeros(im);
        for (int label = 0; label < m; label++) {
            if (!Double.isFinite(re[label]) || !Double.isFinite(im[label])) {
                throw new IllegalArgumentException(name + ": point of label " + label + " is not finite ("
                        + re[label] + ", " + im[label] + ")");
            }
        }
        checkDistinct(name, this.re, this.im);
        if (probability == null) {
            this.probability = new double[m];
            Arrays.fill(this.probability, 1.0 / m);
            this.uniform = true;
        } else {
            if (probability.length != m) {
                throw new IllegalArgumentException(name + ": " + m + " points but " + probability.length + " probabilities");
            }
            double sum = 0;
            for (int label = 0; label < m; label++) {
                double p = probability[label];
                if (!Double.isFinite(p) || p < 0) {
                    throw new IllegalArgumentException(name + ": probability of label " + label + " is " + p
                            + "; probabilities must be finite and >= 0");
                }
                sum += p;
            }
            if (Math.abs(sum - 1.0) > PROBABILITY_SUM_TOLERANCE) {
                throw new IllegalArgumentException(name + ": probabilities sum to " + sum + ", not 1");
            }
            this.probability = probability.clone();
            boolean allEqual = true;
            for (double p : probability) {
                allEqual &= p == probability[0];
            }
            this.uniform = allEqual;
        }
        if (axes != null) {
            checkAxes(name, axes, this.re, this.im);
        }
        this.axes = axes != null || alternatesQuarterTurn ? axes : AxisLayout.detect(this.re, this.im);
        this.alternatesQuarterTurn = alternatesQuarterTurn;
    }

    /** A copy of {@code values} with −0.0 replaced by +0.0 (adding +0.0 does exactly that and nothing else). */
    static double[] positiveZeros(double[] values) {
        double[] copy = new double[values.length];
        for (int n = 0; n < values.length; n++) {
            copy[n] = values[n] + 0.0;
        }
        return copy;
    }

    private static void checkDistinct(String name, double[] re, double[] im) {
        Integer[] order = new Integer[re.length];
        for (int i = 0; i < order.length; i++) {
            order[i] = i;
        }
        Arrays.sort(order, (a, b) -> re[a] != re[b] ? Double.compare(re[a], re[b]) : Double.compare(im[a], im[b]));
        for (int i = 1; i < order.length; i++) {
            int a = order[i - 1];
            int b = order[i];
            if (re[a] == re[b] && im[a] == im[b]) {
                throw new IllegalArgumentException(name + ": labels " + Math.min(a, b) + " and " + Math.max(a, b)
                        + " share the point (" + re[a] + ", " + im[a] + "); points must be distinct");
            }
        }
    }

    private static void checkAxes(String name, AxisLayout axes, double[] re, double[] im) {
        if (axes.bitsPerSymbol() != Integer.numberOfTrailingZeros(re.length)) {
            throw new IllegalArgumentException(name + ": axis layout has " + axes.bitsPerSymbol() + " bits, points need "
                    + Integer.numberOfTrailingZeros(re.length));
        }
        for (int label = 0; label < re.length; label++) {
            if (axes.iLevel(axes.subLabelI(label)) != re[label] || axes.qLevel(axes.subLabelQ(label)) != im[label]) {
                throw new IllegalArgumentException(name + ": axis layout disagrees with the point of label " + label);
            }
        }
    }

    /**
     * A constellation from points indexed by label.
     *
     * @param probability symbol probabilities by label, or {@code null} for equiprobable symbols
     * @param axes        the separable structure, or {@code null}
     */
    public static Constellation ofLabelled(String name, Family family, String labeling, double[] re, double[] im,
                                           double[] probability, AxisLayout axes) {
        return new Constellation(name, family, labeling, re, im, probability, axes, false);
    }

    /**
     * A constellation from a list of points and the label of each (e.g. read from a user's file): the labels must be
     * a permutation of 0..M−1.
     *
     * @param probability symbol probabilities in the order of the points, or {@code null}
     */
    public static Constellation ofPoints(String name, String labeling, double[] re, double[] im, int[] labels,
                                         double[] probability) {
        int m = re.length;
        if (labels.length != m || im.length != m || (probability != null && probability.length != m)) {
            throw new IllegalArgumentException(name + ": points, labels and probabilities must have the same count");
        }
        double[] byLabelRe = new double[m];
        double[] byLabelIm = new double[m];
        double[] byLabelP = probability == null ? null : new double[m];
        boolean[] seen = new boolean[m];
        for (int i = 0; i < m; i++) {
            int label = labels[i];
            if (label < 0 || label >= m) {
                throw new IllegalArgumentException(name + ": point " + i + " has label " + label + ", outside 0.." + (m - 1));
            }
            if (seen[label]) {
                throw new IllegalArgumentException(name + ": label " + label + " is used twice; labels must be a"
                        + " permutation of 0.." + (m - 1));
            }
            seen[label] = true;
            byLabelRe[label] = re[i];
            byLabelIm[label] = im[i];
            if (byLabelP != null) {
                byLabelP[label] = probability[i];
            }
        }
        return new Constellation(name, Family.CUSTOM, labeling, byLabelRe, byLabelIm, byLabelP, null, false);
    }

    /** The π/2-BPSK form of a two-point constellation: odd-index symbols rotated by +90°. */
    public Constellation withAlternatingQuarterTurn(String newName) {
        if (size() != 2) {
            throw new IllegalArgumentException("a quarter-turn alternation applies to 2-point constellations only");
        }
        return new Constellation(newName, Family.PI2_BPSK, labeling, re, im, probability, null, true);
    }

    /** This constellation with other symbol probabilities (by label); averages and normalizations follow them. */
    public Constellation withProbabilities(double[] probabilityByLabel) {
        return new Constellation(name, family, labeling, re, im, probabilityByLabel, axes, alternatesQuarterTurn);
    }

    /** This constellation under another name (e.g. the catalogue name it was resolved from). */
    public Constellation withName(String newName) {
        return new Constellation(newName, family, labeling, re, im, uniform ? null : probability, axes,
                alternatesQuarterTurn);
    }

    /**
     * This constellation with Maxwell–Boltzmann probabilities p(s) ∝ exp(−λ|s|²) on its present coordinates; λ = 0
     * gives equiprobable symbols. Computed with {@link StrictMath} relative to the lowest energy, so large λ cannot
     * underflow every weight.
     *
     * <table class="striped">
     *   <caption>Probabilities of 4-PAM (±1, ±3) under a few λ</caption>
     *   <thead><tr><th>λ</th><th>p(±1)</th><th>p(±3)</th></tr></thead>
     *   <tbody>
     *     <tr><td>0</td><td>0.25</td><td>0.25</td></tr>
     *     <tr><td>0.1</td><td>1/(2(1+e^−0.8)) ≈ 0.3450</td><td>≈ 0.1550</td></tr>
     *     <tr><td>1000</td><td>0.5</td><td>0 (e^−8000 underflows)</td></tr>
     *   </tbody>
     * </table>
     *
     * @param lambda λ, finite and ≥ 0
     */
    public Constellation withMaxwellBoltzmann(double lambda) {
        if (!(lambda >= 0) || !Double.isFinite(lambda)) {
            throw new IllegalArgumentException("Maxwell-Boltzmann parameter must be finite and >= 0, got " + lambda);
        }
        int m = re.length;
        double[] energy = new double[m];
        double lowest = Double.POSITIVE_INFINITY;
        for (int label = 0; label < m; label++) {
            energy[label] = re[label] * re[label] + im[label] * im[label];
            lowest = Math.min(lowest, energy[label]);
        }
        double[] weight = new double[m];
        double sum = 0;
        for (int label = 0; label < m; label++) {
            weight[label] = StrictMath.exp(-lambda * (energy[label] - lowest));
            sum += weight[label];
        }
        for (int label = 0; label < m; label++) {
            weight[label] /= sum;
        }
        return withProbabilities(weight);
    }

    /** This constellation with every point multiplied by {@code factor > 0}. */
    public Constellation scaled(double factor) {
        if (!(factor > 0) || !Double.isFinite(factor)) {
            throw new IllegalArgumentException("scale factor must be finite and > 0, got " + factor);
        }
        double[] r = re.clone();
        double[] i = im.clone();
        for (int n = 0; n < r.length; n++) {
            r[n] *= factor;
            i[n] *= factor;
        }
        return new Constellation(name, family, labeling, r, i, uniform ? null : probability,
                axes == null ? null : axes.scaled(factor), alternatesQuarterTurn);
    }

    /**
     * The factor that {@link #normalized} would apply: 1/√(E_s), 1/√(E_s/k) or 1/√(max|s|²), computed with
     * {@link StrictMath} so it is identical on every JVM, and exactly 1 when within {@value #UNIT_FACTOR_TOLERANCE} of
     * 1. On an integer grid E_s is exact, so unit-energy 16-QAM gets exactly {@code 1 / StrictMath.sqrt(10)}.
     */
    public double normalizationFactor(Normalization normalization) {
        double factor;
        switch (normalization) {
            case NONE:
                return 1.0;
            case UNIT_ENERGY:
                factor = 1.0 / StrictMath.sqrt(averageEnergy());
                break;
            case UNIT_BIT_ENERGY:
                factor = 1.0 / StrictMath.sqrt(averageEnergy() / bitsPerSymbol);
                break;
            case UNIT_PEAK:
                factor = 1.0 / StrictMath.sqrt(peakEnergy());
                break;
            default:
                throw new AssertionError(normalization);
        }
        return Math.abs(factor - 1.0) <= UNIT_FACTOR_TOLERANCE ? 1.0 : factor;
    }

    /** This constellation scaled by {@link #normalizationFactor} (itself when the factor is 1). */
    public Constellation normalized(Normalization normalization) {
        double factor = normalizationFactor(normalization);
        return factor == 1.0 ? this : scaled(factor);
    }

    /** E_s = Σ p(s)·|s|², weighted by the symbol probabilities. */
    public double averageEnergy() {
        double sum = 0;
        for (int label = 0; label < re.length; label++) {
            sum += probability[label] * (re[label] * re[label] + im[label] * im[label]);
        }
        return sum;
    }

    /** max |s|². */
    public double peakEnergy() {
        double peak = 0;
        for (int label = 0; label < re.length; label++) {
            peak = Math.max(peak, re[label] * re[label] + im[label] * im[label]);
        }
        return peak;
    }

    public String name() {
        return name;
    }

    public Family family() {
        return family;
    }

    /** The labeling's name, e.g. {@code gray}, {@code natural}, {@code nr}, {@code wlan}, {@code quasi-gray}. */
    public String labeling() {
        return labeling;
    }

    /** M. */
    public int size() {
        return re.length;
    }

    /** k = log2 M. */
    public int bitsPerSymbol() {
        return bitsPerSymbol;
    }

    public double re(int label) {
        return re[label];
    }

    public double im(int label) {
        return im[label];
    }

    public double probability(int label) {
        return probability[label];
    }

    /** Whether all symbols are equally likely. */
    public boolean isUniform() {
        return uniform;
    }

    /** Real parts by label (a copy). */
    public double[] realParts() {
        return re.clone();
    }

    /** Imaginary parts by label (a copy). */
    public double[] imaginaryParts() {
        return im.clone();
    }

    /** Probabilities by label (a copy). */
    public double[] probabilities() {
        return probability.clone();
    }

    /** The separable structure, or {@code null} if the constellation is not separable. */
    public AxisLayout axes() {
        return axes;
    }

    public boolean isSeparable() {
        return axes != null;
    }

    /** Whether odd-index symbols are rotated by +90° (π/2-BPSK). */
    public boolean alternatesQuarterTurn() {
        return alternatesQuarterTurn;
    }

    @Override
    public String toString() {
        return name + " (" + size() + " points, " + labeling + " labeling)";
    }
}
