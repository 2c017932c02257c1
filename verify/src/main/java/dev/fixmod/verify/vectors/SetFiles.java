package dev.fixmod.verify.vectors;

import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.fixmod.fixed.QFormat;
import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.math.BigDecimal;
import java.math.BigInteger;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.DigestOutputStream;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.Locale;

/**
 * The data files of one set: for each port and each requested format one file {@code <port>.<ext>}, fed chunk by
 * chunk; plus the mapper ROM and slicer thresholds exports. Each file's SHA-256 is computed while it is written.
 */
final class SetFiles {
    private final VectorSpec spec;
    private final Datapath datapath;
    private final Path dir;
    private final List<PortFile> files = new ArrayList<>();
    private final List<ObjectNode> extra = new ArrayList<>();

    SetFiles(VectorSpec spec, Datapath datapath, Path dir, long mapperCount, long demapperCount) throws IOException {
        this.spec = spec;
        this.datapath = datapath;
        this.dir = dir;
        int k = datapath.bitsPerSymbol();
        for (Port port : Port.values()) {
            Layout layout = layout(port, k);
            long count = port.mapperGroup() ? mapperCount : demapperCount;
            for (OutputFormat format : OutputFormat.values()) {
                if (spec.writes(format)) {
                    files.add(open(port, format, layout, count));
                }
            }
        }
    }

