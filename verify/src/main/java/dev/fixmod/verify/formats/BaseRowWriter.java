package dev.fixmod.verify.formats;

import java.io.IOException;
import java.io.OutputStream;

/** Row counting and input checks shared by every format, so all of them reject the same rows the same way. */
abstract class BaseRowWriter implements RowWriter {

    final TableSpec table;
    final FieldLayout layout;
    final ByteSink sink;
    private long written;
    private boolean closed;

    BaseRowWriter(TableSpec table, OutputStream out) {
        this.table = table;
        this.layout = table.layout();
        this.sink = new ByteSink(out);
    }

    @Override
    public final void write(long index, long flags, long[] codes, int offset) throws IOException {
        if (closed) {
            throw new IllegalStateException("table " + table.name() + ": the writer is closed");
        }
        if (written == table.rows()) {
            throw new IllegalStateException("table " + table.name() + " declares " + table.rows()
                    + " rows; row " + (written + 1) + " is one too many");
        }
        if (index < 0) {
            throw new IllegalArgumentException(where(index) + ": the index must be >= 0");
        }
        int named = table.flagNames().size();
        if (named < 64 && (flags >>> named) != 0) {
            throw new IllegalArgumentException(where(index) + ": flag bits 0x"
                    + Long.toHexString(flags >>> named << named) + " have no name (the table names " + named
                    + " flag bits)");
        }
        if (offset < 0 || offset > codes.length - layout.fieldCount()) {
            throw new IllegalArgumentException(where(index) + ": needs " + layout.fieldCount() + " codes at offset "
                    + offset + " of an array of length " + codes.length);
        }
        for (int i = 0; i < layout.fieldCount(); i++) {
            try {
                layout.check(i, codes[offset + i]);
            } catch (IllegalArgumentException e) {
                throw new IllegalArgumentException(where(index) + ": " + e.getMessage(), e);
            }
        }
        row(index, flags, codes, offset);
        written++;
    }

    /** Where a bad row is, for messages (built only on error, so good rows allocate nothing). */
    private String where(long index) {
        return "table " + table.name() + ", row " + written + " (index " + index + ")";
    }

    /** Writes one checked row. */
    abstract void row(long index, long flags, long[] codes, int offset) throws IOException;

    /** Writes what follows the last row (nothing by default). */
    void trailer() throws IOException {
    }

    @Override
    public final void close() throws IOException {
        if (closed) {
            return;
        }
        closed = true;
        try (ByteSink s = sink) {
            if (written < table.rows()) {
                throw new IllegalStateException("table " + table.name() + " declares " + table.rows()
                        + " rows but only " + written + " were written");
            }
            trailer();
        }
    }
}
