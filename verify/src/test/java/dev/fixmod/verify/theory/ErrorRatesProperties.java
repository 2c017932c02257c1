package dev.fixmod.verify.theory;

import static dev.fixmod.verify.theory.GaussianTail.q;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Constellations;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;

class ErrorRatesProperties {
    private static final double ROUNDING = 1e-12;
    /**
     * Absolute slack for comparisons of error rates that fall below the normal double range (high SNR): subnormal
     * values carry fewer significant bits, so two correct computations may differ there by more than ROUNDING.
     */
    private static final double SUBNORMAL = Double.MIN_NORMAL;

    @Property(tries = 200)
    boolean serLiesBetweenZeroAndGuessing(@ForAll @IntRange(min = 1, max = 10) int k,
                                          @ForAll @DoubleRange(min = -20, max = 50) double db) {
        // 0 ≤ SER ≤ 1 − 1/M: no detector is worse than a uniform guess (common practice, no source).
        int m = 1 << k;
        double esN0 = Snr.fromDb(db);
        double guess = 1 - 1.0 / m;
        boolean pam = inRange(ErrorRates.pamSer(m, esN0), guess);
        boolean qam = k % 2 != 0 || inRange(ErrorRates.squareQamSer(m, esN0), guess);
        boolean psk = k > 6 || inRange(ErrorRates.pskSer(m, esN0), guess);
        return pam && qam && psk;
    }

    private static boolean inRange(double ser, double guess) {
        return ser >= 0 && ser <= guess + ROUNDING;
    }

    @Property(tries = 200)
    boolean serFallsAsSnrRises(@ForAll @IntRange(min = 1, max = 6) int k,
                               @ForAll @DoubleRange(min = -20, max = 40) double db,
                               @ForAll @DoubleRange(min = 0.01, max = 5) double step) {
        int m = 1 << k;
        double lo = Snr.fromDb(db);
        double hi = Snr.fromDb(db + step);
        return ErrorRates.pamSer(m, hi) <= ErrorRates.pamSer(m, lo) + SUBNORMAL
                && ErrorRates.pskSer(m, hi) <= ErrorRates.pskSer(m, lo) * (1 + 1e-10) + SUBNORMAL
                && (k % 2 != 0 || ErrorRates.squareQamSer(m, hi) <= ErrorRates.squareQamSer(m, lo) + SUBNORMAL);
    }

    @Property(tries = 200)
    boolean unionBoundsCoverTheExactQamSer(@ForAll @IntRange(min = 1, max = 3) int halfK,
                                           @ForAll @DoubleRange(min = 0, max = 40) double db) {
        // Proakis §4.2: the pairwise union bound bounds any constellation; for square QAM the nearest-neighbour
        // form N̄·Q(d_min/√(2N0)) = 4(1 − 1/√M)Q(·) is also ≥ 1 − (1 − P)² since it omits only −P².
        int m = 1 << (2 * halfK);
        Constellation qam = Constellations.qam(m, true);
        double esN0 = Snr.fromDb(db);
        double exact = ErrorRates.squareQamSer(m, esN0);
        return ErrorRates.nearestNeighbourUnionBound(qam, esN0) >= exact * (1 - ROUNDING) - SUBNORMAL
                && ErrorRates.pairwiseUnionBound(qam, esN0) >= exact * (1 - ROUNDING) - SUBNORMAL;
    }

    @Property(tries = 200)
    boolean regionSumsEqualTheClosedForm(@ForAll @IntRange(min = 1, max = 5) int halfK,
                                         @ForAll @DoubleRange(min = -10, max = 45) double db) {
        // Two methods: Proakis's closed form and the kernel constellation's per-axis decision regions.
        int m = 1 << (2 * halfK);
        double esN0 = Snr.fromDb(db);
        double closed = ErrorRates.squareQamSer(m, esN0);
        double regions = ErrorRates.separableSer(Constellations.qam(m, false), esN0);
        return Math.abs(closed - regions) <= 1e-9 * closed + SUBNORMAL;
    }

    @Property(tries = 200)
    boolean berLiesBetweenSerOverKAndSer(@ForAll @IntRange(min = 1, max = 4) int halfK,
                                         @ForAll boolean gray,
                                         @ForAll @DoubleRange(min = -10, max = 40) double db) {
        // A symbol error costs at least one and at most k bit errors: SER/k ≤ BER ≤ SER.
        Constellation qam = Constellations.qam(1 << (2 * halfK), gray);
        double esN0 = Snr.fromDb(db);
        double ser = ErrorRates.separableSer(qam, esN0);
        double ber = ErrorRates.separableBer(qam, esN0);
        return ber >= ser / qam.bitsPerSymbol() * (1 - ROUNDING) - SUBNORMAL && ber <= ser * (1 + ROUNDING) + SUBNORMAL;
    }

    @Property(tries = 100)
    boolean pskSerStaysUnderTheHalfPlaneBound(@ForAll @IntRange(min = 3, max = 6) int k,
                                              @ForAll @DoubleRange(min = -10, max = 35) double db) {
        int m = 1 << k;
        double esN0 = Snr.fromDb(db);
        return ErrorRates.pskSer(m, esN0) <= 2 * q(Math.sqrt(2 * esN0) * Math.sin(Math.PI / m)) * (1 + 1e-10) + SUBNORMAL;
    }
}
