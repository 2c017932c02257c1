package dev.fixmod.fixed;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Reads the tables of our own documentation (javadoc HTML tables in the sources, Markdown tables in README.md) so a
 * test can check each row against the code. Cells are normalized: tags and {@code {@code ...}} removed, the
 * typographic minus (U+2212) read as '-'.
 */
final class DocTables {

    /** A table: its header cells and its body rows. */
    record Table(List<String> header, List<List<String>> rows) {
    }

    private static final Pattern ROW = Pattern.compile("<tr>(.*?)</tr>", Pattern.DOTALL);
    private static final Pattern CELL = Pattern.compile("<t([dh])>(.*?)</t\\1>", Pattern.DOTALL);

    private DocTables() {
    }

    /** The project root: the nearest directory upward from the working directory holding README.md and kernel/. */
    static Path root() {
        Path dir = Path.of(System.getProperty("user.dir")).toAbsolutePath();
        while (dir != null) {
            if (Files.exists(dir.resolve("README.md")) && Files.isDirectory(dir.resolve("kernel"))) {
                return dir;
            }
            dir = dir.getParent();
        }
        throw new IllegalStateException("project root not found above " + System.getProperty("user.dir"));
    }

    /** The javadoc table of {@code type} whose caption starts with {@code caption}. */
    static Table javadoc(Class<?> type, String caption) {
        Path source = root().resolve("kernel/src/main/java").resolve(type.getName().replace('.', '/') + ".java");
        StringBuilder text = new StringBuilder();
        for (String line : read(source)) {
            text.append(line.replaceFirst("^\\s*\\*", "")).append(' ');
        }
        String all = text.toString();
        int at = all.indexOf("<caption>" + caption);
        if (at < 0) {
            throw new AssertionError("no table captioned '" + caption + "' in " + source);
        }
        String table = all.substring(at, all.indexOf("</table>", at));
        List<String> header = null;
        List<List<String>> rows = new ArrayList<>();
        Matcher row = ROW.matcher(table);
        while (row.find()) {
            List<String> cells = new ArrayList<>();
            Matcher cell = CELL.matcher(row.group(1));
            boolean isHeader = false;
            while (cell.find()) {
                isHeader = cell.group(1).equals("h");
                cells.add(clean(cell.group(2)));
            }
            if (isHeader) {
                header = cells;
            } else {
                rows.add(cells);
            }
        }
        return new Table(header, rows);
    }

    /** The {@code index}-th Markdown table (0-based) in the README section with the given heading. */
    static Table readme(String heading, int index) {
        List<String> lines = read(root().resolve("README.md"));
        int start = lines.indexOf("## " + heading);
        if (start < 0) {
            throw new AssertionError("README.md has no section '## " + heading + "'");
        }
        List<Table> tables = new ArrayList<>();
        List<List<String>> current = null;
        for (int i = start + 1; i < lines.size() && !lines.get(i).startsWith("## "); i++) {
            String line = lines.get(i).trim();
            if (line.startsWith("|")) {
                if (current == null) {
                    current = new ArrayList<>();
                }
                if (!line.matches("\\|[\\s:|-]+\\|")) {
                    List<String> cells = new ArrayList<>();
                    for (String c : line.substring(1, line.length() - 1).split("\\|")) {
                        cells.add(clean(c));
                    }
                    current.add(cells);
                }
            } else if (current != null) {
                tables.add(new Table(current.get(0), current.subList(1, current.size())));
                current = null;
            }
        }
        if (current != null) {
            tables.add(new Table(current.get(0), current.subList(1, current.size())));
        }
        return tables.get(index);
    }

    /** A result cell such as {@code -128*}: the integer and whether an event is marked. */
    record Marked(long value, boolean event) {
        static Marked parse(String cell) {
            boolean event = cell.endsWith("*");
            return new Marked(Long.parseLong(event ? cell.substring(0, cell.length() - 1) : cell), event);
        }
    }

    private static String clean(String cell) {
        return cell.replaceAll("\\{@(code|literal) ([^}]*)}", "$2")
                .replaceAll("<[^>]+>", "")
                .replace('\u2212', '-')
                .replace("`", "")
                .trim();
    }

    private static List<String> read(Path file) {
        try {
            return Files.readAllLines(file, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
