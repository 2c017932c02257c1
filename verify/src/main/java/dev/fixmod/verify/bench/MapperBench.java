package dev.fixmod.verify.bench;

import dev.fixmod.map.FixedMapper;
import dev.fixmod.map.FloatMapper;
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

/** Labels to symbols, a block at a time; one operation is one symbol. */
@State(Scope.Thread)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.SECONDS)
public class MapperBench {
    @Param({"16-qam", "64-qam", "256-qam", "1024-qam", "8-psk"})
    public String scenario;

    private Workload w;
    private FixedMapper fixed;
    private FloatMapper floating;
    private final int[] outI = new int[Workload.BLOCK];
    private final int[] outQ = new int[Workload.BLOCK];
    private final double[] outRe = new double[Workload.BLOCK];
    private final double[] outIm = new double[Workload.BLOCK];

    @Setup
    public void setUp() {
        w = Workload.of(scenario);
        fixed = new FixedMapper(w.rom);
        floating = new FloatMapper(w.constellation);
    }

    @Benchmark
    @OperationsPerInvocation(Workload.BLOCK)
    public int[] fixedMapper() {
        fixed.mapLabels(w.labels, 0, Workload.BLOCK, 0, outI, outQ, 0);
        return outI;
    }

    @Benchmark
    @OperationsPerInvocation(Workload.BLOCK)
    public double[] floatMapper() {
        floating.mapLabels(w.labels, 0, Workload.BLOCK, 0, outRe, outIm, 0);
        return outRe;
    }
}
