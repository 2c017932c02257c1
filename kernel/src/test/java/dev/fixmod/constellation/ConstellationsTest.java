package dev.fixmod.constellation;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;

/** Geometry and labels of the families, and the validation in {@link Constellation}. */
class ConstellationsTest {

    private static Set<String> pointSet(Constellation c) {
        Set<String> set = new HashSet<>();
        for (int l = 0; l < c.size(); l++) {
            set.add(c.re(l) + "," + c.im(l));
        }
        return set;
    }

    @Test
    void pskAxisPointsAreExact() {
        // Geometry (common practice): 4-PSK without offset lies on the axes; Gray around the circle gives labels
        // 0, 1, 3, 2 at 0°, 90°, 180°, 270°.
        Constellation c = Constellations.psk(4, 0.0, Labeling.GRAY);
        assertEquals(1.0, c.re(0), 0.0);
        assertEquals(0.0, c.im(0), 0.0);
        assertEquals(0.0, c.re(1), 0.0);
        assertEquals(1.0, c.im(1), 0.0);
        assertEquals(-1.0, c.re(3), 0.0);
        assertEquals(0.0, c.im(3), 0.0);
        assertEquals(0.0, c.re(2), 0.0);
        assertEquals(-1.0, c.im(2), 0.0);
        assertEquals(Double.doubleToRawLongBits(0.0), Double.doubleToRawLongBits(c.im(3)), "+0.0, not -0.0");
        // BPSK: 1 − 2b.
        Constellation b = Catalogue.resolve("bpsk");
        assertEquals(1.0, b.re(0), 0.0);
        assertEquals(-1.0, b.re(1), 0.0);
        assertEquals(0.0, b.im(1), 0.0);
    }

    @Test
    void pskPointsAgreeWithCosSinAndAreMirrorImages() {
        // Reference: StrictMath.cos/sin of 2πn/M + offset in radians (that sum reaches 2π + 10°, where an ulp is 8.9e-16: allow 2e-15);
        // symmetry of the circle.
        for (int m = 2; m <= 1024; m *= 2) {
            for (double offsetDegrees : new double[] {0, 22.5, 45, 10}) {
                Constellation c = Constellations.pskDegrees(m, offsetDegrees, Labeling.NATURAL);
                for (int n = 0; n < m; n++) {
                    double angle = 2 * Math.PI * n / m + Math.toRadians(offsetDegrees);
                    assertEquals(StrictMath.cos(angle), c.re(n), 2e-15, m + "-PSK point " + n);
                    assertEquals(StrictMath.sin(angle), c.im(n), 2e-15, m + "-PSK point " + n);
                }
                if (offsetDegrees == 0 && m >= 4) {
                    for (int n = 0; n < m; n++) {
                        int mirror = (m - n) % m;
                        assertEquals(c.re(n), c.re(mirror), 0.0, "mirror about the I axis");
                        assertEquals(c.im(n), -c.im(mirror), 0.0);
                        int turned = (n + m / 4) % m;
                        assertEquals(c.re(n), c.im(turned), 0.0, "quarter turn");
                        assertEquals(c.im(n), -c.re(turned), 0.0);
                    }
                }
            }
        }
    }

    @Test
    void qpskAt45DegreesIsSeparableWithEqualCoordinates() {
        Constellation c = Constellations.pskDegrees(4, 45, Labeling.GRAY);
        double h = StrictMath.sqrt(0.5);
        for (int l = 0; l < 4; l++) {
            assertEquals(h, Math.abs(c.re(l)), 0.0);
            assertEquals(h, Math.abs(c.im(l)), 0.0);
        }
        assertTrue(c.isSeparable());
        // Gray around the circle from 45°: 0 (+,+), 1 (−,+), 3 (−,−), 2 (+,−): b1 selects I, b0 selects Q.
        assertArrayEquals(new int[] {1}, c.axes().iBits());
        assertArrayEquals(new int[] {0}, c.axes().qBits());
        assertFalse(Constellations.psk(8, 0, Labeling.GRAY).isSeparable());
    }

