package dev.fixmod.verify.theory;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.constellation.Constellations;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;

class SnrAtTargetTest {
    private static final double[] SNR = {0, 1, 2};

    @Test
    void documentedExamples() {
        assertEquals(0.5, SnrAtTarget.errorRate(SNR, new double[] {1e-2, 1e-4, 1e-6}, 1e-3).getAsDouble(), 1e-12);
        assertEquals(0.5, SnrAtTarget.errorRate(SNR, new double[] {1e-2, 0, 1e-6}, 1e-3).getAsDouble(), 1e-12);
        assertEquals(1, SnrAtTarget.errorRate(SNR, new double[] {1e-2, 1e-3, 1e-6}, 1e-3).getAsDouble(), 0);
        assertEquals(OptionalDouble.empty(), SnrAtTarget.errorRate(SNR, new double[] {1e-4, 1e-5, 1e-6}, 1e-3));
        assertEquals(OptionalDouble.empty(), SnrAtTarget.errorRate(SNR, new double[] {1e-2, 5e-3, 2e-3}, 1e-3));
        assertEquals(0.5, SnrAtTarget.rate(SNR, new double[] {1.0, 1.5, 2.0}, 1.25).getAsDouble(), 1e-12);
        assertEquals(OptionalDouble.empty(), SnrAtTarget.rate(SNR, new double[] {1.0, 1.5, 2.0}, 2.5));
        assertEquals(OptionalDouble.empty(), SnrAtTarget.rate(SNR, new double[] {1.0, 1.5, 2.0}, 0.5));
    }

    @Test
    void firstCrossingCountsOnANoisyCurve() {
        double[] snr = {0, 1, 2, 3};
        double[] ber = {1e-2, 1e-4, 2e-3, 1e-6};  // wobbles back above 1e-3 at 2 dB
        assertEquals(0.5, SnrAtTarget.errorRate(snr, ber, 1e-3).getAsDouble(), 1e-12);
    }

    @Test
    void sampledBpskCurveGivesTheSolvedValue() {
        // Sampled every 0.5 dB from the exact BPSK BER, log-linear interpolation lands within 0.01 dB of the
        // Brent solution (9.5879 dB for 1e-5).
        double[] snr = new double[25];
        double[] ber = new double[25];
        for (int i = 0; i < snr.length; i++) {
            snr[i] = 0.5 * i;
            ber[i] = ErrorRates.bpskBer(Snr.fromDb(snr[i]));
        }
        double solved = SnrAtTarget.errorRate(db -> ErrorRates.bpskBer(Snr.fromDb(db)), 1e-5, 0, 12);
        assertEquals(solved, SnrAtTarget.errorRate(snr, ber, 1e-5).getAsDouble(), 0.01);
    }

    @Test
    void implementationLossOfAShiftedCurveIsTheShift() {
        // A curve moved right by 1.3 dB, on a grid moved by the same amount, crosses 1.3 dB later.
        double[] snr = new double[25];
        double[] shifted = new double[25];
        double[] ser = new double[25];
        for (int i = 0; i < 25; i++) {
            snr[i] = i;
            shifted[i] = i + 1.3;
            ser[i] = ErrorRates.squareQamSer(16, Snr.fromDb(i));
        }
        double loss = SnrAtTarget.errorRate(shifted, ser, 1e-4).getAsDouble()
                - SnrAtTarget.errorRate(snr, ser, 1e-4).getAsDouble();
        assertEquals(1.3, loss, 1e-12);
    }

    @Test
    void rateTargetOnACapacityFunction() {
        // Shannon: log2(1 + x) = 2 at x = 3, i.e. 4.7712 dB.
        assertEquals(10 * Math.log10(3), SnrAtTarget.rate(db -> Capacity.shannon(Snr.fromDb(db)), 2, -10, 30), 1e-8);
        // BICM of Gray QPSK (two BPSKs) reaches 1 bit where BPSK reaches 0.5 at half the energy; it is no lower
        // than the Shannon SNR for 1 bit (0 dB).
        double qpsk = SnrAtTarget.rate(db -> Capacity.bitInterleaved(Constellations.qam(4, true), Snr.fromDb(db)),
                1, -10, 10);
        double bpsk = SnrAtTarget.rate(db -> Capacity.codedModulation(Constellations.pam(2, true), Snr.fromDb(db)),
                0.5, -10, 10);
        assertEquals(bpsk + 10 * Math.log10(2), qpsk, 1e-6);
        assertTrue(qpsk > 0);
    }

    @Test
    void errorRateThatUnderflowsStillSolves() {
        // The exact BER underflows to 0 above about 32 dB; the solver still brackets a target of 1e-300.
        double db = SnrAtTarget.errorRate(x -> ErrorRates.bpskBer(Snr.fromDb(x)), 1e-300, 0, 40);
        assertEquals(1e-300, ErrorRates.bpskBer(Snr.fromDb(db)), 1e-306);
    }

    @Test
    void badInputIsNamed() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> SnrAtTarget.errorRate(new double[] {0, 0}, new double[] {0.1, 0.01}, 0.05));
        assertEquals("SNR points must increase strictly: point 1 (0.0 dB) follows 0.0 dB", e.getMessage());
        assertThrows(IllegalArgumentException.class,
                () -> SnrAtTarget.errorRate(new double[] {0, 1}, new double[] {0.1}, 0.05));
        assertThrows(IllegalArgumentException.class,
                () -> SnrAtTarget.errorRate(new double[] {0, 1}, new double[] {0.1, 1.5}, 0.05));
        assertThrows(IllegalArgumentException.class,
                () -> SnrAtTarget.errorRate(new double[] {0, 1}, new double[] {0.1, 0.01}, 0));
        e = assertThrows(IllegalArgumentException.class,
                () -> SnrAtTarget.errorRate(x -> ErrorRates.bpskBer(Snr.fromDb(x)), 1e-5, 0, 5));
        assertTrue(e.getMessage().contains("widen the SNR range"), e.getMessage());
    }
}
