package dev.fixmod.verify.compare;

import dev.fixmod.verify.compare.CompareReport.ContextRow;
import dev.fixmod.verify.compare.CompareReport.Diagnosis;
import dev.fixmod.verify.compare.CompareReport.FieldDiff;
import dev.fixmod.verify.compare.CompareReport.FieldStats;
import dev.fixmod.verify.compare.CompareReport.FlagStats;
import dev.fixmod.verify.compare.CompareReport.Mismatch;
import java.util.List;
import java.util.Locale;

/** Renders comparison reports as text for a person reading a terminal or a CI log. */
public final class ReportText {
    private ReportText() {
    }

    /** The verdict line alone, as {@code --quiet} prints it. */
    public static String verdict(CompareReport r) {
        String what = r.port() == null ? r.dut() : "port " + r.port() + ": " + r.dut();
        if (r.agrees()) {
            return String.format(Locale.ROOT, "AGREE     %s: %d of %d vectors agree", what, r.agreed(), r.compared());
        }
        StringBuilder b = new StringBuilder(String.format(Locale.ROOT, "DISAGREE  %s: %d of %d vectors mismatch",
                what, r.mismatched(), r.compared()));
        if (r.missing() > 0) {
            b.append(", ").append(r.missing()).append(" missing");
        }
        if (!r.diagnoses().isEmpty()) {
            b.append(" (").append(r.diagnoses().get(0).kind()).append(" at vector ")
                    .append(r.diagnoses().get(0).index()).append(')');
        }
        return b.toString();
    }

    /** The whole report. */
    public static String render(CompareReport r) {
        StringBuilder b = new StringBuilder();
        b.append(verdict(r)).append('\n');
        b.append("  golden   ").append(r.golden()).append("  (").append(r.goldenWords()).append(" vectors")
                .append(r.stoppedAt() >= 0 ? " read before stopping" : "").append(", layout ").append(r.layout())
                .append(")\n");
        b.append("  dut      ").append(r.dut()).append('\n');
        CompareReport.Alignment al = r.alignment();
        b.append("  aligned  skip ").append(al.skipped()).append(", leading unknown ").append(al.leadingUnknown())
                .append(", latency ").append(al.latency());
        if (al.searched()) {
            b.append(" (searched 0..").append(al.window()).append(": ").append(al.prefixAgreed()).append(" of ")
                    .append(al.prefixCompared()).append(" prefix vectors agree)");
        }
        b.append('\n');
        b.append(String.format(Locale.ROOT, "  totals   %d compared, %d agree, %d mismatch (%d unknown, %d width),"
                        + " %d filtered out, %d missing, %d extra dump words%n", r.compared(), r.agreed(),
                r.mismatched(), r.unknownWords(), r.widthWords(), r.filteredOut(), r.missing(), r.extraWords()));
        if (r.stoppedAt() >= 0) {
            b.append("  stopped  at vector ").append(r.stoppedAt()).append(" after ").append(r.mismatched())
                    .append(" mismatches\n");
        }
        if (r.mismatched() > 0) {
            b.append("per field:\n");
            for (FieldStats f : r.fields()) {
                b.append(String.format(Locale.ROOT, "  %-12s %-8s %8d mismatch  %6d unknown  max |diff| %d LSB%s%n",
                        f.name(), f.format(), f.mismatches(), f.unknown(), f.maxAbsDiffLsb(),
                        f.firstIndex() >= 0 ? "  first at vector " + f.firstIndex() : ""));
            }
            if (!r.flags().isEmpty()) {
                b.append("per flag:\n");
                for (FlagStats f : r.flags()) {
                    b.append(String.format(Locale.ROOT, "  %-20s %8d compared %8d mismatch%n", f.flag(), f.compared(),
                            f.mismatched()));
                }
            }
            b.append("first mismatches (").append(r.mismatches().size()).append(" of ").append(r.mismatched())
                    .append("):\n");
            for (Mismatch m : r.mismatches()) {
                b.append(String.format(Locale.ROOT, "  vector %d  dut line %d  %s  expected %s  actual %s%s%n",
                        m.index(), m.dutLine(), m.kind(), m.expected(), m.actual(), flags(m.flags())));
                for (FieldDiff d : m.fields()) {
                    if (d.agrees()) {
                        continue;
                    }
                    b.append(String.format(Locale.ROOT, "      %-12s expected %d (%s)  actual %s  diff %s%n", d.name(),
                            d.expectedCode(), real(d.expectedValue()),
                            d.actualCode() == null ? "undefined" : d.actualCode() + " (" + real(d.actualValue()) + ")",
                            d.diffLsb() == null ? "-" : String.format(Locale.ROOT, "%+d LSB", d.diffLsb())));
                }
            }
        }
        if (!r.context().isEmpty()) {
            b.append("context around the first failure:\n");
            b.append("    vector  dut line  expected          actual\n");
            for (ContextRow c : r.context()) {
                b.append(String.format(Locale.ROOT, "  %s %6d  %8s  %-16s  %-16s %s%s%n", c.first() ? ">" : " ",
                        c.index(), c.dutLine() < 0 ? "-" : Long.toString(c.dutLine()), c.expected(), c.actual(),
                        c.agrees() ? "ok" : "MISMATCH", flags(c.flags())));
            }
        }
        if (!r.diagnoses().isEmpty()) {
            b.append("diagnosis:\n");
            for (Diagnosis d : r.diagnoses()) {
                b.append("  ").append(d.kind()).append(": ").append(d.message()).append('\n');
            }
        }
        return b.toString();
    }

    private static String flags(List<String> flags) {
        return flags.isEmpty() ? "" : "  [" + String.join(", ", flags) + "]";
    }

    private static String real(Double v) {
        return new java.math.BigDecimal(v).stripTrailingZeros().toPlainString();
    }
}
