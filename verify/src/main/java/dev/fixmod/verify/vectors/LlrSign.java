package dev.fixmod.verify.vectors;

/**
 * The sign convention of the LLR port (key {@code demapper.llr-sign}). fixmod's own convention is
 * {@code L(b) = ln P(b=0|y) − ln P(b=1|y)}; a device using the opposite asks for {@code one-positive} and every LLR
 * code written is negated (with the LLR stage's overflow mode, so the most negative code is handled as documented).
 */
public enum LlrSign implements TradeNamed {
    /** {@code L = ln P(b=0|y) − ln P(b=1|y)}: positive means "0" is more likely (the default). */
    ZERO_POSITIVE("zero-positive", "L(b) = ln P(b=0|y) - ln P(b=1|y): positive means 0 is more likely"),
    /** {@code L = ln P(b=1|y) − ln P(b=0|y)}: positive means "1" is more likely. */
    ONE_POSITIVE("one-positive", "L(b) = ln P(b=1|y) - ln P(b=0|y): positive means 1 is more likely");

    private final String tradeName;
    private final String meaning;

    LlrSign(String tradeName, String meaning) {
        this.tradeName = tradeName;
        this.meaning = meaning;
    }

    @Override
    public String tradeName() {
        return tradeName;
    }

    /** The formula in words, written into the manifest. */
    public String meaning() {
        return meaning;
    }
}
