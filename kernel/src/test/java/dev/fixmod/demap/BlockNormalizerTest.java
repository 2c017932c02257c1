package dev.fixmod.demap;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import java.math.BigDecimal;
import java.math.MathContext;
import org.junit.jupiter.api.Test;

class BlockNormalizerTest {
    private static final QFormat IN = QFormat.parse("Q3.12");
    private static final Quantizer OUT = new Quantizer(QFormat.parse("Q2.13"), Rounding.HALF_UP, Overflow.SATURATE);

    /** |code − ideal| ≤ ideal · (10^(worst/20) − 1) + 1 LSB of output rounding. */
    private static void assertWithinGainError(BlockNormalizer normalizer, double ideal, int code) {
        double bound = ideal * (StrictMath.pow(10, normalizer.worstGainErrorDb() / 20) - 1) + 1;
        assertTrue(Math.abs(code - ideal) <= bound, "got " + code + ", ideal " + ideal + " ± " + bound);
    }

    @Test
    void aConstantBlockReachesUnitEnergy() {
        // A block of the QPSK point (A, A) with A = 3.0 has power 18; unit energy needs the gain 1/√18, giving
        // ±1/√2 on each axis, i.e. code round(2^13/√2) = 5793 in Q2.13 (BigDecimal oracle below), within the gain
        // error bound and one LSB of rounding.
        BlockNormalizer normalizer = new BlockNormalizer(IN, 16, 1.0, OUT);
        int[] i = new int[16];
        int[] q = new int[16];
        java.util.Arrays.fill(i, 3 << 12);
        java.util.Arrays.fill(q, 3 << 12);
        int[] outI = new int[16];
        int[] outQ = new int[16];
        OverflowCounter counter = new OverflowCounter("agc");
        normalizer.normalize(i, q, 0, 16, outI, outQ, 0, counter);
        int ideal = BigDecimal.valueOf(8192).divide(BigDecimal.valueOf(2).sqrt(MathContext.DECIMAL64),
                MathContext.DECIMAL64).setScale(0, java.math.RoundingMode.HALF_UP).intValueExact();
        assertEquals(5793, ideal);
        assertWithinGainError(normalizer, ideal, outI[0]);
        assertEquals(outI[0], outQ[15]);
        assertEquals(0, counter.events());
        double error = normalizer.gainErrorDb(i, q, 0);
        assertTrue(Math.abs(error) <= normalizer.worstGainErrorDb(), error + " dB");
    }

    @Test
    void theGainErrorIsBoundedByTheExhaustiveWorstCase() {
        // One Newton step from a table good to about 1.6 % leaves about 1.5 · 0.016² = 0.04 % (Newton's quadratic
        // convergence for 1/√u, common practice, no source), i.e. about 0.0033 dB.
        BlockNormalizer normalizer = new BlockNormalizer(IN, 64, 1.0, OUT);
        double worst = normalizer.worstGainErrorDb();
        assertTrue(worst > 0.001 && worst < 0.004, worst + " dB");
        java.util.SplittableRandom random = new java.util.SplittableRandom(7);
        int[] i = new int[64];
        int[] q = new int[64];
        for (int trial = 0; trial < 500; trial++) {
            int scale = 1 + random.nextInt(1 << random.nextInt(15));
            for (int n = 0; n < 64; n++) {
                i[n] = Math.max(-32768, Math.min(32767, (int) (random.nextGaussian() * scale)));
                q[n] = Math.max(-32768, Math.min(32767, (int) (random.nextGaussian() * scale)));
            }
            i[0] |= 1; // never all zero
            double error = normalizer.gainErrorDb(i, q, 0);
            assertTrue(Math.abs(error) <= worst, "trial " + trial + ": " + error + " dB > " + worst);
        }
    }

    @Test
    void theOutputEnergyIsTheTargetWithinTheGainErrorAndTheOutputRounding() {
        BlockNormalizer normalizer = new BlockNormalizer(IN, 256, 2.0, OUT);
        java.util.SplittableRandom random = new java.util.SplittableRandom(11);
        int[] i = new int[512];
        int[] q = new int[512];
        for (int n = 0; n < i.length; n++) {
            i[n] = (int) (random.nextGaussian() * 900);
            q[n] = (int) (random.nextGaussian() * 900);
        }
        int[] outI = new int[512];
        int[] outQ = new int[512];
        OverflowCounter counter = new OverflowCounter("agc");
        normalizer.normalize(i, q, 0, 512, outI, outQ, 0, counter);
        for (int block = 0; block < 2; block++) {
            double energy = 0;
            for (int n = block * 256; n < (block + 1) * 256; n++) {
                double x = OUT.format().toDouble(outI[n]);
                double y = OUT.format().toDouble(outQ[n]);
                energy += x * x + y * y;
            }
            energy /= 256;
            // Gain error ≤ worst dB; output rounding adds at most ½ LSB per axis: a relative energy error well under
            // 1e-3 for samples around 1 (2^-14 relative per axis).
            double db = 10 * StrictMath.log10(energy / 2.0);
            assertTrue(Math.abs(db) < normalizer.worstGainErrorDb() + 0.005, "block " + block + ": " + db + " dB");
        }
        assertEquals(0, counter.events());
    }

