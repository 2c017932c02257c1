package dev.fixmod.verify.vectors;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.StreamReadFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.json.JsonMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Pattern;

/**
 * A vector set's manifest, {@code manifest.json}: schema and version, tool version, the full canonical
 * specification, the flags glossary, the LLR sign used and, per file, its port, format, field layout, count and
 * SHA-256. The {@link #json() JSON tree} is the whole manifest; the accessors read the parts the checker needs.
 */
public final class Manifest {
    /** The manifest's schema name. */
    public static final String SCHEMA = "fixmod-vector-set";
    /** The manifest schema version; a breaking change bumps it. */
    public static final int VERSION = 1;
    /** The manifest's file name inside a set. */
    public static final String FILE_NAME = "manifest.json";

    /** A plain file name: no separators, no "..", not hidden, printable ASCII. */
    private static final Pattern PLAIN_NAME = Pattern.compile("[A-Za-z0-9_][A-Za-z0-9_.-]{0,127}");

    static final ObjectMapper JSON = JsonMapper.builder()
            .enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION)
            .enable(SerializationFeature.INDENT_OUTPUT)
            .build();

    /** One data file of the set as the manifest lists it. */
    public record Entry(String name, String port, String format, long count, String sha256, JsonNode layout) {
    }

    private final ObjectNode json;
    private final List<Entry> entries;

    private Manifest(ObjectNode json, List<Entry> entries) {
        this.json = json;
        this.entries = List.copyOf(entries);
    }

    /** The manifest tree, in the key order it is written in. */
    public ObjectNode json() {
        return json.deepCopy();
    }

    /** The files listed, in the manifest's order. */
    public List<Entry> files() {
        return entries;
    }

    /** The canonical specification recorded in the manifest. */
    public JsonNode spec() {
        return json.get("spec");
    }

    /** The manifest as UTF-8 text with a final newline (two-space indentation, '\n' line ends). */
    public String text() {
        try {
            return JSON.writerWithDefaultPrettyPrinter().writeValueAsString(json).replace("\r\n", "\n") + "\n";
        } catch (JsonProcessingException e) {
            throw new IllegalStateException(e);
        }
    }

    /** Wraps a manifest tree built by the generator (already in order). */
    static Manifest of(ObjectNode json) {
        return parse(json, "manifest");
    }

    /**
     * Reads a manifest's text; {@code source} names it in messages.
     *
     * @throws IllegalArgumentException naming the key that is missing or wrong
     */
    public static Manifest read(String text, String source) {
        JsonNode root;
        try {
            root = JSON.readTree(text);
        } catch (JsonProcessingException e) {
            throw new IllegalArgumentException(source + ": not valid JSON: " + e.getOriginalMessage());
        }
        if (root == null || !root.isObject()) {
            throw new IllegalArgumentException(source + ": expected a JSON object");
        }
        return parse((ObjectNode) root, source);
    }

    private static Manifest parse(ObjectNode root, String source) {
        String schema = text(root, "schema", source);
        if (!schema.equals(SCHEMA)) {
            throw new IllegalArgumentException(source + ": schema: '" + schema + "' is not a vector set manifest;"
                    + " expected \"" + SCHEMA + "\"");
        }
        if (!root.path("version").isInt() || root.get("version").asInt() != VERSION) {
            throw new IllegalArgumentException(source + ": version: " + root.path("version")
                    + " is not supported; this tool reads version " + VERSION);
        }
        if (!root.path("spec").isObject()) {
            throw new IllegalArgumentException(source + ": spec: the canonical specification is missing");
        }
        JsonNode files = root.get("files");
        if (files == null || !files.isArray()) {
            throw new IllegalArgumentException(source + ": files: expected an array of file entries");
        }
        List<Entry> list = new ArrayList<>();
        for (int i = 0; i < files.size(); i++) {
            JsonNode f = files.get(i);
            String at = "files[" + i + "]";
            if (!f.isObject()) {
                throw new IllegalArgumentException(source + ": " + at + ": expected an object");
            }
            String name = text(f, "name", source + ": " + at);
            requirePlainName(name, source + ": " + at + ".name");
            String sha = text(f, "sha256", source + ": " + at);
            if (!sha.matches("[0-9a-f]{64}")) {
                throw new IllegalArgumentException(source + ": " + at + ".sha256: expected 64 lowercase hex digits");
            }
            if (!f.path("count").canConvertToLong() || !f.path("count").isIntegralNumber() || f.get("count").asLong() < 0) {
                throw new IllegalArgumentException(source + ": " + at + ".count: expected an integer >= 0");
            }
            for (Entry e : list) {
                if (e.name().equals(name)) {
                    throw new IllegalArgumentException(source + ": " + at + ".name: '" + name + "' is listed twice");
                }
            }
            list.add(new Entry(name, text(f, "port", source + ": " + at), text(f, "format", source + ": " + at),
                    f.get("count").asLong(), sha, f.path("layout")));
        }
        return new Manifest(root, list);
    }

    /**
     * Rejects any name that is not a plain file name inside the set: absolute paths, separators, "..", hidden files.
     */
    static void requirePlainName(String name, String where) {
        if (!PLAIN_NAME.matcher(name).matches() || name.contains("..") || name.equals(FILE_NAME)) {
            throw new IllegalArgumentException(where + ": '" + name + "' is not a plain file name inside the set;"
                    + " expected letters, digits, '_', '-', '.' (no '/', '\\', '..', no leading '.')");
        }
    }

    private static String text(JsonNode node, String key, String where) {
        JsonNode v = node.get(key);
        if (v == null || !v.isTextual()) {
            throw new IllegalArgumentException(where + ": " + key + ": expected a string");
        }
        return v.asText();
    }

    /** Adds the glossary of flags to {@code manifest}. */
    static void putGlossary(ObjectNode manifest) {
        ArrayNode flags = manifest.putArray("flags");
        for (CornerFlag f : CornerFlag.values()) {
            ObjectNode o = flags.addObject();
            o.put("bit", f.bit());
            o.put("name", f.tradeName());
            o.put("meaning", f.meaning());
        }
    }
}
