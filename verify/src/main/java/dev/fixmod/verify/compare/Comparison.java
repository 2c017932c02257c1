package dev.fixmod.verify.compare;

import dev.fixmod.verify.compare.CompareReport.Alignment;
import dev.fixmod.verify.compare.CompareReport.ContextRow;
import dev.fixmod.verify.compare.CompareReport.Diagnosis;
import dev.fixmod.verify.compare.CompareReport.FieldDiff;
import dev.fixmod.verify.compare.CompareReport.FieldStats;
import dev.fixmod.verify.compare.CompareReport.FlagStats;
import dev.fixmod.verify.compare.CompareReport.Mismatch;
import dev.fixmod.verify.formats.Field;
import dev.fixmod.verify.formats.FieldLayout;
import java.util.ArrayList;
import java.util.List;

/**
 * The comparison engine: lines a dump up with golden words and judges each vector field by field. It streams both
 * inputs through ring buffers of a few hundred words (a few thousand with a latency search), so its memory does not
 * depend on the length of the dump.
 *
 * <p>Order of alignment: the {@code skip} words are dropped from the dump, then (unless disabled) the leading words
 * with x/z digits, then {@code latency} words (fixed, or found by scoring each latency in {@code 0..window} on a
 * prefix of golden vectors and keeping the one with the most agreeing vectors; ties go to the smaller latency).
 * After that, dump word {@code i} answers golden vector {@code i}.
 *
 * <p>A field agrees when |actual - expected| &le; its tolerance in LSB (two's complement codes), or in sign-only
 * mode when both codes are negative or both are not (the hard decision the sign bit of an LLR gives). A word with
 * x/z digits or of the wrong width never agrees.
 */
public final class Comparison {
    /** Shifts tried around the first failure to recognize dropped, duplicated words and latency errors. */
    static final int MAX_SHIFT = 4;
    /** Vectors that must agree after a shift for it to explain the first failure. */
    static final int PROBE = 16;
    /** Fewest agreeing vectors that count as evidence when the files end sooner than {@link #PROBE}. */
    static final int PROBE_MIN = 4;

    private final FieldLayout layout;
    private final CompareOptions options;

    public Comparison(FieldLayout layout, CompareOptions options) {
        if (options.tolerance().length != layout.fieldCount()) {
            throw new IllegalArgumentException("tolerances for " + options.tolerance().length + " fields, but the"
                    + " layout " + layout + " has " + layout.fieldCount());
        }
        this.layout = layout;
        this.options = options;
    }

    /** A ring buffer over one stream of words, indexed from the first word kept. */
    private static final class Lane {
        final WordReader reader;
        final int mask;
        final long[] word;
        final long[] unknown;
        final long[] line;
        final long[] flags;
        final byte[] status;
        final byte[] digits;
        long origin;
        long end;
        boolean eof;
        final VectorFlags flagSource;

        Lane(WordReader reader, int capacity, VectorFlags flagSource) {
            this.reader = reader;
            this.mask = capacity - 1;
            this.word = new long[capacity];
            this.unknown = new long[capacity];
            this.line = new long[capacity];
            this.flags = flagSource == null ? null : new long[capacity];
            this.status = new byte[capacity];
            this.digits = new byte[capacity];
            this.flagSource = flagSource;
        }

        boolean has(long i) {
            while (!eof && end <= i) {
                if (!reader.advance()) {
                    eof = true;
                    break;
                }
                int s = slot(end);
                word[s] = reader.word();
                unknown[s] = reader.unknownMask();
                line[s] = reader.line();
                status[s] = (byte) reader.status().ordinal();
                digits[s] = (byte) Math.min(reader.digits(), 127);
                if (flags != null) {
                    flags[s] = flagSource.flagsOf(end);
                }
                end++;
            }
            return i < end;
        }

        int slot(long i) {
            return (int) ((i + origin) & mask);
        }

        /** Drops the first {@code n} words, reading them if need be; returns how many existed. */
        long drop(long n) {
            long dropped = 0;
            while (dropped < n && has(0)) {
                long k = Math.min(n - dropped, end);
                origin += k;
                end -= k;
                dropped += k;
            }
            return dropped;
        }

        /** Words from index {@code i} to the end of the stream, read through without keeping them. */
        long countFrom(long i) {
            if (!has(i)) {
                return 0;
            }
            long n = end - i;
            while (reader.advance()) {
                n++;
            }
            eof = true;
            return n;
        }

