package dev.fixmod.verify.cli;

import dev.fixmod.verify.vectors.Manifest;
import dev.fixmod.verify.vectors.SetFolder;
import dev.fixmod.verify.vectors.SpecReader;
import dev.fixmod.verify.vectors.VectorSetChecker;
import dev.fixmod.verify.vectors.VectorSetGenerator;
import dev.fixmod.verify.vectors.VectorSpec;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.charset.CharacterCodingException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import java.util.stream.Stream;
import me.tongfei.progressbar.ProgressBar;
import me.tongfei.progressbar.ProgressBarBuilder;
import me.tongfei.progressbar.ProgressBarStyle;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code fixmod vectors}: generate, check and list golden vector sets. */
@Command(name = "vectors",
        mixinStandardHelpOptions = true,
        description = "Golden vector sets: stimulus and expected outputs per port, for RTL, C and Python testbenches.",
        subcommands = {VectorsCommand.Generate.class, VectorsCommand.Check.class, VectorsCommand.ListSets.class},
        footer = {"", "Examples:",
                "  fixmod vectors generate vectors/nr-qam16.json -o my-set",
                "  fixmod vectors check vectors/nr-qam16",
                "  fixmod vectors list",
                "",
                "Exit status: 0 success, 1 differences found (check), 2 bad input or usage.",
                "The format reference is vectors/README.md."})
public final class VectorsCommand implements Runnable {
    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public void run() {
        spec.commandLine().usage(spec.commandLine().getOut());
    }

    static String readText(Path file) {
        try {
            byte[] bytes = Files.readAllBytes(file);
            return StandardCharsets.UTF_8.newDecoder().decode(java.nio.ByteBuffer.wrap(bytes)).toString();
        } catch (NoSuchFileException e) {
            throw new UsageException(file + ": no such file");
        } catch (CharacterCodingException e) {
            throw new UsageException(file + ": not UTF-8 text");
        } catch (IOException e) {
            throw new UsageException(file + ": cannot read: " + e.getMessage());
        }
    }

    @Command(name = "generate", mixinStandardHelpOptions = true,
            description = "Generate a vector set from a specification into a new folder (written atomically).",
            footer = {"", "Examples:",
                    "  fixmod vectors generate vectors/nr-qam16.json -o my-set",
                    "  fixmod vectors generate my-spec.json -o my-set --force --quiet --threads 2",
                    "",
                    "Exit status: 0 success, 2 bad specification or usage (nothing is written)."})
    static final class Generate implements Callable<Integer> {
        @CommandLine.Spec
        CommandLine.Model.CommandSpec cs;

        @Parameters(index = "0", paramLabel = "SPEC", description = "the specification (JSON)")
        Path specFile;

        @Option(names = {"-o", "--output"}, required = true, paramLabel = "DIR",
                description = "the set's folder; must not exist unless --force")
        Path output;

        @Option(names = "--force", description = "replace an existing set at DIR")
        boolean force;

        @Option(names = {"-q", "--quiet"}, description = "no progress bar, no summary")
        boolean quiet;

        @Option(names = "--threads", paramLabel = "N", defaultValue = "1",
                description = "worker threads (the files do not depend on it; default ${DEFAULT-VALUE})")
        int threads;

        @Override
        public Integer call() throws IOException {
            if (threads < 1 || threads > 256) {
                throw new UsageException("--threads must be 1..256, got " + threads);
            }
            VectorSpec spec = SpecReader.parse(readText(specFile), specFile.toString());
            Path specDir = specFile.toAbsolutePath().getParent();
            VectorSetGenerator generator = VectorSetGenerator.of(spec, specDir);
            SetFolder.requireWritable(output, force);
            boolean bar = !quiet && System.console() != null;
            Manifest manifest;
            if (bar) {
                try (ProgressBar pb = new ProgressBarBuilder().setTaskName("vectors").setInitialMax(generator.totalCount())
                        .setStyle(ProgressBarStyle.ASCII).setConsumer(
                                new me.tongfei.progressbar.ConsoleProgressBarConsumer(System.err)).build()) {
                    manifest = generator.writeTo(output, force, new VectorSetGenerator.Options(threads, pb::stepTo));
                }
            } else {
                manifest = generator.writeTo(output, force, new VectorSetGenerator.Options(threads, null));
            }
            if (!quiet) {
                PrintWriter out = cs.commandLine().getOut();
                out.printf(Locale.ROOT, "%s: %d files, %d mapper vectors, %d demapper vectors%n", output,
                        manifest.files().size(), generator.mapperCount(), generator.demapperCount());
                out.flush();
            }
            return ExitStatus.OK;
        }
    }

