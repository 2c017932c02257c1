package dev.fixmod.demap;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.constellation.Catalogue;
import dev.fixmod.constellation.Constellation;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import dev.fixmod.map.ConstellationRom;
import dev.fixmod.map.FixedMapper;
import dev.fixmod.map.FloatMapper;
import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * π/2-BPSK through the soft demappers: the 3GPP mapping itself, the exact LLR in closed form, the fixed datapath, the
 * round trip from the mapper for both parities, and the documented examples.
 */
class Pi2BpskDemapperTest {
    private static final Constellation NR = Catalogue.resolve("nr:pi2bpsk");
    private static final Constellation PLAIN = Catalogue.resolve("pi2bpsk");
    private static final double A = 1 / StrictMath.sqrt(2);

    /**
     * The handbook closed form. By definition L = ln p(y | b=0) − ln p(y | b=1) for equiprobable bits, and on complex
     * AWGN of power N0, p(y | s) ∝ exp(−|y − s|²/N0) (Proakis, Digital Communications, the ML metric of a memoryless
     * modulation on AWGN). With one point per bit value, L = (|y − s1|² − |y − s0|²)/N0 = (2·Re(y·conj(s0 − s1))
     * − |s0|² + |s1|²)/N0, and |s0| = |s1|. Even symbols of 3GPP TS 38.211 §5.1.1 (b = 0 ↦ +): s0 = a(1 + j),
     * s1 = −s0, s0 − s1 = 2a(1 + j), Re(y·2a(1 − j)) = 2a(I + Q), so L = 4a(I + Q)/N0. Odd symbols: both points
     * times e^{jπ/2} = j, s0 = a(−1 + j), Re(y·2a(−1 − j)) = 2a(Q − I), so L = 4a(Q − I)/N0; a = 1/√2.
     */
    private static double closedForm(double i, double q, long symbolIndex, double n0) {
        return (symbolIndex & 1) == 0 ? 4 * A * (i + q) / n0 : 4 * A * (q - i) / n0;
    }

    @Test
    void logMapAndMaxLogAreTheClosedFormForBothParities() {
        Random random = new Random(7);
        double[] one = new double[1];
        for (double n0 : new double[] {0.02, 0.5, 3.0}) {
            LlrOptions o = LlrOptions.of(n0);
            SoftDemapper logMap = new LogMapDemapper(NR, o);
            SoftDemapper maxLog = new MaxLogDemapper(NR, o);
            for (int n = 0; n < 400; n++) {
                double i = 3 * (2 * random.nextDouble() - 1);
                double q = 3 * (2 * random.nextDouble() - 1);
                long index = random.nextInt(1 << 20);
                double want = closedForm(i, q, index, n0);
                // Rounding only: the distances are of order (|y| + a)², their difference is cancelled to L·N0.
                double tolerance = 1e-13 * (1 + (Math.abs(i) + Math.abs(q) + 1) * (Math.abs(i) + Math.abs(q) + 1)) / n0;
                logMap.llr(i, q, index, one, 0);
                assertEquals(want, one[0], tolerance, "log-map at (" + i + ", " + q + "), index " + index);
                maxLog.llr(i, q, index, one, 0);
                assertEquals(want, one[0], tolerance, "max-log at (" + i + ", " + q + "), index " + index);
            }
        }
    }

    @Test
    void theOneBitSignSwitchNegatesTheClosedForm() {
        double[] one = new double[1];
        SoftDemapper d = new MaxLogDemapper(NR, new LlrOptions(0.5, LlrSign.ONE_POSITIVE, false));
        d.llr(0.3, -0.9, 3, one, 0);
        assertEquals(-closedForm(0.3, -0.9, 3, 0.5), one[0], 1e-12);
    }

