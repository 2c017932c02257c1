package dev.fixmod.verify.cli;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.fixmod.constellation.Catalogue;
import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Labeling;
import dev.fixmod.constellation.Normalization;
import dev.fixmod.demap.FixedLlrSpec;
import dev.fixmod.demap.FixedLlrTrace;
import dev.fixmod.demap.FixedSoftDemapper;
import dev.fixmod.demap.LlrOptions;
import dev.fixmod.demap.LlrSign;
import dev.fixmod.demap.Slicers;
import dev.fixmod.demap.SoftAlgorithm;
import dev.fixmod.demap.SoftDemapper;
import dev.fixmod.fixed.FixedPoint;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import dev.fixmod.map.ConstellationRom;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code fixmod demap}: one received sample through every soft demapper, in floating point and in bit-exact fixed
 * point, with the fixed datapaths' intermediate values bit by bit. Options are read as text and checked here, so
 * every bad value gives one line and exit status 2; the whole report is built before anything is printed.
 */
@Command(name = "demap",
        mixinStandardHelpOptions = true,
        sortOptions = false,
        description = {
            "Demaps one received sample with every soft algorithm (log-map, max-log, max-log-per-axis,"
                    + " folded-linear) in floating point and in bit-exact fixed point, and prints for each the decided"
                    + " label, the bits and every bit's LLR, with the fixed datapaths' intermediate values: what to"
                    + " look at when one vector disagrees.",
            "",
            "LLR convention: L(b) = ln P(b=0|y) - ln P(b=1|y) with --llr-sign zero-positive (the default);"
                    + " N0 is the complex noise power (N0/2 per real dimension). A bit whose LLR is exactly 0 takes"
                    + " the slicer's decision (the tie rule)."},
        footer = {"",
            "Examples:",
            "  fixmod demap -c qam16 --sample 0.3,-0.7 --n0 0.1",
            "  fixmod demap -c nr:qam64 --codes 210,-73 --input-format Q2.9 --esn0 12 --llr Q5.0,half-up,saturate",
            "  fixmod demap -c qam16 --sample 1.2,0.1 --esn0 8 --scaling unscaled --metric Q3.9,floor,saturate",
            "  fixmod demap -c psk8 --sample 0.7,0.2 --esn0 6 --json",
            "  fixmod demap -c nr:pi2bpsk --sample -0.5,0.6 --esn0 3 --odd-symbol",
            "",
            "Stage formats take a Q format, a rounding and an overflow, separated by commas or blanks: e.g."
                    + " Q4.1,half-even,symmetric-saturate. Roundings: " + "floor, ceil, toward-zero, half-up,"
                    + " half-away, half-even. Overflows: saturate, symmetric-saturate, wrap. Metric, scale constant"
                    + " and scale default to a starting point that does not overflow (FixedLlrSpec.suggested).",
            "Exit status: 0 success, 2 bad input."})
public final class DemapCommand implements Callable<Integer> {

    private static final List<SoftAlgorithm> FIXED_ALGORITHMS =
            List.of(SoftAlgorithm.MAX_LOG, SoftAlgorithm.MAX_LOG_PER_AXIS, SoftAlgorithm.FOLDED_LINEAR);

    @Spec
    CommandSpec spec;

    @Option(names = {"-c", "--constellation"}, required = true, paramLabel = "NAME",
            description = "Constellation name, e.g. qam16, pam8, psk8, rqam32, nr:qam64, wlan:qam256.")
    String constellationName;

    @Option(names = "--labeling", paramLabel = "NAME",
            description = "Labeling (gray, natural, quasi-gray); default: the name's own.")
    String labeling;

    @Option(names = "--normalization", paramLabel = "MODE", defaultValue = "unit-energy",
            description = "none, unit-energy, unit-bit-energy or unit-peak (default: ${DEFAULT-VALUE}).")
    String normalization;

    @Option(names = "--shaping", paramLabel = "LAMBDA", defaultValue = "0",
            description = "Maxwell-Boltzmann shaping: p(s) proportional to exp(-LAMBDA |s|^2) (default: 0).")
    double shaping;

    @Option(names = "--sample", paramLabel = "I,Q",
            description = "The received sample as real numbers (Q may be left out for PAM).")
    String sample;

