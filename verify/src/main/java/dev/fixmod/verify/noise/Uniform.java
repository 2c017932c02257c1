package dev.fixmod.verify.noise;

/**
 * Uniform doubles from 64-bit draws, by exact conversions (no rounding: every result is a multiple of 2^−53).
 *
 * <table class="striped">
 *   <caption>Conversions of a 64-bit draw {@code b} (bits as an unsigned number)</caption>
 *   <thead><tr><th>method</th><th>formula</th><th>b = 0</th><th>b = 2^64 − 1</th><th>range</th></tr></thead>
 *   <tbody>
 *     <tr><td>{@link #unit}</td><td>{@code (b >>> 11) · 2^−53}</td><td>0</td><td>1 − 2^−53</td>
 *         <td>[0, 1), step 2^−53</td></tr>
 *     <tr><td>{@link #open}</td><td>{@code ((b >>> 11) | 1) · 2^−53}</td><td>2^−53</td><td>1 − 2^−53</td>
 *         <td>(0, 1), odd multiples of 2^−53, symmetric about ½</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>{@link #open} is meant for logarithms: it never yields 0 (so {@code log} is finite, at least −36.74) nor 1.
 */
public final class Uniform {

    private static final double TWO_POW_MINUS_53 = 0x1.0p-53;

    private Uniform() {
    }

    /** The top 53 bits of {@code bits} as a fraction in [0, 1). */
    public static double unit(long bits) {
        return (bits >>> 11) * TWO_POW_MINUS_53;
    }

    /** The top 52 bits of {@code bits} followed by a 1 bit, as a fraction in (0, 1). */
    public static double open(long bits) {
        return ((bits >>> 11) | 1L) * TWO_POW_MINUS_53;
    }

    /** Fills {@link #unit} of draws {@code firstIndex …} of {@code key} (draw layout: {@link Philox4x32}). */
    public static void fill(double[] out, int offset, int length, StreamKey key, long firstIndex) {
        fill(out, offset, length, key, firstIndex, false);
    }

    /** Fills {@link #open} of draws {@code firstIndex …} of {@code key}. */
    public static void fillOpen(double[] out, int offset, int length, StreamKey key, long firstIndex) {
        fill(out, offset, length, key, firstIndex, true);
    }

    private static void fill(double[] out, int offset, int length, StreamKey key, long firstIndex, boolean open) {
        Checks.slice("out", out.length, offset, length);
        Checks.indices("uniform", firstIndex, length, Philox4x32.MAX_INDEX);
        int[] block = new int[4];
        long j = firstIndex;
        int end = offset + length;
        int pos = offset;
        while (pos < end) {
            Philox4x32.block(key, j >>> 1, 0, block, 0);
            for (int h = (int) (j & 1); h < 2 && pos < end; h++) {
                long bits = Philox4x32.join(block[2 * h], block[2 * h + 1]);
                out[pos++] = open ? open(bits) : unit(bits);
                j++;
            }
        }
    }
}
