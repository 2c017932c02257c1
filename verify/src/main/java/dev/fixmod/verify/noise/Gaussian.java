package dev.fixmod.verify.noise;

import java.util.Locale;

/**
 * Standard normal samples N(0, 1) addressed by index: sample {@code n} of a {@link StreamKey} is the same number
 * however the range is split into chunks or threads. Both methods are deterministic on every JVM (StrictMath);
 * they give different numbers, so a specification names the method it uses.
 *
 * <table class="striped">
 *   <caption>Methods</caption>
 *   <thead><tr><th>constant</th><th>name</th><th>algorithm</th><th>cost per sample</th></tr></thead>
 *   <tbody>
 *     <tr><td>{@link #BOX_MULLER}</td><td>{@code box-muller}</td><td>one Philox block per pair; log, sqrt,
 *         cos, sin</td><td>reference</td></tr>
 *     <tr><td>{@link #ZIGGURAT}</td><td>{@code ziggurat}</td><td>128-layer ziggurat, one 64-bit draw per sample,
 *         retries (~2.8 %) from a separate counter space</td><td>fast: no transcendental function on ~97.2 % of
 *         samples</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>The exact definitions are in {@code noise-algorithm.md} (and in the two implementations' class comments).
 */
public enum Gaussian {

    /** Box–Muller on StrictMath; z(2p) = r·cos θ, z(2p+1) = r·sin θ from block p. */
    BOX_MULLER("box-muller"),
    /** Marsaglia–Tsang ziggurat, 128 layers, rejection retries drawn from counter space (index, retry number). */
    ZIGGURAT("ziggurat");

    private final String label;

    Gaussian(String label) {
        this.label = label;
    }

    /** The name used in specifications and manifests, e.g. {@code box-muller}. */
    public String label() {
        return label;
    }

    /** Parses a {@link #label()}, ignoring case. */
    public static Gaussian fromName(String name) {
        if (name != null) {
            String wanted = name.trim().toLowerCase(Locale.ROOT);
            for (Gaussian g : values()) {
                if (g.label.equals(wanted)) {
                    return g;
                }
            }
        }
        throw new IllegalArgumentException("unknown Gaussian method '" + name + "'; expected box-muller or ziggurat");
    }

    /**
     * Stores samples {@code firstIndex … firstIndex + length − 1} of {@code key} at {@code out[offset …]}. Each call
     * allocates its own small work arrays (this constant is shared by every thread); {@link Awgn} reuses its own.
     *
     * @throws IllegalArgumentException if the slice does not fit {@code out} or an index is negative or overflows
     */
    public void fill(double[] out, int offset, int length, StreamKey key, long firstIndex) {
        fill(out, offset, length, key, firstIndex, new Scratch());
    }

    /** {@link #fill} with the caller's work arrays. */
    void fill(double[] out, int offset, int length, StreamKey key, long firstIndex, Scratch scratch) {
        Checks.slice("out", out.length, offset, length);
        Checks.indices("Gaussian sample", firstIndex, length, Philox4x32.MAX_INDEX);
        if (this == BOX_MULLER) {
            BoxMuller.fill(out, offset, length, key, firstIndex, scratch.block);
        } else {
            Ziggurat.fill(out, offset, length, key, firstIndex, scratch);
        }
    }

    /** Sample {@code index} of {@code key} alone (for spot checks; loops use {@link #fill}). */
    public double sample(StreamKey key, long index) {
        double[] one = new double[1];
        fill(one, 0, 1, key, index);
        return one[0];
    }

    @Override
    public String toString() {
        return label;
    }
}
