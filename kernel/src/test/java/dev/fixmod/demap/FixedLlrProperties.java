package dev.fixmod.demap;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import dev.fixmod.map.ConstellationRom;
import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;

/** The laws of the fixed-point LLR datapaths: bit-exactness between them, error bounds from the formats, symmetry. */
class FixedLlrProperties {

    /** A constellation on an input grid fine enough to keep its coordinates apart. */
    record Setup(Constellation constellation, ConstellationRom rom) {
        QFormat input() {
            return rom.format();
        }

        @Override
        public String toString() {
            return constellation.name() + " in " + rom.quantizer();
        }
    }

    private static Arbitrary<Setup> setups(List<Constellation> from, Arbitrary<Rounding> roundings,
                                           Arbitrary<Overflow> overflows) {
        return Combinators.combine(Arbitraries.of(from), Arbitraries.integers().between(0, 1),
                Arbitraries.integers().between(1, 6), roundings, overflows).as((c, intExtra, fracExtra, r, o) -> {
                    int integer = bitsFor(1.5 * DemapFixtures.peak(c)) + intExtra;
                    int frac = Math.max(0, bitsFor(2 / DemapFixtures.finestSpacing(c))) + fracExtra;
                    frac = Math.min(frac, 29 - integer);
                    return new Setup(c, ConstellationRom.of(c, new Quantizer(QFormat.signed(integer, frac), r, o)));
                });
    }

    /** The bits of the integer part of {@code x > 0} (at least 0). */
    private static int bitsFor(double x) {
        return Math.max(0, 64 - Long.numberOfLeadingZeros((long) Math.floor(x)));
    }

    @Provide
    Arbitrary<Setup> separableSetups() {
        return setups(DemapFixtures.SEPARABLE, Arbitraries.of(Rounding.class), Arbitraries.just(Overflow.SATURATE));
    }

    @Provide
    Arbitrary<Setup> anySetups() {
        return setups(DemapFixtures.ALL, Arbitraries.of(Rounding.class), Arbitraries.just(Overflow.SATURATE));
    }

    @Provide
    Arbitrary<Setup> symmetricSetups() {
        return setups(DemapFixtures.ALL, Arbitraries.of(Rounding.HALF_EVEN, Rounding.HALF_AWAY, Rounding.TOWARD_ZERO),
                Arbitraries.just(Overflow.SYMMETRIC_SATURATE));
    }

    @Provide
    Arbitrary<Setup> graySetups() {
        return setups(DemapFixtures.GRAY_SEPARABLE, Arbitraries.of(Rounding.class),
                Arbitraries.just(Overflow.SATURATE));
    }

    /** Any stages, narrow ones included (so that every stage overflows now and then), any rounding and overflow. */
    private static FixedLlrSpec anySpec(Setup s, double k, int seed) {
        java.util.Random r = new java.util.Random(seed);
        Rounding[] rounding = Rounding.values();
        Overflow[] overflow = Overflow.values();
        int exactFrac = 2 * s.input().fractionalBits();
        int metricWord = 8 + r.nextInt(25);
        Quantizer metric = new Quantizer(QFormat.signedWord(metricWord, r.nextInt(Math.min(exactFrac, metricWord - 1) + 1)),
                rounding[r.nextInt(rounding.length)], overflow[r.nextInt(overflow.length)]);
        Quantizer output = new Quantizer(QFormat.signedWord(4 + r.nextInt(5), r.nextInt(4)),
                rounding[r.nextInt(rounding.length)], overflow[r.nextInt(overflow.length)]);
        Rounding constants = rounding[r.nextInt(rounding.length)];
        if (r.nextInt(5) == 0) {
            return FixedLlrSpec.unscaled(constants, metric, output);
        }
        int kInteger = bitsFor(k);
        QFormat kFormat = QFormat.unsigned(kInteger, Math.max(0, 6 + r.nextInt(11) - kInteger));
        int scaleWord = 8 + r.nextInt(17);
        Quantizer scale = new Quantizer(QFormat.signedWord(scaleWord, r.nextInt(Math.min(9, scaleWord))),
                rounding[r.nextInt(rounding.length)], overflow[r.nextInt(overflow.length)]);
        return new FixedLlrSpec(constants, metric, LlrScaling.NOISE_SCALED, kFormat, scale, output);
    }