    @Test
    void radiansAndDegreesAgreeOnBinaryFractions() {
        Constellation r = Constellations.psk(8, StrictMath.PI / 8, Labeling.GRAY);
        Constellation d = Constellations.pskDegrees(8, 22.5, Labeling.GRAY);
        assertArrayEquals(d.realParts(), r.realParts(), 0.0);
        assertArrayEquals(d.imaginaryParts(), r.imaginaryParts(), 0.0);
    }

    @Test
    void rectangularQamShapesAndLayout() {
        Constellation q8 = Catalogue.resolve("rqam8", Catalogue.Options.DEFAULT.withNormalization(Normalization.NONE));
        assertEquals(Family.RECTANGULAR_QAM, q8.family());
        assertEquals(8, q8.size());
        assertArrayEquals(new int[] {0, 1}, q8.axes().iBits(), "8-QAM as 4 x 2: I carries b0 b1");
        assertArrayEquals(new int[] {2}, q8.axes().qBits());
        assertArrayEquals(new double[] {-3, -1, 3, 1}, q8.axes().iLevels(), 0.0, "Gray 00 01 11 10 from -3");
        assertArrayEquals(new double[] {-1, 1}, q8.axes().qLevels(), 0.0);
        Constellation q32 = Catalogue.resolve("rqam32");
        assertEquals(3, q32.axes().iBits().length, "32-QAM as 8 x 4");
        assertEquals(2, q32.axes().qBits().length);
        assertEquals("rqam2x8", Catalogue.resolve("rqam2x8").name());
        assertThrows(IllegalArgumentException.class, () -> Constellations.rectangularQam(3, 2, Labeling.GRAY));
        assertThrows(IllegalArgumentException.class, () -> Constellations.rectangularQam(128, 64, Labeling.GRAY));
    }

    @Test
    void crossQamPointSets() {
        // Handbook shape (Proakis, cross constellations): 32-QAM is the 6 x 6 square without its corners; 128-QAM the
        // 12 x 12 square without 2 x 2 corners.
        for (int m : new int[] {32, 128, 512, 2048}) {
            int n = (Integer.numberOfTrailingZeros(m) - 1) / 2;
            int side = 3 << (n - 1);
            int corner = 1 << (n - 2);
            Set<String> expected = new HashSet<>();
            for (int i = 0; i < side; i++) {
                for (int q = 0; q < side; q++) {
                    boolean cornerI = i < corner || i >= side - corner;
                    boolean cornerQ = q < corner || q >= side - corner;
                    if (!(cornerI && cornerQ)) {
                        expected.add((double) (-(side - 1) + 2 * i) + "," + (double) (-(side - 1) + 2 * q));
                    }
                }
            }
            for (Labeling l : List.of(Labeling.QUASI_GRAY, Labeling.NATURAL)) {
                Constellation c = Constellations.crossQam(m, l);
                assertEquals(m, expected.size());
                assertEquals(expected, pointSet(c), "cross " + m + " " + l);
                assertNull(c.axes());
            }
        }
    }

    @Test
    void crossQamQuasiGrayIsGrayExceptAcrossArmBases() {
        // Our construction's documented property: nearest pairs inside the central band (|Q| <= L−1, which holds the
        // left and right arms) or inside the top or bottom arm differ in one bit.
        for (int m : new int[] {32, 128, 512, 2048}) {
            int l = 1 << ((Integer.numberOfTrailingZeros(m) - 1) / 2);
            Constellation c = Constellations.crossQam(m, Labeling.QUASI_GRAY);
            int[][] pairs = Constellations.nearestPairs(c.realParts(), c.imaginaryParts());
            int across = 0;
            for (int[] p : pairs) {
                boolean bandA = Math.abs(c.im(p[0])) < l;
                boolean bandB = Math.abs(c.im(p[1])) < l;
                if (bandA == bandB) {
                    assertEquals(1, Integer.bitCount(p[0] ^ p[1]), "cross " + m + " labels " + p[0] + ", " + p[1]);
                } else {
                    across++;
                }
            }
            assertEquals(2 * l, across, "L pairs across the base of the top and of the bottom arm");
        }
        // Measured values of our construction, documented at Constellations.crossQam (regression): Hamming sum over
        // nearest pairs / number of nearest pairs.
        int[][] documented = {{32, 60, 52}, {128, 264, 232}, {512, 1072, 976}, {2048, 4256, 4000}};
        for (int[] d : documented) {
            Constellation c = Constellations.crossQam(d[0], Labeling.QUASI_GRAY);
            assertEquals(d[1], hammingSum(c.realParts(), c.imaginaryParts()), "cross " + d[0]);
            assertEquals(d[2], Constellations.nearestPairs(c.realParts(), c.imaginaryParts()).length);
            assertEquals((double) d[1] / d[2], Metrics.of(c).grayPenalty(), 1e-15);
        }
    }

