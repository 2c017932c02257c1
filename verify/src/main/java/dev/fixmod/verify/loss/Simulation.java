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
        Point point = new Point(spec, d, snr);
        LossSpec.Simulation rule = spec.simulation();
        int k = d.constellation().bitsPerSymbol();
        long chunkBits = (long) rule.chunkSymbols() * k;
        long maxChunks = (rule.maxBits() + chunkBits - 1) / chunkBits;
        Accumulator total = new Accumulator(point);
        // One worker per chunk in flight, each with its own demappers and scratch; a worker is reused only after
        // its chunk was merged, since the whole batch is merged before the next one is submitted.
        Worker[] workers = new Worker[(int) Math.min(parallel, maxChunks)];
        long next = 0;
        boolean stop = false;
        while (!stop) {
            List<Future<Worker>> batch = new ArrayList<>();
            for (int i = 0; i < workers.length && next < maxChunks; i++, next++) {
                if (workers[i] == null) {
                    workers[i] = new Worker(point);
                }
                Worker w = workers[i];
                long chunk = next;
                batch.add(pool.submit(() -> {
                    w.run(chunk);
                    return w;
                }));
            }
            for (Future<Worker> f : batch) {
                if (stop) {
                    f.cancel(false);
                    continue;
                }
                total.merge(get(f).chunk);
                long bits = total.symbols * k;
                stop = bits >= rule.maxBits() || (bits >= rule.minBits()
                        && total.floatBitErrors >= rule.targetErrors() && total.fixedBitErrors >= rule.targetErrors());
            }
            stop |= next >= maxChunks;
        }
        return total.result(designIndex, snr);
    }

    /**
     * A worker for the chunks of design {@code d} at grid point {@code snr} of {@code spec}: what {@link #run} uses
     * for every chunk, for callers that run chunks themselves (the benchmarks).
     */
    public static Worker worker(LossSpec spec, Design d, int snr) {
        return new Worker(new Point(spec, d, snr));
    }

    private static <T> T get(Future<T> f) {
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

    /** Everything the chunks of one point share; immutable, read by every worker. */
    private static final class Point {
        final LossSpec spec;
        final Design design;
        final ConstellationRom rx;
        final FixedLlrSpec llrSpec;
        final double n0;
        final int snr;
        final boolean flat;
        final boolean turns;
        final QFormat outFormat;
        /** The transmit ROM's points by label, in real units; π/2-BPSK's odd symbols use the turned ones. */
        final double[] txRe;
        final double[] txIm;
        final double[] oddTxRe;
        final double[] oddTxIm;

        Point(LossSpec spec, Design design, int snr) {
            this.spec = spec;
            this.design = design;
            this.snr = snr;
            Constellation c = design.constellation();
            double[] grid = spec.ebN0Db().stream().mapToDouble(Double::doubleValue).toArray();
            this.n0 = n0(c, grid[snr], spec.codeRate());
            ConstellationRom tx = design.transmitRom();
            this.rx = design.receiveRom();
            this.llrSpec = design.llrSpec(rx, n0(c, grid[grid.length - 1], spec.codeRate()));
            boolean f = true;
            for (int label = 0; label < c.size(); label++) {
                f &= c.im(label) == 0.0;
            }
            this.turns = c.alternatesQuarterTurn();
            // π/2-BPSK's odd symbols leave the I axis even when the even ones lie on it.
            this.flat = f && !turns;
            this.outFormat = llrSpec.output().format();
            QFormat txf = tx.format();
            this.txRe = new double[c.size()];
            this.txIm = new double[c.size()];
            this.oddTxRe = new double[c.size()];
            this.oddTxIm = new double[c.size()];
            for (int label = 0; label < c.size(); label++) {
                txRe[label] = txf.toDouble(tx.iCode(label));
                txIm[label] = txf.toDouble(tx.qCode(label));
                oddTxRe[label] = txf.toDouble(tx.oddICode(label));
                oddTxIm[label] = txf.toDouble(tx.oddQCode(label));
            }
        }
    }

    /**
     * Runs chunks of one point: chunk c holds symbols c·chunkSymbols … (c+1)·chunkSymbols − 1 (see the class
     * comment). Holds its own demappers and scratch, built once, so a chunk allocates nothing; not thread-safe (one
     * worker per thread). The counts of the last chunk run are read from the accessors.
     */
    public static final class Worker {
        private final Point point;
        private final Constellation c;
        private final int n;
        private final int k;
        private final int mask;
        private final StreamKey labelKey;
        private final StreamKey noiseKey;
        private final Awgn awgn;
        private final SoftDemapper reference;
        private final FixedSoftDemapper datapath;
        /** The datapath's stage counters, read after each chunk. */
        private final List<OverflowCounter> counters;
        private final Quantizer input;
        private final double gain;
        private final OverflowCounter clips = new OverflowCounter("input");
        private final int[] words;
        private final double[] ni;
        private final double[] nq;
        private final byte[] bits;
        private final double[] re;
        private final double[] im;
        private final int[] ci;
        private final int[] cq;
        private final double[] llrF;
        private final int[] llrC;
        private final Accumulator chunk;

        private Worker(Point point) {
            this.point = point;
            Design d = point.design;
            this.c = d.constellation();
            this.n = point.spec.simulation().chunkSymbols();
            this.k = c.bitsPerSymbol();
            this.mask = c.size() - 1;
            long seed = point.spec.seed();
            this.labelKey = StreamKey.of(seed, 2L * point.snr + 1);
            this.noiseKey = StreamKey.of(seed, 2L * point.snr);
            this.awgn = new Awgn(point.n0, Gaussian.fromName(point.spec.gaussian()));
            this.reference = d.floatDemapper(point.n0);
            this.datapath = d.fixedDemapper(point.rx, point.llrSpec, point.n0);
            this.counters = datapath.counters();
            this.input = d.inputQuantizer();
            this.gain = d.gain();
            this.words = new int[n];
            this.ni = new double[n];
            this.nq = new double[n];
            this.bits = new byte[n * k];
            this.re = new double[n];
            this.im = new double[n];
            this.ci = new int[n];
            this.cq = new int[n];
            this.llrF = new double[n * k];
            this.llrC = new int[n * k];
            this.chunk = new Accumulator(point);
        }

        /** Runs chunk {@code index}, replacing the counts of the previous one. */
        public void run(long index) {
            long first = index * n;
            Philox4x32.fillWords(words, 0, n, labelKey, first);
            awgn.fill(ni, 0, nq, 0, n, noiseKey, first);
            boolean flat = point.flat;
            boolean turns = point.turns;
            double[] txRe = point.txRe;
            double[] txIm = point.txIm;
            double[] oddTxRe = point.oddTxRe;
            double[] oddTxIm = point.oddTxIm;
            // code · 2^−n as a product: exact (|code| < 2^31, n ≤ 64), the same double as QFormat.toDouble.
            double lsb = input.format().lsb();
            clips.reset();
            double error = 0;
            for (int s = 0; s < n; s++) {
                int label = words[s] & mask;
                for (int b = 0; b < k; b++) {
                    bits[s * k + b] = (byte) ((label >>> (k - 1 - b)) & 1);
                }
                boolean odd = turns && ((first + s) & 1) != 0;
                re[s] = (odd ? -c.im(label) + 0.0 : c.re(label)) + ni[s];
                im[s] = (odd ? c.re(label) : c.im(label)) + nq[s];
                double xi = gain * ((odd ? oddTxRe[label] : txRe[label]) + ni[s]);
                ci[s] = (int) input.quantize(xi, clips);
                double ei = ci[s] * lsb - xi;
                error += ei * ei;
                if (!flat) {
                    double xq = gain * ((odd ? oddTxIm[label] : txIm[label]) + nq[s]);
                    cq[s] = (int) input.quantize(xq, clips);
                    double eq = cq[s] * lsb - xq;
                    error += eq * eq;
                }
            }
            reference.llr(re, flat ? null : im, 0, n, first, llrF, 0);
            datapath.resetCounters();
            datapath.llr(ci, flat ? null : cq, 0, n, first, llrC, 0);

            Accumulator a = chunk;
            a.reset();
            a.symbols = n;
            long floatBitErrors = 0;
            long fixedBitErrors = 0;
            long floatSymbolErrors = 0;
            long fixedSymbolErrors = 0;
            for (int s = 0; s < n; s++) {
                // Counted without branches: an error is as unpredictable as the noise.
                int floatWrong = 0;
                int fixedWrong = 0;
                for (int b = 0; b < k; b++) {
                    int i = s * k + b;
                    int bit = bits[i];
                    floatWrong += (llrF[i] < 0 ? 1 : 0) ^ bit;
                    fixedWrong += (llrC[i] >>> 31) ^ bit;
                }
                floatBitErrors += floatWrong;
                fixedBitErrors += fixedWrong;
                floatSymbolErrors += (-floatWrong) >>> 31;
                fixedSymbolErrors += (-fixedWrong) >>> 31;
            }
            a.floatBitErrors = floatBitErrors;
            a.fixedBitErrors = fixedBitErrors;
            a.floatSymbolErrors = floatSymbolErrors;
            a.fixedSymbolErrors = fixedSymbolErrors;
            a.gmi.add(llrF, 0, bits, 0, n * k);
            a.histogram.add(llrC, 0, bits, 0, n * k);
            a.inputErrorEnergy = error;
            a.inputSamples = flat ? n : 2L * n;
            a.inputClips = clips.events();
            a.metricEvents = counters.get(0).events();
            a.scaleEvents = counters.get(1).events();
            a.outputEvents = counters.get(2).events();
        }

        /** The symbols of the last chunk. */
        public long symbols() {
            return chunk.symbols;
        }

        /** The bit errors of the float reference in the last chunk. */
        public long floatBitErrors() {
            return chunk.floatBitErrors;
        }

        /** The bit errors of the fixed datapath in the last chunk. */
        public long fixedBitErrors() {
            return chunk.fixedBitErrors;
        }

        /**
         * The last chunk as a point result ({@code design} and {@code snr} are labels only); allocates: not for
         * inner loops.
         */
        public PointResult result(int design, int snr) {
            return chunk.result(design, snr);
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

        /** Back to no samples, as built. */
        void reset() {
            symbols = 0;
            floatBitErrors = 0;
            floatSymbolErrors = 0;
            fixedBitErrors = 0;
            fixedSymbolErrors = 0;
            gmi.reset();
            histogram.reset();
            inputErrorEnergy = 0;
            inputSamples = 0;
            inputClips = 0;
            metricEvents = 0;
            scaleEvents = 0;
            outputEvents = 0;
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
