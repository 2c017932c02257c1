package dev.fixmod.fixed;

/**
 * Counts the overflow events of one fixed-point stage: every value that did not fit its format and was saturated or
 * wrapped. A datapath owns one counter per stage and passes it to each operation, so reports can say how often each
 * stage clipped. Not thread-safe: one counter per stage per thread, {@link #add merged} afterwards.
 */
public final class OverflowCounter {
    private final String stage;
    private long events;

    public OverflowCounter(String stage) {
        this.stage = java.util.Objects.requireNonNull(stage, "stage");
    }

    /** A counter for code that must pass one but does not report it. */
    public static OverflowCounter unnamed() {
        return new OverflowCounter("unnamed");
    }

    /** The stage name used in reports, e.g. {@code llr-output}. */
    public String stage() {
        return stage;
    }

    /** Records one event. */
    public void record() {
        events++;
    }

    /** Records {@code count} events at once (a batch's tally), {@code count >= 0}. */
    public void record(long count) {
        if (count < 0) {
            throw new IllegalArgumentException("an event count must be >= 0, got " + count);
        }
        events += count;
    }

    /** Adds the events of another counter (e.g. from another thread). */
    public void add(OverflowCounter other) {
        events += other.events;
    }

    public long events() {
        return events;
    }

    public void reset() {
        events = 0;
    }

    @Override
    public String toString() {
        return stage + ": " + events + " overflow events";
    }
}
