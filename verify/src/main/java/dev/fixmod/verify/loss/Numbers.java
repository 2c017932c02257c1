package dev.fixmod.verify.loss;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;

/**
 * Fixed text forms of numbers for the reports: through {@link BigDecimal}, so the same double gives the same
 * characters on every JVM (unlike {@code Double.toString}, whose shortest form changed between JDK releases).
 *
 * <table class="striped">
 *   <caption>Examples</caption>
 *   <thead><tr><th>call</th><th>text</th></tr></thead>
 *   <tbody>
 *     <tr><td>{@code fixed(0.0449999, 3)}</td><td>{@code 0.045}</td></tr>
 *     <tr><td>{@code fixed(-0.0001, 2)}</td><td>{@code 0.00} (no negative zero)</td></tr>
 *     <tr><td>{@code sci(0.000123456, 3)}</td><td>{@code 1.23e-4}</td></tr>
 *     <tr><td>{@code sci(0, 3)}</td><td>{@code 0}</td></tr>
 *     <tr><td>{@code plain(0.1)}</td><td>{@code 0.1}</td></tr>
 *     <tr><td>NaN in any form</td><td>{@code n/a}</td></tr>
 *   </tbody>
 * </table>
 */
public final class Numbers {
    public static final String NONE = "n/a";

    private Numbers() {
    }

    /** {@code digits} decimals, half-even. */
    public static String fixed(double x, int digits) {
        if (!Double.isFinite(x)) {
            return NONE;
        }
        BigDecimal d = new BigDecimal(x).setScale(digits, RoundingMode.HALF_EVEN);
        return d.signum() == 0 ? BigDecimal.ZERO.setScale(digits).toPlainString() : d.toPlainString();
    }

    /** {@code significant} digits in scientific form, e.g. {@code 1.23e-4}. */
    public static String sci(double x, int significant) {
        if (!Double.isFinite(x)) {
            return NONE;
        }
        if (x == 0) {
            return "0";
        }
        BigDecimal d = new BigDecimal(x).round(new MathContext(significant, RoundingMode.HALF_EVEN));
        int exponent = d.precision() - d.scale() - 1;
        BigDecimal mantissa = d.movePointLeft(exponent).setScale(significant - 1, RoundingMode.HALF_EVEN);
        return mantissa.toPlainString() + "e" + exponent;
    }

    /** At most 12 significant digits, trailing zeros dropped. */
    public static String plain(double x) {
        if (!Double.isFinite(x)) {
            return NONE;
        }
        if (x == 0) {
            return "0";
        }
        return new BigDecimal(x).round(new MathContext(12, RoundingMode.HALF_EVEN)).stripTrailingZeros()
                .toPlainString();
    }
}
