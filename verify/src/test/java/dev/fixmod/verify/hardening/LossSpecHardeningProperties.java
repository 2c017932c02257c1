package dev.fixmod.verify.hardening;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.fasterxml.jackson.databind.util.RawValue;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Assume;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.lifecycle.AfterContainer;

/**
 * {@code fixmod loss SPEC -o DIR} and {@code fixmod loss merge PART... -o DIR}: damaged loss specifications, hostile
 * sweeps, absurd amounts of work and damaged partial results must be refused before anything runs or is written: one
 * line, exit status 2, the output absent afterwards and nothing else in the sandbox changed. A spec asking for hours
 * of simulation is refused at once (the harness's time limit would catch a run that started).
 */
class LossSpecHardeningProperties {

    /** A valid specification that runs in well under a second (checked by {@link #theTemplateIsValid}). */
    static final String SPEC = "{\"schema\": \"fixmod-loss\", \"version\": 1, \"name\": \"tiny\","
            + " \"constellation\": \"qam4\", \"mapper\": {\"format\": \"Q1.10\"},"
            + " \"demapper\": {\"input\": {\"format\": \"Q2.5\", \"overflow\": \"saturate\"}, \"back-off-db\": 3,"
            + " \"algorithm\": \"max-log\", \"llr\": {\"format\": \"Q3.0\"}, \"llr-scale\": 1,"
            + " \"rounding\": \"half-even\"},"
            + " \"noise\": {\"eb-n0-db\": [4, 8], \"code-rate\": 0.5, \"seed\": 7},"
            + " \"simulation\": {\"target-errors\": 10, \"min-bits\": 512, \"max-bits\": 1024, \"chunk-symbols\": 64},"
            + " \"targets\": {\"ber\": 0.01, \"gmi\": 1.5, \"loss-budget-db\": 0.5, \"operating-eb-n0-db\": 6},"
            + " \"sweep\": [{\"parameter\": \"llr-word-length\", \"values\": [3, 5]}]}";

    /** Each leaf as the text before its value and the value. */
    static final List<String[]> LEAVES = List.of(
            new String[] {"\"schema\": ", "\"fixmod-loss\""}, new String[] {"\"version\": ", "1"},
            new String[] {"\"name\": ", "\"tiny\""}, new String[] {"\"constellation\": ", "\"qam4\""},
            new String[] {"{\"format\": ", "\"Q1.10\""}, new String[] {"\"input\": {\"format\": ", "\"Q2.5\""},
            new String[] {"\"overflow\": ", "\"saturate\""}, new String[] {"\"back-off-db\": ", "3"},
            new String[] {"\"algorithm\": ", "\"max-log\""}, new String[] {"\"llr\": {\"format\": ", "\"Q3.0\""},
            new String[] {"\"llr-scale\": ", "1"}, new String[] {"\"rounding\": ", "\"half-even\""},
            new String[] {"\"eb-n0-db\": [", "4"}, new String[] {"\"code-rate\": ", "0.5"},
            new String[] {"\"seed\": ", "7"}, new String[] {"\"target-errors\": ", "10"},
            new String[] {"\"min-bits\": ", "512"}, new String[] {"\"max-bits\": ", "1024"},
            new String[] {"\"chunk-symbols\": ", "64"}, new String[] {"\"ber\": ", "0.01"},
            new String[] {"\"gmi\": ", "1.5"}, new String[] {"\"loss-budget-db\": ", "0.5"},
            new String[] {"\"operating-eb-n0-db\": ", "6"}, new String[] {"\"parameter\": ", "\"llr-word-length\""},
            new String[] {"\"values\": [", "3"});

    /** Values no leaf accepts: non-finite, beyond every range, wrong kinds, escapes, nesting, megabyte strings. */
    static final List<String> HOSTILE = List.of("NaN", "Infinity", "-Infinity", "1e400", "-1e400", "1e308", "-1e308",
            "9223372036854775808", "99999999999999999999", "-99999999999999999999", "null", "true", "[]", "{}",
            "\"\"", "\"../../escape\"", "\"/tmp/fixmod-escape\"", "\"Q99.99\"", "\"Q40.40\"", "\"UQ-1.5\"",
            "\"half up\"", Harness.nestedArrays(100_000), "{\"a\": " + Harness.nestedArrays(2_000) + "}",
            "\"" + "x".repeat(100_000) + "\"");

