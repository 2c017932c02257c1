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

    /** Fits an exact intermediate with {@code valueFractionalBits} fractional bits; see {@link FixedPoint#fit}. */
    public long fit(long value, int valueFractionalBits, OverflowCounter counter) {
        return FixedPoint.fit(value, valueFractionalBits, format, rounding, overflow, counter);
    }

    /** E.g. {@code Q3.8 half-up saturate}. */
    @Override
    public String toString() {
        return format + " " + rounding + " " + overflow;
    }
}
