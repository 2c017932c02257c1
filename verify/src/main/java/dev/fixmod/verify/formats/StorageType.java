package dev.fixmod.verify.formats;

import java.util.List;

/**
 * The integer type that holds codes in binary, C and NumPy files: the narrowest of 8, 16, 32, 64 bits that holds
 * every field. Signed fields (or a mix) use a signed type, in which an unsigned field of width w needs more than w
 * bits; if every field is unsigned, an unsigned type is used.
 *
 * <table class="striped">
 *   <caption>Examples</caption>
 *   <thead><tr><th>fields</th><th>type</th><th>C</th><th>NumPy</th></tr></thead>
 *   <tbody>
 *     <tr><td>Q3.8, Q3.8 (12-bit signed)</td><td>{@link #INT16}</td><td>{@code int16_t}</td><td>{@code <i2}</td></tr>
 *     <tr><td>Q7 (8-bit signed)</td><td>{@link #INT8}</td><td>{@code int8_t}</td><td>{@code |i1}</td></tr>
 *     <tr><td>UQ8.0 (8-bit unsigned)</td><td>{@link #UINT8}</td><td>{@code uint8_t}</td><td>{@code |u1}</td></tr>
 *     <tr><td>Q3.4 with UQ8.0</td><td>{@link #INT16}</td><td>{@code int16_t}</td><td>{@code <i2}</td></tr>
 *     <tr><td>Q31 with UQ32.0</td><td>{@link #INT64}</td><td>{@code int64_t}</td><td>{@code <i8}</td></tr>
 *   </tbody>
 * </table>
 */
public enum StorageType {
    INT8(8, true), INT16(16, true), INT32(32, true), INT64(64, true),
    UINT8(8, false), UINT16(16, false), UINT32(32, false), UINT64(64, false);

    private final int bits;
    private final boolean signed;

    StorageType(int bits, boolean signed) {
        this.bits = bits;
        this.signed = signed;
    }

    public int bits() {
        return bits;
    }

    public int bytes() {
        return bits / 8;
    }

    public boolean signed() {
        return signed;
    }

    /** The {@code <stdint.h>} type name, e.g. {@code int16_t}. */
    public String cName() {
        return (signed ? "int" : "uint") + bits + "_t";
    }

    /** The NumPy dtype string, little-endian, e.g. {@code <i2}; one-byte types have no byte order: {@code |i1}. */
    public String npyDescr() {
        return (bits == 8 ? "|" : "<") + (signed ? "i" : "u") + bytes();
    }

    /** The type for codes of {@code fields} (rule in the class comment). */
    public static StorageType forFields(List<Field> fields) {
        boolean anySigned = fields.stream().anyMatch(Field::signed);
        int need = 0;
        for (Field f : fields) {
            need = Math.max(need, f.width() + (anySigned && !f.signed() ? 1 : 0));
        }
        return of(need, anySigned);
    }

    /** The unsigned type for packed words of {@code width} bits. */
    public static StorageType forWord(int width) {
        return of(width, false);
    }

    private static StorageType of(int needBits, boolean signed) {
        for (StorageType t : values()) {
            if (t.signed == signed && t.bits >= needBits) {
                return t;
            }
        }
        throw new IllegalArgumentException(needBits + " bits do not fit a 64-bit integer");
    }
}
