package dev.fixmod.verify.demo;

import com.fasterxml.jackson.databind.JsonNode;
import dev.fixmod.verify.vectors.Manifest;
import java.io.BufferedReader;
import java.io.IOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;

/**
 * Drives {@link DeviceModel} as an HDL testbench drives the RTL: reads the set's {@code demapper-in.hex}
 * ({@code $readmemh} style), one sample per clock with the scale constant of the sample's noise level, and writes the
 * output register after every clock as a hex line ({@code $fwrite("%h\n", llr)}), from the first stimulus clock on,
 * plus flush clocks. The dump therefore answers vector {@code i} at word {@code i + DeviceModel.LATENCY}.
 *
 * <p>The scale constants are what the receiver's software would program: K = 1/N0 as UQ6.10 codes rounded half-even,
 * from the manifest's noise levels ({@code groups.demapper}: the first {@code levels × data-per-level} vectors are
 * noisy, level by level; the rest, noiseless, use the design Es/N0 of the specification).
 */
public final class Testbench {
    static final int FLUSH = 4;
    private static final int K_FRACTIONAL_BITS = 10;

    private Testbench() {
    }

    /** Simulates {@code build} on the set in {@code set} and writes the dump to {@code out}; returns words written. */
    public static long run(Path set, DeviceModel.Build build, Writer out) throws IOException {
        JsonNode m = Manifest.read(Files.readString(set.resolve(Manifest.FILE_NAME), StandardCharsets.UTF_8),
                set.resolve(Manifest.FILE_NAME).toString()).json();
        JsonNode demapper = m.path("groups").path("demapper");
        int perLevel = demapper.path("data-per-level").asInt();
        int levels = demapper.path("levels").asInt();
        int[] k = new int[levels + 1];
        // Es = 1 (unit energy), so N0 = 10^(-Es/N0 / 10).
        k[0] = scaleCode(StrictMath.pow(10, -m.path("spec").path("demapper").path("design-es-n0-db").asDouble() / 10));
        for (int l = 0; l < levels; l++) {
            k[l + 1] = scaleCode(m.path("noise-levels").path(l).path("n0").asDouble());
        }
        DeviceModel device = new DeviceModel(build);
        long n = 0;
        try (BufferedReader in = Files.newBufferedReader(set.resolve("demapper-in.hex"), StandardCharsets.US_ASCII)) {
            String line;
            while ((line = in.readLine()) != null) {
                String word = line.strip();
                if (word.isEmpty() || word.startsWith("//")) {
                    continue;
                }
                int level = n < (long) levels * perLevel ? 1 + (int) (n / perLevel) : 0;
                write(out, device.clock(Integer.parseInt(word, 16), k[level]));
                n++;
            }
        }
        for (int i = 0; i < FLUSH; i++) {
            write(out, device.clock(0, k[0]));
        }
        return n + FLUSH;
    }

    private static int scaleCode(double n0) {
        return (int) StrictMath.rint((1 << K_FRACTIONAL_BITS) / n0);
    }

    private static void write(Writer out, long word) throws IOException {
        out.write(String.format(Locale.ROOT, "%09x\n", word));
    }
}
