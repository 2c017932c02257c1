package dev.fixmod.verify.constellation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.constellation.Constellation;
import dev.fixmod.constellation.Family;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Reading user-defined constellations, and the messages for every kind of bad file. */
class ConstellationFileTest {
    @TempDir
    Path dir;

    private Path write(String name, String content) throws IOException {
        Path p = dir.resolve(name);
        Files.writeString(p, content, StandardCharsets.UTF_8);
        return p;
    }

    private String error(String name, String content) throws IOException {
        Path p = write(name, content);
        return assertThrows(IllegalArgumentException.class, () -> ConstellationFile.read(p)).getMessage();
    }

    @Test
    void readsCsvWithCommentsAndAnyColumnOrder() throws IOException {
        // A scenario of our own: an offset QPSK-like grid, labels by bits, with probabilities.
        Path p = write("my4.csv", "# our test grid\n"
                + "q,i,bits,probability\n"
                + "-2,-1,00,0.25\n"
                + "\n"
                + "2,-1,01,0.25\n"
                + "-2,1,10,0.25\n"
                + "2,1,11,0.25\n");
        Constellation c = ConstellationFile.read(p);
        assertEquals("my4", c.name());
        assertEquals(Family.CUSTOM, c.family());
        assertEquals("custom", c.labeling());
        assertEquals(4, c.size());
        assertEquals(-1.0, c.re(0b01), 0.0);
        assertEquals(2.0, c.im(0b01), 0.0);
        assertEquals(1.0, c.re(0b10), 0.0);
        assertTrue(c.isSeparable(), "b0 moves I, b1 moves Q");
    }

    @Test
    void readsJson() throws IOException {
        Path p = write("x.json", "{\n"
                + "  \"name\": \"ours\",\n"
                + "  \"points\": [\n"
                + "    {\"label\": 1, \"i\": 1, \"q\": 0},\n"
                + "    {\"label\": 0, \"bits\": \"0\", \"i\": -1.5e0, \"q\": 0.25}\n"
                + "  ]\n"
                + "}\n");
        Constellation c = ConstellationFile.read(p);
        assertEquals("ours", c.name());
        assertEquals(-1.5, c.re(0), 0.0);
        assertEquals(0.25, c.im(0), 0.0);
        assertTrue(c.isUniform());
    }

    @Test
    void csvErrorsNameFileLineAndColumn() throws IOException {
        String where = dir.resolve("b.csv").toString();
        assertEquals(where + " line 1: unknown column 'x'; accepted columns: label, bits, i, q, probability",
                error("b.csv", "label,i,x\n"));
        assertEquals(where + " line 1: columns 'i' and 'q' are required", error("b.csv", "label,i\n0,1\n"));
        assertEquals(where + " line 3, column 'q': 'abc' is not a number",
                error("b.csv", "label,i,q\n0,1,0\n1,-1,abc\n"));
        assertEquals(where + " line 3, column 'i': 'NaN' is not a finite number",
                error("b.csv", "label,i,q\n0,1,0\n1,NaN,0\n"));
        assertEquals(where + " line 2: 2 fields, the header on line 1 has 3", error("b.csv", "label,i,q\n0,1\n"));
        assertEquals(where + " line 3: label 0 already used on line 2; labels must be a permutation of 0..1",
                error("b.csv", "label,i,q\n0,1,0\n0,-1,0\n"));
        assertEquals(where + " line 3: point (1.0, 0.0) already given on line 2; points must be distinct",
                error("b.csv", "label,i,q\n0,1,0\n1,1,0\n"));
        assertEquals(where + ": 3 points; a constellation needs a power of two >= 2",
                error("b.csv", "label,i,q\n0,1,0\n1,-1,0\n2,0,1\n"));
        assertEquals(where + " line 3, column 'label': 2 is outside 0..1 for 2 points",
                error("b.csv", "label,i,q\n0,1,0\n2,-1,0\n"));
        assertEquals(where + " line 2, column 'bits': '011' has 3 bits; 2 points need 1",
                error("b.csv", "bits,i,q\n011,1,0\n1,-1,0\n"));
        assertEquals(where + " line 2: label 1 and bits '0' disagree", error("b.csv", "label,bits,i,q\n1,0,1,0\n0,1,-1,0\n"));
        assertEquals(where + ": the probabilities sum to 0.9, not 1",
                error("b.csv", "label,i,q,probability\n0,1,0,0.4\n1,-1,0,0.5\n"));
        assertEquals(where + " line 2, column 'probability': -0.5 is negative",
                error("b.csv", "label,i,q,probability\n0,1,0,-0.5\n1,-1,0,1.5\n"));
        assertEquals(where + ": empty file; expected a header line such as 'label,i,q'", error("b.csv", "# nothing\n"));
    }

    @Test
    void jsonErrorsNameFileLineAndKey() throws IOException {
        String where = dir.resolve("b.json").toString();
        assertEquals(where + " line 2: unknown key 'pts'; accepted keys: name, points",
                error("b.json", "{\n\"pts\": []}"));
        assertEquals(where + " line 3, key 'points[1].q': expected a number, got abc",
                error("b.json", "{\"points\": [{\"label\": 0, \"i\": 1, \"q\": 0},\n"
                        + "\n{\"label\": 1, \"i\": -1, \"q\": \"abc\"}]}"));
        assertEquals(where + " line 1: unknown key 'points[0].z'; accepted keys: label, bits, i, q, probability",
                error("b.json", "{\"points\": [{\"z\": 0}]}"));
        assertEquals(where + " line 1, key 'points[0]': keys 'i' and 'q' are required",
                error("b.json", "{\"points\": [{\"label\": 0, \"i\": 1}]}"));
        assertEquals(where + ": the key 'points' is missing", error("b.json", "{\"name\": \"x\"}"));
        String malformed = error("b.json", "{\"points\": [\n{\"label\": 0,, }]}");
        assertTrue(malformed.startsWith(where + " line 2: malformed JSON: "), malformed);
        assertFalse(malformed.contains("\n"), "one line");
        assertEquals(where + " line 2: a probability is given for some points but not for this one; give it for every"
                + " point or for none", error("b.json", "{\"points\": [{\"label\": 0, \"i\": 1, \"q\": 0,"
                + " \"probability\": 1},\n{\"label\": 1, \"i\": -1, \"q\": 0}]}"));
    }

    @Test
    void fileLevelErrors() throws IOException {
        Path missing = dir.resolve("none.csv");
        assertEquals(missing + ": no such file",
                assertThrows(IllegalArgumentException.class, () -> ConstellationFile.read(missing)).getMessage());
        assertEquals(dir.resolve("x.txt") + ": unknown file type; expected a .csv or .json file",
                error("x.txt", "label,i,q\n"));
    }
}
