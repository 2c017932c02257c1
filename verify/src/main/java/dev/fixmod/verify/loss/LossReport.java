package dev.fixmod.verify.loss;

import com.fasterxml.jackson.core.JsonEncoding;
import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonGenerator;
import dev.fixmod.demap.FixedLlrSpec;
import dev.fixmod.demap.FixedSoftDemapper;
import dev.fixmod.verify.formats.OutputSet;
import dev.fixmod.verify.theory.ErrorRateInterval;
import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.List;

/**
 * Writes a loss analysis as {@code results.json}, {@code results.csv} (one row per point), {@code sizing.csv} (one
 * row per sweep value and grid combination), {@code report.md} and a self-contained {@code report.html} (inline SVG
 * charts, no external resource) into a folder that appears only when complete. Every number is formatted by
 * {@link Numbers}.
 */
public final class LossReport {
    public static final String CAUTION = "Engineering model, not conformance certification: the figures come from a"
            + " simulation of this model on an AWGN channel; the governing standard's text and the device decide.";

    private final LossAnalysis analysis;
    private final LossSpec spec;

    public LossReport(LossAnalysis analysis) {
        this.analysis = analysis;
        this.spec = analysis.run().spec();
    }

    /** Writes the five files to {@code target} atomically. */
    public void write(Path target, boolean force) throws IOException {
        System.setProperty("java.awt.headless", "true");
        try (OutputSet set = OutputSet.create(target, force)) {
            try (OutputStream out = set.newFile("results.json")) {
                json(out);
            }
            try (Writer w = writer(set.newFile("results.csv"))) {
                w.write(csv());
            }
            try (Writer w = writer(set.newFile("sizing.csv"))) {
                w.write(sizingCsv());
            }
            try (Writer w = writer(set.newFile("report.md"))) {
                w.write(markdown());
            }
            try (Writer w = writer(set.newFile("report.html"))) {
                w.write(html());
            }
            set.commit();
        }
    }

    private static Writer writer(OutputStream out) {
        return new OutputStreamWriter(out, StandardCharsets.UTF_8);
    }

    // ---- JSON ----