    @Option(names = "--codes", paramLabel = "I,Q",
            description = "The received sample as integer codes of --input-format.")
    String codes;

    @Option(names = "--input-format", paramLabel = "QFORMAT", defaultValue = "Q2.9",
            description = "Format of the input codes and of the reference points (default: ${DEFAULT-VALUE}).")
    String inputFormat;

    @Option(names = "--input-rounding", paramLabel = "ROUNDING", defaultValue = "half-even",
            description = "How --sample and the reference points are quantized (default: ${DEFAULT-VALUE}).")
    String inputRounding;

    @Option(names = "--odd-symbol", description = "Demap the sample as a symbol of odd index, whose points pi/2-BPSK"
            + " (pi2bpsk, nr:pi2bpsk) turns by +90 degrees; default: even index.")
    boolean oddSymbol;

    @Option(names = "--n0", paramLabel = "N0", description = "Complex noise power N0 > 0.")
    String n0;

    @Option(names = "--esn0", paramLabel = "DB", description = "Es/N0 in dB (instead of --n0).")
    String esN0;

    @Option(names = "--llr-sign", paramLabel = "SIGN", defaultValue = "zero-positive",
            description = "zero-positive (L = ln P(0) - ln P(1)) or one-positive (default: ${DEFAULT-VALUE}).")
    String llrSign;

    @Option(names = "--no-priors", description = "Ignore the constellation's symbol probabilities.")
    boolean noPriors;

    @Mixin
    LlrStageOptions stages;

    @Option(names = "--json", description = "Print the report as JSON.")
    boolean json;

    @Override
    public Integer call() {
        Report report = compute();
        String text = json ? report.toJson() : report.toText();
        spec.commandLine().getOut().print(text);
        spec.commandLine().getOut().flush();
        return ExitStatus.OK;
    }

    // ---------------------------------------------------------------- computation

