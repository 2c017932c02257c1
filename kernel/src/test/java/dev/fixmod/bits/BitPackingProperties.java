package dev.fixmod.bits;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Arrays;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.IntRange;

/** Laws of bit packing, checked against a reference built from binary strings (JDK Integer.parseInt radix 2). */
class BitPackingProperties {

    @Property(tries = 300)
    void packMatchesTheBinaryStringReference(@ForAll("bits") byte[] bits, @ForAll @IntRange(max = 5) int offset) {
        byte[] source = shifted(bits, offset);
        byte[] packed = new byte[BitPacking.packedLength(bits.length) + 2];
        BitPacking.pack(source, offset, packed, 1, bits.length);
        StringBuilder s = new StringBuilder();
        for (byte b : bits) {
            s.append(b);
        }
        while (s.length() % 8 != 0) {
            s.append('0'); // zero padding in the low bits of the last byte
        }
        for (int i = 0; i < s.length() / 8; i++) {
            assertEquals((byte) Integer.parseInt(s.substring(8 * i, 8 * i + 8), 2), packed[1 + i], "byte " + i);
        }
        assertEquals(0, packed[0]);
        assertEquals(0, packed[packed.length - 1]);
    }

    @Property(tries = 300)
    void unpackInvertsPack(@ForAll("bits") byte[] bits, @ForAll @IntRange(max = 9) int offset) {
        byte[] packed = new byte[BitPacking.packedLength(bits.length)];
        BitPacking.pack(bits, 0, packed, 0, bits.length);
        byte[] back = new byte[bits.length + offset];
        BitPacking.unpack(packed, 0, back, offset, bits.length);
        assertArrayEquals(bits, Arrays.copyOfRange(back, offset, back.length));
    }

    @Property(tries = 300)
    void labelsMatchTheBinaryStringReferenceAndRoundTrip(@ForAll("bits") byte[] bits,
                                                         @ForAll @IntRange(min = 1, max = 31) int k) {
        int count = bits.length / k;
        int[] labels = new int[count];
        BitPacking.bitsToLabels(bits, 0, labels, 0, count, k);
        StringBuilder s = new StringBuilder();
        for (byte b : bits) {
            s.append(b);
        }
        for (int j = 0; j < count; j++) {
            assertEquals(Integer.parseInt(s.substring(j * k, j * k + k), 2), labels[j], "label " + j);
            assertEquals(labels[j], BitPacking.bitsToLabel(bits, j * k, k), "single label " + j);
        }
        byte[] back = new byte[count * k];
        BitPacking.labelsToBits(labels, 0, back, 0, count, k);
        assertArrayEquals(Arrays.copyOf(bits, count * k), back);
    }

    @Provide
    Arbitrary<byte[]> bits() {
        return Arbitraries.bytes().between((byte) 0, (byte) 1).array(byte[].class).ofMaxSize(200);
    }

    private static byte[] shifted(byte[] bits, int offset) {
        byte[] s = new byte[bits.length + offset];
        System.arraycopy(bits, 0, s, offset, bits.length);
        return s;
    }
}