    /** A code spread over the whole input range, extremes included. */
    private static int code(QFormat f, double u) {
        return (int) Math.max(f.minCode(), Math.min(f.maxCode(), Math.round(u * f.maxCode())));
    }

    @Property(tries = 200)
    void perAxisIsBitExactWithTheExhaustiveReference(@ForAll("separableSetups") Setup s,
                                                    @ForAll @DoubleRange(min = -1, max = 1) double u,
                                                    @ForAll @DoubleRange(min = -1, max = 1) double v,
                                                    @ForAll @DoubleRange(min = 0.05, max = 20) double n0,
                                                    @ForAll boolean onePositive, @ForAll int seed) {
        // Separability in integers: (yI − cI)² + (yQ − cQ)², the Q term common to both halves, cancels exactly.
        LlrOptions o = new LlrOptions(n0, onePositive ? LlrSign.ONE_POSITIVE : LlrSign.ZERO_POSITIVE, true);
        FixedLlrSpec spec = anySpec(s, 1 / n0, seed);
        FixedSoftDemapper perAxis = new FixedPerAxisMaxLogDemapper(s.rom(), o, spec);
        FixedSoftDemapper exhaustive = new FixedMaxLogDemapper(s.rom(), o, spec);
        int k = perAxis.bitsPerSymbol();
        int[] i = {code(s.input(), u), code(s.input(), v), s.rom().iCode(0), s.rom().iCode(0) + 1, 0};
        int[] q = {code(s.input(), v), code(s.input(), -u), s.rom().qCode(1), s.rom().qCode(0), 0};
        i[3] = Math.min(i[3], (int) s.input().maxCode());
        int[] a = new int[i.length * k];
        int[] e = new int[i.length * k];
        perAxis.llr(i, q, 0, i.length, a, 0);
        exhaustive.llr(i, q, 0, i.length, e, 0);
        assertArrayEquals(e, a, s + " " + spec);
        for (int stage = 0; stage < 3; stage++) {
            assertEquals(exhaustive.counters().get(stage).events(), perAxis.counters().get(stage).events(),
                    perAxis.counters().get(stage).stage());
        }
    }

