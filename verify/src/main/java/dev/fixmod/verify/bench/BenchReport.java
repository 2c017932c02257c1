package dev.fixmod.verify.bench;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.lang.management.ManagementFactory;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;

/**
 * The results of one benchmark run with the machine they were measured on: a Markdown table, a targets section and
 * a JSON document ({@code schema: fixmod-bench, version 1}).
 *
 * @param machine   where and how the run happened
 * @param settings  the JMH settings, in words (e.g. {@code 1 fork, 2 × 1 s warm-up, 3 × 1 s measurement})
 * @param results   the measurements in run order
 */
public record BenchReport(Machine machine, String settings, List<Measurement> results) {

    public static final String SCHEMA = "fixmod-bench";
    public static final int VERSION = 1;

    public BenchReport {
        results = List.copyOf(results);
    }

    /**
     * The machine: CPU model (from {@code /proc/cpuinfo} where there is one), logical cores the JVM sees, OS, JVM,
     * and the one-minute load average before and after the run ({@code −1} where the OS does not report it).
     */
    public record Machine(String cpu, int cores, String os, String jvm, double loadBefore, double loadAfter) {

        /** This machine now; {@code loadAfter} is filled in by {@link #finished}. */
        public static Machine current() {
            return new Machine(cpuModel(), Runtime.getRuntime().availableProcessors(),
                    System.getProperty("os.name") + " " + System.getProperty("os.version") + " "
                            + System.getProperty("os.arch"),
                    System.getProperty("java.vm.name") + " " + System.getProperty("java.runtime.version"),
                    load(), Double.NaN);
        }

        public Machine finished() {
            return new Machine(cpu, cores, os, jvm, loadBefore, load());
        }

        static double load() {
            return ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage();
        }

        private static String cpuModel() {
            try {
                for (String line : Files.readAllLines(Path.of("/proc/cpuinfo"))) {
                    if (line.startsWith("model name")) {
                        return line.substring(line.indexOf(':') + 1).trim();
                    }
                }
            } catch (IOException | RuntimeException notLinux) {
                // fall through to the architecture
            }
            return System.getProperty("os.arch");
        }

        String describe() {
            return String.format(Locale.ROOT, "%s, %d logical cores, %s; JVM %s; load average %.1f before, %.1f"
                    + " after", cpu, cores, os, jvm, loadBefore, loadAfter);
        }
    }

    public List<Target> targets() {
        return Target.evaluate(results);
    }

    /** The Markdown summary: machine, settings, results table, targets table. */
    public String markdown() {
        StringBuilder sb = new StringBuilder();
        sb.append("## fixmod benchmarks\n\n");
        sb.append("Machine: ").append(machine.describe()).append(".  \n");
        sb.append("Settings: ").append(settings).append(".\n\n");
        sb.append("| benchmark | parameters | threads | ops/s | ± | one op | per op | derived |\n");
        sb.append("|---|---|---:|---:|---:|---|---:|---:|\n");
        for (Measurement m : results) {
            sb.append("| ").append(m.benchmark()).append(" | ").append(m.paramText()).append(" | ").append(m.threads())
                    .append(" | ").append(number(m.score())).append(" | ").append(number(m.error())).append(" | ")
                    .append(m.item()).append(" | ").append(nanos(1e9 / m.score())).append(" | ").append(m.derived())
                    .append(" |\n");
        }
        sb.append("\n### Targets\n\n");
        sb.append("Each target is a ratio of two figures of this run (hex writing: a rate).\n\n");
        sb.append("| target | measured | required | status |\n|---|---:|---:|---|\n");
        for (Target t : targets()) {
            sb.append("| ").append(t.statement()).append(" | ");
            if (t.measured()) {
                sb.append(ratio(t.value())).append(' ').append(t.unit());
                if (!Double.isNaN(t.error())) {
                    sb.append(" ± ").append(ratio(t.error()));
                }
            } else {
                sb.append("—");
            }
            sb.append(" | ≥ ").append(ratio(t.required())).append(' ').append(t.unit()).append(" | ")
                    .append(!t.measured() ? "not measured" : t.met() ? "met"
                            : String.format(Locale.ROOT, "short by %.0f %%", 100 * (1 - t.value() / t.required())))
                    .append(" |\n");
        }
        return sb.toString();
    }

    /** The JSON document; {@code NaN} becomes {@code null}. */
    public String json() {
        ObjectMapper mapper = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);
        ObjectNode root = mapper.createObjectNode();
        root.put("schema", SCHEMA);
        root.put("version", VERSION);
        ObjectNode m = root.putObject("machine");
        m.put("cpu", machine.cpu());
        m.put("cores", machine.cores());
        m.put("os", machine.os());
        m.put("jvm", machine.jvm());
        put(m, "loadBefore", machine.loadBefore());
        put(m, "loadAfter", machine.loadAfter());
        root.put("settings", settings);
        ArrayNode rs = root.putArray("results");
        for (Measurement r : results) {
            ObjectNode n = rs.addObject();
            n.put("benchmark", r.benchmark());
            ObjectNode p = n.putObject("params");
            new java.util.TreeMap<>(r.params()).forEach(p::put);
            n.put("threads", r.threads());
            n.put("unit", "ops/s");
            n.put("item", r.item());
            put(n, "score", r.score());
            put(n, "error", r.error());
        }
        ArrayNode ts = root.putArray("targets");
        for (Target t : targets()) {
            ObjectNode n = ts.addObject();
            n.put("name", t.name());
            n.put("statement", t.statement());
            n.put("unit", t.unit());
            put(n, "required", t.required());
            put(n, "value", t.value());
            put(n, "error", t.error());
            n.put("measured", t.measured());
            n.put("met", t.met());
        }
        try {
            return mapper.writeValueAsString(root) + "\n";
        } catch (IOException e) {
            throw new IllegalStateException("cannot render the benchmark report as JSON", e);
        }
    }

    private static void put(ObjectNode node, String key, double value) {
        if (Double.isNaN(value) || Double.isInfinite(value)) {
            node.putNull(key);
        } else {
            node.put(key, value);
        }
    }

    /** Three significant digits, grouped thousands for big numbers. */
    static String number(double x) {
        if (Double.isNaN(x)) {
            return "—";
        }
        if (Math.abs(x) >= 1000) {
            double magnitude = Math.pow(10, Math.floor(Math.log10(Math.abs(x))) - 2);
            return String.format(Locale.ROOT, "%,.0f", Math.round(x / magnitude) * magnitude);
        }
        return String.format(Locale.ROOT, "%.3g", x);
    }

    static String ratio(double x) {
        return String.format(Locale.ROOT, Math.abs(x) >= 100 ? "%.0f" : Math.abs(x) >= 10 ? "%.1f" : "%.2f", x);
    }

    static String nanos(double ns) {
        return ns >= 1e6 ? String.format(Locale.ROOT, "%.3g ms", ns / 1e6)
                : ns >= 1e3 ? String.format(Locale.ROOT, "%.3g µs", ns / 1e3)
                : String.format(Locale.ROOT, "%.3g ns", ns);
    }
}
