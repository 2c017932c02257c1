package dev.fixmod.verify.loss;

import dev.fixmod.verify.theory.LlrHistogram;
import java.util.Arrays;

/**
 * The raw outcome of one (design, Eb/N0) point: integer counts, the float GMI, the histogram of fixed LLR codes per
 * bit position and bit sent, and the input quantization error energy. Everything the reports show is derived from
 * these, so a point read back from a partial result gives the same report as one just simulated.
 *
 * @param histogram counts[(j·2 + b)·width + (code − minCode)], width = maxCode − minCode + 1
 */
public record PointResult(int design, int snr, long symbols, long bitsPerSymbol, long floatBitErrors,
                          long floatSymbolErrors, long fixedBitErrors, long fixedSymbolErrors, double floatGmi,
                          int minCode, int maxCode, long[] histogram, double inputErrorEnergy, long inputSamples,
                          long inputClips, long metricEvents, long scaleEvents, long outputEvents) {

    public PointResult {
        histogram = histogram.clone();
        if (histogram.length != bitsPerSymbol * 2 * ((long) maxCode - minCode + 1)) {
            throw new IllegalArgumentException("histogram of point (" + design + ", " + snr + ") has "
                    + histogram.length + " cells; expected " + bitsPerSymbol * 2 * ((long) maxCode - minCode + 1));
        }
    }

    public long bits() {
        return symbols * bitsPerSymbol;
    }

    @Override
    public long[] histogram() {
        return histogram.clone();
    }

    /**
     * The histogram as the theory package's type, rebuilt by replaying the counts symbol by symbol (the order within
     * a bit position does not change a histogram).
     */
    public LlrHistogram llrHistogram() {
        int k = (int) bitsPerSymbol;
        int width = maxCode - minCode + 1;
        LlrHistogram h = new LlrHistogram(k, minCode, maxCode);
        int[] cell = new int[k];
        long[] left = new long[k];
        for (int j = 0; j < k; j++) {
            cell[j] = -1;
        }
        int block = 1024;
        int[] codes = new int[block * k];
        byte[] bits = new byte[block * k];
        long done = 0;
        while (done < symbols) {
            int n = (int) Math.min(block, symbols - done);
            for (int s = 0; s < n; s++) {
                for (int j = 0; j < k; j++) {
                    while (left[j] == 0) {
                        cell[j]++;
                        left[j] = histogram[j * 2 * width + cell[j]];
                    }
                    left[j]--;
                    int bit = cell[j] / width;
                    codes[s * k + j] = minCode + cell[j] % width;
                    bits[s * k + j] = (byte) bit;
                }
            }
            h.add(codes, 0, bits, 0, n * k);
            done += n;
        }
        return h;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof PointResult p && design == p.design && snr == p.snr && symbols == p.symbols
                && bitsPerSymbol == p.bitsPerSymbol && floatBitErrors == p.floatBitErrors
                && floatSymbolErrors == p.floatSymbolErrors && fixedBitErrors == p.fixedBitErrors
                && fixedSymbolErrors == p.fixedSymbolErrors && Double.compare(floatGmi, p.floatGmi) == 0
                && minCode == p.minCode && maxCode == p.maxCode && Arrays.equals(histogram, p.histogram)
                && Double.compare(inputErrorEnergy, p.inputErrorEnergy) == 0 && inputSamples == p.inputSamples
                && inputClips == p.inputClips && metricEvents == p.metricEvents && scaleEvents == p.scaleEvents
                && outputEvents == p.outputEvents;
    }

    @Override
    public int hashCode() {
        return 31 * (31 * design + snr) + Arrays.hashCode(histogram);
    }
}
