package dev.fixmod.verify.noise;

/**
 * Complex additive white Gaussian noise of complex power N0: each real dimension has variance N0/2 (the project's
 * convention). Complex sample {@code m} takes Gaussian {@code 2m} for I and {@code 2m + 1} for Q of its key, scaled
 * by σ = sqrt(N0 / 2) with one rounding: {@code I = σ·z(2m)}, {@code Q = σ·z(2m + 1)}. With Box–Muller the pair is
 * the cos/sin pair of one Philox block.
 *
 * <table class="striped">
 *   <caption>Examples</caption>
 *   <thead><tr><th>N0</th><th>σ per dimension</th><th>E[I² + Q²]</th></tr></thead>
 *   <tbody>
 *     <tr><td>2</td><td>1</td><td>2</td></tr>
 *     <tr><td>0.1</td><td>0.2236…</td><td>0.1</td></tr>
 *     <tr><td>0</td><td>0 (all samples ±0)</td><td>0</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>An instance keeps its work arrays (at most about 18 KiB, sized by the first fills) so that repeated fills
 * allocate nothing; it is therefore <b>not thread-safe</b>: use one instance per thread. The samples depend only on
 * N0, the method, the key and the indices, never on the instance or on earlier fills.
 */
public final class Awgn {

    /** The largest complex sample index: Gaussian {@code 2m + 1} must stay a valid index. */
    public static final long MAX_INDEX = (Philox4x32.MAX_INDEX - 1) / 2;

    private static final int CHUNK = 1024;

    private final double n0;
    private final Gaussian method;
    private final Scratch scratch = new Scratch();

    /**
     * @param n0     complex noise power, finite and ≥ 0
     * @param method the Gaussian sampler
     */
    public Awgn(double n0, Gaussian method) {
        if (!(n0 >= 0) || Double.isInfinite(n0)) {
            throw new IllegalArgumentException("N0 (complex noise power) must be finite and >= 0, got " + n0);
        }
        if (method == null) {
            throw new IllegalArgumentException("a Gaussian method is required (box-muller or ziggurat)");
        }
        this.n0 = n0;
        this.method = method;
    }

    /** The complex noise power N0. */
    public double n0() {
        return n0;
    }

    /** The Gaussian sampler. */
    public Gaussian method() {
        return method;
    }

    /** σ = sqrt(N0 / 2), the standard deviation of each real dimension. */
    public double sigma() {
        return StrictMath.sqrt(n0 / 2.0);
    }

    /** Stores noise samples {@code firstSample … firstSample + length − 1} of {@code key} into {@code i}, {@code q}. */
    public void fill(double[] i, int iOffset, double[] q, int qOffset, int length, StreamKey key, long firstSample) {
        Checks.slice("I", i.length, iOffset, length);
        Checks.slice("Q", q.length, qOffset, length);
        Checks.indices("complex noise sample", firstSample, length, MAX_INDEX);
        double sigma = sigma();
        double[] z = scratch.doubles(2 * Math.min(length, CHUNK));
        for (int done = 0; done < length; done += CHUNK) {
            int count = Math.min(CHUNK, length - done);
            method.fill(z, 0, 2 * count, key, 2 * (firstSample + done), scratch);
            for (int k = 0; k < count; k++) {
                i[iOffset + done + k] = sigma * z[2 * k];
                q[qOffset + done + k] = sigma * z[2 * k + 1];
            }
        }
    }
}
