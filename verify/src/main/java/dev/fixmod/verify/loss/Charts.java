package dev.fixmod.verify.loss;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.demap.FixedLlrSpec;
import dev.fixmod.demap.FixedSoftDemapper;
import dev.fixmod.demap.SoftDemapper;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.map.ConstellationRom;
import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Rectangle;
import java.util.List;
import org.jfree.chart.ChartFactory;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.LogAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.jfree.svg.SVGGraphics2D;

/**
 * The report's charts, drawn with JFreeChart into SVG (JFreeSVG), as inline {@code <svg>} elements. Coordinates are
 * written with two decimals and definitions get a fixed key prefix, so the same figures give the same SVG text.
 */
final class Charts {
    static final int WIDTH = 720;
    static final int HEIGHT = 420;
    private static final Color[] COLORS = {new Color(0x1f77b4), new Color(0xd62728), new Color(0x2ca02c),
            new Color(0xff7f0e), new Color(0x9467bd), new Color(0x8c564b), new Color(0xe377c2), new Color(0x7f7f7f)};

    private Charts() {
    }

    /** BER of float and fixed against Eb/N0 (log scale; points with no error are left out). */
    static String ber(LossAnalysis.DesignFigures f, double target) {
        XYSeries fl = new XYSeries("float reference (" + f.design().reference() + ")");
        XYSeries fx = new XYSeries("fixed point (" + f.design().algorithm() + ")");
        for (LossAnalysis.Point p : f.points()) {
            if (p.floatBer().errors() > 0) {
                fl.add(p.ebN0Db(), p.floatBer().estimate());
            }
            if (p.fixedBer().errors() > 0) {
                fx.add(p.ebN0Db(), p.fixedBer().estimate());
            }
        }
        XYSeries t = new XYSeries("target BER " + Numbers.sci(target, 2));
        t.add(f.points().get(0).ebN0Db(), target);
        t.add(f.points().get(f.points().size() - 1).ebN0Db(), target);
        JFreeChart chart = chart("Bit error rate (base design)", "Eb/N0 (dB)", "BER", collection(fl, fx, t), true);
        XYPlot plot = chart.getXYPlot();
        LogAxis axis = new LogAxis("BER");
        axis.setSmallestValue(1e-9);
        axis.setStandardTickUnits(NumberAxis.createIntegerTickUnits());
        plot.setRangeAxis(axis);
        return svg(chart, "ber");
    }

    /** GMI of float and fixed (nominal LLR scale) against Eb/N0. */
    static String gmi(LossAnalysis.DesignFigures f, double target) {
        XYSeries fl = new XYSeries("float reference");
        XYSeries fx = new XYSeries("fixed point");
        for (LossAnalysis.Point p : f.points()) {
            fl.add(p.ebN0Db(), p.floatGmi());
            fx.add(p.ebN0Db(), p.fixedGmi());
        }
        XYSeries t = new XYSeries("target " + Numbers.plain(target) + " bit/symbol");
        t.add(f.points().get(0).ebN0Db(), target);
        t.add(f.points().get(f.points().size() - 1).ebN0Db(), target);
        return svg(chart("BICM GMI (base design)", "Eb/N0 (dB)", "GMI (bit/symbol)", collection(fl, fx, t), true),
                "gmi");
    }

    /** Loss at the targets against the swept value (numeric sweeps). */
    static String loss(LossAnalysis.Sizing s, double budget, String id) {
        XYSeries g = new XYSeries("loss at target GMI");
        XYSeries b = new XYSeries("loss at target BER");
        XYSeries limit = new XYSeries("budget " + Numbers.fixed(budget, 2) + " dB");
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (LossAnalysis.SizingRow r : s.rows()) {
            double v = Double.parseDouble(r.value());
            lo = Math.min(lo, v);
            hi = Math.max(hi, v);
            if (Double.isFinite(r.lossGmiDb())) {
                g.add(v, r.lossGmiDb());
            }
            if (Double.isFinite(r.lossBerDb())) {
                b.add(v, r.lossBerDb());
            }
        }
        limit.add(lo, budget);
        limit.add(hi, budget);
        return svg(chart("Implementation loss against " + s.parameter(), s.parameter(), "loss (dB)",
                collection(g, b, limit), true), id);
    }

    /** The ideal points, the transmit ROM's and the receiver's reference points (divided by the gain). */
    static String constellation(Design d) {
        Constellation c = d.constellation();
        ConstellationRom tx = d.transmitRom();
        ConstellationRom rx = d.receiveRom();
        XYSeries ideal = new XYSeries("ideal");
        XYSeries t = new XYSeries("transmit ROM " + tx.format());
        XYSeries r = new XYSeries("receiver reference " + rx.format() + " / gain");
        double g = d.gain();
        for (int label = 0; label < c.size(); label++) {
            ideal.add(c.re(label), c.im(label));
            t.add(tx.format().toDouble(tx.iCode(label)), tx.format().toDouble(tx.qCode(label)));
            r.add(rx.format().toDouble(rx.iCode(label)) / g, rx.format().toDouble(rx.qCode(label)) / g);
        }
        JFreeChart chart = chart("Quantized constellation", "I", "Q", collection(ideal, t, r), false);
        XYLineAndShapeRenderer renderer = (XYLineAndShapeRenderer) chart.getXYPlot().getRenderer();
        for (int i = 0; i < 3; i++) {
            renderer.setSeriesLinesVisible(i, false);
            renderer.setSeriesShapesVisible(i, true);
        }
        return svg(chart, "constellation");
    }

