package dev.fixmod.verify.vectors;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.fixed.QFormat;
import java.util.EnumSet;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;

/**
 * Laws of the threshold corner group on slicers without per-axis thresholds (PSK sectors, minimum distance), over
 * random constellations, phase offsets and input formats. The geometric facts used are handbook ones: the
 * maximum-likelihood decision regions of M-PSK are wedges whose edges bisect adjacent points (at the point phases
 * plus odd multiples of π/M); the regions of a minimum-distance slicer are Voronoi cells, so two points at the
 * minimum distance always share an edge through their midpoint (common practice, no source).
 */
class BoundaryCrossingProperties {

    private static final Set<CornerGroup> THRESHOLDS = EnumSet.of(CornerGroup.THRESHOLDS);

    @Provide
    Arbitrary<String> nearestPointConstellations() {
        return Arbitraries.of("cqam32", "cqam128", "apsk16", "apsk32", "star8");
    }

    @Property(tries = 60)
    void everyPskBoundaryIsCrossedBetweenItsTwoSectorsNearItsIdealAngle(
            @ForAll("pskOrders") int m, @ForAll @DoubleRange(min = -180, max = 180) double phaseDegrees,
            @ForAll @IntRange(min = 6, max = 12) int fractionalBits) {
        String spec = "{\"constellation\": {\"name\": \"psk" + m + "\", \"phase-offset-degrees\": " + phaseDegrees
                + "}, \"demapper\": {\"input\": {\"format\": \"Q1." + fractionalBits + "\"}}, \"count\": 0}";
        Crossings c = crossings(spec);
        double phase = Math.toRadians(phaseDegrees);
        // The two sectors either side of boundary j (at phase + (2j+1)π/M) belong to points j and j+1 (mod M).
        Set<Set<Integer>> expected = new HashSet<>();
        for (int j = 0; j < m; j++) {
            expected.add(Set.of(c.labelAt(phase + 2 * Math.PI * j / m), c.labelAt(phase + 2 * Math.PI * (j + 1) / m)));
        }
        assertEquals(expected, c.decisionPairs, "the sector pairs crossed");
        double lsb = Math.scalb(1.0, -fractionalBits);
        for (long[] on : c.onBoundary) {
            if (on[0] == 0 && on[1] == 0) {
                continue;
            }
            double angle = Math.atan2(on[1], on[0]);
            double offBoundary = Math.abs(Math.IEEEremainder(angle - phase - Math.PI / m, 2 * Math.PI / m));
            // On a line of slope quantized to 2^-14 (the sector slicer's default coefficients): within 1e-4 rad.
            assertTrue(offBoundary < 1e-4, "on-threshold sample (" + on[0] + ", " + on[1] + ") is "
                    + offBoundary + " rad off a boundary; LSB " + lsb);
        }
    }

    @Provide
    Arbitrary<Integer> pskOrders() {
        return Arbitraries.of(8, 16, 32, 64);
    }

    @Property(tries = 40)
    void everyPairAtTheMinimumDistanceIsCrossedAndOnBoundarySamplesAreEquidistant(
            @ForAll("nearestPointConstellations") String name, @ForAll @IntRange(min = 2, max = 3) int integerBits,
            @ForAll @IntRange(min = 6, max = 11) int fractionalBits) {
        String spec = "{\"constellation\": \"" + name + "\", \"demapper\": {\"input\": {\"format\": \"Q"
                + integerBits + "." + fractionalBits + "\"}}, \"count\": 0}";
        Crossings c = crossings(spec);
        long[] ri = c.datapath.referenceI();
        long[] rq = c.datapath.referenceQ();
        double best = Double.MAX_VALUE;
        for (int a = 0; a < ri.length; a++) {
            for (int b = a + 1; b < ri.length; b++) {
                best = Math.min(best, floatDistance(c, a, b));
            }
        }
        for (int a = 0; a < ri.length; a++) {
            for (int b = a + 1; b < ri.length; b++) {
                if (floatDistance(c, a, b) < best * (1 + 1e-9)) {
                    assertTrue(c.decisionPairs.contains(Set.of(a, b)), name + ": points " + a + " and " + b
                            + " at the minimum distance are not crossed");
                }
            }
        }
        for (long[] on : c.onBoundary) {
            long first = Long.MAX_VALUE;
            int atFirst = 0;
            for (int p = 0; p < ri.length; p++) {
                long di = on[0] - ri[p];
                long dq = on[1] - rq[p];
                long d = di * di + dq * dq;
                atFirst = d < first ? 1 : d == first ? atFirst + 1 : atFirst;
                first = Math.min(first, d);
            }
            assertTrue(atFirst >= 2, "on-threshold sample (" + on[0] + ", " + on[1] + ") has one nearest point");
        }
    }

