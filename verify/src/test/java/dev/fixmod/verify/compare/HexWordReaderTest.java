package dev.fixmod.verify.compare;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class HexWordReaderTest {
    @Test
    void readsWordsCommentsBlankLinesAndUnderscores() {
        // IEEE 1364-2005 17.2.9: $readmemh data are hex numbers separated by white space, with comments; '_' may
        // appear in numbers (IEEE 1364 3.5.1), x/z digits are allowed.
        HexWordReader r = Dumps.hex("// header\n\n7f80\n  00_01 // trailing\n/* block\n comment */ FFFF\n", "d.hex");
        assertTrue(r.advance());
        assertEquals(0x7F80, r.word());
        assertEquals(3, r.line());
        assertEquals(WordStatus.VALID, r.status());
        assertTrue(r.advance());
        assertEquals(1, r.word());
        assertEquals(4, r.line());
        assertTrue(r.advance());
        assertEquals(0xFFFF, r.word());
        assertEquals(6, r.line());
        assertFalse(r.advance());
    }

    @Test
    void unknownDigitsAreCountedNotRejected() {
        HexWordReader r = Dumps.hex("7fx0\nZZZZ\n", "d.hex");
        assertTrue(r.advance());
        assertEquals(WordStatus.UNKNOWN, r.status());
        assertEquals(0x00F0, r.unknownMask());
        assertEquals(0x7F00, r.word());
        assertTrue(r.advance());
        assertEquals(WordStatus.UNKNOWN, r.status());
        assertEquals(0xFFFF, r.unknownMask());
    }

    @Test
    void wrongDigitCountIsAWidthWord() {
        HexWordReader r = Dumps.hex("07f80\nf80\n", "d.hex");
        assertTrue(r.advance());
        assertEquals(WordStatus.WIDTH, r.status());
        assertEquals(5, r.digits());
        assertTrue(r.advance());
        assertEquals(WordStatus.WIDTH, r.status());
        assertEquals(3, r.digits());
    }

    @Test
    void topDigitBeyondTheWordIsAWidthWord() {
        HexWordReader r = new HexWordReader(new java.io.ByteArrayInputStream("3ff\n7ff\n".getBytes()), "d.hex", 10);
        assertTrue(r.advance());
        assertEquals(WordStatus.VALID, r.status());
        assertTrue(r.advance());
        assertEquals(WordStatus.WIDTH, r.status());
    }

    @Test
    void strayCharacterIsAFormatErrorWithFileLineAndColumn() {
        HexWordReader r = Dumps.hex("7f80\n7g80\n", "dut.hex");
        assertTrue(r.advance());
        DumpFormatException e = assertThrows(DumpFormatException.class, r::advance);
        assertTrue(e.getMessage().startsWith("dut.hex:2:2: unexpected character 'g'"), e.getMessage());
        assertThrows(DumpFormatException.class, Dumps.hex("@10\n", "d.hex")::advance);
        assertThrows(DumpFormatException.class, Dumps.hex("-12\n", "d.hex")::advance);
        assertThrows(DumpFormatException.class, Dumps.hex("/* open\n", "d.hex")::advance);
    }
}
