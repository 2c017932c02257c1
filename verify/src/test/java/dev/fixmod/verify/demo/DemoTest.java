package dev.fixmod.verify.demo;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.verify.cli.FixmodCommand;
import dev.fixmod.verify.loss.LossSpecReader;
import dev.fixmod.verify.vectors.Manifest;
import dev.fixmod.verify.vectors.SpecReader;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code fixmod demo} through the real command line, into a temporary folder. */
class DemoTest {
    @TempDir
    Path tmp;

    record Run(int status, String out, String err) {
    }

    static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = FixmodCommand.commandLine(new PrintWriter(out), new PrintWriter(err)).execute(args);
        return new Run(status, out.toString().replace(System.lineSeparator(), "\n"), err.toString());
    }

    @Test
    void theDemoWritesEveryPartAndItsSetChecks() throws IOException {
        Path demo = tmp.resolve("demo");
        Run r = run("demo", "-o", demo.toString(), "--threads", "2");
        assertEquals(0, r.status(), r.out() + r.err());

        // The specifications are the files the other commands read.
        SpecReader.parse(Files.readString(demo.resolve(Demo.VECTOR_SPEC)), Demo.VECTOR_SPEC);
        LossSpecReader.parse(Files.readString(demo.resolve(Demo.LOSS_SPEC)), Demo.LOSS_SPEC);
        Manifest manifest = Manifest.read(Files.readString(demo.resolve("vectors/manifest.json")), "manifest");
        assertEquals("nr:qam64", manifest.spec().path("constellation").path("name").asText());
        for (String f : new String[] {"report.html", "report.md", "results.json", "results.csv"}) {
            assertTrue(Files.size(demo.resolve(Demo.LOSS_REPORT).resolve(f)) > 0, f);
        }
        String md = Files.readString(demo.resolve(Demo.LOSS_REPORT + "/report.md"));
        assertTrue(md.contains("### input-word-length: choose "), md);
        assertTrue(md.contains("### llr-word-length: choose "), md);

        // The model of the device agrees exactly, at the latency of its pipeline, found by the search.
        String device = Files.readString(demo.resolve(Demo.COMPARE));
        assertTrue(device.startsWith("AGREE     port llr: " + Demo.DUMP + ": 613 of 613 vectors agree"), device);
        assertTrue(device.contains("latency " + DeviceModel.LATENCY + " (searched 0.." + Demo.ALIGN_WINDOW), device);
        // The faulty build: truncation instead of rounding half-even shows as one-LSB differences.
        String faulty = Files.readString(demo.resolve(Demo.FAULTY_COMPARE));
        assertTrue(faulty.startsWith("DISAGREE  port llr: " + Demo.FAULTY_DUMP), faulty);
        assertTrue(faulty.contains("(one-lsb at vector"), faulty);

        // The summary names the scenario, the recommendation, the verdicts and the paths to open.
        assertTrue(r.out().contains("fixmod demo: " + Demo.SCENARIO), r.out());
        assertTrue(r.out().contains("recommended input-word-length: "), r.out());
        assertTrue(r.out().contains("device model, as designed:        AGREE (613 of 613 vectors, latency 3 found)"),
                r.out());
        assertTrue(r.out().contains("diagnosis one-lsb"), r.out());
        for (String p : new String[] {"/loss-report/report.html", "/vectors/manifest.json", "/" + Demo.COMPARE}) {
            assertTrue(r.out().contains(demo + p), p + " in\n" + r.out());
            assertTrue(Files.exists(Path.of(demo + p)), p);
        }
        String summary = Files.readString(demo.resolve(Demo.SUMMARY), StandardCharsets.UTF_8);
        assertTrue(summary.startsWith("fixmod demo: "), summary);

        // The golden set regenerates byte for byte, and the rerun the summary suggests gives the same verdict.
        Run check = run("vectors", "check", demo.resolve("vectors").toString());
        assertEquals(0, check.status(), check.out() + check.err());
        Run compare = run("compare", demo.resolve("vectors").toString(), "--port", "llr", "--dut",
                demo.resolve(Demo.DUMP).toString(), "--align-window", "8");
        assertEquals(0, compare.status(), compare.out());

        // No work folder is left beside the demo.
        try (var s = Files.list(tmp)) {
            assertEquals(1, s.count());
        }
    }

    @Test
    void anExistingFolderThatIsNoDemoIsRefusedAndLeftAlone() throws IOException {
        Path mine = Files.createDirectories(tmp.resolve("mine"));
        Files.writeString(mine.resolve("notes.txt"), "keep me");
        Run r = run("demo", "-o", mine.toString());
        assertEquals(2, r.status());
        assertTrue(r.err().contains("is not a previous demo folder"), r.err());
        assertFalse(r.err().contains("Exception"), r.err());
        assertEquals("keep me", Files.readString(mine.resolve("notes.txt")));
        try (var s = Files.list(tmp)) {
            assertEquals(1, s.count(), "no work folder left");
        }
    }
}
