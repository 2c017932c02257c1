package dev.fixmod.demap;

import dev.fixmod.constellation.Constellation;
import java.util.Objects;

/**
 * The channel and convention a soft demapper works under: the complex noise power {@code N0} (each real dimension
 * has variance {@code N0/2}, so a symbol's metric is {@code −|y − s|²/N0}), the {@link LlrSign}, and whether the
 * constellation's symbol probabilities enter as priors ({@code + ln p(s)} on each metric).
 *
 * <p>Priors change nothing for an equiprobable constellation (the constant {@code ln(1/M)} cancels), so demappers skip
 * them there. The per-axis, folded-linear and fixed-point demappers assume equiprobable symbols; they reject a
 * non-uniform constellation unless priors are off.
 *
 * @param n0     complex noise power, finite and {@code > 0}
 * @param sign   which bit value a positive LLR favours
 * @param priors whether {@code ln p(s)} is added to each symbol's metric
 */
public record LlrOptions(double n0, LlrSign sign, boolean priors) {

    public LlrOptions {
        Objects.requireNonNull(sign, "sign");
        if (!(n0 > 0) || !Double.isFinite(n0)) {
            throw new IllegalArgumentException("noise power N0 must be finite and > 0, got " + n0);
        }
    }

    /** {@code N0} with fixmod's sign convention ({@code zero-positive}) and priors on. */
    public static LlrOptions of(double n0) {
        return new LlrOptions(n0, LlrSign.ZERO_POSITIVE, true);
    }

    /**
     * The options whose {@code N0 = E_s / 10^(EsN0/10)}, with {@code E_s} the constellation's average symbol energy
     * (weighted by its probabilities). Uses {@link StrictMath} so the same dB gives the same {@code N0} on every JVM.
     *
     * @throws IllegalArgumentException if {@code esN0Db} is not finite
     */
    public static LlrOptions fromEsN0Db(Constellation constellation, double esN0Db, LlrSign sign, boolean priors) {
        if (!Double.isFinite(esN0Db)) {
            throw new IllegalArgumentException("Es/N0 must be a finite number of dB, got " + esN0Db);
        }
        return new LlrOptions(constellation.averageEnergy() / StrictMath.pow(10.0, esN0Db / 10.0), sign, priors);
    }

    /** {@code 10·log10(E_s/N0)} for the given constellation, in dB. */
    public double esN0Db(Constellation constellation) {
        return 10.0 * StrictMath.log10(constellation.averageEnergy() / n0);
    }

    /** These options with another noise power. */
    public LlrOptions withN0(double newN0) {
        return new LlrOptions(newN0, sign, priors);
    }

    /** Whether priors actually enter the metrics of {@code constellation} (on, and not equiprobable). */
    boolean usesPriors(Constellation constellation) {
        return priors && !constellation.isUniform();
    }
}
