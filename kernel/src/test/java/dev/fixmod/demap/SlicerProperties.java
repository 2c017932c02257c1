package dev.fixmod.demap;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Constellations;
import dev.fixmod.constellation.Labeling;
import dev.fixmod.constellation.Profile;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import dev.fixmod.map.ConstellationRom;
import dev.fixmod.map.FixedMapper;
import dev.fixmod.map.FloatMapper;
import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Assume;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.LongRange;

/** The laws of the slicers: round trips, equivalences between methods, and one tie rule in float and fixed point. */
class SlicerProperties {

    @Provide
    Arbitrary<String> everyFamily() {
        return Arbitraries.of(SliceFixtures.EVERY_FAMILY);
    }

    @Provide
    Arbitrary<String> separable() {
        return Arbitraries.of(SliceFixtures.SEPARABLE);
    }

    /**
     * Noiseless (and slightly noisy) round trip, float: a point moved by less than d_min/2 is nearer to it than to any
     * other point (triangle inequality), so every exact slicer returns its label.
     */
    @Property(tries = 300)
    void floatMapThenSliceReturnsTheLabel(@ForAll("everyFamily") String name, @ForAll @IntRange(max = 4095) int pick,
                                          @ForAll @DoubleRange(min = 0, max = 0.49) double radius,
                                          @ForAll @DoubleRange(min = 0, max = 360) double degrees,
                                          @ForAll @LongRange(max = 1000) long symbolIndex) {
        Constellation c = SliceFixtures.constellation(name);
        int label = pick % c.size();
        double[] re = new double[1];
        double[] im = new double[1];
        new FloatMapper(c).mapLabels(new int[] {label}, 0, 1, symbolIndex, re, im, 0);
        double d = radius * SliceFixtures.minDistance(name);
        double x = re[0] + d * StrictMath.cos(StrictMath.toRadians(degrees));
        double y = im[0] + d * StrictMath.sin(StrictMath.toRadians(degrees));
        assertEquals(label, SliceFixtures.floatSlicer(name).slice(x, y, symbolIndex), name);
        assertEquals(label, SliceFixtures.floatNearest(name).slice(x, y, symbolIndex), name);
        assertEquals(label, SliceFixtures.floatSlicer(name).slice(re[0], im[0], symbolIndex), name + " noiseless");
    }

    /**
     * Round trip, fixed: the ROM codes (within 1 LSB of the points) moved by less than d_min/2 minus 2 LSB stay
     * nearest to their own point, for formats where d_min spans at least 16 LSB.
     */
    @Property(tries = 300)
    void fixedMapThenSliceReturnsTheLabel(@ForAll("everyFamily") String name, @ForAll @IntRange(max = 4095) int pick,
                                          @ForAll @IntRange(min = 8, max = 14) int fractionalBits,
                                          @ForAll @DoubleRange(min = 0, max = 0.49) double radius,
                                          @ForAll @DoubleRange(min = 0, max = 360) double degrees,
                                          @ForAll @LongRange(max = 1000) long symbolIndex) {
        double dminLsb = Math.scalb(SliceFixtures.minDistance(name), fractionalBits);
        Assume.that(dminLsb >= 16);
        ConstellationRom rom = SliceFixtures.rom(name, fractionalBits);
        int label = pick % rom.size();
        int[] i = new int[1];
        int[] q = new int[1];
        new FixedMapper(rom).mapLabels(new int[] {label}, 0, 1, symbolIndex, i, q, 0);
        double d = Math.max(0, radius * dminLsb - 2);
        // Clamping into the format is a projection onto a box that holds the point: it cannot move the sample away.
        QFormat f = rom.format();
        int x = (int) clamp(StrictMath.rint(i[0] + d * StrictMath.cos(StrictMath.toRadians(degrees))), f);
        int y = (int) clamp(StrictMath.rint(q[0] + d * StrictMath.sin(StrictMath.toRadians(degrees))), f);
        assertEquals(label, SliceFixtures.fixedSlicer(name, fractionalBits).slice(x, y, symbolIndex), name);
        assertEquals(label, SliceFixtures.fixedNearest(name, fractionalBits).slice(x, y, symbolIndex), name);
        assertEquals(label, SliceFixtures.fixedSlicer(name, fractionalBits).slice(i[0], q[0], symbolIndex), name);
    }

