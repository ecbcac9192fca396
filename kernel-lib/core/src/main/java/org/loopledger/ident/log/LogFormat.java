package org.loopledger.ident.log;

import java.nio.charset.Charset;
import java.nio.charset.StandardCharsets;
import java.util.Objects;

/**
 * How a delimited text log is written: separator, decimal mark, encoding, comment prefix. Immutable; each
 * {@code with}-style method returns a new format. {@link #detect()} (the default) finds the separator
 * from the header row (semicolon, then tab, then comma, else runs of blanks) and a decimal comma from the
 * first data row; state either when detection cannot tell.
 *
 * <p>Lines starting with the comment prefix ({@code #} by default) are comments anywhere in the file;
 * {@code # key = value} (or {@code # key: value}) lines become the log's metadata. A UTF-8 byte-order mark
 * is skipped. Text is strict UTF-8 unless another {@link #encoding(Charset)} is stated; a byte that is not
 * valid in the encoding is refused with its line and the fix.
 *
 * <p>Fields: the separator ({@code 0} detect, {@code ' '} runs of blanks), the decimal mark ({@code null}
 * detect), the encoding (ASCII-compatible: UTF-8, ISO-8859-1, windows-1252, ...), the comment prefix.
 */
public final class LogFormat {
    private final char separator;
    private final Boolean decimalComma;
    private final Charset charset;
    private final String commentPrefix;

    private LogFormat(char separator, Boolean decimalComma, Charset charset, String commentPrefix) {
        Objects.requireNonNull(charset, "charset");
        Objects.requireNonNull(commentPrefix, "commentPrefix");
        if (separator != 0 && separator != ',' && separator != ';' && separator != '\t' && separator != ' ' && separator != '|') {
            throw new IllegalArgumentException("separator '" + separator + "' not supported; use ',', ';', '\\t', '|' or ' ' (runs of blanks)");
        }
        if (separator == ',' && Boolean.TRUE.equals(decimalComma)) {
            throw new IllegalArgumentException("a comma cannot be both the separator and the decimal mark; a decimal-comma file is usually "
                    + "semicolon-separated: pass .separator(';').decimalComma()");
        }
        if (commentPrefix.isEmpty()) throw new IllegalArgumentException("the comment prefix must not be empty (default '#')");
        if (!charset.newEncoder().canEncode("0123456789.,;-+eE") || charset.name().toUpperCase(java.util.Locale.ROOT).startsWith("UTF-16")
                || charset.name().toUpperCase(java.util.Locale.ROOT).startsWith("UTF-32")) {
            throw new IllegalArgumentException("encoding " + charset + " is not ASCII-compatible; convert the file to UTF-8 first");
        }
        this.separator = separator;
        this.decimalComma = decimalComma;
        this.charset = charset;
        this.commentPrefix = commentPrefix;
    }

    /** The separator, {@code 0} when detected, {@code ' '} for runs of blanks. */
    public char separatorChar() { return separator; }

    /** Whether numbers use a decimal comma; null when detected. */
    public Boolean decimalCommaSetting() { return decimalComma; }

    public Charset charset() { return charset; }

    public String commentPrefix() { return commentPrefix; }

    @Override public String toString() {
        return "LogFormat[separator " + describeSeparator(separator) + ", decimal " + (decimalComma == null ? "detect" : decimalComma ? "comma" : "point")
                + ", " + charset + ", comments '" + commentPrefix + "']";
    }

    /** Detect separator and decimal mark; UTF-8; {@code #} comments. */
    public static LogFormat detect() { return new LogFormat((char) 0, null, StandardCharsets.UTF_8, "#"); }

    /** The field separator: {@code ','}, {@code ';'}, {@code '\t'}, {@code '|'} or {@code ' '} (runs of blanks). */
    public LogFormat separator(char c) { return new LogFormat(c, decimalComma, charset, commentPrefix); }

    /** Fields separated by runs of spaces or tabs. */
    public LogFormat whitespace() { return separator(' '); }

    /** Numbers use a comma as the decimal mark ({@code 1,25}). */
    public LogFormat decimalComma() { return new LogFormat(separator, true, charset, commentPrefix); }

    /** Numbers use a point as the decimal mark (no detection). */
    public LogFormat decimalPoint() { return new LogFormat(separator, false, charset, commentPrefix); }

    /** The text encoding, e.g. {@code StandardCharsets.ISO_8859_1} for Latin-1 exports. */
    public LogFormat encoding(Charset cs) { return new LogFormat(separator, decimalComma, cs, commentPrefix); }

    public LogFormat commentPrefix(String prefix) { return new LogFormat(separator, decimalComma, charset, prefix); }

    /** How to state this format in code, for messages. */
    static String describeSeparator(char c) {
        return switch (c) {
            case ',' -> "comma";
            case ';' -> "semicolon";
            case '\t' -> "tab";
            case ' ' -> "blanks";
            case '|' -> "bar";
            default -> "detect";
        };
    }

    static String code(char c) {
        return switch (c) {
            case '\t' -> ".separator('\\t')";
            case ' ' -> ".whitespace()";
            default -> ".separator('" + c + "')";
        };
    }
}
