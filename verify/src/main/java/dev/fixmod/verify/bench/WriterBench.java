package dev.fixmod.verify.bench;

import dev.fixmod.verify.formats.Field;
import dev.fixmod.verify.formats.FieldLayout;
import dev.fixmod.verify.formats.FileFormat;
import dev.fixmod.verify.formats.RowWriter;
import dev.fixmod.verify.formats.TableSpec;
import dev.fixmod.verify.noise.Philox4x32;
import dev.fixmod.verify.noise.StreamKey;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
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
import org.openjdk.jmh.annotations.TearDown;

/**
 * Vector file writing: one operation is one row of an I/Q table ({@link #LAYOUT}: two Q2.13 fields, a 32-bit word),
 * written through {@link FileFormat#open} to a stream that discards the bytes or to a temporary file. A hex row is
 * 9 bytes (8 digits and a line feed), a binary row 4 bytes (two little-endian int16); {@link #bytesPerRow} gives
 * the figure the report turns into MB/s.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.SECONDS)
public class WriterBench {
    static final int ROWS = 1 << 16;
    static final FieldLayout LAYOUT = FieldLayout.of(Field.of("I", "Q2.13"), Field.of("Q", "Q2.13"));

    @Param({"hex", "binary"})
    public String format;

    @Param({"null", "file"})
    public String sink;

    private FileFormat fileFormat;
    private TableSpec table;
    private final long[] codes = new long[2 * ROWS];
    private Path file;

    /** Bytes per row of {@code format} ({@code hex} or {@code binary}) for {@link #LAYOUT}. */
    static int bytesPerRow(String format) {
        return switch (format) {
            case "hex" -> LAYOUT.hexDigits() + 1;
            case "binary" -> LAYOUT.fieldCount() * LAYOUT.storage().bytes();
            default -> throw new IllegalArgumentException("unknown writer format " + format);
        };
    }

    @Setup
    public void setUp() throws IOException {
        fileFormat = FileFormat.fromName(format);
        table = TableSpec.of("iq", LAYOUT, ROWS);
        int[] words = new int[2 * ROWS];
        Philox4x32.fillWords(words, 0, words.length, StreamKey.of(Workload.SEED, 21), 0);
        for (int i = 0; i < codes.length; i++) {
            codes[i] = (short) words[i]; // any 16-bit value is a Q2.13 code
        }
        if (sink.equals("file")) {
            file = Files.createTempFile("fixmod-bench", "." + fileFormat.extension());
        }
    }

    @TearDown
    public void tearDown() throws IOException {
        if (file != null) {
            Files.deleteIfExists(file);
        }
    }

    @Benchmark
    @OperationsPerInvocation(ROWS)
    public long write() throws IOException {
        OutputStream out = file == null ? OutputStream.nullOutputStream()
                : Files.newOutputStream(file);
        try (RowWriter writer = fileFormat.open(table, out)) {
            for (int r = 0; r < ROWS; r++) {
                writer.write(r, 0, codes, 2 * r);
            }
        }
        return ROWS;
    }
}
