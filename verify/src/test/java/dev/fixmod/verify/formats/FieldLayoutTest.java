package dev.fixmod.verify.formats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import dev.fixmod.fixed.QFormat;
import java.util.List;
import org.junit.jupiter.api.Test;

class FieldLayoutTest {

    private final FieldLayout iq = FieldLayout.of(Field.of("I", "Q3.8"), Field.of("Q", "Q3.8"));

    private long pack(FieldLayout layout, long... codes) {
        return layout.pack(codes, 0);
    }

    @Test
    void packsTheDocumentedExamplesWithIInTheUpperHalf() {
        // DESIGN.md: "In packed hex words the I field is the more significant half"; two's complement per field
        // (common practice, no source).
        assertEquals(24, iq.wordWidth());
        assertEquals(6, iq.hexDigits());
        assertEquals(12, iq.shift(0));
        assertEquals(0, iq.shift(1));
        assertEquals(0x001002L, pack(iq, 1, 2));
        assertEquals(0xfff001L, pack(iq, -1, 1));
        assertEquals(0x7ff800L, pack(iq, 2047, -2048));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> pack(iq, 2048, 0));
        assertEquals("field I: code 2048 lies outside Q3.8 (codes -2048..2047)", e.getMessage());
        assertEquals("I[23:12] Q3.8, Q[11:0] Q3.8", iq.describe());
    }

    @Test
    void unpackSignExtendsSignedFieldsOnly() {
        FieldLayout mixed = FieldLayout.of(Field.of("label", "UQ4.0"), Field.of("llr", "Q5.2"), Field.of("b", "UQ1.0"));
        assertEquals(13, mixed.wordWidth());
        assertEquals(4, mixed.hexDigits());
        long word = pack(mixed, 15, -128, 1);
        assertEquals(0b1111_10000000_1L, word);
        assertEquals(15, mixed.unpack(word, 0));
        assertEquals(-128, mixed.unpack(word, 1));
        assertEquals(1, mixed.unpack(word, 2));
        assertThrows(IllegalArgumentException.class, () -> pack(mixed, -1, 0, 0));
    }

    @Test
    void sixtyFourBitWordsUseTheWholeLong() {
        FieldLayout wide = FieldLayout.of(Field.of("hi", "Q31"), Field.of("lo", "UQ32.0"));
        long word = pack(wide, -1, 0xFFFF_FFFFL);
        assertEquals(-1L, word);
        assertEquals(-1, wide.unpack(word, 0));
        assertEquals(0xFFFF_FFFFL, wide.unpack(word, 1));
        assertEquals(16, wide.hexDigits());
        assertEquals(StorageType.INT64, wide.storage());
    }

    @Test
    void rejectsBadLayouts() {
        assertEquals("field name I appears twice in the word layout", assertThrows(IllegalArgumentException.class,
                () -> FieldLayout.of(Field.of("I", "Q7"), Field.of("I", "Q7"))).getMessage());
        assertEquals("the fields a[71:40] Q0.31, b[39:8] Q0.31, c[7:0] Q0.7 make a 72-bit word; at most 64 bits are"
                + " accepted", assertThrows(IllegalArgumentException.class,
                () -> FieldLayout.of(Field.of("a", "Q31"), Field.of("b", "Q31"), Field.of("c", "Q7"))).getMessage());
        assertThrows(IllegalArgumentException.class, () -> FieldLayout.of(List.of()));
        assertEquals("field name '2x' is not accepted; use 1..64 letters, digits or underscores, starting with a"
                + " letter or underscore (e.g. I, Q, llr_b0)", assertThrows(IllegalArgumentException.class,
                () -> new Field("2x", QFormat.parse("Q7"))).getMessage());
        assertThrows(IllegalArgumentException.class, () -> Field.of("I", "Q3.x"));
    }

    @Test
    void storageTypesOfTheDocumentedTable() {
        assertEquals(StorageType.INT16, iq.storage());
        assertEquals(StorageType.INT8, FieldLayout.of(Field.of("a", "Q7")).storage());
        assertEquals(StorageType.UINT8, FieldLayout.of(Field.of("a", "UQ8.0")).storage());
        assertEquals(StorageType.INT16, FieldLayout.of(Field.of("a", "Q3.4"), Field.of("b", "UQ8.0")).storage());
        assertEquals(StorageType.INT8, FieldLayout.of(Field.of("a", "Q3.4"), Field.of("b", "UQ7.0")).storage());
        assertEquals(StorageType.UINT32, FieldLayout.of(Field.of("a", "UQ32.0")).storage());
        assertEquals("int16_t", StorageType.INT16.cName());
        assertEquals("<i2", StorageType.INT16.npyDescr());
        assertEquals("|u1", StorageType.UINT8.npyDescr());
        assertEquals("<u4", StorageType.UINT32.npyDescr());
        assertEquals(StorageType.UINT32, StorageType.forWord(24));
        assertEquals(StorageType.UINT64, StorageType.forWord(33));
    }
}
