package dev.fixmod.verify.vectors;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.demap.FixedAxisSlicer;
import dev.fixmod.demap.FixedSectorSlicer;
import dev.fixmod.demap.FixedSlicer;
import dev.fixmod.demap.FixedSoftDemapper;
import dev.fixmod.demap.LlrOptions;
import dev.fixmod.demap.LlrScaling;
import dev.fixmod.demap.SoftDemapper;
import dev.fixmod.demap.Slicers;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.map.ConstellationRom;
import dev.fixmod.map.FixedMapper;
import dev.fixmod.map.FloatMapper;
import java.util.Optional;

/**
 * The {@link Datapath} built from the kernel: {@link FixedMapper} over the mapper ROM, the demapper input
 * {@link Quantizer}, the {@link FixedSlicer} on a reference ROM of the constellation quantized onto the input grid
 * (with the demapper's constant rounding), the {@link FixedSoftDemapper} with K set by each level's N0, and the float
 * {@link SoftDemapper} as reference. Kernel objects with scratch state are held one per thread.
 */
final class KernelDatapath implements Datapath {
    private final Constellation constellation;
    private final ConstellationRom rom;
    private final FixedMapper mapper;
    private final FloatMapper symbols;
    private final Quantizer input;
    private final ConstellationRom reference;
    private final FixedSlicer slicer;
    private final LlrOptions[] options;
    private final ThreadLocal<FixedSoftDemapper[]> fixed;
    private final ThreadLocal<SoftDemapper[]> floats;
    private final double[] unitsPerNat;
    private final long[] thresholdsI;
    private final long[] thresholdsQ;
    private final long[][] sectorLines;
    private final QFormat sectorLineFormat;
    private final QFormat scaleFormat;
    private final long llrLow;
    private final long llrHigh;

    private KernelDatapath(VectorSpec spec) {
        this.constellation = ConstellationResolver.resolve(spec.constellation());
        this.rom = ConstellationRom.of(constellation, spec.mapper());
        this.mapper = new FixedMapper(rom);
        this.symbols = new FloatMapper(constellation);
        this.input = spec.demapper().input();
        this.reference = spec.demapper().reference(constellation);
        this.slicer = Slicers.fixedFor(reference);
        int k = constellation.bitsPerSymbol();
        int levels = spec.noise().levelsDb().size();
        // Slot 0 is the design level (vectors without noise), slot l + 1 is noise level l.
        options = new LlrOptions[levels + 1];
        options[0] = LlrOptions.fromEsN0Db(constellation, spec.demapper().designEsN0Db(),
                spec.demapper().llrSign(), false);
        for (int l = 0; l < levels; l++) {
            options[l + 1] = LlrOptions.fromEsN0Db(constellation, spec.noise().esN0Db(l, k),
                    spec.demapper().llrSign(), false);
        }
        fixed = ThreadLocal.withInitial(() -> {
            FixedSoftDemapper[] d = new FixedSoftDemapper[options.length];
            for (int s = 0; s < d.length; s++) {
                d[s] = FixedSoftDemapper.create(spec.demapper().algorithm(), reference, options[s],
                        spec.demapper().fixedSpec());
            }
            return d;
        });
        floats = ThreadLocal.withInitial(() -> {
            SoftDemapper[] d = new SoftDemapper[options.length];
            for (int s = 0; s < d.length; s++) {
                d[s] = SoftDemapper.create(spec.demapper().reference(), constellation, options[s]);
            }
            return d;
        });
        unitsPerNat = new double[options.length];
        FixedSoftDemapper[] probe = fixed.get();
        for (int s = 0; s < options.length; s++) {
            unitsPerNat[s] = spec.demapper().scaling() == LlrScaling.NOISE_SCALED ? 1.0
                    : 1.0 / probe[s].idealScaleConstant();
        }
        scaleFormat = spec.demapper().scaling() == LlrScaling.NOISE_SCALED
                ? spec.demapper().fixedSpec().scaleConstant() : null;
        if (slicer instanceof FixedAxisSlicer axis) {
            thresholdsI = widen(axis.iThresholds());
            thresholdsQ = widen(axis.qThresholds());
        } else {
            thresholdsI = new long[0];
            thresholdsQ = new long[0];
        }
        if (slicer instanceof FixedSectorSlicer sector) {
            sectorLines = new long[sector.lineCount()][];
            for (int j = 0; j < sectorLines.length; j++) {
                sectorLines[j] = sector.orientedLineCodes(j);
            }
            sectorLineFormat = sector.coefficients().format();
        } else {
            sectorLines = new long[0][];
            sectorLineFormat = null;
        }
        Quantizer out = spec.demapper().llr();
        llrHigh = out.format().maxCode();
        llrLow = out.overflow() == Overflow.SYMMETRIC_SATURATE ? -out.format().maxCode() : out.format().minCode();
    }

    static KernelDatapath of(VectorSpec spec) {
        return new KernelDatapath(spec);
    }

    private static long[] widen(int[] v) {
        long[] out = new long[v.length];
        for (int n = 0; n < v.length; n++) {
            out[n] = v[n];
        }
        return out;
    }

