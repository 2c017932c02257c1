package dev.fixmod.verify.compare;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.demap.FixedLlrSpec;
import dev.fixmod.demap.FixedSoftDemapper;
import dev.fixmod.demap.LlrOptions;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.map.ConstellationRom;
import dev.fixmod.verify.formats.FieldLayout;
import dev.fixmod.verify.vectors.ConstellationResolver;
import dev.fixmod.verify.vectors.Manifest;
import dev.fixmod.verify.vectors.SpecReader;
import dev.fixmod.verify.vectors.VectorSpec;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.ArrayList;
import java.util.List;

/**
 * The committed golden set {@code vectors/nr-qam16} as the HDL proof needs it: the stimulus codes, each vector's
 * noise level, the golden LLR words, and the kernel's fixed LLR datapath rebuilt from the manifest's specification,
 * so that a test can run the kernel with one stage changed and find where it departs from the set.
 */
final class NrQam16Set {
    static final Path ROOT = Paths.get("..").toAbsolutePath().normalize();
    static final Path FOLDER = ROOT.resolve("vectors").resolve("nr-qam16");

    final VectorSpec spec;
    final Manifest manifest;
    final Constellation constellation;
    final ConstellationRom reference;
    final FieldLayout llrLayout;
    final int[] iCodes;
    final int[] qCodes;
    /** Per vector: 0 without noise (the design level), l + 1 for noise level l, as the generator numbers them. */
    final int[] slot;
    final long[] llrWords;
    final int perLevel;
    final int levels;

    private NrQam16Set() throws IOException {
        manifest = Manifest.read(Files.readString(FOLDER.resolve(Manifest.FILE_NAME), StandardCharsets.UTF_8),
                FOLDER.toString());
        spec = SpecReader.parse(manifest.spec().toString(), "manifest spec");
        constellation = ConstellationResolver.resolve(spec.constellation());
        reference = ConstellationRom.of(constellation, new Quantizer(spec.demapper().input().format(),
                spec.demapper().constantRounding(), Overflow.SATURATE));
        GoldenSet set = GoldenSet.open(FOLDER);
        FieldLayout in = set.port("demapper-in").layout();
        llrLayout = set.port("llr").layout();
        long[] inWords = words(FOLDER.resolve("demapper-in.hex"));
        llrWords = words(FOLDER.resolve("llr.hex"));
        iCodes = new int[inWords.length];
        qCodes = new int[inWords.length];
        for (int n = 0; n < inWords.length; n++) {
            iCodes[n] = (int) in.unpack(inWords[n], 0);
            qCodes[n] = (int) in.unpack(inWords[n], 1);
        }
        slot = levelSlots(FOLDER.resolve("reference.csv"), inWords.length);
        perLevel = manifest.json().path("groups").path("demapper").path("data-per-level").asInt();
        levels = manifest.json().path("groups").path("demapper").path("levels").asInt();
    }

    static NrQam16Set load() throws IOException {
        return new NrQam16Set();
    }

    int count() {
        return iCodes.length;
    }

    private static long[] words(Path hex) throws IOException {
        List<Long> out = new ArrayList<>();
        for (String line : Files.readAllLines(hex, StandardCharsets.US_ASCII)) {
            String s = line.trim();
            if (!s.isEmpty() && !s.startsWith("//")) {
                out.add(Long.parseLong(s, 16));
            }
        }
        return out.stream().mapToLong(Long::longValue).toArray();
    }

    private static int[] levelSlots(Path referenceCsv, int count) throws IOException {
        List<String> lines = Files.readAllLines(referenceCsv, StandardCharsets.UTF_8);
        int column = List.of(lines.get(0).split(",")).indexOf("level");
        int[] slots = new int[count];
        assertEquals(count + 1, lines.size(), "reference.csv: one row per vector");
        for (int n = 0; n < count; n++) {
            slots[n] = Integer.parseInt(lines.get(n + 1).split(",")[column]) + 1;
        }
        return slots;
    }

    /** The set's own stage formats. */
    FixedLlrSpec goldenSpec() {
        return spec.demapper().fixedSpec();
    }

    /** One datapath per slot (0: design level, l + 1: noise level l), as the generator builds them. */
    FixedSoftDemapper[] datapaths(FixedLlrSpec stages) {
        int k = constellation.bitsPerSymbol();
        FixedSoftDemapper[] d = new FixedSoftDemapper[levels + 1];
        d[0] = FixedSoftDemapper.create(spec.demapper().algorithm(), reference, LlrOptions.fromEsN0Db(constellation,
                spec.demapper().designEsN0Db(), spec.demapper().llrSign(), false), stages);
        for (int l = 0; l < levels; l++) {
            d[l + 1] = FixedSoftDemapper.create(spec.demapper().algorithm(), reference, LlrOptions.fromEsN0Db(
                    constellation, spec.noise().esN0Db(l, k), spec.demapper().llrSign(), false), stages);
        }
        return d;
    }

    /** The LLR port's words the kernel computes for every vector with these stages. */
    long[] kernelLlrWords(FixedLlrSpec stages) {
        FixedSoftDemapper[] d = datapaths(stages);
        int k = constellation.bitsPerSymbol();
        int[] llr = new int[k];
        long[] codes = new long[k];
        long[] out = new long[count()];
        for (int n = 0; n < count(); n++) {
            d[slot[n]].llr(iCodes[n], qCodes[n], llr, 0);
            for (int b = 0; b < k; b++) {
                codes[b] = llr[b];
            }
            out[n] = llrLayout.pack(codes, 0);
        }
        return out;
    }

    /** The first vector, field and difference (actual − golden, in LSB) where {@code actual} departs from the set. */
    record FirstDifference(int index, String field, long diff) {
    }

    FirstDifference firstDifference(long[] actual) {
        for (int n = 0; n < count(); n++) {
            for (int f = 0; f < llrLayout.fieldCount(); f++) {
                long g = llrLayout.unpack(llrWords[n], f);
                long a = llrLayout.unpack(actual[n], f);
                if (g != a) {
                    return new FirstDifference(n, llrLayout.field(f).name(), a - g);
                }
            }
        }
        throw new AssertionError("no vector differs: the variant tests nothing");
    }
}
