package dev.fixmod.verify.formats;

import java.io.IOException;
import java.io.OutputStream;

/** One packed word per line, lowercase hex, ceil(W/4) digits; optionally after {@code //} comment lines. */
final class HexRowWriter extends BaseRowWriter {

    private final int digits;

    HexRowWriter(TableSpec table, OutputStream out, boolean comments) throws IOException {
        super(table, out);
        this.digits = layout.hexDigits();
        if (comments) {
            for (String c : table.comments()) {
                sink.put("// ");
                sink.put(c);
                sink.put('\n');
            }
            sink.put("// " + table.name() + ": " + table.rows() + " words of " + layout.wordWidth() + " bits, "
                    + digits + " hex digits per line, fields (two's complement if signed) " + layout.describe()
                    + '\n');
        }
    }

    @Override
    void row(long index, long flags, long[] codes, int offset) throws IOException {
        sink.hexLine(layout.packChecked(codes, offset), digits);
    }
}
