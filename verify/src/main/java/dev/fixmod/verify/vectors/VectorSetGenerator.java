package dev.fixmod.verify.vectors;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.fixmod.demap.LlrSign;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.verify.cli.Version;
import dev.fixmod.verify.noise.Awgn;
import dev.fixmod.verify.noise.Gaussian;
import dev.fixmod.verify.noise.NoiseSpec;
import dev.fixmod.verify.noise.StreamKey;
import java.io.IOException;
import dev.fixmod.verify.formats.OutputSet;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFileAttributeView;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.NoSuchElementException;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.function.LongConsumer;
import java.util.function.Supplier;

/**
 * Generates a vector set from a specification, streamed in chunks of {@value #CHUNK} vectors so memory stays bounded
 * whatever the count. Chunks may be computed on several threads; they are written in index order and every random
 * value is keyed by (seed, stream, index), so the files do not depend on the thread count.
 *
 * <p>Vector order. Mapper group: the {@code count} data symbols cut from the bit source, then (group
 * {@code labels}) every label once. Demapper group: for each noise level the same {@code count} data symbols through
 * the channel (without noise levels, one block without noise), then every label without noise, then the constructed
 * corner inputs (thresholds, ties, extremes, zero, LLR limit probes).
 *
 * <p>Stream index (the parity that turns π/2-BPSK's odd symbols): in the mapper group the vector's index; in the
 * demapper group data symbol j of every level has index j, as in the mapper group, and the label sweep and the corner
 * inputs have their index in the group. For π/2-BPSK the corner inputs are built for both parities and each is listed
 * twice, on consecutive rows of either parity ({@link CornerCases}).
 */
public final class VectorSetGenerator {

    /** Vectors per chunk: large enough to amortize the per-chunk work, small enough to keep memory flat. */
    static final int CHUNK = 4096;

    /** How a run is carried out; none of these options changes the files. */
    public record Options(int threads, LongConsumer progress) {
        public Options {
            if (threads < 1 || threads > 256) {
                throw new IllegalArgumentException("threads must be 1..256, got " + threads);
            }
            progress = progress == null ? n -> { } : progress;
        }

        public static Options single() {
            return new Options(1, null);
        }
    }

    private final VectorSpec spec;
    private final Path specDir;
    private final KernelDatapath datapath;
    private final CornerCases.Result corners;
    private final int k;
    private final int m;
    private final double[] n0ByLevel;

    /** The name of the copy of a user bit file inside a set; the manifest's specification points at it. */
    public static final String BIT_FILE_COPY = "source-bits.txt";

    private VectorSetGenerator(VectorSpec spec, Path specDir) {
        this.spec = spec;
        this.specDir = specDir;
        if (spec.bits().source().equals("file")) {
            LabelStream.readBitFile(specDir.resolve(spec.bits().file()), spec.bits().file());
        }
        this.datapath = KernelDatapath.of(spec);
        this.k = datapath.bitsPerSymbol();
        this.m = datapath.size();
        long cornerStart = Math.max(1, spec.noise().levelsDb().size()) * spec.count()
                + (spec.includes(CornerGroup.LABELS) ? m : 0);
        this.corners = CornerCases.build(datapath, spec.demapper().input().format(), spec.cornerCases(), cornerStart);
        int levels = spec.noise().levelsDb().size();
        n0ByLevel = new double[levels];
        double es = datapath.averageEnergy();
        for (int l = 0; l < levels; l++) {
            n0ByLevel[l] = es / StrictMath.pow(10.0, spec.noise().esN0Db(l, k) / 10.0);
        }
    }

    /** The generator of {@code spec}; {@code specDir} resolves a user bit file. */
    public static VectorSetGenerator of(VectorSpec spec, Path specDir) {
        return new VectorSetGenerator(spec, specDir);
    }

    /** Vectors in the mapper group. */
    public long mapperCount() {
        return spec.count() + (spec.includes(CornerGroup.LABELS) ? m : 0);
    }

    /** Vectors in the demapper group. */
    public long demapperCount() {
        return Math.max(1, n0ByLevel.length) * spec.count() + (spec.includes(CornerGroup.LABELS) ? m : 0)
                + corners.vectors().size();
    }

    /** Both groups' vectors: the progress total. */
    public long totalCount() {
        return mapperCount() + demapperCount();
    }