    @Test
    void theKernelsMappingIsTheStandardsFormula() {
        // 3GPP TS 38.211 §5.1.1: d(i) = e^{jπ(i mod 2)/2}/√2 · [(1 − 2b(i)) + j(1 − 2b(i))]. The factor is exactly 1
        // for even i and exactly j for odd i; 1/√2 is taken from BigDecimal (JDK reference) to 40 digits.
        MathContext mc = new MathContext(40);
        BigDecimal invSqrt2 = BigDecimal.ONE.divide(BigDecimal.valueOf(2).sqrt(mc), mc);
        for (QFormat f : new QFormat[] {QFormat.parse("Q1.14"), QFormat.parse("Q2.9"), QFormat.parse("Q0.7")}) {
            ConstellationRom rom = ConstellationRom.of(NR, new Quantizer(f, Rounding.HALF_EVEN, Overflow.SATURATE));
            FixedMapper fixed = new FixedMapper(rom);
            FloatMapper floating = new FloatMapper(NR);
            for (int b = 0; b <= 1; b++) {
                for (long i = 0; i < 4; i++) {
                    BigDecimal x = invSqrt2.multiply(BigDecimal.valueOf(1 - 2 * b));
                    // (x + jx)·1 = x + jx; (x + jx)·j = −x + jx.
                    BigDecimal re = (i & 1) == 0 ? x : x.negate();
                    BigDecimal im = x;
                    int[] oi = new int[1];
                    int[] oq = new int[1];
                    fixed.mapLabels(new int[] {b}, 0, 1, i, oi, oq, 0);
                    String where = f + " b=" + b + " i=" + i;
                    assertEquals(code(re, f), oi[0], "I " + where);
                    assertEquals(code(im, f), oq[0], "Q " + where);
                    assertEquals(oi[0], (i & 1) == 0 ? rom.iCode(b) : rom.oddICode(b), "ROM I " + where);
                    assertEquals(oq[0], (i & 1) == 0 ? rom.qCode(b) : rom.oddQCode(b), "ROM Q " + where);
                    double[] fr = new double[1];
                    double[] fq = new double[1];
                    floating.mapLabels(new int[] {b}, 0, 1, i, fr, fq, 0);
                    // Within one ulp: the kernel normalizes by a computed factor.
                    assertEquals(re.doubleValue(), fr[0], Math.ulp(fr[0]), "float I " + where);
                    assertEquals(im.doubleValue(), fq[0], Math.ulp(fq[0]), "float Q " + where);
                }
            }
        }
    }

    /** The code of an exact value in {@code f}, rounded half-even (BigDecimal.HALF_EVEN is our half-even). */
    private static int code(BigDecimal value, QFormat f) {
        return value.multiply(BigDecimal.valueOf(2).pow(f.fractionalBits())).setScale(0, RoundingMode.HALF_EVEN)
                .intValueExact();
    }

    @Test
    void theFloatExamplesTableHolds() {
        // The table in SoftDemapper's documentation; the values follow from the closed forms above (and 4I/N0,
        // 4Q/N0 for pi2bpsk with s0 = 1, or j on odd symbols, by the same derivation).
        double[] one = new double[1];
        Object[][] rows = {
            {NR, 0L, A, A, 4.0}, {NR, 1L, A, A, 0.0}, {NR, 1L, -A, A, 4.0}, {NR, 0L, 0.5, -0.5, 0.0},
            {NR, 0L, 1.0, 0.0, 2 * StrictMath.sqrt(2)}, {NR, 7L, 1.0, 0.0, -2 * StrictMath.sqrt(2)},
            {PLAIN, 2L, 0.25, 3.0, 1.0}, {PLAIN, 3L, 0.25, 3.0, 12.0}};
        for (Object[] row : rows) {
            for (SoftAlgorithm a : new SoftAlgorithm[] {SoftAlgorithm.LOG_MAP, SoftAlgorithm.MAX_LOG}) {
                SoftDemapper d = SoftDemapper.create(a, (Constellation) row[0], LlrOptions.of(1.0));
                d.llr((double) row[2], (double) row[3], (long) row[1], one, 0);
                assertEquals((double) row[4], one[0], 1e-12, a + " " + ((Constellation) row[0]).name() + " index "
                        + row[1] + " at (" + row[2] + ", " + row[3] + ")");
            }
        }
    }

