package dev.fixmod.verify.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code fixmod loss} through the real command line: bad specs, sharding, and the README's commands. */
class LossCommandTest {
    @TempDir
    Path dir;

    record Run(int status, String out, String err) {
    }

    static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = FixmodCommand.commandLine(new PrintWriter(out), new PrintWriter(err)).execute(args);
        return new Run(status, out.toString(), err.toString());
    }

    private static final String SMALL = "{\"constellation\": \"qpsk\", \"noise\": {\"eb-n0-db\": [0, 2, 4]},"
            + " \"simulation\": {\"min-bits\": 4000, \"max-bits\": 8000, \"chunk-symbols\": 512},"
            + " \"targets\": {\"ber\": 0.05, \"gmi\": 1.5},"
            + " \"sweep\": [{\"parameter\": \"llr-word-length\", \"values\": [3, 5]},"
            + " {\"parameter\": \"rounding\", \"values\": [\"floor\", \"half-even\"]}]}";

    private void assertRefused(String json, String expectedStart) throws IOException {
        Path spec = dir.resolve("bad.json");
        Files.writeString(spec, json);
        Path out = dir.resolve("out");
        Run r = run("loss", spec.toString(), "-o", out.toString(), "--quiet");
        assertEquals(ExitStatus.USAGE, r.status(), r.err());
        assertEquals("", r.out());
        assertEquals(1, r.err().strip().split("\n").length, "one line: " + r.err());
        assertTrue(r.err().startsWith("fixmod loss: " + spec + ":1:"), r.err());
        assertTrue(r.err().contains(": " + expectedStart), r.err());
        assertFalse(Files.exists(out), "nothing written");
        try (Stream<Path> left = Files.list(dir)) {
            assertEquals(List.of(spec), left.toList(), "no temporary folder left behind");
        }
    }

    @Test
    void badSpecsGiveOneMessageWithTheJsonPathAndWriteNothing() throws IOException {
        assertRefused("{\"demapper\": {\"llr\": {\"format\": \"Q5.x\"}}}", "demapper.llr.format: ");
        assertRefused("{\"noise\": {\"eb-n0-db\": [4, 2]}}", "noise.eb-n0-db[1]: 2.0 dB does not follow");
        assertRefused("{\"sweep\": [{\"parameter\": \"llr-word-length\", \"values\": [4, 13]}]}",
                "sweep[0].values[1]: ");
        assertRefused("{\"sweep\": [{\"parameter\": \"adc-bits\", \"values\": [4]}]}",
                "sweep[0].parameter: unknown sweep parameter 'adc-bits'; expected one of input-word-length,");
        assertRefused("{\"demapper\": {\"algorithm\": \"log-map\"}}", "demapper.algorithm: log-map has no");
        assertRefused("{\"targets\": {\"gmi\": 5}}", "targets.gmi: 5.0 is not a target rate for 4 bits");
        assertRefused("{\"simulaton\": {}}", "simulaton: unknown key \"simulaton\"; expected one of schema,");
        // A design whose input format cannot hold the constellation is caught before anything runs.
        assertRefused("{\"sweep\": [{\"parameter\": \"input-word-length\", \"values\": [12, 3]}]}",
                "sweep[0].values[1]: ");
    }

    @Test
    void shardedAndMergedEqualsUnshardedByteForByte() throws IOException {
        Path spec = dir.resolve("small.json");
        Files.writeString(spec, SMALL);
        Run whole = run("loss", spec.toString(), "-o", dir.resolve("whole").toString(), "--threads", "2");
        assertEquals(0, whole.status(), whole.err());
        List<String> parts = new ArrayList<>(List.of("loss", "merge"));
        for (int i = 3; i >= 1; i--) {
            Path part = dir.resolve("part" + i + ".json");
            Run r = run("loss", spec.toString(), "--shard", i + "/3", "-o", part.toString(), "--threads", "1");
            assertEquals(0, r.status(), r.err());
            parts.add(part.toString());
        }
        parts.add("-o");
        parts.add(dir.resolve("merged").toString());
        Run merged = run(parts.toArray(String[]::new));
        assertEquals(0, merged.status(), merged.err());
        for (String f : List.of("results.json", "results.csv", "report.md")) {
            assertArrayEquals(Files.readAllBytes(dir.resolve("whole").resolve(f)),
                    Files.readAllBytes(dir.resolve("merged").resolve(f)), f);
        }
        String md = Files.readString(dir.resolve("whole/report.md"));
        assertTrue(md.contains("Engineering model, not conformance certification"), md);
        assertTrue(md.contains("### rounding: choose "), md);
        // A missing shard is refused.
        Run missing = run("loss", "merge", dir.resolve("part1.json").toString(), "-o", dir.resolve("m2").toString());
        assertEquals(ExitStatus.USAGE, missing.status());
        assertEquals("fixmod loss merge: shard 2/3 is missing; give all 3 partial results\n",
                missing.err().replace(System.lineSeparator(), "\n"));
        assertFalse(Files.exists(dir.resolve("m2")));
    }

    @Test
    void damagedPartsGiveOneLineNamingTheFileAndTheKeyAndWriteNothing() throws IOException {
        Path spec = dir.resolve("small.json");
        Files.writeString(spec, SMALL);
        Path p1 = dir.resolve("p1.json");
        Path p2 = dir.resolve("p2.json");
        for (int i = 1; i <= 2; i++) {
            Run r = run("loss", spec.toString(), "--shard", i + "/2", "-o", dir.resolve("p" + i + ".json").toString(),
                    "--threads", "1");
            assertEquals(0, r.status(), r.err());
        }
        String part = Files.readString(p2);
        // Each damage: a regular expression on the writer's compact JSON, what replaces it, and the message's tail.
        String[][] damages = {
            {"\"symbols\":\\d+,", "", "points[0].symbols: missing key; expected an integer from 0 to "},
            {"\"float-bit-errors\":(\\d+)", "\"float-bit-errors\":\"$1\"",
                "points[0].float-bit-errors: expected an integer from 0 to 9223372036854775807, got the string \""},
            {"\"fixed-bit-errors\":(\\d+)", "\"fixed-bit-errors\":$1.5",
                "points[0].fixed-bit-errors: expected an integer from 0 to 9223372036854775807, got the number "},
            {"\"input-clips\":\\d+", "\"input-clips\":-3",
                "points[0].input-clips: expected an integer from 0 to 9223372036854775807, got the number -3"},
            {"\"design\":\\d+", "\"design\":null", "points[0].design: expected an integer from 0 to 2147483647, got null"},
            {"\"float-gmi\":\"[^\"]*\"", "\"float-gmi\":1.5",
                "points[0].float-gmi: expected a double in hexadecimal as fixmod writes it (e.g. \"0x1.8p-3\"), got the"
                        + " number 1.5"},
            {"\"input-error-energy\":\"[^\"]*\"", "\"input-error-energy\":\"0.25\"",
                "points[0].input-error-energy: expected a double in hexadecimal as fixmod writes it"},
            {"\"histogram\":\\[\\d+", "\"histogram\":[\"7\"",
                "points[0].histogram[0]: expected an integer from 0 to 9223372036854775807, got the string \"7\""},
            {"\"histogram\":\\[\\d+,", "\"histogram\":[",
                "points[0].histogram: "},
            {"\"histogram\":\\[[^\\]]*\\]", "\"histogram\":{}",
                "points[0].histogram: expected an array of counts, got an object"},
            {"\"bits-per-symbol\":\\d+", "\"bits-per-symbol\":true",
                "points[0].bits-per-symbol: expected an integer from 1 to 31, got the boolean true"},
            {"\"output-events\":\\d+\\}", "\"output-events\":0,\"x-extra\":1}",
                "points[0].x-extra: unknown key \"x-extra\"; a point has design, snr,"},
            {"\"shard\":2,", "", "shard: missing key; expected an integer from 1 to 999999"},
            {"\"shards\":2", "\"shards\":\"2\"", "shards: expected an integer from 1 to 999999, got the string \"2\""},
            {"\"spec\":\"(?:[^\"\\\\]|\\\\.)*\"", "\"spec\":7", "spec: expected a string, got the number 7"},
            {"^\\{", "{\"x-unknown\":1,", "x-unknown: unknown key \"x-unknown\"; a partial result has schema, version,"},
            {"\"spec-source\":\"[^\"]*\",", "", "spec-source: missing key; expected a string"},
            {"\"version\":1", "\"version\":\"1\"", "version: expected the integer 1, got the string \"1\""},
            {"\"points\":\\[", "\"points\":[3,", "points[0]: expected a point {\"design\": ..., ...}, got the number 3"},
            {"\"snr\":(\\d+)", "\"snr\":$1,\"snr\":$1", "not valid JSON: Duplicate field 'snr'"},
        };
        for (String[] d : damages) {
            String damaged = part.replaceFirst(d[0], d[1]);
            assertTrue(!damaged.equals(part), "the damage " + d[0] + " applies");
            Files.writeString(p2, damaged);
            Path out = dir.resolve("merged");
            Run r = run("loss", "merge", p1.toString(), p2.toString(), "-o", out.toString());
            String what = d[0] + " -> " + d[1] + ": " + r.err();
            assertEquals(ExitStatus.USAGE, r.status(), what);
            assertEquals("", r.out(), what);
            assertEquals(1, r.err().strip().split("\n").length, "one line: " + what);
            assertTrue(r.err().startsWith("fixmod loss merge: " + p2 + ":1:"), what);
            assertTrue(r.err().contains(": " + d[2]), what);
            assertFalse(Files.exists(out), "nothing written: " + what);
        }
        // The undamaged parts still merge.
        Files.writeString(p2, part);
        Run ok = run("loss", "merge", p1.toString(), p2.toString(), "-o", dir.resolve("merged").toString());
        assertEquals(0, ok.status(), ok.err());
    }

    /** Runs the {@code ./fixmod loss} commands of the README's loss section in order, in a temporary folder. */
    @Test
    void readmeCommandsRunAndTheirReportsAgree() throws IOException {
        Path root = Path.of("").toAbsolutePath().getParent();
        String readme = Files.readString(root.resolve("README.md"));
        int start = readme.indexOf("## Quantization loss");
        assertTrue(start >= 0, "README has a quantization loss section");
        int end = readme.indexOf("\n## ", start + 5);
        String section = readme.substring(start, end < 0 ? readme.length() : end);
        List<String[]> commands = new ArrayList<>();
        for (String line : section.split("\n")) {
            if (line.startsWith("./fixmod loss")) {
                commands.add(line.substring("./fixmod ".length()).trim().split("\\s+"));
            }
        }
        assertEquals(4, commands.size(), "full run, two shards, merge");
        for (String[] args : commands) {
            for (int i = 0; i < args.length; i++) {
                Path p = root.resolve(args[i]);
                args[i] = Files.exists(p) && args[i].contains("/") ? p.toString()
                        : args[i].endsWith(".json") || args[i].startsWith("loss-report") ? dir.resolve(args[i]).toString()
                        : args[i];
            }
            Run r = run(args);
            assertEquals(0, r.status(), String.join(" ", args) + ": " + r.err());
        }
        Path report = dir.resolve("loss-report");
        assertArrayEquals(Files.readAllBytes(report.resolve("results.json")),
                Files.readAllBytes(dir.resolve("loss-report-merged/results.json")));
        String md = Files.readString(report.resolve("report.md"));
        // The README's reading of the example report must stay true.
        assertTrue(md.contains("### llr-word-length: choose 5"), md);
        assertTrue(md.contains("### input-word-length: choose 6"), md);
        assertTrue(Files.readString(report.resolve("report.html")).contains("<svg"));
    }
}