        WordStatus status(long i) {
            return WordStatus.values()[status[slot(i)]];
        }
    }

    /**
     * Compares golden words with a dump and reports.
     *
     * @param golden the golden words of one port (never x/z in a well-formed set)
     * @param flags the golden vectors' corner-case flags
     * @param dut the device's dump
     * @param port port name for the report, or null
     */
    public CompareReport run(WordReader golden, VectorFlags flags, WordReader dut, String port) {
        if (flags == null) {
            flags = VectorFlags.NONE;
        }
        int window = options.alignWindow();
        int prefix = options.alignPrefix();
        int history = Math.max(options.context(), MAX_SHIFT) + 1;
        int ahead = Math.max(options.context(), PROBE) + MAX_SHIFT + 1;
        int need = Math.max(window > 0 ? window + prefix : 0, history + ahead) + 2;
        int capacity = Integer.highestOneBit(need) << 1;
        Lane e = new Lane(golden, capacity, flags);
        Lane a = new Lane(dut, capacity, null);

        long skipped = a.drop(options.skip());
        long leadingUnknown = 0;
        if (options.skipLeadingUnknown()) {
            while (a.has(0) && a.status(0) == WordStatus.UNKNOWN) {
                a.drop(1);
                leadingUnknown++;
            }
        }
        List<Diagnosis> diagnoses = new ArrayList<>();
        int latency = options.latency();
        long prefixAgreed = 0;
        long prefixCompared = 0;
        if (window > 0) {
            long best = -1;
            for (int d = 0; d <= window; d++) {
                long score = 0;
                long scored = 0;
                for (long i = 0; i < prefix && e.has(i) && a.has(d + i); i++) {
                    scored++;
                    if (agrees(e, i, a, d + i)) {
                        score++;
                    }
                }
                if (score > best) {
                    best = score;
                    latency = d;
                    prefixAgreed = score;
                    prefixCompared = scored;
                }
            }
            if (prefixAgreed == 0) {
                latency = 0;
                diagnoses.add(new Diagnosis(FaultKind.NO_ALIGNMENT, 0, "no latency in 0.." + window
                        + " makes any of the first " + prefix + " vectors agree; compared at latency 0"));
            }
        }
        a.drop(latency);
        Alignment alignment = new Alignment(skipped, leadingUnknown, latency, window > 0, window, prefixAgreed,
                prefixCompared);

        int nf = layout.fieldCount();
        List<String> flagNames = flags.names();
        long[] fieldMismatches = new long[nf];
        long[] fieldUnknown = new long[nf];
        long[] fieldMaxDiff = new long[nf];
        long[] fieldFirst = new long[nf];
        java.util.Arrays.fill(fieldFirst, -1);
        long[] flagCompared = new long[flagNames.size()];
        long[] flagMismatched = new long[flagNames.size()];
        List<Mismatch> shown = new ArrayList<>();
        List<ContextRow> context = List.of();

        long compared = 0;
        long mismatched = 0;
        long unknownWords = 0;
        long widthWords = 0;
        long filteredOut = 0;
        long missing = 0;
        long extra = 0;
        long stoppedAt = -1;
        long firstFailure = -1;
        long firstUnknown = -1;
        long firstWidth = -1;
        int widthDigitsSeen = 0;
        long widthLine = 0;
        long firstCompared = -1;
        int shift = 0;
        // Pattern evidence over mismatches with defined values.
        long valueMismatches = 0;
        boolean allOneLsb = true;
        boolean allAtLimit = true;
        boolean allSingleBit = true;
        long adjacent = 0;
        long lastMismatch = Long.MIN_VALUE;
        long firstValue = -1;
        String firstValueBits = "";
        int firstValueField = -1;
        long largestDiff = 0;
        int largestField = -1;

        long i = 0;
        long goldenWords;
        while (true) {
            if (!e.has(i)) {
                extra = a.countFrom(i);
                goldenWords = i;
                break;
            }
            if (!a.has(i)) {
                missing = e.countFrom(i);
                goldenWords = i + missing;
                break;
            }
            long vf = e.flags[e.slot(i)];
            if (options.flagMask() != 0 && (vf & options.flagMask()) == 0) {
                filteredOut++;
                i++;
                continue;
            }
            if (firstCompared < 0) {
                firstCompared = i;
            }
            compared++;
            for (int f = 0; f < flagCompared.length; f++) {
                if ((vf >>> f & 1) != 0) {
                    flagCompared[f]++;
                }
            }
            if (agrees(e, i, a, i)) {
                i++;
                continue;
            }
            mismatched++;
            for (int f = 0; f < flagCompared.length; f++) {
                if ((vf >>> f & 1) != 0) {
                    flagMismatched[f]++;
                }
            }
            if (lastMismatch == i - 1) {
                adjacent++;
            }
            lastMismatch = i;
            WordStatus st = a.status(i);
            int as = a.slot(i);
            int es = e.slot(i);
            if (st == WordStatus.UNKNOWN) {
                unknownWords++;
                if (firstUnknown < 0) {
                    firstUnknown = i;
                }
                for (int f = 0; f < nf; f++) {
                    if (((a.unknown[as] >>> layout.shift(f)) & layout.field(f).format().wordMask()) != 0) {
                        fieldUnknown[f]++;
                        fieldMismatches[f]++;
                        if (fieldFirst[f] < 0) {
                            fieldFirst[f] = i;
                        }
                    }
                }
            } else if (st == WordStatus.WIDTH) {
                widthWords++;
                if (firstWidth < 0) {
                    firstWidth = i;
                    widthDigitsSeen = a.digits[as];
                    widthLine = a.line[as];
                }
            } else {
                valueMismatches++;
                long ew = e.word[es];
                long aw = a.word[as];
                if (Long.bitCount((ew ^ aw) & layout.wordMask()) != 1) {
                    allSingleBit = false;
                }
                boolean oneLsb = true;
                boolean atLimit = true;
                for (int f = 0; f < nf; f++) {
                    Field field = layout.field(f);
                    long ec = layout.unpack(ew, f);
                    long ac = layout.unpack(aw, f);
                    if (fieldAgrees(f, ec, ac)) {
                        continue;
                    }
                    fieldMismatches[f]++;
                    if (fieldFirst[f] < 0) {
                        fieldFirst[f] = i;
                    }
                    long d = Math.abs(ac - ec);
                    if (d > fieldMaxDiff[f]) {
                        fieldMaxDiff[f] = d;
                    }
                    if (d > largestDiff) {
                        largestDiff = d;
                        largestField = f;
                    }
                    if (firstValueField < 0) {
                        firstValueField = f;
                    }
                    if (d != 1) {
                        oneLsb = false;
                    }
                    long min = field.format().minCode();
                    long max = field.format().maxCode();
                    // -max is the lower limit of symmetric saturation.
                    if (ec != min && ec != max && ec != -max && ac != min && ac != max && ac != -max) {
                        atLimit = false;
                    }
                }
                if (firstValue < 0) {
                    firstValue = i;
                    firstValueBits = bitName(ew ^ aw);
                }
                allOneLsb &= oneLsb;
                allAtLimit &= atLimit;
            }
            if (shown.size() < options.show()) {
                shown.add(mismatch(e, a, i, flagNames));
            }
            if (firstFailure < 0) {
                firstFailure = i;
                context = context(e, a, i, flagNames);
                shift = probeShift(e, a, i);
                if (shift != 0) {
                    diagnoses.add(shiftDiagnosis(a, i, i == firstCompared, shift, latency));
                }
            }
            if (options.maxMismatches() > 0 && mismatched >= options.maxMismatches()) {
                stoppedAt = i;
                goldenWords = i + 1;
                break;
            }
            i++;
        }

        if (missing > 0 && !(shift < 0 && missing <= -shift)) {
            diagnoses.add(new Diagnosis(FaultKind.TRUNCATED, goldenWords - missing, "the dump ends after "
                    + (goldenWords - missing) + " aligned words; the golden set has " + goldenWords + " vectors ("
                    + missing + " missing)"));
        }
        if (widthWords > 0) {
            diagnoses.add(new Diagnosis(FaultKind.WORD_WIDTH, firstWidth, widthWords + " dump word(s) do not fit the "
                    + layout.wordWidth() + "-bit word of " + layout.hexDigits() + " hex digits; the first, at "
                    + a.reader.source() + ":" + widthLine + ", has " + widthDigitsSeen + " digits"));
        }
        if (unknownWords > 0) {
            diagnoses.add(new Diagnosis(FaultKind.UNKNOWN, firstUnknown, unknownWords
                    + " dump word(s) hold x/z digits (undriven or uninitialized signals), the first at vector "
                    + firstUnknown));
        }
        if (valueMismatches > 0 && shift == 0) {
            diagnoses.add(patternDiagnosis(valueMismatches, allOneLsb, allAtLimit, allSingleBit, adjacent,
                    firstValue, firstValueField, firstValueBits, largestDiff, largestField));
        }

        List<FieldStats> fieldStats = new ArrayList<>();
        for (int f = 0; f < nf; f++) {
            Field field = layout.field(f);
            fieldStats.add(new FieldStats(field.name(), field.format().toString(), fieldMismatches[f], fieldUnknown[f],
                    fieldMaxDiff[f], fieldFirst[f]));
        }
        List<FlagStats> flagStats = new ArrayList<>();
        for (int f = 0; f < flagNames.size(); f++) {
            if (flagNames.get(f) == null) {
                continue;
            }
            flagStats.add(new FlagStats(flagNames.get(f), flagCompared[f], flagMismatched[f]));
        }
        return new CompareReport(golden.source(), dut.source(), port, layout.toString(), alignment, goldenWords,
                compared, compared - mismatched, mismatched, unknownWords, widthWords, filteredOut, missing, extra,
                stoppedAt, fieldStats, flagStats, List.copyOf(shown), context, List.copyOf(diagnoses));
    }