    @Test
    void crossQam32QuasiGrayIsOptimalAmongArmAssignments() {
        // Exhaustive check of the documented claim: keeping the central band of the 8 x 4 Gray grid, no assignment of
        // the 8 displaced labels to the 8 arm positions has a smaller Hamming sum over nearest pairs.
        Constellation c = Constellations.crossQam(32, Labeling.QUASI_GRAY);
        int[] armLabels = new int[8];
        double[][] armPoints = new double[8][];
        int a = 0;
        for (int l = 0; l < 32; l++) {
            if (Math.abs(c.im(l)) > 4) {
                armLabels[a] = l;
                armPoints[a++] = new double[] {c.re(l), c.im(l)};
            }
        }
        assertEquals(8, a);
        long ours = hammingSum(c.realParts(), c.imaginaryParts());
        assertEquals(60, ours, "Gray penalty 60/52 as documented");
        int[] perm = {0, 1, 2, 3, 4, 5, 6, 7};
        long best = Long.MAX_VALUE;
        double[] re = c.realParts();
        double[] im = c.imaginaryParts();
        do {
            for (int j = 0; j < 8; j++) {
                re[armLabels[perm[j]]] = armPoints[j][0];
                im[armLabels[perm[j]]] = armPoints[j][1];
            }
            best = Math.min(best, hammingSum(re, im));
        } while (nextPermutation(perm));
        assertEquals(best, ours);
    }

    @Test
    void star8QuasiGrayIsOptimalAmongAllLabelings() {
        // Exhaustive check over all 8! labelings of the star 8-QAM points: none has a smaller Hamming sum over the
        // 12 nearest pairs than ours (16, Gray penalty 4/3 as documented).
        Constellation c = Catalogue.resolve("star8", Catalogue.Options.DEFAULT.withNormalization(Normalization.NONE));
        int[][] pairs = Constellations.nearestPairs(c.realParts(), c.imaginaryParts());
        assertEquals(12, pairs.length);
        long ours = hammingSum(c.realParts(), c.imaginaryParts());
        assertEquals(16, ours);
        int[] perm = {0, 1, 2, 3, 4, 5, 6, 7};
        long best = Long.MAX_VALUE;
        do {
            long sum = 0;
            for (int[] p : pairs) {
                sum += Integer.bitCount(perm[p[0]] ^ perm[p[1]]);
            }
            best = Math.min(best, sum);
        } while (nextPermutation(perm));
        assertEquals(best, ours);
    }

    @Test
    void ringQuasiGrayPenaltiesAsDocumented() {
        // Measured values of our construction, documented at Constellations.apsk (regression, no outside source).
        assertEquals(1.0, Metrics.of(Catalogue.resolve("apsk16")).grayPenalty(), 0.0);
        assertEquals(1.2, Metrics.of(Catalogue.resolve("apsk32")).grayPenalty(), 1e-15);
        assertEquals(4.0 / 3, Metrics.of(Catalogue.resolve("star8")).grayPenalty(), 1e-15);
    }

    private static long hammingSum(double[] re, double[] im) {
        long sum = 0;
        for (int[] p : Constellations.nearestPairs(re, im)) {
            sum += Integer.bitCount(p[0] ^ p[1]);
        }
        return sum;
    }

    private static boolean nextPermutation(int[] a) {
        int i = a.length - 2;
        while (i >= 0 && a[i] >= a[i + 1]) {
            i--;
        }
        if (i < 0) {
            return false;
        }
        int j = a.length - 1;
        while (a[j] <= a[i]) {
            j--;
        }
        int t = a[i];
        a[i] = a[j];
        a[j] = t;
        for (int x = i + 1, y = a.length - 1; x < y; x++, y--) {
            t = a[x];
            a[x] = a[y];
            a[y] = t;
        }
        return true;
    }

