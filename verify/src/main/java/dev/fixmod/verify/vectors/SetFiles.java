package dev.fixmod.verify.vectors;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.verify.formats.Field;
import dev.fixmod.verify.formats.FieldLayout;
import dev.fixmod.verify.formats.FileFormat;
import dev.fixmod.verify.formats.OutputSet;
import dev.fixmod.verify.formats.RowWriter;
import dev.fixmod.verify.formats.TableSpec;
import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;

/**
 * The data files of one set, written through the formats package: for each port and each requested format one file,
 * fed chunk by chunk; with CSV also {@code reference.csv}, the real-valued side of the demapper group (channel
 * samples before quantization, float reference LLRs), which no integer table holds.
 */
final class SetFiles {
    /** The real-valued companion of the demapper group (written with CSV). */
    static final String REFERENCE_FILE = "reference.csv";

    private final VectorSpec spec;
    private final OutputSet set;
    private final int k;
    private final List<PortFile> files = new ArrayList<>();
    private final ReferenceFile reference;

    private record PortFile(String name, Port port, FileFormat format, TableSpec table, RowWriter writer,
            long[] codes) {
    }

    SetFiles(VectorSpec spec, int bitsPerSymbol, OutputSet set, long mapperCount, long demapperCount)
            throws IOException {
        this.spec = spec;
        this.set = set;
        this.k = bitsPerSymbol;
        List<String> flags = Arrays.stream(CornerFlag.values()).map(CornerFlag::tradeName).toList();
        for (Port port : Port.values()) {
            FieldLayout layout = layout(spec, port, k);
            long rows = port.mapperGroup() ? mapperCount : demapperCount;
            TableSpec table = new TableSpec(tableName(spec.name(), port.tradeName()), layout, rows, flags,
                    List.of("fixmod golden vectors: set " + spec.name() + ", port " + port.tradeName() + " ("
                            + (port.stimulus() ? "stimulus" : "expected") + ")"));
            for (FileFormat format : FileFormat.values()) {
                if (!spec.writes(format) || (format == FileFormat.C_HEADER && rows == 0)) {
                    continue; // ISO C has no empty arrays: an empty port has no C header
                }
                String name = fileName(port.tradeName(), format);
                files.add(new PortFile(name, port, format, table, format.open(table, set.newFile(name)),
                        new long[layout.fieldCount()]));
            }
        }
        reference = spec.writes(FileFormat.CSV) ? new ReferenceFile(set.newFile(REFERENCE_FILE), k) : null;
    }

    /** {@code llr.hex}, {@code llr-commented.hex}, {@code llr.bin}, {@code llr-packed.bin}, {@code llr.h}, ... */
    static String fileName(String stem, FileFormat format) {
        return switch (format) {
            case HEX_COMMENTED -> stem + "-commented." + format.extension();
            case PACKED_BINARY -> stem + "-packed." + format.extension();
            default -> stem + "." + format.extension();
        };
    }

    /** The C array name of a table: the set name and the part, non-alphanumerics as {@code _}. */
    static String tableName(String setName, String part) {
        return (setName + "_" + part).replaceAll("[^A-Za-z0-9]+", "_").toLowerCase(Locale.ROOT);
    }

    static FieldLayout layout(VectorSpec spec, Port port, int k) {
        return switch (port) {
            case BITS, HARD -> FieldLayout.of(new Field("label", QFormat.unsigned(k, 0)));
            case MAPPER_OUT -> iq(spec.mapper().format());
            case DEMAPPER_IN -> iq(spec.demapper().input().format());
            case LLR -> {
                List<Field> fields = new ArrayList<>();
                for (int b = 0; b < k; b++) {
                    fields.add(new Field("llr" + b, spec.demapper().llr().format()));
                }
                yield FieldLayout.of(fields);
            }
        };
    }

    static FieldLayout iq(QFormat format) {
        return FieldLayout.of(new Field("I", format), new Field("Q", format));
    }

