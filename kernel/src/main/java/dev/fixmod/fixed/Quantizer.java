package dev.fixmod.fixed;

import java.util.Objects;

/**
 * One fixed-point stage's number handling: the format its results take and how they get there (rounding, overflow).
 * The unit a datapath specification is written in, e.g. "LLR output: Q5.0, half-up, saturate".
 */
public record Quantizer(QFormat format, Rounding rounding, Overflow overflow) {

    public Quantizer {
        Objects.requireNonNull(format, "format");
        Objects.requireNonNull(rounding, "rounding");
        Objects.requireNonNull(overflow, "overflow");
    }

    /** The code of {@code x}; see {@link FixedPoint#quantize}. */
    public long quantize(double x, OverflowCounter counter) {
        return FixedPoint.quantize(x, format, rounding, overflow, counter);
    }

    /**
     * Quantizes {@code length} values of {@code x} from {@code xOffset} into {@code codes} from
     * {@code codeOffset}; see {@link FixedPoint#quantize}.
     *
     * @throws IllegalArgumentException naming the index of the first NaN or infinite value
     */
    public void quantize(double[] x, int xOffset, long[] codes, int codeOffset, int length,
                         OverflowCounter counter) {
        Objects.checkFromIndexSize(xOffset, length, x.length);
        Objects.checkFromIndexSize(codeOffset, length, codes.length);
        for (int i = 0; i < length; i++) {
            double v = x[xOffset + i];
            if (Double.isNaN(v) || Double.isInfinite(v)) {
                throw new IllegalArgumentException("value at index " + (xOffset + i) + " is " + v
                        + ": only finite values have a code in " + format);
            }
            codes[codeOffset + i] = FixedPoint.quantize(v, format, rounding, overflow, counter);
        }
    }

    /** Fits an exact intermediate with {@code valueFractionalBits} fractional bits; see {@link FixedPoint#fit}. */
    public long fit(long value, int valueFractionalBits, OverflowCounter counter) {
        return FixedPoint.fit(value, valueFractionalBits, format, rounding, overflow, counter);
    }

    /**
     * Reads the form {@link #toString} writes: a Q format, a rounding and an overflow name separated by blanks,
     * e.g. {@code Q3.8 half-up saturate}.
     *
     * @throws IllegalArgumentException naming the text and what is accepted
     */
    public static Quantizer parse(String text) {
        String[] parts = text == null ? new String[0] : text.trim().split("\\s+");
        if (parts.length != 3) {
            throw new IllegalArgumentException("'" + text + "' is not a quantizer; expected a Q format, a rounding ("
                    + Rounding.names() + ") and an overflow (" + Overflow.names() + "), e.g. Q3.8 half-up saturate");
        }
        return new Quantizer(QFormat.parse(parts[0]), Rounding.fromName(parts[1]), Overflow.fromName(parts[2]));
    }

    /** E.g. {@code Q3.8 half-up saturate}. */
    @Override
    public String toString() {
        return format + " " + rounding + " " + overflow;
    }
}
