package dev.fixmod.demap;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.fixmod.constellation.Catalogue;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import dev.fixmod.map.ConstellationRom;
import org.junit.jupiter.api.Test;

class FixedAxisSlicerTest {
    @Test
    void thresholdsAreTheRomMidpointsRoundedUp() {
        // The example of the FixedAxisSlicer javadoc: unit-energy 4-PAM has levels ±1/√5, ±3/√5 (E_s = 5 on the
        // grid, Proakis' M-PAM energy (M²−1)/3); in Q2.5 they are ±14, ±43; midpoints −28.5, 0, 28.5 → −28, 0, 29.
        ConstellationRom rom = ConstellationRom.of(Catalogue.resolve("pam4"),
                new Quantizer(QFormat.parse("Q2.5"), Rounding.HALF_EVEN, Overflow.SATURATE));
        FixedAxisSlicer slicer = new FixedAxisSlicer(rom);
        assertArrayEquals(new int[] {-28, 0, 29}, slicer.iThresholds());
        assertArrayEquals(new int[0], slicer.qThresholds());
        // −28.5 is a tie only for a half code: −28 is nearer to −14 (distance 14) than to −43 (distance 15).
        assertEquals(slicer.slice(-14, 0, 0), slicer.slice(-28, 0, 0));
        assertEquals(slicer.slice(-43, 0, 0), slicer.slice(-29, 0, 0));
        assertEquals(slicer.slice(43, 0, 0), slicer.slice(29, 0, 0));
        assertEquals(slicer.slice(14, 0, 0), slicer.slice(28, 0, 0));
    }
}
