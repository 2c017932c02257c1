package dev.fixmod.map;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.constellation.Catalogue;
import dev.fixmod.constellation.Constellation;
import dev.fixmod.fixed.FixedPoint;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import java.util.HashSet;
import java.util.Set;
import java.util.SplittableRandom;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.LongRange;

/** The laws of the mappers: the ROM is the quantized constellation, and batches do not depend on chunking. */
class MapperProperties {

    @Provide
    Arbitrary<String> names() {
        return Arbitraries.of("pam8", "qam16", "qam64", "qam1024", "rqam32", "cqam128", "psk8", "psk32", "pi2bpsk",
                "apsk32", "star8", "nr:pi2bpsk", "nr:qam256", "wlan:qam64", "bpsk");
    }

    /**
     * Every ROM code is {@code FixedPoint.quantize} of the scaled float point, and a ROM is refused exactly when the
     * class rule says so: a code more than one LSB from its point, or two labels sharing a code pair.
     */
    @Property(tries = 300)
    void romCodesAreTheQuantizedPointsOrTheRomIsRefusedForAReason(
            @ForAll("names") String name, @ForAll @IntRange(max = 3) int integerBits,
            @ForAll @IntRange(min = 1, max = 14) int fractionalBits, @ForAll Rounding rounding,
            @ForAll Overflow overflow, @ForAll @IntRange(min = 1, max = 40) int scaleTenths) {
        Constellation c = Catalogue.resolve(name);
        double scale = scaleTenths / 10.0;
        Quantizer quantizer = new Quantizer(QFormat.signed(integerBits, fractionalBits), rounding, overflow);
        QFormat f = quantizer.format();
        OverflowCounter counter = OverflowCounter.unnamed();
        long[] i = new long[c.size()];
        long[] q = new long[c.size()];
        boolean violates = false;
        Set<Long> pairs = new HashSet<>();
        for (int label = 0; label < c.size(); label++) {
            double x = scale * c.re(label);
            double y = scale * c.im(label);
            i[label] = FixedPoint.quantize(x, f, rounding, overflow, counter);
            q[label] = FixedPoint.quantize(y, f, rounding, overflow, counter);
            violates |= Math.abs(f.toDouble(i[label]) - x) > f.lsb() || Math.abs(f.toDouble(q[label]) - y) > f.lsb();
            violates |= !pairs.add(i[label] * (1L << 33) + q[label]);
            if (c.alternatesQuarterTurn()) {
                long turned = overflow.apply(-q[label], f, counter);
                violates |= Math.abs(f.toDouble(turned) + y) > f.lsb();
            }
        }
        ConstellationRom rom;
        try {
            rom = new ConstellationRom(c, scale, quantizer);
        } catch (IllegalArgumentException refused) {
            assertTrue(violates, "refused without reason: " + refused.getMessage());
            return;
        }
        assertTrue(!violates, "accepted a ROM that breaks the rule");
        assertEquals(counter.events(), rom.overflowCount());
        FixedMapper mapper = new FixedMapper(rom);
        int[] outI = new int[1];
        int[] outQ = new int[1];
        for (int label = 0; label < c.size(); label++) {
            mapper.mapLabels(new int[] {label}, 0, 1, 0, outI, outQ, 0);
            assertEquals(i[label], outI[0], name + " label " + label + " I");
            assertEquals(q[label], outQ[0], name + " label " + label + " Q");
            mapper.mapLabels(new int[] {label}, 0, 1, 1, outI, outQ, 0);
            long oddI = c.alternatesQuarterTurn() ? overflow.apply(-q[label], f, OverflowCounter.unnamed()) : i[label];
            long oddQ = c.alternatesQuarterTurn() ? i[label] : q[label];
            assertEquals(oddI, outI[0], name + " label " + label + " I of an odd symbol");
            assertEquals(oddQ, outQ[0], name + " label " + label + " Q of an odd symbol");
        }
    }

    /** Mapping a stream in chunks, each given the stream index of its first symbol, equals mapping it at once. */
    @Property(tries = 200)
    void chunksEqualTheWholeStream(@ForAll("names") String name, @ForAll @IntRange(min = 1, max = 60) int count,
                                   @ForAll @IntRange(max = 60) int cut, @ForAll @LongRange(max = 5) long first,
                                   @ForAll @IntRange(max = 1 << 20) int seed) {
        Constellation c = Catalogue.resolve(name);
        int k = c.bitsPerSymbol();
        int split = Math.min(cut, count);
        byte[] bits = new byte[count * k];
        SplittableRandom random = new SplittableRandom(seed);
        for (int n = 0; n < bits.length; n++) {
            bits[n] = (byte) random.nextInt(2);
        }
        FloatMapper floating = new FloatMapper(c);
        double[] re = new double[count];
        double[] im = new double[count];
        double[] chunkRe = new double[count];
        double[] chunkIm = new double[count];
        floating.mapBits(bits, 0, count, first, re, im, 0);
        floating.mapBits(bits, 0, split, first, chunkRe, chunkIm, 0);
        floating.mapBits(bits, split * k, count - split, first + split, chunkRe, chunkIm, split);
        assertArrayEquals(re, chunkRe);
        assertArrayEquals(im, chunkIm);
        FixedMapper fixed = new FixedMapper(ConstellationRom.of(c,
                new Quantizer(QFormat.parse("Q1.14"), Rounding.HALF_EVEN, Overflow.SATURATE)));
        int[] i = new int[count];
        int[] q = new int[count];
        int[] chunkI = new int[count];
        int[] chunkQ = new int[count];
        fixed.mapBits(bits, 0, count, first, i, q, 0);
        fixed.mapBits(bits, 0, split, first, chunkI, chunkQ, 0);
        fixed.mapBits(bits, split * k, count - split, first + split, chunkI, chunkQ, split);
        assertArrayEquals(i, chunkI);
        assertArrayEquals(q, chunkQ);
        // Bits and labels map alike (b0 = MSB of the label).
        int[] labels = new int[count];
        for (int n = 0; n < count; n++) {
            for (int j = 0; j < k; j++) {
                labels[n] = labels[n] << 1 | bits[n * k + j];
            }
        }
        fixed.mapLabels(labels, 0, count, first, chunkI, chunkQ, 0);
        assertArrayEquals(i, chunkI);
        assertArrayEquals(q, chunkQ);
    }
}
