package dev.fixmod.verify.loss;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Metrics;
import dev.fixmod.demap.FixedLlrSpec;
import dev.fixmod.demap.FixedSoftDemapper;
import dev.fixmod.demap.LlrOptions;
import dev.fixmod.demap.LlrSign;
import dev.fixmod.demap.SoftDemapper;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.map.ConstellationRom;
import dev.fixmod.verify.theory.ErrorRateInterval;
import dev.fixmod.verify.theory.GaussianTail;
import dev.fixmod.verify.theory.LlrHistogram;
import dev.fixmod.verify.theory.SnrAtTarget;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;

/**
 * The figures derived from a run's points: per design the BER, SER and GMI curves of float and fixed with 99%
 * Clopper–Pearson intervals, the implementation losses at the target BER and the target GMI, the saturation rates
 * per stage, the static figures of the ROMs and the input quantizer, the range analysis; per sweep the sizing
 * table. Pure function of the specification and the points.
 */
public final class LossAnalysis {
    public static final double CONFIDENCE = 0.99;

    /** Static figures of a table of points against the ideal constellation. */
    public record RomFigures(String format, double energy, double minDistanceSquared, double evmPercent,
                             double evmDb, double powerEfficiencyLossDb) {
    }

    /** The receive chain's range figures: what cannot overflow and what the chosen formats do. */
    public record Range(String metricFormat, String scaleConstantFormat, String scaleFormat, double maxLlrNats,
                        int llrIntegerBitsNoSaturation, double llrSaturatesAboveNats) {
    }

    /** The input quantizer at the operating point. */
    public record InputFigures(double gain, double operatingEbN0Db, double sqnrGranularDb, double clipProbability,
                               int measuredAt, double sqnrMeasuredDb, double clipRateMeasured) {
    }

    /** One point's figures. */
    public record Point(double ebN0Db, double esN0Db, long bits, long symbols, ErrorRateInterval floatBer,
                        ErrorRateInterval fixedBer, ErrorRateInterval floatSer, ErrorRateInterval fixedSer,
                        double floatGmi, double fixedGmi, double fixedGmiBestScale, double inputClipRate,
                        double metricRate, double scaleRate, double outputRate, double sqnrDb) {
    }

    /** One design's figures. */
    public record DesignFigures(int index, Design design, List<Point> points, double lossBerDb, double lossGmiDb,
                                double floatEbN0AtBer, double fixedEbN0AtBer, double floatEbN0AtGmi,
                                double fixedEbN0AtGmi, RomFigures transmitRom, RomFigures receiveRom,
                                InputFigures input, Range range, double maxOutputSaturation) {

        /** The loss the sizing uses. */
        public double loss(String measure) {
            return measure.equals("ber") ? lossBerDb : lossGmiDb;
        }
    }

    /** One row of a sizing table. */
    public record SizingRow(String value, int design, double lossBerDb, double lossGmiDb, boolean withinBudget) {
    }

    /** One sweep's sizing: every value tried, and the cheapest (or best) one within the budget. */
    public record Sizing(String parameter, List<SizingRow> rows, String chosen, String reason) {
    }

    private final LossRun run;
    private final List<DesignFigures> designs;
    private final List<Sizing> sizing;

    public LossAnalysis(LossRun run, List<PointResult> points) {
        this.run = run;
        LossSpec spec = run.spec();
        int snrs = spec.ebN0Db().size();
        List<DesignFigures> list = new ArrayList<>();
        for (int d = 0; d < run.designs().size(); d++) {
            list.add(figures(d, run.designs().get(d), points.subList(d * snrs, (d + 1) * snrs)));
        }
        this.designs = List.copyOf(list);
        List<Sizing> s = new ArrayList<>();
        for (LossSpec.Sweep sweep : spec.sweeps()) {
            s.add(size(sweep));
        }
        this.sizing = List.copyOf(s);
    }

    public LossRun run() {
        return run;
    }

