package dev.fixmod.bits;

import java.util.Objects;

/** A fixed pattern repeated forever; backs {@link BitSource#constant}, {@code alternating} and {@code repeating}. */
final class RepeatingBits implements BitSource {
    private final byte[] pattern;
    private int phase;

    RepeatingBits(byte[] pattern) {
        this.pattern = pattern;
    }

    @Override
    public void fill(byte[] bits, int offset, int length) {
        Objects.checkFromIndexSize(offset, length, bits.length);
        for (int i = offset, end = offset + length; i < end; i++) {
            bits[i] = pattern[phase];
            phase = phase + 1 == pattern.length ? 0 : phase + 1;
        }
    }

    @Override
    public String toString() {
        StringBuilder s = new StringBuilder("repeating ");
        for (byte b : pattern) {
            s.append(b);
        }
        return s.toString();
    }
}