    /** The mapper ROM's overflow events at construction (points that did not fit the mapper format). */
    long romOverflows() {
        return rom.overflowCount();
    }

    @Override
    public int bitsPerSymbol() {
        return constellation.bitsPerSymbol();
    }

    @Override
    public long romI(int label) {
        return rom.iCode(label);
    }

    @Override
    public long romQ(int label) {
        return rom.qCode(label);
    }

    @Override
    public void map(int[] labels, int count, long firstSymbol, long[] i, long[] q) {
        int[] oi = new int[count];
        int[] oq = new int[count];
        mapper.mapLabels(labels, 0, count, firstSymbol, oi, oq, 0);
        for (int n = 0; n < count; n++) {
            i[n] = oi[n];
            q[n] = oq[n];
        }
    }

    @Override
    public double symbolI(int label) {
        return constellation.re(label);
    }

    @Override
    public double symbolQ(int label) {
        return constellation.im(label);
    }

    @Override
    public boolean turnsOddSymbols() {
        return constellation.alternatesQuarterTurn();
    }

    @Override
    public void symbols(int[] labels, int count, long firstSymbol, double[] i, double[] q) {
        symbols.mapLabels(labels, 0, count, firstSymbol, i, q, 0);
    }

    @Override
    public double averageEnergy() {
        return constellation.averageEnergy();
    }

    @Override
    public long quantizeInput(double x, OverflowCounter counter) {
        return input.quantize(x, counter);
    }

    @Override
    public long[] referenceI() {
        return widen(reference.iCodes());
    }

    @Override
    public long[] referenceQ() {
        return widen(reference.qCodes());
    }

    @Override
    public long[] referenceI(boolean odd) {
        long[] codes = new long[reference.size()];
        for (int label = 0; label < codes.length; label++) {
            codes[label] = odd ? reference.oddICode(label) : reference.iCode(label);
        }
        return codes;
    }

    @Override
    public long[] referenceQ(boolean odd) {
        long[] codes = new long[reference.size()];
        for (int label = 0; label < codes.length; label++) {
            codes[label] = odd ? reference.oddQCode(label) : reference.qCode(label);
        }
        return codes;
    }

    @Override
    public void slice(long[] i, long[] q, int count, long firstSymbol, int[] labels) {
        slicer.sliceLabels(narrow(i, count), narrow(q, count), 0, count, firstSymbol, labels, 0);
    }

    @Override
    public boolean onBoundary(long i, long q, long symbolIndex) {
        return slicer.onBoundary(Math.toIntExact(i), Math.toIntExact(q), symbolIndex);
    }

    @Override
    public long llr(long[] i, long[] q, int count, long firstSymbol, int level, long[] llr) {
        FixedSoftDemapper d = fixed.get()[level + 1];
        int k = bitsPerSymbol();
        int[] ii = narrow(i, count);
        int[] qq = narrow(q, count);
        int[] out = new int[count * k];
        long before = events(d);
        d.llr(ii, qq, 0, count, firstSymbol, out, 0);
        for (int n = 0; n < count * k; n++) {
            llr[n] = out[n];
        }
        return events(d) - before;
    }

    /** Codes of a format of at most 32 bits, as the kernel's int batch methods take them. */
    private static int[] narrow(long[] v, int count) {
        int[] out = new int[count];
        for (int n = 0; n < count; n++) {
            out[n] = Math.toIntExact(v[n]);
        }
        return out;
    }

    private static long events(FixedSoftDemapper d) {
        long sum = 0;
        for (OverflowCounter c : d.counters()) {
            sum += c.events();
        }
        return sum;
    }

    @Override
    public void referenceLlr(double[] i, double[] q, int count, long firstSymbol, int level, double[] llr) {
        floats.get()[level + 1].llr(i, q, 0, count, firstSymbol, llr, 0);
        double units = unitsPerNat[level + 1];
        if (units != 1.0) {
            int k = bitsPerSymbol();
            for (int n = 0; n < count * k; n++) {
                llr[n] *= units;
            }
        }
    }

    @Override
    public long[] thresholdsI() {
        return thresholdsI.clone();
    }

    @Override
    public long[] thresholdsQ() {
        return thresholdsQ.clone();
    }

    @Override
    public long[][] sectorLines() {
        long[][] copy = new long[sectorLines.length][];
        for (int j = 0; j < copy.length; j++) {
            copy[j] = sectorLines[j].clone();
        }
        return copy;
    }

    @Override
    public long[] scaleCodes() {
        if (scaleFormat == null) {
            return new long[0];
        }
        FixedSoftDemapper[] d = fixed.get();
        long[] codes = new long[d.length];
        for (int s = 0; s < d.length; s++) {
            codes[s] = d[s].scaleConstantCode();
        }
        return codes;
    }

    @Override
    public Optional<QFormat> scaleFormat() {
        return Optional.ofNullable(scaleFormat);
    }

    @Override
    public Optional<QFormat> sectorLineFormat() {
        return Optional.ofNullable(sectorLineFormat);
    }

    @Override
    public long llrLow() {
        return llrLow;
    }

    @Override
    public long llrHigh() {
        return llrHigh;
    }
}
