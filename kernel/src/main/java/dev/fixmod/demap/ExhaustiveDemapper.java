package dev.fixmod.demap;

import dev.fixmod.constellation.Constellation;

/**
 * What the demappers that visit all M points share: the points of even and of odd symbols (π/2-BPSK's turned points,
 * else the same arrays), the log-priors when priors apply, 1/N0 and the bit partition of the labels.
 */
abstract class ExhaustiveDemapper extends SoftDemapper {
    final double[] re;
    final double[] im;
    final double[] oddRe;
    final double[] oddIm;
    final double[] logPrior;
    final boolean priors;
    final double invN0;
    final BitPartition partition;

    ExhaustiveDemapper(SoftAlgorithm algorithm, Constellation constellation, LlrOptions options) {
        super(algorithm, constellation, options);
        int m = constellation.size();
        this.re = constellation.realParts();
        this.im = constellation.imaginaryParts();
        this.oddRe = constellation.alternatesQuarterTurn() ? turnedRe(im) : re;
        this.oddIm = constellation.alternatesQuarterTurn() ? re : im;
        this.priors = options.usesPriors(constellation);
        this.logPrior = new double[m];
        for (int label = 0; label < m; label++) {
            logPrior[label] = priors ? StrictMath.log(constellation.probability(label)) : 0.0;
        }
        this.invN0 = 1.0 / options.n0();
        this.partition = new BitPartition(bitsPerSymbol);
    }

    @Override
    final void compute(double yRe, double yIm, double[] llr, int llrOffset) {
        compute(yRe, yIm, false, llr, llrOffset);
    }

    @Override
    abstract void compute(double yRe, double yIm, boolean odd, double[] llr, int llrOffset);
}
