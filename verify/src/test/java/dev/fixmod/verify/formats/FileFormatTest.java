package dev.fixmod.verify.formats;

import static java.nio.charset.StandardCharsets.US_ASCII;
import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.util.HexFormat;
import java.util.List;
import org.junit.jupiter.api.Test;

class FileFormatTest {

    private final FieldLayout iq = FieldLayout.of(Field.of("I", "Q3.8"), Field.of("Q", "Q3.8"));

    /** The example row of FileFormat's table: index 7, flag "tie", I = -1, Q = 384. */
    private byte[] exampleRow(FileFormat format) throws IOException {
        TableSpec spec = TableSpec.of("tx", iq, 1).withFlagNames(List.of("sat", "tie"));
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        try (RowWriter w = format.open(spec, out)) {
            w.write(7, 0b10, new long[] {-1, 384}, 0);
        }
        return out.toByteArray();
    }

    private static byte[] hex(String bytes) {
        return HexFormat.ofDelimiter(" ").parseHex(bytes);
    }

    @Test
    void documentedExampleRowInEveryFormat() throws IOException {
        assertEquals("fff180\n", new String(exampleRow(FileFormat.HEX), US_ASCII));
        assertEquals("// tx: 1 words of 24 bits, 6 hex digits per line, fields (two's complement if signed)"
                + " I[23:12] Q3.8, Q[11:0] Q3.8\nfff180\n", new String(exampleRow(FileFormat.HEX_COMMENTED), US_ASCII));
        // -1 * 2^-8 and 384 * 2^-8, exact.
        assertEquals("index,flags,I,Q,I_value,Q_value\n7,tie,-1,384,-0.00390625,1.5\n",
                new String(exampleRow(FileFormat.CSV), US_ASCII));
        assertArrayEquals(hex("ff ff 80 01"), exampleRow(FileFormat.BINARY));
        assertArrayEquals(hex("80 f1 ff 00"), exampleRow(FileFormat.PACKED_BINARY));
        String header = new String(exampleRow(FileFormat.C_HEADER), US_ASCII);
        assertTrue(header.contains("static const int16_t tx[TX_ROWS][TX_FIELDS] = {\n    {-1, 384},\n};\n"), header);
        assertTrue(header.startsWith("/*\n * tx: 1 rows x 2 fields, int16_t each, row-major."), header);
        assertTrue(header.contains("#ifndef FIXMOD_TX_H\n#define FIXMOD_TX_H\n\n#include <stdint.h>\n"), header);
        assertTrue(header.contains(" *   [0] I: Q3.8 (signed, 12-bit word, 8 fractional bits"), header);
        assertTrue(header.endsWith("#endif /* FIXMOD_TX_H */\n"), header);
        byte[] npy = exampleRow(FileFormat.NPY);
        byte[] data = java.util.Arrays.copyOfRange(npy, npy.length - 4, npy.length);
        assertArrayEquals(hex("ff ff 80 01"), data);
    }

    @Test
    void npyHeaderFollowsVersion10OfTheSpec() {
        // NumPy's format spec (numpy.lib.format docstring; from memory): magic "\x93NUMPY", major 1, minor 0,
        // uint16 little-endian HEADER_LEN, then an ASCII dict literal with keys descr, fortran_order, shape, ended
        // by '\n' and padded with spaces so that 6 + 2 + 2 + HEADER_LEN is divisible by 64.
        for (int rows : new int[] {0, 1, 9, 123456}) {
            for (FieldLayout layout : List.of(iq, FieldLayout.of(Field.of("a", "UQ8.0")))) {
                byte[] h = NpyRowWriter.header(TableSpec.of("t", layout, rows));
                assertArrayEquals(new byte[] {(byte) 0x93, 'N', 'U', 'M', 'P', 'Y', 1, 0},
                        java.util.Arrays.copyOf(h, 8));
                int len = (h[8] & 0xFF) | (h[9] & 0xFF) << 8;
                assertEquals(h.length, 10 + len);
                assertEquals(0, h.length % 64);
                String dict = new String(h, 10, len, US_ASCII);
                String descr = layout == iq ? "<i2" : "|u1";
                assertTrue(dict.matches("\\{'descr': '" + java.util.regex.Pattern.quote(descr)
                        + "', 'fortran_order': False, 'shape': \\(" + rows + ", " + layout.fieldCount()
                        + "\\), } *\n"), dict);
            }
        }
    }

