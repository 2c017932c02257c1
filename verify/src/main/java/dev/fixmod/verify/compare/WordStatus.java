package dev.fixmod.verify.compare;

/** What a dump reader found in one word. */
public enum WordStatus {
    /** A complete word of the expected width. */
    VALID("valid"),
    /** Some digits are {@code x} or {@code z} (IEEE 1364 four-state values): the word has no defined value. */
    UNKNOWN("unknown"),
    /** The word has the wrong number of digits, or its value does not fit the port's width. */
    WIDTH("width");

    private final String tradeName;

    WordStatus(String tradeName) {
        this.tradeName = tradeName;
    }

    @Override
    public String toString() {
        return tradeName;
    }
}
