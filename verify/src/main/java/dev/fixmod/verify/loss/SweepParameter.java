package dev.fixmod.verify.loss;

import dev.fixmod.demap.FixedLlrSpec;
import dev.fixmod.demap.SoftAlgorithm;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import java.util.Arrays;
import java.util.Locale;
import java.util.stream.Collectors;

/**
 * The parameters a sweep may vary, each applied to a design. Word-length parameters keep the other field of the
 * format: the input keeps its integer bits, the LLR keeps its fractional bits.
 *
 * <table class="striped">
 *   <caption>Parameters and what a value does to a base of input Q2.9, LLR Q5.0</caption>
 *   <thead><tr><th>name</th><th>value</th><th>result</th></tr></thead>
 *   <tbody>
 *     <tr><td>{@code input-word-length}</td><td>8</td><td>input Q2.5</td></tr>
 *     <tr><td>{@code input-fractional-bits}</td><td>6</td><td>input Q2.6</td></tr>
 *     <tr><td>{@code back-off-db}</td><td>6</td><td>peak coordinate 6 dB below the input's largest value</td></tr>
 *     <tr><td>{@code llr-word-length}</td><td>4</td><td>LLR Q3.0</td></tr>
 *     <tr><td>{@code llr-fractional-bits}</td><td>1</td><td>LLR Q4.1 (same word length)</td></tr>
 *     <tr><td>{@code llr-scale}</td><td>2</td><td>LLRs doubled before the output quantizer</td></tr>
 *     <tr><td>{@code rounding}</td><td>floor</td><td>every receive stage truncates</td></tr>
 *     <tr><td>{@code algorithm}</td><td>folded-linear</td><td>the fixed datapath's algorithm</td></tr>
 *     <tr><td>{@code metric-word-length}</td><td>10</td><td>metric stage of 10 bits (see below)</td></tr>
 *     <tr><td>{@code scale-constant-word-length}</td><td>8</td><td>K in 8 bits (see below)</td></tr>
 *     <tr><td>{@code scale-word-length}</td><td>8</td><td>scale (product) stage of 8 bits (see below)</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>The three internal stages ({@code metric}, {@code scale-constant}, {@code scale}) start from the design's stage:
 * the one it gives, else the kernel's suggestion for it. A new word length keeps the stage's integer bits (its
 * range) and its signedness, and moves the fractional bits (its precision); a word too short for the integer bits
 * has no fractional bit left and loses integer bits from the top: the stage saturates more (its overflow events show
 * it), or K no longer fits and the value is refused. Rounding and overflow stay the stage's. Word lengths are 2 to 32.
 *
 * <table class="striped">
 *   <caption>Stage word lengths applied to a metric stage Q6.18 and a scale constant UQ3.13</caption>
 *   <thead><tr><th>stage</th><th>word length</th><th>result</th><th>why</th></tr></thead>
 *   <tbody>
 *     <tr><td>metric Q6.18</td><td>25</td><td>Q6.18</td><td>unchanged</td></tr>
 *     <tr><td>metric Q6.18</td><td>12</td><td>Q6.5</td><td>13 fractional bits fewer</td></tr>
 *     <tr><td>metric Q6.18</td><td>7</td><td>Q6.0</td><td>no fractional bit left, range intact</td></tr>
 *     <tr><td>metric Q6.18</td><td>5</td><td>Q4.0</td><td>2 integer bits cut: |metric| &ge; 16 saturates</td></tr>
 *     <tr><td>metric Q6.18</td><td>32</td><td>Q6.25</td><td>7 fractional bits more</td></tr>
 *     <tr><td>scale constant UQ3.13</td><td>8</td><td>UQ3.5</td><td>unsigned: no sign bit</td></tr>
 *     <tr><td>scale constant UQ3.13</td><td>2</td><td>UQ2.0</td><td>refused if K &ge; 3.5 (K does not fit)</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>Two parameters cross in a {@link LossSpec.Grid}; they are applied in the order of this enum's constants, so
 * the internal stages come last and start from the stages of the combination's other value.
 */
