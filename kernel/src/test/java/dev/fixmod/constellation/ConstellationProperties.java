package dev.fixmod.constellation;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.Scale;

/** Laws of normalization, labeling and metrics over the catalogue. */
class ConstellationProperties {

    /** Catalogue names of moderate size (the metrics are O(M²)). */
    @Provide
    Arbitrary<String> names() {
        Arbitrary<String> ordered = Combinators.combine(Arbitraries.of("pam", "psk", "qam", "rqam"),
                Arbitraries.integers().between(1, 8)).as((family, k) -> {
                    int kk = family.equals("qam") ? 2 * ((k + 1) / 2) : family.equals("rqam") ? Math.max(k, 2) : k;
                    return family + (1 << kk);
                });
        Arbitrary<String> fixed = Arbitraries.of("cqam32", "cqam128", "apsk16", "apsk32", "star8", "bpsk", "qpsk",
                "pi2bpsk", "nr:qam64", "nr:bpsk", "wlan:qam256", "rqam2x16");
        return Arbitraries.oneOf(ordered, fixed);
    }

    /** Names whose default labeling is binary-reflected Gray. */
    @Provide
    Arbitrary<String> grayNames() {
        return Combinators.combine(Arbitraries.of("pam", "psk", "qam", "rqam"), Arbitraries.integers().between(1, 9))
                .as((family, k) -> {
                    int kk = family.equals("qam") ? 2 * ((k + 1) / 2) : family.equals("rqam") ? Math.max(k, 2) : k;
                    return family + (1 << kk);
                });
    }

    /** Names whose points are separable (PAM, square and rectangular QAM). */
    @Provide
    Arbitrary<String> separableNames() {
        return grayNames().filter(name -> !name.startsWith("psk"));
    }

    @Property(tries = 150)
    void unitEnergyGivesUnitAverageEnergy(@ForAll("names") String name,
                                          @ForAll @DoubleRange(min = 0, max = 0.3) double lambda) {
        Catalogue.Options o = Catalogue.Options.DEFAULT.withShaping(lambda);
        assertEquals(1.0, Catalogue.resolve(name, o).averageEnergy(), 1e-12, name);
        assertEquals(1.0, Metrics.of(Catalogue.resolve(name, o.withNormalization(Normalization.UNIT_BIT_ENERGY)))
                .bitEnergy(), 1e-12, name);
        assertEquals(1.0, Catalogue.resolve(name, o.withNormalization(Normalization.UNIT_PEAK)).peakEnergy(), 1e-12,
                name);
    }

    @Property(tries = 150)
    void normalizingTwiceChangesNothing(@ForAll("names") String name, @ForAll Normalization normalization) {
        Constellation once = Catalogue.resolve(name, Catalogue.Options.DEFAULT.withNormalization(normalization));
        assertSame(once, once.normalized(normalization), name + " " + normalization);
    }

    @Property(tries = 100)
    void grayLabelingsHaveGrayPenaltyOne(@ForAll("grayNames") String name) {
        assertEquals(1.0, Metrics.of(Catalogue.resolve(name)).grayPenalty(), 0.0, name);
    }

    @Property(tries = 150)
    void scaleFreeMetricsIgnoreScaling(@ForAll("names") String name,
                                       @ForAll @DoubleRange(min = 1e-3, max = 1e3) @Scale(6) double factor) {
        Constellation c = Catalogue.resolve(name, Catalogue.Options.DEFAULT.withShaping(0.02));
        Metrics a = Metrics.of(c);
        Metrics b = Metrics.of(c.scaled(factor));
        double rel = 1e-12;
        assertEquals(a.powerEfficiency(), b.powerEfficiency(), a.powerEfficiency() * rel, "eps");
        assertEquals(a.snrLossVsBpskDb(), b.snrLossVsBpskDb(), 1e-10, "loss");
        assertEquals(a.paprDb(), b.paprDb(), 1e-10, "PAPR");
        assertEquals(a.grayPenalty(), b.grayPenalty(), 0.0, "Gray penalty");
        assertArrayEquals(a.neighbourCounts(), b.neighbourCounts(), "neighbours");
        assertEquals(a.entropy(), b.entropy(), 0.0, "entropy");
        // and the energies scale with the square of the factor
        assertEquals(a.averageEnergy() * factor * factor, b.averageEnergy(), a.averageEnergy() * factor * factor * rel);
        assertEquals(a.minDistanceSquared() * factor * factor, b.minDistanceSquared(),
                a.minDistanceSquared() * factor * factor * rel);
    }

    @Property(tries = 100)
    void maxwellBoltzmannFavoursLowEnergy(@ForAll("names") String name,
                                          @ForAll @DoubleRange(min = 0, max = 2) double lambda) {
        Constellation c = Catalogue.resolve(name, Catalogue.Options.DEFAULT.withNormalization(Normalization.NONE))
                .withMaxwellBoltzmann(lambda);
        double sum = 0;
        for (int a = 0; a < c.size(); a++) {
            sum += c.probability(a);
            double ea = c.re(a) * c.re(a) + c.im(a) * c.im(a);
            for (int b = 0; b < c.size(); b++) {
                double eb = c.re(b) * c.re(b) + c.im(b) * c.im(b);
                if (ea < eb) {
                    assertTrue(c.probability(a) >= c.probability(b), name);
                }
            }
        }
        assertEquals(1.0, sum, 1e-12);
        assertTrue(Metrics.of(c).entropy() <= c.bitsPerSymbol() + 1e-12, "entropy at most k");
    }

    @Property(tries = 200)
    void axisLayoutComposeInvertsTheSubLabels(@ForAll("separableNames") String name, @ForAll @IntRange(min = 0) int seed) {
        Constellation c = Catalogue.resolve(name);
        AxisLayout axes = c.axes();
        assertNotNull(axes, name);
        int label = seed & (c.size() - 1);
        assertEquals(label, axes.compose(axes.subLabelI(label), axes.subLabelQ(label)));
        assertEquals(c.re(label), axes.iLevel(axes.subLabelI(label)), 0.0);
        assertEquals(c.im(label), axes.qLevel(axes.subLabelQ(label)), 0.0);
    }

    @Property(tries = 200)
    void unitCirclePointsAreOnTheCircle(@ForAll @DoubleRange(min = -3, max = 3) double turns) {
        double[] p = new double[2];
        Constellations.unitCircle(turns, p);
        assertEquals(1.0, p[0] * p[0] + p[1] * p[1], 4e-16);
        // Reference: StrictMath on the angle reduced to one turn; 2π·t carries up to an ulp of 2π (8.9e-16) of error.
        double reduced = 2 * StrictMath.PI * (turns - StrictMath.floor(turns));
        assertEquals(StrictMath.cos(reduced), p[0], 2e-15);
        assertEquals(StrictMath.sin(reduced), p[1], 2e-15);
    }
}
