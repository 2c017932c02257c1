package dev.fixmod.verify.bench;

import java.util.Map;
import java.util.Objects;
import java.util.TreeMap;

/**
 * One benchmark result: the benchmark (simple class name and method, e.g. {@code LlrBench.demap}), its parameters,
 * and the throughput in operations per second with the half-width of its 99.9 % confidence interval as JMH
 * computes it ({@code NaN} when too few iterations ran). What one operation is depends on the benchmark: see
 * {@link #item()}.
 */
public record Measurement(String benchmark, Map<String, String> params, int threads, double score, double error) {

    public Measurement {
        Objects.requireNonNull(benchmark, "benchmark");
        params = Map.copyOf(params);
    }

    /** The parameters as {@code key=value} pairs in key order, or empty. */
    public String paramText() {
        StringBuilder sb = new StringBuilder();
        new TreeMap<>(params).forEach((key, value) -> sb.append(sb.length() == 0 ? "" : " ").append(key).append('=')
                .append(value));
        return sb.toString();
    }

    public String param(String key) {
        return params.getOrDefault(key, "");
    }

    /** What one operation is. */
    public String item() {
        return switch (benchmark.substring(0, benchmark.indexOf('.'))) {
            case "LlrBench", "SlicerBench" -> "sample";
            case "NoiseBench" -> "Gaussian";
            case "WriterBench" -> "row";
            default -> "symbol";
        };
    }

    /** A second figure where one says more than ops/s: ns per LLR, MB/s of output; empty otherwise. */
    public String derived() {
        if (benchmark.startsWith("LlrBench.")) {
            String demapper = param("demapper");
            int k = bitsPerSymbol(demapper.substring(demapper.lastIndexOf(':') + 1));
            return String.format(java.util.Locale.ROOT, "%.3g ns/LLR", 1e9 / (score * k));
        }
        if (benchmark.startsWith("WriterBench.")) {
            return String.format(java.util.Locale.ROOT, "%.0f MB/s", megabytesPerSecond());
        }
        return "";
    }

    public double megabytesPerSecond() {
        return score * WriterBench.bytesPerRow(param("format")) / 1e6;
    }

    static int bitsPerSymbol(String scenario) {
        return switch (scenario) {
            case "16-qam" -> 4;
            case "64-qam" -> 6;
            case "256-qam" -> 8;
            case "1024-qam" -> 10;
            case "8-psk" -> 3;
            default -> throw new IllegalArgumentException("unknown benchmark scenario '" + scenario + "'");
        };
    }
}
