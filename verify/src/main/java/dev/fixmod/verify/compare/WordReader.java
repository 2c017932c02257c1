package dev.fixmod.verify.compare;

import java.io.Closeable;
import java.io.IOException;
import java.io.UncheckedIOException;

/**
 * A stream of words read from a dump one at a time, so that a dump of any length compares in bounded memory. After
 * {@link #advance()} returns true, the accessors describe the current word; the reader allocates nothing per word.
 */
public abstract class WordReader implements Closeable {
    /** The file name used in messages. */
    protected final String source;
    protected long word;
    protected long unknownMask;
    protected WordStatus status = WordStatus.VALID;
    protected long line;
    protected int digits;

    protected WordReader(String source) {
        this.source = source;
    }

    /**
     * Moves to the next word.
     *
     * @return false at the end of the dump
     * @throws DumpFormatException when the text is not a dump of words, naming file and line
     */
    public final boolean advance() {
        try {
            return read();
        } catch (IOException e) {
            throw new UncheckedIOException(source + ": " + e.getMessage(), e);
        }
    }

    protected abstract boolean read() throws IOException;

    /** The word's bits (unknown digits read as 0). */
    public final long word() {
        return word;
    }

    /** Bits whose digit was {@code x} or {@code z}; 0 for a word without unknown digits. */
    public final long unknownMask() {
        return unknownMask;
    }

    public final WordStatus status() {
        return status;
    }

    /** The 1-based line of the word in its file (for binary dumps: the 1-based word number). */
    public final long line() {
        return line;
    }

    /** Digits the word was written with (hex digits for hex dumps; the expected count for other formats). */
    public final int digits() {
        return digits;
    }

    public final String source() {
        return source;
    }
}
