package dev.fixmod.bits;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

class PrbsTest {

    /** Sequences whose whole period is walked in the test (2^23 − 1 bits at most). */
    private static final List<Prbs> WALKED = List.of(Prbs.PRBS_7, Prbs.PRBS_9, Prbs.PRBS_11, Prbs.PRBS_15,
            Prbs.PRBS_20, Prbs.PRBS_23);

    @ParameterizedTest
    @EnumSource(Prbs.class)
    void followsTheStraightforwardShiftRegisterOverALongPrefix(Prbs prbs) {
        // Independent reference: ShiftRegister, one stage per array element (O.150 wording, from memory).
        int count = prbs.degree() >= 29 ? 4_000_000 : 300_000;
        byte[] expected = new ShiftRegister(prbs, prbs.defaultSeed()).next(count);
        byte[] got = new byte[count];
        prbs.generator().fill(got, 0, count);
        assertArrayEquals(expected, got, prbs.toString());
        long seed = 0x5A5A5A5AL & prbs.period();
        expected = new ShiftRegister(prbs, seed).next(10_000);
        got = new byte[10_000];
        prbs.generator(seed).fill(got, 0, got.length);
        assertArrayEquals(expected, got, prbs + " seed " + seed);
    }

    @Test
    void firstWordsDerivedByHandFromTheRecurrence() {
        // y(k) = y(k-6) xor y(k-7) from y(0..6) = 1 (all-ones seed), worked by hand:
        // y7..y12 = 0, y13 = y7^y6 = 1, y14..y18 = 0, y19 = y13^y12 = 1, y20 = y14^y13 = 1, y21..y24 = 0,
        // y25 = y19^y18 = 1, y26 = y20^y19 = 0, y27 = y21^y20 = 1, y28..y30 = 0, y31 = y25^y24 = 1
        // -> 1111 1110 0000 0100 0001 1000 0101 0001 = FE 04 18 51 (PRBS-7, not inverted).
        assertArrayEquals(new byte[] {(byte) 0xFE, 0x04, 0x18, 0x51}, firstBytes(Prbs.PRBS_7, 4));
        // PRBS-9, y(k) = y(k-5) xor y(k-9): y9..y13 = 0, y14 = y9^y5 = 1, y15 = y10^y6 = 1 -> FF 83.
        assertArrayEquals(new byte[] {(byte) 0xFF, (byte) 0x83}, firstBytes(Prbs.PRBS_9, 2));
        // PRBS-15 (inverted), y(k) = y(k-14) xor y(k-15): y15 = y1^y0 = 0 ... y28 = y14^y13 = 0, y29 = y15^y14 = 1;
        // uninverted FF FE 00 04 -> inverted 00 01 FF FB.
        assertArrayEquals(new byte[] {0x00, 0x01, (byte) 0xFF, (byte) 0xFB}, firstBytes(Prbs.PRBS_15, 4));
    }

    @Test
    void periodIsExactly2PowNMinus1() {
        for (Prbs prbs : WALKED) {
            int n = prbs.degree();
            int period = (int) prbs.period();
            byte[] bits = new byte[period + n];
            fillInChunks(prbs.generator(), bits);
            int mask = (1 << n) - 1;
            int first = window(bits, 0, n);
            int w = first;
            int recurrence = -1;
            for (int k = 1; k <= period; k++) {
                w = (w << 1 | bits[k + n - 1]) & mask; // the n bits from position k: the register state
                if (w == first) {
                    recurrence = k;
                    break;
                }
            }
            // n consecutive bits determine the rest, so the first recurrence of the first window is the period.
            assertEquals(period, recurrence, prbs.toString());
        }
    }

    @Test
    void golombsRunPostulatesHoldOverOnePeriod() {
        // Handbook fact (S. W. Golomb, Shift Register Sequences, randomness postulates R1, R2 for m-sequences):
        // one period of a degree-n maximal-length sequence has 2^(n-1) ones and 2^(n-1) - 1 zeros; of each kind
        // 2^(n-2-r) runs of length r for 1 <= r <= n-2; one run of n ones and one run of n-1 zeros. Inversion swaps
        // ones and zeros.
        for (Prbs prbs : WALKED) {
            int n = prbs.degree();
            int period = (int) prbs.period();
            byte[] bits = new byte[period];
            prbs.generator().fill(bits, 0, period);
            int one = prbs.inverted() ? 0 : 1; // the symbol of the run of n
            assertNotEquals(bits[0], bits[period - 1], "the default seed starts on a run boundary");
            long[][] runs = runLengths(bits, n + 1);
            long ones = 0;
            for (byte b : bits) {
                ones += b;
            }
            long many = prbs.inverted() ? period - ones : ones;
            assertEquals(1L << (n - 1), many, prbs + " count of the majority symbol");
            for (int r = 1; r <= n - 2; r++) {
                assertEquals(1L << (n - 2 - r), runs[one][r], prbs + " runs of " + r + " x " + one);
                assertEquals(1L << (n - 2 - r), runs[1 - one][r], prbs + " runs of " + r + " x " + (1 - one));
            }
            assertEquals(1, runs[one][n], prbs.toString());
            assertEquals(0, runs[one][n - 1], prbs.toString());
            assertEquals(1, runs[1 - one][n - 1], prbs.toString());
            assertEquals(0, runs[1 - one][n], prbs.toString());
        }
    }

