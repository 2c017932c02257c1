package dev.fixmod.map;

import dev.fixmod.bits.BitPacking;
import dev.fixmod.fixed.QFormat;
import java.util.Objects;

/**
 * Maps labels or bits to fixed-point I/Q codes by looking them up in a {@link ConstellationRom}, as a hardware
 * mapper does. The per-symbol work is a table read (and, for π/2-BPSK's odd symbols, the ROM's +90° turn
 * {@code (I, Q) → (−Q, I)}, fitted once at construction): integer-only, checked by a bytecode test.
 *
 * <p>A normalization folded into the ROM ({@link ConstellationRom#normalized}) costs nothing per symbol. A mapper
 * whose ROM holds the integer grid and scales by a constant K in a multiplier is this mapper followed by a
 * {@link FixedGain}; their costs add ({@link DatapathCost#plus}).
 *
 * <p>Batch calls take the stream index of their first symbol (its parity selects the rotation), check all their input
 * before writing anything and allocate nothing.
 */
public final class FixedMapper {
    private final ConstellationRom rom;
    private final int[] evenI;
    private final int[] evenQ;
    private final int[] oddI;
    private final int[] oddQ;
    private final int bitsPerSymbol;

    public FixedMapper(ConstellationRom rom) {
        this.rom = Objects.requireNonNull(rom, "rom");
        this.evenI = rom.iTable(false);
        this.evenQ = rom.qTable(false);
        this.oddI = rom.iTable(true);
        this.oddQ = rom.qTable(true);
        this.bitsPerSymbol = rom.bitsPerSymbol();
    }

    public ConstellationRom rom() {
        return rom;
    }

    /** The format of the output codes: the ROM's. */
    public QFormat outputFormat() {
        return rom.format();
    }

    /** The cost per symbol: see {@link ConstellationRom#mappingCost()}. */
    public DatapathCost cost() {
        return rom.mappingCost();
    }

    /**
     * Writes the I/Q codes of {@code labels[labelOffset .. labelOffset+count)} to {@code outI}/{@code outQ} from
     * {@code outOffset}.
     *
     * @param firstSymbol the stream index of the first symbol (its parity selects π/2-BPSK's rotation)
     * @throws IllegalArgumentException if a region does not fit its array or a label is outside {@code 0..M−1}
     */
    public void mapLabels(int[] labels, int labelOffset, int count, long firstSymbol, int[] outI, int[] outQ,
                          int outOffset) {
        ArrayRegions.require("labels", labels.length, labelOffset, count);
        ArrayRegions.require("output I", outI.length, outOffset, count);
        ArrayRegions.require("output Q", outQ.length, outOffset, count);
        ArrayRegions.requireSymbolIndex(firstSymbol);
        BitPacking.requireLabels(labels, labelOffset, count, evenI.length);
        for (int n = 0; n < count; n++) {
            int label = labels[labelOffset + n];
            boolean odd = ((firstSymbol + n) & 1) != 0;
            outI[outOffset + n] = odd ? oddI[label] : evenI[label];
            outQ[outOffset + n] = odd ? oddQ[label] : evenQ[label];
        }
    }

    /**
     * Maps {@code count} symbols of k unpacked bits each (values 0 or 1, b0 first: the most significant bit of the
     * label) from {@code bits[bitOffset]} on.
     *
     * @throws IllegalArgumentException if a region does not fit its array or a bit is neither 0 nor 1
     */
    public void mapBits(byte[] bits, int bitOffset, int count, long firstSymbol, int[] outI, int[] outQ,
                        int outOffset) {
        ArrayRegions.require("bits", bits.length, bitOffset, (long) count * bitsPerSymbol);
        ArrayRegions.require("output I", outI.length, outOffset, count);
        ArrayRegions.require("output Q", outQ.length, outOffset, count);
        ArrayRegions.requireSymbolIndex(firstSymbol);
        BitPacking.requireBits(bits, bitOffset, count * bitsPerSymbol);
        for (int n = 0; n < count; n++) {
            int label = BitPacking.bitsToLabel(bits, bitOffset + n * bitsPerSymbol, bitsPerSymbol);
            boolean odd = ((firstSymbol + n) & 1) != 0;
            outI[outOffset + n] = odd ? oddI[label] : evenI[label];
            outQ[outOffset + n] = odd ? oddQ[label] : evenQ[label];
        }
    }
}