    @Test
    void anAllZeroBlockStaysZeroAndHasNoGainToReport() {
        BlockNormalizer normalizer = new BlockNormalizer(IN, 4, 1.0, OUT);
        int[] zero = new int[4];
        int[] out = {5, 5, 5, 5};
        normalizer.normalize(zero, zero, 0, 4, out, out, 0, OverflowCounter.unnamed());
        assertArrayEquals(new int[4], out);
        assertThrows(IllegalArgumentException.class, () -> normalizer.gainErrorDb(zero, zero, 0));
    }

    @Test
    void aTinyBlockGetsALargeGain() {
        BlockNormalizer normalizer = new BlockNormalizer(IN, 2, 1.0, OUT);
        int[] i = {1, -1};
        int[] q = {0, 0};
        int[] outI = new int[2];
        int[] outQ = new int[2];
        OverflowCounter counter = new OverflowCounter("agc");
        normalizer.normalize(i, q, 0, 2, outI, outQ, 0, counter);
        // Power 2^-24 → gain 2^12: ±1 LSB becomes ±1.0 exactly, which fits Q2.13.
        assertWithinGainError(normalizer, 8192, outI[0]);
        assertEquals(-outI[0], outI[1]);
        assertEquals(0, counter.events());
        int[] j = {1, 0};
        normalizer.normalize(j, new int[2], 0, 2, outI, outQ, 0, counter);
        // Power 2^-25 → gain √2·2^12: 1 LSB becomes √2 ≈ 1.414, still inside Q2.13; the zero stays zero.
        assertWithinGainError(normalizer, 8192 * StrictMath.sqrt(2), outI[0]);
        assertEquals(0, outI[1]);
        // Into Q0.7 (codes −128 … 127), unit energy puts ±1 LSB at ±1.0: +1.0 saturates to 127 and counts one event.
        BlockNormalizer narrow = new BlockNormalizer(IN, 2, 1.0,
                new Quantizer(QFormat.parse("Q0.7"), Rounding.HALF_UP, Overflow.SATURATE));
        OverflowCounter events = new OverflowCounter("agc");
        narrow.normalize(i, q, 0, 2, outI, outQ, 0, events);
        assertArrayEquals(new int[] {127, -128}, outI);
        assertEquals(1, events.events());
    }

    @Test
    void badParametersAndInputsAreRefused() {
        assertThrows(IllegalArgumentException.class, () -> new BlockNormalizer(IN, 3, 1.0, OUT));
        assertThrows(IllegalArgumentException.class, () -> new BlockNormalizer(IN, 16, 0, OUT));
        assertThrows(IllegalArgumentException.class, () -> new BlockNormalizer(IN, 16, Double.NaN, OUT));
        IllegalArgumentException wide = assertThrows(IllegalArgumentException.class,
                () -> new BlockNormalizer(QFormat.parse("Q3.28"), 1024, 1.0, OUT));
        assertTrue(wide.getMessage().contains("64-bit accumulator"), wide.getMessage());
        BlockNormalizer normalizer = new BlockNormalizer(IN, 4, 1.0, OUT);
        int[] out = {5, 5, 5, 5, 5, 5};
        IllegalArgumentException partial = assertThrows(IllegalArgumentException.class,
                () -> normalizer.normalize(new int[6], new int[6], 0, 6, out, out, 0, OverflowCounter.unnamed()));
        assertEquals("count 6 is not a multiple of the block length 4", partial.getMessage());
        int[] bad = {0, 0, 0, 40000};
        assertThrows(IllegalArgumentException.class,
                () -> normalizer.normalize(bad, new int[4], 0, 4, out, out, 0, OverflowCounter.unnamed()));
        assertArrayEquals(new int[] {5, 5, 5, 5, 5, 5}, out);
    }
}
