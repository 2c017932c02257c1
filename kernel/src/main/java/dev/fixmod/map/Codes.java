package dev.fixmod.map;

import dev.fixmod.fixed.QFormat;

/** The check that fixed-point input codes lie in their format, shared by the batch calls of every fixed stage. */
public final class Codes {
    private Codes() {
    }

    /**
     * Requires every code of the region to lie in {@code format}'s codes.
     *
     * @param name the array's role in the call, e.g. {@code "input I"}
     * @throws IllegalArgumentException naming the array, the first bad index and value, and the accepted codes
     */
    public static void requireCodes(String name, int[] codes, int offset, int count, QFormat format) {
        long min = format.minCode();
        long max = format.maxCode();
        for (int n = offset; n < offset + count; n++) {
            if (codes[n] < min || codes[n] > max) {
                throw new IllegalArgumentException(name + ": code " + codes[n] + " at index " + n + " is outside "
                        + format + " (codes " + min + " .. " + max + ")");
            }
        }
    }
}
