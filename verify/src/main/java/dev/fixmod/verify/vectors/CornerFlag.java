package dev.fixmod.verify.vectors;

/**
 * The flags a vector carries: bit {@link #bit()} of its flags word is set when the vector exercises the case. The
 * manifest holds this glossary; the CSV files list each vector's flags by name, joined by {@code |}.
 *
 * <table class="striped">
 *   <caption>Flags</caption>
 *   <thead><tr><th>bit</th><th>name</th><th>set on</th></tr></thead>
 *   <tbody>
 *     <tr><td>0</td><td>noisy</td><td>channel noise added (the level is in the CSV)</td></tr>
 *     <tr><td>1</td><td>label-sweep</td><td>every label once, without noise</td></tr>
 *     <tr><td>2</td><td>on-threshold</td><td>a coordinate exactly on a decision threshold</td></tr>
 *     <tr><td>3</td><td>threshold-minus-lsb</td><td>a coordinate one LSB below a threshold</td></tr>
 *     <tr><td>4</td><td>threshold-plus-lsb</td><td>a coordinate one LSB above a threshold</td></tr>
 *     <tr><td>5</td><td>tie</td><td>exactly equidistant from two nearest points</td></tr>
 *     <tr><td>6</td><td>min-code</td><td>a coordinate at the most negative code</td></tr>
 *     <tr><td>7</td><td>max-code</td><td>a coordinate at the most positive code</td></tr>
 *     <tr><td>8</td><td>both-axes-full-scale</td><td>both coordinates at the most negative or positive code</td></tr>
 *     <tr><td>9</td><td>zero</td><td>both coordinates zero</td></tr>
 *     <tr><td>10</td><td>llr-probe</td><td>chosen to drive an LLR output to a limit</td></tr>
 *     <tr><td>11</td><td>llr-at-min</td><td>an LLR output equals its lowest code (any vector)</td></tr>
 *     <tr><td>12</td><td>llr-at-max</td><td>an LLR output equals its highest code (any vector)</td></tr>
 *   </tbody>
 * </table>
 */
public enum CornerFlag {
    NOISY("noisy", "channel noise added; the noise level is in the CSV column 'level'"),
    LABEL_SWEEP("label-sweep", "every label once, mapped without noise"),
    ON_THRESHOLD("on-threshold", "a coordinate exactly on a decision threshold of the slicer"),
    THRESHOLD_MINUS_LSB("threshold-minus-lsb", "a coordinate one LSB below a decision threshold"),
    THRESHOLD_PLUS_LSB("threshold-plus-lsb", "a coordinate one LSB above a decision threshold"),
    TIE("tie", "exactly equidistant from two nearest constellation points (the tie rule decides)"),
    MIN_CODE("min-code", "a coordinate at the most negative code of the demapper input format"),
    MAX_CODE("max-code", "a coordinate at the most positive code of the demapper input format"),
    BOTH_AXES_FULL_SCALE("both-axes-full-scale", "both coordinates at the most negative or most positive code"),
    ZERO("zero", "both coordinates zero"),
    LLR_PROBE("llr-probe", "chosen to drive an LLR output to its lowest or highest code"),
    LLR_AT_MIN("llr-at-min", "at least one LLR output equals the lowest code the LLR stage emits"),
    LLR_AT_MAX("llr-at-max", "at least one LLR output equals the highest code of the LLR format");

    private final String tradeName;
    private final String meaning;

    CornerFlag(String tradeName, String meaning) {
        this.tradeName = tradeName;
        this.meaning = meaning;
    }

    /** The flag's bit position in a flags word. */
    public int bit() {
        return ordinal();
    }

    /** The flag's value in a flags word, {@code 1 << bit()}. */
    public int mask() {
        return 1 << ordinal();
    }

    /** The name in the manifest's glossary. */
    public String tradeName() {
        return tradeName;
    }

    /** What the flag means, for the glossary. */
    public String meaning() {
        return meaning;
    }
}
