package dev.fixmod.demap;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.map.DatapathCost;
import java.util.Objects;

/**
 * The fixed-point PSK sector slicer: no angle, no trigonometric call, only log2 M integer sign tests against
 * quantized constants.
 *
 * <p>Method. The M decision boundaries of M-PSK are rays from the origin at {@code φ0 + (2j+1)π/M}, lying on M/2 lines.
 * Each line is described by its normal (a, b), scaled at construction so that the larger component is exactly ±1 and
 * the other is the slope ({@code tan} of the line's angle or its inverse), quantized once by the coefficient
 * quantizer; a test is then {@code a·I + b·Q >= 0}, i.e. one axis compared with the other times a quantized slope,
 * computed exactly in 64 bits: one multiplication, one addition, one comparison, and no multiplication at all on the
 * axes and diagonals (slopes 0 and ±1, e.g. every line of QPSK and of 8-PSK at 22.5°). A binary search over the
 * sectors ({@code SectorTree}) tests log2 M lines: the first splits the plane into two halves of M/2 sectors, each
 * further line halves an arc of at most 180° the sample is known to be in. The normals point toward +I (toward +Q on
 * a horizontal line), so a sample on a line goes to its larger-I side: the tie rule of {@link FixedSlicer}. Symmetry
 * folding (|I|, |Q| and a swap) would save multiplications for some phases; the search is used because it serves any
 * M and any phase offset with the same datapath.
 *
 * <p>Construction refuses a coefficient format so coarse that a quantized line turns by a quarter of a sector or more
 * from its ideal angle (lines could then cross and leave a sector empty). π/2-BPSK's odd symbols use the lines turned
 * by +90°, {@code (a, b) → (−b, a)}, exactly.
 */
public final class FixedSectorSlicer extends FixedSlicer {
    private final int m;
    private final int[] sectorLabel;
    private final Quantizer coefficients;
    private final long[][] lines;
    private final SectorTree<long[]> even;
    private final SectorTree<long[]> odd;

    /**
     * @param input        the format of the input codes (signed, at most 32 bits)
     * @param coefficients how the line slopes are quantized; signed with at least one integer bit, so that ±1 is exact
     * @throws IllegalArgumentException if the points do not form an M-PSK, a format is unsupported, or the
     *                                  coefficients are too coarse for M
     */
    public FixedSectorSlicer(Constellation constellation, QFormat input, Quantizer coefficients) {
        super(constellation, input);
        this.coefficients = Objects.requireNonNull(coefficients, "coefficients");
        QFormat cf = coefficients.format();
        if (!input.isSigned() || input.wordLength() > 32) {
            throw new IllegalArgumentException("the input of a slicer must be a signed format of at most 32 bits, got "
                    + input.describe());
        }
        if (!cf.isSigned() || cf.integerBits() < 1) {
            throw new IllegalArgumentException("sector slicer coefficients need a signed format with an integer bit"
                    + " (to hold ±1 exactly), e.g. Q1.14; got " + cf.describe());
        }
        if (input.wordLength() + cf.wordLength() > 63) {
            throw new IllegalArgumentException("a sign test of " + input + " and " + cf + " needs more than 64 bits;"
                    + " use shorter words");
        }
        PskGeometry g = PskGeometry.of(constellation);
        m = g.m;
        sectorLabel = g.sectorLabel.clone();
        lines = new long[m / 2][];
        long[][] turned = new long[m / 2][];
        OverflowCounter counter = OverflowCounter.unnamed();
        for (int j = 0; j < m / 2; j++) {
            double[] ideal = g.leftNormal(j);
            long a = coefficients.quantize(ideal[0], counter);
            long b = coefficients.quantize(ideal[1], counter);
            double error = StrictMath.atan2(b, a) - StrictMath.atan2(ideal[1], ideal[0]);
            error = StrictMath.IEEEremainder(error, 2 * StrictMath.PI);
            if (Math.abs(error) >= StrictMath.PI / (2 * m)) {
                throw new IllegalArgumentException(constellation.name() + ": coefficients " + coefficients
                        + " are too coarse: the boundary at " + StrictMath.toDegrees(g.boundaryAngle(j))
                        + "° turns by " + StrictMath.toDegrees(error) + "°, a quarter sector ("
                        + StrictMath.toDegrees(StrictMath.PI / (2 * m)) + "°) or more; use more fractional bits");
            }
            lines[j] = new long[] {a, b};
            turned[j] = new long[] {-b, a};
        }
        even = SectorTree.ofCodes(m, lines);
        odd = constellation.alternatesQuarterTurn() ? SectorTree.ofCodes(m, turned) : even;
    }

    public Quantizer coefficients() {
        return coefficients;
    }

    /**
     * The quantized normal {@code {a, b}} of line j (0 ≤ j < M/2) before its orientation toward +I, codes of the
     * coefficient format (a copy).
     *
     * @throws IllegalArgumentException if there is no line j
     */
    public long[] lineCodes(int line) {
        return checkedLine(line).clone();
    }

