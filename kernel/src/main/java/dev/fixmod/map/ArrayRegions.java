package dev.fixmod.map;

/**
 * Checks of the array regions a batch call reads or writes, with messages that name the array. Batch methods check
 * every region before computing anything, so a bad call leaves its output arrays untouched.
 */
public final class ArrayRegions {
    private ArrayRegions() {
    }

    /**
     * Requires {@code 0 <= offset}, {@code 0 <= count} and {@code offset + count <= length}.
     *
     * @param name   the array's role in the call, e.g. {@code "labels"}
     * @param length the array's length
     * @throws IllegalArgumentException naming the array, the region and the length
     */
    public static void require(String name, int length, long offset, long count) {
        if (offset < 0 || count < 0 || offset + count > length) {
            throw new IllegalArgumentException(name + ": offset " + offset + " and count " + count
                    + " do not fit an array of length " + length + "; need 0 <= offset, 0 <= count, offset + count <= "
                    + length);
        }
    }

    /**
     * Requires a symbol index {@code >= 0}: it numbers symbols from the start of the stream (π/2-BPSK rotates the
     * odd ones), so a batch that continues a stream passes the index of its first symbol.
     */
    public static void requireSymbolIndex(long firstSymbol) {
        if (firstSymbol < 0) {
            throw new IllegalArgumentException("first symbol index must be >= 0, got " + firstSymbol);
        }
    }
}
