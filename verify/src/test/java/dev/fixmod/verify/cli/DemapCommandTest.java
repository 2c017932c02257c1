package dev.fixmod.verify.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.fixmod.constellation.Catalogue;
import dev.fixmod.constellation.Constellation;
import dev.fixmod.demap.FixedLlrSpec;
import dev.fixmod.demap.FixedSoftDemapper;
import dev.fixmod.demap.LlrOptions;
import dev.fixmod.demap.LogMapDemapper;
import dev.fixmod.demap.SoftAlgorithm;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import dev.fixmod.map.ConstellationRom;
import java.io.PrintWriter;
import java.io.StringWriter;
import org.junit.jupiter.api.Test;

class DemapCommandTest {

    private record Run(int status, String out, String err) {
    }

    private static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = FixmodCommand.commandLine(new PrintWriter(out, true), new PrintWriter(err, true)).execute(args);
        return new Run(status, out.toString(), err.toString());
    }

    private static JsonNode json(String... args) throws Exception {
        Run r = run(args);
        assertEquals(0, r.status(), r.err());
        return new ObjectMapper().readTree(r.out());
    }

    @Test
    void theJsonReportCarriesTheKernelsNumbersForEveryAlgorithm() throws Exception {
        JsonNode root = json("demap", "-c", "qam16", "--sample", "0.3,-0.7", "--n0", "0.1", "--json");
        Constellation c = Catalogue.resolve("qam16");
        LlrOptions o = LlrOptions.of(0.1);
        double[] exact = new double[4];
        new LogMapDemapper(c, o).llr(0.3, -0.7, exact, 0);
        JsonNode logMap = root.get("float").get(0);
        assertEquals("log-map", logMap.get("algorithm").asText());
        for (int b = 0; b < 4; b++) {
            assertEquals(exact[b], logMap.get("llr").get(b).asDouble(), 0.0);
        }
        // Fixed: the input code of 0.3 in Q2.9 is round(0.3 · 512) = 154; the datapath's output as the kernel gives it.
        assertEquals(154, root.get("sample").get("input").get("iCode").asInt());
        assertEquals(-358, root.get("sample").get("input").get("qCode").asInt());
        ConstellationRom rom = ConstellationRom.of(c,
                new Quantizer(QFormat.parse("Q2.9"), Rounding.HALF_EVEN, Overflow.SATURATE));
        Quantizer out = Quantizer.parse("Q4.1 half-even symmetric-saturate");
        int row = 0;
        for (SoftAlgorithm a : new SoftAlgorithm[] {SoftAlgorithm.MAX_LOG, SoftAlgorithm.MAX_LOG_PER_AXIS,
                SoftAlgorithm.FOLDED_LINEAR}) {
            FixedSoftDemapper d = FixedSoftDemapper.create(a, rom, o, FixedLlrSpec.suggested(a, rom, o, out.format()));
            int[] codes = new int[4];
            d.llr(154, -358, codes, 0);
            JsonNode fixed = root.get("fixed").get(row++);
            assertEquals(a.tradeName(), fixed.get("algorithm").asText());
            for (int b = 0; b < 4; b++) {
                JsonNode bit = fixed.get("bits").get(b);
                assertEquals(codes[b], bit.get("llrCode").asInt(), a + " bit " + b);
                JsonNode values = bit.get("values");
                assertEquals("output", values.get(values.size() - 1).get("name").asText());
                assertEquals(codes[b], values.get(values.size() - 1).get("code").asInt());
            }
            assertEquals(0, fixed.get("overflowEvents").get("llr-output").asInt());
        }
        assertEquals("1100", root.get("slicers").get("float").asText());
    }

    @Test
    void theClosedFormOnTheOddGridAppearsAsIs() throws Exception {
        // Gray 16-QAM per axis on ±1, ±3, first bit beyond 2: L = −8(y − 1)/N0 (Tosato and Bisaglia 2002, from
        // memory; see MaxLogClosedFormTest): y = 2.5, N0 = 0.5 gives −24. Second bit: 4(|y| − 2)/N0 = 4.
        JsonNode root = json("demap", "-c", "qam16", "--normalization", "none", "--sample", "2.5,-0.25", "--n0",
                "0.5", "--input-format", "Q3.4", "--llr", "Q5.1,half-even,symmetric-saturate", "--json");
        JsonNode maxLog = root.get("float").get(1);
        assertEquals(-24.0, maxLog.get("llr").get(0).asDouble(), 1e-12);
        assertEquals(4.0, maxLog.get("llr").get(1).asDouble(), 1e-12);
        JsonNode fixed = root.get("fixed").get(1); // max-log-per-axis
        assertEquals(-48, fixed.get("bits").get(0).get("llrCode").asInt()); // −24 in Q5.1
        assertEquals(-24.0, fixed.get("bits").get(0).get("llrValue").asDouble(), 0.0);
    }

    @Test
    void theTextReportShowsDecisionsTiesAndTheTrace() {
        Run r = run("demap", "-c", "qam16", "--sample", "0,0", "--n0", "1");
        assertEquals(0, r.status(), r.err());
        // At the origin every first bit of an axis ties (LLR 0): it takes the slicer's decision, toward +I, +Q.
        assertTrue(r.out().contains("slicers        float 1111, fixed 1111"), r.out());
        assertTrue(r.out().contains("  log-map           1111 "), r.out());
        assertTrue(r.out().contains("max-log-per-axis datapath: "), r.out());
        assertTrue(r.out().contains("segment=") && r.out().contains("level0=") && r.out().contains("fold1="), r.out());
        assertTrue(r.out().contains("overflow events: llr-metric 0 llr-scale 0 llr-output 0"), r.out());
    }

    @Test
    void piOverTwoBpskDemapsTheSampleAsAnEvenOrAnOddSymbol() throws Exception {
        // 3GPP TS 38.211 §5.1.1 points a(1 + j)(1 − 2b), times j on odd symbols; the exact LLR on AWGN is
        // 4a(I + Q)/N0 (even) and 4a(Q − I)/N0 (odd), a = 1/√2 (derived in the kernel's Pi2BpskDemapperTest).
        double a = 1 / StrictMath.sqrt(2);
        for (boolean odd : new boolean[] {false, true}) {
            JsonNode root = odd
                    ? json("demap", "-c", "nr:pi2bpsk", "--sample", "-0.5,0.6", "--n0", "0.5", "--odd-symbol", "--json")
                    : json("demap", "-c", "nr:pi2bpsk", "--sample", "-0.5,0.6", "--n0", "0.5", "--json");
            assertEquals(odd, root.get("sample").get("oddSymbol").asBoolean());
            double want = 4 * a * (odd ? 0.6 + 0.5 : 0.6 - 0.5) / 0.5;
            for (int row = 0; row < 2; row++) { // log-map, max-log
                assertEquals(want, root.get("float").get(row).get("llr").get(0).asDouble(), 1e-12);
            }
            assertEquals(false, root.get("float").get(2).get("available").asBoolean(), "max-log-per-axis");
            Constellation c = Catalogue.resolve("nr:pi2bpsk");
            LlrOptions o = new LlrOptions(0.5, dev.fixmod.demap.LlrSign.ZERO_POSITIVE, true);
            ConstellationRom rom = ConstellationRom.of(c,
                    new Quantizer(QFormat.parse("Q2.9"), Rounding.HALF_EVEN, Overflow.SATURATE));
            FixedSoftDemapper d = FixedSoftDemapper.create(SoftAlgorithm.MAX_LOG, rom, o,
                    FixedLlrSpec.suggested(SoftAlgorithm.MAX_LOG, rom, o, QFormat.parse("Q4.1")));
            int[] codes = new int[1];
            d.llr(-256, 307, odd ? 1 : 0, codes, 0);
            assertEquals(codes[0], root.get("fixed").get(0).get("bits").get(0).get("llrCode").asInt());
        }
        Run text = run("demap", "-c", "pi2bpsk", "--sample", "0.2,-0.9", "--n0", "1", "--odd-symbol");
        assertEquals(0, text.status(), text.err());
        assertTrue(text.out().contains("symbol         odd index: the points are turned by +90 degrees"), text.out());
        assertTrue(text.out().contains("slicers        float 1, fixed 1"), text.out()); // odd points ±j: Q < 0
    }

    @Test
    void theOddSymbolSwitchIsRefusedWhereParityMeansNothing() {
        Run r = run("demap", "-c", "qam16", "--sample", "0,0", "--n0", "1", "--odd-symbol");
        assertEquals(2, r.status());
        assertEquals("", r.out());
        assertTrue(r.err().contains("--odd-symbol: qam16 treats every symbol alike; only pi/2-BPSK"), r.err());
    }

    @Test
    void algorithmsThatDoNotApplyAreListedWithTheReason() {
        Run r = run("demap", "-c", "psk8", "--sample", "0.7,0.2", "--esn0", "6");
        assertEquals(0, r.status(), r.err());
        assertTrue(r.out().contains("max-log-per-axis  n/a: max-log-per-axis needs a separable constellation"),
                r.out());
    }

    @Test
    void unscaledOutputsAreMetricsAndSaySo() throws Exception {
        JsonNode root = json("demap", "-c", "qam16", "--sample", "1.2,0.1", "--esn0", "8", "--scaling", "unscaled",
                "--metric", "Q3.9,floor,saturate", "--json");
        JsonNode fixed = root.get("fixed").get(0);
        assertEquals("unscaled", fixed.get("spec").get("scaling").asText());
        assertEquals(1, fixed.get("scaleConstant").get("code").asInt());
    }

    @Test
    void badInputGivesOneLineAndStatusTwo() {
        String[][] cases = {
            {"demap", "-c", "qam16", "--sample", "NaN,0", "--n0", "1"},
            {"demap", "-c", "qam16", "--sample", "0.1,0", "--n0", "0"},
            {"demap", "-c", "qam16", "--sample", "0.1,0", "--n0", "-2"},
            {"demap", "-c", "qam16", "--sample", "0.1,zero", "--n0", "1"},
            {"demap", "-c", "qam16", "--sample", "0.1", "--n0", "1"},
            {"demap", "-c", "qam16", "--codes", "1.5,0", "--n0", "1"},
            {"demap", "-c", "qam16", "--codes", "5000,0", "--n0", "1"},
            {"demap", "-c", "qam16", "--sample", "0,0", "--codes", "0,0", "--n0", "1"},
            {"demap", "-c", "qam16", "--sample", "0,0"},
            {"demap", "-c", "qam16", "--sample", "0,0", "--n0", "1", "--esn0", "3"},
            {"demap", "-c", "qam16", "--sample", "0,0", "--n0", "1", "--llr", "Q4.1,round,saturate"},
            {"demap", "-c", "qam16", "--sample", "0,0", "--n0", "1", "--input-format", "Q2.x"},
            {"demap", "-c", "qam16", "--normalization", "none", "--sample", "0,0", "--n0", "1", "--input-format",
                "Q0.6"},
            {"demap", "-c", "qam16", "--sample", "0,0", "--n0", "1", "--scaling", "unscaled", "--scale-constant",
                "UQ4.12"},
            {"demap", "-c", "qam99", "--sample", "0,0", "--n0", "1"},
            {"demap", "-c", "pi2bpsk", "--sample", "0.5", "--n0", "1"}, // odd symbols need Q: no 1-D shorthand
            {"demap", "-c", "psk8", "--sample", "0,0", "--n0", "1", "--odd-symbol"},
        };
        for (String[] args : cases) {
            Run r = run(args);
            String what = String.join(" ", args);
            assertEquals(ExitStatus.USAGE, r.status(), what);
            assertEquals("", r.out(), "no partial output: " + what);
            assertEquals(1, r.err().strip().lines().count(), what + ": " + r.err());
            assertTrue(r.err().startsWith("fixmod demap: "), r.err());
        }
    }

    @Test
    void helpShowsExamples() {
        Run r = run("demap", "--help");
        assertEquals(0, r.status());
        assertTrue(r.out().contains("Examples:") && r.out().contains("fixmod demap -c qam16 --sample 0.3,-0.7"),
                r.out());
    }
}
