package dev.fixmod.constellation;

import java.util.List;
import java.util.Locale;

/**
 * The bit-to-symbol mappings of published standards, named {@code <profile>:<member>} in the {@link Catalogue}
 * (e.g. {@code nr:qam64}). Each is built on its integer grid; unit-energy normalization (the catalogue's default)
 * then gives exactly the standard's points, e.g. 16-QAM as odd integers × {@code 1 / StrictMath.sqrt(10)}. These are
 * engineering models of the published formulas; the standard's text decides.
 *
 * <table class="striped">
 *   <caption>What each profile maps (b0 is the first bit; I = real, Q = imaginary part)</caption>
 *   <thead><tr><th>profile</th><th>bits to axes</th><th>per-axis levels</th><th>scale on the grid</th></tr></thead>
 *   <tbody>
 *     <tr><td>nr (3GPP TS 38.211 §5.1)</td><td>interleaved: I from b0, b2, b4, …; Q from b1, b3, b5, …
 *         (BPSK and π/2-BPSK: b0 on both)</td>
 *         <td>(1−2b0)[2^(h−1) − (1−2b2)[2^(h−2) − …]]: 16-QAM I for b0b2 = 00, 01, 10, 11 is +1, +3, −1, −3</td>
 *         <td>1/√2, 1/√2, 1/√10, 1/√42, 1/√170, 1/√682</td></tr>
 *     <tr><td>wlan (IEEE 802.11, subcarrier modulation mapping)</td><td>first half of the bits to I, second half to
 *         Q (BPSK: b0 on I)</td><td>binary-reflected Gray from the most negative level: 16-QAM I for b0b1 = 00, 01,
 *         11, 10 is −3, −1, +1, +3</td><td>K_MOD = 1, 1/√2, 1/√10, 1/√42, 1/√170, 1/√682</td></tr>
 *   </tbody>
 * </table>
 */
public enum Profile {
    NR("nr", "3GPP TS 38.211 section 5.1", List.of("pi2bpsk", "bpsk", "qpsk", "qam16", "qam64", "qam256", "qam1024")),
    WLAN("wlan", "IEEE 802.11 subcarrier modulation mapping",
            List.of("bpsk", "qpsk", "qam16", "qam64", "qam256", "qam1024"));

    private final String prefix;
    private final String source;
    private final List<String> members;

    Profile(String prefix, String source, List<String> members) {
        this.prefix = prefix;
        this.source = source;
        this.members = members;
    }

    /** The name before the colon, e.g. {@code nr}. */
    public String prefix() {
        return prefix;
    }

    /** The published document the mappings come from. */
    public String source() {
        return source;
    }

    /** The accepted names after the colon, e.g. {@code qam64}. */
    public List<String> members() {
        return members;
    }

    /** The profile of the given prefix, or {@code null}. */
    static Profile ofPrefix(String prefix) {
        for (Profile p : values()) {
            if (p.prefix.equals(prefix)) {
                return p;
            }
        }
        return null;
    }

    /** The member's constellation on its integer grid, named {@code <prefix>:<member>}, labeling = the prefix. */
    public Constellation onGrid(String member) {
        String key = member.trim().toLowerCase(Locale.ROOT);
        if (!members.contains(key)) {
            throw new IllegalArgumentException("profile " + prefix + " has no constellation '" + member
                    + "'; accepted: " + prefix + ":" + String.join(", " + prefix + ":", members));
        }
        String name = prefix + ":" + key;
        return this == NR ? nr(name, key) : wlan(name, key);
    }

    private static Constellation nr(String name, String member) {
        switch (member) {
            case "pi2bpsk":
                return nrBpsk(name).withAlternatingQuarterTurn(name);
            case "bpsk":
                return nrBpsk(name);
            case "qpsk":
                return Constellations.fromAxes(name, Family.SQUARE_QAM, "nr",
                        new AxisLayout(new int[] {0}, new int[] {1}, nrLevels(1), nrLevels(1)));
            default:
                int k = Integer.numberOfTrailingZeros(Integer.parseInt(member.substring(3)));
                int half = k / 2;
                int[] iBits = new int[half];
                int[] qBits = new int[half];
                for (int j = 0; j < half; j++) {
                    iBits[j] = 2 * j;
                    qBits[j] = 2 * j + 1;
                }
                return Constellations.fromAxes(name, Family.SQUARE_QAM, "nr",
                        new AxisLayout(iBits, qBits, nrLevels(half), nrLevels(half)));
        }
    }

    /** d = (1−2b)(1 + j): both axes carry b0, so there is no axis layout. */
    private static Constellation nrBpsk(String name) {
        return Constellation.ofLabelled(name, Family.PSK, "nr", new double[] {1, -1}, new double[] {1, -1}, null, null);
    }

    /**
     * The levels of one NR axis by sub-label c0 c1 … c(h−1) (c0 the MSB, the axis's first bit in time):
     * (1−2c0)·(2^(h−1) − f1) with f_j = (1−2c_j)·(2^(h−1−j) − f_(j+1)) and f_(h−1) = 1−2c_(h−1).
     */
    static double[] nrLevels(int h) {
        double[] levels = new double[1 << h];
        for (int sub = 0; sub < levels.length; sub++) {
            int f = 0;
            for (int j = h - 1; j >= 1; j--) {
                int sign = 1 - 2 * ((sub >>> (h - 1 - j)) & 1);
                f = j == h - 1 ? sign : sign * ((1 << (h - 1 - j)) - f);
            }
            int sign0 = 1 - 2 * ((sub >>> (h - 1)) & 1);
            levels[sub] = h == 1 ? sign0 : sign0 * ((1 << (h - 1)) - f);
        }
        return levels;
    }

    private static Constellation wlan(String name, String member) {
        Constellation grid;
        switch (member) {
            case "bpsk":
                grid = Constellations.pam(2, Labeling.GRAY);
                break;
            case "qpsk":
                grid = Constellations.qam(4, Labeling.GRAY);
                break;
            default:
                grid = Constellations.qam(Integer.parseInt(member.substring(3)), Labeling.GRAY);
                break;
        }
        return Constellation.ofLabelled(name, grid.family(), "wlan", grid.realParts(), grid.imaginaryParts(), null,
                grid.axes());
    }
}
