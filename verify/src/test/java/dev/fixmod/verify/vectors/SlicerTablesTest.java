package dev.fixmod.verify.vectors;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * The slicer tables of the committed sets ({@code slicer-reference}, {@code slicer-lines}), read from their hex files
 * with the manifest's layouts as a testbench reads them with {@code $readmemh} (IEEE 1364-2005 §17.2.9): the
 * decisions recomputed from these numbers alone must be every row of the committed {@code hard} port.
 */
class SlicerTablesTest {

    /** A hex table of a committed set: one row per line, each field cut from the word as the manifest says. */
    record Table(long[][] rows, JsonNode layout) {
        long get(int row, int field) {
            return rows[row][field];
        }

        int size() {
            return rows.length;
        }
    }

    static Manifest manifest(String set) throws IOException {
        Path dir = VectorSuiteTest.VECTORS.resolve(set);
        return Manifest.read(Files.readString(dir.resolve(Manifest.FILE_NAME), StandardCharsets.UTF_8), set);
    }

    static Table hex(String set, String file) throws IOException {
        Manifest.Entry entry = manifest(set).files().stream().filter(e -> e.name().equals(file)).findFirst()
                .orElseThrow(() -> new AssertionError(set + ": no " + file + " in the manifest"));
        JsonNode fields = entry.layout().path("fields");
        List<String> lines = Files.readAllLines(VectorSuiteTest.VECTORS.resolve(set).resolve(file),
                StandardCharsets.US_ASCII);
        assertEquals(entry.count(), lines.size(), file);
        long[][] rows = new long[lines.size()][fields.size()];
        for (int r = 0; r < rows.length; r++) {
            long word = Long.parseUnsignedLong(lines.get(r), 16);
            for (int f = 0; f < fields.size(); f++) {
                JsonNode field = fields.get(f);
                int bits = field.path("bits").asInt();
                long v = (word >>> field.path("word-lsb").asInt()) & (bits == 64 ? -1L : (1L << bits) - 1);
                boolean negative = field.path("signed").asBoolean() && bits < 64 && (v >>> (bits - 1)) != 0;
                rows[r][f] = negative ? v - (1L << bits) : v;
            }
        }
        return new Table(rows, entry.layout());
    }

    static VectorSpec spec(String set) throws IOException {
        return SpecReader.parse(manifest(set).spec().toString(), set + ": spec");
    }

    static List<String> sets() throws IOException {
        return VectorSuiteTest.sets().toList();
    }

    @ParameterizedTest
    @MethodSource("sets")
    void theReferenceTableHoldsTheSlicersPointsByLabel(String set) throws IOException {
        VectorSpec spec = spec(set);
        KernelDatapath d = KernelDatapath.of(spec);
        Table ref = hex(set, "slicer-reference.hex");
        assertEquals(d.size(), ref.size(), "one row per label");
        assertEquals(List.of("I", "Q"), List.of(ref.layout().path("fields").get(0).path("name").asText(),
                ref.layout().path("fields").get(1).path("name").asText()));
        assertEquals(spec.demapper().input().format().toString(), ref.layout().path("fields").get(0).path("format")
                .asText(), "the demapper input format, not the mapper's");
        long[] i = new long[ref.size()];
        long[] q = new long[ref.size()];
        int n = spec.demapper().input().format().fractionalBits();
        BigDecimal scale = BigDecimal.valueOf(2).pow(n);
        assertEquals("half-even", manifest(set).spec().path("demapper").path("constant-rounding").asText());
        for (int label = 0; label < ref.size(); label++) {
            i[label] = ref.get(label, 0);
            q[label] = ref.get(label, 1);
            // The float symbol times 2^n rounded half-even by BigDecimal (the JDK as the oracle of the rounding): the
            // committed sets' points all fit their input formats, so no saturation intervenes.
            assertEquals(new BigDecimal(d.symbolI(label)).multiply(scale).setScale(0, RoundingMode.HALF_EVEN)
                    .longValueExact(), i[label], set + " label " + label + " I");
            assertEquals(new BigDecimal(d.symbolQ(label)).multiply(scale).setScale(0, RoundingMode.HALF_EVEN)
                    .longValueExact(), q[label], set + " label " + label + " Q");
        }
        assertArrayEquals(d.referenceI(), i, set);
        assertArrayEquals(d.referenceQ(), q, set);
        boolean sector = manifest(set).files().stream().anyMatch(e -> e.port().equals("slicer-lines"));
        assertEquals(Set.of("psk8", "nr-pi2bpsk").contains(set), sector, "only the PSK sets have sector lines");
    }

