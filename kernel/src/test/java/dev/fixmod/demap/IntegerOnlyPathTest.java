package dev.fixmod.demap;

import dev.fixmod.map.FixedGain;
import dev.fixmod.map.FixedMapper;
import dev.fixmod.testing.IntegerOnlyBytecode;
import org.junit.jupiter.api.Test;

/**
 * DESIGN.md contract: the per-sample methods of the fixed mapper, slicers and normalizers perform no floating-point
 * operation. The check reads their bytecode (and that of every kernel method they call).
 */
class IntegerOnlyPathTest {
    @Test
    void fixedMapper() {
        IntegerOnlyBytecode.assertIntegerOnly(FixedMapper.class, "mapLabels", "mapBits");
    }

    @Test
    void fixedGain() {
        IntegerOnlyBytecode.assertIntegerOnly(FixedGain.class, "apply");
    }

    @Test
    void fixedSlicers() {
        IntegerOnlyBytecode.assertIntegerOnly(FixedSlicer.class, "slice", "sliceLabels", "sliceBits");
        IntegerOnlyBytecode.assertIntegerOnly(FixedAxisSlicer.class, "decide", "onBoundary");
        IntegerOnlyBytecode.assertIntegerOnly(FixedSectorSlicer.class, "decide", "onBoundary");
        IntegerOnlyBytecode.assertIntegerOnly(FixedNearestSlicer.class, "decide", "onBoundary");
    }

    @Test
    void blockNormalizer() {
        IntegerOnlyBytecode.assertIntegerOnly(BlockNormalizer.class, "normalize");
    }
}
