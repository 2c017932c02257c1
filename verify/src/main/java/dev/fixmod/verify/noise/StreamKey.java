package dev.fixmod.verify.noise;

/**
 * The key of one random stream: a 32-bit {@code seed} and a 32-bit {@code stream} number, which become the two
 * Philox key words. Different keys give unrelated streams; within one key the sample index is the counter.
 *
 * <p>Use one stream number per purpose (noise, payload bits, ...) so two purposes never share samples. Both values
 * are unsigned 32-bit numbers held in a {@code long}:
 *
 * <table class="striped">
 *   <caption>Accepted values</caption>
 *   <thead><tr><th>call</th><th>result</th></tr></thead>
 *   <tbody>
 *     <tr><td>{@code StreamKey.of(0, 0)}</td><td>key words (0x00000000, 0x00000000)</td></tr>
 *     <tr><td>{@code StreamKey.of(4294967295L, 7)}</td><td>key words (0xffffffff, 0x00000007)</td></tr>
 *     <tr><td>{@code StreamKey.of(-1, 0)}</td><td>IllegalArgumentException</td></tr>
 *     <tr><td>{@code StreamKey.of(1L << 32, 0)}</td><td>IllegalArgumentException</td></tr>
 *   </tbody>
 * </table>
 *
 * @param seed   0 … 4294967295, key word k0
 * @param stream 0 … 4294967295, key word k1
 */
public record StreamKey(long seed, long stream) {

    /** The largest seed or stream number, {@code 2^32 − 1}. */
    public static final long MAX = 0xFFFF_FFFFL;

    public StreamKey {
        if (seed < 0 || seed > MAX) {
            throw new IllegalArgumentException("seed must be 0.." + MAX + " (an unsigned 32-bit number), got " + seed);
        }
        if (stream < 0 || stream > MAX) {
            throw new IllegalArgumentException("stream must be 0.." + MAX + " (an unsigned 32-bit number), got "
                    + stream);
        }
    }

    public static StreamKey of(long seed, long stream) {
        return new StreamKey(seed, stream);
    }

    /** The same seed with another stream number. */
    public StreamKey withStream(long otherStream) {
        return new StreamKey(seed, otherStream);
    }

    /** Key word k0 of Philox4x32. */
    int k0() {
        return (int) seed;
    }

    /** Key word k1 of Philox4x32. */
    int k1() {
        return (int) stream;
    }
}
