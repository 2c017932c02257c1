package dev.fixmod.demap;

import dev.fixmod.constellation.Constellation;

/**
 * The floating-point PSK sector slicer, the reference of {@link FixedSectorSlicer}: the same binary search of
 * log2 M sign tests {@code a·re + b·im >= 0} against the decision lines, with the same orientation of each line's
 * normal toward +I (or +Q) that realizes the tie rule of {@link FixedSlicer}. Its lines are the ideal ones (slopes in
 * double precision, axes and diagonals exact).
 */
public final class FloatSectorSlicer extends FloatSlicer {
    private final int m;
    private final int[] sectorLabel;
    private final SectorTree<double[]> even;
    private final SectorTree<double[]> odd;

    /** @throws IllegalArgumentException if the points do not form an M-PSK (equal radii, equal angular steps) */
    public FloatSectorSlicer(Constellation constellation) {
        super(constellation);
        PskGeometry g = PskGeometry.of(constellation);
        m = g.m;
        sectorLabel = g.sectorLabel.clone();
        double[][] lines = new double[m / 2][];
        double[][] turned = new double[m / 2][];
        for (int j = 0; j < m / 2; j++) {
            lines[j] = g.leftNormal(j);
            turned[j] = new double[] {-lines[j][1], lines[j][0]};
        }
        even = SectorTree.ofDoubles(m, lines);
        odd = constellation.alternatesQuarterTurn() ? SectorTree.ofDoubles(m, turned) : even;
    }

    @Override
    int decide(double re, double im, boolean oddSymbol) {
        SectorTree<double[]> tree = oddSymbol ? odd : even;
        double[] a = tree.a;
        double[] b = tree.b;
        boolean[] upper = tree.upperIfNonNegative;
        int h = 1;
        while (h < m) {
            boolean nonNegative = a[h] * re + b[h] * im >= 0;
            h = 2 * h + (nonNegative == upper[h] ? 1 : 0);
        }
        return sectorLabel[h - m];
    }
}
