package dev.fixmod.verify.vectors;

/**
 * The ports of the datapath a set has files for. The mapper ports share one vector index (the mapper group); the
 * demapper ports share another (the demapper group). Stimulus ports are what a testbench drives, expected ports what
 * it compares against.
 *
 * <table class="striped">
 *   <caption>Ports</caption>
 *   <thead><tr><th>port</th><th>group</th><th>role</th><th>fields (hex word, most significant first)</th></tr></thead>
 *   <tbody>
 *     <tr><td>bits</td><td>mapper</td><td>stimulus</td><td>label (k bits, b0 = MSB)</td></tr>
 *     <tr><td>mapper-out</td><td>mapper</td><td>expected</td><td>I, Q (mapper format)</td></tr>
 *     <tr><td>demapper-in</td><td>demapper</td><td>stimulus</td><td>I, Q (demapper input format)</td></tr>
 *     <tr><td>hard</td><td>demapper</td><td>expected</td><td>label (k bits)</td></tr>
 *     <tr><td>llr</td><td>demapper</td><td>expected</td><td>llr0 … llr(k−1) (LLR format), llr0 = bit b0</td></tr>
 *   </tbody>
 * </table>
 */
public enum Port {
    BITS("bits", true, true),
    MAPPER_OUT("mapper-out", true, false),
    DEMAPPER_IN("demapper-in", false, true),
    HARD("hard", false, false),
    LLR("llr", false, false);

    private final String tradeName;
    private final boolean mapperGroup;
    private final boolean stimulus;

    Port(String tradeName, boolean mapperGroup, boolean stimulus) {
        this.tradeName = tradeName;
        this.mapperGroup = mapperGroup;
        this.stimulus = stimulus;
    }

    /** The port's name in the manifest and in file names. */
    public String tradeName() {
        return tradeName;
    }

    /** Whether the port belongs to the mapper group (else the demapper group). */
    public boolean mapperGroup() {
        return mapperGroup;
    }

    /** Whether a testbench drives this port (else it compares against it). */
    public boolean stimulus() {
        return stimulus;
    }
}
