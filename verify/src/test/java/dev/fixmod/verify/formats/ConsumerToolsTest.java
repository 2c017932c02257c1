package dev.fixmod.verify.formats;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.fixmod.verify.testing.ExternalProgram;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Our files read by the programs that consume them: gcc compiles a C program against the header and decodes both
 * binaries independently; NumPy loads the .npy; Icarus Verilog runs $readmemh (IEEE 1364-2005 §17.2.9) on the hex.
 * Each test is skipped with a visible message when its tool is missing.
 */
class ConsumerToolsTest {

    @TempDir
    Path dir;

    private static final List<Tables> TABLES = List.of(
            Tables.iq(200),
            new Tables(TableSpec.of("wide", FieldLayout.of(Field.of("a", "Q31"), Field.of("b", "Q15")), 50), 2),
            new Tables(TableSpec.of("bytes", FieldLayout.of(Field.of("x", "UQ8.0"), Field.of("y", "UQ0.8")), 50), 3),
            new Tables(TableSpec.of("mixed", FieldLayout.of(Field.of("u", "UQ32.0"), Field.of("s", "Q3.4")), 50), 4));

    private Path write(Tables t, FileFormat format) throws IOException {
        Path file = dir.resolve(t.spec.name() + "." + format.label() + "." + format.extension());
        try (OutputStream out = Files.newOutputStream(file)) {
            t.writeTo(format, out);
        }
        return file;
    }

    /** A C program that prints the header's array and checks both binary files against it, element by element. */
    private static String cProgram(Tables t) {
        FieldLayout layout = t.spec.layout();
        String n = t.spec.name();
        String p = n.toUpperCase(java.util.Locale.ROOT);
        String shifts = layout.fields().stream().map(f -> Integer.toString(layout.shift(layout.fields().indexOf(f))))
                .collect(Collectors.joining(", "));
        String widths = layout.fields().stream().map(f -> Integer.toString(f.width())).collect(Collectors.joining(", "));
        String signs = layout.fields().stream().map(f -> f.signed() ? "1" : "0").collect(Collectors.joining(", "));
        int wordBytes = StorageType.forWord(layout.wordWidth()).bytes();
        return """
                #include <stdio.h>
                #include <stdint.h>
                #include "%1$s.h"

                static const int shift[] = {%3$s}, width[] = {%4$s}, is_signed[] = {%5$s};

                /* little-endian bytes to a value, sign-extended if asked */
                static long long decode(const unsigned char *p, int bytes, int sign, int bits) {
                    unsigned long long v = 0;
                    for (int b = bytes - 1; b >= 0; b--) v = (v << 8) | p[b];
                    if (bits < 64) {
                        v &= (1ULL << bits) - 1;
                        if (sign && ((v >> (bits - 1)) & 1)) v |= ~0ULL << bits;
                    }
                    return (long long) v;
                }

                int main(int argc, char **argv) {
                    FILE *bin = fopen(argv[1], "rb"), *packed = fopen(argv[2], "rb");
                    unsigned char buf[8];
                    const int elem = (int) sizeof %1$s[0][0];
                    const int elem_signed = ((__typeof__(%1$s[0][0])) -1) < 0;
                    if (argc != 3 || !bin || !packed) return 2;
                    for (size_t r = 0; r < %2$s_ROWS; r++) {
                        unsigned long long word;
                        if (fread(buf, %6$d, 1, packed) != 1) return 3;
                        word = (unsigned long long) decode(buf, %6$d, 0, 64);
                        for (size_t f = 0; f < %2$s_FIELDS; f++) {
                            long long want = (long long) %1$s[r][f];
                            if (fread(buf, elem, 1, bin) != 1) return 4;
                            if (decode(buf, elem, elem_signed, 8 * elem) != want) {
                                fprintf(stderr, "binary row %%zu field %%zu\\n", r, f); return 5;
                            }
                            {
                                unsigned long long raw = word >> shift[f];
                                unsigned char b8[8];
                                for (int k = 0; k < 8; k++) b8[k] = (unsigned char) (raw >> (8 * k));
                                if (decode(b8, 8, is_signed[f], width[f]) != want) {
                                    fprintf(stderr, "packed row %%zu field %%zu\\n", r, f); return 7;
                                }
                            }
                            printf(f ? " %%lld" : "%%lld", want);
                        }
                        printf("\\n");
                    }
                    return fgetc(bin) == EOF && fgetc(packed) == EOF ? 0 : 8;
                }
                """.formatted(n, p, shifts, widths, signs, wordBytes);
    }

