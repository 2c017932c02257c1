package dev.fixmod.verify.cli;

import dev.fixmod.verify.bench.BenchReport;
import dev.fixmod.verify.bench.BenchRunner;
import dev.fixmod.verify.bench.CpuTime;
import dev.fixmod.verify.bench.Growth;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.concurrent.Callable;
import org.openjdk.jmh.runner.RunnerException;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code fixmod bench}: runs the JMH suite and prints the results table and the targets. */
@Command(name = "bench",
        mixinStandardHelpOptions = true,
        versionProvider = Version.class,
        sortOptions = false,
        description = {"Runs fixmod's JMH benchmarks (mapper, slicers, LLR demappers, Gaussian noise, the Monte Carlo"
                + " chain, vector writers) in forked JVMs and prints a Markdown table of ops/s with 99.9 %% error"
                + " bars, the machine, and the performance targets as ratios measured in the same run.",
                "JMH's progress goes to standard error; the report to standard output."},
        footer = {"", "Examples:",
                "  fixmod bench --quick                       all benchmarks, ~5 s each (about 7 minutes)",
                "  fixmod bench --quick --results bench.json 'Llr|Noise'",
                "  fixmod bench --quick LlrBench --param demapper=fixed:max-log:256-qam,fixed:max-log-per-axis:256-qam",
                "  fixmod bench --list",
                "  fixmod bench --growth                      time and memory vs vector count and order",
                "  fixmod bench --cpu-time                    target figures as thread CPU time (busy machines)",
                "",
                "Figures depend on the machine and its load: compare ratios from one run, not across machines.",
                "Exit status: 0 success (whether or not targets are met), 2 bad option or pattern."})
public final class BenchCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", arity = "0..1", paramLabel = "PATTERN",
            description = "Regular expression searched in the benchmark names, e.g. LlrBench or 'Noise|Chain'"
                    + " (default: all).")
    String include;

    @Option(names = "--quick", description = "2 × 1 s warm-up and 3 × 1 s measurement per benchmark (default: 3 × 2 s"
            + " and 5 × 2 s).")
    boolean quick;

    @Option(names = "--json", description = "Print the results and targets as JSON instead of Markdown.")
    boolean json;

    @Option(names = "--results", paramLabel = "FILE", description = "Also write the results and targets as JSON to"
            + " FILE (written whole or not at all).")
    Path results;

    @Option(names = "--list", description = "List the benchmarks and their parameters, run nothing.")
    boolean list;

    @Option(names = "--growth", description = "Measure time and heap allocation vs vector count and constellation"
            + " order instead of running JMH.")
    boolean growth;

    @Option(names = "--cpu-time", description = "Measure the single-thread target figures as thread CPU time in this"
            + " JVM (a cross-check for a busy machine) instead of running JMH.")
    boolean cpuTime;

    @Option(names = "--growth-max", paramLabel = "COUNT", defaultValue = "1000000",
            description = "Largest vector count of --growth, a power of ten from 10000 to 100000000 (default:"
                    + " ${DEFAULT-VALUE}).")
    long growthMax;

    @Option(names = "--param", paramLabel = "KEY=VALUES",
            description = "Run only these values of a benchmark parameter (comma separated; repeatable), e.g."
                    + " --param demapper=fixed:max-log:256-qam,fixed:max-log-per-axis:256-qam.")
    java.util.Map<String, String> params = new java.util.LinkedHashMap<>();

    @Option(names = {"-q", "--quiet"}, description = "Do not print JMH's progress.")
    boolean quiet;

    @Override
    public Integer call() throws IOException, RunnerException {
        PrintWriter out = spec.commandLine().getOut();
        if (list && growth) {
            throw new UsageException("choose one of --list and --growth");
        }
        if (list) {
            if (json || results != null) {
                throw new UsageException("--list runs nothing, so it takes no --json or --results");
            }
            BenchRunner.list(include).forEach(out::println);
            out.flush();
            return ExitStatus.OK;
        }
        if (cpuTime) {
            if (list || growth || include != null || results != null || !params.isEmpty()) {
                throw new UsageException("--cpu-time takes no other option or PATTERN");
            }
            BenchReport report = new BenchReport(BenchReport.Machine.current().finished(),
                    "thread CPU time, best of 7 × 0.2 s after 1 s warm-up, no fork", CpuTime.measure());
            out.print(json ? report.json() : report.markdown());
            out.flush();
            return ExitStatus.OK;
        }
        if (growth) {
            if (include != null || json || results != null) {
                throw new UsageException("--growth takes no PATTERN, --json or --results");
            }
            if (growthMax < 10_000 || growthMax > 100_000_000 || !isPowerOfTen(growthMax)) {
                throw new UsageException("--growth-max must be a power of ten from 10000 to 100000000, got "
                        + growthMax);
            }
            out.print(Growth.markdown(Growth.measure(growthMax)));
            out.flush();
            return ExitStatus.OK;
        }
        if (results != null) {
            Path parent = results.toAbsolutePath().getParent();
            if (parent != null && !Files.isDirectory(parent)) {
                throw new UsageException("--results " + results + ": the folder " + parent + " does not exist");
            }
        }
        BenchReport report = BenchRunner.run(include, params, quick ? BenchRunner.Settings.QUICK
                : BenchRunner.Settings.FULL, System.err, !quiet);
        if (results != null) {
            writeAtomically(results, report.json());
        }
        out.print(json ? report.json() : report.markdown());
        out.flush();
        return ExitStatus.OK;
    }

    private static boolean isPowerOfTen(long n) {
        while (n % 10 == 0) {
            n /= 10;
        }
        return n == 1;
    }

    /** Writes a sibling temporary file, then moves it into place, so a failure leaves no partial file. */
    private static void writeAtomically(Path target, String text) throws IOException {
        Path absolute = target.toAbsolutePath();
        Path tmp = Files.createTempFile(absolute.getParent(), "." + absolute.getFileName(), ".tmp");
        try {
            Files.writeString(tmp, text, StandardCharsets.UTF_8);
            Files.move(tmp, absolute, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
        } finally {
            Files.deleteIfExists(tmp);
        }
    }
}