    public List<DesignFigures> designs() {
        return designs;
    }

    public List<Sizing> sizing() {
        return sizing;
    }

    private DesignFigures figures(int index, Design d, List<PointResult> results) {
        LossSpec spec = run.spec();
        Constellation c = d.constellation();
        int n = results.size();
        double[] eb = new double[n];
        double[] ber = new double[n];
        double[] berFixed = new double[n];
        double[] gmi = new double[n];
        double[] gmiFixed = new double[n];
        List<Point> points = new ArrayList<>();
        ConstellationRom rx = d.receiveRom();
        FixedLlrSpec llrSpec = d.llrSpec(rx, Simulation.n0(c, spec.ebN0Db().get(n - 1), spec.codeRate()));
        double gain = d.gain();
        double signal = gain * gain * c.averageEnergy();
        double maxOut = 0;
        for (int i = 0; i < n; i++) {
            PointResult r = results.get(i);
            eb[i] = spec.ebN0Db().get(i);
            double n0 = Simulation.n0(c, eb[i], spec.codeRate());
            FixedSoftDemapper datapath = d.fixedDemapper(rx, llrSpec, n0);
            LlrHistogram h = r.llrHistogram();
            double perCode = d.llrPerCode(datapath);
            double fixedGmi = h.gmi(perCode);
            double best = h.gmi(h.bestScale(perCode));
            long llrs = r.bits();
            double out = (double) r.outputEvents() / llrs;
            maxOut = Math.max(maxOut, out);
            double sqnr = r.inputErrorEnergy() > 0
                    ? 10 * StrictMath.log10(signal * r.symbols() / r.inputErrorEnergy()) : Double.POSITIVE_INFINITY;
            Point p = new Point(eb[i], 10 * StrictMath.log10(c.averageEnergy() / n0), r.bits(), r.symbols(),
                    ErrorRateInterval.clopperPearson(r.floatBitErrors(), r.bits(), CONFIDENCE),
                    ErrorRateInterval.clopperPearson(r.fixedBitErrors(), r.bits(), CONFIDENCE),
                    ErrorRateInterval.clopperPearson(r.floatSymbolErrors(), r.symbols(), CONFIDENCE),
                    ErrorRateInterval.clopperPearson(r.fixedSymbolErrors(), r.symbols(), CONFIDENCE),
                    r.floatGmi(), fixedGmi, best, (double) r.inputClips() / r.inputSamples(),
                    (double) r.metricEvents() / llrs, (double) r.scaleEvents() / llrs, out, sqnr);
            points.add(p);
            ber[i] = p.floatBer().estimate();
            berFixed[i] = p.fixedBer().estimate();
            gmi[i] = r.floatGmi();
            gmiFixed[i] = fixedGmi;
        }
        double fb = orNaN(SnrAtTarget.errorRate(eb, ber, spec.targets().ber()));
        double xb = orNaN(SnrAtTarget.errorRate(eb, berFixed, spec.targets().ber()));
        double fg = orNaN(SnrAtTarget.rate(eb, gmi, spec.targets().gmi()));
        double xg = orNaN(SnrAtTarget.rate(eb, gmiFixed, spec.targets().gmi()));
        ConstellationRom tx = d.transmitRom();
        return new DesignFigures(index, d, points, xb - fb, xg - fg, fb, xb, fg, xg,
                rom(c, tx, 1.0), rom(c, rx, gain), input(d, points), range(d, rx, llrSpec), maxOut);
    }

    private static double orNaN(OptionalDouble v) {
        return v.isPresent() ? v.getAsDouble() : Double.NaN;
    }

