package dev.fixmod.verify.bench;

import dev.fixmod.demap.FixedAxisSlicer;
import dev.fixmod.demap.FixedNearestSlicer;
import dev.fixmod.demap.FixedSectorSlicer;
import dev.fixmod.demap.FixedSlicer;
import dev.fixmod.demap.FloatAxisSlicer;
import dev.fixmod.demap.FloatNearestSlicer;
import dev.fixmod.demap.FloatSectorSlicer;
import dev.fixmod.demap.FloatSlicer;
import dev.fixmod.demap.Slicers;
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
 * Hard decisions on the noisy block; one operation is one sample. {@code slicer} is
 * {@code <float|fixed>:<axis|sector|nearest>:<scenario>}: the per-axis slicers on the square QAMs, the sector slicers
 * on 8-PSK, and the nearest-point slicers (which apply to any constellation) on both.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.SECONDS)
public class SlicerBench {
    @Param({"float:axis:16-qam", "fixed:axis:16-qam", "float:axis:256-qam", "fixed:axis:256-qam",
            "float:axis:1024-qam", "fixed:axis:1024-qam", "float:sector:8-psk", "fixed:sector:8-psk",
            "float:nearest:16-qam", "fixed:nearest:16-qam", "float:nearest:8-psk", "fixed:nearest:8-psk"})
    public String slicer;

    private Workload w;
    private FloatSlicer floating;
    private FixedSlicer fixed;
    private final int[] labels = new int[Workload.BLOCK];

    @Setup
    public void setUp() {
        String[] parts = slicer.split(":");
        w = Workload.of(parts[2]);
        boolean isFixed = parts[0].equals("fixed");
        switch (parts[1]) {
            case "axis" -> {
                floating = new FloatAxisSlicer(w.constellation);
                fixed = new FixedAxisSlicer(w.rom);
            }
            case "sector" -> {
                floating = new FloatSectorSlicer(w.constellation);
                fixed = new FixedSectorSlicer(w.constellation, w.rom.format(), Slicers.DEFAULT_SECTOR_COEFFICIENTS);
            }
            case "nearest" -> {
                floating = new FloatNearestSlicer(w.constellation);
                fixed = new FixedNearestSlicer(w.rom);
            }
            default -> throw new IllegalArgumentException("unknown slicer kind in " + slicer);
        }
        if (isFixed) {
            floating = null;
        } else {
            fixed = null;
        }
    }

    @Benchmark
    @OperationsPerInvocation(Workload.BLOCK)
    public int[] slice() {
        if (fixed != null) {
            fixed.sliceLabels(w.iCodes, w.qCodes, 0, Workload.BLOCK, 0, labels, 0);
        } else {
            floating.sliceLabels(w.re, w.im, 0, Workload.BLOCK, 0, labels, 0);
        }
        return labels;
    }
}