    @Test
    void ringsCarryCyclicGrayCodes() {
        // Our documented construction: consecutive points of every ring differ in one bit, including last to first.
        int[] sizes = {4, 12, 16};
        double[] radii = {1, 2.7, 5};
        Constellation c = Constellations.apsk("r", sizes, radii, new double[] {45, 15, 0}, Labeling.QUASI_GRAY);
        for (int ring = 0; ring < 3; ring++) {
            int s = sizes[ring];
            int[] byPosition = new int[s];
            for (int l = 0; l < 32; l++) {
                if (Math.abs(Math.hypot(c.re(l), c.im(l)) - radii[ring]) < 1e-9) {
                    double angle = Math.toDegrees(Math.atan2(c.im(l), c.re(l)));
                    int position = (int) Math.round((((angle - new double[] {45, 15, 0}[ring]) % 360 + 360) % 360) * s
                            / 360.0) % s;
                    byPosition[position] = l;
                }
            }
            for (int p = 0; p < s; p++) {
                assertEquals(1, Integer.bitCount(byPosition[p] ^ byPosition[(p + 1) % s]), "ring " + ring);
            }
        }
    }

    @Test
    void ringNaturalLabelsWalkTheRings() {
        Constellation c = Constellations.apsk("r", new int[] {4, 4}, new double[] {1, 2}, new double[] {0, 45},
                Labeling.NATURAL);
        assertEquals(1.0, c.re(0), 0.0);
        assertEquals(0.0, c.im(0), 0.0);
        assertEquals(0.0, c.re(1), 0.0);
        assertEquals(1.0, c.im(1), 0.0);
        assertEquals(2 * StrictMath.sqrt(0.5), c.re(4), 0.0);
        assertEquals(2 * StrictMath.sqrt(0.5), c.im(4), 0.0);
        assertEquals(Family.APSK, c.family());
    }

