package dev.fixmod.demap;

import dev.fixmod.constellation.AxisLayout;
import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Constellations;
import dev.fixmod.constellation.Family;
import dev.fixmod.constellation.Labeling;
import dev.fixmod.constellation.Normalization;
import java.util.ArrayList;
import java.util.List;

/** Constellations the demapper tests run on, built once. */
final class DemapFixtures {
    private DemapFixtures() {
    }

    /** Gray-labelled separable constellations: PAM, square QAM, rectangular QAM, the 3GPP 16-QAM bit order. */
    static final List<Constellation> GRAY_SEPARABLE = withUnitEnergy(List.of(
            Constellations.pam(2, true), Constellations.pam(4, true), Constellations.pam(8, true),
            Constellations.pam(16, true), Constellations.qam(4, true), Constellations.qam(16, true),
            Constellations.qam(64, true), Constellations.qam(256, true), rectangular(3, 2), rectangular(1, 3),
            rectangular(4, 2), nr16()));

    /** Separable constellations with other labelings (natural along each axis). */
    static final List<Constellation> OTHER_SEPARABLE = withUnitEnergy(List.of(
            Constellations.pam(8, false), Constellations.qam(16, false), Constellations.qam(64, false)));

    /** Non-separable constellations. */
    static final List<Constellation> NON_SEPARABLE = List.of(
            Constellations.psk(8, 0.0, true), Constellations.psk(8, Math.PI / 8, false),
            Constellations.psk(16, 0.0, true));

    static final List<Constellation> SEPARABLE = concat(GRAY_SEPARABLE, OTHER_SEPARABLE);
    static final List<Constellation> ALL = concat(SEPARABLE, NON_SEPARABLE);

    /**
     * A rectangular QAM of 2^iBits × 2^qBits points on the odd grid, Gray along each axis from the most negative
     * level up; the first iBits label bits select the I level.
     */
    static Constellation rectangular(int iBits, int qBits) {
        int[] i = new int[iBits];
        int[] q = new int[qBits];
        for (int n = 0; n < iBits; n++) {
            i[n] = n;
        }
        for (int n = 0; n < qBits; n++) {
            q[n] = iBits + n;
        }
        AxisLayout layout = new AxisLayout(i, q, grayLevels(1 << iBits), grayLevels(1 << qBits));
        return Constellations.fromAxes("rqam" + (1 << (iBits + qBits)), Family.RECTANGULAR_QAM, "gray", layout);
    }

    private static double[] grayLevels(int count) {
        double[] bySubLabel = new double[count];
        for (int n = 0; n < count; n++) {
            bySubLabel[Labeling.gray(n)] = -(count - 1) + 2.0 * n;
        }
        return bySubLabel;
    }

    /**
     * 16-QAM in the bit order of 3GPP TS 38.211 clause 5.1.4: I = (1−2b0)(2−(1−2b2)), Q = (1−2b1)(2−(1−2b3)) on the
     * grid ±1, ±3 (formula recalled from memory; the 1/√10 factor is applied by normalization). b0, b2 ride on I.
     */
    static Constellation nr16() {
        double[] levels = new double[4];
        for (int sub = 0; sub < 4; sub++) {
            int first = sub >>> 1;
            int second = sub & 1;
            levels[sub] = (1 - 2 * first) * (2 - (1 - 2 * second));
        }
        AxisLayout layout = new AxisLayout(new int[] {0, 2}, new int[] {1, 3}, levels, levels);
        return Constellations.fromAxes("nr-qam16", Family.SQUARE_QAM, "nr", layout);
    }

    private static List<Constellation> withUnitEnergy(List<Constellation> raw) {
        List<Constellation> all = new ArrayList<>(raw);
        for (Constellation c : raw) {
            all.add(c.normalized(Normalization.UNIT_ENERGY));
        }
        return List.copyOf(all);
    }

    private static List<Constellation> concat(List<Constellation> a, List<Constellation> b) {
        List<Constellation> all = new ArrayList<>(a);
        all.addAll(b);
        return List.copyOf(all);
    }

    /** max |coordinate| over the points. */
    static double peak(Constellation c) {
        double peak = 0;
        for (int s = 0; s < c.size(); s++) {
            peak = Math.max(peak, Math.max(Math.abs(c.re(s)), Math.abs(c.im(s))));
        }
        return peak;
    }

    /** The smallest distance between two distinct coordinates on either axis (what the input grid must resolve). */
    static double finestSpacing(Constellation c) {
        double min = Double.POSITIVE_INFINITY;
        for (int a = 0; a < c.size(); a++) {
            for (int b = 0; b < c.size(); b++) {
                double dr = Math.abs(c.re(a) - c.re(b));
                double di = Math.abs(c.im(a) - c.im(b));
                if (dr > 0) {
                    min = Math.min(min, dr);
                }
                if (di > 0) {
                    min = Math.min(min, di);
                }
            }
        }
        return min;
    }

    /**
     * The XOR that mirroring {@code re → −re} applies to every label, or −1 if it is not one constant mask (the
     * labeling is then not symmetric under that mirror).
     */
    static int mirrorMask(Constellation c) {
        int mask = -1;
        for (int s = 0; s < c.size(); s++) {
            int mirror = -1;
            for (int t = 0; t < c.size(); t++) {
                if (c.re(t) == -c.re(s) && c.im(t) == c.im(s)) {
                    mirror = t;
                }
            }
            if (mirror < 0 || (mask >= 0 && (s ^ mirror) != mask)) {
                return -1;
            }
            mask = s ^ mirror;
        }
        return mask;
    }
}
