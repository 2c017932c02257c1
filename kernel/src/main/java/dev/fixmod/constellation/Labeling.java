package dev.fixmod.constellation;

/** Labeling helpers shared by the family factories. */
public final class Labeling {
    private Labeling() {
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
