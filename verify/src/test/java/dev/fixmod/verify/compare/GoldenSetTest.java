package dev.fixmod.verify.compare;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Golden set folders: manifest layout and SHA-256, per-vector flags, and two sets compared port by port. */
class GoldenSetTest {
    @TempDir
    Path dir;

    @Test
    void twoIdenticalSetsAgreeOnEveryPort() throws Exception {
        Path a = HdlGoldenSet.write(dir.resolve("a"));
        Path b = HdlGoldenSet.write(dir.resolve("b"));
        HdlProofTest.Result r = HdlProofTest.compare(a.toString(), b.toString(), "--json");
        assertEquals(0, r.status(), r.err());
        JsonNode root = new ObjectMapper().readTree(r.out());
        assertEquals(2, root.path("reports").size(), "demapper-in and llr");
    }

    @Test
    void aRegressionBetweenSetsIsReportedWithTheVectorsFlags() throws Exception {
        Path a = HdlGoldenSet.write(dir.resolve("a"));
        Path b = HdlGoldenSet.write(dir.resolve("b"));
        // Change one LLR word of set B the way a kernel change would, and keep B's manifest consistent.
        Path llr = b.resolve("llr.hex");
        List<String> lines = Files.readAllLines(llr, StandardCharsets.US_ASCII);
        int line = 1 + 300; // vector 300 (line 1 is the header comment)
        long word = Long.parseLong(lines.get(line), 16) ^ 1;
        lines.set(line, NrQam16LlrModel.LLR_LAYOUT.hex(word));
        Files.write(llr, lines, StandardCharsets.US_ASCII);
        String manifest = Files.readString(b.resolve("manifest.json"));
        Files.writeString(b.resolve("manifest.json"), manifest.replaceAll(
                "(\"name\" : \"llr.hex\"[^}]*\"sha256\" : \")[0-9a-f]{64}", "$1" + GoldenSet.sha256(llr)));

        HdlProofTest.Result r = HdlProofTest.compare(a.toString(), b.toString(), "--port", "llr", "--json");
        assertEquals(1, r.status(), r.out() + r.err());
        JsonNode rep = new ObjectMapper().readTree(r.out()).path("reports").get(0);
        JsonNode m = rep.path("mismatches").get(0);
        assertEquals(300, m.path("index").asLong());
        long expectedFlags = HdlGoldenSet.flags(NrQam16LlrModel.stimulus()[300],
                NrQam16LlrModel.golden().llrWord(NrQam16LlrModel.stimulus()[300]));
        assertEquals(Long.bitCount(expectedFlags), m.path("flags").size());
    }

    @Test
    void theSetsOwnCsvReadsAsACsvDump() throws Exception {
        Path a = HdlGoldenSet.write(dir.resolve("a"));
        HdlProofTest.Result r = HdlProofTest.compare(a.toString(), "--port", "llr", "--dut",
                a.resolve("llr.csv").toString(), "--dut-format", "csv", "--quiet");
        assertEquals(0, r.status(), r.out() + r.err());
        assertTrue(r.out().startsWith("AGREE"), r.out());
    }

    @Test
    void aModifiedGoldenFileIsRefused() throws Exception {
        Path a = HdlGoldenSet.write(dir.resolve("a"));
        Files.writeString(a.resolve("llr.hex"), "000000\n", StandardCharsets.US_ASCII,
                java.nio.file.StandardOpenOption.APPEND);
        HdlProofTest.Result r = HdlProofTest.compare(a.toString(), "--port", "llr", "--dut",
                a.resolve("llr.hex").toString());
        assertEquals(2, r.status());
        assertTrue(r.err().contains("differs from the manifest's"), r.err());
    }

    @Test
    void flagSubsetComparesOnlyFlaggedVectors() throws Exception {
        Path a = HdlGoldenSet.write(dir.resolve("a"));
        HdlProofTest.Result r = HdlProofTest.compare(a.toString(), "--port", "llr", "--dut",
                a.resolve("llr.hex").toString(), "--flags", "llr-at-max", "--json");
        assertEquals(0, r.status(), r.err());
        JsonNode rep = new ObjectMapper().readTree(r.out()).path("reports").get(0);
        long flagged = 0;
        for (long w : NrQam16LlrModel.stimulus()) {
            if ((HdlGoldenSet.flags(w, NrQam16LlrModel.golden().llrWord(w)) >> HdlGoldenSet.LLR_AT_MAX & 1) != 0) {
                flagged++;
            }
        }
        assertTrue(flagged > 0 && flagged < 512, "the subset is a proper one: " + flagged);
        assertEquals(flagged, rep.path("compared").asLong());
        assertEquals(512 - flagged, rep.path("filteredOut").asLong());
        HdlProofTest.Result bad = HdlProofTest.compare(a.toString(), "--port", "llr", "--dut",
                a.resolve("llr.hex").toString(), "--flags", "nonsense");
        assertEquals(2, bad.status());
        assertTrue(bad.err().contains("unknown corner-case flag 'nonsense'"), bad.err());
    }
}
