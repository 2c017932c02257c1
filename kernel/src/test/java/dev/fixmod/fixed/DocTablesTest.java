package dev.fixmod.fixed;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Every row of the rounding, overflow and format tables in our javadoc and README is checked against the code (and
 * the rounding rows also against the BigDecimal oracle), so the documentation cannot drift from the behaviour.
 */
class DocTablesTest {

    private static final QFormat Q7_0 = QFormat.parse("Q7.0");

    @Test
    void roundingTableOfTheJavadoc() {
        DocTables.Table t = DocTables.javadoc(Rounding.class, "Rounding a value to an integer number of LSBs");
        assertTrue(t.rows().size() >= 10);
        checkRoundingRows(t);
    }

    @Test
    void roundingTableOfTheReadme() {
        checkRoundingRows(DocTables.readme("Q formats, rounding and overflow", 0));
    }

    @Test
    void roundingAtTheEndsOfTheRange() {
        DocTables.Table t = DocTables.javadoc(Rounding.class, "Quantizing to Q7.0");
        assertTrue(t.rows().size() >= 5);
        OverflowCounter counter = new OverflowCounter("doc");
        for (List<String> row : t.rows()) {
            double lsbs = Double.parseDouble(row.get(0));
            for (int j = 1; j < row.size(); j++) {
                Rounding r = Rounding.fromName(t.header().get(j));
                DocTables.Marked expected = DocTables.Marked.parse(row.get(j));
                counter.reset();
                assertEquals(expected.value(), FixedPoint.quantize(lsbs, Q7_0, r, Overflow.SATURATE, counter),
                        row.get(0) + " " + r);
                assertEquals(expected.event() ? 1 : 0, counter.events(), row.get(0) + " " + r + " events");
                // The oracle agrees (JDK BigDecimal).
                Oracle.Result o = Oracle.quantize(lsbs, Q7_0, r, Overflow.SATURATE);
                assertEquals(expected, new DocTables.Marked(o.code(), o.event()));
            }
        }
    }

    @Test
    void bigDecimalOracleTable() {
        // Each documented JDK mode really agrees with ours on ties and between codes; half-up has no JDK mode.
        DocTables.Table t = DocTables.javadoc(Rounding.class, "BigDecimal oracle of each mode");
        assertEquals(Rounding.values().length, t.rows().size());
        double[] probes = {-2.5, -1.5, -1.25, -0.75, -0.5, -0.25, 0.25, 0.5, 0.75, 1.5, 2.5, 3.75};
        for (List<String> row : t.rows()) {
            Rounding r = Rounding.fromName(row.get(0));
            if (row.get(1).startsWith("none")) {
                for (RoundingMode jdk : RoundingMode.values()) {
                    if (jdk == RoundingMode.UNNECESSARY) {
                        continue;
                    }
                    boolean allAgree = true;
                    for (double x : probes) {
                        allAgree &= new BigDecimal(x).setScale(0, jdk).doubleValue() == r.roundToIntegral(x);
                    }
                    assertFalse(allAgree, r + " documented without a JDK mode, but " + jdk + " matches");
                }
                for (double x : probes) {
                    assertEquals(new BigDecimal(x).add(new BigDecimal("0.5")).setScale(0, RoundingMode.FLOOR)
                            .doubleValue(), r.roundToIntegral(x), r + " " + x);
                }
            } else {
                RoundingMode jdk = RoundingMode.valueOf(row.get(1));
                for (double x : probes) {
                    assertEquals(new BigDecimal(x).setScale(0, jdk).doubleValue(), r.roundToIntegral(x), r + " " + x);
                }
            }
        }
    }

    @Test
    void overflowTablesOfTheJavadoc() {
        checkOverflowRows(DocTables.javadoc(Overflow.class, "Results for a signed 8-bit word, Q7.0"), Q7_0);
        checkOverflowRows(DocTables.javadoc(Overflow.class, "Results for an unsigned 8-bit word, UQ8.0"),
                QFormat.parse("UQ8.0"));
    }

    @Test
    void overflowTableOfTheReadme() {
        checkOverflowRows(DocTables.readme("Q formats, rounding and overflow", 1), Q7_0);
    }

    @Test
    void formatExamplesOfTheJavadoc() {
        DocTables.Table t = DocTables.javadoc(QFormat.class, "Examples of Q formats");
        assertEquals(List.of("short form", "word length", "fractional bits", "codes", "range", "LSB"), t.header());
        for (List<String> row : t.rows()) {
            QFormat f = QFormat.parse(row.get(0));
            assertEquals(Integer.parseInt(row.get(1)), f.wordLength(), row.get(0));
            assertEquals(Integer.parseInt(row.get(2)), f.fractionalBits(), row.get(0));
            String[] codes = row.get(3).split(" … ");
            assertEquals(Long.parseLong(codes[0]), f.minCode(), row.get(0));
            assertEquals(Long.parseLong(codes[1]), f.maxCode(), row.get(0));
            String[] range = row.get(4).substring(1, row.get(4).length() - 1).split(", ");
            assertEquals(0, evaluate(range[0]).compareTo(new BigDecimal(f.minValue())), row.get(0));
            assertEquals(0, evaluate(range[1]).compareTo(new BigDecimal(f.maxValue())), row.get(0));
            assertEquals(0, evaluate(row.get(5)).compareTo(new BigDecimal(f.lsb())), row.get(0));
        }
    }

