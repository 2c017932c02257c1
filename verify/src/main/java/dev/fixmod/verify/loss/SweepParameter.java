package dev.fixmod.verify.loss;

import dev.fixmod.demap.SoftAlgorithm;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import java.util.Arrays;
import java.util.Locale;
import java.util.stream.Collectors;

/**
 * The parameters a sweep may vary, each applied to the base design. Word-length parameters keep the other field of
 * the format: the input keeps its integer bits, the LLR keeps its fractional bits.
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
 *   </tbody>
 * </table>
 */
public enum SweepParameter {
    INPUT_WORD_LENGTH("input-word-length", true),
    INPUT_FRACTIONAL_BITS("input-fractional-bits", true),
    BACK_OFF_DB("back-off-db", true),
    LLR_WORD_LENGTH("llr-word-length", true),
    LLR_FRACTIONAL_BITS("llr-fractional-bits", true),
    LLR_SCALE("llr-scale", true),
    ROUNDING("rounding", false),
    ALGORITHM("algorithm", false);

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
                || this == LLR_FRACTIONAL_BITS;
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

    /** The base design with this parameter set to {@code value} (a number for numeric parameters, else a name). */
    public Design apply(Design base, String value) {
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
            default:
                throw new AssertionError(this);
        }
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
