package dev.fixmod.verify.demo;

import dev.fixmod.verify.compare.CompareOptions;
import dev.fixmod.verify.compare.CompareReport;
import dev.fixmod.verify.compare.Comparison;
import dev.fixmod.verify.compare.GoldenSet;
import dev.fixmod.verify.compare.HexWordReader;
import dev.fixmod.verify.compare.ReportText;
import dev.fixmod.verify.compare.VectorFlags;
import dev.fixmod.verify.compare.WordReader;
import dev.fixmod.verify.formats.OutputSet;
import dev.fixmod.verify.loss.LossAnalysis;
import dev.fixmod.verify.loss.LossReport;
import dev.fixmod.verify.loss.LossRun;
import dev.fixmod.verify.loss.LossSpecReader;
import dev.fixmod.verify.loss.Numbers;
import dev.fixmod.verify.vectors.Manifest;
import dev.fixmod.verify.vectors.SpecReader;
import dev.fixmod.verify.vectors.VectorSetGenerator;
import java.io.BufferedInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.UncheckedIOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.stream.Stream;

/**
 * The demo scenario end to end. Everything is written into a hidden work folder beside the target and moved into
 * place at the end, so the target is either the complete demo or untouched. An existing target is replaced only
 * when it is a previous demo folder (it holds {@value #SUMMARY} starting with {@value #MARK}) or empty; any other
 * existing path is refused.
 *
 * <p>The scenario is fictional: the <em>Kittiwake Reef</em> sensor network, whose line-of-sight links carry 64-QAM
 * (3GPP TS 38.211 mapping); its max-log demapper moves from a floating-point prototype to a small FPGA planned with
 * a 12-bit ADC and 6-bit LLRs, under a 0.2 dB implementation-loss budget.
 */
public final class Demo {
    public static final String DEFAULT_FOLDER = "fixmod-demo";
    public static final String SCENARIO = "Kittiwake Reef sensor link (fictional)";
    public static final String SUMMARY = "summary.txt";
    static final String MARK = "fixmod demo";
    public static final String VECTOR_SPEC = "scenario/vectors.json";
    public static final String LOSS_SPEC = "scenario/loss.json";
    public static final String SET = "vectors";
    public static final String LOSS_REPORT = "loss-report";
    public static final String DUMP = "device/llr-dump.hex";
    public static final String FAULTY_DUMP = "device/llr-dump-truncating.hex";
    public static final String COMPARE = "compare/device.txt";
    public static final String FAULTY_COMPARE = "compare/device-truncating.txt";
    /** Latencies the comparison searches; the model's is {@link DeviceModel#LATENCY}. */
    public static final int ALIGN_WINDOW = 8;

    /** What the demo found; paths are relative to the demo folder. */
    public record Result(List<LossAnalysis.Sizing> sizing, double baseLossGmiDb, double budgetDb, long mapperVectors,
            long demapperVectors, int setFiles, CompareReport device, CompareReport faulty) {
    }

    private Demo() {
    }

    /**
     * Runs the scenario into {@code target} with {@code threads} workers (the outputs do not depend on it).
     *
     * @throws IllegalArgumentException if {@code target} exists and is not a previous demo folder or empty
     */
    public static Result run(Path target, int threads) throws IOException {
        boolean replace = checkTarget(target);
        try (OutputSet out = OutputSet.create(target, replace)) {
            Path work = out.workFolder();
            String vectorSpec = resource("vectors.json");
            String lossSpec = resource("loss.json");
            copy(out, VECTOR_SPEC, vectorSpec);
            copy(out, LOSS_SPEC, lossSpec);

            Path setDir = work.resolve(SET);
            VectorSetGenerator generator = VectorSetGenerator.of(SpecReader.parse(vectorSpec, VECTOR_SPEC),
                    work.resolve("scenario"));
            Manifest manifest = generator.writeTo(setDir, false, new VectorSetGenerator.Options(threads, null));

            LossRun run = new LossRun(LossSpecReader.parse(lossSpec, LOSS_SPEC));
            LossAnalysis analysis = new LossAnalysis(run, run.assemble(run.simulate(1, 1, threads, done -> { })));
            new LossReport(analysis).write(work.resolve(LOSS_REPORT), false);

            CompareReport device = simulateAndCompare(out, setDir, DeviceModel.Build.AS_DESIGNED, DUMP, COMPARE);
            CompareReport faulty = simulateAndCompare(out, setDir, DeviceModel.Build.TRUNCATING_OUTPUT, FAULTY_DUMP,
                    FAULTY_COMPARE);

            Result result = new Result(analysis.sizing(), analysis.designs().get(0).lossGmiDb(),
                    run.spec().targets().budgetDb(), generator.mapperCount(), generator.demapperCount(),
                    manifest.files().size(), device, faulty);
            copy(out, SUMMARY, summary(result, ""));
            out.commit();
            return result;
        }
    }

