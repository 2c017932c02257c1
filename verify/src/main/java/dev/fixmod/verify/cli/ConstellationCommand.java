package dev.fixmod.verify.cli;

import dev.fixmod.constellation.Catalogue;
import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Labeling;
import dev.fixmod.constellation.Normalization;
import dev.fixmod.constellation.Profile;
import dev.fixmod.verify.constellation.ConstellationFile;
import dev.fixmod.verify.constellation.ConstellationReport;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.concurrent.Callable;
import java.util.stream.Collectors;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code fixmod constellation}: prints a constellation's points, labels and ideal metrics. */
@Command(name = "constellation",
        mixinStandardHelpOptions = true,
        versionProvider = Version.class,
        sortOptions = false,
        description = {"Prints a constellation's points with their labels (b0 first) and its ideal metrics:"
                + " E_s, E_b, d_min, nearest neighbours, power efficiency, SNR loss vs BPSK, PAPR, Gray penalty,"
                + " entropy, bandwidth efficiency."},
        footer = {"", "Examples:",
                "  fixmod constellation qam16",
                "  fixmod constellation nr:qam64 --json",
                "  fixmod constellation psk8 --phase-offset 22.5 --labeling natural",
                "  fixmod constellation qam64 --shaping 0.05",
                "  fixmod constellation cqam32 --normalization none --csv > cross32.csv",
                "  fixmod constellation --file cross32.csv --normalization none",
                "  fixmod constellation --list",
                "",
                "Exit status: 0 success, 2 bad name, option or file.",
                "The standard profiles (nr:, wlan:) are engineering models of the published mappings, not"
                        + " conformance certification; the standard's text decides."})
public final class ConstellationCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", arity = "0..1", paramLabel = "NAME",
            description = "Constellation name, e.g. qam16, psk8, rqam8, cqam32, apsk16, star8, pi2bpsk, nr:qam64,"
                    + " wlan:qam1024 (see --list).")
    String name;

    @Option(names = "--labeling", paramLabel = "LABELING",
            description = "gray, natural or quasi-gray (default: the name's own, see --list).")
    String labeling;

    @Option(names = "--normalization", paramLabel = "MODE", defaultValue = "unit-energy",
            description = "none, unit-energy, unit-bit-energy or unit-peak (default: ${DEFAULT-VALUE}). none keeps the"
                    + " natural grid: odd integers for PAM/QAM, unit circle for PSK, the file's coordinates.")
    String normalization;

    @Option(names = "--phase-offset", paramLabel = "DEGREES", defaultValue = "0",
            description = "Angle of point 0 for psk<M> and bpsk (default: 0).")
    double phaseOffsetDegrees;

    @Option(names = "--shaping", paramLabel = "LAMBDA", defaultValue = "0",
            description = "Maxwell-Boltzmann probabilities p ~ exp(-LAMBDA |s|^2) on the natural grid, before"
                    + " normalization (default: 0, equiprobable).")
    double shaping;

    @Option(names = "--rolloff", paramLabel = "ALPHA", defaultValue = "0.25",
            description = "Raised-cosine roll-off for the bandwidth efficiency, 0..1 (default: ${DEFAULT-VALUE}).")
    double rolloff;

    @Option(names = "--file", paramLabel = "PATH",
            description = "Read a user-defined constellation from a .csv or .json file (columns or keys label and/or"
                    + " bits, i, q, optional probability) instead of NAME.")
    Path file;

    @Option(names = "--json", description = "Print everything as JSON.")
    boolean json;

    @Option(names = "--csv", description = "Print the points as CSV (label,bits,i,q,probability), readable by --file.")
    boolean csv;

    @Option(names = "--list", description = "List the names, labelings, normalizations and standard profiles.")
    boolean list;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        if (json && csv) {
            throw new UsageException("choose one of --json and --csv");
        }
        if (list) {
            if (name != null || file != null || json || csv) {
                throw new UsageException("--list takes no NAME, --file, --json or --csv");
            }
            out.print(listing());
            out.flush();
            return ExitStatus.OK;
        }
        if (name != null && file != null) {
            throw new UsageException("give a constellation NAME or --file PATH, not both");
        }
        if (name == null && file == null) {
            throw new UsageException("give a constellation NAME (see --list) or --file PATH");
        }
        if (!(rolloff >= 0 && rolloff <= 1)) {
            throw new UsageException("--rolloff must be between 0 and 1, got " + rolloff);
        }
        Normalization n;
        Labeling l;
        try {
            n = Normalization.fromName(normalization);
        } catch (IllegalArgumentException e) {
            throw new UsageException("--normalization: " + e.getMessage());
        }
        try {
            l = labeling == null ? null : Labeling.fromName(labeling);
        } catch (IllegalArgumentException e) {
            throw new UsageException("--labeling: " + e.getMessage());
        }
        if (!(shaping >= 0) || !Double.isFinite(shaping)) {
            throw new UsageException("--shaping: the Maxwell-Boltzmann parameter must be finite and >= 0, got "
                    + shaping);
        }
        if (!Double.isFinite(phaseOffsetDegrees)) {
            throw new UsageException("--phase-offset must be a finite number of degrees, got " + phaseOffsetDegrees);
        }
        Catalogue.Options options = new Catalogue.Options(l, n, phaseOffsetDegrees, shaping);
        Constellation grid;
        if (file != null) {
            if (labeling != null) {
                throw new UsageException("a file gives its own labels; drop --labeling");
            }
            if (phaseOffsetDegrees != 0) {
                throw new UsageException("--phase-offset applies to psk<M> and bpsk, not to a file");
            }
            grid = ConstellationFile.read(file);
        } else {
            grid = Catalogue.resolveOnGrid(name, options);
        }
        Constellation shaped = Catalogue.shape(grid, options);
        double scale = shaped.normalizationFactor(n);
        ConstellationReport report = new ConstellationReport(shaped.normalized(n), n, scale, phaseOffsetDegrees,
                shaping, rolloff);
        String text = json ? report.json() : csv ? report.csv() : report.text();
        out.print(text);
        out.flush();
        return ExitStatus.OK;
    }

    private static String listing() {
        StringBuilder sb = new StringBuilder("Constellation names (case-insensitive):\n");
        for (Catalogue.Entry e : Catalogue.entries()) {
            sb.append("  ").append(e.pattern()).append('\n');
            sb.append("      ").append(e.description());
            if (!e.labelings().isEmpty()) {
                sb.append("; labelings: ").append(e.labelings().get(0)).append(" (default)");
                for (Labeling l : e.labelings().subList(1, e.labelings().size())) {
                    sb.append(", ").append(l);
                }
            }
            sb.append('\n');
        }
        sb.append("\nLabelings: ").append(Arrays.stream(Labeling.values()).map(Labeling::tradeName)
                .collect(Collectors.joining(", "))).append('\n');
        sb.append("Normalizations: ").append(Arrays.stream(Normalization.values())
                .map(x -> x == Normalization.UNIT_ENERGY ? x.tradeName() + " (default)" : x.tradeName())
                .collect(Collectors.joining(", "))).append('\n');
        sb.append("Standard profiles (name them as <profile>:<member>):\n");
        for (Profile p : Profile.values()) {
            sb.append("  ").append(p.prefix()).append("  ").append(p.source()).append(": ")
                    .append(String.join(", ", p.members())).append('\n');
        }
        sb.append("User files: --file PATH.csv or PATH.json with label and/or bits, i, q and optional probability.\n");
        return sb.toString();
    }
}
