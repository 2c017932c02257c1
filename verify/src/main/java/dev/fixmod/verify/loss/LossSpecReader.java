package dev.fixmod.verify.loss;

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
import dev.fixmod.constellation.Catalogue;
import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Labeling;
import dev.fixmod.constellation.Normalization;
import dev.fixmod.demap.FixedLlrSpec;
import dev.fixmod.demap.LlrScaling;
import dev.fixmod.demap.SoftAlgorithm;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import java.io.IOException;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.function.Function;

/**
 * Reads a loss specification (JSON) strictly: unknown or duplicate keys, wrong types and values outside their sets
 * are refused with one message naming the source, line and column, the key's path and what would be accepted. The
 * vocabulary is the vector specification's where the idea is the same ({@code constellation}, {@code mapper},
 * {@code demapper.input}, {@code demapper.algorithm}, {@code demapper.reference}, {@code demapper.scaling},
 * {@code demapper.metric}, {@code demapper.scale-constant}, {@code demapper.scale}, {@code demapper.llr},
 * {@code noise}); the rest is the loss analysis's own. The shortest spec is {@code {}}: 16-QAM, input Q2.9, max-log,
 * LLR Q5.0, internal stages as the kernel suggests. {@code demapper.rounding} is the rounding of the constants and
 * the default of every stage's. A {@code sweep} entry varies one parameter ({@code parameter}, {@code values}) or
 * crosses two ({@code grid}: two such entries; every combination is a design).
 *
 * <pre>{@code
 * {"schema": "fixmod-loss", "version": 1, "name": "nr16",
 *  "constellation": "qam16",
 *  "mapper": {"format": "Q1.14"},
 *  "demapper": {"input": {"format": "Q2.9", "rounding": "half-even", "overflow": "saturate"},
 *               "back-off-db": 3, "algorithm": "max-log", "reference": "max-log", "scaling": "noise-scaled",
 *               "metric": {"format": "Q6.12", "overflow": "saturate"}, "scale-constant": "UQ4.12",
 *               "scale": {"format": "Q7.4"}, "llr": {"format": "Q5.0"}, "llr-scale": 1, "rounding": "half-even"},
 *  "noise": {"eb-n0-db": [4, 6, 8, 10], "code-rate": 1, "seed": 1, "gaussian": "box-muller"},
 *  "simulation": {"target-errors": 200, "min-bits": 100000, "max-bits": 1000000, "chunk-symbols": 4096},
 *  "targets": {"ber": 1e-3, "gmi": 3.0, "loss-budget-db": 0.1, "sizing": "gmi", "operating-eb-n0-db": 8},
 *  "sweep": [{"parameter": "llr-word-length", "values": [3, 4, 5, 6, 8]},
 *            {"parameter": "metric-word-length", "values": [8, 10, 12, 19]},
 *            {"grid": [{"parameter": "input-word-length", "values": [6, 8, 10]},
 *                      {"parameter": "llr-word-length", "values": [4, 5, 6]}]}]}
 * }</pre>
 */
public final class LossSpecReader {