    /** Whether the target must be replaced; refuses an existing path that is not a previous demo or empty. */
    private static boolean checkTarget(Path target) throws IOException {
        if (!Files.exists(target, LinkOption.NOFOLLOW_LINKS)) {
            return false;
        }
        if (!Files.isDirectory(target, LinkOption.NOFOLLOW_LINKS)) {
            throw new IllegalArgumentException(target + " exists and is not a folder; choose another folder with -o");
        }
        try (Stream<Path> s = Files.list(target)) {
            if (s.findAny().isEmpty()) {
                return true;
            }
        }
        Path summary = target.resolve(SUMMARY);
        if (Files.isRegularFile(summary, LinkOption.NOFOLLOW_LINKS)) {
            try (Stream<String> lines = Files.lines(summary, StandardCharsets.UTF_8)) {
                if (lines.findFirst().orElse("").startsWith(MARK)) {
                    return true;
                }
            } catch (UncheckedIOException e) {
                // not text: not a demo folder
            }
        }
        throw new IllegalArgumentException(target + " exists and is not a previous demo folder (no " + SUMMARY
                + " written by fixmod demo); choose another folder with -o");
    }

    private static CompareReport simulateAndCompare(OutputSet out, Path setDir, DeviceModel.Build build, String dump,
            String reportName) throws IOException {
        try (Writer w = writer(out.newFile(dump))) {
            Testbench.run(setDir, build, w);
        }
        GoldenSet.PortFiles port = GoldenSet.open(setDir).port("llr");
        CompareOptions options = CompareOptions.exact(port.layout().fieldCount()).withAlignWindow(ALIGN_WINDOW);
        CompareReport report;
        try (VectorFlags flags = port.flags();
                WordReader g = new HexWordReader(open(port.hex()), SET + "/" + port.hex().getFileName(),
                        port.layout().wordWidth());
                WordReader d = new HexWordReader(open(out.workFolder().resolve(dump)), dump,
                        port.layout().wordWidth())) {
            report = new Comparison(port.layout(), options).run(g, flags, d, "llr");
        }
        copy(out, reportName, ReportText.render(report));
        return report;
    }

    /** The summary the command prints; {@code folder} prefixes the paths ("" inside the folder's own copy). */
    public static String summary(Result r, String folder) {
        List<String> lines = new ArrayList<>();
        lines.add(MARK + ": " + SCENARIO);
        lines.add("  64-QAM (3GPP TS 38.211 mapping), fixed max-log demapper, floating-point prototype -> small FPGA;"
                + " planned 12-bit ADC, 6-bit LLRs");
        lines.add("  loss budget " + Numbers.fixed(r.budgetDb(), 1) + " dB; planned design loses "
                + Numbers.fixed(r.baseLossGmiDb(), 3) + " dB at the target GMI");
        for (LossAnalysis.Sizing s : r.sizing()) {
            String loss = s.rows().stream().filter(row -> row.value().equals(s.chosen())).findFirst()
                    .map(row -> Numbers.fixed(row.lossGmiDb(), 3) + " dB").orElse("n/a");
            lines.add("  recommended " + s.parameter() + ": " + s.chosen() + " bits (loss " + loss + ")");
        }
        lines.add(String.format(Locale.ROOT, "  golden set: %d mapper + %d demapper vectors, %d files",
                r.mapperVectors(), r.demapperVectors(), r.setFiles()));
        lines.add("  device model, as designed:        " + verdict(r.device()));
        lines.add("  device model, truncating output:  " + verdict(r.faulty()));
        lines.add("  open:");
        lines.add("    " + folder + LOSS_REPORT + "/report.html");
        lines.add("    " + folder + SET + "/" + Manifest.FILE_NAME);
        lines.add("    " + folder + COMPARE);
        lines.add("    " + folder + FAULTY_COMPARE);
        lines.add("  edit and rerun: " + folder + VECTOR_SPEC + ", " + folder + LOSS_SPEC + ", e.g.");
        lines.add("    ./fixmod compare " + folder + SET + " --port llr --dut " + folder + DUMP + " --align-window "
                + ALIGN_WINDOW);
        lines.add("  Engineering model, not conformance certification; the governing standard's text decides.");
        return String.join("\n", lines) + "\n";
    }

    private static String verdict(CompareReport r) {
        String latency = "latency " + r.alignment().latency() + (r.alignment().searched() ? " found" : "");
        if (r.agrees()) {
            return String.format(Locale.ROOT, "AGREE (%d of %d vectors, %s)", r.agreed(), r.compared(), latency);
        }
        String why = r.diagnoses().isEmpty() ? "" : ", diagnosis " + r.diagnoses().get(0).kind().tradeName();
        return String.format(Locale.ROOT, "DISAGREE (%d of %d vectors mismatch, %s%s)", r.mismatched(), r.compared(),
                latency, why);
    }

    private static InputStream open(Path p) throws IOException {
        return new BufferedInputStream(Files.newInputStream(p), 1 << 16);
    }

    private static Writer writer(OutputStream out) {
        return new OutputStreamWriter(out, StandardCharsets.UTF_8);
    }

    private static void copy(OutputSet out, String name, String text) throws IOException {
        try (Writer w = writer(out.newFile(name))) {
            w.write(text);
        }
    }

    private static String resource(String name) throws IOException {
        try (InputStream in = Demo.class.getResourceAsStream("/demo/" + name)) {
            if (in == null) {
                throw new IllegalStateException("the demo's resource /demo/" + name + " is missing from the jar");
            }
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        }
    }
}
