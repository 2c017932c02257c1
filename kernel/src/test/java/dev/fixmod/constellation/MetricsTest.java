package dev.fixmod.constellation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;

/** The ideal metrics against handbook closed forms and facts of the trade. */
class MetricsTest {
    private static final double REL = 1e-12;

    private static Metrics grid(String name) {
        return Metrics.of(Catalogue.resolve(name, Catalogue.Options.DEFAULT.withNormalization(Normalization.NONE)));
    }

    private static void assertRelative(double expected, double actual, String what) {
        assertEquals(expected, actual, Math.abs(expected) * REL, what);
    }

    @Test
    void pamPowerEfficiencyAndEnergy() {
        // Handbook closed forms (e.g. Proakis, Digital Communications, PAM): on the grid ±1, ±3, …, E_s = (M²−1)/3,
        // d_min = 2, so ε = d_min²/E_b = 12k/(M²−1).
        for (int k = 1; k <= 10; k++) {
            int m = 1 << k;
            Metrics x = grid("pam" + m);
            assertEquals((m * (double) m - 1) / 3, x.averageEnergy(), 0.0, "E_s of " + m + "-PAM (exact on the grid)");
            assertEquals(4.0, x.minDistanceSquared(), 0.0);
            assertRelative(12.0 * k / (m * (double) m - 1), x.powerEfficiency(), "eps of " + m + "-PAM");
            // Common practice, no source: an inner PAM point has 2 nearest neighbours, the two end points 1.
            assertRelative(2.0 * (m - 1) / m, x.averageNeighbours(), "neighbours of " + m + "-PAM");
        }
    }

    @Test
    void squareQamPowerEfficiencyEnergyAndPapr() {
        // Handbook closed forms (Proakis, square QAM on the odd-integer grid): E_s = 2(M−1)/3, ε = 6k/(M−1),
        // peak-to-average ratio 3(√M−1)/(√M+1).
        for (int k = 2; k <= 12; k += 2) {
            int m = 1 << k;
            double side = 1 << (k / 2);
            Metrics x = grid("qam" + m);
            assertEquals(2.0 * (m - 1) / 3, x.averageEnergy(), 0.0, "E_s of " + m + "-QAM (exact on the grid)");
            assertRelative(6.0 * k / (m - 1), x.powerEfficiency(), "eps of " + m + "-QAM");
            assertRelative(10 * Math.log10(3 * (side - 1) / (side + 1)), x.paprDb(), "PAPR of " + m + "-QAM");
            // Common practice, no source: average number of nearest neighbours of square QAM is 4(1 − 1/√M).
            assertRelative(4 * (1 - 1 / side), x.averageNeighbours(), "neighbours of " + m + "-QAM");
            assertEquals(1.0, x.grayPenalty(), 0.0);
        }
    }

    @Test
    void pskPowerEfficiency() {
        // Handbook closed form (Proakis, M-PSK on a circle of radius √E_s): d_min² = 4E_s·sin²(π/M), so
        // ε = 4k·sin²(π/M).
        for (int k = 1; k <= 10; k++) {
            int m = 1 << k;
            Metrics x = grid("psk" + m);
            double sin = Math.sin(Math.PI / m);
            assertRelative(4 * k * sin * sin, x.powerEfficiency(), "eps of " + m + "-PSK");
            assertEquals(1.0, x.averageEnergy(), 1e-15);
            assertEquals(0.0, x.paprDb(), 1e-14, "constant envelope");
            assertEquals(m == 2 ? 1.0 : 2.0, x.averageNeighbours(), 0.0, "neighbours of " + m + "-PSK");
        }
    }