    /** Sweeps no parameter accepts, or more of them than a run may hold. */
    static final List<String> HOSTILE_SWEEPS = List.of("{}", "null", "\"llr-word-length\"", "[null]", "[[]]",
            "[{}]", "[{\"parameter\": \"llr-word-length\"}]", "[{\"values\": [3]}]",
            "[{\"parameter\": \"no-such-parameter\", \"values\": [3]}]",
            "[{\"parameter\": \"" + "x".repeat(100_000) + "\", \"values\": [3]}]",
            "[{\"parameter\": 7, \"values\": [3]}]", "[{\"parameter\": \"llr-word-length\", \"values\": []}]",
            "[{\"parameter\": \"llr-word-length\", \"values\": 3}]",
            "[{\"parameter\": \"llr-word-length\", \"values\": [3, 3]}]",
            "[{\"parameter\": \"llr-word-length\", \"values\": [3], \"x-extra\": 1}]",
            "[{\"parameter\": \"llr-word-length\", \"values\": " + range(1, 40) + "}]",
            "[" + String.join(", ", java.util.Collections.nCopies(9,
                    "{\"parameter\": \"llr-scale\", \"values\": [0.5]}")) + "]",
            "[{\"parameter\": \"rounding\", \"values\": [\"half up\"]}]",
            "[{\"parameter\": \"rounding\", \"values\": [1]}]",
            "[{\"parameter\": \"algorithm\", \"values\": [\"log-map\"]}]");

    /** Values a word-length or scale sweep must refuse. */
    static final List<String> HOSTILE_SWEEP_VALUES = List.of("0", "-1", "1", "1000", "2147483648", "1e308", "-1e308",
            "1e400", "2.5", "\"x\"", "null", "true", "[]", "{}", "64", "NaN");

    static final List<String> SWEPT = List.of("input-word-length", "input-fractional-bits", "llr-word-length",
            "llr-fractional-bits", "llr-scale", "back-off-db");

    /**
     * Simulations of hours or more: huge max-bits, whole-chunk rounding of a huge chunk over many points, or many
     * points times a moderate max-bits. Each must be refused at once.
     */
    static final List<String> ABSURD_WORK = List.of(
            "\"simulation\": {\"max-bits\": 1125899906842624, \"min-bits\": 1125899906842624}",
            "\"simulation\": {\"max-bits\": 10000000000}",
            "\"simulation\": {\"max-bits\": 1000000000000, \"target-errors\": 1}",
            "\"simulation\": {\"max-bits\": 100000000000000, \"min-bits\": 0, \"chunk-symbols\": 1048576}",
            "\"simulation\": {\"max-bits\": 1, \"min-bits\": 0, \"chunk-symbols\": 1048576},"
                    + " \"noise\": {\"eb-n0-db\": " + range(-20, 43) + "},"
                    + " \"sweep\": [{\"parameter\": \"llr-scale\", \"values\": " + scales(32, 0) + "},"
                    + " {\"parameter\": \"back-off-db\", \"values\": " + range(1, 32) + "},"
                    + " {\"parameter\": \"llr-scale\", \"values\": " + scales(32, 8) + "}]",
            "\"simulation\": {\"max-bits\": 10000000},"
                    + " \"noise\": {\"eb-n0-db\": " + range(-20, 43) + "},"
                    + " \"sweep\": [{\"parameter\": \"llr-scale\", \"values\": " + scales(32, 0) + "},"
                    + " {\"parameter\": \"back-off-db\", \"values\": " + range(1, 32) + "}]");

    @Property(tries = 1)
    void theTemplateIsValid() {
        Path sandbox = Harness.sandbox();
        try {
            Path spec = Harness.write(sandbox.resolve("in/spec.json"), SPEC);
            Path out = sandbox.resolve("out/report");
            Harness.Outcome o = Harness.run("loss", spec.toString(), "-o", out.toString(), "--quiet", "--threads",
                    "1");
            assertEquals(0, o.status(), o::describe);
            assertTrue(Files.exists(out.resolve("results.json")), o::describe);
        } finally {
            Harness.delete(sandbox);
        }
    }

    @Property(tries = 20)
    void randomBytesAreRejected(@ForAll("bytes") byte[] bytes) {
        check("loss-spec random bytes", bytes);
    }

    @Property(tries = 20)
    void truncationsAreRejected(@ForAll("cut") int cut) {
        check("loss-spec truncated", SPEC.substring(0, cut).getBytes(StandardCharsets.UTF_8));
    }