public enum SweepParameter {
    INPUT_WORD_LENGTH("input-word-length", true),
    INPUT_FRACTIONAL_BITS("input-fractional-bits", true),
    BACK_OFF_DB("back-off-db", true),
    LLR_WORD_LENGTH("llr-word-length", true),
    LLR_FRACTIONAL_BITS("llr-fractional-bits", true),
    LLR_SCALE("llr-scale", true),
    ROUNDING("rounding", false),
    ALGORITHM("algorithm", false),
    METRIC_WORD_LENGTH("metric-word-length", true),
    SCALE_CONSTANT_WORD_LENGTH("scale-constant-word-length", true),
    SCALE_WORD_LENGTH("scale-word-length", true);

    /** The narrowest word of an internal stage (the widest is {@link QFormat#MAX_WORD_LENGTH}). */
    static final int MIN_STAGE_WORD_LENGTH = 2;

    private final String tradeName;
    private final boolean numeric;

    SweepParameter(String tradeName, boolean numeric) {
        this.tradeName = tradeName;
        this.numeric = numeric;
    }

    public String tradeName() {
        return tradeName;
    }

    public boolean isNumeric() {
        return numeric;
    }

    /** Whether a smaller value is cheaper hardware (the sizing question "how few bits suffice"). */
    public boolean isWordLength() {
        return this == INPUT_WORD_LENGTH || this == INPUT_FRACTIONAL_BITS || this == LLR_WORD_LENGTH
                || this == LLR_FRACTIONAL_BITS || isStage();
    }

    /** Whether this parameter sizes an internal stage of the LLR datapath (metric, scale constant, scale). */
    public boolean isStage() {
        return this == METRIC_WORD_LENGTH || this == SCALE_CONSTANT_WORD_LENGTH || this == SCALE_WORD_LENGTH;
    }

    /**
     * The port or setting this parameter changes; two parameters of one grid must change different ones (the input
     * word length and the input fractional bits both set the input format).
     */
    String port() {
        switch (this) {
            case INPUT_WORD_LENGTH:
            case INPUT_FRACTIONAL_BITS:
                return "the input format";
            case LLR_WORD_LENGTH:
            case LLR_FRACTIONAL_BITS:
                return "the LLR format";
            default:
                return tradeName;
        }
    }

    /**
     * The bits of hardware this parameter sizes in {@code d}, {@code smallestN0} the run's smallest noise power: the
     * word length of the port or stage it sets; 0 for parameters that set no width (back-off, LLR scale, rounding,
     * algorithm). A grid's cost is the sum over its two parameters.
     */
    public int bits(Design d, double smallestN0) {
        switch (this) {
            case INPUT_WORD_LENGTH:
            case INPUT_FRACTIONAL_BITS:
                return d.input().format().wordLength();
            case LLR_WORD_LENGTH:
            case LLR_FRACTIONAL_BITS:
                return d.llr().format().wordLength();
            case METRIC_WORD_LENGTH:
                return d.llrSpec(d.receiveRom(), smallestN0).metric().format().wordLength();
            case SCALE_CONSTANT_WORD_LENGTH:
                return d.llrSpec(d.receiveRom(), smallestN0).scaleConstant().wordLength();
            case SCALE_WORD_LENGTH:
                return d.llrSpec(d.receiveRom(), smallestN0).scale().format().wordLength();
            default:
                return 0;
        }
    }

    public static SweepParameter fromName(String name) {
        String key = name == null ? "" : name.trim().toLowerCase(Locale.ROOT);
        for (SweepParameter p : values()) {
            if (p.tradeName.equals(key)) {
                return p;
            }
        }
        throw new IllegalArgumentException("unknown sweep parameter '" + name + "'; expected one of " + names());
    }

    public static String names() {
        return Arrays.stream(values()).map(SweepParameter::tradeName).collect(Collectors.joining(", "));
    }

