package dev.fixmod.verify.loss;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.demap.FixedLlrSpec;
import dev.fixmod.demap.FixedSoftDemapper;
import dev.fixmod.demap.SoftDemapper;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.map.ConstellationRom;
import dev.fixmod.verify.noise.Awgn;
import dev.fixmod.verify.noise.Gaussian;
import dev.fixmod.verify.noise.Philox4x32;
import dev.fixmod.verify.noise.StreamKey;
import dev.fixmod.verify.theory.GmiEstimator;
import dev.fixmod.verify.theory.LlrHistogram;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Future;

/**
 * The Monte Carlo engine: map → AWGN → demap, with the float reference and the fixed-point model on the same bits and
 * the same noise (common random numbers, so their difference has a low variance).
 *
 * <p>Chunk c of a point holds symbols c·chunkSymbols … (c+1)·chunkSymbols − 1. Its labels are the low k bits of the
 * Philox words of those indices under key (seed, 2·snr + 1), its noise the complex samples of those indices under
 * key (seed, 2·snr): every chunk is computed independently, and every design sees the same channel at the same
 * Eb/N0. Chunks run on a thread pool; their results are reduced in chunk order, and the stopping rule is evaluated
 * after each chunk in that order, so the result is the same for any number of threads.
 *
 * <p>The fixed path transmits the mapper ROM's points, multiplies by the design's gain, quantizes with the input
 * stage (its overflow events are the input clips) and runs the fixed datapath. Hard decisions are the LLR signs; a
 * zero LLR decides 0 (the sign convention's side for "0"), in float and fixed alike. A symbol is in error when any of
 * its bits is.
 *
 * <p>Symbol s of chunk c has stream index c·chunkSymbols + s: π/2-BPSK sends the odd ones turned by +90° (the float
 * points and the transmit ROM's odd codes) and both demappers are told each symbol's index.
 */
public final class Simulation {

    private final LossSpec spec;
    private final ExecutorService pool;
    private final int parallel;

    /**
     * @param pool     runs the chunks
     * @param parallel how many chunks are in flight at once (usually the pool's thread count); does not change results
     */
    public Simulation(LossSpec spec, ExecutorService pool, int parallel) {
        this.spec = spec;
        this.pool = pool;
        this.parallel = Math.max(1, parallel);
    }

    /** The complex noise power for {@code ebN0Db} (E_s from the constellation, E_s/N0 = E_b/N0 + 10·log10(k·r)). */
    public static double n0(Constellation c, double ebN0Db, double codeRate) {
        double esN0Db = ebN0Db + 10 * StrictMath.log10(c.bitsPerSymbol() * codeRate);
        return c.averageEnergy() / StrictMath.pow(10.0, esN0Db / 10.0);
    }

    /** Simulates design {@code d} (index {@code designIndex} of the run) at grid point {@code snr}. */
    public PointResult run(Design d, int designIndex, int snr) {
        Constellation c = d.constellation();
        double[] grid = spec.ebN0Db().stream().mapToDouble(Double::doubleValue).toArray();
        double n0 = n0(c, grid[snr], spec.codeRate());
        ConstellationRom tx = d.transmitRom();
        ConstellationRom rx = d.receiveRom();
        FixedLlrSpec llrSpec = d.llrSpec(rx, n0(c, grid[grid.length - 1], spec.codeRate()));
        Point point = new Point(d, tx, rx, llrSpec, n0, snr);
        LossSpec.Simulation rule = spec.simulation();
        int k = c.bitsPerSymbol();
        long chunkBits = (long) rule.chunkSymbols() * k;
        long maxChunks = (rule.maxBits() + chunkBits - 1) / chunkBits;
        Accumulator total = new Accumulator(point);
        long next = 0;
        boolean stop = false;
        while (!stop) {
            List<Future<Accumulator>> batch = new ArrayList<>();
            for (int i = 0; i < parallel && next < maxChunks; i++, next++) {
                long chunk = next;
                batch.add(pool.submit(() -> point.chunk(chunk)));
            }
            for (Future<Accumulator> f : batch) {
                if (stop) {
                    f.cancel(false);
                    continue;
                }
                total.merge(get(f));
                long bits = total.symbols * k;
                stop = bits >= rule.maxBits() || (bits >= rule.minBits()
                        && total.floatBitErrors >= rule.targetErrors() && total.fixedBitErrors >= rule.targetErrors());
            }
            stop |= next >= maxChunks;
        }
        return total.result(designIndex, snr);
    }

