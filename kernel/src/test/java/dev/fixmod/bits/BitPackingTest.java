package dev.fixmod.bits;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;

class BitPackingTest {

    @Test
    void packsMsbFirstAndPadsTheLastByteWithZeros() {
        // The examples of the BitPacking javadoc; MSB-first packing is common practice, no source.
        assertArrayEquals(new byte[] {(byte) 0xB0}, pack(1, 0, 1, 1, 0, 0, 0, 0));
        assertArrayEquals(new byte[] {(byte) 0xAC}, pack(1, 0, 1, 0, 1, 1));
        assertArrayEquals(new byte[] {(byte) 0x80}, pack(1));
        assertArrayEquals(new byte[] {(byte) 0xFF, 0x00, (byte) 0x80},
                pack(1, 1, 1, 1, 1, 1, 1, 1, 0, 0, 0, 0, 0, 0, 0, 0, 1));
        assertEquals(0, BitPacking.packedLength(0));
        assertEquals(1, BitPacking.packedLength(1));
        assertEquals(1, BitPacking.packedLength(8));
        assertEquals(2, BitPacking.packedLength(9));
        assertEquals(268_435_456, BitPacking.packedLength(Integer.MAX_VALUE));
    }

    @Test
    void labelsCarryTheFirstBitInTimeAsTheirMsb() {
        // DESIGN.md label convention: b0 is the first bit in time and the most significant bit of the label.
        byte[] bits = {1, 0, 1, 0, 1, 1};
        int[] labels = new int[2];
        BitPacking.bitsToLabels(bits, 0, labels, 0, 2, 3);
        assertArrayEquals(new int[] {5, 3}, labels);
        byte[] back = new byte[8];
        BitPacking.labelsToBits(labels, 0, back, 1, 2, 3);
        assertArrayEquals(new byte[] {0, 1, 0, 1, 0, 1, 1, 0}, back); // offset honoured, the rest untouched
        int[] wide = new int[1];
        BitPacking.bitsToLabels(new byte[] {1, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 1}, 0, wide, 0, 1, 16);
        assertEquals(0x8001, wide[0]);
        assertEquals(5, BitPacking.bitsToLabel(bits, 0, 3));
        assertEquals(3, BitPacking.bitsToLabel(bits, 3, 3));
        byte[] one = {7, 7, 7, 7, 7};
        BitPacking.labelToBits(6, one, 1, 3);
        assertArrayEquals(new byte[] {7, 1, 1, 0, 7}, one); // offset honoured, the rest untouched
    }

    @Test
    void regionChecksNameTheFirstBadIndex() {
        BitPacking.requireBits(new byte[] {0, 1, 1, 0}, 0, 4);
        BitPacking.requireLabels(new int[] {0, 3, 2}, 0, 3, 4);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> BitPacking.requireBits(new byte[] {0, 1, 2, -1}, 1, 3));
        assertEquals("bit at index 2 is 2; unpacked bits are one byte each, 0 or 1", e.getMessage());
        e = assertThrows(IllegalArgumentException.class,
                () -> BitPacking.requireLabels(new int[] {9, 0, -1, 4}, 1, 3, 4));
        assertEquals("label -1 at index 2 is outside 0..3 of a 4-point constellation", e.getMessage());
        // Outside the region nothing is looked at.
        BitPacking.requireBits(new byte[] {5, 0, 1, 5}, 1, 2);
        BitPacking.requireLabels(new int[] {9, 0, 1, 9}, 1, 2, 2);
    }

    @Test
    void unpackIgnoresPaddingAndHonoursOffsets() {
        byte[] bits = new byte[12];
        bits[0] = 9;
        bits[11] = 9;
        BitPacking.unpack(new byte[] {0x00, (byte) 0xA5, (byte) 0xFF}, 1, bits, 1, 10);
        assertArrayEquals(new byte[] {9, 1, 0, 1, 0, 0, 1, 0, 1, 1, 1, 9}, bits);
    }

    @Test
    void badInputIsNamed() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> BitPacking.pack(new byte[] {0, 1, 0, 1, 0, 1, 0, 1, 0, 2}, 0, new byte[2], 0, 10));
        assertEquals("bits[9] = 2: a bit must be 0 or 1", e.getMessage());
        e = assertThrows(IllegalArgumentException.class,
                () -> BitPacking.pack(new byte[] {0, 1, -1, 1, 0, 1, 0, 1}, 0, new byte[1], 0, 8));
        assertEquals("bits[2] = -1: a bit must be 0 or 1", e.getMessage());
        e = assertThrows(IllegalArgumentException.class,
                () -> BitPacking.labelsToBits(new int[] {3, 8}, 0, new byte[6], 0, 2, 3));
        assertEquals("labels[1] = 8 does not fit 3 bits (0..7)", e.getMessage());
        e = assertThrows(IllegalArgumentException.class,
                () -> BitPacking.bitsToLabels(new byte[] {1, 0, 7}, 0, new int[1], 0, 1, 3));
        assertEquals("bits[2] = 7: a bit must be 0 or 1", e.getMessage());
        e = assertThrows(IllegalArgumentException.class,
                () -> BitPacking.bitsToLabels(new byte[64], 0, new int[1], 0, 1, 32));
        assertEquals("bits per label must be 1..31, got 32", e.getMessage());
        assertThrows(IndexOutOfBoundsException.class, () -> BitPacking.pack(new byte[8], 1, new byte[1], 0, 8));
        assertThrows(IndexOutOfBoundsException.class, () -> BitPacking.unpack(new byte[1], 0, new byte[9], 0, 9));
    }

    private static byte[] pack(int... bits) {
        byte[] b = new byte[bits.length];
        for (int i = 0; i < bits.length; i++) {
            b[i] = (byte) bits[i];
        }
        byte[] packed = new byte[BitPacking.packedLength(bits.length)];
        BitPacking.pack(b, 0, packed, 0, bits.length);
        return packed;
    }
}
