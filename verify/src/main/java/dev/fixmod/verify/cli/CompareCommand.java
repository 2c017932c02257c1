package dev.fixmod.verify.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import dev.fixmod.verify.compare.BinaryWordReader;
import dev.fixmod.verify.compare.CompareOptions;
import dev.fixmod.verify.compare.CompareReport;
import dev.fixmod.verify.compare.Comparison;
import dev.fixmod.verify.compare.CsvWordReader;
import dev.fixmod.verify.compare.GoldenSet;
import dev.fixmod.verify.compare.HexWordReader;
import dev.fixmod.verify.compare.ReportText;
import dev.fixmod.verify.compare.VectorFlags;
import dev.fixmod.verify.compare.WordReader;
import dev.fixmod.verify.formats.FieldLayout;
import java.io.BufferedInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code fixmod compare}: a device dump against one port of golden words, or two golden sets against each other.
 * Prints the report (text or JSON) on standard output; exit status 0 when everything agrees, 1 on mismatches, 2 on
 * bad usage or a malformed file.
 */
@Command(name = "compare",
        mixinStandardHelpOptions = true,
        description = {"Compare a device-under-test dump with golden words, field by field, and diagnose faults.",
                "GOLDEN is a golden hex file (give --layout) or a vector set folder (give --port).",
                "With two folders and no --dut, compares every port of two sets (regression between versions)."},
        footer = {"", "Alignment: --skip words are dropped first, then leading x/z words, then the latency",
                "(--latency, or the best in 0..--align-window scored on --align-prefix vectors).",
                "",
                "Examples:",
                "  fixmod compare vectors/nr-qam16 --port llr --dut llr_dump.hex",
                "  fixmod compare vectors/nr-qam16 --port llr --dut llr_dump.hex --align-window 16 --tolerance '*=1'",
                "  fixmod compare golden.hex --layout i:Q1.6,q:Q1.6 --dut out.bin --dut-format bin --json",
                "  fixmod compare old-set new-set --quiet",
                "",
                "Exit status: 0 all agree, 1 mismatches, 2 bad usage or malformed file (named with its line)."})
public final class CompareCommand implements Callable<Integer> {

    /** Dump file formats. */
    public enum DumpFormat {
        HEX, CSV, BIN
    }

    @Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Parameters(index = "0", paramLabel = "GOLDEN", description = "Golden hex file, or vector set folder.")
    Path golden;

    @Parameters(index = "1", arity = "0..1", paramLabel = "SET_B",
            description = "Second vector set folder: compare the two sets port by port.")
    Path second;

    @Option(names = "--port", paramLabel = "PORT", description = "Port of the set to compare against, e.g. llr.")
    String port;

    @Option(names = "--layout", paramLabel = "FIELDS",
            description = "Fields of a golden hex file, most significant first: name:Qm.n,... (e.g. I:Q2.9,Q:Q2.9).")
    String layoutText;

    @Option(names = "--dut", paramLabel = "FILE", description = "The device's dump.")
    Path dut;

    @Option(names = "--dut-format", paramLabel = "FORMAT", defaultValue = "hex",
            description = "Dump format: hex (one word per line, // comments, x/z digits), csv (header naming the"
                    + " fields, decimal codes), bin (little-endian words of --word-bytes). Default: ${DEFAULT-VALUE}.")
    DumpFormat dutFormat;

    @Option(names = "--word-bytes", paramLabel = "N",
            description = "Bytes per word of a bin dump: 1, 2, 4 or 8 (default: the smallest that holds the word).")
    Integer wordBytes;

    @Option(names = "--latency", paramLabel = "N", description = "Device latency in words (default 0).")
    Integer latency;

    @Option(names = "--align-window", paramLabel = "N",
            description = "Search the latency in 0..N instead; the report names the latency chosen.")
    Integer alignWindow;

    @Option(names = "--align-prefix", paramLabel = "N", defaultValue = "256",
            description = "Vectors the latency search scores each candidate on. Default: ${DEFAULT-VALUE}.")
    int alignPrefix;

    @Option(names = "--skip", paramLabel = "N", defaultValue = "0",
            description = "Dump words to drop first (e.g. written during reset). Default: ${DEFAULT-VALUE}.")
    long skip;

    @Option(names = "--keep-unknown-prefix",
            description = "Compare leading words with x/z digits instead of dropping them as invalid.")
    boolean keepUnknownPrefix;

