package dev.fixmod.verify.theory;

/**
 * Signal-to-noise ratios in decibels and the conversions between symbol and bit energy. N0 is the complex noise
 * power (each real dimension carries N0/2), E_s the average symbol energy, E_b = E_s/(k·r) the energy per
 * information bit for k bits per symbol and code rate r.
 *
 * <table class="striped">
 *   <caption>Examples</caption>
 *   <thead><tr><th>call</th><th>result</th></tr></thead>
 *   <tbody>
 *     <tr><td>{@code toDb(2)}</td><td>3.0103 dB</td></tr>
 *     <tr><td>{@code toDb(0)}</td><td>−∞ dB (no signal)</td></tr>
 *     <tr><td>{@code fromDb(-10)}</td><td>0.1</td></tr>
 *     <tr><td>{@code ebN0DbFromEsN0Db(10, 4, 1)} (16-QAM, uncoded)</td><td>10 − 6.0206 = 3.9794 dB</td></tr>
 *     <tr><td>{@code ebN0DbFromEsN0Db(10, 2, 0.5)} (QPSK, rate ½)</td><td>10 − 0 = 10 dB</td></tr>
 *     <tr><td>{@code n0(1, 10)}</td><td>0.1 (per-dimension variance 0.05)</td></tr>
 *   </tbody>
 * </table>
 *
 * <p>Uses {@link StrictMath}: these values reach report files.
 */
public final class Snr {
    private Snr() {
    }

    /** 10·log10(ratio) for a power ratio ≥ 0. */
    public static double toDb(double ratio) {
        if (!(ratio >= 0) || ratio == Double.POSITIVE_INFINITY) {
            throw new IllegalArgumentException("a power ratio must be finite and >= 0 to be expressed in dB, got " + ratio);
        }
        return 10.0 * StrictMath.log10(ratio);
    }

    /** 10^(dB/10). */
    public static double fromDb(double db) {
        if (Double.isNaN(db) || db == Double.POSITIVE_INFINITY) {
            throw new IllegalArgumentException("a level in dB must be a number below +infinity, got " + db);
        }
        return StrictMath.pow(10.0, db / 10.0);
    }

    /** E_b/N0 in dB from E_s/N0 in dB: E_s/N0 − 10·log10(k·r). */
    public static double ebN0DbFromEsN0Db(double esN0Db, int bitsPerSymbol, double codeRate) {
        return esN0Db - bitsPerInformation(bitsPerSymbol, codeRate);
    }

    /** E_s/N0 in dB from E_b/N0 in dB: E_b/N0 + 10·log10(k·r). */
    public static double esN0DbFromEbN0Db(double ebN0Db, int bitsPerSymbol, double codeRate) {
        return ebN0Db + bitsPerInformation(bitsPerSymbol, codeRate);
    }

    /** The complex noise power N0 that gives {@code esN0Db} for symbols of average energy {@code symbolEnergy}. */
    public static double n0(double symbolEnergy, double esN0Db) {
        if (!(symbolEnergy > 0) || symbolEnergy == Double.POSITIVE_INFINITY) {
            throw new IllegalArgumentException("symbol energy must be finite and > 0, got " + symbolEnergy);
        }
        return symbolEnergy / fromDb(esN0Db);
    }

    private static double bitsPerInformation(int bitsPerSymbol, double codeRate) {
        if (bitsPerSymbol < 1) {
            throw new IllegalArgumentException("bits per symbol must be >= 1, got " + bitsPerSymbol);
        }
        if (!(codeRate > 0 && codeRate <= 1)) {
            throw new IllegalArgumentException("code rate must be in (0, 1], got " + codeRate);
        }
        return 10.0 * StrictMath.log10(bitsPerSymbol * codeRate);
    }
}
