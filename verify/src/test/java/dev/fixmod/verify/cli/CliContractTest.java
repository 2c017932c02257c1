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
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestFactory;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;

/**
 * The command-line contract every fixmod command keeps, checked on every registered subcommand (walked recursively,
 * so a command added later is checked without editing this test): a description, a help footer with examples and
 * the exit statuses, {@code --help} exits 0, an unknown option exits 2 with one line on stderr and no stack trace,
 * and no ANSI escape reaches output that is not a terminal. The exit statuses are fixmod's own (documented in
 * {@link ExitStatus} and the root help).
 */
class CliContractTest {

    record Run(int status, String out, String err) {
    }

    static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = FixmodCommand.commandLine(new PrintWriter(out, true), new PrintWriter(err, true)).execute(args);
        return new Run(status, out.toString(), err.toString());
    }

    /** Every command as the words that call it, the root first ({@code []}). */
    static List<List<String>> commands() {
        List<List<String>> all = new ArrayList<>();
        walk(FixmodCommand.commandLine(new PrintWriter(new StringWriter()), new PrintWriter(new StringWriter())),
                new ArrayList<>(), all);
        return all;
    }

    private static void walk(CommandLine c, List<String> words, List<List<String>> all) {
        all.add(List.copyOf(words));
        c.getSubcommands().forEach((name, sub) -> {
            // picocli's own help command has no footer to give; 'fixmod help X' is checked through --help below.
            if (sub.getCommand() instanceof CommandLine.HelpCommand
                    || !sub.getCommandName().equals(name)) { // aliases are the same command
                return;
            }
            List<String> next = new ArrayList<>(words);
            next.add(name);
            walk(sub, next, all);
        });
    }

    static CommandLine.Model.CommandSpec specOf(List<String> words) {
        CommandLine c = FixmodCommand.commandLine(new PrintWriter(new StringWriter()),
                new PrintWriter(new StringWriter()));
        for (String w : words) {
            c = c.getSubcommands().get(w);
        }
        return c.getCommandSpec();
    }

    static String label(List<String> words) {
        return ("fixmod " + String.join(" ", words)).trim();
    }

    static String[] with(List<String> words, String... more) {
        List<String> args = new ArrayList<>(words);
        args.addAll(Arrays.asList(more));
        return args.toArray(String[]::new);
    }

    @Test
    void theWalkFindsTheCommandsOnMain() {
        List<String> labels = commands().stream().map(CliContractTest::label).toList();
        // The commands merged so far; the walk must find at least these (more join as branches land).
        for (String expected : List.of("fixmod", "fixmod constellation", "fixmod compare", "fixmod vectors",
                "fixmod vectors generate", "fixmod vectors check", "fixmod vectors list")) {
            assertTrue(labels.contains(expected), expected + " missing from " + labels);
        }
    }

    @TestFactory
    Stream<DynamicTest> everyCommandHasADescriptionAndAnExamplesFooter() {
        return commands().stream().map(words -> DynamicTest.dynamicTest(label(words), () -> {
            CommandLine.Model.UsageMessageSpec usage = specOf(words).usageMessage();
            String description = String.join(" ", usage.description()).trim();
            assertFalse(description.isEmpty(), label(words) + ": no description");
            List<String> footer = Arrays.asList(usage.footer());
            int examples = footer.indexOf("Examples:");
            assertTrue(examples >= 0, label(words) + ": the footer has no 'Examples:' heading: " + footer);
            assertTrue(examples + 1 < footer.size() && footer.get(examples + 1).startsWith("  " + label(words)),
                    label(words) + ": the first example does not call the command itself: " + footer);
            assertTrue(footer.stream().anyMatch(l -> l.startsWith("Exit status:")),
                    label(words) + ": the footer does not document the exit status");
        }));
    }

    @TestFactory
    Stream<DynamicTest> helpExitsZeroWithoutEscapes() {
        return commands().stream().map(words -> DynamicTest.dynamicTest(label(words), () -> {
            Run r = run(with(words, "--help"));
            assertEquals(0, r.status(), label(words) + " --help: " + r.err());
            assertTrue(r.out().contains("Examples:"), r.out());
            assertEquals("", r.err());
            assertFalse(r.out().indexOf('\u001B') >= 0, "ANSI escape in captured --help output");
        }));
    }

    @TestFactory
    Stream<DynamicTest> anUnknownOptionIsOneLineAndStatusTwo() {
        return commands().stream().map(words -> DynamicTest.dynamicTest(label(words), () -> {
            Run r = run(with(words, "--no-such-option"));
            assertEquals(ExitStatus.USAGE, r.status(), label(words) + ": " + r.err());
            assertEquals("", r.out(), "nothing on stdout after a usage error");
            List<String> lines = r.err().lines().toList();
            assertEquals(1, lines.size(), "exactly one line on stderr: " + r.err());
            assertTrue(lines.get(0).contains("--no-such-option"), "the message names the option: " + lines.get(0));
            assertFalse(r.err().contains("Exception") || r.err().contains("\tat "), r.err());
            assertFalse(r.err().indexOf('\u001B') >= 0, "ANSI escape in captured stderr");
        }));
    }

    @Test
    void versionNamesTheTool() {
        Run r = run("--version");
        assertEquals(0, r.status());
        assertTrue(r.out().startsWith("fixmod " + Version.TOOL_VERSION + "\n"), r.out());
    }

    @Test
    void noCommandAndHelpCommandPrintUsage() {
        Run none = run();
        assertEquals(0, none.status());
        assertTrue(none.out().contains("Usage: fixmod"), none.out());
        Run help = run("help", "compare");
        assertEquals(0, help.status());
        assertTrue(help.out().contains("Usage: fixmod compare"), help.out());
        Run unknown = run("no-such-command");
        assertEquals(ExitStatus.USAGE, unknown.status());
        assertEquals(1, unknown.err().lines().count(), unknown.err());
    }

    @Test
    void messagesStayOneReadableLine() {
        String x = "x".repeat(100_000);
        // common practice, no source: a message quotes the offending input, but not a megabyte of it
        assertEquals("fixmod vectors generate: name: '" + "x".repeat(60) + "...' (100000 characters) is not a set"
                + " name", FixmodCommand.oneLine("fixmod vectors generate: name: '" + x + "' is not a set name"));
        assertEquals("a: not valid JSON: b at line 3", FixmodCommand.oneLine("a: not valid JSON: b\n at line 3\n"));
        assertEquals("short 'quoted' stays", FixmodCommand.oneLine("short 'quoted' stays"));
        assertEquals(1000, FixmodCommand.oneLine("y".repeat(5000)).length(), "cut to 1000 characters");
    }

    /**
     * In a real process whose stdout and stderr are files, not a terminal, picocli's AUTO colour scheme must emit no
     * escape codes, even when the environment claims a colour terminal.
     */
    @Test
    void aChildProcessWritingToFilesGetsNoEscapes(@TempDir Path dir) throws IOException, InterruptedException {
        Path java = Path.of(System.getProperty("java.home"), "bin", "java");
        Path out = dir.resolve("out.txt");
        Path err = dir.resolve("err.txt");
        ProcessBuilder pb = new ProcessBuilder(java.toString(), "-cp", System.getProperty("java.class.path"),
                FixmodCommand.class.getName(), "compare", "--help")
                .redirectOutput(out.toFile()).redirectError(err.toFile());
        pb.environment().put("TERM", "xterm-256color");
        pb.environment().put("COLORTERM", "truecolor");
        Process p = pb.start();
        assertTrue(p.waitFor(60, TimeUnit.SECONDS), "child JVM did not finish");
        assertEquals(0, p.exitValue(), Files.readString(err));
        String text = Files.readString(out, StandardCharsets.UTF_8);
        assertTrue(text.contains("Usage: fixmod compare"), text);
        assertFalse(text.indexOf('\u001B') >= 0, "ANSI escape written to a file");

        Process bad = new ProcessBuilder(java.toString(), "-cp", System.getProperty("java.class.path"),
                FixmodCommand.class.getName(), "compare", "--no-such-option")
                .redirectOutput(out.toFile()).redirectError(err.toFile()).start();
        assertTrue(bad.waitFor(60, TimeUnit.SECONDS));
        assertEquals(ExitStatus.USAGE, bad.exitValue(), "System.exit carries the status");
        String e = Files.readString(err, StandardCharsets.UTF_8);
        assertEquals(1, e.lines().count(), e);
        assertFalse(e.indexOf('\u001B') >= 0);
    }
}
