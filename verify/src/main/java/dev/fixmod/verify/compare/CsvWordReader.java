package dev.fixmod.verify.compare;

import dev.fixmod.verify.formats.Field;
import dev.fixmod.verify.formats.FieldLayout;
import java.io.BufferedReader;
import java.io.IOException;
import java.util.Arrays;
import java.util.Locale;

/**
 * Reads a CSV dump with a header row: one column per field of the layout, found by name (case-insensitive, in any
 * order; other columns are ignored), each cell a signed decimal code. A cell of {@code x}/{@code z} letters is an
 * {@link WordStatus#UNKNOWN} field; a code outside the field's format makes the word a {@link WordStatus#WIDTH}
 * mismatch; anything else that is not an integer is a {@link DumpFormatException} naming file, line and column.
 * Blank lines and lines starting with {@code #} are skipped.
 */
public final class CsvWordReader extends WordReader {
    private final BufferedReader in;
    private final FieldLayout layout;
    private final int[] columnOfField;
    private long currentLine;

    public CsvWordReader(BufferedReader in, String source, FieldLayout layout) {
        super(source);
        this.in = in;
        this.layout = layout;
        this.digits = layout.hexDigits();
        this.columnOfField = new int[layout.fieldCount()];
        try {
            String header = nextLine();
            if (header == null) {
                throw new DumpFormatException(source + ": empty file; a CSV dump starts with a header naming the"
                        + " fields " + names());
            }
            String[] columns = header.split(",", -1);
            Arrays.fill(columnOfField, -1);
            for (int c = 0; c < columns.length; c++) {
                int f = indexOfIgnoreCase(columns[c].trim());
                if (f >= 0) {
                    columnOfField[f] = c;
                }
            }
            for (int f = 0; f < columnOfField.length; f++) {
                if (columnOfField[f] < 0) {
                    throw new DumpFormatException(source + ":" + currentLine + ": header lacks column '"
                            + layout.field(f).name() + "'; the port's fields are " + names());
                }
            }
        } catch (IOException e) {
            throw new DumpFormatException(source + ": " + e.getMessage());
        }
    }

    private String names() {
        StringBuilder b = new StringBuilder();
        for (Field f : layout.fields()) {
            b.append(b.length() == 0 ? "" : ", ").append(f.name());
        }
        return b.toString();
    }

    private int indexOfIgnoreCase(String name) {
        for (int i = 0; i < layout.fieldCount(); i++) {
            if (layout.field(i).name().equalsIgnoreCase(name)) {
                return i;
            }
        }
        return -1;
    }

    private String nextLine() throws IOException {
        String s;
        while ((s = in.readLine()) != null) {
            currentLine++;
            String t = s.trim();
            if (!t.isEmpty() && !t.startsWith("#")) {
                return s;
            }
        }
        return null;
    }

    @Override
    protected boolean read() throws IOException {
        String s = nextLine();
        if (s == null) {
            return false;
        }
        line = currentLine;
        String[] cells = s.split(",", -1);
        long value = 0;
        long unknown = 0;
        WordStatus st = WordStatus.VALID;
        for (int f = 0; f < columnOfField.length; f++) {
            Field field = layout.field(f);
            int shift = layout.shift(f);
            int c = columnOfField[f];
            if (c >= cells.length) {
                throw new DumpFormatException(source + ":" + line + ": " + cells.length + " cells, but column '"
                        + field.name() + "' is column " + (c + 1) + " of the header");
            }
            String cell = cells[c].trim();
            long fieldMask = field.format().wordMask() << shift;
            if (!cell.isEmpty() && cell.toLowerCase(Locale.ROOT).chars().allMatch(ch -> ch == 'x' || ch == 'z')) {
                unknown |= fieldMask;
                if (st == WordStatus.VALID) {
                    st = WordStatus.UNKNOWN;
                }
                continue;
            }
            long code;
            try {
                if (!cell.chars().allMatch(ch -> ch < 128)) {
                    throw new NumberFormatException(cell); // Long.parseLong would take any Unicode digit
                }
                code = Long.parseLong(cell);
            } catch (NumberFormatException e) {
                throw new DumpFormatException(source + ":" + line + ": column '" + field.name() + "' holds '" + cell
                        + "'; expected a signed decimal code of " + field.format() + " (or x for unknown)");
            }
            if (!field.format().contains(code)) {
                st = WordStatus.WIDTH;
            }
            value |= (code << shift) & fieldMask;
        }
        word = value;
        unknownMask = unknown;
        status = st;
        return true;
    }

    @Override
    public void close() throws IOException {
        in.close();
    }
}
