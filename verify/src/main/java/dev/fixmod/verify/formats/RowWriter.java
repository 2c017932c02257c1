package dev.fixmod.verify.formats;

import java.io.Closeable;
import java.io.IOException;

/**
 * Streams the rows of one {@link TableSpec} into one file, in order, holding only a fixed-size buffer in memory.
 * Exactly {@code rows} rows must be written; {@link #close()} then finishes the file and closes the stream.
 */
public interface RowWriter extends Closeable {

    /**
     * Appends the next row.
     *
     * @param index  the row's stable index (≥ 0; only the CSV file prints it)
     * @param flags  corner-case flags, bit i named by {@code flagNames().get(i)} (only the CSV file prints them)
     * @param codes  one code per field at {@code codes[offset …]}, each within its field's format
     * @throws IllegalArgumentException naming the row and field for a bad code, index or flag
     * @throws IllegalStateException    if the table's declared rows have all been written
     */
    void write(long index, long flags, long[] codes, int offset) throws IOException;

    /**
     * Finishes the file and closes the stream.
     *
     * @throws IllegalStateException if fewer rows than declared were written (the stream is closed all the same)
     */
    @Override
    void close() throws IOException;
}
