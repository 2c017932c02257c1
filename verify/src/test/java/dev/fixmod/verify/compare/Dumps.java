package dev.fixmod.verify.compare;

import dev.fixmod.verify.formats.FieldLayout;
import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/** Test helpers: invented golden words (a scenario of our own, not data from anywhere) and dumps made from them. */
final class Dumps {
    static final FieldLayout LLR2 = FieldLayout.parse("llr0:Q3.4,llr1:Q3.4");

    private Dumps() {
    }

    /** A word of {@link #LLR2} as fixed-width lower-case hex, as a {@code %h} dump writes it. */
    static String word(long w) {
        return String.format(Locale.ROOT, "%0" + LLR2.hexDigits() + "x", w & LLR2.wordMask());
    }

    /** Deterministic pseudo-random 16-bit words (an LCG; any varied sequence does). */
    static List<String> goldenLines(int n) {
        List<String> lines = new ArrayList<>();
        long x = 12345;
        for (int i = 0; i < n; i++) {
            x = x * 6364136223846793005L + 1442695040888963407L;
            lines.add(word(x >>> 48));
        }
        return lines;
    }

    static HexWordReader hex(List<String> lines, String name) {
        return hex(String.join("\n", lines) + "\n", name);
    }

    static HexWordReader hex(String text, String name) {
        return new HexWordReader(new ByteArrayInputStream(text.getBytes(StandardCharsets.US_ASCII)), name,
                LLR2.wordWidth());
    }

    static CompareReport compare(List<String> golden, List<String> dut, CompareOptions options) {
        return new Comparison(LLR2, options).run(hex(golden, "golden.hex"), VectorFlags.NONE, hex(dut, "dut.hex"),
                "llr");
    }

    static CompareOptions exact() {
        return CompareOptions.exact(LLR2.fieldCount());
    }
}
