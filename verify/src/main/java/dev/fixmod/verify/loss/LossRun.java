package dev.fixmod.verify.loss;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.function.IntConsumer;

/**
 * The work of a loss specification: the distinct designs (the base first, then each sweep value not already listed,
 * then each grid combination not already listed) times the Eb/N0 grid, numbered design-major. A shard {@code i/n}
 * runs the points whose number is {@code i − 1} modulo {@code n}; the merged points of all shards are the points of an
 * unsharded run.
 */
public final class LossRun {
    private final LossSpec spec;
    private final List<Design> designs;

    public LossRun(LossSpec spec) {
        this.spec = spec;
        List<Design> list = new ArrayList<>();
        list.add(spec.base());
        for (LossSpec.Sweep s : spec.sweeps()) {
            for (Design d : s.designs()) {
                if (!list.contains(d)) {
                    list.add(d);
                }
            }
        }
        for (LossSpec.Grid g : spec.grids()) {
            for (Design d : g.designs()) {
                if (!list.contains(d)) {
                    list.add(d);
                }
            }
        }
        this.designs = List.copyOf(list);
    }

    public LossSpec spec() {
        return spec;
    }

    public List<Design> designs() {
        return designs;
    }

    public int pointCount() {
        return designs.size() * spec.ebN0Db().size();
    }

    /** How many points shard {@code shard} (1-based) of {@code shards} runs. */
    public int pointCount(int shard, int shards) {
        int n = 0;
        for (int p = shard - 1; p < pointCount(); p += shards) {
            n++;
        }
        return n;
    }

    /**
     * Runs the points of shard {@code shard} of {@code shards} (1/1 for all) on {@code threads} threads, calling
     * {@code done} with the number of points finished so far after each.
     */
    public List<PointResult> simulate(int shard, int shards, int threads, IntConsumer done) {
        ExecutorService pool = Executors.newFixedThreadPool(threads, r -> {
            Thread t = new Thread(r, "fixmod-loss");
            t.setDaemon(true);
            return t;
        });
        try {
            Simulation sim = new Simulation(spec, pool, threads * 2);
            List<PointResult> out = new ArrayList<>();
            int snrs = spec.ebN0Db().size();
            for (int p = shard - 1; p < pointCount(); p += shards) {
                out.add(sim.run(designs.get(p / snrs), p / snrs, p % snrs));
                done.accept(out.size());
            }
            return out;
        } finally {
            pool.shutdownNow();
        }
    }

    /**
     * Checks that {@code r} is a point of this run: its design and Eb/N0 exist and its bits per symbol and LLR code
     * range are its design's.
     *
     * @throws IllegalArgumentException naming the point, what it holds and what its design has
     */
    public void check(PointResult r) {
        int snrs = spec.ebN0Db().size();
        if (r.design() < 0 || r.design() >= designs.size() || r.snr() < 0 || r.snr() >= snrs) {
            throw new IllegalArgumentException("point (design " + r.design() + ", Eb/N0 " + r.snr()
                    + ") does not belong to this specification's " + designs.size() + " designs and " + snrs
                    + " Eb/N0 values");
        }
        Design d = designs.get(r.design());
        int k = d.constellation().bitsPerSymbol();
        var out = d.llr().format();
        if (r.bitsPerSymbol() != k || r.minCode() != out.minCode() || r.maxCode() != out.maxCode()) {
            throw new IllegalArgumentException("point (design " + r.design() + ", Eb/N0 " + r.snr() + ") has "
                    + r.bitsPerSymbol() + " bits per symbol and LLR codes " + r.minCode() + ".." + r.maxCode()
                    + ", but design " + r.design() + " of this specification (" + d.describe() + ") has " + k
                    + " and " + out.minCode() + ".." + out.maxCode() + "; the part comes from another run or another"
                    + " version of fixmod: rerun its shard");
        }
    }

    /**
     * The points of all shards in point order.
     *
     * @throws IllegalArgumentException if a point is missing, given twice or fails {@link #check}
     */
    public List<PointResult> assemble(List<PointResult> parts) {
        int snrs = spec.ebN0Db().size();
        Map<Integer, PointResult> byIndex = new TreeMap<>();
        for (PointResult r : parts) {
            check(r);
            if (byIndex.put(r.design() * snrs + r.snr(), r) != null) {
                throw new IllegalArgumentException("point (design " + r.design() + ", Eb/N0 " + r.snr()
                        + ") is given twice; give each shard once");
            }
        }
        if (byIndex.size() != pointCount()) {
            for (int p = 0; p < pointCount(); p++) {
                if (!byIndex.containsKey(p)) {
                    throw new IllegalArgumentException("point " + p + " (design " + p / snrs + ", Eb/N0 " + p % snrs
                            + ") is missing; " + byIndex.size() + " of " + pointCount() + " points were given: merge"
                            + " every shard");
                }
            }
        }
        return List.copyOf(byIndex.values());
    }
}
