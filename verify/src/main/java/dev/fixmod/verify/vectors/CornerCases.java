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
 *
 * <p>π/2-BPSK turns the decision boundary and the LLRs of odd-index symbols, and a corner vector's stream index is
 * its index in the demapper group. So for it the inputs are found twice, once on the even geometry and once on the
 * odd one, and every input of either search is listed twice, on two consecutive rows of opposite parity (the even
 * search's inputs first, then the odd search's new ones). Each row carries the flags its own parity's search gave it;
 * an input the other parity's search found alone keeps only the flags that describe the codes themselves
 * (min-code, max-code, both-axes-full-scale, zero), so such a row may have no flag.
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

    /** The flags that describe an input's codes, whatever its parity. */
    private static final int CODE_FLAGS = CornerFlag.MIN_CODE.mask() | CornerFlag.MAX_CODE.mask()
            | CornerFlag.BOTH_AXES_FULL_SCALE.mask() | CornerFlag.ZERO.mask();

    /**
     * The corner vectors of {@code groups}; {@code firstIndex} is the demapper-group index of the first, which
     * decides the parity of each row for π/2-BPSK.
     */
    static Result build(Datapath d, QFormat input, Set<CornerGroup> groups, long firstIndex) {
        if (!d.turnsOddSymbols()) {
            return build(d, input, groups, false);
        }
        Result even = build(d, input, groups, false);
        Result odd = build(d, input, groups, true);
        Map<String, Integer> evenFlags = new LinkedHashMap<>();
        Map<String, Integer> oddFlags = new LinkedHashMap<>();
        Map<String, long[]> inputs = new LinkedHashMap<>();
        for (Vector v : even.vectors()) {
            evenFlags.put(v.i() + "," + v.q(), v.flags());
            inputs.putIfAbsent(v.i() + "," + v.q(), new long[] {v.i(), v.q()});
        }
        for (Vector v : odd.vectors()) {
            oddFlags.put(v.i() + "," + v.q(), v.flags());
            inputs.putIfAbsent(v.i() + "," + v.q(), new long[] {v.i(), v.q()});
        }
        boolean evenFirst = (firstIndex & 1) == 0;
        List<Vector> rows = new ArrayList<>(2 * inputs.size());
        for (Map.Entry<String, long[]> e : inputs.entrySet()) {
            long[] v = e.getValue();
            Integer fe = evenFlags.get(e.getKey());
            Integer fo = oddFlags.get(e.getKey());
            int onEven = fe != null ? fe : fo & CODE_FLAGS;
            int onOdd = fo != null ? fo : fe & CODE_FLAGS;
            rows.add(new Vector(v[0], v[1], evenFirst ? onEven : onOdd));
            rows.add(new Vector(v[0], v[1], evenFirst ? onOdd : onEven));
        }
        List<String> unreached = new ArrayList<>();
        even.unreachedLimits().forEach(l -> unreached.add(l + " (even symbols)"));
        odd.unreachedLimits().forEach(l -> unreached.add(l + " (odd symbols)"));
        return new Result(List.copyOf(rows), List.copyOf(unreached));
    }

    /** The corner vectors for symbols of one parity ({@code odd} is false unless the constellation turns). */
    private static Result build(Datapath d, QFormat input, Set<CornerGroup> groups, boolean odd) {
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
        long[] pi = d.referenceI(odd);
        long[] pq = d.referenceQ(odd);
        long parity = odd ? 1 : 0;
        if (groups.contains(CornerGroup.THRESHOLDS) && d.thresholdsI().length + d.thresholdsQ().length == 0) {
            addBoundaryCrossings(d, input, pi, pq, parity, add);
        } else if (groups.contains(CornerGroup.THRESHOLDS)) {
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
            probeLlrLimits(d, input, pi, pq, parity, add, unreached);
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
     * The threshold group of a slicer without per-axis thresholds (PSK sectors, minimum distance), whose boundaries
     * are lines at any angle. For each pair of neighbouring reference points a &lt; b (every other point is farther
     * from their midpoint, by a margin that excludes pairs meeting only at a corner of their regions), the line
     * through the midpoint along the axis on which b − a is longer (I when equal) is bisected between a's and b's
     * ends down to two adjacent codes, one decided a and one decided b. If one of the two lies exactly on the
     * boundary ({@link Datapath#onBoundary}) it is flagged on-threshold and its neighbours either side one LSB below
     * and above; otherwise the lower code (on that axis) is flagged one LSB below and the upper one LSB above. A pair
     * whose line passes through a third point's region at a probe is left out.
     */
    private static void addBoundaryCrossings(Datapath d, QFormat input, long[] pi, long[] pq, long parity,
            Adder add) {
        int m = pi.length;
        int[] decided = new int[1];
        for (int a = 0; a < m; a++) {
            for (int b = a + 1; b < m; b++) {
                if (!neighbours(pi, pq, a, b)) {
                    continue;
                }
                boolean alongI = Math.abs(pi[b] - pi[a]) >= Math.abs(pq[b] - pq[a]);
                long other = Math.floorDiv(alongI ? pq[a] + pq[b] : pi[a] + pi[b], 2);
                long[] crossing = bisect(d, input, parity, alongI, other, alongI ? pi[a] : pq[a], a,
                        alongI ? pi[b] : pq[b], b, decided);
                if (crossing == null) {
                    continue;
                }
                long lower = Math.min(crossing[0], crossing[1]);
                long upper = lower + 1;
                int on = CornerFlag.ON_THRESHOLD.mask();
                int minus = CornerFlag.THRESHOLD_MINUS_LSB.mask();
                int plus = CornerFlag.THRESHOLD_PLUS_LSB.mask();
                if (onBoundary(d, parity, alongI, other, upper)) {
                    addOnAxis(add, alongI, other, lower, minus);
                    addOnAxis(add, alongI, other, upper, on);
                    addOnAxis(add, alongI, other, upper + 1, plus);
                } else if (onBoundary(d, parity, alongI, other, lower)) {
                    addOnAxis(add, alongI, other, lower - 1, minus);
                    addOnAxis(add, alongI, other, lower, on);
                    addOnAxis(add, alongI, other, upper, plus);
                } else {
                    addOnAxis(add, alongI, other, lower, minus);
                    addOnAxis(add, alongI, other, upper, plus);
                }
            }
        }
    }

    /** Whether every point other than a and b is farther from their midpoint than a and b are, by 1/16 in d². */
    private static boolean neighbours(long[] pi, long[] pq, int a, int b) {
        double halfI = pi[b] - pi[a];
        double halfQ = pq[b] - pq[a];
        double toEnds = halfI * halfI + halfQ * halfQ;
        for (int c = 0; c < pi.length; c++) {
            if (c == a || c == b) {
                continue;
            }
            // Doubled coordinates keep the midpoint on integers.
            double di = pi[a] + pi[b] - 2.0 * pi[c];
            double dq = pq[a] + pq[b] - 2.0 * pq[c];
            if (16 * (di * di + dq * dq) <= 17 * toEnds) {
                return false;
            }
        }
        return true;
    }

    /**
     * Two adjacent codes on the axis line at {@code other}, decided {@code labelA} and {@code labelB}, found by
     * bisection from {@code fromA} (a's end) to {@code toB}; null when an end or a probe is decided otherwise.
     */
    private static long[] bisect(Datapath d, QFormat input, long parity, boolean alongI, long other, long fromA,
            int labelA, long toB, int labelB, int[] decided) {
        long lo = clamp(fromA, input);
        long hi = clamp(toB, input);
        if (decide(d, parity, alongI, other, lo, decided) != labelA
                || decide(d, parity, alongI, other, hi, decided) != labelB) {
            return null;
        }
        while (Math.abs(hi - lo) > 1) {
            long mid = Math.floorDiv(lo + hi, 2);
            int label = decide(d, parity, alongI, other, mid, decided);
            if (label == labelA) {
                lo = mid;
            } else if (label == labelB) {
                hi = mid;
            } else {
                return null;
            }
        }
        return lo == hi ? null : new long[] {lo, hi};
    }

    private static long clamp(long code, QFormat input) {
        return Math.max(input.minCode(), Math.min(input.maxCode(), code));
    }

    private static int decide(Datapath d, long parity, boolean alongI, long other, long x, int[] decided) {
        long[] i = {alongI ? x : other};
        long[] q = {alongI ? other : x};
        d.slice(i, q, 1, parity, decided);
        return decided[0];
    }

    private static boolean onBoundary(Datapath d, long parity, boolean alongI, long other, long x) {
        return alongI ? d.onBoundary(x, other, parity) : d.onBoundary(other, x, parity);
    }

    private static void addOnAxis(Adder add, boolean alongI, long other, long x, int flags) {
        if (alongI) {
            add.add(x, other, flags);
        } else {
            add.add(other, x, flags);
        }
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
    private static void probeLlrLimits(Datapath d, QFormat input, long[] pi, long[] pq, long parity, Adder add,
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
        if (d.turnsOddSymbols()) {
            // Every candidate is demapped as a symbol of the one parity searched.
            long[] one = new long[k];
            for (int c = 0; c < n; c++) {
                d.llr(new long[] {ci[c]}, new long[] {cq[c]}, 1, parity, -1, one);
                System.arraycopy(one, 0, llr, c * k, k);
            }
        } else {
            d.llr(ci, cq, n, 0, -1, llr);
        }
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