    /** Metrics of the dequantized table (divided by its gain) against the ideal points. */
    static RomFigures rom(Constellation ideal, ConstellationRom rom, double gain) {
        int m = ideal.size();
        double[] re = new double[m];
        double[] im = new double[m];
        double err = 0;
        double ref = 0;
        QFormat f = rom.format();
        for (int label = 0; label < m; label++) {
            re[label] = f.toDouble(rom.iCode(label)) / gain;
            im[label] = f.toDouble(rom.qCode(label)) / gain;
            double di = re[label] - ideal.re(label);
            double dq = im[label] - ideal.im(label);
            err += ideal.probability(label) * (di * di + dq * dq);
            ref += ideal.probability(label) * (ideal.re(label) * ideal.re(label) + ideal.im(label) * ideal.im(label));
        }
        Constellation q = Constellation.ofLabelled(ideal.name() + " quantized", ideal.family(), ideal.labeling(), re,
                im, ideal.isUniform() ? null : ideal.probabilities(), null);
        Metrics mq = Metrics.of(q);
        Metrics mi = Metrics.of(ideal);
        double evm = StrictMath.sqrt(err / ref);
        return new RomFigures(f.toString(), mq.averageEnergy(), mq.minDistanceSquared(), 100 * evm,
                evm == 0 ? Double.NEGATIVE_INFINITY : 20 * StrictMath.log10(evm),
                10 * StrictMath.log10(mi.powerEfficiency() / mq.powerEfficiency()));
    }

    private InputFigures input(Design d, List<Point> points) {
        LossSpec spec = run.spec();
        Constellation c = d.constellation();
        double gain = d.gain();
        QFormat f = d.input().format();
        // π/2-BPSK's odd symbols are the even ones turned by +90°: both axes carry signal, each parity half the time.
        int parities = c.alternatesQuarterTurn() ? 2 : 1;
        boolean flat = parities == 1;
        for (int label = 0; label < c.size(); label++) {
            flat &= c.im(label) == 0.0;
        }
        int dims = flat ? 1 : 2;
        double granular = dims * f.lsb() * f.lsb() / 12.0;
        double sqnr = 10 * StrictMath.log10(gain * gain * c.averageEnergy() / granular);
        double n0 = Simulation.n0(c, spec.targets().operatingEbN0Db(), spec.codeRate());
        double sigma = gain * StrictMath.sqrt(n0 / 2);
        // A real sample clips when it leaves [minValue − LSB/2, maxValue + LSB/2]: Gaussian tails beyond each edge.
        double top = f.maxValue() + f.lsb() / 2;
        double bottom = f.minValue() - f.lsb() / 2;
        double clip = 0;
        for (int label = 0; label < c.size(); label++) {
            for (int parity = 0; parity < parities; parity++) {
                double re = parity == 0 ? c.re(label) : -c.im(label);
                double im = parity == 0 ? c.im(label) : c.re(label);
                double[] coords = flat ? new double[] {re} : new double[] {re, im};
                for (double x : coords) {
                    double a = gain * x;
                    clip += c.probability(label) / dims / parities
                            * (GaussianTail.q((top - a) / sigma) + GaussianTail.q((a - bottom) / sigma));
                }
            }
        }
        int nearest = 0;
        for (int i = 1; i < points.size(); i++) {
            if (Math.abs(points.get(i).ebN0Db() - spec.targets().operatingEbN0Db())
                    < Math.abs(points.get(nearest).ebN0Db() - spec.targets().operatingEbN0Db())) {
                nearest = i;
            }
        }
        return new InputFigures(gain, spec.targets().operatingEbN0Db(), sqnr, clip, nearest,
                points.get(nearest).sqnrDb(), points.get(nearest).inputClipRate());
    }

