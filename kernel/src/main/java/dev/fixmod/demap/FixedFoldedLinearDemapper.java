package dev.fixmod.demap;

import dev.fixmod.constellation.AxisLayout;
import dev.fixmod.fixed.FixedPoint;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.map.ConstellationRom;
import dev.fixmod.map.DatapathCost;
import java.util.List;

/**
 * The folded-linear approximation ({@link FoldedLinearDemapper}) in fixed point, for Gray-labelled PAM, square and
 * rectangular QAM on equally spaced levels. Per axis, the metric stage holds every fold: {@code f0} is the input code
 * fitted into the metric format, and {@code fj = Tj − |f(j−1)|} with the fold constants {@code Tj = 2^(m−j)·A}
 * quantized once into the metric format, each result fitted again (so rounding and overflow happen where the
 * hardware's fold register would do them). Each bit's metric is {@code ±fj}; K = 4A/N0 turns it into nats. Both axes
 * must share one level spacing (one K).
 *
 * <p>Not thread-safe: holds per-axis fold scratch.
 */
public final class FixedFoldedLinearDemapper extends FixedSoftDemapper {
    private final int[] axis;
    private final int[] fold;
    private final int[] sign;
    private final long[][] thresholds;
    private final long[][] folds;
    private final int inputFractionalBits;
    private final int metricFractionalBits;

    public FixedFoldedLinearDemapper(ConstellationRom reference, LlrOptions options, FixedLlrSpec spec) {
        super(SoftAlgorithm.FOLDED_LINEAR, reference, options, spec);
        AxisLayout layout = AxisSegments.requireSeparable(constellation, options, SoftAlgorithm.FOLDED_LINEAR);
        FoldedAxis[] axes = FixedLevels.foldedAxes(constellation);
        AxisSegments.BitPlaces places = new AxisSegments.BitPlaces(layout);
        this.axis = places.axis;
        this.fold = new int[bitsPerSymbol];
        this.sign = new int[bitsPerSymbol];
        for (int b = 0; b < bitsPerSymbol; b++) {
            FoldedAxis fa = axes[axis[b]];
            fold[b] = fa.fold[places.position[b]];
            sign[b] = options.sign().factor() * fa.polarity[places.position[b]];
        }
        QFormat mf = spec.metric().format();
        this.inputFractionalBits = input.fractionalBits();
        this.metricFractionalBits = mf.fractionalBits();
        this.thresholds = new long[2][];
        this.folds = new long[2][];
        for (int x = 0; x < 2; x++) {
            thresholds[x] = new long[axes[x].bits];
            folds[x] = new long[axes[x].bits];
            for (int j = 1; j < axes[x].bits; j++) {
                OverflowCounter fit = OverflowCounter.unnamed();
                double t = axes[x].threshold(j);
                thresholds[x][j] = FixedPoint.quantize(t, mf, spec.constantRounding(), Overflow.SATURATE, fit);
                if (fit.events() > 0) {
                    throw new IllegalArgumentException("metric format " + mf.describe() + " is too narrow for the"
                            + " fold constant " + t + " of " + constellation.name() + "; add integer bits");
                }
            }
        }
    }

    @Override
    void prepare(long iCode, long qCode, OverflowCounter metric) {
        fold(iCode, thresholds[0], folds[0], metric);
        fold(qCode, thresholds[1], folds[1], metric);
    }

    private void fold(long y, long[] threshold, long[] out, OverflowCounter metric) {
        if (out.length == 0) {
            return;
        }
        out[0] = spec.metric().fit(y, inputFractionalBits, metric);
        for (int j = 1; j < out.length; j++) {
            out[j] = spec.metric().fit(threshold[j] - Math.abs(out[j - 1]), metricFractionalBits, metric);
        }
    }

    @Override
    long metric(int b, long iCode, long qCode, OverflowCounter metric) {
        return sign[b] * folds[axis[b]][fold[b]];
    }

    @Override
    void describe(int b, long iCode, long qCode, List<FixedLlrTrace.Value> into) {
        long y = axis[b] == 0 ? iCode : qCode;
        long[] t = thresholds[axis[b]];
        into.add(FixedLlrTrace.Value.code("y", y, inputFractionalBits, false));
        OverflowCounter c = OverflowCounter.unnamed();
        long f = spec.metric().fit(y, inputFractionalBits, c);
        into.add(FixedLlrTrace.Value.code("fold0", f, metricFractionalBits, c.events() > 0));
        for (int j = 1; j <= fold[b]; j++) {
            long before = c.events();
            into.add(FixedLlrTrace.Value.code("T" + j, t[j], metricFractionalBits, false));
            f = spec.metric().fit(t[j] - Math.abs(f), metricFractionalBits, c);
            into.add(FixedLlrTrace.Value.code("fold" + j, f, metricFractionalBits, c.events() > before));
        }
    }

    /**
     * Per axis: the input fitted into the metric format, then per further fold an absolute value and a subtraction
     * (two additions) and the metric stage. Tables: the fold constants.
     */
    @Override
    DatapathCost frontCost() {
        DatapathCost total = DatapathCost.ZERO;
        int wm = spec.metric().format().wordLength();
        for (long[] t : thresholds) {
            if (t.length == 0) {
                continue;
            }
            total = total.plus(stage(spec.metric(), inputFractionalBits));
            int folds = t.length - 1;
            total = total.plus(new DatapathCost(0, 2, 0, 0).plus(stage(spec.metric(), metricFractionalBits))
                    .repeated(folds)).plus(new DatapathCost(0, 0, 0, (long) folds * wm));
        }
        return total;
    }

    @Override
    String axisOf(int b) {
        return axis[b] == 0 ? "I" : "Q";
    }
}
