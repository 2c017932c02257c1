package dev.fixmod.verify.bench;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.demap.SoftAlgorithm;
import dev.fixmod.verify.cli.FixmodCommand;
import dev.fixmod.verify.loss.LossSpec;
import dev.fixmod.verify.loss.LossSpecReader;
import dev.fixmod.verify.loss.PointResult;
import dev.fixmod.verify.loss.Simulation;
import java.io.IOException;
import java.io.InputStream;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
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
    void theChainBenchmarkRunsTheLossEnginesChunks() throws Exception {
        Workload w = Workload.of("16-qam");
        Simulation.Worker worker = w.chainWorker();
        LossSpec spec = LossSpecReader.parse("{\"constellation\": \"qam16\", \"mapper\": {\"format\": \"Q2.12\"},"
                + " \"demapper\": {\"input\": {\"format\": \"Q2.12\", \"rounding\": \"half-even\"},"
                + " \"algorithm\": \"max-log-per-axis\", \"reference\": \"max-log-per-axis\","
                + " \"llr\": {\"format\": \"Q5.2\"}}, \"noise\": {\"es-n0-db\": [9, 12], \"seed\": "
                + Workload.SEED + ", \"gaussian\": \"ziggurat\"}, \"simulation\": {\"chunk-symbols\": "
                + Workload.BLOCK + ", \"min-bits\": 0, \"max-bits\": " + Workload.BLOCK * 4 + "}}", "test");
        ExecutorService pool = Executors.newSingleThreadExecutor();
        try {
            // A one-chunk point of 'fixmod loss' is the benchmark's first chunk, count for count.
            PointResult point = new Simulation(spec, pool, 1).run(spec.base(), 0, 1);
            worker.run(0);
            assertEquals(point, worker.result(0, 1));
            assertEquals(Workload.BLOCK, worker.symbols());
            assertTrue(worker.floatBitErrors() > 0 && worker.fixedBitErrors() > 0, "errors at Es/N0 12 dB");
            // A reused worker carries nothing over from the chunk before.
            worker.run(1);
            worker.run(0);
            assertEquals(point, worker.result(0, 1));
        } finally {
            pool.shutdownNow();
        }
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
