package dev.fixmod.demap;

import dev.fixmod.constellation.AxisLayout;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.map.ConstellationRom;
import dev.fixmod.map.DatapathCost;
import java.util.List;

/**
 * Per-dimension max-log in fixed point, for separable constellations (PAM, square and rectangular QAM). The axis
 * levels are the reference ROM's codes; each bit has a segment table (the doubled midpoints of its
 * bit-0 and bit-1 levels, and per segment the nearest level codes {@code c0}, {@code c1}). Per sample and bit: a binary
 * search of {@code 2y} in the table, then the exact integer
 * {@code D = ±(c0 − c1)·(2y − c0 − c1) = ±((y − c1)² − (y − c0)²)} with twice the input's fractional bits, fitted by
 * the metric stage, multiplied by K = 1/N0 and fitted by the scale and output stages.
 *
 * <p>{@code D} equals, integer for integer, the difference of minimum squared distances that
 * {@link FixedMaxLogDemapper} computes exhaustively against the quantized points (the other axis's term is the same
 * for both bit values and cancels exactly), so the two are bit-exact, overflow counts included.
 */
public final class FixedPerAxisMaxLogDemapper extends FixedSoftDemapper {
    private final int[] axis;
    private final long[][] boundaries;
    /** Per bit and segment: {@code sign·(c0 − c1)}. */
    private final long[][] slope;
    /** Per bit and segment: {@code c0 + c1}. */
    private final long[][] offset;
    private final long[][] zeroCode;
    private final long[][] oneCode;
    private final int exactFractionalBits;
    private final StageFit metricFit;
    /** Per axis code y and bit b, at {@code (y − minCode)·k + b}: the LLR code; built on the first large batch. */
    private int[] table;
    /**
     * Per axis (I, Q) and axis code: the stage events of that axis's bits, packed as metric + scale·2^21 +
     * output·2^42 so that one addition per sample and axis tallies all three.
     */
    private long[][] rowEvents;
    /** The label bits each axis carries. */
    private int[][] axisBitList;

    public FixedPerAxisMaxLogDemapper(ConstellationRom reference, LlrOptions options, FixedLlrSpec spec) {
        super(SoftAlgorithm.MAX_LOG_PER_AXIS, reference, options, spec);
        AxisLayout layout = AxisSegments.requireSeparable(constellation, options, SoftAlgorithm.MAX_LOG_PER_AXIS);
        AxisSegments.BitPlaces places = new AxisSegments.BitPlaces(layout);
        long[][] codes = {FixedLevels.axisCodes(reference, layout, false), FixedLevels.axisCodes(reference, layout, true)};
        int[] axisBits = {layout.iBits().length, layout.qBits().length};
        int sign = options.sign().factor();
        this.axis = places.axis;
        this.exactFractionalBits = 2 * input.fractionalBits();
        this.metricFit = new StageFit(spec.metric(), exactFractionalBits);
        this.boundaries = new long[bitsPerSymbol][];
        this.slope = new long[bitsPerSymbol][];
        this.offset = new long[bitsPerSymbol][];
        this.zeroCode = new long[bitsPerSymbol][];
        this.oneCode = new long[bitsPerSymbol][];
        for (int b = 0; b < bitsPerSymbol; b++) {
            long[] c = codes[axis[b]];
            double[] asDouble = new double[c.length];
            for (int n = 0; n < c.length; n++) {
                asDouble[n] = c[n]; // exact: codes have at most 30 bits, their sums 31
            }
            AxisSegments seg = AxisSegments.of(asDouble, axisBits[axis[b]], places.position[b]);
            int n = seg.zeroLevel.length;
            boundaries[b] = new long[n - 1];
            for (int t = 0; t < n - 1; t++) {
                boundaries[b][t] = (long) seg.boundaries[t];
            }
            slope[b] = new long[n];
            offset[b] = new long[n];
            zeroCode[b] = new long[n];
            oneCode[b] = new long[n];
            for (int s = 0; s < n; s++) {
                long c0 = c[seg.zeroLevel[s]];
                long c1 = c[seg.oneLevel[s]];
                zeroCode[b][s] = c0;
                oneCode[b][s] = c1;
                slope[b][s] = sign * (c0 - c1);
                offset[b][s] = c0 + c1;
            }
        }
    }

    /** Input words up to this many bits get a code table (2^W · k entries); wider ones compute every sample. */
    static final int TABLE_MAX_INPUT_BITS = 16;
    /** Batches shorter than this compute every sample, so a demapper used on a few samples never builds a table. */
    static final int TABLE_MIN_BATCH = 256;

