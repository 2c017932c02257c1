package dev.fixmod.verify.vectors;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.DigestInputStream;
import java.security.MessageDigest;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import java.util.stream.Stream;

/**
 * Checks a vector set: every listed file is present with its SHA-256, no file is unlisted, sizes and line counts
 * agree with the counts and layouts, and regenerating from the manifest's canonical specification reproduces every
 * file (the manifest included) byte for byte.
 */
public final class VectorSetChecker {
    private VectorSetChecker() {
    }

    /**
     * The differences found; empty when the set is good.
     *
     * @throws IllegalArgumentException when {@code dir} is not a readable set (no or malformed manifest)
     */
    public static List<String> check(Path dir) throws IOException {
        if (!Files.isDirectory(dir)) {
            throw new IllegalArgumentException(dir + ": no such folder");
        }
        Path manifestFile = dir.resolve(Manifest.FILE_NAME);
        if (!Files.isRegularFile(manifestFile)) {
            throw new IllegalArgumentException(dir + ": not a vector set (no " + Manifest.FILE_NAME + ")");
        }
        Manifest manifest = Manifest.read(Files.readString(manifestFile, StandardCharsets.UTF_8),
                manifestFile.toString());
        List<String> problems = new ArrayList<>();
        Set<String> listed = new TreeSet<>();
        for (Manifest.Entry e : manifest.files()) {
            listed.add(e.name());
            Path f = dir.resolve(e.name());
            if (!Files.isRegularFile(f)) {
                problems.add(e.name() + ": listed in the manifest but missing");
                continue;
            }
            String sha = sha256(f);
            if (!sha.equals(e.sha256())) {
                problems.add(e.name() + ": SHA-256 " + sha + " differs from the manifest's " + e.sha256());
            }
            consistency(f, e, problems);
        }
        try (Stream<Path> s = Files.list(dir)) {
            s.map(p -> p.getFileName().toString()).filter(n -> !n.equals(Manifest.FILE_NAME) && !listed.contains(n))
                    .sorted().forEach(n -> problems.add(n + ": present but not listed in the manifest"));
        }
        VectorSpec spec = SpecReader.parse(manifest.spec().toString(), manifestFile + ": spec");
        groupCounts(manifest, problems);
        countsFitTheFiles(spec, manifest, dir, manifestFile.toString());
        Path work = Files.createTempDirectory("fixmod-check-");
        Path temp = work.resolve("regenerated");
        try {
            VectorSetGenerator.of(spec, dir).writeTo(temp, false, VectorSetGenerator.Options.single());
            Set<String> regenerated = new TreeSet<>();
            try (Stream<Path> s = Files.list(temp)) {
                s.forEach(p -> regenerated.add(p.getFileName().toString()));
            }
            for (String name : regenerated) {
                Path mine = dir.resolve(name);
                if (!Files.isRegularFile(mine)) {
                    problems.add(name + ": regeneration writes this file, the set does not have it");
                    continue;
                }
                long at = Files.mismatch(mine, temp.resolve(name));
                if (at >= 0) {
                    problems.add(name + ": regeneration differs from byte " + at + describeLine(mine, at));
                }
            }
            for (String name : listed) {
                if (!regenerated.contains(name)) {
                    problems.add(name + ": regeneration does not write this file");
                }
            }
        } finally {
            SetFolder.deleteQuietly(work);
        }
        return problems;
    }

    /**
     * Refuses to regenerate a set the files cannot be: every vector takes at least one byte in every format, and the
     * groups record the spec's count, so an edited {@code spec.count} (say 10^9 in a set of kilobytes) is reported
     * at once instead of regenerated for hours.
     */
    private static void countsFitTheFiles(VectorSpec spec, Manifest manifest, Path dir, String where)
            throws IOException {
        long largest = 0;
        for (Manifest.Entry e : manifest.files()) {
            Path f = dir.resolve(e.name());
            if (Files.isRegularFile(f)) {
                largest = Math.max(largest, Files.size(f));
            }
        }
        JsonNode groups = manifest.json().path("groups");
        long mapperData = groups.path("mapper").path("data").asLong(spec.count());
        long demapperData = groups.path("demapper").path("data-per-level").asLong(spec.count());
        if (spec.count() > largest || mapperData != spec.count() || demapperData != spec.count()) {
            throw new IllegalArgumentException(where + ": spec.count " + spec.count() + " does not fit the set (groups:"
                    + " mapper data " + mapperData + ", demapper data-per-level " + demapperData + "; largest file "
                    + largest + " bytes); the manifest was edited, so regenerating it cannot reproduce these files");
        }
    }

