package dev.fixmod.verify.formats;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;

/** SHA-256 (FIPS 180-4) via {@link MessageDigest}, as lowercase hex: the digest a manifest records per file. */
public final class Sha256 {

    private static final char[] HEX = "0123456789abcdef".toCharArray();

    private Sha256() {
    }

    static MessageDigest newDigest() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java platform must provide SHA-256", e);
        }
    }

    /** 64 lowercase hex digits of {@code digest}. */
    static String hex(byte[] digest) {
        char[] out = new char[2 * digest.length];
        for (int i = 0; i < digest.length; i++) {
            out[2 * i] = HEX[(digest[i] >>> 4) & 0xF];
            out[2 * i + 1] = HEX[digest[i] & 0xF];
        }
        return new String(out);
    }

    /** The SHA-256 of a file's bytes, e.g. to verify a committed vector set against its manifest. */
    public static String of(Path file) throws IOException {
        MessageDigest md = newDigest();
        byte[] buf = new byte[1 << 16];
        try (InputStream in = Files.newInputStream(file)) {
            for (int n; (n = in.read(buf)) > 0; ) {
                md.update(buf, 0, n);
            }
        }
        return hex(md.digest());
    }
}
