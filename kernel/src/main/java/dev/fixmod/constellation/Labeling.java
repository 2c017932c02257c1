package dev.fixmod.constellation;

import dev.fixmod.names.TradeNamed;

/**
 * How bit labels are assigned to the points of a family, by trade name. The mappings of published standards are not
 * labelings of this set: they are fixed by the standard and named by their {@link Profile}.
 *
 * <table class="striped">
 *   <caption>Labels of 4-PAM on the grid −3, −1, +1, +3 (b0 is the first bit and the label's MSB)</caption>
 *   <thead><tr><th>labeling</th><th>−3</th><th>−1</th><th>+1</th><th>+3</th><th>applies to</th></tr></thead>
 *   <tbody>
 *     <tr><td>gray</td><td>00</td><td>01</td><td>11</td><td>10</td><td>PAM, PSK (around the circle), square and
 *         rectangular QAM (per axis)</td></tr>
 *     <tr><td>natural</td><td>00</td><td>01</td><td>10</td><td>11</td><td>every family</td></tr>
 *     <tr><td>quasi-gray</td><td colspan="4">not defined for PAM</td><td>cross QAM and ring (APSK) constellations,
 *         where no labeling gives every nearest pair a one-bit difference</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>{@code gray} is the binary-reflected Gray code {@code n XOR (n >> 1)} of the level index n counted from the most
 * negative level (PAM, per QAM axis) or counter-clockwise from the first point (PSK). The quasi-Gray constructions are
 * documented at {@link Constellations#crossQam} and {@link Constellations#apsk}.
 */
public enum Labeling implements TradeNamed {
    GRAY("gray"),
    NATURAL("natural"),
    QUASI_GRAY("quasi-gray");

    private final String tradeName;

    Labeling(String tradeName) {
        this.tradeName = tradeName;
    }

    /** The name used on the command line, in specification files and in reports, e.g. {@code quasi-gray}. */
    @Override
    public String tradeName() {
        return tradeName;
    }

    @Override
    public String toString() {
        return tradeName;
    }

    /** The labeling of the given name (case-insensitive; {@code _} accepted for {@code -}). */
    public static Labeling fromName(String name) {
        return TradeNamed.parse(Labeling.class, name, "labeling");
    }

    /** The binary-reflected Gray code of {@code n}: {@code n XOR (n >> 1)}. */
    public static int gray(int n) {
        return n ^ (n >>> 1);
    }

    /** The inverse of {@link #gray}: the position whose Gray code is {@code g}. */
    public static int grayInverse(int g) {
        int n = g;
        for (int shift = 1; shift < 32; shift <<= 1) {
            n ^= n >>> shift;
        }
        return n;
    }
}
