package dev.fixmod.verify.vectors;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.fixmod.fixed.QFormat;
import java.util.List;

/**
 * The fields of one port's vector: in a hex word the first field occupies the most significant bits (so I is above Q
 * and LLR b0 above b1); in binary, C and NumPy files each field is one little-endian integer of
 * {@link #containerBytes()} bytes, in field order. All fields of a port share one width and signedness.
 */
record Layout(List<Field> fields) {

    /** One field: its name, width in bits, signedness and, for a numeric value, its Q format (else null). */
    record Field(String name, int bits, boolean signed, QFormat format) {
    }

    Layout {
        fields = List.copyOf(fields);
    }

    static Layout of(QFormat format, String... names) {
        return new Layout(java.util.Arrays.stream(names)
                .map(n -> new Field(n, format.wordLength(), format.isSigned(), format)).toList());
    }

    static Layout label(int bits) {
        return new Layout(List.of(new Field("label", bits, false, null)));
    }

    int width() {
        return fields.get(0).bits();
    }

    boolean signed() {
        return fields.get(0).signed();
    }

    int wordBits() {
        return width() * fields.size();
    }

    int hexDigits() {
        return (wordBits() + 3) / 4;
    }

    /** 1, 2 or 4: the smallest little-endian container holding one field. */
    int containerBytes() {
        return width() <= 8 ? 1 : width() <= 16 ? 2 : 4;
    }

    /** The C type of one field, e.g. {@code int16_t}. */
    String cType() {
        return (signed() ? "int" : "uint") + containerBytes() * 8 + "_t";
    }

    /** The NumPy dtype descriptor of one field, e.g. {@code <i2}. */
    String npyType() {
        return (containerBytes() == 1 ? "|" : "<") + (signed() ? "i" : "u") + containerBytes();
    }

    ObjectNode toJson() {
        ObjectNode o = JsonNodeFactory.instance.objectNode();
        o.put("word-bits", wordBits());
        o.put("hex-digits", hexDigits());
        o.put("packing", "first field in the most significant bits of the hex word; one little-endian "
                + containerBytes() + "-byte integer per field, in field order, in bin, c and npy");
        o.put("container", cType());
        ArrayNode arr = o.putArray("fields");
        int msb = wordBits() - 1;
        for (Field f : fields) {
            ObjectNode e = arr.addObject();
            e.put("name", f.name());
            e.put("bits", f.bits());
            e.put("signed", f.signed());
            e.put("word-msb", msb);
            e.put("word-lsb", msb - f.bits() + 1);
            msb -= f.bits();
            if (f.format() != null) {
                e.put("q-format", f.format().toString());
                e.put("meaning", f.format().describe());
            }
        }
        return o;
    }
}
