package dev.fixmod.verify.cli;

import dev.fixmod.verify.loss.LossAnalysis;
import dev.fixmod.verify.loss.LossReport;
import dev.fixmod.verify.loss.LossRun;
import dev.fixmod.verify.loss.LossSpec;
import dev.fixmod.verify.loss.LossSpecReader;
import dev.fixmod.verify.loss.PartialResult;
import dev.fixmod.verify.loss.PointResult;
import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintWriter;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.function.IntConsumer;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import me.tongfei.progressbar.ConsoleProgressBarConsumer;
import me.tongfei.progressbar.ProgressBar;
import me.tongfei.progressbar.ProgressBarBuilder;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code fixmod loss}: quantization-loss report and word-length sizing from a loss specification. */
@Command(name = "loss",
        mixinStandardHelpOptions = true,
        subcommands = {LossCommand.Merge.class},
        description = {"Simulates the float reference and the fixed-point model on the same noise and writes"
                + " report.md, report.html, results.json, results.csv and sizing.csv into a new folder.",
                "Without SPEC, runs the built-in 16-QAM demo specification."},
        footer = {"", "Examples:",
                "  fixmod loss verify/src/main/resources/examples/crane-link-16qam.json -o loss-report",
                "  fixmod loss -o demo-report --threads 2 --quiet",
                "  fixmod loss my-spec.json --shard 1/2 -o part1.json",
                "",
                "Exit status: 0 success, 2 bad specification or usage (nothing is written)."})
public final class LossCommand implements Callable<Integer> {
    private static final Pattern SHARD = Pattern.compile("(\\d{1,6})/(\\d{1,6})");

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Parameters(index = "0", arity = "0..1", paramLabel = "SPEC", description = "The loss specification (JSON).")
    Path specFile;

    @Option(names = {"-o", "--output"}, paramLabel = "DIR",
            description = "The report folder (must not exist unless --force); with --shard, the partial result file.")
    Path output;

    /** 0 stands for "all cores"; picocli gives the same int type as every other command's --threads. */
    @Option(names = "--threads", paramLabel = "N", defaultValue = "0", description = "Worker threads (default:"
            + " all cores). Results do not depend on it.")
    int threads;

    @Option(names = "--shard", paramLabel = "I/N", description = "Run only part I of N of the points (round robin)"
            + " and write a partial result for 'fixmod loss merge'.")
    String shard;

    @Option(names = {"-q", "--quiet"}, description = "No progress bar.")
    boolean quiet;

    @Option(names = "--force", description = "Replace an existing output.")
    boolean force;

