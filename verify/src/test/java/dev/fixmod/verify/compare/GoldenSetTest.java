package dev.fixmod.verify.compare;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Golden set folders as the vector generator writes them (the committed {@code vectors/nr-qam16}): manifest layout
 * and SHA-256, per-vector flags from the CSV files, and two sets compared port by port.
 */
class GoldenSetTest {
    private static final Path SET = NrQam16Set.FOLDER;

    @TempDir
    Path dir;

    private Path copy(String name) throws IOException {
        Path to = Files.createDirectories(dir.resolve(name));
        try (Stream<Path> files = Files.list(SET)) {
            for (Path f : files.toList()) {
                Files.copy(f, to.resolve(f.getFileName()));
            }
        }
        return to;
    }

    /** The {@code flags} cell of each vector in a port's CSV file, split into names. */
    private static List<List<String>> flagsOf(Path csv) throws IOException {
        List<String> lines = Files.readAllLines(csv, StandardCharsets.UTF_8);
        int column = List.of(lines.get(0).split(",")).indexOf("flags");
        return lines.subList(1, lines.size()).stream()
                .map(l -> l.split(",", -1)[column])
                .map(c -> c.isEmpty() ? List.<String>of() : List.of(c.split("\\|")))
                .toList();
    }

    @Test
    void theManifestGivesEachHexPortItsLayoutAndCount() {
        GoldenSet set = GoldenSet.open(SET);
        assertTrue(set.ports().containsAll(List.of("bits", "mapper-out", "demapper-in", "hard", "llr")),
                set.ports().toString());
        GoldenSet.PortFiles llr = set.port("llr");
        assertEquals(461, llr.count());
        assertEquals("llr0[23:18] Q5.0, llr1[17:12] Q5.0, llr2[11:6] Q5.0, llr3[5:0] Q5.0", llr.layout().describe());
        assertEquals(SET.resolve("llr.csv"), llr.csv());
    }

    @Test
    void twoIdenticalSetsAgreeOnEveryPort() throws Exception {
        Path b = copy("b");
        HdlProofTest.Result r = HdlProofTest.compare(SET.toString(), b.toString(), "--json");
        assertEquals(0, r.status(), r.err());
        JsonNode root = new ObjectMapper().readTree(r.out());
        assertEquals(GoldenSet.open(SET).ports().size(), root.path("reports").size(), "one report per hex port");
    }

    @Test
    void aRegressionBetweenSetsIsReportedWithTheVectorsFlags() throws Exception {
        Path b = copy("b");
        // Change one LLR word of set B the way a kernel change would, and keep B's manifest consistent.
        int vector = 440;
        Path llr = b.resolve("llr.hex");
        List<String> lines = Files.readAllLines(llr, StandardCharsets.US_ASCII);
        long word = Long.parseLong(lines.get(vector), 16) ^ 1;
        lines.set(vector, String.format("%06x", word));
        Files.write(llr, lines, StandardCharsets.US_ASCII);
        String manifest = Files.readString(b.resolve("manifest.json"));
        Files.writeString(b.resolve("manifest.json"), manifest.replaceAll(
                "(\"name\" : \"llr.hex\"[^}]*?\"sha256\" : \")[0-9a-f]{64}", "$1" + GoldenSet.sha256(llr)));

        HdlProofTest.Result r = HdlProofTest.compare(SET.toString(), b.toString(), "--port", "llr", "--json");
        assertEquals(1, r.status(), r.out() + r.err());
        JsonNode rep = new ObjectMapper().readTree(r.out()).path("reports").get(0);
        JsonNode m = rep.path("mismatches").get(0);
        assertEquals(vector, m.path("index").asLong());
        List<String> expected = flagsOf(SET.resolve("llr.csv")).get(vector);
        assertTrue(!expected.isEmpty(), "the changed vector carries flags");
        assertEquals(expected.toString(), new ObjectMapper().convertValue(m.path("flags"), List.class).toString());
    }

    @Test
    void theSetsOwnCsvReadsAsACsvDump() {
        HdlProofTest.Result r = HdlProofTest.compare(SET.toString(), "--port", "llr", "--dut",
                SET.resolve("llr.csv").toString(), "--dut-format", "csv", "--quiet");
        assertEquals(0, r.status(), r.out() + r.err());
        assertTrue(r.out().startsWith("AGREE"), r.out());
    }

    @Test
    void aModifiedGoldenFileIsRefused() throws Exception {
        Path a = copy("a");
        Files.writeString(a.resolve("llr.hex"), "000000\n", StandardCharsets.US_ASCII, StandardOpenOption.APPEND);
        HdlProofTest.Result r = HdlProofTest.compare(a.toString(), "--port", "llr", "--dut",
                a.resolve("llr.hex").toString());
        assertEquals(2, r.status());
        assertTrue(r.err().contains("differs from the manifest's"), r.err());
    }

    @Test
    void flagSubsetComparesOnlyFlaggedVectors() throws Exception {
        HdlProofTest.Result r = HdlProofTest.compare(SET.toString(), "--port", "llr", "--dut",
                SET.resolve("llr.hex").toString(), "--flags", "llr-at-max", "--json");
        assertEquals(0, r.status(), r.err());
        JsonNode rep = new ObjectMapper().readTree(r.out()).path("reports").get(0);
        List<List<String>> flags = flagsOf(SET.resolve("llr.csv"));
        long flagged = flags.stream().filter(f -> f.contains("llr-at-max")).count();
        assertTrue(flagged > 0 && flagged < flags.size(), "the subset is a proper one: " + flagged);
        assertEquals(flagged, rep.path("compared").asLong());
        assertEquals(flags.size() - flagged, rep.path("filteredOut").asLong());
        HdlProofTest.Result bad = HdlProofTest.compare(SET.toString(), "--port", "llr", "--dut",
                SET.resolve("llr.hex").toString(), "--flags", "nonsense");
        assertEquals(2, bad.status());
        assertTrue(bad.err().contains("unknown corner-case flag 'nonsense'"), bad.err());
    }
}
