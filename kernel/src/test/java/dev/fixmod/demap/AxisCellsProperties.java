package dev.fixmod.demap;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.fixmod.constellation.AxisLayout;
import dev.fixmod.constellation.Constellation;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.TreeSet;
import java.util.stream.IntStream;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;

/**
 * The direct-index cell search counts exactly what a plain count does, and the per-axis demapper built on it gives,
 * bit for bit, the per-bit segment formula of {@link AxisSegments} (the closed form its class comment derives).
 */
class AxisCellsProperties {

    /** The reference: how many of {@code ascending} lie at or below {@code t}, by plain comparison. */
    private static int count(double[] ascending, double t) {
        int c = 0;
        for (double b : ascending) {
            c += b <= t ? 1 : 0;
        }
        return c;
    }

    /**
     * Boundary sets as the demappers make them and worse: near-even grids with one-ulp near-duplicates, clusters,
     * ±0, and a few far outliers that stretch the bucket grid.
     */
    @Provide
    Arbitrary<double[]> boundaries() {
        Arbitrary<Double> value = Arbitraries.oneOf(
                Arbitraries.integers().between(-40, 40).map(i -> i * 0.1534),
                Arbitraries.integers().between(-40, 40).map(i -> Math.nextUp(i * 0.1534)),
                Arbitraries.doubles().between(-3, 3),
                Arbitraries.of(0.0, -0.0, 1e-300, -1e-300, 1e300, -1e300, Double.MAX_VALUE, -Double.MAX_VALUE));
        return value.list().ofMinSize(0).ofMaxSize(70).map(list -> {
            TreeSet<Double> set = new TreeSet<>();
            for (double v : list) {
                set.add(v + 0.0);
            }
            return set.stream().mapToDouble(Double::doubleValue).toArray();
        });
    }

    @Property(tries = 300)
    void theCellIsTheCountOfBoundariesAtOrBelow(@ForAll("boundaries") double[] ascending,
                                               @ForAll @DoubleRange(min = -4, max = 4) double u,
                                               @ForAll @IntRange(min = 0, max = 69) int pick) {
        AxisCells cells = AxisCells.of(ascending);
        assertEquals(ascending.length, cells.boundaries());
        List<Double> probes = new ArrayList<>(List.of(u, 0.0, -0.0, 1e308, -1e308, Double.POSITIVE_INFINITY,
                Double.NEGATIVE_INFINITY));
        if (ascending.length > 0) {
            // On a boundary and one ulp either side: where a search that rounds its index would go wrong.
            double b = ascending[pick % ascending.length];
            probes.addAll(List.of(b, Math.nextUp(b), Math.nextDown(b)));
        }
        for (double t : probes) {
            assertEquals(count(ascending, t), cells.cellOf(t), "t = " + t + " in " + Arrays.toString(ascending));
        }
    }

    @Property(tries = 200)
    void aBitsSegmentFollowsFromTheCell(@ForAll("boundaries") double[] ascending,
                                        @ForAll @IntRange(min = 0, max = 1 << 20) int subsetMask,
                                        @ForAll @DoubleRange(min = -4, max = 4) double u) {
        // A bit's boundaries are some of the merged ones.
        double[] subset = IntStream.range(0, ascending.length)
                .filter(i -> ((subsetMask >>> (i % 21)) & 1) != 0).mapToDouble(i -> ascending[i]).toArray();
        AxisCells cells = AxisCells.of(ascending, subset);
        int[] segment = cells.segments(subset);
        assertEquals(count(subset, u), segment[cells.cellOf(u)]);
    }

    @Provide
    Arbitrary<Constellation> separable() {
        return Arbitraries.of(DemapFixtures.SEPARABLE);
    }

    @Property(tries = 200)
    void perAxisMaxLogIsTheSegmentFormulaBitForBit(@ForAll("separable") Constellation c,
                                                   @ForAll @DoubleRange(min = -1.6, max = 1.6) double u,
                                                   @ForAll @DoubleRange(min = -1.6, max = 1.6) double v,
                                                   @ForAll @DoubleRange(min = 0.01, max = 10) double n0,
                                                   @ForAll @IntRange(min = 0, max = 1023) int pick) {
        LlrOptions o = LlrOptions.of(n0);
        PerAxisMaxLogDemapper d = new PerAxisMaxLogDemapper(c, o);
        AxisLayout layout = c.axes();
        AxisSegments.BitPlaces places = new AxisSegments.BitPlaces(layout);
        double[][] levels = {layout.iLevels(), layout.qLevels()};
        int[] axisBits = {layout.iBits().length, layout.qBits().length};
        int k = c.bitsPerSymbol();
        double peak = DemapFixtures.peak(c);
        // A sample anywhere, and one whose I part sits exactly on (and one ulp beside) a segment boundary.
        AxisSegments first = AxisSegments.of(levels[places.axis[0]], axisBits[places.axis[0]], places.position[0]);
        double[] firstBounds = first.boundaries;
        double edge = firstBounds.length == 0 ? 0.0 : firstBounds[pick % firstBounds.length] / 2;
        double[][] samples = {{u * peak, v * peak}, {edge, v * peak}, {Math.nextUp(edge), edge},
                {Math.nextDown(edge), -edge}, {-0.0, 0.0}};
        for (double[] y : samples) {
            double re = y[0];
            double im = y[1];
            double[] got = new double[k];
            d.llr(re, im, got, 0);
            for (int b = 0; b < k; b++) {
                AxisSegments seg = AxisSegments.of(levels[places.axis[b]], axisBits[places.axis[b]],
                        places.position[b]);
                double twoY = 2 * (places.axis[b] == 0 ? re : im);
                int s = count(seg.boundaries, twoY);
                double l0 = levels[places.axis[b]][seg.zeroLevel[s]];
                double l1 = levels[places.axis[b]][seg.oneLevel[s]];
                // The closed form of the class comment, evaluated in the same order of operations.
                double want = o.sign().factor() * (l0 - l1) * (1.0 / n0) * (twoY - (l0 + l1)) + 0.0;
                assertEquals(Double.doubleToRawLongBits(want), Double.doubleToRawLongBits(got[b]),
                        c.name() + " bit " + b + " at (" + re + ", " + im + "): " + want + " vs " + got[b]);
            }
        }
    }
}
