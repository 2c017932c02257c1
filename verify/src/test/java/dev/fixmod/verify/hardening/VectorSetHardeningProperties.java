package dev.fixmod.verify.hardening;

import static org.junit.jupiter.api.Assertions.assertEquals;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.lifecycle.AfterContainer;

/**
 * Vector sets with a damaged {@code manifest.json}, read by {@code fixmod vectors check}, {@code fixmod vectors list}
 * and {@code fixmod compare SET --port llr}: random bytes, truncations, file names escaping the set ({@code ..},
 * absolute paths), counts claiming terabytes, wrong layouts, duplicate keys and deep nesting. The set sits two
 * folders deep in a sandbox so that a name escaping it would still land in the sandbox, whose files are compared
 * before and after every run.
 */
class VectorSetHardeningProperties {

    static final Path TEMPLATE = template();
    static final String MANIFEST = read(TEMPLATE.resolve("manifest.json"));
    /** Indexes of the manifest's entries that compare reads (hex and CSV files). */
    static final List<Integer> READ_BY_COMPARE = readByCompare();
    /** The entry of the llr port's hex file, whose layout compare uses. */
    static final int LLR_HEX = indexOf("llr.hex");

    static final List<String> ESCAPING_NAMES = List.of("../../victim.hex", "../set/llr.hex", "..", ".", "",
            "a/../../victim.hex", "sub/llr.hex", "..\\..\\victim.hex", "C:\\victim.hex", ".hidden", "~/victim.hex",
            "%2e%2e/victim.hex", "llr.hex/", "manifest.json", "llr.hex\u0000.txt", "\u2025/victim.hex");

    static final List<String> HUGE_COUNTS = List.of("1000000000", "999999999", "1000000000000", "9223372036854775807", "9223372036854775808",
            "99999999999999999999", "1e400", "-1", "NaN", "1.5", "null", "\"12\"");

    enum Reader {
        CHECK, LIST, COMPARE
    }

    @Property(tries = 25)
    void randomBytesAreRejected(@ForAll("bytes") byte[] bytes, @ForAll Reader reader) {
        check("vector-set random bytes", bytes, reader, true);
    }

    @Property(tries = 25)
    void truncationsAreRejected(@ForAll("cut") int cut, @ForAll Reader reader) {
        check("vector-set truncated manifest", MANIFEST.substring(0, cut).getBytes(StandardCharsets.UTF_8), reader,
                true);
    }

    @Property(tries = 40)
    void namesEscapingTheSetAreRejected(@ForAll("compared") int entry, @ForAll("escaping") String name,
                                        @ForAll Reader reader) {
        // compare reads only the port it is asked for; the other entries are the checker's and the lister's.
        int target = reader == Reader.COMPARE ? LLR_HEX : entry;
        String text = MANIFEST.replace(nameField(target), "\"name\" : " + quote(name));
        check("vector-set names escaping the set", text.getBytes(StandardCharsets.UTF_8), reader, true);
    }

    /**
     * Counts are claims, not allocations: a file's count of 10^12 is a difference from the files ({@code check}
     * exits 1) or not used ({@code compare} and {@code list} stream the files); it never allocates or hangs. The
     * canonical specification's count must be a number of at most 10^9 that agrees with the groups and fits the files
     * ({@code check} regenerates from it).
     */
    @Property(tries = 30)
    void hugeCountsAreNeverAllocated(@ForAll("compared") int entry, @ForAll("hugeCount") String count,
                                     @ForAll boolean inSpec, @ForAll Reader reader) {
        int from = inSpec ? MANIFEST.indexOf("\"spec\" : ") : MANIFEST.indexOf(nameField(entry));
        int at = MANIFEST.indexOf("\"count\" : ", from) + "\"count\" : ".length();
        int end = MANIFEST.indexOf(',', at);
        String text = MANIFEST.substring(0, at) + count + MANIFEST.substring(end);
        check("vector-set huge counts", text.getBytes(StandardCharsets.UTF_8), reader,
                inSpec && reader == Reader.CHECK);
    }

    /**
     * Every count of the manifest edited to agree (spec, groups), so only the files' sizes betray it: {@code check}
     * must refuse at once rather than regenerate millions of vectors.
     */
    @Property(tries = 6)
    void consistentlyEditedCountsAreNotRegenerated(@ForAll("editedCount") String count) {
        int from = MANIFEST.indexOf("\"spec\" : ");
        int at = MANIFEST.indexOf("\"count\" : ", from) + "\"count\" : ".length();
        int end = MANIFEST.indexOf(',', at);
        String text = (MANIFEST.substring(0, at) + count + MANIFEST.substring(end))
                .replaceAll("\"data\" : \\d+", "\"data\" : " + count)
                .replaceAll("\"data-per-level\" : \\d+", "\"data-per-level\" : " + count);
        check("vector-set consistently edited counts", text.getBytes(StandardCharsets.UTF_8), Reader.CHECK, true);
    }

    @Property(tries = 15)
    void deepNestingIsRejected(@ForAll("nestable") String key, @ForAll Reader reader) {
        String text = MANIFEST.replaceFirst("\"" + key + "\" : ", "\"" + key + "\" : "
                + Harness.nestedArrays(100_000) + ", \"x-" + key + "\" : ");
        check("vector-set deep nesting", text.getBytes(StandardCharsets.UTF_8), reader, true);
    }

    @Property(tries = 15)
    void duplicateKeysAreRejected(@ForAll("nestable") String key, @ForAll Reader reader) {
        String text = MANIFEST.replaceFirst("\\{", "{ \"" + key + "\" : 0,");
        check("vector-set duplicate keys", text.getBytes(StandardCharsets.UTF_8), reader, true);
    }

