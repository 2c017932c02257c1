package dev.fixmod.verify.compare;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.InputStream;
import org.junit.jupiter.api.Test;

/**
 * Dumps far larger than the engine's buffers compare without being held in memory: the words are generated on the
 * fly by an input stream that never exists as a whole, so only the readers' and the ring buffers' fixed arrays are
 * needed (a 10^8-line dump differs only in running time).
 */
class StreamingTest {
    private static final int WORDS = 400_000;

    /** 16-bit words n * 40503 mod 2^16 as "%04x\n" lines, with one word replaced when {@code flipAt >= 0}. */
    static InputStream generated(long count, long flipAt) {
        return new InputStream() {
            private long n;
            private int pos = 5;
            private final byte[] line = new byte[5];

            @Override
            public int read() {
                if (pos == 5) {
                    if (n == count) {
                        return -1;
                    }
                    long w = (n * 40503) & 0xFFFF;
                    if (n == flipAt) {
                        w ^= 0x1000; // bit 4 of field llr0: 16 LSB, not a rounding-like difference
                    }
                    for (int d = 0; d < 4; d++) {
                        line[d] = (byte) Character.forDigit((int) (w >> (12 - 4 * d)) & 0xF, 16);
                    }
                    line[4] = '\n';
                    pos = 0;
                    n++;
                }
                return line[pos++];
            }
        };
    }

    @Test
    void longDumpComparesInFixedBuffers() {
        Comparison c = new Comparison(Dumps.LLR2, Dumps.exact().withAlignWindow(16));
        CompareReport ok = c.run(new HexWordReader(generated(WORDS, -1), "golden", 16), VectorFlags.NONE,
                new HexWordReader(generated(WORDS, -1), "dut", 16), null);
        assertTrue(ok.agrees());
        assertEquals(WORDS, ok.compared());

        CompareReport bad = c.run(new HexWordReader(generated(WORDS, -1), "golden", 16), VectorFlags.NONE,
                new HexWordReader(generated(WORDS, WORDS - 10), "dut", 16), null);
        assertEquals(1, bad.mismatched());
        assertEquals(WORDS - 10, bad.mismatches().get(0).index());
        assertEquals(FaultKind.FLIPPED_BIT, bad.diagnoses().get(0).kind());
        assertEquals(WORDS - 9, bad.mismatches().get(0).dutLine());
    }
}
