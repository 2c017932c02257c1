package dev.fixmod.testing;

/** Test-only methods with known arithmetic, to show that {@link IntegerOnlyBytecode} tells them apart. */
final class BytecodeSamples {
    private final double scale;
    private final int[] table = {1, 2, 3};

    private BytecodeSamples(double scale) {
        this.scale = scale;
    }

    static int integerOnly(int a, int b) {
        long product = (long) a * b;
        return (int) (product >> 3) + Math.abs(a) + Long.numberOfLeadingZeros(product);
    }

    static int roundsThroughDouble(int a) {
        return (int) (a * 0.5); // i2d, dmul, d2i
    }

    static int callsHelperThatUsesDouble(int a) {
        return hiddenHelper(a) + 1;
    }

    private static int hiddenHelper(int a) {
        return (int) Math.floor(a / 3.0);
    }

    int readsDoubleField(int a) {
        return a > 0 ? table[a % 3] : (int) scale; // getfield of type D
    }

    static long callsStrictMath(long a) {
        return StrictMath.round(StrictMath.sqrt(a));
    }

    static int duplicatesOnly(int[] counts, int i) {
        return counts[i]++; // dup2 / iaload / iastore: integer stack work
    }

    static int usesFloat(int a) {
        float f = a;
        return (int) (f * 2f);
    }
}
