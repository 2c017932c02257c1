package dev.fixmod.verify.bench;

import java.io.PrintStream;
import java.util.ArrayList;
import java.util.Collection;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Pattern;
import java.util.regex.PatternSyntaxException;
import org.openjdk.jmh.infra.BenchmarkParams;
import org.openjdk.jmh.results.RunResult;
import org.openjdk.jmh.runner.BenchmarkList;
import org.openjdk.jmh.runner.BenchmarkListEntry;
import org.openjdk.jmh.runner.NoBenchmarksException;
import org.openjdk.jmh.runner.Runner;
import org.openjdk.jmh.runner.RunnerException;
import org.openjdk.jmh.runner.format.OutputFormat;
import org.openjdk.jmh.runner.format.OutputFormatFactory;
import org.openjdk.jmh.runner.options.Options;
import org.openjdk.jmh.runner.options.OptionsBuilder;
import org.openjdk.jmh.runner.options.TimeValue;
import org.openjdk.jmh.runner.options.VerboseMode;

/**
 * Runs the benchmarks of this package through JMH's {@link Runner} in this process (each benchmark in one forked
 * JVM, as JMH requires for trustworthy figures) and collects a {@link BenchReport}.
 */
public final class BenchRunner {
    /** The package prefix of every benchmark name. */
    public static final String PACKAGE = BenchRunner.class.getPackageName() + ".";

    /**
     * JMH iteration settings.
     *
     * @param warmupIterations  warm-up iterations per benchmark
     * @param warmupSeconds     seconds per warm-up iteration
     * @param iterations        measured iterations per benchmark
     * @param seconds           seconds per measured iteration
     */
    public record Settings(int warmupIterations, int warmupSeconds, int iterations, int seconds) {
        /** A short run for a shared machine: about 5 s per benchmark and parameter set. */
        public static final Settings QUICK = new Settings(2, 1, 3, 1);
        /** The default run: about 16 s per benchmark and parameter set. */
        public static final Settings FULL = new Settings(3, 2, 5, 2);

        String describe() {
            return "1 fork, " + warmupIterations + " × " + warmupSeconds + " s warm-up, " + iterations + " × "
                    + seconds + " s measurement; ± is the half-width of JMH's 99.9 % confidence interval";
        }
    }

    private BenchRunner() {
    }

    /**
     * The benchmarks (with their parameter values) whose full name matches {@code include}.
     *
     * @throws IllegalArgumentException if {@code include} is not a regular expression
     */
    public static List<String> list(String include) {
        List<String> names = new ArrayList<>();
        for (BenchmarkListEntry e : BenchmarkList.defaultList().find(quiet(), List.of(checked(include)), List.of())) {
            StringBuilder sb = new StringBuilder(e.getUsername().substring(PACKAGE.length()));
            if (e.getParams().hasValue()) {
                e.getParams().get().forEach((key, values) ->
                        sb.append("  ").append(key).append('=').append(String.join(",", values)));
            }
            names.add(sb.toString());
        }
        return names;
    }

    /**
     * Runs the benchmarks matching {@code include} (a regular expression searched in the full benchmark name, e.g.
     * {@code LlrBench} or {@code Noise|Chain}), with only the given values of the named parameters, printing JMH's
     * progress on {@code progress}.
     *
     * @throws IllegalArgumentException if the pattern is invalid or matches no benchmark
     */
    public static BenchReport run(String include, Map<String, String> params, Settings settings,
                                  PrintStream progress, boolean verbose) throws RunnerException {
        String pattern = checked(include);
        BenchReport.Machine machine = BenchReport.Machine.current();
        OptionsBuilder builder = new OptionsBuilder();
        params.forEach((key, values) -> {
            if (key.isBlank() || values.isBlank()) {
                throw new IllegalArgumentException("--param '" + key + "=" + values + "' needs a name and values,"
                        + " e.g. scenario=256-qam");
            }
            builder.param(key, values.split(","));
        });
        Options options = builder
                .include(pattern)
                .forks(1)
                .warmupIterations(settings.warmupIterations())
                .warmupTime(TimeValue.seconds(settings.warmupSeconds()))
                .measurementIterations(settings.iterations())
                .measurementTime(TimeValue.seconds(settings.seconds()))
                .jvmArgsAppend("-Xmx1g")
                .shouldFailOnError(true)
                .build();
        OutputFormat out = OutputFormatFactory.createFormatInstance(progress,
                verbose ? VerboseMode.NORMAL : VerboseMode.SILENT);
        Collection<RunResult> runs;
        try {
            runs = new Runner(options, out).run();
        } catch (NoBenchmarksException e) {
            throw noMatch(include);
        }
        if (runs.isEmpty()) {
            throw noMatch(include);
        }
        List<Measurement> results = new ArrayList<>();
        for (RunResult r : runs) {
            results.add(measurement(r));
        }
        return new BenchReport(machine.finished(), settings.describe(), results);
    }

    static Measurement measurement(RunResult r) {
        BenchmarkParams p = r.getParams();
        Map<String, String> params = new LinkedHashMap<>();
        for (String key : p.getParamsKeys()) {
            params.put(key, p.getParam(key));
        }
        String name = p.getBenchmark().startsWith(PACKAGE) ? p.getBenchmark().substring(PACKAGE.length())
                : p.getBenchmark();
        return new Measurement(name, params, p.getThreads(), r.getPrimaryResult().getScore(),
                r.getPrimaryResult().getScoreError());
    }

    private static String checked(String include) {
        String pattern = include == null || include.isBlank() ? ".*" : include;
        try {
            Pattern.compile(pattern);
        } catch (PatternSyntaxException e) {
            throw new IllegalArgumentException("benchmark pattern '" + include + "' is not a regular expression ("
                    + e.getDescription() + "); give e.g. LlrBench or 'Noise|Chain'");
        }
        return pattern;
    }

    private static IllegalArgumentException noMatch(String include) {
        return new IllegalArgumentException("benchmark pattern '" + include + "' matches no benchmark; see"
                + " fixmod bench --list");
    }

    private static OutputFormat quiet() {
        return OutputFormatFactory.createFormatInstance(new PrintStream(PrintStream.nullOutputStream()),
                VerboseMode.SILENT);
    }
}
