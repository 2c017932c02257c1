package dev.fixmod.verify.noise;

/** Argument checks shared by the batch methods, so every one reports bad ranges the same way. */
final class Checks {

    private Checks() {
    }

    static void slice(String arrayName, int arrayLength, int offset, int length) {
        if (offset < 0 || length < 0 || offset > arrayLength - length) {
            throw new IllegalArgumentException(arrayName + ": offset " + offset + " and length " + length
                    + " do not fit an array of length " + arrayLength + " (need 0 <= offset, 0 <= length,"
                    + " offset + length <= array length)");
        }
    }

    /** Indices {@code first … first + length − 1} must lie in {@code 0 … limit}. */
    static void indices(String what, long first, int length, long limit) {
        if (first < 0 || first > limit) {
            throw new IllegalArgumentException("first " + what + " index must be 0.." + limit + ", got " + first);
        }
        if (length > 0 && first > limit - (length - 1)) {
            throw new IllegalArgumentException(length + " " + what + "s from index " + first
                    + " would pass the largest index " + limit);
        }
    }
}