    private static double clamp(double code, QFormat f) {
        return Math.max(f.minCode(), Math.min(f.maxCode(), code));
    }

    /**
     * Per-axis = minimum distance on separable constellations, float, away from ties (a sample within 1e−9 of a
     * threshold is skipped: there the rounding of the squared distances may decide).
     */
    @Property(tries = 300)
    void floatAxisSlicerEqualsNearestAwayFromTies(@ForAll("separable") String name,
                                                  @ForAll @DoubleRange(min = -2, max = 2) double x,
                                                  @ForAll @DoubleRange(min = -2, max = 2) double y) {
        FloatAxisSlicer axis = new FloatAxisSlicer(SliceFixtures.constellation(name));
        Assume.that(farFrom(x, axis.iThresholds()) && farFrom(y, axis.qThresholds()));
        assertEquals(SliceFixtures.floatNearest(name).slice(x, y, 0), axis.slice(x, y, 0), name);
    }

    private static boolean farFrom(double x, double[] thresholds) {
        for (double t : thresholds) {
            if (Math.abs(x - t) < 1e-9) {
                return false;
            }
        }
        return true;
    }

    /**
     * Per-axis = minimum distance on separable constellations in fixed point on the same ROM, on every code, ties
     * included: samples are drawn on and next to the thresholds as often as anywhere else.
     */
    @Property(tries = 400)
    void fixedAxisSlicerEqualsNearestEverywhere(@ForAll("separable") String name,
                                                @ForAll @IntRange(min = 4, max = 12) int fractionalBits,
                                                @ForAll @IntRange(max = 1 << 20) int a, @ForAll @IntRange(max = 1 << 20) int b,
                                                @ForAll @IntRange(min = -1, max = 1) int nudgeI,
                                                @ForAll @IntRange(min = -1, max = 1) int nudgeQ,
                                                @ForAll boolean onThresholds) {
        ConstellationRom rom;
        try {
            rom = SliceFixtures.rom(name, fractionalBits);
        } catch (IllegalArgumentException tooCoarse) {
            Assume.that(false);
            return;
        }
        FixedAxisSlicer axis = new FixedAxisSlicer(rom);
        QFormat f = rom.format();
        int i = sample(a, nudgeI, onThresholds, axis.iThresholds(), f);
        int q = sample(b, nudgeQ, onThresholds, axis.qThresholds(), f);
        assertEquals(SliceFixtures.fixedNearest(name, fractionalBits).slice(i, q, 0), axis.slice(i, q, 0),
                name + " at (" + i + ", " + q + ") in " + f);
    }

    private static int sample(int draw, int nudge, boolean onThresholds, int[] thresholds, QFormat f) {
        long span = f.maxCode() - f.minCode() + 1;
        long code = onThresholds && thresholds.length > 0 ? thresholds[draw % thresholds.length] + nudge
                : f.minCode() + draw % span;
        return (int) Math.max(f.minCode(), Math.min(f.maxCode(), code));
    }

    /** Constellations whose points lie on the grid of Q4.3: every boundary is the same line in float and fixed. */
    @Provide
    Arbitrary<Constellation> onTheGrid() {
        return Arbitraries.of(List.of(Constellations.pam(4, Labeling.GRAY), Constellations.pam(8, Labeling.NATURAL),
                Constellations.qam(16, Labeling.GRAY), Constellations.qam(64, Labeling.GRAY),
                Constellations.rectangularQam(8, 4, Labeling.GRAY), Constellations.crossQam(32, Labeling.QUASI_GRAY),
                Profile.NR.onGrid("qam16"), Profile.NR.onGrid("qam64"), Profile.NR.onGrid("bpsk"),
                Constellations.qam(4, Labeling.NATURAL)));
    }

    private static final Quantizer Q4_3 = new Quantizer(QFormat.parse("Q4.3"), Rounding.HALF_EVEN, Overflow.SATURATE);

