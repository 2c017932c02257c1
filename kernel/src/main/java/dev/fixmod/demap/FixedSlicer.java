package dev.fixmod.demap;

import dev.fixmod.bits.BitPacking;
import dev.fixmod.constellation.Constellation;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.map.ArrayRegions;
import dev.fixmod.map.Codes;
import dev.fixmod.map.DatapathCost;

/**
 * A hard-decision slicer on fixed-point I/Q codes: each sample becomes the label of the decided point (the label is
 * the point's index in the constellation and in its ROM), or that label's k bits (b0 first). The per-sample path is
 * integer-only, as in an FPGA or MCU; every constant was quantized at construction. Three methods exist, each with a
 * floating-point reference ({@link FloatSlicer}): {@link FixedAxisSlicer} (per-axis thresholds: PAM, square and
 * rectangular QAM), {@link FixedSectorSlicer} (PSK sectors by sign tests) and {@link FixedNearestSlicer} (minimum
 * distance, any constellation). {@link Slicers} picks one.
 *
 * <h2>The tie rule</h2>
 *
 * <p>A sample exactly on a decision boundary is decided as if it were moved an infinitesimal step toward +I, and, on
 * a boundary parallel to the I axis, toward +Q (formally: the sample is taken as (I + ε, Q + ε²) for an infinitesimal
 * ε). Each method realizes that one rule in the way hardware does naturally, and float and fixed point follow it
 * identically:
 * <ul>
 *   <li>per-axis thresholds: a sample equal to a threshold takes the upper (more positive) level: {@code x >= t};</li>
 *   <li>minimum distance: among equidistant points the one with the largest I wins, among those the largest Q: the
 *       points are scanned in that order and the best is replaced only by a strictly smaller distance;</li>
 *   <li>PSK sectors: a sample on a boundary line goes to the side of larger I (on a horizontal boundary, larger Q):
 *       the sign test {@code a·I + b·Q >= 0} uses the line normal (a, b) that points toward +I (or +Q); the origin,
 *       on every boundary, goes to the sector that contains the direction just above the positive I axis.</li>
 * </ul>
 * Because it is one geometric rule, the per-axis and the minimum-distance slicers agree on every sample of a square
 * or rectangular QAM, ties included (in fixed point when both use the same reference ROM: a threshold is the exact
 * midpoint of two adjacent ROM levels a &lt; b, compared as {@code x >= ceil((a+b)/2)}, i.e. {@code 2x >= a+b}). A
 * label-based rule ("lowest label wins") would not: with Gray labels it sends some ties up and others down, which no
 * single comparator does. Where the methods can differ is the boundary itself, not the rule: a fixed-point PSK
 * sector boundary is a line with quantized slope, whereas a minimum-distance boundary lies midway between quantized
 * ROM points. Samples beyond the outer points take the outer decision.
 *
 * <table class="striped">
 *   <caption>Examples (4-PAM and 16-QAM on the grid ±1, ±3 with this kernel's Gray labels, input Q3.4: codes
 *   −128 … 127, LSB 1/16; PSK with Gray labels, input Q1.6)</caption>
 *   <thead><tr><th>constellation</th><th>sample (I, Q)</th><th>decision</th><th>why</th></tr></thead>
 *   <tbody>
 *     <tr><td>4-PAM (−3, −1, +1, +3 ↔ 00, 01, 11, 10)</td><td>2.0</td><td>+3, label 10</td>
 *         <td>exact threshold: upper level</td></tr>
 *     <tr><td>4-PAM</td><td>0.0</td><td>+1, label 11</td><td>upper level</td></tr>
 *     <tr><td>4-PAM</td><td>−2.0</td><td>−1, label 01</td><td>upper level</td></tr>
 *     <tr><td>4-PAM</td><td>−2.0625 (one LSB below)</td><td>−3, label 00</td><td>below the threshold</td></tr>
 *     <tr><td>4-PAM</td><td>−8.0 (code −128, the most negative)</td><td>−3, label 00</td>
 *         <td>beyond the outer point: outer decision</td></tr>
 *     <tr><td>4-PAM</td><td>7.9375 (code 127)</td><td>+3, label 10</td><td>outer decision</td></tr>
 *     <tr><td>16-QAM (b0 b1 → I, b2 b3 → Q)</td><td>(0, 0)</td><td>(+1, +1), label 1111</td>
 *         <td>both axes upper; minimum distance: four equidistant points, largest I then largest Q</td></tr>
 *     <tr><td>16-QAM</td><td>(2, −2)</td><td>(+3, −1), label 1001</td><td>both axes upper</td></tr>
 *     <tr><td>16-QAM</td><td>(−8, −8) (most negative codes)</td><td>(−3, −3), label 0000</td><td>outer decision</td></tr>
 *     <tr><td>QPSK, points at 45° + n·90°</td><td>(0, 0.5)</td><td>45°, label 00</td>
 *         <td>on the vertical boundary: larger-I side</td></tr>
 *     <tr><td>QPSK</td><td>(−0.5, 0)</td><td>135°, label 01</td><td>on the horizontal boundary: larger-Q side</td></tr>
 *     <tr><td>QPSK</td><td>(0, 0)</td><td>45°, label 00</td><td>origin: sector above the positive I axis</td></tr>
 *     <tr><td>8-PSK, points at n·45°</td><td>(0, 0)</td><td>0°, label 000</td><td>origin</td></tr>
 *     <tr><td>8-PSK, points at 22.5° + n·45°</td><td>(0.5, 0.5)</td><td>22.5°, label 000</td>
 *         <td>on the 45° boundary: larger-I side</td></tr>
 *     <tr><td>8-PSK, points at 22.5° + n·45°</td><td>(−1, −1) (most negative codes)</td><td>247.5°, label 111</td>
 *         <td>on the 225° boundary: larger-I side</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>Batch calls take the stream index of their first symbol (π/2-BPSK turns odd symbols by +90°), check every input
 * code against the input format before writing anything, and allocate nothing.
 */
