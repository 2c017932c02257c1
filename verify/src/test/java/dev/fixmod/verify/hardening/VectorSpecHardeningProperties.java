package dev.fixmod.verify.hardening;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Assume;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.lifecycle.AfterContainer;

/**
 * {@code fixmod vectors generate SPEC -o DIR}: damaged specifications must be rejected before anything is written:
 * the output folder does not exist afterwards and nothing else in the sandbox changed.
 */
class VectorSpecHardeningProperties {

    /** A small valid specification (checked by {@link #theTemplateIsValid}); every leaf is a target. */
    static final String SPEC = "{\"name\": \"pam4-set\", \"constellation\": \"pam4\","
            + " \"mapper\": {\"format\": \"Q2.9\", \"rounding\": \"half-even\"},"
            + " \"demapper\": {\"input\": {\"format\": \"Q3.8\"}, \"algorithm\": \"folded-linear\","
            + " \"scaling\": \"unscaled\", \"llr\": {\"format\": \"Q3.2\", \"overflow\": \"symmetric-saturate\"}},"
            + " \"noise\": {\"es-n0-db\": [10], \"seed\": 4}, \"count\": 16, \"formats\": [\"hex\", \"csv\"]}";

    /** Each leaf as the text before its value and the value. */
    static final List<String[]> LEAVES = List.of(
            new String[] {"\"name\": ", "\"pam4-set\""}, new String[] {"\"constellation\": ", "\"pam4\""},
            new String[] {"{\"format\": ", "\"Q2.9\""}, new String[] {"\"rounding\": ", "\"half-even\""},
            new String[] {"\"input\": {\"format\": ", "\"Q3.8\""},
            new String[] {"\"algorithm\": ", "\"folded-linear\""}, new String[] {"\"scaling\": ", "\"unscaled\""},
            new String[] {"\"llr\": {\"format\": ", "\"Q3.2\""},
            new String[] {"\"overflow\": ", "\"symmetric-saturate\""}, new String[] {"\"es-n0-db\": [", "10"},
            new String[] {"\"seed\": ", "4"}, new String[] {"\"count\": ", "16"},
            new String[] {"\"formats\": [", "\"hex\""});

    /** Values no leaf of the specification accepts: non-finite, out of every range, wrong kinds, escapes, nesting. */
    static final List<String> HOSTILE = List.of("NaN", "Infinity", "-Infinity", "1e400", "-1e400",
            "9223372036854775808", "99999999999999999999", "-99999999999999999999", "-1", "1.5", "null", "true", "[]",
            "{}", "\"\"", "\"../../escape\"", "\"/tmp/fixmod-escape\"", "\"Q99.99\"", "\"Q40.40\"", "\"UQ-1.5\"",
            "\"half up\"", "\"NaN.0\"", Harness.nestedArrays(100_000), "{\"a\": " + Harness.nestedArrays(2_000) + "}",
            "\"" + "x".repeat(100_000) + "\"");

    @Property(tries = 1)
    void theTemplateIsValid() {
        Path sandbox = Harness.sandbox();
        try {
            Path spec = Harness.write(sandbox.resolve("in/spec.json"), SPEC);
            Harness.Outcome o = Harness.run("vectors", "generate", spec.toString(), "-o",
                    sandbox.resolve("out/set").toString(), "--quiet");
            assertEquals(0, o.status(), o::describe);
        } finally {
            Harness.delete(sandbox);
        }
    }

    @Property(tries = 50)
    void randomBytesAreRejected(@ForAll("bytes") byte[] bytes) {
        check("vector-spec random bytes", bytes);
    }

    @Property(tries = 50)
    void truncationsAreRejected(@ForAll("cut") int cut) {
        check("vector-spec truncated", SPEC.substring(0, cut).getBytes(StandardCharsets.UTF_8));
    }

    @Property(tries = 100)
    void hostileValuesAreRejected(@ForAll("leaf") int leaf, @ForAll("hostile") String token) {
        String[] l = LEAVES.get(leaf);
        // -1 dB and 1.5 dB are fine operating points; everywhere else these two are out of range or not integers
        Assume.that(!(l[0].contains("es-n0-db") && (token.equals("-1") || token.equals("1.5"))));
        // an empty constellation object means every default (qam16), a valid choice
        Assume.that(!(l[0].equals("\"constellation\": ") && token.equals("{}")));
        String text = SPEC.replace(l[0] + l[1], l[0] + token);
        check("vector-spec hostile values", text.getBytes(StandardCharsets.UTF_8));
    }

    @Property(tries = 30)
    void duplicateKeysAreRejected(@ForAll("leaf") int leaf) {
        String[] l = LEAVES.get(leaf);
        String text;
        if (l[0].endsWith("[")) { // an array element: give the whole array twice
            int from = SPEC.indexOf(l[0]);
            String whole = SPEC.substring(from, SPEC.indexOf(']', from) + 1);
            text = SPEC.replace(whole, whole + ", " + whole);
        } else {
            String key = l[0].substring(l[0].lastIndexOf('"', l[0].lastIndexOf('"') - 1));
            text = SPEC.replace(l[0] + l[1], l[0] + l[1] + ", " + key + l[1]);
        }
        check("vector-spec duplicate keys", text.getBytes(StandardCharsets.UTF_8));
    }

    @Property(tries = 10)
    void deepNestingIsRejected(@ForAll("depth") int depth) {
        check("vector-spec deep nesting", ("{\"constellation\": \"pam4\", \"description\": "
                + Harness.nestedArrays(depth) + "}").getBytes(StandardCharsets.UTF_8));
    }

    private static void check(String property, byte[] spec) {
        Path sandbox = Harness.sandbox();
        try {
            Path file = Harness.write(sandbox.resolve("in/spec.json"), spec);
            Path out = sandbox.resolve("out/set");
            Map<String, String> before = Harness.snapshot(sandbox);
            Harness.Outcome o = Harness.run("vectors", "generate", file.toString(), "-o", out.toString(), "--quiet");
            Harness.tally(property).count(o);
            Harness.assertRejected(o);
            assertFalse(Files.exists(out), "the output folder exists after a failure");
            assertEquals(before, Harness.snapshot(sandbox), "the sandbox changed");
            assertFalse(Files.exists(Path.of("/tmp/fixmod-escape")), "a write outside the sandbox");
        } finally {
            Harness.delete(sandbox);
        }
    }

    @AfterContainer
    static void summary() {
        Harness.printSummaries("vector-spec");
    }

    @Provide
    Arbitrary<byte[]> bytes() {
        return Arbitraries.bytes().array(byte[].class).ofMaxSize(600);
    }

    @Provide
    Arbitrary<Integer> cut() {
        return Arbitraries.integers().between(0, SPEC.lastIndexOf('}') - 1);
    }

    @Provide
    Arbitrary<Integer> leaf() {
        return Arbitraries.integers().between(0, LEAVES.size() - 1);
    }

    @Provide
    Arbitrary<String> hostile() {
        return Arbitraries.of(HOSTILE);
    }

    @Provide
    Arbitrary<Integer> depth() {
        return Arbitraries.of(1_001, 5_000, 100_000);
    }
}
