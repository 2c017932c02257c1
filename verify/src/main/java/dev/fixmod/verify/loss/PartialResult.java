package dev.fixmod.verify.loss;

import com.fasterxml.jackson.core.JsonEncoding;
import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.OutputStream;
import java.util.ArrayList;
import java.util.List;

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
    private static final List<String> TOP_KEYS =
            List.of("schema", "version", "shard", "shards", "spec-source", "spec", "points");

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
     * Reads a partial result written by {@link #write}.
     *
     * @throws IllegalArgumentException naming {@code source} and what is wrong
     */
    public static PartialResult read(String text, String source) {
        try {
            JsonNode root = new ObjectMapper().readTree(text);
            if (root == null || !root.isObject() || !SCHEMA.equals(root.path("schema").asText())) {
                throw new IllegalArgumentException(source + ": not a partial loss result (schema \"" + SCHEMA
                        + "\" expected); give the files written by 'fixmod loss SPEC --shard i/n -o FILE'");
            }
            for (java.util.Iterator<String> it = root.fieldNames(); it.hasNext(); ) {
                String k = it.next();
                if (!TOP_KEYS.contains(k)) {
                    throw new IllegalArgumentException(source + ": unknown key \"" + k + "\"; a partial result has "
                            + String.join(", ", TOP_KEYS) + " (was it edited?)");
                }
            }
            if (root.path("version").asInt() != VERSION) {
                throw new IllegalArgumentException(source + ": version " + root.path("version").asText()
                        + " is not supported; this tool reads version " + VERSION);
            }
            List<PointResult> points = new ArrayList<>();
            for (JsonNode p : root.path("points")) {
                JsonNode h = p.path("histogram");
                long[] counts = new long[h.size()];
                for (int i = 0; i < counts.length; i++) {
                    counts[i] = h.get(i).asLong();
                }
                points.add(new PointResult(p.path("design").asInt(), p.path("snr").asInt(), p.path("symbols").asLong(),
                        p.path("bits-per-symbol").asLong(), p.path("float-bit-errors").asLong(),
                        p.path("float-symbol-errors").asLong(), p.path("fixed-bit-errors").asLong(),
                        p.path("fixed-symbol-errors").asLong(), Double.parseDouble(p.path("float-gmi").asText()),
                        p.path("min-code").asInt(), p.path("max-code").asInt(), counts,
                        Double.parseDouble(p.path("input-error-energy").asText()), p.path("input-samples").asLong(),
                        p.path("input-clips").asLong(), p.path("metric-events").asLong(),
                        p.path("scale-events").asLong(), p.path("output-events").asLong()));
            }
            return new PartialResult(root.path("spec").asText(), root.path("spec-source").asText(),
                    root.path("shard").asInt(), root.path("shards").asInt(), points);
        } catch (IOException e) {
            throw new IllegalArgumentException(source + ": not valid JSON: " + e.getMessage());
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException(source + ": a number is damaged (" + e.getMessage() + ")");
        }
    }
}
