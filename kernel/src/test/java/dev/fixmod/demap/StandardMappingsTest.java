package dev.fixmod.demap;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.fixmod.constellation.Catalogue;
import dev.fixmod.constellation.Constellation;
import dev.fixmod.fixed.FixedPoint;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import dev.fixmod.map.ConstellationRom;
import java.util.SplittableRandom;
import java.util.function.IntFunction;
import org.junit.jupiter.api.Test;

/**
 * Hard decisions on the points of published mappings: every point is computed here from the standard's formula or
 * table (not from the kernel), moved by a small random offset (at most 0.4·d_min/2), sliced in float and in fixed
 * point (Q1.14 input), and the decided label must carry the bits the standard mapped. These are engineering checks of
 * our model against the published definitions; the standard's text decides.
 */
class StandardMappingsTest {
    private static final Quantizer Q1_14 = new Quantizer(QFormat.parse("Q1.14"), Rounding.HALF_EVEN,
            Overflow.SATURATE);
    private static final int TRIALS_PER_LABEL = 4;

    private static int b(int label, int k, int position) {
        return (label >>> (k - 1 - position)) & 1;
    }

    /** 1 − 2·b_position. */
    private static int s(int label, int k, int position) {
        return 1 - 2 * b(label, k, position);
    }

    /** Points by label as {re, im} from a formula, sliced after a random offset of at most 0.4·d_min/2. */
    private static void slicesBackToTheBits(String name, double dmin, IntFunction<double[]> point, long symbolIndex) {
        Constellation c = Catalogue.resolve(name);
        FloatSlicer floating = Slicers.floatFor(c);
        FixedSlicer fixed = Slicers.fixedFor(ConstellationRom.of(c, Q1_14));
        FloatNearestSlicer nearest = new FloatNearestSlicer(c);
        SplittableRandom random = new SplittableRandom(name.hashCode());
        OverflowCounter counter = OverflowCounter.unnamed();
        for (int label = 0; label < c.size(); label++) {
            double[] p = point.apply(label);
            for (int t = 0; t < TRIALS_PER_LABEL; t++) {
                double r = 0.2 * dmin * random.nextDouble();
                double a = 2 * StrictMath.PI * random.nextDouble();
                double x = p[0] + r * StrictMath.cos(a);
                double y = p[1] + r * StrictMath.sin(a);
                String where = name + " label " + label + " at (" + x + ", " + y + ")";
                assertEquals(label, floating.slice(x, y, symbolIndex), "float, " + where);
                assertEquals(label, nearest.slice(x, y, symbolIndex), "float nearest, " + where);
                int i = (int) FixedPoint.quantize(x, Q1_14.format(), Rounding.HALF_EVEN, Overflow.SATURATE, counter);
                int q = (int) FixedPoint.quantize(y, Q1_14.format(), Rounding.HALF_EVEN, Overflow.SATURATE, counter);
                assertEquals(label, fixed.slice(i, q, symbolIndex), "fixed, " + where);
            }
        }
        assertEquals(0, counter.events());
    }

    @Test
    void nrPi2Bpsk() {
        // TS 38.211 §5.1.1 (subclause number from memory): d(i) = e^{jπ(i mod 2)/2}/√2 · [(1−2b(i)) + j(1−2b(i))];
        // for odd i, e^{jπ/2} = j turns x + jx into −x + jx.
        double a = 1 / StrictMath.sqrt(2);
        slicesBackToTheBits("nr:pi2bpsk", 2, label -> new double[] {a * s(label, 1, 0), a * s(label, 1, 0)}, 4);
        slicesBackToTheBits("nr:pi2bpsk", 2, label -> new double[] {-a * s(label, 1, 0), a * s(label, 1, 0)}, 7);
    }

    @Test
    void nrBpskAndQpsk() {
        double a = 1 / StrictMath.sqrt(2);
        // TS 38.211 §5.1.2: d(i) = (1/√2)[(1−2b(i)) + j(1−2b(i))].
        slicesBackToTheBits("nr:bpsk", 2, label -> new double[] {a * s(label, 1, 0), a * s(label, 1, 0)}, 0);
        // TS 38.211 §5.1.3: d(i) = (1/√2)[(1−2b(2i)) + j(1−2b(2i+1))].
        slicesBackToTheBits("nr:qpsk", 2 * a, label -> new double[] {a * s(label, 2, 0), a * s(label, 2, 1)}, 0);
    }

    @Test
    void nrSixteenQam() {
        // TS 38.211 §5.1.4: d = (1/√10){(1−2b0)[2−(1−2b2)] + j(1−2b1)[2−(1−2b3)]}.
        double n = 1 / StrictMath.sqrt(10);
        slicesBackToTheBits("nr:qam16", 2 * n, label -> new double[] {
            n * s(label, 4, 0) * (2 - s(label, 4, 2)),
            n * s(label, 4, 1) * (2 - s(label, 4, 3))}, 0);
    }

