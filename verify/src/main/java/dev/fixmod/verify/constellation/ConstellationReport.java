package dev.fixmod.verify.constellation;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.StreamWriteFeature;
import com.fasterxml.jackson.core.io.NumberOutput;
import com.fasterxml.jackson.core.json.JsonWriteFeature;
import com.fasterxml.jackson.core.util.DefaultIndenter;
import com.fasterxml.jackson.core.util.DefaultPrettyPrinter;
import dev.fixmod.constellation.AxisLayout;
import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Metrics;
import dev.fixmod.constellation.Normalization;
import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;

/**
 * A constellation with its ideal metrics, rendered as a readable table ({@link #text}), JSON ({@link #json}) or CSV
 * ({@link #csv}). Machine outputs carry every number exactly: the shortest decimal that reads back to the same double
 * (Jackson's Schubfach writer, identical on every JVM). The text rounds to 10 significant digits.
 *
 * @param constellation      the constellation as output (normalized)
 * @param normalization      the normalization that was applied
 * @param scale              the factor applied to the natural grid
 * @param phaseOffsetDegrees the phase offset that was applied (PSK), else 0
 * @param shaping            the Maxwell–Boltzmann λ on the natural grid, 0 if none
 * @param rolloff            the raised-cosine roll-off for the bandwidth efficiency
 */
