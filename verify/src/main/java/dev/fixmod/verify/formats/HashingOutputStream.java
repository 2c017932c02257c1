package dev.fixmod.verify.formats;

import java.io.FilterOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.security.MessageDigest;
import java.util.function.Consumer;

/** Passes bytes through and digests them on the way, so a file's SHA-256 costs no second read. */
final class HashingOutputStream extends FilterOutputStream {

    private final MessageDigest digest = Sha256.newDigest();
    private final Consumer<String> onClose;
    private boolean closed;

    HashingOutputStream(OutputStream out, Consumer<String> onClose) {
        super(out);
        this.onClose = onClose;
    }

    @Override
    public void write(int b) throws IOException {
        out.write(b);
        digest.update((byte) b);
    }

    @Override
    public void write(byte[] b, int off, int len) throws IOException {
        out.write(b, off, len);
        digest.update(b, off, len);
    }

    @Override
    public void close() throws IOException {
        if (closed) {
            return;
        }
        closed = true;
        out.close();
        onClose.accept(Sha256.hex(digest.digest()));
    }
}
