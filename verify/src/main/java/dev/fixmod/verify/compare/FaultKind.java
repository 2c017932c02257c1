package dev.fixmod.verify.compare;

import com.fasterxml.jackson.annotation.JsonValue;

/** The kinds of fault a comparison recognizes and names in its diagnoses. */
public enum FaultKind {
    /** Isolated words that differ from the golden word in exactly one bit. */
    FLIPPED_BIT("flipped-bit"),
    /** From one vector on, the dump runs early: a word (a line) is missing from it. */
    DROPPED_WORD("dropped-word"),
    /** From one vector on, the dump runs late because a word repeats its predecessor. */
    DUPLICATED_WORD("duplicated-word"),
    /** From one vector on, the dump runs late by words that are not copies of their predecessor. */
    INSERTED_WORDS("inserted-words"),
    /** From the first vector on, everything agrees at another latency than the one used. */
    LATENCY("latency"),
    /** No latency in the search window makes any prefix vector agree. */
    NO_ALIGNMENT("no-alignment"),
    /** The dump ends before the golden set does. */
    TRUNCATED("truncated"),
    /** Dump words have the wrong number of digits or bits for the port. */
    WORD_WIDTH("word-width"),
    /** Dump words hold x or z digits. */
    UNKNOWN("unknown"),
    /** Every mismatch differs by one LSB in some field, and each mismatching code sits at a limit of its format. */
    SATURATION_LIMIT("saturation-limit"),
    /** Every mismatch differs by one LSB: typical of a rounding mode differing from the golden model's. */
    ONE_LSB("one-lsb"),
    /** Differences of no particular pattern. */
    VALUES("values");

    private final String tradeName;

    FaultKind(String tradeName) {
        this.tradeName = tradeName;
    }

    @JsonValue
    public String tradeName() {
        return tradeName;
    }

    @Override
    public String toString() {
        return tradeName;
    }
}
