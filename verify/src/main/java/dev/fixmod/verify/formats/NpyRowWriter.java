package dev.fixmod.verify.formats;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;

/**
 * NumPy .npy format version 1.0: magic {@code \x93NUMPY}, bytes 1 and 0, a little-endian uint16 header length,
 * then an ASCII Python dict literal padded with spaces and ended by a newline so that the data starts at a multiple
 * of 64 bytes, then the C-order data (the same bytes as {@link FileFormat#BINARY}).
 */
final class NpyRowWriter extends BinaryRowWriter {

    static final int ALIGNMENT = 64;
    private static final int PREAMBLE = 10; // magic (6) + version (2) + header length (2)

    NpyRowWriter(TableSpec table, OutputStream out) throws IOException {
        super(table, out, false);
        sink.bytes(header(table));
    }

    static byte[] header(TableSpec table) {
        String dict = "{'descr': '" + table.layout().storage().npyDescr() + "', 'fortran_order': False, 'shape': ("
                + table.rows() + ", " + table.layout().fieldCount() + "), }";
        int unpadded = PREAMBLE + dict.length() + 1;
        int padding = (ALIGNMENT - unpadded % ALIGNMENT) % ALIGNMENT;
        int headerLength = dict.length() + padding + 1;
        byte[] out = new byte[PREAMBLE + headerLength];
        out[0] = (byte) 0x93;
        System.arraycopy("NUMPY".getBytes(StandardCharsets.US_ASCII), 0, out, 1, 5);
        out[6] = 1;
        out[7] = 0;
        out[8] = (byte) headerLength;
        out[9] = (byte) (headerLength >>> 8);
        byte[] text = dict.getBytes(StandardCharsets.US_ASCII);
        System.arraycopy(text, 0, out, PREAMBLE, text.length);
        for (int i = PREAMBLE + text.length; i < out.length - 1; i++) {
            out[i] = ' ';
        }
        out[out.length - 1] = '\n';
        return out;
    }
}
