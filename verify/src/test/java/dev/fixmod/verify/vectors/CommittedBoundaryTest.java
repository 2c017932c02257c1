package dev.fixmod.verify.vectors;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;

import java.io.IOException;
import java.nio.file.Path;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.Test;

/**
 * The threshold vectors of the committed sets whose slicer has no per-axis thresholds, read from their CSV files as a
 * testbench would: each below/above pair decides differently, and the pairs cross every decision boundary once.
 */
class CommittedBoundaryTest {

    /** The distinct label pairs decided either side of a threshold-minus/plus pair, in file order of the pairs. */
    private static Set<Set<Integer>> crossedPairs(String set) throws IOException {
        Path dir = VectorSuiteTest.VECTORS.resolve(set);
        List<Map<String, String>> in = VectorSetGeneratorTest.csv(dir, "demapper-in.csv");
        List<Map<String, String>> hard = VectorSetGeneratorTest.csv(dir, "hard.csv");
        Set<Set<Integer>> pairs = new HashSet<>();
        int minus = CornerFlag.THRESHOLD_MINUS_LSB.mask();
        int plus = CornerFlag.THRESHOLD_PLUS_LSB.mask();
        int pending = -1;
        for (int n = 0; n < in.size(); n++) {
            int f = VectorSetGeneratorTest.flags(in.get(n));
            int label = Integer.parseInt(hard.get(n).get("label"));
            if ((f & minus) != 0) {
                pending = label;
            } else if ((f & plus) != 0 && pending >= 0) {
                assertNotEquals(pending, label, set + " vector " + n + " decides as the code below the boundary");
                pairs.add(Set.of(pending, label));
                pending = -1;
            }
        }
        return pairs;
    }

    @Test
    void eightPskCrossesEachOfItsEightSectorBoundaries() throws IOException {
        // M-PSK has M decision boundaries, one between each pair of adjacent points (common practice, no source).
        Set<Set<Integer>> pairs = crossedPairs("psk8");
        assertEquals(8, pairs.size(), pairs.toString());
    }

    @Test
    void crossThirtyTwoQamCrossesEachOfItsFiftyTwoNeighbourBoundaries() throws IOException {
        // Cross 32-QAM is the 6 x 6 grid without its four corners: rows of 4, 6, 6, 6, 6, 4 points give 3 + 5·4 + 3
        // = 26 horizontal neighbour pairs, and as many vertical ones (common practice, no source).
        Set<Set<Integer>> pairs = crossedPairs("cqam32");
        assertEquals(52, pairs.size(), pairs.toString());
    }
}
