package dev.fixmod.verify.theory;

import dev.fixmod.constellation.Constellation;

/**
 * Minimum distance and nearest-neighbour count of a constellation scaled to unit average energy (E_s = 1, weighted by
 * the symbol probabilities). Squared distances within a relative 1e−9 of d_min² count as nearest, because PSK
 * points come from sine and cosine and equal distances differ in the last bits.
 */
final class Distances {
    private static final double SAME_DISTANCE = 1e-9;

    /** d_min at E_s = 1. */
    final double minimum;
    /** N̄ = Σ_i p_i · (number of points at d_min from point i). */
    final double averageNeighbours;

    private Distances(double minimum, double averageNeighbours) {
        this.minimum = minimum;
        this.averageNeighbours = averageNeighbours;
    }

    static Distances of(Constellation constellation) {
        double[] re = constellation.realParts();
        double[] im = constellation.imaginaryParts();
        double scale = 1.0 / constellation.averageEnergy();
        int m = re.length;
        double min2 = Double.POSITIVE_INFINITY;
        for (int i = 0; i < m; i++) {
            for (int j = i + 1; j < m; j++) {
                min2 = Math.min(min2, squaredDistance(re, im, i, j) * scale);
            }
        }
        double limit = min2 * (1 + SAME_DISTANCE);
        double neighbours = 0;
        for (int i = 0; i < m; i++) {
            int count = 0;
            for (int j = 0; j < m; j++) {
                if (j != i && squaredDistance(re, im, i, j) * scale <= limit) {
                    count++;
                }
            }
            neighbours += constellation.probability(i) * count;
        }
        return new Distances(StrictMath.sqrt(min2), neighbours);
    }

    static double squaredDistance(double[] re, double[] im, int i, int j) {
        double dr = re[i] - re[j];
        double di = im[i] - im[j];
        return dr * dr + di * di;
    }
}
