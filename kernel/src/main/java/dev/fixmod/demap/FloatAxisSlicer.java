package dev.fixmod.demap;

import dev.fixmod.constellation.AxisLayout;
import dev.fixmod.constellation.Constellation;

/**
 * The floating-point per-axis slicer of a separable constellation (PAM, square and rectangular QAM): each axis is
 * decided on its own against thresholds midway between adjacent levels, a sample equal to a threshold taking the upper
 * level ({@code x >= t}, the tie rule of {@link FixedSlicer}); the sub-labels of both axes compose the label through
 * the constellation's {@link AxisLayout}.
 */
public final class FloatAxisSlicer extends FloatSlicer {
    private final double[] iThresholds;
    private final double[] qThresholds;
    private final int[] labelByIndex;
    private final int qLevelCount;

    /**
     * @throws IllegalArgumentException if the constellation has no axis layout (not separable)
     */
    public FloatAxisSlicer(Constellation constellation) {
        super(constellation);
        AxisLayout axes = constellation.axes();
        if (axes == null) {
            throw new IllegalArgumentException(constellation.name() + " is not separable into I and Q axes; use a"
                    + " sector slicer (PSK) or the nearest-point slicer");
        }
        double[] iLevels = axes.iLevels();
        double[] qLevels = axes.qLevels();
        int[] iOrder = AxisLevels.subLabelsByAscendingLevel(iLevels);
        int[] qOrder = AxisLevels.subLabelsByAscendingLevel(qLevels);
        iThresholds = midpoints(iLevels, iOrder);
        qThresholds = midpoints(qLevels, qOrder);
        qLevelCount = qLevels.length;
        labelByIndex = new int[iLevels.length * qLevelCount];
        for (int a = 0; a < iLevels.length; a++) {
            for (int b = 0; b < qLevelCount; b++) {
                labelByIndex[a * qLevelCount + b] = axes.compose(iOrder[a], qOrder[b]);
            }
        }
    }

    private static double[] midpoints(double[] levels, int[] order) {
        double[] t = new double[order.length - 1];
        for (int n = 0; n < t.length; n++) {
            t[n] = (levels[order[n]] + levels[order[n + 1]]) / 2;
        }
        return t;
    }

    /** The I thresholds, ascending (a copy). */
    public double[] iThresholds() {
        return iThresholds.clone();
    }

    /** The Q thresholds, ascending (a copy; empty for PAM). */
    public double[] qThresholds() {
        return qThresholds.clone();
    }

    @Override
    int decide(double re, double im, boolean odd) {
        return labelByIndex[levelIndex(re, iThresholds) * qLevelCount + levelIndex(im, qThresholds)];
    }

    /** The number of thresholds at or below {@code x}, by binary search. */
    private static int levelIndex(double x, double[] thresholds) {
        int lo = 0;
        int hi = thresholds.length;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (x >= thresholds[mid]) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }
}