    @Option(names = "--tolerance", paramLabel = "FIELD=LSB", split = ",",
            description = "Per-field tolerance in LSB, e.g. llr0=1,llr1=1 (default exact); '*=1' for every field.")
    List<String> tolerances = new ArrayList<>();

    @Option(names = "--sign-only", description = "Compare only the sign of each field (LLR hard decisions).")
    boolean signOnly;

    @Option(names = "--flags", paramLabel = "FLAG", split = ",",
            description = "Compare only vectors carrying at least one of these corner-case flags.")
    List<String> flags = new ArrayList<>();

    @Option(names = "--max-mismatches", paramLabel = "N", defaultValue = "0",
            description = "Stop after N mismatching vectors (0 = compare everything). Default: ${DEFAULT-VALUE}.")
    long maxMismatches;

    @Option(names = "--show", paramLabel = "K", defaultValue = "10",
            description = "Mismatches listed in detail. Default: ${DEFAULT-VALUE}.")
    int show;

    @Option(names = "--context", paramLabel = "N", defaultValue = "3",
            description = "Vectors shown before and after the first failure. Default: ${DEFAULT-VALUE}.")
    int context;

    @Option(names = "--json", description = "Print the report as JSON.")
    boolean json;

    @Option(names = {"-q", "--quiet"}, description = "Print only the verdict line (the exit status says it too).")
    boolean quiet;

    @Override
    public Integer call() {
        if (latency != null && alignWindow != null) {
            throw new UsageException("--latency and --align-window exclude each other: give a fixed latency or a"
                    + " window to search it in");
        }
        if (json && quiet) {
            throw new UsageException("--json and --quiet exclude each other");
        }
        List<CompareReport> reports = new ArrayList<>();
        if (second != null) {
            if (dut != null) {
                throw new UsageException("give either SET_B (compare two sets) or --dut (compare a dump), not both");
            }
            GoldenSet a = GoldenSet.open(golden);
            GoldenSet b = GoldenSet.open(second);
            reports.addAll(compareSets(a, b));
        } else {
            if (dut == null) {
                throw new UsageException("--dut FILE is required (or give a second set folder to compare two sets)");
            }
            reports.add(compareDump());
        }
        print(reports);
        boolean agree = reports.stream().allMatch(CompareReport::agrees);
        return agree ? ExitStatus.OK : ExitStatus.MISMATCH;
    }

