package dev.fixmod.verify.loss;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.function.IntConsumer;

/**
 * The work of a loss specification: the distinct designs (the base first, then each sweep value not already listed)
 * times the Eb/N0 grid, numbered design-major. A shard {@code i/n} runs the points whose number is {@code i − 1}
 * modulo {@code n}; the merged points of all shards are the points of an unsharded run.
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
     * The points of all shards in point order.
     *
     * @throws IllegalArgumentException if a point is missing, given twice or does not belong to this run
     */
    public List<PointResult> assemble(List<PointResult> parts) {
        int snrs = spec.ebN0Db().size();
        Map<Integer, PointResult> byIndex = new TreeMap<>();
        for (PointResult r : parts) {
            if (r.design() < 0 || r.design() >= designs.size() || r.snr() < 0 || r.snr() >= snrs) {
                throw new IllegalArgumentException("point (design " + r.design() + ", Eb/N0 " + r.snr()
                        + ") does not belong to this specification's " + designs.size() + " designs and " + snrs
                        + " Eb/N0 values");
            }
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
