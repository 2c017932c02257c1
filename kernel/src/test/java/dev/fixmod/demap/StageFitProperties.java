package dev.fixmod.demap;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.IntRange;

/** The precomputed stage fit of the LLR datapaths is FixedPoint.fit, result and overflow events alike. */
class StageFitProperties {

    @Property(tries = 2000)
    void equalsTheGenericFit(@ForAll("values") long value, @ForAll @IntRange(min = -8, max = 70) int fromFractionalBits,
                             @ForAll @IntRange(min = 0, max = 12) int integerBits,
                             @ForAll @IntRange(min = 0, max = 12) int fractionalBits, @ForAll boolean signed,
                             @ForAll Rounding rounding, @ForAll Overflow overflow) {
        QFormat format = signed ? QFormat.signed(integerBits, fractionalBits)
                : QFormat.unsigned(Math.max(1, integerBits), fractionalBits);
        Quantizer stage = new Quantizer(format, rounding, overflow);
        OverflowCounter fast = OverflowCounter.unnamed();
        OverflowCounter generic = OverflowCounter.unnamed();
        long expected = stage.fit(value, fromFractionalBits, generic);
        assertEquals(expected, new StageFit(stage, fromFractionalBits).fit(value, fast),
                () -> stage + " from " + fromFractionalBits + " fractional bits, value " + value);
        assertEquals(generic.events(), fast.events());
    }

    @Provide
    Arbitrary<Long> values() {
        // Ties and near-ties matter most: values with few low bits set, plus the extremes of a long.
        return Arbitraries.oneOf(Arbitraries.longs(),
                Arbitraries.longs().between(-1 << 20, 1 << 20),
                Arbitraries.longs().between(-64, 64).map(v -> v << 20),
                Arbitraries.of(Long.MIN_VALUE, Long.MAX_VALUE, Long.MIN_VALUE + 1, -1L, 0L, 1L));
    }
}