    private boolean fieldAgrees(int f, long ec, long ac) {
        if (options.signOnly()) {
            return (ec < 0) == (ac < 0);
        }
        return Math.abs(ac - ec) <= options.toleranceOf(f);
    }

    private boolean agrees(Lane e, long ei, Lane a, long ai) {
        int es = e.slot(ei);
        int as = a.slot(ai);
        if (e.status[es] != 0 || a.status[as] != 0) {
            return false;
        }
        long ew = e.word[es];
        long aw = a.word[as];
        if (ew == aw) {
            return true;
        }
        for (int f = 0; f < layout.fieldCount(); f++) {
            if (!fieldAgrees(f, layout.unpack(ew, f), layout.unpack(aw, f))) {
                return false;
            }
        }
        return true;
    }

    /** The shift s (dump word i + s answers vector i from here on) that explains the failure at i, or 0. */
    private int probeShift(Lane e, Lane a, long i) {
        for (int m = 1; m <= MAX_SHIFT; m++) {
            for (int s : new int[] {-m, m}) {
                if (i + s < 0) {
                    continue;
                }
                // Dropped words leave golden vectors i .. i-s-1 without an answer; inserted ones answer nothing.
                long from = i + Math.max(0, -s);
                int n = 0;
                boolean ok = true;
                for (long k = from; k < from + PROBE && e.has(k) && a.has(k + s); k++) {
                    if (!agrees(e, k, a, k + s)) {
                        ok = false;
                        break;
                    }
                    n++;
                }
                boolean endsTogether = !e.has(from + n) || !a.has(from + n + s);
                if (ok && (n >= PROBE || (n >= PROBE_MIN && endsTogether))) {
                    return s;
                }
            }
        }
        return 0;
    }

