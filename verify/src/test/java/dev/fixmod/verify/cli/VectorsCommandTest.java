package dev.fixmod.verify.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

class VectorsCommandTest {

    record Run(int status, String out, String err) {
    }

    static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = FixmodCommand.commandLine(new PrintWriter(out, true), new PrintWriter(err, true)).execute(args);
        return new Run(status, out.toString(), err.toString());
    }

    static Path spec(Path dir, String text) throws IOException {
        Path f = dir.resolve("spec.json");
        Files.writeString(f, text, StandardCharsets.UTF_8);
        return f;
    }

    static final String SMALL = "{\"constellation\": \"pam4\", \"count\": 20, \"formats\": [\"hex\", \"csv\"]}";

    @Test
    void generateCheckListAndRefuseToOverwrite(@TempDir Path dir) throws IOException {
        Path spec = spec(dir, SMALL);
        Path set = dir.resolve("out/pam4");
        Run g = run("vectors", "generate", spec.toString(), "-o", set.toString());
        assertEquals(0, g.status(), g.err());
        assertTrue(Files.isRegularFile(set.resolve("manifest.json")));
        assertEquals("", g.err(), "no progress bar when stderr is not a terminal");

        Run c = run("vectors", "check", set.toString());
        assertEquals(0, c.status(), c.out() + c.err());

        byte[] before = Files.readAllBytes(set.resolve("llr.hex"));
        Run again = run("vectors", "generate", spec.toString(), "-o", set.toString());
        assertEquals(2, again.status());
        assertTrue(again.err().contains("already exists; give --force"), again.err());
        assertEquals(-1, java.util.Arrays.mismatch(before, Files.readAllBytes(set.resolve("llr.hex"))));

        Run forced = run("vectors", "generate", spec.toString(), "-o", set.toString(), "--force", "--quiet");
        assertEquals(0, forced.status(), forced.err());
        assertEquals("", forced.out());

        Run files = run("vectors", "list", set.toString());
        assertEquals(0, files.status());
        assertTrue(files.out().contains("demapper-in.hex") && files.out().contains("llr.csv"), files.out());
        Run sets = run("vectors", "list", dir.resolve("out").toString());
        assertTrue(sets.out().contains("pam4"), sets.out());
        assertNoLeftovers(dir.resolve("out"));
    }

    @Test
    void checkReportsTamperedFilesWithStatus1(@TempDir Path dir) throws IOException {
        Path set = dir.resolve("s");
        assertEquals(0, run("vectors", "generate", spec(dir, SMALL).toString(), "-o", set.toString()).status());
        Path hex = set.resolve("llr.hex");
        List<String> lines = Files.readAllLines(hex);
        lines.set(3, lines.get(3).equals("00") ? "01" : "00");
        Files.write(hex, lines);
        Files.writeString(set.resolve("extra.txt"), "x");
        Path csv = set.resolve("hard.csv");
        List<String> rows = Files.readAllLines(csv);
        Files.write(csv, rows.subList(0, rows.size() - 1));
        Run c = run("vectors", "check", set.toString());
        assertEquals(1, c.status(), c.out() + c.err());
        assertTrue(c.out().contains("llr.hex: SHA-256"), c.out());
        assertTrue(c.out().contains("llr.hex: regeneration differs from byte"), c.out());
        assertTrue(c.out().contains("extra.txt: present but not listed"), c.out());
        assertTrue(c.out().contains("hard.csv: " + (rows.size() - 1) + " lines, but a header and " + (rows.size() - 1)
                + " vectors need " + rows.size()), c.out());
    }

    @Test
    void listWithoutAFolderShowsTheCommittedSuite() {
        // run from the verify module: the nearest vectors/ folder is the project's
        Run l = run("vectors", "list");
        assertEquals(0, l.status(), l.err());
        assertTrue(l.out().contains("nr-qam16") && l.out().contains("wlan:qam1024"), l.out());
    }

    @ParameterizedTest
    @ValueSource(strings = {"../escape.hex", "/etc/passwd", "sub/dir.hex", ".hidden", "..", "a\\\\b.hex"})
    void checkRejectsManifestNamesOutsideTheSetWithStatus2(String name, @TempDir Path dir) throws IOException {
        Path set = dir.resolve("s");
        assertEquals(0, run("vectors", "generate", spec(dir, SMALL).toString(), "-o", set.toString()).status());
        Path m = set.resolve("manifest.json");
        String before = Files.readString(m);
        String text = before.replace("\"name\" : \"bits.hex\"", "\"name\" : \"" + name + "\"");
        assertFalse(text.equals(before));
        Files.writeString(m, text);
        Run c = run("vectors", "check", set.toString());
        assertEquals(2, c.status(), c.out() + c.err());
        assertTrue(c.err().contains("is not a plain file name inside the set"), c.err());
    }

    @ParameterizedTest
    @ValueSource(strings = {
            "{\"count\": -1}",
            "{\"count\": 1, \"count\": 2}",
            "{\"mapper\": {\"format\": \"Q1.x\"}}",
            "{\"demapper\": {\"llr\": {\"rounding\": \"nearest\"}}}",
            "{\"colour\": \"red\"}",
            "{\"noise\": {\"es-n0-db\": [NaN]}}",
            "{\"formats\": [\"hex\", 3]}",
            "not json"})
    void aMalformedSpecGivesOneLineStatus2AndWritesNothing(String text, @TempDir Path dir) throws IOException {
        Path set = dir.resolve("never");
        Run g = run("vectors", "generate", spec(dir, text).toString(), "-o", set.toString());
        assertEquals(2, g.status());
        assertEquals(1, g.err().lines().count(), g.err());
        assertTrue(g.err().startsWith("fixmod vectors generate: " + dir.resolve("spec.json") + ":"), g.err());
        assertFalse(g.err().contains("Exception"), g.err());
        assertFalse(Files.exists(set));
        assertNoLeftovers(dir);
    }

    @Test
    void helpIsAvailableAtEachLevel() {
        Run top = run("vectors", "--help");
        assertEquals(0, top.status(), top.err());
        assertTrue(top.out().contains("generate") && top.out().contains("check") && top.out().contains("list"));
        Run gen = run("vectors", "generate", "--help");
        assertEquals(0, gen.status(), gen.err());
        assertTrue(gen.out().contains("--force") && gen.out().contains("--threads"), gen.out());
    }

    @Test
    void missingSpecAndMissingSetAreStatus2(@TempDir Path dir) {
        Run g = run("vectors", "generate", dir.resolve("nope.json").toString(), "-o", dir.resolve("x").toString());
        assertEquals(2, g.status());
        assertTrue(g.err().contains("no such file"), g.err());
        Run c = run("vectors", "check", dir.toString());
        assertEquals(2, c.status());
        assertTrue(c.err().contains("not a vector set"), c.err());
    }

    private static void assertNoLeftovers(Path dir) throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            assertEquals(List.of(), s.map(p -> p.getFileName().toString()).filter(n -> n.startsWith(".")).toList());
        }
    }
}