    @Command(name = "check", mixinStandardHelpOptions = true,
            description = "Verify a set: checksums, internal consistency, and regeneration compared byte for byte.",
            footer = {"", "Examples:",
                    "  fixmod vectors check vectors/nr-qam16",
                    "",
                    "Exit status: 0 the set is intact, 1 differences found, 2 not a readable set."})
    static final class Check implements Callable<Integer> {
        @CommandLine.Spec
        CommandLine.Model.CommandSpec cs;

        @Parameters(index = "0", paramLabel = "DIR", description = "the set's folder")
        Path dir;

        @Override
        public Integer call() throws IOException {
            List<String> problems = VectorSetChecker.check(dir);
            PrintWriter out = cs.commandLine().getOut();
            if (problems.isEmpty()) {
                out.println(dir + ": OK (checksums, consistency and regeneration agree)");
                out.flush();
                return ExitStatus.OK;
            }
            for (String p : problems) {
                out.println(dir + ": " + p);
            }
            out.println(dir + ": " + problems.size() + " difference" + (problems.size() == 1 ? "" : "s"));
            out.flush();
            return ExitStatus.MISMATCH;
        }
    }

    @Command(name = "list", mixinStandardHelpOptions = true,
            description = "List the committed sets under vectors/, or the files of one set.",
            footer = {"", "Examples:",
                    "  fixmod vectors list",
                    "  fixmod vectors list vectors/nr-qam16",
                    "",
                    "Exit status: 0 success, 2 not a folder or a malformed manifest."})
    static final class ListSets implements Callable<Integer> {
        @CommandLine.Spec
        CommandLine.Model.CommandSpec cs;

        @Parameters(index = "0", arity = "0..1", paramLabel = "DIR",
                description = "a set's folder, or a folder of sets (default: vectors/ of this project)")
        Path dir;

        @Override
        public Integer call() throws IOException {
            PrintWriter out = cs.commandLine().getOut();
            Path where = dir != null ? dir : findVectorsFolder();
            if (!Files.isDirectory(where)) {
                throw new UsageException(where + ": no such folder");
            }
            Path manifestFile = where.resolve(Manifest.FILE_NAME);
            if (Files.isRegularFile(manifestFile)) {
                Manifest m = Manifest.read(readText(manifestFile), manifestFile.toString());
                out.printf(Locale.ROOT, "%-32s %-20s %-13s %10s %12s  %s%n", "file", "port", "format", "count",
                        "bytes", "sha256");
                for (Manifest.Entry e : m.files()) {
                    Path f = where.resolve(e.name());
                    String size = Files.isRegularFile(f) ? Long.toString(Files.size(f)) : "missing";
                    out.printf(Locale.ROOT, "%-32s %-20s %-13s %10d %12s  %s%n", e.name(), e.port(), e.format(),
                            e.count(), size, e.sha256().substring(0, 16));
                }
                out.flush();
                return ExitStatus.OK;
            }
            List<Path> sets = new ArrayList<>();
            try (Stream<Path> s = Files.list(where)) {
                s.filter(p -> Files.isRegularFile(p.resolve(Manifest.FILE_NAME))).sorted().forEach(sets::add);
            }
            if (sets.isEmpty()) {
                out.println(where + ": no vector sets (folders with " + Manifest.FILE_NAME + ")");
            }
            out.printf(Locale.ROOT, "%-28s %-16s %6s %10s %10s%n", "set", "constellation", "files", "mapper",
                    "demapper");
            for (Path set : sets) {
                Path mf = set.resolve(Manifest.FILE_NAME);
                Manifest m = Manifest.read(readText(mf), mf.toString());
                var j = m.json();
                out.printf(Locale.ROOT, "%-28s %-16s %6d %10d %10d%n", set.getFileName(),
                        m.spec().path("constellation").path("name").asText(), m.files().size(),
                        j.path("groups").path("mapper").path("count").asLong(),
                        j.path("groups").path("demapper").path("count").asLong());
            }
            out.flush();
            return ExitStatus.OK;
        }

        /** vectors/ in the working folder or the nearest parent that has one. */
        private static Path findVectorsFolder() {
            Path p = Path.of("").toAbsolutePath();
            while (p != null) {
                if (Files.isDirectory(p.resolve("vectors"))) {
                    return p.resolve("vectors");
                }
                p = p.getParent();
            }
            throw new UsageException("no vectors/ folder here or in a parent folder; give DIR");
        }
    }
}
