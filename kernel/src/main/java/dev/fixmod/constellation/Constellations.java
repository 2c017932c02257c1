package dev.fixmod.constellation;

/**
 * Factories of the constellation families on their natural grids (PAM and QAM on the odd integers ±1, ±3, …, PSK on
 * the unit circle). Normalize with {@link Constellation#normalized}.
 */
public final class Constellations {
    private Constellations() {
    }

    private static void requirePowerOfTwo(int m, int min, int max, String family) {
        if (m < min || m > max || Integer.bitCount(m) != 1) {
            throw new IllegalArgumentException(family + " order must be a power of two in " + min + ".." + max + ", got " + m);
        }
    }

    /** Levels −(L−1), …, −1, 1, …, L−1 indexed by sub-label: Gray ({@code gray}) or natural order. */
    static double[] axisLevels(int levels, boolean gray) {
        double[] bySubLabel = new double[levels];
        for (int n = 0; n < levels; n++) {
            int subLabel = gray ? Labeling.gray(n) : n;
            bySubLabel[subLabel] = -(levels - 1) + 2.0 * n;
        }
        return bySubLabel;
    }

    static int[] range(int from, int count) {
        int[] r = new int[count];
        for (int i = 0; i < count; i++) {
            r[i] = from + i;
        }
        return r;
    }

    /** M-PAM on the odd-integer grid with binary-reflected Gray (or natural) labels along the axis. */
    public static Constellation pam(int m, boolean gray) {
        requirePowerOfTwo(m, 2, 1024, "PAM");
        int k = Integer.numberOfTrailingZeros(m);
        AxisLayout axes = new AxisLayout(range(0, k), new int[0], axisLevels(m, gray), new double[] {0.0});
        return fromAxes("pam" + m, Family.PAM, gray ? "gray" : "natural", axes);
    }

    /**
     * Square M-QAM on the odd-integer grid; the first k/2 label bits select the I level and the last k/2 the Q
     * level, each axis labelled by binary-reflected Gray (or natural) code from the most negative level up.
     */
    public static Constellation qam(int m, boolean gray) {
        requirePowerOfTwo(m, 4, 4096, "square QAM");
        int k = Integer.numberOfTrailingZeros(m);
        if (k % 2 != 0) {
            throw new IllegalArgumentException("square QAM needs an even number of bits per symbol; " + m
                    + "-QAM has " + k + " (use a rectangular or cross QAM)");
        }
        int half = k / 2;
        int levels = 1 << half;
        AxisLayout axes = new AxisLayout(range(0, half), range(half, half), axisLevels(levels, gray),
                axisLevels(levels, gray));
        return fromAxes("qam" + m, Family.SQUARE_QAM, gray ? "gray" : "natural", axes);
    }

    /** Builds the points of a separable constellation from its axis layout. */
    public static Constellation fromAxes(String name, Family family, String labeling, AxisLayout axes) {
        int m = 1 << axes.bitsPerSymbol();
        double[] re = new double[m];
        double[] im = new double[m];
        for (int label = 0; label < m; label++) {
            re[label] = axes.iLevel(axes.subLabelI(label));
            im[label] = axes.qLevel(axes.subLabelQ(label));
        }
        return Constellation.ofLabelled(name, family, labeling, re, im, null, axes);
    }

    /**
     * M-PSK on the unit circle: point n (counter-clockwise from {@code phaseOffset} radians) has angle
     * {@code phaseOffset + 2πn/M} and label Gray(n) (or n). Uses {@link StrictMath} so points are identical on every JVM.
     */
    public static Constellation psk(int m, double phaseOffset, boolean gray) {
        requirePowerOfTwo(m, 2, 1024, "PSK");
        if (!Double.isFinite(phaseOffset)) {
            throw new IllegalArgumentException("PSK phase offset must be finite, got " + phaseOffset);
        }
        double[] re = new double[m];
        double[] im = new double[m];
        for (int n = 0; n < m; n++) {
            int label = gray ? Labeling.gray(n) : n;
            double angle = phaseOffset + 2 * StrictMath.PI * n / m;
            re[label] = StrictMath.cos(angle);
            im[label] = StrictMath.sin(angle);
        }
        return Constellation.ofLabelled("psk" + m, Family.PSK, gray ? "gray" : "natural", re, im, null, null);
    }
}
