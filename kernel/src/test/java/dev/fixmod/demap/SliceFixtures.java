package dev.fixmod.demap;

import dev.fixmod.constellation.Catalogue;
import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Metrics;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import dev.fixmod.map.ConstellationRom;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;

/** Shared constellations, formats and cached slicers of the slicer tests (building 1024-point slicers takes time). */
final class SliceFixtures {
    /** One or more members of every family the catalogue has, unit energy. */
    static final List<String> EVERY_FAMILY = List.of(
            "pam2", "pam4", "pam8", "pam16",
            "qam4", "qam16", "qam64", "qam256", "qam1024",
            "rqam8", "rqam32", "rqam2x8", "rqam128",
            "cqam32", "cqam128",
            "psk2", "psk4", "psk8", "psk16", "psk32", "bpsk", "qpsk", "pi2bpsk",
            "apsk16", "apsk32", "star8",
            "nr:pi2bpsk", "nr:bpsk", "nr:qpsk", "nr:qam16", "nr:qam64", "nr:qam256", "nr:qam1024",
            "wlan:bpsk", "wlan:qpsk", "wlan:qam16", "wlan:qam64", "wlan:qam256", "wlan:qam1024");

    /** Separable ones (per-axis slicers apply). */
    static final List<String> SEPARABLE = List.of("pam4", "pam16", "qam16", "qam64", "qam256", "rqam8", "rqam32",
            "rqam2x8", "nr:qam16", "nr:qam64", "nr:qam256", "wlan:qam64");

    private static final Map<String, Constellation> CONSTELLATIONS = new ConcurrentHashMap<>();
    private static final Map<String, Object> SLICERS = new ConcurrentHashMap<>();

    private SliceFixtures() {
    }

    static Constellation constellation(String name) {
        return CONSTELLATIONS.computeIfAbsent(name, Catalogue::resolve);
    }

    static double minDistance(String name) {
        return Metrics.of(constellation(name)).minDistance();
    }

    /** Q1.n, half-even, saturate: holds every unit-energy constellation of the catalogue (peaks below 2). */
    static Quantizer unitFormat(int fractionalBits) {
        return new Quantizer(QFormat.signed(1, fractionalBits), Rounding.HALF_EVEN, Overflow.SATURATE);
    }

    static ConstellationRom rom(String name, int fractionalBits) {
        return (ConstellationRom) SLICERS.computeIfAbsent("rom " + name + " " + fractionalBits,
                k -> ConstellationRom.of(constellation(name), unitFormat(fractionalBits)));
    }

    static FloatSlicer floatSlicer(String name) {
        return (FloatSlicer) SLICERS.computeIfAbsent("float " + name, k -> Slicers.floatFor(constellation(name)));
    }

    static FloatNearestSlicer floatNearest(String name) {
        return (FloatNearestSlicer) SLICERS.computeIfAbsent("float nearest " + name,
                k -> new FloatNearestSlicer(constellation(name)));
    }

    static FixedSlicer fixedSlicer(String name, int fractionalBits) {
        return (FixedSlicer) SLICERS.computeIfAbsent("fixed " + name + " " + fractionalBits,
                k -> Slicers.fixedFor(rom(name, fractionalBits)));
    }

    static FixedNearestSlicer fixedNearest(String name, int fractionalBits) {
        return (FixedNearestSlicer) SLICERS.computeIfAbsent("fixed nearest " + name + " " + fractionalBits,
                k -> new FixedNearestSlicer(rom(name, fractionalBits)));
    }
}
