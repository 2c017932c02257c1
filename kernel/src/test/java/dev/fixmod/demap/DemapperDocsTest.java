package dev.fixmod.demap;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.fixmod.constellation.Catalogue;
import dev.fixmod.constellation.Constellation;
import dev.fixmod.fixed.Overflow;
import dev.fixmod.fixed.QFormat;
import dev.fixmod.fixed.Quantizer;
import dev.fixmod.fixed.Rounding;
import dev.fixmod.map.ConstellationRom;
import dev.fixmod.map.DatapathCost;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/** The cost table of the README's "Picking a demapper" section, row by row against the code. */
class DemapperDocsTest {

    @Test
    void theReadmeCostTableIsWhatTheDemappersReport() throws IOException {
        List<String[]> rows = costTable();
        assertEquals(7, rows.size(), "one row per variant");
        int[] orders = {16, 64, 256};
        for (String[] row : rows) {
            String[] variant = row[0].split(" ", 2);
            SoftAlgorithm algorithm = SoftAlgorithm.fromName(variant[1]);
            for (int n = 0; n < orders.length; n++) {
                Constellation c = Catalogue.resolve("qam" + orders[n]);
                LlrOptions o = LlrOptions.fromEsN0Db(c, 10, LlrSign.ZERO_POSITIVE, true);
                DatapathCost cost;
                if (variant[0].equals("float")) {
                    cost = SoftDemapper.create(algorithm, c, o).cost();
                } else {
                    ConstellationRom rom = ConstellationRom.of(c,
                            new Quantizer(QFormat.parse("Q2.9"), Rounding.HALF_EVEN, Overflow.SATURATE));
                    cost = FixedSoftDemapper.create(algorithm, rom, o,
                            FixedLlrSpec.suggested(algorithm, rom, o, QFormat.parse("Q4.1"))).cost();
                }
                String want = cost.multiplies() + " / " + cost.adds() + " / " + cost.compares() + " / "
                        + cost.tableBits();
                assertEquals(want, row[n + 1], row[0] + " for " + orders[n] + "-QAM");
            }
        }
    }

    private static List<String[]> costTable() throws IOException {
        Path dir = Path.of("").toAbsolutePath();
        while (dir != null && !(Files.exists(dir.resolve("README.md")) && Files.isDirectory(dir.resolve("kernel")))) {
            dir = dir.getParent();
        }
        assertTrue(dir != null, "project root with README.md not found above " + Path.of("").toAbsolutePath());
        List<String> lines = Files.readAllLines(dir.resolve("README.md"), StandardCharsets.UTF_8);
        int start = lines.indexOf("## Picking a demapper");
        assertTrue(start >= 0, "README section 'Picking a demapper'");
        List<String[]> rows = new ArrayList<>();
        for (int n = start + 1; n < lines.size() && !lines.get(n).startsWith("## "); n++) {
            String line = lines.get(n);
            if (line.startsWith("| float ") || line.startsWith("| fixed ")) {
                String[] cells = line.substring(1, line.length() - 1).split("\\|");
                for (int c = 0; c < cells.length; c++) {
                    cells[c] = cells[c].trim();
                }
                rows.add(cells);
            }
        }
        return rows;
    }
}