    private Diagnosis shiftDiagnosis(Lane a, long i, boolean atStart, int s, int latency) {
        long dutLine = a.has(i) ? a.line[a.slot(i)] : -1;
        String where = a.reader.source() + ":" + dutLine;
        if (atStart) {
            int right = latency + s;
            return new Diagnosis(FaultKind.LATENCY, i, "everything agrees " + Math.abs(s) + " word(s) "
                    + (s > 0 ? "later" : "earlier") + " than latency " + latency + " assumes: the device's latency is "
                    + right + (right >= 0 ? " (use --latency " + right + ", or --align-window to search it)"
                    : " (the dump lacks its first " + (-right) + " words)"));
        }
        if (s < 0) {
            return new Diagnosis(FaultKind.DROPPED_WORD, i, (-s)
                    + " dump word(s) missing before " + where + ": from vector " + i + " on, the dump agrees "
                    + (-s) + " word(s) early (a dropped line)");
        }
        boolean repeats = s == 1 && a.has(i) && i >= 1 && a.word[a.slot(i)] == a.word[a.slot(i - 1)]
                && a.status[a.slot(i)] == a.status[a.slot(i - 1)];
        if (repeats) {
            return new Diagnosis(FaultKind.DUPLICATED_WORD, i, where + " repeats the previous word: from vector " + i
                    + " on, the dump agrees one word late (a duplicated line)");
        }
        return new Diagnosis(FaultKind.INSERTED_WORDS, i, s + " extra dump word(s) at " + where + ": from vector "
                + i + " on, the dump agrees " + s + " word(s) late");
    }

