package dev.fixmod.verify.vectors;

import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.verify.formats.Field;
import dev.fixmod.verify.formats.FieldLayout;
import dev.fixmod.verify.formats.FileFormat;
import dev.fixmod.verify.formats.OutputSet;
import dev.fixmod.verify.formats.RowWriter;
import dev.fixmod.verify.formats.TableSpec;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;

/**
 * The constant tables of the datapath, for RTL and firmware that need them: the mapper ROM (address = label, word =
 * I then Q), the slicer thresholds per axis (ascending), the slicer's reference points (address = label, I then Q in
 * demapper input codes: what every slicer and the LLR datapath compare with) and, for a PSK sector slicer, its lines
 * as the sign tests use them, and for a noise-scaled LLR datapath the scale constant K per level, as
 * {@code $readmemh} hex and C headers, and one VHDL package holding all of them.
 * Written whatever the formats of the ports.
 */
final class RomExport {
    private RomExport() {
    }

    static void write(VectorSpec spec, Datapath d, OutputSet set, List<ObjectNode> entries) throws IOException {
        int m = d.size();
        QFormat rom = spec.mapper().format();
        QFormat in = spec.demapper().input().format();
        long[] romI = new long[m];
        long[] romQ = new long[m];
        for (int label = 0; label < m; label++) {
            romI[label] = d.romI(label);
            romQ[label] = d.romQ(label);
        }
        table(set, entries, spec, "mapper-rom", "mapper_rom", SetFiles.iq(rom), rows(romI, romQ),
                "mapper ROM: row = label, I and Q of the mapper output format");
        long[] ti = d.thresholdsI();
        long[] tq = d.thresholdsQ();
        FieldLayout threshold = FieldLayout.of(new Field("threshold", in));
        table(set, entries, spec, "slicer-thresholds-i", "slicer_thresholds_i", threshold, rows(ti),
                "slicer thresholds on I, ascending demapper input codes: x >= threshold takes the upper level");
        table(set, entries, spec, "slicer-thresholds-q", "slicer_thresholds_q", threshold, rows(tq),
                "slicer thresholds on Q, ascending demapper input codes: x >= threshold takes the upper level");
        long[] refI = d.referenceI();
        long[] refQ = d.referenceQ();
        table(set, entries, spec, "slicer-reference", "slicer_reference", SetFiles.iq(in), rows(refI, refQ),
                "slicer reference points: row = label, I and Q in demapper input codes",
                "(the points every slicer and the LLR datapath compare with; even symbols)");
        long[][] lines = d.sectorLines();
        QFormat lineFormat = d.sectorLineFormat().orElse(null);
        if (lineFormat != null) {
            table(set, entries, spec, "slicer-lines", "slicer_lines",
                    FieldLayout.of(new Field("a", lineFormat), new Field("b", lineFormat)), lines,
                    "PSK sector slicer lines: row j = the line through the boundary rays at phi0 + (2j+1)*180/M",
                    "and phi0 + (2j+1)*180/M + 180 degrees (phi0 = angle of label 0), normal (a, b) toward +I",
                    "(+Q if a = 0): a*I + b*Q >= 0 means on the line or on its larger-I side; the decision is the",
                    "reference point whose M/2 test results equal the sample's (even symbols)");
        }
        long[] scale = d.scaleCodes();
        QFormat scaleFormat = d.scaleFormat().orElse(null);
        if (scaleFormat != null) {
            table(set, entries, spec, "llr-scale", "llr_scale", FieldLayout.of(new Field("k", scaleFormat)),
                    rows(scale), "LLR scale constant K = 1/N0 (4A/N0 for folded-linear) per level, "
                            + scaleFormat.describe() + ": row 0 for the vectors without noise (the design level),",
                    "row l + 1 for noise level l (the demapper group's data blocks in level order)");
        }
        String id = SetFiles.tableName(spec.name(), "tables_pkg");
        String vhd = id + ".vhd";
        byte[] text = vhdl(id, rom, in, lineFormat, scaleFormat, romI, romQ, ti, tq, refI, refQ, lines,
                scale)
                .getBytes(StandardCharsets.US_ASCII);
        try (OutputStream out = set.newFile(vhd)) {
            out.write(text);
        }
        entries.add(SetFiles.entry(vhd, "mapper-rom+slicer-tables", "vhdl", m, set.sha256(vhd), null));
    }

    /** One row per index, one field per column. */
    private static long[][] rows(long[]... columns) {
        long[][] rows = new long[columns[0].length][columns.length];
        for (int r = 0; r < rows.length; r++) {
            for (int c = 0; c < columns.length; c++) {
                rows[r][c] = columns[c][r];
            }
        }
        return rows;
    }

    private static void table(OutputSet set, List<ObjectNode> entries, VectorSpec spec, String stem, String part,
            FieldLayout layout, long[][] rows, String comment, String... moreComments) throws IOException {
        List<String> comments = new ArrayList<>();
        comments.add("fixmod: set " + spec.name() + ", " + comment);
        comments.addAll(List.of(moreComments));
        TableSpec table = new TableSpec(SetFiles.tableName(spec.name(), part), layout, rows.length, List.of(),
                comments);
        for (FileFormat format : List.of(FileFormat.HEX, FileFormat.C_HEADER)) {
            if (format == FileFormat.C_HEADER && rows.length == 0) {
                continue; // a slicer without thresholds (PSK sectors, minimum distance): ISO C has no empty arrays
            }
            String name = SetFiles.fileName(stem, format);
            try (RowWriter w = format.open(table, set.newFile(name))) {
                for (int r = 0; r < rows.length; r++) {
                    w.write(r, 0, rows[r], 0);
                }
            }
            entries.add(SetFiles.entry(name, stem, format.label(), rows.length, set.sha256(name),
                    SetFiles.layoutJson(table)));
        }
    }

