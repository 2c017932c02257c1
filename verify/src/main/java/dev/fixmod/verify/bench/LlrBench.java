package dev.fixmod.verify.bench;

import dev.fixmod.demap.FixedLlrSpec;
import dev.fixmod.demap.FixedSoftDemapper;
import dev.fixmod.demap.SoftAlgorithm;
import dev.fixmod.demap.SoftDemapper;
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
 * Soft demapping of the noisy block; one operation is one received sample (k LLRs). {@code demapper} is
 * {@code <float|fixed>:<algorithm>:<scenario>}, listing only the combinations where the algorithm applies
 * (per-axis and folded-linear need a square QAM; log-MAP has no fixed-point datapath). Fixed datapaths use
 * {@link FixedLlrSpec#suggested} with a {@link Workload#LLR_OUTPUT} output word.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.SECONDS)
public class LlrBench {
    @Param({
            "float:log-map:16-qam", "float:log-map:64-qam", "float:log-map:256-qam", "float:log-map:1024-qam",
            "float:log-map:8-psk",
            "float:max-log:16-qam", "float:max-log:64-qam", "float:max-log:256-qam", "float:max-log:1024-qam",
            "float:max-log:8-psk",
            "float:max-log-per-axis:16-qam", "float:max-log-per-axis:64-qam", "float:max-log-per-axis:256-qam",
            "float:max-log-per-axis:1024-qam",
            "float:folded-linear:16-qam", "float:folded-linear:64-qam", "float:folded-linear:256-qam",
            "float:folded-linear:1024-qam",
            "fixed:max-log:16-qam", "fixed:max-log:64-qam", "fixed:max-log:256-qam", "fixed:max-log:1024-qam",
            "fixed:max-log:8-psk",
            "fixed:max-log-per-axis:16-qam", "fixed:max-log-per-axis:64-qam", "fixed:max-log-per-axis:256-qam",
            "fixed:max-log-per-axis:1024-qam",
            "fixed:folded-linear:16-qam", "fixed:folded-linear:64-qam", "fixed:folded-linear:256-qam",
            "fixed:folded-linear:1024-qam"})
    public String demapper;

    private Workload w;
    private SoftDemapper floating;
    private FixedSoftDemapper fixed;
    private double[] llr;
    private int[] codes;

    @Setup
    public void setUp() {
        String[] parts = demapper.split(":");
        w = Workload.of(parts[2]);
        SoftAlgorithm algorithm = SoftAlgorithm.fromName(parts[1]);
        if (parts[0].equals("fixed")) {
            fixed = fixedDemapper(algorithm, w);
            codes = new int[Workload.BLOCK * w.bitsPerSymbol()];
        } else {
            floating = SoftDemapper.create(algorithm, w.constellation, w.options);
            llr = new double[Workload.BLOCK * w.bitsPerSymbol()];
        }
    }

    static FixedSoftDemapper fixedDemapper(SoftAlgorithm algorithm, Workload w) {
        FixedLlrSpec spec = FixedLlrSpec.suggested(algorithm, w.rom, w.options, Workload.LLR_OUTPUT);
        return FixedSoftDemapper.create(algorithm, w.rom, w.options, spec);
    }

    @Benchmark
    @OperationsPerInvocation(Workload.BLOCK)
    public Object demap() {
        if (fixed != null) {
            fixed.llr(w.iCodes, w.qCodes, 0, Workload.BLOCK, codes, 0);
            return codes;
        }
        floating.llr(w.re, w.im, 0, Workload.BLOCK, llr, 0);
        return llr;
    }
}
