package dev.fixmod.verify.vectors;

import dev.fixmod.fixed.QFormat;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * The demapper-input corner vectors of a set, in their fixed order: threshold sweeps, ties, extremes, zero, LLR limit
 * probes. (The label sweep is mapped like data and handled by the generator.) Each vector is an input code pair with
 * its flags; the same input is listed once, its flags the union of every reason it was chosen.
 */
final class CornerCases {

    /** One corner vector: demapper input codes and flags. */
    record Vector(long i, long q, int flags) {
    }

    /** The limits an LLR probe was looked for but no candidate reached: "b3 low" etc. */
    record Result(List<Vector> vectors, List<String> unreachedLimits) {
    }

    private CornerCases() {
    }

    static Result build(Datapath d, QFormat input, Set<CornerGroup> groups) {
        Map<String, int[]> flags = new LinkedHashMap<>();
        List<long[]> list = new ArrayList<>();
        Adder add = (i, q, f) -> {
            if (!input.contains(i) || !input.contains(q)) {
                return;
            }
            String key = i + "," + q;
            int[] existing = flags.get(key);
            if (existing != null) {
                existing[0] |= f;
                return;
            }
            flags.put(key, new int[] {f});
            list.add(new long[] {i, q});
        };
        long min = input.minCode();
        long max = input.maxCode();
        long[] pi = d.referenceI();
        long[] pq = d.referenceQ();
        if (groups.contains(CornerGroup.THRESHOLDS)) {
            // The other coordinate sits on the first point's level, away from the thresholds of its own axis.
            for (long t : d.thresholdsI()) {
                add.add(t, pq[0], CornerFlag.ON_THRESHOLD.mask());
                add.add(t - 1, pq[0], CornerFlag.THRESHOLD_MINUS_LSB.mask());
                add.add(t + 1, pq[0], CornerFlag.THRESHOLD_PLUS_LSB.mask());
            }
            for (long t : d.thresholdsQ()) {
                add.add(pi[0], t, CornerFlag.ON_THRESHOLD.mask());
                add.add(pi[0], t - 1, CornerFlag.THRESHOLD_MINUS_LSB.mask());
                add.add(pi[0], t + 1, CornerFlag.THRESHOLD_PLUS_LSB.mask());
            }
        }
        if (groups.contains(CornerGroup.TIES)) {
            addTies(pi, pq, add);
        }
        if (groups.contains(CornerGroup.EXTREMES)) {
            int lo = CornerFlag.MIN_CODE.mask();
            int hi = CornerFlag.MAX_CODE.mask();
            int both = CornerFlag.BOTH_AXES_FULL_SCALE.mask();
            add.add(min, 0, lo);
            add.add(max, 0, hi);
            add.add(0, min, lo);
            add.add(0, max, hi);
            add.add(min, min, lo | both);
            add.add(min, max, lo | hi | both);
            add.add(max, min, lo | hi | both);
            add.add(max, max, hi | both);
        }
        if (groups.contains(CornerGroup.ZERO)) {
            add.add(0, 0, CornerFlag.ZERO.mask());
        }
        List<String> unreached = new ArrayList<>();
        if (groups.contains(CornerGroup.LLR_LIMITS)) {
            probeLlrLimits(d, input, pi, pq, add, unreached);
        }
        List<Vector> vectors = new ArrayList<>(list.size());
        for (long[] v : list) {
            vectors.add(new Vector(v[0], v[1], flags.get(v[0] + "," + v[1])[0]));
        }
        return new Result(List.copyOf(vectors), List.copyOf(unreached));
    }

    @FunctionalInterface
    private interface Adder {
        void add(long i, long q, int flags);
    }

    /**
     * Midpoints of every pair of points at the minimum distance of the slicer's reference points, kept when the
     * midpoint is a demapper input code exactly (then it is equidistant in the fixed datapath too).
     */
    private static void addTies(long[] ci, long[] cq, Adder add) {
        int m = ci.length;
        long best = Long.MAX_VALUE;
        for (int a = 0; a < m; a++) {
            for (int b = a + 1; b < m; b++) {
                long di = ci[a] - ci[b];
                long dq = cq[a] - cq[b];
                long dist = di * di + dq * dq;
                if (dist > 0 && dist < best) {
                    best = dist;
                }
            }
        }
        for (int a = 0; a < m; a++) {
            for (int b = a + 1; b < m; b++) {
                long di = ci[a] - ci[b];
                long dq = cq[a] - cq[b];
                if (di * di + dq * dq != best) {
                    continue;
                }
                long si = ci[a] + ci[b];
                long sq = cq[a] + cq[b];
                if ((si & 1) == 0 && (sq & 1) == 0) {
                    add.add(si / 2, sq / 2, CornerFlag.TIE.mask());
                }
            }
        }
    }

    /**
     * For each LLR bit and each limit, the first candidate input that drives the fixed LLR there. Candidates: the
     * extremes of the input format, then each point pushed to full scale along one or both axes.
     */
    private static void probeLlrLimits(Datapath d, QFormat input, long[] pi, long[] pq, Adder add,
            List<String> unreached) {
        long min = input.minCode();
        long max = input.maxCode();
        List<long[]> cand = new ArrayList<>();
        long[] axis = {min, 0, max};
        for (long a : axis) {
            for (long b : axis) {
                cand.add(new long[] {a, b});
            }
        }
        for (int label = 0; label < pi.length; label++) {
            cand.add(new long[] {pi[label] < 0 ? min : max, pq[label]});
            cand.add(new long[] {pi[label], pq[label] < 0 ? min : max});
            cand.add(new long[] {pi[label] < 0 ? min : max, pq[label] < 0 ? min : max});
            cand.add(new long[] {pi[label], pq[label]});
        }
        int n = cand.size();
        int k = d.bitsPerSymbol();
        long[] ci = new long[n];
        long[] cq = new long[n];
        for (int c = 0; c < n; c++) {
            ci[c] = cand.get(c)[0];
            cq[c] = cand.get(c)[1];
        }
        long[] llr = new long[n * k];
        d.llr(ci, cq, n, -1, llr);
        int probe = CornerFlag.LLR_PROBE.mask();
        for (int bit = 0; bit < k; bit++) {
            int low = -1;
            int high = -1;
            for (int c = 0; c < n && (low < 0 || high < 0); c++) {
                long v = llr[c * k + bit];
                if (low < 0 && v == d.llrLow()) {
                    low = c;
                }
                if (high < 0 && v == d.llrHigh()) {
                    high = c;
                }
            }
            if (low >= 0) {
                add.add(ci[low], cq[low], probe);
            } else {
                unreached.add("b" + bit + " low");
            }
            if (high >= 0) {
                add.add(ci[high], cq[high], probe);
            } else {
                unreached.add("b" + bit + " high");
            }
        }
    }
}
