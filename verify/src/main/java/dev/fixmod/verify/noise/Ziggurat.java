package dev.fixmod.verify.noise;

/**
 * The fast Gaussian sampler: the ziggurat method of Marsaglia and Tsang ("The Ziggurat Method for Generating Random
 * Variables", J. Stat. Software 5(8), 2000) with 128 layers of equal area under f(x) = exp(−x²/2), arranged so that
 * every output depends only on (key, index).
 *
 * <p>Gaussian {@code n} reads a sequence of 64-bit words: first the primary draw {@code n} (word pair
 * {@code n & 1} of primary block {@code n >>> 1}), then, only if it needs more, the retry blocks at counter
 * {@code n} with draw word 1, 2, … (each gives two words: words 0–1, then 2–3). From a word {@code w}: layer
 * {@code i = w & 127}, sign bit {@code (w >>> 7) & 1}, {@code u = unit(w)} (its top 53 bits); bits 8–10 are unused.
 * <pre>
 *   x = u·X[i]
 *   if x &lt; X[i+1]                 accept ±x                      (rectangle; ~97.2 % of all words)
 *   else if i == 0                  tail: repeat { a = open(next), b = open(next),
 *                                                  s = −log(a) / R, t = −log(b) } until t + t ≥ s·s,
 *                                   accept ±(R + s)
 *   else                            v = unit(next); if Y[i] + v·(Y[i+1] − Y[i]) &lt; f(x) accept ±x
 *   otherwise start again with w = next
 * </pre>
 * Tables, built once with StrictMath: R = 3.442619855899, V = 9.91256303526217e−3 (Marsaglia–Tsang's constants for
 * 128 layers), X[0] = V / f(R), X[1] = R, X[i+1] = sqrt(−2·log(V / X[i] + f(X[i]))) for i = 1 … 126, X[128] = 0,
 * Y[0] = 0 and Y[i] = f(X[i]) for i ≥ 1 (so layer i spans heights Y[i] … Y[i+1]); f(x) is computed as
 * {@code exp(−0.5·x·x)}.
 */
final class Ziggurat {

    static final int LAYERS = 128;
    static final double R = 3.442619855899;
    static final double V = 9.91256303526217e-3;

    /** Layer edges X[0 … 128] (X[0] is the base layer's virtual width); read-only after class initialization. */
    static final double[] X = new double[LAYERS + 1];
    /** Layer bottoms: Y[0] = 0 (base layer), Y[i] = f(X[i]); Y[128] = 1. */
    static final double[] Y = new double[LAYERS + 1];

    static {
        X[0] = V / f(R);
        X[1] = R;
        for (int i = 1; i < LAYERS - 1; i++) {
            X[i + 1] = StrictMath.sqrt(-2.0 * StrictMath.log(V / X[i] + f(X[i])));
        }
        X[LAYERS] = 0.0;
        for (int i = 1; i <= LAYERS; i++) {
            Y[i] = f(X[i]);
        }
    }

    private Ziggurat() {
    }

    static double f(double x) {
        return StrictMath.exp(-0.5 * x * x);
    }

    /** Draws computed per step of {@link #fill}: enough to amortize the step, few enough to stay in L1. */
    private static final int STEP = 256;

    static void fill(double[] out, int offset, int length, StreamKey key, long firstIndex, Scratch scratch) {
        long[] words = scratch.words(Math.min(length, STEP));
        Retries retries = scratch.retries;
        long n = firstIndex;
        int end = offset + length;
        int pos = offset;
        while (pos < end) {
            int count = Math.min(STEP, end - pos);
            // Gaussian n's primary word is draw n (word pair n & 1 of block n >>> 1).
            Philox4x32.draws(words, 0, count, key, n, scratch.block);
            for (int j = 0; j < count; j++) {
                long w = words[j];
                int i = (int) w & (LAYERS - 1);
                double x = Uniform.unit(w) * X[i];
                if (x < X[i + 1]) {
                    out[pos + j] = (w & 0x80) != 0 ? -x : x;
                } else {
                    retries.start(key, n + j);
                    out[pos + j] = outsideRectangle(i, (w & 0x80) != 0, x, retries);
                }
            }
            pos += count;
            n += count;
        }
    }

    /** The rare path: layer {@code i}'s candidate {@code x} fell outside its rectangle. */
    private static double outsideRectangle(int i, boolean negative, double x, Retries next) {
        while (true) {
            if (i == 0) {
                while (true) {
                    double s = -StrictMath.log(Uniform.open(next.word())) / R;
                    double t = -StrictMath.log(Uniform.open(next.word()));
                    if (t + t >= s * s) {
                        return negative ? -(R + s) : R + s;
                    }
                }
            }
            double v = Uniform.unit(next.word());
            if (Y[i] + v * (Y[i + 1] - Y[i]) < f(x)) {
                return negative ? -x : x;
            }
            long w = next.word();
            i = (int) w & (LAYERS - 1);
            negative = (w & 0x80) != 0;
            x = Uniform.unit(w) * X[i];
            if (x < X[i + 1]) {
                return negative ? -x : x;
            }
        }
    }

    /**
     * The retry words of one Gaussian index, in order: block (n, draw word k) for k = 1, 2, …, two words each.
     * One instance serves every fill of its {@link Scratch}, so the rare path allocates nothing.
     */
    static final class Retries {
        private final int[] block = new int[4];
        private StreamKey key;
        private long n;
        private int drawWord;
        private int half;

        void start(StreamKey streamKey, long index) {
            key = streamKey;
            n = index;
            drawWord = 0;
            half = 2;
        }

        long word() {
            if (half == 2) {
                drawWord++;
                Philox4x32.block(key, n, drawWord, block, 0);
                half = 0;
            }
            long w = Philox4x32.join(block[2 * half], block[2 * half + 1]);
            half++;
            return w;
        }
    }
}