    @Property(tries = 75)
    void hostileValuesAreRejected(@ForAll("leaf") int leaf, @ForAll("hostile") String token) {
        String[] l = LEAVES.get(leaf);
        // an empty constellation object means every default (qam16), a valid choice
        Assume.that(!(l[0].equals("\"constellation\": ") && token.equals("{}")));
        check("loss-spec hostile values", SPEC.replace(l[0] + l[1], l[0] + token)
                .getBytes(StandardCharsets.UTF_8));
    }

    @Property(tries = 15)
    void unknownKeysAreRejected(@ForAll("objectStart") int at, @ForAll("unknownKey") String key) {
        check("loss-spec unknown keys", (SPEC.substring(0, at + 1) + "\"" + key + "\": 1, " + SPEC.substring(at + 1))
                .getBytes(StandardCharsets.UTF_8));
    }

    @Property(tries = 15)
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
        check("loss-spec duplicate keys", text.getBytes(StandardCharsets.UTF_8));
    }

    @Property(tries = 10)
    void deepNestingIsRejected(@ForAll("depth") int depth) {
        check("loss-spec deep nesting", ("{\"constellation\": \"qam4\", \"description\": "
                + Harness.nestedArrays(depth) + "}").getBytes(StandardCharsets.UTF_8));
    }

    @Property(tries = 20)
    void hostileSweepsAreRejected(@ForAll("hostileSweep") String sweep) {
        check("loss-spec hostile sweeps", replaceSweep(sweep).getBytes(StandardCharsets.UTF_8));
    }

    @Property(tries = 30)
    void hostileSweepValuesAreRejected(@ForAll("swept") String parameter, @ForAll("hostileSweepValue") String value) {
        // 64, 1000, 2^31 and 1 are legal (if useless) LLR scales and back-offs in dB: every code saturates
        Assume.that(!((parameter.equals("llr-scale") || parameter.equals("back-off-db"))
                && List.of("1", "64", "1000", "2.5", "2147483648").contains(value)));
        Assume.that(!(parameter.equals("back-off-db") && value.equals("0")));
        Assume.that(!(parameter.equals("input-fractional-bits") && List.of("0", "1").contains(value)));
        Assume.that(!(parameter.equals("llr-fractional-bits") && List.of("0", "1").contains(value)));
        check("loss-spec hostile sweep values", replaceSweep("[{\"parameter\": \"" + parameter + "\", \"values\": ["
                + value + "]}]").getBytes(StandardCharsets.UTF_8));
    }

    @Property(tries = 12)
    void absurdWorkIsRefusedAtOnce(@ForAll("absurd") String override) {
        // the override's keys replace the template's (the last of a duplicate would be refused as a duplicate)
        String text = "{\"constellation\": \"qam4\", \"demapper\": {\"llr\": {\"format\": \"Q3.0\"}},"
                + " \"targets\": {\"gmi\": 1.5}, " + override + "}";
        check("loss-spec absurd work", text.getBytes(StandardCharsets.UTF_8));
    }

    @Property(tries = 10)
    void hostileArgumentsAreRejected(@ForAll("argument") List<String> args) {
        Path sandbox = Harness.sandbox();
        try {
            Path spec = Harness.write(sandbox.resolve("in/spec.json"), SPEC);
            Harness.write(sandbox.resolve("out/existing"), "keep me");
            Path out = sandbox.resolve("out/report");
            List<String> all = new ArrayList<>(List.of("loss", spec.toString(), "--quiet"));
            for (String a : args) {
                all.add(a.replace("OUT", out.toString()).replace("EXISTING",
                        sandbox.resolve("out/existing").toString()));
            }
            if (!args.contains("-o")) {
                all.addAll(List.of("-o", out.toString()));
            }
            judge("loss-spec hostile arguments", sandbox, out, all.toArray(String[]::new));
        } finally {
            Harness.delete(sandbox);
        }
    }

    @Property(tries = 15)
    void damagedPartialResultsAreRejected(@ForAll("damage") int damage, @ForAll("cut") int cut,
                                          @ForAll("bytes") byte[] bytes) {
        Path sandbox = Harness.sandbox();
        try {
            Path spec = Harness.write(sandbox.resolve("in/spec.json"), SPEC);
            Path p1 = sandbox.resolve("in/p1.json");
            Path p2 = sandbox.resolve("in/p2.json");
            for (String[] s : new String[][] {{"1/2", p1.toString()}, {"2/2", p2.toString()}}) {
                Harness.Outcome o = Harness.run("loss", spec.toString(), "--shard", s[0], "-o", s[1], "--quiet",
                        "--threads", "1");
                assertEquals(0, o.status(), o::describe);
            }
            String part = new String(readBytes(p2), StandardCharsets.UTF_8);
            List<String> parts = new ArrayList<>(List.of(p1.toString(), p2.toString()));
            switch (damage) {
                case 0 -> Harness.write(p2, bytes);
                case 1 -> Harness.write(p2, part.substring(0, cut % part.length()));
                case 2 -> parts.remove(1); // a missing shard
                case 3 -> parts.set(1, p1.toString()); // the same shard twice
                case 4 -> Harness.write(p2, part.replaceFirst("\\{", "{\"x-unknown\": 1, "));
                case 5 -> Harness.write(p2, part.replaceFirst("\\{", "{\"a\": " + Harness.nestedArrays(100_000)
                        + ", "));
                default -> parts.set(1, sandbox.resolve("in/no-such-part.json").toString());
            }
            Path out = sandbox.resolve("out/report");
            List<String> all = new ArrayList<>(List.of("loss", "merge"));
            all.addAll(parts);
            all.addAll(List.of("-o", out.toString()));
            judge("loss-merge damaged parts", sandbox, out, all.toArray(String[]::new));
        } finally {
            Harness.delete(sandbox);
        }
    }

    /** The keys of a partial result: its top level, then those of a point. */
    static final List<String> PART_KEYS = List.of("schema", "version", "shard", "shards", "spec-source", "spec",
            "points", "design", "snr", "symbols", "bits-per-symbol", "float-bit-errors", "float-symbol-errors",
            "fixed-bit-errors", "fixed-symbol-errors", "float-gmi", "min-code", "max-code", "histogram",
            "input-error-energy", "input-samples", "input-clips", "metric-events", "scale-events", "output-events");

    /** Values of a type or size no key of a partial result takes; {@code MISSING} removes the key. */
    static final List<String> MISTYPED = List.of("MISSING", "12.5", "-0.0", "null", "true", "{}", "[]", "1e400",
            "99999999999999999999", "-99999999999999999999", "\"x\"", "\"12\"", "[\"7\"]");

    /** The two parts of {@link #SPEC} in two shards, made once: the damage is done on copies. */
    private static String[] cleanParts;

    @Property(tries = 20)
    void mistypedPartialResultsAreRejected(@ForAll("partKey") String key, @ForAll("mistyped") String value,
                                           @ForAll @IntRange(min = 0, max = 7) int point)
            throws IOException {
        // A spec-source is any string (it only names the spec in messages), so a string there is no damage.
        Assume.that(!(key.equals("spec-source") && value.startsWith("\"")));
        String[] clean = cleanParts();
        ObjectMapper mapper = new ObjectMapper();
        ObjectNode root =
                (ObjectNode) mapper.readTree(clean[1]);
        int top = PART_KEYS.indexOf("points") + 1;
        ObjectNode target = PART_KEYS.indexOf(key) < top ? root
                : (ObjectNode) root.get("points").get(point % root.get("points").size());
        if (value.equals("MISSING")) {
            target.remove(key);
        } else {
            target.putRawValue(key, new RawValue(value));
        }
        Path sandbox = Harness.sandbox();
        try {
            Path p1 = Harness.write(sandbox.resolve("in/p1.json"), clean[0]);
            Path p2 = Harness.write(sandbox.resolve("in/p2.json"), mapper.writeValueAsString(root));
            Path out = sandbox.resolve("out/report");
            judge("loss-merge damaged parts", sandbox, out, "loss", "merge", p1.toString(), p2.toString(), "-o",
                    out.toString());
        } finally {
            Harness.delete(sandbox);
        }
    }

    private static synchronized String[] cleanParts() {
        if (cleanParts == null) {
            Path sandbox = Harness.sandbox();
            try {
                Path spec = Harness.write(sandbox.resolve("spec.json"), SPEC);
                String[] parts = new String[2];
                for (int i = 0; i < 2; i++) {
                    Path part = sandbox.resolve("p" + (i + 1) + ".json");
                    Harness.Outcome o = Harness.run("loss", spec.toString(), "--shard", (i + 1) + "/2", "-o",
                            part.toString(), "--quiet", "--threads", "1");
                    assertEquals(0, o.status(), o::describe);
                    parts[i] = new String(readBytes(part), StandardCharsets.UTF_8);
                }
                cleanParts = parts;
            } finally {
                Harness.delete(sandbox);
            }
        }
        return cleanParts;
    }

    private static void check(String property, byte[] spec) {
        Path sandbox = Harness.sandbox();
        try {
            Path file = Harness.write(sandbox.resolve("in/spec.json"), spec);
            Path out = sandbox.resolve("out/report");
            judge(property, sandbox, out, "loss", file.toString(), "-o", out.toString(), "--quiet", "--threads", "1");
        } finally {
            Harness.delete(sandbox);
        }
    }

    private static void judge(String property, Path sandbox, Path out, String... args) {
        Map<String, String> before = Harness.snapshot(sandbox);
        Harness.Outcome o = Harness.run(args);
        Harness.tally(property).count(o);
        Harness.assertRejected(o);
        assertFalse(Files.exists(out), "the output exists after a failure");
        assertEquals(before, Harness.snapshot(sandbox), "the sandbox changed");
        assertFalse(Files.exists(Path.of("/tmp/fixmod-escape")), "a write outside the sandbox");
    }

    private static String replaceSweep(String sweep) {
        int from = SPEC.indexOf("\"sweep\": ");
        return SPEC.substring(0, from) + "\"sweep\": " + sweep + "}";
    }

    private static String range(int from, int to) {
        StringBuilder sb = new StringBuilder("[");
        for (int i = from; i <= to; i++) {
            sb.append(i == from ? "" : ", ").append(i);
        }
        return sb.append(']').toString();
    }

    /** {@code n} LLR scales from {@code offset + 0.25} in steps of 0.25. */
    private static String scales(int n, double offset) {
        StringBuilder sb = new StringBuilder("[");
        for (int i = 1; i <= n; i++) {
            sb.append(i == 1 ? "" : ", ").append(offset + 0.25 * i);
        }
        return sb.append(']').toString();
    }

    private static byte[] readBytes(Path p) {
        try {
            return Files.readAllBytes(p);
        } catch (java.io.IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
    }

    @AfterContainer
    static void summary() {
        Harness.printSummaries("loss-");
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
    Arbitrary<Integer> objectStart() {
        List<Integer> starts = new ArrayList<>();
        for (int i = SPEC.indexOf('{'); i >= 0; i = SPEC.indexOf('{', i + 1)) {
            starts.add(i);
        }
        return Arbitraries.of(starts);
    }

    @Provide
    Arbitrary<String> unknownKey() {
        return Arbitraries.of("x-unknown", "max_bits", "Seed", "llr-sign", "count", "", "..", "\\u0000",
                "k".repeat(10_000));
    }

    @Provide
    Arbitrary<Integer> depth() {
        return Arbitraries.of(1_001, 5_000, 100_000);
    }

    @Provide
    Arbitrary<String> hostileSweep() {
        return Arbitraries.of(HOSTILE_SWEEPS);
    }

    @Provide
    Arbitrary<String> swept() {
        return Arbitraries.of(SWEPT);
    }

    @Provide
    Arbitrary<String> hostileSweepValue() {
        return Arbitraries.of(HOSTILE_SWEEP_VALUES);
    }

    @Provide
    Arbitrary<String> absurd() {
        return Arbitraries.of(ABSURD_WORK);
    }

    @Provide
    Arbitrary<List<String>> argument() {
        return Arbitraries.of(List.of("--threads", "-1"), List.of("--threads", "100000"),
                List.of("--threads", "99999999999"), List.of("--threads", "x"), List.of("--shard", "0/2"),
                List.of("--shard", "3/2"), List.of("--shard", "1/0"), List.of("--shard", "a/b"),
                List.of("--shard", "1/2/3"), List.of("--shard", "-1/2"), List.of("--shard", "1/9999999"),
                List.of("-o", "EXISTING"), List.of("-o"), List.of("--shard", "1/2", "-o", "EXISTING"),
                List.of("--no-such-option"), List.of("extra-argument"));
    }

    @Provide
    Arbitrary<String> partKey() {
        return Arbitraries.of(PART_KEYS);
    }

    @Provide
    Arbitrary<String> mistyped() {
        return Arbitraries.of(MISTYPED);
    }

    @Provide
    Arbitrary<Integer> damage() {
        return Arbitraries.integers().between(0, 6);
    }
}
