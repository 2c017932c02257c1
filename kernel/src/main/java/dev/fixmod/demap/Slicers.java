package dev.fixmod.demap;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import dev.fixmod.map.ConstellationRom;

/**
 * Picks the cheapest exact slicer for a constellation: per-axis thresholds if it is separable (PAM, square and
 * rectangular QAM), sector tests if its points form an M-PSK (including π/2-BPSK), minimum distance otherwise (cross
 * QAM, APSK, custom point sets). All three follow the same tie rule ({@link FixedSlicer}).
 */
public final class Slicers {
    /** The default quantizer of sector slicer slopes: Q1.14 (16 bits), half-even, saturate. */
    public static final Quantizer DEFAULT_SECTOR_COEFFICIENTS =
            new Quantizer(QFormat.signed(1, 14), Rounding.HALF_EVEN, Overflow.SATURATE);

    private Slicers() {
    }

    /** The floating-point slicer of {@code constellation} (as given: normalize it first). */
    public static FloatSlicer floatFor(Constellation constellation) {
        if (constellation.isSeparable()) {
            return new FloatAxisSlicer(constellation);
        }
        if (PskGeometry.isPsk(constellation)) {
            return new FloatSectorSlicer(constellation);
        }
        return new FloatNearestSlicer(constellation);
    }

    /**
     * The fixed-point slicer whose input format and reference points are {@code reference}'s, with
     * {@link #DEFAULT_SECTOR_COEFFICIENTS} for a PSK.
     */
    public static FixedSlicer fixedFor(ConstellationRom reference) {
        return fixedFor(reference, DEFAULT_SECTOR_COEFFICIENTS);
    }

    /** As {@link #fixedFor(ConstellationRom)}, with the given quantizer of sector slicer slopes. */
    public static FixedSlicer fixedFor(ConstellationRom reference, Quantizer sectorCoefficients) {
        Constellation c = reference.constellation();
        if (c.isSeparable()) {
            return new FixedAxisSlicer(reference);
        }
        if (PskGeometry.isPsk(c)) {
            return new FixedSectorSlicer(c, reference.format(), sectorCoefficients);
        }
        return new FixedNearestSlicer(reference);
    }
}
