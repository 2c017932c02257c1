package dev.fixmod.verify.bench;

import dev.fixmod.verify.formats.FileFormat;
import dev.fixmod.verify.formats.RowWriter;
import dev.fixmod.verify.formats.TableSpec;
import dev.fixmod.verify.loss.Simulation;
import java.io.IOException;
import java.io.OutputStream;
import java.lang.management.ManagementFactory;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * How cost grows with the work: wall time and heap allocated by the measuring thread for the Monte Carlo chain and
 * for hex vector writing as the vector count grows tenfold per step, and for the chain as the constellation order
 * grows. Allocation comes from {@code com.sun.management.ThreadMXBean#getThreadAllocatedBytes} (HotSpot); a flat
 * figure means memory does not grow with the count. A plain measurement, not a JMH benchmark: each row runs once
 * after one warm-up pass of the smallest size, so small counts carry JIT noise.
 */
public final class Growth {

    /** One measured row. */
    public record Row(String work, String scenario, long count, double seconds, long allocatedBytes) {
        double nanosPerItem() {
            return seconds * 1e9 / count;
        }
    }

    private Growth() {
    }

    /** Counts 10^4, 10^5, … up to {@code maxCount}, for the chain on 256-QAM and for hex writing; then orders. */
    public static List<Row> measure(long maxCount) throws IOException {
        List<Row> rows = new ArrayList<>();
        chain("256-qam", 10_000);
        hex(10_000);
        for (long n = 10_000; n <= maxCount; n *= 10) {
            rows.add(chain("256-qam", n));
        }
        for (long n = 10_000; n <= maxCount; n *= 10) {
            rows.add(hex(n));
        }
        long perOrder = Math.min(maxCount, 1_000_000);
        for (String scenario : List.of("16-qam", "64-qam", "256-qam", "1024-qam")) {
            chain(scenario, 10_000);
            rows.add(chain(scenario, perOrder));
        }
        return rows;
    }

    static Row chain(String scenario, long symbols) {
        long start = System.nanoTime();
        long allocatedBefore = allocated();
        Simulation.Worker worker = Workload.of(scenario).chainWorker();
        long done = 0;
        for (long chunk = 0; done < symbols; chunk++) {
            worker.run(chunk);
            done += worker.symbols();
        }
        long bytes = allocated() - allocatedBefore;
        return new Row("Monte Carlo chain", scenario, done, (System.nanoTime() - start) / 1e9, bytes);
    }

    static Row hex(long rows) throws IOException {
        long[] codes = new long[2 * 4096];
        for (int i = 0; i < codes.length; i++) {
            codes[i] = (short) (i * 2654435761L >>> 16);
        }
        long start = System.nanoTime();
        long allocatedBefore = allocated();
        try (RowWriter writer = FileFormat.HEX.open(TableSpec.of("iq", WriterBench.LAYOUT, rows),
                OutputStream.nullOutputStream())) {
            for (long r = 0; r < rows; r++) {
                writer.write(r, 0, codes, (int) (2 * (r & 4095)));
            }
        }
        long bytes = allocated() - allocatedBefore;
        return new Row("hex writing", "I/Q Q2.13", rows, (System.nanoTime() - start) / 1e9, bytes);
    }

    private static long allocated() {
        java.lang.management.ThreadMXBean bean = ManagementFactory.getThreadMXBean();
        if (bean instanceof com.sun.management.ThreadMXBean hotspot) {
            return hotspot.getThreadAllocatedBytes(Thread.currentThread().getId());
        }
        return -1;
    }

    /** The rows as a Markdown table. */
    public static String markdown(List<Row> rows) {
        StringBuilder sb = new StringBuilder("| work | scenario | count | time | per item | heap allocated |\n"
                + "|---|---|---:|---:|---:|---:|\n");
        for (Row r : rows) {
            sb.append(String.format(Locale.ROOT, "| %s | %s | %,d | %.3f s | %s | %s |%n", r.work(), r.scenario(),
                    r.count(), r.seconds(), BenchReport.nanos(r.nanosPerItem()), kib(r.allocatedBytes())));
        }
        return sb.toString();
    }

    private static String kib(long bytes) {
        return bytes < 0 ? "n/a" : String.format(Locale.ROOT, "%,.0f KiB", bytes / 1024.0);
    }
}