    @Property(tries = 300)
    void withoutOverflowTheFixedLlrIsWithinTheFormatsBoundOfTheFloatLlr(
            @ForAll("anySetups") Setup s, @ForAll @DoubleRange(min = -1, max = 1) double u,
            @ForAll @DoubleRange(min = -1, max = 1) double v, @ForAll @DoubleRange(min = -3, max = 15) double esN0Db,
            @ForAll("algorithms") SoftAlgorithm algorithm, @ForAll boolean scaled,
            @ForAll @IntRange(min = 0, max = 8) int dropped, @ForAll Rounding rounding) {
        Constellation c = s.constellation();
        if (algorithm != SoftAlgorithm.MAX_LOG && !c.isSeparable()) {
            return;
        }
        LlrOptions o = LlrOptions.fromEsN0Db(c, esN0Db, LlrSign.ZERO_POSITIVE, true);
        FixedLlrSpec base;
        try {
            base = FixedLlrSpec.suggested(algorithm, s.rom(), o, QFormat.signed(9, 2));
        } catch (IllegalArgumentException notGray) {
            return; // folded-linear on a non-Gray labeling
        }
        // Wide stages with any rounding, fewer metric fractional bits than lossless, a wide output.
        QFormat m = base.metric().format();
        Quantizer metric = new Quantizer(QFormat.signed(m.integerBits(), Math.max(0, m.fractionalBits() - dropped)),
                rounding, Overflow.SATURATE);
        Quantizer output = new Quantizer(QFormat.signed(9, 2), rounding, Overflow.SATURATE);
        FixedLlrSpec spec = scaled
                ? new FixedLlrSpec(rounding, metric, LlrScaling.NOISE_SCALED, QFormat.unsigned(
                        base.scaleConstant().integerBits(), base.scaleConstant().fractionalBits()),
                        new Quantizer(QFormat.signed(12, 8), rounding, Overflow.SATURATE), output)
                : FixedLlrSpec.unscaled(rounding, metric, output);
        FixedSoftDemapper fixed = FixedSoftDemapper.create(algorithm, s.rom(), o, spec);
        SoftDemapper reference = SoftDemapper.create(algorithm, c, o);
        QFormat in = s.input();
        int iCode = code(in, u);
        int qCode = c.isSeparable() && c.axes().isOneDimensional() ? 0 : code(in, v);
        int k = c.bitsPerSymbol();
        int[] got = new int[k];
        fixed.llr(iCode, qCode, got, 0);
        for (OverflowCounter counter : fixed.counters()) {
            if (counter.events() > 0) {
                return; // the bound holds only where nothing saturated
            }
        }
        double yI = in.toDouble(iCode);
        double yQ = in.toDouble(qCode);
        double[] want = new double[k];
        reference.llr(yI, yQ, want, 0);
        // Error sources, each at most one LSB of its format (half for rounding to nearest; one covers every mode):
        // the reference points (δ, the ROM's worst error), the metric stage, K, the scale and output stages.
        double delta = s.rom().maxErrorLsb() * in.lsb();
        double peak = DemapFixtures.peak(c);
        double lsbM = metric.format().lsb();
        double kq = fixed.scaleConstant();
        double lsbK = scaled ? spec.scaleConstant().lsb() : 0;
        for (int b = 0; b < k; b++) {
            double metricTrue = want[b] / fixed.idealScaleConstant(); // the metric the float datapath implies
            double metricError;
            if (algorithm == SoftAlgorithm.FOLDED_LINEAR) {
                // each fold is 1-Lipschitz: input rounding plus one quantized fold constant per fold
                metricError = (c.bitsPerSymbol() + 1) * lsbM;
            } else {
                // |(y − c)² − (y − l)²| ≤ δ(2|y| + 2|l| + δ) per axis, for each of the two minimum distances
                metricError = 2 * delta * (2 * Math.abs(yI) + 2 * Math.abs(yQ) + 4 * peak + 2 * delta) + lsbM;
            }
            double gotValue = output.format().toDouble(got[b]);
            double wantValue;
            double bound;
            if (scaled) {
                // L_fixed − L = (D_m − D)·K_q + D·(K_q − K), then the scale and output roundings
                wantValue = want[b];
                bound = kq * metricError + Math.abs(metricTrue) * lsbK + spec.scale().format().lsb()
                        + output.format().lsb();
            } else {
                wantValue = metricTrue;
                bound = metricError + output.format().lsb();
            }
            assertTrue(Math.abs(gotValue - wantValue) <= bound * (1 + 1e-9) + 1e-9 * (1 + Math.abs(wantValue)),
                    algorithm + " " + s + " y=(" + iCode + ", " + qCode + ") bit " + b + ": fixed " + gotValue
                            + ", float " + wantValue + ", bound " + bound + " (" + spec + ")");
        }
    }

