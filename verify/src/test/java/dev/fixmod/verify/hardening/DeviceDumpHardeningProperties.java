package dev.fixmod.verify.hardening;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.lifecycle.AfterContainer;

/**
 * {@code fixmod compare GOLDEN --layout ... --dut DUMP}: damaged device dumps in hex, CSV and binary. A dump may be
 * a legal dump of wrong words, which is a mismatch (exit 1), not bad input; so random content must end in a
 * documented status, and a rejection in one clean line. Content that is never a dump (stray characters, non-integer
 * or overflowing CSV codes, a cut binary word) must be rejected. Huge numbers in the numeric options of every
 * command are usage errors or valid settings, never a crash, a hang or an allocation by the claim.
 */
class DeviceDumpHardeningProperties {

    /** Four 12-bit words of two Q3.2 fields, as a testbench would dump them. */
    static final String LAYOUT = "llr0:Q3.2,llr1:Q3.2";
    static final String GOLDEN_HEX = "7c1\n03f\n800\nfff\n";
    static final String GOLDEN_CSV = "llr0,llr1\n31,1\n0,-1\n-32,0\n-1,-1\n";

    enum Format {
        HEX, CSV, BIN
    }

    static final List<String> NEVER_A_CSV_CODE = List.of("NaN", "Infinity", "1e400", "1.5", "0x10",
            "99999999999999999999", "9223372036854775808", "-9223372036854775809", "--1", "1_0", "\u0661", "\uff11");
    static final List<String> NEVER_A_HEX_WORD = List.of("7g1", "-12", "7c.1", "@10", "NaN", "1e40g", "\u00e9",
            "0x7c1!", "[[[", "7c1\u0000");

    @Property(tries = 60)
    void randomDumpsEndInADocumentedStatus(@ForAll("bytes") byte[] bytes, @ForAll Format format) {
        check("device-dump random bytes", bytes, format, false);
    }

    @Property(tries = 25)
    void truncatedDumpsEndInADocumentedStatus(@ForAll("fraction") double fraction, @ForAll Format format) {
        byte[] full = valid(format);
        check("device-dump truncated", Arrays.copyOf(full, (int) (full.length * fraction)), format, false);
    }

    @Property(tries = 15)
    void aCutBinaryWordIsRejected(@ForAll("oddLength") int length) {
        check("device-dump cut binary word", Arrays.copyOf(valid(Format.BIN), length), Format.BIN, true);
    }

    @Property(tries = 30)
    void strayHexIsRejected(@ForAll("line") int line, @ForAll("strayHex") String token) {
        List<String> lines = new ArrayList<>(GOLDEN_HEX.lines().toList());
        lines.set(line, token);
        check("device-dump stray hex", (String.join("\n", lines) + "\n").getBytes(StandardCharsets.UTF_8),
                Format.HEX, true);
    }

    @Property(tries = 30)
    void hostileCsvCodesAreRejected(@ForAll("line") int line, @ForAll boolean second, @ForAll("csvCode") String code) {
        List<String> lines = new ArrayList<>(GOLDEN_CSV.lines().toList());
        String[] cells = lines.get(1 + line).split(",");
        cells[second ? 1 : 0] = code;
        lines.set(1 + line, String.join(",", cells));
        check("device-dump hostile csv codes", (String.join("\n", lines) + "\n").getBytes(StandardCharsets.UTF_8),
                Format.CSV, true);
    }

    /** Words of the wrong width are counted as mismatches by design (exit 1), never an error or a crash. */
    @Property(tries = 15)
    void wrongWidthsAreMismatches(@ForAll("line") int line, @ForAll("widthDigits") String digits) {
        List<String> lines = new ArrayList<>(GOLDEN_HEX.lines().toList());
        lines.set(line, digits);
        Harness.Outcome o = runCompare((String.join("\n", lines) + "\n").getBytes(StandardCharsets.UTF_8),
                Format.HEX, "device-dump wrong widths");
        assertEquals(1, o.status(), o::describe);
    }

