package dev.fixmod.verify.bench;

import dev.fixmod.demap.FixedSoftDemapper;
import dev.fixmod.demap.SoftAlgorithm;
import dev.fixmod.demap.SoftDemapper;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.map.FloatMapper;
import dev.fixmod.verify.noise.Awgn;
import dev.fixmod.verify.noise.Gaussian;
import dev.fixmod.verify.noise.Philox4x32;
import dev.fixmod.verify.noise.StreamKey;
import dev.fixmod.verify.theory.LlrHistogram;

/**
 * The Monte Carlo chain of a quantization-loss measurement, composed from the kernel and verify APIs for benchmarking:
 * per block of symbols, uniform labels from a counter-based stream, the float mapper, complex AWGN (ziggurat), the
 * receiver's quantizer ({@link Workload#INPUT}), the fixed-point LLR datapath on the codes and the float demapper on
 * the unquantized samples, then per bit the hard-decision errors of both and their GMI statistics. Every random
 * number is addressed by symbol index, so blocks may be run in any order or on any thread.
 *
 * <p>GMI accounting costs no logarithm per bit: the fixed codes go into an {@link LlrHistogram} (exact), and each float
 * LLR's penalty {@code ln(1 + e^−x)} (x = LLR signed by the bit sent) is {@code max(x, 0) + g(|x|)} with
 * {@code g(t) = ln(1 + e^−t)} read from a table of {@link #PENALTY_STEPS_PER_NAT} steps per nat on [0, 32) with
 * linear interpolation (error at most g''·h²/8 ≤ 3.1e−5 nat per sample, g'' ≤ 1/4; beyond 32 nats g &lt; 1.3e−14
 * is dropped). The table is built once with StrictMath, so the sums are the same on every JVM.
 *
 * <p>Not thread-safe: one chain per thread; the counts of several chains add.
 */
final class MonteCarloChain {
    static final int PENALTY_STEPS_PER_NAT = 32;
    static final int PENALTY_RANGE = 32;
    /** g(t) at t = i / PENALTY_STEPS_PER_NAT, one entry past the range so interpolation never reads beyond. */
    private static final double[] PENALTY = new double[PENALTY_RANGE * PENALTY_STEPS_PER_NAT + 2];
    private static final double LN2 = StrictMath.log(2.0);

    private static final double PENALTY_LAST = PENALTY_RANGE * PENALTY_STEPS_PER_NAT;

    static {
        // Entries RANGE·STEPS and RANGE·STEPS + 1 stay 0: beyond 32 nats g < 1.3e−14 is dropped.
        for (int i = 0; i < PENALTY_RANGE * PENALTY_STEPS_PER_NAT; i++) {
            PENALTY[i] = StrictMath.log1p(StrictMath.exp(-(double) i / PENALTY_STEPS_PER_NAT));
        }
    }

    private final Workload w;
    private final int block;
    private final int k;
    private final int mask;
    private final FloatMapper mapper;
    private final Awgn awgn;
    private final SoftDemapper floatDemapper;
    private final FixedSoftDemapper fixedDemapper;
    private final StreamKey labelKey = StreamKey.of(Workload.SEED, 11);
    private final StreamKey noiseKey = StreamKey.of(Workload.SEED, 12);
    private final OverflowCounter clip = new OverflowCounter("adc");

    private final int[] labels;
    private final double[] re;
    private final double[] im;
    private final double[] noiseI;
    private final double[] noiseQ;
    private final int[] iCodes;
    private final int[] qCodes;
    private final byte[] bits;
    private final int[] codes;
    private final double[] llr;

    private final LlrHistogram fixedHistogram;
    private final double[] floatPenalty;
    private final double[] floatCompensation;
    private final double[] blockPenalty;
    private long fixedBitErrors;
    private long floatBitErrors;
    private long symbols;

    MonteCarloChain(Workload w, SoftAlgorithm algorithm, int block) {
        this.w = w;
        this.block = block;
        this.k = w.bitsPerSymbol();
        this.mask = w.constellation.size() - 1;
        this.mapper = new FloatMapper(w.constellation);
        this.awgn = new Awgn(w.options.n0(), Gaussian.ZIGGURAT);
        this.floatDemapper = SoftDemapper.create(algorithm, w.constellation, w.options);
        this.fixedDemapper = LlrBench.fixedDemapper(algorithm, w);
        this.labels = new int[block];
        this.re = new double[block];
        this.im = new double[block];
        this.noiseI = new double[block];
        this.noiseQ = new double[block];
        this.iCodes = new int[block];
        this.qCodes = new int[block];
        this.bits = new byte[block * k];
        this.codes = new int[block * k];
        this.llr = new double[block * k];
        QFormat out = fixedDemapper.spec().output().format();
        this.fixedHistogram = new LlrHistogram(k, (int) out.minCode(), (int) out.maxCode());
        this.floatPenalty = new double[k];
        this.floatCompensation = new double[k];
        this.blockPenalty = new double[k];
    }

