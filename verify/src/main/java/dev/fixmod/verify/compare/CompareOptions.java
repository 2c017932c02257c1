package dev.fixmod.verify.compare;

import java.util.Arrays;

/**
 * How to line up and judge a dump against golden words. Build with {@link #exact(int)} and the {@code with}
 * methods; every value is validated here.
 *
 * @param latency words of device delay: dump word {@code skip + latency + i} (after leading unknown words) answers
 *        golden vector {@code i}; ignored when {@code alignWindow > 0}
 * @param alignWindow when positive, the latency is searched in {@code 0..alignWindow} instead
 * @param alignPrefix golden vectors the search scores each latency on
 * @param skip dump words dropped before anything else (e.g. words written during reset)
 * @param skipLeadingUnknown whether leading words with x/z digits (after {@code skip}) are dropped as invalid
 * @param tolerance per field, the largest |actual - expected| in LSB that still agrees (0 = exact)
 * @param signOnly compare only the sign of each field (LLRs: the hard decision they imply)
 * @param flagMask when non-zero, only vectors carrying at least one of these flags are compared
 * @param maxMismatches stop after this many mismatching words (0 = never stop)
 * @param show mismatches listed in detail in the report
 * @param context vectors shown before and after the first failure
 */
public record CompareOptions(int latency, int alignWindow, int alignPrefix, long skip, boolean skipLeadingUnknown,
        long[] tolerance, boolean signOnly, long flagMask, long maxMismatches, int show, int context) {

    /** The largest latency search window, so the search buffer stays small. */
    public static final int MAX_ALIGN_WINDOW = 1 << 16;

    public CompareOptions {
        require(latency >= 0, "latency must be >= 0 words, got " + latency);
        require(alignWindow >= 0 && alignWindow <= MAX_ALIGN_WINDOW,
                "align window must be 0.." + MAX_ALIGN_WINDOW + " words, got " + alignWindow);
        require(alignPrefix >= 1 && alignPrefix <= MAX_ALIGN_WINDOW,
                "align prefix must be 1.." + MAX_ALIGN_WINDOW + " vectors, got " + alignPrefix);
        require(skip >= 0, "skip must be >= 0 words, got " + skip);
        require(maxMismatches >= 0, "max mismatches must be >= 0 (0 = no limit), got " + maxMismatches);
        require(show >= 0 && show <= 100_000, "show must be 0..100000 mismatches, got " + show);
        require(context >= 0 && context <= 64, "context must be 0..64 vectors, got " + context);
        tolerance = tolerance.clone();
        for (long t : tolerance) {
            require(t >= 0, "a tolerance must be >= 0 LSB, got " + t);
        }
    }

    private static void require(boolean ok, String message) {
        if (!ok) {
            throw new IllegalArgumentException(message);
        }
    }

    /** Exact comparison of {@code fields} fields, latency 0, leading unknown words dropped, 10 mismatches shown. */
    public static CompareOptions exact(int fields) {
        return new CompareOptions(0, 0, 256, 0, true, new long[fields], false, 0, 0, 10, 3);
    }

    @Override
    public long[] tolerance() {
        return tolerance.clone();
    }

    long toleranceOf(int field) {
        return tolerance[field];
    }

    public CompareOptions withLatency(int words) {
        return new CompareOptions(words, 0, alignPrefix, skip, skipLeadingUnknown, tolerance, signOnly, flagMask,
                maxMismatches, show, context);
    }

    public CompareOptions withAlignWindow(int words) {
        return new CompareOptions(latency, words, alignPrefix, skip, skipLeadingUnknown, tolerance, signOnly,
                flagMask, maxMismatches, show, context);
    }

    public CompareOptions withSkip(long words) {
        return new CompareOptions(latency, alignWindow, alignPrefix, words, skipLeadingUnknown, tolerance, signOnly,
                flagMask, maxMismatches, show, context);
    }

    public CompareOptions withSkipLeadingUnknown(boolean on) {
        return new CompareOptions(latency, alignWindow, alignPrefix, skip, on, tolerance, signOnly, flagMask,
                maxMismatches, show, context);
    }

    public CompareOptions withTolerance(long[] lsb) {
        return new CompareOptions(latency, alignWindow, alignPrefix, skip, skipLeadingUnknown, lsb, signOnly,
                flagMask, maxMismatches, show, context);
    }

    public CompareOptions withSignOnly(boolean on) {
        return new CompareOptions(latency, alignWindow, alignPrefix, skip, skipLeadingUnknown, tolerance, on,
                flagMask, maxMismatches, show, context);
    }

    public CompareOptions withFlagMask(long mask) {
        return new CompareOptions(latency, alignWindow, alignPrefix, skip, skipLeadingUnknown, tolerance, signOnly,
                mask, maxMismatches, show, context);
    }

    public CompareOptions withMaxMismatches(long n) {
        return new CompareOptions(latency, alignWindow, alignPrefix, skip, skipLeadingUnknown, tolerance, signOnly,
                flagMask, n, show, context);
    }

    public CompareOptions withShow(int n) {
        return new CompareOptions(latency, alignWindow, alignPrefix, skip, skipLeadingUnknown, tolerance, signOnly,
                flagMask, maxMismatches, n, context);
    }

    public CompareOptions withContext(int n) {
        return new CompareOptions(latency, alignWindow, alignPrefix, skip, skipLeadingUnknown, tolerance, signOnly,
                flagMask, maxMismatches, show, n);
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof CompareOptions c && c.latency == latency && c.alignWindow == alignWindow
                && c.alignPrefix == alignPrefix && c.skip == skip && c.skipLeadingUnknown == skipLeadingUnknown
                && Arrays.equals(c.tolerance, tolerance) && c.signOnly == signOnly && c.flagMask == flagMask
                && c.maxMismatches == maxMismatches && c.show == show && c.context == context;
    }

    @Override
    public int hashCode() {
        return Arrays.hashCode(tolerance) * 31 + Long.hashCode(skip) + latency * 7 + alignWindow * 13;
    }

    @Override
    public String toString() {
        return "CompareOptions[latency=" + latency + ", alignWindow=" + alignWindow + ", skip=" + skip
                + ", tolerance=" + Arrays.toString(tolerance) + ", signOnly=" + signOnly + "]";
    }
}
