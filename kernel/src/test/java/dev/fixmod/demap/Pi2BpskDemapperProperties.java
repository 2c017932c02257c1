package dev.fixmod.demap;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.constellation.Catalogue;
import dev.fixmod.constellation.Constellation;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import dev.fixmod.map.ConstellationRom;
import java.util.Random;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.LongRange;

/** The laws of the stream-indexed LLR methods, π/2-BPSK above all. */
class Pi2BpskDemapperProperties {

    @Provide
    Arbitrary<Constellation> constellations() {
        return Arbitraries.of("nr:pi2bpsk", "pi2bpsk", "qpsk", "qam16", "psk8", "nr:qam64").map(Catalogue::resolve);
    }

    @Provide
    Arbitrary<Constellation> turned() {
        return Arbitraries.of("nr:pi2bpsk", "pi2bpsk").map(Catalogue::resolve);
    }

    @Property(tries = 200)
    void aBatchFromAnyFirstSymbolEqualsSingleSamplesWithTheirOwnParity(
            @ForAll("constellations") Constellation c, @ForAll @LongRange(min = 0, max = 1L << 50) long firstSymbol,
            @ForAll @IntRange(min = 0, max = 3) int offset, @ForAll @IntRange(min = 0, max = 12) int count,
            @ForAll @DoubleRange(min = 0.05, max = 5) double n0, @ForAll long seed) {
        // Common practice, no source: a batch is the concatenation of its samples, sample n having index first + n.
        Random random = new Random(seed);
        int k = c.bitsPerSymbol();
        double[] re = new double[offset + count];
        double[] im = new double[offset + count];
        for (int n = 0; n < re.length; n++) {
            re[n] = 2.5 * (2 * random.nextDouble() - 1);
            im[n] = 2.5 * (2 * random.nextDouble() - 1);
        }
        LlrOptions o = new LlrOptions(n0, LlrSign.ZERO_POSITIVE, false);
        for (SoftAlgorithm a : new SoftAlgorithm[] {SoftAlgorithm.LOG_MAP, SoftAlgorithm.MAX_LOG}) {
            SoftDemapper d = SoftDemapper.create(a, c, o);
            double[] batch = new double[2 + count * k];
            d.llr(re, im, offset, count, firstSymbol, batch, 2);
            double[] single = new double[k];
            for (int n = 0; n < count; n++) {
                d.llr(re[offset + n], im[offset + n], firstSymbol + n, single, 0);
                for (int b = 0; b < k; b++) {
                    assertEquals(single[b], batch[2 + n * k + b], 0.0, a + " " + c.name() + " sample " + n);
                }
            }
            if (!c.alternatesQuarterTurn()) {
                double[] plain = new double[2 + count * k];
                d.llr(re, im, offset, count, plain, 2);
                assertArrayEquals(plain, batch, 0.0, "the index is irrelevant for " + c.name());
            }
        }
        ConstellationRom rom = ConstellationRom.of(c, new Quantizer(QFormat.parse("Q2.9"), Rounding.HALF_EVEN,
                Overflow.SATURATE));
        FixedSoftDemapper fixed = FixedSoftDemapper.create(SoftAlgorithm.MAX_LOG, rom, o,
                FixedLlrSpec.suggested(SoftAlgorithm.MAX_LOG, rom, o, QFormat.parse("Q5.1")));
        int[] ci = new int[re.length];
        int[] cq = new int[re.length];
        for (int n = 0; n < re.length; n++) {
            ci[n] = (int) Math.round(StrictMath.scalb(re[n], 9));
            cq[n] = (int) Math.round(StrictMath.scalb(im[n], 9));
        }
        int[] batch = new int[count * k];
        fixed.llr(ci, cq, offset, count, firstSymbol, batch, 0);
        long events = fixed.counters().stream().mapToLong(OverflowCounter::events).sum();
        fixed.resetCounters();
        int[] single = new int[k];
        for (int n = 0; n < count; n++) {
            fixed.llr(ci[offset + n], cq[offset + n], firstSymbol + n, single, 0);
            for (int b = 0; b < k; b++) {
                assertEquals(single[b], batch[n * k + b], "fixed " + c.name() + " sample " + n);
            }
        }
        assertEquals(events, fixed.counters().stream().mapToLong(OverflowCounter::events).sum(), "same events");
    }