    void json(OutputStream out) throws IOException {
        try (JsonGenerator g = new JsonFactory().createGenerator(out, JsonEncoding.UTF8)) {
            g.useDefaultPrettyPrinter();
            g.writeStartObject();
            g.writeStringField("schema", "fixmod-loss-results");
            g.writeNumberField("version", 1);
            g.writeStringField("name", spec.name());
            g.writeStringField("caution", CAUTION);
            g.writeObjectFieldStart("targets");
            num(g, "ber", Numbers.sci(spec.targets().ber(), 3));
            num(g, "gmi", Numbers.plain(spec.targets().gmi()));
            num(g, "loss-budget-db", Numbers.plain(spec.targets().budgetDb()));
            g.writeStringField("sizing", spec.targets().sizingMeasure());
            num(g, "operating-eb-n0-db", Numbers.plain(spec.targets().operatingEbN0Db()));
            g.writeEndObject();
            g.writeArrayFieldStart("designs");
            for (LossAnalysis.DesignFigures f : analysis.designs()) {
                g.writeStartObject();
                g.writeNumberField("index", f.index());
                g.writeStringField("description", f.design().describe());
                g.writeStringField("input", f.design().input().toString());
                g.writeStringField("llr", f.design().llr().toString());
                g.writeStringField("algorithm", f.design().algorithm().tradeName());
                g.writeStringField("reference", f.design().reference().tradeName());
                num(g, "gain", Numbers.plain(f.input().gain()));
                num(g, "loss-at-ber-db", Numbers.fixed(f.lossBerDb(), 4));
                num(g, "loss-at-gmi-db", Numbers.fixed(f.lossGmiDb(), 4));
                num(g, "float-eb-n0-at-gmi-db", Numbers.fixed(f.floatEbN0AtGmi(), 4));
                num(g, "fixed-eb-n0-at-gmi-db", Numbers.fixed(f.fixedEbN0AtGmi(), 4));
                num(g, "float-eb-n0-at-ber-db", Numbers.fixed(f.floatEbN0AtBer(), 4));
                num(g, "fixed-eb-n0-at-ber-db", Numbers.fixed(f.fixedEbN0AtBer(), 4));
                rom(g, "transmit-rom", f.transmitRom());
                rom(g, "receive-reference", f.receiveRom());
                g.writeObjectFieldStart("input-quantizer");
                num(g, "sqnr-granular-db", Numbers.fixed(f.input().sqnrGranularDb(), 3));
                num(g, "clip-probability", Numbers.sci(f.input().clipProbability(), 4));
                num(g, "sqnr-measured-db", Numbers.fixed(f.input().sqnrMeasuredDb(), 3));
                num(g, "clip-rate-measured", Numbers.sci(f.input().clipRateMeasured(), 4));
                g.writeEndObject();
                g.writeObjectFieldStart("range");
                g.writeStringField("metric", f.range().metricFormat());
                g.writeStringField("scale-constant", f.range().scaleConstantFormat());
                g.writeStringField("scale", f.range().scaleFormat());
                num(g, "max-llr-nats", Numbers.fixed(f.range().maxLlrNats(), 3));
                g.writeNumberField("llr-integer-bits-no-saturation", f.range().llrIntegerBitsNoSaturation());
                num(g, "llr-saturates-above-nats", Numbers.plain(f.range().llrSaturatesAboveNats()));
                g.writeNumberField("metric-integer-bits", f.range().stages().metric().format().integerBits());
                g.writeNumberField("metric-integer-bits-no-overflow", f.range().metricIntegerBitsNoOverflow());
                g.writeEndObject();
                LossAnalysis.Overflows o = f.overflows();
                g.writeObjectFieldStart("overflow-events");
                g.writeNumberField("input-samples", o.inputSamples());
                g.writeNumberField("input-clips", o.inputClips());
                g.writeNumberField("llrs", o.llrs());
                g.writeNumberField(FixedSoftDemapper.METRIC_STAGE, o.metric());
                g.writeNumberField(FixedSoftDemapper.SCALE_STAGE, o.scale());
                g.writeNumberField(FixedSoftDemapper.OUTPUT_STAGE, o.output());
                g.writeEndObject();
                g.writeArrayFieldStart("points");
                for (LossAnalysis.Point p : f.points()) {
                    g.writeStartObject();
                    num(g, "eb-n0-db", Numbers.plain(p.ebN0Db()));
                    num(g, "es-n0-db", Numbers.fixed(p.esN0Db(), 4));
                    g.writeNumberField("bits", p.bits());
                    interval(g, "float-ber", p.floatBer());
                    interval(g, "fixed-ber", p.fixedBer());
                    interval(g, "float-ser", p.floatSer());
                    interval(g, "fixed-ser", p.fixedSer());
                    num(g, "float-gmi", Numbers.fixed(p.floatGmi(), 6));
                    num(g, "fixed-gmi", Numbers.fixed(p.fixedGmi(), 6));
                    num(g, "fixed-gmi-best-scale", Numbers.fixed(p.fixedGmiBestScale(), 6));
                    num(g, "input-clip-rate", Numbers.sci(p.inputClipRate(), 4));
                    num(g, "llr-metric-overflow-rate", Numbers.sci(p.metricRate(), 4));
                    num(g, "llr-scale-overflow-rate", Numbers.sci(p.scaleRate(), 4));
                    num(g, "llr-output-saturation-rate", Numbers.sci(p.outputRate(), 4));
                    g.writeEndObject();
                }
                g.writeEndArray();
                g.writeEndObject();
            }
            g.writeEndArray();
            g.writeArrayFieldStart("sizing");
            for (LossAnalysis.Sizing s : analysis.sizing()) {
                g.writeStartObject();
                g.writeStringField("parameter", s.parameter());
                g.writeStringField("chosen", s.chosen());
                g.writeStringField("reason", s.reason());
                g.writeArrayFieldStart("tried");
                for (LossAnalysis.SizingRow r : s.rows()) {
                    g.writeStartObject();
                    g.writeStringField("value", r.value());
                    g.writeNumberField("design", r.design());
                    losses(g, r.lossBerDb(), r.lossGmiDb(), r.withinBudget());
                    g.writeEndObject();
                }
                g.writeEndArray();
                g.writeEndObject();
            }
            g.writeEndArray();
            g.writeArrayFieldStart("grids");
            for (LossAnalysis.GridSizing s : analysis.grids()) {
                g.writeStartObject();
                g.writeFieldName("parameters");
                strings(g, s.parameters());
                g.writeFieldName("chosen");
                if (s.chosen() < 0) {
                    g.writeNull();
                } else {
                    strings(g, s.rows().get(s.chosen()).values());
                }
                g.writeStringField("reason", s.reason());
                g.writeArrayFieldStart("tried");
                for (LossAnalysis.GridRow r : s.rows()) {
                    g.writeStartObject();
                    g.writeFieldName("values");
                    strings(g, r.values());
                    g.writeNumberField("design", r.design());
                    g.writeNumberField("bits", r.bits());
                    losses(g, r.lossBerDb(), r.lossGmiDb(), r.withinBudget());
                    g.writeEndObject();
                }
                g.writeEndArray();
                g.writeEndObject();
            }
            g.writeEndArray();
            g.writeEndObject();
            g.writeRaw('\n');
        }
    }

