package dev.fixmod.constellation;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Factories of the constellation families on their natural grids: PAM and QAM on the odd integers ±1, ±3, …, PSK on
 * the unit circle, ring constellations with their given radii. Normalize with {@link Constellation#normalized}; look
 * families up by name with {@link Catalogue}.
 *
 * <p><b>Points on the unit circle</b> (PSK and every ring) are computed from the angle as a fraction of a turn: the
 * angle is reduced to its quadrant exactly, {@link StrictMath} evaluates cos and sin only inside the first octant, and
 * the point is reflected into place. So points that lie on an axis are exactly 0 and ±1, points on a diagonal have
 * both coordinates ±√½ (correctly rounded), points mirrored about an axis or a diagonal are exact mirror images, and
 * the result is the same on every JVM.
 *
 * <table class="striped">
 *   <caption>Examples of points on the unit circle</caption>
 *   <thead><tr><th>angle</th><th>I</th><th>Q</th></tr></thead>
 *   <tbody>
 *     <tr><td>0°</td><td>1</td><td>0</td></tr>
 *     <tr><td>90°</td><td>0</td><td>1 (not 6.1e−17, 1)</td></tr>
 *     <tr><td>180°</td><td>−1</td><td>0 (+0.0, not 1.2e−16)</td></tr>
 *     <tr><td>45°</td><td>0.7071067811865476</td><td>0.7071067811865476</td></tr>
 *     <tr><td>225°</td><td>−0.7071067811865476</td><td>−0.7071067811865476</td></tr>
 *     <tr><td>67.5°</td><td>sin(22.5°)</td><td>cos(22.5°)</td></tr>
 *   </tbody>
 * </table>
 */
public final class Constellations {
    private Constellations() {
    }

    private static void requirePowerOfTwo(int m, int min, int max, String family) {
        if (m < min || m > max || Integer.bitCount(m) != 1) {
            throw new IllegalArgumentException(family + " order must be a power of two in " + min + ".." + max + ", got " + m);
        }
    }

    private static void requireLabeling(Labeling labeling, String family, Labeling... accepted) {
        for (Labeling a : accepted) {
            if (a == labeling) {
                return;
            }
        }
        throw new IllegalArgumentException(family + " has no " + labeling + " labeling; accepted: "
                + String.join(", ", Arrays.stream(accepted).map(Labeling::tradeName).toArray(String[]::new)));
    }

    /** Levels −(L−1), …, −1, 1, …, L−1 indexed by sub-label: Gray ({@code gray}) or natural order from the bottom. */
    static double[] axisLevels(int levels, boolean gray) {
        double[] bySubLabel = new double[levels];
        for (int n = 0; n < levels; n++) {
            int subLabel = gray ? Labeling.gray(n) : n;
            bySubLabel[subLabel] = -(levels - 1) + 2.0 * n;
        }
        return bySubLabel;
    }

    static int[] range(int from, int count) {
        int[] r = new int[count];
        for (int i = 0; i < count; i++) {
            r[i] = from + i;
        }
        return r;
    }

    /** M-PAM on the odd-integer grid with binary-reflected Gray (or natural) labels along the axis. */
    public static Constellation pam(int m, boolean gray) {
        return pam(m, gray ? Labeling.GRAY : Labeling.NATURAL);
    }

    /**
     * M-PAM, M = 2..1024, on the odd-integer grid −(M−1), …, M−1 (points on the I axis); the n-th level from the most
     * negative gets label Gray(n) or n. Labelings: gray, natural.
     */
    public static Constellation pam(int m, Labeling labeling) {
        requirePowerOfTwo(m, 2, 1024, "PAM");
        requireLabeling(labeling, "PAM", Labeling.GRAY, Labeling.NATURAL);
        int k = Integer.numberOfTrailingZeros(m);
        AxisLayout axes = new AxisLayout(range(0, k), new int[0], axisLevels(m, labeling == Labeling.GRAY),
                new double[] {0.0});
        return fromAxes("pam" + m, Family.PAM, labeling.tradeName(), axes);
    }

    /**
     * Square M-QAM on the odd-integer grid; the first k/2 label bits select the I level and the last k/2 the Q
     * level, each axis labelled by binary-reflected Gray (or natural) code from the most negative level up.
     */
    public static Constellation qam(int m, boolean gray) {
        return qam(m, gray ? Labeling.GRAY : Labeling.NATURAL);
    }

    /**
     * Square M-QAM, M = 4, 16, …, 4096, on the odd-integer grid; the first k/2 label bits select the I level and the
     * last k/2 the Q level, each axis labelled from its most negative level up. Labelings: gray, natural.
     */
    public static Constellation qam(int m, Labeling labeling) {
        requirePowerOfTwo(m, 4, 4096, "square QAM");
        int k = Integer.numberOfTrailingZeros(m);
        if (k % 2 != 0) {
            throw new IllegalArgumentException("square QAM needs an even number of bits per symbol; " + m
                    + "-QAM has " + k + " (use a rectangular or cross QAM)");
        }
        requireLabeling(labeling, "square QAM", Labeling.GRAY, Labeling.NATURAL);
        return rectangular("qam" + m, Family.SQUARE_QAM, 1 << (k / 2), 1 << (k / 2), labeling);
    }

    /**
     * Rectangular QAM with {@code iLevels} × {@code qLevels} points on the odd-integer grid (both powers of two ≥ 2,
     * product ≤ 4096), e.g. 8-QAM as 4 × 2 and 32-QAM as 8 × 4. The first log2(iLevels) label bits select the I level,
     * the rest the Q level, each axis labelled from its most negative level up. Labelings: gray, natural. The name is
     * {@code rqam<M>} when I has as many or twice as many levels as Q, else {@code rqam<I>x<Q>}.
     */
    public static Constellation rectangularQam(int iLevels, int qLevels, Labeling labeling) {
        if (iLevels < 2 || qLevels < 2 || Integer.bitCount(iLevels) != 1 || Integer.bitCount(qLevels) != 1
                || (long) iLevels * qLevels > 4096) {
            throw new IllegalArgumentException("rectangular QAM needs I and Q level counts that are powers of two >= 2"
                    + " with a product <= 4096, got " + iLevels + " x " + qLevels);
        }
        requireLabeling(labeling, "rectangular QAM", Labeling.GRAY, Labeling.NATURAL);
        int m = iLevels * qLevels;
        boolean usual = iLevels == qLevels || iLevels == 2 * qLevels;
        return rectangular(usual ? "rqam" + m : "rqam" + iLevels + "x" + qLevels, Family.RECTANGULAR_QAM, iLevels,
                qLevels, labeling);
    }

    private static Constellation rectangular(String name, Family family, int iLevels, int qLevels, Labeling labeling) {
        int a = Integer.numberOfTrailingZeros(iLevels);
        int b = Integer.numberOfTrailingZeros(qLevels);
        boolean gray = labeling == Labeling.GRAY;
        AxisLayout axes = new AxisLayout(range(0, a), range(a, b), axisLevels(iLevels, gray), axisLevels(qLevels, gray));
        return fromAxes(name, family, labeling.tradeName(), axes);
    }

    /**
     * Cross QAM, M = 32, 128, 512 or 2048 (k = 2n+1 odd), on the odd-integer grid: the square of side 3L/2 levels
     * (L = 2^n) without its four corners of (L/4)² points each; 32-QAM is the 6 × 6 square without its corners.
     *
     * <p><b>Construction</b> (ours, for both labelings). Start from the rectangular grid of 2L × L points with its
     * per-axis labeling (the first n+1 bits select I, the last n select Q, as {@link #rectangularQam}). The points
     * with |I| ≤ 3L/2 − 1 stay. The L/4 outer columns on each side are folded into the arms above and below: a point
     * with |I| = 3L/2 + 1 + 2c and |Q| = 1 + 2r moves to |I| = 1 + 2r, |Q| = L + 1 + 2c in the same quadrant, i.e.
     * its distance from the cross's edge and its distance from the axis swap roles.
     *
     * <p>With {@code quasi-gray} (per-axis Gray on the rectangle) every nearest pair inside the central band
     * |Q| ≤ L − 1 (which holds the left and right arms) or inside the top or bottom arm differs in exactly one bit;
     * only the 2L pairs across the bases of the top and bottom arms differ in more. Measured Gray
     * penalty (average Hamming distance over nearest-neighbour pairs, {@link Metrics#grayPenalty}):
     *
     * <table class="striped">
     *   <caption>Gray penalty of the quasi-gray cross QAM</caption>
     *   <thead><tr><th>M</th><th>32</th><th>128</th><th>512</th><th>2048</th></tr></thead>
     *   <tbody><tr><td>penalty</td><td>60/52 ≈ 1.1538</td><td>264/232 ≈ 1.1379</td><td>1072/976 ≈ 1.0984</td>
     *   <td>4256/4000 = 1.064</td></tr></tbody>
     * </table>
     *
     * For M = 32 no other assignment of the eight displaced labels to the eight arm positions does better (checked
     * exhaustively in the tests). Labelings: quasi-gray, natural.
     */
    public static Constellation crossQam(int m, Labeling labeling) {
        if (m != 32 && m != 128 && m != 512 && m != 2048) {
            throw new IllegalArgumentException("cross QAM order must be 32, 128, 512 or 2048, got " + m);
        }
        requireLabeling(labeling, "cross QAM", Labeling.QUASI_GRAY, Labeling.NATURAL);
        int n = (Integer.numberOfTrailingZeros(m) - 1) / 2;
        int l = 1 << n;
        boolean gray = labeling == Labeling.QUASI_GRAY;
        double[] iAxis = axisLevels(2 * l, gray);
        double[] qAxis = axisLevels(l, gray);
        double[] re = new double[m];
        double[] im = new double[m];
        int edge = 3 * l / 2 - 1;
        for (int label = 0; label < m; label++) {
            double i = iAxis[label >>> n];
            double q = qAxis[label & (l - 1)];
            if (Math.abs(i) > edge) {
                double c = (Math.abs(i) - (edge + 2)) / 2;
                double r = (Math.abs(q) - 1) / 2;
                double movedI = Math.signum(i) * (1 + 2 * r);
                double movedQ = Math.signum(q) * (l + 1 + 2 * c);
                i = movedI;
                q = movedQ;
            }
            re[label] = i;
            im[label] = q;
        }
        return Constellation.ofLabelled("cqam" + m, Family.CROSS_QAM, labeling.tradeName(), re, im, null, null);
    }

    /** Builds the points of a separable constellation from its axis layout. */
    public static Constellation fromAxes(String name, Family family, String labeling, AxisLayout axes) {
        int m = 1 << axes.bitsPerSymbol();
        double[] re = new double[m];
        double[] im = new double[m];
        for (int label = 0; label < m; label++) {
            re[label] = axes.iLevel(axes.subLabelI(label));
            im[label] = axes.qLevel(axes.subLabelQ(label));
        }
        return Constellation.ofLabelled(name, family, labeling, re, im, null, axes);
    }

    /**
     * M-PSK on the unit circle: point n (counter-clockwise from {@code phaseOffset} radians) has angle
     * {@code phaseOffset + 2πn/M} and label Gray(n) (or n).
     */
    public static Constellation psk(int m, double phaseOffset, boolean gray) {
        return psk(m, phaseOffset, gray ? Labeling.GRAY : Labeling.NATURAL);
    }

    /**
     * M-PSK, M = 2..1024, on the unit circle: point n, counter-clockwise from the phase offset, has angle
     * {@code phaseOffsetRadians + 2πn/M} and label Gray(n) or n. Labelings: gray, natural. An offset that is an exact
     * binary fraction of π (π/4, π/M) gives exact axis points; see {@link #pskDegrees} for offsets in degrees.
     */
    public static Constellation psk(int m, double phaseOffsetRadians, Labeling labeling) {
        if (!Double.isFinite(phaseOffsetRadians)) {
            throw new IllegalArgumentException("PSK phase offset must be finite, got " + phaseOffsetRadians);
        }
        return pskTurns(m, phaseOffsetRadians / (2 * StrictMath.PI), labeling);
    }

    /** As {@link #psk(int, double, Labeling)} with the offset in degrees (22.5° and 45° are exact). */
    public static Constellation pskDegrees(int m, double phaseOffsetDegrees, Labeling labeling) {
        if (!Double.isFinite(phaseOffsetDegrees)) {
            throw new IllegalArgumentException("PSK phase offset must be finite, got " + phaseOffsetDegrees);
        }
        return pskTurns(m, phaseOffsetDegrees / 360.0, labeling);
    }

    private static Constellation pskTurns(int m, double offsetTurns, Labeling labeling) {
        requirePowerOfTwo(m, 2, 1024, "PSK");
        requireLabeling(labeling, "PSK", Labeling.GRAY, Labeling.NATURAL);
        double[] re = new double[m];
        double[] im = new double[m];
        double[] point = new double[2];
        for (int n = 0; n < m; n++) {
            int label = labeling == Labeling.GRAY ? Labeling.gray(n) : n;
            unitCircle(offsetTurns + (double) n / m, point);
            re[label] = point[0];
            im[label] = point[1];
        }
        return Constellation.ofLabelled("psk" + m, Family.PSK, labeling.tradeName(), re, im, null, null);
    }

    /** Writes cos and sin of {@code turns} full turns into {@code out[0]}, {@code out[1]} (see the class comment). */
    static void unitCircle(double turns, double[] out) {
        double t = turns - StrictMath.floor(turns);
        double x = 4 * t;
        int quadrant = (int) x;
        double r = x - quadrant;
        double c;
        double s;
        if (r == 0) {
            c = 1;
            s = 0;
        } else if (r == 0.5) {
            c = StrictMath.sqrt(0.5);
            s = c;
        } else if (r < 0.5) {
            c = StrictMath.cos(r * StrictMath.PI / 2);
            s = StrictMath.sin(r * StrictMath.PI / 2);
        } else {
            double u = 1 - r;
            c = StrictMath.sin(u * StrictMath.PI / 2);
            s = StrictMath.cos(u * StrictMath.PI / 2);
        }
        switch (quadrant & 3) {
            case 0:
                out[0] = c;
                out[1] = s;
                break;
            case 1:
                out[0] = -s;
                out[1] = c;
                break;
            case 2:
                out[0] = -c;
                out[1] = -s;
                break;
            default:
                out[0] = s;
                out[1] = -c;
                break;
        }
        out[0] += 0.0;
        out[1] += 0.0;
    }

    /**
     * A ring (APSK) constellation: ring j holds {@code ringSizes[j]} equally spaced points of radius
     * {@code radii[j]}, the first at {@code phaseOffsetsDegrees[j]} and the rest counter-clockwise. The radius ratios
     * of the trade (γ = r2/r1, …) are the radii with r1 = 1. Examples: 4+12 and 4+12+16 APSK, star 8-QAM (4+4).
     *
     * <p><b>natural</b>: labels count 0, 1, … through the points, ring by ring from the first (inner) ring, each ring
     * counter-clockwise from its first point.
     *
     * <p><b>quasi-gray</b> (ours; every ring size even): walk the binary-reflected Gray cycle G(0), …, G(M−1), which
     * satisfies G(M−1−i) = G(i) XOR 2^(k−1), in mirror pairs (i, M−1−i). Ring j takes the next s_j/2 pairs i = a..b and
     * its points, in order, get G(a), …, G(b), G(M−1−b), …, G(M−1−a): consecutive labels differ in one bit, across the
     * fold in the top bit, and the last returns to the first in the top bit. So every ring carries a cyclic Gray code.
     * Each ring after the first is then turned (start point and direction) to minimise the total Hamming distance over
     * the nearest-neighbour pairs among the rings placed so far; ties go to the smaller turn, counter-clockwise first.
     * Measured Gray penalty: 4+12 APSK 1, 4+12+16 APSK 1.2, star 8-QAM 4/3 (with the catalogue radii; for star
     * 8-QAM no labeling does better, checked exhaustively in the tests).
     *
     * @param ringSizes           points per ring, each ≥ 1, summing to a power of two 2..4096
     * @param radii               strictly increasing, finite, &gt; 0
     * @param phaseOffsetsDegrees angle of each ring's first point
     */
    public static Constellation apsk(String name, int[] ringSizes, double[] radii, double[] phaseOffsetsDegrees,
                                     Labeling labeling) {
        int rings = ringSizes.length;
        if (rings == 0 || radii.length != rings || phaseOffsetsDegrees.length != rings) {
            throw new IllegalArgumentException(name + ": ring sizes, radii and phase offsets must be given for each of"
                    + " at least one ring (got " + ringSizes.length + ", " + radii.length + ", "
                    + phaseOffsetsDegrees.length + ")");
        }
        int m = 0;
        for (int j = 0; j < rings; j++) {
            if (ringSizes[j] < 1 || ringSizes[j] > 4096) {
                throw new IllegalArgumentException(name + ": ring " + (j + 1) + " size must be 1..4096, got "
                        + ringSizes[j]);
            }
            if (!(radii[j] > 0) || !Double.isFinite(radii[j]) || (j > 0 && !(radii[j] > radii[j - 1]))) {
                throw new IllegalArgumentException(name + ": ring radii must be finite, > 0 and strictly increasing,"
                        + " got " + Arrays.toString(radii));
            }
            if (!Double.isFinite(phaseOffsetsDegrees[j])) {
                throw new IllegalArgumentException(name + ": ring " + (j + 1) + " phase offset is not finite");
            }
            m += ringSizes[j];
        }
        requirePowerOfTwo(m, 2, 4096, name + ": ring constellation size (sum of ring sizes)");
        requireLabeling(labeling, "a ring constellation", Labeling.QUASI_GRAY, Labeling.NATURAL);
        double[] walkRe = new double[m];
        double[] walkIm = new double[m];
        int[] ringStart = new int[rings + 1];
        double[] point = new double[2];
        for (int j = 0, w = 0; j < rings; j++) {
            ringStart[j] = w;
            for (int n = 0; n < ringSizes[j]; n++, w++) {
                unitCircle(phaseOffsetsDegrees[j] / 360.0 + (double) n / ringSizes[j], point);
                walkRe[w] = radii[j] * point[0];
                walkIm[w] = radii[j] * point[1];
            }
        }
        ringStart[rings] = m;
        int[] labelOfWalk = labeling == Labeling.NATURAL ? range(0, m)
                : quasiGrayRings(name, ringSizes, ringStart, walkRe, walkIm);
        double[] re = new double[m];
        double[] im = new double[m];
        for (int w = 0; w < m; w++) {
            re[labelOfWalk[w]] = walkRe[w];
            im[labelOfWalk[w]] = walkIm[w];
        }
        return Constellation.ofLabelled(name, Family.APSK, labeling.tradeName(), re, im, null, null);
    }

    private static int[] quasiGrayRings(String name, int[] ringSizes, int[] ringStart, double[] re, double[] im) {
        int m = re.length;
        int rings = ringSizes.length;
        int[] label = new int[m];
        int pair = 0;
        for (int j = 0; j < rings; j++) {
            int s = ringSizes[j];
            if (s % 2 != 0) {
                throw new IllegalArgumentException(name + ": quasi-gray needs an even number of points on every ring,"
                        + " ring " + (j + 1) + " has " + s + "; use the natural labeling");
            }
            int half = s / 2;
            for (int n = 0; n < half; n++) {
                label[ringStart[j] + n] = Labeling.gray(pair + n);
                label[ringStart[j] + half + n] = Labeling.gray(m - pair - half + n);
            }
            pair += half;
        }
        int[][] pairs = nearestPairs(re, im);
        int[] ringOf = new int[m];
        for (int j = 0; j < rings; j++) {
            Arrays.fill(ringOf, ringStart[j], ringStart[j + 1], j);
        }
        for (int j = 1; j < rings; j++) {
            int s = ringSizes[j];
            int[] cycle = Arrays.copyOfRange(label, ringStart[j], ringStart[j + 1]);
            int[] best = null;
            long bestCost = Long.MAX_VALUE;
            for (int turn = 0; turn < s; turn++) {
                for (int direction = 1; direction >= -1; direction -= 2) {
                    for (int n = 0; n < s; n++) {
                        label[ringStart[j] + n] = cycle[Math.floorMod(turn + direction * n, s)];
                    }
                    long cost = 0;
                    for (int[] p : pairs) {
                        if (ringOf[p[0]] <= j && ringOf[p[1]] <= j) {
                            cost += Integer.bitCount(label[p[0]] ^ label[p[1]]);
                        }
                    }
                    if (cost < bestCost) {
                        bestCost = cost;
                        best = Arrays.copyOfRange(label, ringStart[j], ringStart[j + 1]);
                    }
                }
            }
            System.arraycopy(best, 0, label, ringStart[j], s);
        }
        return label;
    }

    /** The unordered pairs of points at the minimum distance, with the tolerance of {@link Metrics}. */
    static int[][] nearestPairs(double[] re, double[] im) {
        double min = Metrics.minDistanceSquared(re, im);
        double limit = min * (1 + Metrics.EQUAL_DISTANCE_TOLERANCE);
        List<int[]> pairs = new ArrayList<>();
        for (int a = 0; a < re.length; a++) {
            for (int b = a + 1; b < re.length; b++) {
                double dr = re[a] - re[b];
                double di = im[a] - im[b];
                if (dr * dr + di * di <= limit) {
                    pairs.add(new int[] {a, b});
                }
            }
        }
        return pairs.toArray(new int[0][]);
    }
}
