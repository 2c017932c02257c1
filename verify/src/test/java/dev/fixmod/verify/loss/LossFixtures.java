package dev.fixmod.verify.loss;

import java.util.List;

/** Small specifications and runs shared by the loss tests. */
final class LossFixtures {
    private LossFixtures() {
    }

    /** Runs every point of {@code json} on {@code threads} threads. */
    static List<PointResult> simulate(String json, int threads) {
        LossRun run = new LossRun(LossSpecReader.parse(json, "test.json"));
        return run.simulate(1, 1, threads, done -> { });
    }

    static LossAnalysis analyse(String json, int threads) {
        LossRun run = new LossRun(LossSpecReader.parse(json, "test.json"));
        return new LossAnalysis(run, run.simulate(1, 1, threads, done -> { }));
    }
}
