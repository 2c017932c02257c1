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
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Every {@code fixmod} command in a code block of README.md is run by a test, so the README cannot go stale. The
 * commands of the compare walk-through are run by {@code compare.ReadmeWalkthroughTest} (it needs a simulator), the
 * {@code fixmod loss} commands of the loss walk-through by {@link LossCommandTest}, {@code ./fixmod demo} by
 * {@code demo.DemoTest} (into a temporary folder); this test runs all the others, in order, as written: paths that
 * exist in the repository are read from there, other relative paths and /tmp/ are in a temporary folder, and
 * {@code > FILE} receives the standard output. A trailing {@code # exit N} comment states the expected status
 * (default 0).
 */
class ReadmeCommandsTest {
    private static final Path ROOT = Path.of("").toAbsolutePath().getParent();
    private static final Pattern EXIT = Pattern.compile("#\\s*exit (\\d)");
    /** Run by DemoTest with -o into a temporary folder, the only difference from the README's form. */
    static final String DEMO = "./fixmod demo";

    @TempDir
    Path tmp;

    /** One command line of a code block and where it stands. */
    record Line(String text, boolean inCompareWalkthrough, boolean inLossSection) {
    }

    static List<Line> commandLines() throws IOException {
        List<String> lines = Files.readAllLines(ROOT.resolve("README.md"), StandardCharsets.UTF_8);
        List<Line> out = new ArrayList<>();
        boolean inBlock = false;
        boolean walkthrough = false;
        boolean loss = false;
        for (int i = 0; i < lines.size(); i++) {
            String l = lines.get(i);
            if (l.startsWith("## ")) {
                loss = false;
            }
            if (l.startsWith("#") && l.contains(" Quantization loss")) {
                loss = true;
            }
            if (l.startsWith("```")) {
                inBlock = !inBlock;
                walkthrough = inBlock && i > 0 && lines.get(i - 1).equals("<!-- compare-walkthrough -->");
                continue;
            }
            String t = l.strip();
            if (inBlock && (t.startsWith("./fixmod ") || t.startsWith("fixmod ") || t.equals("./fixmod"))) {
                out.add(new Line(t, walkthrough, loss));
            }
        }
        return out;
    }

    @Test
    void everyReadmeCommandIsRunByATest() throws IOException {
        List<Line> lines = commandLines();
        assertTrue(lines.stream().anyMatch(l -> l.text().equals(DEMO)), "the quick start shows " + DEMO);
        int here = 0;
        for (Line line : lines) {
            if (line.inCompareWalkthrough() || line.text().equals(DEMO)
                    || (line.inLossSection() && line.text().startsWith("./fixmod loss "))) {
                continue;
            }
            run(line.text());
            here++;
        }
        assertTrue(here >= 10, "the constellation and DSP walk-through commands run here: " + here);
    }

    private void run(String line) throws IOException {
        String command = line;
        int expect = 0;
        Matcher m = EXIT.matcher(command);
        if (m.find()) {
            expect = Integer.parseInt(m.group(1));
        }
        int hash = command.indexOf(" #");
        if (hash >= 0) {
            command = command.substring(0, hash);
        }
        assertFalse(command.contains("\"") || command.contains("'") || command.contains("|"),
                "README commands are plain words (no quoting or pipes): " + line);
        String[] words = command.strip().split("\\s+");
        List<String> args = new ArrayList<>();
        Path redirect = null;
        for (int i = 1; i < words.length; i++) {
            String w = words[i];
            if (w.equals(">")) {
                redirect = tmp.resolve(words[++i]);
                continue;
            }
            args.add(path(w));
        }
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = FixmodCommand.commandLine(new PrintWriter(out), new PrintWriter(err))
                .execute(args.toArray(new String[0]));
        assertEquals(expect, status, line + "\n" + out + err);
        assertTrue(err.toString().isEmpty() || expect != 0, line + " wrote to standard error:\n" + err);
        if (redirect != null) {
            Files.writeString(redirect, out.toString(), StandardCharsets.UTF_8);
        }
    }

    /** A repository file stays where it is; other relative paths and /tmp/ go to the temporary folder. */
    private String path(String w) {
        if (w.startsWith("/tmp/")) {
            return tmp.resolve(w.substring(5)).toString();
        }
        if (w.startsWith("-") || w.startsWith("/") || !(w.contains("/") || w.contains("."))) {
            return w;
        }
        if (Files.exists(ROOT.resolve(w))) {
            return ROOT.resolve(w).toString();
        }
        return w.matches("[0-9.,:-]+|[a-z]+:[a-z0-9]+") ? w : tmp.resolve(w).toString();
    }
}