    @Test
    void theFixedExamplesTableHolds() {
        // The table in FixedSoftDemapper's documentation: Q1.6 puts a = 1/√2 at 45.25 LSB, code 45; the metric
        // d1 − d0 = 4·45·(I + Q) (even) or 4·45·(Q − I) (odd), exact, in units of 2^−12.
        ConstellationRom rom = ConstellationRom.of(NR, new Quantizer(QFormat.parse("Q1.6"), Rounding.HALF_EVEN,
                Overflow.SATURATE));
        assertEquals(45, rom.iCode(0));
        Quantizer wide = new Quantizer(QFormat.parse("Q9.12"), Rounding.HALF_EVEN, Overflow.SATURATE);
        FixedSoftDemapper d = new FixedMaxLogDemapper(rom, LlrOptions.of(1.0),
                FixedLlrSpec.unscaled(Rounding.HALF_EVEN, wide, wide));
        int[][] rows = {{0, 45, 45, 16200}, {1, 45, 45, 0}, {1, -45, 45, 16200}, {2, -128, -128, -46080},
            {3, 10, -3, -2340}};
        int[] one = new int[1];
        for (int[] row : rows) {
            d.llr(row[1], row[2], row[0], one, 0);
            assertEquals(row[3], one[0], "index " + row[0] + " codes (" + row[1] + ", " + row[2] + ")");
            assertEquals(row[3], 4 * 45 * ((row[0] & 1) == 0 ? row[1] + row[2] : row[2] - row[1]));
        }
        assertEquals(0, d.counters().stream().mapToLong(c -> c.events()).sum());
    }

    @Test
    void theMapperToDemapperRoundTripRecoversTheBitsForBothParities() {
        // At Es/N0 = 20 dB the nearest wrong decision is 10σ away (distance 1 to the boundary, σ = 0.0707): no
        // errors. Demapping with the wrong parity must fail (about half the bits), so the parity is really used.
        Quantizer q14 = new Quantizer(QFormat.parse("Q1.14"), Rounding.HALF_EVEN, Overflow.SATURATE);
        for (Constellation c : new Constellation[] {NR, PLAIN}) {
            double n0 = 0.01;
            double sigma = StrictMath.sqrt(n0 / 2);
            ConstellationRom rom = ConstellationRom.of(c, q14);
            FloatMapper floating = new FloatMapper(c);
            FixedMapper fixed = new FixedMapper(rom);
            SoftDemapper[] floats = {new LogMapDemapper(c, LlrOptions.of(n0)), new MaxLogDemapper(c, LlrOptions.of(n0))};
            FixedSoftDemapper datapath = FixedSoftDemapper.create(SoftAlgorithm.MAX_LOG, rom, LlrOptions.of(n0),
                    FixedLlrSpec.suggested(SoftAlgorithm.MAX_LOG, rom, LlrOptions.of(n0), QFormat.parse("Q5.0")));
            Random random = new Random(11);
            for (long first : new long[] {0, 1, 2, 1001}) {
                int n = 300;
                int[] labels = new int[n];
                for (int s = 0; s < n; s++) {
                    labels[s] = random.nextInt(2);
                }
                double[] re = new double[n];
                double[] im = new double[n];
                floating.mapLabels(labels, 0, n, first, re, im, 0);
                int[] ci = new int[n];
                int[] cq = new int[n];
                fixed.mapLabels(labels, 0, n, first, ci, cq, 0);
                for (int s = 0; s < n; s++) {
                    double ni = sigma * random.nextGaussian();
                    double nq = sigma * random.nextGaussian();
                    re[s] += ni;
                    im[s] += nq;
                    ci[s] += (int) Math.round(StrictMath.scalb(ni, 14));
                    cq[s] += (int) Math.round(StrictMath.scalb(nq, 14));
                }
                double[] llr = new double[n];
                for (SoftDemapper d : floats) {
                    d.llr(re, im, 0, n, first, llr, 0);
                    assertEquals(0, errors(labels, llr), d + " from symbol " + first);
                    d.llr(re, im, 0, n, first + 1, llr, 0);
                    assertTrue(errors(labels, llr) > n / 4, d + " with the wrong parity");
                }
                int[] codes = new int[n];
                datapath.llr(ci, cq, 0, n, first, codes, 0);
                double[] asDouble = new double[n];
                for (int s = 0; s < n; s++) {
                    asDouble[s] = codes[s];
                }
                assertEquals(0, errors(labels, asDouble), datapath + " from symbol " + first);
            }
        }
    }

    private static int errors(int[] labels, double[] llr) {
        int wrong = 0;
        for (int s = 0; s < labels.length; s++) {
            wrong += (llr[s] > 0 ? 0 : 1) != labels[s] ? 1 : 0;
        }
        return wrong;
    }

