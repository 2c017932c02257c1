package dev.fixmod.verify.demo;

/**
 * A cycle model of the demo scenario's FPGA demapper, written as its RTL would be: integer registers updated once per
 * clock, no floating point, and no call into the kernel (it is the device under test, checked against the kernel's
 * golden vectors, so it must be an independent implementation).
 *
 * <p>Datapath (3GPP TS 38.211 §5.1.4 64-QAM, max-log with K = 1/N0), four registers, so the output answers the
 * input of three clocks before:
 * <ol>
 *   <li>input: {I, Q} as two Q2.9 codes (I in the upper 12 bits), and the scale constant K (UQ6.10, 16 bits) that
 *       the receiver's software sets per noise level;</li>
 *   <li>metric: per label bit D = min over levels with b = 1 of (y − a)² − min over levels with b = 0 of
 *       (y − a)², per axis (the other axis' term is the same in both minima and cancels), exact with 18 fractional
 *       bits, saturated into Q6.18;</li>
 *   <li>scale: D·K, exact with 28 fractional bits, rounded half-even into Q7.4 (drop 24 bits), saturated to 12
 *       bits;</li>
 *   <li>output: drop 4 bits rounding half-even (the {@link Build#TRUNCATING_OUTPUT} build truncates instead: the
 *       deliberate fault of the demo), symmetric saturation to [−31, 31], six bits per LLR;
 *       llr = {llr0 … llr5} = {b0 … b5}, llr0 in the most significant bits.</li>
 * </ol>
 * LLR sign: L = ln P(b=0|y) − ln P(b=1|y). Per TS 38.211 the I coordinate is (1−2b0)(4 − (1−2b2)(2 − (1−2b4)))/√42
 * and Q the same with b1, b3, b5.
 */
public final class DeviceModel {

    /** The builds the demo simulates. */
    public enum Build {
        /** The design as specified. */
        AS_DESIGNED,
        /** The output stage drops its 4 fractional bits by truncation (floor) instead of rounding half-even. */
        TRUNCATING_OUTPUT
    }

    /**
     * The reference levels 1, 3, 5, 7 times 1/√42 as Q2.9 codes (512/√42 = 79.0035…; no level is near a tie, so
     * every rounding mode gives these): a ROM in the RTL, parameters here.
     */
    static final int[] LEVEL = {79, 237, 395, 553};
    /** Per axis: the 8 levels by sub-label (sign bit, b2 or b3, b4 or b5), as TS 38.211 maps them, in Q2.9 codes. */
    private static final int[] AXIS = new int[8];
    private static final int METRIC_MAX = (1 << 24) - 1;     // Q6.18: 25-bit codes
    private static final int METRIC_MIN = -(1 << 24);
    private static final long SCALE_MAX = 2047;              // Q7.4: 12-bit codes
    private static final long SCALE_MIN = -2048;
    private static final long OUT_MAX = 31;                  // Q5.0, symmetric saturation
    private static final long OUT_MIN = -31;
    /** Registers between the stimulus and the output: input, metric, scale, output, less the output itself. */
    public static final int LATENCY = 3;

    static {
        for (int sub = 0; sub < 8; sub++) {
            int sign = (sub >> 2) & 1;
            int mid = (sub >> 1) & 1;
            int low = sub & 1;
            // 4 - (1-2*mid)*(2 - (1-2*low)) gives 3, 1, 5, 7 for (mid, low) = 00, 01, 10, 11.
            int amplitude = 4 - (1 - 2 * mid) * (2 - (1 - 2 * low));
            int code = LEVEL[(amplitude - 1) / 2];
            AXIS[sub] = sign == 0 ? code : -code;
        }
    }

    private final boolean halfEvenOutput;
    // Pipeline registers.
    private int iReg;
    private int qReg;
    private int kReg;
    private final int[] metric = new int[6];
    private int kMetric;
    private final long[] scaled = new long[6];
    private long out;

    public DeviceModel(Build build) {
        this.halfEvenOutput = build == Build.AS_DESIGNED;
    }

    /**
     * One rising clock edge: every register takes its next value at once (the order below runs the stages back to
     * front so that each reads its predecessor's old value, as non-blocking assignments do).
     *
     * @param iq the input word {I, Q}, 24 bits
     * @param k the scale constant code, UQ6.10
     * @return the output register after the edge, 36 bits
     */
    public long clock(int iq, int k) {
        long word = 0;
        for (int f = 0; f < 6; f++) {
            word = (word << 6) | (output(scaled[f]) & 0x3F);
        }
        out = word;
        for (int f = 0; f < 6; f++) {
            scaled[f] = scale(metric[f], kMetric);
        }
        kMetric = kReg;
        // Fields b0..b5: b0, b2, b4 from the I axis (sign, middle, low sub-label bit), b1, b3, b5 from Q.
        for (int f = 0; f < 6; f++) {
            metric[f] = metric(f % 2 == 0 ? iReg : qReg, 2 - f / 2);
        }
        iReg = signExtend12(iq >> 12);
        qReg = signExtend12(iq);
        kReg = k & 0xFFFF;
        return out;
    }

    private static int signExtend12(int v) {
        return (v << 20) >> 20;
    }

    /** D for the sub-label bit at position {@code bit} (2: sign, 1: middle, 0: low) of one axis. */
    private static int metric(int y, int bit) {
        long min0 = Long.MAX_VALUE;
        long min1 = Long.MAX_VALUE;
        for (int sub = 0; sub < 8; sub++) {
            long d = y - AXIS[sub];
            long dd = d * d;
            if (((sub >> bit) & 1) == 0) {
                min0 = Math.min(min0, dd);
            } else {
                min1 = Math.min(min1, dd);
            }
        }
        long diff = min1 - min0;
        return (int) Math.max(METRIC_MIN, Math.min(METRIC_MAX, diff));
    }

    private static long scale(int m, int k) {
        long p = shiftRoundHalfEven((long) m * k, 24);
        return Math.max(SCALE_MIN, Math.min(SCALE_MAX, p));
    }

    private long output(long s) {
        long o = halfEvenOutput ? shiftRoundHalfEven(s, 4) : s >> 4;
        return Math.max(OUT_MIN, Math.min(OUT_MAX, o));
    }

    /** v / 2^s rounded half-even: the adder and comparator an RTL rounder has. */
    private static long shiftRoundHalfEven(long v, int s) {
        long q = v >> s;
        long r = v & ((1L << s) - 1);
        long half = 1L << (s - 1);
        if (r > half || (r == half && (q & 1) != 0)) {
            q++;
        }
        return q;
    }
}
