package dev.fixmod.verify.cli;

/** The documented exit statuses of every fixmod command. */
public final class ExitStatus {
    /** The job succeeded; for comparisons, everything agreed. */
    public static final int OK = 0;
    /** The job ran but found disagreement (compare, vectors check). */
    public static final int MISMATCH = 1;
    /** Bad input or usage: one message on stderr, nothing written. */
    public static final int USAGE = 2;
    /** A defect in fixmod itself; the message asks for a report. */
    public static final int INTERNAL = 3;

    private ExitStatus() {
    }
}
