package dev.fixmod.verify.formats;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

/**
 * A word made of named fields, the first field in the most significant bits (so for I then Q, I is the upper half,
 * per the project's convention). Each field holds its code in two's complement (or plain binary if unsigned),
 * masked to its width.
 *
 * <table class="striped">
 *   <caption>Packing with layout I:Q3.8 then Q:Q3.8 (24-bit word, I in bits 23..12, Q in bits 11..0)</caption>
 *   <thead><tr><th>I</th><th>Q</th><th>word (hex)</th></tr></thead>
 *   <tbody>
 *     <tr><td>1</td><td>2</td><td>{@code 001002}</td></tr>
 *     <tr><td>−1</td><td>1</td><td>{@code fff001}</td></tr>
 *     <tr><td>2047</td><td>−2048</td><td>{@code 7ff800}</td></tr>
 *     <tr><td>2048</td><td>0</td><td>IllegalArgumentException (outside Q3.8)</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>Words are at most 64 bits wide; a 64-bit word is held in a {@code long}'s bit pattern.
 */
public final class FieldLayout {

    /** The widest word. */
    public static final int MAX_WORD_WIDTH = 64;

    private final List<Field> fields;
    private final int[] shifts;
    private final long[] masks;
    private final int wordWidth;
    private final StorageType storage;

    private FieldLayout(List<Field> fields) {
        if (fields.isEmpty()) {
            throw new IllegalArgumentException("a word layout needs at least one field, e.g. I:Q3.8,Q:Q3.8");
        }
        Set<String> names = new HashSet<>();
        int width = 0;
        for (Field f : fields) {
            if (f == null) {
                throw new IllegalArgumentException("a word layout's fields must not be null");
            }
            if (!names.add(f.name())) {
                throw new IllegalArgumentException("field name " + f.name() + " appears twice in the word layout");
            }
            width += f.width();
        }
        if (width > MAX_WORD_WIDTH) {
            throw new IllegalArgumentException("the fields " + describe(fields) + " make a " + width
                    + "-bit word; at most " + MAX_WORD_WIDTH + " bits are accepted");
        }
        this.fields = List.copyOf(fields);
        this.wordWidth = width;
        this.shifts = new int[fields.size()];
        this.masks = new long[fields.size()];
        int shift = width;
        for (int i = 0; i < fields.size(); i++) {
            shift -= fields.get(i).width();
            shifts[i] = shift;
            masks[i] = fields.get(i).format().wordMask();
        }
        this.storage = StorageType.forFields(fields);
    }

    /** The layout of {@code fields}, the first one most significant. */
    public static FieldLayout of(Field... fields) {
        return new FieldLayout(List.of(fields));
    }

    /** The layout of {@code fields}, the first one most significant. */
    public static FieldLayout of(List<Field> fields) {
        return new FieldLayout(fields);
    }

    /**
     * Parses {@code name:Qm.n,name:Qm.n,...}, the first field most significant, e.g. {@code I:Q2.9,Q:Q2.9}.
     *
     * @throws IllegalArgumentException naming the bad element and the accepted form
     */
    public static FieldLayout parse(String text) {
        List<Field> parsed = new ArrayList<>();
        for (String part : text.split(",", -1)) {
            int colon = part.indexOf(':');
            if (colon < 0) {
                throw new IllegalArgumentException("layout element '" + part.trim()
                        + "' lacks a format; expected name:Qm.n, e.g. I:Q2.9,Q:Q2.9");
            }
            parsed.add(Field.of(part.substring(0, colon).trim(), part.substring(colon + 1).trim()));
        }
        return new FieldLayout(parsed);
    }

    public List<Field> fields() {
        return fields;
    }

    /** The index of the field named {@code name}, or −1 when the layout has none. */
    public int indexOf(String name) {
        for (int i = 0; i < fields.size(); i++) {
            if (fields.get(i).name().equals(name)) {
                return i;
            }
        }
        return -1;
    }

    public int fieldCount() {
        return fields.size();
    }

    public Field field(int index) {
        return fields.get(index);
    }

    /** The word width W: the sum of the field widths. */
    public int wordWidth() {
        return wordWidth;
    }

    /** The bit position of field {@code index}'s least significant bit within the word. */
    public int shift(int index) {
        return shifts[index];
    }

    /** The mask of the word's W bits. */
    public long wordMask() {
        return wordWidth == 64 ? -1L : (1L << wordWidth) - 1;
    }

    /** Hex digits per word: ceil(W / 4). */
    public int hexDigits() {
        return (wordWidth + 3) / 4;
    }

    /** The integer type that holds every field's codes in binary, C and NumPy files. */
    public StorageType storage() {
        return storage;
    }

    /**
     * Packs one code per field, {@code codes[offset … offset + fieldCount − 1]}, into a word.
     *
     * @throws IllegalArgumentException naming the field if a code lies outside its format
     */
    public long pack(long[] codes, int offset) {
        long word = 0;
        for (int i = 0; i < shifts.length; i++) {
            long code = codes[offset + i];
            check(i, code);
            word |= (code & masks[i]) << shifts[i];
        }
        return word;
    }

    /** {@link #pack} of codes already checked (the row writers check every row before writing it). */
    long packChecked(long[] codes, int offset) {
        long word = 0;
        for (int i = 0; i < shifts.length; i++) {
            word |= (codes[offset + i] & masks[i]) << shifts[i];
        }
        return word;
    }

    /** Throws if {@code code} lies outside field {@code index}'s format. */
    void check(int index, long code) {
        Field f = fields.get(index);
        if (!f.format().contains(code)) {
            throw new IllegalArgumentException("field " + f.name() + ": code " + code + " lies outside "
                    + f.format() + " (codes " + f.format().minCode() + ".." + f.format().maxCode() + ")");
        }
    }

    /** The code of field {@code index} in {@code word}, sign-extended if the field is signed. */
    public long unpack(long word, int index) {
        Field f = fields.get(index);
        long raw = (word >>> shifts[index]) & masks[index];
        if (f.signed()) {
            int unused = 64 - f.width();
            return (raw << unused) >> unused;
        }
        return raw;
    }

    /** E.g. {@code I[23:12] Q3.8, Q[11:0] Q3.8}. */
    public String describe() {
        return describe(fields);
    }

    private static String describe(List<Field> fields) {
        StringBuilder sb = new StringBuilder();
        int shift = fields.stream().mapToInt(Field::width).sum();
        for (Field f : fields) {
            shift -= f.width();
            if (sb.length() > 0) {
                sb.append(", ");
            }
            sb.append(f.name()).append('[').append(shift + f.width() - 1).append(':').append(shift).append("] ")
                    .append(f.format());
        }
        return sb.toString();
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof FieldLayout l && l.fields.equals(fields);
    }

    @Override
    public int hashCode() {
        return fields.hashCode();
    }

    @Override
    public String toString() {
        return describe();
    }
}