    private static double floatDistance(Crossings c, int a, int b) {
        double di = c.datapath.symbolI(a) - c.datapath.symbolI(b);
        double dq = c.datapath.symbolQ(a) - c.datapath.symbolQ(b);
        return di * di + dq * dq;
    }

    /** The threshold group of a spec, read back as straddling decision pairs and on-boundary samples. */
    private static Crossings crossings(String specText) {
        VectorSpec spec = SpecReader.parse(specText, "p.json");
        KernelDatapath d = KernelDatapath.of(spec);
        QFormat input = spec.demapper().input().format();
        List<CornerCases.Vector> vectors = CornerCases.build(d, input, THRESHOLDS, 0).vectors();
        Map<String, CornerCases.Vector> byCode = new HashMap<>();
        for (CornerCases.Vector v : vectors) {
            byCode.put(v.i() + "," + v.q(), v);
        }
        Crossings c = new Crossings(d);
        int on = CornerFlag.ON_THRESHOLD.mask();
        int minus = CornerFlag.THRESHOLD_MINUS_LSB.mask();
        int plus = CornerFlag.THRESHOLD_PLUS_LSB.mask();
        for (CornerCases.Vector v : vectors) {
            assertNotEquals(0, v.flags() & (on | minus | plus), "every threshold vector carries a threshold flag");
            if ((v.flags() & on) != 0) {
                assertTrue(d.onBoundary(v.i(), v.q(), 0));
                c.onBoundary.add(new long[] {v.i(), v.q()});
            }
            if ((v.flags() & minus) == 0) {
                continue;
            }
            // Its partner one or two LSB above on one axis (two when a code on the boundary sits between).
            CornerCases.Vector partner = null;
            for (int step = 1; step <= 2 && partner == null; step++) {
                for (long[] e : new long[][] {{step, 0}, {0, step}}) {
                    CornerCases.Vector p = byCode.get((v.i() + e[0]) + "," + (v.q() + e[1]));
                    if (p != null && (p.flags() & plus) != 0 && partner == null
                            && (step == 1 || onBetween(byCode, v, e, on))) {
                        partner = p;
                    }
                }
            }
            assertTrue(partner != null, "threshold-minus-lsb (" + v.i() + ", " + v.q() + ") has no partner above");
            int below = c.decide(v.i(), v.q());
            int above = c.decide(partner.i(), partner.q());
            assertNotEquals(below, above, "the pair at (" + v.i() + ", " + v.q() + ") straddles no decision change");
            c.decisionPairs.add(Set.of(below, above));
        }
        return c;
    }

    private static boolean onBetween(Map<String, CornerCases.Vector> byCode, CornerCases.Vector v, long[] e, int on) {
        CornerCases.Vector middle = byCode.get((v.i() + e[0] / 2) + "," + (v.q() + e[1] / 2));
        return middle != null && (middle.flags() & on) != 0;
    }

    private static final class Crossings {
        final KernelDatapath datapath;
        final Set<Set<Integer>> decisionPairs = new HashSet<>();
        final List<long[]> onBoundary = new java.util.ArrayList<>();
        private final int[] label = new int[1];

        Crossings(KernelDatapath datapath) {
            this.datapath = datapath;
        }

        int decide(long i, long q) {
            datapath.slice(new long[] {i}, new long[] {q}, 1, 0, label);
            return label[0];
        }

        /** The label of the constellation point nearest the given phase (the float symbols, unit energy). */
        int labelAt(double phase) {
            int best = 0;
            double bestDistance = Double.MAX_VALUE;
            for (int p = 0; p < datapath.size(); p++) {
                double di = datapath.symbolI(p) - Math.cos(phase);
                double dq = datapath.symbolQ(p) - Math.sin(phase);
                if (di * di + dq * dq < bestDistance) {
                    bestDistance = di * di + dq * dq;
                    best = p;
                }
            }
            return best;
        }
    }
}
