package dev.fixmod.verify.vectors;

import dev.fixmod.names.TradeNamed;

/** Which signal-to-noise ratio the noise levels of a specification are given in. */
public enum NoiseMeasure implements TradeNamed {
    /** Symbol energy to noise density, E_s/N0 in dB (key {@code es-n0-db}). */
    ES_N0("es-n0-db"),
    /** Bit energy to noise density, E_b/N0 = E_s/N0 − 10·log10(k·r) dB (key {@code eb-n0-db}). */
    EB_N0("eb-n0-db");

    private final String tradeName;

    NoiseMeasure(String tradeName) {
        this.tradeName = tradeName;
    }

    @Override
    public String tradeName() {
        return tradeName;
    }
}
