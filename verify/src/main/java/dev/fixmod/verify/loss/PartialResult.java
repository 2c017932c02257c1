package dev.fixmod.verify.loss;

import com.fasterxml.jackson.core.JsonEncoding;
import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.StreamReadFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.json.JsonMapper;
import dev.fixmod.bits.BitPacking;
import java.io.IOException;
import java.io.OutputStream;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Map;

/**
 * The result of one shard: the specification's text (so a merge needs nothing else and refuses parts of different
 * specifications), the shard number, and its raw points. Doubles are stored in hexadecimal ({@code 0x1.8p-3}), which
 * reads back bit for bit, so a merged report equals an unsharded one byte for byte.
 *
 * @param shard 1-based
 */
public record PartialResult(String specText, String specSource, int shard, int shards, List<PointResult> points) {
    public static final String SCHEMA = "fixmod-loss-partial";
    public static final int VERSION = 1;
    /** The most shards a run is split into: {@code fixmod loss --shard I/N} takes N of up to six digits. */
    public static final int MAX_SHARDS = 999_999;
    private static final List<String> TOP_KEYS =
            List.of("schema", "version", "shard", "shards", "spec-source", "spec", "points");
    private static final List<String> POINT_KEYS = List.of("design", "snr", "symbols", "bits-per-symbol",
            "float-bit-errors", "float-symbol-errors", "fixed-bit-errors", "fixed-symbol-errors", "float-gmi",
            "min-code", "max-code", "histogram", "input-error-energy", "input-samples", "input-clips",
            "metric-events", "scale-events", "output-events");
    private static final ObjectMapper MAPPER =
            JsonMapper.builder().enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION).build();

    public PartialResult {
        points = List.copyOf(points);
    }

    public void write(OutputStream out) throws IOException {
        try (JsonGenerator g = new JsonFactory().createGenerator(out, JsonEncoding.UTF8)) {
            g.writeStartObject();
            g.writeStringField("schema", SCHEMA);
            g.writeNumberField("version", VERSION);
            g.writeNumberField("shard", shard);
            g.writeNumberField("shards", shards);
            g.writeStringField("spec-source", specSource);
            g.writeStringField("spec", specText);
            g.writeArrayFieldStart("points");
            for (PointResult p : points) {
                g.writeStartObject();
                g.writeNumberField("design", p.design());
                g.writeNumberField("snr", p.snr());
                g.writeNumberField("symbols", p.symbols());
                g.writeNumberField("bits-per-symbol", p.bitsPerSymbol());
                g.writeNumberField("float-bit-errors", p.floatBitErrors());
                g.writeNumberField("float-symbol-errors", p.floatSymbolErrors());
                g.writeNumberField("fixed-bit-errors", p.fixedBitErrors());
                g.writeNumberField("fixed-symbol-errors", p.fixedSymbolErrors());
                g.writeStringField("float-gmi", Double.toHexString(p.floatGmi()));
                g.writeNumberField("min-code", p.minCode());
                g.writeNumberField("max-code", p.maxCode());
                long[] h = p.histogram();
                g.writeFieldName("histogram");
                g.writeArray(h, 0, h.length);
                g.writeStringField("input-error-energy", Double.toHexString(p.inputErrorEnergy()));
                g.writeNumberField("input-samples", p.inputSamples());
                g.writeNumberField("input-clips", p.inputClips());
                g.writeNumberField("metric-events", p.metricEvents());
                g.writeNumberField("scale-events", p.scaleEvents());
                g.writeNumberField("output-events", p.outputEvents());
                g.writeEndObject();
            }
            g.writeEndArray();
            g.writeEndObject();
            g.writeRaw('\n');
        }
    }

    /**
     * Reads a partial result written by {@link #write}, strictly: every key must be present with the type and range
     * the writer gives it; no key may be added.
     *
     * @throws IllegalArgumentException naming {@code source}, the line and column, the key's path (e.g.
     *                                  {@code points[3].float-bit-errors}) and what was expected
     */
    public static PartialResult read(String text, String source) {
        JsonNode root = LossSpecReader.readTree(MAPPER, text, source);
        if (root == null || !root.isObject() || !SCHEMA.equals(root.path("schema").asText())) {
            throw new IllegalArgumentException(source + ": not a partial loss result (schema \"" + SCHEMA
                    + "\" expected); give the files written by 'fixmod loss SPEC --shard i/n -o FILE'");
        }
        return new Reader(text, source).read(root);
    }

    /** The strict reading of one file; knows the text only to place a message. */
    private static final class Reader {
        private final String text;
        private final String source;

        Reader(String text, String source) {
            this.text = text;
            this.source = source;
        }

        PartialResult read(JsonNode root) {
            allow(root, "", "a partial result", TOP_KEYS);
            JsonNode version = present(root, "", "version", "the integer " + VERSION);
            if (!version.isIntegralNumber()) {
                throw error("/version", "expected the integer " + VERSION + ", got " + LossSpecReader.kind(version));
            }
            if (!version.canConvertToInt() || version.asInt() != VERSION) {
                throw new IllegalArgumentException(source + ": version " + version.asText()
                        + " is not supported; this tool reads version " + VERSION);
            }
            int shard = (int) integer(root, "", "shard", 1, MAX_SHARDS);
            int shards = (int) integer(root, "", "shards", 1, MAX_SHARDS);
            String specSource = string(root, "", "spec-source");
            String spec = string(root, "", "spec");
            JsonNode array = present(root, "", "points", "an array of points");
            if (!array.isArray()) {
                throw error("/points", "expected an array of points, got " + LossSpecReader.kind(array));
            }
            List<PointResult> points = new ArrayList<>();
            for (int i = 0; i < array.size(); i++) {
                points.add(point(array.get(i), "/points/" + i));
            }
            return new PartialResult(spec, specSource, shard, shards, points);
        }

        private PointResult point(JsonNode p, String at) {
            if (!p.isObject()) {
                throw error(at, "expected a point {\"design\": ..., ...}, got " + LossSpecReader.kind(p));
            }
            allow(p, at, "a point", POINT_KEYS);
            int design = (int) integer(p, at, "design", 0, Integer.MAX_VALUE);
            int snr = (int) integer(p, at, "snr", 0, Integer.MAX_VALUE);
            long symbols = count(p, at, "symbols");
            long bitsPerSymbol = integer(p, at, "bits-per-symbol", 1, BitPacking.MAX_BITS_PER_LABEL);
            long floatBitErrors = count(p, at, "float-bit-errors");
            long floatSymbolErrors = count(p, at, "float-symbol-errors");
            long fixedBitErrors = count(p, at, "fixed-bit-errors");
            long fixedSymbolErrors = count(p, at, "fixed-symbol-errors");
            double floatGmi = hexDouble(p, at, "float-gmi");
            int minCode = (int) integer(p, at, "min-code", Integer.MIN_VALUE, Integer.MAX_VALUE);
            int maxCode = (int) integer(p, at, "max-code", minCode, Integer.MAX_VALUE);
            long[] histogram = histogram(p, at, bitsPerSymbol * 2 * ((long) maxCode - minCode + 1));
            double inputErrorEnergy = hexDouble(p, at, "input-error-energy");
            return new PointResult(design, snr, symbols, bitsPerSymbol, floatBitErrors, floatSymbolErrors,
                    fixedBitErrors, fixedSymbolErrors, floatGmi, minCode, maxCode, histogram, inputErrorEnergy,
                    count(p, at, "input-samples"), count(p, at, "input-clips"), count(p, at, "metric-events"),
                    count(p, at, "scale-events"), count(p, at, "output-events"));
        }

        private void allow(JsonNode object, String at, String what, List<String> keys) {
            for (Iterator<String> it = object.fieldNames(); it.hasNext(); ) {
                String k = it.next();
                if (!keys.contains(k)) {
                    throw error(at + "/" + k.replace("~", "~0").replace("/", "~1"), "unknown key \"" + k + "\"; "
                            + what + " has " + String.join(", ", keys) + " (was it edited?)");
                }
            }
        }

        private long[] histogram(JsonNode p, String at, long cells) {
            String path = at + "/histogram";
            JsonNode h = present(p, at, "histogram", "an array of counts");
            if (!h.isArray()) {
                throw error(path, "expected an array of counts, got " + LossSpecReader.kind(h));
            }
            if (h.size() != cells) {
                throw error(path, h.size() + " counts; expected " + cells
                        + " (bits-per-symbol x 2 x (max-code - min-code + 1))");
            }
            long[] counts = new long[h.size()];
            for (int i = 0; i < counts.length; i++) {
                counts[i] = integer(h.get(i), path + "/" + i, 0, Long.MAX_VALUE);
            }
            return counts;
        }

        private long count(JsonNode parent, String at, String key) {
            return integer(parent, at, key, 0, Long.MAX_VALUE);
        }

        private long integer(JsonNode parent, String at, String key, long min, long max) {
            return integer(present(parent, at, key, integers(min, max)), at + "/" + key, min, max);
        }

        private long integer(JsonNode n, String path, long min, long max) {
            if (!n.isIntegralNumber() || !n.canConvertToLong() || n.asLong() < min || n.asLong() > max) {
                throw error(path, "expected " + integers(min, max) + ", got " + LossSpecReader.kind(n));
            }
            return n.asLong();
        }

        private static String integers(long min, long max) {
            return "an integer from " + min + " to " + max;
        }

        private String string(JsonNode parent, String at, String key) {
            JsonNode n = present(parent, at, key, "a string");
            if (!n.isTextual()) {
                throw error(at + "/" + key, "expected a string, got " + LossSpecReader.kind(n));
            }
            return n.asText();
        }

        /** A double as {@link #write} stores it: the exact text of {@link Double#toHexString}. */
        private double hexDouble(JsonNode parent, String at, String key) {
            String expected = "a double in hexadecimal as fixmod writes it (e.g. \"0x1.8p-3\")";
            JsonNode n = present(parent, at, key, expected);
            if (n.isTextual()) {
                try {
                    double v = Double.parseDouble(n.asText());
                    if (Double.toHexString(v).equals(n.asText())) {
                        return v;
                    }
                } catch (NumberFormatException notADouble) {
                    // reported below
                }
            }
            throw error(at + "/" + key, "expected " + expected + ", got " + LossSpecReader.kind(n));
        }

        private JsonNode present(JsonNode parent, String at, String key, String expected) {
            JsonNode n = parent.get(key);
            if (n == null) {
                throw error(at + "/" + key, "missing key; expected " + expected);
            }
            return n;
        }

        /** Placed at the key's value, or at its parent for a missing key; the root is the top of the file. */
        private IllegalArgumentException error(String pointer, String message) {
            Map<String, JsonLocation> locations = LossSpecReader.locate(text);
            String placed = pointer;
            while (!locations.containsKey(placed) && !placed.isEmpty()) {
                placed = placed.substring(0, placed.lastIndexOf('/'));
            }
            JsonLocation at = locations.get(placed);
            String where = at == null ? source : source + ":" + at.getLineNr() + ":" + at.getColumnNr();
            return new IllegalArgumentException(where + ": " + LossSpecReader.display(pointer) + ": " + message);
        }
    }
}