    private static void strings(JsonGenerator g, Iterable<String> values) throws IOException {
        g.writeStartArray();
        for (String v : values) {
            g.writeString(v);
        }
        g.writeEndArray();
    }

    /** A sizing row's losses (4 decimals, null when not available) and its budget verdict. */
    private static void losses(JsonGenerator g, double berDb, double gmiDb, boolean within) throws IOException {
        num(g, "loss-at-ber-db", Numbers.fixed(berDb, 4));
        num(g, "loss-at-gmi-db", Numbers.fixed(gmiDb, 4));
        g.writeBooleanField("within-budget", within);
    }

    /** A formatted number as a JSON number, or null when it is not available. */
    private static void num(JsonGenerator g, String key, String text) throws IOException {
        g.writeFieldName(key);
        if (text.equals(Numbers.NONE)) {
            g.writeNull();
        } else {
            g.writeNumber(text);
        }
    }

    private static void interval(JsonGenerator g, String key, ErrorRateInterval i) throws IOException {
        g.writeObjectFieldStart(key);
        g.writeNumberField("errors", i.errors());
        g.writeNumberField("trials", i.trials());
        num(g, "rate", Numbers.sci(i.estimate(), 4));
        num(g, "lower-99", Numbers.sci(i.lower(), 4));
        num(g, "upper-99", Numbers.sci(i.upper(), 4));
        g.writeEndObject();
    }

    private static void rom(JsonGenerator g, String key, LossAnalysis.RomFigures r) throws IOException {
        g.writeObjectFieldStart(key);
        g.writeStringField("format", r.format());
        num(g, "energy", Numbers.plain(r.energy()));
        num(g, "d-min-squared", Numbers.plain(r.minDistanceSquared()));
        num(g, "evm-percent", Numbers.fixed(r.evmPercent(), 5));
        num(g, "evm-db", Numbers.fixed(r.evmDb(), 2));
        num(g, "power-efficiency-loss-db", Numbers.fixed(r.powerEfficiencyLossDb(), 5));
        g.writeEndObject();
    }

    // ---- CSV ----

