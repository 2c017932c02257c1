package dev.fixmod.fixed;

import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * A fixed-point number format: signed two's complement {@code Qm.n} or unsigned {@code UQm.n}.
 *
 * <p>A signed format has one sign bit, {@code m} integer bits and {@code n} fractional bits, so its word length is
 * {@code m + n + 1}; an unsigned format has {@code m + n} bits. A code {@code c} represents the real value
 * {@code c · 2^-n}. The short form {@code Qn} means {@code Q0.n}.
 *
 * <table class="striped">
 *   <caption>Examples of Q formats</caption>
 *   <thead><tr><th>short form</th><th>word length</th><th>fractional bits</th><th>codes</th><th>range</th><th>LSB</th></tr></thead>
 *   <tbody>
 *     <tr><td>{@code Q15}</td><td>16</td><td>15</td><td>−32768 … 32767</td><td>[−1, 1 − 2^−15]</td><td>2^−15</td></tr>
 *     <tr><td>{@code Q1.14}</td><td>16</td><td>14</td><td>−32768 … 32767</td><td>[−2, 2 − 2^−14]</td><td>2^−14</td></tr>
 *     <tr><td>{@code Q3.8}</td><td>12</td><td>8</td><td>−2048 … 2047</td><td>[−8, 8 − 2^−8]</td><td>2^−8</td></tr>
 *     <tr><td>{@code Q5.0}</td><td>6</td><td>0</td><td>−32 … 31</td><td>[−32, 31]</td><td>1</td></tr>
 *     <tr><td>{@code UQ0.8}</td><td>8</td><td>8</td><td>0 … 255</td><td>[0, 1 − 2^−8]</td><td>2^−8</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>Word lengths run from 1 to {@value #MAX_WORD_LENGTH} bits. Instances are immutable; equal formats are
 * {@link #equals equal}.
 */
public final class QFormat {

    /** The widest word a format may have. */
    public static final int MAX_WORD_LENGTH = 32;

    // Up to 9 digits so any digit string parses as an int and is then rejected by the range checks with a reason.
    private static final Pattern SHORT_FORM =
            Pattern.compile("(U?)Q(\\d{1,9})(?:\\.(\\d{1,9}))?", Pattern.CASE_INSENSITIVE);

    private final boolean signed;
    private final int integerBits;
    private final int fractionalBits;

    private QFormat(boolean signed, int integerBits, int fractionalBits) {
        if (integerBits < 0) {
            throw new IllegalArgumentException("integer bits must be >= 0, got " + integerBits);
        }
        if (fractionalBits < 0) {
            throw new IllegalArgumentException("fractional bits must be >= 0, got " + fractionalBits);
        }
        int word = (signed ? 1 : 0) + integerBits + fractionalBits;
        if (word < 1) {
            throw new IllegalArgumentException("an unsigned format needs at least one bit (UQ0.0 has none)");
        }
        if (word > MAX_WORD_LENGTH) {
            throw new IllegalArgumentException("word length " + word + " of " + shortForm(signed, integerBits, fractionalBits)
                    + " exceeds " + MAX_WORD_LENGTH + " bits");
        }
        this.signed = signed;
        this.integerBits = integerBits;
        this.fractionalBits = fractionalBits;
    }

    /** A signed format {@code Qm.n}: 1 sign bit, {@code m} integer bits, {@code n} fractional bits. */
    public static QFormat signed(int integerBits, int fractionalBits) {
        return new QFormat(true, integerBits, fractionalBits);
    }

    /** An unsigned format {@code UQm.n}: {@code m} integer bits, {@code n} fractional bits. */
    public static QFormat unsigned(int integerBits, int fractionalBits) {
        return new QFormat(false, integerBits, fractionalBits);
    }

    /** The signed format of the given word length and fractional bits, e.g. {@code signedWord(12, 8)} is {@code Q3.8}. */
    public static QFormat signedWord(int wordLength, int fractionalBits) {
        if (wordLength < 1 || wordLength > MAX_WORD_LENGTH) {
            throw new IllegalArgumentException("word length must be 1.." + MAX_WORD_LENGTH + ", got " + wordLength);
        }
        if (fractionalBits < 0 || fractionalBits > wordLength - 1) {
            throw new IllegalArgumentException("a signed " + wordLength + "-bit word holds 0.." + (wordLength - 1)
                    + " fractional bits, got " + fractionalBits);
        }
        return new QFormat(true, wordLength - 1 - fractionalBits, fractionalBits);
    }

    /**
     * The unsigned format of the given word length and fractional bits, e.g. {@code unsignedWord(8, 8)} is
     * {@code UQ0.8}.
     */
    public static QFormat unsignedWord(int wordLength, int fractionalBits) {
        if (wordLength < 1 || wordLength > MAX_WORD_LENGTH) {
            throw new IllegalArgumentException("word length must be 1.." + MAX_WORD_LENGTH + ", got " + wordLength);
        }
        if (fractionalBits < 0 || fractionalBits > wordLength) {
            throw new IllegalArgumentException("an unsigned " + wordLength + "-bit word holds 0.." + wordLength
                    + " fractional bits, got " + fractionalBits);
        }
        return new QFormat(false, wordLength - fractionalBits, fractionalBits);
    }

    /**
     * Parses {@code Qm.n}, {@code Qn} (meaning {@code Q0.n}), {@code UQm.n} or {@code UQn}; the letters may be in
     * either case.
     *
     * @throws IllegalArgumentException naming the text and what is accepted
     */
    public static QFormat parse(String text) {
        if (text == null) {
            throw new IllegalArgumentException("a Q format is required, e.g. Q1.14 or UQ0.8");
        }
        Matcher m = SHORT_FORM.matcher(text.trim());
        if (!m.matches()) {
            throw new IllegalArgumentException("'" + text + "' is not a Q format; expected Qm.n, Qn, UQm.n or UQn"
                    + " (e.g. Q1.14, Q15, UQ0.8)");
        }
        boolean isSigned = m.group(1).isEmpty();
        // Integer.parseInt cannot fail: at most 9 digits.
        int first = Integer.parseInt(m.group(2));
        try {
            if (m.group(3) == null) {
                return new QFormat(isSigned, 0, first);
            }
            return new QFormat(isSigned, first, Integer.parseInt(m.group(3)));
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException("'" + text + "': " + e.getMessage(), e);
        }
    }

    public boolean isSigned() {
        return signed;
    }

    public int integerBits() {
        return integerBits;
    }

    public int fractionalBits() {
        return fractionalBits;
    }

    public int wordLength() {
        return (signed ? 1 : 0) + integerBits + fractionalBits;
    }

    /** The smallest code: {@code −2^(W−1)} if signed, 0 if unsigned. */
    public long minCode() {
        return signed ? -(1L << (wordLength() - 1)) : 0L;
    }

    /** The largest code: {@code 2^(W−1) − 1} if signed, {@code 2^W − 1} if unsigned. */
    public long maxCode() {
        return signed ? (1L << (wordLength() - 1)) - 1 : (1L << wordLength()) - 1;
    }

    /** Whether {@code code} lies in {@code [minCode, maxCode]}. */
    public boolean contains(long code) {
        return code >= minCode() && code <= maxCode();
    }

    /** The value of one LSB, {@code 2^-n} (exact). */
    public double lsb() {
        return Math.scalb(1.0, -fractionalBits);
    }

    /** The real value of the smallest code (exact). */
    public double minValue() {
        return toDouble(minCode());
    }

    /** The real value of the largest code (exact). */
    public double maxValue() {
        return toDouble(maxCode());
    }

    /** The real value {@code code · 2^-n}; exact, since every code of a format fits a double's 53-bit significand. */
    public double toDouble(long code) {
        return Math.scalb((double) code, -fractionalBits);
    }

    /** The mask of the word's bits, e.g. {@code 0xFFF} for a 12-bit word. */
    public long wordMask() {
        return wordLength() == 64 ? -1L : (1L << wordLength()) - 1;
    }

    /** The short form, e.g. {@code Q1.14} or {@code UQ0.8}; {@link #parse} reads it back. */
    @Override
    public String toString() {
        return shortForm(signed, integerBits, fractionalBits);
    }

    /**
     * The explicit meaning, e.g.
     * {@code Q1.14 (signed, 16-bit word, 14 fractional bits, range [-2, 1.99993896484375], LSB 2^-14)};
     * the range is exact and an integer format says {@code LSB 1}.
     */
    public String describe() {
        return String.format(Locale.ROOT, "%s (%s, %d-bit word, %d fractional bits, range [%s, %s], LSB %s)",
                this, signed ? "signed" : "unsigned", wordLength(), fractionalBits,
                plain(minValue()), plain(maxValue()), fractionalBits == 0 ? "1" : "2^-" + fractionalBits);
    }

    /**
     * Returns {@code code} if it is one of this format's codes.
     *
     * @param what names the operand in the message, e.g. {@code "a"}
     * @throws IllegalArgumentException naming the operand, the code and the accepted codes
     */
    public long requireCode(long code, String what) {
        if (code < minCode() || code > maxCode()) {
            throw new IllegalArgumentException(what + " = " + code + " is not a code of " + this + " (codes "
                    + minCode() + ".." + maxCode() + ")");
        }
        return code;
    }

    private static String plain(double v) {
        return new java.math.BigDecimal(v).stripTrailingZeros().toPlainString();
    }

    private static String shortForm(boolean signed, int m, int n) {
        return (signed ? "Q" : "UQ") + m + "." + n;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof QFormat q && q.signed == signed && q.integerBits == integerBits
                && q.fractionalBits == fractionalBits;
    }

    @Override
    public int hashCode() {
        return (signed ? 1 : 0) + 31 * integerBits + 961 * fractionalBits;
    }
}
