package dev.fixmod.demap;

import java.util.List;
import java.util.Objects;

/**
 * The intermediate values of a fixed-point LLR datapath for one received sample, bit by bit: what a verification
 * engineer compares against the RTL's internal signals when one vector disagrees.
 *
 * @param iCode the I input code
 * @param qCode the Q input code
 * @param bits  one entry per label bit, b0 first
 */
public record FixedLlrTrace(int iCode, int qCode, List<Bit> bits) {

    public FixedLlrTrace {
        bits = List.copyOf(bits);
    }

    /**
     * One bit's path through the datapath.
     *
     * @param bit    the label bit index (0 = b0, the first in time)
     * @param axis   {@code I} or {@code Q} for the per-axis datapaths, {@code IQ} for the exhaustive one
     * @param values the intermediate values in datapath order, ending with the {@code output} stage
     * @param llr    the output code (the same as the datapath's batch methods return)
     */
    public record Bit(int bit, String axis, List<Value> values, int llr) {
        public Bit {
            Objects.requireNonNull(axis, "axis");
            values = List.copyOf(values);
        }

        /** The value named {@code name}. */
        public Value value(String name) {
            for (Value v : values) {
                if (v.name().equals(name)) {
                    return v;
                }
            }
            throw new IllegalArgumentException("bit " + bit + " has no value '" + name + "'");
        }
    }

    /** What a traced integer is. */
    public enum Kind {
        /** A fixed-point code: its real value is {@code code · 2^−fractionalBits}. */
        CODE,
        /** A symbol label (print it in binary, b0 first). */
        LABEL,
        /** An index, e.g. a segment of a piecewise-linear table. */
        INDEX
    }

    /**
     * One intermediate integer.
     *
     * @param name           e.g. {@code level0}, {@code metric}, {@code output}
     * @param kind           how to read {@code code}
     * @param code           the integer the datapath holds
     * @param fractionalBits the code's fractional bits (0 unless {@link Kind#CODE})
     * @param overflowed     whether the stage that produced it recorded an overflow event
     */
    public record Value(String name, Kind kind, long code, int fractionalBits, boolean overflowed) {
        public Value {
            Objects.requireNonNull(name, "name");
            Objects.requireNonNull(kind, "kind");
        }

        static Value code(String name, long code, int fractionalBits, boolean overflowed) {
            return new Value(name, Kind.CODE, code, fractionalBits, overflowed);
        }

        static Value label(String name, long label) {
            return new Value(name, Kind.LABEL, label, 0, false);
        }

        static Value index(String name, long index) {
            return new Value(name, Kind.INDEX, index, 0, false);
        }

        /** The real value of a code (exact for codes of up to 53 bits). */
        public double real() {
            return Math.scalb((double) code, -fractionalBits);
        }
    }
}