    /**
     * The largest |LLR| any input code can produce, at the smallest N0 of the run: the float demapper of the
     * datapath's algorithm over a grid of the input range (max-log LLRs are piecewise linear, so their extremes lie
     * on the range's edges and breakpoints; a 65×65 grid with the corners covers them for the listed families).
     */
    private Range range(Design d, ConstellationRom rx, FixedLlrSpec llrSpec) {
        LossSpec spec = run.spec();
        Constellation c = d.constellation();
        double n0 = Simulation.n0(c, spec.ebN0Db().get(spec.ebN0Db().size() - 1), spec.codeRate());
        SoftDemapper ref = SoftDemapper.create(d.algorithm(), c, new LlrOptions(n0, LlrSign.ZERO_POSITIVE, false));
        QFormat f = d.input().format();
        double g = d.gain();
        int steps = 64;
        double[] llr = new double[c.bitsPerSymbol()];
        // π/2-BPSK: both parities (the odd symbols' LLRs are the even ones' of the turned sample).
        int parities = c.alternatesQuarterTurn() ? 2 : 1;
        boolean flat = parities == 1;
        for (int label = 0; label < c.size(); label++) {
            flat &= c.im(label) == 0.0;
        }
        double max = 0;
        for (int a = 0; a <= steps; a++) {
            for (int b = 0; b <= steps; b++) {
                double x = (f.minValue() + (f.maxValue() - f.minValue()) * a / steps) / g;
                double y = (f.minValue() + (f.maxValue() - f.minValue()) * b / steps) / g;
                for (int parity = 0; parity < parities; parity++) {
                    ref.llr(x, flat ? 0 : y, parity, llr, 0);
                    for (double l : llr) {
                        max = Math.max(max, Math.abs(l));
                    }
                }
            }
        }
        double scaled = max * d.llrScale();
        int bits = 0;
        while ((1L << bits) <= scaled && bits < 40) {
            bits++;
        }
        QFormat out = d.llr().format();
        return new Range(llrSpec.metric().format().describe(),
                llrSpec.isScaled() ? llrSpec.scaleConstant().describe() : "none (unscaled)",
                llrSpec.isScaled() ? llrSpec.scale().format().describe() : "none (unscaled)", max, bits,
                out.maxValue() / d.llrScale());
    }

    private Sizing size(LossSpec.Sweep sweep) {
        LossSpec.Targets t = run.spec().targets();
        SweepParameter parameter = SweepParameter.fromName(sweep.parameter());
        List<SizingRow> rows = new ArrayList<>();
        for (int i = 0; i < sweep.values().size(); i++) {
            int index = run.designs().indexOf(sweep.designs().get(i));
            DesignFigures f = designs.get(index);
            double loss = f.loss(t.sizingMeasure());
            rows.add(new SizingRow(sweep.values().get(i), index, f.lossBerDb(), f.lossGmiDb(),
                    Double.isFinite(loss) && loss <= t.budgetDb()));
        }
        String chosen = null;
        String reason;
        String measure = t.sizingMeasure().equals("ber") ? "BER " + Numbers.sci(t.ber(), 2)
                : "GMI " + Numbers.plain(t.gmi()) + " bit/symbol";
        if (parameter.isWordLength()) {
            double best = Double.POSITIVE_INFINITY;
            for (SizingRow r : rows) {
                double v = Double.parseDouble(r.value());
                if (r.withinBudget() && v < best) {
                    best = v;
                    chosen = r.value();
                }
            }
            reason = chosen == null ? "no value tried stays within the budget of "
                    + Numbers.fixed(t.budgetDb(), 2) + " dB at " + measure + "; try wider formats"
                    : "the smallest value whose loss at " + measure + " stays within "
                    + Numbers.fixed(t.budgetDb(), 2) + " dB";
        } else {
            double best = Double.POSITIVE_INFINITY;
            for (SizingRow r : rows) {
                double loss = t.sizingMeasure().equals("ber") ? r.lossBerDb() : r.lossGmiDb();
                if (Double.isFinite(loss) && loss < best) {
                    best = loss;
                    chosen = r.value();
                }
            }
            reason = chosen == null ? "no value reached the target " + measure + " on the Eb/N0 grid"
                    : "the value with the smallest loss at " + measure;
        }
        return new Sizing(sweep.parameter(), rows, chosen == null ? Numbers.NONE : chosen, reason);
    }
}
