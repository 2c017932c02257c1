package dev.fixmod.verify.vectors;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import dev.fixmod.constellation.Catalogue;
import dev.fixmod.demap.FixedSlicer;
import dev.fixmod.demap.Slicers;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import dev.fixmod.map.ConstellationRom;
import java.io.IOException;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * The committed π/2-BPSK set read as a testbench reads it: each row's stream index by the rule of vectors/README.md
 * (data symbol j of a level has index j; the label sweep and corner inputs their index in the demapper group), its
 * hard decision from the kernel's slicer and from the exported tables alone with that parity, its reference LLR
 * against the closed form.
 */
class Pi2BpskSetTest {
    private static final String SET = "nr-pi2bpsk";

    /** The stream index of demapper row {@code r} (vectors/README.md, section 2). */
    private static long streamIndex(int r, JsonNode demapperGroup) {
        long perLevel = demapperGroup.path("data-per-level").asLong();
        long data = Math.max(1, demapperGroup.path("levels").asLong()) * perLevel;
        return r < data ? r % perLevel : r;
    }

    @Test
    void theHardPortIsTheKernelsSlicerAndTheTablesDecisionOnOddAndEvenRows() throws IOException {
        JsonNode group = SlicerTablesTest.manifest(SET).json().path("groups").path("demapper");
        SlicerTablesTest.Table in = SlicerTablesTest.hex(SET, "demapper-in.hex");
        SlicerTablesTest.Table hard = SlicerTablesTest.hex(SET, "hard.hex");
        SlicerTablesTest.Table lines = SlicerTablesTest.hex(SET, "slicer-lines.hex");
        SlicerTablesTest.Table ref = SlicerTablesTest.hex(SET, "slicer-reference.hex");
        assertEquals(1, lines.size(), "BPSK: M/2 = 1 line");
        FixedSlicer slicer = Slicers.fixedFor(ConstellationRom.of(Catalogue.resolve("nr:pi2bpsk"),
                new Quantizer(QFormat.parse("Q2.9"), Rounding.HALF_EVEN, Overflow.SATURATE)));
        List<Integer> flags = VectorSetGeneratorTest.csv(VectorSuiteTest.VECTORS.resolve(SET), "demapper-in.csv")
                .stream().map(VectorSetGeneratorTest::flags).toList();
        int[] rows = new int[2];
        for (int r = 0; r < in.size(); r++) {
            long index = streamIndex(r, group);
            boolean odd = (index & 1) != 0;
            int i = (int) in.get(r, 0);
            int q = (int) in.get(r, 1);
            assertEquals(slicer.slice(i, q, index), hard.get(r, 0), "row " + r + " (stream index " + index + ")");
            // vectors/README.md: odd symbols turn points and lines by +90°, (I, Q) → (−Q, I) and (a, b) → (−b, a),
            // then the line is re-oriented toward +I (+Q when a = 0); the decision is the point on the sample's side.
            long a = lines.get(0, 0);
            long b = lines.get(0, 1);
            if (odd) {
                long t = a;
                a = -b;
                b = t;
                if (a < 0 || (a == 0 && b < 0)) {
                    a = -a;
                    b = -b;
                }
            }
            boolean side = a * i + b * q >= 0;
            int decided = -1;
            for (int label = 0; label < ref.size(); label++) {
                long pi = odd ? -ref.get(label, 1) : ref.get(label, 0);
                long pq = odd ? ref.get(label, 0) : ref.get(label, 1);
                decided = (a * pi + b * pq >= 0) == side ? label : decided;
            }
            assertEquals(hard.get(r, 0), decided, "row " + r + " from the tables alone");
            if ((flags.get(r) & CornerFlag.ON_THRESHOLD.mask()) != 0) {
                assertTrue(slicer.onBoundary(i, q, index), "row " + r + " is on its own parity's boundary");
            }
            rows[odd ? 1 : 0]++;
        }
        assertTrue(rows[0] > 50 && rows[1] > 50, "both parities are exercised: " + rows[0] + " even, " + rows[1]
                + " odd");
    }

    @Test
    void theReferenceLlrIsTheClosedFormForTheRowsParity() throws IOException {
        // Handbook closed form, derived in the kernel's Pi2BpskDemapperTest from L = ln p(y|0) − ln p(y|1) on AWGN
        // (3GPP TS 38.211 §5.1.1 points, a = 1/√2): L = 4a(I + Q)/N0 on even symbols, 4a(Q − I)/N0 on odd ones.
        Manifest m = SlicerTablesTest.manifest(SET);
        JsonNode group = m.json().path("groups").path("demapper");
        double design = m.spec().path("demapper").path("design-es-n0-db").asDouble();
        List<Map<String, String>> rows = VectorSetGeneratorTest.csv(VectorSuiteTest.VECTORS.resolve(SET),
                "reference.csv");
        double a = 1 / StrictMath.sqrt(2);
        int corners = 0;
        for (int r = 0; r < rows.size(); r++) {
            Map<String, String> row = rows.get(r);
            int level = Integer.parseInt(row.get("level"));
            // Unit energy: N0 = 1/10^(Es/N0 / 10).
            double esN0 = level < 0 ? design : m.json().path("noise-levels").get(level).path("es-n0-db").asDouble();
            double n0 = 1 / StrictMath.pow(10, esN0 / 10);
            double i = Double.parseDouble(row.get("channel_I"));
            double q = Double.parseDouble(row.get("channel_Q"));
            long index = streamIndex(r, group);
            double want = 4 * a * ((index & 1) == 0 ? i + q : q - i) / n0;
            // Nine printed decimals on the sample and on the LLR.
            assertEquals(want, Double.parseDouble(row.get("reference0")), 1e-8 / n0 + 1e-9, "row " + r);
            corners += row.get("sent_label").equals("-1") ? 1 : 0;
        }
        assertEquals(group.path("corner-inputs").asInt(), corners);
        assertEquals(0, corners % 2, "corner inputs come in pairs, one of each parity");
    }

    @Test
    void cornerInputsComeInPairsOfOppositeParityWithTheirOwnFlags() {
        VectorSpec spec = SpecReader.parse("{\"constellation\": \"nr:pi2bpsk\", \"count\": 0}", "p.json");
        KernelDatapath d = KernelDatapath.of(spec);
        QFormat input = spec.demapper().input().format();
        for (long first : new long[] {0, 7}) {
            List<CornerCases.Vector> v = CornerCases.build(d, input, spec.cornerCases(), first).vectors();
            assertEquals(0, v.size() % 2);
            for (int n = 0; n < v.size(); n += 2) {
                assertEquals(v.get(n).i(), v.get(n + 1).i());
                assertEquals(v.get(n).q(), v.get(n + 1).q());
                for (int row = n; row < n + 2; row++) {
                    long index = first + row;
                    CornerCases.Vector c = v.get(row);
                    boolean on = d.onBoundary(c.i(), c.q(), index);
                    // A row flagged on-threshold or tie is on its own parity's boundary (both are, for this BPSK).
                    if ((c.flags() & (CornerFlag.ON_THRESHOLD.mask() | CornerFlag.TIE.mask())) != 0) {
                        assertTrue(on, "row " + row + " from " + first);
                    }
                }
            }
        }
        // The parity matters: at (−1, 0) the even boundary I + Q = 0 and the odd one Q = I give opposite sides.
        long[] i = {-1};
        long[] q = {0};
        int[] even = new int[1];
        int[] odd = new int[1];
        d.slice(i, q, 1, 0, even);
        d.slice(i, q, 1, 1, odd);
        assertEquals(1, even[0]);
        assertEquals(0, odd[0]);
    }
}
