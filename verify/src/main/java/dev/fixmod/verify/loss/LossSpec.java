package dev.fixmod.verify.loss;

import java.util.List;

/**
 * A loss specification after reading: the base design, the Eb/N0 grid, the stopping rules, the targets, the
 * one-at-a-time sweeps and the two-parameter grids. See {@link LossSpecReader} for the JSON keys.
 *
 * @param ebN0Db     the Eb/N0 grid in dB, ascending
 * @param codeRate   r in Eb/N0 = Es/N0 − 10·log10(k·r)
 * @param simulation when each point stops
 * @param targets    where losses are read off and what budget sizing uses
 * @param sweeps     each varies one parameter of the base design
 * @param grids      each varies two parameters of the base design jointly
 */
public record LossSpec(String name, String description, Design base, List<Double> ebN0Db, double codeRate, long seed,
                       String gaussian, Simulation simulation, Targets targets, List<Sweep> sweeps, List<Grid> grids) {

    public static final String SCHEMA = "fixmod-loss";
    public static final int VERSION = 1;

    public LossSpec {
        ebN0Db = List.copyOf(ebN0Db);
        sweeps = List.copyOf(sweeps);
        grids = List.copyOf(grids);
    }

    /** The smallest complex noise power of the run (the highest Eb/N0), for which suggested stages are sized. */
    public double smallestN0() {
        return dev.fixmod.verify.loss.Simulation.n0(base.constellation(), ebN0Db.get(ebN0Db.size() - 1), codeRate);
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

    /**
     * Two parameters crossed: every combination of their values.
     *
     * @param parameters the two parameter names, as written
     * @param values     the value labels of each, as written
     * @param designs    the design of values (i, j) at {@code i · values.get(1).size() + j}
     */
    public record Grid(List<String> parameters, List<List<String>> values, List<Design> designs) {
        public Grid {
            parameters = List.copyOf(parameters);
            values = values.stream().map(List::copyOf).toList();
            designs = List.copyOf(designs);
            if (parameters.size() != 2 || values.size() != 2
                    || designs.size() != values.get(0).size() * values.get(1).size()) {
                throw new IllegalArgumentException("a grid crosses two parameters and holds one design per"
                        + " combination");
            }
        }

        /** The labels of combination {@code index} (first parameter's value, then the second's). */
        public List<String> combination(int index) {
            int n = values.get(1).size();
            return List.of(values.get(0).get(index / n), values.get(1).get(index % n));
        }
    }
}