    String csv() {
        StringBuilder sb = new StringBuilder("design,description,eb_n0_db,bits,float_ber,fixed_ber,float_ser,fixed_ser,"
                + "float_gmi,fixed_gmi,fixed_gmi_best_scale,input_clip_rate,llr_metric_overflow_rate,"
                + "llr_scale_overflow_rate,llr_output_saturation_rate\n");
        for (LossAnalysis.DesignFigures f : analysis.designs()) {
            for (LossAnalysis.Point p : f.points()) {
                sb.append(f.index()).append(",\"").append(f.design().describe()).append("\",")
                        .append(Numbers.plain(p.ebN0Db())).append(',').append(p.bits()).append(',')
                        .append(Numbers.sci(p.floatBer().estimate(), 4)).append(',')
                        .append(Numbers.sci(p.fixedBer().estimate(), 4)).append(',')
                        .append(Numbers.sci(p.floatSer().estimate(), 4)).append(',')
                        .append(Numbers.sci(p.fixedSer().estimate(), 4)).append(',')
                        .append(Numbers.fixed(p.floatGmi(), 6)).append(',')
                        .append(Numbers.fixed(p.fixedGmi(), 6)).append(',')
                        .append(Numbers.fixed(p.fixedGmiBestScale(), 6)).append(',')
                        .append(Numbers.sci(p.inputClipRate(), 4)).append(',')
                        .append(Numbers.sci(p.metricRate(), 4)).append(',')
                        .append(Numbers.sci(p.scaleRate(), 4)).append(',')
                        .append(Numbers.sci(p.outputRate(), 4)).append('\n');
            }
        }
        return sb.toString();
    }

    /**
     * One row per value of each sweep, then per combination of each grid ({@code kind} says which); the second
     * parameter and value and the bits (a grid's cost) are empty for a sweep; {@code chosen} marks the
     * recommendation.
     */
    String sizingCsv() {
        StringBuilder sb = new StringBuilder("kind,parameter,value,second_parameter,second_value,design,bits,"
                + "loss_at_ber_db,loss_at_gmi_db,within_budget,chosen\n");
        for (LossAnalysis.Sizing s : analysis.sizing()) {
            for (LossAnalysis.SizingRow r : s.rows()) {
                sb.append("sweep,").append(s.parameter()).append(',').append(r.value()).append(",,,")
                        .append(r.design()).append(",,").append(Numbers.fixed(r.lossBerDb(), 4)).append(',')
                        .append(Numbers.fixed(r.lossGmiDb(), 4)).append(',').append(r.withinBudget()).append(',')
                        .append(r.value().equals(s.chosen())).append('\n');
            }
        }
        for (LossAnalysis.GridSizing s : analysis.grids()) {
            for (int i = 0; i < s.rows().size(); i++) {
                LossAnalysis.GridRow r = s.rows().get(i);
                sb.append("grid,").append(s.parameters().get(0)).append(',').append(r.values().get(0)).append(',')
                        .append(s.parameters().get(1)).append(',').append(r.values().get(1)).append(',')
                        .append(r.design()).append(',').append(r.bits()).append(',')
                        .append(Numbers.fixed(r.lossBerDb(), 4)).append(',').append(Numbers.fixed(r.lossGmiDb(), 4))
                        .append(',').append(r.withinBudget()).append(',').append(i == s.chosen()).append('\n');
            }
        }
        return sb.toString();
    }

    // ---- Markdown (also the text of the HTML) ----

    private String headline() {
        LossAnalysis.DesignFigures base = analysis.designs().get(0);
        return "Base design: " + base.design().constellation().name() + ", " + base.design().describe()
                + ". Loss at GMI " + Numbers.plain(spec.targets().gmi()) + " bit/symbol: "
                + Numbers.fixed(base.lossGmiDb(), 3) + " dB; at BER " + Numbers.sci(spec.targets().ber(), 2) + ": "
                + Numbers.fixed(base.lossBerDb(), 3) + " dB (budget " + Numbers.fixed(spec.targets().budgetDb(), 2)
                + " dB).";
    }

