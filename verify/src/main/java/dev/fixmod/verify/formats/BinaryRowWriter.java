package dev.fixmod.verify.formats;

import java.io.IOException;
import java.io.OutputStream;

/**
 * Raw little-endian binary, no header: either every field as the layout's {@link StorageType} (row-major), or the
 * packed word as the narrowest unsigned 8/16/32/64-bit integer. Also the payload of the .npy writer.
 */
class BinaryRowWriter extends BaseRowWriter {

    private final boolean packed;
    private final int bytes;

    BinaryRowWriter(TableSpec table, OutputStream out, boolean packed) {
        super(table, out);
        this.packed = packed;
        this.bytes = packed ? StorageType.forWord(layout.wordWidth()).bytes() : layout.storage().bytes();
    }

    @Override
    final void row(long index, long flags, long[] codes, int offset) throws IOException {
        if (packed) {
            sink.littleEndian(layout.packChecked(codes, offset), bytes);
        } else {
            for (int i = 0; i < layout.fieldCount(); i++) {
                sink.littleEndian(codes[offset + i], bytes);
            }
        }
    }
}
