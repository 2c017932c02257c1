package dev.fixmod.demap;

import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.map.ConstellationRom;
import dev.fixmod.map.DatapathCost;
import java.util.List;

/**
 * Exhaustive max-log in fixed point, for any constellation: against the reference ROM's points, per sample the exact integer squared distance to every point is computed, and per bit
 * {@code D = ±(min_{b=1} d − min_{b=0} d)} (twice the input's fractional bits) goes through the metric, scale
 * (K = 1/N0) and output stages. It is the bit-exact oracle of {@link FixedPerAxisMaxLogDemapper}, and the fixed
 * datapath for non-separable constellations (PSK, APSK, custom) and for π/2-BPSK, whose odd-index samples are
 * measured against the ROM's turned codes.
 *
 * <p>Not thread-safe: holds an M-entry scratch array.
 */
public final class FixedMaxLogDemapper extends FixedSoftDemapper {
    private final long[] re;
    private final long[] im;
    /** The ROM's codes of odd-index symbols: π/2-BPSK's turned points, else the same arrays. */
    private final long[] oddRe;
    private final long[] oddIm;
    private final long[] distance;
    private final BitPartition partition;
    private final int exactFractionalBits;
    private final int sign;

    public FixedMaxLogDemapper(ConstellationRom reference, LlrOptions options, FixedLlrSpec spec) {
        super(SoftAlgorithm.MAX_LOG, reference, options, spec);
        int m = reference.size();
        this.re = new long[m];
        this.im = new long[m];
        boolean turns = reference.alternatesQuarterTurn();
        this.oddRe = turns ? new long[m] : re;
        this.oddIm = turns ? new long[m] : im;
        for (int s = 0; s < m; s++) {
            re[s] = reference.iCode(s);
            im[s] = reference.qCode(s);
            if (turns) {
                oddRe[s] = reference.oddICode(s);
                oddIm[s] = reference.oddQCode(s);
            }
        }
        this.distance = new long[constellation.size()];
        this.partition = new BitPartition(bitsPerSymbol);
        this.exactFractionalBits = 2 * input.fractionalBits();
        this.sign = options.sign().factor();
    }

    @Override
    void prepare(long iCode, long qCode, OverflowCounter metric) {
        prepare(iCode, qCode, false, metric);
    }

    @Override
    void prepare(long iCode, long qCode, boolean odd, OverflowCounter metric) {
        long[] pointI = odd ? oddRe : re;
        long[] pointQ = odd ? oddIm : im;
        for (int s = 0; s < distance.length; s++) {
            long dr = iCode - pointI[s];
            long di = qCode - pointQ[s];
            distance[s] = dr * dr + di * di;
        }
    }

    @Override
    long metric(int b, long iCode, long qCode, OverflowCounter metric) {
        long d0 = distance[nearest(partition.zeros[b])];
        long d1 = distance[nearest(partition.ones[b])];
        return spec.metric().fit(sign * (d1 - d0), exactFractionalBits, metric);
    }

    /** The label of the nearest point among {@code labels}; the lowest label among equals. */
    private int nearest(int[] labels) {
        int best = labels[0];
        for (int s : labels) {
            if (distance[s] < distance[best]) {
                best = s;
            }
        }
        return best;
    }

    @Override
    void describe(int b, long iCode, long qCode, List<FixedLlrTrace.Value> into) {
        int s0 = nearest(partition.zeros[b]);
        int s1 = nearest(partition.ones[b]);
        into.add(FixedLlrTrace.Value.label("symbol0", s0));
        into.add(FixedLlrTrace.Value.code("distance0", distance[s0], exactFractionalBits, false));
        into.add(FixedLlrTrace.Value.label("symbol1", s1));
        into.add(FixedLlrTrace.Value.code("distance1", distance[s1], exactFractionalBits, false));
        into.add(FixedLlrTrace.Value.code("metric-exact", sign * (distance[s1] - distance[s0]), exactFractionalBits,
                false));
    }

    /**
     * Per point: two differences, two squares and their sum. Per bit: the two halves' minima, their difference and
     * the metric stage. Tables: the quantized points (plus, for π/2-BPSK, the negation that turns them for odd
     * symbols, as the mapper and the slicers count it).
     */
    @Override
    DatapathCost frontCost() {
        long m = distance.length;
        return new DatapathCost(2 * m, 3 * m + (reference.alternatesQuarterTurn() ? 1 : 0), 0,
                2 * m * input.wordLength())
                .plus(new DatapathCost(0, 1, m - 2, 0).plus(stage(spec.metric(), exactFractionalBits))
                        .repeated(bitsPerSymbol));
    }

    @Override
    String axisOf(int b) {
        return "IQ";
    }
}
