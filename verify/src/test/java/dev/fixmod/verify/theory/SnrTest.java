package dev.fixmod.verify.theory;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;

class SnrTest {
    @Test
    void decibelsAreTenLog10OfPower() {
        // Definition of the decibel for power ratios (common practice, no source): 10·log10(2) = 3.0103.
        assertEquals(3.010299956639812, Snr.toDb(2), 1e-15);
        assertEquals(Double.NEGATIVE_INFINITY, Snr.toDb(0), 0);
        assertEquals(0.1, Snr.fromDb(-10), 1e-17);
        assertEquals(0, Snr.fromDb(Double.NEGATIVE_INFINITY), 0);
        for (double db = -30; db <= 50; db += 7.3) {
            assertEquals(db, Snr.toDb(Snr.fromDb(db)), 1e-12);
        }
    }

    @Test
    void bitEnergyFollowsTheDesignConvention() {
        // DESIGN.md: Eb/N0 = Es/N0 − 10·log10(k·r).
        assertEquals(10 - 10 * Math.log10(4), Snr.ebN0DbFromEsN0Db(10, 4, 1), 1e-12);
        assertEquals(10, Snr.ebN0DbFromEsN0Db(10, 2, 0.5), 1e-12);
        assertEquals(10 + 10 * Math.log10(6 * 0.75), Snr.esN0DbFromEbN0Db(10, 6, 0.75), 1e-12);
        assertEquals(4.2, Snr.ebN0DbFromEsN0Db(Snr.esN0DbFromEbN0Db(4.2, 8, 0.4), 8, 0.4), 1e-12);
        // N0 = Es/(Es/N0): 10 dB on unit energy is N0 = 0.1, i.e. 0.05 per real dimension.
        assertEquals(0.1, Snr.n0(1, 10), 1e-16);
    }

    @Test
    void badInputIsNamed() {
        assertThrows(IllegalArgumentException.class, () -> Snr.toDb(-1));
        assertThrows(IllegalArgumentException.class, () -> Snr.fromDb(Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> Snr.ebN0DbFromEsN0Db(3, 0, 1));
        assertThrows(IllegalArgumentException.class, () -> Snr.ebN0DbFromEsN0Db(3, 2, 1.5));
        assertThrows(IllegalArgumentException.class, () -> Snr.n0(0, 3));
    }
}