    @Test
    void hexLinesParseBackToTheCodes() {
        Tables t = new Tables(TableSpec.of("mix", FieldLayout.of(Field.of("label", "UQ4.0"), Field.of("llr", "Q5.2"),
                Field.of("b", "UQ1.0")), 500), 3);
        String[] lines = new String(t.bytes(FileFormat.HEX), US_ASCII).split("\n", -1);
        assertEquals(501, lines.length);
        assertEquals("", lines[500]);
        for (int r = 0; r < 500; r++) {
            assertEquals(4, lines[r].length(), "fixed width ceil(13/4) = 4 digits");
            assertTrue(lines[r].matches("[0-9a-f]{4}"), lines[r]);
            long word = Long.parseLong(lines[r], 16);
            for (int f = 0; f < 3; f++) {
                assertEquals(t.codes[r][f], t.spec.layout().unpack(word, f), "row " + r + " field " + f);
            }
        }
        // Row 0 holds each field's minimum (0, -128, 0): bits 0000 10000000 0; row 1 the maxima (15, 127, 1).
        assertEquals("0100", lines[0]);
        assertEquals("1eff", lines[1]);
    }

    @Test
    void commentedHexPutsEveryCommentBehindSlashes() {
        TableSpec spec = TableSpec.of("tx", iq, 0).withComments(List.of("fixmod golden vectors", ""));
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        assertEquals("// fixmod golden vectors\n// \n// tx: 0 words of 24 bits, 6 hex digits per line, fields (two's"
                + " complement if signed) I[23:12] Q3.8, Q[11:0] Q3.8\n", write(FileFormat.HEX_COMMENTED, spec, out));
        assertEquals("", write(FileFormat.HEX, spec, new ByteArrayOutputStream()));
    }

    private static String write(FileFormat format, TableSpec spec, ByteArrayOutputStream out) {
        try (RowWriter w = format.open(spec, out)) {
            assertTrue(w != null);
        } catch (IOException e) {
            throw new AssertionError(e);
        }
        return out.toString(US_ASCII);
    }

    @Test
    void everyFormatIsDeterministicByteForByte() {
        for (FileFormat f : FileFormat.values()) {
            assertArrayEquals(Tables.iq(300).bytes(f), Tables.iq(300).bytes(f), f.label());
        }
    }

    @Test
    void rowsAreCheckedWithTheirPosition() throws IOException {
        TableSpec spec = TableSpec.of("tx", iq, 2).withFlagNames(List.of("tie"));
        RowWriter w = FileFormat.CSV.open(spec, new ByteArrayOutputStream());
        w.write(0, 1, new long[] {0, 0}, 0);
        assertEquals("table tx, row 1 (index 5): field Q: code -2049 lies outside Q3.8 (codes -2048..2047)",
                assertThrows(IllegalArgumentException.class, () -> w.write(5, 0, new long[] {0, -2049}, 0))
                        .getMessage());
        assertEquals("table tx, row 1 (index 5): flag bits 0x6 have no name (the table names 1 flag bits)",
                assertThrows(IllegalArgumentException.class, () -> w.write(5, 7, new long[] {0, 0}, 0)).getMessage());
        assertEquals("table tx declares 2 rows but only 1 were written",
                assertThrows(IllegalStateException.class, w::close).getMessage());
        RowWriter full = FileFormat.HEX.open(TableSpec.of("tx", iq, 0), new ByteArrayOutputStream());
        assertEquals("table tx declares 0 rows; row 1 is one too many", assertThrows(IllegalStateException.class,
                () -> full.write(0, 0, new long[] {0, 0}, 0)).getMessage());
        assertEquals("table tx: a C header needs at least one row (ISO C has no empty arrays)",
                assertThrows(IllegalArgumentException.class,
                        () -> FileFormat.C_HEADER.open(TableSpec.of("tx", iq, 0), new ByteArrayOutputStream()))
                        .getMessage());
    }

    @Test
    void tableSpecRejectsNamesThatBreakAFormat() {
        assertThrows(IllegalArgumentException.class, () -> TableSpec.of("int", iq, 1));
        assertThrows(IllegalArgumentException.class, () -> TableSpec.of("tx-1", iq, 1));
        assertEquals("table tx: field name index clashes with a CSV column of the same name",
                assertThrows(IllegalArgumentException.class, () -> TableSpec.of("tx",
                        FieldLayout.of(Field.of("index", "Q7")), 1)).getMessage());
        assertThrows(IllegalArgumentException.class, () -> TableSpec.of("tx",
                FieldLayout.of(Field.of("I", "Q3.8"), Field.of("I_value", "Q7")), 1));
        assertEquals("table tx: comment line 1 must be printable ASCII without '*/', got 'a */ b'",
                assertThrows(IllegalArgumentException.class,
                        () -> TableSpec.of("tx", iq, 1).withComments(List.of("a */ b"))).getMessage());
        assertThrows(IllegalArgumentException.class, () -> TableSpec.of("tx", iq, 1).withFlagNames(List.of("a|b")));
        assertEquals(FileFormat.HEX_COMMENTED, FileFormat.fromName("HEX-commented"));
        assertEquals("unknown file format 'xls'; expected one of hex, hex-commented, csv, binary, packed-binary,"
                + " c-header, npy", assertThrows(IllegalArgumentException.class, () -> FileFormat.fromName("xls"))
                .getMessage());
    }
}