    @Property(tries = 60)
    void hugeNumbersInOptionsAreUsageErrorsOrSettings(@ForAll("numericOption") String[] option,
                                                      @ForAll("hugeNumber") String number) {
        Path sandbox = Harness.sandbox();
        try {
            Path golden = Harness.write(sandbox.resolve("in/golden.hex"), GOLDEN_HEX);
            Path spec = Harness.write(sandbox.resolve("in/spec.json"), "{\"constellation\": \"pam4\", \"count\": 4}");
            Map<String, String> before = Harness.snapshot(sandbox);
            List<String> args = new ArrayList<>(switch (option[0]) {
                case "compare" -> List.of("compare", golden.toString(), "--layout", LAYOUT, "--dut",
                        golden.toString(), "--quiet");
                case "constellation" -> List.of("constellation", "qam16");
                default -> List.of("vectors", "generate", spec.toString(), "-o",
                        sandbox.resolve("out/set").toString(), "--quiet");
            });
            args.add(option[1] + "=" + number);
            Harness.Outcome o = Harness.run(args.toArray(String[]::new));
            Harness.tally("cli-numbers").count(o);
            Harness.assertClean(o);
            if (o.status() == 2) {
                assertEquals(before, Harness.snapshot(sandbox), "the sandbox changed after a rejection");
            }
        } finally {
            Harness.delete(sandbox);
        }
    }

    private static void check(String property, byte[] dump, Format format, boolean mustReject) {
        Harness.Outcome o = runCompare(dump, format, property);
        if (mustReject) {
            Harness.assertRejected(o);
        } else {
            Harness.assertClean(o);
        }
    }

    private static Harness.Outcome runCompare(byte[] dump, Format format, String property) {
        Path sandbox = Harness.sandbox();
        try {
            Path golden = Harness.write(sandbox.resolve("in/golden.hex"), GOLDEN_HEX);
            Path dut = Harness.write(sandbox.resolve("in/dut." + format.name().toLowerCase()), dump);
            Map<String, String> before = Harness.snapshot(sandbox);
            Harness.Outcome o = Harness.run("compare", golden.toString(), "--layout", LAYOUT, "--dut", dut.toString(),
                    "--dut-format", format.name().toLowerCase(), "--json");
            Harness.tally(property).count(o);
            assertEquals(before, Harness.snapshot(sandbox), "the sandbox changed");
            return o;
        } finally {
            Harness.delete(sandbox);
        }
    }

    static byte[] valid(Format format) {
        return switch (format) {
            case HEX -> GOLDEN_HEX.getBytes(StandardCharsets.US_ASCII);
            case CSV -> GOLDEN_CSV.getBytes(StandardCharsets.US_ASCII);
            case BIN -> new byte[] {(byte) 0xc1, 0x07, 0x3f, 0x00, 0x00, 0x08, (byte) 0xff, 0x0f};
        };
    }

    @AfterContainer
    static void summary() {
        Harness.printSummaries("device-dump");
        Harness.printSummaries("cli-numbers");
    }

    @Provide
    Arbitrary<byte[]> bytes() {
        return Arbitraries.bytes().array(byte[].class).ofMaxSize(400);
    }

    @Provide
    Arbitrary<Double> fraction() {
        return Arbitraries.doubles().between(0, 0.99);
    }

    @Provide
    Arbitrary<Integer> oddLength() {
        return Arbitraries.of(1, 3, 5, 7);
    }

    @Provide
    Arbitrary<Integer> line() {
        return Arbitraries.integers().between(0, 3);
    }

    @Provide
    Arbitrary<String> strayHex() {
        return Arbitraries.of(NEVER_A_HEX_WORD);
    }

    @Provide
    Arbitrary<String> csvCode() {
        return Arbitraries.of(NEVER_A_CSV_CODE);
    }

    @Provide
    Arbitrary<String> widthDigits() {
        return Arbitraries.of("7c", "07c1", "0000000000000000", "fffffffffffffffff", "99999999999999999999", "1");
    }

    @Provide
    Arbitrary<String[]> numericOption() {
        return Arbitraries.of(new String[] {"compare", "--align-window"}, new String[] {"compare", "--align-prefix"},
                new String[] {"compare", "--latency"}, new String[] {"compare", "--skip"},
                new String[] {"compare", "--show"}, new String[] {"compare", "--context"},
                new String[] {"compare", "--max-mismatches"}, new String[] {"compare", "--word-bytes"},
                new String[] {"constellation", "--shaping"}, new String[] {"constellation", "--rolloff"},
                new String[] {"constellation", "--phase-offset"}, new String[] {"vectors", "--threads"});
    }

    @Provide
    Arbitrary<String> hugeNumber() {
        return Arbitraries.of("1e400", "-1e400", "NaN", "Infinity", "9223372036854775807", "9223372036854775808",
                "-9223372036854775809", "99999999999999999999", "2147483648", "2147483647", "-1", "1e308", "", "0x10");
    }
}
