package dev.fixmod.verify.constellation;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.JsonToken;
import dev.fixmod.constellation.Constellation;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Reads a user-defined constellation, on the file's own coordinates, from CSV or JSON (chosen by the file's extension).
 * Each point gives its label as {@code label} (decimal) and/or {@code bits} (k binary digits, b0 first), its
 * coordinates {@code i} and {@code q}, and optionally its {@code probability}. The labels must be a permutation of
 * 0..M−1 with M a power of two; points distinct and finite; probabilities, if given, for every point, summing to 1.
 * Every error names the file, the line and the column or key. The family is {@code custom}, the labeling
 * {@code custom}.
 *
 * <p>CSV: a header line naming the columns (any order), then one point per line; blank lines and lines starting with
 * {@code #} are skipped. This is what {@code fixmod constellation NAME --csv} writes.
 * <pre>
 * label,bits,i,q,probability
 * 0,00,-1,-1,0.25
 * 1,01,-1,1,0.25
 * </pre>
 *
 * <p>JSON: an object with an optional {@code name} and an array {@code points} of objects with the same keys.
 * <pre>
 * {"name": "my4", "points": [{"bits": "00", "i": -1, "q": -1}, {"bits": "01", "i": -1, "q": 1}, …]}
 * </pre>
 */
public final class ConstellationFile {
    private static final List<String> KEYS = List.of("label", "bits", "i", "q", "probability");

    private ConstellationFile() {
    }

    /** One point as read, before the checks that need all points. */
    private static final class Row {
        int line;
        Integer label;
        String bits;
        Double i;
        Double q;
        Double probability;
    }

    /** Reads {@code file}; the name is the JSON {@code name} or else the file name without its extension. */
    public static Constellation read(Path file) {
        String where = file.toString();
        if (!Files.isRegularFile(file)) {
            throw new IllegalArgumentException(where + ": no such file");
        }
        String fileName = file.getFileName().toString();
        String lower = fileName.toLowerCase(Locale.ROOT);
        String text;
        try {
            text = Files.readString(file, StandardCharsets.UTF_8);
        } catch (IOException | java.io.UncheckedIOException e) {
            throw new IllegalArgumentException(where + ": cannot read (" + e.getMessage() + ")");
        }
        if (text.startsWith("\uFEFF")) {
            text = text.substring(1);
        }
        String stem = fileName.contains(".") ? fileName.substring(0, fileName.lastIndexOf('.')) : fileName;
        if (lower.endsWith(".csv")) {
            return build(where, stem, readCsv(where, text), "column");
        }
        if (lower.endsWith(".json")) {
            Map<String, String> name = new HashMap<>();
            List<Row> rows = readJson(where, text, name);
            return build(where, name.getOrDefault("name", stem), rows, "key");
        }
        throw new IllegalArgumentException(where + ": unknown file type; expected a .csv or .json file");
    }

    private static List<Row> readCsv(String where, String text) {
        String[] lines = text.split("\r?\n", -1);
        List<String> header = null;
        int headerLine = 0;
        List<Row> rows = new ArrayList<>();
        for (int n = 0; n < lines.length; n++) {
            String line = lines[n].trim();
            int lineNr = n + 1;
            if (line.isEmpty() || line.startsWith("#")) {
                continue;
            }
            String[] fields = line.split(",", -1);
            if (header == null) {
                header = new ArrayList<>();
                for (String f : fields) {
                    String column = f.trim().toLowerCase(Locale.ROOT);
                    if (!KEYS.contains(column)) {
                        throw new IllegalArgumentException(where + " line " + lineNr + ": unknown column '" + f.trim()
                                + "'; accepted columns: " + String.join(", ", KEYS));
                    }
                    if (header.contains(column)) {
                        throw new IllegalArgumentException(where + " line " + lineNr + ": column '" + column
                                + "' appears twice");
                    }
                    header.add(column);
                }
                requireColumns(where + " line " + lineNr, header, "column");
                headerLine = lineNr;
                continue;
            }
            if (fields.length != header.size()) {
                throw new IllegalArgumentException(where + " line " + lineNr + ": " + fields.length + " fields, the"
                        + " header on line " + headerLine + " has " + header.size());
            }
            Row row = new Row();
            row.line = lineNr;
            for (int c = 0; c < fields.length; c++) {
                String value = fields[c].trim();
                String at = where + " line " + lineNr + ", column '" + header.get(c) + "'";
                switch (header.get(c)) {
                    case "label":
                        row.label = parseLabel(at, value);
                        break;
                    case "bits":
                        row.bits = parseBits(at, value);
                        break;
                    case "i":
                        row.i = parseNumber(at, value);
                        break;
                    case "q":
                        row.q = parseNumber(at, value);
                        break;
                    default:
                        row.probability = parseNumber(at, value);
                        break;
                }
            }
            rows.add(row);
        }
        if (header == null) {
            throw new IllegalArgumentException(where + ": empty file; expected a header line such as 'label,i,q'");
        }
        return rows;
    }

    private static void requireColumns(String at, List<String> present, String word) {
        if (!present.contains("i") || !present.contains("q")) {
            throw new IllegalArgumentException(at + ": " + word + "s 'i' and 'q' are required");
        }
        if (!present.contains("label") && !present.contains("bits")) {
            throw new IllegalArgumentException(at + ": a " + word + " 'label' or 'bits' is required");
        }
    }

    private static Integer parseLabel(String at, String value) {
        if (!value.matches("[0-9]{1,4}")) {
            throw new IllegalArgumentException(at + ": '" + value + "' is not a label (a decimal integer 0..4095)");
        }
        return Integer.valueOf(value);
    }

    private static String parseBits(String at, String value) {
        if (!value.matches("[01]{1,12}")) {
            throw new IllegalArgumentException(at + ": '" + value + "' is not a bit string (1 to 12 binary digits,"
                    + " b0 first)");
        }
        return value;
    }

    private static double parseNumber(String at, String value) {
        double x;
        try {
            x = Double.parseDouble(value);
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException(at + ": '" + value + "' is not a number");
        }
        if (!Double.isFinite(x)) {
            throw new IllegalArgumentException(at + ": '" + value + "' is not a finite number");
        }
        return x;
    }

    private static List<Row> readJson(String where, String text, Map<String, String> name) {
        List<Row> rows = new ArrayList<>();
        try (JsonParser p = new JsonFactory().createParser(text)) {
            if (p.nextToken() != JsonToken.START_OBJECT) {
                throw new IllegalArgumentException(where + " line " + line(p) + ": expected a JSON object with the"
                        + " key 'points'");
            }
            boolean points = false;
            while (p.nextToken() == JsonToken.FIELD_NAME) {
                String key = p.currentName();
                JsonToken value = p.nextToken();
                if (key.equals("name")) {
                    if (value != JsonToken.VALUE_STRING) {
                        throw new IllegalArgumentException(where + " line " + line(p) + ", key 'name': expected a"
                                + " string");
                    }
                    name.put("name", p.getText());
                } else if (key.equals("points")) {
                    if (value != JsonToken.START_ARRAY) {
                        throw new IllegalArgumentException(where + " line " + line(p) + ", key 'points': expected an"
                                + " array of point objects");
                    }
                    readJsonPoints(where, p, rows);
                    points = true;
                } else {
                    throw new IllegalArgumentException(where + " line " + line(p) + ": unknown key '" + key
                            + "'; accepted keys: name, points");
                }
            }
            if (!points) {
                throw new IllegalArgumentException(where + ": the key 'points' is missing");
            }
            if (p.nextToken() != null) {
                throw new IllegalArgumentException(where + " line " + line(p) + ": text after the JSON object");
            }
        } catch (JsonProcessingException e) {
            String message = e.getOriginalMessage().split("\n", 2)[0];
            throw new IllegalArgumentException(where + " line " + e.getLocation().getLineNr() + ": malformed JSON: "
                    + message);
        } catch (IOException e) {
            throw new IllegalArgumentException(where + ": cannot read (" + e.getMessage() + ")");
        }
        return rows;
    }

    private static void readJsonPoints(String where, JsonParser p, List<Row> rows) throws IOException {
        int index = 0;
        JsonToken t;
        while ((t = p.nextToken()) != JsonToken.END_ARRAY) {
            String point = "points[" + index + "]";
            if (t != JsonToken.START_OBJECT) {
                throw new IllegalArgumentException(where + " line " + line(p) + ", key '" + point + "': expected an"
                        + " object with keys " + String.join(", ", KEYS));
            }
            Row row = new Row();
            row.line = line(p);
            List<String> present = new ArrayList<>();
            while (p.nextToken() == JsonToken.FIELD_NAME) {
                String key = p.currentName();
                String at = where + " line " + line(p) + ", key '" + point + "." + key + "'";
                if (!KEYS.contains(key)) {
                    throw new IllegalArgumentException(where + " line " + line(p) + ": unknown key '" + point + "."
                            + key + "'; accepted keys: " + String.join(", ", KEYS));
                }
                if (present.contains(key)) {
                    throw new IllegalArgumentException(at + ": given twice");
                }
                present.add(key);
                JsonToken value = p.nextToken();
                switch (key) {
                    case "label":
                        if (value != JsonToken.VALUE_NUMBER_INT) {
                            throw new IllegalArgumentException(at + ": expected an integer label 0..4095, got "
                                    + p.getText());
                        }
                        row.label = parseLabel(at, p.getText());
                        break;
                    case "bits":
                        if (value != JsonToken.VALUE_STRING) {
                            throw new IllegalArgumentException(at + ": expected a string of binary digits such as"
                                    + " \"0110\", got " + p.getText());
                        }
                        row.bits = parseBits(at, p.getText());
                        break;
                    default:
                        if (value != JsonToken.VALUE_NUMBER_INT && value != JsonToken.VALUE_NUMBER_FLOAT) {
                            throw new IllegalArgumentException(at + ": expected a number, got " + p.getText());
                        }
                        double x = parseNumber(at, p.getText());
                        if (key.equals("i")) {
                            row.i = x;
                        } else if (key.equals("q")) {
                            row.q = x;
                        } else {
                            row.probability = x;
                        }
                        break;
                }
            }
            requireColumns(where + " line " + row.line + ", key '" + point + "'", present, "key");
            rows.add(row);
            index++;
        }
    }

    private static int line(JsonParser p) {
        return p.currentTokenLocation().getLineNr();
    }

    private static Constellation build(String where, String name, List<Row> rows, String word) {
        int m = rows.size();
        if (m < 2 || Integer.bitCount(m) != 1) {
            throw new IllegalArgumentException(where + ": " + m + " points; a constellation needs a power of two >= 2");
        }
        int k = Integer.numberOfTrailingZeros(m);
        double[] re = new double[m];
        double[] im = new double[m];
        int[] labels = new int[m];
        double[] probability = rows.get(0).probability == null ? null : new double[m];
        Map<Integer, Integer> lineOfLabel = new HashMap<>();
        Map<String, Integer> lineOfPoint = new LinkedHashMap<>();
        double sum = 0;
        for (int n = 0; n < m; n++) {
            Row row = rows.get(n);
            String at = where + " line " + row.line;
            int label;
            if (row.bits != null) {
                if (row.bits.length() != k) {
                    throw new IllegalArgumentException(at + ", " + word + " 'bits': '" + row.bits + "' has "
                            + row.bits.length() + " bits; " + m + " points need " + k);
                }
                label = Integer.parseInt(row.bits, 2);
                if (row.label != null && row.label != label) {
                    throw new IllegalArgumentException(at + ": label " + row.label + " and bits '" + row.bits
                            + "' disagree");
                }
            } else {
                label = row.label;
                if (label >= m) {
                    throw new IllegalArgumentException(at + ", " + word + " 'label': " + label + " is outside 0.."
                            + (m - 1) + " for " + m + " points");
                }
            }
            Integer earlier = lineOfLabel.put(label, row.line);
            if (earlier != null) {
                throw new IllegalArgumentException(at + ": label " + label + " already used on line " + earlier
                        + "; labels must be a permutation of 0.." + (m - 1));
            }
            String key = (row.i + 0.0) + "," + (row.q + 0.0);
            Integer samePoint = lineOfPoint.put(key, row.line);
            if (samePoint != null) {
                throw new IllegalArgumentException(at + ": point (" + row.i + ", " + row.q + ") already given on line "
                        + samePoint + "; points must be distinct");
            }
            if ((row.probability == null) != (probability == null)) {
                throw new IllegalArgumentException(at + ": a probability is given for some points but not for this"
                        + " one; give it for every point or for none");
            }
            if (probability != null) {
                if (row.probability < 0) {
                    throw new IllegalArgumentException(at + ", " + word + " 'probability': " + row.probability
                            + " is negative");
                }
                probability[n] = row.probability;
                sum += row.probability;
            }
            re[n] = row.i;
            im[n] = row.q;
            labels[n] = label;
        }
        if (probability != null && Math.abs(sum - 1) > Constellation.PROBABILITY_SUM_TOLERANCE) {
            throw new IllegalArgumentException(where + ": the probabilities sum to " + sum + ", not 1");
        }
        try {
            return Constellation.ofPoints(name, "custom", re, im, labels, probability);
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException(where + ": " + e.getMessage(), e);
        }
    }
}