    /** A layout field whose format is not a Q format that fits a word: compare refuses; check reports or refuses. */
    @Property(tries = 25)
    void wrongLayoutsAreRejected(@ForAll("badFormat") String format, @ForAll Reader reader) {
        // The layout lists {"name", ..., "format"} per field; the entry's own "format" (hex) precedes "fields".
        int at = MANIFEST.indexOf("\"format\" : ", MANIFEST.indexOf("\"fields\" : ",
                MANIFEST.indexOf(nameField(LLR_HEX))));
        int end = MANIFEST.indexOf(',', at);
        String text = MANIFEST.substring(0, at) + "\"format\" : " + format + MANIFEST.substring(end);
        check("vector-set wrong layouts", text.getBytes(StandardCharsets.UTF_8), reader, reader == Reader.COMPARE);
    }

    private static void check(String property, byte[] manifest, Reader reader, boolean mustReject) {
        Path sandbox = Harness.sandbox();
        try {
            Path set = sandbox.resolve("a/b/set");
            copy(TEMPLATE, set);
            Harness.write(set.resolve("manifest.json"), manifest);
            Path dut = Harness.write(sandbox.resolve("in/dut.hex"), readBytes(TEMPLATE.resolve("llr.hex")));
            Map<String, String> before = Harness.snapshot(sandbox);
            Harness.Outcome o = switch (reader) {
                case CHECK -> Harness.run("vectors", "check", set.toString());
                case LIST -> Harness.run("vectors", "list", set.toString());
                case COMPARE -> Harness.run("compare", set.toString(), "--port", "llr", "--dut", dut.toString(),
                        "--quiet");
            };
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
        Harness.printSummaries("vector-set");
        Harness.delete(TEMPLATE.getParent());
    }

    @Provide
    Arbitrary<byte[]> bytes() {
        return Arbitraries.bytes().array(byte[].class).ofMaxSize(600);
    }

    @Provide
    Arbitrary<Integer> cut() {
        return Arbitraries.integers().between(0, MANIFEST.lastIndexOf('}') - 1);
    }

    @Provide
    Arbitrary<Integer> compared() {
        return Arbitraries.of(READ_BY_COMPARE);
    }

    @Provide
    Arbitrary<String> escaping() {
        return Arbitraries.of(ESCAPING_NAMES);
    }

    @Provide
    Arbitrary<String> hugeCount() {
        return Arbitraries.of(HUGE_COUNTS);
    }

    @Provide
    Arbitrary<String> editedCount() {
        return Arbitraries.of("1000000000", "100000000", "10000000");
    }

    @Provide
    Arbitrary<String> nestable() {
        return Arbitraries.of("schema", "version", "spec", "files", "flags");
    }

    @Provide
    Arbitrary<String> badFormat() {
        return Arbitraries.of("\"Q40.40\"", "\"Q63.0\"", "\"UQ64.1\"", "\"Q-1.3\"", "\"Q1.6.7\"", "7", "null",
                "\"\"", "[]", "\"Q1e400\"");
    }

    private static Path template() {
        Path root = Harness.sandbox();
        Path spec = Harness.write(root.resolve("spec.json"), "{\"constellation\": \"pam4\", \"count\": 12,"
                + " \"formats\": [\"hex\", \"csv\"]}");
        Path set = root.resolve("set");
        Harness.Outcome o = Harness.run("vectors", "generate", spec.toString(), "-o", set.toString(), "--quiet");
        if (o.status() != 0) {
            throw new IllegalStateException("cannot generate the template set: " + o.describe());
        }
        Harness.Outcome c = Harness.run("compare", set.toString(), "--port", "llr", "--dut",
                set.resolve("llr.hex").toString(), "--quiet");
        if (c.status() != 0) {
            throw new IllegalStateException("the template set does not compare with itself: " + c.describe());
        }
        return set;
    }

    private static List<Integer> readByCompare() {
        try {
            JsonNode files = new ObjectMapper().readTree(MANIFEST).path("files");
            List<Integer> list = new ArrayList<>();
            for (int i = 0; i < files.size(); i++) {
                String f = files.get(i).path("format").asText();
                if (f.equals("hex") || f.equals("csv")) {
                    list.add(i);
                }
            }
            return list;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private static int indexOf(String name) {
        try {
            JsonNode files = new ObjectMapper().readTree(MANIFEST).path("files");
            for (int i = 0; i < files.size(); i++) {
                if (files.get(i).path("name").asText().equals(name)) {
                    return i;
                }
            }
            throw new IllegalStateException("no " + name + " in the template set");
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** The text of entry {@code i}'s name field as the manifest writes it. */
    private static String nameField(int i) {
        try {
            String name = new ObjectMapper().readTree(MANIFEST).path("files").get(i).path("name").asText();
            String field = "\"name\" : \"" + name + "\"";
            if (!MANIFEST.contains(field)) {
                throw new IllegalStateException("the manifest's layout changed: no " + field);
            }
            return field;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private static String quote(String s) {
        StringBuilder sb = new StringBuilder("\"");
        for (char c : s.toCharArray()) {
            if (c == '"' || c == '\\') {
                sb.append('\\').append(c);
            } else if (c < 0x20) {
                sb.append(String.format("\\u%04x", (int) c));
            } else {
                sb.append(c);
            }
        }
        return sb.append('"').toString();
    }

    private static void copy(Path from, Path to) {
        try (Stream<Path> s = Files.list(from)) {
            Files.createDirectories(to);
            for (Path p : s.toList()) {
                Files.copy(p, to.resolve(p.getFileName()));
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private static String read(Path p) {
        return new String(readBytes(p), StandardCharsets.UTF_8);
    }

    private static byte[] readBytes(Path p) {
        try {
            return Files.readAllBytes(p);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