    /**
     * The tie rule is identical in float and fixed point: on constellations whose points are codes, every sample code
     * (drawn on the midpoints between points as often as anywhere) gets the same label from the float slicers on its
     * value and from the fixed slicers on its code.
     */
    @Property(tries = 500)
    void tiesAreDecidedAlikeInFloatAndFixed(@ForAll("onTheGrid") Constellation c,
                                            @ForAll @IntRange(min = -128, max = 127) int i,
                                            @ForAll @IntRange(min = -128, max = 127) int q,
                                            @ForAll boolean snapToMidpoints) {
        if (snapToMidpoints) {
            // Points are odd integers (codes 8·odd); midpoints are even integers, codes multiple of 8.
            i = Math.floorDiv(i, 8) * 8;
            q = Math.floorDiv(q, 8) * 8;
        }
        ConstellationRom rom = ConstellationRom.of(c, Q4_3);
        assertEquals(0.0, rom.maxErrorLsb());
        double re = Q4_3.format().toDouble(i);
        double im = Q4_3.format().toDouble(q);
        int fixedNearest = new FixedNearestSlicer(rom).slice(i, q, 0);
        assertEquals(fixedNearest, new FloatNearestSlicer(c).slice(re, im, 0), c + " at " + re + ", " + im);
        if (c.isSeparable()) {
            assertEquals(fixedNearest, new FixedAxisSlicer(rom).slice(i, q, 0), c + " axis");
            assertEquals(fixedNearest, new FloatAxisSlicer(c).slice(re, im, 0), c + " float axis");
        }
    }

    /** PSK whose boundaries are all axes or diagonals: those lines are exact in float and in fixed point. */
    @Provide
    Arbitrary<Constellation> alignedPsk() {
        return Arbitraries.of(List.of(Constellations.pskDegrees(2, 0, Labeling.GRAY),
                Constellations.pskDegrees(2, 45, Labeling.GRAY), Constellations.pskDegrees(2, 90, Labeling.GRAY),
                Constellations.pskDegrees(4, 0, Labeling.GRAY), Constellations.pskDegrees(4, 45, Labeling.NATURAL),
                Constellations.pskDegrees(8, 22.5, Labeling.GRAY), Constellations.pskDegrees(8, 67.5, Labeling.NATURAL),
                Profile.NR.onGrid("pi2bpsk")));
    }

    /**
     * The PSK sector slicers decide every code alike in float and fixed point when every boundary is an axis or a
     * diagonal, ties included (codes are drawn on the diagonals and axes as often as anywhere).
     */
    @Property(tries = 500)
    void alignedSectorsAreDecidedAlikeInFloatAndFixed(@ForAll("alignedPsk") Constellation c,
                                                      @ForAll @IntRange(min = -64, max = 63) int i,
                                                      @ForAll @IntRange(min = -64, max = 63) int q,
                                                      @ForAll @IntRange(max = 3) int onto,
                                                      @ForAll @LongRange(max = 7) long symbolIndex) {
        int qq = switch (onto) {
            case 0 -> i; // the 45° diagonal
            case 1 -> Math.max(-64, Math.min(63, -i)); // the 135° diagonal
            case 2 -> 0; // the I axis
            default -> q;
        };
        QFormat input = QFormat.parse("Q1.6");
        FixedSectorSlicer fixed = new FixedSectorSlicer(c, input, Slicers.DEFAULT_SECTOR_COEFFICIENTS);
        assertEquals(fixed.slice(i, qq, symbolIndex),
                new FloatSectorSlicer(c).slice(input.toDouble(i), input.toDouble(qq), symbolIndex),
                c + " at (" + i + ", " + qq + ")");
    }