    /**
     * Writes every file of the set into {@code dir} (an existing, empty folder) and returns the manifest, which is
     * written there too.
     */
    public Manifest writeTo(Path target, boolean force, Options options) throws IOException {
        SetFolder.requireWritable(target, force);
        try (OutputSet set = OutputSet.create(target, force)) {
            Manifest manifest = writeInto(set, options);
            set.commit();
            // The work folder was private (rwx------); a finished set is an ordinary folder.
            if (Files.getFileStore(target).supportsFileAttributeView(PosixFileAttributeView.class)) {
                Files.setPosixFilePermissions(target, PosixFilePermissions.fromString("rwxr-xr-x"));
            }
            return manifest;
        }
    }

    /** Writes every file of the set into {@code set} (not committed) and returns the manifest, written there too. */
    Manifest writeInto(OutputSet set, Options options) throws IOException {
        SetFiles files = new SetFiles(spec, k, set, mapperCount(), demapperCount());
        ObjectNode bitFile = null;
        VectorSpec recorded = spec;
        if (spec.bits().source().equals("file")) {
            // The set carries its own copy of the bits, so the manifest alone regenerates it.
            Path source = specDir.resolve(spec.bits().file());
            byte[] bytes = Files.readAllBytes(source);
            try (OutputStream out = set.newFile(BIT_FILE_COPY)) {
                out.write(bytes);
            }
            long bits = LabelStream.readBitFile(source, spec.bits().file()).length;
            bitFile = SetFiles.entry(BIT_FILE_COPY, "bits-source", "text", bits, set.sha256(BIT_FILE_COPY), null);
            recorded = new VectorSpec(spec.name(), spec.constellation(), spec.mapper(), spec.demapper(),
                    new VectorSpec.BitSource("file", 0, 0, BIT_FILE_COPY), spec.noise(), spec.count(),
                    spec.cornerCases(), spec.formats());
        }
        ExecutorService pool = options.threads() > 1 ? Executors.newFixedThreadPool(options.threads(), r -> {
            Thread t = new Thread(r, "fixmod-vectors");
            t.setDaemon(true);
            return t;
        }) : null;
        long[] overflows = new long[3];
        try {
            long done = 0;
            for (Iterator<Supplier<Batch>> it : List.of(mapperTasks(), demapperTasks())) {
                ArrayDeque<Future<Batch>> window = new ArrayDeque<>();
                while (it.hasNext() || !window.isEmpty()) {
                    while (it.hasNext() && (pool == null ? window.isEmpty() : window.size() < 2 * options.threads())) {
                        Supplier<Batch> task = it.next();
                        window.add(pool == null ? java.util.concurrent.CompletableFuture.completedFuture(task.get())
                                : pool.submit(task::get));
                    }
                    Batch b = await(window.poll());
                    files.write(b);
                    overflows[1] += b.inputOverflows;
                    overflows[2] += b.llrOverflows;
                    done += b.size;
                    options.progress().accept(done);
                }
            }
        } finally {
            if (pool != null) {
                pool.shutdownNow();
            }
        }
        List<ObjectNode> entries = files.finish();
        RomExport.write(spec, datapath, set, entries);
        if (bitFile != null) {
            entries.add(bitFile);
        }
        Manifest manifest = Manifest.of(manifestJson(recorded, entries, overflows));
        try (OutputStream out = set.newFile(Manifest.FILE_NAME)) {
            out.write(manifest.text().getBytes(StandardCharsets.UTF_8));
        }
        return manifest;
    }

    private static Batch await(Future<Batch> f) throws IOException {
        try {
            return f.get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IOException("interrupted", e);
        } catch (ExecutionException e) {
            Throwable c = e.getCause();
            if (c instanceof RuntimeException r) {
                throw r;
            }
            throw new IOException(c);
        }
    }

