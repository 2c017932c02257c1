package dev.fixmod.verify.compare;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.fixmod.demap.FixedSoftDemapper;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import dev.fixmod.verify.cli.FixmodCommand;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The proof on a real simulator: the bundled Verilog LLR demapper, simulated by Icarus Verilog on the committed
 * set {@code vectors/nr-qam16}'s stimulus, agrees with that set word for word through {@code fixmod compare};
 * deliberately broken builds of it are caught and diagnosed with the first vector, field and LSB difference that
 * the kernel datapath, run with the same fault, predicts. The simulations are skipped, with a message, where
 * iverilog is not installed.
 */
class HdlProofTest {
    static final Path HDL = Paths.get("src", "test", "hdl");
    /** K per level, exported by the generator into the set (row 0 design level, row l + 1 noise level l). */
    static final Path SCALE = NrQam16Set.FOLDER.resolve("llr-scale.hex");
    /** Registers between the testbench's stimulus and its dump: input, metric, scale, output. */
    static final int LATENCY = 3;
    /** Words the testbench writes after the last vector. */
    static final int FLUSH = 4;

    @TempDir
    static Path dir;
    static NrQam16Set set;

    @BeforeAll
    static void setUp() throws IOException {
        set = NrQam16Set.load();
    }

    static boolean simulatorPresent() {
        try {
            Process p = new ProcessBuilder("iverilog", "-V").redirectErrorStream(true).start();
            p.getInputStream().readAllBytes();
            return p.waitFor(20, TimeUnit.SECONDS) && p.exitValue() == 0;
        } catch (IOException e) {
            return false;
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return false;
        }
    }

    static void requireSimulator() {
        boolean present = simulatorPresent();
        if (!present) {
            System.err.println("HdlProofTest: SKIPPED: iverilog (Icarus Verilog) is not installed;"
                    + " install the Debian package 'iverilog' (.ci/run does) to run the HDL proof");
        }
        Assumptions.assumeTrue(present, "iverilog (Icarus Verilog) is not installed: HDL proof skipped");
    }

    static void run(Path workDir, String... command) throws IOException, InterruptedException {
        Process p = new ProcessBuilder(command).directory(workDir.toFile()).redirectErrorStream(true).start();
        String output = new String(p.getInputStream().readAllBytes());
        assertTrue(p.waitFor(120, TimeUnit.SECONDS), "timed out: " + String.join(" ", command));
        assertEquals(0, p.exitValue(), String.join(" ", command) + " failed:\n" + output);
    }

    /** Compiles the design with the given defines, simulates it on the set's stimulus, returns the dump. */
    static Path simulate(String name, String... defines) throws IOException, InterruptedException {
        Path work = Files.createDirectories(dir.resolve(name));
        List<String> compile = new ArrayList<>(List.of("iverilog", "-g2001", "-Wall", "-o", "sim.vvp"));
        for (String d : defines) {
            compile.add("-D" + d);
        }
        compile.add(HDL.resolve("nr16qam_llr.v").toAbsolutePath().toString());
        compile.add(HDL.resolve("nr16qam_llr_tb.v").toAbsolutePath().toString());
        run(work, compile.toArray(new String[0]));
        Path dump = work.resolve("llr-dump.hex");
        run(work, "vvp", "-n", "sim.vvp", "+stim=" + NrQam16Set.FOLDER.resolve("demapper-in.hex"),
                "+scale=" + SCALE.toAbsolutePath(), "+dump=" + dump.toAbsolutePath(), "+count=" + set.count(),
                "+per_level=" + set.perLevel, "+levels=" + set.levels);
        return dump;
    }

    record Result(int status, String out, String err) {
        JsonNode report() throws IOException {
            return new ObjectMapper().readTree(out).path("reports").get(0);
        }
    }

    static Result compare(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        List<String> all = new ArrayList<>(List.of("compare"));
        all.addAll(List.of(args));
        int status = FixmodCommand.commandLine(new PrintWriter(out), new PrintWriter(err))
                .execute(all.toArray(new String[0]));
        return new Result(status, out.toString(), err.toString());
    }

    static Result compareLlr(Path dump, String... more) {
        List<String> args = new ArrayList<>(List.of(NrQam16Set.FOLDER.toString(), "--port", "llr", "--dut",
                dump.toString()));
        args.addAll(List.of(more));
        return compare(args.toArray(new String[0]));
    }

    static void assertFirstMismatch(JsonNode report, NrQam16Set.FirstDifference expected) {
        JsonNode m = report.path("mismatches").get(0);
        assertEquals(expected.index(), m.path("index").asLong(), report.toPrettyString());
        JsonNode firstBad = null;
        for (JsonNode f : m.path("fields")) {
            if (!f.path("agrees").asBoolean()) {
                firstBad = f;
                break;
            }
        }
        assertEquals(expected.field(), firstBad.path("name").asText());
        assertEquals(expected.diff(), firstBad.path("diffLsb").asLong());
    }

