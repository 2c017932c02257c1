package dev.fixmod.fixed;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import org.junit.jupiter.api.Test;

class QFormatTest {
    @Test
    void shortFormsFollowTheDesignConvention() {
        // Convention of DESIGN.md: Qm.n is 1 sign + m integer + n fractional bits; Q15 means Q0.15.
        QFormat q15 = QFormat.parse("Q15");
        assertEquals(16, q15.wordLength());
        assertEquals(-32768, q15.minCode());
        assertEquals(32767, q15.maxCode());
        assertEquals(QFormat.signed(3, 8), QFormat.parse("Q3.8"));
        assertEquals(255, QFormat.parse("UQ0.8").maxCode());
        assertEquals(QFormat.parse("UQ0.8"), QFormat.parse("uq8"));
        assertEquals(QFormat.signedWord(12, 8), QFormat.parse("Q3.8"));
        assertEquals(QFormat.unsignedWord(8, 8), QFormat.parse("UQ0.8"));
        assertEquals("Q1.14 (signed, 16-bit word, 14 fractional bits, range [-2, 1.99993896484375], LSB 2^-14)",
                QFormat.parse("Q1.14").describe());
        assertEquals("Q5.0 (signed, 6-bit word, 0 fractional bits, range [-32, 31], LSB 1)",
                QFormat.parse("Q5.0").describe());
        assertEquals("UQ0.32 (unsigned, 32-bit word, 32 fractional bits, range [0, 0.99999999976716935634613037109375],"
                + " LSB 2^-32)", QFormat.parse("UQ0.32").describe());
        assertEquals("Q0.0 (signed, 1-bit word, 0 fractional bits, range [-1, 0], LSB 1)",
                QFormat.parse("Q0.0").describe());
    }

    @Test
    void everyFormatReadsBackItsShortFormAndHasExactLimits() {
        for (int w = 1; w <= QFormat.MAX_WORD_LENGTH; w++) {
            for (QFormat f : Expect.formatsOfWord(w)) {
                assertEquals(f, QFormat.parse(f.toString()));
                assertEquals(w, f.wordLength());
                // Source: JDK BigDecimal (exact): range and LSB by definition c · 2^-n.
                assertEquals(0, Oracle.real(f.minCode(), f.fractionalBits()).compareTo(new BigDecimal(f.minValue())));
                assertEquals(0, Oracle.real(f.maxCode(), f.fractionalBits()).compareTo(new BigDecimal(f.maxValue())));
                assertEquals(f.isSigned() ? 1L << (w - 1) : 0, -f.minCode());
                assertEquals(f.isSigned() ? (1L << (w - 1)) - 1 : (1L << w) - 1, f.maxCode());
                assertEquals((1L << w) - 1, f.wordMask());
            }
        }
    }

    @Test
    void invalidFormatsSayWhy() {
        assertMessage("Q20.20", "'Q20.20': word length 41 of Q20.20 exceeds 32 bits");
        assertMessage("UQ0.0", "'UQ0.0': an unsigned format needs at least one bit (UQ0.0 has none)");
        assertMessage("Q100", "'Q100': word length 101 of Q0.100 exceeds 32 bits");
        assertMessage("Q999999999.1", "'Q999999999.1': word length 1000000001 of Q999999999.1 exceeds 32 bits");
        for (String bad : new String[] {"12.3", "Q-1.5", "Q1.2.3", "Q", "Q1.", "S1.15", "", " "}) {
            IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> QFormat.parse(bad));
            assertTrue(e.getMessage().contains("is not a Q format; expected Qm.n, Qn, UQm.n or UQn"), e.getMessage());
        }
        assertThrows(IllegalArgumentException.class, () -> QFormat.parse(null));
        assertThrows(IllegalArgumentException.class, () -> QFormat.signedWord(33, 0));
        assertThrows(IllegalArgumentException.class, () -> QFormat.signedWord(8, 8));
        assertThrows(IllegalArgumentException.class, () -> QFormat.unsignedWord(8, 9));
        assertThrows(IllegalArgumentException.class, () -> QFormat.signed(-1, 4));
    }

    private static void assertMessage(String text, String message) {
        assertEquals(message, assertThrows(IllegalArgumentException.class, () -> QFormat.parse(text)).getMessage());
    }
}