    private ObjectNode manifestJson(VectorSpec recorded, List<ObjectNode> entries, long[] overflows) {
        ObjectNode root = JsonNodeFactory.instance.objectNode();
        root.put("schema", Manifest.SCHEMA);
        root.put("version", Manifest.VERSION);
        root.put("tool", "fixmod");
        root.put("tool-version", Version.TOOL_VERSION);
        root.put("name", spec.name());
        root.put("note", "Engineering model, not conformance certification; the governing standard's text decides.");
        ObjectNode sign = root.putObject("llr-sign");
        sign.put("name", spec.demapper().llrSign().tradeName());
        sign.put("meaning", spec.demapper().llrSign() == LlrSign.ZERO_POSITIVE
                ? "L(b) = ln P(b=0|y) - ln P(b=1|y): positive means 0 is more likely"
                : "L(b) = ln P(b=1|y) - ln P(b=0|y): positive means 1 is more likely");
        ObjectNode groups = root.putObject("groups");
        ObjectNode mg = groups.putObject("mapper");
        mg.put("count", mapperCount());
        mg.put("data", spec.count());
        mg.put("label-sweep", spec.includes(CornerGroup.LABELS) ? m : 0);
        ObjectNode dg = groups.putObject("demapper");
        dg.put("count", demapperCount());
        dg.put("data-per-level", spec.count());
        dg.put("levels", n0ByLevel.length);
        dg.put("label-sweep", spec.includes(CornerGroup.LABELS) ? m : 0);
        dg.put("corner-inputs", corners.vectors().size());
        ArrayNode unreached = dg.putArray("llr-limits-not-reached");
        corners.unreachedLimits().forEach(unreached::add);
        root.put("noise-algorithm", NoiseSpec.VERSION);
        ArrayNode levels = root.putArray("noise-levels");
        for (int l = 0; l < n0ByLevel.length; l++) {
            ObjectNode o = levels.addObject();
            o.put("level", l);
            o.put("es-n0-db", spec.noise().esN0Db(l, k));
            o.put("n0", n0ByLevel[l]);
            o.put("stream", l);
        }
        ObjectNode ov = root.putObject("overflow-events");
        ov.put("mapper-rom", datapath.romOverflows());
        ov.put("demapper-input", overflows[1]);
        ov.put("llr", overflows[2]);
        Manifest.putGlossary(root);
        root.set("spec", recorded.toCanonicalJson());
        ArrayNode files = root.putArray("files");
        entries.forEach(files::add);
        return root;
    }

    /** Mapper group tasks: labels are cut from the bit source here (sequentially), the ROM look-up in the task. */
    private Iterator<Supplier<Batch>> mapperTasks() {
        LabelStream labels = LabelStream.open(spec.bits(), specDir, k);
        long data = spec.count();
        long total = mapperCount();
        return chunks(total, (first, n) -> {
            Batch b = new Batch(true, n, k);
            b.first = first;
            b.size = n;
            int fromData = (int) Math.max(0, Math.min(n, data - first));
            labels.fill(b.label, 0, fromData);
            for (int j = fromData; j < n; j++) {
                b.label[j] = (int) (first + j - data);
                b.flags[j] = CornerFlag.LABEL_SWEEP.mask();
            }
            java.util.Arrays.fill(b.level, -1);
            return () -> {
                datapath.map(b.label, n, first, b.mapI, b.mapQ);
                return b;
            };
        });
    }

    /** Demapper group tasks: noisy data blocks, the noiseless label sweep, the corner inputs. */
    private Iterator<Supplier<Batch>> demapperTasks() {
        int blocks = Math.max(1, n0ByLevel.length);
        long data = spec.count();
        long sweepEnd = blocks * data + (spec.includes(CornerGroup.LABELS) ? m : 0);
        List<CornerCases.Vector> cv = corners.vectors();
        LabelStream[] stream = new LabelStream[1];
        int[] streamLevel = {-1};
        return chunks(demapperCount(), (first, n) -> {
            Batch b = new Batch(false, n, k);
            b.first = first;
            b.size = n;
            // A chunk never straddles a block boundary (see chunks()), so one case applies to all its vectors.
            if (first < blocks * data) {
                int lvl = (int) (first / data);
                if (streamLevel[0] != lvl) {
                    stream[0] = LabelStream.open(spec.bits(), specDir, k);
                    streamLevel[0] = lvl;
                }
                stream[0].fill(b.label, 0, n);
                int level = n0ByLevel.length == 0 ? -1 : lvl;
                java.util.Arrays.fill(b.level, 0, n, level);
                long indexInBlock = first - lvl * data;
                return () -> {
                    computeData(b, level, indexInBlock, indexInBlock);
                    return b;
                };
            }
            java.util.Arrays.fill(b.level, -1);
            if (first < sweepEnd) {
                for (int j = 0; j < n; j++) {
                    b.label[j] = (int) (first + j - blocks * data);
                    b.flags[j] = CornerFlag.LABEL_SWEEP.mask();
                }
                return () -> {
                    computeData(b, -1, 0, first);
                    return b;
                };
            }
            for (int j = 0; j < n; j++) {
                CornerCases.Vector v = cv.get((int) (first + j - sweepEnd));
                b.label[j] = -1;
                b.inI[j] = v.i();
                b.inQ[j] = v.q();
                b.flags[j] = v.flags();
            }
            return () -> {
                    computeCorner(b);
                    return b;
                };
        });
    }

