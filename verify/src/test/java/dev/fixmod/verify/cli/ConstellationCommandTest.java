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
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code fixmod constellation} through the real command line, as a user runs it. */
class ConstellationCommandTest {
    @TempDir
    Path dir;

    private record Run(int status, String out, String err) {
    }

    private static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = FixmodCommand.commandLine(new PrintWriter(out), new PrintWriter(err)).execute(args);
        return new Run(status, out.toString(), err.toString());
    }

    private static void assertUsageError(Run r, String expectedLine) {
        assertEquals(ExitStatus.USAGE, r.status());
        assertEquals("", r.out(), "no partial output");
        assertEquals(expectedLine + System.lineSeparator(), r.err());
    }

    @Test
    void quickStartCommandPrintsPointsLabelsAndMetrics() {
        Run r = run("constellation", "qam16");
        assertEquals(0, r.status(), r.err());
        assertEquals("", r.err());
        String out = r.out();
        assertTrue(out.startsWith("qam16: square QAM, 16 points, gray labeling\n"), out);
        // Gray per axis (common practice): label 0000 is the corner (−3, −3)/√10 of unit-energy 16-QAM.
        assertTrue(out.contains("    0  0000  -0.9486832981  -0.9486832981       0.0625           2\n"), out);
        assertTrue(out.contains("  E_s             1  "), out);
        assertTrue(out.contains("  d_min^2         0.4\n"), out);
        // Handbook closed form ε = 6k/(M−1) = 1.6, loss 10 log10(2.5) = 3.979400087 dB.
        assertTrue(out.contains("  eps             1.6  "), out);
        assertTrue(out.contains("  loss vs BPSK    3.979400087 dB"), out);
        assertTrue(out.contains("  Gray penalty    1  "), out);
        assertTrue(out.contains("2 bit/s/Hz  rectangular pulses"), out);
    }

    @Test
    void badNameExitsTwoWithOneLine() {
        Run r = run("constellation", "nope");
        assertEquals(ExitStatus.USAGE, r.status());
        assertEquals("", r.out());
        assertTrue(r.err().startsWith("fixmod constellation: unknown constellation 'nope'; accepted: pam<M>, psk<M>,"),
                r.err());
        assertEquals(1, r.err().split("\n").length, "one line");
    }

    @Test
    void badOptionValuesExitTwoWithOneLine() {
        assertUsageError(run("constellation", "qam16", "--labeling", "grey"),
                "fixmod constellation: --labeling: unknown labeling 'grey'; expected one of gray, natural, quasi-gray");
        assertUsageError(run("constellation", "qam16", "--normalization", "unit"),
                "fixmod constellation: --normalization: unknown normalization 'unit'; expected one of none,"
                        + " unit-energy, unit-bit-energy, unit-peak");
        assertUsageError(run("constellation", "qam16", "--labeling", "quasi-gray"),
                "fixmod constellation: qam16 has no quasi-gray labeling; accepted: gray, natural");
        assertUsageError(run("constellation", "qam16", "--phase-offset", "10"),
                "fixmod constellation: a phase offset applies to psk<M> and bpsk only, not to qam16");
        assertUsageError(run("constellation", "qam16", "--shaping", "-1"),
                "fixmod constellation: --shaping: the Maxwell-Boltzmann parameter must be finite and >= 0, got -1.0");
        assertUsageError(run("constellation", "qam16", "--rolloff", "2"),
                "fixmod constellation: --rolloff must be between 0 and 1, got 2.0");
        assertUsageError(run("constellation", "qam16", "--json", "--csv"),
                "fixmod constellation: choose one of --json and --csv");
        assertUsageError(run("constellation"),
                "fixmod constellation: give a constellation NAME (see --list) or --file PATH");
        assertUsageError(run("constellation", "nr:qam16", "--labeling", "gray"),
                "fixmod constellation: nr:qam16 has the labeling fixed by 3GPP TS 38.211 section 5.1; give no"
                        + " labeling");
        Run unknown = run("constellation", "qam16", "--frobnicate");
        assertEquals(ExitStatus.USAGE, unknown.status());
        assertEquals("", unknown.out());
        assertTrue(unknown.err().startsWith("fixmod constellation: Unknown option: '--frobnicate'"), unknown.err());
    }

    @Test
    void jsonCarriesExactPointsAndMetrics() throws IOException {
        Run r = run("constellation", "nr:qam16", "--json");
        assertEquals(0, r.status(), r.err());
        JsonNode root = new ObjectMapper().readTree(r.out());
        assertEquals("nr:qam16", root.get("name").asText());
        assertEquals("nr", root.get("labeling").asText());
        // 3GPP TS 38.211 §5.1.4: b = 0000 maps to (1 + j)/√10; I carries b0, b2.
        JsonNode p0 = root.get("points").get(0);
        assertEquals("0000", p0.get("bits").asText());
        assertEquals(1 / StrictMath.sqrt(10), p0.get("i").asDouble(), 0.0);
        assertEquals(1 / StrictMath.sqrt(10), p0.get("q").asDouble(), 0.0);
        assertEquals("[0,2]", root.get("axes").get("i_bits").toString());
        assertEquals(1.6, root.get("metrics").get("power_efficiency").asDouble(), 1e-12);
        assertEquals(4.0, root.get("metrics").get("bandwidth_efficiency").get("nyquist").asDouble(), 0.0);
    }

    @Test
    void csvRoundTripsThroughTheFileReader() throws IOException {
        Run csv = run("constellation", "cqam32", "--normalization", "none", "--csv");
        assertEquals(0, csv.status(), csv.err());
        assertTrue(csv.out().startsWith("label,bits,i,q,probability\n0,00000,"), csv.out());
        Path file = dir.resolve("cross32.csv");
        Files.writeString(file, csv.out(), StandardCharsets.UTF_8);
        Run back = run("constellation", "--file", file.toString(), "--normalization", "none", "--csv");
        assertEquals(0, back.status(), back.err());
        assertEquals(csv.out(), back.out());
        // Handbook (Proakis): cross 32-QAM on the odd-integer grid has E_s = 20.
        Run text = run("constellation", "--file", file.toString(), "--normalization", "none");
        assertTrue(text.out().contains("  E_s             20  "), text.out());
        assertTrue(text.out().startsWith("cross32: user-defined points, 32 points, custom labeling\n"), text.out());
    }

    @Test
    void fileErrorsExitTwo() throws IOException {
        Path file = dir.resolve("bad.csv");
        Files.writeString(file, "label,i,q\n0,1,0\n1,oops,0\n", StandardCharsets.UTF_8);
        assertUsageError(run("constellation", "--file", file.toString()),
                "fixmod constellation: " + file + " line 3, column 'i': 'oops' is not a number");
        assertUsageError(run("constellation", "qam16", "--file", file.toString()),
                "fixmod constellation: give a constellation NAME or --file PATH, not both");
    }

    @Test
    void optionsReachTheOutput() {
        Run r = run("constellation", "psk8", "--phase-offset", "22.5", "--labeling", "natural");
        assertEquals(0, r.status(), r.err());
        assertTrue(r.out().contains("phase offset: 22.5 degrees\n"), r.out());
        assertTrue(r.out().startsWith("psk8: PSK, 8 points, natural labeling\n"), r.out());
        // cos 22.5° = 0.9238795325 (to 10 digits)
        assertTrue(r.out().contains("0.9238795325"), r.out());
        Run shaped = run("constellation", "qam64", "--shaping", "0.05");
        assertTrue(shaped.out().contains("probabilities: Maxwell-Boltzmann, p ~ exp(-0.05 |s|^2) on the natural grid"),
                shaped.out());
        assertTrue(shaped.out().contains("  E_s             1  "), shaped.out());
        Run pi2 = run("constellation", "pi2bpsk");
        assertTrue(pi2.out().contains("I (odd)"), pi2.out());
    }

    @Test
    void listShowsFamiliesLabelingsNormalizationsAndProfiles() {
        Run r = run("constellation", "--list");
        assertEquals(0, r.status(), r.err());
        for (String s : new String[] {"qam<M>", "cqam<M>", "apsk32", "star8", "pi2bpsk", "quasi-gray",
            "unit-bit-energy", "nr  3GPP TS 38.211", "wlan  IEEE 802.11"}) {
            assertTrue(r.out().contains(s), s);
        }
    }

    @Test
    void helpHasExamples() {
        Run r = run("constellation", "--help");
        assertEquals(0, r.status());
        assertTrue(r.out().contains("Examples:"), r.out());
        assertTrue(r.out().contains("fixmod constellation nr:qam64 --json"), r.out());
        assertTrue(run("--help").out().contains("constellation"), "registered as a subcommand");
    }
}
