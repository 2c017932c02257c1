package dev.fixmod.verify.compare;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
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
 * The proof on a real simulator: the bundled Verilog LLR demapper, simulated by Icarus Verilog on the golden
 * stimulus, agrees with the golden set word for word; deliberately broken builds of it are caught and diagnosed
 * with the right first vector, field and LSB difference. Skipped, with a message, where iverilog is not installed.
 */
class HdlProofTest {
    static final Path HDL = Paths.get("src", "test", "hdl");

    @TempDir
    static Path dir;
    static Path set;

    @BeforeAll
    static void setUp() throws IOException {
        set = HdlGoldenSet.write(dir.resolve("set"));
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

    /** Compiles the design with the given defines, simulates it on the golden stimulus, returns the dump. */
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
        run(work, "vvp", "-n", "sim.vvp", "+stim=" + set.resolve("demapper-in.hex").toAbsolutePath(),
                "+dump=" + dump.toAbsolutePath(), "+count=" + NrQam16LlrModel.stimulus().length);
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

    /** The first vector, field and difference where a broken model departs from the golden one. */
    record FirstDifference(int index, String field, long diff) {
    }

    static FirstDifference firstDifference(NrQam16LlrModel broken) {
        long[] stim = NrQam16LlrModel.stimulus();
        NrQam16LlrModel golden = NrQam16LlrModel.golden();
        for (int n = 0; n < stim.length; n++) {
            long g = golden.llrWord(stim[n]);
            long b = broken.llrWord(stim[n]);
            for (WordLayout.Field f : NrQam16LlrModel.LLR_LAYOUT.fields()) {
                if (f.extract(g) != f.extract(b)) {
                    return new FirstDifference(n, f.name(), f.extract(b) - f.extract(g));
                }
            }
        }
        throw new AssertionError("the broken model agrees everywhere: the variant tests nothing");
    }

    static void assertFirstMismatch(JsonNode report, FirstDifference expected) {
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

    @Test
    void bundledDesignAgreesWithTheGoldenSet() throws Exception {
        requireSimulator();
        Path dump = simulate("golden");
        Result r = compare(set.toString(), "--port", "llr", "--dut", dump.toString(), "--latency", "2", "--json");
        assertEquals(0, r.status(), r.out() + r.err());
        JsonNode rep = r.report();
        assertTrue(rep.path("agree").asBoolean());
        assertEquals(512, rep.path("compared").asLong());
        assertEquals(0, rep.path("mismatched").asLong());
        // The testbench writes from the first stimulus cycle plus 4 flush cycles: 4 - 2 words remain after the set.
        assertEquals(2, rep.path("extraWords").asLong());
        // Sign-only and flag subsets see the same agreement.
        assertEquals(0, compare(set.toString(), "--port", "llr", "--dut", dump.toString(), "--latency", "2",
                "--sign-only", "--flags", "llr-at-max", "--quiet").status());
    }

    @Test
    void truncationInsteadOfHalfUpIsCaughtAtTheRightVector() throws Exception {
        requireSimulator();
        Path dump = simulate("truncate", "LLR_TRUNCATE");
        Result r = compare(set.toString(), "--port", "llr", "--dut", dump.toString(), "--latency", "2", "--json");
        assertEquals(1, r.status(), r.err());
        JsonNode rep = r.report();
        assertFirstMismatch(rep, firstDifference(new NrQam16LlrModel(Rounding.FLOOR, 31)));
        assertEquals("one-lsb", rep.path("diagnoses").get(0).path("kind").asText());
    }

    @Test
    void saturationLimitOffByOneIsCaughtAndNamed() throws Exception {
        requireSimulator();
        Path dump = simulate("saturation", "LLR_SAT_OFF_BY_ONE");
        Result r = compare(set.toString(), "--port", "llr", "--dut", dump.toString(), "--latency", "2", "--json");
        assertEquals(1, r.status(), r.err());
        JsonNode rep = r.report();
        FirstDifference expected = firstDifference(new NrQam16LlrModel(Rounding.HALF_UP, 30));
        assertEquals(-1, expected.diff());
        assertFirstMismatch(rep, expected);
        assertEquals("saturation-limit", rep.path("diagnoses").get(0).path("kind").asText());
        // Every mismatching vector has an LLR at the limit, so the flag breakdown puts them all under llr-at-max.
        for (JsonNode f : rep.path("flags")) {
            if (f.path("flag").asText().equals("llr-at-max")) {
                assertEquals(rep.path("mismatched").asLong(), f.path("mismatched").asLong());
            }
        }
    }

    @Test
    void extraLatencyFailsWithoutAlignmentAndIsRecoveredByTheSearch() throws Exception {
        requireSimulator();
        Path dump = simulate("latency", "LLR_EXTRA_LATENCY");
        Result fixed = compare(set.toString(), "--port", "llr", "--dut", dump.toString(), "--latency", "2",
                "--json");
        assertEquals(1, fixed.status(), fixed.err());
        JsonNode rep = fixed.report();
        JsonNode diagnosis = rep.path("diagnoses").get(0);
        assertEquals("latency", diagnosis.path("kind").asText());
        assertTrue(diagnosis.path("message").asText().contains("--latency 3"), diagnosis.toString());
        assertEquals(0, rep.path("mismatches").get(0).path("index").asLong());

        Result searched = compare(set.toString(), "--port", "llr", "--dut", dump.toString(), "--align-window", "8",
                "--json");
        assertEquals(0, searched.status(), searched.out());
        assertEquals(3, searched.report().path("alignment").path("latency").asInt());
    }
}
