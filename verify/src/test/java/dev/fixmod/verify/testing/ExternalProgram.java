package dev.fixmod.verify.testing;

import static org.junit.jupiter.api.Assertions.fail;

import java.io.File;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Assumptions;

/**
 * Runs outside programs (python3, gcc, iverilog) for tests that check our files with the tools that consume them.
 * A missing tool skips the test with a visible message instead of failing it.
 */
public final class ExternalProgram {

    /** What a finished program printed. */
    public record Result(int exitCode, String stdout, String stderr) {
    }

    private ExternalProgram() {
    }

    /** The executable {@code name} on the PATH, or an absolute path if it is executable. */
    public static Optional<Path> find(String name) {
        Path direct = Path.of(name);
        if (direct.isAbsolute()) {
            return Files.isExecutable(direct) ? Optional.of(direct) : Optional.empty();
        }
        String path = System.getenv("PATH");
        if (path == null) {
            return Optional.empty();
        }
        for (String dir : path.split(File.pathSeparator)) {
            if (!dir.isEmpty()) {
                Path candidate = Path.of(dir, name);
                if (Files.isExecutable(candidate)) {
                    return Optional.of(candidate);
                }
            }
        }
        return Optional.empty();
    }

    /** The first candidate found, or the test is skipped with a message naming what is missing and why. */
    public static Path require(String purpose, String... candidates) {
        for (String c : candidates) {
            Optional<Path> found = find(c);
            if (found.isPresent()) {
                return found.get();
            }
        }
        return skip(String.join(" or ", candidates) + " not found; skipping " + purpose);
    }

    /** A python3 that can import {@code module}, or the test is skipped with a message. */
    public static Path requirePython(String module, String purpose) {
        for (String c : new String[] {"python3", "/usr/bin/python3"}) {
            Optional<Path> python = find(c);
            if (python.isPresent() && (module == null
                    || run(Path.of("."), 60, python.get().toString(), "-c", "import " + module).exitCode() == 0)) {
                return python.get();
            }
        }
        return skip("no python3" + (module == null ? "" : " with " + module) + " found; skipping " + purpose);
    }

    private static <T> T skip(String message) {
        System.err.println("SKIPPED: " + message);
        Assumptions.abort(message);
        throw new AssertionError("unreachable: Assumptions.abort throws");
    }

    /** Runs {@code command} in {@code dir}; fails the test if it does not finish within {@code timeoutSeconds}. */
    public static Result run(Path dir, long timeoutSeconds, String... command) {
        List<String> cmd = new ArrayList<>(List.of(command));
        try {
            Path err = Files.createTempFile("fixmod-stderr", ".txt");
            try {
                Process p = new ProcessBuilder(cmd).directory(dir.toFile()).redirectError(err.toFile()).start();
                p.getOutputStream().close();
                String out;
                try (InputStream in = p.getInputStream()) {
                    out = new String(in.readAllBytes(), StandardCharsets.UTF_8);
                }
                if (!p.waitFor(timeoutSeconds, TimeUnit.SECONDS)) {
                    p.destroyForcibly();
                    fail(cmd + " did not finish within " + timeoutSeconds + " s");
                }
                return new Result(p.exitValue(), out, Files.readString(err));
            } finally {
                Files.deleteIfExists(err);
            }
        } catch (IOException e) {
            throw new UncheckedIOException("could not run " + cmd, e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new AssertionError("interrupted while running " + cmd, e);
        }
    }

    /** Like {@link #run} but fails the test, showing stderr, unless the exit code is 0. */
    public static String runOk(Path dir, long timeoutSeconds, String... command) {
        Result r = run(dir, timeoutSeconds, command);
        if (r.exitCode() != 0) {
            fail(List.of(command) + " exited with " + r.exitCode() + ":\n" + r.stderr() + r.stdout());
        }
        return r.stdout();
    }

    /** Copies a classpath resource to {@code target} (test resources may live inside a jar). */
    public static Path copyResource(Class<?> anchor, String resource, Path target) {
        try (InputStream in = anchor.getResourceAsStream(resource)) {
            if (in == null) {
                throw new IllegalStateException("test resource " + resource + " is missing");
            }
            Files.copy(in, target);
            return target;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
