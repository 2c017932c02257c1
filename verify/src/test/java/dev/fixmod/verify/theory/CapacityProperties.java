package dev.fixmod.verify.theory;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Constellations;
import java.util.Random;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.DoubleRange;

class CapacityProperties {
    /** Gauss–Hermite rounding allowed in comparisons that hold exactly in the integrals. */
    private static final double QUADRATURE = 1e-9;

    @Provide
    Arbitrary<Constellation> constellations() {
        Arbitrary<Constellation> standard = Arbitraries.of(
                Constellations.pam(4, true), Constellations.qam(4, true), Constellations.psk(8, 0, true),
                Constellations.qam(16, true), Constellations.qam(16, false), Constellations.psk(16, 0.3, false));
        // Random 8-point constellations with random labels (our own scenario): the laws hold for any.
        Arbitrary<Constellation> random = Arbitraries.longs().map(seed -> {
            Random r = new Random(seed);
            double[] re = new double[8];
            double[] im = new double[8];
            int[] labels = new int[8];
            for (int i = 0; i < 8; i++) {
                re[i] = r.nextGaussian() + 3 * i;
                im[i] = r.nextGaussian();
                labels[i] = i;
            }
            for (int i = 7; i > 0; i--) {
                int j = r.nextInt(i + 1);
                int t = labels[i];
                labels[i] = labels[j];
                labels[j] = t;
            }
            return Constellation.ofPoints("random" + seed, "random", re, im, labels, null);
        });
        return Arbitraries.oneOf(standard, random);
    }

    @Property(tries = 150)
    boolean ratesRiseWithSnr(@ForAll("constellations") Constellation c,
                             @ForAll @DoubleRange(min = -15, max = 40) double db,
                             @ForAll @DoubleRange(min = 0.05, max = 6) double step) {
        double lo = Snr.fromDb(db);
        double hi = Snr.fromDb(db + step);
        return Capacity.codedModulation(c, hi) >= Capacity.codedModulation(c, lo) - QUADRATURE
                && Capacity.bitInterleaved(c, hi) >= Capacity.bitInterleaved(c, lo) - QUADRATURE
                && Capacity.shannon(hi) > Capacity.shannon(lo);
    }

    @Property(tries = 150)
    boolean bitwiseBelowSymbolwiseBelowShannonAndEntropy(@ForAll("constellations") Constellation c,
                                                         @ForAll @DoubleRange(min = -15, max = 40) double db) {
        // BICM ≤ CM (bit-wise decoding discards the dependence between bits), CM ≤ log2(1 + Es/N0) (Shannon),
        // CM ≤ H(X) = log2 M for uniform symbols.
        double esN0 = Snr.fromDb(db);
        double cm = Capacity.codedModulation(c, esN0);
        double bicm = Capacity.bitInterleaved(c, esN0);
        return bicm <= cm + QUADRATURE && cm <= Capacity.shannon(esN0) + QUADRATURE
                && cm <= c.bitsPerSymbol() + QUADRATURE && bicm >= -QUADRATURE;
    }

    @Provide
    Arbitrary<Double> llrs() {
        // Around the two thresholds of fdlibm's small-argument path (e^x = 2^-29 and 2^-54), and everywhere else.
        Arbitrary<Double> nearThresholds = Arbitraries.of(-29.0, -54.0).flatMap(p ->
                Arbitraries.integers().between(-2000, 2000).map(u -> {
                    double x = p * StrictMath.log(2.0);
                    for (int step = 0; step < Math.abs(u); step++) {
                        x = u < 0 ? Math.nextDown(x) : Math.nextUp(x);
                    }
                    return x;
                }));
        return Arbitraries.oneOf(nearThresholds, Arbitraries.doubles().between(-800, 800),
                Arbitraries.doubles().between(-60, 60), Arbitraries.of(0.0, -0.0, 745.2, -745.2, 1e300, -1e300));
    }

    @Property(tries = 3000)
    void softplusIsTheStrictMathFormulaBitForBit(@ForAll("llrs") double x, @ForAll("llrs") double y) {
        // The JDK's StrictMath (fdlibm semantics) is the reference; softplus only skips the call where fdlibm's
        // log1p would return its argument's short series.
        for (double v : new double[] {x, y, -x, x + y}) {
            double want = v > 0 ? v + StrictMath.log1p(StrictMath.exp(-v)) : StrictMath.log1p(StrictMath.exp(v));
            assertEquals(Double.doubleToRawLongBits(want),
                    Double.doubleToRawLongBits(Capacity.softplus(v)), "softplus(" + v + ")");
        }
    }
}
