package dev.fixmod.verify.formats;

import static java.nio.charset.StandardCharsets.US_ASCII;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.verify.noise.NoiseSpec;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HexFormat;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/** vectors/README.md is the format reference testbench authors read: its examples must be what the writers write. */
class VectorsReadmeTest {

    private static final Path README = Path.of("..", "vectors", "README.md");

    private final String readme = read();

    private static String read() {
        try {
            return Files.readString(README);
        } catch (IOException e) {
            throw new AssertionError("cannot read " + README.toAbsolutePath(), e);
        }
    }

    private static String example(FileFormat format) throws IOException {
        FieldLayout iq = FieldLayout.of(Field.of("I", "Q3.8"), Field.of("Q", "Q3.8"));
        TableSpec spec = TableSpec.of("tx", iq, 1).withFlagNames(List.of("sat", "tie"));
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        try (RowWriter w = format.open(spec, out)) {
            w.write(7, 0b10, new long[] {-1, 384}, 0);
        }
        byte[] b = out.toByteArray();
        return switch (format) {
            case BINARY, PACKED_BINARY -> "bytes `" + HexFormat.ofDelimiter(" ").formatHex(b) + "`";
            case NPY -> "header, then bytes `" + HexFormat.ofDelimiter(" ").formatHex(b, b.length - 4, b.length) + "`";
            default -> new String(b, US_ASCII);
        };
    }

    @Test
    void formatTableShowsWhatEachWriterWrites() throws IOException {
        for (FileFormat f : FileFormat.values()) {
            Matcher row = Pattern.compile("\\| `" + f.label() + "` \\| `\\." + f.extension() + "` \\| (.*) \\|")
                    .matcher(readme);
            assertTrue(row.find(), "README format table row for " + f.label());
            String shown = row.group(1);
            String actual = example(f);
            if (f == FileFormat.C_HEADER) {
                assertTrue(actual.contains("    " + shown.replace("`", "") + "\n"), shown);
            } else if (f == FileFormat.CSV || f == FileFormat.HEX || f == FileFormat.HEX_COMMENTED) {
                String lastLine = actual.substring(actual.lastIndexOf('\n', actual.length() - 2) + 1).trim();
                assertEquals("`" + lastLine + "`", shown, f.label());
            } else {
                assertEquals(actual, shown, f.label());
            }
        }
    }

    @Test
    void cHeaderExampleIsTheWritersOutput() throws IOException {
        Matcher block = Pattern.compile("```c\n(.*?)```", Pattern.DOTALL).matcher(readme);
        assertTrue(block.find(), "README has a C header example");
        String shown = block.group(1).replace(" * <comment lines of the table>\n", "");
        assertEquals(example(FileFormat.C_HEADER), shown);
    }

    @Test
    void csvExampleIsTheWritersOutput() throws IOException {
        assertTrue(readme.contains("```\n" + example(FileFormat.CSV) + "```"), "README CSV example");
    }

    @Test
    void noiseSectionIsThePublishedAlgorithm() {
        // The README copy drops the document's title and moves every heading one level down.
        String doc = NoiseSpec.document();
        String body = doc.substring(doc.indexOf('\n') + 1).replaceAll("(?m)^## ", "### ").strip();
        String section = readme.substring(readme.indexOf("## Noise generator"));
        assertTrue(section.contains(body), "vectors/README.md 'Noise generator' must contain noise-algorithm.md");
    }
}