    @Property(tries = 200)
    void symmetricRoundingKeepsTheMirrorSymmetryAndTheSignSwitchExact(
            @ForAll("symmetricSetups") Setup s, @ForAll @DoubleRange(min = -1, max = 1) double u,
            @ForAll @DoubleRange(min = -1, max = 1) double v, @ForAll @DoubleRange(min = 0.05, max = 20) double n0,
            @ForAll("algorithms") SoftAlgorithm algorithm,
            @ForAll("symmetricRounding") Rounding rounding, @ForAll @IntRange(min = 4, max = 8) int outputBits) {
        // Mirror symmetry as in SoftDemapperProperties; in fixed point it survives exactly when the reference points
        // are symmetric and every stage rounds and saturates symmetrically (common practice, no source).
        Constellation c = s.constellation();
        int mask = DemapFixtures.mirrorMask(c);
        if (mask < 0 || (algorithm != SoftAlgorithm.MAX_LOG && !c.isSeparable())) {
            return;
        }
        LlrOptions zero = new LlrOptions(n0, LlrSign.ZERO_POSITIVE, true);
        LlrOptions one = new LlrOptions(n0, LlrSign.ONE_POSITIVE, true);
        FixedLlrSpec suggested;
        try {
            suggested = FixedLlrSpec.suggested(algorithm, s.rom(), zero, QFormat.signedWord(outputBits, 1));
        } catch (IllegalArgumentException notApplicable) {
            return;
        }
        Overflow sym = Overflow.SYMMETRIC_SATURATE;
        QFormat m = suggested.metric().format();
        // A narrower metric than suggested, so that symmetric saturation acts now and then (folds keep their range).
        int narrower = algorithm == SoftAlgorithm.FOLDED_LINEAR ? 0 : 3;
        FixedLlrSpec spec = new FixedLlrSpec(rounding,
                new Quantizer(QFormat.signed(Math.max(0, m.integerBits() - narrower), m.fractionalBits() / 2),
                        rounding, sym),
                LlrScaling.NOISE_SCALED, suggested.scaleConstant(),
                new Quantizer(suggested.scale().format(), rounding, sym),
                new Quantizer(suggested.output().format(), rounding, sym));
        FixedSoftDemapper plus = FixedSoftDemapper.create(algorithm, s.rom(), zero, spec);
        FixedSoftDemapper minus = FixedSoftDemapper.create(algorithm, s.rom(), one, spec);
        QFormat in = s.input();
        int i = (int) Math.round(u * in.maxCode());
        int q = (int) Math.round(v * in.maxCode());
        int k = c.bitsPerSymbol();
        int[] at = new int[k];
        int[] mirrored = new int[k];
        int[] flipped = new int[k];
        plus.llr(i, q, at, 0);
        plus.llr(-i, q, mirrored, 0);
        minus.llr(i, q, flipped, 0);
        for (int b = 0; b < k; b++) {
            int parity = ((mask >>> (k - 1 - b)) & 1) == 1 ? -1 : 1;
            assertEquals(parity * at[b], mirrored[b], algorithm + " " + s + " mirrored bit " + b + " " + spec);
            assertEquals(-at[b], flipped[b], algorithm + " " + s + " one-positive bit " + b);
        }
    }

    @Provide
    Arbitrary<Rounding> symmetricRounding() {
        return Arbitraries.of(Rounding.HALF_EVEN, Rounding.HALF_AWAY, Rounding.TOWARD_ZERO);
    }