    Layout layout(Port port, int k) {
        return switch (port) {
            case BITS, HARD -> Layout.label(k);
            case MAPPER_OUT -> Layout.of(spec.mapper().format(), "i", "q");
            case DEMAPPER_IN -> Layout.of(spec.demapper().input().format(), "i", "q");
            case LLR -> {
                String[] names = new String[k];
                for (int b = 0; b < k; b++) {
                    names[b] = "llr" + b;
                }
                yield Layout.of(spec.demapper().llr().format(), names);
            }
        };
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

    private PortFile open(Port port, OutputFormat format, Layout layout, long count) throws IOException {
        String name = port.tradeName() + "." + format.extension();
        return switch (format) {
            case HEX -> new HexFile(dir, name, port, layout, count);
            case BIN -> new BinFile(dir, name, port, layout, count, null);
            case NPY -> new BinFile(dir, name, port, layout, count, npyHeader(layout, count));
            case CSV -> new CsvFile(dir, name, port, layout, count, spec, datapath.bitsPerSymbol());
            case C -> new CFile(dir, name, port, layout, count, spec.name());
        };
    }

    void write(Batch b) throws IOException {
        for (PortFile f : files) {
            if (f.port.mapperGroup() == b.mapperGroup) {
                f.write(b);
            }
        }
    }

    /** Closes every file and writes the ROM exports; returns the manifest entries in file order. */
    List<ObjectNode> finish() throws IOException {
        List<ObjectNode> entries = new ArrayList<>();
        for (PortFile f : files) {
            entries.add(f.finish());
        }
        RomExport.write(spec, datapath, dir, entries);
        entries.addAll(extra);
        return entries;
    }

    static void writeText(Path file, String text) throws IOException {
        Files.writeString(file, text, StandardCharsets.UTF_8);
    }

    static MessageDigest sha256() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("the JDK always provides SHA-256", e);
        }
    }

    /** A manifest file entry. */
    static ObjectNode entry(String name, String port, String format, long count, byte[] digest, ObjectNode layout) {
        ObjectNode e = JsonNodeFactory.instance.objectNode();
        e.put("name", name);
        e.put("port", port);
        e.put("format", format);
        e.put("count", count);
        e.put("sha256", HexFormat.of().formatHex(digest));
        if (layout != null) {
            e.set("layout", layout);
        }
        return e;
    }

    /** NumPy format version 1.0 header: magic, version, little-endian header length, dict padded to 64 bytes. */
    static byte[] npyHeader(Layout layout, long count) {
        String dict = "{'descr': '" + layout.npyType() + "', 'fortran_order': False, 'shape': (" + count + ", "
                + layout.fields().size() + "), }";
        int unpadded = 10 + dict.length() + 1;
        int total = (unpadded + 63) / 64 * 64;
        StringBuilder sb = new StringBuilder(dict);
        while (10 + sb.length() + 1 < total) {
            sb.append(' ');
        }
        sb.append('\n');
        byte[] h = sb.toString().getBytes(StandardCharsets.US_ASCII);
        byte[] out = new byte[10 + h.length];
        out[0] = (byte) 0x93;
        System.arraycopy("NUMPY".getBytes(StandardCharsets.US_ASCII), 0, out, 1, 5);
        out[6] = 1;
        out[7] = 0;
        out[8] = (byte) h.length;
        out[9] = (byte) (h.length >>> 8);
        System.arraycopy(h, 0, out, 10, h.length);
        return out;
    }

    /** One open data file. */
    abstract static class PortFile {
        final String name;
        final Port port;
        final Layout layout;
        final long count;
        final MessageDigest digest = sha256();
        final OutputStream out;
        final String formatName;

        PortFile(Path dir, String name, Port port, Layout layout, long count, String formatName) throws IOException {
            this.name = name;
            this.port = port;
            this.layout = layout;
            this.count = count;
            this.formatName = formatName;
            this.out = new BufferedOutputStream(new DigestOutputStream(Files.newOutputStream(dir.resolve(name)),
                    digest), 1 << 16);
        }

        abstract void write(Batch b) throws IOException;

        void beforeClose() throws IOException {
        }

        ObjectNode finish() throws IOException {
            beforeClose();
            out.close();
            return entry(name, port.tradeName(), formatName, count, digest.digest(), layout.toJson());
        }

        void ascii(String s) throws IOException {
            out.write(s.getBytes(StandardCharsets.US_ASCII));
        }
    }

    /** Hex text: one fixed-width word per line, lowercase, two's complement fields packed first-field-high. */
    static final class HexFile extends PortFile {
        private final byte[] line;

        HexFile(Path dir, String name, Port port, Layout layout, long count) throws IOException {
            super(dir, name, port, layout, count, "hex");
            line = new byte[layout.hexDigits() + 1];
            line[line.length - 1] = '\n';
        }

        @Override
        void write(Batch b) throws IOException {
            int fields = layout.fields().size();
            int w = layout.width();
            long mask = (1L << w) - 1;
            int digits = layout.hexDigits();
            for (int j = 0; j < b.size; j++) {
                // Nibbles from the least significant end: the last field is the lowest.
                long acc = 0;
                int accBits = 0;
                int pos = digits - 1;
                for (int f = fields - 1; f >= 0; f--) {
                    acc |= (value(port, b, j, f) & mask) << accBits;
                    accBits += w;
                    while (accBits >= 4) {
                        line[pos--] = (byte) Character.forDigit((int) (acc & 0xF), 16);
                        acc >>>= 4;
                        accBits -= 4;
                    }
                }
                if (accBits > 0) {
                    line[pos--] = (byte) Character.forDigit((int) (acc & 0xF), 16);
                }
                while (pos >= 0) {
                    line[pos--] = '0';
                }
                out.write(line);
            }
        }
    }

    /** Raw little-endian integers, one per field in field order; with a header for NumPy .npy. */
    static final class BinFile extends PortFile {
        private final byte[] row;

        BinFile(Path dir, String name, Port port, Layout layout, long count, byte[] npyHeader) throws IOException {
            super(dir, name, port, layout, count, npyHeader == null ? "bin" : "npy");
            row = new byte[layout.fields().size() * layout.containerBytes()];
            if (npyHeader != null) {
                out.write(npyHeader);
            }
        }

        @Override
        void write(Batch b) throws IOException {
            int c = layout.containerBytes();
            int fields = layout.fields().size();
            for (int j = 0; j < b.size; j++) {
                for (int f = 0; f < fields; f++) {
                    long v = value(port, b, j, f);
                    for (int i = 0; i < c; i++) {
                        row[f * c + i] = (byte) (v >>> (8 * i));
                    }
                }
                out.write(row);
            }
        }
    }

    /** CSV with a header: index, flags, the integer codes and their real values, plus per port extras. */
    static final class CsvFile extends PortFile {
        private final VectorSpec spec;
        private final int k;
        private final StringBuilder sb = new StringBuilder(256);

        CsvFile(Path dir, String name, Port port, Layout layout, long count, VectorSpec spec, int k) throws IOException {
            super(dir, name, port, layout, count, "csv");
            this.spec = spec;
            this.k = k;
            ascii(header() + "\n");
        }

        private String header() {
            StringBuilder h = new StringBuilder("index,flags");
            switch (port) {
                case BITS -> h.append(",label,bits");
                case MAPPER_OUT -> h.append(",label,i,q,i_value,q_value");
                case DEMAPPER_IN -> h.append(",level,es_n0_db,sent_label,i,q,i_value,q_value,channel_i,channel_q");
                case HARD -> h.append(",label");
                case LLR -> {
                    for (int b = 0; b < k; b++) {
                        h.append(",llr").append(b);
                    }
                    for (int b = 0; b < k; b++) {
                        h.append(",llr").append(b).append("_value");
                    }
                    for (int b = 0; b < k; b++) {
                        h.append(",reference").append(b);
                    }
                }
            }
            return h.toString();
        }

        @Override
        void write(Batch b) throws IOException {
            for (int j = 0; j < b.size; j++) {
                sb.setLength(0);
                sb.append(b.first + j).append(',').append(b.flags[j]);
                switch (port) {
                    case BITS -> {
                        sb.append(',').append(b.label[j]).append(',');
                        for (int bit = k - 1; bit >= 0; bit--) {
                            sb.append((b.label[j] >>> bit) & 1);
                        }
                    }
                    case MAPPER_OUT -> {
                        QFormat f = spec.mapper().format();
                        sb.append(',').append(b.label[j]).append(',').append(b.mapI[j]).append(',').append(b.mapQ[j]);
                        sb.append(',').append(exact(b.mapI[j], f)).append(',').append(exact(b.mapQ[j], f));
                    }
                    case DEMAPPER_IN -> {
                        QFormat f = spec.demapper().input().format();
                        int level = b.level[j];
                        sb.append(',').append(level).append(',');
                        if (level >= 0) {
                            sb.append(fixed9(spec.noise().esN0Db(level, k)));
                        }
                        sb.append(',').append(b.label[j]).append(',').append(b.inI[j]).append(',').append(b.inQ[j]);
                        sb.append(',').append(exact(b.inI[j], f)).append(',').append(exact(b.inQ[j], f));
                        sb.append(',').append(fixed9(b.chanI[j])).append(',').append(fixed9(b.chanQ[j]));
                    }
                    case HARD -> sb.append(',').append(b.hard[j]);
                    case LLR -> {
                        QFormat f = spec.demapper().llr().format();
                        for (int bit = 0; bit < k; bit++) {
                            sb.append(',').append(b.llr[j * k + bit]);
                        }
                        for (int bit = 0; bit < k; bit++) {
                            sb.append(',').append(exact(b.llr[j * k + bit], f));
                        }
                        for (int bit = 0; bit < k; bit++) {
                            sb.append(',').append(fixed9(b.ref[j * k + bit]));
                        }
                    }
                }
                sb.append('\n');
                ascii(sb.toString());
            }
        }
    }

    private static final BigInteger FIVE = BigInteger.valueOf(5);

    /** The exact decimal value of {@code code · 2^-n}: n fractional digits at most, trailing zeros removed. */
    static String exact(long code, QFormat f) {
        int n = f.fractionalBits();
        if (n == 0) {
            return Long.toString(code);
        }
        BigDecimal v = new BigDecimal(BigInteger.valueOf(code).multiply(FIVE.pow(n)), n);
        String s = v.stripTrailingZeros().toPlainString();
        return s.equals("0.0") ? "0" : s;
    }

    /**
     * A real value with 9 decimals, rounded half-even from the double's exact value: the same text on every JVM
     * (unlike {@link Double#toString}, whose digits changed between JDK releases).
     */
    static String fixed9(double x) {
        if (!Double.isFinite(x)) {
            return x > 0 ? "inf" : x < 0 ? "-inf" : "nan";
        }
        return new BigDecimal(x).setScale(9, java.math.RoundingMode.HALF_EVEN).toPlainString();
    }

    /** A C header: the port's values as a {@code <stdint.h>} array and the flags of each vector. */
    static final class CFile extends PortFile {
        private final Path flagsTemp;
        private final OutputStream flagsOut;
        private final String id;
        private long written;

        CFile(Path dir, String name, Port port, Layout layout, long count, String setName) throws IOException {
            super(dir, name, port, layout, count, "c");
            id = cIdentifier(setName + "_" + port.tradeName());
            flagsTemp = dir.resolve("." + name + ".flags");
            flagsOut = new BufferedOutputStream(Files.newOutputStream(flagsTemp), 1 << 16);
            String guard = id.toUpperCase(Locale.ROOT) + "_H";
            int fields = layout.fields().size();
            StringBuilder h = new StringBuilder();
            h.append("/* Generated by fixmod: golden vectors of set '").append(setName).append("', port '")
                    .append(port.tradeName()).append("'.\n");
            h.append(" * ").append(id).append("[n][f] is field f of vector n; fields:");
            for (Layout.Field f : layout.fields()) {
                h.append(' ').append(f.name());
            }
            Layout.Field f0 = layout.fields().get(0);
            h.append(".\n * Each field: ").append(f0.format() == null ? f0.bits() + "-bit unsigned label, b0 = MSB"
                    : f0.format().describe()).append(".\n */\n");
            h.append("#ifndef ").append(guard).append("\n#define ").append(guard).append("\n\n#include <stdint.h>\n\n");
            h.append("#define ").append(id.toUpperCase(Locale.ROOT)).append("_COUNT ").append(count).append("u\n");
            h.append("#define ").append(id.toUpperCase(Locale.ROOT)).append("_FIELDS ").append(fields).append("u\n\n");
            // A C array cannot be empty; an empty port gets one unused zero row (COUNT stays 0).
            h.append("static const ").append(layout.cType()).append(' ').append(id).append('[')
                    .append(Math.max(1, count)).append("][").append(fields).append("] = {\n");
            ascii(h.toString());
        }

        @Override
        void write(Batch b) throws IOException {
            int fields = layout.fields().size();
            StringBuilder sb = new StringBuilder(64);
            for (int j = 0; j < b.size; j++) {
                sb.setLength(0);
                sb.append("  {");
                for (int f = 0; f < fields; f++) {
                    if (f > 0) {
                        sb.append(", ");
                    }
                    long v = value(port, b, j, f);
                    sb.append(cLiteral(v, layout));
                }
                sb.append("},\n");
                ascii(sb.toString());
                flagsOut.write(("  " + b.flags[j] + "u,\n").getBytes(StandardCharsets.US_ASCII));
                written++;
            }
        }

        @Override
        void beforeClose() throws IOException {
            if (written == 0) {
                StringBuilder z = new StringBuilder("  {");
                for (int f = 0; f < layout.fields().size(); f++) {
                    z.append(f > 0 ? ", 0" : "0");
                }
                ascii(z + "},\n");
                flagsOut.write("  0u,\n".getBytes(StandardCharsets.US_ASCII));
            }
            flagsOut.close();
            ascii("};\n\n/* Corner-case flags of each vector (bit numbers as in the manifest's glossary). */\n");
            ascii("static const uint32_t " + id + "_flags[" + Math.max(1, count) + "] = {\n");
            try (var in = Files.newInputStream(flagsTemp)) {
                in.transferTo(out);
            }
            Files.delete(flagsTemp);
            ascii("};\n\n#endif\n");
        }
    }

    /** A C literal of a field value; the most negative value of a signed type is written as an expression. */
    static String cLiteral(long v, Layout layout) {
        int bits = layout.containerBytes() * 8;
        if (layout.signed() && v == -(1L << (bits - 1))) {
            return "(" + (v + 1) + " - 1)";
        }
        return Long.toString(v);
    }

    /** A valid C/VHDL identifier from a set name: letters, digits and single underscores, no trailing underscore. */
    static String cIdentifier(String name) {
        String s = name.replaceAll("[^A-Za-z0-9]+", "_").replaceAll("_+$", "");
        return s.toLowerCase(Locale.ROOT);
    }
}
