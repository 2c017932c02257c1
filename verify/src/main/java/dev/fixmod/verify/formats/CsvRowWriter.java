package dev.fixmod.verify.formats;

import java.io.IOException;
import java.io.OutputStream;
import java.util.List;

/** CSV with a header: index, flags, one code column per field, one exact value column per fractional field. */
final class CsvRowWriter extends BaseRowWriter {

    private final List<Field> fields;
    private final List<String> flagNames;

    CsvRowWriter(TableSpec table, OutputStream out) throws IOException {
        super(table, out);
        this.fields = layout.fields();
        this.flagNames = table.flagNames();
        sink.put("index,flags");
        for (Field f : fields) {
            sink.put(',');
            sink.put(f.name());
        }
        for (Field f : fields) {
            if (f.format().fractionalBits() > 0) {
                sink.put(',');
                sink.put(f.name());
                sink.put("_value");
            }
        }
        sink.put('\n');
    }

    @Override
    void row(long index, long flags, long[] codes, int offset) throws IOException {
        sink.decimal(index);
        sink.put(',');
        boolean first = true;
        for (int bit = 0; bit < flagNames.size(); bit++) {
            if ((flags >>> bit & 1) != 0) {
                if (!first) {
                    sink.put('|');
                }
                sink.put(flagNames.get(bit));
                first = false;
            }
        }
        for (int i = 0; i < fields.size(); i++) {
            sink.put(',');
            sink.decimal(codes[offset + i]);
        }
        for (int i = 0; i < fields.size(); i++) {
            int n = fields.get(i).format().fractionalBits();
            if (n > 0) {
                sink.put(',');
                sink.fixed(codes[offset + i], n);
            }
        }
        sink.put('\n');
    }
}