    /** The testbench's inputs are the set's: K per level from the kernel, the level of each vector, the levels. */
    @Test
    void theTestbenchInputsAreTheKernelsAndTheSetsOwn() throws IOException {
        FixedSoftDemapper[] d = set.datapaths(set.goldenSpec());
        List<Long> scale = new ArrayList<>();
        for (String line : Files.readAllLines(SCALE)) {
            String code = line.replaceAll("//.*", "").trim();
            if (!code.isEmpty()) {
                scale.add(Long.parseLong(code, 16));
            }
        }
        assertEquals(d.length, scale.size(), SCALE + ": one K per slot");
        for (int s = 0; s < d.length; s++) {
            assertEquals(d[s].scaleConstantCode(), scale.get(s), SCALE + " line for slot " + s);
        }
        for (int n = 0; n < set.count(); n++) {
            int rule = n < set.levels * set.perLevel ? 1 + n / set.perLevel : 0;
            assertEquals(set.slot[n], rule, "the testbench's noise level of vector " + n);
        }
        // The Verilog's default levels A1, A3 are the reference ROM's codes (3GPP TS 38.211 5.1.3: label 0 = b0..b3
        // 0000 is (1 + j)/sqrt(10), label 2 = 0010 is (3 + j)/sqrt(10)).
        String verilog = Files.readString(HDL.resolve("nr16qam_llr.v"));
        assertTrue(verilog.contains("parameter A1 = " + set.reference.iCode(0) + ","), "A1");
        assertTrue(verilog.contains("parameter A3 = " + set.reference.iCode(2) + ","), "A3");
        // The rebuilt kernel datapath reproduces the committed LLRs, so its variants below predict the faults.
        assertArrayEquals(set.llrWords, set.kernelLlrWords(set.goldenSpec()));
    }

    @Test
    void bundledDesignAgreesWithTheGoldenSet() throws Exception {
        requireSimulator();
        Path dump = simulate("golden");
        Result r = compareLlr(dump, "--latency", String.valueOf(LATENCY), "--json");
        assertEquals(0, r.status(), r.out() + r.err());
        JsonNode rep = r.report();
        assertTrue(rep.path("agree").asBoolean());
        assertEquals(set.count(), rep.path("compared").asLong());
        assertEquals(0, rep.path("mismatched").asLong());
        assertEquals(FLUSH - LATENCY, rep.path("extraWords").asLong());
        // Sign-only and flag subsets see the same agreement.
        assertEquals(0, compareLlr(dump, "--latency", String.valueOf(LATENCY), "--sign-only", "--flags",
                "llr-at-max,tie", "--quiet").status());
    }

    @Test
    void truncationInsteadOfHalfEvenIsCaughtAtTheRightVector() throws Exception {
        requireSimulator();
        Path dump = simulate("truncate", "LLR_TRUNCATE");
        Result r = compareLlr(dump, "--latency", String.valueOf(LATENCY), "--json");
        assertEquals(1, r.status(), r.err());
        JsonNode rep = r.report();
        Quantizer out = set.goldenSpec().output();
        long[] floor = set.kernelLlrWords(set.goldenSpec().withOutput(
                new Quantizer(out.format(), Rounding.FLOOR, out.overflow())));
        assertFirstMismatch(rep, set.firstDifference(floor));
        assertEquals(mismatches(floor), rep.path("mismatched").asLong());
        assertEquals("one-lsb", rep.path("diagnoses").get(0).path("kind").asText());
    }

    @Test
    void saturationLimitOffByOneIsCaughtAndNamed() throws Exception {
        requireSimulator();
        Path dump = simulate("saturation", "LLR_SAT_OFF_BY_ONE");
        Result r = compareLlr(dump, "--latency", String.valueOf(LATENCY), "--json");
        assertEquals(1, r.status(), r.err());
        JsonNode rep = r.report();
        Quantizer out = set.goldenSpec().output();
        long[] plain = set.kernelLlrWords(set.goldenSpec().withOutput(
                new Quantizer(out.format(), out.rounding(), Overflow.SATURATE)));
        NrQam16Set.FirstDifference expected = set.firstDifference(plain);
        assertEquals(-1, expected.diff());
        assertFirstMismatch(rep, expected);
        assertEquals(mismatches(plain), rep.path("mismatched").asLong());
        assertEquals("saturation-limit", rep.path("diagnoses").get(0).path("kind").asText());
        // Every mismatching vector has an LLR at the lowest code, so the flag breakdown puts them under llr-at-min.
        boolean seen = false;
        for (JsonNode f : rep.path("flags")) {
            if (f.path("flag").asText().equals("llr-at-min")) {
                assertEquals(rep.path("mismatched").asLong(), f.path("mismatched").asLong());
                seen = true;
            }
        }
        assertTrue(seen, rep.path("flags").toString());
    }

    @Test
    void extraLatencyFailsWithoutAlignmentAndIsRecoveredByTheSearch() throws Exception {
        requireSimulator();
        Path dump = simulate("latency", "LLR_EXTRA_LATENCY");
        Result fixed = compareLlr(dump, "--latency", String.valueOf(LATENCY), "--json");
        assertEquals(1, fixed.status(), fixed.err());
        JsonNode rep = fixed.report();
        JsonNode diagnosis = rep.path("diagnoses").get(0);
        assertEquals("latency", diagnosis.path("kind").asText());
        assertTrue(diagnosis.path("message").asText().contains("--latency " + (LATENCY + 1)), diagnosis.toString());
        // One word late: vector n meets vector n - 1's word (the reset word, 0, for n = 0).
        long[] late = new long[set.count()];
        for (int n = 1; n < late.length; n++) {
            late[n] = set.llrWords[n - 1];
        }
        assertFirstMismatch(rep, set.firstDifference(late));

        Result searched = compareLlr(dump, "--align-window", "8", "--json");
        assertEquals(0, searched.status(), searched.out());
        assertEquals(LATENCY + 1, searched.report().path("alignment").path("latency").asInt());
    }

    private static long mismatches(long[] words) {
        long n = 0;
        for (int i = 0; i < words.length; i++) {
            n += words[i] != set.llrWords[i] ? 1 : 0;
        }
        return n;
    }
}