    /** Field {@code f} of vector {@code j} of the batch, for {@code port}. */
    static long value(Port port, Batch b, int j, int f) {
        return switch (port) {
            case BITS -> b.label[j];
            case MAPPER_OUT -> f == 0 ? b.mapI[j] : b.mapQ[j];
            case DEMAPPER_IN -> f == 0 ? b.inI[j] : b.inQ[j];
            case HARD -> b.hard[j];
            case LLR -> b.llr[j * b.bitsPerSymbol + f];
        };
    }

    void write(Batch b) throws IOException {
        for (PortFile f : files) {
            if (f.port().mapperGroup() != b.mapperGroup) {
                continue;
            }
            long[] codes = f.codes();
            for (int j = 0; j < b.size; j++) {
                for (int field = 0; field < codes.length; field++) {
                    codes[field] = value(f.port(), b, j, field);
                }
                f.writer().write(b.first + j, b.flags[j], codes, 0);
            }
        }
        if (reference != null && !b.mapperGroup) {
            reference.write(b, spec);
        }
    }

    /** Closes every file; returns the manifest entries in file order. */
    List<ObjectNode> finish() throws IOException {
        List<ObjectNode> entries = new ArrayList<>();
        for (PortFile f : files) {
            f.writer().close();
            entries.add(entry(f.name(), f.port().tradeName(), f.format().label(), f.table().rows(),
                    set.sha256(f.name()), layoutJson(f.table())));
        }
        if (reference != null) {
            reference.close();
            entries.add(entry(REFERENCE_FILE, "demapper-reference", "csv", reference.rows, set.sha256(REFERENCE_FILE),
                    null));
        }
        return entries;
    }

    /** A manifest file entry. */
    static ObjectNode entry(String name, String port, String format, long count, String sha256, ObjectNode layout) {
        ObjectNode e = JsonNodeFactory.instance.objectNode();
        e.put("name", name);
        e.put("port", port);
        e.put("format", format);
        e.put("count", count);
        e.put("sha256", sha256);
        if (layout != null) {
            e.set("layout", layout);
        }
        return e;
    }

    /** The manifest's description of a table's fields: names, widths, signedness, Q formats, packing order. */
    static ObjectNode layoutJson(TableSpec table) {
        FieldLayout layout = table.layout();
        ObjectNode o = JsonNodeFactory.instance.objectNode();
        o.put("table", table.name());
        o.put("word-bits", layout.wordWidth());
        o.put("hex-digits", layout.hexDigits());
        o.put("packing", "first field in the most significant bits of the word");
        o.put("storage", layout.storage().cName());
        ArrayNode arr = o.putArray("fields");
        for (int i = 0; i < layout.fieldCount(); i++) {
            Field f = layout.field(i);
            ObjectNode e = arr.addObject();
            e.put("name", f.name());
            e.put("bits", f.width());
            e.put("signed", f.signed());
            e.put("word-msb", layout.shift(i) + f.width() - 1);
            e.put("word-lsb", layout.shift(i));
            e.put("format", f.format().toString());
            e.put("meaning", f.format().describe());
        }
        return o;
    }

    /**
     * {@code reference.csv}: per demapper vector its index and flags (as in the port CSVs), noise level, E_s/N0,
     * the label sent (−1 for constructed inputs), the channel sample before quantization and the float reference
     * LLRs, real numbers with 9 decimals rounded half-even from the double's exact value (the same text on every
     * JVM, unlike {@link Double#toString}).
     */
    static final class ReferenceFile {
        private final OutputStream out;
        private final int k;
        private final StringBuilder sb = new StringBuilder(256);
        long rows;

        ReferenceFile(OutputStream raw, int k) throws IOException {
            this.out = new BufferedOutputStream(raw, 1 << 16);
            this.k = k;
            StringBuilder h = new StringBuilder("index,flags,level,es_n0_db,sent_label,channel_I,channel_Q");
            for (int b = 0; b < k; b++) {
                h.append(",reference").append(b);
            }
            out.write((h + "\n").getBytes(StandardCharsets.US_ASCII));
        }

