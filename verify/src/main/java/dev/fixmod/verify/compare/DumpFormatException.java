package dev.fixmod.verify.compare;

/**
 * A dump or golden file cannot be read as words: the message names the file, the line (or byte offset) and what
 * would have been accepted. The command line turns it into one message and exit status 2.
 */
public final class DumpFormatException extends IllegalArgumentException {
    private static final long serialVersionUID = 1L;

    public DumpFormatException(String message) {
        super(message);
    }
}