    @Test
    void longestRunOfZerosIsTheOneTabulated() {
        // The "longest sequence of zeros" of each O.150 pattern (from memory of O.150): n-1 uninverted, n inverted.
        int[] tabulated = {6, 8, 10, 15, 19, 23};
        for (int i = 0; i < WALKED.size(); i++) {
            Prbs prbs = WALKED.get(i);
            byte[] bits = new byte[(int) prbs.period()];
            prbs.generator().fill(bits, 0, bits.length);
            long[][] runs = runLengths(bits, prbs.degree() + 1);
            int longest = 0;
            for (int r = 0; r < runs[0].length; r++) {
                if (runs[0][r] > 0) {
                    longest = r;
                }
            }
            assertEquals(tabulated[i], longest, prbs.toString());
        }
    }

    @Test
    void autocorrelationIsTwoValued() {
        // Handbook fact (Golomb's postulate R3 for m-sequences): the periodic autocorrelation of the +-1 sequence
        // is P at shift 0 and -1 at every other shift.
        for (Prbs prbs : List.of(Prbs.PRBS_7, Prbs.PRBS_9, Prbs.PRBS_11)) {
            int period = (int) prbs.period();
            byte[] bits = new byte[period];
            prbs.generator().fill(bits, 0, period);
            for (int shift = 1; shift < period; shift++) {
                int sum = 0;
                for (int k = 0; k < period; k++) {
                    sum += (bits[k] ^ bits[(k + shift) % period]) == 0 ? 1 : -1;
                }
                assertEquals(-1, sum, prbs + " shift " + shift);
            }
        }
    }

    @ParameterizedTest
    @EnumSource(Prbs.class)
    void polynomialIsPrimitiveSoEveryNonZeroSeedHasTheFullPeriod(Prbs prbs) {
        // Handbook fact (Lidl & Niederreiter, Finite Fields; Golomb): a recurrence of degree n whose characteristic
        // polynomial has x of multiplicative order 2^n - 1 (i.e. is primitive) has period 2^n - 1 from every non-zero
        // state. The recurrence y(k) = y(k-m) + y(k-n) has characteristic polynomial x^n + x^(n-m) + 1, the
        // reciprocal of x^n + x^m + 1 (same order); both are checked. This covers PRBS-29 and PRBS-31 too.
        int n = prbs.degree();
        long order = prbs.period();
        for (long poly : new long[] {1L << n | 1L << (n - prbs.tap()) | 1, 1L << n | 1L << prbs.tap() | 1}) {
            assertEquals(1L, powerOfX(order, poly, n), prbs + ": x^(2^n-1) = 1");
            for (long p : primeFactors(order)) {
                assertNotEquals(1L, powerOfX(order / p, poly, n), prbs + ": x^((2^n-1)/" + p + ") != 1");
            }
        }
    }

    @Test
    void aSeedIsAPhaseOfTheSameSequence() {
        Prbs prbs = Prbs.PRBS_9;
        int period = (int) prbs.period();
        byte[] reference = new byte[3 * period];
        prbs.generator().fill(reference, 0, reference.length);
        for (long seed : new long[] {1, 2, 0x155, 0x1FE, 0x100}) {
            byte[] bits = new byte[period];
            prbs.generator(seed).fill(bits, 0, period);
            // The seed is the first n uninverted bits: find that window in the reference and compare from there.
            int at = -1;
            for (int k = 0; k < period && at < 0; k++) {
                if (window(reference, k, prbs.degree()) == seed) {
                    at = k;
                }
            }
            assertTrue(at >= 0, "seed " + seed);
            assertArrayEquals(Arrays.copyOfRange(reference, at, at + period), bits, "seed " + seed);
        }
    }

    @Test
    void defaultSeedStartsWithTheRunOfNOnesBeforeInversion() {
        for (Prbs prbs : Prbs.values()) {
            byte[] bits = new byte[prbs.degree() + 1];
            prbs.generator().fill(bits, 0, bits.length);
            int one = prbs.inverted() ? 0 : 1;
            for (int i = 0; i < prbs.degree(); i++) {
                assertEquals(one, bits[i], prbs + " bit " + i);
            }
            assertEquals(1 - one, bits[prbs.degree()], prbs.toString());
        }
    }