    @Test
    void theFixedLlrSignIsTheSlicersDecisionForBothParities() {
        // Max-log's zero crossing is the minimum-distance boundary of the same ROM: a positive LLR decides label 0,
        // a negative one label 1, and 0 means equidistant (on the boundary), for every code of a small format.
        for (Constellation c : new Constellation[] {NR, PLAIN}) {
            ConstellationRom rom = ConstellationRom.of(c, new Quantizer(QFormat.parse("Q1.4"), Rounding.HALF_EVEN,
                    Overflow.SATURATE));
            FixedSoftDemapper d = FixedSoftDemapper.create(SoftAlgorithm.MAX_LOG, rom, LlrOptions.of(0.25),
                    FixedLlrSpec.suggested(SoftAlgorithm.MAX_LOG, rom, LlrOptions.of(0.25), QFormat.parse("Q7.0")));
            FixedSlicer nearest = new FixedNearestSlicer(rom);
            FixedSlicer chosen = Slicers.fixedFor(rom);
            int[] one = new int[1];
            int zeros = 0;
            for (long index = 4; index < 6; index++) {
                for (int i = -32; i < 32; i++) {
                    for (int q = -32; q < 32; q++) {
                        d.llr(i, q, index, one, 0);
                        String where = c.name() + " index " + index + " (" + i + ", " + q + ")";
                        if (one[0] == 0) {
                            zeros++;
                            assertTrue(nearest.onBoundary(i, q, index), where);
                        } else {
                            int label = one[0] > 0 ? 0 : 1;
                            assertEquals(label, nearest.slice(i, q, index), where);
                            assertEquals(label, chosen.slice(i, q, index), where);
                        }
                    }
                }
            }
            assertTrue(zeros > 0, "the boundary is met");
        }
    }

    @Test
    void oddSymbolsUseTheTurnedRomEvenWhereTheTurnSaturates() {
        // In Q0.3 (codes −8 … 7) a point at −1.0 is code −8, whose negation +8 saturates to 7: the ROM's odd
        // codes differ from an exact turn, and the datapath must use the ROM's (the codes the fixed mapper emits).
        Constellation c = Constellation.ofLabelled("edge", dev.fixmod.constellation.Family.PSK, "gray",
                new double[] {0.5, -0.5}, new double[] {-1.0, 1.0}, null, null).withAlternatingQuarterTurn("edge");
        ConstellationRom rom = ConstellationRom.of(c, new Quantizer(QFormat.parse("Q0.3"), Rounding.HALF_EVEN,
                Overflow.SATURATE));
        assertEquals(7, rom.oddICode(0));
        Quantizer wide = new Quantizer(QFormat.parse("Q9.6"), Rounding.HALF_EVEN, Overflow.SATURATE);
        FixedSoftDemapper d = new FixedMaxLogDemapper(rom, LlrOptions.of(1.0),
                FixedLlrSpec.unscaled(Rounding.HALF_EVEN, wide, wide));
        int[] one = new int[1];
        for (int i = -8; i < 8; i++) {
            for (int q = -8; q < 8; q++) {
                d.llr(i, q, 1, one, 0);
                long d0 = sq(i - rom.oddICode(0)) + sq(q - rom.oddQCode(0));
                long d1 = sq(i - rom.oddICode(1)) + sq(q - rom.oddQCode(1));
                assertEquals(d1 - d0, one[0], "(" + i + ", " + q + ")");
            }
        }
        // An exact turn (−Q, I) would put label 0 at (8, 4) (label 1 at (−7, −4)): at (7, 4) the two differ.
        d.llr(7, 4, 1, one, 0);
        assertNotEquals(sq(7 + 7) + sq(4 + 4) - sq(7 - 8) - sq(4 - 4), one[0]);
    }

    private static long sq(long x) {
        return x * x;
    }

