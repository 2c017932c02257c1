package dev.fixmod.demap;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import java.util.SplittableRandom;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;

/** The laws of the block normalizer, against the ideal floating-point normalization √(E_target / P). */
class NormalizerProperties {

    /**
     * For any input format, block length, target and signal level, each block's gain is within the exhaustive worst
     * case of the ideal, and every output code is the input times that gain, rounded by the output quantizer (checked
     * here against the float product: at most one LSB apart, or saturated).
     */
    @Property(tries = 200)
    void everyBlockGainIsWithinTheWorstCase(@ForAll @IntRange(min = 6, max = 24) int inputWord,
                                            @ForAll @IntRange(max = 8) int log2Block,
                                            @ForAll @DoubleRange(min = 0.1, max = 100) double target,
                                            @ForAll @IntRange(min = 0, max = 22) int level,
                                            @ForAll @IntRange(max = 1 << 20) int seed) {
        QFormat in = QFormat.signedWord(inputWord, inputWord - 3);
        int n = 1 << log2Block;
        Quantizer out = new Quantizer(QFormat.signed(7, 16), Rounding.HALF_EVEN, Overflow.SATURATE);
        BlockNormalizer normalizer = new BlockNormalizer(in, n, target, out);
        SplittableRandom random = new SplittableRandom(seed);
        double sigma = Math.min(Math.scalb(1.0, level), in.maxCode() / 4.0);
        int[] i = new int[n];
        int[] q = new int[n];
        for (int s = 0; s < n; s++) {
            i[s] = (int) Math.max(in.minCode(), Math.min(in.maxCode(), StrictMath.rint(random.nextGaussian() * sigma)));
            q[s] = (int) Math.max(in.minCode(), Math.min(in.maxCode(), StrictMath.rint(random.nextGaussian() * sigma)));
        }
        i[0] = i[0] == 0 ? 1 : i[0];
        double error = normalizer.gainErrorDb(i, q, 0);
        assertTrue(Math.abs(error) <= normalizer.worstGainErrorDb(), error + " dB");
        int[] outI = new int[n];
        int[] outQ = new int[n];
        OverflowCounter counter = OverflowCounter.unnamed();
        normalizer.normalize(i, q, 0, n, outI, outQ, 0, counter);
        double power = 0;
        for (int s = 0; s < n; s++) {
            power += Math.pow(in.toDouble(i[s]), 2) + Math.pow(in.toDouble(q[s]), 2);
        }
        double gain = StrictMath.sqrt(target / (power / n)) * StrictMath.pow(10, error / 20);
        for (int s = 0; s < n; s++) {
            double ideal = Math.scalb(in.toDouble(i[s]) * gain, 16);
            double expected = Math.max(out.format().minCode(), Math.min(out.format().maxCode(), ideal));
            assertTrue(Math.abs(outI[s] - expected) <= 1, "sample " + s + ": " + outI[s] + " vs " + expected);
        }
        assertEquals(0, counter.events(), "Q7.16 holds every normalized sample of these blocks");
    }
}
