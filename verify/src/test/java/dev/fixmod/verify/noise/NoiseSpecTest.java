package dev.fixmod.verify.noise;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/** The published description and the code must state the same constants: a testbench only has the text. */
class NoiseSpecTest {

    private final String doc = NoiseSpec.document();

    private void mentions(String text) {
        assertTrue(doc.contains(text), "noise-algorithm.md should contain " + text);
    }

    @Test
    void documentStatesTheConstantsTheCodeUses() {
        mentions("`" + NoiseSpec.VERSION + "`");
        mentions(String.format("M0 = 0x%08X", Philox4x32.M0));
        mentions(String.format("M1 = 0x%08X", Philox4x32.M1));
        mentions(String.format("W0 = 0x%08X", Philox4x32.W0));
        mentions(String.format("W1 = 0x%08X", Philox4x32.W1));
        mentions("repeat " + Philox4x32.ROUNDS + " times");
        mentions("TWO_PI = " + Double.toHexString(BoxMuller.TWO_PI));
        assertEquals(Ziggurat.R, stated("R"));
        assertEquals(Ziggurat.V, stated("V"));
        mentions("with " + Ziggurat.LAYERS + " layers");
    }

    /** The decimal after {@code name = } in the ziggurat tables block, parsed as a double. */
    private double stated(String name) {
        Matcher m = Pattern.compile("\\b" + name + " = ([0-9.e-]+)").matcher(doc);
        assertTrue(m.find(), name + " is stated");
        return Double.parseDouble(m.group(1));
    }

    @Test
    void knownAnswerTableOfTheDocumentHolds() {
        Pattern row = Pattern.compile("\\| ((?:[0-9a-f]{8} ){4}) *\\| ((?:[0-9a-f]{8} ){2}) *\\| ((?:[0-9a-f]{8} ){4}) *\\|");
        Matcher m = row.matcher(doc);
        int rows = 0;
        while (m.find()) {
            int[] c = words(m.group(1));
            int[] k = words(m.group(2));
            int[] out = new int[4];
            Philox4x32.encrypt(c[0], c[1], c[2], c[3], k[0], k[1], out, 0);
            assertArrayEquals(words(m.group(3)), out, m.group());
            rows++;
        }
        assertEquals(3, rows, "known-answer rows found");
    }

    @Test
    void statedRectangleAcceptanceMatchesTheTables() {
        double accept = 0;
        for (int i = 0; i < Ziggurat.LAYERS; i++) {
            accept += Ziggurat.X[i + 1] / Ziggurat.X[i] / Ziggurat.LAYERS;
        }
        mentions(String.format("about %.1f %% of samples end here", 100 * accept));
    }

    private static int[] words(String hex) {
        String[] parts = hex.trim().split(" ");
        int[] out = new int[parts.length];
        for (int i = 0; i < parts.length; i++) {
            out[i] = Integer.parseUnsignedInt(parts[i], 16);
        }
        return out;
    }
}
