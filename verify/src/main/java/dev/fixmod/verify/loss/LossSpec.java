package dev.fixmod.verify.loss;

import java.util.List;

/**
 * A loss specification after reading: the base design, the Eb/N0 grid, the stopping rules, the targets and the
 * one-at-a-time sweeps. See {@link LossSpecReader} for the JSON keys.
 *
 * @param ebN0Db     the Eb/N0 grid in dB, ascending
 * @param codeRate   r in Eb/N0 = Es/N0 − 10·log10(k·r)
 * @param simulation when each point stops
 * @param targets    where losses are read off and what budget sizing uses
 * @param sweeps     each varies one parameter of the base design
 */
public record LossSpec(String name, String description, Design base, List<Double> ebN0Db, double codeRate, long seed,
                       String gaussian, Simulation simulation, Targets targets, List<Sweep> sweeps) {

    public static final String SCHEMA = "fixmod-loss";
    public static final int VERSION = 1;

    public LossSpec {
        ebN0Db = List.copyOf(ebN0Db);
        sweeps = List.copyOf(sweeps);
    }

    /**
     * Stopping rules of one (design, Eb/N0) point, decided after whole chunks in chunk order: stop once at least
     * {@code minBits} bits ran and both float and fixed paths saw {@code targetErrors} bit errors, or at
     * {@code maxBits} bits.
     */
    public record Simulation(long targetErrors, long minBits, long maxBits, int chunkSymbols) {
    }

    /**
     * @param ber             the BER at which the implementation loss is read
     * @param gmi             the rate (bits per symbol) at which the GMI-based loss is read
     * @param budgetDb        the loss budget sizing compares with
     * @param sizingMeasure   {@code gmi} or {@code ber}: which loss sizing uses
     * @param operatingEbN0Db where the static input figures (SQNR, clipping) are evaluated
     */
    public record Targets(double ber, double gmi, double budgetDb, String sizingMeasure, double operatingEbN0Db) {
    }

    /** One swept parameter: its name, the value labels as written and the design of each value. */
    public record Sweep(String parameter, List<String> values, List<Design> designs) {
        public Sweep {
            values = List.copyOf(values);
            designs = List.copyOf(designs);
        }
    }
}