public record ConstellationReport(Constellation constellation, Normalization normalization, double scale,
                                  double phaseOffsetDegrees, double shaping, double rolloff) {

    /** The metrics of {@link #constellation}. */
    public Metrics metrics() {
        return Metrics.of(constellation);
    }

    /** Exact, JVM-independent decimal form of a double (shortest round trip). */
    static String exact(double x) {
        return NumberOutput.toString(x, true);
    }

    /** At most 10 significant digits, no exponent, no trailing zeros. */
    static String human(double x) {
        if (x == 0) {
            return "0";
        }
        return new BigDecimal(x).round(new MathContext(10, RoundingMode.HALF_EVEN)).stripTrailingZeros()
                .toPlainString();
    }

    private static String bits(int label, int k) {
        StringBuilder sb = new StringBuilder(k);
        for (int j = k - 1; j >= 0; j--) {
            sb.append((label >>> j) & 1);
        }
        return sb.toString();
    }

    private static String familyName(Constellation c) {
        return c.family().name().toLowerCase(Locale.ROOT).replace('_', '-');
    }

    /** The readable table: description, points with labels, then every metric with its definition. */
    public String text() {
        Constellation c = constellation;
        Metrics m = metrics();
        int k = c.bitsPerSymbol();
        StringBuilder out = new StringBuilder();
        out.append(c.name()).append(": ").append(c.family().description()).append(", ").append(c.size())
                .append(" points, ").append(c.labeling()).append(" labeling\n");
        out.append("normalization: ").append(normalization.tradeName());
        if (normalization != Normalization.NONE) {
            out.append(" (scale ").append(human(scale)).append(" applied to the natural grid)");
        }
        out.append('\n');
        if (phaseOffsetDegrees != 0) {
            out.append("phase offset: ").append(human(phaseOffsetDegrees)).append(" degrees\n");
        }
        out.append("probabilities: ");
        if (c.isUniform()) {
            out.append("equiprobable\n");
        } else if (shaping > 0) {
            out.append("Maxwell-Boltzmann, p ~ exp(-").append(human(shaping)).append(" |s|^2) on the natural grid\n");
        } else {
            out.append("as given\n");
        }
        AxisLayout axes = c.axes();
        if (axes != null) {
            out.append("axes: I carries ").append(positions(axes.iBits())).append(", Q carries ")
                    .append(positions(axes.qBits())).append('\n');
        } else if (c.alternatesQuarterTurn()) {
            out.append("odd-index symbols are turned by +90 degrees: (I, Q) -> (-Q, I)\n");
        } else {
            out.append("axes: not separable (I and Q depend on the same bits)\n");
        }
        out.append('\n');
        appendPoints(out, c, m, k);
        out.append('\n');
        out.append("ideal metrics (floating point, noise-free)\n");
        row(out, "M", c.size() + " points");
        row(out, "k", k + " bits/symbol");
        row(out, "E_s", human(m.averageEnergy()) + "  (average symbol energy, probability-weighted)");
        row(out, "E_b", human(m.bitEnergy()) + "  (E_s/k)");
        row(out, "peak energy", human(m.peakEnergy()) + "  (max |s|^2)");
        row(out, "d_min", human(m.minDistance()));
        row(out, "d_min^2", human(m.minDistanceSquared()));
        row(out, "neighbours", human(m.averageNeighbours()) + " on average at d_min  (" + neighbourSummary(m) + ")");
        row(out, "eps", human(m.powerEfficiency()) + "  (power efficiency d_min^2/E_b; BPSK 4)");
        row(out, "loss vs BPSK", human(m.snrLossVsBpskDb()) + " dB  (10 log10(4/eps))");
        row(out, "PAPR", human(m.paprDb()) + " dB  (peak/average energy of the points, before pulse shaping)");
        row(out, "Gray penalty", human(m.grayPenalty()) + "  (differing bits per nearest-neighbour pair; Gray 1)");
        row(out, "entropy", human(m.entropy()) + " bits/symbol");
        row(out, "bandwidth eff.", human(m.bandwidthEfficiencyFirstNull())
                + " bit/s/Hz  rectangular pulses, first-null bandwidth 2/T");
        row(out, "", human(m.bandwidthEfficiency(rolloff)) + " bit/s/Hz  raised cosine, roll-off " + human(rolloff));
        row(out, "", human(m.bandwidthEfficiencyNyquist()) + " bit/s/Hz  Nyquist minimum bandwidth 1/T");
        return out.toString();
    }

    private static String positions(int[] bits) {
        if (bits.length == 0) {
            return "no bits";
        }
        StringBuilder sb = new StringBuilder();
        for (int b : bits) {
            sb.append(sb.length() == 0 ? "" : " ").append('b').append(b);
        }
        return sb.toString();
    }

    private static String neighbourSummary(Metrics m) {
        Map<Integer, Integer> count = new TreeMap<>();
        for (int n : m.neighbourCounts()) {
            count.merge(n, 1, Integer::sum);
        }
        StringBuilder sb = new StringBuilder();
        for (Map.Entry<Integer, Integer> e : count.entrySet()) {
            sb.append(sb.length() == 0 ? "" : ", ").append(e.getValue()).append(e.getValue() == 1 ? " point" : " points")
                    .append(" with ").append(e.getKey());
        }
        return sb.toString();
    }

    private static void row(StringBuilder out, String name, String value) {
        out.append("  ").append(name);
        out.append(" ".repeat(Math.max(1, 16 - name.length()))).append(value).append('\n');
    }

    private static void appendPoints(StringBuilder out, Constellation c, Metrics m, int k) {
        boolean odd = c.alternatesQuarterTurn();
        int size = c.size();
        String[][] cells = new String[size + 1][];
        cells[0] = odd ? new String[] {"label", "bits", "I", "Q", "I (odd)", "Q (odd)", "probability", "neighbours"}
                : new String[] {"label", "bits", "I", "Q", "probability", "neighbours"};
        for (int l = 0; l < size; l++) {
            String p = human(c.probability(l));
            String nn = Integer.toString(m.neighbours(l));
            cells[l + 1] = odd
                    ? new String[] {Integer.toString(l), bits(l, k), human(c.re(l)), human(c.im(l)), human(-c.im(l)),
                        human(c.re(l)), p, nn}
                    : new String[] {Integer.toString(l), bits(l, k), human(c.re(l)), human(c.im(l)), p, nn};
        }
        int columns = cells[0].length;
        int[] width = new int[columns];
        for (String[] r : cells) {
            for (int j = 0; j < columns; j++) {
                width[j] = Math.max(width[j], r[j].length());
            }
        }
        for (String[] r : cells) {
            StringBuilder line = new StringBuilder();
            for (int j = 0; j < columns; j++) {
                boolean left = j == 1;
                String cell = r[j];
                String pad = " ".repeat(width[j] - cell.length());
                line.append(j == 0 ? "" : "  ").append(left ? cell + pad : pad + cell);
            }
            out.append(line.toString().replaceAll("\\s+$", "")).append('\n');
        }
    }

    /** Points as CSV with a header; the columns {@link ConstellationFile} reads (plus the odd-symbol points of π/2-BPSK). */
    public String csv() {
        Constellation c = constellation;
        boolean odd = c.alternatesQuarterTurn();
        StringBuilder out = new StringBuilder(odd ? "label,bits,i,q,probability,i_odd,q_odd\n"
                : "label,bits,i,q,probability\n");
        for (int l = 0; l < c.size(); l++) {
            out.append(l).append(',').append(bits(l, c.bitsPerSymbol())).append(',').append(exact(c.re(l))).append(',')
                    .append(exact(c.im(l))).append(',').append(exact(c.probability(l)));
            if (odd) {
                out.append(',').append(exact(-c.im(l) + 0.0)).append(',').append(exact(c.re(l)));
            }
            out.append('\n');
        }
        return out.toString();
    }

    /** Everything as one JSON object with snake_case keys. */
    public String json() {
        Constellation c = constellation;
        Metrics m = metrics();
        StringWriter w = new StringWriter();
        JsonFactory factory = JsonFactory.builder().enable(StreamWriteFeature.USE_FAST_DOUBLE_WRITER)
                .disable(JsonWriteFeature.ESCAPE_NON_ASCII).build();
        try (JsonGenerator g = factory.createGenerator(w)) {
            g.setPrettyPrinter(new DefaultPrettyPrinter().withObjectIndenter(new DefaultIndenter("  ", "\n")));
            g.writeStartObject();
            g.writeStringField("name", c.name());
            g.writeStringField("family", familyName(c));
            g.writeStringField("labeling", c.labeling());
            g.writeStringField("normalization", normalization.tradeName());
            g.writeNumberField("scale", scale);
            g.writeNumberField("phase_offset_degrees", phaseOffsetDegrees);
            g.writeNumberField("shaping_lambda", shaping);
            g.writeNumberField("size", c.size());
            g.writeNumberField("bits_per_symbol", c.bitsPerSymbol());
            g.writeBooleanField("alternates_quarter_turn", c.alternatesQuarterTurn());
            AxisLayout axes = c.axes();
            if (axes == null) {
                g.writeNullField("axes");
            } else {
                g.writeObjectFieldStart("axes");
                g.writeFieldName("i_bits");
                g.writeArray(axes.iBits(), 0, axes.iBits().length);
                g.writeFieldName("q_bits");
                g.writeArray(axes.qBits(), 0, axes.qBits().length);
                g.writeFieldName("i_levels");
                g.writeArray(axes.iLevels(), 0, axes.iLevels().length);
                g.writeFieldName("q_levels");
                g.writeArray(axes.qLevels(), 0, axes.qLevels().length);
                g.writeEndObject();
            }
            g.writeArrayFieldStart("points");
            for (int l = 0; l < c.size(); l++) {
                g.writeStartObject();
                g.writeNumberField("label", l);
                g.writeStringField("bits", bits(l, c.bitsPerSymbol()));
                g.writeNumberField("i", c.re(l));
                g.writeNumberField("q", c.im(l));
                g.writeNumberField("probability", c.probability(l));
                g.writeNumberField("neighbours", m.neighbours(l));
                g.writeEndObject();
            }
            g.writeEndArray();
            g.writeObjectFieldStart("metrics");
            g.writeNumberField("average_energy", m.averageEnergy());
            g.writeNumberField("bit_energy", m.bitEnergy());
            g.writeNumberField("peak_energy", m.peakEnergy());
            g.writeNumberField("min_distance", m.minDistance());
            g.writeNumberField("min_distance_squared", m.minDistanceSquared());
            g.writeNumberField("average_neighbours", m.averageNeighbours());
            g.writeNumberField("power_efficiency", m.powerEfficiency());
            g.writeNumberField("snr_loss_vs_bpsk_db", m.snrLossVsBpskDb());
            g.writeNumberField("papr_db", m.paprDb());
            g.writeNumberField("gray_penalty", m.grayPenalty());
            g.writeNumberField("entropy_bits", m.entropy());
            g.writeObjectFieldStart("bandwidth_efficiency");
            g.writeNumberField("rectangular_first_null", m.bandwidthEfficiencyFirstNull());
            g.writeNumberField("raised_cosine_rolloff", rolloff);
            g.writeNumberField("raised_cosine", m.bandwidthEfficiency(rolloff));
            g.writeNumberField("nyquist", m.bandwidthEfficiencyNyquist());
            g.writeEndObject();
            g.writeEndObject();
            g.writeEndObject();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return w.toString() + "\n";
    }
}
