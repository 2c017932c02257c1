package dev.fixmod.demap;

import dev.fixmod.constellation.Constellation;
import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;

/**
 * An independent high-precision bit LLR for tests: the definition
 * {@code ln Σ_{b=0} p(s)·e^{−|y−s|²/N0} − ln Σ_{b=1} p(s)·e^{−|y−s|²/N0}} evaluated directly (no maximum taken out)
 * in JDK {@link BigDecimal} at 50 significant digits, with exp by its Taylor series after halving the argument and
 * squaring back, and ln by the series {@code ln m = 2·atanh((m−1)/(m+1))} after taking out the decimal exponent. It
 * shares no code and no formula arrangement with the kernel's log-sum-exp, and uses no {@code Math}/{@code StrictMath}.
 */
final class BigDecimalLlr {
    private static final MathContext MC = new MathContext(50, RoundingMode.HALF_EVEN);
    private static final BigDecimal TWO = BigDecimal.valueOf(2);
    private static final BigDecimal LN_10 = lnMantissa(BigDecimal.TEN);

    private BigDecimalLlr() {
    }

    /** The zero-positive LLR of every bit of {@code (re, im)}; priors from the constellation when {@code priors}. */
    static double[] llr(Constellation c, double re, double im, double n0, boolean priors) {
        int k = c.bitsPerSymbol();
        BigDecimal[] zero = new BigDecimal[k];
        BigDecimal[] one = new BigDecimal[k];
        for (int b = 0; b < k; b++) {
            zero[b] = BigDecimal.ZERO;
            one[b] = BigDecimal.ZERO;
        }
        BigDecimal yr = new BigDecimal(re);
        BigDecimal yi = new BigDecimal(im);
        BigDecimal noise = new BigDecimal(n0);
        for (int s = 0; s < c.size(); s++) {
            BigDecimal dr = yr.subtract(new BigDecimal(c.re(s)));
            BigDecimal di = yi.subtract(new BigDecimal(c.im(s)));
            BigDecimal d = dr.multiply(dr).add(di.multiply(di));
            BigDecimal term = exp(d.divide(noise, MC).negate());
            if (priors) {
                term = term.multiply(new BigDecimal(c.probability(s)), MC);
            }
            for (int b = 0; b < k; b++) {
                if (((s >>> (k - 1 - b)) & 1) == 0) {
                    zero[b] = zero[b].add(term, MC);
                } else {
                    one[b] = one[b].add(term, MC);
                }
            }
        }
        double[] l = new double[k];
        for (int b = 0; b < k; b++) {
            l[b] = ln(zero[b]).subtract(ln(one[b]), MC).doubleValue();
        }
        return l;
    }

    /** e^x: Taylor series of x/2^h with |x/2^h| &lt; 1/2, then h squarings (with guard digits for them). */
    static BigDecimal exp(BigDecimal x) {
        int halvings = 0;
        BigDecimal r = x;
        while (r.abs().compareTo(new BigDecimal("0.5")) >= 0) {
            r = r.divide(TWO);
            halvings++;
        }
        MathContext work = new MathContext(MC.getPrecision() + halvings + 10, RoundingMode.HALF_EVEN);
        BigDecimal sum = BigDecimal.ONE;
        BigDecimal term = BigDecimal.ONE;
        BigDecimal epsilon = BigDecimal.ONE.movePointLeft(work.getPrecision() + 2);
        for (int n = 1; term.abs().compareTo(epsilon) > 0; n++) {
            term = term.multiply(r, work).divide(BigDecimal.valueOf(n), work);
            sum = sum.add(term, work);
        }
        for (int i = 0; i < halvings; i++) {
            sum = sum.multiply(sum, work);
        }
        return sum.round(MC);
    }

    /** ln x for x &gt; 0: x = m·10^e with 1 ≤ m &lt; 10, ln x = ln m + e·ln 10. */
    static BigDecimal ln(BigDecimal x) {
        if (x.signum() <= 0) {
            throw new IllegalArgumentException("ln of " + x);
        }
        int exponent = x.precision() - x.scale() - 1;
        BigDecimal m = x.movePointLeft(exponent);
        return lnMantissa(m).add(LN_10.multiply(BigDecimal.valueOf(exponent)), MC);
    }

    /** ln m = 2·Σ z^(2n+1)/(2n+1), z = (m−1)/(m+1), for m in [1, 10]. */
    private static BigDecimal lnMantissa(BigDecimal m) {
        MathContext work = new MathContext(MC.getPrecision() + 10, RoundingMode.HALF_EVEN);
        BigDecimal z = m.subtract(BigDecimal.ONE).divide(m.add(BigDecimal.ONE), work);
        BigDecimal z2 = z.multiply(z, work);
        BigDecimal power = z;
        BigDecimal sum = BigDecimal.ZERO;
        BigDecimal epsilon = BigDecimal.ONE.movePointLeft(work.getPrecision() + 2);
        for (int n = 0; power.abs().compareTo(epsilon) > 0; n++) {
            sum = sum.add(power.divide(BigDecimal.valueOf(2L * n + 1), work), work);
            power = power.multiply(z2, work);
        }
        return sum.multiply(TWO, work);
    }
}
