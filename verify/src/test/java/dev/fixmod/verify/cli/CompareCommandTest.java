package dev.fixmod.verify.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code fixmod compare} end to end on small invented files: exit statuses, formats, options, messages. */
class CompareCommandTest {
    private static final String LAYOUT = "i:Q1.6,q:Q1.6";

    @TempDir
    Path dir;
    Path golden;
    List<String> words = new ArrayList<>();

    record Run(int status, String out, String err) {
        JsonNode json() throws IOException {
            return new ObjectMapper().readTree(out);
        }
    }

    static Run fixmod(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = FixmodCommand.commandLine(new PrintWriter(out), new PrintWriter(err)).execute(args);
        return new Run(status, out.toString(), err.toString());
    }

    @BeforeEach
    void writeGolden() throws IOException {
        for (int n = 0; n < 64; n++) {
            words.add(String.format("%02x%02x", (n * 7) & 0xFF, (n * 13 + 5) & 0xFF));
        }
        golden = write("golden.hex", words);
    }

    Path write(String name, List<String> lines) throws IOException {
        Path p = dir.resolve(name);
        Files.write(p, lines, StandardCharsets.US_ASCII);
        return p;
    }

    @Test
    void agreementExitsZeroAndSaysSo() throws IOException {
        Path dut = write("dut.hex", words);
        Run r = fixmod("compare", golden.toString(), "--layout", LAYOUT, "--dut", dut.toString());
        assertEquals(ExitStatus.OK, r.status(), r.err());
        assertTrue(r.out().startsWith("AGREE"), r.out());
        Run q = fixmod("compare", golden.toString(), "--layout", LAYOUT, "--dut", dut.toString(), "--quiet");
        assertEquals(1, q.out().lines().count());
    }

    @Test
    void mismatchExitsOneWithJsonDetail() throws IOException {
        List<String> d = new ArrayList<>(words);
        d.set(20, "7f80");
        Run r = fixmod("compare", golden.toString(), "--layout", LAYOUT, "--dut", write("dut.hex", d).toString(),
                "--json");
        assertEquals(ExitStatus.MISMATCH, r.status());
        JsonNode rep = r.json().path("reports").get(0);
        assertEquals(false, r.json().path("agree").asBoolean());
        assertEquals(20, rep.path("mismatches").get(0).path("index").asLong());
        assertEquals(21, rep.path("mismatches").get(0).path("dutLine").asLong());
        // Vector 20 is (140, 5) as bytes: i = 0x8c = -116, so expected value -116/64 = -1.8125 in Q1.6.
        JsonNode i = rep.path("mismatches").get(0).path("fields").get(0);
        assertEquals(-116, i.path("expectedCode").asLong());
        assertEquals(-1.8125, i.path("expectedValue").asDouble());
        assertEquals(127, i.path("actualCode").asLong());
        assertEquals(243, i.path("diffLsb").asLong());
        assertEquals(7, rep.path("context").size(), "3 vectors either side of the first failure");
    }

    @Test
    void toleranceAndMismatchLimit() throws IOException {
        List<String> d = new ArrayList<>();
        for (String w : words) {
            int q = Integer.parseInt(w.substring(2), 16);
            d.add(w.substring(0, 2) + String.format("%02x", q == 0x7F ? q : (q + 1) & 0xFF));
        }
        Path dut = write("dut.hex", d);
        assertEquals(1, fixmod("compare", golden.toString(), "--layout", LAYOUT, "--dut", dut.toString()).status());
        assertEquals(0, fixmod("compare", golden.toString(), "--layout", LAYOUT, "--dut", dut.toString(),
                "--tolerance", "q=1").status());
        Run stopped = fixmod("compare", golden.toString(), "--layout", LAYOUT, "--dut", dut.toString(),
                "--max-mismatches", "5", "--json");
        JsonNode rep = stopped.json().path("reports").get(0);
        assertEquals(5, rep.path("mismatched").asLong());
        assertTrue(rep.path("stoppedAt").asLong() >= 4);
    }

    @Test
    void csvAndBinaryDumps() throws IOException {
        List<String> csv = new ArrayList<>(List.of("index,q,i"));
        byte[] bin = new byte[2 * words.size()];
        for (int n = 0; n < words.size(); n++) {
            int w = Integer.parseInt(words.get(n), 16);
            csv.add(n + "," + (byte) (w & 0xFF) + "," + (byte) (w >> 8));
            bin[2 * n] = (byte) w;
            bin[2 * n + 1] = (byte) (w >> 8);
        }
        Path c = write("dut.csv", csv);
        Path b = dir.resolve("dut.bin");
        Files.write(b, bin);
        assertEquals(0, fixmod("compare", golden.toString(), "--layout", LAYOUT, "--dut", c.toString(),
                "--dut-format", "csv").status());
        assertEquals(0, fixmod("compare", golden.toString(), "--layout", LAYOUT, "--dut", b.toString(),
                "--dut-format", "bin").status());
        Files.write(b, java.util.Arrays.copyOf(bin, bin.length - 1));
        Run cut = fixmod("compare", golden.toString(), "--layout", LAYOUT, "--dut", b.toString(), "--dut-format",
                "bin");
        assertEquals(ExitStatus.USAGE, cut.status());
        assertTrue(cut.err().contains("word 64 is cut off after 1 of 2 bytes"), cut.err());
    }

    @Test
    void badInputExitsTwoWithFileAndLineAndNoReport() throws IOException {
        List<String> d = new ArrayList<>(words);
        d.set(9, "12g4");
        Run r = fixmod("compare", golden.toString(), "--layout", LAYOUT, "--dut", write("dut.hex", d).toString());
        assertEquals(ExitStatus.USAGE, r.status());
        assertTrue(r.err().contains("dut.hex:10:3: unexpected character 'g'"), r.err());
        assertEquals("", r.out());

        assertEquals(ExitStatus.USAGE, fixmod("compare", golden.toString(), "--dut", golden.toString()).status());
        Run both = fixmod("compare", golden.toString(), "--layout", LAYOUT, "--dut", golden.toString(), "--latency",
                "1", "--align-window", "4");
        assertEquals(ExitStatus.USAGE, both.status());
        assertTrue(both.err().contains("exclude each other"), both.err());
        Run tol = fixmod("compare", golden.toString(), "--layout", LAYOUT, "--dut", golden.toString(),
                "--tolerance", "x=1");
        assertEquals(ExitStatus.USAGE, tol.status());
        assertTrue(tol.err().contains("no field 'x'"), tol.err());
        Run missing = fixmod("compare", golden.toString(), "--layout", LAYOUT, "--dut", dir.resolve("nope.hex")
                .toString());
        assertEquals(ExitStatus.USAGE, missing.status());
        assertTrue(missing.err().contains("nope.hex: no such file"), missing.err());
    }
}