    @Test
    void snrLossTable() {
        // Fact of the trade (common practice, no source): SNR loss relative to BPSK at equal d_min-limited error
        // rate, 10·log10(4/ε), rounded to 0.01 dB.
        Object[][] table = {
            {"bpsk", 0.00}, {"qpsk", 0.00}, {"psk4", 0.00}, {"qam4", 0.00},
            {"pam4", 3.98}, {"qam16", 3.98},
            {"pam8", 8.45}, {"qam64", 8.45},
            {"psk8", 3.57},
            {"pam16", 13.27}, {"qam256", 13.27},
        };
        for (Object[] row : table) {
            double loss = grid((String) row[0]).snrLossVsBpskDb();
            assertEquals((double) row[1], Math.round(loss * 100) / 100.0, 0.0, (String) row[0]);
        }
        // Closed form 10·log10(4/ε) for k = 1..6 with the ε above: PAM, PSK every k; square QAM even k.
        for (int k = 1; k <= 6; k++) {
            int m = 1 << k;
            double sin = Math.sin(Math.PI / m);
            assertRelative(10 * Math.log10(4 / (12.0 * k / (m * (double) m - 1))), grid("pam" + m).snrLossVsBpskDb(),
                    "pam" + m);
            if (k > 2) {
                assertRelative(10 * Math.log10(4 / (4 * k * sin * sin)), grid("psk" + m).snrLossVsBpskDb(), "psk" + m);
            }
            if (k % 2 == 0 && k > 2) {
                assertRelative(10 * Math.log10(4 / (6.0 * k / (m - 1))), grid("qam" + m).snrLossVsBpskDb(), "qam" + m);
            }
        }
    }

    @Test
    void crossQamHandbookEnergies() {
        // Handbook (Proakis, cross constellations on the odd-integer grid): average energy 20 for 32-QAM and 82 for
        // 128-QAM, d_min = 2.
        Metrics q32 = grid("cqam32");
        assertEquals(20.0, q32.averageEnergy(), 0.0);
        assertEquals(4.0, q32.minDistanceSquared(), 0.0);
        assertEquals(1.0, q32.powerEfficiency(), 1e-15, "d_min²/E_b = 4/(20/5)");
        Metrics q128 = grid("cqam128");
        assertEquals(82.0, q128.averageEnergy(), 0.0);
        assertEquals(4.0, q128.minDistanceSquared(), 0.0);
    }

    @Test
    void rectangularQamEnergy() {
        // Closed form from the PAM handbook energy: the axes are independent, E_s = (M_I²−1)/3 + (M_Q²−1)/3.
        int[][] shapes = {{4, 2}, {8, 4}, {2, 8}, {16, 2}, {32, 16}, {64, 32}};
        for (int[] shape : shapes) {
            Metrics x = grid("rqam" + shape[0] + "x" + shape[1]);
            double expected = (shape[0] * shape[0] - 1) / 3.0 + (shape[1] * shape[1] - 1) / 3.0;
            assertEquals(expected, x.averageEnergy(), 0.0, shape[0] + "x" + shape[1]);
            assertEquals(1.0, x.grayPenalty(), 0.0);
        }
    }

    @Test
    void naturalLabelingGrayPenalty() {
        // Derived here: neighbouring levels n−1 and n differ in bitCount(n XOR (n−1)) = tz(n)+1 bits, and
        // Σ_{n=1}^{M−1} tz(n) = M−1−k, so the Gray penalty of natural M-PAM is (2M−2−k)/(M−1); a square QAM has the
        // same on each axis.
        for (int k = 1; k <= 8; k++) {
            int m = 1 << k;
            Constellation pam = Catalogue.resolve("pam" + m, Catalogue.Options.DEFAULT.withLabeling(Labeling.NATURAL));
            assertRelative((2.0 * m - 2 - k) / (m - 1), Metrics.of(pam).grayPenalty(), "natural pam" + m);
        }
        Constellation qam = Catalogue.resolve("qam16", Catalogue.Options.DEFAULT.withLabeling(Labeling.NATURAL));
        assertRelative(4.0 / 3, Metrics.of(qam).grayPenalty(), "natural qam16");
    }

    @Test
    void maxwellBoltzmannEnergyAndEntropy() {
        // Closed form for 4-PAM (levels ±1, ±3): p(±1) = 1/(2(1+e^{−8λ})), p(±3) = 1/2 − p(±1);
        // E_s = 2p1·1 + 2p3·9; H = −2p1·log2 p1 − 2p3·log2 p3.
        double lambda = 0.1;
        Constellation c = Catalogue.resolve("pam4", Catalogue.Options.DEFAULT.withShaping(lambda)
                .withNormalization(Normalization.NONE));
        double p1 = 1 / (2 * (1 + Math.exp(-8 * lambda)));
        double p3 = 0.5 - p1;
        Metrics x = Metrics.of(c);
        assertRelative(2 * p1 + 18 * p3, x.averageEnergy(), "E_s");
        assertRelative(-2 * p1 * Math.log(p1) / Math.log(2) - 2 * p3 * Math.log(p3) / Math.log(2), x.entropy(), "H");
        assertRelative(x.minDistanceSquared() / (x.averageEnergy() / 2), x.powerEfficiency(), "E_b = E_s/k");
        // Common practice: equiprobable symbols carry exactly k bits.
        assertEquals(2.0, grid("pam4").entropy(), 0.0);
    }