    private Report compute() {
        Catalogue.Options options = Catalogue.Options.DEFAULT
                .withNormalization(Normalization.fromName(normalization))
                .withShaping(finite("--shaping", shaping));
        if (labeling != null) {
            options = options.withLabeling(Labeling.fromName(labeling));
        }
        Constellation c = Catalogue.resolve(constellationName, options);
        if (oddSymbol && !c.alternatesQuarterTurn()) {
            throw new UsageException("--odd-symbol: " + c.name() + " treats every symbol alike; only pi/2-BPSK"
                    + " (pi2bpsk, nr:pi2bpsk) turns the symbols of odd index");
        }
        // The kernel's demappers and slicers take a stream index; only its parity matters, and only for π/2-BPSK.
        long index = oddSymbol ? 1 : 0;
        if ((sample == null) == (codes == null)) {
            throw new UsageException("give the received sample once: either --sample I,Q (reals) or --codes I,Q"
                    + " (codes of --input-format)");
        }
        if ((n0 == null) == (esN0 == null)) {
            throw new UsageException("give the noise once: either --n0 N0 or --esn0 DB");
        }
        LlrSign sign = LlrSign.fromName(llrSign);
        boolean priors = !noPriors;
        LlrOptions llr = n0 != null ? new LlrOptions(number("--n0", n0), sign, priors)
                : LlrOptions.fromEsN0Db(c, number("--esn0", esN0), sign, priors);
        QFormat in = QFormat.parse(inputFormat);
        Quantizer inQ = new Quantizer(in, Rounding.fromName(inputRounding), Overflow.SATURATE);
        ConstellationRom rom = ConstellationRom.of(c, inQ);
        boolean oneDimensional = c.isSeparable() && c.axes().isOneDimensional();

        Report r = new Report();
        r.constellation = c;
        r.normalization = Normalization.fromName(normalization);
        r.options = llr;
        r.rom = rom;
        r.index = index;
        if (sample != null) {
            double[] v = pair("--sample", sample, oneDimensional, true);
            r.re = v[0];
            r.im = v[1];
            OverflowCounter clip = new OverflowCounter("input");
            r.iCode = (int) FixedPoint.quantize(r.re, in, inQ.rounding(), Overflow.SATURATE, clip);
            r.qCode = (int) FixedPoint.quantize(r.im, in, inQ.rounding(), Overflow.SATURATE, clip);
            r.clipped = clip.events() > 0;
        } else {
            double[] v = pair("--codes", codes, oneDimensional, false);
            r.iCode = code("I", v[0], in);
            r.qCode = code("Q", v[1], in);
            r.re = in.toDouble(r.iCode);
            r.im = in.toDouble(r.qCode);
        }
        r.floatSlice = Slicers.floatFor(c).slice(r.re, r.im, index);
        r.fixedSlice = Slicers.fixedFor(rom).slice(r.iCode, r.qCode, index);

        for (SoftAlgorithm a : SoftAlgorithm.values()) {
            FloatRow row = new FloatRow(a);
            try {
                SoftDemapper d = SoftDemapper.create(a, c, llr);
                row.llr = new double[c.bitsPerSymbol()];
                d.llr(r.re, r.im, index, row.llr, 0);
                row.decision = decision(row.llr, r.floatSlice, c.bitsPerSymbol());
            } catch (IllegalArgumentException notApplicable) {
                row.reason = notApplicable.getMessage();
            }
            r.floats.add(row);
        }
        Quantizer out = stages.output();
        for (SoftAlgorithm a : FIXED_ALGORITHMS) {
            FixedRow row = new FixedRow(a);
            FixedLlrSpec fixedSpec;
            try {
                fixedSpec = FixedLlrSpec.suggested(a, rom, llr, out.format());
            } catch (IllegalArgumentException notApplicable) {
                row.reason = notApplicable.getMessage();
                r.fixeds.add(row);
                continue;
            }
            fixedSpec = stages.over(fixedSpec);
            try {
                FixedSoftDemapper d = FixedSoftDemapper.create(a, rom, llr, fixedSpec);
                row.datapath = d;
                row.codes = new int[c.bitsPerSymbol()];
                d.llr(r.iCode, r.qCode, index, row.codes, 0);
                row.trace = d.trace(r.iCode, r.qCode, index);
                row.reference = new double[c.bitsPerSymbol()];
                SoftDemapper.create(a, c, llr).llr(in.toDouble(r.iCode), in.toDouble(r.qCode), index, row.reference,
                        0);
                double[] asDouble = new double[row.codes.length];
                for (int b = 0; b < asDouble.length; b++) {
                    asDouble[b] = row.codes[b];
                }
                row.decision = decision(asDouble, r.fixedSlice, c.bitsPerSymbol());
            } catch (IllegalArgumentException notApplicable) {
                row.reason = notApplicable.getMessage();
                row.datapath = null;
            }
            r.fixeds.add(row);
        }
        return r;
    }

    /** The label from the LLR signs; a bit whose LLR is exactly 0 takes the slicer's decision. */
    private static int decision(double[] llr, int sliced, int k) {
        int label = 0;
        for (int b = 0; b < k; b++) {
            int bit = llr[b] > 0 ? 0 : llr[b] < 0 ? 1 : (sliced >>> (k - 1 - b)) & 1;
            label = (label << 1) | bit;
        }
        return label;
    }

    /** A finite number, or a message naming the option and the text. */
    private static double number(String option, String text) {
        double v;
        try {
            v = Double.parseDouble(text.trim());
        } catch (NumberFormatException e) {
            throw new UsageException(option + ": '" + text + "' is not a number");
        }
        if (!Double.isFinite(v)) {
            throw new UsageException(option + ": " + text.trim() + " is not a finite number");
        }
        return v;
    }

    private static double finite(String option, double v) {
        if (!Double.isFinite(v)) {
            throw new UsageException(option + ": " + v + " is not a finite number");
        }
        return v;
    }

    private static double[] pair(String option, String text, boolean oneDimensional, boolean reals) {
        String[] parts = text.split(",", -1);
        if (parts.length == 1 && oneDimensional) {
            parts = new String[] {parts[0], "0"};
        }
        if (parts.length != 2) {
            throw new UsageException(option + ": '" + text + "' is not I,Q (two " + (reals ? "numbers" : "integers")
                    + " separated by a comma)");
        }
        double[] v = new double[2];
        for (int n = 0; n < 2; n++) {
            String axis = n == 0 ? "I" : "Q";
            if (reals) {
                v[n] = number(option + " " + axis, parts[n]);
            } else {
                try {
                    v[n] = Long.parseLong(parts[n].trim());
                } catch (NumberFormatException e) {
                    throw new UsageException(option + " " + axis + ": '" + parts[n] + "' is not an integer code");
                }
            }
        }
        return v;
    }

