package dev.fixmod.verify.vectors;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import dev.fixmod.verify.compare.GoldenSet;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The committed golden sets under vectors/: each is regenerated from its manifest and must match byte for byte, and
 * its specification file must still say what the manifest recorded. This is the alarm for any kernel change that
 * alters behaviour; after an intended change, regenerate the sets (vectors/README.md, section 6) and review the diff.
 */
class VectorSuiteTest {

    static final Path VECTORS = Path.of("..", "vectors");

    static Stream<String> sets() throws IOException {
        try (Stream<Path> s = Files.list(VECTORS)) {
            return s.filter(p -> p.getFileName().toString().endsWith(".json"))
                    .map(p -> p.getFileName().toString().replaceAll("\\.json$", "")).sorted().toList().stream();
        }
    }

    @Test
    void theSuiteHasItsSets() throws IOException {
        List<String> names = sets().toList();
        assertTrue(names.containsAll(List.of("nr-qam16", "nr-qam64", "nr-qam256", "wlan-qam1024", "psk8", "cqam32",
                "pam4")), names.toString());
        long bytes;
        try (Stream<Path> s = Files.walk(VECTORS)) {
            bytes = s.filter(Files::isRegularFile).mapToLong(p -> p.toFile().length()).sum();
        }
        assertTrue(bytes < 8_000_000, "the committed suite stays small: " + bytes + " bytes");
    }

    @ParameterizedTest
    @MethodSource("sets")
    void aCommittedSetRegeneratesByteForByte(String name) throws IOException {
        Path dir = VECTORS.resolve(name);
        assertTrue(Files.isRegularFile(dir.resolve(Manifest.FILE_NAME)), name + " has no generated set folder");
        assertEquals(List.of(), VectorSetChecker.check(dir));
        VectorSpec fromFile = SpecReader.parse(Files.readString(VECTORS.resolve(name + ".json"),
                StandardCharsets.UTF_8), name + ".json");
        Manifest m = Manifest.read(Files.readString(dir.resolve(Manifest.FILE_NAME)), name);
        assertEquals(fromFile.toCanonicalJson().toString(), m.spec().toString(), name + ".json no longer matches the committed set");
        // The comparison tool opens the set through its own reader: every port's hex file with its layout and count.
        GoldenSet golden = GoldenSet.open(dir);
        long mapper = m.json().get("groups").get("mapper").get("count").asLong();
        long demapper = m.json().get("groups").get("demapper").get("count").asLong();
        for (Port p : Port.values()) {
            GoldenSet.PortFiles files = golden.port(p.tradeName());
            assertEquals(p.mapperGroup() ? mapper : demapper, files.count(), name + " " + p.tradeName());
        }
    }
}
