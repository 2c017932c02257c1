package dev.fixmod.demap;

import dev.fixmod.constellation.AxisLayout;
import dev.fixmod.constellation.Constellation;
import dev.fixmod.fixed.FixedPoint;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Rounding;
import java.util.HashMap;
import java.util.Map;

/** Construction-time quantization of a constellation onto an input grid, with the checks that it fits. */
final class FixedLevels {
    private FixedLevels() {
    }

    /** The metric magnitude bound (in real units) that {@link FixedLlrSpec#suggested} sizes the metric stage for. */
    record Bounds(double metric) {
    }

    /**
     * The codes of {@code levels} in {@code input}.
     *
     * @throws IllegalArgumentException if a level lies outside the format or two levels share a code
     */
    static long[] quantize(double[] levels, QFormat input, Rounding rounding, String what) {
        long[] codes = new long[levels.length];
        Map<Long, Double> seen = new HashMap<>();
        for (int n = 0; n < levels.length; n++) {
            codes[n] = code(levels[n], input, rounding, what);
            Double other = seen.put(codes[n], levels[n]);
            if (other != null) {
                throw tooCoarse(input, what, other, levels[n], codes[n]);
            }
        }
        return codes;
    }

    /** The codes of every point of {@code constellation}, as {@code {re codes, im codes}} by label. */
    static long[][] quantizePoints(Constellation constellation, QFormat input, Rounding rounding) {
        int m = constellation.size();
        long[][] codes = new long[2][m];
        Map<String, Integer> seen = new HashMap<>();
        for (int s = 0; s < m; s++) {
            codes[0][s] = code(constellation.re(s), input, rounding, constellation.name() + " label " + s + " (I)");
            codes[1][s] = code(constellation.im(s), input, rounding, constellation.name() + " label " + s + " (Q)");
            Integer other = seen.put(codes[0][s] + "," + codes[1][s], s);
            if (other != null) {
                throw new IllegalArgumentException("input format " + input + " is too coarse for "
                        + constellation.name() + ": labels " + other + " and " + s + " both quantize to the point ("
                        + codes[0][s] + ", " + codes[1][s] + "); add fractional bits");
            }
        }
        return codes;
    }

    private static long code(double value, QFormat input, Rounding rounding, String what) {
        OverflowCounter fit = OverflowCounter.unnamed();
        long code = FixedPoint.quantize(value, input, rounding, Overflow.SATURATE, fit);
        if (fit.events() > 0) {
            throw new IllegalArgumentException("input format " + input.describe() + " is too narrow for " + what
                    + ": it cannot hold the value " + value + "; add integer bits or normalize the constellation");
        }
        return code;
    }

    private static IllegalArgumentException tooCoarse(QFormat input, String what, double a, double b, long code) {
        return new IllegalArgumentException("input format " + input + " is too coarse for " + what + ": levels " + a
                + " and " + b + " both quantize to code " + code + "; add fractional bits");
    }

    /** The largest magnitude an input code can have, in real units. */
    static double inputPeak(QFormat input) {
        return Math.max(-input.minValue(), input.maxValue());
    }

    static Bounds bounds(SoftAlgorithm algorithm, Constellation constellation, QFormat input) {
        double y = inputPeak(input);
        if (algorithm == SoftAlgorithm.FOLDED_LINEAR) {
            FoldedAxis[] axes = foldedAxes(constellation);
            double worst = 0;
            for (FoldedAxis a : axes) {
                double sum = y;
                for (int j = 1; j < a.bits; j++) {
                    sum += a.threshold(j);
                }
                worst = Math.max(worst, sum);
            }
            return new Bounds(worst);
        }
        requireFixedAlgorithm(algorithm);
        double peak = 0;
        for (int s = 0; s < constellation.size(); s++) {
            peak = Math.max(peak, Math.max(Math.abs(constellation.re(s)), Math.abs(constellation.im(s))));
        }
        // Every squared distance is at most 2·(y + peak)²; so is a difference of two.
        return new Bounds(2 * (y + peak) * (y + peak));
    }

    /** K: 1/N0 for the max-log metrics, 4A/N0 for folded-linear. */
    static double scaleValue(SoftAlgorithm algorithm, Constellation constellation, LlrOptions options) {
        if (algorithm == SoftAlgorithm.FOLDED_LINEAR) {
            return 4 * commonHalfSpacing(foldedAxes(constellation), constellation) / options.n0();
        }
        requireFixedAlgorithm(algorithm);
        return 1.0 / options.n0();
    }

    static void requireFixedAlgorithm(SoftAlgorithm algorithm) {
        if (algorithm == SoftAlgorithm.LOG_MAP) {
            throw new IllegalArgumentException("log-map has no fixed-point datapath; use max-log, max-log-per-axis or"
                    + " folded-linear");
        }
    }

    static FoldedAxis[] foldedAxes(Constellation constellation) {
        AxisLayout layout = constellation.axes();
        if (layout == null) {
            throw new IllegalArgumentException(SoftAlgorithm.FOLDED_LINEAR + " needs a separable constellation (PAM,"
                    + " square or rectangular QAM); " + constellation.name() + " is not: use max-log");
        }
        return new FoldedAxis[] {
            FoldedAxis.of(layout.iLevels(), layout.iBits().length, constellation.name() + " axis I"),
            FoldedAxis.of(layout.qLevels(), layout.qBits().length, constellation.name() + " axis Q")};
    }

    /** The one level half-spacing A both axes share (one scale constant serves both). */
    static double commonHalfSpacing(FoldedAxis[] axes, Constellation constellation) {
        double a = axes[0].halfSpacing;
        double b = axes[1].halfSpacing;
        if (axes[1].bits == 0) {
            return a;
        }
        if (Math.abs(a - b) > 1e-9 * Math.max(a, b)) {
            throw new IllegalArgumentException("the fixed-point " + SoftAlgorithm.FOLDED_LINEAR + " datapath shares"
                    + " one scale constant between the axes, but " + constellation.name() + " has level spacings "
                    + 2 * a + " (I) and " + 2 * b + " (Q): use max-log-per-axis");
        }
        return a;
    }
}
