package dev.fixmod.verify.vectors;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import dev.fixmod.bits.BitSource;
import dev.fixmod.bits.Prbs;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class VectorSetGeneratorTest {

    static final String SPEC = """
            {"name": "t16", "constellation": "qam16", "count": 300, "noise": {"es-n0-db": [8, 30], "seed": 7},
             "bits": {"source": "prbs-9", "seed": 33}, "demapper": {"design-es-n0-db": 20}}
            """;

    @TempDir
    static Path temp;
    static Path set;
    static Manifest manifest;
    static VectorSpec spec;
    static KernelDatapath datapath;

    @BeforeAll
    static void generate() throws IOException {
        spec = SpecReader.parse(SPEC, "t.json");
        set = temp.resolve("t16");
        manifest = VectorSetGenerator.of(spec, temp).writeTo(set, false, VectorSetGenerator.Options.single());
        datapath = KernelDatapath.of(spec);
    }

    /** One row per vector of a port's CSV, as column name → text. */
    static List<Map<String, String>> csv(String name) throws IOException {
        return csv(set, name);
    }

    static List<Map<String, String>> csv(Path dir, String name) throws IOException {
        List<String> lines = Files.readAllLines(dir.resolve(name), StandardCharsets.US_ASCII);
        String[] header = lines.get(0).split(",", -1);
        List<Map<String, String>> rows = new ArrayList<>();
        for (String line : lines.subList(1, lines.size())) {
            String[] cells = line.split(",", -1);
            assertEquals(header.length, cells.length, line);
            Map<String, String> row = new TreeMap<>();
            for (int c = 0; c < header.length; c++) {
                row.put(header[c], cells[c]);
            }
            rows.add(row);
        }
        return rows;
    }

    /** The flags word of a CSV row, whose flags column lists the names joined by '|'. */
    static int flags(Map<String, String> row) {
        int word = 0;
        for (String name : row.get("flags").split("\\|")) {
            for (CornerFlag f : CornerFlag.values()) {
                word |= f.tradeName().equals(name) ? f.mask() : 0;
            }
        }
        return word;
    }

    @Test
    void theBitPortCarriesThePrbsInLabelsOfKBitsB0First() throws IOException {
        // The reference: the kernel's PRBS-9 (ITU-T O.150) from the same seed, cut into 4-bit labels, b0 = MSB
        // (label bit order of DESIGN.md).
        BitSource prbs = Prbs.PRBS_9.generator(33);
        byte[] bits = new byte[300 * 4];
        prbs.fill(bits, 0, bits.length);
        byte[] bin = Files.readAllBytes(set.resolve("bits.bin"));
        // labels are 4-bit unsigned, stored as one byte each
        for (int n = 0; n < 300; n++) {
            int label = bits[4 * n] << 3 | bits[4 * n + 1] << 2 | bits[4 * n + 2] << 1 | bits[4 * n + 3];
            assertEquals(label, bin[n], "symbol " + n);
        }
        // then the label sweep 0..15
        for (int label = 0; label < 16; label++) {
            assertEquals(label, bin[300 + label]);
        }
        assertEquals(316, bin.length);
    }

    @Test
    void everyFileIsListedWithItsSha256AndTheSetChecksClean() throws IOException {
        for (Manifest.Entry e : manifest.files()) {
            assertEquals(VectorSetChecker.sha256(set.resolve(e.name())), e.sha256(), e.name());
        }
        try (Stream<Path> s = Files.list(set)) {
            assertEquals(manifest.files().size() + 1, s.count());
        }
        assertEquals(List.of(), VectorSetChecker.check(set));
    }

    @Test
    void theManifestRecordsSchemaToolSignGlossaryAndCanonicalSpec() {
        JsonNode m = manifest.json();
        assertEquals("fixmod-vector-set", m.get("schema").asText());
        assertEquals(1, m.get("version").asInt());
        assertEquals(dev.fixmod.verify.cli.Version.TOOL_VERSION, m.get("tool-version").asText());
        assertEquals("zero-positive", m.get("llr-sign").get("name").asText());
        assertEquals(CornerFlag.values().length, m.get("flags").size());
        assertEquals("tie", m.get("flags").get(CornerFlag.TIE.bit()).get("name").asText());
        assertEquals(spec.toCanonicalJson().toString(), m.get("spec").toString());
        assertEquals("fixmod-noise-1", m.get("noise-algorithm").asText());
        assertEquals(316, m.get("groups").get("mapper").get("count").asLong());
    }

    @Test
    void theLabelSweepIsMappedToTheRomAndSlicedBackToItsLabel() throws IOException {
        List<Map<String, String>> mapped = csv("mapper-out.csv");
        for (int label = 0; label < 16; label++) {
            Map<String, String> row = mapped.get(300 + label);
            assertEquals(CornerFlag.LABEL_SWEEP.mask(), flags(row));
            assertEquals(datapath.romI(label), Long.parseLong(row.get("I")));
            assertEquals(datapath.romQ(label), Long.parseLong(row.get("Q")));
        }
        List<Map<String, String>> hard = csv("hard.csv");
        List<Map<String, String>> in = csv("reference.csv");
        int sweep = 2 * 300;
        for (int label = 0; label < 16; label++) {
            assertEquals(CornerFlag.LABEL_SWEEP.mask(), flags(in.get(sweep + label)) & CornerFlag.LABEL_SWEEP.mask());
            assertEquals(label, Integer.parseInt(hard.get(sweep + label).get("label")), "noiseless label " + label);
            assertEquals(label, Integer.parseInt(in.get(sweep + label).get("sent_label")));
        }
    }

    @Test
    void atHighSnrTheHardDecisionsAndLlrSignsRecoverTheSentBits() throws IOException {
        // Level 1 is E_s/N0 = 30 dB: for 16-QAM (d_min = 2/sqrt(10) at unit energy) a noise sample beyond half the
        // minimum distance is a > 10-sigma event (handbook Q function; common practice, no source). With the
        // zero-positive convention a positive LLR means bit 0.
        List<Map<String, String>> in = csv("reference.csv");
        List<Map<String, String>> hard = csv("hard.csv");
        List<Map<String, String>> llr = csv("llr.csv");
        for (int n = 300; n < 600; n++) {
            int sent = Integer.parseInt(in.get(n).get("sent_label"));
            assertEquals("1", in.get(n).get("level"));
            assertEquals(sent, Integer.parseInt(hard.get(n).get("label")), "vector " + n);
            for (int b = 0; b < 4; b++) {
                long code = Long.parseLong(llr.get(n).get("llr" + b));
                int bit = (sent >> (3 - b)) & 1;
                assertTrue(bit == 0 ? code > 0 : code < 0, "vector " + n + " bit " + b + " code " + code);
            }
        }
    }

    @Test
    void noiseLevelBlocksShareSymbolsAndDifferInNoise() throws IOException {
        List<Map<String, String>> in = csv("reference.csv");
        for (int n = 0; n < 300; n++) {
            assertEquals(in.get(n).get("sent_label"), in.get(300 + n).get("sent_label"));
            assertEquals(CornerFlag.NOISY.mask(), flags(in.get(n)) & CornerFlag.NOISY.mask());
        }
        long differ = 0;
        for (int n = 0; n < 300; n++) {
            differ += in.get(n).get("channel_I").equals(in.get(300 + n).get("channel_I")) ? 0 : 1;
        }
        assertEquals(300, differ);
    }

    @Test
    void cornerInputsCarryTheirFlagsAndFollowTheTieRule() throws IOException {
        List<Map<String, String>> in = csv("demapper-in.csv");
        List<Map<String, String>> ref = csv("reference.csv");
        List<Map<String, String>> hard = csv("hard.csv");
        long[] ti = datapath.thresholdsI();
        long[] ri = datapath.referenceI();
        long[] rq = datapath.referenceQ();
        long min = spec.demapper().input().format().minCode();
        long max = spec.demapper().input().format().maxCode();
        int seen = 0;
        boolean zero = false;
        boolean bothMax = false;
        for (int n = 616; n < in.size(); n++) {
            Map<String, String> row = in.get(n);
            int f = flags(row);
            long i = Long.parseLong(row.get("I"));
            long q = Long.parseLong(row.get("Q"));
            int decided = Integer.parseInt(hard.get(n).get("label"));
            assertEquals("-1", ref.get(n).get("sent_label"));
            assertEquals(f, flags(ref.get(n)));
            if ((f & CornerFlag.ON_THRESHOLD.mask()) != 0 && contains(ti, i)) {
                // Per-axis tie rule of the slicer: x >= threshold takes the upper level.
                assertTrue(ri[decided] >= i, "threshold " + i + " decided " + decided);
                seen++;
            }
            if ((f & CornerFlag.THRESHOLD_MINUS_LSB.mask()) != 0 && contains(ti, i + 1)) {
                assertTrue(ri[decided] <= i, "one LSB below threshold " + (i + 1));
            }
            if ((f & CornerFlag.TIE.mask()) != 0) {
                // Equidistant from its nearest reference points; the tie rule picks the largest I, then largest Q.
                long best = Long.MAX_VALUE;
                for (int p = 0; p < ri.length; p++) {
                    best = Math.min(best, dist(i, q, ri[p], rq[p]));
                }
                int nearest = 0;
                int winner = -1;
                for (int p = 0; p < ri.length; p++) {
                    if (dist(i, q, ri[p], rq[p]) == best) {
                        nearest++;
                        if (winner < 0 || ri[p] > ri[winner] || (ri[p] == ri[winner] && rq[p] > rq[winner])) {
                            winner = p;
                        }
                    }
                }
                assertTrue(nearest >= 2, "tie vector " + n + " has " + nearest + " nearest points");
                assertEquals(winner, decided, "tie vector " + n);
            }
            if ((f & CornerFlag.ZERO.mask()) != 0) {
                assertEquals(0, i);
                assertEquals(0, q);
                zero = true;
            }
            if (i == max && q == max) {
                assertEquals(CornerFlag.MAX_CODE.mask() | CornerFlag.BOTH_AXES_FULL_SCALE.mask(),
                        f & (CornerFlag.MAX_CODE.mask() | CornerFlag.BOTH_AXES_FULL_SCALE.mask() | CornerFlag.MIN_CODE.mask()));
                bothMax = true;
            }
            assertTrue(i >= min && i <= max && q >= min && q <= max);
        }
        assertEquals(ti.length, seen, "every I threshold is exercised once");
        assertTrue(zero);
        assertTrue(bothMax);
    }

    @Test
    void everyLlrLimitIsReachedByAFlaggedProbe() throws IOException {
        List<Map<String, String>> in = csv("demapper-in.csv");
        List<Map<String, String>> llr = csv("llr.csv");
        assertEquals(0, manifest.json().get("groups").get("demapper").get("llr-limits-not-reached").size());
        boolean[][] reached = new boolean[4][2];
        for (int n = 0; n < in.size(); n++) {
            int f = flags(in.get(n));
            assertEquals(f, flags(llr.get(n)));
            boolean low = false;
            boolean high = false;
            for (int b = 0; b < 4; b++) {
                long code = Long.parseLong(llr.get(n).get("llr" + b));
                // Q5.0 with symmetric-saturate emits -31 .. 31 (DESIGN.md overflow names)
                assertTrue(code >= -31 && code <= 31);
                if ((f & CornerFlag.LLR_PROBE.mask()) != 0) {
                    reached[b][0] |= code == -31;
                    reached[b][1] |= code == 31;
                }
                low |= code == -31;
                high |= code == 31;
            }
            assertEquals(low, (f & CornerFlag.LLR_AT_MIN.mask()) != 0, "vector " + n);
            assertEquals(high, (f & CornerFlag.LLR_AT_MAX.mask()) != 0, "vector " + n);
        }
        for (int b = 0; b < 4; b++) {
            assertTrue(reached[b][0] && reached[b][1], "bit " + b);
        }
    }

    @Test
    void limitsTheDatapathCannotReachAreListed() {
        // Gray 16-QAM, unit energy, levels ±A, ±3A with A = 1/sqrt(10): the inner bit of each axis (b1, b3) is 1 on
        // the inner levels and 0 on the outer ones, so its max-log LLR (min d1 − min d0)/N0 is lowest at y = 0,
        // (A² − 9A²)/N0 = −8A²/N0, and grows without bound outward (the piecewise-linear form of the simplified
        // soft demapper, Tosato & Bisaglia, ICC 2002; from memory). At the default design E_s/N0 of 10 dB
        // (N0 = 0.1) that is −8 nats: a Q5.0 output (LSB 1 nat) never reaches −31 on b1 and b3, while every other
        // limit is reachable.
        VectorSpec s = SpecReader.parse("{\"constellation\": \"qam16\", \"count\": 0}", "d.json");
        CornerCases.Result r = CornerCases.build(KernelDatapath.of(s), s.demapper().input().format(), s.cornerCases(),
                0);
        assertEquals(List.of("b1 low", "b3 low"), r.unreachedLimits());
    }

    @Test
    void filesOfOnePortAgreeAcrossFormats() throws IOException {
        List<String> hex = Files.readAllLines(set.resolve("llr.hex"));
        byte[] bin = Files.readAllBytes(set.resolve("llr.bin"));
        byte[] npy = Files.readAllBytes(set.resolve("llr.npy"));
        List<Map<String, String>> csv = csv("llr.csv");
        assertEquals(csv.size(), hex.size());
        assertEquals(csv.size() * 4, bin.length);
        // .npy 1.0: magic, version 1.0, header length; header + preamble a multiple of 64 (NumPy format spec)
        assertEquals((byte) 0x93, npy[0]);
        assertEquals("NUMPY", new String(npy, 1, 5, StandardCharsets.US_ASCII));
        int headerLength = (npy[8] & 0xFF) | (npy[9] & 0xFF) << 8;
        assertEquals(0, (10 + headerLength) % 64);
        String header = new String(npy, 10, headerLength, StandardCharsets.US_ASCII);
        assertTrue(header.contains("'descr': '|i1'") && header.contains("'shape': (" + csv.size() + ", 4)"), header);
        byte[] data = java.util.Arrays.copyOfRange(npy, 10 + headerLength, npy.length);
        assertArrayEquals(bin, data);
        for (int n = 0; n < csv.size(); n++) {
            String word = hex.get(n);
            assertEquals(6, word.length()); // 4 fields of 6 bits = 24 bits
            long packed = Long.parseLong(word, 16);
            for (int b = 0; b < 4; b++) {
                long code = Long.parseLong(csv.get(n).get("llr" + b));
                long field = (packed >>> (6 * (3 - b))) & 0x3F;
                assertEquals(code & 0x3F, field, "hex line " + n);
                assertEquals(code, bin[4 * n + b]);
            }
        }
        List<String> in = Files.readAllLines(set.resolve("demapper-in.hex"));
        ByteBuffer inBin = ByteBuffer.wrap(Files.readAllBytes(set.resolve("demapper-in.bin")))
                .order(ByteOrder.LITTLE_ENDIAN);
        for (String word : in) {
            assertEquals(6, word.length()); // two 12-bit fields
            long packed = Long.parseLong(word, 16);
            long i = (packed >>> 12) << 52 >> 52;
            long q = packed << 52 >> 52;
            assertEquals(i, inBin.getShort());
            assertEquals(q, inBin.getShort());
        }
    }

    @Test
    void oneAndTwoThreadsAndSeveralChunksGiveIdenticalFiles(@TempDir Path dir) throws IOException {
        // count > 2 chunks so that chunk boundaries and the parallel window are exercised
        VectorSpec s = SpecReader.parse("{\"constellation\": \"qam64\", \"count\": 9000, \"formats\": [\"binary\", \"csv\"],"
                + " \"noise\": {\"es-n0-db\": [12]}}", "d.json");
        Path one = dir.resolve("one");
        Path two = dir.resolve("two");
        Manifest a = VectorSetGenerator.of(s, dir).writeTo(one, false, new VectorSetGenerator.Options(1, null));
        Manifest b = VectorSetGenerator.of(s, dir).writeTo(two, false, new VectorSetGenerator.Options(2, null));
        assertEquals(a.text(), b.text());
        for (Manifest.Entry e : a.files()) {
            assertEquals(-1L, Files.mismatch(one.resolve(e.name()), two.resolve(e.name())), e.name());
        }
        assertFalse(a.files().isEmpty());
    }

    @Test
    void aUserBitFileTravelsWithTheSetAndRegenerates(@TempDir Path dir) throws IOException {
        // 8-PSK labels of 3 bits from a file with a comment line and white space; 7 bits repeat cyclically.
        Files.writeString(dir.resolve("my.bits"), "# test pattern\n110 0101\n");
        VectorSpec s = SpecReader.parse("{\"constellation\": \"psk8\", \"count\": 7, \"bits\": {\"source\": \"file\","
                + " \"file\": \"my.bits\"}, \"formats\": [\"csv\"], \"corner-cases\": []}", "u.json");
        Path out = dir.resolve("u");
        Manifest m = VectorSetGenerator.of(s, dir).writeTo(out, false, VectorSetGenerator.Options.single());
        assertEquals("source-bits.txt", m.spec().get("bits").get("file").asText());
        assertEquals(-1L, Files.mismatch(dir.resolve("my.bits"), out.resolve("source-bits.txt")));
        List<Map<String, String>> bits = csv(out, "bits.csv");
        // 1100101 1100101 1100101 ... cut in threes: 110 010 111 001 011 100 101
        int[] expected = {6, 2, 7, 1, 3, 4, 5};
        for (int n = 0; n < 7; n++) {
            assertEquals(expected[n], Integer.parseInt(bits.get(n).get("label")), "label " + n);
        }
        assertEquals(List.of(), VectorSetChecker.check(out));
    }

    private static boolean contains(long[] values, long v) {
        for (long x : values) {
            if (x == v) {
                return true;
            }
        }
        return false;
    }

    private static long dist(long i, long q, long pi, long pq) {
        return (i - pi) * (i - pi) + (q - pq) * (q - pq);
    }
}
