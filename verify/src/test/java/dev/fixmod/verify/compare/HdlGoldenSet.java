package dev.fixmod.verify.compare;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * Writes the golden set the HDL proof compares against, from {@link NrQam16LlrModel}: a folder with manifest.json
 * (files with port, format, layout, count, SHA-256; a flags glossary), the stimulus hex file, the expected LLR hex
 * file and a CSV with each vector's flags and LLR codes. Flag names and bits follow the vector sets' glossary.
 */
final class HdlGoldenSet {
    static final int ON_THRESHOLD = 2;
    static final int ZERO = 9;
    static final int LLR_AT_MIN = 11;
    static final int LLR_AT_MAX = 12;

    private HdlGoldenSet() {
    }

    static long flags(long in, long llr) {
        long i = NrQam16LlrModel.IN_LAYOUT.field(0).extract(in);
        long q = NrQam16LlrModel.IN_LAYOUT.field(1).extract(in);
        long f = 0;
        if (Math.abs(i) == NrQam16LlrModel.T || Math.abs(q) == NrQam16LlrModel.T || i == 0 || q == 0) {
            f |= 1L << ON_THRESHOLD;
        }
        if (i == 0 && q == 0) {
            f |= 1L << ZERO;
        }
        for (WordLayout.Field field : NrQam16LlrModel.LLR_LAYOUT.fields()) {
            long c = field.extract(llr);
            if (c == -NrQam16LlrModel.LLR.maxCode()) {
                f |= 1L << LLR_AT_MIN;
            }
            if (c == NrQam16LlrModel.LLR.maxCode()) {
                f |= 1L << LLR_AT_MAX;
            }
        }
        return f;
    }

    /** Flag names joined by '|', as the vector sets' CSV files write them. */
    static String flagNames(long flags) {
        StringBuilder b = new StringBuilder();
        String[] names = new String[64];
        names[ON_THRESHOLD] = "on-threshold";
        names[ZERO] = "zero";
        names[LLR_AT_MIN] = "llr-at-min";
        names[LLR_AT_MAX] = "llr-at-max";
        for (int bit = 0; bit < 64; bit++) {
            if ((flags >>> bit & 1) != 0) {
                b.append(b.length() == 0 ? "" : "|").append(names[bit]);
            }
        }
        return b.toString();
    }

    /** Writes the set into {@code folder} (created) and returns it. */
    static Path write(Path folder) throws IOException {
        Files.createDirectories(folder);
        long[] stim = NrQam16LlrModel.stimulus();
        NrQam16LlrModel model = NrQam16LlrModel.golden();
        StringBuilder in = new StringBuilder("// demapper-in: i:Q1.6,q:Q1.6, one word per vector\n");
        StringBuilder out = new StringBuilder("// llr: llr0:Q5.0,llr1:Q5.0,llr2:Q5.0,llr3:Q5.0, one word per vector\n");
        StringBuilder csv = new StringBuilder("index,flags,llr0,llr1,llr2,llr3\n");
        for (int n = 0; n < stim.length; n++) {
            long llr = model.llrWord(stim[n]);
            in.append(NrQam16LlrModel.IN_LAYOUT.hex(stim[n])).append('\n');
            out.append(NrQam16LlrModel.LLR_LAYOUT.hex(llr)).append('\n');
            csv.append(n).append(',').append(flagNames(flags(stim[n], llr)));
            for (WordLayout.Field f : NrQam16LlrModel.LLR_LAYOUT.fields()) {
                csv.append(',').append(f.extract(llr));
            }
            csv.append('\n');
        }
        Files.writeString(folder.resolve("demapper-in.hex"), in, StandardCharsets.US_ASCII);
        Files.writeString(folder.resolve("llr.hex"), out, StandardCharsets.US_ASCII);
        Files.writeString(folder.resolve("llr.csv"), csv, StandardCharsets.US_ASCII);
        ObjectMapper json = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);
        ObjectNode root = json.createObjectNode();
        root.put("schema", "fixmod-vector-set");
        root.put("version", 1);
        ArrayNode glossary = root.putArray("flags");
        glossary.addObject().put("bit", ON_THRESHOLD).put("name", "on-threshold");
        glossary.addObject().put("bit", ZERO).put("name", "zero");
        glossary.addObject().put("bit", LLR_AT_MIN).put("name", "llr-at-min");
        glossary.addObject().put("bit", LLR_AT_MAX).put("name", "llr-at-max");
        ArrayNode files = root.putArray("files");
        entry(files, folder, "demapper-in.hex", "demapper-in", "hex", NrQam16LlrModel.IN_LAYOUT, stim.length);
        entry(files, folder, "llr.hex", "llr", "hex", NrQam16LlrModel.LLR_LAYOUT, stim.length);
        entry(files, folder, "llr.csv", "llr", "csv", NrQam16LlrModel.LLR_LAYOUT, stim.length);
        Files.writeString(folder.resolve("manifest.json"), json.writeValueAsString(root) + "\n");
        return folder;
    }

    private static void entry(ArrayNode files, Path folder, String name, String port, String format,
            WordLayout layout, long count) {
        ObjectNode e = files.addObject();
        e.put("name", name);
        e.put("port", port);
        e.put("format", format);
        e.put("layout", layout.toString());
        e.put("count", count);
        e.put("sha256", GoldenSet.sha256(folder.resolve(name)));
    }
}
