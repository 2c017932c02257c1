package dev.fixmod.fixed;

import java.util.Arrays;
import java.util.Locale;
import java.util.stream.Collectors;

/**
 * What happens to an integer result that lies outside its format's codes. Every mode records one event on the
 * stage's {@link OverflowCounter} for each value that did not fit (and, for {@code symmetric-saturate}, for each most
 * negative code it replaced).
 *
 * <table class="striped">
 *   <caption>Results for an 8-bit signed word (codes −128 … 127)</caption>
 *   <thead><tr><th>value</th><th>saturate</th><th>symmetric-saturate</th><th>wrap</th><th>events</th></tr></thead>
 *   <tbody>
 *     <tr><td>127</td><td>127</td><td>127</td><td>127</td><td>0</td></tr>
 *     <tr><td>128</td><td>127</td><td>127</td><td>−128</td><td>1</td></tr>
 *     <tr><td>300</td><td>127</td><td>127</td><td>44</td><td>1</td></tr>
 *     <tr><td>−127</td><td>−127</td><td>−127</td><td>−127</td><td>0</td></tr>
 *     <tr><td>−128</td><td>−128</td><td>−127</td><td>−128</td><td>0, 1 for symmetric-saturate</td></tr>
 *     <tr><td>−129</td><td>−128</td><td>−127</td><td>127</td><td>1</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>For an unsigned format {@code symmetric-saturate} is the same as {@code saturate}.
 */
public enum Overflow {
    /** Clamp to the nearest representable code. */
    SATURATE("saturate"),
    /** Clamp to {@code [−max, max]}: the most negative code is never produced, so negating a result is safe. */
    SYMMETRIC_SATURATE("symmetric-saturate"),
    /** Keep the low W bits: two's complement arithmetic modulo {@code 2^W}. */
    WRAP("wrap");

    private final String tradeName;

    Overflow(String tradeName) {
        this.tradeName = tradeName;
    }

    /** The name used on the command line, in specification files and in reports. */
    public String tradeName() {
        return tradeName;
    }

    @Override
    public String toString() {
        return tradeName;
    }

    /**
     * The mode of the given trade name (case-insensitive; {@code _} accepted for {@code -}).
     *
     * @throws IllegalArgumentException naming the text and listing the accepted names
     */
    public static Overflow fromName(String name) {
        String key = name == null ? "" : name.trim().toLowerCase(Locale.ROOT).replace('_', '-');
        for (Overflow o : values()) {
            if (o.tradeName.equals(key)) {
                return o;
            }
        }
        throw new IllegalArgumentException("unknown overflow '" + name + "'; expected one of " + names());
    }

    /** The accepted names, comma separated. */
    public static String names() {
        return Arrays.stream(values()).map(Overflow::tradeName).collect(Collectors.joining(", "));
    }

    /** Brings {@code value} into {@code format}'s codes by this mode, counting an event when it had to act. */
    public long apply(long value, QFormat format, OverflowCounter counter) {
        long min = format.minCode();
        long max = format.maxCode();
        switch (this) {
            case SATURATE:
                if (value > max) {
                    counter.record();
                    return max;
                }
                if (value < min) {
                    counter.record();
                    return min;
                }
                return value;
            case SYMMETRIC_SATURATE:
                long low = format.isSigned() ? -max : min;
                if (value > max) {
                    counter.record();
                    return max;
                }
                if (value < low) {
                    counter.record();
                    return low;
                }
                return value;
            case WRAP:
                if (value >= min && value <= max) {
                    return value;
                }
                counter.record();
                return wrapBits(value, format);
            default:
                throw new AssertionError(this);
        }
    }

    /** The low W bits of {@code value}, read as a code of {@code format} (sign-extended if signed). */
    static long wrapBits(long value, QFormat format) {
        int unused = 64 - format.wordLength();
        return format.isSigned() ? (value << unused) >> unused : (value << unused) >>> unused;
    }
}
