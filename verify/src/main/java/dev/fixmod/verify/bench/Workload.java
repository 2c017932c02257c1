package dev.fixmod.verify.bench;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Constellations;
import dev.fixmod.constellation.Normalization;
import dev.fixmod.demap.LlrOptions;
import dev.fixmod.demap.LlrSign;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import dev.fixmod.map.ConstellationRom;
import dev.fixmod.map.FloatMapper;
import dev.fixmod.verify.noise.Awgn;
import dev.fixmod.verify.noise.Gaussian;
import dev.fixmod.verify.noise.Philox4x32;
import dev.fixmod.verify.loss.LossSpec;
import dev.fixmod.verify.loss.LossSpecReader;
import dev.fixmod.verify.loss.Simulation;
import dev.fixmod.verify.noise.StreamKey;
import java.util.Locale;

/**
 * One benchmark scenario of our own: a unit-energy constellation at a fixed Es/N0, its ROM in {@link #INPUT}, and a
 * block of noisy received samples (float and quantized) that every demapper and slicer benchmark reads. The
 * operating points are chosen so that the LLRs are neither all saturated nor all near zero; they are not taken from
 * any standard.
 *
 * <table class="striped">
 *   <caption>Scenarios</caption>
 *   <thead><tr><th>name</th><th>constellation</th><th>Es/N0 (dB)</th></tr></thead>
 *   <tbody>
 *     <tr><td>{@code 16-qam}</td><td>Gray square 16-QAM</td><td>12</td></tr>
 *     <tr><td>{@code 64-qam}</td><td>Gray square 64-QAM</td><td>18</td></tr>
 *     <tr><td>{@code 256-qam}</td><td>Gray square 256-QAM</td><td>24</td></tr>
 *     <tr><td>{@code 1024-qam}</td><td>Gray square 1024-QAM</td><td>30</td></tr>
 *     <tr><td>{@code 8-psk}</td><td>Gray 8-PSK, no phase offset</td><td>12</td></tr>
 *   </tbody>
 * </table>
 */
final class Workload {
    /** Received-sample and ROM format: Q2.12, 15 bits, range [−4, 4), half-even, saturate. */
    static final Quantizer INPUT = new Quantizer(QFormat.signed(2, 12), Rounding.HALF_EVEN, Overflow.SATURATE);
    /** LLR word: Q5.2, 8 bits, LSB 0.25 nat. */
    static final QFormat LLR_OUTPUT = QFormat.signed(5, 2);
    /** Samples per benchmark operation batch. */
    static final int BLOCK = 1024;
    static final long SEED = 20240607L;

    final String name;
    final Constellation constellation;
    final ConstellationRom rom;
    final LlrOptions options;
    final double esN0Db;
    final int[] labels = new int[BLOCK];
    final double[] re = new double[BLOCK];
    final double[] im = new double[BLOCK];
    final int[] iCodes = new int[BLOCK];
    final int[] qCodes = new int[BLOCK];

    private Workload(String name, Constellation raw, double esN0Db) {
        this.name = name;
        this.constellation = raw.normalized(Normalization.UNIT_ENERGY);
        this.rom = ConstellationRom.of(constellation, INPUT);
        this.esN0Db = esN0Db;
        this.options = LlrOptions.fromEsN0Db(constellation, esN0Db, LlrSign.ZERO_POSITIVE, false);
        int[] words = new int[BLOCK];
        Philox4x32.fillWords(words, 0, BLOCK, StreamKey.of(SEED, 1), 0);
        for (int n = 0; n < BLOCK; n++) {
            labels[n] = words[n] & (constellation.size() - 1);
        }
        new FloatMapper(constellation).mapLabels(labels, 0, BLOCK, 0, re, im, 0);
        double[] nI = new double[BLOCK];
        double[] nQ = new double[BLOCK];
        new Awgn(options.n0(), Gaussian.ZIGGURAT).fill(nI, 0, nQ, 0, BLOCK, StreamKey.of(SEED, 2), 0);
        OverflowCounter clip = OverflowCounter.unnamed();
        for (int n = 0; n < BLOCK; n++) {
            re[n] += nI[n];
            im[n] += nQ[n];
            iCodes[n] = (int) INPUT.quantize(re[n], clip);
            qCodes[n] = (int) INPUT.quantize(im[n], clip);
        }
    }

    /** The scenario of {@code name}; see the class table. */
    static Workload of(String name) {
        return switch (name) {
            case "16-qam" -> new Workload(name, Constellations.qam(16, true), 12);
            case "64-qam" -> new Workload(name, Constellations.qam(64, true), 18);
            case "256-qam" -> new Workload(name, Constellations.qam(256, true), 24);
            case "1024-qam" -> new Workload(name, Constellations.qam(1024, true), 30);
            case "8-psk" -> new Workload(name, Constellations.psk(8, 0.0, true), 12);
            default -> throw new IllegalArgumentException("unknown benchmark scenario '" + name
                    + "'; expected 16-qam, 64-qam, 256-qam, 1024-qam or 8-psk");
        };
    }

    int bitsPerSymbol() {
        return constellation.bitsPerSymbol();
    }

    /**
     * The Monte Carlo chain of a quantization-loss run on this QAM scenario, as {@code fixmod loss} runs it: a
     * specification with this constellation, {@link #INPUT} as mapper and receiver input, per-axis max-log in float
     * and fixed point with a {@link #LLR_OUTPUT} word, ziggurat noise, and chunks of {@link #BLOCK} symbols; the
     * worker simulates its last grid point, this scenario's Es/N0. Each worker has its own demappers and scratch.
     */
    Simulation.Worker chainWorker() {
        String spec = String.format(Locale.ROOT, "{\"constellation\": \"qam%d\","
                + " \"mapper\": {\"format\": \"%s\"},"
                + " \"demapper\": {\"input\": {\"format\": \"%s\", \"rounding\": \"half-even\","
                + " \"overflow\": \"saturate\"}, \"algorithm\": \"max-log-per-axis\","
                + " \"reference\": \"max-log-per-axis\", \"llr\": {\"format\": \"%s\"}},"
                + " \"noise\": {\"es-n0-db\": [%s, %s], \"seed\": %d, \"gaussian\": \"ziggurat\"},"
                + " \"simulation\": {\"chunk-symbols\": %d}}",
                constellation.size(), INPUT.format(), INPUT.format(), LLR_OUTPUT, esN0Db - 3, esN0Db, SEED, BLOCK);
        LossSpec loss = LossSpecReader.parse(spec, "chain benchmark " + name);
        return Simulation.worker(loss, loss.base(), loss.ebN0Db().size() - 1);
    }
}
