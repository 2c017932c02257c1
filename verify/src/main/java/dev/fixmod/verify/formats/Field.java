package dev.fixmod.verify.formats;

import dev.fixmod.fixed.QFormat;
import java.util.regex.Pattern;

/**
 * One named field of a word: an integer code in a fixed-point {@link QFormat} (two's complement if signed).
 * The name is used as a CSV column, in C comments and in hex-file comments, so it must be a C identifier.
 *
 * <table class="striped">
 *   <caption>Examples</caption>
 *   <thead><tr><th>field</th><th>width</th><th>codes</th></tr></thead>
 *   <tbody>
 *     <tr><td>{@code new Field("I", QFormat.parse("Q3.8"))}</td><td>12</td><td>−2048 … 2047</td></tr>
 *     <tr><td>{@code new Field("label", QFormat.parse("UQ4.0"))}</td><td>4</td><td>0 … 15</td></tr>
 *     <tr><td>{@code new Field("2x", ...)}</td><td colspan="2">IllegalArgumentException (not an identifier)</td></tr>
 *   </tbody>
 * </table>
 *
 * @param name   a C identifier, 1 … 64 characters: letter or underscore, then letters, digits, underscores
 * @param format the field's fixed-point format; its word length is the field's width
 */
public record Field(String name, QFormat format) {

    private static final Pattern IDENTIFIER = Pattern.compile("[A-Za-z_][A-Za-z0-9_]{0,63}");

    public Field {
        if (name == null || !IDENTIFIER.matcher(name).matches()) {
            throw new IllegalArgumentException("field name '" + name + "' is not accepted; use 1..64 letters, digits"
                    + " or underscores, starting with a letter or underscore (e.g. I, Q, llr_b0)");
        }
        if (format == null) {
            throw new IllegalArgumentException("field " + name + " needs a Q format, e.g. Q3.8 or UQ4.0");
        }
    }

    /** Shorthand for {@code new Field(name, QFormat.parse(format))}. */
    public static Field of(String name, String format) {
        try {
            return new Field(name, QFormat.parse(format));
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException("field " + name + ": " + e.getMessage(), e);
        }
    }

    public int width() {
        return format.wordLength();
    }

    public boolean signed() {
        return format.isSigned();
    }
}
