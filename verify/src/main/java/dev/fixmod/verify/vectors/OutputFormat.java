package dev.fixmod.verify.vectors;

/** The file formats a set is written in (key {@code formats}); all by default. */
public enum OutputFormat implements TradeNamed {
    /** One fixed-width hex word per line, fields packed, for {@code $readmemh} and VHDL {@code hread}. */
    HEX("hex", "hex"),
    /** CSV with a header: index, flags, integer codes, real values. */
    CSV("csv", "csv"),
    /** Raw little-endian binary, one integer per field. */
    BIN("bin", "bin"),
    /** A C header with {@code <stdint.h>} arrays. */
    C("c", "h"),
    /** NumPy {@code .npy}, format version 1.0. */
    NPY("npy", "npy");

    private final String tradeName;
    private final String extension;

    OutputFormat(String tradeName, String extension) {
        this.tradeName = tradeName;
        this.extension = extension;
    }

    @Override
    public String tradeName() {
        return tradeName;
    }

    /** The file name extension, without the dot. */
    public String extension() {
        return extension;
    }
}