    private static Accumulator get(Future<Accumulator> f) {
        try {
            return f.get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("simulation interrupted", e);
        } catch (ExecutionException e) {
            if (e.getCause() instanceof RuntimeException r) {
                throw r;
            }
            throw new IllegalStateException(e.getCause());
        }
    }

    /** Everything a chunk needs; immutable, shared by the workers (each chunk builds its own demappers and noise). */
    private final class Point {
        final Design design;
        final ConstellationRom tx;
        final ConstellationRom rx;
        final FixedLlrSpec llrSpec;
        final double n0;
        final int snr;
        final boolean flat;
        final boolean turns;
        final QFormat outFormat;

        Point(Design design, ConstellationRom tx, ConstellationRom rx, FixedLlrSpec llrSpec, double n0, int snr) {
            this.design = design;
            this.tx = tx;
            this.rx = rx;
            this.llrSpec = llrSpec;
            this.n0 = n0;
            this.snr = snr;
            Constellation c = design.constellation();
            boolean f = true;
            for (int label = 0; label < c.size(); label++) {
                f &= c.im(label) == 0.0;
            }
            this.turns = c.alternatesQuarterTurn();
            // π/2-BPSK's odd symbols leave the I axis even when the even ones lie on it.
            this.flat = f && !turns;
            this.outFormat = llrSpec.output().format();
        }

        Accumulator chunk(long index) {
            Constellation c = design.constellation();
            int n = spec.simulation().chunkSymbols();
            int k = c.bitsPerSymbol();
            int mask = c.size() - 1;
            long first = index * n;
            int[] words = new int[n];
            Philox4x32.fillWords(words, 0, n, StreamKey.of(spec.seed(), 2L * snr + 1), first);
            double[] ni = new double[n];
            double[] nq = new double[n];
            new Awgn(n0, Gaussian.fromName(spec.gaussian())).fill(ni, 0, nq, 0, n, StreamKey.of(spec.seed(), 2L * snr),
                    first);
            byte[] bits = new byte[n * k];
            double[] re = new double[n];
            double[] im = new double[n];
            int[] ci = new int[n];
            int[] cq = new int[n];
            double gain = design.gain();
            Quantizer input = design.inputQuantizer();
            QFormat in = input.format();
            QFormat txf = tx.format();
            OverflowCounter clips = new OverflowCounter("input");
            double error = 0;
            for (int s = 0; s < n; s++) {
                int label = words[s] & mask;
                for (int b = 0; b < k; b++) {
                    bits[s * k + b] = (byte) ((label >>> (k - 1 - b)) & 1);
                }
                boolean odd = turns && ((first + s) & 1) != 0;
                re[s] = (odd ? -c.im(label) + 0.0 : c.re(label)) + ni[s];
                im[s] = (odd ? c.re(label) : c.im(label)) + nq[s];
                double xi = gain * (txf.toDouble(odd ? tx.oddICode(label) : tx.iCode(label)) + ni[s]);
                ci[s] = (int) input.quantize(xi, clips);
                double ei = in.toDouble(ci[s]) - xi;
                error += ei * ei;
                if (!flat) {
                    double xq = gain * (txf.toDouble(odd ? tx.oddQCode(label) : tx.qCode(label)) + nq[s]);
                    cq[s] = (int) input.quantize(xq, clips);
                    double eq = in.toDouble(cq[s]) - xq;
                    error += eq * eq;
                }
            }
            double[] llrF = new double[n * k];
            int[] llrC = new int[n * k];
            SoftDemapper reference = design.floatDemapper(n0);
            reference.llr(re, flat ? null : im, 0, n, first, llrF, 0);
            FixedSoftDemapper datapath = design.fixedDemapper(rx, llrSpec, n0);
            datapath.llr(ci, flat ? null : cq, 0, n, first, llrC, 0);

            Accumulator a = new Accumulator(this);
            a.symbols = n;
            for (int s = 0; s < n; s++) {
                boolean floatWrong = false;
                boolean fixedWrong = false;
                for (int b = 0; b < k; b++) {
                    int i = s * k + b;
                    int bit = bits[i];
                    if ((llrF[i] < 0 ? 1 : 0) != bit) {
                        a.floatBitErrors++;
                        floatWrong = true;
                    }
                    if ((llrC[i] < 0 ? 1 : 0) != bit) {
                        a.fixedBitErrors++;
                        fixedWrong = true;
                    }
                }
                a.floatSymbolErrors += floatWrong ? 1 : 0;
                a.fixedSymbolErrors += fixedWrong ? 1 : 0;
            }
            a.gmi.add(llrF, 0, bits, 0, n * k);
            a.histogram.add(llrC, 0, bits, 0, n * k);
            a.inputErrorEnergy = error;
            a.inputSamples = flat ? n : 2L * n;
            a.inputClips = clips.events();
            List<OverflowCounter> counters = datapath.counters();
            a.metricEvents = counters.get(0).events();
            a.scaleEvents = counters.get(1).events();
            a.outputEvents = counters.get(2).events();
            return a;
        }
    }