    private Diagnosis patternDiagnosis(long count, boolean oneLsb, boolean atLimit, boolean singleBit, long adjacent,
            long first, int firstField, String firstBits, long largest, int largestField) {
        String firstName = layout.field(firstField).name();
        if (oneLsb && atLimit) {
            return new Diagnosis(FaultKind.SATURATION_LIMIT, first, count + " vector(s) differ by 1 LSB, each at a"
                    + " limit of its field's format (first at vector " + first + ", field " + firstName
                    + "): a saturation bound off by one");
        }
        if (oneLsb) {
            return new Diagnosis(FaultKind.ONE_LSB, first, count + " vector(s) differ by exactly 1 LSB (first at"
                    + " vector " + first + ", field " + firstName + "): typical of a rounding mode other than the"
                    + " golden model's, e.g. truncation (floor) instead of half-up");
        }
        if (singleBit && adjacent == 0) {
            return new Diagnosis(FaultKind.FLIPPED_BIT, first, count + " isolated vector(s) differ in exactly one"
                    + " bit; the first, vector " + first + ", in " + firstBits);
        }
        return new Diagnosis(FaultKind.VALUES, first, count + " vector(s) differ, largest by " + largest
                + " LSB in field " + layout.field(largestField).name() + " (first at vector " + first + ")");
    }

    private String bitName(long difference) {
        int bit = Long.numberOfTrailingZeros(difference & layout.wordMask());
        if (Long.bitCount(difference & layout.wordMask()) != 1) {
            return "several bits";
        }
        for (int f = 0; f < layout.fieldCount(); f++) {
            int shift = layout.shift(f);
            if (bit >= shift && bit < shift + layout.field(f).width()) {
                return "word bit " + bit + " (field " + layout.field(f).name() + " bit " + (bit - shift) + ")";
            }
        }
        return "word bit " + bit;
    }

    private Mismatch mismatch(Lane e, Lane a, long i, List<String> flagNames) {
        int es = e.slot(i);
        int as = a.slot(i);
        WordStatus st = a.status(i);
        List<FieldDiff> diffs = new ArrayList<>();
        for (int f = 0; f < layout.fieldCount(); f++) {
            Field field = layout.field(f);
            long ec = layout.unpack(e.word[es], f);
            double ev = field.format().toDouble(ec);
            boolean unknownField = ((a.unknown[as] >>> layout.shift(f)) & field.format().wordMask()) != 0;
            if (st == WordStatus.WIDTH || unknownField) {
                diffs.add(new FieldDiff(field.name(), ec, null, ev, null, null, false));
            } else {
                long ac = layout.unpack(a.word[as], f);
                diffs.add(new FieldDiff(field.name(), ec, ac, ev, field.format().toDouble(ac), ac - ec,
                        fieldAgrees(f, ec, ac)));
            }
        }
        return new Mismatch(i, a.line[as], flagList(e.flags[es], flagNames), st == WordStatus.VALID ? "value"
                : st.toString(), hex(e, i), hex(a, i), diffs);
    }

    private List<ContextRow> context(Lane e, Lane a, long i, List<String> flagNames) {
        List<ContextRow> rows = new ArrayList<>();
        for (long k = Math.max(0, i - options.context()); k <= i + options.context(); k++) {
            if (!e.has(k)) {
                break;
            }
            boolean present = a.has(k);
            rows.add(new ContextRow(k, present ? a.line[a.slot(k)] : -1, flagList(e.flags[e.slot(k)], flagNames),
                    hex(e, k), present ? hex(a, k) : "(end of dump)", present && agrees(e, k, a, k), k == i));
        }
        return List.copyOf(rows);
    }

    private static List<String> flagList(long bits, List<String> names) {
        List<String> out = new ArrayList<>();
        for (int f = 0; f < names.size(); f++) {
            if ((bits >>> f & 1) != 0 && names.get(f) != null) {
                out.add(names.get(f));
            }
        }
        return out;
    }

    private String hex(Lane lane, long i) {
        int s = lane.slot(i);
        int n = lane.status[s] == WordStatus.WIDTH.ordinal() ? Math.min(lane.digits[s], 16) : layout.hexDigits();
        char[] out = new char[n];
        for (int d = 0; d < n; d++) {
            int shiftBits = 4 * (n - 1 - d);
            if (((lane.unknown[s] >>> shiftBits) & 0xF) != 0) {
                out[d] = 'x';
            } else {
                out[d] = Character.forDigit((int) ((lane.word[s] >>> shiftBits) & 0xF), 16);
            }
        }
        return new String(out);
    }
}
