package dev.fixmod.verify.bench;

import dev.fixmod.demap.FixedSoftDemapper;
import dev.fixmod.demap.SoftAlgorithm;
import dev.fixmod.demap.SoftDemapper;
import dev.fixmod.verify.loss.Simulation;
import dev.fixmod.verify.noise.Gaussian;
import dev.fixmod.verify.noise.StreamKey;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * The figures behind the single-thread targets measured as CPU time of the measuring thread instead of wall time:
 * on a machine shared with other work, wall-clock iterations are stretched by whatever else runs, while the thread's
 * own CPU time mostly is not (caches and a shared core still are). Each figure is the best of 7 rounds of 0.2 s of
 * CPU time after a warm-up, in this JVM. A cross-check of the JMH run, not a replacement: there is no fork and no
 * confidence interval (errors are reported as unknown).
 */
public final class CpuTime {
    private static final ThreadMXBean THREADS = ManagementFactory.getThreadMXBean();

    private CpuTime() {
    }

    /** The measurements under the JMH benchmark names and parameters, so {@link Target#evaluate} reads them. */
    public static List<Measurement> measure() {
        List<Measurement> out = new ArrayList<>();
        Workload w = Workload.of("256-qam");
        int block = Workload.BLOCK;
        int k = w.bitsPerSymbol();
        int[] codes = new int[block * k];
        double[] llr = new double[block * k];
        for (SoftAlgorithm a : List.of(SoftAlgorithm.MAX_LOG_PER_AXIS, SoftAlgorithm.MAX_LOG)) {
            FixedSoftDemapper fixed = LlrBench.fixedDemapper(a, w);
            out.add(llrResult("fixed:" + a.tradeName() + ":256-qam",
                    perItem(() -> fixed.llr(w.iCodes, w.qCodes, 0, block, codes, 0), block)));
        }
        SoftDemapper floating = SoftDemapper.create(SoftAlgorithm.MAX_LOG_PER_AXIS, w.constellation, w.options);
        out.add(llrResult("float:max-log-per-axis:256-qam",
                perItem(() -> floating.llr(w.re, w.im, 0, block, llr, 0), block)));
        double[] z = new double[2 * block];
        StreamKey key = StreamKey.of(Workload.SEED, 2);
        for (Gaussian g : Gaussian.values()) {
            long[] next = {0};
            out.add(new Measurement("NoiseBench.gaussian", Map.of("method", g.label()), 1,
                    perItem(() -> {
                        g.fill(z, 0, z.length, key, next[0]);
                        next[0] += z.length;
                    }, z.length), Double.NaN));
        }
        Simulation.Worker chain = w.chainWorker();
        long[] chunk = {0};
        out.add(new Measurement("ChainBench.oneThread", Map.of("scenario", "256-qam"), 1,
                perItem(() -> chain.run(chunk[0]++), block), Double.NaN));
        WriterBench writer = new WriterBench();
        writer.format = "hex";
        writer.sink = "null";
        try {
            writer.setUp();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        out.add(new Measurement("WriterBench.write", Map.of("format", "hex", "sink", "null"), 1, perItem(() -> {
            try {
                writer.write();
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        }, WriterBench.ROWS), Double.NaN));
        return out;
    }

    private static Measurement llrResult(String demapper, double perSecond) {
        return new Measurement("LlrBench.demap", Map.of("demapper", demapper), 1, perSecond, Double.NaN);
    }

    /** Items per second of CPU time: {@code items} per call of {@code work}. */
    private static double perItem(Runnable work, int items) {
        long warm = THREADS.getCurrentThreadCpuTime();
        while (THREADS.getCurrentThreadCpuTime() - warm < 1_000_000_000L) {
            work.run();
        }
        double best = 0;
        for (int round = 0; round < 7; round++) {
            long start = THREADS.getCurrentThreadCpuTime();
            long calls = 0;
            long used;
            do {
                work.run();
                calls++;
                used = THREADS.getCurrentThreadCpuTime() - start;
            } while (used < 200_000_000L);
            best = Math.max(best, calls * (double) items / (used / 1e9));
        }
        return best;
    }
}