    /**
     * Each bit's LLR code is a function of one axis code, so for inputs of up to {@link #TABLE_MAX_INPUT_BITS} bits
     * the datapath is evaluated once per (code, bit), by the same {@link #metric} and stages, and batches read the
     * results: the same codes and the same event counts, at a table read per LLR instead of a search, a product and
     * three stage fits. The hardware model and its {@link #cost} are unchanged; the table is a software device.
     */
    @Override
    boolean computeBatch(int[] i, int[] q, int offset, int count, int[] llr, int llrOffset) {
        if (count < TABLE_MIN_BATCH || input.wordLength() > TABLE_MAX_INPUT_BITS) {
            return false;
        }
        if (table == null) {
            buildTable();
        }
        int k = bitsPerSymbol;
        int min = (int) input.minCode();
        int[] t = table;
        int[] onI = axisBitList[0];
        int[] onQ = axisBitList[1];
        long[] eventsI = rowEvents[0];
        long[] eventsQ = rowEvents[1];
        for (int done = 0; done < count; done += TALLY_SAMPLES) {
            int end = Math.min(count, done + TALLY_SAMPLES);
            long tally = 0;
            for (int n = done; n < end; n++) {
                int codeI = i[offset + n] - min;
                int codeQ = (q == null ? 0 : q[offset + n]) - min;
                int rowI = codeI * k;
                int rowQ = codeQ * k;
                int out = llrOffset + n * k;
                for (int b : onI) {
                    llr[out + b] = t[rowI + b];
                }
                for (int b : onQ) {
                    llr[out + b] = t[rowQ + b];
                }
                tally += eventsI[codeI] + eventsQ[codeQ];
            }
            metricCounter().record(tally & FIELD);
            scaleCounter().record((tally >>> 21) & FIELD);
            outputCounter().record(tally >>> 42);
        }
        return true;
    }

    /** Samples per tally: each adds at most k ≤ 30 events per field, so a 21-bit field cannot overflow. */
    private static final int TALLY_SAMPLES = 1 << 15;
    private static final long FIELD = (1L << 21) - 1;

    private void buildTable() {
        int k = bitsPerSymbol;
        long min = input.minCode();
        int codes = (int) (input.maxCode() - min + 1);
        int[] t = new int[codes * k];
        long[][] events = new long[2][codes];
        OverflowCounter m = OverflowCounter.unnamed();
        OverflowCounter s = OverflowCounter.unnamed();
        OverflowCounter o = OverflowCounter.unnamed();
        for (int c = 0; c < codes; c++) {
            long y = min + c;
            for (int b = 0; b < k; b++) {
                m.reset();
                s.reset();
                o.reset();
                t[c * k + b] = (int) finish(metric(b, y, y, m), s, o);
                events[axis[b]][c] += m.events() + (s.events() << 21) + (o.events() << 42);
            }
        }
        int[][] lists = new int[2][];
        for (int a = 0; a < 2; a++) {
            int axisIndex = a;
            lists[a] = java.util.stream.IntStream.range(0, k).filter(b -> axis[b] == axisIndex).toArray();
        }
        axisBitList = lists;
        rowEvents = events;
        table = t;
    }

    @Override
    void prepare(long iCode, long qCode, OverflowCounter metric) {
        // Every bit reads its own axis directly; nothing is shared.
    }

    @Override
    long metric(int b, long iCode, long qCode, OverflowCounter metric) {
        long twoY = 2 * (axis[b] == 0 ? iCode : qCode);
        int s = AxisSegments.segmentOfCode(boundaries[b], twoY);
        return metricFit.fit(slope[b][s] * (twoY - offset[b][s]), metric);
    }

    @Override
    void describe(int b, long iCode, long qCode, List<FixedLlrTrace.Value> into) {
        long y = axis[b] == 0 ? iCode : qCode;
        int s = AxisSegments.segmentOfCode(boundaries[b], 2 * y);
        int frac = input.fractionalBits();
        into.add(FixedLlrTrace.Value.code("y", y, frac, false));
        into.add(FixedLlrTrace.Value.index("segment", s));
        into.add(FixedLlrTrace.Value.code("level0", zeroCode[b][s], frac, false));
        into.add(FixedLlrTrace.Value.code("level1", oneCode[b][s], frac, false));
        into.add(FixedLlrTrace.Value.code("metric-exact", slope[b][s] * (2 * y - offset[b][s]), exactFractionalBits,
                false));
    }

    /**
     * Per bit: the binary search, {@code 2y − (c0 + c1)} (one addition), the product by {@code c0 − c1} (not
     * counted when every segment's slope is 0 or a power of two: a shift) and the metric stage. Tables per bit:
     * boundaries, slopes and offsets, each one bit wider than an input code.
     */
    @Override
    DatapathCost frontCost() {
        DatapathCost total = DatapathCost.ZERO;
        int entry = input.wordLength() + 1;
        for (int b = 0; b < bitsPerSymbol; b++) {
            int n = slope[b].length;
            boolean shiftsOnly = true;
            for (long s : slope[b]) {
                shiftsOnly &= Long.bitCount(Math.abs(s)) <= 1;
            }
            total = total.plus(new DatapathCost(shiftsOnly ? 0 : 1, 1, AxisSegments.searchComparisons(n - 1),
                    (long) entry * (n - 1 + 2 * n)))
                    .plus(stage(spec.metric(), exactFractionalBits));
        }
        return total;
    }

    @Override
    String axisOf(int b) {
        return axis[b] == 0 ? "I" : "Q";
    }
}
