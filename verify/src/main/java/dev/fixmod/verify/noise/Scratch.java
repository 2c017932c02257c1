package dev.fixmod.verify.noise;

/**
 * The work arrays of one sampler, kept between fills so that a sampler used by one thread allocates nothing per
 * call. Arrays grow on demand and are never shrunk; their contents carry nothing from one fill to the next. Not
 * thread-safe: one instance per thread.
 */
final class Scratch {

    /** One Philox block: the sampler's primary blocks (Box–Muller, an unaligned first draw, a last partial step). */
    final int[] block = new int[4];
    /** The ziggurat's rare path; holds its own block, so it can run between two uses of {@link #block}. */
    final Ziggurat.Retries retries = new Ziggurat.Retries();

    private long[] words = {};
    private double[] doubles = {};

    /** An array of at least {@code length} 64-bit draws. */
    long[] words(int length) {
        if (words.length < length) {
            words = new long[length];
        }
        return words;
    }

    /** An array of at least {@code length} doubles. */
    double[] doubles(int length) {
        if (doubles.length < length) {
            doubles = new double[length];
        }
        return doubles;
    }
}