    String markdown() {
        StringBuilder sb = new StringBuilder();
        sb.append("# Quantization loss: ").append(spec.name()).append("\n\n");
        if (!spec.description().isEmpty()) {
            sb.append(spec.description()).append("\n\n");
        }
        sb.append("> ").append(CAUTION).append("\n\n");
        sb.append(headline()).append("\n\n");
        sb.append("## Sizing\n\n");
        if (analysis.sizing().isEmpty() && analysis.grids().isEmpty()) {
            sb.append("No sweep in the specification.\n\n");
        }
        for (LossAnalysis.Sizing s : analysis.sizing()) {
            sb.append("### ").append(s.parameter()).append(": choose ").append(s.chosen()).append("\n\n")
                    .append(s.reason()).append(".\n\n")
                    .append("| value | design | loss at BER (dB) | loss at GMI (dB) | within budget |\n")
                    .append("|---|---|---|---|---|\n");
            for (LossAnalysis.SizingRow r : s.rows()) {
                sb.append("| ").append(r.value()).append(" | ").append(r.design()).append(" | ")
                        .append(Numbers.fixed(r.lossBerDb(), 3)).append(" | ").append(Numbers.fixed(r.lossGmiDb(), 3))
                        .append(" | ").append(r.withinBudget() ? "yes" : "no").append(" |\n");
            }
            sb.append('\n');
        }
        for (LossAnalysis.GridSizing s : analysis.grids()) {
            gridMarkdown(sb, s);
        }
        sb.append("## Designs\n\n| design | description | loss at BER (dB) | loss at GMI (dB) | max LLR saturation |\n")
                .append("|---|---|---|---|---|\n");
        for (LossAnalysis.DesignFigures f : analysis.designs()) {
            sb.append("| ").append(f.index()).append(" | ").append(f.design().describe()).append(" | ")
                    .append(Numbers.fixed(f.lossBerDb(), 3)).append(" | ").append(Numbers.fixed(f.lossGmiDb(), 3))
                    .append(" | ").append(Numbers.sci(f.maxOutputSaturation(), 3)).append(" |\n");
        }
        rangeTable(sb);
        LossAnalysis.DesignFigures base = analysis.designs().get(0);
        sb.append("\n## Static figures (base design)\n\n| table | format | E_s | d_min² | EVM (%) | EVM (dB) |"
                + " power-efficiency loss (dB) |\n|---|---|---|---|---|---|---|\n");
        romRow(sb, "transmit ROM", base.transmitRom());
        romRow(sb, "receiver reference points / gain", base.receiveRom());
        LossAnalysis.InputFigures in = base.input();
        sb.append("\nInput quantizer ").append(base.design().input().format().describe()).append(", gain ")
                .append(Numbers.plain(in.gain())).append(", at Eb/N0 ").append(Numbers.plain(in.operatingEbN0Db()))
                .append(" dB: granular SQNR ").append(Numbers.fixed(in.sqnrGranularDb(), 2))
                .append(" dB (LSB²/12 per dimension), clipping probability ").append(Numbers.sci(in.clipProbability(), 3))
                .append(" per sample (Gaussian tails); measured at ")
                .append(Numbers.plain(base.points().get(in.measuredAt()).ebN0Db())).append(" dB: SQNR ")
                .append(Numbers.fixed(in.sqnrMeasuredDb(), 2)).append(" dB, clip rate ")
                .append(Numbers.sci(in.clipRateMeasured(), 3)).append(".\n\n");
        LossAnalysis.Range r = base.range();
        sb.append("Range analysis: metric stage ").append(r.metricFormat()).append(r.metricCannotOverflow()
                        ? " cannot overflow for any input code;" : " has fewer integer bits than the "
                        + r.metricIntegerBitsNoOverflow() + " with which no input code can overflow it;")
                .append(" scale constant ").append(r.scaleConstantFormat()).append("; scale stage ")
                .append(r.scaleFormat()).append(". The largest |LLR| any input can produce at the highest Eb/N0 is ")
                .append(Numbers.fixed(r.maxLlrNats(), 2)).append(" nats: an output with ")
                .append(r.llrIntegerBitsNoSaturation()).append(" integer bits never saturates; the chosen ")
                .append(base.design().llr().format()).append(" saturates above ")
                .append(Numbers.plain(r.llrSaturatesAboveNats())).append(" nats (saturating LLRs is usual).\n\n");
        sb.append("## Curves (base design)\n\n| Eb/N0 (dB) | bits | float BER | fixed BER | fixed BER 99% interval |"
                + " float SER | fixed SER | float GMI | fixed GMI | input clips | LLR saturation |\n"
                + "|---|---|---|---|---|---|---|---|---|---|---|\n");
        for (LossAnalysis.Point p : base.points()) {
            sb.append("| ").append(Numbers.plain(p.ebN0Db())).append(" | ").append(p.bits()).append(" | ")
                    .append(Numbers.sci(p.floatBer().estimate(), 3)).append(" | ")
                    .append(Numbers.sci(p.fixedBer().estimate(), 3)).append(" | [")
                    .append(Numbers.sci(p.fixedBer().lower(), 2)).append(", ")
                    .append(Numbers.sci(p.fixedBer().upper(), 2)).append("] | ")
                    .append(Numbers.sci(p.floatSer().estimate(), 3)).append(" | ")
                    .append(Numbers.sci(p.fixedSer().estimate(), 3)).append(" | ")
                    .append(Numbers.fixed(p.floatGmi(), 4)).append(" | ").append(Numbers.fixed(p.fixedGmi(), 4))
                    .append(" | ").append(Numbers.sci(p.inputClipRate(), 2)).append(" | ")
                    .append(Numbers.sci(p.outputRate(), 2)).append(" |\n");
        }
        sb.append("\nHow to read: the loss is the extra Eb/N0 the fixed-point chain needs to reach the target, against"
                + " the float reference on the same noise, interpolated on the Eb/N0 grid (n/a: the target is not"
                + " crossed on the grid). GMI is the BICM generalized mutual information estimated from the LLRs;"
                + " the fixed GMI reads code c as c·LSB/scale nats. Hard decisions are the LLR signs.\n");
        return sb.toString();
    }