    @Test
    void bandwidthEfficiency() {
        // Common practice, no source: passband linear modulation at 1/T symbols/s with k bits/symbol; rectangular
        // pulses have first-null bandwidth 2/T (η = k/2), raised cosine (1+α)/T (η = k/(1+α)), Nyquist 1/T (η = k).
        Metrics x = grid("qam64");
        assertEquals(3.0, x.bandwidthEfficiencyFirstNull(), 0.0);
        assertEquals(6 / 1.25, x.bandwidthEfficiency(0.25), 0.0);
        assertEquals(3.0, x.bandwidthEfficiency(1.0), 0.0);
        assertEquals(6.0, x.bandwidthEfficiencyNyquist(), 0.0);
        assertEquals(x.bandwidthEfficiencyNyquist(), x.bandwidthEfficiency(0), 0.0);
        assertThrows(IllegalArgumentException.class, () -> x.bandwidthEfficiency(1.5));
    }

    @Test
    void ringConstellations() {
        // Geometry (common practice, no source): the chord of n points on radius r is 2r·sin(π/n).
        Metrics a16 = grid("apsk16");
        assertEquals(2.0, a16.minDistanceSquared(), 1e-14, "inner chord √2 = outer chord 2(1+√3)sin(π/12)");
        // 4 inner + 12 outer chords, every point has 2 neighbours on its ring
        assertEquals(2.0, a16.averageNeighbours(), 0.0);
        assertEquals(1.0, a16.grayPenalty(), 0.0, "every ring carries a cyclic Gray code");
        assertRelative((4 + 12 * Math.pow(1 + Math.sqrt(3), 2)) / 16, a16.averageEnergy(), "E_s 4+12");
        Metrics star = grid("star8");
        assertEquals(2.0, star.minDistanceSquared(), 1e-14);
        int[] n = star.neighbourCounts();
        Constellation c = Catalogue.resolve("star8", Catalogue.Options.DEFAULT.withNormalization(Normalization.NONE));
        for (int label = 0; label < 8; label++) {
            boolean inner = Math.hypot(c.re(label), c.im(label)) < 1.5;
            assertEquals(inner ? 4 : 2, n[label], "star 8-QAM: inner points see 2 inner and 2 outer neighbours");
        }
    }

    @Test
    void metricsOfNormalizedConstellations() {
        // Closed form: unit-energy 16-QAM has d_min² = 4/10 and E_b = 1/4, so ε is unchanged at 1.6.
        Metrics x = Metrics.of(Catalogue.resolve("qam16"));
        assertEquals(1.0, x.averageEnergy(), 1e-15);
        assertRelative(0.4, x.minDistanceSquared(), "d_min²");
        assertRelative(1.6, x.powerEfficiency(), "eps");
        assertRelative(Math.sqrt(0.4), x.minDistance(), "d_min");
    }

    @Test
    void grayPenaltyWhenOnlyImprobablePointsAreNearest() {
        // Our documented fallback: 4 points on a line at 0, 1 (labels 00, 11) and 3, 5 (labels 01, 10); only the
        // pair (0, 1) is at d_min, and it has probability 0, so the pairs are weighed equally: 2 bits per pair.
        Constellation c = Constellation.ofPoints("u", "custom", new double[] {0, 1, 3, 5}, new double[] {0, 0, 0, 0},
                new int[] {0b00, 0b11, 0b01, 0b10}, new double[] {0, 0, 0.5, 0.5});
        Metrics x = Metrics.of(c);
        assertEquals(0.0, x.averageNeighbours(), 0.0);
        assertEquals(2.0, x.grayPenalty(), 0.0);
    }
}
