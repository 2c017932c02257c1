package dev.fixmod.fixed;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

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
        assertEquals("Q1.14 (signed, 16-bit word, 14 fractional bits, range [-2, 1.99993896484375], LSB 2^-14)",
                QFormat.parse("Q1.14").describe());
    }

    @Test
    void invalidFormatsSayWhy() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> QFormat.parse("Q20.20"));
        assertEquals("'Q20.20': word length 41 of Q20.20 exceeds 32 bits", e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> QFormat.parse("12.3"));
    }
}
