package dev.fixmod.verify.compare;

import com.fasterxml.jackson.annotation.JsonProperty;
import java.util.List;

/**
 * The outcome of one comparison: totals, alignment, per-field and per-flag breakdowns, the first mismatches in
 * detail, the vectors around the first failure and the diagnoses. Serialized as is by {@code --json}.
 *
 * @param golden the golden file
 * @param dut the dump (or the second golden file)
 * @param port the port name, or null when compared without a set
 * @param layout the word layout, e.g. {@code llr0:Q3.4,llr1:Q3.4}
 * @param alignment how dump words were lined up with golden vectors
 * @param goldenWords golden vectors read (all of them unless the comparison stopped early)
 * @param compared vectors compared (after the flag filter)
 * @param agreed vectors that agreed
 * @param mismatched vectors that disagreed, including unknown and width words
 * @param unknownWords mismatching dump words with x/z digits
 * @param widthWords mismatching dump words of the wrong width
 * @param filteredOut vectors not compared because they lack the selected flags
 * @param missing golden vectors the dump ends before
 * @param extraWords dump words after the last golden vector (not a failure)
 * @param stoppedAt the vector at which the mismatch limit stopped the comparison, or -1
 * @param fields per-field breakdown
 * @param flags per-flag breakdown
 * @param mismatches the first mismatches in detail
 * @param context the vectors around the first failure (empty when all agree)
 * @param diagnoses the fault kinds recognized, most specific first
 */
public record CompareReport(String golden, String dut, String port, String layout, Alignment alignment,
        long goldenWords, long compared, long agreed, long mismatched, long unknownWords, long widthWords,
        long filteredOut, long missing, long extraWords, long stoppedAt, List<FieldStats> fields,
        List<FlagStats> flags, List<Mismatch> mismatches, List<ContextRow> context, List<Diagnosis> diagnoses) {

    /** True when every compared vector agreed and none is missing. */
    @JsonProperty("agree")
    public boolean agrees() {
        return mismatched == 0 && missing == 0;
    }

    /**
     * @param skipped dump words dropped by the skip option
     * @param leadingUnknown dump words with x/z digits dropped at the start
     * @param latency the latency used, in words
     * @param searched whether the latency was found by search
     * @param window the search window (0 when not searched)
     * @param prefixAgreed vectors of the search prefix that agree at the chosen latency
     * @param prefixCompared vectors of the search prefix scored
     */
    public record Alignment(long skipped, long leadingUnknown, int latency, boolean searched, int window,
            long prefixAgreed, long prefixCompared) {
    }

    /**
     * @param name field name
     * @param format the field's Q format
     * @param mismatches vectors whose field is outside tolerance (or unknown)
     * @param unknown vectors whose field has x/z digits
     * @param maxAbsDiffLsb largest |actual - expected| over mismatches with defined values
     * @param firstIndex first mismatching vector, or -1
     */
    public record FieldStats(String name, String format, long mismatches, long unknown, long maxAbsDiffLsb,
            long firstIndex) {
    }

    /** Vectors carrying one flag: how many were compared and how many mismatched. */
    public record FlagStats(String flag, long compared, long mismatched) {
    }

    /**
     * One mismatching vector.
     *
     * @param index golden vector index
     * @param dutLine line (or word number) of the dump word
     * @param flags the vector's corner-case flags
     * @param kind {@code value}, {@code unknown} or {@code width}
     * @param expected the golden word in hex
     * @param actual the dump word as written (x for unknown digits)
     * @param fields per-field detail (codes absent for unknown or width words)
     */
    public record Mismatch(long index, long dutLine, List<String> flags, String kind, String expected, String actual,
            List<FieldDiff> fields) {
    }

    /**
     * One field of a mismatching vector.
     *
     * @param expectedValue the expected code's real value in the field's Q format
     * @param diffLsb actual - expected in LSB; null when the actual code is undefined
     * @param agrees whether the field is within tolerance
     */
    public record FieldDiff(String name, long expectedCode, Long actualCode, double expectedValue, Double actualValue,
            Long diffLsb, boolean agrees) {
    }

    /** One vector near the first failure. */
    public record ContextRow(long index, long dutLine, List<String> flags, String expected, String actual,
            boolean agrees, boolean first) {
    }

    /** A recognized fault, the vector where it shows first, and what to do about it. */
    public record Diagnosis(FaultKind kind, long index, String message) {
    }
}
