package dev.fixmod.fixed;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/**
 * Quantization noise of a full-scale uniform input: with a W-bit word over the whole range the SQNR is
 * 10·log10(2^(2W)) = 6.02·W dB (common practice, no source: signal power (range²)/12 over noise power LSB²/12).
 */
class QuantizationNoiseTest {

    /** Grid points per LSB interval at the largest word length: enough for the 0.1 dB tolerance. */
    private static final int POINTS = 1 << 22;

    @Test
    void sqnrOfAFullScaleUniformInputIsSixDecibelsPerBit() {
        for (Rounding rounding : new Rounding[] {Rounding.HALF_EVEN, Rounding.HALF_UP}) {
            for (int w = 8; w <= 16; w++) {
                double sqnr = sqnrDb(QFormat.signedWord(w, w - 1), rounding);
                // Common practice, no source: 20·log10(2) = 6.0206 dB per bit.
                assertEquals(20 * StrictMath.log10(2) * w, sqnr, 0.1, rounding + " W=" + w);
            }
        }
    }

    @Test
    void truncationAddsTheBiasPowerOfHalfAnLsb() {
        // Common practice, no source: floor's error is uniform on (-LSB, 0], mean -LSB/2, power LSB²/3: four times
        // the rounding noise, i.e. 6.02 dB less SQNR than rounding to nearest.
        for (int w = 8; w <= 16; w += 4) {
            double sqnr = sqnrDb(QFormat.signedWord(w, w - 1), Rounding.FLOOR);
            assertEquals(20 * StrictMath.log10(2) * (w - 1), sqnr, 0.1, "floor W=" + w);
        }
    }

    /**
     * SQNR of a deterministic uniform sweep over the whole range [-1, 1) of a Q0.(W-1) format: the midpoints of
     * {@link #POINTS} equal cells, an odd count so the grid is not aligned with the codes.
     */
    private static double sqnrDb(QFormat format, Rounding rounding) {
        OverflowCounter counter = new OverflowCounter("sweep");
        int n = POINTS + 1;
        double signal = 0;
        double noise = 0;
        for (int i = 0; i < n; i++) {
            double x = -1.0 + (2.0 * i + 1.0) / n;
            long code = FixedPoint.quantize(x, format, rounding, Overflow.SATURATE, counter);
            double e = format.toDouble(code) - x;
            signal += x * x;
            noise += e * e;
        }
        return 10 * StrictMath.log10(signal / noise);
    }
}