    private static final ObjectMapper MAPPER = JsonMapper.builder()
            .enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION)
            .enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
            .build();

    /** The built-in spec: small enough to run in seconds, used when no spec file is given. */
    public static final String DEFAULT_SPEC = "{\n"
            + "  \"schema\": \"fixmod-loss\", \"version\": 1, \"name\": \"default-qam16\",\n"
            + "  \"description\": \"built-in demo: Gray 16-QAM, 12-bit input, 6-bit max-log LLRs\",\n"
            + "  \"constellation\": \"qam16\",\n"
            + "  \"demapper\": {\"input\": {\"format\": \"Q2.9\"}, \"algorithm\": \"max-log\", \"llr\": {\"format\": \"Q3.2\"}},\n"
            + "  \"noise\": {\"eb-n0-db\": [2, 4, 6, 8, 10]},\n"
            + "  \"simulation\": {\"target-errors\": 100, \"min-bits\": 40000, \"max-bits\": 80000, \"chunk-symbols\": 2048},\n"
            + "  \"targets\": {\"ber\": 1e-2, \"gmi\": 3.0, \"loss-budget-db\": 0.1},\n"
            + "  \"sweep\": [{\"parameter\": \"llr-word-length\", \"values\": [3, 4, 5, 6, 8]}]\n"
            + "}\n";

    private static final int MAX_POINTS = 64;
    private static final int MAX_SWEEP_VALUES = 32;
    private static final int MAX_SWEEPS = 8;
    /** The most combinations of one grid: as many designs as the eight one-parameter sweeps may add. */
    static final int MAX_GRID_POINTS = MAX_SWEEPS * MAX_SWEEP_VALUES;
    /**
     * Most bits one run may simulate over all its points (points x max-bits, rounded up to whole chunks): about ten
     * minutes on two cores. A spec that asks for more would run for hours; it is refused before anything runs.
     */
    static final long MAX_RUN_BITS = 10_000_000_000L;

    private final String source;
    private final Map<String, JsonLocation> locations;

    private LossSpecReader(String source, Map<String, JsonLocation> locations) {
        this.source = source;
        this.locations = locations;
    }

    /**
     * Parses {@code text}; {@code source} names it in messages (usually the file name).
     *
     * @throws IllegalArgumentException with the one-line message described above
     */
    public static LossSpec parse(String text, String source) {
        JsonNode root = readTree(MAPPER, text, source);
        if (root == null || root.isMissingNode()) {
            throw new IllegalArgumentException(source + ": empty specification; expected a JSON object such as"
                    + " {\"constellation\": \"qam16\"}");
        }
        return new LossSpecReader(source, locate(text)).read(root);
    }

    /** Where each JSON pointer's value starts in {@code text}, which must be valid JSON. */
    /** Parses JSON text; a syntax error becomes one message placed at {@code source:line:column}. */
    static JsonNode readTree(ObjectMapper mapper, String text, String source) {
        try {
            return mapper.readTree(text);
        } catch (JsonProcessingException e) {
            JsonLocation at = e.getLocation();
            String where = at == null ? source : source + ":" + at.getLineNr() + ":" + at.getColumnNr();
            throw new IllegalArgumentException(where + ": not valid JSON: " + e.getOriginalMessage());
        }
    }

    static Map<String, JsonLocation> locate(String text) {
        Map<String, JsonLocation> map = new HashMap<>();
        try (JsonParser p = new JsonFactory().createParser(text)) {
            JsonToken t;
            while ((t = p.nextToken()) != null) {
                if (t != JsonToken.END_OBJECT && t != JsonToken.END_ARRAY) {
                    map.putIfAbsent(p.getParsingContext().pathAsPointer().toString(), p.currentTokenLocation());
                }
            }
        } catch (IOException e) {
            throw new IllegalArgumentException("cannot read the specification: " + e.getMessage());
        }
        return map;
    }

    private LossSpec read(JsonNode root) {
        ObjectNode top = object(root, "");
        allow(top, "", "schema", "version", "name", "description", "constellation", "mapper", "demapper", "noise",
                "simulation", "targets", "sweep");
        String schema = string(top, "", "schema", LossSpec.SCHEMA);
        if (!schema.equals(LossSpec.SCHEMA)) {
            throw error("/schema", "'" + schema + "' is not a loss specification; expected \"" + LossSpec.SCHEMA + "\"");
        }
        long version = integer(top, "", "version", LossSpec.VERSION, 1, Integer.MAX_VALUE);
        if (version != LossSpec.VERSION) {
            throw error("/version", "version " + version + " is not supported; this tool reads version "
                    + LossSpec.VERSION);
        }
        String description = string(top, "", "description", "");
        Constellation constellation = constellation(top);
        String name = string(top, "", "name", constellation.name().replace(':', '-'));
        if (!name.matches("[A-Za-z][A-Za-z0-9_-]{0,63}")) {
            throw error("/name", "'" + name + "' is not a name; expected a letter then up to 63 letters, digits, '_'"
                    + " or '-'");
        }
        String p = "/noise";
        ObjectNode n = optionalObject(top, "", "noise");
        allow(n, p, "eb-n0-db", "es-n0-db", "code-rate", "seed", "gaussian");
        if (n.has("es-n0-db") && n.has("eb-n0-db")) {
            throw error(p + "/eb-n0-db", "give either es-n0-db or eb-n0-db, not both");
        }
        double rate = number(n, p, "code-rate", 1.0);
        if (!(rate > 0 && rate <= 1)) {
            throw error(p + "/code-rate", rate + " is not a code rate; expected a number in (0, 1]");
        }
        double toEb = 10 * StrictMath.log10(constellation.bitsPerSymbol() * rate);
        List<Double> grid = new ArrayList<>();
        boolean es = n.has("es-n0-db");
        String gridKey = es ? "es-n0-db" : "eb-n0-db";
        JsonNode arr = n.get(gridKey);
        if (arr == null) {
            grid.addAll(List.of(2.0, 4.0, 6.0, 8.0, 10.0));
        } else {
            if (!arr.isArray() || arr.size() < 2 || arr.size() > MAX_POINTS) {
                throw error(p + "/" + gridKey, "expected an array of 2 to " + MAX_POINTS + " numbers in dB, ascending,"
                        + " e.g. [4, 6, 8]");
            }
            for (int i = 0; i < arr.size(); i++) {
                double v = finite(arr.get(i), p + "/" + gridKey + "/" + i);
                if (v < -20 || v > 60) {
                    throw error(p + "/" + gridKey + "/" + i, v + " dB is out of range; expected -20 to 60 dB");
                }
                double eb = es ? v - toEb : v;
                if (!grid.isEmpty() && eb <= grid.get(grid.size() - 1)) {
                    throw error(p + "/" + gridKey + "/" + i, v + " dB does not follow the previous value; the grid"
                            + " must be strictly ascending");
                }
                grid.add(eb);
            }
        }
        long seed = integer(n, p, "seed", 1, 0, 0xFFFF_FFFFL);
        String gaussian = string(n, p, "gaussian", "box-muller");
        try {
            dev.fixmod.verify.noise.Gaussian.fromName(gaussian);
        } catch (IllegalArgumentException e) {
            throw error(p + "/gaussian", e.getMessage());
        }

        Quantizer mapper = quantizer(top, "", "mapper", "Q1.14", Rounding.HALF_EVEN, Overflow.SATURATE);
        double smallestN0 = Simulation.n0(constellation, grid.get(grid.size() - 1), rate);
        Design base = demapper(top, constellation, mapper, smallestN0);

        p = "/simulation";
        ObjectNode s = optionalObject(top, "", "simulation");
        allow(s, p, "target-errors", "min-bits", "max-bits", "chunk-symbols");
        long targetErrors = integer(s, p, "target-errors", 200, 1, Long.MAX_VALUE / 4);
        long minBits = integer(s, p, "min-bits", 100_000, 0, 1L << 50);
        long maxBits = integer(s, p, "max-bits", 1_000_000, 1, 1L << 50);
        if (maxBits < minBits) {
            throw error(p + "/max-bits", maxBits + " is below min-bits " + minBits + "; expected max-bits >= min-bits");
        }
        int chunk = (int) integer(s, p, "chunk-symbols", 4096, 64, 1 << 20);
        LossSpec.Simulation simulation = new LossSpec.Simulation(targetErrors, minBits, maxBits, chunk);

        p = "/targets";
        ObjectNode t = optionalObject(top, "", "targets");
        allow(t, p, "ber", "gmi", "loss-budget-db", "sizing", "operating-eb-n0-db");
        double ber = number(t, p, "ber", 1e-3);
        if (!(ber > 0 && ber < 0.5)) {
            throw error(p + "/ber", ber + " is not a target BER; expected a number in (0, 0.5)");
        }
        int k = constellation.bitsPerSymbol();
        double gmi = number(t, p, "gmi", 0.75 * k);
        if (!(gmi > 0 && gmi < k)) {
            throw error(p + "/gmi", gmi + " is not a target rate for " + k + " bits per symbol; expected a number in"
                    + " (0, " + k + ")");
        }
        double budget = number(t, p, "loss-budget-db", 0.1);
        if (!(budget > 0 && budget <= 10)) {
            throw error(p + "/loss-budget-db", budget + " dB is not a loss budget; expected a number in (0, 10]");
        }
        String sizing = string(t, p, "sizing", "gmi");
        if (!sizing.equals("gmi") && !sizing.equals("ber")) {
            throw error(p + "/sizing", "unknown sizing measure '" + sizing + "'; expected gmi or ber");
        }
        double operating = number(t, p, "operating-eb-n0-db", grid.get(grid.size() / 2));
        if (operating < -20 || operating > 60) {
            throw error(p + "/operating-eb-n0-db", operating + " dB is out of range; expected -20 to 60 dB");
        }
        LossSpec.Targets targets = new LossSpec.Targets(ber, gmi, budget, sizing, operating);

        validate(base, "/demapper", "", grid, constellation, rate);
        List<LossSpec.Sweep> sweeps = new ArrayList<>();
        List<LossSpec.Grid> grids = new ArrayList<>();
        List<String> sweepPointers = new ArrayList<>();
        List<String> gridPointers = new ArrayList<>();
        sweeps(top, base, smallestN0, sweeps, sweepPointers, grids, gridPointers);
        bounded(simulation, grid.size(), sweeps, grids, k);
        for (int i = 0; i < sweeps.size(); i++) {
            for (int j = 0; j < sweeps.get(i).designs().size(); j++) {
                validate(sweeps.get(i).designs().get(j), sweepPointers.get(i) + "/values/" + j, "", grid,
                        constellation, rate);
            }
        }
        for (int i = 0; i < grids.size(); i++) {
            LossSpec.Grid g = grids.get(i);
            for (int j = 0; j < g.designs().size(); j++) {
                validate(g.designs().get(j), gridPointers.get(i), combination(g.parameters(), g.combination(j)) + ": ",
                        grid, constellation, rate);
            }
        }
        return new LossSpec(name, description, base, grid, rate, seed, gaussian, simulation, targets, sweeps, grids);
    }

    /** Refuses a run whose worst case (every point to max-bits) exceeds {@link #MAX_RUN_BITS}. */
    private void bounded(LossSpec.Simulation sim, int levels, List<LossSpec.Sweep> sweeps, List<LossSpec.Grid> grids,
                         int bitsPerSymbol) {
        long designs = 1;
        for (LossSpec.Sweep s : sweeps) {
            designs += s.designs().size();
        }
        for (LossSpec.Grid g : grids) {
            designs += g.designs().size();
        }
        long chunkBits = (long) sim.chunkSymbols() * bitsPerSymbol;
        long perPoint = (sim.maxBits() + chunkBits - 1) / chunkBits * chunkBits;
        long points = designs * levels;
        if (perPoint > MAX_RUN_BITS / points) {
            throw error("/simulation/max-bits", "the run could simulate " + points + " points x " + perPoint
                    + " bits, more than the limit of " + MAX_RUN_BITS + " bits per run (hours of work); lower max-bits,"
                    + " the number of Eb/N0 points or sweep values (a grid counts each combination), or split the"
                    + " sweep over several specifications");
        }
    }

    /**
     * Builds every datapath the run will build, so that a design that cannot be built is reported here, at
     * {@code pointer}, its message after {@code prefix}.
     */
    private void validate(Design d, String pointer, String prefix, List<Double> grid, Constellation c, double rate) {
        try {
            d.transmitRom();
            var rx = d.receiveRom();
            double[] n0 = new double[grid.size()];
            for (int i = 0; i < n0.length; i++) {
                n0[i] = Simulation.n0(c, grid.get(i), rate);
            }
            var spec = d.llrSpec(rx, n0[n0.length - 1]);
            for (double v : n0) {
                d.fixedDemapper(rx, spec, v);
                d.floatDemapper(v);
            }
        } catch (IllegalArgumentException e) {
            // A given K that does not fit is the base's scale-constant key's fault, not the whole demapper's.
            boolean k = pointer.equals("/demapper") && d.scaleConstant() != null
                    && e.getMessage().startsWith("scale constant");
            throw error(k ? pointer + "/scale-constant" : pointer, prefix + e.getMessage());
        }
    }

    /** {@code input-word-length = 6, llr-word-length = 5}: a grid's combination as messages and reports name it. */
    public static String combination(List<String> parameters, List<String> values) {
        return parameters.get(0) + " = " + values.get(0) + ", " + parameters.get(1) + " = " + values.get(1);
    }

    private Constellation constellation(ObjectNode top) {
        String p = "/constellation";
        JsonNode node = top.get("constellation");
        String name = "qam16";
        Labeling labeling = null;
        Normalization normalization = Normalization.UNIT_ENERGY;
        if (node != null && node.isTextual()) {
            name = node.asText();
        } else if (node != null) {
            ObjectNode c = object(node, p);
            allow(c, p, "name", "labeling", "normalization");
            name = string(c, p, "name", name);
            String l = string(c, p, "labeling", "default");
            labeling = l.equals("default") ? null : named(c, p, "labeling", l, Labeling::fromName);
            normalization = named(c, p, "normalization", normalization.tradeName(), Normalization::fromName);
        }
        try {
            return Catalogue.resolve(name, new Catalogue.Options(labeling, normalization, 0, 0));
        } catch (IllegalArgumentException e) {
            throw error(node != null && node.isObject() && node.has("name") ? p + "/name" : p, e.getMessage());
        }
    }

    private Design demapper(ObjectNode top, Constellation constellation, Quantizer mapper, double smallestN0) {
        String p = "/demapper";
        ObjectNode d = optionalObject(top, "", "demapper");
        allow(d, p, "input", "back-off-db", "algorithm", "reference", "scaling", "metric", "scale-constant", "scale",
                "llr", "llr-scale", "rounding");
        Rounding rounding = named(d, p, "rounding", Rounding.HALF_EVEN.tradeName(), Rounding::fromName);
        Quantizer input = quantizer(d, p, "input", "Q2.9", rounding, Overflow.SATURATE);
        if (input.format().wordLength() > 30) {
            throw error(p + "/input/format", input.format() + " has " + input.format().wordLength()
                    + " bits; the LLR datapaths take at most 30");
        }
        double backOff = d.has("back-off-db") ? number(d, p, "back-off-db", 0) : Double.NaN;
        SoftAlgorithm algorithm = named(d, p, "algorithm", "max-log", SoftAlgorithm::fromName);
        if (algorithm == SoftAlgorithm.LOG_MAP) {
            throw error(p + "/algorithm", "log-map has no fixed-point datapath; expected max-log, max-log-per-axis"
                    + " or folded-linear (log-map may be the float reference: key \"reference\")");
        }
        SoftAlgorithm reference = named(d, p, "reference", algorithm.tradeName(), SoftAlgorithm::fromName);
        LlrScaling scaling = named(d, p, "scaling", LlrScaling.NOISE_SCALED.tradeName(), LlrScaling::fromName);
        Quantizer llr = quantizer(d, p, "llr", "Q5.0", rounding, Overflow.SYMMETRIC_SATURATE);
        double scale = number(d, p, "llr-scale", 1.0);
        Design design;
        try {
            design = new Design(constellation, mapper, input, backOff, algorithm, reference, scaling, null, null, null,
                    llr, scale, rounding);
        } catch (IllegalArgumentException e) {
            String at = e.getMessage().startsWith("LLR scale") ? "/llr-scale"
                    : e.getMessage().startsWith("back-off") ? "/back-off-db" : "/llr/format";
            throw error(p + at, e.getMessage());
        }
        return stages(d, p, design, smallestN0);
    }

    /**
     * The internal stages the spec gives ({@code metric}, {@code scale-constant}, {@code scale}, as in a vector
     * specification); a key left out, or a field of one, is the kernel's suggestion with the design's rounding.
     */
    private Design stages(ObjectNode d, String p, Design design, double smallestN0) {
        if (!d.has("metric") && !d.has("scale-constant") && !d.has("scale")) {
            return design;
        }
        if (design.scaling() == LlrScaling.UNSCALED) {
            for (String key : new String[] {"scale-constant", "scale"}) {
                if (d.has(key)) {
                    throw error(p + "/" + key, "an unscaled datapath has no " + key + "; remove the key or use"
                            + " \"scaling\": \"noise-scaled\"");
                }
            }
        }
        FixedLlrSpec suggested;
        try {
            suggested = design.llrSpec(design.receiveRom(), smallestN0);
        } catch (IllegalArgumentException e) {
            throw error(p, e.getMessage());
        }
        Design out = design;
        if (d.has("metric")) {
            Quantizer m = suggested.metric();
            out = out.withMetric(quantizer(d, p, "metric", m.format().toString(), m.rounding(), m.overflow()));
        }
        if (d.has("scale-constant")) {
            out = out.withScaleConstant(named(d, p, "scale-constant", suggested.scaleConstant().toString(),
                    QFormat::parse));
        }
        if (d.has("scale")) {
            Quantizer m = suggested.scale();
            out = out.withScale(quantizer(d, p, "scale", m.format().toString(), m.rounding(), m.overflow()));
        }
        return out;
    }

    private void sweeps(ObjectNode top, Design base, double smallestN0, List<LossSpec.Sweep> sweeps,
                        List<String> sweepPointers, List<LossSpec.Grid> grids, List<String> gridPointers) {
        JsonNode arr = top.get("sweep");
        if (arr == null) {
            return;
        }
        if (!arr.isArray()) {
            throw error("/sweep", "expected an array of {\"parameter\": ..., \"values\": [...]} or"
                    + " {\"grid\": [...]}, got " + kind(arr));
        }
        if (arr.size() > MAX_SWEEPS) {
            throw error("/sweep", arr.size() + " sweeps; expected at most " + MAX_SWEEPS + " (a grid counts as one)");
        }
        for (int i = 0; i < arr.size(); i++) {
            String p = "/sweep/" + i;
            ObjectNode s = object(arr.get(i), p);
            if (s.has("grid")) {
                for (Iterator<String> it = s.fieldNames(); it.hasNext(); ) {
                    String k = it.next();
                    if (!k.equals("grid")) {
                        throw error(p + "/" + k.replace("~", "~0").replace("/", "~1"), "unknown key \"" + k
                                + "\" beside \"grid\"; a grid entry holds only \"grid\": [{\"parameter\": ...,"
                                + " \"values\": [...]}, {\"parameter\": ..., \"values\": [...]}]");
                    }
                }
                grids.add(grid(s.get("grid"), p + "/grid", base, smallestN0));
                gridPointers.add(p + "/grid");
                continue;
            }
            allow(s, p, "parameter", "values", "grid");
            if (!s.has("parameter") || !s.has("values")) {
                throw error(p, "a sweep needs \"parameter\" (one of " + SweepParameter.names() + ") and \"values\","
                        + " or \"grid\": two such sweeps to cross");
            }
            Axis axis = axis(s, p, base, smallestN0);
            List<Design> designs = new ArrayList<>();
            for (String label : axis.labels()) {
                designs.add(axis.parameter().apply(base, label, smallestN0));
            }
            sweeps.add(new LossSpec.Sweep(axis.parameter().tradeName(), axis.labels(), designs));
            sweepPointers.add(p);
        }
    }

    /** A one-parameter sweep or a grid's axis: the parameter and its value labels. */
    private record Axis(SweepParameter parameter, List<String> labels) {
    }

    /** Reads {@code {"parameter": ..., "values": [...]}}, checking each value on {@code base} at its own path. */
    private Axis axis(ObjectNode s, String p, Design base, double smallestN0) {
        allow(s, p, "parameter", "values");
        if (!s.has("parameter") || !s.has("values")) {
            throw error(p, "a sweep needs \"parameter\" (one of " + SweepParameter.names() + ") and \"values\"");
        }
        SweepParameter parameter = named(s, p, "parameter", "", SweepParameter::fromName);
        JsonNode values = s.get("values");
        if (!values.isArray() || values.size() < 1 || values.size() > MAX_SWEEP_VALUES) {
            throw error(p + "/values", "expected an array of 1 to " + MAX_SWEEP_VALUES + " values");
        }
        List<String> labels = new ArrayList<>();
        for (int j = 0; j < values.size(); j++) {
            String vp = p + "/values/" + j;
            JsonNode v = values.get(j);
            String label;
            if (parameter.isNumeric()) {
                label = Numbers.plain(finite(v, vp));
            } else if (v.isTextual()) {
                label = v.asText();
            } else {
                throw error(vp, "expected a name, got " + kind(v));
            }
            if (labels.contains(label)) {
                throw error(vp, "'" + label + "' is listed twice");
            }
            try {
                parameter.apply(base, label, smallestN0);
            } catch (IllegalArgumentException e) {
                throw error(vp, e.getMessage());
            }
            labels.add(label);
        }
        return new Axis(parameter, labels);
    }

    /**
     * Reads {@code [axis, axis]}: two parameters that set different things, at most {@link #MAX_GRID_POINTS}
     * combinations. Each combination applies the two values in {@link SweepParameter}'s order.
     */
    private LossSpec.Grid grid(JsonNode node, String p, Design base, double smallestN0) {
        String shape = "an array of two sweeps [{\"parameter\": ..., \"values\": [...]}, {\"parameter\": ...,"
                + " \"values\": [...]}]";
        if (!node.isArray() || node.size() != 2) {
            throw error(p, "expected " + shape + ", got " + (node.isArray() ? "an array of " + node.size()
                    : kind(node)));
        }
        Axis first = axis(object(node.get(0), p + "/0"), p + "/0", base, smallestN0);
        Axis second = axis(object(node.get(1), p + "/1"), p + "/1", base, smallestN0);
        if (first.parameter() == second.parameter()) {
            throw error(p + "/1/parameter", first.parameter().tradeName() + " is crossed with itself; a grid crosses"
                    + " two different parameters (list more values in one sweep instead)");
        }
        if (first.parameter().port().equals(second.parameter().port())) {
            throw error(p + "/1/parameter", first.parameter().tradeName() + " and " + second.parameter().tradeName()
                    + " both set " + first.parameter().port() + "; a grid crosses two parameters that set different"
                    + " things");
        }
        int combinations = first.labels().size() * second.labels().size();
        if (combinations > MAX_GRID_POINTS) {
            throw error(p, first.labels().size() + " x " + second.labels().size() + " = " + combinations
                    + " combinations; expected at most " + MAX_GRID_POINTS);
        }
        boolean inOrder = first.parameter().compareTo(second.parameter()) < 0;
        Axis early = inOrder ? first : second;
        Axis late = inOrder ? second : first;
        List<String> names = List.of(first.parameter().tradeName(), second.parameter().tradeName());
        List<Design> designs = new ArrayList<>();
        for (String a : first.labels()) {
            for (String b : second.labels()) {
                String e = inOrder ? a : b;
                String l = inOrder ? b : a;
                try {
                    designs.add(late.parameter().apply(early.parameter().apply(base, e, smallestN0), l, smallestN0));
                } catch (IllegalArgumentException ex) {
                    throw error(p, combination(names, List.of(a, b)) + ": " + ex.getMessage());
                }
            }
        }
        return new LossSpec.Grid(names, List.of(first.labels(), second.labels()), designs);
    }

    private <T> T named(ObjectNode parent, String parentPath, String key, String fallback, Function<String, T> lookup) {
        String text = string(parent, parentPath, key, fallback);
        try {
            return lookup.apply(text);
        } catch (IllegalArgumentException e) {
            throw error(parentPath + "/" + key, e.getMessage());
        }
    }

    private Quantizer quantizer(ObjectNode parent, String parentPath, String key, String format, Rounding rounding,
                                Overflow overflow) {
        String p = parentPath + "/" + key;
        ObjectNode q = optionalObject(parent, parentPath, key);
        allow(q, p, "format", "rounding", "overflow");
        QFormat f = named(q, p, "format", format, QFormat::parse);
        if (!f.isSigned() || f.wordLength() < 2) {
            throw error(p + "/format", "'" + f + "' is not a signed format of at least 2 bits; expected Qm.n or Qn");
        }
        Rounding r = named(q, p, "rounding", rounding.tradeName(), Rounding::fromName);
        Overflow o = named(q, p, "overflow", overflow.tradeName(), Overflow::fromName);
        return new Quantizer(f, r, o);
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
                throw error(path + "/" + k.replace("~", "~0").replace("/", "~1"), "unknown key \"" + k
                        + "\"; expected one of " + String.join(", ", keys));
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
        if (n.isFloatingPointNumber() && n.asDouble() == Math.rint(n.asDouble()) && Math.abs(n.asDouble()) < 1e15) {
            n = MAPPER.getNodeFactory().numberNode((long) n.asDouble());
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
            throw error(path, n.asText() + " is not a finite number");
        }
        return v;
    }

    /** The value as a message shows it: {@code the string "x"}, {@code the number 5}, {@code null}, ... */
    static String kind(JsonNode n) {
        if (n.isTextual()) {
            return "the string \"" + n.asText() + "\"";
        }
        if (n.isNumber() || n.isBoolean()) {
            return "the " + (n.isNumber() ? "number " : "boolean ") + n.asText();
        }
        return n.isNull() ? "null" : n.isArray() ? "an array" : "an object";
    }

    private IllegalArgumentException error(String pointer, String message) {
        JsonLocation at = locations.get(pointer);
        String where = at == null ? source : source + ":" + at.getLineNr() + ":" + at.getColumnNr();
        return new IllegalArgumentException(where + ": " + display(pointer) + ": " + message);
    }

    /** {@code /sweep/0/values/2} becomes {@code sweep[0].values[2]}; the root is {@code (top level)}. */
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