    /** A grid: the loss at the sizing measure over the combinations, then every combination's figures. */
    private void gridMarkdown(StringBuilder sb, LossAnalysis.GridSizing s) {
        String first = s.parameters().get(0);
        String second = s.parameters().get(1);
        boolean ber = spec.targets().sizingMeasure().equals("ber");
        sb.append("### grid ").append(first).append(" × ").append(second).append(": choose ")
                .append(s.chosen() < 0 ? Numbers.NONE
                        : LossSpecReader.combination(s.parameters(), s.rows().get(s.chosen()).values()))
                .append("\n\n").append(s.reason()).append(".\n\nLoss at ").append(ber ? "BER" : "GMI")
                .append(" (dB), ").append(first).append(" down, ").append(second)
                .append(" across; ✗ over the budget, bold the choice:\n\n| ").append(first).append(" \\ ")
                .append(second).append(" |");
        List<String> across = s.values().get(1);
        for (String v : across) {
            sb.append(' ').append(v).append(" |");
        }
        sb.append("\n|---|").append("---|".repeat(across.size())).append('\n');
        for (int i = 0; i < s.rows().size(); i++) {
            LossAnalysis.GridRow r = s.rows().get(i);
            if (i % across.size() == 0) {
                sb.append("| ").append(r.values().get(0)).append(" |");
            }
            String loss = Numbers.fixed(ber ? r.lossBerDb() : r.lossGmiDb(), 3);
            sb.append(' ').append(i == s.chosen() ? "**" + loss + "**" : r.withinBudget() ? loss : loss + " ✗")
                    .append(" |");
            if (i % across.size() == across.size() - 1) {
                sb.append('\n');
            }
        }
        sb.append("\n| ").append(first).append(" | ").append(second).append(" | design | bits | loss at BER (dB) |"
                + " loss at GMI (dB) | within budget |\n|---|---|---|---|---|---|---|\n");
        for (LossAnalysis.GridRow r : s.rows()) {
            sb.append("| ").append(r.values().get(0)).append(" | ").append(r.values().get(1)).append(" | ")
                    .append(r.design()).append(" | ").append(r.bits()).append(" | ")
                    .append(Numbers.fixed(r.lossBerDb(), 3)).append(" | ").append(Numbers.fixed(r.lossGmiDb(), 3))
                    .append(" | ").append(r.withinBudget() ? "yes" : "no").append(" |\n");
        }
        sb.append('\n');
    }

