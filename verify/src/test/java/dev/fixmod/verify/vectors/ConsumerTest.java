package dev.fixmod.verify.vectors;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.verify.testing.ExternalProgram;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** The generated files are read by the programs that consume them: a C program built with gcc, and NumPy. */
class ConsumerTest {

    @TempDir
    static Path temp;
    static Path set;
    static Manifest manifest;

    @BeforeAll
    static void generate() throws IOException {
        // 64-QAM with a 16-bit input (two-byte containers) and 6-bit LLRs (one-byte), all corner groups.
        VectorSpec spec = SpecReader.parse("{\"name\": \"c64\", \"constellation\": \"nr:qam64\", \"count\": 200,"
                + " \"demapper\": {\"input\": {\"format\": \"Q3.12\"}}, \"noise\": {\"es-n0-db\": [15]}}", "c.json");
        set = temp.resolve("c64");
        manifest = VectorSetGenerator.of(spec, temp).writeTo(set, false, VectorSetGenerator.Options.single());
    }

    static Manifest.Entry entry(String name) {
        return manifest.files().stream().filter(e -> e.name().equals(name)).findFirst().orElseThrow();
    }

    /** Sum of all values of a .bin file with the given container, in the file's order. */
    static long sum(Path bin, int bytes, boolean signed) throws IOException {
        ByteBuffer b = ByteBuffer.wrap(Files.readAllBytes(bin)).order(ByteOrder.LITTLE_ENDIAN);
        long sum = 0;
        while (b.hasRemaining()) {
            sum += switch (bytes) {
                case 1 -> signed ? b.get() : b.get() & 0xFF;
                case 2 -> signed ? b.getShort() : b.getShort() & 0xFFFF;
                default -> b.getInt();
            };
        }
        return sum;
    }

    @ParameterizedTest
    @CsvSource({"llr, 1, true", "demapper-in, 2, true", "bits, 1, false"})
    void aCProgramReadsTheHeaderAndTheBinaryAndRecomputesTheManifestChecksum(String port, int bytes, boolean signed)
            throws IOException {
        Path gcc = ExternalProgram.require("the C consumer check", "gcc", "cc");
        Path src = ExternalProgram.copyResource(ConsumerTest.class, "/vectors/consumer.c",
                temp.resolve("consumer-" + port + ".c"));
        String id = "c64_" + port.replace('-', '_');
        Path exe = temp.resolve("consumer-" + port);
        ExternalProgram.runOk(temp, 120, gcc.toString(), "-std=c99", "-Wall", "-Wextra", "-Werror", "-O1",
                "-I" + set, "-DPORT_HEADER=\"" + port + ".h\"", "-DPORT_ARRAY=" + id,
                "-DPORT_COUNT=" + id.toUpperCase() + "_ROWS", "-DPORT_FIELDS=" + id.toUpperCase() + "_FIELDS",
                "-o", exe.toString(), src.toString());
        String out = ExternalProgram.runOk(temp, 60, exe.toString(), set.resolve(port + ".bin").toString());
        // The C side serializes the header's values as little-endian integers and hashes them (FIPS 180-4): the
        // result must be the manifest's SHA-256 of the .bin file, so header, binary and manifest agree.
        assertTrue(out.contains("sha256 " + entry(port + ".bin").sha256() + "\n"), out);
        assertTrue(out.contains("sum " + sum(set.resolve(port + ".bin"), bytes, signed) + "\n"), out);
        assertTrue(out.contains("mismatches 0\n"), out);
    }

    @ParameterizedTest
    @CsvSource({"psk8, psk8, true", "cqam32, cqam32, false", "nr-qam16, nr_qam16, false", "pam4, pam4, false"})
    void aCProgramDecidesEveryCommittedHardVectorFromTheSlicerHeadersAlone(String name, String id, boolean sector)
            throws IOException {
        Path gcc = ExternalProgram.require("the C consumer check", "gcc", "cc");
        Path src = ExternalProgram.copyResource(ConsumerTest.class, "/vectors/slicer.c",
                temp.resolve("slicer-" + name + ".c"));
        Path committed = VectorSuiteTest.VECTORS.resolve(name).toAbsolutePath();
        Path exe = temp.resolve("slicer-" + name);
        List<String> command = new ArrayList<>(List.of(gcc.toString(), "-std=c99", "-Wall", "-Wextra", "-Werror",
                "-O1", "-I" + committed, "-DSET=" + id, "-o", exe.toString(), src.toString()));
        if (sector) {
            command.add("-DSECTOR");
        }
        ExternalProgram.runOk(temp, 120, command.toArray(String[]::new));
        String out = ExternalProgram.runOk(temp, 60, exe.toString());
        // The decision rules are the vector format's (minimum distance or sector sides, ties to larger I then Q;
        // common practice, no source): the C side must reproduce every row of the committed hard port.
        Manifest m = Manifest.read(Files.readString(committed.resolve(Manifest.FILE_NAME)), name);
        assertEquals("rows " + m.json().get("groups").get("demapper").get("count").asLong() + "\nmismatches 0\n", out);
    }

    @ParameterizedTest
    @CsvSource({"llr, int8, 6", "demapper-in, int16, 2", "bits, uint8, 1"})
    void numpyLoadsTheNpyFilesWithTheirShapeTypeAndValues(String port, String dtype, int fields) throws IOException {
        Path python = ExternalProgram.requirePython("numpy", "the NumPy .npy check");
        String script = String.join("\n",
                "import sys, numpy as np",
                "a = np.load(sys.argv[1])",
                "b = np.fromfile(sys.argv[2], dtype=a.dtype).reshape(a.shape)",
                "assert (a == b).all()",
                "print(a.dtype.name, a.shape[0], a.shape[1], int(a.astype(np.int64).sum()), a.flags['C_CONTIGUOUS'])");
        String out = ExternalProgram.runOk(temp, 120, python.toString(), "-c", script,
                set.resolve(port + ".npy").toString(), set.resolve(port + ".bin").toString());
        long count = entry(port + ".npy").count();
        boolean signed = !dtype.startsWith("u");
        int bytes = dtype.endsWith("16") ? 2 : 1;
        assertEquals(dtype + " " + count + " " + fields + " " + sum(set.resolve(port + ".bin"), bytes, signed)
                + " True", out.strip());
    }
}