    @Test
    void badCallsAreRefusedWithAClearMessage() {
        LlrOptions o = LlrOptions.of(1.0);
        double[] out = new double[4];
        SoftDemapper maxLog = new MaxLogDemapper(NR, o);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> maxLog.llr(0.1, 0.2, out, 0));
        assertTrue(e.getMessage().contains("nr:pi2bpsk turns odd-index symbols by +90°")
                && e.getMessage().contains("stream index"), e.getMessage());
        assertThrows(IllegalArgumentException.class,
                () -> maxLog.llr(new double[2], new double[2], 0, 2, out, 0));
        e = assertThrows(IllegalArgumentException.class, () -> maxLog.llr(0.1, 0.2, -1, out, 0));
        assertEquals("first symbol index must be >= 0, got -1", e.getMessage());
        assertThrows(IllegalArgumentException.class,
                () -> maxLog.llr(new double[2], new double[2], 0, 2, -3, out, 0));
        // The plain pi2bpsk lies on the I axis for even symbols only: Q is never optional.
        SoftDemapper plain = new LogMapDemapper(PLAIN, o);
        e = assertThrows(IllegalArgumentException.class, () -> plain.llr(new double[2], null, 0, 2, 0, out, 0));
        assertTrue(e.getMessage().contains("Q sample array is missing"), e.getMessage());
        for (SoftAlgorithm a : new SoftAlgorithm[] {SoftAlgorithm.MAX_LOG_PER_AXIS, SoftAlgorithm.FOLDED_LINEAR}) {
            e = assertThrows(IllegalArgumentException.class, () -> SoftDemapper.create(a, NR, o));
            assertEquals(a + " needs a separable constellation, and nr:pi2bpsk is not: it turns odd-index symbols"
                    + " by +90°, which moves its bit from one axis to the other; use max-log (exact for two points)"
                    + " or log-map", e.getMessage());
            ConstellationRom rom = ConstellationRom.of(PLAIN, new Quantizer(QFormat.parse("Q2.9"),
                    Rounding.HALF_EVEN, Overflow.SATURATE));
            e = assertThrows(IllegalArgumentException.class, () -> FixedSoftDemapper.create(a, rom, o,
                    FixedLlrSpec.suggested(SoftAlgorithm.MAX_LOG, rom, o, QFormat.parse("Q5.0"))));
            assertTrue(e.getMessage().startsWith(a + " needs a separable constellation, and pi2bpsk is not"),
                    e.getMessage());
        }
        ConstellationRom rom = ConstellationRom.of(NR, new Quantizer(QFormat.parse("Q2.9"), Rounding.HALF_EVEN,
                Overflow.SATURATE));
        FixedSoftDemapper fixed = FixedSoftDemapper.create(SoftAlgorithm.MAX_LOG, rom, o,
                FixedLlrSpec.suggested(SoftAlgorithm.MAX_LOG, rom, o, QFormat.parse("Q5.0")));
        int[] codes = {5, 7};
        int[] llr = {99, 99};
        assertThrows(IllegalArgumentException.class, () -> fixed.llr(3, 4, llr, 0));
        assertThrows(IllegalArgumentException.class, () -> fixed.llr(codes, codes, 0, 2, llr, 0));
        assertThrows(IllegalArgumentException.class, () -> fixed.trace(3, 4));
        assertThrows(IllegalArgumentException.class, () -> fixed.llr(codes, codes, 0, 2, -1, llr, 0));
        assertArrayEquals(new int[] {99, 99}, llr, "nothing written");
        // The index is checked but irrelevant for the other constellations.
        Constellation qpsk = Catalogue.resolve("qpsk");
        double[] a = new double[2];
        double[] b = new double[2];
        new MaxLogDemapper(qpsk, o).llr(0.3, -0.2, a, 0);
        new MaxLogDemapper(qpsk, o).llr(0.3, -0.2, 12345, b, 0);
        assertArrayEquals(a, b);
        assertThrows(IllegalArgumentException.class, () -> new MaxLogDemapper(qpsk, o).llr(0.3, -0.2, -1, b, 0));
    }

    @Test
    void theTraceFollowsTheParity() {
        ConstellationRom rom = ConstellationRom.of(NR, new Quantizer(QFormat.parse("Q2.9"), Rounding.HALF_EVEN,
                Overflow.SATURATE));
        LlrOptions o = LlrOptions.of(0.3);
        FixedSoftDemapper d = FixedSoftDemapper.create(SoftAlgorithm.MAX_LOG, rom, o,
                FixedLlrSpec.suggested(SoftAlgorithm.MAX_LOG, rom, o, QFormat.parse("Q5.0")));
        int[] one = new int[1];
        for (long index = 0; index < 2; index++) {
            d.llr(-300, 200, index, one, 0);
            assertEquals(one[0], d.trace(-300, 200, index).bits().get(0).llr(), "index " + index);
        }
        assertNotEquals(d.trace(-300, 200, 0).bits().get(0).llr(), d.trace(-300, 200, 1).bits().get(0).llr());
    }
}
