package dev.fixmod.verify.compare;

import java.util.ArrayList;
import java.util.List;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.Size;

/** Laws of the comparison over arbitrary 16-bit golden words. */
class ComparisonProperties {
    private static List<String> hex(List<Integer> words) {
        List<String> out = new ArrayList<>();
        for (int w : words) {
            out.add(Dumps.word(w));
        }
        return out;
    }

    @Property(tries = 200)
    boolean aDumpAgreesWithItselfAtAnyLatencyItIsGiven(
            @ForAll @Size(min = 1, max = 80) List<@IntRange(min = 0, max = 0xFFFF) Integer> words,
            @ForAll @IntRange(min = 0, max = 5) int latency) {
        List<String> golden = hex(words);
        List<String> dut = new ArrayList<>();
        for (int i = 0; i < latency; i++) {
            dut.add("0000");
        }
        dut.addAll(golden);
        CompareReport r = Dumps.compare(golden, dut, Dumps.exact().withLatency(latency));
        return r.agrees() && r.compared() == words.size() && r.extraWords() == 0;
    }

    @Property(tries = 200)
    boolean unpackingAndPackingAreInverse(@ForAll @IntRange(min = 0, max = 0xFFFF) int word) {
        long a = Dumps.LLR2.unpack(word, 0);
        long b = Dumps.LLR2.unpack(word, 1);
        return Dumps.LLR2.pack(new long[] {a, b}, 0) == word && a >= -128 && a <= 127 && b >= -128 && b <= 127;
    }

    @Property(tries = 200)
    boolean aFlippedBitIsFoundAtItsVectorAndField(
            @ForAll @Size(min = 1, max = 60) List<@IntRange(min = 0, max = 0xFFFF) Integer> words,
            @ForAll @IntRange(min = 0, max = 59) int at, @ForAll @IntRange(min = 0, max = 15) int bit) {
        int index = at % words.size();
        List<String> golden = hex(words);
        List<String> dut = new ArrayList<>(golden);
        dut.set(index, Dumps.word(words.get(index) ^ (1 << bit)));
        CompareReport r = Dumps.compare(golden, dut, Dumps.exact().withShow(1));
        CompareReport.Mismatch m = r.mismatches().get(0);
        int field = bit >= 8 ? 0 : 1;
        long diff = m.fields().get(field).diffLsb();
        // Flipping bit j of a two's complement code changes it by 2^j in magnitude (common practice).
        return r.mismatched() == 1 && m.index() == index && !m.fields().get(field).agrees()
                && Math.abs(diff) == 1L << (bit % 8);
    }
}