    @Test
    void nrSixtyFourQam() {
        // TS 38.211 §5.1.5: d = (1/√42){(1−2b0)[4−(1−2b2)[2−(1−2b4)]] + j(1−2b1)[4−(1−2b3)[2−(1−2b5)]]}.
        double n = 1 / StrictMath.sqrt(42);
        slicesBackToTheBits("nr:qam64", 2 * n, label -> new double[] {
            n * s(label, 6, 0) * (4 - s(label, 6, 2) * (2 - s(label, 6, 4))),
            n * s(label, 6, 1) * (4 - s(label, 6, 3) * (2 - s(label, 6, 5)))}, 0);
    }

    @Test
    void nrTwoHundredFiftySixQam() {
        // TS 38.211 §5.1.6: d = (1/√170){(1−2b0)[8−(1−2b2)[4−(1−2b4)[2−(1−2b6)]]]
        //                              + j(1−2b1)[8−(1−2b3)[4−(1−2b5)[2−(1−2b7)]]]}.
        double n = 1 / StrictMath.sqrt(170);
        slicesBackToTheBits("nr:qam256", 2 * n, label -> new double[] {
            n * s(label, 8, 0) * (8 - s(label, 8, 2) * (4 - s(label, 8, 4) * (2 - s(label, 8, 6)))),
            n * s(label, 8, 1) * (8 - s(label, 8, 3) * (4 - s(label, 8, 5) * (2 - s(label, 8, 7))))}, 0);
    }

    @Test
    void nrThousandTwentyFourQam() {
        // TS 38.211 §5.1.7 (Rel-17): d = (1/√682){(1−2b0)[16−(1−2b2)[8−(1−2b4)[4−(1−2b6)[2−(1−2b8)]]]]
        //                                   + j(1−2b1)[16−(1−2b3)[8−(1−2b5)[4−(1−2b7)[2−(1−2b9)]]]]}.
        double n = 1 / StrictMath.sqrt(682);
        slicesBackToTheBits("nr:qam1024", 2 * n, label -> new double[] {
            n * s(label, 10, 0) * (16 - s(label, 10, 2) * (8 - s(label, 10, 4) * (4 - s(label, 10, 6)
                    * (2 - s(label, 10, 8))))),
            n * s(label, 10, 1) * (16 - s(label, 10, 3) * (8 - s(label, 10, 5) * (4 - s(label, 10, 7)
                    * (2 - s(label, 10, 9)))))}, 0);
    }

    /**
     * The IEEE 802.11 per-axis tables as published for 16-QAM (b0 b1 → I: 00 → −3, 01 → −1, 11 → +1, 10 → +3) and
     * 64-QAM (b0 b1 b2 → I: 000 → −7, 001 → −5, 011 → −3, 010 → −1, 110 → +1, 111 → +3, 101 → +5, 100 → +7), from
     * memory of the OFDM PHY encoding tables; Q takes the second half of the bits alike. The 256- and 1024-QAM tables
     * continue the same binary-reflected pattern, built here by reflection (not by the XOR formula the kernel uses).
     */
    private static int[] reflectedLevels(int h) {
        int[] codes = {0, 1};
        for (int bits = 2; bits <= h; bits++) {
            int[] next = new int[codes.length * 2];
            for (int n = 0; n < codes.length; n++) {
                next[n] = codes[n];
                next[next.length - 1 - n] = codes[n] | 1 << (bits - 1);
            }
            codes = next;
        }
        int[] levelByCode = new int[codes.length];
        for (int n = 0; n < codes.length; n++) {
            levelByCode[codes[n]] = 2 * n - (codes.length - 1);
        }
        return levelByCode;
    }

    @Test
    void wlanTablesAsPublished() {
        int[] sixteen = {-3, -1, 3, 1}; // indexed by b0b1: 00, 01, 10, 11
        int[] sixtyFour = {-7, -5, -1, -3, 7, 5, 1, 3}; // indexed by b0b1b2: 000 … 111
        assertEquals(java.util.Arrays.toString(sixteen), java.util.Arrays.toString(reflectedLevels(2)));
        assertEquals(java.util.Arrays.toString(sixtyFour), java.util.Arrays.toString(reflectedLevels(3)));
    }

    @Test
    void wlanQam() {
        // IEEE 802.11: BPSK b0 = 0 → −1, 1 → +1; QPSK b0 → I, b1 → Q alike; K_MOD = 1, 1/√2, 1/√10, 1/√42, 1/√170,
        // 1/√682 (from memory).
        slicesBackToTheBits("wlan:bpsk", 2, label -> new double[] {2 * label - 1, 0}, 0);
        double[] kMod = {0, 1 / StrictMath.sqrt(2), 1 / StrictMath.sqrt(10), 1 / StrictMath.sqrt(42),
            1 / StrictMath.sqrt(170), 1 / StrictMath.sqrt(682)};
        String[] names = {null, "wlan:qpsk", "wlan:qam16", "wlan:qam64", "wlan:qam256", "wlan:qam1024"};
        for (int h = 1; h <= 5; h++) {
            int[] levels = reflectedLevels(h);
            double k = kMod[h];
            int half = h;
            slicesBackToTheBits(names[h], 2 * k, label -> new double[] {
                k * levels[label >>> half], k * levels[label & ((1 << half) - 1)]}, 0);
        }
    }
}
