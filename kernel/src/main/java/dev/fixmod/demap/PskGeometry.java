package dev.fixmod.demap;

import dev.fixmod.constellation.Constellation;

/**
 * The sector structure of a PSK constellation for the sector slicers: M points of equal radius at angles
 * {@code φ0 + 2πn/M}, the label of each sector n, and the M/2 decision lines through the origin. Line j carries the
 * boundary rays at {@code φ0 + (2j+1)π/M} and that plus π (between points j and j+1, and j+M/2 and j+M/2+1).
 *
 * <p>Each line is given by its left normal {@code (−sin β, cos β)} scaled so that its larger component is exactly ±1
 * (then a test {@code a·I + b·Q} is a comparison of one axis with the other times a slope, at most one
 * multiplication). The other component is snapped to 0 or ±1 when within 1e−12 of it: by Niven's theorem the only
 * rational slopes tan(rπ) are 0 and ±1, so the axes and diagonals are the only boundaries a sample on a fixed-point
 * grid can lie on exactly, and snapping makes them exact in floating point as they are in fixed point.
 */
final class PskGeometry {
    private static final double RADIUS_TOLERANCE = 1e-9;
    private static final double ANGLE_TOLERANCE = 1e-9;
    private static final double SNAP = 1e-12;

    final int m;
    final double phase;
    final int[] sectorLabel;

    private PskGeometry(int m, double phase, int[] sectorLabel) {
        this.m = m;
        this.phase = phase;
        this.sectorLabel = sectorLabel;
    }

    /** Whether the points form an M-PSK: equal radii, angles equally spaced by 2π/M. */
    static boolean isPsk(Constellation c) {
        return failure(c) == null;
    }

    /** @throws IllegalArgumentException if the constellation's points do not form an M-PSK */
    static PskGeometry of(Constellation c) {
        String failure = failure(c);
        if (failure != null) {
            throw new IllegalArgumentException(c.name() + " is not a PSK constellation: " + failure
                    + "; use the nearest-point slicer");
        }
        int m = c.size();
        double phase = StrictMath.atan2(c.im(0), c.re(0));
        int[] sectorLabel = new int[m];
        for (int label = 0; label < m; label++) {
            sectorLabel[sectorOf(c, label, phase)] = label;
        }
        return new PskGeometry(m, phase, sectorLabel);
    }

    private static int sectorOf(Constellation c, int label, double phase) {
        double step = 2 * StrictMath.PI / c.size();
        double turn = StrictMath.atan2(c.im(label), c.re(label)) - phase;
        long n = StrictMath.round(turn / step);
        return (int) Math.floorMod(n, (long) c.size());
    }

    private static String failure(Constellation c) {
        int m = c.size();
        double r0 = StrictMath.hypot(c.re(0), c.im(0));
        double phase = StrictMath.atan2(c.im(0), c.re(0));
        double step = 2 * StrictMath.PI / m;
        boolean[] seen = new boolean[m];
        for (int label = 0; label < m; label++) {
            double r = StrictMath.hypot(c.re(label), c.im(label));
            if (Math.abs(r - r0) > RADIUS_TOLERANCE * r0) {
                return "label " + label + " has radius " + r + ", label 0 has " + r0;
            }
            double turn = StrictMath.atan2(c.im(label), c.re(label)) - phase;
            double n = StrictMath.rint(turn / step);
            if (Math.abs(turn - n * step) > ANGLE_TOLERANCE) {
                return "label " + label + " is not on the grid of angles 2π/" + m + " from label 0";
            }
            int sector = sectorOf(c, label, phase);
            if (seen[sector]) {
                return "two labels share the angle of sector " + sector;
            }
            seen[sector] = true;
        }
        return null;
    }

    /** The angle of line j's boundary ray between points j and j+1. */
    double boundaryAngle(int line) {
        return phase + (2 * line + 1) * StrictMath.PI / m;
    }

    /**
     * The left normal of line j (pointing counter-clockwise of its ray at {@link #boundaryAngle}), its larger
     * component exactly ±1 and the other snapped to 0 or ±1 when within 1e−12: {@code {a, b}}.
     */
    double[] leftNormal(int line) {
        double beta = boundaryAngle(line);
        double a = -StrictMath.sin(beta);
        double b = StrictMath.cos(beta);
        if (Math.abs(a) >= Math.abs(b)) {
            return new double[] {Math.signum(a), snap(b / Math.abs(a))};
        }
        return new double[] {snap(a / Math.abs(b)), Math.signum(b)};
    }

    private static double snap(double slope) {
        if (Math.abs(slope) < SNAP) {
            return 0.0;
        }
        if (Math.abs(Math.abs(slope) - 1) < SNAP) {
            return Math.signum(slope);
        }
        return slope;
    }
}
