package dev.fixmod.verify.formats;

import java.io.IOException;
import java.io.OutputStream;
import java.util.Locale;

/** A C header with include guards and one {@code static const} two-dimensional array of {@code <stdint.h>} type. */
final class CHeaderRowWriter extends BaseRowWriter {

    private final StorageType type;
    private final String guard;

    CHeaderRowWriter(TableSpec table, OutputStream out) throws IOException {
        super(table, out);
        if (table.rows() < 1) {
            throw new IllegalArgumentException("table " + table.name() + ": a C header needs at least one row"
                    + " (ISO C has no empty arrays)");
        }
        this.type = layout.storage();
        String prefix = table.name().toUpperCase(Locale.ROOT);
        this.guard = "FIXMOD_" + prefix + "_H";
        sink.put("/*\n");
        for (String c : table.comments()) {
            sink.put(c.isEmpty() ? " *\n" : " * " + c + "\n");
        }
        sink.put(" * " + table.name() + ": " + table.rows() + " rows x " + layout.fieldCount() + " fields, "
                + type.cName() + " each, row-major. A code c of format Qm.n or UQm.n means c * 2^-n.\n");
        for (int i = 0; i < layout.fieldCount(); i++) {
            sink.put(" *   [" + i + "] " + layout.field(i).name() + ": " + layout.field(i).format().describe() + "\n");
        }
        sink.put(" */\n#ifndef " + guard + "\n#define " + guard + "\n\n#include <stdint.h>\n\n");
        sink.put("#define " + prefix + "_ROWS " + table.rows() + "\n");
        sink.put("#define " + prefix + "_FIELDS " + layout.fieldCount() + "\n\n");
        sink.put("static const " + type.cName() + " " + table.name() + "[" + prefix + "_ROWS][" + prefix
                + "_FIELDS] = {\n");
    }

    @Override
    void row(long index, long flags, long[] codes, int offset) throws IOException {
        sink.put("    {");
        for (int i = 0; i < layout.fieldCount(); i++) {
            if (i > 0) {
                sink.put(", ");
            }
            long c = codes[offset + i];
            if (type == StorageType.INT32 && c == Integer.MIN_VALUE) {
                sink.put("(-2147483647 - 1)");
            } else {
                sink.decimal(c);
                if (!type.signed()) {
                    sink.put('u');
                }
            }
        }
        sink.put("},\n");
    }

    @Override
    void trailer() throws IOException {
        sink.put("};\n\n#endif /* " + guard + " */\n");
    }
}
