package dev.fixmod.verify.formats;

import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.regex.Pattern;

/**
 * What a data file holds: a named table of {@code rows} rows, each one code per field of {@code layout}, plus the
 * row's stable index and corner-case flags (printed by the CSV writer) and optional comment lines (printed by the
 * commented hex and C header writers). Every writer checks its input against this, so a file is never half valid.
 *
 * @param name      a C identifier (not a C keyword): the C array name and, upper-cased, its macro prefix
 * @param layout    the fields of each row
 * @param rows      the number of rows that will be written, ≥ 0 (binary headers need it up front)
 * @param flagNames names of flag bits 0, 1, … (at most 64; letters, digits, '_' and '-')
 * @param comments  comment lines: printable ASCII, no {@code *}{@code /}
 */
public record TableSpec(String name, FieldLayout layout, long rows, List<String> flagNames, List<String> comments) {

    private static final Pattern IDENTIFIER = Pattern.compile("[A-Za-z_][A-Za-z0-9_]{0,63}");
    private static final Pattern FLAG = Pattern.compile("[A-Za-z0-9_-]{1,64}");
    private static final Pattern COMMENT = Pattern.compile("[\\x20-\\x7E]*");
    private static final Set<String> C_KEYWORDS = Set.of("auto", "break", "case", "char", "const", "continue",
            "default", "do", "double", "else", "enum", "extern", "float", "for", "goto", "if", "inline", "int", "long",
            "register", "restrict", "return", "short", "signed", "sizeof", "static", "struct", "switch", "typedef",
            "union", "unsigned", "void", "volatile", "while", "_Alignas", "_Alignof", "_Atomic", "_Bool", "_Complex",
            "_Generic", "_Imaginary", "_Noreturn", "_Static_assert", "_Thread_local");

    public TableSpec {
        if (name == null || !IDENTIFIER.matcher(name).matches() || C_KEYWORDS.contains(name)) {
            throw new IllegalArgumentException("table name '" + name + "' is not accepted; use a C identifier of 1..64"
                    + " letters, digits or underscores that is not a C keyword (e.g. tx_symbols)");
        }
        if (layout == null) {
            throw new IllegalArgumentException("table " + name + " needs a field layout");
        }
        if (rows < 0) {
            throw new IllegalArgumentException("table " + name + ": row count must be >= 0, got " + rows);
        }
        flagNames = List.copyOf(flagNames);
        comments = List.copyOf(comments);
        if (flagNames.size() > 64) {
            throw new IllegalArgumentException("table " + name + ": at most 64 flag names, got " + flagNames.size());
        }
        Set<String> flags = new HashSet<>();
        for (String f : flagNames) {
            if (!FLAG.matcher(f).matches() || !flags.add(f)) {
                throw new IllegalArgumentException("table " + name + ": flag name '" + f + "' is "
                        + (FLAG.matcher(f).matches() ? "given twice" : "not accepted; use 1..64 letters, digits, '_' or '-'"));
            }
        }
        for (int i = 0; i < comments.size(); i++) {
            String c = comments.get(i);
            if (!COMMENT.matcher(c).matches() || c.contains("*/")) {
                throw new IllegalArgumentException("table " + name + ": comment line " + (i + 1)
                        + " must be printable ASCII without '*/', got '" + c + "'");
            }
        }
        Set<String> columns = new HashSet<>(List.of("index", "flags"));
        for (Field f : layout.fields()) {
            if (!columns.add(f.name())) {
                throw new IllegalArgumentException("table " + name + ": field name " + f.name()
                        + " clashes with a CSV column of the same name");
            }
            if (f.format().fractionalBits() > 0 && !columns.add(f.name() + "_value")) {
                throw new IllegalArgumentException("table " + name + ": field name " + f.name() + "_value"
                        + " clashes with the CSV value column of field " + f.name());
            }
        }
    }

    /** A table without flag names or comments. */
    public static TableSpec of(String name, FieldLayout layout, long rows) {
        return new TableSpec(name, layout, rows, List.of(), List.of());
    }

    public TableSpec withFlagNames(List<String> names) {
        return new TableSpec(name, layout, rows, names, comments);
    }

    public TableSpec withComments(List<String> lines) {
        return new TableSpec(name, layout, rows, flagNames, lines);
    }
}