    private static String vhdl(String id, QFormat rom, QFormat in, QFormat lineFormat, QFormat scaleFormat,
            long[] romI, long[] romQ, long[] ti, long[] tq, long[] refI, long[] refQ, long[][] lines, long[] scale) {
        StringBuilder v = new StringBuilder();
        v.append("-- Generated by fixmod: mapper ROM (index = label), slicer thresholds (ascending), slicer\n");
        v.append("-- reference points (index = label, demapper input codes)")
                .append(lineFormat == null ? "" : " and PSK sector lines (index = line)").append(".\n");
        v.append("-- ROM words: ").append(rom.describe()).append("\n");
        v.append("-- Thresholds and reference points: ").append(in.describe()).append("\n");
        if (lineFormat != null) {
            v.append("-- Sector lines: ").append(lineFormat.describe()).append("\n");
            v.append("--   line j: normal (A, B) toward +I (+Q if A = 0) of the line through the boundary\n");
            v.append("--   rays at phi0 + (2j+1)*180/M degrees and opposite (phi0 = angle of label 0);\n");
            v.append("--   A*I + B*Q >= 0 means on the line or on its larger-I side. The decision is the\n");
            v.append("--   reference point whose M/2 results equal the sample's.\n");
        }
        if (scaleFormat != null) {
            v.append("-- LLR scale constant K per level: ").append(scaleFormat.describe())
                    .append("; index 0 = design level (no noise), l + 1 = noise level l.\n");
        }
        v.append("library ieee;\nuse ieee.numeric_std.all;\n\npackage ").append(id).append(" is\n");
        v.append("  constant ROM_WIDTH : natural := ").append(rom.wordLength()).append(";\n");
        v.append("  constant THRESHOLD_WIDTH : natural := ").append(in.wordLength()).append(";\n");
        v.append("  constant REFERENCE_WIDTH : natural := ").append(in.wordLength()).append(";\n");
        if (lineFormat != null) {
            v.append("  constant SECTOR_LINE_WIDTH : natural := ").append(lineFormat.wordLength()).append(";\n");
        }
        if (scaleFormat != null) {
            v.append("  constant LLR_SCALE_WIDTH : natural := ").append(scaleFormat.wordLength()).append(";\n");
        }
        v.append("  type rom_t is array (natural range <>) of signed(ROM_WIDTH - 1 downto 0);\n");
        v.append("  type threshold_t is array (natural range <>) of signed(THRESHOLD_WIDTH - 1 downto 0);\n");
        v.append("  type reference_t is array (natural range <>) of signed(REFERENCE_WIDTH - 1 downto 0);\n");
        if (lineFormat != null) {
            v.append("  type sector_line_t is array (natural range <>) of signed(SECTOR_LINE_WIDTH - 1 downto 0);\n");
        }
        if (scaleFormat != null) {
            v.append("  type llr_scale_t is array (natural range <>) of unsigned(LLR_SCALE_WIDTH - 1 downto 0);\n");
        }
        vhdlArray(v, "MAPPER_ROM_I", "rom_t", romI, "ROM_WIDTH");
        vhdlArray(v, "MAPPER_ROM_Q", "rom_t", romQ, "ROM_WIDTH");
        vhdlArray(v, "SLICER_THRESHOLDS_I", "threshold_t", ti, "THRESHOLD_WIDTH");
        vhdlArray(v, "SLICER_THRESHOLDS_Q", "threshold_t", tq, "THRESHOLD_WIDTH");
        vhdlArray(v, "SLICER_REFERENCE_I", "reference_t", refI, "REFERENCE_WIDTH");
        vhdlArray(v, "SLICER_REFERENCE_Q", "reference_t", refQ, "REFERENCE_WIDTH");
        if (lineFormat != null) {
            vhdlArray(v, "SLICER_LINES_A", "sector_line_t", column(lines, 0), "SECTOR_LINE_WIDTH");
            vhdlArray(v, "SLICER_LINES_B", "sector_line_t", column(lines, 1), "SECTOR_LINE_WIDTH");
        }
        if (scaleFormat != null) {
            vhdlArray(v, "LLR_SCALE", "llr_scale_t", scale, "LLR_SCALE_WIDTH", "to_unsigned");
        }
        v.append("end package ").append(id).append(";\n");
        return v.toString();
    }

    private static long[] column(long[][] rows, int field) {
        long[] c = new long[rows.length];
        for (int r = 0; r < rows.length; r++) {
            c[r] = rows[r][field];
        }
        return c;
    }

    /** Named association throughout: it is the only aggregate form valid for one element and for none. */
    private static void vhdlArray(StringBuilder v, String name, String type, long[] values, String width) {
        vhdlArray(v, name, type, values, width, "to_signed");
    }

    private static void vhdlArray(StringBuilder v, String name, String type, long[] values, String width,
            String convert) {
        v.append("  constant ").append(name).append(" : ").append(type).append("(0 to ").append(values.length - 1)
                .append(") := (");
        if (values.length == 0) {
            v.append("others => (others => '0')");
        }
        for (int i = 0; i < values.length; i++) {
            v.append(i == 0 ? "\n    " : ",\n    ").append(i).append(" => ").append(convert).append('(').append(values[i]).append(", ")
                    .append(width).append(')');
        }
        v.append(");\n");
    }
}
