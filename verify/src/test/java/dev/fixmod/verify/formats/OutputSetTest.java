package dev.fixmod.verify.formats;

import static java.nio.charset.StandardCharsets.US_ASCII;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class OutputSetTest {

    @TempDir
    Path parent;

    private List<String> entries(Path dir) throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }

    private static void write(OutputSet set, String name, String text) throws IOException {
        try (OutputStream out = set.newFile(name)) {
            out.write(text.getBytes(US_ASCII));
        }
    }

    @Test
    void commitMovesTheCompleteSetIntoPlaceWithTheDigestsOfItsFiles() throws Exception {
        Path target = parent.resolve("set1");
        Tables t = Tables.iq(1000);
        Map<String, String> digests;
        try (OutputSet set = OutputSet.create(target, false)) {
            assertTrue(Files.isDirectory(set.workFolder()));
            assertFalse(Files.exists(target), "nothing visible before commit");
            t.writeTo(FileFormat.HEX, set.newFile("tx/symbols.hex"));
            t.writeTo(FileFormat.NPY, set.newFile("symbols.npy"));
            write(set, "abc.txt", "abc");
            digests = set.sha256();
            set.commit();
        }
        assertEquals(List.of("set1"), entries(parent), "no work folder left beside the set");
        assertEquals(List.of("abc.txt", "symbols.npy", "tx"), entries(target));
        assertEquals(List.of("abc.txt", "symbols.npy", "tx/symbols.hex"), List.copyOf(digests.keySet()));
        // FIPS 180-2, appendix B.1: SHA-256("abc").
        assertEquals("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad", digests.get("abc.txt"));
        for (Map.Entry<String, String> e : digests.entrySet()) {
            byte[] bytes = Files.readAllBytes(target.resolve(e.getKey()));
            String independent = HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
            assertEquals(independent, e.getValue(), e.getKey());
            assertEquals(independent, Sha256.of(target.resolve(e.getKey())), e.getKey());
        }
        assertEquals(new String(t.bytes(FileFormat.HEX), US_ASCII), Files.readString(target.resolve("tx/symbols.hex")));
    }

    @Test
    void anExistingTargetIsReplacedOnlyWithForce() throws IOException {
        Path target = parent.resolve("set");
        Files.createDirectories(target.resolve("old"));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> OutputSet.create(target, false));
        assertEquals("output folder " + target.toAbsolutePath() + " already exists; choose another folder or allow"
                + " overwriting it (force)", e.getMessage());
        try (OutputSet set = OutputSet.create(target, true)) {
            write(set, "new.txt", "x");
            set.commit();
        }
        assertEquals(List.of("new.txt"), entries(target));
        assertEquals(List.of("set"), entries(parent));
        Path file = Files.writeString(parent.resolve("plain"), "x");
        assertThrows(IllegalArgumentException.class, () -> OutputSet.create(file, true));
    }

    @Test
    void aTargetThatAppearsDuringTheWriteIsNotOverwritten() throws IOException {
        Path target = parent.resolve("set");
        try (OutputSet set = OutputSet.create(target, false)) {
            write(set, "a.txt", "a");
            Files.createDirectory(target);
            assertThrows(IllegalArgumentException.class, set::commit);
        }
        assertEquals(List.of(), entries(target));
        assertEquals(List.of("set"), entries(parent));
    }

    @Test
    void fileNamesMustStayInsideTheSet() throws IOException {
        try (OutputSet set = OutputSet.create(parent.resolve("set"), false)) {
            for (String bad : new String[] {"../x.hex", "a/../../x", "/tmp/x", "a\\x", "./x", "", "a/./b", "a/..",
                "..", "."}) {
                IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> set.newFile(bad), bad);
                assertEquals("file name '" + bad + "' inside the vector set must be a relative path that stays in the"
                        + " set folder (no '..', no '.', no leading '/', no '\\'), e.g. tx/symbols.hex", e.getMessage());
            }
            write(set, "tx/a.hex", "1");
            assertEquals("file tx/a.hex is written twice in vector set " + set.target(),
                    assertThrows(IllegalArgumentException.class, () -> set.newFile("tx/a.hex")).getMessage());
        }
        assertEquals(List.of(), entries(parent), "closing without commit leaves nothing");
    }

    @Test
    void aProducerFailingMidwayLeavesNeitherTargetNorWorkFolder() throws IOException {
        Path target = parent.resolve("set");
        Tables t = Tables.iq(100);
        RuntimeException failure = assertThrows(RuntimeException.class, () -> {
            try (OutputSet set = OutputSet.create(target, false)) {
                t.writeTo(FileFormat.CSV, set.newFile("complete.csv"));
                try (RowWriter w = FileFormat.HEX.open(t.spec, set.newFile("partial.hex"))) {
                    for (int r = 0; r < 50; r++) {
                        w.write(r, 0, t.codes[r], 0);
                    }
                    throw new RuntimeException("producer failed at row 50");
                }
            }
        });
        assertEquals("producer failed at row 50", failure.getMessage());
        assertEquals("table tx declares 100 rows but only 50 were written", failure.getSuppressed()[0].getMessage());
        assertEquals(List.of(), entries(parent));
    }

    @Test
    void commitRefusesWhileAFileIsOpen() throws IOException {
        try (OutputSet set = OutputSet.create(parent.resolve("set"), false)) {
            OutputStream open = set.newFile("a.txt");
            assertEquals("vector set " + set.target() + ": close these files before committing: [a.txt]",
                    assertThrows(IllegalStateException.class, set::commit).getMessage());
            open.close();
            set.commit();
            assertThrows(IllegalStateException.class, () -> set.newFile("b.txt"));
        }
        assertEquals(List.of("set"), entries(parent));
    }

    @Test
    void stoppingTheJvmMidwayDeletesTheWorkFolder() throws Exception {
        Path javaBin = Path.of(System.getProperty("java.home"), "bin", "java");
        String classpath = Stream.of(OutputSetChild.class, OutputSet.class, dev.fixmod.fixed.QFormat.class)
                .map(c -> {
                    try {
                        return Path.of(c.getProtectionDomain().getCodeSource().getLocation().toURI()).toString();
                    } catch (java.net.URISyntaxException e) {
                        throw new IllegalStateException(e);
                    }
                })
                .distinct().collect(java.util.stream.Collectors.joining(java.io.File.pathSeparator));
        Path target = parent.resolve("set");
        Process child = new ProcessBuilder(javaBin.toString(), "-cp", classpath, OutputSetChild.class.getName(),
                target.toString()).redirectError(ProcessBuilder.Redirect.INHERIT).start();
        try {
            BufferedReader out = new BufferedReader(new InputStreamReader(child.getInputStream(), US_ASCII));
            Path work = Path.of(out.readLine());
            assertTrue(Files.exists(work.resolve("part/data.hex")), "the child is mid-way through its set");
            child.destroy(); // SIGTERM: the JVM runs its shutdown hooks
            assertTrue(child.waitFor(60, TimeUnit.SECONDS), "child JVM stopped");
            assertEquals(List.of(), entries(parent), "no target and no work folder after the JVM stopped");
        } finally {
            child.destroyForcibly();
        }
    }
}
