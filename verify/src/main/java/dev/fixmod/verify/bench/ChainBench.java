package dev.fixmod.verify.bench;

import dev.fixmod.verify.loss.Simulation;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicLong;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Threads;

/**
 * The Monte Carlo chain of the loss analysis ({@link Simulation.Worker}, per-axis max-log, float and fixed, see
 * {@link Workload#chainWorker}); one operation is one symbol, one call one chunk. The two methods differ only in the
 * number of threads JMH runs them on, each thread with its own worker and chunk range; JMH reports their summed
 * throughput.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.SECONDS)
public class ChainBench {
    private static final AtomicLong THREADS = new AtomicLong();

    @Param({"16-qam", "256-qam"})
    public String scenario;

    private Simulation.Worker worker;
    private long next;

    @Setup
    public void setUp() {
        worker = Workload.of(scenario).chainWorker();
        next = THREADS.getAndIncrement() << 32;
    }

    @Benchmark
    @Threads(1)
    @OperationsPerInvocation(Workload.BLOCK)
    public long oneThread() {
        return step();
    }

    @Benchmark
    @Threads(2)
    @OperationsPerInvocation(Workload.BLOCK)
    public long twoThreads() {
        return step();
    }

    private long step() {
        worker.run(next++);
        return worker.floatBitErrors() + worker.fixedBitErrors();
    }
}
