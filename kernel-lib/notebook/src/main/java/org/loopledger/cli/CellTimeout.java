package org.loopledger.cli;

import picocli.CommandLine;

import java.time.Duration;
import java.time.format.DateTimeParseException;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/** Parses {@code --cell-timeout}: {@code 90} or {@code 90s}, {@code 500ms}, {@code 10m}, {@code 1h}, ISO {@code PT10M}; {@code 0} for none. */
final class CellTimeout implements CommandLine.ITypeConverter<Duration> {
    static final String DESCRIPTION = "longest time one cell may run before it is stopped and the run fails, naming the cell: "
            + "90 or 90s, 500ms, 10m, 1h; 0 for no limit (default ${DEFAULT-VALUE})";
    private static final Pattern SIMPLE = Pattern.compile("(\\d+(?:\\.\\d+)?)\\s*(ms|s|m|h)?");

    @Override
    public Duration convert(String value) {
        String v = value.strip().toLowerCase(Locale.ROOT);
        Matcher m = SIMPLE.matcher(v);
        if (m.matches()) {
            double n = Double.parseDouble(m.group(1));
            String unit = m.group(2) == null ? "s" : m.group(2);
            double ms = n * switch (unit) {
                case "ms" -> 1;
                case "m" -> 60_000;
                case "h" -> 3_600_000;
                default -> 1000;
            };
            return Duration.ofMillis(Math.round(ms));
        }
        try {
            return Duration.parse(value.strip().toUpperCase(Locale.ROOT));
        } catch (DateTimeParseException e) {
            throw new CommandLine.TypeConversionException("'" + value + "' is not a duration; write e.g. 90s, 10m, 1h, or 0 for no limit");
        }
    }
}
