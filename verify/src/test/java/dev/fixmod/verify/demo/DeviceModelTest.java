package dev.fixmod.verify.demo;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class DeviceModelTest {

    @Test
    void levelRomHoldsTheNormalizedLevelsInQ29() {
        // 3GPP TS 38.211 §5.1.4: 64-QAM levels (1, 3, 5, 7)/sqrt(42); Q2.9 has 9 fractional bits.
        for (int j = 0; j < 4; j++) {
            double exact = 512.0 * (2 * j + 1) / StrictMath.sqrt(42);
            assertEquals(StrictMath.rint(exact), DeviceModel.LEVEL[j], 0.0);
            assertTrue(Math.abs(exact - Math.floor(exact) - 0.5) > 0.4, "far from a rounding tie: " + exact);
        }
    }

    @Test
    void anImpulseLeavesThePipelineThreeClocksLater() {
        DeviceModel d = new DeviceModel(DeviceModel.Build.AS_DESIGNED);
        // I = +0.5 (code 256), Q = 0, K = 16 in UQ6.10; then zeros. D(b0) = (0.5 + 79/512)^2 - (0.5 - 237/512)^2 = 0.427,
        // so L(b0) = 16 * 0.427 = 6.8, rounded to 7.
        int iq = 256 << 12;
        long[] out = new long[6];
        for (int t = 0; t < out.length; t++) {
            out[t] = d.clock(t == 0 ? iq : 0, 16 << 10);
        }
        // Words 0..2 are the cleared registers; a zero input (clocks 1..) answers at words 4 and 5.
        long zeroResponse = out[5];
        assertEquals(0, out[0] | out[1] | out[2]);
        assertEquals(zeroResponse, out[4]);
        assertTrue(out[DeviceModel.LATENCY] != zeroResponse, "the impulse's answer is at word 3");
        // b0 is the I sign bit (TS 38.211 5.1.4), the top field; y = +0.5 favours 0, so L > 0.
        long llr0 = out[DeviceModel.LATENCY] >>> 30;
        assertEquals(7, llr0);
    }
}