    /** Splits {@code total} vectors into chunks that do not straddle the block boundaries of the demapper group. */
    private Iterator<Supplier<Batch>> chunks(long total, ChunkFactory factory) {
        int blocks = Math.max(1, n0ByLevel.length);
        long data = spec.count();
        List<Long> bounds = new ArrayList<>();
        for (int l = 1; l <= blocks; l++) {
            bounds.add(l * data);
        }
        bounds.add(blocks * data + (spec.includes(CornerGroup.LABELS) ? m : 0));
        bounds.add(data);
        bounds.add(data + (spec.includes(CornerGroup.LABELS) ? m : 0));
        return new Iterator<>() {
            long next = 0;

            @Override
            public boolean hasNext() {
                return next < total;
            }

            @Override
            public Supplier<Batch> next() {
                if (!hasNext()) {
                    throw new NoSuchElementException();
                }
                long end = Math.min(total, next + CHUNK);
                for (long bound : bounds) {
                    if (bound > next && bound < end) {
                        end = bound;
                    }
                }
                Supplier<Batch> s = factory.create(next, (int) (end - next));
                next = end;
                return s;
            }
        };
    }

    @FunctionalInterface
    private interface ChunkFactory {
        Supplier<Batch> create(long first, int n);
    }

    /** Channel, quantizer and demapper for mapped symbols; {@code symbol} is the stream index of the first. */
    private void computeData(Batch b, int level, long indexInBlock, long symbol) {
        int n = b.size;
        datapath.symbols(b.label, n, symbol, b.chanI, b.chanQ);
        if (level >= 0) {
            double[] ni = new double[n];
            double[] nq = new double[n];
            Awgn awgn = new Awgn(n0ByLevel[level], Gaussian.fromName(spec.noise().gaussian()));
            awgn.fill(ni, 0, nq, 0, n, StreamKey.of(spec.noise().seed(), level), indexInBlock);
            for (int j = 0; j < n; j++) {
                b.chanI[j] += ni[j];
                b.chanQ[j] += nq[j];
                b.flags[j] |= CornerFlag.NOISY.mask();
            }
        }
        OverflowCounter in = OverflowCounter.unnamed();
        for (int j = 0; j < n; j++) {
            b.inI[j] = datapath.quantizeInput(b.chanI[j], in);
            b.inQ[j] = datapath.quantizeInput(b.chanQ[j], in);
        }
        b.inputOverflows = in.events();
        demap(b, level, symbol);
    }

    private void computeCorner(Batch b) {
        QFormat f = spec.demapper().input().format();
        for (int j = 0; j < b.size; j++) {
            b.chanI[j] = f.toDouble(b.inI[j]);
            b.chanQ[j] = f.toDouble(b.inQ[j]);
        }
        demap(b, -1, b.first);
    }

    /** Hard decisions, fixed LLRs and the float reference (at the design N0 for vectors without noise). */
    private void demap(Batch b, int level, long symbol) {
        int n = b.size;
        datapath.slice(b.inI, b.inQ, n, symbol, b.hard);
        b.llrOverflows = datapath.llr(b.inI, b.inQ, n, symbol, level, b.llr);
        datapath.referenceLlr(b.chanI, b.chanQ, n, symbol, level, b.ref);
        long low = datapath.llrLow();
        long high = datapath.llrHigh();
        for (int j = 0; j < n; j++) {
            for (int bit = 0; bit < k; bit++) {
                long v = b.llr[j * k + bit];
                if (v == low) {
                    b.flags[j] |= CornerFlag.LLR_AT_MIN.mask();
                }
                if (v == high) {
                    b.flags[j] |= CornerFlag.LLR_AT_MAX.mask();
                }
            }
        }
    }

}
