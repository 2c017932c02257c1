package dev.fixmod.verify.compare;

import dev.fixmod.verify.formats.FieldLayout;
import java.io.IOException;
import java.io.InputStream;
import java.util.Locale;

/**
 * Reads hex words as {@code $readmemh} files and {@code $fwrite("%h\n", ...)} dumps hold them (IEEE 1364-2005
 * 17.2.9): words separated by white space, {@code //} and {@code /* ... *}{@code /} comments, blank lines, {@code _}
 * between digits ignored.
 *
 * <table>
 * <caption>Classification of one word of a 16-bit port (4 hex digits)</caption>
 * <tr><th>text</th><th>result</th></tr>
 * <tr><td>{@code 7f80}, {@code 7F80}, {@code 7f_80}</td><td>valid word 0x7F80</td></tr>
 * <tr><td>{@code 7fx0}, {@code zzzz}, {@code XXXX}</td><td>{@link WordStatus#UNKNOWN}: a mismatch, not an error</td></tr>
 * <tr><td>{@code 07f80}, {@code f80}, {@code 0x7f80}</td><td>{@link WordStatus#WIDTH}: 5, 3 or 6 digits where 4
 * are needed</td></tr>
 * <tr><td>{@code 7g80}, {@code -12}, {@code 7f.8}</td><td>{@link DumpFormatException} naming file, line and
 * column: exit status 2</td></tr>
 * <tr><td>{@code @10}</td><td>{@link DumpFormatException}: address records are not supported in dumps</td></tr>
 * </table>
 *
 * <p>Stray characters are format errors rather than counted mismatches because they mean the file is not a hex dump
 * of this port (a decimal dump, a log line, a corrupted transfer), and no count of mismatches would describe that
 * truthfully; {@code x}/{@code z} digits are legal four-state output of a simulator and are counted.
 */
public final class HexWordReader extends WordReader {
    private static final int BUFFER = 1 << 16;

    private final InputStream in;
    private final int expectedDigits;
    private final int wordBits;
    private final byte[] buffer = new byte[BUFFER];
    private int position;
    private int limit;
    private long currentLine = 1;
    private long lineStart;
    private long offset;

    /**
     * @param in the dump; closed by {@link #close()}
     * @param source file name for messages
     * @param wordBits bits of the port's word; the dump must write ceil(wordBits / 4) digits per word
     */
    public HexWordReader(InputStream in, String source, int wordBits) {
        super(source);
        if (wordBits < 1 || wordBits > FieldLayout.MAX_WORD_WIDTH) {
            throw new IllegalArgumentException("word bits must be 1.." + FieldLayout.MAX_WORD_WIDTH + ", got " + wordBits);
        }
        this.in = in;
        this.wordBits = wordBits;
        this.expectedDigits = (wordBits + 3) / 4;
    }

    private int next() throws IOException {
        if (position == limit) {
            offset += limit;
            limit = in.read(buffer, 0, BUFFER);
            position = 0;
            if (limit <= 0) {
                limit = 0;
                return -1;
            }
        }
        return buffer[position++] & 0xFF;
    }

    private int peek() throws IOException {
        int c = next();
        if (c >= 0) {
            position--;
        }
        return c;
    }

    private long column() {
        return offset + position - lineStart;
    }

    private void newLine() {
        currentLine++;
        lineStart = offset + position;
    }

    @Override
    protected boolean read() throws IOException {
        int c = skipSpaceAndComments();
        if (c < 0) {
            return false;
        }
        line = currentLine;
        long value = 0;
        long unknown = 0;
        int count = 0;
        while (true) {
            int nibble = Character.digit(c, 16);
            if (nibble >= 0 && c < 128) {
                value = (value << 4) | nibble;
                unknown <<= 4;
                count++;
            } else if (c == 'x' || c == 'X' || c == 'z' || c == 'Z') {
                value <<= 4;
                unknown = (unknown << 4) | 0xF;
                count++;
            } else if (c != '_') {
                throw stray(c);
            }
            c = peek();
            if (c < 0 || c == ' ' || c == '\t' || c == '\r' || c == '\n' || c == '\f') {
                break;
            }
            if (c == '/') {
                break;
            }
            next();
        }
        digits = count;
        long mask = wordBits == 64 ? -1L : (1L << wordBits) - 1;
        unknownMask = unknown & mask;
        if (count != expectedDigits || count > 16 || (value & ~mask) != 0 || (unknown & ~mask) != 0) {
            status = WordStatus.WIDTH;
            word = value; // all digits, so the report shows the word as written
        } else {
            word = value;
            status = unknown != 0 ? WordStatus.UNKNOWN : WordStatus.VALID;
        }
        return true;
    }

    private int skipSpaceAndComments() throws IOException {
        while (true) {
            int c = next();
            if (c < 0) {
                return -1;
            }
            if (c == '\n') {
                newLine();
            } else if (c == ' ' || c == '\t' || c == '\r' || c == '\f') {
                continue;
            } else if (c == '/') {
                int d = next();
                if (d == '/') {
                    while ((c = next()) >= 0 && c != '\n') {
                        // skip the comment's text
                    }
                    if (c == '\n') {
                        newLine();
                    }
                } else if (d == '*') {
                    skipBlockComment();
                } else {
                    throw stray('/');
                }
            } else if (c == '@') {
                throw new DumpFormatException(source + ":" + currentLine + ": address record '@' is not supported;"
                        + " a dump lists one word per position, from the first");
            } else {
                return c;
            }
        }
    }

    private void skipBlockComment() throws IOException {
        long startLine = currentLine;
        int prev = 0;
        while (true) {
            int c = next();
            if (c < 0) {
                throw new DumpFormatException(source + ":" + startLine + ": comment '/*' is never closed");
            }
            if (c == '\n') {
                newLine();
            }
            if (prev == '*' && c == '/') {
                return;
            }
            prev = c;
        }
    }

    private DumpFormatException stray(int c) {
        String shown = c >= 0x20 && c < 0x7F ? "'" + (char) c + "'" : String.format(Locale.ROOT, "byte 0x%02x", c);
        return new DumpFormatException(source + ":" + currentLine + ":" + column() + ": unexpected character " + shown
                + " in a hex word; expected " + expectedDigits + " digits of 0-9, a-f, A-F (x or z for unknown),"
                + " one word per line, // comments");
    }

    @Override
    public void close() throws IOException {
        in.close();
    }
}
