package dev.fixmod.bits;

/**
 * A straightforward n-stage shift register written from the wording of ITU-T O.150 (from memory): "an n-stage
 * shift register whose m-th and n-th stage outputs are added in a modulo-two addition stage, and the result is fed
 * back to the input of the first stage"; the output is taken at stage n. One bit per clock, one array element per
 * stage, sharing no code with {@link PrbsGenerator}.
 */
final class ShiftRegister {
    private final boolean[] stage; // stage[1] is the input stage, stage[n] the output stage
    private final int n;
    private final int m;
    private final boolean invert;

    /** The register loaded with {@code seed}: bit i−1 of the seed in stage i, so stage n (the first output) is the MSB. */
    ShiftRegister(Prbs prbs, long seed) {
        this.n = prbs.degree();
        this.m = prbs.tap();
        this.invert = prbs.inverted();
        this.stage = new boolean[n + 1];
        for (int i = 1; i <= n; i++) {
            stage[i] = (seed >>> (i - 1) & 1) == 1;
        }
    }

    /** One clock: returns the output bit (inverted where the sequence is) and shifts the feedback in. */
    int clock() {
        boolean out = stage[n];
        boolean feedback = stage[m] ^ stage[n];
        System.arraycopy(stage, 1, stage, 2, n - 1);
        stage[1] = feedback;
        return (out ^ invert) ? 1 : 0;
    }

    byte[] next(int count) {
        byte[] bits = new byte[count];
        for (int i = 0; i < count; i++) {
            bits[i] = (byte) clock();
        }
        return bits;
    }
}
