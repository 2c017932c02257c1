package dev.fixmod.bits;

/**
 * A stream of bits that fills unpacked bit arrays (one bit, 0 or 1, per byte), chunk after chunk: consecutive calls
 * continue the stream, so filling 10 bits then 6 gives the same 16 bits as filling 16 at once. Sources are
 * stateful and not thread-safe; create one per stream.
 */
public interface BitSource {

    /**
     * Writes the next {@code length} bits of the stream into {@code bits[offset .. offset+length)}.
     *
     * @throws IndexOutOfBoundsException if the range does not lie within {@code bits}
     */
    void fill(byte[] bits, int offset, int length);

    /**
     * The constant stream 000… or 111….
     *
     * @throws IllegalArgumentException unless {@code bit} is 0 or 1
     */
    static BitSource constant(int bit) {
        return new RepeatingBits(new byte[] {checkBit(bit)});
    }

    /**
     * The alternating stream 0101… ({@code firstBit} 0) or 1010… ({@code firstBit} 1).
     *
     * @throws IllegalArgumentException unless {@code firstBit} is 0 or 1
     */
    static BitSource alternating(int firstBit) {
        return new RepeatingBits(new byte[] {checkBit(firstBit), (byte) (1 - firstBit)});
    }

    /**
     * The stream that repeats {@code pattern} (bits 0 or 1, first in time first) forever, e.g. {@code 1, 0, 0, 0}
     * for one mark in four.
     *
     * @throws IllegalArgumentException if the pattern is empty or holds anything but 0 and 1
     */
    static BitSource repeating(byte... pattern) {
        if (pattern.length == 0) {
            throw new IllegalArgumentException("a repeating pattern needs at least one bit");
        }
        for (int i = 0; i < pattern.length; i++) {
            if ((pattern[i] & ~1) != 0) {
                throw new IllegalArgumentException("pattern[" + i + "] = " + pattern[i] + ": a bit must be 0 or 1");
            }
        }
        return new RepeatingBits(pattern.clone());
    }

    private static byte checkBit(int bit) {
        if (bit != 0 && bit != 1) {
            throw new IllegalArgumentException("a bit must be 0 or 1, got " + bit);
        }
        return (byte) bit;
    }
}