    @Test
    void namesSeedsAndMessages() {
        assertEquals(Prbs.PRBS_23, Prbs.fromName("prbs-23"));
        assertEquals(Prbs.PRBS_23, Prbs.fromName("PRBS_23"));
        assertEquals("x^23 + x^18 + 1", Prbs.PRBS_23.polynomial());
        assertEquals(8_388_607L, Prbs.PRBS_23.period());
        assertEquals("prbs-23 (x^23 + x^18 + 1, inverted, seed 0x7fffff)", Prbs.PRBS_23.generator().toString());
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Prbs.fromName("prbs-8"));
        assertEquals("unknown PRBS 'prbs-8'; expected one of prbs-7, prbs-9, prbs-11, prbs-15, prbs-20, prbs-23,"
                + " prbs-29, prbs-31", e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> Prbs.PRBS_7.generator(0));
        assertEquals("seed of prbs-7 must be a non-zero 7-bit register state (1..127), got 0", e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> Prbs.PRBS_7.generator(128));
        assertThrows(IndexOutOfBoundsException.class, () -> Prbs.PRBS_7.generator().fill(new byte[4], 2, 3));
    }

    @Test
    void constantAlternatingAndRepeatingSources() {
        byte[] bits = new byte[7];
        BitSource.constant(1).fill(bits, 1, 5);
        assertArrayEquals(new byte[] {0, 1, 1, 1, 1, 1, 0}, bits);
        BitSource alternating = BitSource.alternating(1);
        byte[] a = new byte[3];
        byte[] b = new byte[4];
        alternating.fill(a, 0, 3);
        alternating.fill(b, 0, 4);
        assertArrayEquals(new byte[] {1, 0, 1}, a);
        assertArrayEquals(new byte[] {0, 1, 0, 1}, b); // the phase continues across calls
        byte[] r = new byte[9];
        BitSource.repeating((byte) 1, (byte) 0, (byte) 0, (byte) 0).fill(r, 0, 9);
        assertArrayEquals(new byte[] {1, 0, 0, 0, 1, 0, 0, 0, 1}, r);
        assertThrows(IllegalArgumentException.class, () -> BitSource.constant(2));
        assertThrows(IllegalArgumentException.class, () -> BitSource.alternating(-1));
        assertThrows(IllegalArgumentException.class, () -> BitSource.repeating());
        assertThrows(IllegalArgumentException.class, () -> BitSource.repeating((byte) 0, (byte) 3));
    }

    // ---- helpers ---------------------------------------------------------------------------------------------

    private static byte[] firstBytes(Prbs prbs, int count) {
        byte[] bits = new byte[8 * count];
        prbs.generator().fill(bits, 0, bits.length);
        byte[] packed = new byte[count];
        BitPacking.pack(bits, 0, packed, 0, bits.length);
        return packed;
    }

    /** Fills in uneven chunks, so chunk boundaries of the generator and of the caller never line up. */
    private static void fillInChunks(BitSource source, byte[] bits) {
        int at = 0;
        int chunk = 1;
        while (at < bits.length) {
            int len = Math.min(chunk, bits.length - at);
            source.fill(bits, at, len);
            at += len;
            chunk = chunk * 3 % 1009 + 1;
        }
    }

    /** The uninverted register state: the n bits from position k, read MSB first (inversion undone). */
    private static int window(byte[] bits, int k, int n) {
        int w = 0;
        for (int i = 0; i < n; i++) {
            w = w << 1 | bits[k + i];
        }
        return w;
    }

    /** runs[symbol][length] over a sequence that starts and ends on a run boundary. */
    private static long[][] runLengths(byte[] bits, int maxLength) {
        long[][] runs = new long[2][maxLength + 1];
        int start = 0;
        for (int k = 1; k <= bits.length; k++) {
            if (k == bits.length || bits[k] != bits[start]) {
                runs[bits[start]][Math.min(k - start, maxLength)]++;
                start = k;
            }
        }
        return runs;
    }

    /** x^e modulo the GF(2) polynomial {@code poly} of degree n (bit i = coefficient of x^i). */
    private static long powerOfX(long e, long poly, int n) {
        long result = 1;
        long base = 2; // x
        while (e > 0) {
            if ((e & 1) != 0) {
                result = mulMod(result, base, poly, n);
            }
            base = mulMod(base, base, poly, n);
            e >>>= 1;
        }
        return result;
    }

    private static long mulMod(long a, long b, long poly, int n) {
        long product = 0; // degree < 2n - 1 <= 61
        for (int i = 0; i < n; i++) {
            if ((b >>> i & 1) != 0) {
                product ^= a << i;
            }
        }
        for (int d = 2 * n - 2; d >= n; d--) {
            if ((product >>> d & 1) != 0) {
                product ^= poly << (d - n);
            }
        }
        return product;
    }

    private static List<Long> primeFactors(long v) {
        List<Long> factors = new ArrayList<>();
        for (long p = 2; p * p <= v; p++) {
            if (v % p == 0) {
                factors.add(p);
                while (v % p == 0) {
                    v /= p;
                }
            }
        }
        if (v > 1) {
            factors.add(v);
        }
        return factors;
    }
}
