package dev.fixmod.verify.compare;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.verify.cli.FixmodCommand;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Runs every command of the README's compare walk-through as written (from the repository root, with /tmp/ moved
 * into a temporary folder): simulator commands as processes, {@code ./fixmod} in process, and checks the exit status
 * and the word each comment promises. Without iverilog the simulator commands, and the commands that read what
 * they would have written, are skipped with a message; the others still run.
 */
class ReadmeWalkthroughTest {
    private static final Path ROOT = Paths.get("..").toAbsolutePath().normalize();
    private static final Pattern EXPECT = Pattern.compile("#\\s*exit (\\d)(?:[:,]\\s*(\\S+))?");
    private static final Set<String> SIMULATOR = Set.of("iverilog", "vvp");

    @TempDir
    Path tmp;

    static List<String> walkthrough() throws Exception {
        List<String> lines = Files.readAllLines(ROOT.resolve("README.md"));
        int start = lines.indexOf("<!-- compare-walkthrough -->");
        assertTrue(start >= 0, "README.md lacks the compare walk-through marker");
        List<String> commands = new ArrayList<>();
        assertEquals("```", lines.get(start + 1));
        for (int i = start + 2; !lines.get(i).equals("```"); i++) {
            commands.add(lines.get(i));
        }
        return commands;
    }

    /** The files a simulator command writes: iverilog's {@code -o FILE}, vvp's {@code +dump=FILE}. */
    private static List<String> outputsOf(String[] words) {
        List<String> out = new ArrayList<>();
        for (int i = 0; i < words.length; i++) {
            if (words[i].equals("-o") && i + 1 < words.length) {
                out.add(words[i + 1]);
            } else if (words[i].startsWith("+dump=")) {
                out.add(words[i].substring("+dump=".length()));
            }
        }
        return out;
    }

    @Test
    void everyDocumentedCommandWorks() throws Exception {
        boolean simulator = HdlProofTest.simulatorPresent();
        List<String> commands = walkthrough();
        List<String> missing = new ArrayList<>();
        int fixmodRuns = 0;
        int simulatorRuns = 0;
        for (String line : commands) {
            String command = line.replace("/tmp/", tmp.toString() + "/");
            Matcher m = EXPECT.matcher(command);
            String expectWord = null;
            int expectStatus = 0;
            if (m.find()) {
                expectStatus = Integer.parseInt(m.group(1));
                expectWord = m.group(2);
                command = command.substring(0, m.start()).trim();
            }
            String[] words = command.trim().split("\\s+");
            boolean needsMissing = missing.stream().anyMatch(command::contains);
            if ((SIMULATOR.contains(words[0]) && !simulator) || needsMissing) {
                System.err.println("ReadmeWalkthroughTest: SKIPPED (iverilog is not installed): " + line);
                missing.addAll(outputsOf(words));
                continue;
            }
            if (words[0].equals("./fixmod")) {
                List<String> args = new ArrayList<>();
                for (int i = 1; i < words.length; i++) {
                    String w = words[i];
                    boolean relativePath = !w.startsWith("-") && !w.startsWith("/") && w.contains("/");
                    args.add(relativePath ? ROOT.resolve(w).toString() : w);
                }
                StringWriter out = new StringWriter();
                StringWriter err = new StringWriter();
                int status = FixmodCommand.commandLine(new PrintWriter(out), new PrintWriter(err))
                        .execute(args.toArray(new String[0]));
                assertEquals(expectStatus, status, line + "\n" + out + err);
                if (expectWord != null) {
                    assertTrue(out.toString().contains(expectWord), line + " should print " + expectWord + ":\n" + out);
                }
                fixmodRuns++;
            } else {
                assertTrue(SIMULATOR.contains(words[0]), "the walk-through runs only ./fixmod and the simulator: " + line);
                Process p = new ProcessBuilder(words).directory(ROOT.toFile()).redirectErrorStream(true).start();
                String output = new String(p.getInputStream().readAllBytes());
                assertTrue(p.waitFor(120, TimeUnit.SECONDS), line);
                assertEquals(expectStatus, p.exitValue(), line + "\n" + output);
                simulatorRuns++;
            }
        }
        if (simulator) {
            assertEquals(4, simulatorRuns, "the walk-through simulates the good and the broken build");
            assertEquals(4, fixmodRuns, "the walk-through generates the set and compares three times");
        } else {
            assertEquals(1, fixmodRuns, "without a simulator only the set generation runs");
        }
    }
}
