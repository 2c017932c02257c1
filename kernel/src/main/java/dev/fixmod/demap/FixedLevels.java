package dev.fixmod.demap;

import dev.fixmod.constellation.AxisLayout;
import dev.fixmod.constellation.Constellation;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.map.ConstellationRom;

/** Construction-time helpers of the fixed-point LLR datapaths: reference levels, bounds, the scale constant. */
final class FixedLevels {
    private FixedLevels() {
    }

    /** The metric magnitude bound (in real units) that {@link FixedLlrSpec#suggested} sizes the metric stage for. */
    record Bounds(double metric) {
    }

    /** The constellation in the units of the ROM's codes: the ROM's points before quantization. */
    static Constellation effective(ConstellationRom reference) {
        return reference.scale() == 1.0 ? reference.constellation()
                : reference.constellation().scaled(reference.scale());
    }

    /** The codes of an axis's levels, indexed by sub-label, read from the ROM. */
    static long[] axisCodes(ConstellationRom reference, AxisLayout layout, boolean qAxis) {
        int count = 1 << (qAxis ? layout.qBits().length : layout.iBits().length);
        long[] codes = new long[count];
        for (int sub = 0; sub < count; sub++) {
            codes[sub] = qAxis ? reference.qCode(layout.compose(0, sub)) : reference.iCode(layout.compose(sub, 0));
        }
        return codes;
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
