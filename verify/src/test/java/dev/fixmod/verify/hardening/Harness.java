package dev.fixmod.verify.hardening;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.verify.cli.ExitStatus;
import dev.fixmod.verify.cli.FixmodCommand;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.Comparator;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.AtomicLong;
import java.util.stream.Stream;

/**
 * Runs fixmod on hostile input and judges the outcome: one clear line and exit status 2 for bad input, never a
 * stack trace, never longer than {@link #LIMIT}, never a file changed in the sandbox the run was given.
 */
final class Harness {
    /** Far above any case's cost (milliseconds); a hang or a multi-gigabyte allocation shows up as a timeout. */
    static final Duration LIMIT = Duration.ofSeconds(20);

    /** The longest message a reader should have to take in. */
    static final int MAX_MESSAGE = 1000;

    private static final Map<String, Tally> TALLIES = new ConcurrentHashMap<>();

    private Harness() {
    }

    record Outcome(int status, String out, String err) {
        String describe() {
            return "status " + status + "\n--- stdout:\n" + out + "--- stderr:\n" + err;
        }
    }

    /** Runs {@code fixmod args} through the real command line on captured streams, bounded by {@link #LIMIT}. */
    static Outcome run(String... args) {
        return assertTimeoutPreemptively(LIMIT, () -> {
            StringWriter out = new StringWriter();
            StringWriter err = new StringWriter();
            int status = FixmodCommand.commandLine(new PrintWriter(out, true), new PrintWriter(err, true))
                    .execute(args);
            return new Outcome(status, out.toString(), err.toString());
        }, () -> "fixmod " + String.join(" ", args) + " did not finish within " + LIMIT);
    }

    /** Bad input: exit status 2, exactly one line naming the problem, nothing on stdout, no stack trace. */
    static void assertRejected(Outcome o) {
        assertEquals(ExitStatus.USAGE, o.status(), o::describe);
        assertEquals("", o.out(), () -> "partial output before the error\n" + o.describe());
        assertNoTrace(o);
        assertEquals(1, o.err().lines().count(), () -> "expected one line on stderr\n" + o.describe());
        assertTrue(o.err().startsWith("fixmod "), o::describe);
        assertTrue(o.err().trim().length() > "fixmod x: ".length() + 10, () -> "a message too short to help\n"
                + o.describe());
        // A message that echoes a megabyte of hostile input is no longer one clear line.
        assertTrue(o.err().strip().length() <= MAX_MESSAGE, () -> "a message of " + o.err().length() + " characters: "
                + o.err().substring(0, 300) + "...");
    }

    /**
     * Input that may or may not be valid (a random dump can be a legal dump of wrong words): any documented status,
     * and if rejected, rejected cleanly.
     */
    static void assertClean(Outcome o) {
        assertTrue(o.status() == ExitStatus.OK || o.status() == ExitStatus.MISMATCH || o.status() == ExitStatus.USAGE,
                o::describe);
        assertNoTrace(o);
        if (o.status() == ExitStatus.USAGE) {
            assertRejected(o);
        }
    }

    private static void assertNoTrace(Outcome o) {
        for (String s : new String[] {o.out(), o.err()}) {
            assertFalse(s.contains("Exception") || s.contains("\tat ") || s.contains("internal error")
                    || s.contains("OutOfMemory") || s.contains("StackOverflow"),
                    () -> "stack trace or internal error\n" + o.describe());
        }
    }

    /** Every file under {@code dir} with its size and content hash, to prove a run changed nothing there. */
    static Map<String, String> snapshot(Path dir) {
        Map<String, String> files = new TreeMap<>();
        try (Stream<Path> s = Files.walk(dir)) {
            s.sorted(Comparator.naturalOrder()).forEach(p -> {
                String key = dir.relativize(p).toString();
                try {
                    files.put(key, Files.isDirectory(p) ? "dir"
                            : Files.size(p) + ":" + java.util.Arrays.hashCode(Files.readAllBytes(p)));
                } catch (IOException e) {
                    throw new UncheckedIOException(e);
                }
            });
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return files;
    }

    static Path sandbox() {
        try {
            return Files.createTempDirectory("fixmod-hardening-");
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    static void delete(Path dir) {
        if (dir == null || !Files.exists(dir)) {
            return;
        }
        try (Stream<Path> s = Files.walk(dir)) {
            s.sorted(Comparator.reverseOrder()).forEach(p -> {
                try {
                    Files.delete(p);
                } catch (IOException e) {
                    throw new UncheckedIOException(e);
                }
            });
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    static Path write(Path file, byte[] bytes) {
        try {
            Files.createDirectories(file.getParent());
            return Files.write(file, bytes);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    static Path write(Path file, String text) {
        return write(file, text.getBytes(StandardCharsets.UTF_8));
    }

    /** {@code depth} nested JSON arrays: far beyond Jackson's nesting limit when depth is 10^5. */
    static String nestedArrays(int depth) {
        return "[".repeat(depth) + "]".repeat(depth);
    }

    /** Counts the cases of one property by outcome; printed as one summary line per property. */
    static Tally tally(String name) {
        return TALLIES.computeIfAbsent(name, Tally::new);
    }

    static final class Tally {
        private final String name;
        private final AtomicLong rejected = new AtomicLong();
        private final AtomicLong mismatched = new AtomicLong();
        private final AtomicLong accepted = new AtomicLong();

        Tally(String name) {
            this.name = name;
        }

        void count(Outcome o) {
            (o.status() == ExitStatus.USAGE ? rejected : o.status() == ExitStatus.MISMATCH ? mismatched : accepted)
                    .incrementAndGet();
        }

        /** The summary line, e.g. "hardening: constellation-file: 500 cases, all rejected cleanly". */
        String summary() {
            long total = rejected.get() + mismatched.get() + accepted.get();
            if (total == rejected.get()) {
                return "hardening: " + name + ": " + total + " cases, all rejected cleanly (exit 2, one line)";
            }
            return "hardening: " + name + ": " + total + " cases, " + rejected.get() + " rejected cleanly (exit 2),"
                    + " " + mismatched.get() + " read as mismatches (exit 1), " + accepted.get()
                    + " still valid (exit 0); none crashed, hung or wrote outside its folder";
        }
    }

    /** Prints and forgets the summaries of the properties whose names start with {@code prefix}. */
    static void printSummaries(String prefix) {
        TALLIES.values().stream().filter(t -> t.name.startsWith(prefix))
                .sorted(Comparator.comparing(t -> t.name)).forEach(t -> System.out.println(t.summary()));
        TALLIES.keySet().removeIf(k -> k.startsWith(prefix));
    }
}