    @Test
    void ringValidation() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Constellations.apsk("r",
                new int[] {4, 12}, new double[] {2, 1}, new double[] {0, 0}, Labeling.NATURAL));
        assertTrue(e.getMessage().contains("strictly increasing"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> Constellations.apsk("r", new int[] {4, 10},
                new double[] {1, 2}, new double[] {0, 0}, Labeling.NATURAL));
        assertTrue(e.getMessage().contains("power of two"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> Constellations.apsk("r", new int[] {1, 7},
                new double[] {1, 2}, new double[] {0, 0}, Labeling.QUASI_GRAY));
        assertEquals("r: quasi-gray needs an even number of points on every ring, ring 1 has 1; use the natural"
                + " labeling", e.getMessage());
        assertEquals(8, Constellations.apsk("r", new int[] {1, 7}, new double[] {1, 2}, new double[] {0, 0},
                Labeling.NATURAL).size());
    }

    @Test
    void validationNamesTheProblem() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Constellation.ofPoints("u",
                "custom", new double[] {0, 1, 2}, new double[] {0, 0, 0}, new int[] {0, 1, 2}, null));
        assertEquals("u: the number of points must be a power of two >= 2, got 3", e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> Constellation.ofPoints("u", "custom",
                new double[] {0, 1}, new double[] {0, 0}, new int[] {1, 1}, null));
        assertEquals("u: label 1 is used twice; labels must be a permutation of 0..1", e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> Constellation.ofPoints("u", "custom",
                new double[] {0, 1}, new double[] {0, 0}, new int[] {0, 2}, null));
        assertEquals("u: point 1 has label 2, outside 0..1", e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> Constellation.ofPoints("u", "custom",
                new double[] {1, 1}, new double[] {0, 0}, new int[] {0, 1}, null));
        assertEquals("u: labels 0 and 1 share the point (1.0, 0.0); points must be distinct", e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> Constellation.ofPoints("u", "custom",
                new double[] {1, Double.NaN}, new double[] {0, 0}, new int[] {0, 1}, null));
        assertEquals("u: point of label 1 is not finite (NaN, 0.0)", e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> Constellation.ofPoints("u", "custom",
                new double[] {1, -1}, new double[] {0, 0}, new int[] {0, 1}, new double[] {0.5, 0.6}));
        assertEquals("u: probabilities sum to 1.1, not 1", e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> Constellation.ofPoints("u", "custom",
                new double[] {1, -1}, new double[] {0, 0}, new int[] {0, 1}, new double[] {1.5, -0.5}));
        assertEquals("u: probability of label 1 is -0.5; probabilities must be finite and >= 0", e.getMessage());
    }

    @Test
    void userGridsAreDetectedAsSeparable() {
        // A 4-point grid where b1 moves I and b0 moves Q.
        Constellation c = Constellation.ofPoints("u", "custom", new double[] {-1, 1, -1, 1},
                new double[] {-2, -2, 2, 2}, new int[] {0, 1, 2, 3}, null);
        assertNotNull(c.axes());
        assertArrayEquals(new int[] {1}, c.axes().iBits());
        assertArrayEquals(new int[] {0}, c.axes().qBits());
        assertArrayEquals(new double[] {-2, 2}, c.axes().qLevels(), 0.0);
        Constellation skew = Constellation.ofPoints("u", "custom", new double[] {-1, 1, -1, 1.5},
                new double[] {-2, -2, 2, 2}, new int[] {0, 1, 2, 3}, null);
        assertNull(skew.axes());
    }

    @Test
    void negativeZeroIsStoredAsPositive() {
        Constellation c = Constellation.ofPoints("u", "custom", new double[] {-0.0, 1}, new double[] {1, -0.0},
                new int[] {0, 1}, null);
        assertEquals(Double.doubleToRawLongBits(0.0), Double.doubleToRawLongBits(c.re(0)));
        assertEquals(Double.doubleToRawLongBits(0.0), Double.doubleToRawLongBits(c.im(1)));
    }

    @Test
    void normalizationIsExactWhereTheGridIsExact() {
        // On the integer grid E_s is exact, so the factor is exactly 1/StrictMath.sqrt(E_s).
        Constellation q = Constellations.qam(64, Labeling.GRAY);
        assertEquals(1 / StrictMath.sqrt(42), q.normalizationFactor(Normalization.UNIT_ENERGY), 0.0);
        assertEquals(1 / StrictMath.sqrt(42.0 / 6), q.normalizationFactor(Normalization.UNIT_BIT_ENERGY), 0.0);
        assertEquals(1 / StrictMath.sqrt(98), q.normalizationFactor(Normalization.UNIT_PEAK), 0.0);
        // PSK is already on the unit circle: kept bit for bit although cos² + sin² is not exactly 1 in doubles.
        Constellation p = Constellations.psk(8, 0, Labeling.GRAY);
        assertSame(p, p.normalized(Normalization.UNIT_ENERGY));
        assertEquals(1.0, p.re(0), 0.0);
    }

    @Test
    void pi2BpskKeepsItsPoints() {
        Constellation c = Catalogue.resolve("pi2bpsk");
        assertTrue(c.alternatesQuarterTurn());
        assertEquals(1.0, c.re(0), 0.0);
        assertEquals(-1.0, c.re(1), 0.0);
        assertNull(c.axes());
        assertThrows(IllegalArgumentException.class, () -> Catalogue.resolve("qpsk").withAlternatingQuarterTurn("x"));
    }

    @Test
    void maxwellBoltzmannValidation() {
        Constellation q = Constellations.qam(16, Labeling.GRAY);
        assertTrue(q.withMaxwellBoltzmann(0).isUniform());
        assertThrows(IllegalArgumentException.class, () -> q.withMaxwellBoltzmann(-1));
        assertThrows(IllegalArgumentException.class, () -> q.withMaxwellBoltzmann(Double.NaN));
        // Huge λ: the outer weights underflow to 0 but the inner ring keeps probability 1/4 each.
        Constellation sharp = q.withMaxwellBoltzmann(1000);
        for (int l = 0; l < 16; l++) {
            boolean inner = Math.abs(q.re(l)) == 1 && Math.abs(q.im(l)) == 1;
            assertEquals(inner ? 0.25 : 0.0, sharp.probability(l), 0.0);
        }
    }
}
