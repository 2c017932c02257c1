package dev.fixmod.verify.noise;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class UniformTest {

    /** Oracle: the exact rational value via JDK BigInteger/BigDecimal (reference library). */
    private static BigDecimal exact(BigInteger numerator) {
        return new BigDecimal(numerator).divide(new BigDecimal(BigInteger.TWO.pow(53)));
    }

    private static BigInteger top53(long bits) {
        return new BigInteger(Long.toUnsignedString(bits)).shiftRight(11);
    }

    @Test
    void edgeCasesOfTheDocumentedTable() {
        assertEquals(0.0, Uniform.unit(0L));
        assertEquals(1.0 - 0x1.0p-53, Uniform.unit(-1L));
        assertEquals(0x1.0p-53, Uniform.open(0L));
        assertEquals(1.0 - 0x1.0p-53, Uniform.open(-1L));
        assertEquals(0.5, Uniform.unit(Long.MIN_VALUE));
        assertEquals(0.5 + 0x1.0p-53, Uniform.open(Long.MIN_VALUE));
        // Bits 0..10 are ignored, bit 11 is the lowest one used.
        assertEquals(0.0, Uniform.unit(0x7FFL));
        assertEquals(0x1.0p-53, Uniform.unit(0x800L));
        assertEquals(0x1.0p-53, Uniform.open(0x800L));
    }

    @Test
    void conversionsAreExactMultiplesOfTwoToTheMinus53() {
        SplittableRandom random = new SplittableRandom(99);
        for (int t = 0; t < 10_000; t++) {
            long bits = random.nextLong();
            BigInteger k = top53(bits);
            assertEquals(0, exact(k).compareTo(new BigDecimal(Uniform.unit(bits))), "unit of " + bits);
            assertEquals(0, exact(k.setBit(0)).compareTo(new BigDecimal(Uniform.open(bits))), "open of " + bits);
        }
    }

    @Test
    void fillsConvertTheDraws() {
        StreamKey key = StreamKey.of(11, 12);
        long[] draws = new long[9];
        Philox4x32.fillDraws(draws, 0, 9, key, 3);
        double[] unit = new double[9];
        double[] open = new double[9];
        Uniform.fill(unit, 0, 9, key, 3);
        Uniform.fillOpen(open, 0, 9, key, 3);
        for (int j = 0; j < 9; j++) {
            assertEquals(Uniform.unit(draws[j]), unit[j]);
            assertEquals(Uniform.open(draws[j]), open[j]);
        }
        double[] chunked = new double[9];
        Uniform.fill(chunked, 0, 4, key, 3);
        Uniform.fill(chunked, 4, 5, key, 7);
        assertArrayEquals(unit, chunked);
    }
}