    @Property(tries = 200)
    void anOddSymbolIsTheEvenSymbolOfTheSampleTurnedBack(
            @ForAll("turned") Constellation c, @ForAll @DoubleRange(min = -3, max = 3) double i,
            @ForAll @DoubleRange(min = -3, max = 3) double q, @ForAll @DoubleRange(min = 0.05, max = 5) double n0,
            @ForAll @IntRange(min = -100, max = 100) int ci, @ForAll @IntRange(min = -100, max = 100) int cq) {
        // The turned points are the even points times j, and |y − j·s| = |(−j)·y − s|: turning the sample by −90°,
        // (I, Q) → (Q, −I), gives the even symbol's LLR, bit for bit (the same squares, summed in the other order).
        LlrOptions o = new LlrOptions(n0, LlrSign.ZERO_POSITIVE, false);
        double[] odd = new double[1];
        double[] even = new double[1];
        for (SoftAlgorithm a : new SoftAlgorithm[] {SoftAlgorithm.LOG_MAP, SoftAlgorithm.MAX_LOG}) {
            SoftDemapper d = SoftDemapper.create(a, c, o);
            d.llr(i, q, 1, odd, 0);
            d.llr(q, -i, 0, even, 0);
            assertEquals(even[0], odd[0], 0.0, a.tradeName());
        }
        // In integers too, as long as the turned ROM is exact (no saturated negation: Q2.9 keeps ±1 far inside).
        ConstellationRom rom = ConstellationRom.of(c, new Quantizer(QFormat.parse("Q2.9"), Rounding.HALF_EVEN,
                Overflow.SATURATE));
        FixedSoftDemapper fixed = FixedSoftDemapper.create(SoftAlgorithm.MAX_LOG, rom, o,
                FixedLlrSpec.suggested(SoftAlgorithm.MAX_LOG, rom, o, QFormat.parse("Q6.2")));
        int[] a = new int[1];
        int[] b = new int[1];
        fixed.llr(ci * 13, cq * 17, 1, a, 0);
        fixed.llr(cq * 17, -ci * 13, 0, b, 0);
        assertEquals(b[0], a[0]);
    }

    @Property(tries = 300)
    void withoutOverflowTheFixedLlrIsWithinTheFormatsBoundOfTheFloatLlr(
            @ForAll("turned") Constellation c, @ForAll @IntRange(min = 0, max = 2) int integerBits,
            @ForAll @IntRange(min = 3, max = 12) int fractionalBits, @ForAll Rounding rounding,
            @ForAll @DoubleRange(min = -1, max = 1) double u, @ForAll @DoubleRange(min = -1, max = 1) double v,
            @ForAll @LongRange(min = 0, max = 1000) long index, @ForAll @DoubleRange(min = -3, max = 15) double esN0Db,
            @ForAll boolean scaled, @ForAll @IntRange(min = 0, max = 8) int dropped) {
        // The bound of FixedLlrProperties (derived there from the formats: each error source at most one LSB of its
        // format), applied to π/2-BPSK symbols of either parity against the float max-log (= log-MAP here).
        ConstellationRom rom = ConstellationRom.of(c, new Quantizer(QFormat.signed(integerBits, fractionalBits),
                rounding, Overflow.SATURATE));
        LlrOptions o = LlrOptions.fromEsN0Db(c, esN0Db, LlrSign.ZERO_POSITIVE, false);
        FixedLlrSpec base = FixedLlrSpec.suggested(SoftAlgorithm.MAX_LOG, rom, o, QFormat.signed(9, 2));
        QFormat m = base.metric().format();
        Quantizer metric = new Quantizer(QFormat.signed(m.integerBits(), Math.max(0, m.fractionalBits() - dropped)),
                rounding, Overflow.SATURATE);
        Quantizer output = new Quantizer(QFormat.signed(9, 2), rounding, Overflow.SATURATE);
        FixedLlrSpec spec = scaled
                ? new FixedLlrSpec(rounding, metric, LlrScaling.NOISE_SCALED, base.scaleConstant(),
                        new Quantizer(QFormat.signed(12, 8), rounding, Overflow.SATURATE), output)
                : FixedLlrSpec.unscaled(rounding, metric, output);
        FixedSoftDemapper fixed = FixedSoftDemapper.create(SoftAlgorithm.MAX_LOG, rom, o, spec);
        SoftDemapper reference = new LogMapDemapper(c, o);
        QFormat in = rom.format();
        int iCode = (int) Math.max(in.minCode(), Math.min(in.maxCode(), Math.round(u * in.maxCode())));
        int qCode = (int) Math.max(in.minCode(), Math.min(in.maxCode(), Math.round(v * in.maxCode())));
        int[] got = new int[1];
        fixed.llr(iCode, qCode, index, got, 0);
        if (fixed.counters().stream().anyMatch(counter -> counter.events() > 0)) {
            return; // the bound holds only where nothing saturated
        }
        double yI = in.toDouble(iCode);
        double yQ = in.toDouble(qCode);
        double[] want = new double[1];
        reference.llr(yI, yQ, index, want, 0);
        double delta = rom.maxErrorLsb() * in.lsb();
        double peak = DemapFixtures.peak(c);
        double metricTrue = want[0] / fixed.idealScaleConstant();
        double metricError = 2 * delta * (2 * Math.abs(yI) + 2 * Math.abs(yQ) + 4 * peak + 2 * delta)
                + metric.format().lsb();
        double gotValue = output.format().toDouble(got[0]);
        double wantValue = scaled ? want[0] : metricTrue;
        double bound = scaled
                ? fixed.scaleConstant() * metricError + Math.abs(metricTrue) * spec.scaleConstant().lsb()
                        + spec.scale().format().lsb() + output.format().lsb()
                : metricError + output.format().lsb();
        assertTrue(Math.abs(gotValue - wantValue) <= bound * (1 + 1e-9) + 1e-9 * (1 + Math.abs(wantValue)),
                c.name() + " index " + index + " y=(" + iCode + ", " + qCode + "): fixed " + gotValue + ", float "
                        + wantValue + ", bound " + bound + " (" + spec + ")");
    }
}