    @Property(tries = 300)
    void theHardDecisionIsTheSignOfTheMaxLogLlrAwayFromTies(@ForAll("anySetups") Setup s,
                                                           @ForAll @DoubleRange(min = -1, max = 1) double u,
                                                           @ForAll @DoubleRange(min = -1, max = 1) double v,
                                                           @ForAll @DoubleRange(min = 0.05, max = 20) double n0) {
        // Max-log picks, per bit, the nearest point with each bit value: the sign says which half holds the nearest
        // point overall, i.e. the slicer's decision (common practice, no source). Float: the kernel's slicer for the
        // constellation; fixed: the minimum-distance decision against the same ROM (per-axis thresholds for a
        // separable constellation, which the slicers' own tests prove equal to it).
        Constellation c = s.constellation();
        LlrOptions o = LlrOptions.of(n0);
        int k = c.bitsPerSymbol();
        double re = u * (1.5 * DemapFixtures.peak(c) + 0.5);
        double im = c.isSeparable() && c.axes().isOneDimensional() ? 0 : v * (1.5 * DemapFixtures.peak(c) + 0.5);
        double[] l = new double[k];
        new MaxLogDemapper(c, o).llr(re, im, l, 0);
        int label = Slicers.floatFor(c).slice(re, im, 0);
        for (int b = 0; b < k; b++) {
            if (Math.abs(l[b]) > 1e-9 * (1 + (re * re + im * im) / n0)) {
                assertEquals(l[b] > 0 ? 0 : 1, (label >>> (k - 1 - b)) & 1, "float " + c.name() + " bit " + b);
            }
        }
        FixedSlicer slicer = c.isSeparable() ? Slicers.fixedFor(s.rom()) : new FixedNearestSlicer(s.rom());
        int i = code(s.input(), u);
        int q = c.isSeparable() && c.axes().isOneDimensional() ? 0 : code(s.input(), v);
        int fixedLabel = slicer.slice(i, q, 0);
        FixedLlrSpec spec = FixedLlrSpec.suggested(SoftAlgorithm.MAX_LOG, s.rom(), o, QFormat.signed(5, 0));
        int[] codes = new int[k];
        new FixedMaxLogDemapper(s.rom(), o, spec).llr(i, q, codes, 0);
        for (int b = 0; b < k; b++) {
            if (codes[b] != 0) {
                assertEquals(codes[b] > 0 ? 0 : 1, (fixedLabel >>> (k - 1 - b)) & 1, "fixed " + s + " bit " + b);
            }
        }
    }

    @Property(tries = 200)
    void theTraceRetracesTheBatchPathAndLeavesTheCountersAlone(@ForAll("anySetups") Setup s,
                                                               @ForAll @DoubleRange(min = -1, max = 1) double u,
                                                               @ForAll @DoubleRange(min = -1, max = 1) double v,
                                                               @ForAll @DoubleRange(min = 0.05, max = 20) double n0,
                                                               @ForAll("algorithms") SoftAlgorithm algorithm,
                                                               @ForAll int seed) {
        Constellation c = s.constellation();
        LlrOptions o = LlrOptions.of(n0);
        FixedSoftDemapper d;
        try {
            d = FixedSoftDemapper.create(algorithm, s.rom(), o, anySpec(s, FixedLevels.scaleValue(algorithm, c, o),
                    seed));
        } catch (IllegalArgumentException notApplicable) {
            return; // not separable, not Gray, or a fold constant beyond a narrow metric format
        }
        int k = c.bitsPerSymbol();
        int[] i = {code(s.input(), u), code(s.input(), -v)};
        int[] q = {code(s.input(), v), code(s.input(), u)};
        int[] batch = new int[2 * k];
        d.llr(i, q, 0, 2, batch, 0);
        long[] events = d.counters().stream().mapToLong(OverflowCounter::events).toArray();
        for (int n = 0; n < 2; n++) {
            FixedLlrTrace trace = d.trace(i[n], q[n]);
            int[] single = new int[k];
            d.llr(i[n], q[n], single, 0);
            for (int b = 0; b < k; b++) {
                assertEquals(batch[n * k + b], trace.bits().get(b).llr(), "trace of bit " + b);
                assertEquals(batch[n * k + b], trace.bits().get(b).value("output").code(), "output value of bit " + b);
                assertEquals(batch[n * k + b], single[b], "single call, bit " + b);
            }
        }
        // The batch counted every event twice over (batch + single calls); the traces counted none.
        for (int stage = 0; stage < 3; stage++) {
            assertEquals(2 * events[stage], d.counters().get(stage).events(), d.counters().get(stage).stage());
        }
    }

    @Provide
    Arbitrary<SoftAlgorithm> algorithms() {
        return Arbitraries.of(SoftAlgorithm.MAX_LOG, SoftAlgorithm.MAX_LOG_PER_AXIS, SoftAlgorithm.FOLDED_LINEAR);
    }
}