    /**
     * Per design the stages as simulated and the overflow events their counters saw over all points: where the
     * datapath saturates inside, not only at its output.
     */
    private void rangeTable(StringBuilder sb) {
        sb.append("\n## Range analysis per design\n\nOverflow events over all points of each design (input clips"
                + " per real sample, the LLR stages per LLR); \"needs\" is the metric's integer bits with which no"
                + " input code can overflow it (the kernel's range analysis).\n\n| design | metric | needs |"
                + " metric overflows | scale constant | scale | scale overflows | LLR | LLR saturations |"
                + " input clips |\n|---|---|---|---|---|---|---|---|---|---|\n");
        for (LossAnalysis.DesignFigures f : analysis.designs()) {
            FixedLlrSpec st = f.range().stages();
            LossAnalysis.Overflows o = f.overflows();
            sb.append("| ").append(f.index()).append(" | ").append(st.metric().format()).append(" | ")
                    .append(f.range().metricIntegerBitsNoOverflow()).append(" | ").append(events(o.metric(), o.llrs()))
                    .append(" | ").append(st.isScaled() ? st.scaleConstant().toString() : "none").append(" | ")
                    .append(st.isScaled() ? st.scale().format().toString() : "none").append(" | ")
                    .append(st.isScaled() ? events(o.scale(), o.llrs()) : "none").append(" | ")
                    .append(st.output().format()).append(" | ").append(events(o.output(), o.llrs())).append(" | ")
                    .append(events(o.inputClips(), o.inputSamples())).append(" |\n");
        }
    }

    /** {@code 12 (3.00e-4)}: a count and its rate. */
    private static String events(long count, long of) {
        return count + " (" + Numbers.sci(of == 0 ? 0 : (double) count / of, 2) + ")";
    }

    private static void romRow(StringBuilder sb, String what, LossAnalysis.RomFigures r) {
        sb.append("| ").append(what).append(" | ").append(r.format()).append(" | ").append(Numbers.plain(r.energy()))
                .append(" | ").append(Numbers.plain(r.minDistanceSquared())).append(" | ")
                .append(Numbers.fixed(r.evmPercent(), 4)).append(" | ").append(Numbers.fixed(r.evmDb(), 1))
                .append(" | ").append(Numbers.fixed(r.powerEfficiencyLossDb(), 4)).append(" |\n");
    }

    // ---- HTML ----

