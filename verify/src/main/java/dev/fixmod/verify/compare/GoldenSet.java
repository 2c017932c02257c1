package dev.fixmod.verify.compare;

import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.fixmod.fixed.QFormat;
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
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * A golden vector set folder as compare needs it: per port, the hex file, its word layout and count from the
 * manifest, and the vectors' corner-case flags (the {@code flags} column of the port's CSV file, named by the
 * manifest's glossary). Each hex file's SHA-256 is checked against the manifest before it is used.
 */
public final class GoldenSet {
    private static final String MANIFEST = "manifest.json";
    private static final String SCHEMA = "fixmod-vector-set";

    /** One port's files. */
    public record PortFiles(String port, WordLayout layout, long count, Path hex, Path csv, List<String> flagNames) {
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
        Path manifest = folder.resolve(MANIFEST);
        if (!Files.isRegularFile(manifest)) {
            throw new IllegalArgumentException(folder + ": not a vector set folder (no " + MANIFEST + ")");
        }
        JsonNode root;
        try {
            root = new ObjectMapper().enable(JsonParser.Feature.STRICT_DUPLICATE_DETECTION)
                    .readTree(manifest.toFile());
        } catch (IOException e) {
            throw new IllegalArgumentException(manifest + ": not valid JSON: " + (e instanceof JsonProcessingException j
                    ? j.getOriginalMessage() : e.getMessage()).split("\n", 2)[0]);
        }
        if (root == null || !SCHEMA.equals(root.path("schema").asText())) {
            throw new IllegalArgumentException(manifest + ": schema: expected \"" + SCHEMA + "\"");
        }
        List<String> flagNames = glossary(root, manifest);
        Map<String, Path> csvOfPort = new LinkedHashMap<>();
        JsonNode files = root.path("files");
        for (JsonNode f : files) {
            if ("csv".equals(f.path("format").asText())) {
                csvOfPort.put(f.path("port").asText(), folder.resolve(plain(f.path("name").asText(), manifest)));
            }
        }
        Map<String, PortFiles> ports = new LinkedHashMap<>();
        for (int i = 0; i < files.size(); i++) {
            JsonNode f = files.get(i);
            if (!"hex".equals(f.path("format").asText())) {
                continue;
            }
            String at = manifest + ": files[" + i + "]";
            String port = f.path("port").asText();
            Path hex = folder.resolve(plain(f.path("name").asText(), manifest));
            WordLayout layout = layout(f.path("layout"), at + ".layout");
            String sha = f.path("sha256").asText();
            if (!Files.isRegularFile(hex)) {
                throw new IllegalArgumentException(at + ": file " + hex + " is missing");
            }
            String actual = sha256(hex);
            if (!actual.equals(sha)) {
                throw new IllegalArgumentException(hex + ": SHA-256 " + actual + " differs from the manifest's " + sha
                        + "; the golden file was modified or belongs to another set");
            }
            ports.put(port, new PortFiles(port, layout, f.path("count").asLong(), hex, csvOfPort.get(port),
                    flagNames));
        }
        if (ports.isEmpty()) {
            throw new IllegalArgumentException(manifest + ": files: no hex file listed; compare reads hex golden files");
        }
        return new GoldenSet(folder, ports);
    }

    private static String plain(String name, Path manifest) {
        if (!name.matches("[A-Za-z0-9_][A-Za-z0-9_.-]*") || name.contains("..")) {
            throw new IllegalArgumentException(manifest + ": file name '" + name + "' is not a plain name in the set");
        }
        return name;
    }

    private static List<String> glossary(JsonNode root, Path manifest) {
        List<String> names = new ArrayList<>();
        for (JsonNode flag : root.path("flags")) {
            int bit = flag.path("bit").asInt(-1);
            if (bit < 0 || bit >= 64) {
                throw new IllegalArgumentException(manifest + ": flags: bit " + flag.path("bit") + " is not 0..63");
            }
            while (names.size() <= bit) {
                names.add(null); // a bit the glossary does not name; no flag of that name can be selected
            }
            names.set(bit, flag.path("name").asText());
        }
        return java.util.Collections.unmodifiableList(names);
    }

    /** Reads a layout given as "name:Qm.n,..." or as an array of {name, format} objects, most significant first. */
    static WordLayout layout(JsonNode node, String where) {
        try {
            if (node.isTextual()) {
                return WordLayout.parse(node.asText());
            }
            JsonNode fields = node.isObject() ? node.path("fields") : node;
            if (fields.isArray() && fields.size() > 0) {
                List<String> names = new ArrayList<>();
                List<QFormat> formats = new ArrayList<>();
                for (JsonNode field : fields) {
                    names.add(field.path("name").asText());
                    formats.add(QFormat.parse(field.path(field.has("q-format") ? "q-format" : "format").asText()));
                }
                return WordLayout.of(names, formats);
            }
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException(where + ": " + e.getMessage());
        }
        throw new IllegalArgumentException(where + ": expected the fields of the word, most significant first");
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