    /** Sums of chunks, merged in chunk order. */
    private static final class Accumulator {
        final Point point;
        long symbols;
        long floatBitErrors;
        long floatSymbolErrors;
        long fixedBitErrors;
        long fixedSymbolErrors;
        final GmiEstimator gmi;
        final LlrHistogram histogram;
        double inputErrorEnergy;
        long inputSamples;
        long inputClips;
        long metricEvents;
        long scaleEvents;
        long outputEvents;

        Accumulator(Point point) {
            this.point = point;
            int k = point.design.constellation().bitsPerSymbol();
            this.gmi = new GmiEstimator(k);
            this.histogram = new LlrHistogram(k, (int) point.outFormat.minCode(), (int) point.outFormat.maxCode());
        }

        void merge(Accumulator o) {
            symbols += o.symbols;
            floatBitErrors += o.floatBitErrors;
            floatSymbolErrors += o.floatSymbolErrors;
            fixedBitErrors += o.fixedBitErrors;
            fixedSymbolErrors += o.fixedSymbolErrors;
            gmi.merge(o.gmi);
            histogram.merge(o.histogram);
            inputErrorEnergy += o.inputErrorEnergy;
            inputSamples += o.inputSamples;
            inputClips += o.inputClips;
            metricEvents += o.metricEvents;
            scaleEvents += o.scaleEvents;
            outputEvents += o.outputEvents;
        }

        PointResult result(int design, int snr) {
            int k = point.design.constellation().bitsPerSymbol();
            int min = (int) point.outFormat.minCode();
            int max = (int) point.outFormat.maxCode();
            int width = max - min + 1;
            long[] counts = new long[k * 2 * width];
            for (int j = 0; j < k; j++) {
                for (int b = 0; b < 2; b++) {
                    for (int code = min; code <= max; code++) {
                        counts[(j * 2 + b) * width + code - min] = histogram.count(j, b, code);
                    }
                }
            }
            return new PointResult(design, snr, symbols, k, floatBitErrors, floatSymbolErrors, fixedBitErrors,
                    fixedSymbolErrors, gmi.gmi(), min, max, counts, inputErrorEnergy, inputSamples, inputClips,
                    metricEvents, scaleEvents, outputEvents);
        }
    }
}
