package dev.fixmod.verify.compare;

import dev.fixmod.fixed.QFormat;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * How one word of a port packs its fields: fields are listed most significant first (so a complex sample lists I
 * before Q, as the design notes require), each a two's complement or unsigned code in its Q format, with no gaps.
 *
 * <table>
 * <caption>Unpacking the 16-bit word {@code 0x7F80} of the layout {@code i:Q7, q:Q7}</caption>
 * <tr><th>field</th><th>bits</th><th>raw</th><th>code</th><th>value</th></tr>
 * <tr><td>i</td><td>15..8</td><td>0x7F</td><td>127</td><td>127/128</td></tr>
 * <tr><td>q</td><td>7..0</td><td>0x80</td><td>-128</td><td>-1</td></tr>
 * </table>
 */
public final class WordLayout {
    /** One field of a word: its name, its Q format and the bit position of its least significant bit. */
    public record Field(String name, QFormat format, int shift) {
        public Field {
            if (name == null || !name.matches("[A-Za-z][A-Za-z0-9_.-]*")) {
                throw new IllegalArgumentException("field name '" + name
                        + "' is not valid; expected a letter followed by letters, digits, '_', '.' or '-'");
            }
        }

        /** The field's code in {@code word}: sign-extended when the format is signed. */
        public long extract(long word) {
            int bits = format.wordLength();
            long raw = (word >>> shift) & format.wordMask();
            return format.isSigned() ? (raw << (64 - bits)) >> (64 - bits) : raw;
        }
    }

    /** The most bits a packed word may hold: 64, the width of a long. */
    public static final int MAX_WORD_BITS = 64;

    private final List<Field> fields;
    private final int wordBits;

    private WordLayout(List<Field> fields, int wordBits) {
        this.fields = List.copyOf(fields);
        this.wordBits = wordBits;
    }

    /**
     * A layout from its fields' names and formats, most significant field first.
     *
     * @throws IllegalArgumentException when names repeat, the list is empty or the word exceeds 64 bits
     */
    public static WordLayout of(List<String> names, List<QFormat> formats) {
        if (names.isEmpty() || names.size() != formats.size()) {
            throw new IllegalArgumentException("a word layout needs one Q format per field and at least one field");
        }
        int total = 0;
        for (QFormat f : formats) {
            total += f.wordLength();
        }
        if (total > MAX_WORD_BITS) {
            throw new IllegalArgumentException("a word of " + total + " bits exceeds " + MAX_WORD_BITS + " bits");
        }
        List<Field> out = new ArrayList<>();
        int shift = total;
        for (int i = 0; i < names.size(); i++) {
            shift -= formats.get(i).wordLength();
            String name = names.get(i);
            for (Field f : out) {
                if (f.name().equals(name)) {
                    throw new IllegalArgumentException("field name '" + name + "' appears twice in a word layout");
                }
            }
            out.add(new Field(name, formats.get(i), shift));
        }
        return new WordLayout(out, total);
    }

    /**
     * Parses {@code name:Qm.n,name:Qm.n,...} (most significant first), e.g. {@code i:Q1.6,q:Q1.6}.
     *
     * @throws IllegalArgumentException naming the bad element and the accepted form
     */
    public static WordLayout parse(String text) {
        List<String> names = new ArrayList<>();
        List<QFormat> formats = new ArrayList<>();
        for (String part : text.split(",", -1)) {
            int colon = part.indexOf(':');
            if (colon < 0) {
                throw new IllegalArgumentException("layout element '" + part.trim()
                        + "' lacks a format; expected name:Qm.n, e.g. i:Q1.6,q:Q1.6");
            }
            names.add(part.substring(0, colon).trim());
            formats.add(QFormat.parse(part.substring(colon + 1).trim()));
        }
        return of(names, formats);
    }

    public List<Field> fields() {
        return fields;
    }

    public int fieldCount() {
        return fields.size();
    }

    public Field field(int index) {
        return fields.get(index);
    }

    /** The field's index, or -1 when the layout has no field of that name. */
    public int indexOf(String name) {
        for (int i = 0; i < fields.size(); i++) {
            if (fields.get(i).name().equals(name)) {
                return i;
            }
        }
        return -1;
    }

    /** Bits of a packed word: the sum of the fields' word lengths. */
    public int wordBits() {
        return wordBits;
    }

    /** Hex digits of a packed word as {@code $readmemh} files and {@code %h} dumps write it: ceil(bits / 4). */
    public int hexDigits() {
        return (wordBits + 3) / 4;
    }

    /** Mask of the word's bits. */
    public long wordMask() {
        return wordBits == 64 ? -1L : (1L << wordBits) - 1;
    }

    /** Packs field codes (two's complement, most significant field first) into a word; codes must fit. */
    public long pack(long... codes) {
        if (codes.length != fields.size()) {
            throw new IllegalArgumentException("expected " + fields.size() + " field codes, got " + codes.length);
        }
        long word = 0;
        for (int i = 0; i < codes.length; i++) {
            Field f = fields.get(i);
            if (!f.format().contains(codes[i])) {
                throw new IllegalArgumentException("code " + codes[i] + " of field " + f.name() + " is outside "
                        + f.format().describe());
            }
            word |= (codes[i] & f.format().wordMask()) << f.shift();
        }
        return word;
    }

    /** The word as fixed-width lower-case hex, as a {@code %h} dump writes it. */
    public String hex(long word) {
        return String.format(Locale.ROOT, "%0" + hexDigits() + "x", word & wordMask());
    }

    @Override
    public String toString() {
        StringBuilder b = new StringBuilder();
        for (Field f : fields) {
            if (b.length() > 0) {
                b.append(',');
            }
            b.append(f.name()).append(':').append(f.format());
        }
        return b.toString();
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof WordLayout w && w.fields.equals(fields);
    }

    @Override
    public int hashCode() {
        return fields.hashCode();
    }
}
