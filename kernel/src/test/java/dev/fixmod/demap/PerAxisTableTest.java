package dev.fixmod.demap;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Constellations;
import dev.fixmod.constellation.Normalization;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.OverflowCounter;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import dev.fixmod.map.ConstellationRom;
import dev.fixmod.testing.IntegerOnlyBytecode;
import java.util.List;
import org.junit.jupiter.api.Test;

/** The table the per-axis datapath reads for large batches gives the per-sample datapath's codes and event counts. */
class PerAxisTableTest {

    @Test
    void theBatchTablePathIsIntegerOnly() {
        IntegerOnlyBytecode.assertIntegerOnly(FixedPerAxisMaxLogDemapper.class, "computeBatch");
    }

    @Test
    void aLargeBatchEqualsSampleBySampleIncludingOverflowCounts() {
        for (int m : new int[] {16, 64, 256}) {
            Constellation c = Constellations.qam(m, true).normalized(Normalization.UNIT_ENERGY);
            ConstellationRom rom = ConstellationRom.of(c,
                    new Quantizer(QFormat.signed(1, 6), Rounding.HALF_EVEN, Overflow.SATURATE));
            LlrOptions options = LlrOptions.fromEsN0Db(c, 20, LlrSign.ZERO_POSITIVE, false);
            // A 4-bit output saturates often, so the output counter has events to compare.
            FixedLlrSpec spec = FixedLlrSpec.suggested(SoftAlgorithm.MAX_LOG_PER_AXIS, rom, options,
                    QFormat.signed(2, 1));
            FixedSoftDemapper batch = FixedSoftDemapper.create(SoftAlgorithm.MAX_LOG_PER_AXIS, rom, options, spec);
            FixedSoftDemapper single = FixedSoftDemapper.create(SoftAlgorithm.MAX_LOG_PER_AXIS, rom, options, spec);
            int k = c.bitsPerSymbol();
            // Every pair of input codes (Q1.6: 256 codes per axis), in batches well above the table threshold.
            int codes = 256;
            int[] i = new int[codes * codes];
            int[] q = new int[codes * codes];
            for (int a = 0; a < codes; a++) {
                for (int b = 0; b < codes; b++) {
                    i[a * codes + b] = a - 128;
                    q[a * codes + b] = 127 - b;
                }
            }
            int[] fast = new int[i.length * k];
            batch.llr(i, q, 0, i.length, fast, 0);
            int[] slow = new int[i.length * k];
            for (int n = 0; n < i.length; n++) {
                single.llr(i[n], q[n], slow, n * k);
            }
            assertArrayEquals(slow, fast, m + "-QAM");
            List<OverflowCounter> a = batch.counters();
            List<OverflowCounter> b = single.counters();
            for (int s = 0; s < a.size(); s++) {
                assertEquals(b.get(s).events(), a.get(s).events(), m + "-QAM " + b.get(s).stage());
            }
            assertTrue(b.get(2).events() > 0, "the output stage saturated somewhere");
        }
    }
}