    @Override
    public Integer call() throws IOException {
        if (output == null) {
            throw new UsageException("missing -o DIR: the folder to write the report into");
        }
        String text;
        String source;
        if (specFile == null) {
            text = LossSpecReader.DEFAULT_SPEC;
            source = "(built-in spec)";
        } else {
            text = Files.readString(specFile);
            source = specFile.toString();
        }
        LossSpec loss = LossSpecReader.parse(text, source);
        LossRun run = new LossRun(loss);
        int n = threads == 0 ? Runtime.getRuntime().availableProcessors() : threads;
        if (n < 1 || n > 1024) {
            throw new UsageException("--threads must be from 1 to 1024 (or 0 for all cores), got " + n);
        }
        if (shard != null) {
            Matcher m = SHARD.matcher(shard);
            if (!m.matches() || Integer.parseInt(m.group(1)) < 1
                    || Integer.parseInt(m.group(1)) > Integer.parseInt(m.group(2))) {
                throw new UsageException("--shard '" + shard + "' is not I/N with 1 <= I <= N, e.g. 2/4");
            }
            int i = Integer.parseInt(m.group(1));
            int of = Integer.parseInt(m.group(2));
            if (Files.exists(output) && !force) {
                throw new UsageException("output " + output + " already exists; choose another file or use --force");
            }
            List<PointResult> points = simulate(run, i, of, n);
            Path abs = output.toAbsolutePath();
            Files.createDirectories(abs.getParent());
            Path tmp = Files.createTempFile(abs.getParent(), "." + abs.getFileName(), ".partial");
            try {
                try (OutputStream out = Files.newOutputStream(tmp)) {
                    new PartialResult(text, source, i, of, points).write(out);
                }
                try {
                    Files.move(tmp, abs, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
                } catch (AtomicMoveNotSupportedException e) {
                    Files.move(tmp, abs, StandardCopyOption.REPLACE_EXISTING);
                }
            } finally {
                Files.deleteIfExists(tmp);
            }
            out().println("shard " + i + "/" + of + ": " + points.size() + " of " + run.pointCount()
                    + " points written to " + output);
            return ExitStatus.OK;
        }
        List<PointResult> points = simulate(run, 1, 1, n);
        return report(run, points, output, force, out());
    }

    private PrintWriter out() {
        return spec.commandLine().getOut();
    }

    private List<PointResult> simulate(LossRun run, int i, int of, int n) {
        int total = run.pointCount(i, of);
        if (quiet || System.console() == null) {
            return run.simulate(i, of, n, done -> { });
        }
        try (ProgressBar bar = new ProgressBarBuilder().setTaskName("loss").setInitialMax(total)
                .setConsumer(new ConsoleProgressBarConsumer(System.err)).build()) {
            IntConsumer step = bar::stepTo;
            return run.simulate(i, of, n, step);
        }
    }

    static int report(LossRun run, List<PointResult> points, Path output, boolean force, PrintWriter out)
            throws IOException {
        LossAnalysis analysis = new LossAnalysis(run, run.assemble(points));
        new LossReport(analysis).write(output, force);
        LossAnalysis.DesignFigures base = analysis.designs().get(0);
        out.println("loss report for " + run.spec().name() + ": " + run.pointCount() + " points, base design loss "
                + dev.fixmod.verify.loss.Numbers.fixed(base.lossGmiDb(), 3) + " dB at the target GMI, "
                + dev.fixmod.verify.loss.Numbers.fixed(base.lossBerDb(), 3) + " dB at the target BER; see "
                + output.resolve("report.html"));
        for (LossAnalysis.Sizing s : analysis.sizing()) {
            out.println("  " + s.parameter() + ": choose " + s.chosen() + " (" + s.reason() + ")");
        }
        for (LossAnalysis.GridSizing g : analysis.grids()) {
            out.println("  grid " + g.parameters().get(0) + " x " + g.parameters().get(1) + ": choose "
                    + (g.chosen() < 0 ? dev.fixmod.verify.loss.Numbers.NONE
                    : LossSpecReader.combination(g.parameters(), g.rows().get(g.chosen()).values()))
                    + " (" + g.reason() + ")");
        }
        out.flush();
        return ExitStatus.OK;
    }

    /** {@code fixmod loss merge}: combines the partial results of every shard into the full report. */
    @Command(name = "merge", mixinStandardHelpOptions = true,
            description = "Combines the partial results of 'fixmod loss SPEC --shard i/n' (all n of them) into the"
                    + " report an unsharded run writes.",
            footer = {"", "Examples:",
                    "  fixmod loss merge part1.json part2.json -o loss-report-merged",
                    "",
                    "Exit status: 0 success, 2 missing, duplicate or foreign parts or bad usage (nothing is written)."})
    static final class Merge implements Callable<Integer> {
        @CommandLine.Spec
        CommandLine.Model.CommandSpec spec;

        @Parameters(arity = "1..*", paramLabel = "PART", description = "The partial result files.")
        List<Path> parts;

        @Option(names = {"-o", "--output"}, required = true, paramLabel = "DIR", description = "The report folder.")
        Path output;

        @Option(names = "--force", description = "Replace an existing output folder.")
        boolean force;

        @Override
        public Integer call() throws IOException {
            List<PartialResult> read = new ArrayList<>();
            for (Path p : parts) {
                read.add(PartialResult.read(Files.readString(p), p.toString()));
            }
            PartialResult first = read.get(0);
            LossRun run = new LossRun(LossSpecReader.parse(first.specText(), first.specSource()));
            boolean[] seen = new boolean[Math.max(first.shards(), 1) + 1];
            List<PointResult> points = new ArrayList<>();
            for (int i = 0; i < read.size(); i++) {
                PartialResult r = read.get(i);
                if (!r.specText().equals(first.specText()) || r.shards() != first.shards()) {
                    throw new UsageException(parts.get(i) + ": comes from another specification or shard count than "
                            + parts.get(0) + "; merge the parts of one run only");
                }
                if (r.shard() < 1 || r.shard() > r.shards() || seen[r.shard()]) {
                    throw new UsageException(parts.get(i) + ": shard " + r.shard() + "/" + r.shards()
                            + " is given twice or is out of range");
                }
                seen[r.shard()] = true;
                for (PointResult p : r.points()) {
                    try {
                        run.check(p);
                    } catch (IllegalArgumentException e) {
                        throw new UsageException(parts.get(i) + ": " + e.getMessage());
                    }
                }
                points.addAll(r.points());
            }
            for (int s = 1; s <= first.shards(); s++) {
                if (!seen[s]) {
                    throw new UsageException("shard " + s + "/" + first.shards() + " is missing; give all "
                            + first.shards() + " partial results");
                }
            }
            return report(run, points, output, force, spec.commandLine().getOut());
        }
    }
}
