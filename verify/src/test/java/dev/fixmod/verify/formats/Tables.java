package dev.fixmod.verify.formats;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.util.SplittableRandom;

/** Test tables: a layout plus codes covering each field's extremes and random values in between. */
final class Tables {

    final TableSpec spec;
    final long[][] codes;

    Tables(TableSpec spec, long seed) {
        this.spec = spec;
        FieldLayout layout = spec.layout();
        int rows = Math.toIntExact(spec.rows());
        codes = new long[rows][layout.fieldCount()];
        SplittableRandom random = new SplittableRandom(seed);
        for (int r = 0; r < rows; r++) {
            for (int f = 0; f < layout.fieldCount(); f++) {
                var format = layout.field(f).format();
                long min = format.minCode();
                long max = format.maxCode();
                codes[r][f] = switch (r) {
                    case 0 -> min;
                    case 1 -> max;
                    case 2 -> 0;
                    case 3 -> Math.max(min, -1);
                    case 4 -> Math.min(max, 1);
                    default -> min + random.nextLong(max - min + 1);
                };
            }
        }
    }

    /** The same codes under a spec with comment lines (for the commented formats). */
    Tables withComments() {
        return new Tables(spec.withComments(java.util.List.of("fixmod test table " + spec.name(),
                "fields " + spec.layout().describe())), codes);
    }

    private Tables(TableSpec spec, long[][] codes) {
        this.spec = spec;
        this.codes = codes;
    }

    /** I and Q as Q3.8: a 24-bit word, I in bits 23..12. */
    static Tables iq(int rows) {
        return new Tables(TableSpec.of("tx", FieldLayout.of(Field.of("I", "Q3.8"), Field.of("Q", "Q3.8")), rows), 1);
    }

    void writeTo(FileFormat format, OutputStream out) throws IOException {
        try (RowWriter w = format.open(spec, out)) {
            for (int r = 0; r < codes.length; r++) {
                w.write(r, 0, codes[r], 0);
            }
        }
    }

    byte[] bytes(FileFormat format) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        try {
            writeTo(format, out);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return out.toByteArray();
    }

    /** Codes as text, one row per line, fields separated by single spaces. */
    String rowsAsText() {
        StringBuilder sb = new StringBuilder();
        for (long[] row : codes) {
            for (int f = 0; f < row.length; f++) {
                sb.append(f == 0 ? "" : " ").append(row[f]);
            }
            sb.append('\n');
        }
        return sb.toString();
    }
}
