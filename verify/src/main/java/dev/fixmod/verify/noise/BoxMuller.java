package dev.fixmod.verify.noise;

/**
 * The reference Gaussian sampler: Box–Muller on {@link StrictMath}. Gaussian {@code n} comes from primary block
 * {@code p = n >>> 1}: with draws {@code a = draw 2p} and {@code b = draw 2p + 1} (words 0–1 and 2–3 of the block),
 * <pre>
 *   u1 = open(a),  u2 = unit(b),  r = sqrt(−2·log(u1)),  θ = 2π·u2
 *   z(2p) = r·cos(θ),  z(2p + 1) = r·sin(θ)
 * </pre>
 * with 2π the double nearest to it ({@code 0x1.921fb54442d18p2}) and each operation rounded once, in that order.
 */
final class BoxMuller {

    static final double TWO_PI = 0x1.921fb54442d18p2;

    private BoxMuller() {
    }

    static void fill(double[] out, int offset, int length, StreamKey key, long firstIndex, int[] block) {
        long n = firstIndex;
        int end = offset + length;
        int pos = offset;
        while (pos < end) {
            Philox4x32.block(key, n >>> 1, 0, block, 0);
            double u1 = Uniform.open(Philox4x32.join(block[0], block[1]));
            double u2 = Uniform.unit(Philox4x32.join(block[2], block[3]));
            double r = StrictMath.sqrt(-2.0 * StrictMath.log(u1));
            double theta = TWO_PI * u2;
            if ((n & 1) == 0) {
                out[pos++] = r * StrictMath.cos(theta);
                n++;
            }
            if (pos < end) {
                out[pos++] = r * StrictMath.sin(theta);
                n++;
            }
        }
    }
}