public abstract sealed class FixedSlicer permits FixedAxisSlicer, FixedNearestSlicer, FixedSectorSlicer {
    private final Constellation constellation;
    private final QFormat input;
    private final int bitsPerSymbol;
    private final boolean alternates;

    FixedSlicer(Constellation constellation, QFormat input) {
        this.constellation = constellation;
        this.input = input;
        this.bitsPerSymbol = constellation.bitsPerSymbol();
        this.alternates = constellation.alternatesQuarterTurn();
    }

    /** The label decided for codes {@code i}, {@code q} of a symbol of even ({@code odd == false}) or odd index. */
    abstract int decide(int i, int q, boolean odd);

    /** Whether codes {@code i}, {@code q} of an even or odd symbol lie exactly on a decision boundary. */
    abstract boolean onBoundary(int i, int q, boolean odd);

    /** The operation counts and table bits per symbol of this slicer's datapath. */
    public abstract DatapathCost cost();

    /** The constellation whose labels are decided. */
    public final Constellation constellation() {
        return constellation;
    }

    /** The format of the input codes. */
    public final QFormat inputFormat() {
        return input;
    }

    /**
     * The label decided for one sample.
     *
     * @param symbolIndex the sample's index in the stream (its parity matters for π/2-BPSK only)
     * @throws IllegalArgumentException if a code lies outside the input format or the index is negative
     */
    public final int slice(int i, int q, long symbolIndex) {
        requireSample(i, q, symbolIndex);
        return decide(i, q, alternates && (symbolIndex & 1) != 0);
    }

