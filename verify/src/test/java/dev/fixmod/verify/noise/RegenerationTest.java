package dev.fixmod.verify.noise;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.verify.testing.ExternalProgram;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The proof that a testbench can regenerate the noise: regenerate.py, written from noise-algorithm.md with the
 * Python standard library only, must reproduce the Java samples bit for bit.
 */
class RegenerationTest {

    @TempDir
    static Path dir;
    private static Path python;
    private static Path script;

    @BeforeAll
    static void setUp() {
        python = ExternalProgram.requirePython(null, "the Python regeneration proof of the noise generator");
        script = ExternalProgram.copyResource(RegenerationTest.class, "/noise/regenerate.py", dir.resolve("regenerate.py"));
    }

    private static List<String> python(String... args) {
        List<String> cmd = new ArrayList<>(List.of(python.toString(), script.toString()));
        cmd.addAll(List.of(args));
        String out = ExternalProgram.runOk(dir, 120, cmd.toArray(String[]::new));
        return out.isEmpty() ? List.of() : List.of(out.split("\n"));
    }

    private static String hex(double v) {
        return String.format("%016x", Double.doubleToRawLongBits(v));
    }

    private static List<String> hex(double[] values) {
        List<String> out = new ArrayList<>(values.length);
        for (double v : values) {
            out.add(hex(v));
        }
        return out;
    }

    private static List<String> python(Gaussian method, StreamKey key, long first, int count) {
        return python("gaussian", "--method", method.label(), "--seed", Long.toString(key.seed()),
                "--stream", Long.toString(key.stream()), "--first", Long.toString(first), "--count",
                Integer.toString(count));
    }

    private static double[] java(Gaussian method, StreamKey key, long first, int count) {
        double[] out = new double[count];
        method.fill(out, 0, count, key, first);
        return out;
    }

    @Test
    void scriptPassesThePublishedPhiloxKnownAnswers() {
        assertEquals(List.of("ok"), python("self-test"));
    }

    @Test
    void boxMullerMatchesBitForBit() {
        StreamKey key = StreamKey.of(20240611L, 3);
        assertEquals(hex(java(Gaussian.BOX_MULLER, key, 0, 1000)), python(Gaussian.BOX_MULLER, key, 0, 1000));
        // An odd first index (a sin sample first) and a large index with both counter words in use.
        StreamKey other = StreamKey.of(4294967295L, 0);
        long far = 0x1234_5678_9abcL + 1;
        assertEquals(hex(java(Gaussian.BOX_MULLER, other, far, 7)), python(Gaussian.BOX_MULLER, other, far, 7));
    }

    @Test
    void zigguratMatchesBitForBitIncludingWedgeAndTailPaths() {
        StreamKey key = StreamKey.of(7, 11);
        int count = 20_000;
        // The range must exercise both rare paths, or the comparison would not prove them.
        long[] draws = new long[count];
        Philox4x32.fillDraws(draws, 0, count, key, 0);
        int outside = 0;
        int tail = 0;
        for (long w : draws) {
            int i = (int) w & 127;
            if (Uniform.unit(w) * Ziggurat.X[i] >= Ziggurat.X[i + 1]) {
                outside++;
                tail += i == 0 ? 1 : 0;
            }
        }
        assertTrue(outside >= 150, "wedge/tail words in range: " + outside);
        assertTrue(tail >= 3, "tail words in range: " + tail);
        assertEquals(hex(java(Gaussian.ZIGGURAT, key, 0, count)), python(Gaussian.ZIGGURAT, key, 0, count));
    }

    @Test
    void uniformsMatch() {
        StreamKey key = StreamKey.of(5, 6);
        double[] unit = new double[200];
        double[] open = new double[200];
        Uniform.fill(unit, 0, 200, key, 33);
        Uniform.fillOpen(open, 0, 200, key, 33);
        assertEquals(hex(unit), python("uniform", "--seed", "5", "--stream", "6", "--first", "33", "--count", "200"));
        assertEquals(hex(open), python("uniform", "--seed", "5", "--stream", "6", "--first", "33", "--count", "200",
                "--open"));
    }

    @Test
    void awgnMatches() {
        StreamKey key = StreamKey.of(99, 1);
        for (Gaussian method : Gaussian.values()) {
            Awgn awgn = new Awgn(0.3, method);
            double[] i = new double[300];
            double[] q = new double[300];
            awgn.fill(i, 0, q, 0, 300, key, 17);
            List<String> expected = new ArrayList<>();
            for (int k = 0; k < 300; k++) {
                expected.add(hex(i[k]) + " " + hex(q[k]));
            }
            assertEquals(expected, python("awgn", "--method", method.label(), "--n0", Double.toString(0.3),
                    "--seed", "99", "--stream", "1", "--first", "17", "--count", "300"), method.label());
        }
    }
}
