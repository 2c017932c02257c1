package dev.fixmod.verify.formats;

import java.io.Closeable;
import java.io.IOException;
import java.io.OutputStream;

/**
 * A fixed buffer in front of an output stream that formats numbers straight into bytes, so writers allocate
 * nothing per value.
 */
final class ByteSink implements Closeable {

    private static final byte[] HEX = "0123456789abcdef".getBytes(java.nio.charset.StandardCharsets.US_ASCII);

    private final OutputStream out;
    private final byte[] buf = new byte[1 << 16];
    private int pos;

    ByteSink(OutputStream out) {
        this.out = out;
    }

    private void room(int n) throws IOException {
        if (pos + n > buf.length) {
            flush();
        }
    }

    void put(char c) throws IOException {
        room(1);
        buf[pos++] = (byte) c;
    }

    /** ASCII text (callers pass validated ASCII). */
    void put(String s) throws IOException {
        for (int i = 0; i < s.length(); i++) {
            put(s.charAt(i));
        }
    }

    void bytes(byte[] b) throws IOException {
        for (byte x : b) {
            room(1);
            buf[pos++] = x;
        }
    }

    /** Decimal digits of {@code v}, with a leading '-' if negative. */
    void decimal(long v) throws IOException {
        room(20);
        if (v < 0) {
            buf[pos++] = '-';
        } else {
            v = -v; // work on the negative magnitude so Long.MIN_VALUE needs no special case
        }
        int start = pos;
        do {
            buf[pos++] = (byte) ('0' - (v % 10));
            v /= 10;
        } while (v != 0);
        reverse(start, pos - 1);
    }

    /** The exact decimal value of {@code code · 2^-fractionalBits}; see {@link FileFormat#CSV}. */
    void fixed(long code, int fractionalBits) throws IOException {
        long magnitude = Math.abs(code);
        if (code < 0) {
            put('-');
        }
        decimal(magnitude >>> fractionalBits);
        long mask = (1L << fractionalBits) - 1;
        long fraction = magnitude & mask;
        if (fraction != 0) {
            put('.');
            do {
                fraction *= 10;
                put((char) ('0' + (fraction >>> fractionalBits)));
                fraction &= mask;
            } while (fraction != 0);
        }
    }

    /** The low {@code 4 · digits} bits of {@code v} as lowercase hex, most significant digit first. */
    void hex(long v, int digits) throws IOException {
        room(digits);
        for (int d = digits - 1; d >= 0; d--) {
            buf[pos++] = HEX[(int) (v >>> (4 * d)) & 0xF];
        }
    }

    /** {@link #hex} followed by a line feed, with one buffer check for the whole line. */
    void hexLine(long v, int digits) throws IOException {
        room(digits + 1);
        int p = pos;
        for (int d = digits - 1; d >= 0; d--) {
            buf[p++] = HEX[(int) (v >>> (4 * d)) & 0xF];
        }
        buf[p++] = '\n';
        pos = p;
    }

    /** The low {@code bytes} bytes of {@code v}, least significant first. */
    void littleEndian(long v, int bytes) throws IOException {
        room(bytes);
        for (int b = 0; b < bytes; b++) {
            buf[pos++] = (byte) (v >>> (8 * b));
        }
    }

    private void reverse(int i, int j) {
        while (i < j) {
            byte t = buf[i];
            buf[i++] = buf[j];
            buf[j--] = t;
        }
    }

    void flush() throws IOException {
        out.write(buf, 0, pos);
        pos = 0;
    }

    @Override
    public void close() throws IOException {
        try {
            flush();
        } finally {
            out.close();
        }
    }
}
