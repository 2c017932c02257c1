package dev.fixmod.map;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Constellations;
import dev.fixmod.constellation.Normalization;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import org.junit.jupiter.api.Test;

class ConstellationRomTest {
    private static Quantizer q(String format, Overflow overflow) {
        return new Quantizer(QFormat.parse(format), Rounding.HALF_EVEN, overflow);
    }

    @Test
    void bpskInQ15SaturatesPlusOneAndCountsIt() {
        // Q15 codes are -32768..32767 (DESIGN.md Q convention): +1.0 is one LSB above the top code.
        ConstellationRom rom = ConstellationRom.of(Constellations.pam(2, true), q("Q15", Overflow.SATURATE));
        assertEquals(-32768, rom.iCode(0));
        assertEquals(32767, rom.iCode(1));
        assertEquals(0, rom.qCode(0));
        assertEquals(1, rom.overflowCount());
        assertEquals(1.0, rom.maxErrorLsb());
    }

    @Test
    void unitEnergyQamCodesMatchABigDecimalOracle() {
        // 16-QAM on ±1, ±3 has E_s = 10 (Proakis, square QAM average energy 2(M-1)/3); unit energy scales by 1/√10.
        ConstellationRom rom = ConstellationRom.normalized(Constellations.qam(16, true), Normalization.UNIT_ENERGY,
                q("Q15", Overflow.SATURATE));
        for (int level : new int[] {1, 3}) {
            BigDecimal ideal = BigDecimal.valueOf(level).divide(new BigDecimal("10").sqrt(MathContext.DECIMAL128),
                    MathContext.DECIMAL128);
            int expected = ideal.multiply(BigDecimal.valueOf(32768)).setScale(0, RoundingMode.HALF_EVEN).intValueExact();
            boolean found = false;
            for (int label = 0; label < 16; label++) {
                found |= rom.iCode(label) == expected;
            }
            assertTrue(found, "code " + expected + " of level " + level);
        }
        int[] sortedI = rom.iCodes();
        java.util.Arrays.sort(sortedI);
        assertEquals(-31086, sortedI[0]);
        assertEquals(10362, sortedI[sortedI.length - 5]);
        assertEquals(0, rom.overflowCount());
        assertEquals(16 * 2 * 16, rom.tableBits());
    }

    @Test
    void tooNarrowFormatsAreRefused() {
        IllegalArgumentException range = assertThrows(IllegalArgumentException.class,
                () -> ConstellationRom.of(Constellations.qam(16, true), q("Q1.14", Overflow.SATURATE)));
        assertTrue(range.getMessage().contains("more than one LSB away"), range.getMessage());
        IllegalArgumentException collision = assertThrows(IllegalArgumentException.class,
                () -> ConstellationRom.normalized(Constellations.qam(64, true), Normalization.UNIT_ENERGY,
                        q("Q1.1", Overflow.SATURATE)));
        assertTrue(collision.getMessage().contains("both become codes"), collision.getMessage());
        IllegalArgumentException wrapped = assertThrows(IllegalArgumentException.class,
                () -> ConstellationRom.of(Constellations.pam(2, true), q("Q15", Overflow.WRAP)));
        assertTrue(wrapped.getMessage().contains("-32768"), wrapped.getMessage());
        assertThrows(IllegalArgumentException.class,
                () -> ConstellationRom.of(Constellations.pam(2, true), q("UQ0.8", Overflow.SATURATE)));
        assertThrows(IllegalArgumentException.class,
                () -> new ConstellationRom(Constellations.pam(2, true), Double.NaN, q("Q15", Overflow.SATURATE)));
    }

    @Test
    void quarterTurnCodesAreIntegerExact() {
        // π/2-BPSK of TS 38.211 §5.1.1: even symbols (1+j)/√2 · (1 − 2b), odd ones turned by +90°.
        double a = 1 / StrictMath.sqrt(2);
        Constellation even = Constellation.ofLabelled("bpsk45", dev.fixmod.constellation.Family.PSK, "nr",
                new double[] {a, -a}, new double[] {a, -a}, null, null);
        ConstellationRom rom = ConstellationRom.of(even.withAlternatingQuarterTurn("pi2bpsk"),
                q("Q15", Overflow.SATURATE));
        for (int label = 0; label < 2; label++) {
            assertEquals(-rom.qCode(label), rom.oddICode(label));
            assertEquals(rom.iCode(label), rom.oddQCode(label));
        }
        assertEquals(23170, rom.iCode(0)); // round(32768/√2) = round(23170.475)
        assertEquals(0, rom.overflowCount());
    }

    @Test
    void quarterTurnOfTheMostNegativeCodeSaturates() {
        Constellation even = Constellation.ofLabelled("bpsk-diag", dev.fixmod.constellation.Family.PSK, "custom",
                new double[] {0.5, -1.0}, new double[] {0.5, -1.0}, null, null);
        ConstellationRom rom = ConstellationRom.of(even.withAlternatingQuarterTurn("odd"), q("Q15", Overflow.SATURATE));
        assertEquals(-32768, rom.qCode(1));
        assertEquals(32767, rom.oddICode(1)); // −(−32768) does not fit: saturated, one LSB from +1.0
        assertEquals(1, rom.overflowCount());
    }

    @Test
    void gainErrorIsTheEnergyOfTheCodesAgainstTheIdeal() {
        ConstellationRom rom = ConstellationRom.normalized(Constellations.qam(16, true), Normalization.UNIT_ENERGY,
                q("Q3.4", Overflow.SATURATE));
        // Levels 1/√10 → 5/16, 3/√10 → 15/16: energy 2·(25 + 225)/2/256 = 250/256 against 1 (unit energy).
        assertEquals(10 * StrictMath.log10(250.0 / 256.0), rom.gainErrorDb(), 1e-12);
    }

    @Test
    void romsAreValues() {
        Quantizer quantizer = q("Q2.5", Overflow.SATURATE);
        Constellation qam = Constellations.qam(16, true);
        assertEquals(ConstellationRom.of(qam, quantizer), ConstellationRom.of(qam, quantizer));
        assertEquals(ConstellationRom.of(qam, quantizer).hashCode(), ConstellationRom.of(qam, quantizer).hashCode());
        assertNotEquals(ConstellationRom.of(qam, quantizer),
                ConstellationRom.of(qam, q("Q2.6", Overflow.SATURATE)));
        int[] copy = ConstellationRom.of(qam, quantizer).iCodes();
        copy[0] = 99;
        assertArrayEquals(ConstellationRom.of(qam, quantizer).iCodes(), ConstellationRom.of(qam, quantizer).iCodes());
    }
}