    @Test
    void gccCompilesTheHeaderAndItAgreesWithBothBinaries() throws IOException {
        Path gcc = ExternalProgram.require("the C header check", "gcc", "cc");
        for (Tables t : TABLES) {
            String n = t.spec.name();
            Files.move(write(t, FileFormat.C_HEADER), dir.resolve(n + ".h"));
            Path bin = write(t, FileFormat.BINARY);
            Path packed = write(t, FileFormat.PACKED_BINARY);
            Path src = Files.writeString(dir.resolve(n + ".c"), cProgram(t));
            ExternalProgram.runOk(dir, 120, gcc.toString(), "-std=gnu11", "-Wall", "-Wextra", "-Werror",
                    "-o", dir.resolve(n).toString(), src.toString());
            String out = ExternalProgram.runOk(dir, 60, dir.resolve(n).toString(), bin.toString(), packed.toString());
            assertEquals(t.rowsAsText(), out, n + ": the header's array printed by C");
        }
    }

    @Test
    void numpyLoadsTheNpyAndItsDataAreTheBinaryFile() throws IOException {
        Path python = ExternalProgram.requirePython("numpy", "the .npy check");
        Path script = Files.writeString(dir.resolve("load.py"), """
                import sys
                import numpy as np
                for npy, binary in zip(sys.argv[1::2], sys.argv[2::2]):
                    a = np.load(npy, allow_pickle=False)
                    assert a.tobytes() == open(binary, 'rb').read(), 'npy data differ from ' + binary
                    print(a.dtype.str, a.shape, a.flags['C_CONTIGUOUS'])
                    for row in a.tolist():
                        print(' '.join(str(v) for v in row))
                """);
        List<String> command = new java.util.ArrayList<>(List.of(python.toString(), script.toString()));
        StringBuilder expected = new StringBuilder();
        for (Tables t : TABLES) {
            command.add(write(t, FileFormat.NPY).toString());
            command.add(write(t, FileFormat.BINARY).toString());
            FieldLayout layout = t.spec.layout();
            expected.append(layout.storage().npyDescr()).append(" (").append(t.codes.length).append(", ")
                    .append(layout.fieldCount()).append(") True\n").append(t.rowsAsText());
        }
        assertEquals(expected.toString(), ExternalProgram.runOk(dir, 120, command.toArray(String[]::new)));
    }

    /** A testbench that $readmemh's the file and $display's each word and its fields as decimals. */
    private static String testbench(Tables t, Path hex) {
        FieldLayout layout = t.spec.layout();
        int w = layout.wordWidth();
        StringBuilder fields = new StringBuilder(", mem[i]");
        StringBuilder format = new StringBuilder("%h");
        for (int f = 0; f < layout.fieldCount(); f++) {
            int lo = layout.shift(f);
            int hi = lo + layout.field(f).width() - 1;
            String slice = "mem[i][" + hi + ":" + lo + "]";
            fields.append(", ").append(layout.field(f).signed() ? "$signed(" + slice + ")" : slice);
            format.append(" %0d");
        }
        return """
                module tb;
                  reg [%d:0] mem [0:%d];
                  integer i;
                  initial begin
                    $readmemh("%s", mem);
                    for (i = 0; i < %d; i = i + 1)
                      $display("%s"%s);
                    $finish;
                  end
                endmodule
                """.formatted(w - 1, t.codes.length - 1, hex.toString(), t.codes.length, format, fields);
    }

    @Test
    void iverilogReadsTheHexWithAndWithoutComments() throws IOException {
        Path iverilog = ExternalProgram.require("the $readmemh check", "/usr/bin/iverilog");
        Path vvp = ExternalProgram.require("the $readmemh check", "/usr/bin/vvp", "vvp");
        Tables mixed = new Tables(TableSpec.of("mix", FieldLayout.of(Field.of("label", "UQ4.0"), Field.of("llr", "Q5.2"),
                Field.of("b", "UQ1.0")), 100), 5).withComments();
        for (Tables t : List.of(Tables.iq(300), mixed)) {
            for (FileFormat format : List.of(FileFormat.HEX, FileFormat.HEX_COMMENTED)) {
                Path hex = write(t, format);
                Path tb = Files.writeString(dir.resolve("tb_" + t.spec.name() + ".v"), testbench(t, hex));
                Path sim = dir.resolve("tb_" + t.spec.name() + ".vvp");
                ExternalProgram.runOk(dir, 120, iverilog.toString(), "-g2005", "-o", sim.toString(), tb.toString());
                String out = ExternalProgram.runOk(dir, 120, vvp.toString(), "-n", sim.toString());
                String displayed = out.lines().filter(l -> !l.contains("$finish")).collect(Collectors.joining("\n", "",
                        "\n"));
                StringBuilder expected = new StringBuilder();
                FieldLayout layout = t.spec.layout();
                for (long[] row : t.codes) {
                    String word = String.format("%0" + layout.hexDigits() + "x", layout.pack(row, 0));
                    expected.append(word);
                    for (long c : row) {
                        expected.append(' ').append(c);
                    }
                    expected.append('\n');
                }
                assertEquals(expected.toString(), displayed, t.spec.name() + " as " + format.label());
            }
        }
    }
}