    String html() {
        LossAnalysis.DesignFigures base = analysis.designs().get(0);
        StringBuilder sb = new StringBuilder();
        sb.append("<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\"><title>Quantization loss: ")
                .append(esc(spec.name())).append("</title>\n<style>body{font-family:sans-serif;margin:24px;"
                        + "max-width:1100px;color:#222}table{border-collapse:collapse;margin:8px 0}"
                        + "td,th{border:1px solid #bbb;padding:3px 8px;text-align:right}th{background:#eee}"
                        + ".caution{border-left:4px solid #d62728;padding:6px 12px;background:#fff4f4}"
                        + ".chart{margin:12px 0}pre{white-space:pre-wrap}</style></head><body>\n");
        sb.append("<h1>Quantization loss: ").append(esc(spec.name())).append("</h1>\n");
        if (!spec.description().isEmpty()) {
            sb.append("<p>").append(esc(spec.description())).append("</p>\n");
        }
        sb.append("<p class=\"caution\">").append(esc(CAUTION)).append("</p>\n<p>").append(esc(headline()))
                .append("</p>\n");
        sb.append("<h2>Sizing</h2>\n");
        for (LossAnalysis.Sizing s : analysis.sizing()) {
            sb.append("<h3>").append(esc(s.parameter())).append(": choose ").append(esc(s.chosen())).append("</h3>\n<p>")
                    .append(esc(s.reason())).append(".</p>\n<table><tr><th>value</th><th>loss at BER (dB)</th>"
                            + "<th>loss at GMI (dB)</th><th>within budget</th></tr>\n");
            for (LossAnalysis.SizingRow r : s.rows()) {
                sb.append("<tr><td>").append(esc(r.value())).append("</td><td>").append(Numbers.fixed(r.lossBerDb(), 3))
                        .append("</td><td>").append(Numbers.fixed(r.lossGmiDb(), 3)).append("</td><td>")
                        .append(r.withinBudget() ? "yes" : "no").append("</td></tr>\n");
            }
            sb.append("</table>\n");
            if (SweepParameter.fromName(s.parameter()).isNumeric()) {
                chart(sb, Charts.loss(s, spec.targets().budgetDb(), "loss-" + s.parameter()));
            }
        }
        for (LossAnalysis.GridSizing s : analysis.grids()) {
            gridHtml(sb, s);
        }
        sb.append("<h2>Curves</h2>\n");
        chart(sb, Charts.ber(base, spec.targets().ber()));
        chart(sb, Charts.gmi(base, spec.targets().gmi()));
        sb.append("<h2>Quantized constellation and LLR transfer</h2>\n");
        chart(sb, Charts.constellation(base.design()));
        double n0 = Simulation.n0(base.design().constellation(), spec.targets().operatingEbN0Db(), spec.codeRate());
        double smallest = Simulation.n0(base.design().constellation(), spec.ebN0Db().get(spec.ebN0Db().size() - 1),
                spec.codeRate());
        chart(sb, Charts.transfer(base.design(), n0, smallest));
        sb.append("<h2>Tables</h2>\n<pre>").append(esc(markdown())).append("</pre>\n</body></html>\n");
        return sb.toString();
    }

    /** A grid's loss table: the first parameter down, the second across; within budget shaded, the choice bold. */
    private void gridHtml(StringBuilder sb, LossAnalysis.GridSizing s) {
        boolean ber = spec.targets().sizingMeasure().equals("ber");
        sb.append("<h3>grid ").append(esc(s.parameters().get(0))).append(" &times; ")
                .append(esc(s.parameters().get(1))).append(": choose ")
                .append(esc(s.chosen() < 0 ? Numbers.NONE
                        : LossSpecReader.combination(s.parameters(), s.rows().get(s.chosen()).values())))
                .append("</h3>\n<p>").append(esc(s.reason())).append(". Loss at ").append(ber ? "BER" : "GMI")
                .append(" (dB); shaded: within the budget; bold: the choice.</p>\n<table><tr><th>")
                .append(esc(s.parameters().get(0))).append(" \\ ").append(esc(s.parameters().get(1))).append("</th>");
        List<String> across = s.values().get(1);
        for (String v : across) {
            sb.append("<th>").append(esc(v)).append("</th>");
        }
        sb.append("</tr>\n");
        for (int i = 0; i < s.rows().size(); i++) {
            LossAnalysis.GridRow r = s.rows().get(i);
            if (i % across.size() == 0) {
                sb.append("<tr><th>").append(esc(r.values().get(0))).append("</th>");
            }
            String loss = Numbers.fixed(ber ? r.lossBerDb() : r.lossGmiDb(), 3);
            sb.append(r.withinBudget() ? "<td style=\"background:#e3f4e3\">" : "<td>")
                    .append(i == s.chosen() ? "<b>" + loss + "</b>" : loss).append("</td>");
            if (i % across.size() == across.size() - 1) {
                sb.append("</tr>\n");
            }
        }
        sb.append("</table>\n");
    }

    private static void chart(StringBuilder sb, String svg) {
        sb.append("<div class=\"chart\">").append(svg).append("</div>\n");
    }

    private static String esc(String s) {
        return s.replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;").replace("\"", "&quot;");
    }

}
