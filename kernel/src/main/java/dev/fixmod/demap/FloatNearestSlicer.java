package dev.fixmod.demap;

import dev.fixmod.constellation.Constellation;

/**
 * The floating-point minimum-distance slicer: the label of the point nearest to the sample in Euclidean distance, for
 * any constellation. Among equidistant points the one with the largest I wins, then the largest Q (the tie rule of
 * {@link FixedSlicer}). For π/2-BPSK the odd-index symbols are compared with the points turned by +90°.
 */
public final class FloatNearestSlicer extends FloatSlicer {
    private final double[] evenRe;
    private final double[] evenIm;
    private final int[] evenLabels;
    private final double[] oddRe;
    private final double[] oddIm;
    private final int[] oddLabels;

    public FloatNearestSlicer(Constellation constellation) {
        super(constellation);
        double[] re = constellation.realParts();
        double[] im = constellation.imaginaryParts();
        evenLabels = ScanOrder.of(re, im);
        evenRe = permute(re, evenLabels);
        evenIm = permute(im, evenLabels);
        if (constellation.alternatesQuarterTurn()) {
            double[] turnedRe = new double[re.length];
            for (int n = 0; n < re.length; n++) {
                turnedRe[n] = -im[n];
            }
            oddLabels = ScanOrder.of(turnedRe, re);
            oddRe = permute(turnedRe, oddLabels);
            oddIm = permute(re, oddLabels);
        } else {
            oddLabels = evenLabels;
            oddRe = evenRe;
            oddIm = evenIm;
        }
    }

    private static double[] permute(double[] values, int[] labels) {
        double[] p = new double[labels.length];
        for (int n = 0; n < labels.length; n++) {
            p[n] = values[labels[n]];
        }
        return p;
    }

    @Override
    int decide(double re, double im, boolean odd) {
        double[] x = odd ? oddRe : evenRe;
        double[] y = odd ? oddIm : evenIm;
        int best = 0;
        double bestDistance = Double.POSITIVE_INFINITY;
        for (int n = 0; n < x.length; n++) {
            double di = re - x[n];
            double dq = im - y[n];
            double d = di * di + dq * dq;
            if (d < bestDistance) {
                bestDistance = d;
                best = n;
            }
        }
        return (odd ? oddLabels : evenLabels)[best];
    }
}