    /** The sector slicer is the minimum-distance decision of PSK: float, away from the boundaries. */
    @Property(tries = 300)
    void floatSectorSlicerEqualsNearestAwayFromBoundaries(@ForAll @IntRange(min = 1, max = 8) int order,
                                                          @ForAll @DoubleRange(min = -180, max = 180) double phase,
                                                          @ForAll @DoubleRange(min = 0.01, max = 3) double r,
                                                          @ForAll @DoubleRange(min = 0, max = 360) double theta) {
        int m = 1 << order;
        Constellation c = Constellations.pskDegrees(m, phase, Labeling.GRAY);
        double fromBoundary = Math.IEEEremainder(theta - phase - 180.0 / m, 360.0 / m);
        Assume.that(Math.abs(fromBoundary) > 1e-6);
        double x = r * StrictMath.cos(StrictMath.toRadians(theta));
        double y = r * StrictMath.sin(StrictMath.toRadians(theta));
        assertEquals(new FloatNearestSlicer(c).slice(x, y, 0), new FloatSectorSlicer(c).slice(x, y, 0), c.toString());
    }

    /** Batch calls equal one call per sample, whatever the chunking and the stream index of the first symbol. */
    /**
     * The tie rule sends a sample on a boundary to its +I side (+Q on a boundary parallel to I), so one LSB toward −I
     * or −Q it is decided otherwise; checked on every code of a small grid, for the default and the minimum-distance
     * slicer of each family, even and odd symbols.
     */
    @Property(tries = 80)
    void aSampleOnABoundaryIsDecidedUnlikeItsNeighbourTowardMinusIOrMinusQ(@ForAll("everyFamily") String name,
            @ForAll @IntRange(min = 5, max = 6) int fractionalBits, @ForAll @LongRange(max = 1) long symbolIndex) {
        ConstellationRom rom;
        try {
            rom = SliceFixtures.rom(name, fractionalBits);
        } catch (IllegalArgumentException tooCoarse) {
            Assume.that(false);
            return;
        }
        QFormat f = rom.format();
        for (FixedSlicer slicer : List.of(SliceFixtures.fixedSlicer(name, fractionalBits),
                SliceFixtures.fixedNearest(name, fractionalBits))) {
            int onBoundary = 0;
            for (int i = (int) f.minCode() + 1; i <= f.maxCode(); i++) {
                for (int q = (int) f.minCode() + 1; q <= f.maxCode(); q++) {
                    if (!slicer.onBoundary(i, q, symbolIndex)) {
                        continue;
                    }
                    onBoundary++;
                    int here = slicer.slice(i, q, symbolIndex);
                    boolean differs = slicer.slice(i - 1, q, symbolIndex) != here
                            || slicer.slice(i, q - 1, symbolIndex) != here;
                    assertEquals(true, differs, name + " " + slicer.getClass().getSimpleName() + " on a boundary at ("
                            + i + ", " + q + ") in " + f);
                }
            }
            Assume.that(onBoundary > 0 || rom.size() == 1);
        }
    }

    @Property(tries = 200)
    void batchesEqualSingleSlices(@ForAll("everyFamily") String name, @ForAll @IntRange(max = 40) int count,
                                  @ForAll @LongRange(max = 9) long firstSymbol, @ForAll @IntRange(max = 1 << 20) int seed) {
        FixedSlicer slicer = SliceFixtures.fixedSlicer(name, 10);
        QFormat f = slicer.inputFormat();
        int[] i = new int[count + 3];
        int[] q = new int[count + 3];
        java.util.SplittableRandom random = new java.util.SplittableRandom(seed);
        for (int n = 0; n < i.length; n++) {
            i[n] = (int) random.nextLong(f.minCode(), f.maxCode() + 1);
            q[n] = (int) random.nextLong(f.minCode(), f.maxCode() + 1);
        }
        int k = slicer.constellation().bitsPerSymbol();
        int[] labels = new int[count + 1];
        byte[] bits = new byte[count * k + 2];
        slicer.sliceLabels(i, q, 3, count, firstSymbol, labels, 1);
        slicer.sliceBits(i, q, 3, count, firstSymbol, bits, 2);
        for (int n = 0; n < count; n++) {
            int single = slicer.slice(i[3 + n], q[3 + n], firstSymbol + n);
            assertEquals(single, labels[1 + n]);
            int fromBits = 0;
            for (int j = 0; j < k; j++) {
                fromBits = fromBits << 1 | bits[2 + n * k + j];
            }
            assertEquals(single, fromBits, "bits b0 first");
        }
    }
}
