package dev.fixmod.verify.vectors;

import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.fixed.QFormat;
import java.util.Optional;

/**
 * The kernel blocks a vector set exercises, as the generator sees them: the fixed mapper ROM, the float symbol, the
 * demapper input quantizer, the fixed slicer and LLR datapath, and the float reference LLR. Batch methods over
 * primitive arrays; safe to share between threads (counters are passed in). A noise {@code level} of −1 means the
 * design E_s/N0 of the specification (vectors without noise). Methods that take a stream index ({@code firstSymbol},
 * {@code symbolIndex}) apply π/2-BPSK's +90° turn to the symbols of odd index; for other constellations it is
 * irrelevant.
 */
interface Datapath {

    /** Bits per symbol k. */
    int bitsPerSymbol();

    /** The number of labels M = 2^k. */
    default int size() {
        return 1 << bitsPerSymbol();
    }

    /** The mapper ROM entry of {@code label} (even symbols): I and Q codes of the mapper output format. */
    long romI(int label);

    long romQ(int label);

    /** Maps labels through the fixed mapper; {@code firstSymbol} is the stream index of the first. */
    void map(int[] labels, int count, long firstSymbol, long[] i, long[] q);

    /** The float (normalized) symbol of {@code label} (of an even-index symbol for π/2-BPSK). */
    double symbolI(int label);

    double symbolQ(int label);

    /** Whether symbols of odd index are turned by +90° (π/2-BPSK). */
    boolean turnsOddSymbols();

    /** The float symbols of {@code labels}, the channel's input; {@code firstSymbol} is the stream index of the first. */
    void symbols(int[] labels, int count, long firstSymbol, double[] i, double[] q);

    /** The average symbol energy E_s of the float symbols. */
    double averageEnergy();

    /** Quantizes one real channel sample to a demapper input code. */
    long quantizeInput(double x, OverflowCounter counter);

    /** The slicer's reference points in demapper input codes, by label (even-index symbols). */
    long[] referenceI();

    long[] referenceQ();

    /** The reference points of even ({@code odd == false}) or odd-index symbols: π/2-BPSK's turned ROM codes. */
    long[] referenceI(boolean odd);

    long[] referenceQ(boolean odd);

    /** Hard decisions: the label the slicer picks for each input. */
    void slice(long[] i, long[] q, int count, long firstSymbol, int[] labels);

    /** Whether an input of stream index {@code symbolIndex} lies exactly on a decision boundary of the fixed slicer. */
    boolean onBoundary(long i, long q, long symbolIndex);

    /** Fixed LLRs, {@code k} codes per input in the requested sign convention; returns the overflow events. */
    long llr(long[] i, long[] q, int count, long firstSymbol, int level, long[] llr);

    /**
     * Float reference LLRs, {@code k} per input, in the units of the LLR codes' real values (nats when the datapath
     * is noise-scaled, the metric's units when unscaled).
     */
    void referenceLlr(double[] i, double[] q, int count, long firstSymbol, int level, double[] llr);

    /** The slicer's decision thresholds on the I axis as demapper input codes, ascending; empty if not per axis. */
    long[] thresholdsI();

    /** The slicer's decision thresholds on the Q axis as demapper input codes, ascending; empty if not per axis. */
    long[] thresholdsQ();

    /**
     * The PSK sector slicer's lines as its sign tests use them (even symbols): per line {@code {a, b}}, oriented
     * toward +I (+Q when a = 0), so that {@code a·I + b·Q >= 0} means on the line or on its larger-I side; codes of
     * {@link #sectorLineFormat()}. Empty if the slicer has no sector lines.
     */
    long[][] sectorLines();

    /** The format of the sector lines' codes; empty if the slicer has no sector lines. */
    Optional<QFormat> sectorLineFormat();

    /**
     * The codes of the LLR scale constant K per level, in {@link #scaleFormat()}: slot 0 for the design level
     * (vectors without noise), slot l + 1 for noise level l. Empty when the datapath is unscaled.
     */
    long[] scaleCodes();

    /** The format of K; empty when the datapath is unscaled. */
    Optional<QFormat> scaleFormat();

    /** The lowest code the LLR stage emits (the most negative code, or minus the largest for symmetric-saturate). */
    long llrLow();

    /** The highest code the LLR stage emits. */
    long llrHigh();
}
