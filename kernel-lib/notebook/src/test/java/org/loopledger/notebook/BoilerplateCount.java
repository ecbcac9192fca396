package org.loopledger.notebook;

import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import com.google.gson.JsonParser;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.regex.Pattern;

/**
 * Counts the boilerplate in a notebook's code cells (issue 10): lines that build table columns, append cells,
 * convert units element by element, or format numbers by hand, over the non-blank code lines (comment lines
 * included, so the denominator is what a reader scrolls through). Run from the repository root:
 * {@code mvn -B -o -q test -pl kernel-lib/notebook -Dtest=NotebookBoilerplateTest} prints the table.
 */
final class BoilerplateCount {
    /** What makes a line boilerplate, by kind; a line counts once even when it matches several. */
    enum Kind {
        TABLE_COLUMNS("builds table columns", "\\b(String|Double|Int|Long|Boolean)Column\\.create\\(|\\.addColumns\\(|\\bTable\\.create\\("),
        APPENDS_CELLS("appends cells", "\\.append\\("),
        CONVERTS_ELEMENTWISE("converts units element by element", "\\b\\w+\\[\\w+\\]\\s*=\\s*[^;=]*[*/]|^\\s*for\\s*\\(int\\s+\\w+\\s*=\\s*0;[^;]*\\.length;[^)]*\\)\\s*\\w+\\[\\w+\\]\\s*="),
        FORMATS_BY_HAND("formats numbers by hand", "String\\.format\\(|\\.printf\\(|\\.formatted\\(|DecimalFormat|\\bUnits\\.(g4|format\\w*)\\(|\\b(g4|hz|fmt|opt)\\(|\\+\\s*\"\\s?(ms|µs|us|µm|um|mm|m|s|Hz|deg|dB|A|%|rad/s|kg·m²|N·m/A)\\b[^\"]*\"");

        final String description;
        final Pattern pattern;

        Kind(String description, String regex) {
            this.description = description;
            this.pattern = Pattern.compile(regex);
        }
    }

    record Line(int cell, String text, Kind kind) {}

    record Count(Path notebook, int codeLines, List<Line> boilerplate) {
        double fraction() { return codeLines == 0 ? 0 : boilerplate.size() / (double) codeLines; }

        String summary() {
            return String.format(Locale.ROOT, "%-40s %4d code lines, %3d boilerplate (%4.1f %%)", notebook.getFileName(), codeLines,
                    boilerplate.size(), 100 * fraction());
        }
    }

    private BoilerplateCount() {}

    static Kind classify(String line) {
        for (Kind k : Kind.values()) {
            if (k.pattern.matcher(line).find()) return k;
        }
        return null;
    }

    static Count of(Path notebook) throws IOException {
        JsonObject nb = JsonParser.parseString(Files.readString(notebook)).getAsJsonObject();
        int code = 0, cellIndex = 0;
        List<Line> found = new ArrayList<>();
        for (JsonElement c : nb.getAsJsonArray("cells")) {
            JsonObject cell = c.getAsJsonObject();
            cellIndex++;
            if (!"code".equals(cell.get("cell_type").getAsString())) continue;
            JsonElement src = cell.get("source");
            StringBuilder text = new StringBuilder();
            if (src.isJsonArray()) src.getAsJsonArray().forEach(e -> text.append(e.getAsString()));
            else text.append(src.getAsString());
            for (String line : text.toString().split("\n", -1)) {
                if (line.isBlank()) continue;
                code++;
                Kind k = classify(line);
                if (k != null) found.add(new Line(cellIndex, line.strip(), k));
            }
        }
        return new Count(notebook, code, List.copyOf(found));
    }
}
