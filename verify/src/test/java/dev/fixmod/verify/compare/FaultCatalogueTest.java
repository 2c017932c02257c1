package dev.fixmod.verify.compare;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Synthetic faults injected into a dump of invented golden words; each must be detected and named as what it is.
 * The faults are the usual ways a simulator dump goes wrong (common practice, no source).
 */
class FaultCatalogueTest {
    private static final List<String> GOLDEN = Dumps.goldenLines(200);

    private static List<String> dut() {
        return new ArrayList<>(GOLDEN);
    }

    private static CompareReport.Diagnosis first(CompareReport r) {
        assertFalse(r.diagnoses().isEmpty(), ReportText.render(r));
        return r.diagnoses().get(0);
    }

    @Test
    void identicalDumpAgrees() {
        CompareReport r = Dumps.compare(GOLDEN, dut(), Dumps.exact());
        assertTrue(r.agrees(), ReportText.render(r));
        assertEquals(200, r.compared());
        assertTrue(r.diagnoses().isEmpty());
        assertTrue(r.context().isEmpty());
    }

    @Test
    void flippedBit() {
        List<String> d = dut();
        d.set(57, Dumps.word(Long.parseLong(d.get(57), 16) ^ (1 << 11)));
        CompareReport r = Dumps.compare(GOLDEN, d, Dumps.exact());
        assertEquals(1, r.mismatched());
        CompareReport.Diagnosis g = first(r);
        assertEquals(FaultKind.FLIPPED_BIT, g.kind());
        assertEquals(57, g.index());
        // Bit 11 of the word is bit 3 of the more significant field llr0 (bits 15..8).
        assertTrue(g.message().contains("word bit 11 (field llr0 bit 3)"), g.message());
        CompareReport.FieldDiff f = r.mismatches().get(0).fields().get(0);
        assertEquals(8L, Math.abs(f.diffLsb()));
    }

    @Test
    void droppedLine() {
        List<String> d = dut();
        d.remove(80);
        CompareReport r = Dumps.compare(GOLDEN, d, Dumps.exact());
        CompareReport.Diagnosis g = first(r);
        assertEquals(FaultKind.DROPPED_WORD, g.kind(), ReportText.render(r));
        assertEquals(80, g.index());
        assertEquals(1, r.missing());
        assertEquals(1, r.diagnoses().size(), "the missing last word is explained by the dropped line");
    }

    @Test
    void duplicatedLine() {
        List<String> d = dut();
        d.add(120, d.get(119));
        CompareReport r = Dumps.compare(GOLDEN, d, Dumps.exact());
        CompareReport.Diagnosis g = first(r);
        assertEquals(FaultKind.DUPLICATED_WORD, g.kind(), ReportText.render(r));
        assertEquals(120, g.index());
        assertEquals(1, r.extraWords());
        assertTrue(g.message().contains("dut.hex:121"), g.message());
    }

    @Test
    void shiftedLatencyIsDiagnosedAndRecoveredBySearch() {
        List<String> d = dut();
        d.add(0, "0000");
        d.add(0, "0000");
        d.add(0, "0000");
        CompareReport r = Dumps.compare(GOLDEN, d, Dumps.exact());
        CompareReport.Diagnosis g = first(r);
        assertEquals(FaultKind.LATENCY, g.kind(), ReportText.render(r));
        assertTrue(g.message().contains("--latency 3"), g.message());

        CompareReport fixed = Dumps.compare(GOLDEN, d, Dumps.exact().withLatency(3));
        assertTrue(fixed.agrees(), ReportText.render(fixed));
        CompareReport searched = Dumps.compare(GOLDEN, d, Dumps.exact().withAlignWindow(8));
        assertTrue(searched.agrees(), ReportText.render(searched));
        assertEquals(3, searched.alignment().latency());
        assertTrue(searched.alignment().searched());
    }

    @Test
    void truncatedFile() {
        List<String> d = new ArrayList<>(GOLDEN.subList(0, 150));
        CompareReport r = Dumps.compare(GOLDEN, d, Dumps.exact());
        assertFalse(r.agrees());
        assertEquals(0, r.mismatched());
        assertEquals(50, r.missing());
        CompareReport.Diagnosis g = first(r);
        assertEquals(FaultKind.TRUNCATED, g.kind());
        assertEquals(150, g.index());
    }

    @Test
    void wrongWordWidth() {
        List<String> d = dut();
        d.replaceAll(s -> "0" + s);
        CompareReport r = Dumps.compare(GOLDEN, d, Dumps.exact());
        assertEquals(200, r.widthWords());
        CompareReport.Diagnosis g = first(r);
        assertEquals(FaultKind.WORD_WIDTH, g.kind());
        assertTrue(g.message().contains("has 5 digits"), g.message());
        assertEquals("0" + GOLDEN.get(0), r.mismatches().get(0).actual());
    }

    @Test
    void strayCharactersStopWithFileAndLine() {
        List<String> d = dut();
        d.set(33, "12;4");
        DumpFormatException e = assertThrows(DumpFormatException.class,
                () -> Dumps.compare(GOLDEN, d, Dumps.exact()));
        assertTrue(e.getMessage().startsWith("dut.hex:34:3: unexpected character ';'"), e.getMessage());
    }

    @Test
    void unknownDigitsAreCountedAndLeadingOnesSkipped() {
        List<String> d = dut();
        d.set(10, "7xx0");
        d.add(0, "xxxx");
        d.add(0, "zzzz");
        CompareReport r = Dumps.compare(GOLDEN, d, Dumps.exact());
        assertEquals(2, r.alignment().leadingUnknown());
        assertEquals(1, r.mismatched());
        assertEquals(1, r.unknownWords());
        CompareReport.Diagnosis g = first(r);
        assertEquals(FaultKind.UNKNOWN, g.kind());
        assertEquals(10, g.index());
        CompareReport.FieldStats llr0 = r.fields().get(0);
        CompareReport.FieldStats llr1 = r.fields().get(1);
        assertEquals(1, llr0.unknown());
        assertEquals(1, llr1.unknown());
    }

    @Test
    void offByOneLsbIsNamedAsRounding() {
        List<String> d = dut();
        for (int i : new int[] {5, 9, 44}) {
            long w = Long.parseLong(d.get(i), 16);
            long lo = (w & 0xFF) == 0x7F ? 0x7E : (w & 0xFF) + 1;
            d.set(i, Dumps.word((w & 0xFF00) | (lo & 0xFF)));
        }
        CompareReport r = Dumps.compare(GOLDEN, d, Dumps.exact());
        assertEquals(3, r.mismatched());
        assertEquals(FaultKind.ONE_LSB, first(r).kind(), ReportText.render(r));
        assertEquals(5, first(r).index());
        CompareReport lenient = Dumps.compare(GOLDEN, d, Dumps.exact().withTolerance(new long[] {0, 1}));
        assertTrue(lenient.agrees());
    }
}