    /**
     * LLR against the received I (Q held at the first label's Q level) at the operating Eb/N0: the float reference and
     * the fixed datapath (code × LLR per code), for up to four bits whose LLR depends on I.
     */
    static String transfer(Design d, double n0, double smallestN0) {
        Constellation c = d.constellation();
        ConstellationRom rx = d.receiveRom();
        FixedLlrSpec spec = d.llrSpec(rx, smallestN0);
        FixedSoftDemapper datapath = d.fixedDemapper(rx, spec, n0);
        SoftDemapper reference = d.floatDemapper(n0);
        double perCode = d.llrPerCode(datapath);
        int k = c.bitsPerSymbol();
        double peak = 0;
        for (int label = 0; label < c.size(); label++) {
            peak = Math.max(peak, Math.abs(c.re(label)));
        }
        double q = c.im(0);
        int steps = 240;
        double[][] fl = new double[steps + 1][k];
        int[][] fx = new int[steps + 1][k];
        Quantizer in = d.inputQuantizer();
        QFormat f = in.format();
        OverflowCounter ignored = OverflowCounter.unnamed();
        double g = d.gain();
        for (int s = 0; s <= steps; s++) {
            double x = -1.5 * peak + 3.0 * peak * s / steps;
            // Symbol index 0: for π/2-BPSK this is the transfer of the even symbols.
            reference.llr(x, q, 0, fl[s], 0);
            int ci = (int) in.quantize(g * x, ignored);
            int cq = (int) in.quantize(g * q, ignored);
            datapath.llr(ci, f.contains(cq) ? cq : 0, 0, fx[s], 0);
        }
        XYSeriesCollection data = new XYSeriesCollection();
        int shown = 0;
        for (int b = 0; b < k && shown < 4; b++) {
            double lo = Double.POSITIVE_INFINITY;
            double hi = Double.NEGATIVE_INFINITY;
            for (double[] row : fl) {
                lo = Math.min(lo, row[b]);
                hi = Math.max(hi, row[b]);
            }
            if (hi - lo < 1e-9) {
                continue;
            }
            XYSeries a = new XYSeries("b" + b + " float");
            XYSeries z = new XYSeries("b" + b + " fixed");
            for (int s = 0; s <= steps; s++) {
                double x = -1.5 * peak + 3.0 * peak * s / steps;
                a.add(x, fl[s][b]);
                z.add(x, fx[s][b] * perCode);
            }
            data.addSeries(a);
            data.addSeries(z);
            shown++;
        }
        JFreeChart chart = chart("LLR transfer (base design, operating point)", "received I", "LLR (nats)", data,
                false);
        XYLineAndShapeRenderer renderer = (XYLineAndShapeRenderer) chart.getXYPlot().getRenderer();
        for (int i = 0; i < data.getSeriesCount(); i++) {
            renderer.setSeriesPaint(i, COLORS[(i / 2) % COLORS.length]);
            renderer.setSeriesStroke(i, i % 2 == 0
                    ? new BasicStroke(1.5f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f, new float[] {6f, 4f}, 0f)
                    : new BasicStroke(2f));
        }
        return svg(chart, "transfer");
    }

    private static XYSeriesCollection collection(XYSeries... series) {
        XYSeriesCollection c = new XYSeriesCollection();
        for (XYSeries s : series) {
            c.addSeries(s);
        }
        return c;
    }

    private static JFreeChart chart(String title, String x, String y, XYSeriesCollection data, boolean shapes) {
        JFreeChart chart = ChartFactory.createXYLineChart(title, x, y, data, PlotOrientation.VERTICAL, true, false,
                false);
        chart.setBackgroundPaint(Color.WHITE);
        chart.getTitle().setFont(new Font(Font.SANS_SERIF, Font.BOLD, 15));
        XYPlot plot = chart.getXYPlot();
        plot.setBackgroundPaint(Color.WHITE);
        plot.setDomainGridlinePaint(new Color(0xcccccc));
        plot.setRangeGridlinePaint(new Color(0xcccccc));
        ((NumberAxis) plot.getRangeAxis()).setAutoRangeIncludesZero(false);
        XYLineAndShapeRenderer renderer = new XYLineAndShapeRenderer(true, shapes);
        for (int i = 0; i < data.getSeriesCount(); i++) {
            renderer.setSeriesPaint(i, COLORS[i % COLORS.length]);
            renderer.setSeriesStroke(i, new BasicStroke(2f));
        }
        plot.setRenderer(renderer);
        return chart;
    }

    private static String svg(JFreeChart chart, String id) {
        SVGGraphics2D g2 = new SVGGraphics2D(WIDTH, HEIGHT);
        g2.setDefsKeyPrefix(id + "-");
        g2.setGeomDoubleConverter(Charts::twoDecimals);
        g2.setTransformDoubleConverter(Charts::twoDecimals);
        chart.draw(g2, new Rectangle(0, 0, WIDTH, HEIGHT));
        return g2.getSVGElement(id);
    }

    /** Two decimals, half away from zero, without floating-point formatting. */
    static String twoDecimals(double x) {
        if (!Double.isFinite(x)) {
            return "0";
        }
        long hundredths = Math.round(Math.abs(x) * 100);
        String sign = x < 0 && hundredths != 0 ? "-" : "";
        long frac = hundredths % 100;
        return sign + hundredths / 100 + "." + (frac < 10 ? "0" : "") + frac;
    }

}
