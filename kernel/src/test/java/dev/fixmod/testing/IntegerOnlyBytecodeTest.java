package dev.fixmod.testing;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

class IntegerOnlyBytecodeTest {

    @Test
    void acceptsIntegerArithmeticAndIntegerJdkCalls() {
        IntegerOnlyBytecode.assertIntegerOnly(BytecodeSamples.class, "integerOnly", "duplicatesOnly");
    }

    @Test
    void catchesDoubleArithmeticInTheNamedMethod() {
        List<String> uses = IntegerOnlyBytecode.floatingPointUses(BytecodeSamples.class, "roundsThroughDouble");
        // javac compiles (int) (a * 0.5) to i2d, ldc2_w 0.5d, dmul, d2i (JVM specification, chapter 6).
        assertTrue(uses.stream().anyMatch(u -> u.contains("i2d")), uses::toString);
        assertTrue(uses.stream().anyMatch(u -> u.contains("dmul")), uses::toString);
        assertTrue(uses.stream().anyMatch(u -> u.contains("d2i")), uses::toString);
        assertTrue(uses.stream().anyMatch(u -> u.contains("ldc2_w") && u.contains("double")), uses::toString);
        AssertionError e = assertThrows(AssertionError.class,
                () -> IntegerOnlyBytecode.assertIntegerOnly(BytecodeSamples.class, "roundsThroughDouble"));
        assertTrue(e.getMessage().contains("BytecodeSamples"), e.getMessage());
    }

    @Test
    void followsCallsIntoHelpers() {
        List<String> uses = IntegerOnlyBytecode.floatingPointUses(BytecodeSamples.class, "callsHelperThatUsesDouble");
        assertFalse(uses.isEmpty());
        assertTrue(uses.stream().allMatch(u -> u.contains("-> BytecodeSamples.hiddenHelper")), uses::toString);
        assertTrue(uses.stream().anyMatch(u -> u.contains("java/lang/Math.floor:(D)D")), uses::toString);
    }

    @Test
    void catchesDoubleFieldsFloatsAndMathCalls() {
        assertTrue(IntegerOnlyBytecode.floatingPointUses(BytecodeSamples.class, "readsDoubleField").stream()
                .anyMatch(u -> u.contains("getfield") && u.contains(":D")));
        assertTrue(IntegerOnlyBytecode.floatingPointUses(BytecodeSamples.class, "callsStrictMath").stream()
                .anyMatch(u -> u.contains("java/lang/StrictMath.sqrt:(D)D")));
        List<String> floats = IntegerOnlyBytecode.floatingPointUses(BytecodeSamples.class, "usesFloat");
        assertTrue(floats.stream().anyMatch(u -> u.contains("i2f")), floats::toString);
        assertTrue(floats.stream().anyMatch(u -> u.contains("fmul")), floats::toString);
    }

    @Test
    void unknownMethodNamesFailInsteadOfPassingEmpty() {
        AssertionError e = assertThrows(AssertionError.class,
                () -> IntegerOnlyBytecode.assertIntegerOnly(BytecodeSamples.class, "noSuchMethod"));
        assertTrue(e.getMessage().contains("noSuchMethod"), e.getMessage());
        assertThrows(AssertionError.class, () -> IntegerOnlyBytecode.assertIntegerOnly(BytecodeSamples.class));
    }

    @Test
    void descriptorsAreReadByType() {
        assertTrue(IntegerOnlyBytecode.signatureHasFloatingPoint("(I)D"));
        assertTrue(IntegerOnlyBytecode.signatureHasFloatingPoint("(JF)I"));
        assertFalse(IntegerOnlyBytecode.signatureHasFloatingPoint("([D)I"), "an array is a reference");
        assertFalse(IntegerOnlyBytecode.signatureHasFloatingPoint("(Ldev/fixmod/Double;[[DI)V"));
        assertTrue(IntegerOnlyBytecode.signatureHasFloatingPoint("([DD)V"));
        assertEquals(false, IntegerOnlyBytecode.signatureHasFloatingPoint("()V"));
    }
}