    /**
     * The design {@code base} with this parameter set to {@code value} (a number for numeric parameters, else a name);
     * {@code smallestN0} is the run's smallest noise power, for which the suggested stages are sized. Setting a stage
     * to the format it already has gives {@code base} itself.
     */
    public Design apply(Design base, String value, double smallestN0) {
        switch (this) {
            case INPUT_WORD_LENGTH: {
                QFormat f = base.input().format();
                return base.withInput(requant(base.input(), QFormat.signed(f.integerBits(),
                        integer(value, 2, 30) - 1 - f.integerBits())));
            }
            case INPUT_FRACTIONAL_BITS: {
                QFormat f = base.input().format();
                return base.withInput(requant(base.input(), QFormat.signed(f.integerBits(), integer(value, 0, 29))));
            }
            case BACK_OFF_DB:
                return base.withBackOffDb(Double.parseDouble(value));
            case LLR_WORD_LENGTH: {
                QFormat f = base.llr().format();
                return base.withLlr(requant(base.llr(), QFormat.signed(integer(value, 2, 12) - 1 - f.fractionalBits(),
                        f.fractionalBits())));
            }
            case LLR_FRACTIONAL_BITS: {
                QFormat f = base.llr().format();
                int frac = integer(value, 0, 11);
                return base.withLlr(requant(base.llr(), QFormat.signed(f.wordLength() - 1 - frac, frac)));
            }
            case LLR_SCALE:
                return base.withLlrScale(Double.parseDouble(value));
            case ROUNDING:
                return base.withRounding(Rounding.fromName(value));
            case ALGORITHM:
                return base.withAlgorithm(SoftAlgorithm.fromName(value));
            case METRIC_WORD_LENGTH: {
                Quantizer m = base.llrSpec(base.receiveRom(), smallestN0).metric();
                Quantizer q = requant(m, stageWord(m.format(), integer(value, MIN_STAGE_WORD_LENGTH,
                        QFormat.MAX_WORD_LENGTH)));
                return q.equals(m) ? base : base.withMetric(q);
            }
            case SCALE_CONSTANT_WORD_LENGTH: {
                QFormat k = scaled(base, smallestN0).scaleConstant();
                QFormat f = stageWord(k, integer(value, MIN_STAGE_WORD_LENGTH, QFormat.MAX_WORD_LENGTH));
                return f.equals(k) ? base : base.withScaleConstant(f);
            }
            case SCALE_WORD_LENGTH: {
                Quantizer s = scaled(base, smallestN0).scale();
                Quantizer q = requant(s, stageWord(s.format(), integer(value, MIN_STAGE_WORD_LENGTH,
                        QFormat.MAX_WORD_LENGTH)));
                return q.equals(s) ? base : base.withScale(q);
            }
            default:
                throw new AssertionError(this);
        }
    }

    private FixedLlrSpec scaled(Design base, double smallestN0) {
        FixedLlrSpec spec = base.llrSpec(base.receiveRom(), smallestN0);
        if (!spec.isScaled()) {
            throw new IllegalArgumentException("an unscaled datapath has no " + (this == SCALE_WORD_LENGTH
                    ? "scale stage" : "scale constant") + " to size; use \"scaling\": \"noise-scaled\"");
        }
        return spec;
    }

    /** {@code f} in {@code word} bits: same signedness and integer bits, fractional bits first (see the table). */
    static QFormat stageWord(QFormat f, int word) {
        int sign = f.isSigned() ? 1 : 0;
        int frac = word - sign - f.integerBits();
        if (frac >= 0) {
            return f.isSigned() ? QFormat.signed(f.integerBits(), frac) : QFormat.unsigned(f.integerBits(), frac);
        }
        return f.isSigned() ? QFormat.signed(word - 1, 0) : QFormat.unsigned(word, 0);
    }

    private static Quantizer requant(Quantizer q, QFormat f) {
        return new Quantizer(f, q.rounding(), q.overflow());
    }

    private static int integer(String value, int min, int max) {
        double d = Double.parseDouble(value);
        if (d != Math.rint(d) || d < min || d > max) {
            throw new IllegalArgumentException(value + " is not a valid number of bits here; expected an integer from "
                    + min + " to " + max);
        }
        return (int) d;
    }
}