    /**
     * Whether one sample lies exactly on a decision boundary of this slicer's integer datapath, so that the tie rule
     * decides it: a code equal to a threshold (per axis), a code on a quantized sector line (PSK; the origin is on
     * all of them), a code at equal smallest distance from two or more ROM points (minimum distance). A verification
     * set uses it to tag the samples that exercise the tie rule.
     *
     * <table class="striped">
     *   <caption>Examples (same constellations and formats as the table above)</caption>
     *   <thead><tr><th>constellation</th><th>sample (I, Q)</th><th>on a boundary</th></tr></thead>
     *   <tbody>
     *     <tr><td>4-PAM</td><td>2.0</td><td>yes: the threshold between +1 and +3</td></tr>
     *     <tr><td>4-PAM</td><td>1.9375 (one LSB below)</td><td>no</td></tr>
     *     <tr><td>16-QAM</td><td>(0, 0.5)</td><td>yes: on the I threshold 0</td></tr>
     *     <tr><td>16-QAM, minimum distance</td><td>(0, 0)</td><td>yes: four points equidistant</td></tr>
     *     <tr><td>QPSK, points at 45° + n·90°</td><td>(0.5, 0.5)</td><td>no: on a point's ray, not a boundary</td></tr>
     *     <tr><td>8-PSK, points at n·45°</td><td>(0, 0)</td><td>yes: the origin</td></tr>
     *   </tbody>
     * </table>
     *
     * @throws IllegalArgumentException if a code lies outside the input format or the index is negative
     */
    public final boolean onBoundary(int i, int q, long symbolIndex) {
        requireSample(i, q, symbolIndex);
        return onBoundary(i, q, alternates && (symbolIndex & 1) != 0);
    }

    private void requireSample(int i, int q, long symbolIndex) {
        if (i < input.minCode() || i > input.maxCode() || q < input.minCode() || q > input.maxCode()) {
            throw new IllegalArgumentException("sample (" + i + ", " + q + ") is outside " + input + " (codes "
                    + input.minCode() + " .. " + input.maxCode() + ")");
        }
        ArrayRegions.requireSymbolIndex(symbolIndex);
    }

    /**
     * Writes the labels decided for {@code count} samples from {@code offset} to {@code labels} from
     * {@code labelOffset}.
     *
     * @param firstSymbol the stream index of the first sample
     * @throws IllegalArgumentException if a region does not fit its array or a code lies outside the input format
     */
    public final void sliceLabels(int[] i, int[] q, int offset, int count, long firstSymbol, int[] labels,
                                  int labelOffset) {
        requireInput(i, q, offset, count, firstSymbol);
        ArrayRegions.require("labels", labels.length, labelOffset, count);
        for (int n = 0; n < count; n++) {
            labels[labelOffset + n] = decide(i[offset + n], q[offset + n], alternates && ((firstSymbol + n) & 1) != 0);
        }
    }

    /**
     * Writes the k bits (b0 first, one byte 0 or 1 each) of the labels decided for {@code count} samples from
     * {@code offset} to {@code bits} from {@code bitOffset}: hard demapping.
     *
     * @throws IllegalArgumentException if a region does not fit its array or a code lies outside the input format
     */
    public final void sliceBits(int[] i, int[] q, int offset, int count, long firstSymbol, byte[] bits,
                                int bitOffset) {
        requireInput(i, q, offset, count, firstSymbol);
        ArrayRegions.require("bits", bits.length, bitOffset, (long) count * bitsPerSymbol);
        for (int n = 0; n < count; n++) {
            int label = decide(i[offset + n], q[offset + n], alternates && ((firstSymbol + n) & 1) != 0);
            BitPacking.labelToBits(label, bits, bitOffset + n * bitsPerSymbol, bitsPerSymbol);
        }
    }

    private void requireInput(int[] i, int[] q, int offset, int count, long firstSymbol) {
        ArrayRegions.require("input I", i.length, offset, count);
        ArrayRegions.require("input Q", q.length, offset, count);
        ArrayRegions.requireSymbolIndex(firstSymbol);
        Codes.requireCodes("input I", i, offset, count, input);
        Codes.requireCodes("input Q", q, offset, count, input);
    }
}
