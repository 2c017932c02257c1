package dev.fixmod.verify.formats;

import java.io.IOException;
import java.io.OutputStream;
import java.util.Locale;

/**
 * The file formats a {@link TableSpec} can be written in. Every format is deterministic byte for byte: ASCII
 * formats use LF line ends and no locale; numbers are formatted by our own code, never by {@code Double.toString}.
 *
 * <table class="striped">
 *   <caption>Formats (example: fields I:Q3.8, Q:Q3.8; a row with I = −1, Q = 384)</caption>
 *   <thead><tr><th>constant</th><th>name</th><th>content</th><th>row bytes / text</th></tr></thead>
 *   <tbody>
 *     <tr><td>{@link #HEX}</td><td>{@code hex}</td><td>one packed word per line, ceil(W/4) lowercase hex digits,
 *         no header: read by Verilog {@code $readmemh} and VHDL {@code hread}</td><td>{@code fff180}</td></tr>
 *     <tr><td>{@link #HEX_COMMENTED}</td><td>{@code hex-commented}</td><td>the same after {@code //} comment
 *         lines ($readmemh skips them; VHDL {@code hread} fails on them)</td><td>{@code fff180}</td></tr>
 *     <tr><td>{@link #CSV}</td><td>{@code csv}</td><td>header {@code index,flags,I,Q,I_value,Q_value}; flags as
 *         names joined by {@code |}; values exact</td><td>{@code 7,tie,-1,384,-0.00390625,1.5}</td></tr>
 *     <tr><td>{@link #BINARY}</td><td>{@code binary}</td><td>each field as the layout's {@link StorageType},
 *         little-endian, row-major, no header</td><td>{@code ff ff 80 01}</td></tr>
 *     <tr><td>{@link #PACKED_BINARY}</td><td>{@code packed-binary}</td><td>the packed word as the narrowest
 *         unsigned 8/16/32/64-bit integer, little-endian</td><td>{@code 80 f1 ff 00}</td></tr>
 *     <tr><td>{@link #C_HEADER}</td><td>{@code c-header}</td><td>{@code static const int16_t name[ROWS][FIELDS]}
 *         with include guards and a comment naming the fields</td><td>{@code {-1, 384},}</td></tr>
 *     <tr><td>{@link #NPY}</td><td>{@code npy}</td><td>NumPy .npy 1.0, shape (rows, fields), dtype of the
 *         {@link StorageType}; data bytes identical to {@link #BINARY}</td><td>{@code ff ff 80 01}</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>CSV values: the exact decimal of {@code code · 2^−n}, shortest form: no exponent, no trailing zeros, no
 * decimal point for integers, {@code 0} never signed (e.g. {@code -0.75}, {@code 1}, {@code 0.000030517578125}).
 */
public enum FileFormat {
    HEX("hex", "hex"),
    HEX_COMMENTED("hex-commented", "hex"),
    CSV("csv", "csv"),
    BINARY("binary", "bin"),
    PACKED_BINARY("packed-binary", "bin"),
    C_HEADER("c-header", "h"),
    NPY("npy", "npy");

    private final String label;
    private final String extension;

    FileFormat(String label, String extension) {
        this.label = label;
        this.extension = extension;
    }

    /** The name used in specifications, e.g. {@code hex-commented}. */
    public String label() {
        return label;
    }

    /** The usual file name extension, without the dot. */
    public String extension() {
        return extension;
    }

    public static FileFormat fromName(String name) {
        if (name != null) {
            String wanted = name.trim().toLowerCase(Locale.ROOT);
            for (FileFormat f : values()) {
                if (f.label.equals(wanted)) {
                    return f;
                }
            }
        }
        StringBuilder accepted = new StringBuilder();
        for (FileFormat f : values()) {
            accepted.append(accepted.length() == 0 ? "" : ", ").append(f.label);
        }
        throw new IllegalArgumentException("unknown file format '" + name + "'; expected one of " + accepted);
    }

    /**
     * A writer of {@code table} in this format onto {@code out}; the writer owns the stream and closes it.
     *
     * @throws IllegalArgumentException if the format cannot hold the table (a C header needs at least one row)
     */
    public RowWriter open(TableSpec table, OutputStream out) throws IOException {
        try {
            return create(table, out);
        } catch (IOException | RuntimeException e) {
            out.close();
            throw e;
        }
    }

    private RowWriter create(TableSpec table, OutputStream out) throws IOException {
        return switch (this) {
            case HEX -> new HexRowWriter(table, out, false);
            case HEX_COMMENTED -> new HexRowWriter(table, out, true);
            case CSV -> new CsvRowWriter(table, out);
            case BINARY -> new BinaryRowWriter(table, out, false);
            case PACKED_BINARY -> new BinaryRowWriter(table, out, true);
            case C_HEADER -> new CHeaderRowWriter(table, out);
            case NPY -> new NpyRowWriter(table, out);
        };
    }

    @Override
    public String toString() {
        return label;
    }
}
