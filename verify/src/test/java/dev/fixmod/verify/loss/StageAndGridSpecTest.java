package dev.fixmod.verify.loss;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/**
 * Reading the internal stages and the grids of a loss specification: what is accepted means what the vector
 * specification's keys mean, and what is refused gets one message with the file, line and column, the JSON path and
 * what would be accepted.
 */
class StageAndGridSpecTest {

    private static void refused(String json, String expected) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> LossSpecReader.parse(json, "test.json"), json);
        assertTrue(Pattern.compile("test\\.json:1:\\d+: " + Pattern.quote(expected)).matcher(e.getMessage())
                .lookingAt(), "expected '" + expected + "' in: " + e.getMessage());
    }

    private static String message(String json) {
        return assertThrows(IllegalArgumentException.class, () -> LossSpecReader.parse(json, "test.json"), json)
                .getMessage();
    }

    private static String axis(String parameter, String values) {
        return "{\"parameter\": \"" + parameter + "\", \"values\": [" + values + "]}";
    }

    private static String grid(String a, String b) {
        return "{\"sweep\": [{\"grid\": [" + a + ", " + b + "]}]}";
    }

    @Test
    void stagesAreReadWithTheVectorSpecificationsShapes() {
        LossSpec s = LossSpecReader.parse("{\"demapper\": {\"rounding\": \"floor\","
                + " \"metric\": {\"format\": \"Q6.12\"},"
                + " \"scale-constant\": \"UQ6.10\", \"scale\": {\"format\": \"Q7.4\", \"overflow\": \"wrap\"}}}",
                "test.json");
        Design d = s.base();
        // A stage's rounding defaults to demapper.rounding, its overflow to the suggestion's (saturate).
        assertEquals(new Quantizer(QFormat.parse("Q6.12"), Rounding.FLOOR, Overflow.SATURATE), d.metric());
        assertEquals(QFormat.parse("UQ6.10"), d.scaleConstant());
        assertEquals(new Quantizer(QFormat.parse("Q7.4"), Rounding.FLOOR, Overflow.WRAP), d.scale());
        var spec = d.llrSpec(d.receiveRom(), s.smallestN0());
        assertEquals(d.metric(), spec.metric());
        assertEquals(d.scale(), spec.scale());
        assertEquals(Rounding.FLOOR, spec.constantRounding());
        assertTrue(d.describe().contains("metric Q6.12, scale constant UQ6.10, scale Q7.4"), d.describe());
        // Left out, a stage is the kernel's suggestion.
        Design plain = LossSpecReader.parse("{}", "test.json").base();
        assertNull(plain.metric());
        assertNull(plain.scaleConstant());
        assertNull(plain.scale());
    }

    @Test
    void aStagesOwnRoundingIsKeptAndTheRoundingSweepSetsThemAll() {
        LossSpec s = LossSpecReader.parse("{\"demapper\": {\"input\": {\"rounding\": \"floor\"},"
                + " \"metric\": {\"format\": \"Q6.12\", \"rounding\": \"half-up\"}},"
                + " \"sweep\": [{\"parameter\": \"rounding\", \"values\": [\"toward-zero\"]}]}", "test.json");
        Design base = s.base();
        assertEquals(Rounding.FLOOR, base.inputQuantizer().rounding());
        assertEquals(Rounding.HALF_UP, base.metric().rounding());
        assertEquals(Rounding.HALF_EVEN, base.llr().rounding());
        assertEquals(Rounding.HALF_EVEN, base.receiveRom().quantizer().rounding(), "constants: demapper.rounding");
        Design swept = s.sweeps().get(0).designs().get(0);
        for (Quantizer q : new Quantizer[] {swept.inputQuantizer(), swept.metric(), swept.llr(),
            swept.receiveRom().quantizer()}) {
            assertEquals(Rounding.TOWARD_ZERO, q.rounding(), q.toString());
        }
    }

    @Test
    void badStagesAreRefusedAtTheirKey() {
        refused("{\"demapper\": {\"metric\": {\"format\": \"Q5.x\"}}}", "demapper.metric.format: ");
        refused("{\"demapper\": {\"metric\": \"Q5.0\"}}",
                "demapper.metric: expected a JSON object {...}, got the string \"Q5.0\"");
        refused("{\"demapper\": {\"metric\": {\"overflow\": \"clamp\"}}}", "demapper.metric.overflow: ");
        refused("{\"demapper\": {\"scale-constant\": 7}}",
                "demapper.scale-constant: expected a string, got the number 7");
        refused("{\"demapper\": {\"scale\": {\"format\": \"Q6.5\", \"x\": 1}}}",
                "demapper.scale.x: unknown key \"x\"; expected one of format, rounding, overflow");
        refused("{\"demapper\": {\"scaling\": \"unscaled\", \"scale\": {\"format\": \"Q6.5\"}}}",
                "demapper.scale: an unscaled datapath has no scale; remove the key or use"
                        + " \"scaling\": \"noise-scaled\"");
        refused("{\"demapper\": {\"scale-constant\": \"UQ1.2\"}}", "demapper.scale-constant: scale constant K = ");
        String k = message("{\"demapper\": {\"scale-constant\": \"UQ1.2\"}}");
        assertTrue(k.contains("does not fit UQ1.2") && k.endsWith("add integer bits"), k);
    }

    @Test
    void badStageSweepsAreRefusedAtTheirValue() {
        refused("{\"sweep\": [" + axis("metric-word-length", "12, 1") + "]}",
                "sweep[0].values[1]: 1 is not a valid number of bits here; expected an integer from 2 to 32");
        refused("{\"sweep\": [" + axis("scale-word-length", "33") + "]}", "sweep[0].values[0]: 33 is not a valid");
        refused("{\"demapper\": {\"scaling\": \"unscaled\"}, \"sweep\": [" + axis("scale-word-length", "8") + "]}",
                "sweep[0].values[0]: an unscaled datapath has no scale stage to size");
        // The default 16-QAM design's K is 40 at 10 dB: 4 bits keep its 6 integer bits and cannot hold it.
        refused("{\"sweep\": [" + axis("scale-constant-word-length", "16, 4") + "]}",
                "sweep[0].values[1]: scale constant K = ");
    }

    @Test
    void badGridsAreRefusedWithTheirPath() {
        String in = axis("input-word-length", "8, 10");
        String llr = axis("llr-word-length", "4, 5");
        refused("{\"sweep\": [{\"grid\": 3}]}", "sweep[0].grid: expected an array of two sweeps");
        refused("{\"sweep\": [{\"grid\": [" + in + "]}]}", "sweep[0].grid: expected an array of two sweeps [{");
        assertTrue(message("{\"sweep\": [{\"grid\": [" + in + "]}]}").endsWith(", got an array of 1"));
        refused("{\"sweep\": [{\"grid\": [" + in + ", " + llr + ", " + llr + "]}]}", "sweep[0].grid: expected");
        refused("{\"sweep\": [{\"grid\": [3, " + llr + "]}]}", "sweep[0].grid[0]: expected a JSON object {...}");
        refused("{\"sweep\": [{\"grid\": [" + in + ", " + llr + "], \"parameter\": \"llr-scale\"}]}",
                "sweep[0].parameter: unknown key \"parameter\" beside \"grid\"");
        refused("{\"sweep\": [{\"parameters\": [\"llr-scale\"]}]}",
                "sweep[0].parameters: unknown key \"parameters\"; expected one of parameter, values, grid");
        refused(grid(in, axis("input-fractional-bits", "5, 7")), "sweep[0].grid[1].parameter: input-word-length and"
                + " input-fractional-bits both set the input format; a grid crosses two parameters that set different");
        refused(grid(llr, llr), "sweep[0].grid[1].parameter: llr-word-length is crossed with itself");
        refused(grid(in, axis("llr-word-length", "4, 13")), "sweep[0].grid[1].values[1]: ");
        refused(grid(in, "{\"parameter\": \"llr-word-length\"}"), "sweep[0].grid[1]: a sweep needs \"parameter\"");
        StringBuilder many = new StringBuilder();
        for (int i = 1; i <= 17; i++) {
            many.append(i == 1 ? "" : ", ").append(0.25 * i);
        }
        refused(grid(axis("llr-scale", many.toString()), axis("back-off-db", many.substring(0, many.lastIndexOf(",")))),
                "sweep[0].grid: 17 x 16 = 272 combinations; expected at most 256");
        // K fits each value alone but not the combination: the message names the combination.
        refused("{\"demapper\": {\"scale-constant\": \"UQ6.10\"}, "
                + grid(axis("llr-scale", "1, 64"), llr).substring(1),
                "sweep[0].grid: llr-scale = 64, llr-word-length = 4: scale constant K = ");
    }

    @Test
    void aGridCountsAsOneSweepAndEachCombinationCountsAgainstTheBitLimit() {
        StringBuilder levels = new StringBuilder();
        for (int i = 0; i < 40; i++) {
            levels.append(i == 0 ? "" : ", ").append(i);
        }
        StringBuilder sixteen = new StringBuilder();
        for (int i = 1; i <= 16; i++) {
            sixteen.append(i == 1 ? "" : ", ").append(0.25 * i);
        }
        String head = "{\"noise\": {\"eb-n0-db\": [" + levels + "]}, \"simulation\": {\"max-bits\": 1000000},"
                + " \"sweep\": [";
        // One sweep of 16 values: 17 designs x 40 levels x 1 015 808 bits, below 10^10.
        LossSpecReader.parse(head + axis("llr-scale", sixteen.toString()) + "]}", "test.json");
        // A 16 x 16 grid: 257 designs x 40 levels, above.
        refused(head + "{\"grid\": [" + axis("llr-scale", sixteen.toString()) + ", "
                + axis("back-off-db", sixteen.toString()) + "]}]}",
                "simulation.max-bits: the run could simulate 10280 points x 1015808 bits, more than the limit");
        String nine = String.join(", ", java.util.Collections.nCopies(8, axis("llr-scale", "2")));
        refused("{\"sweep\": [" + nine + ", {\"grid\": [" + axis("llr-scale", "2") + ", "
                + axis("llr-word-length", "4") + "]}]}", "sweep: 9 sweeps; expected at most 8 (a grid counts as one)");
    }
}
