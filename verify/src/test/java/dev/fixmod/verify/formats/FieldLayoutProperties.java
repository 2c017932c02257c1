package dev.fixmod.verify.formats;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.fixmod.fixed.QFormat;
import java.math.BigDecimal;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.LongRange;

class FieldLayoutProperties {

    @Provide
    Arbitrary<List<QFormat>> formats() {
        Arbitrary<QFormat> one = Combinators.combine(Arbitraries.of(true, false), Arbitraries.integers().between(1, 32))
                .as((signed, width) -> signed ? QFormat.signedWord(width, width / 2)
                        : QFormat.unsigned(width - width / 3, width / 3));
        return one.list().ofMinSize(1).ofMaxSize(5).filter(l -> l.stream().mapToInt(QFormat::wordLength).sum() <= 64);
    }

    /** Law: unpack(pack(codes)) = codes, for any layout of at most 64 bits and any in-range codes. */
    @Property(tries = 300)
    void packThenUnpackIsTheIdentity(@ForAll("formats") List<QFormat> formats, @ForAll long seed) {
        List<Field> fields = new ArrayList<>();
        for (int i = 0; i < formats.size(); i++) {
            fields.add(new Field("f" + i, formats.get(i)));
        }
        FieldLayout layout = FieldLayout.of(fields);
        java.util.SplittableRandom random = new java.util.SplittableRandom(seed);
        long[] codes = new long[fields.size()];
        for (int i = 0; i < codes.length; i++) {
            QFormat f = formats.get(i);
            codes[i] = f.minCode() + random.nextLong(f.maxCode() - f.minCode() + 1);
        }
        long word = layout.pack(codes, 0);
        for (int i = 0; i < codes.length; i++) {
            assertEquals(codes[i], layout.unpack(word, i), "field " + i);
        }
        if (layout.wordWidth() < 64) {
            assertEquals(0, word >>> layout.wordWidth(), "bits above the word");
        }
    }

    /**
     * Law: the CSV value column is the exact decimal of code·2^-n; oracle: JDK BigDecimal (reference library),
     * stripped of trailing zeros and printed without exponent.
     */
    @Property(tries = 500)
    void csvValuesAreExactDecimals(@ForAll @LongRange(min = -(1L << 32), max = (1L << 32) - 1) long code,
            @ForAll @IntRange(min = 0, max = 32) int n) throws Exception {
        java.io.ByteArrayOutputStream out = new java.io.ByteArrayOutputStream();
        try (ByteSink sink = new ByteSink(out)) {
            sink.fixed(code, n);
        }
        BigDecimal exact = new BigDecimal(BigInteger.valueOf(code)).divide(new BigDecimal(BigInteger.TWO.pow(n)));
        String expected = exact.signum() == 0 ? "0" : exact.stripTrailingZeros().toPlainString();
        assertEquals(expected, out.toString(java.nio.charset.StandardCharsets.US_ASCII));
    }
}
