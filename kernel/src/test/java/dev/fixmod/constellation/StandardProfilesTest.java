package dev.fixmod.constellation;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * The published mappings, each label computed here from the standard's own formula or table, independently of the
 * kernel's construction. The kernel scales its integer grid by 1/StrictMath.sqrt(E_s) with E_s exact, the formulas
 * here by 1/StrictMath.sqrt(n): the comparisons are exact, bit for bit.
 */
class StandardProfilesTest {

    private static int bit(int label, int k, int position) {
        return (label >>> (k - 1 - position)) & 1;
    }

    /** 1 − 2b. */
    private static int s(int label, int k, int position) {
        return 1 - 2 * bit(label, k, position);
    }

    private static void assertPoint(Constellation c, int label, double re, double im) {
        assertEquals(re, c.re(label), 0.0, c.name() + " label " + label + " I");
        assertEquals(im, c.im(label), 0.0, c.name() + " label " + label + " Q");
    }

    @Test
    void nrPi2BpskFollowsTheFormula() {
        // 3GPP TS 38.211 §5.1.1 (subclause number from memory): d(i) = e^{jπ(i mod 2)/2}/√2 · [(1−2b(i)) + j(1−2b(i))].
        Constellation c = Catalogue.resolve("nr:pi2bpsk");
        assertTrue(c.alternatesQuarterTurn());
        assertEquals(Family.PI2_BPSK, c.family());
        double a = 1 / StrictMath.sqrt(2);
        for (int b = 0; b <= 1; b++) {
            // even i: e^0 = 1
            assertPoint(c, b, a * (1 - 2 * b), a * (1 - 2 * b));
            // odd i: e^{jπ/2} = j, so the symbol is j·(x + jx) = −x + jx. The kernel turns the even point by +90°,
            // (I, Q) → (−Q, I), which must give exactly that.
            double x = a * (1 - 2 * b);
            double oddI = -x;
            double oddQ = x;
            assertEquals(oddI, -c.im(b), 0.0);
            assertEquals(oddQ, c.re(b), 0.0);
        }
        assertNull(c.axes(), "the quarter turn moves b0 between axes");
    }

    @Test
    void nrBpskFollowsTheFormula() {
        // 3GPP TS 38.211 §5.1.2: d(i) = (1/√2)[(1−2b(i)) + j(1−2b(i))]
        Constellation c = Catalogue.resolve("nr:bpsk");
        double a = 1 / StrictMath.sqrt(2);
        for (int b = 0; b <= 1; b++) {
            assertPoint(c, b, a * (1 - 2 * b), a * (1 - 2 * b));
        }
        assertFalse(c.isSeparable(), "b0 drives both axes");
    }

    @Test
    void nrQpskFollowsTheFormula() {
        // 3GPP TS 38.211 §5.1.3: d(i) = (1/√2)[(1−2b(2i)) + j(1−2b(2i+1))]
        Constellation c = Catalogue.resolve("nr:qpsk");
        double a = 1 / StrictMath.sqrt(2);
        for (int label = 0; label < 4; label++) {
            assertPoint(c, label, a * s(label, 2, 0), a * s(label, 2, 1));
        }
        assertArrayEquals(new int[] {0}, c.axes().iBits());
        assertArrayEquals(new int[] {1}, c.axes().qBits());
    }

    @Test
    void nr16QamFollowsTheFormula() {
        // 3GPP TS 38.211 §5.1.4: d = (1/√10){(1−2b0)[2−(1−2b2)] + j(1−2b1)[2−(1−2b3)]}
        Constellation c = Catalogue.resolve("nr:qam16");
        double a = 1 / StrictMath.sqrt(10);
        for (int l = 0; l < 16; l++) {
            double re = s(l, 4, 0) * (2 - s(l, 4, 2));
            double im = s(l, 4, 1) * (2 - s(l, 4, 3));
            assertPoint(c, l, a * re, a * im);
        }
        // TS 38.211 interleaves the axes: I from b0, b2; Q from b1, b3.
        assertArrayEquals(new int[] {0, 2}, c.axes().iBits());
        assertArrayEquals(new int[] {1, 3}, c.axes().qBits());
    }

