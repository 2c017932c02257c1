package dev.fixmod.verify.vectors;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.core.StreamReadFeature;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.json.JsonMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.fixmod.bits.Prbs;
import dev.fixmod.names.TradeNamed;
import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Normalization;
import dev.fixmod.demap.FixedLlrSpec;
import dev.fixmod.demap.FixedSoftDemapper;
import dev.fixmod.demap.LlrOptions;
import dev.fixmod.demap.LlrScaling;
import dev.fixmod.demap.LlrSign;
import dev.fixmod.demap.SoftAlgorithm;
import dev.fixmod.demap.SoftDemapper;
import dev.fixmod.map.ConstellationRom;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import dev.fixmod.verify.formats.FileFormat;
import java.io.IOException;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.HashMap;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.function.Function;

/**
 * Reads a specification file into a {@link VectorSpec}, filling every default. Strict: duplicate keys, unknown keys,
 * wrong types, non-finite numbers and values outside their sets are rejected with a {@link SpecException} naming the
 * source, line and column, the JSON path of the offending key and what would be accepted. A spec may be as short as
 * <pre>{"constellation": "nr:qam16"}</pre>
 */
public final class SpecReader {

    private static final ObjectMapper MAPPER = JsonMapper.builder()
            .enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION)
            .enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
            .build();

    /** Largest count accepted: a bound on the files' size, not on memory (generation is streamed). */
    public static final long MAX_COUNT = 1_000_000_000L;

    private static final List<String> GAUSSIANS = List.of("box-muller", "ziggurat");

    private final String source;
    private final Map<String, JsonLocation> locations;
    private final Function<VectorSpec.ConstellationChoice, Constellation> constellationCheck;
    private Constellation resolved;

    private SpecReader(String source, Map<String, JsonLocation> locations,
            Function<VectorSpec.ConstellationChoice, Constellation> constellationCheck) {
        this.source = source;
        this.locations = locations;
        this.constellationCheck = constellationCheck;
    }

    /**
     * Parses {@code text}; {@code source} names it in messages (usually the file name). The constellation is
     * checked by {@link ConstellationResolver#resolve}.
     */
    public static VectorSpec parse(String text, String source) {
        return parse(text, source, ConstellationResolver::resolve);
    }

    static VectorSpec parse(String text, String source, Function<VectorSpec.ConstellationChoice, Constellation> constellationCheck) {
        JsonNode root;
        try {
            root = MAPPER.readTree(text);
        } catch (JsonProcessingException e) {
            JsonLocation at = e.getLocation();
            String where = at == null ? source : source + ":" + at.getLineNr() + ":" + at.getColumnNr();
            String why = e.getOriginalMessage();
            int hint = why.indexOf(": enable `");
            if (hint >= 0) {
                why = why.substring(0, hint) + "; numbers must be finite decimals";
            }
            throw new SpecException(where + ": not valid JSON: " + why);
        }
        if (root == null || root.isMissingNode()) {
            throw new SpecException(source + ": empty specification; expected a JSON object such as"
                    + " {\"constellation\": \"qam16\"}");
        }
        return new SpecReader(source, locate(text), constellationCheck).read(root);
    }

    /** Maps each JSON pointer of the document to where its key (or array element) starts. */
    private static Map<String, JsonLocation> locate(String text) {
        Map<String, JsonLocation> map = new HashMap<>();
        try (JsonParser p = new JsonFactory().createParser(text)) {
            JsonToken t;
            while ((t = p.nextToken()) != null) {
                if (t == JsonToken.END_OBJECT || t == JsonToken.END_ARRAY) {
                    continue;
                }
                String pointer = p.getParsingContext().pathAsPointer().toString();
                map.putIfAbsent(pointer, p.currentTokenLocation());
            }
        } catch (IOException e) {
            throw new SpecException("cannot read the specification: " + e.getMessage());
        }
        return map;
    }

    private VectorSpec read(JsonNode root) {
        ObjectNode top = object(root, "");
        allow(top, "", "schema", "version", "name", "description", "constellation", "mapper", "demapper", "bits",
                "noise", "count", "corner-cases", "formats");
        String schema = string(top, "", "schema", VectorSpec.SCHEMA);
        if (!schema.equals(VectorSpec.SCHEMA)) {
            throw error("/schema", "'" + schema + "' is not this tool's schema; expected \"" + VectorSpec.SCHEMA + "\"");
        }
        long version = integer(top, "", "version", VectorSpec.VERSION, 1, Integer.MAX_VALUE);
        if (version != VectorSpec.VERSION) {
            throw error("/version", "version " + version + " is not supported; this tool reads version "
                    + VectorSpec.VERSION);
        }
        string(top, "", "description", "");
        VectorSpec.ConstellationChoice constellation = constellation(top);
        String name = string(top, "", "name", constellation.name().replace(':', '-'));
        if (!name.matches("[A-Za-z][A-Za-z0-9_-]{0,39}")) {
            throw error("/name", "'" + name + "' is not a set name; expected a letter then up to 39 letters, digits,"
                    + " '_' or '-' (it becomes part of C and VHDL identifiers)");
        }
        Quantizer mapper = quantizer(top, "", "mapper", "Q1.14", Rounding.HALF_EVEN, Overflow.SATURATE);
        VectorSpec.BitSource bits = bits(top);
        VectorSpec.Noise noise = noise(top);
        VectorSpec.Demapper demapper = demapper(top, noise);
        long count = integer(top, "", "count", 256, 0, MAX_COUNT);
        Set<CornerGroup> corners = nameSet(top, "", "corner-cases", CornerGroup.class);
        Set<FileFormat> formats = formats(top);
        return new VectorSpec(name, constellation, mapper, demapper, bits, noise, count, corners, formats);
    }

    private VectorSpec.ConstellationChoice constellation(ObjectNode top) {
        String p = "/constellation";
        JsonNode node = top.get("constellation");
        String name = "qam16";
        String labeling = ConstellationResolver.DEFAULT_LABELING;
        Normalization normalization = Normalization.UNIT_ENERGY;
        double phase = 0;
        if (node != null && node.isTextual()) {
            name = node.asText();
        } else if (node != null) {
            if (!node.isObject()) {
                throw error(p, "expected a constellation name such as \"nr:qam16\" or an object {\"name\": ...},"
                        + " got " + kind(node));
            }
            ObjectNode c = object(node, p);
            allow(c, p, "name", "labeling", "normalization", "phase-offset-degrees");
            name = string(c, p, "name", name);
            labeling = string(c, p, "labeling", labeling);
            normalization = named(c, p, "normalization", normalization.tradeName(), Normalization::fromName);
            phase = number(c, p, "phase-offset-degrees", 0.0);
        }
        VectorSpec.ConstellationChoice choice = new VectorSpec.ConstellationChoice(name, labeling, normalization,
                phase);
        try {
            resolved = constellationCheck.apply(choice);
        } catch (IllegalArgumentException e) {
            String at = node == null || node.isTextual() ? p
                    : e.getMessage().contains("label") && node.has("labeling") ? p + "/labeling"
                    : e.getMessage().contains("phase") && node.has("phase-offset-degrees") ? p + "/phase-offset-degrees"
                    : node.has("name") ? p + "/name" : p;
            throw error(at, e.getMessage());
        }
        return choice;
    }

    private VectorSpec.Demapper demapper(ObjectNode top, VectorSpec.Noise noise) {
        String p = "/demapper";
        ObjectNode d = optionalObject(top, "", "demapper");
        allow(d, p, "input", "algorithm", "reference", "scaling", "design-es-n0-db", "constant-rounding", "metric",
                "scale-constant", "scale", "llr", "llr-sign");
        Quantizer input = quantizer(d, p, "input", "Q2.9", Rounding.HALF_EVEN, Overflow.SATURATE);
        SoftAlgorithm algorithm = named(d, p, "algorithm", "max-log", SoftAlgorithm::fromName);
        if (algorithm == SoftAlgorithm.LOG_MAP) {
            throw error(p + "/algorithm", "log-map has no fixed-point datapath; expected max-log, max-log-per-axis"
                    + " or folded-linear (log-map may be the float reference: key \"reference\")");
        }
        SoftAlgorithm reference = named(d, p, "reference", algorithm.tradeName(), SoftAlgorithm::fromName);
        LlrScaling scaling = named(d, p, "scaling", LlrScaling.NOISE_SCALED.tradeName(), LlrScaling::fromName);
        double design = number(d, p, "design-es-n0-db", 10.0);
        if (design < -50 || design > 100) {
            throw error(p + "/design-es-n0-db", design + " dB is out of range; expected -50 to 100 dB");
        }
        Rounding constants = named(d, p, "constant-rounding", Rounding.HALF_EVEN.tradeName(), Rounding::fromName);
        LlrSign sign = named(d, p, "llr-sign", LlrSign.ZERO_POSITIVE.tradeName(), LlrSign::fromName);
        Quantizer llr = quantizer(d, p, "llr", "Q5.0", Rounding.HALF_EVEN, Overflow.SYMMETRIC_SATURATE);
        QFormat outputFormat = llr.format();
        int k = resolved.bitsPerSymbol();
        if (k * outputFormat.wordLength() > 64) {
            throw error(d.has("llr") ? p + "/llr/format" : p + "/llr", k + " LLRs of " + outputFormat.wordLength()
                    + " bits make a " + k * outputFormat.wordLength() + "-bit word; the LLR port holds at most 64"
                    + " bits, so use at most " + 64 / k + "-bit LLRs for " + resolved.name());
        }
        // The suggested stages are sized for the largest K the set uses (the smallest N0 of any level).
        double esN0 = design;
        for (int l = 0; l < noise.levelsDb().size(); l++) {
            esN0 = Math.max(esN0, noise.esN0Db(l, k));
        }
        LlrOptions options = LlrOptions.fromEsN0Db(resolved, esN0, sign, false);
        FixedLlrSpec suggested;
        ConstellationRom points;
        try {
            points = ConstellationRom.of(resolved, new Quantizer(input.format(), constants, Overflow.SATURATE));
            suggested = FixedLlrSpec.suggested(algorithm, points, options, outputFormat);
        } catch (IllegalArgumentException e) {
            throw error(d.has("algorithm") ? p + "/algorithm" : p, e.getMessage());
        }
        Quantizer metric = quantizer(d, p, "metric", suggested.metric().format().toString(),
                suggested.metric().rounding(), suggested.metric().overflow());
        QFormat scaleConstant = null;
        Quantizer scale = null;
        if (scaling == LlrScaling.NOISE_SCALED) {
            String kf = string(d, p, "scale-constant", suggested.scaleConstant().toString());
            try {
                scaleConstant = QFormat.parse(kf);
            } catch (IllegalArgumentException e) {
                throw error(p + "/scale-constant", e.getMessage());
            }
            scale = quantizer(d, p, "scale", suggested.scale().format().toString(), suggested.scale().rounding(),
                    suggested.scale().overflow());
        } else {
            for (String key : new String[] {"scale-constant", "scale"}) {
                if (d.has(key)) {
                    throw error(p + "/" + key, "an unscaled datapath has no " + key + "; remove the key or use"
                            + " \"scaling\": \"noise-scaled\"");
                }
            }
        }
        VectorSpec.Demapper demapper = new VectorSpec.Demapper(input, algorithm, reference, scaling, design, constants,
                metric, scaleConstant, scale, llr, sign);
        // Build the datapath once for every N0 the set uses, so that a K that does not fit is reported here.
        try {
            FixedLlrSpec fixed = demapper.fixedSpec();
            List<Double> levels = new ArrayList<>();
            levels.add(design);
            for (int l = 0; l < noise.levelsDb().size(); l++) {
                levels.add(noise.esN0Db(l, k));
            }
            for (double level : levels) {
                LlrOptions o = LlrOptions.fromEsN0Db(resolved, level, sign, false);
                FixedSoftDemapper.create(algorithm, points, o, fixed);
                SoftDemapper.create(reference, resolved, o);
            }
        } catch (IllegalArgumentException e) {
            throw error(p, e.getMessage());
        }
        return demapper;
    }

    private <T> T named(ObjectNode parent, String parentPath, String key, String fallback, Function<String, T> lookup) {
        String text = string(parent, parentPath, key, fallback);
        try {
            return lookup.apply(text);
        } catch (IllegalArgumentException e) {
            throw error(parentPath + "/" + key, e.getMessage());
        }
    }

    private VectorSpec.BitSource bits(ObjectNode top) {
        String p = "/bits";
        ObjectNode b = optionalObject(top, "", "bits");
        String src = string(b, p, "source", Prbs.PRBS_23.tradeName());
        switch (src) {
            case "constant", "alternating" -> {
                allow(b, p, "source", "value");
                long v = integer(b, p, "value", 0, 0, 1);
                return new VectorSpec.BitSource(src, 0, (int) v, "");
            }
            case "file" -> {
                allow(b, p, "source", "file");
                if (!b.has("file")) {
                    throw error(p, "source \"file\" needs the key \"file\": a text file of 0 and 1 characters,"
                            + " relative to the specification");
                }
                String file = string(b, p, "file", null);
                if (file.isBlank()) {
                    throw error(p + "/file", "empty file name; expected a path relative to the specification");
                }
                return new VectorSpec.BitSource(src, 0, 0, file);
            }
            default -> {
                Prbs prbs;
                try {
                    prbs = Prbs.fromName(src);
                } catch (IllegalArgumentException e) {
                    throw error(p + "/source", "unknown bit source '" + src + "'; expected one of " + Prbs.names()
                            + ", constant, alternating, file");
                }
                allow(b, p, "source", "seed");
                long seed = integer(b, p, "seed", prbs.defaultSeed(), 1, prbs.period());
                return new VectorSpec.BitSource(prbs.tradeName(), seed, 0, "");
            }
        }
    }

    private VectorSpec.Noise noise(ObjectNode top) {
        String p = "/noise";
        ObjectNode n = optionalObject(top, "", "noise");
        allow(n, p, "es-n0-db", "eb-n0-db", "code-rate", "seed", "gaussian");
        if (n.has("es-n0-db") && n.has("eb-n0-db")) {
            throw error(p + "/eb-n0-db", "give either es-n0-db or eb-n0-db, not both");
        }
        NoiseMeasure measure = n.has("eb-n0-db") ? NoiseMeasure.EB_N0 : NoiseMeasure.ES_N0;
        List<Double> levels = new ArrayList<>();
        String key = measure.tradeName();
        if (!n.has(key)) {
            levels.addAll(List.of(10.0, 20.0));
        } else {
            JsonNode arr = n.get(key);
            if (!arr.isArray()) {
                throw error(p + "/" + key, "expected an array of numbers in dB, e.g. [6.0, 12.0], got "
                        + kind(arr));
            }
            for (int i = 0; i < arr.size(); i++) {
                double v = finite(arr.get(i), p + "/" + key + "/" + i);
                if (v < -50 || v > 100) {
                    throw error(p + "/" + key + "/" + i, v + " dB is out of range; expected -50 to 100 dB");
                }
                levels.add(v);
            }
            if (levels.size() > 64) {
                throw error(p + "/" + key, levels.size() + " levels; at most 64 are accepted");
            }
        }
        double rate = number(n, p, "code-rate", 1.0);
        if (!(rate > 0 && rate <= 1)) {
            throw error(p + "/code-rate", rate + " is not a code rate; expected a number in (0, 1]");
        }
        long seed = integer(n, p, "seed", 1, 0, 0xFFFF_FFFFL);
        String gaussian = string(n, p, "gaussian", "box-muller");
        if (!GAUSSIANS.contains(gaussian)) {
            throw error(p + "/gaussian", "unknown Gaussian sampler '" + gaussian + "'; expected one of "
                    + String.join(", ", GAUSSIANS));
        }
        return new VectorSpec.Noise(measure, levels, rate, seed, gaussian);
    }

    private Quantizer quantizer(ObjectNode parent, String parentPath, String key, String format, Rounding rounding,
            Overflow overflow) {
        String p = parentPath + "/" + key;
        ObjectNode q = optionalObject(parent, parentPath, key);
        allow(q, p, "format", "rounding", "overflow");
        QFormat f;
        try {
            f = QFormat.parse(string(q, p, "format", format));
        } catch (SpecException e) {
            throw e;
        } catch (IllegalArgumentException e) {
            throw error(p + "/format", e.getMessage());
        }
        if (!f.isSigned()) {
            throw error(p + "/format", "'" + f + "' is unsigned; ports carry signed values, expected Qm.n or Qn");
        }
        if (f.wordLength() < 2) {
            throw error(p + "/format", "'" + f + "' has a 1-bit word; expected at least 2 bits");
        }
        Rounding r;
        try {
            r = Rounding.fromName(string(q, p, "rounding", rounding.tradeName()));
        } catch (SpecException e) {
            throw e;
        } catch (IllegalArgumentException e) {
            throw error(p + "/rounding", e.getMessage());
        }
        Overflow o;
        try {
            o = Overflow.fromName(string(q, p, "overflow", overflow.tradeName()));
        } catch (SpecException e) {
            throw e;
        } catch (IllegalArgumentException e) {
            throw error(p + "/overflow", e.getMessage());
        }
        return new Quantizer(f, r, o);
    }

    /** The default formats: one of each kind a testbench reads (the commented and packed variants on request). */
    static final Set<FileFormat> DEFAULT_FORMATS = EnumSet.of(FileFormat.HEX, FileFormat.CSV, FileFormat.BINARY,
            FileFormat.C_HEADER, FileFormat.NPY);

    private Set<FileFormat> formats(ObjectNode top) {
        String p = "/formats";
        JsonNode arr = top.get("formats");
        String accepted = java.util.Arrays.stream(FileFormat.values()).map(FileFormat::label)
                .collect(java.util.stream.Collectors.joining(", "));
        if (arr == null) {
            return DEFAULT_FORMATS;
        }
        if (!arr.isArray()) {
            throw error(p, "expected an array of names from " + accepted + ", got " + kind(arr));
        }
        EnumSet<FileFormat> set = EnumSet.noneOf(FileFormat.class);
        for (int i = 0; i < arr.size(); i++) {
            JsonNode e = arr.get(i);
            if (!e.isTextual()) {
                throw error(p + "/" + i, "expected a name from " + accepted + ", got " + kind(e));
            }
            FileFormat f;
            try {
                f = FileFormat.fromName(e.asText());
            } catch (IllegalArgumentException x) {
                throw error(p + "/" + i, "unknown format '" + e.asText() + "'; expected one of " + accepted);
            }
            if (!set.add(f)) {
                throw error(p + "/" + i, "'" + e.asText() + "' is listed twice");
            }
        }
        return set;
    }

    private <E extends Enum<E> & TradeNamed> Set<E> nameSet(ObjectNode parent, String parentPath, String key,
            Class<E> type) {
        String p = parentPath + "/" + key;
        JsonNode arr = parent.get(key);
        if (arr == null) {
            return EnumSet.allOf(type);
        }
        if (!arr.isArray()) {
            throw error(p, "expected an array of names from " + TradeNamed.names(type) + ", got " + kind(arr));
        }
        EnumSet<E> set = EnumSet.noneOf(type);
        for (int i = 0; i < arr.size(); i++) {
            JsonNode e = arr.get(i);
            if (!e.isTextual()) {
                throw error(p + "/" + i, "expected a name from " + TradeNamed.names(type) + ", got " + kind(e));
            }
            E value = TradeNamed.find(type, e.asText());
            if (value == null) {
                throw error(p + "/" + i, "unknown name '" + e.asText() + "'; expected one of "
                        + TradeNamed.names(type));
            }
            if (!set.add(value)) {
                throw error(p + "/" + i, "'" + e.asText() + "' is listed twice");
            }
        }
        return set;
    }

    private ObjectNode object(JsonNode node, String path) {
        if (!node.isObject()) {
            throw error(path, "expected a JSON object {...}, got " + kind(node));
        }
        return (ObjectNode) node;
    }

    private ObjectNode optionalObject(ObjectNode parent, String parentPath, String key) {
        JsonNode n = parent.get(key);
        return n == null ? MAPPER.createObjectNode() : object(n, parentPath + "/" + key);
    }

    private void allow(ObjectNode node, String path, String... keys) {
        Set<String> allowed = Set.of(keys);
        for (Iterator<String> it = node.fieldNames(); it.hasNext(); ) {
            String k = it.next();
            if (!allowed.contains(k)) {
                throw error(path + "/" + escape(k), "unknown key \"" + k + "\"; expected one of "
                        + String.join(", ", keys));
            }
        }
    }

    private String string(ObjectNode parent, String parentPath, String key, String fallback) {
        JsonNode n = parent.get(key);
        if (n == null) {
            return fallback;
        }
        if (!n.isTextual()) {
            throw error(parentPath + "/" + key, "expected a string, got " + kind(n));
        }
        return n.asText();
    }

    private long integer(ObjectNode parent, String parentPath, String key, long fallback, long min, long max) {
        JsonNode n = parent.get(key);
        String p = parentPath + "/" + key;
        if (n == null) {
            return fallback;
        }
        if (!n.isIntegralNumber() || !n.canConvertToLong()) {
            throw error(p, "expected an integer from " + min + " to " + max + ", got " + kind(n));
        }
        long v = n.asLong();
        if (v < min || v > max) {
            throw error(p, v + " is out of range; expected an integer from " + min + " to " + max);
        }
        return v;
    }

    private double number(ObjectNode parent, String parentPath, String key, double fallback) {
        JsonNode n = parent.get(key);
        return n == null ? fallback : finite(n, parentPath + "/" + key);
    }

    private double finite(JsonNode n, String path) {
        if (!n.isNumber()) {
            throw error(path, "expected a number, got " + kind(n));
        }
        double v = n.asDouble();
        if (!Double.isFinite(v)) {
            throw error(path, n.asText() + " is not a finite number; expected a finite decimal number");
        }
        return v;
    }

    private static String kind(JsonNode n) {
        if (n.isTextual()) {
            return "the string \"" + n.asText() + "\"";
        }
        if (n.isNumber()) {
            return "the number " + n.asText();
        }
        if (n.isBoolean()) {
            return "the boolean " + n.asText();
        }
        if (n.isNull()) {
            return "null";
        }
        return n.isArray() ? "an array" : "an object";
    }

    private static String escape(String key) {
        return key.replace("~", "~0").replace("/", "~1");
    }

    /** An error at JSON pointer {@code pointer}, located in the source text when the key is present there. */
    private SpecException error(String pointer, String message) {
        JsonLocation at = locations.get(pointer);
        String where = at == null ? source : source + ":" + at.getLineNr() + ":" + at.getColumnNr();
        return new SpecException(where + ": " + display(pointer) + ": " + message);
    }

    /** {@code /noise/es-n0-db/2} becomes {@code noise.es-n0-db[2]}; the root is {@code (top level)}. */
    static String display(String pointer) {
        if (pointer.isEmpty()) {
            return "(top level)";
        }
        StringBuilder sb = new StringBuilder();
        for (String part : pointer.substring(1).split("/", -1)) {
            String k = part.replace("~1", "/").replace("~0", "~");
            if (!k.isEmpty() && k.chars().allMatch(Character::isDigit) && sb.length() > 0) {
                sb.append('[').append(k).append(']');
            } else {
                sb.append(sb.length() == 0 ? "" : ".").append(k);
            }
        }
        return sb.toString();
    }
}