    /** Runs symbols {@code firstSymbol … firstSymbol + block − 1}. */
    void run(long firstSymbol) {
        Philox4x32.fillWords(labels, 0, block, labelKey, firstSymbol);
        for (int n = 0; n < block; n++) {
            labels[n] &= mask;
        }
        mapper.mapLabels(labels, 0, block, firstSymbol, re, im, 0);
        awgn.fill(noiseI, 0, noiseQ, 0, block, noiseKey, firstSymbol);
        for (int n = 0; n < block; n++) {
            re[n] += noiseI[n];
            im[n] += noiseQ[n];
            iCodes[n] = adc(re[n]);
            qCodes[n] = adc(im[n]);
        }
        for (int n = 0; n < block; n++) {
            int label = labels[n];
            for (int b = 0; b < k; b++) {
                bits[n * k + b] = (byte) ((label >>> (k - 1 - b)) & 1);
            }
        }
        fixedDemapper.llr(iCodes, qCodes, 0, block, codes, 0);
        floatDemapper.llr(re, im, 0, block, llr, 0);
        fixedHistogram.add(codes, 0, bits, 0, block * k);
        long fixedErrors = 0;
        long floatErrors = 0;
        double[] penalty = blockPenalty;
        java.util.Arrays.fill(penalty, 0.0);
        for (int n = 0; n < block; n++) {
            for (int b = 0; b < k; b++) {
                int at = n * k + b;
                int bit = bits[at];
                // A decision of 1 when the LLR is negative; 0 (a tie) decides 0.
                fixedErrors += bit ^ (codes[at] >>> 31);
                double l = llr[at];
                // The sign bit is l < 0: the demappers never return −0.0.
                floatErrors += bit ^ (int) (Double.doubleToRawLongBits(l) >>> 63);
                double x = l * (2 * bit - 1); // exact: −l for bit 0, l for bit 1, without a branch
                penalty[b] += Math.max(x, 0.0) + g(Math.abs(x));
            }
        }
        for (int b = 0; b < k; b++) {
            accumulate(b, penalty[b]);
        }
        fixedBitErrors += fixedErrors;
        floatBitErrors += floatErrors;
        symbols += block;
    }

    /**
     * ln(1 + e^−t) for t ≥ 0 by linear interpolation in {@link #PENALTY}; from 32 nats on the last two entries are 0,
     * so a clamped index gives 0 without a branch (the LLR magnitudes of a noisy block are unpredictable).
     */
    private static double g(double t) {
        double u = Math.min(t * PENALTY_STEPS_PER_NAT, PENALTY_LAST);
        int i = (int) u;
        double f = u - i;
        return PENALTY[i] + f * (PENALTY[i + 1] - PENALTY[i]);
    }

    private void accumulate(int b, double value) {
        // Neumaier's compensated sum, as GmiEstimator keeps it.
        double s = floatPenalty[b];
        double t = s + value;
        floatCompensation[b] += Math.abs(s) >= Math.abs(value) ? (s - t) + value : (value - t) + s;
        floatPenalty[b] = t;
    }

    /**
     * The receiver's quantizer {@link Workload#INPUT} (half-even, saturate) inline: {@code Math.rint} is exact
     * half-even rounding, so this equals {@code Workload.INPUT.quantize(x, clip)} for every finite sample, which a
     * test checks.
     */
    private int adc(double x) {
        double r = Math.rint(x * ADC_SCALE);
        if (r < ADC_MIN || r > ADC_MAX) {
            clip.record();
            return r < ADC_MIN ? (int) ADC_MIN : (int) ADC_MAX;
        }
        return (int) r;
    }

    private static final double ADC_SCALE = Math.scalb(1.0, Workload.INPUT.format().fractionalBits());
    private static final double ADC_MIN = Workload.INPUT.format().minCode();
    private static final double ADC_MAX = Workload.INPUT.format().maxCode();

    int[] labels() {
        return labels;
    }

    int[] iCodes() {
        return iCodes;
    }

    int[] qCodes() {
        return qCodes;
    }

    double[] received(boolean q) {
        return q ? im : re;
    }

    long symbols() {
        return symbols;
    }

    long fixedBitErrors() {
        return fixedBitErrors;
    }

    long floatBitErrors() {
        return floatBitErrors;
    }

    long adcClips() {
        return clip.events();
    }

    LlrHistogram fixedHistogram() {
        return fixedHistogram;
    }

    /** The GMI of the fixed codes in bits per symbol, each code read as code · LSB nats. */
    double fixedGmi() {
        return fixedHistogram.gmi(fixedDemapper.spec().output().format().lsb());
    }

    /** The GMI of the float LLRs in bits per symbol (see the class comment for the penalty's accuracy). */
    double floatGmi() {
        double total = 0;
        for (int b = 0; b < k; b++) {
            total += 1 - (floatPenalty[b] + floatCompensation[b]) / symbols / LN2;
        }
        return total;
    }

    Workload workload() {
        return w;
    }
}