    @Test
    void nr64QamFollowsTheFormula() {
        // 3GPP TS 38.211 §5.1.5: d = (1/√42){(1−2b0)[4−(1−2b2)[2−(1−2b4)]] + j(1−2b1)[4−(1−2b3)[2−(1−2b5)]]}
        Constellation c = Catalogue.resolve("nr:qam64");
        double a = 1 / StrictMath.sqrt(42);
        for (int l = 0; l < 64; l++) {
            double re = s(l, 6, 0) * (4 - s(l, 6, 2) * (2 - s(l, 6, 4)));
            double im = s(l, 6, 1) * (4 - s(l, 6, 3) * (2 - s(l, 6, 5)));
            assertPoint(c, l, a * re, a * im);
        }
        assertArrayEquals(new int[] {0, 2, 4}, c.axes().iBits());
        assertArrayEquals(new int[] {1, 3, 5}, c.axes().qBits());
    }

    @Test
    void nr256QamFollowsTheFormula() {
        // 3GPP TS 38.211 §5.1.6:
        // d = (1/√170){(1−2b0)[8−(1−2b2)[4−(1−2b4)[2−(1−2b6)]]] + j(1−2b1)[8−(1−2b3)[4−(1−2b5)[2−(1−2b7)]]]}
        Constellation c = Catalogue.resolve("nr:qam256");
        double a = 1 / StrictMath.sqrt(170);
        for (int l = 0; l < 256; l++) {
            double re = s(l, 8, 0) * (8 - s(l, 8, 2) * (4 - s(l, 8, 4) * (2 - s(l, 8, 6))));
            double im = s(l, 8, 1) * (8 - s(l, 8, 3) * (4 - s(l, 8, 5) * (2 - s(l, 8, 7))));
            assertPoint(c, l, a * re, a * im);
        }
    }

    @Test
    void nr1024QamFollowsTheFormula() {
        // 3GPP TS 38.211 §5.1.7: d = (1/√682){(1−2b0)[16−(1−2b2)[8−(1−2b4)[4−(1−2b6)[2−(1−2b8)]]]]
        //                                   + j(1−2b1)[16−(1−2b3)[8−(1−2b5)[4−(1−2b7)[2−(1−2b9)]]]]}
        Constellation c = Catalogue.resolve("nr:qam1024");
        double a = 1 / StrictMath.sqrt(682);
        for (int l = 0; l < 1024; l++) {
            double re = s(l, 10, 0) * (16 - s(l, 10, 2) * (8 - s(l, 10, 4) * (4 - s(l, 10, 6) * (2 - s(l, 10, 8)))));
            double im = s(l, 10, 1) * (16 - s(l, 10, 3) * (8 - s(l, 10, 5) * (4 - s(l, 10, 7) * (2 - s(l, 10, 9)))));
            assertPoint(c, l, a * re, a * im);
        }
        assertArrayEquals(new int[] {0, 2, 4, 6, 8}, c.axes().iBits());
        assertArrayEquals(new int[] {1, 3, 5, 7, 9}, c.axes().qBits());
    }

    @Test
    void nrPointsHaveUnitAverageEnergy() {
        // 3GPP TS 38.211 §5.1: every modulation is normalized to unit average power (the 1/√n factors).
        for (String m : Profile.NR.members()) {
            assertEquals(1.0, Catalogue.resolve("nr:" + m).averageEnergy(), 1e-15, m);
        }
    }

    @Test
    void wlanKmodValues() {
        // IEEE 802.11 (OFDM PHY, modulation-dependent normalization factor K_MOD): BPSK 1, QPSK 1/√2, 16-QAM 1/√10,
        // 64-QAM 1/√42, 256-QAM 1/√170 (VHT), 1024-QAM 1/√682 (HE).
        String[] members = {"bpsk", "qpsk", "qam16", "qam64", "qam256", "qam1024"};
        int[] denominators = {1, 2, 10, 42, 170, 682};
        for (int n = 0; n < members.length; n++) {
            Constellation grid = Profile.WLAN.onGrid(members[n]);
            double kmod = 1 / StrictMath.sqrt(denominators[n]);
            assertEquals(kmod, grid.normalizationFactor(Normalization.UNIT_ENERGY), 0.0, members[n]);
            Constellation published = Catalogue.resolve("wlan:" + members[n]);
            for (int l = 0; l < grid.size(); l++) {
                assertPoint(published, l, kmod * grid.re(l), kmod * grid.im(l));
            }
        }
    }

