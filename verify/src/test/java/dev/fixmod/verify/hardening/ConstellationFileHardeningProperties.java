package dev.fixmod.verify.hardening;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.lifecycle.AfterContainer;

/**
 * {@code fixmod constellation --file}: user constellation files (CSV and JSON) that are damaged, truncated or carry
 * hostile values. The command writes nothing, so besides the clean rejection the sandbox must stay as it was.
 */
class ConstellationFileHardeningProperties {

    /** The CSV that {@code fixmod constellation qam16 --csv --normalization none} prints: a valid file. */
    static final String CSV = validCsv();
    /** The same points as a JSON constellation file. */
    static final String JSON = toJson(CSV);

    /** Tokens that no key of a constellation file accepts. */
    static final List<String> NEVER_VALID = List.of("NaN", "-NaN", "Infinity", "-Infinity", "+Infinity", "1e400",
            "-1e400", "null", "true", "[]", "{}", "\"\"", "\"1\"", "0x10", "1_0", "--1", "'1'",
            Harness.nestedArrays(100_000), "{\"a\":" + Harness.nestedArrays(5_000) + "}");
    /** Numbers that are valid coordinates but never a label: too large, negative or fractional. */
    static final List<String> NOT_A_LABEL = List.of("9223372036854775808", "99999999999999999999", "-1", "1.5",
            "4096", "2147483648", "1e3", "-0.0");

    @Property(tries = 50)
    void randomBytesAreRejected(@ForAll("bytes") byte[] bytes, @ForAll("extension") String extension) {
        check("constellation-file random bytes", bytes, extension, true);
    }

    @Property(tries = 50)
    void truncatedJsonIsRejected(@ForAll("jsonCut") int cut) {
        check("constellation-file truncated json", JSON.substring(0, cut).getBytes(StandardCharsets.UTF_8), ".json",
                true);
    }

    /** A CSV cut inside its last data row may still be a valid (smaller) constellation; it must never crash. */
    @Property(tries = 30)
    void truncatedCsvIsRejectedOrValid(@ForAll("csvCut") int cut) {
        check("constellation-file truncated csv", CSV.substring(0, cut).getBytes(StandardCharsets.UTF_8), ".csv",
                false);
    }

    @Property(tries = 60)
    void hostileJsonValuesAreRejected(@ForAll("point") int point, @ForAll("key") String key,
                                      @ForAll("neverValid") String token) {
        check("constellation-file hostile json values", replaceJson(point, key, token), ".json", true);
    }

    @Property(tries = 40)
    void hostileLabelsAreRejected(@ForAll("point") int point, @ForAll("notALabel") String token,
                                  @ForAll boolean csv) {
        byte[] file = csv ? replaceCsv(point, 0, token) : replaceJson(point, "label", token);
        check("constellation-file hostile labels", file, csv ? ".csv" : ".json", true);
    }

    @Property(tries = 40)
    void hostileCsvCellsAreRejected(@ForAll("point") int point, @ForAll("column") int column,
                                    @ForAll("neverValid") String token) {
        check("constellation-file hostile csv cells", replaceCsv(point, column, token), ".csv", true);
    }

    @Property(tries = 25)
    void duplicateKeysAreRejected(@ForAll("point") int point, @ForAll("key") String key) {
        String p = pointJson(CSV.lines().skip(1 + point).findFirst().orElseThrow());
        String twice = p.substring(0, p.length() - 1) + ", \"" + key + "\": 0}";
        check("constellation-file duplicate keys", JSON.replace(p, twice).getBytes(StandardCharsets.UTF_8), ".json",
                true);
    }

    private static void check(String property, byte[] content, String extension, boolean mustReject) {
        Path sandbox = Harness.sandbox();
        try {
            Path file = Harness.write(sandbox.resolve("in/user" + extension), content);
            Map<String, String> before = Harness.snapshot(sandbox);
            Harness.Outcome o = Harness.run("constellation", "--file", file.toString(), "--normalization", "none");
            Harness.tally(property).count(o);
            if (mustReject) {
                Harness.assertRejected(o);
            } else {
                Harness.assertClean(o);
            }
            assertEquals(before, Harness.snapshot(sandbox), "the sandbox changed");
        } finally {
            Harness.delete(sandbox);
        }
    }

    @AfterContainer
    static void summary() {
        Harness.printSummaries("constellation-file");
    }

    @Provide
    Arbitrary<byte[]> bytes() {
        return Arbitraries.bytes().array(byte[].class).ofMaxSize(600);
    }

    @Provide
    Arbitrary<String> extension() {
        return Arbitraries.of(".csv", ".json", ".CSV");
    }

    @Provide
    Arbitrary<Integer> jsonCut() {
        return Arbitraries.integers().between(0, JSON.lastIndexOf('}') - 1);
    }

    @Provide
    Arbitrary<Integer> csvCut() {
        return Arbitraries.integers().between(0, CSV.stripTrailing().length() - 1);
    }

    @Provide
    Arbitrary<Integer> point() {
        return Arbitraries.integers().between(0, 15);
    }

    @Provide
    Arbitrary<Integer> column() {
        return Arbitraries.integers().between(0, 4);
    }

    @Provide
    Arbitrary<String> key() {
        return Arbitraries.of("label", "bits", "i", "q", "probability");
    }

    @Provide
    Arbitrary<String> neverValid() {
        return Combinators.combine(Arbitraries.of(NEVER_VALID), Arbitraries.of("", " ")).as((t, pad) -> pad + t);
    }

    @Provide
    Arbitrary<String> notALabel() {
        return Arbitraries.of(NOT_A_LABEL);
    }

    private static String validCsv() {
        Harness.Outcome o = Harness.run("constellation", "qam16", "--csv", "--normalization", "none");
        assertEquals(0, o.status(), o::describe);
        if (!o.out().startsWith("label,bits,i,q,probability\n")) {
            throw new IllegalStateException("the report's CSV header changed: " + o.out());
        }
        return o.out();
    }

    private static String pointJson(String csvRow) {
        String[] c = csvRow.split(",");
        return "{\"label\": " + c[0] + ", \"bits\": \"" + c[1] + "\", \"i\": " + c[2] + ", \"q\": " + c[3]
                + ", \"probability\": " + c[4] + "}";
    }

    private static String toJson(String csv) {
        List<String> points = new ArrayList<>();
        csv.lines().skip(1).filter(l -> !l.isBlank()).forEach(l -> points.add(pointJson(l)));
        return "{\"name\": \"qam16-copy\", \"points\": [\n  " + String.join(",\n  ", points) + "\n]}\n";
    }

    private static byte[] replaceJson(int point, String key, String token) {
        String[] c = CSV.lines().skip(1 + point).findFirst().orElseThrow().split(",");
        String p = pointJson(String.join(",", c));
        String value = switch (key) {
            case "label" -> c[0];
            case "bits" -> "\"" + c[1] + "\"";
            case "i" -> c[2];
            case "q" -> c[3];
            default -> c[4];
        };
        String hostile = p.replace("\"" + key + "\": " + value, "\"" + key + "\": " + token);
        return JSON.replace(p, hostile).getBytes(StandardCharsets.UTF_8);
    }

    private static byte[] replaceCsv(int point, int column, String token) {
        List<String> lines = new ArrayList<>(CSV.lines().toList());
        String[] c = lines.get(1 + point).split(",");
        c[column] = token.replace(",", ";");
        lines.set(1 + point, String.join(",", c));
        return (String.join("\n", lines) + "\n").getBytes(StandardCharsets.UTF_8);
    }
}
