package dev.fixmod.demap;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Constellations;
import dev.fixmod.constellation.Labeling;
import dev.fixmod.fixed.QFormat;
import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The oriented sector lines ({@link FixedSectorSlicer#orientedLineCodes}): the documented examples, and that the M/2
 * sign tests alone, compared with those of the points, decide every input code as the slicer's binary search does.
 */
class SectorLinesTest {
    private static final QFormat Q1_6 = QFormat.parse("Q1.6");

    private static FixedSectorSlicer slicer(int m, double phaseDegrees) {
        return new FixedSectorSlicer(Constellations.pskDegrees(m, phaseDegrees, Labeling.GRAY), Q1_6,
                Slicers.DEFAULT_SECTOR_COEFFICIENTS);
    }

    @Test
    void theDocumentedExamples() {
        // tan 22.5° = √2 − 1 (half-angle identity, common practice, no source), times 2^14, rounded half-even with
        // BigDecimal as the oracle: the slope code of every 8-PSK line at a phase of 0°.
        long slope = new BigDecimal(2).sqrt(MathContext.DECIMAL64).subtract(BigDecimal.ONE)
                .multiply(BigDecimal.valueOf(16384)).setScale(0, RoundingMode.HALF_EVEN).longValueExact();
        assertEquals(6786, slope);
        long one = 16384;
        FixedSectorSlicer psk8 = slicer(8, 0);
        long[][] before = {{-slope, one}, {-one, slope}, {-one, -slope}, {-slope, -one}};
        long[][] oriented = {{slope, -one}, {one, -slope}, {one, slope}, {slope, one}};
        assertEquals(4, psk8.lineCount());
        for (int j = 0; j < 4; j++) {
            assertArrayEquals(before[j], psk8.lineCodes(j), "8-PSK line " + j);
            assertArrayEquals(oriented[j], psk8.orientedLineCodes(j), "8-PSK line " + j);
        }
        // QPSK at 45°: the boundaries are the Q axis (tested as I >= 0) and the I axis (horizontal: Q >= 0).
        FixedSectorSlicer qpsk = slicer(4, 45);
        assertArrayEquals(new long[] {-one, 0}, qpsk.lineCodes(0));
        assertArrayEquals(new long[] {one, 0}, qpsk.orientedLineCodes(0));
        assertArrayEquals(new long[] {0, -one}, qpsk.lineCodes(1));
        assertArrayEquals(new long[] {0, one}, qpsk.orientedLineCodes(1));
    }

    @Test
    void aLineThatDoesNotExistIsRefused() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> slicer(8, 0)
                .orientedLineCodes(4));
        assertTrue(e.getMessage().contains("lines 0 .. 3"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> slicer(8, 0).lineCodes(-1));
    }

    @ParameterizedTest
    @CsvSource({"2, 0", "4, 45", "4, 0", "8, 0", "8, 22.5", "8, 10", "16, 0", "16, 5.625", "32, 3"})
    void theSignTestsOfAllLinesDecideEveryCodeAsTheSlicer(int m, double phase) {
        // M lines through the origin cut the plane into sectors, each given by its pattern of sides (common practice,
        // no source): the decision is the point whose pattern the sample has. Every code of Q1.6, ties included.
        FixedSectorSlicer s = slicer(m, phase);
        Constellation c = s.constellation();
        int lines = s.lineCount();
        assertEquals(m / 2, lines);
        long[] pattern = new long[m];
        for (int label = 0; label < m; label++) {
            for (int j = 0; j < lines; j++) {
                long[] n = s.orientedLineCodes(j);
                double t = n[0] * c.re(label) + n[1] * c.im(label);
                assertNotEquals(0.0, t, "a point lies inside its sector");
                pattern[label] |= t > 0 ? 1L << j : 0;
            }
        }
        int ties = 0;
        for (int i = (int) Q1_6.minCode(); i <= Q1_6.maxCode(); i++) {
            for (int q = (int) Q1_6.minCode(); q <= Q1_6.maxCode(); q++) {
                long bits = 0;
                for (int j = 0; j < lines; j++) {
                    long[] n = s.orientedLineCodes(j);
                    long t = n[0] * i + n[1] * q;
                    ties += t == 0 ? 1 : 0;
                    bits |= t >= 0 ? 1L << j : 0;
                }
                int decided = -1;
                for (int label = 0; label < m; label++) {
                    if (pattern[label] == bits) {
                        assertEquals(-1, decided, "two points share a pattern");
                        decided = label;
                    }
                }
                assertEquals(s.slice(i, q, 0), decided, m + "-PSK at " + phase + "°, (" + i + ", " + q + ")");
            }
        }
        assertTrue(ties > 0, "the origin at least lies on every line");
    }
}