    private static void groupCounts(Manifest manifest, List<String> problems) {
        JsonNode groups = manifest.json().path("groups");
        for (Manifest.Entry e : manifest.files()) {
            for (Port p : Port.values()) {
                if (p.tradeName().equals(e.port())) {
                    long expected = groups.path(p.mapperGroup() ? "mapper" : "demapper").path("count").asLong(-1);
                    if (expected != e.count()) {
                        problems.add(e.name() + ": count " + e.count() + " differs from the " + (p.mapperGroup()
                                ? "mapper" : "demapper") + " group's " + expected);
                    }
                }
            }
        }
    }

    /** Sizes and line counts that follow from the count and layout. */
    private static void consistency(Path f, Manifest.Entry e, List<String> problems) throws IOException {
        JsonNode layout = e.layout();
        if (layout == null || !layout.isObject()) {
            return;
        }
        int fields = layout.path("fields").size();
        int digits = layout.path("hex-digits").asInt();
        String container = layout.path("storage").asText();
        String bitsOfType = container.replaceAll("[^0-9]", "");
        int bytes = bitsOfType.isEmpty() ? 0 : Integer.parseInt(bitsOfType) / 8; // int16_t -> 2
        long size = Files.size(f);
        switch (e.format()) {
            case "binary" -> {
                if (size != e.count() * fields * bytes) {
                    problems.add(e.name() + ": " + size + " bytes, but " + e.count() + " vectors of " + fields + " "
                            + container + " need " + e.count() * fields * bytes);
                }
            }
            case "hex" -> {
                if (size != e.count() * (digits + 1L)) {
                    problems.add(e.name() + ": " + size + " bytes, but " + e.count() + " lines of " + digits
                            + " hex digits need " + e.count() * (digits + 1L));
                }
            }
            case "npy" -> {
                long data = e.count() * fields * bytes;
                if (size < data + 64 || (size - data) % 64 != 0) {
                    problems.add(e.name() + ": " + size + " bytes do not hold a 64-byte aligned header and " + data
                            + " data bytes");
                }
            }
            case "csv" -> {
                long lines;
                try (Stream<String> s = Files.lines(f, StandardCharsets.US_ASCII)) {
                    lines = s.count();
                }
                if (lines != e.count() + 1) {
                    problems.add(e.name() + ": " + lines + " lines, but a header and " + e.count() + " vectors need "
                            + (e.count() + 1));
                }
            }
            default -> {
            }
        }
    }

    /** For a text file, the line holding byte {@code at}. */
    private static String describeLine(Path f, long at) throws IOException {
        String name = f.getFileName().toString();
        if (!(name.endsWith(".hex") || name.endsWith(".csv") || name.endsWith(".h") || name.endsWith(".json"))) {
            return "";
        }
        long line = 1;
        try (InputStream in = Files.newInputStream(f)) {
            for (long n = 0; n < at; n++) {
                int c = in.read();
                if (c < 0) {
                    break;
                }
                if (c == '\n') {
                    line++;
                }
            }
        }
        return " (line " + line + ")";
    }

    static String sha256(Path f) throws IOException {
        MessageDigest md;
        try {
            md = MessageDigest.getInstance("SHA-256");
        } catch (java.security.NoSuchAlgorithmException e) {
            throw new IllegalStateException("the JDK always provides SHA-256", e);
        }
        try (InputStream in = new DigestInputStream(Files.newInputStream(f), md)) {
            in.transferTo(java.io.OutputStream.nullOutputStream());
        }
        return HexFormat.of().formatHex(md.digest());
    }
}
