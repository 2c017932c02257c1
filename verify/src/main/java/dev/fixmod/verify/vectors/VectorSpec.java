package dev.fixmod.verify.vectors;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Normalization;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.map.ConstellationRom;
import dev.fixmod.demap.FixedLlrSpec;
import dev.fixmod.demap.LlrScaling;
import dev.fixmod.demap.LlrSign;
import dev.fixmod.demap.SoftAlgorithm;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import dev.fixmod.verify.formats.FileFormat;
import java.util.EnumSet;
import java.util.List;
import java.util.Objects;
import java.util.Set;

/**
 * A golden vector set's specification, fully defaulted: what {@link SpecReader} returns and what
 * {@link #toCanonicalJson()} writes into the manifest (every key, fixed key order), so that the manifest alone
 * regenerates the set. vectors/README.md lists every key with its default.
 *
 * @param name          the set's name, used in file names and the C identifiers
 * @param constellation the points and labels
 * @param mapper        the mapper ROM's number handling (format of the mapper output port)
 * @param demapper      the demapper input quantizer, algorithm and LLR output stage
 * @param bits          where the stimulus bits come from
 * @param noise         the noise levels and the noise seed
 * @param count         the noisy vectors per noise level
 * @param cornerCases   the corner-case groups included (iteration order is the enum's)
 * @param formats       the file formats written (iteration order is the enum's)
 */
