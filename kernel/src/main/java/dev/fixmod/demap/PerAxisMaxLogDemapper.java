package dev.fixmod.demap;

import dev.fixmod.constellation.AxisLayout;
import dev.fixmod.constellation.Constellation;
import dev.fixmod.map.DatapathCost;
import java.util.stream.IntStream;

/**
 * Per-dimension max-log for separable constellations (PAM, square and rectangular QAM, any labeling of the axes).
 * Each label bit is carried by one axis only, and the other axis's distance term is the same for both bit values, so
 * the exhaustive max-log reduces to one axis:
 * {@code L(b) = (min_{l: b=1} (y − l)² − min_{l: b=0} (y − l)²)/N0}, times the {@link LlrSign} factor, with {@code y}
 * the sample's I or Q part and {@code l} that axis's levels. The result equals {@link MaxLogDemapper} (uniform priors).
 *
 * <p>It is evaluated in closed form by segment: between consecutive midpoints of same-bit levels the nearest bit-0
 * level {@code l0} and bit-1 level {@code l1} are fixed and {@code L = (l0 − l1)(2y − l0 − l1)/N0}. One search per
 * axis over the doubled midpoints of all the axis's bits ({@link AxisCells}: a direct index, then a comparison or two)
 * finds the segment of each of them; {@link #cost} counts the per-bit binary search a datapath would make. For Gray
 * 16-QAM on the grid ±1, ±3 this gives, per axis and with fixmod's labels (level −3 ↦ 00, −1 ↦ 01, +1 ↦ 11,
 * +3 ↦ 10):
 *
 * <table class="striped">
 *   <caption>Per-axis max-log of Gray 16-QAM, in units of 1/N0 (zero-positive)</caption>
 *   <thead><tr><th>region of y</th><th>first bit of the axis</th><th>second bit of the axis</th></tr></thead>
 *   <tbody>
 *     <tr><td>y &lt; −2</td><td>−8(y + 1)</td><td>4(|y| − 2)</td></tr>
 *     <tr><td>−2 ≤ y ≤ 2</td><td>−4y</td><td>4(|y| − 2)</td></tr>
 *     <tr><td>y &gt; 2</td><td>−8(y − 1)</td><td>4(|y| − 2)</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>This demapper keeps no scratch, so one instance may be shared between threads (the other demappers may not).
 */
public final class PerAxisMaxLogDemapper extends SoftDemapper {
    /** Per bit: whether the Q axis carries it. */
    private final boolean[] onQ;
    private final AxisCells cellsI;
    private final AxisCells cellsQ;
    /** Where the rows of the Q cells begin in {@link #cellGain} and {@link #cellOffset}. */
    private final int qRows;
    /**
     * At {@code row·k + b}, row = the I cell or qRows + the Q cell: the segment's {@code sign·(l0 − l1)/N0} for bit
     * b in that cell of its axis (the other axis's bits are unused there).
     */
    private final double[] cellGain;
    /** The same place: the segment's {@code l0 + l1}. */
    private final double[] cellOffset;
    /** Per bit: the number of segments. */
    private final int[] segments;

    public PerAxisMaxLogDemapper(Constellation constellation, LlrOptions options) {
        super(SoftAlgorithm.MAX_LOG_PER_AXIS, constellation, options);
        AxisLayout layout = AxisSegments.requireSeparable(constellation, options, SoftAlgorithm.MAX_LOG_PER_AXIS);
        AxisSegments.BitPlaces places = new AxisSegments.BitPlaces(layout);
        double[][] levels = {layout.iLevels(), layout.qLevels()};
        int[] axisBits = {layout.iBits().length, layout.qBits().length};
        double invN0 = 1.0 / options.n0();
        int sign = options.sign().factor();
        int k = bitsPerSymbol;
        AxisSegments[] seg = new AxisSegments[k];
        this.segments = new int[k];
        this.onQ = new boolean[k];
        for (int b = 0; b < k; b++) {
            seg[b] = AxisSegments.of(levels[places.axis[b]], axisBits[places.axis[b]], places.position[b]);
            segments[b] = seg[b].zeroLevel.length;
            onQ[b] = places.axis[b] == 1;
        }
        AxisCells[] cells = new AxisCells[2];
        for (int a = 0; a < 2; a++) {
            int axis = a;
            cells[a] = AxisCells.of(IntStream.range(0, k).filter(b -> places.axis[b] == axis)
                    .mapToObj(b -> seg[b].boundaries).toArray(double[][]::new));
        }
        this.cellsI = cells[0];
        this.cellsQ = cells[1];
        this.qRows = cellsI.boundaries() + 1;
        int rows = qRows + cellsQ.boundaries() + 1;
        this.cellGain = new double[rows * k];
        this.cellOffset = new double[rows * k];
        for (int b = 0; b < k; b++) {
            int a = places.axis[b];
            double[] lv = levels[a];
            int[] segmentOfCell = cells[a].segments(seg[b].boundaries);
            int first = a == 0 ? 0 : qRows;
            for (int c = 0; c < segmentOfCell.length; c++) {
                int s = segmentOfCell[c];
                double l0 = lv[seg[b].zeroLevel[s]];
                double l1 = lv[seg[b].oneLevel[s]];
                cellGain[(first + c) * k + b] = sign * (l0 - l1) * invN0;
                cellOffset[(first + c) * k + b] = l0 + l1;
            }
        }
    }

    @Override
    void compute(double yRe, double yIm, double[] llr, int llrOffset) {
        // One cell search per axis serves all of its bits.
        int k = bitsPerSymbol;
        double twoI = 2 * yRe;
        double twoQ = 2 * yIm;
        int rowI = cellsI.cellOf(twoI) * k;
        int rowQ = (qRows + cellsQ.cellOf(twoQ)) * k;
        for (int b = 0; b < k; b++) {
            boolean q = onQ[b];
            int at = (q ? rowQ : rowI) + b;
            llr[llrOffset + b] = cellGain[at] * ((q ? twoQ : twoI) - cellOffset[at]) + 0.0; // + 0.0: −0.0 to 0.0
        }
    }

    /**
     * Per bit: the binary search over the segment boundaries, one subtraction and one multiplication; tables: the
     * boundaries and two constants per segment.
     */
    @Override
    public DatapathCost cost() {
        DatapathCost total = DatapathCost.ZERO;
        for (int b = 0; b < bitsPerSymbol; b++) {
            int n = segments[b];
            total = total.plus(new DatapathCost(1, 1, AxisSegments.searchComparisons(n - 1),
                    (long) DOUBLE_BITS * (n - 1 + 2 * n)));
        }
        return total;
    }
}
