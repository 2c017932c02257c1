package dev.fixmod.verify.bench;

import dev.fixmod.verify.noise.Gaussian;
import dev.fixmod.verify.noise.StreamKey;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

/**
 * Counter-based standard normal samples alone; one operation is one Gaussian sample. Each call continues the stream
 * where the last one stopped, so the retry path of the ziggurat is hit at its natural rate.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.SECONDS)
public class NoiseBench {
    static final int SAMPLES = 2 * Workload.BLOCK;

    @Param({"box-muller", "ziggurat"})
    public String method;

    private Gaussian sampler;
    private final double[] out = new double[SAMPLES];
    private final StreamKey key = StreamKey.of(Workload.SEED, 2);
    private long next;

    @Setup
    public void setUp() {
        sampler = Gaussian.fromName(method);
    }

    @Benchmark
    @OperationsPerInvocation(SAMPLES)
    public double[] gaussian() {
        sampler.fill(out, 0, SAMPLES, key, next);
        next += SAMPLES;
        return out;
    }
}
