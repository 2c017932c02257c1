package dev.fixmod.verify.compare;

import java.io.IOException;
import java.io.InputStream;

/**
 * Reads raw little-endian words of a fixed size (1, 2, 4 or 8 bytes), as a board or a C testbench writes them with
 * {@code fwrite}. The packed word sits in the low bits of each container; the bits above it must be zero or copies of
 * the word's top bit (sign extension), otherwise the word is a {@link WordStatus#WIDTH} mismatch. A file whose length
 * is not a multiple of the container size is a {@link DumpFormatException}. {@link #line()} is the 1-based word number.
 */
public final class BinaryWordReader extends WordReader {
    private final InputStream in;
    private final int bytesPerWord;
    private final int wordBits;
    private final byte[] buffer = new byte[1 << 16];
    private int position;
    private int limit;
    private long count;

    public BinaryWordReader(InputStream in, String source, int wordBits, int bytesPerWord) {
        super(source);
        if (bytesPerWord != 1 && bytesPerWord != 2 && bytesPerWord != 4 && bytesPerWord != 8) {
            throw new IllegalArgumentException("bytes per word must be 1, 2, 4 or 8, got " + bytesPerWord);
        }
        if (wordBits < 1 || wordBits > 8 * bytesPerWord) {
            throw new IllegalArgumentException("a " + wordBits + "-bit word does not fit " + bytesPerWord + " bytes");
        }
        this.in = in;
        this.bytesPerWord = bytesPerWord;
        this.wordBits = wordBits;
        this.digits = (wordBits + 3) / 4;
    }

    /** The smallest container of 1, 2, 4 or 8 bytes that holds a word of {@code wordBits}. */
    public static int containerBytes(int wordBits) {
        return wordBits <= 8 ? 1 : wordBits <= 16 ? 2 : wordBits <= 32 ? 4 : 8;
    }

    @Override
    protected boolean read() throws IOException {
        long value = 0;
        for (int i = 0; i < bytesPerWord; i++) {
            if (position == limit) {
                limit = in.readNBytes(buffer, 0, buffer.length);
                position = 0;
                if (limit == 0) {
                    if (i == 0) {
                        return false;
                    }
                    throw new DumpFormatException(source + ": word " + (count + 1) + " is cut off after " + i + " of "
                            + bytesPerWord + " bytes; a binary dump holds whole little-endian words of "
                            + bytesPerWord + " bytes");
                }
            }
            value |= (buffer[position++] & 0xFFL) << (8 * i);
        }
        count++;
        line = count;
        unknownMask = 0;
        long mask = wordBits == 64 ? -1L : (1L << wordBits) - 1;
        word = value & mask;
        long upper = value & ~mask;
        long containerMask = bytesPerWord == 8 ? -1L : (1L << (8 * bytesPerWord)) - 1;
        boolean top = wordBits < 64 && ((value >>> (wordBits - 1)) & 1) != 0;
        status = upper == 0 || (top && upper == (~mask & containerMask)) ? WordStatus.VALID : WordStatus.WIDTH;
        return true;
    }

    @Override
    public void close() throws IOException {
        in.close();
    }
}