public record VectorSpec(String name, ConstellationChoice constellation, Quantizer mapper, Demapper demapper,
        BitSource bits, Noise noise, long count, Set<CornerGroup> cornerCases, Set<FileFormat> formats) {

    /** The schema name of specification files. */
    public static final String SCHEMA = "fixmod-vector-spec";
    /** The specification schema version this tool reads and writes; a breaking change bumps it. */
    public static final int VERSION = 1;

    public VectorSpec {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(constellation, "constellation");
        Objects.requireNonNull(mapper, "mapper");
        Objects.requireNonNull(demapper, "demapper");
        Objects.requireNonNull(bits, "bits");
        Objects.requireNonNull(noise, "noise");
        if (count < 0) {
            throw new IllegalArgumentException("count must be >= 0, got " + count);
        }
        cornerCases = cornerCases.isEmpty() ? Set.of() : Set.copyOf(EnumSet.copyOf(cornerCases));
        formats = formats.isEmpty() ? Set.of() : Set.copyOf(EnumSet.copyOf(formats));
    }

    /** Whether the corner-case group is included. */
    public boolean includes(CornerGroup group) {
        return cornerCases.contains(group);
    }

    /** Whether the file format is written. */
    public boolean writes(FileFormat format) {
        return formats.contains(format);
    }

    /**
     * The constellation: a catalogue name (family or published profile), its labeling and normalization.
     *
     * @param name          e.g. {@code qam16}, {@code nr:qam64}, {@code wlan:qam1024}, {@code psk8}
     * @param labeling      {@code gray}, {@code natural}, {@code quasi-gray}, or {@code default} (the name's own:
     *                      Gray for families, the standard's for profiles)
     * @param normalization how the points are scaled before the mapper ROM is quantized
     * @param phaseOffsetDegrees the angle of PSK point 0 (PSK only)
     */
    public record ConstellationChoice(String name, String labeling, Normalization normalization,
            double phaseOffsetDegrees) {
        public ConstellationChoice {
            Objects.requireNonNull(name, "name");
            Objects.requireNonNull(labeling, "labeling");
            Objects.requireNonNull(normalization, "normalization");
        }
    }

    /**
     * The demapper: input quantizer, fixed LLR datapath stages, float reference, sign convention.
     *
     * @param input            the demapper input port (channel samples are quantized here)
     * @param algorithm        the fixed-point datapath: {@code max-log}, {@code max-log-per-axis} or {@code folded-linear}
     * @param reference        the float reference written beside it in the CSV: {@code log-map} or one of the above
     * @param scaling          {@code noise-scaled} (output in nats, K = 1/N0 per noise level) or {@code unscaled}
     * @param designEsN0Db     the E_s/N0 whose N0 sets K for vectors without noise (labels, corner inputs)
     * @param constantRounding how levels, fold thresholds and K are quantized once
     * @param metric           the metric stage
     * @param scaleConstant    the format of K; null when unscaled
     * @param scale            the product stage; null when unscaled
     * @param llr              the LLR output port
     * @param llrSign          the sign convention of the LLR port
     */
    public record Demapper(Quantizer input, SoftAlgorithm algorithm, SoftAlgorithm reference, LlrScaling scaling,
            double designEsN0Db, Rounding constantRounding, Quantizer metric, QFormat scaleConstant, Quantizer scale,
            Quantizer llr, LlrSign llrSign) {
        public Demapper {
            Objects.requireNonNull(input, "input");
            Objects.requireNonNull(algorithm, "algorithm");
            Objects.requireNonNull(reference, "reference");
            Objects.requireNonNull(scaling, "scaling");
            Objects.requireNonNull(constantRounding, "constantRounding");
            Objects.requireNonNull(metric, "metric");
            Objects.requireNonNull(llr, "llr");
            Objects.requireNonNull(llrSign, "llrSign");
        }

        /** The kernel's stage formats of the fixed LLR datapath (its input format is the reference ROM's). */
        public FixedLlrSpec fixedSpec() {
            return new FixedLlrSpec(constantRounding, metric, scaling, scaleConstant, scale, llr);
        }

        /**
         * The slicer's and LLR datapath's reference points: the constellation quantized onto the input grid with
         * the constant rounding.
         */
        public ConstellationRom reference(Constellation constellation) {
            return ConstellationRom.of(constellation, new Quantizer(input.format(), constantRounding,
                    Overflow.SATURATE));
        }
    }

    /**
     * The stimulus bits.
     *
     * @param source a PRBS of ITU-T O.150 ({@code prbs-7} … {@code prbs-31}), {@code constant}, {@code alternating}
     *               or {@code file}
     * @param seed   the PRBS register's initial state (non-zero, at most {@code 2^n − 1}); 0 for other sources
     * @param value  the constant bit, or the first bit of the alternating pattern; 0 for other sources
     * @param file   the user bit file (text of {@code 0}/{@code 1}), relative to the specification; "" otherwise
     */
    public record BitSource(String source, long seed, int value, String file) {
        public BitSource {
            Objects.requireNonNull(source, "source");
            Objects.requireNonNull(file, "file");
        }

        /** Whether the source is a PRBS (then {@link #seed} applies). */
        public boolean isPrbs() {
            return source.startsWith("prbs-");
        }
    }

    /**
     * The channel noise.
     *
     * @param measure  whether {@code levelsDb} are E_s/N0 or E_b/N0 values
     * @param levelsDb the noise levels in dB, in the order written
     * @param codeRate the code rate r used to convert E_b/N0 to E_s/N0 ({@code 0 < r <= 1})
     * @param seed     the noise generator's key (32 bits); level {@code i} uses stream {@code i}
     * @param gaussian the Gaussian sampler: {@code box-muller} or {@code ziggurat}
     */
    public record Noise(NoiseMeasure measure, List<Double> levelsDb, double codeRate, long seed, String gaussian) {
        public Noise {
            Objects.requireNonNull(measure, "measure");
            Objects.requireNonNull(gaussian, "gaussian");
            levelsDb = List.copyOf(levelsDb);
            if (!(codeRate > 0 && codeRate <= 1)) {
                throw new IllegalArgumentException("code-rate must lie in (0, 1], got " + codeRate);
            }
        }

        /** E_s/N0 in dB of level {@code i}: E_s/N0 = E_b/N0 + 10·log10(k·r). */
        public double esN0Db(int i, int bitsPerSymbol) {
            double level = levelsDb.get(i);
            return measure == NoiseMeasure.ES_N0 ? level : level + 10 * StrictMath.log10(bitsPerSymbol * codeRate);
        }
    }

    /** The canonical form: every key present, in the order vectors/README.md documents. */
    public ObjectNode toCanonicalJson() {
        JsonNodeFactory f = JsonNodeFactory.instance;
        ObjectNode root = f.objectNode();
        root.put("schema", SCHEMA);
        root.put("version", VERSION);
        root.put("name", name);
        ObjectNode c = root.putObject("constellation");
        c.put("name", constellation.name());
        c.put("labeling", constellation.labeling());
        c.put("normalization", constellation.normalization().tradeName());
        c.put("phase-offset-degrees", constellation.phaseOffsetDegrees());
        putQuantizer(root.putObject("mapper"), mapper);
        ObjectNode d = root.putObject("demapper");
        putQuantizer(d.putObject("input"), demapper.input());
        d.put("algorithm", demapper.algorithm().tradeName());
        d.put("reference", demapper.reference().tradeName());
        d.put("scaling", demapper.scaling().tradeName());
        d.put("design-es-n0-db", demapper.designEsN0Db());
        d.put("constant-rounding", demapper.constantRounding().tradeName());
        putQuantizer(d.putObject("metric"), demapper.metric());
        if (demapper.scaleConstant() != null) {
            d.put("scale-constant", demapper.scaleConstant().toString());
            putQuantizer(d.putObject("scale"), demapper.scale());
        }
        putQuantizer(d.putObject("llr"), demapper.llr());
        d.put("llr-sign", demapper.llrSign().tradeName());
        ObjectNode b = root.putObject("bits");
        b.put("source", bits.source());
        if (bits.isPrbs()) {
            b.put("seed", bits.seed());
        } else if (bits.source().equals("constant") || bits.source().equals("alternating")) {
            b.put("value", bits.value());
        } else {
            b.put("file", bits.file());
        }
        ObjectNode n = root.putObject("noise");
        ArrayNode levels = n.putArray(noise.measure().tradeName());
        noise.levelsDb().forEach(levels::add);
        n.put("code-rate", noise.codeRate());
        n.put("seed", noise.seed());
        n.put("gaussian", noise.gaussian());
        root.put("count", count);
        ArrayNode corners = root.putArray("corner-cases");
        EnumSet.allOf(CornerGroup.class).stream().filter(cornerCases::contains).forEach(g -> corners.add(g.tradeName()));
        ArrayNode fmts = root.putArray("formats");
        EnumSet.allOf(FileFormat.class).stream().filter(formats::contains).forEach(o -> fmts.add(o.label()));
        return root;
    }

    private static void putQuantizer(ObjectNode node, Quantizer q) {
        node.put("format", q.format().toString());
        node.put("rounding", q.rounding().tradeName());
        node.put("overflow", q.overflow().tradeName());
    }
}
