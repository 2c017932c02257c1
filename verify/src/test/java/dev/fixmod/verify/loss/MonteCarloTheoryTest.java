package dev.fixmod.verify.loss;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.verify.theory.ErrorRateInterval;
import dev.fixmod.verify.theory.ErrorRates;
import dev.fixmod.verify.theory.GaussianTail;
import dev.fixmod.verify.theory.Snr;
import dev.fixmod.verify.theory.SnrAtTarget;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The Monte Carlo engine against handbook closed forms: the counted BER and SER must lie in the 99% Clopper–Pearson
 * interval of the count. Seeds are fixed, so these are deterministic checks, not flaky ones.
 */
class MonteCarloTheoryTest {

    private static String spec(String constellation, double low, double high, long bits) {
        return "{\"constellation\": \"" + constellation + "\","
                + " \"demapper\": {\"input\": {\"format\": \"Q2.13\"}, \"llr\": {\"format\": \"Q7.4\"}},"
                + " \"noise\": {\"eb-n0-db\": [" + low + ", " + high + "], \"seed\": 7},"
                + " \"simulation\": {\"target-errors\": 1000000, \"min-bits\": " + bits + ", \"max-bits\": " + bits
                + ", \"chunk-symbols\": 4096}, \"targets\": {\"gmi\": 0.5}}";
    }

    private static void assertWithin(long errors, long trials, double theory, String what) {
        ErrorRateInterval i = ErrorRateInterval.clopperPearson(errors, trials, 0.99);
        assertTrue(i.contains(theory), what + ": theory " + theory + " outside the 99% interval [" + i.lower() + ", "
                + i.upper() + "] of " + errors + "/" + trials);
    }

    @Test
    void bpskBerMatchesTheClosedForm() {
        // Proakis, Digital Communications, 5th ed., §4.3: P_b = Q(sqrt(2 Eb/N0)).
        List<PointResult> r = LossFixtures.simulate(spec("bpsk", 4.0, 6.8, 200_000), 2);
        for (int i = 0; i < 2; i++) {
            double eb = i == 0 ? 4.0 : 6.8;
            double theory = GaussianTail.q(StrictMath.sqrt(2 * Snr.fromDb(eb)));
            assertWithin(r.get(i).floatBitErrors(), r.get(i).bits(), theory, "BPSK float at " + eb + " dB");
            assertWithin(r.get(i).fixedBitErrors(), r.get(i).bits(), theory, "BPSK fixed 16-bit at " + eb + " dB");
        }
        // At 6.8 dB the BER is about 1e-3 (handbook tables: 1.0e-3 near 6.8 dB).
        assertEquals(1e-3, (double) r.get(1).floatBitErrors() / r.get(1).bits(), 2e-4);
    }

    @Test
    void bpskReachesOneInOneHundredThousandNearNinePointSixDb() {
        // Handbook value (Proakis; Sklar, Digital Communications, Fig. 4.x): BPSK needs Eb/N0 = 9.6 dB for 1e-5.
        double eb = SnrAtTarget.errorRate(x -> ErrorRates.bpskBer(Snr.fromDb(x)), 1e-5, 0, 15);
        assertEquals(9.6, eb, 0.05);
    }

    @Test
    void qpskBerAndSerMatchTheClosedForms() {
        // Proakis §4.3: Gray QPSK P_b = Q(sqrt(2 Eb/N0)); P_s = 2Q(x) − Q(x)², x = sqrt(Es/N0).
        List<PointResult> r = LossFixtures.simulate(spec("qpsk", 3.0, 6.8, 200_000), 2);
        for (int i = 0; i < 2; i++) {
            double eb = i == 0 ? 3.0 : 6.8;
            double q = GaussianTail.q(StrictMath.sqrt(2 * Snr.fromDb(eb)));
            assertWithin(r.get(i).floatBitErrors(), r.get(i).bits(), q, "QPSK BER at " + eb + " dB");
            assertWithin(r.get(i).floatSymbolErrors(), r.get(i).symbols(), 2 * q - q * q, "QPSK SER at " + eb + " dB");
            assertWithin(r.get(i).fixedBitErrors(), r.get(i).bits(), q, "QPSK fixed BER at " + eb + " dB");
        }
    }

    @Test
    void grayQam16BerAndSerMatchTheClosedForms() {
        // Exact Gray 16-QAM BER, x = sqrt(Es/(5 N0)) with Es = 4 Eb: P_b = (3Q(x) + 2Q(3x) − Q(5x))/4
        // (K. Cho and D. Yoon, IEEE Trans. Commun. 50(7), 2002; from memory), and the exact square-QAM SER of
        // Proakis §4.3: P_s = 1 − (1 − P_√M)², P_√M = 2(1 − 1/√M) Q(sqrt(3 Es/((M − 1) N0))).
        List<PointResult> r = LossFixtures.simulate(spec("qam16", 6.0, 9.0, 120_000), 2);
        for (int i = 0; i < 2; i++) {
            double eb = i == 0 ? 6.0 : 9.0;
            double es = 4 * Snr.fromDb(eb);
            double x = StrictMath.sqrt(es / 5);
            double ber = (3 * GaussianTail.q(x) + 2 * GaussianTail.q(3 * x) - GaussianTail.q(5 * x)) / 4;
            double pam = 2 * (1 - 0.25) * GaussianTail.q(StrictMath.sqrt(3 * es / 15));
            double ser = 1 - (1 - pam) * (1 - pam);
            assertEquals(ErrorRates.squareQamSer(16, es), ser, 1e-12, "theory package agrees with Proakis");
            assertWithin(r.get(i).floatBitErrors(), r.get(i).bits(), ber, "16-QAM BER at " + eb + " dB");
            assertWithin(r.get(i).floatSymbolErrors(), r.get(i).symbols(), ser, "16-QAM SER at " + eb + " dB");
            assertWithin(r.get(i).fixedBitErrors(), r.get(i).bits(), ber, "16-QAM fixed BER at " + eb + " dB");
        }
    }
}
