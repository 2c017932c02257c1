package dev.fixmod.verify.bench;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.demap.FixedSoftDemapper;
import dev.fixmod.demap.SoftAlgorithm;
import dev.fixmod.demap.SoftDemapper;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.verify.cli.FixmodCommand;
import dev.fixmod.verify.theory.GmiEstimator;
import java.io.IOException;
import java.io.InputStream;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.util.List;
import org.junit.jupiter.api.Test;

/** The suite is built and wired: no timing is asserted anywhere. */
class BenchSuiteTest {

    @Test
    void theAnnotationProcessorWroteTheBenchmarkList() throws IOException {
        try (InputStream in = getClass().getClassLoader().getResourceAsStream("META-INF/BenchmarkList")) {
            assertNotNull(in, "META-INF/BenchmarkList is missing: the JMH annotation processor did not run");
            String list = new String(in.readAllBytes(), StandardCharsets.UTF_8);
            for (String bench : List.of("ChainBench", "LlrBench", "MapperBench", "NoiseBench", "SlicerBench",
                    "WriterBench")) {
                assertTrue(list.contains(BenchRunner.PACKAGE + bench), bench + " is not in the benchmark list");
            }
        }
    }

    @Test
    void helpAndListWork() {
        Run help = run("bench", "--help");
        assertEquals(0, help.status);
        assertTrue(help.out.contains("--quick") && help.out.contains("--results") && help.out.contains("--json"),
                help.out);
        Run list = run("bench", "--list", "Noise");
        assertEquals(0, list.status);
        assertEquals("NoiseBench.gaussian  method=box-muller,ziggurat", list.out.strip());
    }

    @Test
    void badInputExitsTwoWithOneLine() {
        Run pattern = run("bench", "--list", "[");
        assertEquals(2, pattern.status);
        assertTrue(pattern.err.contains("not a regular expression"), pattern.err);
        Run growth = run("bench", "--growth", "--growth-max", "12345");
        assertEquals(2, growth.status);
        assertTrue(growth.err.contains("power of ten"), growth.err);
        Run listJson = run("bench", "--list", "--json");
        assertEquals(2, listJson.status);
        assertTrue(listJson.err.contains("--list runs nothing"), listJson.err);
        Run growthJson = run("bench", "--growth", "--json");
        assertEquals(2, growthJson.status);
        assertTrue(growthJson.err.contains("--growth takes no"), growthJson.err);
    }

    @Test
    void everyLlrParameterBuildsAndTheFixedPerAxisEqualsTheExhaustiveReference() {
        for (String scenario : List.of("16-qam", "64-qam", "256-qam", "1024-qam")) {
            Workload w = Workload.of(scenario);
            int k = w.bitsPerSymbol();
            int[] perAxis = new int[Workload.BLOCK * k];
            int[] exhaustive = new int[Workload.BLOCK * k];
            LlrBench.fixedDemapper(SoftAlgorithm.MAX_LOG_PER_AXIS, w)
                    .llr(w.iCodes, w.qCodes, 0, Workload.BLOCK, perAxis, 0);
            LlrBench.fixedDemapper(SoftAlgorithm.MAX_LOG, w).llr(w.iCodes, w.qCodes, 0, Workload.BLOCK, exhaustive, 0);
            // The per-axis datapath's documented bit-exactness against the exhaustive one, on the benchmark data.
            assertArrayEquals(exhaustive, perAxis, scenario);
        }
        LlrBench bench = new LlrBench();
        for (String demapper : List.of("float:log-map:8-psk", "fixed:max-log:8-psk", "fixed:folded-linear:64-qam")) {
            bench.demapper = demapper;
            bench.setUp();
            assertNotNull(bench.demap(), demapper);
        }
    }

    @Test
    void theChainCountsWhatTheKernelComputes() {
        Workload w = Workload.of("16-qam");
        MonteCarloChain chain = new MonteCarloChain(w, SoftAlgorithm.MAX_LOG_PER_AXIS, 512);
        chain.run(0);
        int k = w.bitsPerSymbol();
        OverflowCounter clip = OverflowCounter.unnamed();
        double[] re = chain.received(false);
        double[] im = chain.received(true);
        for (int n = 0; n < 512; n++) {
            assertEquals(Workload.INPUT.quantize(re[n], clip), chain.iCodes()[n], "ADC, I of " + n);
            assertEquals(Workload.INPUT.quantize(im[n], clip), chain.qCodes()[n], "ADC, Q of " + n);
        }
        // The float GMI from the interpolated penalty is within 3.1e-5 nat per bit of the per-sample estimate.
        SoftDemapper floating = SoftDemapper.create(SoftAlgorithm.MAX_LOG_PER_AXIS, w.constellation, w.options);
        double[] llr = new double[512 * k];
        floating.llr(re, im, 0, 512, llr, 0);
        byte[] bits = sentBits(chain, w, 512);
        GmiEstimator exact = new GmiEstimator(k);
        exact.add(llr, 0, bits, 0, llr.length);
        double bound = k * 3.1e-5 / Math.log(2);
        assertEquals(exact.gmi(), chain.floatGmi(), bound);
        long errors = 0;
        for (int i = 0; i < llr.length; i++) {
            errors += bits[i] ^ (llr[i] < 0 ? 1 : 0);
        }
        assertEquals(errors, chain.floatBitErrors());
        FixedSoftDemapper fixed = LlrBench.fixedDemapper(SoftAlgorithm.MAX_LOG_PER_AXIS, w);
        int[] codes = new int[512 * k];
        fixed.llr(chain.iCodes(), chain.qCodes(), 0, 512, codes, 0);
        long fixedErrors = 0;
        for (int i = 0; i < codes.length; i++) {
            fixedErrors += bits[i] ^ (codes[i] < 0 ? 1 : 0);
        }
        assertEquals(fixedErrors, chain.fixedBitErrors());
        assertTrue(chain.fixedGmi() > 0 && chain.fixedGmi() <= k, "GMI " + chain.fixedGmi());
    }

    /** The label bits of the chain's symbols, recomputed from its label stream. */
    private static byte[] sentBits(MonteCarloChain chain, Workload w, int count) {
        int k = w.bitsPerSymbol();
        int[] labels = chain.labels();
        byte[] bits = new byte[count * k];
        for (int n = 0; n < count; n++) {
            for (int b = 0; b < k; b++) {
                bits[n * k + b] = (byte) ((labels[n] >>> (k - 1 - b)) & 1);
            }
        }
        return bits;
    }

    private record Run(int status, String out, String err) {
    }

    private static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int status = FixmodCommand.commandLine(new PrintWriter(out, true), new PrintWriter(err, true)).execute(args);
        return new Run(status, out.toString(), err.toString());
    }
}