    /**
     * The normal {@code {a, b}} of line j (0 ≤ j < M/2) exactly as this slicer's sign tests use it for even symbols:
     * {@link #lineCodes} negated if needed to point toward +I, or toward +Q on a horizontal line (a = 0). Then
     * {@code a·I + b·Q >= 0} holds exactly when the sample is on the line or on its larger-I (larger-Q) side, which
     * is the tie rule; codes of the coefficient format (a copy). With these M/2 tests a decision needs no search
     * tree: the sector of a sample is the one whose interior gives the same M/2 test results (π/2-BPSK's odd symbols
     * test {@code (−b, a)} of {@link #lineCodes}, oriented the same way).
     *
     * <table class="striped">
     *   <caption>Examples (default coefficients Q1.14: ±1 is ±16384; tan 22.5° = 0.41421… is 6786)</caption>
     *   <thead><tr><th>constellation</th><th>line j: boundary rays</th><th>lineCodes</th><th>orientedLineCodes</th>
     *   <th>a sample on the line goes to</th></tr></thead>
     *   <tbody>
     *     <tr><td>QPSK, points at 45° + n·90°</td><td>0: 90°, 270°</td><td>{−16384, 0}</td><td>{16384, 0}</td>
     *         <td>I ≥ 0</td></tr>
     *     <tr><td>QPSK</td><td>1: 180°, 0°</td><td>{0, −16384}</td><td>{0, 16384}</td><td>Q ≥ 0 (horizontal)</td></tr>
     *     <tr><td>8-PSK, points at n·45°</td><td>0: 22.5°, 202.5°</td><td>{−6786, 16384}</td><td>{6786, −16384}</td>
     *         <td>below the line, the side of +I</td></tr>
     *     <tr><td>8-PSK</td><td>1: 67.5°, 247.5°</td><td>{−16384, 6786}</td><td>{16384, −6786}</td>
     *         <td>the side of +I</td></tr>
     *     <tr><td>8-PSK</td><td>2: 112.5°, 292.5°</td><td>{−16384, −6786}</td><td>{16384, 6786}</td>
     *         <td>the side of +I</td></tr>
     *     <tr><td>8-PSK</td><td>3: 157.5°, 337.5°</td><td>{−6786, −16384}</td><td>{6786, 16384}</td>
     *         <td>above the line, the side of +I</td></tr>
     *   </tbody>
     * </table>
     *
     * @throws IllegalArgumentException if there is no line j
     */
    public long[] orientedLineCodes(int line) {
        long[] normal = checkedLine(line);
        long a = normal[0];
        long b = normal[1];
        return SectorTree.pointsTowardPlusI(a, b) ? new long[] {a, b} : new long[] {-a, -b};
    }

    /** The number of lines, M/2. */
    public int lineCount() {
        return lines.length;
    }

    private long[] checkedLine(int line) {
        if (line < 0 || line >= lines.length) {
            throw new IllegalArgumentException("line " + line + " does not exist; " + constellation().name()
                    + " has lines 0 .. " + (lines.length - 1));
        }
        return lines[line];
    }

    /**
     * The longest search path: log2 M comparisons, one multiplication per line whose slope is not 0 or a power of
     * two, one addition per line that is not an axis; tables: one slope per line and the sector → label map.
     */
    @Override
    public DatapathCost cost() {
        long[] multiplies = new long[2 * m];
        long[] adds = new long[2 * m];
        for (int h = m - 1; h >= 1; h--) {
            long a = Math.abs(even.a[h]);
            long b = Math.abs(even.b[h]);
            int mul = (a != 0 && Long.bitCount(a) != 1) || (b != 0 && Long.bitCount(b) != 1) ? 1 : 0;
            int add = a != 0 && b != 0 ? 1 : 0;
            int child = multiplies[2 * h] > multiplies[2 * h + 1]
                    || (multiplies[2 * h] == multiplies[2 * h + 1] && adds[2 * h] >= adds[2 * h + 1]) ? 2 * h : 2 * h + 1;
            multiplies[h] = mul + multiplies[child];
            adds[h] = add + adds[child];
        }
        int k = constellation().bitsPerSymbol();
        long tableBits = (long) (m / 2) * coefficients.format().wordLength() + (long) m * k;
        return new DatapathCost(multiplies[1], adds[1], k, tableBits);
    }

    @Override
    int decide(int i, int q, boolean oddSymbol) {
        SectorTree<long[]> tree = oddSymbol ? odd : even;
        long[] a = tree.a;
        long[] b = tree.b;
        boolean[] upper = tree.upperIfNonNegative;
        int h = 1;
        while (h < m) {
            boolean nonNegative = a[h] * i + b[h] * q >= 0;
            h = 2 * h + (nonNegative == upper[h] ? 1 : 0);
        }
        return sectorLabel[h - m];
    }

    @Override
    boolean onBoundary(int i, int q, boolean oddSymbol) {
        for (long[] line : lines) {
            long test = oddSymbol ? -line[1] * i + line[0] * q : line[0] * i + line[1] * q;
            if (test == 0) {
                return true;
            }
        }
        return false;
    }
}