    private CompareReport compareDump() {
        FieldLayout layout;
        Path goldenFile;
        VectorFlags vectorFlags = VectorFlags.NONE;
        String portName = port;
        if (Files.isDirectory(golden)) {
            if (layoutText != null) {
                throw new UsageException("--layout is for a golden hex file; a set's manifest gives the layout");
            }
            GoldenSet set = GoldenSet.open(golden);
            if (port == null) {
                throw new UsageException("--port is required with a vector set; this set's ports are "
                        + String.join(", ", set.ports()));
            }
            GoldenSet.PortFiles p = set.port(port);
            layout = p.layout();
            goldenFile = p.hex();
            vectorFlags = p.flags();
        } else {
            if (layoutText == null) {
                throw new UsageException("--layout FIELDS is required with a golden hex file (e.g. --layout"
                        + " llr0:Q5.0,llr1:Q5.0); a vector set folder carries its own");
            }
            if (port != null) {
                throw new UsageException("--port selects a port of a vector set folder; " + golden
                        + " is a file");
            }
            layout = FieldLayout.parse(layoutText);
            goldenFile = golden;
        }
        CompareOptions options = options(layout, vectorFlags);
        try (VectorFlags closing = vectorFlags;
                WordReader g = new HexWordReader(open(goldenFile), goldenFile.toString(), layout.wordWidth());
                WordReader d = dutReader(layout)) {
            return new Comparison(layout, options).run(g, vectorFlags, d, portName);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private List<CompareReport> compareSets(GoldenSet a, GoldenSet b) {
        List<CompareReport> out = new ArrayList<>();
        List<String> onlyA = new ArrayList<>(a.ports());
        onlyA.removeAll(b.ports());
        List<String> onlyB = new ArrayList<>(b.ports());
        onlyB.removeAll(a.ports());
        if (!onlyA.isEmpty() || !onlyB.isEmpty()) {
            throw new UsageException("the sets have different ports: only in " + a.folder() + ": " + onlyA
                    + "; only in " + b.folder() + ": " + onlyB);
        }
        for (String p : a.ports()) {
            if (port != null && !port.equals(p)) {
                continue;
            }
            GoldenSet.PortFiles pa = a.port(p);
            GoldenSet.PortFiles pb = b.port(p);
            if (!pa.layout().equals(pb.layout())) {
                throw new UsageException("port " + p + " has layout " + pa.layout() + " in " + a.folder() + " but "
                        + pb.layout() + " in " + b.folder() + "; words of different layouts do not compare");
            }
            VectorFlags flagsA = pa.flags();
            CompareOptions options = options(pa.layout(), flagsA);
            try (VectorFlags closing = flagsA;
                    WordReader ga = new HexWordReader(open(pa.hex()), pa.hex().toString(), pa.layout().wordWidth());
                    WordReader gb = new HexWordReader(open(pb.hex()), pb.hex().toString(), pb.layout().wordWidth())) {
                out.add(new Comparison(pa.layout(), options).run(ga, flagsA, gb, p));
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        }
        if (out.isEmpty()) {
            throw new UsageException("port '" + port + "' is not in the sets; their ports are "
                    + String.join(", ", a.ports()));
        }
        return out;
    }

    private CompareOptions options(FieldLayout layout, VectorFlags vectorFlags) {
        CompareOptions o = CompareOptions.exact(layout.fieldCount())
                .withSkip(skip)
                .withSkipLeadingUnknown(!keepUnknownPrefix)
                .withTolerance(tolerance(layout))
                .withSignOnly(signOnly)
                .withMaxMismatches(maxMismatches)
                .withShow(show)
                .withContext(context);
        o = new CompareOptions(latency == null ? 0 : latency, alignWindow == null ? 0 : alignWindow, alignPrefix,
                o.skip(), o.skipLeadingUnknown(), o.tolerance(), o.signOnly(), o.flagMask(), o.maxMismatches(),
                o.show(), o.context());
        if (!flags.isEmpty()) {
            o = o.withFlagMask(vectorFlags.maskOf(flags));
        }
        return o;
    }

    private long[] tolerance(FieldLayout layout) {
        long[] t = new long[layout.fieldCount()];
        for (String item : tolerances) {
            int eq = item.indexOf('=');
            if (eq < 0) {
                throw new UsageException("--tolerance '" + item + "': expected FIELD=LSB, e.g. llr0=1");
            }
            String name = item.substring(0, eq).trim();
            long lsb;
            try {
                lsb = Long.parseLong(item.substring(eq + 1).trim());
            } catch (NumberFormatException e) {
                throw new UsageException("--tolerance '" + item + "': '" + item.substring(eq + 1)
                        + "' is not a whole number of LSB");
            }
            if (lsb < 0) {
                throw new UsageException("--tolerance '" + item + "': a tolerance must be >= 0 LSB");
            }
            if (name.equals("*")) {
                java.util.Arrays.fill(t, lsb);
                continue;
            }
            int f = layout.indexOf(name);
            if (f < 0) {
                throw new UsageException("--tolerance '" + item + "': no field '" + name + "'; the fields are "
                        + layout);
            }
            t[f] = lsb;
        }
        return t;
    }

    private WordReader dutReader(FieldLayout layout) throws IOException {
        switch (dutFormat) {
            case HEX:
                return new HexWordReader(open(dut), dut.toString(), layout.wordWidth());
            case CSV:
                return new CsvWordReader(Files.newBufferedReader(existing(dut), StandardCharsets.UTF_8),
                        dut.toString(), layout);
            case BIN:
                int bytes = wordBytes == null ? BinaryWordReader.containerBytes(layout.wordWidth()) : wordBytes;
                return new BinaryWordReader(open(dut), dut.toString(), layout.wordWidth(), bytes);
            default:
                throw new AssertionError(dutFormat);
        }
    }

    private static InputStream open(Path p) throws IOException {
        return new BufferedInputStream(Files.newInputStream(existing(p)), 1 << 16);
    }

    private static Path existing(Path p) {
        if (!Files.isRegularFile(p)) {
            throw new UsageException(p + ": no such file");
        }
        return p;
    }

    private void print(List<CompareReport> reports) {
        PrintWriter out = spec.commandLine().getOut();
        if (json) {
            ObjectMapper mapper = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);
            Map<String, Object> root = new LinkedHashMap<>();
            root.put("tool", "fixmod " + Version.TOOL_VERSION);
            root.put("agree", reports.stream().allMatch(CompareReport::agrees));
            root.put("reports", reports);
            try {
                out.println(mapper.writeValueAsString(root));
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        } else {
            for (CompareReport r : reports) {
                out.print(quiet ? ReportText.verdict(r) + "\n" : ReportText.render(r));
            }
        }
        out.flush();
    }
}
