package dev.fixmod.verify.compare;

import com.fasterxml.jackson.databind.JsonNode;
import dev.fixmod.verify.formats.Field;
import dev.fixmod.verify.formats.FieldLayout;
import dev.fixmod.verify.vectors.Manifest;
import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * A golden vector set folder as compare needs it: per port, the hex file, its word layout and count from the
 * set's {@link Manifest}, and the vectors' corner-case flags (the {@code flags} column of the port's CSV file, flag
 * names joined by '|', named by the manifest's glossary). Each hex file's SHA-256 is checked against the manifest
 * before it is used.
 */
public final class GoldenSet {

    /** One port's files. */
    public record PortFiles(String port, FieldLayout layout, long count, Path hex, Path csv, List<String> flagNames) {
        /** The vectors' flags, streamed from the CSV file (none when the set has no CSV for the port). */
        public VectorFlags flags() {
            return csv == null ? VectorFlags.NONE : new CsvFlags(csv, flagNames);
        }
    }

    private final Path folder;
    private final Map<String, PortFiles> ports;

    private GoldenSet(Path folder, Map<String, PortFiles> ports) {
        this.folder = folder;
        this.ports = ports;
    }

    /**
     * Opens a set folder and checks its manifest.
     *
     * @throws IllegalArgumentException naming the manifest key or file that is wrong
     */
    public static GoldenSet open(Path folder) {
        Path manifestFile = folder.resolve(Manifest.FILE_NAME);
        if (!Files.isRegularFile(manifestFile)) {
            throw new IllegalArgumentException(folder + ": not a vector set folder (no " + Manifest.FILE_NAME + ")");
        }
        Manifest manifest;
        try {
            manifest = Manifest.read(Files.readString(manifestFile, StandardCharsets.UTF_8), manifestFile.toString());
        } catch (IOException e) {
            throw new IllegalArgumentException(manifestFile + ": cannot be read: " + e.getMessage());
        }
        List<String> flagNames = glossary(manifest.json().path("flags"), manifestFile);
        Map<String, Path> csvOfPort = new LinkedHashMap<>();
        for (Manifest.Entry f : manifest.files()) {
            if ("csv".equals(f.format())) {
                csvOfPort.putIfAbsent(f.port(), folder.resolve(f.name()));
            }
        }
        Map<String, PortFiles> ports = new LinkedHashMap<>();
        List<Manifest.Entry> files = manifest.files();
        for (int i = 0; i < files.size(); i++) {
            Manifest.Entry f = files.get(i);
            if (!"hex".equals(f.format())) {
                continue;
            }
            String at = manifestFile + ": files[" + i + "]";
            Path hex = folder.resolve(f.name());
            FieldLayout layout = layout(f.layout(), at + ".layout");
            if (!Files.isRegularFile(hex)) {
                throw new IllegalArgumentException(at + ": file " + hex + " is missing");
            }
            String actual = sha256(hex);
            if (!actual.equals(f.sha256())) {
                throw new IllegalArgumentException(hex + ": SHA-256 " + actual + " differs from the manifest's "
                        + f.sha256() + "; the golden file was modified or belongs to another set");
            }
            ports.put(f.port(), new PortFiles(f.port(), layout, f.count(), hex, csvOfPort.get(f.port()), flagNames));
        }
        if (ports.isEmpty()) {
            throw new IllegalArgumentException(manifestFile + ": files: no hex file listed; compare reads hex golden"
                    + " files");
        }
        return new GoldenSet(folder, ports);
    }

    private static List<String> glossary(JsonNode flags, Path manifest) {
        List<String> names = new ArrayList<>();
        for (JsonNode flag : flags) {
            int bit = flag.path("bit").asInt(-1);
            if (bit < 0 || bit >= 64) {
                throw new IllegalArgumentException(manifest + ": flags: bit " + flag.path("bit") + " is not 0..63");
            }
            while (names.size() <= bit) {
                names.add(null); // a bit the glossary does not name; no flag of that name can be selected
            }
            names.set(bit, flag.path("name").asText());
        }
        return Collections.unmodifiableList(names);
    }

    /** Reads a layout as the manifest writes it: {@code {"fields": [{"name", "format"}, ...]}}, most significant first. */
    static FieldLayout layout(JsonNode node, String where) {
        JsonNode fields = node.path("fields");
        if (!fields.isArray() || fields.isEmpty()) {
            throw new IllegalArgumentException(where + ".fields: expected the fields of the word, most significant"
                    + " first, each {\"name\": ..., \"format\": \"Qm.n\"}");
        }
        List<Field> list = new ArrayList<>();
        for (int i = 0; i < fields.size(); i++) {
            JsonNode field = fields.get(i);
            try {
                list.add(Field.of(field.path("name").asText(), field.path("format").asText()));
            } catch (IllegalArgumentException e) {
                throw new IllegalArgumentException(where + ".fields[" + i + "]: " + e.getMessage());
            }
        }
        try {
            return FieldLayout.of(list);
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException(where + ": " + e.getMessage());
        }
    }

    static String sha256(Path file) {
        try (InputStream in = Files.newInputStream(file)) {
            MessageDigest md = MessageDigest.getInstance("SHA-256");
            byte[] buffer = new byte[1 << 16];
            int n;
            while ((n = in.read(buffer)) > 0) {
                md.update(buffer, 0, n);
            }
            return HexFormat.of().formatHex(md.digest());
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }

    public Path folder() {
        return folder;
    }

    /** The ports with a hex golden file, in manifest order. */
    public List<String> ports() {
        return List.copyOf(ports.keySet());
    }

    /** The port's files; an unknown port is a usage error listing the set's ports. */
    public PortFiles port(String name) {
        PortFiles p = ports.get(name);
        if (p == null) {
            throw new IllegalArgumentException("port '" + name + "' is not in " + folder + "; its ports are "
                    + String.join(", ", ports.keySet()));
        }
        return p;
    }

    /** Streams the {@code flags} column of a port's CSV file: flag names joined by '|', or a flags word. */
    private static final class CsvFlags implements VectorFlags {
        private final Path csv;
        private final List<String> names;
        private BufferedReader in;
        private int column = -1;
        private long row = -1;
        private long lineNo;
        private long current;

        CsvFlags(Path csv, List<String> names) {
            this.csv = csv;
            this.names = names;
        }

        @Override
        public List<String> names() {
            return names;
        }

        @Override
        public long flagsOf(long index) {
            try {
                if (in == null) {
                    in = Files.newBufferedReader(csv, StandardCharsets.UTF_8);
                    String header = nextLine();
                    String[] cols = header == null ? new String[0] : header.split(",", -1);
                    for (int c = 0; c < cols.length; c++) {
                        if (cols[c].trim().equals("flags")) {
                            column = c;
                        }
                    }
                    if (column < 0) {
                        throw new DumpFormatException(csv + ":" + lineNo + ": no 'flags' column in the header");
                    }
                }
                while (row < index) {
                    String line = nextLine();
                    if (line == null) {
                        in.close();
                        throw new DumpFormatException(csv + ": ends after " + (row + 1) + " rows; the hex file has"
                                + " more vectors");
                    }
                    row++;
                    String[] cells = line.split(",", -1);
                    String cell = column < cells.length ? cells[column].trim() : "";
                    current = parseFlags(cell);
                }
                return current;
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        }

        /** A cell is flag names joined by '|' (empty: none), or a flags word in decimal or 0x-hex. */
        private long parseFlags(String cell) {
            if (cell.isEmpty()) {
                return 0;
            }
            char c = cell.charAt(0);
            if (c >= '0' && c <= '9') {
                try {
                    return cell.startsWith("0x") ? Long.parseUnsignedLong(cell.substring(2), 16) : Long.parseLong(cell);
                } catch (NumberFormatException e) {
                    throw new DumpFormatException(csv + ":" + lineNo + ": flags '" + cell
                            + "' is neither a flags word nor flag names joined by '|'");
                }
            }
            long bits = 0;
            for (String name : cell.split("\\|", -1)) {
                int bit = names.indexOf(name.trim());
                if (bit < 0) {
                    throw new DumpFormatException(csv + ":" + lineNo + ": flag '" + name
                            + "' is not in the manifest's glossary");
                }
                bits |= 1L << bit;
            }
            return bits;
        }

        @Override
        public void close() {
            try {
                if (in != null) {
                    in.close();
                }
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        }

        private String nextLine() throws IOException {
            String s;
            while ((s = in.readLine()) != null) {
                lineNo++;
                if (!s.isBlank() && !s.startsWith("#")) {
                    return s;
                }
            }
            return null;
        }
    }
}
