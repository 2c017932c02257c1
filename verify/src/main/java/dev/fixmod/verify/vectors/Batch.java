package dev.fixmod.verify.vectors;

/**
 * A chunk of consecutive vectors of one group, column by column; the unit the generator computes (possibly on
 * another thread) and the writers consume in index order. Sized once; never reallocated per vector.
 */
final class Batch {
    final boolean mapperGroup;
    final int capacity;
    final int bitsPerSymbol;
    /** Index of the first vector of the chunk within its group. */
    long first;
    int size;
    final int[] flags;
    /** Noise level index, or −1 for vectors without noise. */
    final int[] level;
    /** Mapper group: the label driven; demapper group: the label sent, or −1 for constructed inputs. */
    final int[] label;
    final long[] mapI;
    final long[] mapQ;
    /** The real channel sample before quantization (demapper group). */
    final double[] chanI;
    final double[] chanQ;
    final long[] inI;
    final long[] inQ;
    final int[] hard;
    /** k LLR codes per vector. */
    final long[] llr;
    /** k float reference LLRs per vector, in the units of the LLR codes' real values. */
    final double[] ref;
    long inputOverflows;
    long llrOverflows;

    Batch(boolean mapperGroup, int capacity, int bitsPerSymbol) {
        this.mapperGroup = mapperGroup;
        this.capacity = capacity;
        this.bitsPerSymbol = bitsPerSymbol;
        flags = new int[capacity];
        level = new int[capacity];
        label = new int[capacity];
        mapI = mapperGroup ? new long[capacity] : new long[0];
        mapQ = mapperGroup ? new long[capacity] : new long[0];
        chanI = mapperGroup ? new double[0] : new double[capacity];
        chanQ = mapperGroup ? new double[0] : new double[capacity];
        inI = mapperGroup ? new long[0] : new long[capacity];
        inQ = mapperGroup ? new long[0] : new long[capacity];
        hard = mapperGroup ? new int[0] : new int[capacity];
        llr = mapperGroup ? new long[0] : new long[capacity * bitsPerSymbol];
        ref = mapperGroup ? new double[0] : new double[capacity * bitsPerSymbol];
    }
}
