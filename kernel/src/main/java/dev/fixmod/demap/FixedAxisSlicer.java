package dev.fixmod.demap;

import dev.fixmod.constellation.AxisLayout;
import dev.fixmod.constellation.Constellation;
import dev.fixmod.map.ConstellationRom;
import dev.fixmod.map.DatapathCost;
import java.util.Arrays;

/**
 * The fixed-point per-axis slicer of a separable constellation (PAM, square and rectangular QAM), as RTL does it:
 * integer thresholds per axis, a binary search of comparisons giving the level index, a table giving the sub-label,
 * wiring composing the label through the {@link AxisLayout}.
 *
 * <p>The reference levels are those of a {@link ConstellationRom} in the input format (the constellation quantized
 * once, with its normalization, exactly as the minimum-distance slicer sees it). Between adjacent levels
 * {@code a < b} of an axis the threshold is their exact midpoint rounded up to a code, {@code t = ceil((a+b)/2)}, so
 * that {@code x >= t} holds exactly when {@code 2x >= a+b}: a sample on the midpoint takes the upper level (the tie
 * rule of {@link FixedSlicer}) and the decision equals the minimum-distance decision against the same ROM on every
 * code, ties included.
 *
 * <table class="striped">
 *   <caption>Thresholds of 4-PAM, unit energy (levels ±0.447, ±1.342), input Q2.5 half-even</caption>
 *   <thead><tr><th>levels (codes)</th><th>midpoints</th><th>thresholds</th></tr></thead>
 *   <tbody><tr><td>−43, −14, 14, 43</td><td>−28.5, 0, 28.5</td><td>−28, 0, 29</td></tr></tbody>
 * </table>
 */
public final class FixedAxisSlicer extends FixedSlicer {
    private final ConstellationRom reference;
    private final int[] iThresholds;
    private final int[] qThresholds;
    private final int[] labelByIndex;
    private final int qLevelCount;
    private final int iBits;
    private final int qBits;

    /**
     * @param reference the constellation's points quantized into the input format of the slicer
     * @throws IllegalArgumentException if the constellation is not separable (a format so coarse that two levels,
     *                                  and so the thresholds between them, would collide is refused by the ROM)
     */
    public FixedAxisSlicer(ConstellationRom reference) {
        super(reference.constellation(), reference.format());
        this.reference = reference;
        Constellation c = reference.constellation();
        AxisLayout axes = c.axes();
        if (axes == null) {
            throw new IllegalArgumentException(c.name() + " is not separable into I and Q axes; use a sector slicer"
                    + " (PSK) or the nearest-point slicer");
        }
        int iCount = 1 << axes.iBits().length;
        qLevelCount = 1 << axes.qBits().length;
        iBits = axes.iBits().length;
        qBits = axes.qBits().length;
        int[] iCodes = new int[iCount];
        int[] qCodes = new int[qLevelCount];
        for (int sub = 0; sub < iCount; sub++) {
            iCodes[sub] = reference.iCode(axes.compose(sub, 0));
        }
        for (int sub = 0; sub < qLevelCount; sub++) {
            qCodes[sub] = reference.qCode(axes.compose(0, sub));
        }
        int[] iOrder = AxisLevels.subLabelsByAscendingLevel(toDouble(iCodes));
        int[] qOrder = AxisLevels.subLabelsByAscendingLevel(toDouble(qCodes));
        iThresholds = thresholds(iCodes, iOrder);
        qThresholds = thresholds(qCodes, qOrder);
        labelByIndex = new int[iCount * qLevelCount];
        for (int a = 0; a < iCount; a++) {
            for (int b = 0; b < qLevelCount; b++) {
                labelByIndex[a * qLevelCount + b] = axes.compose(iOrder[a], qOrder[b]);
            }
        }
    }

    private static double[] toDouble(int[] codes) {
        double[] d = new double[codes.length];
        for (int n = 0; n < codes.length; n++) {
            d[n] = codes[n];
        }
        return d;
    }

    /** Levels are distinct codes: the ROM refuses two labels on one code pair, which equal levels would give. */
    private static int[] thresholds(int[] codes, int[] order) {
        int[] t = new int[order.length - 1];
        for (int n = 0; n < t.length; n++) {
            t[n] = (int) Math.floorDiv((long) codes[order[n]] + codes[order[n + 1]] + 1, 2);
        }
        return t;
    }

    /** The reference ROM the thresholds were derived from. */
    public ConstellationRom reference() {
        return reference;
    }

    /** The I thresholds, ascending codes of the input format (a copy). */
    public int[] iThresholds() {
        return iThresholds.clone();
    }

    /** The Q thresholds, ascending codes of the input format (a copy; empty for PAM). */
    public int[] qThresholds() {
        return qThresholds.clone();
    }

    /**
     * A binary search per axis (ceil(log2 L) comparisons for L levels), no arithmetic; tables: the thresholds and
     * the level-index → sub-label maps.
     */
    @Override
    public DatapathCost cost() {
        int word = inputFormat().wordLength();
        int iCount = iThresholds.length + 1;
        long tableBits = (long) (iThresholds.length + qThresholds.length) * word
                + (long) iCount * iBits + (long) qLevelCount * qBits;
        return new DatapathCost(0, 0, AxisLevels.searchDepth(iCount) + AxisLevels.searchDepth(qLevelCount),
                tableBits);
    }

    @Override
    int decide(int i, int q, boolean odd) {
        return labelByIndex[levelIndex(i, iThresholds) * qLevelCount + levelIndex(q, qThresholds)];
    }

    @Override
    boolean onBoundary(int i, int q, boolean odd) {
        return Arrays.binarySearch(iThresholds, i) >= 0 || Arrays.binarySearch(qThresholds, q) >= 0;
    }

    /** The number of thresholds at or below {@code x}, by binary search. */
    private static int levelIndex(int x, int[] thresholds) {
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
