package dev.fixmod.verify.vectors;

import dev.fixmod.names.TradeNamed;

/** The groups of corner-case vectors a specification may ask for (key {@code corner-cases}); all by default. */
public enum CornerGroup implements TradeNamed {
    /** Every label once, mapped and demapped without noise. */
    LABELS("labels"),
    /** Demapper inputs exactly on each decision threshold and one LSB either side. */
    THRESHOLDS("thresholds"),
    /** Demapper inputs exactly equidistant from two nearest points. */
    TIES("ties"),
    /** The most negative and most positive codes, on one axis and on both. */
    EXTREMES("extremes"),
    /** The zero input. */
    ZERO("zero"),
    /** Inputs that drive each LLR output to its lower and upper limit. */
    LLR_LIMITS("llr-limits");

    private final String tradeName;

    CornerGroup(String tradeName) {
        this.tradeName = tradeName;
    }

    @Override
    public String tradeName() {
        return tradeName;
    }
}