        void write(Batch b, VectorSpec spec) throws IOException {
            for (int j = 0; j < b.size; j++) {
                sb.setLength(0);
                sb.append(b.first + j).append(',');
                boolean first = true;
                for (CornerFlag f : CornerFlag.values()) {
                    if ((b.flags[j] & f.mask()) != 0) {
                        sb.append(first ? "" : "|").append(f.tradeName());
                        first = false;
                    }
                }
                int level = b.level[j];
                sb.append(',').append(level).append(',');
                if (level >= 0) {
                    sb.append(fixed9(spec.noise().esN0Db(level, k)));
                }
                sb.append(',').append(b.label[j]);
                sb.append(',').append(fixed9(b.chanI[j])).append(',').append(fixed9(b.chanQ[j]));
                for (int bit = 0; bit < k; bit++) {
                    sb.append(',').append(fixed9(b.ref[j * k + bit]));
                }
                sb.append('\n');
                out.write(sb.toString().getBytes(StandardCharsets.US_ASCII));
                rows++;
            }
        }

        void close() throws IOException {
            out.close();
        }
    }

    private static final long NANO = 1_000_000_000L;

    /**
     * A real value with 9 decimals, rounded half-even from the double's exact value; {@code -0} prints as
     * {@code 0.000000000}. Exact 128-bit integer arithmetic (BigDecimal's {@code setScale(9, HALF_EVEN)} is the
     * oracle, and the fallback outside the fast range).
     *
     * <table class="striped">
     *   <caption>Examples</caption>
     *   <tbody>
     *     <tr><td>0.1</td><td>0.100000000</td></tr>
     *     <tr><td>−2.5e−10</td><td>0.000000000 (tie to even)</td></tr>
     *     <tr><td>1.5e−9</td><td>0.000000002 (the double lies just above 1.5e−9)</td></tr>
     *     <tr><td>−7.25</td><td>−7.250000000</td></tr>
     *   </tbody>
     * </table>
     */
    static String fixed9(double x) {
        if (!Double.isFinite(x)) {
            return x > 0 ? "inf" : x < 0 ? "-inf" : "nan";
        }
        long bits = Double.doubleToRawLongBits(x);
        boolean negative = bits < 0;
        int exponent = (int) ((bits >>> 52) & 0x7FF);
        long mantissa = bits & ((1L << 52) - 1);
        if (exponent == 0) {
            exponent = 1;
        } else {
            mantissa |= 1L << 52;
        }
        int shift = 1075 - exponent; // |x| = mantissa · 2^-shift
        if (shift <= 0 || Math.abs(x) >= NANO) {
            return slowFixed9(x);
        }
        long q;
        if (mantissa == 0 || shift > 90) {
            q = 0; // |x|·10^9 < 2^83 · 2^-91 < 1/2
        } else {
            long lo = mantissa * NANO;
            long hi = Math.multiplyHigh(mantissa, NANO);
            int cmp;
            if (shift < 64) {
                q = (hi << (64 - shift)) | (lo >>> shift);
                long rem = lo & ((1L << shift) - 1);
                cmp = Long.compareUnsigned(rem, 1L << (shift - 1));
            } else if (shift == 64) {
                q = hi;
                cmp = Long.compareUnsigned(lo, 1L << 63);
            } else {
                q = hi >>> (shift - 64);
                long remHi = hi & ((1L << (shift - 64)) - 1);
                long halfHi = 1L << (shift - 65);
                cmp = remHi != halfHi ? Long.compare(remHi, halfHi) : (lo == 0 ? 0 : 1);
            }
            if (cmp > 0 || (cmp == 0 && (q & 1) == 1)) {
                q++;
            }
        }
        StringBuilder sb = new StringBuilder(24);
        if (negative && q != 0) {
            sb.append('-');
        }
        String frac = Long.toString(q % NANO);
        sb.append(q / NANO).append('.');
        for (int i = frac.length(); i < 9; i++) {
            sb.append('0');
        }
        return sb.append(frac).toString();
    }

    static String slowFixed9(double x) {
        String s = new BigDecimal(x).setScale(9, RoundingMode.HALF_EVEN).toPlainString();
        return s.equals("-0.000000000") ? "0.000000000" : s;
    }
}
