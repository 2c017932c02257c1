package dev.fixmod.verify.vectors;

import dev.fixmod.bits.BitSource;
import dev.fixmod.bits.Prbs;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;


/**
 * Cuts a specification's bit source into labels: k consecutive bits per symbol, the first bit in time being b0, the
 * label's most significant bit. A new stream starts the source from its beginning, so every noise level carries the
 * same symbols.
 */
final class LabelStream {
    private final BitSource bits;
    private final int k;
    private byte[] scratch = new byte[0];

    private LabelStream(BitSource bits, int k) {
        this.bits = bits;
        this.k = k;
    }

    /** Fills {@code count} labels. */
    void fill(int[] labels, int offset, int count) {
        if (scratch.length < count * k) {
            scratch = new byte[count * k];
        }
        bits.fill(scratch, 0, count * k);
        for (int n = 0; n < count; n++) {
            int label = 0;
            for (int b = 0; b < k; b++) {
                label = (label << 1) | scratch[n * k + b];
            }
            labels[offset + n] = label;
        }
    }

    /** The stream of {@code source}; a user bit file is resolved against {@code specDir} and repeats cyclically. */
    static LabelStream open(VectorSpec.BitSource source, Path specDir, int bitsPerSymbol) {
        return new LabelStream(bits(source, specDir), bitsPerSymbol);
    }

    /** The kernel bit source of a specification's {@code bits} section, from its start. */
    static BitSource bits(VectorSpec.BitSource source, Path specDir) {
        return switch (source.source()) {
            case "constant" -> BitSource.constant(source.value());
            case "alternating" -> BitSource.alternating(source.value());
            case "file" -> BitSource.repeating(readBitFile(specDir.resolve(source.file()), source.file()));
            default -> Prbs.fromName(source.source()).generator(source.seed());
        };
    }

    /**
     * Reads a bit file: the characters {@code 0} and {@code 1} in time order; white space and lines starting with
     * {@code #} are ignored.
     */
    static byte[] readBitFile(Path path, String shown) {
        String text;
        try {
            text = Files.readString(path, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new IllegalArgumentException("bits.file: cannot read '" + shown + "' (" + path + "): " + e.getMessage());
        }
        byte[] out = new byte[text.length()];
        int n = 0;
        int line = 1;
        boolean comment = false;
        boolean lineStart = true;
        for (int c = 0; c < text.length(); c++) {
            char ch = text.charAt(c);
            if (ch == '\n') {
                line++;
                comment = false;
                lineStart = true;
                continue;
            }
            if (lineStart && ch == '#') {
                comment = true;
            }
            lineStart = lineStart && Character.isWhitespace(ch);
            if (comment || Character.isWhitespace(ch)) {
                continue;
            }
            if (ch != '0' && ch != '1') {
                throw new IllegalArgumentException(shown + ":" + line + ": '" + ch + "' is not a bit; a bit file"
                        + " holds the characters 0 and 1 (white space and # comment lines are ignored)");
            }
            out[n++] = (byte) (ch - '0');
        }
        if (n == 0) {
            throw new IllegalArgumentException(shown + ": the bit file holds no bits; expected 0 and 1 characters");
        }
        return java.util.Arrays.copyOf(out, n);
    }
}