    @Test
    void operationExamplesOfTheJavadoc() {
        DocTables.Table t = DocTables.javadoc(FixedPoint.class, "Examples with half-up and saturate");
        QFormat q15 = QFormat.parse("Q15");
        Rounding r = Rounding.HALF_UP;
        Overflow o = Overflow.SATURATE;
        OverflowCounter[] c = new OverflowCounter[t.rows().size()];
        long[] got = new long[c.length];
        for (int i = 0; i < c.length; i++) {
            c[i] = new OverflowCounter("row " + i);
        }
        // One call per row, in the order of the table; the first cell names it.
        got[0] = FixedPoint.quantize(0.3, QFormat.parse("Q0.7"), r, o, c[0]);
        got[1] = FixedPoint.requantize(255, QFormat.parse("Q3.8"), QFormat.parse("Q3.4"), r, o, c[1]);
        got[2] = FixedPoint.multiply(-32768, q15, -32768, q15, FixedPoint.productFormat(q15, q15), r, o, c[2]);
        got[3] = FixedPoint.multiply(-32768, q15, -32768, q15, q15, r, o, c[3]);
        got[4] = FixedPoint.negate(-128, Q7_0, o, c[4]);
        List<String> calls = List.of("quantize(0.3, Q0.7)", "requantize(255, Q3.8 → Q3.4)",
                "multiply(-32768, Q15, -32768, Q15 → Q1.30)", "multiply(-32768, Q15, -32768, Q15 → Q15)",
                "negate(-128, Q7.0)");
        assertEquals(calls.size(), t.rows().size());
        assertEquals(QFormat.parse("Q1.30"), FixedPoint.productFormat(q15, q15));
        for (int i = 0; i < calls.size(); i++) {
            List<String> row = t.rows().get(i);
            assertEquals(calls.get(i), row.get(0));
            DocTables.Marked expected = DocTables.Marked.parse(row.get(1));
            assertEquals(expected, new DocTables.Marked(got[i], c[i].events() == 1), row.get(0));
        }
    }

    private static void checkRoundingRows(DocTables.Table t) {
        for (List<String> row : t.rows()) {
            double lsbs = Double.parseDouble(row.get(0));
            for (int j = 1; j < row.size(); j++) {
                Rounding r = Rounding.fromName(t.header().get(j));
                long expected = Long.parseLong(row.get(j));
                assertEquals((double) expected, r.roundToIntegral(lsbs), row.get(0) + " " + r);
                assertEquals(expected, Oracle.round(new BigDecimal(lsbs), r).longValueExact(), "oracle " + row);
                if (lsbs * 4 == Math.rint(lsbs * 4)) {
                    // Quarter-LSB values are exact: the integer path must agree too.
                    assertEquals(expected, r.shiftRight((long) (lsbs * 4), 2), row.get(0) + " " + r);
                }
            }
        }
    }

    private static void checkOverflowRows(DocTables.Table t, QFormat f) {
        assertTrue(t.rows().size() >= 4);
        OverflowCounter counter = new OverflowCounter("doc");
        for (List<String> row : t.rows()) {
            long value = Long.parseLong(row.get(0));
            for (int j = 1; j < row.size(); j++) {
                Overflow o = Overflow.fromName(t.header().get(j));
                DocTables.Marked expected = DocTables.Marked.parse(row.get(j));
                counter.reset();
                assertEquals(expected.value(), o.apply(value, f, counter), value + " " + o);
                assertEquals(expected.event() ? 1 : 0, counter.events(), value + " " + o + " events");
                if (o == Overflow.SYMMETRIC_SATURATE && f.isSigned()) {
                    assertNotEquals(f.minCode(), expected.value());
                }
            }
        }
    }

    /** Evaluates the range notation of the docs: an integer, {@code 2^-k}, or {@code a - 2^-k}. */
    private static BigDecimal evaluate(String text) {
        String[] terms = text.split(" - ");
        BigDecimal v = term(terms[0]);
        for (int i = 1; i < terms.length; i++) {
            v = v.subtract(term(terms[i]));
        }
        return v;
    }

    private static BigDecimal term(String t) {
        if (t.startsWith("2^")) {
            return Oracle.timesPowerOfTwo(BigDecimal.ONE, Integer.parseInt(t.substring(2)));
        }
        return new BigDecimal(t);
    }
}
