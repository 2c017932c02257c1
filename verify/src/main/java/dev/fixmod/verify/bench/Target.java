package dev.fixmod.verify.bench;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * A performance target as a ratio of two figures measured in the same run (or, for the writer, one figure against a
 * floor), so the load of a shared machine cancels out as far as it can. A target whose figures were not measured
 * (the include pattern left them out) has a {@code NaN} value.
 *
 * @param name      short name, e.g. {@code per-axis-vs-exhaustive}
 * @param statement what is compared, in words
 * @param required  the least value that meets the target
 * @param value     the measured ratio (or MB/s), {@code NaN} if not measured
 * @param error     its propagated 99.9 % half-width (relative errors added in quadrature), {@code NaN} if unknown
 * @param unit      {@code ×} for a ratio, {@code MB/s} for a rate
 */
public record Target(String name, String statement, double required, double value, double error, String unit) {

    public boolean measured() {
        return !Double.isNaN(value);
    }

    public boolean met() {
        return measured() && value >= required;
    }

    /** The targets of the benchmark issue, evaluated on {@code results}. */
    public static List<Target> evaluate(List<Measurement> results) {
        List<Target> targets = new ArrayList<>();
        targets.add(ratio("per-axis-vs-exhaustive", "fixed per-axis max-log vs fixed exhaustive max-log, 256-QAM"
                        + " (LLRs per second)", 200,
                find(results, "LlrBench.demap", "demapper", "fixed:max-log-per-axis:256-qam"),
                find(results, "LlrBench.demap", "demapper", "fixed:max-log:256-qam"), 1));
        for (String qam : List.of("16-qam", "64-qam", "256-qam", "1024-qam")) {
            targets.add(ratio("fixed-vs-float-per-axis-" + qam, "fixed per-axis max-log vs float per-axis max-log, "
                            + qam.toUpperCase(java.util.Locale.ROOT), 1,
                    find(results, "LlrBench.demap", "demapper", "fixed:max-log-per-axis:" + qam),
                    find(results, "LlrBench.demap", "demapper", "float:max-log-per-axis:" + qam), 1));
        }
        targets.add(ratio("ziggurat-vs-box-muller", "ziggurat vs Box–Muller on StrictMath (Gaussians per second)", 5,
                find(results, "NoiseBench.gaussian", "method", "ziggurat"),
                find(results, "NoiseBench.gaussian", "method", "box-muller"), 1));
        targets.add(ratio("chain-vs-noise", "Monte Carlo chain, 256-QAM, 1 thread, symbols per second vs the ziggurat"
                        + " generating its 2 Gaussians per symbol", 0.5,
                find(results, "ChainBench.oneThread", "scenario", "256-qam"),
                find(results, "NoiseBench.gaussian", "method", "ziggurat"), 2));
        targets.add(ratio("chain-2-threads", "Monte Carlo chain, 256-QAM, 2 threads vs 1 thread", 1.7,
                find(results, "ChainBench.twoThreads", "scenario", "256-qam"),
                find(results, "ChainBench.oneThread", "scenario", "256-qam"), 1));
        Optional<Measurement> hex = results.stream().filter(m -> m.benchmark().equals("WriterBench.write")
                && m.param("format").equals("hex") && m.param("sink").equals("null")).findFirst();
        targets.add(new Target("hex-writing", "hex vector writing to a discarding stream (MB/s of output)", 300,
                hex.map(Measurement::megabytesPerSecond).orElse(Double.NaN),
                hex.map(m -> m.error() / m.score() * m.megabytesPerSecond()).orElse(Double.NaN), "MB/s"));
        return targets;
    }

    private static Optional<Measurement> find(List<Measurement> results, String benchmark, String key, String value) {
        return results.stream().filter(m -> m.benchmark().equals(benchmark) && m.param(key).equals(value)).findFirst();
    }

    /** {@code numerator / (denominator / perItem)}. */
    private static Target ratio(String name, String statement, double required, Optional<Measurement> numerator,
                                Optional<Measurement> denominator, double perItem) {
        if (numerator.isEmpty() || denominator.isEmpty()) {
            return new Target(name, statement, required, Double.NaN, Double.NaN, "×");
        }
        Measurement n = numerator.get();
        Measurement d = denominator.get();
        double value = n.score() / (d.score() / perItem);
        double relative = Math.sqrt(square(n.error() / n.score()) + square(d.error() / d.score()));
        return new Target(name, statement, required, value, value * relative, "×");
    }

    private static double square(double x) {
        return x * x;
    }
}