    /**
     * K = 1/N0 with N0 = E_s / 10^(E_s/N0 / 10) per level (the definition of E_s/N0 with N0 the complex noise power;
     * common practice, no source), rounded half-even to the fractional bits of the file's field by BigDecimal (the JDK
     * as the rounding oracle); row 0 is the design level, row l + 1 noise level l.
     */
    @ParameterizedTest
    @MethodSource("sets")
    void theScaleTableHoldsKPerLevelWhenNoiseScaled(String set) throws IOException {
        VectorSpec spec = spec(set);
        KernelDatapath d = KernelDatapath.of(spec);
        boolean scaled = spec.demapper().scaling() == dev.fixmod.demap.LlrScaling.NOISE_SCALED;
        boolean listed = manifest(set).files().stream().anyMatch(e -> e.name().equals("llr-scale.hex"));
        assertEquals(scaled, listed, set + ": llr-scale.hex exactly when noise-scaled");
        if (!scaled) {
            return;
        }
        Table k = hex(set, "llr-scale.hex");
        int levels = spec.noise().levelsDb().size();
        assertEquals(levels + 1, k.size(), "the design level, then each noise level");
        JsonNode field = k.layout().path("fields").get(0);
        assertEquals(false, field.path("signed").asBoolean(), "K is unsigned");
        int frac = dev.fixmod.fixed.QFormat.parse(field.path("format").asText()).fractionalBits();
        for (int row = 0; row <= levels; row++) {
            double db = row == 0 ? spec.demapper().designEsN0Db() : spec.noise().esN0Db(row - 1, d.bitsPerSymbol());
            double n0 = d.averageEnergy() / StrictMath.pow(10.0, db / 10.0);
            long expected = new BigDecimal(1.0 / n0).multiply(BigDecimal.valueOf(2).pow(frac))
                    .setScale(0, RoundingMode.HALF_EVEN).longValueExact();
            assertEquals(expected, k.get(row, 0), set + " row " + row + " (" + db + " dB)");
        }
    }

    @Test
    void eightPskLinesAndReferencePointsAloneGiveEveryCommittedHardDecision() throws IOException {
        Table lines = hex("psk8", "slicer-lines.hex");
        Table ref = hex("psk8", "slicer-reference.hex");
        Table in = hex("psk8", "demapper-in.hex");
        Table hard = hex("psk8", "hard.hex");
        assertEquals(4, lines.size(), "M/2 lines");
        assertEquals("Q1.14", lines.layout().path("fields").get(0).path("format").asText());
        for (int j = 0; j < lines.size(); j++) {
            long a = lines.get(j, 0);
            long b = lines.get(j, 1);
            assertTrue(a > 0 || (a == 0 && b > 0), "line " + j + " oriented toward +I (+Q when a = 0)");
            // 8-PSK with points at n·45° has its boundaries midway, at 22.5° + j·45° (common practice, no source); the
            // line through them is perpendicular to its normal (a, b). Q1.14 slopes turn it by far less than 0.01°.
            double angle = (StrictMath.toDegrees(StrictMath.atan2(-a, b)) + 360) % 180;
            assertEquals(22.5 + 45 * j, angle, 0.01, "line " + j);
        }
        long[] pattern = new long[ref.size()];
        Set<Long> distinct = new HashSet<>();
        for (int label = 0; label < ref.size(); label++) {
            for (int j = 0; j < lines.size(); j++) {
                long t = lines.get(j, 0) * ref.get(label, 0) + lines.get(j, 1) * ref.get(label, 1);
                assertNotEquals(0, t, "reference point " + label + " lies inside its sector, on no line");
                pattern[label] |= t >= 0 ? 1L << j : 0;
            }
            distinct.add(pattern[label]);
        }
        assertEquals(8, distinct.size(), "each sector has its own pattern of sides");
        assertEquals(in.size(), hard.size());
        int onALine = 0;
        for (int r = 0; r < in.size(); r++) {
            long bits = 0;
            for (int j = 0; j < lines.size(); j++) {
                // The documented test: on the line or on its larger-I side counts as >= 0 (the tie rule).
                long t = lines.get(j, 0) * in.get(r, 0) + lines.get(j, 1) * in.get(r, 1);
                bits |= t >= 0 ? 1L << j : 0;
                onALine += t == 0 ? 1 : 0;
            }
            int decided = -1;
            for (int label = 0; label < ref.size(); label++) {
                decided = pattern[label] == bits ? label : decided;
            }
            assertEquals(hard.get(r, 0), decided, "psk8 demapper vector " + r);
        }
        assertTrue(onALine > 0, "the set exercises the tie rule (the origin lies on every line)");
    }

    @ParameterizedTest
    @ValueSource(strings = {"cqam32", "nr-qam16", "nr-qam64", "nr-qam256", "wlan-qam1024", "pam4"})
    void theMinimumDistanceToTheReferenceTableGivesEveryCommittedHardDecision(String set) throws IOException {
        // Minimum Euclidean distance is the hard decision of every slicer of these sets (common practice, no source:
        // per-axis thresholds midway between levels are the same decision); ties go to the largest I, then the
        // largest Q, the tie rule of the vector format.
        Table ref = hex(set, "slicer-reference.hex");
        Table in = hex(set, "demapper-in.hex");
        Table hard = hex(set, "hard.hex");
        assertEquals(in.size(), hard.size());
        assertFalse(manifest(set).files().stream().anyMatch(e -> e.port().equals("slicer-lines")));
        int ties = 0;
        for (int r = 0; r < in.size(); r++) {
            int best = -1;
            long bestDistance = Long.MAX_VALUE;
            boolean tie = false;
            for (int label = 0; label < ref.size(); label++) {
                long di = in.get(r, 0) - ref.get(label, 0);
                long dq = in.get(r, 1) - ref.get(label, 1);
                long d = di * di + dq * dq;
                boolean better = d < bestDistance || (d == bestDistance && (ref.get(label, 0) > ref.get(best, 0)
                        || (ref.get(label, 0) == ref.get(best, 0) && ref.get(label, 1) > ref.get(best, 1))));
                tie = d < bestDistance ? false : tie || d == bestDistance;
                if (better) {
                    best = label;
                    bestDistance = d;
                }
            }
            ties += tie ? 1 : 0;
            assertEquals(hard.get(r, 0), best, set + " demapper vector " + r);
        }
        assertTrue(ties > 0, set + " exercises the tie rule");
    }
}