    private static int code(String axis, double value, QFormat in) {
        long c = (long) value;
        if (c < in.minCode() || c > in.maxCode()) {
            throw new UsageException("--codes " + axis + ": " + c + " is outside " + in + " (codes " + in.minCode()
                    + " … " + in.maxCode() + ")");
        }
        return (int) c;
    }

    // ---------------------------------------------------------------- report

    private static final class FloatRow {
        final SoftAlgorithm algorithm;
        double[] llr;
        int decision;
        String reason;

        FloatRow(SoftAlgorithm algorithm) {
            this.algorithm = algorithm;
        }
    }

    private static final class FixedRow {
        final SoftAlgorithm algorithm;
        FixedSoftDemapper datapath;
        int[] codes;
        double[] reference;
        FixedLlrTrace trace;
        int decision;
        String reason;

        FixedRow(SoftAlgorithm algorithm) {
            this.algorithm = algorithm;
        }
    }

    private static final class Report {
        Constellation constellation;
        Normalization normalization;
        LlrOptions options;
        ConstellationRom rom;
        long index;
        double re;
        double im;
        int iCode;
        int qCode;
        boolean clipped;
        int floatSlice;
        int fixedSlice;
        final List<FloatRow> floats = new ArrayList<>();
        final List<FixedRow> fixeds = new ArrayList<>();

        private int k() {
            return constellation.bitsPerSymbol();
        }

        String toText() {
            StringBuilder sb = new StringBuilder();
            Constellation c = constellation;
            QFormat in = rom.format();
            sb.append(String.format(Locale.ROOT, "constellation  %s, %s, %d bits per symbol%n", c, normalization, k()));
            sb.append(String.format(Locale.ROOT, "noise          N0 = %s (Es/N0 = %.3f dB), LLR sign %s, priors %s%n",
                    plain(options.n0()), options.esN0Db(c), options.sign(), priorsText()));
            sb.append(String.format(Locale.ROOT, "sample         I = %s, Q = %s%n", plain(re), plain(im)));
            if (c.alternatesQuarterTurn()) {
                sb.append(index % 2 == 1 ? "symbol         odd index: the points are turned by +90 degrees, (I, Q) -> (-Q, I)"
                        : "symbol         even index (--odd-symbol demaps it as one of odd index)").append(System.lineSeparator());
            }
            sb.append(String.format(Locale.ROOT, "input codes    I = %d, Q = %d (%s, %s) in %s%s%n", iCode, qCode,
                    plain(in.toDouble(iCode)), plain(in.toDouble(qCode)), in.describe(),
                    clipped ? "; the sample was clipped to the input range" : ""));
            sb.append(String.format(Locale.ROOT, "slicers        float %s, fixed %s (ties: toward +I, then +Q)%n",
                    binary(floatSlice), binary(fixedSlice)));
            sb.append(System.lineSeparator()).append("floating point, at the sample").append(System.lineSeparator());
            sb.append(header());
            for (FloatRow row : floats) {
                sb.append(String.format(Locale.ROOT, "  %-18s", row.algorithm));
                if (row.reason != null) {
                    sb.append("n/a: ").append(row.reason).append(System.lineSeparator());
                    continue;
                }
                sb.append(String.format(Locale.ROOT, "%-10s", binary(row.decision)));
                for (double l : row.llr) {
                    sb.append(String.format(Locale.ROOT, " %12.6f", l));
                }
                sb.append(System.lineSeparator());
            }
            sb.append(System.lineSeparator()).append("fixed point, at the input codes (code = value; float at the"
                    + " codes' values below)").append(System.lineSeparator());
            sb.append(header());
            for (FixedRow row : fixeds) {
                sb.append(String.format(Locale.ROOT, "  %-18s", row.algorithm));
                if (row.reason != null) {
                    sb.append("n/a: ").append(row.reason).append(System.lineSeparator());
                    continue;
                }
                QFormat of = row.datapath.spec().output().format();
                sb.append(String.format(Locale.ROOT, "%-10s", binary(row.decision)));
                for (int code : row.codes) {
                    sb.append(String.format(Locale.ROOT, " %12s", code + " = " + plain(of.toDouble(code))));
                }
                sb.append(System.lineSeparator()).append(String.format(Locale.ROOT, "  %-28s", "  float reference"));
                for (double l : row.reference) {
                    sb.append(String.format(Locale.ROOT, " %12.6f", row.datapath.spec().isScaled() ? l
                            : l / row.datapath.idealScaleConstant()));
                }
                sb.append(System.lineSeparator());
            }
            for (FixedRow row : fixeds) {
                if (row.reason != null) {
                    continue;
                }
                FixedSoftDemapper d = row.datapath;
                sb.append(System.lineSeparator()).append(row.algorithm).append(" datapath: ").append(d.spec())
                        .append(System.lineSeparator());
                if (d.spec().isScaled()) {
                    sb.append(String.format(Locale.ROOT, "  K = %s (code %d in %s), ideal %s%n", plain(d.scaleConstant()),
                            d.scaleConstantCode(), d.spec().scaleConstant(), plain(d.idealScaleConstant())));
                } else {
                    sb.append(String.format(Locale.ROOT, "  unscaled: the output is the metric; L = %s x output%n",
                            plain(d.idealScaleConstant())));
                }
                for (FixedLlrTrace.Bit bit : row.trace.bits()) {
                    sb.append(String.format(Locale.ROOT, "  b%d [%s]", bit.bit(), bit.axis()));
                    for (FixedLlrTrace.Value v : bit.values()) {
                        if (!v.name().equals("scale-constant")) { // printed once above
                            sb.append("  ").append(v.name()).append('=').append(valueText(v));
                        }
                    }
                    sb.append(System.lineSeparator());
                }
                sb.append("  overflow events:");
                for (OverflowCounter counter : d.counters()) {
                    sb.append(' ').append(counter.stage()).append(' ').append(counter.events());
                }
                sb.append(System.lineSeparator());
            }
            sb.append(System.lineSeparator()).append("* marks a stage that overflowed. Engineering model, not"
                    + " conformance certification.").append(System.lineSeparator());
            return sb.toString();
        }