    @Test
    void wlanBpskAndQpsk() {
        // IEEE 802.11 BPSK and QPSK encoding tables: b0 → I (and b1 → Q for QPSK), 0 → −1, 1 → +1.
        Constellation bpsk = Profile.WLAN.onGrid("bpsk");
        assertPoint(bpsk, 0, -1, 0);
        assertPoint(bpsk, 1, 1, 0);
        Constellation qpsk = Profile.WLAN.onGrid("qpsk");
        assertPoint(qpsk, 0b00, -1, -1);
        assertPoint(qpsk, 0b01, -1, 1);
        assertPoint(qpsk, 0b10, 1, -1);
        assertPoint(qpsk, 0b11, 1, 1);
    }

    @Test
    void wlan16QamTable() {
        // IEEE 802.11 16-QAM encoding table: b0b1 → I and b2b3 → Q, 00 → −3, 01 → −1, 11 → +1, 10 → +3.
        int[] bits = {0b00, 0b01, 0b11, 0b10};
        int[] level = {-3, -1, 1, 3};
        Constellation c = Profile.WLAN.onGrid("qam16");
        for (int i = 0; i < 4; i++) {
            for (int q = 0; q < 4; q++) {
                assertPoint(c, bits[i] << 2 | bits[q], level[i], level[q]);
            }
        }
        assertArrayEquals(new int[] {0, 1}, c.axes().iBits());
        assertArrayEquals(new int[] {2, 3}, c.axes().qBits());
    }

    @Test
    void wlan64QamTable() {
        // IEEE 802.11 64-QAM encoding table: b0b1b2 → I, b3b4b5 → Q:
        // 000 → −7, 001 → −5, 011 → −3, 010 → −1, 110 → +1, 111 → +3, 101 → +5, 100 → +7.
        int[] bits = {0b000, 0b001, 0b011, 0b010, 0b110, 0b111, 0b101, 0b100};
        int[] level = {-7, -5, -3, -1, 1, 3, 5, 7};
        Constellation c = Profile.WLAN.onGrid("qam64");
        for (int i = 0; i < 8; i++) {
            for (int q = 0; q < 8; q++) {
                assertPoint(c, bits[i] << 3 | bits[q], level[i], level[q]);
            }
        }
    }

    @Test
    void wlan256QamTable() {
        // IEEE 802.11 (VHT) 256-QAM encoding table, from memory: b0..b3 → I, b4..b7 → Q:
        // 0000 −15, 0001 −13, 0011 −11, 0010 −9, 0110 −7, 0111 −5, 0101 −3, 0100 −1,
        // 1100 +1, 1101 +3, 1111 +5, 1110 +7, 1010 +9, 1011 +11, 1001 +13, 1000 +15.
        int[] bits = {0b0000, 0b0001, 0b0011, 0b0010, 0b0110, 0b0111, 0b0101, 0b0100,
            0b1100, 0b1101, 0b1111, 0b1110, 0b1010, 0b1011, 0b1001, 0b1000};
        Constellation c = Profile.WLAN.onGrid("qam256");
        for (int i = 0; i < 16; i++) {
            for (int q = 0; q < 16; q++) {
                assertPoint(c, bits[i] << 4 | bits[q], -15 + 2 * i, -15 + 2 * q);
            }
        }
    }

    @Test
    void wlan1024QamIsGrayPerAxisFromTheBottom() {
        // IEEE 802.11 (HE) 1024-QAM: b0..b4 → I, b5..b9 → Q, each axis binary-reflected Gray from the most negative
        // level (−31). Level index of a 5-bit code g is the prefix XOR of its bits (the inverse Gray code).
        Constellation c = Profile.WLAN.onGrid("qam1024");
        for (int l = 0; l < 1024; l++) {
            int gi = l >>> 5;
            int gq = l & 31;
            assertPoint(c, l, -31 + 2 * prefixXor(gi, 5), -31 + 2 * prefixXor(gq, 5));
        }
    }

    private static int prefixXor(int code, int bits) {
        int index = 0;
        int running = 0;
        for (int j = bits - 1; j >= 0; j--) {
            running ^= (code >>> j) & 1;
            index = index << 1 | running;
        }
        return index;
    }

    @Test
    void profilesRejectALabelingAndUnknownMembers() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> Catalogue.resolve("nr:qam16", Catalogue.Options.DEFAULT.withLabeling(Labeling.NATURAL)));
        assertTrue(e.getMessage().contains("fixed by 3GPP TS 38.211"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> Catalogue.resolve("nr:qam4096"));
        assertEquals("profile nr has no constellation 'qam4096'; accepted: nr:pi2bpsk, nr:bpsk, nr:qpsk, nr:qam16,"
                + " nr:qam64, nr:qam256, nr:qam1024", e.getMessage());
    }
}