        private String header() {
            StringBuilder sb = new StringBuilder(String.format(Locale.ROOT, "  %-18s%-10s", "algorithm", "decision"));
            for (int b = 0; b < k(); b++) {
                sb.append(String.format(Locale.ROOT, " %12s", "b" + b));
            }
            return sb.append(System.lineSeparator()).toString();
        }

        private String priorsText() {
            if (constellation.isUniform()) {
                return "equiprobable";
            }
            return options.priors() ? "from the constellation's probabilities" : "ignored (--no-priors)";
        }

        private String binary(int label) {
            StringBuilder sb = new StringBuilder(Integer.toBinaryString(label));
            while (sb.length() < k()) {
                sb.insert(0, '0');
            }
            return sb.toString();
        }

        private String valueText(FixedLlrTrace.Value v) {
            String mark = v.overflowed() ? "*" : "";
            switch (v.kind()) {
                case LABEL:
                    return binary((int) v.code()) + mark;
                case INDEX:
                    return v.code() + mark;
                default:
                    return v.code() + " (" + plain(v.real()) + ")" + mark;
            }
        }

        String toJson() {
            ObjectMapper mapper = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);
            ObjectNode root = mapper.createObjectNode();
            ObjectNode c = root.putObject("constellation");
            c.put("name", constellation.name());
            c.put("points", constellation.size());
            c.put("bitsPerSymbol", k());
            c.put("labeling", constellation.labeling());
            c.put("normalization", normalization.tradeName());
            ObjectNode noise = root.putObject("noise");
            noise.put("n0", options.n0());
            noise.put("esN0Db", options.esN0Db(constellation));
            root.put("llrSign", options.sign().tradeName());
            root.put("priors", options.priors() && !constellation.isUniform());
            ObjectNode s = root.putObject("sample");
            s.put("i", re);
            s.put("q", im);
            if (constellation.alternatesQuarterTurn()) {
                s.put("oddSymbol", index % 2 == 1);
            }
            ObjectNode input = s.putObject("input");
            input.put("format", rom.format().toString());
            input.put("meaning", rom.format().describe());
            input.put("iCode", iCode);
            input.put("qCode", qCode);
            input.put("iValue", rom.format().toDouble(iCode));
            input.put("qValue", rom.format().toDouble(qCode));
            input.put("clipped", clipped);
            ObjectNode slicers = root.putObject("slicers");
            slicers.put("float", binary(floatSlice));
            slicers.put("fixed", binary(fixedSlice));
            ArrayNode fl = root.putArray("float");
            for (FloatRow row : floats) {
                ObjectNode n = fl.addObject();
                n.put("algorithm", row.algorithm.tradeName());
                n.put("available", row.reason == null);
                if (row.reason != null) {
                    n.put("reason", row.reason);
                    continue;
                }
                n.put("decision", binary(row.decision));
                ArrayNode l = n.putArray("llr");
                for (double v : row.llr) {
                    l.add(v);
                }
            }
            ArrayNode fx = root.putArray("fixed");
            for (FixedRow row : fixeds) {
                ObjectNode n = fx.addObject();
                n.put("algorithm", row.algorithm.tradeName());
                n.put("available", row.reason == null);
                if (row.reason != null) {
                    n.put("reason", row.reason);
                    continue;
                }
                FixedSoftDemapper d = row.datapath;
                FixedLlrSpec sp = d.spec();
                ObjectNode formats = n.putObject("spec");
                formats.put("constantRounding", sp.constantRounding().tradeName());
                formats.put("metric", sp.metric().toString());
                formats.put("scaling", sp.scaling().tradeName());
                if (sp.isScaled()) {
                    formats.put("scaleConstant", sp.scaleConstant().toString());
                    formats.put("scale", sp.scale().toString());
                }
                formats.put("output", sp.output().toString());
                ObjectNode k = n.putObject("scaleConstant");
                k.put("ideal", d.idealScaleConstant());
                k.put("code", d.scaleConstantCode());
                k.put("value", d.scaleConstant());
                n.put("decision", binary(row.decision));
                ArrayNode bits = n.putArray("bits");
                for (FixedLlrTrace.Bit bit : row.trace.bits()) {
                    ObjectNode b = bits.addObject();
                    b.put("bit", bit.bit());
                    b.put("axis", bit.axis());
                    b.put("llrCode", bit.llr());
                    b.put("llrValue", sp.output().format().toDouble(bit.llr()));
                    double ref = row.reference[bit.bit()];
                    b.put("floatReference", sp.isScaled() ? ref : ref / d.idealScaleConstant());
                    ArrayNode values = b.putArray("values");
                    for (FixedLlrTrace.Value v : bit.values()) {
                        ObjectNode vn = values.addObject();
                        vn.put("name", v.name());
                        vn.put("kind", v.kind().name().toLowerCase(Locale.ROOT));
                        vn.put("code", v.code());
                        if (v.kind() == FixedLlrTrace.Kind.CODE) {
                            vn.put("fractionalBits", v.fractionalBits());
                            vn.put("value", v.real());
                        } else if (v.kind() == FixedLlrTrace.Kind.LABEL) {
                            vn.put("binary", binary((int) v.code()));
                        }
                        vn.put("overflowed", v.overflowed());
                    }
                }
                ObjectNode events = n.putObject("overflowEvents");
                for (OverflowCounter counter : d.counters()) {
                    events.put(counter.stage(), counter.events());
                }
            }
            try {
                return mapper.writeValueAsString(root) + System.lineSeparator();
            } catch (JsonProcessingException e) {
                throw new IllegalStateException("could not write the JSON report", e);
            }
        }
    }

    /** The exact decimal expansion of a double, without exponent or trailing zeros. */
    private static String plain(double v) {
        if (v == 0) {
            return "0";
        }
        String exact = new BigDecimal(v).stripTrailingZeros().toPlainString();
        // Doubles that are not short binary fractions (e.g. 0.1) print as their shortest decimal form instead.
        return exact.length() <= 20 ? exact : Double.toString(v);
    }
}
