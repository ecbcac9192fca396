package org.loopledger.ident.log;

import java.io.IOException;
import java.io.InputStream;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Streaming reader of delimited numeric text (shared by {@link DriveLogReader} and {@link FrfFileReader}):
 * lines are split on bytes, numbers parsed straight from the bytes into growable {@code double[]} columns,
 * so memory beyond the numeric arrays stays a fixed buffer however long the file. Only comment and header
 * lines are decoded as text (strictly, in the stated encoding).
 *
 * <p>Numbers: the exact fast path of Clinger (1990, "How to read floating point numbers accurately")
 * for up to 15 significant digits and decimal exponents within ±22 (one correctly rounded multiplication
 * or division of two exact doubles); anything else goes to {@link Double#parseDouble}. Empty cells,
 * {@code NaN} and {@code nan} read as NaN; {@code inf} and {@code -inf} as infinities.
 */
final class DelimitedText {
    private DelimitedText() {}

    /**
     * What was read. Columns hold {@code rows} values and may be longer (capacity). Data row r (0-based) is file line
     * {@code firstDataLine + r} when {@code contiguous} (no comment or blank line among the data).
     */
    record Table(String[] names, double[][] columns, int rows, int firstDataLine, boolean contiguous, Map<String, String> metadata,
                 List<String> comments, double[] resolution, char separator, boolean decimalComma, int headerLine) {}

    /** Result of the last fast-path parse: value and resolution exponent (10^res is the last printed digit). */
    private static final class Num {
        double value;
        int resExp;
    }

    private static final double[] POW10 = {1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16,
            1e17, 1e18, 1e19, 1e20, 1e21, 1e22};

    /** Line reader over bytes. */
    private static final class Lines {
        final InputStream in;
        byte[] buf = new byte[1 << 20];
        int start, end, lineNo;
        boolean eof;
        int ls, le; // current line [ls, le) in buf

        Lines(InputStream in) { this.in = in; }

        boolean next() throws IOException {
            while (true) {
                for (int i = start; i < end; i++) {
                    if (buf[i] == '\n') {
                        ls = start;
                        le = i > start && buf[i - 1] == '\r' ? i - 1 : i;
                        start = i + 1;
                        lineNo++;
                        return true;
                    }
                }
                if (eof) {
                    if (start < end) {
                        ls = start;
                        le = buf[end - 1] == '\r' ? end - 1 : end;
                        start = end;
                        lineNo++;
                        return true;
                    }
                    return false;
                }
                int scanned = end - start;
                if (start > 0) {
                    System.arraycopy(buf, start, buf, 0, scanned);
                    end = scanned;
                    start = 0;
                }
                if (end == buf.length) buf = Arrays.copyOf(buf, buf.length * 2);
                int r = in.read(buf, end, buf.length - end);
                if (r < 0) eof = true;
                else end += r;
            }
        }
    }

    static Table read(String source, InputStream in, long sizeHintBytes, LogFormat f) throws IOException {
        Lines L = new Lines(in);
        CharsetDecoder dec = f.charset().newDecoder().onMalformedInput(CodingErrorAction.REPORT).onUnmappableCharacter(CodingErrorAction.REPORT);
        Map<String, String> meta = new LinkedHashMap<>();
        List<String> comments = new ArrayList<>();
        byte[] prefix = f.commentPrefix().getBytes(f.charset());
        String[] names = null;
        int headerLine = 0;
        char sep = f.separatorChar();
        Boolean dc = f.decimalCommaSetting();
        String lastComment = null, lastCommentKey = null;
        int lastCommentLine = 0;
        boolean first = true;
        // 1. comments, metadata and the header
        while (true) {
            if (!L.next()) {
                throw new IllegalArgumentException(source + ": " + (names == null ? "no header row and no data" : "a header but no data rows")
                        + "; a log needs a header row such as time_s,current_measured_A,velocity_rad_s and rows of numbers");
            }
            if (first) {
                first = false;
                byte[] b = L.buf;
                if (L.le - L.ls >= 3 && (b[L.ls] & 0xff) == 0xEF && (b[L.ls + 1] & 0xff) == 0xBB && (b[L.ls + 2] & 0xff) == 0xBF) L.ls += 3;
                else if (L.le - L.ls >= 2 && (((b[L.ls] & 0xff) == 0xFF && (b[L.ls + 1] & 0xff) == 0xFE) || ((b[L.ls] & 0xff) == 0xFE && (b[L.ls + 1] & 0xff) == 0xFF))) {
                    throw new IllegalArgumentException(source + ": line 1: the file is UTF-16 (byte-order mark " + String.format("%02X %02X", b[L.ls] & 0xff, b[L.ls + 1] & 0xff)
                            + "); save or convert it as UTF-8 (e.g. iconv -f UTF-16 -t UTF-8)");
                }
            }
            int s = skipBlanks(L.buf, L.ls, L.le);
            if (s == L.le) continue;
            if (startsWith(L.buf, s, L.le, prefix)) {
                String text = decode(source, L, dec, f).strip().substring(f.commentPrefix().length()).strip();
                int eq = keyValueSplit(text);
                lastCommentKey = null;
                if (eq > 0) meta.put(lastCommentKey = text.substring(0, eq).strip(), text.substring(eq + 1).strip());
                else if (!text.isEmpty()) comments.add(text);
                lastComment = text;
                lastCommentLine = L.lineNo;
                continue;
            }
            if (names == null) {
                String line = decode(source, L, dec, f);
                if (sep == 0) sep = detectSeparator(line);
                String[] fields = split(line, sep);
                if (looksNumeric(fields[0])) {
                    // no header row: numpy.savetxt writes its header as a comment ("# a;b;c"); take the last comment if it fits
                    String[] fromComment = lastComment == null ? null : split(lastComment, sep);
                    if (fromComment != null && fromComment.length == fields.length && !looksNumeric(fromComment[0])) {
                        names = fromComment;
                        headerLine = lastCommentLine;
                        comments.remove(lastComment);
                        if (lastCommentKey != null) meta.remove(lastCommentKey);
                    } else {
                        throw new IllegalArgumentException(source + ": line " + L.lineNo + ": numbers where the header row of column names should be; "
                                + "add a header row (e.g. time_s;current_measured_A;velocity_rad_s) before the data");
                    }
                } else {
                    names = fields;
                    headerLine = L.lineNo;
                    continue;
                }
            }
            break; // L holds the first data line
        }
        for (int i = 0; i < names.length; i++) names[i] = unquote(names[i]);
        checkNames(source, headerLine, names, sep);
        // 2. decimal mark from the first data line
        if (dc == null) {
            dc = false;
            if (sep != ',') for (int i = L.ls; i < L.le; i++) if (L.buf[i] == ',') { dc = true; break; }
        }
        byte dot = dc ? (byte) ',' : (byte) '.';
        int nc = names.length;
        int cap = 1024;
        if (sizeHintBytes > 0) {
            // rows from the mean line length of the data already in the buffer (up to 1 MB), 2 % slack
            int lines = 0;
            for (int i = L.ls; i < L.end; i++) if (L.buf[i] == '\n') lines++;
            double meanLine = lines > 0 ? (double) (L.end - L.ls) / lines : L.le - L.ls + 1;
            long est = (long) (sizeHintBytes / Math.max(4, meanLine));
            cap = (int) Math.min(Integer.MAX_VALUE - 16, Math.max(1024, est + est / 50 + 64));
        }
        double[][] cols = new double[nc][cap];
        // histogram of each column's printed resolution 10^e, e in [-40, 23]
        int[][] resHist = new int[nc][64];
        int rows = 0;
        int firstDataLine = L.lineNo;
        boolean contiguous = true;
        Num num = new Num();
        int[] fs = new int[nc + 1], fe = new int[nc + 1];
        do {
            int s = skipBlanks(L.buf, L.ls, L.le);
            if (s == L.le) { contiguous = false; continue; }
            if (startsWith(L.buf, s, L.le, prefix)) {
                contiguous = false;
                String text = decode(source, L, dec, f).strip().substring(f.commentPrefix().length()).strip();
                int eq = keyValueSplit(text);
                if (eq > 0) meta.put(text.substring(0, eq).strip(), text.substring(eq + 1).strip());
                else if (!text.isEmpty()) comments.add(text);
                continue;
            }
            if (rows == cap) {
                cap = cap + Math.max(1024, cap >> 2);
                for (int c = 0; c < nc; c++) cols[c] = Arrays.copyOf(cols[c], cap);
            }
            int bad = row(L.buf, L.ls, L.le, sep, dot, fs, fe, cols, rows, resHist, num);
            if (bad == -2) {
                String line = decode(source, L, dec, f);
                int n = splitBytes(L.buf, L.ls, L.le, sep, fs, fe, nc + 1);
                throw new IllegalArgumentException(fieldCountMessage(source, L.lineNo, line, n, nc, names, sep, f.separatorChar() == 0));
            }
            while (bad >= 0) {
                // a cell off the fast path: the general parser, or a refusal naming line and column
                cols[bad][rows] = slow(source, L, f, fs[bad], fe[bad], dc, bad, names, sep);
                bad = rowFrom(L.buf, bad + 1, dot, fs, fe, cols, rows, resHist, num);
            }
            rows++;
        } while (L.next());
        double[] resolution = new double[nc];
        // not trimmed: a copy would need the memory of one more column at the end
        for (int c = 0; c < nc; c++) resolution[c] = resolution(resHist[c], rows);
        return new Table(names, cols, rows, firstDataLine, contiguous, meta, comments, resolution, sep, dc, headerLine);
    }

    /**
     * Splits and parses one data line into row {@code r}: -1 done, -2 wrong field count, else the first
     * column that needs the general parser. A small method of its own so the JIT compiles it early.
     */
    private static int row(byte[] b, int ls, int le, char sep, byte dot, int[] fs, int[] fe, double[][] cols, int r, int[][] resHist, Num num) {
        int nc = cols.length;
        if (splitBytes(b, ls, le, sep, fs, fe, nc + 1) != nc) return -2;
        return rowFrom(b, 0, dot, fs, fe, cols, r, resHist, num);
    }

    private static int rowFrom(byte[] b, int c0, byte dot, int[] fs, int[] fe, double[][] cols, int r, int[][] resHist, Num num) {
        for (int c = c0; c < cols.length; c++) {
            if (!parse(b, fs[c], fe[c], dot, num)) return c;
            cols[c][r] = num.value;
            int h = num.resExp + 40;
            if (h >= 0 && h < 64) resHist[c][h]++;
        }
        return -1;
    }

    /**
     * The column's print resolution: the coarsest 10^e that at least a tenth of the cells show (fixed
     * notation such as {@code %.6f} gives one e for all; {@code %g} drops trailing zeros, so a few cells
     * look coarser than the format is); 0 when unknown.
     */
    private static double resolution(int[] hist, int rows) {
        for (int h = 63; h >= 0; h--) if (hist[h] > 0 && hist[h] >= rows / 10) return Double.parseDouble("1e" + (h - 40));
        return 0;
    }

    // ---- fields and names ----

    static char detectSeparator(String header) {
        if (header.indexOf(';') >= 0) return ';';
        if (header.indexOf('\t') >= 0) return '\t';
        if (header.indexOf(',') >= 0) return ',';
        if (header.indexOf('|') >= 0) return '|';
        return ' ';
    }

    static String[] split(String line, char sep) {
        if (sep == ' ') {
            String t = line.strip();
            return t.isEmpty() ? new String[] {""} : t.split("[ \\t]+");
        }
        String[] p = line.split(java.util.regex.Pattern.quote(String.valueOf(sep)), -1);
        for (int i = 0; i < p.length; i++) p[i] = p[i].strip();
        return p;
    }

    private static String unquote(String s) {
        String t = s.strip();
        if (t.length() >= 2 && (t.charAt(0) == '"' && t.charAt(t.length() - 1) == '"' || t.charAt(0) == '\'' && t.charAt(t.length() - 1) == '\'')) {
            t = t.substring(1, t.length() - 1).strip();
        }
        return t;
    }

    private static void checkNames(String source, int line, String[] names, char sep) {
        for (int i = 0; i < names.length; i++) {
            if (names[i].isEmpty()) {
                throw new IllegalArgumentException(source + ": line " + line + ", field " + (i + 1) + ": empty column name in the header"
                        + (i == names.length - 1 ? " (a separator at the end of the line?)" : "") + "; name every column");
            }
            for (int j = 0; j < i; j++) {
                if (names[i].equals(names[j])) throw new IllegalArgumentException(source + ": line " + line + ": duplicate column name '" + names[i]
                        + "' (fields " + (j + 1) + " and " + (i + 1) + "); rename one");
            }
        }
    }

    private static boolean looksNumeric(String s) {
        String t = s.strip();
        if (t.isEmpty()) return false;
        char c = t.charAt(0);
        return (c >= '0' && c <= '9') || ((c == '-' || c == '+' || c == '.') && t.length() > 1 && (Character.isDigit(t.charAt(1)) || t.charAt(1) == '.'));
    }

    private static int keyValueSplit(String text) {
        int eq = text.indexOf('=');
        int colon = text.indexOf(':');
        int k = eq > 0 ? eq : colon;
        if (k <= 0) return -1;
        String key = text.substring(0, k).strip();
        return key.matches("[\\p{L}\\p{N}_ .\\-\\[\\]()/]+") && key.length() <= 64 ? k : -1;
    }

    private static int skipBlanks(byte[] b, int s, int e) {
        while (s < e && (b[s] == ' ' || b[s] == '\t')) s++;
        return s;
    }

    private static boolean startsWith(byte[] b, int s, int e, byte[] p) {
        if (e - s < p.length) return false;
        for (int i = 0; i < p.length; i++) if (b[s + i] != p[i]) return false;
        return true;
    }

    private static int splitBytes(byte[] b, int s, int e, char sep, int[] fs, int[] fe, int max) {
        int n = 0;
        if (sep == ' ') {
            int i = s;
            while (true) {
                while (i < e && (b[i] == ' ' || b[i] == '\t')) i++;
                if (i >= e) return n;
                int st = i;
                while (i < e && b[i] != ' ' && b[i] != '\t') i++;
                if (n < max) { fs[n] = st; fe[n] = i; }
                n++;
            }
        }
        byte sb = (byte) sep;
        int st = s;
        for (int i = s; i <= e; i++) {
            if (i == e || b[i] == sb) {
                if (n < max) { fs[n] = st; fe[n] = i; }
                n++;
                st = i + 1;
            }
        }
        return n;
    }

    private static String decode(String source, Lines L, CharsetDecoder dec, LogFormat f) {
        ByteBuffer in = ByteBuffer.wrap(L.buf, L.ls, L.le - L.ls);
        CharBuffer out = CharBuffer.allocate((int) ((L.le - L.ls) * (double) dec.maxCharsPerByte()) + 4);
        dec.reset();
        CoderResult r = dec.decode(in, out, true);
        if (!r.isError()) r = dec.flush(out);
        if (r.isError()) {
            int bad = in.position();
            throw new IllegalArgumentException(String.format(Locale.ROOT,
                    "%s: line %d, byte %d (0x%02X): not valid %s text; the file is probably Latin-1 / Windows-1252: pass "
                            + "LogFormat.detect().encoding(StandardCharsets.ISO_8859_1) (or the file's encoding), or convert it to UTF-8",
                    source, L.lineNo, bad - L.ls + 1, L.buf[bad] & 0xff, f.charset()));
        }
        out.flip();
        return out.toString();
    }

    private static String fieldCountMessage(String source, int line, String text, int n, int nc, String[] names, char sep, boolean detected) {
        StringBuilder m = new StringBuilder(String.format(Locale.ROOT, "%s: line %d has %d field(s), the header has %d (%s-separated%s)",
                source, line, n, nc, LogFormat.describeSeparator(sep), detected ? ", detected from the header" : ""));
        char other = 0;
        for (char c : new char[] {';', '\t', ','}) if (c != sep && text.indexOf(c) >= 0) { other = c; break; }
        if (other == ',' && sep != ',' && n == 1) {
            m.append("; ").append("comma-separated? pass LogFormat.detect().separator(',')");
        } else if (other != 0 && n == 1) {
            m.append("; ").append(LogFormat.describeSeparator(other)).append("-separated? pass LogFormat.detect()").append(LogFormat.code(other));
        } else if (sep == ',' && n > nc) {
            m.append("; decimal commas in a comma-separated file cannot be read: export with another separator (e.g. ';') or a decimal point");
        } else {
            m.append("; repair or cut that line (a truncated last line from an interrupted export?)");
        }
        return m.toString();
    }

    // ---- numbers ----

    /**
     * Parses [s, e) as a decimal number with decimal mark {@code dot} on the exact fast path; false when
     * the cell needs the general parser (or is not a number).
     */
    private static boolean parse(byte[] b, int s, int e, byte dot, Num out) {
        while (s < e && b[s] == ' ') s++;
        while (e > s && b[e - 1] == ' ') e--;
        if (s == e) return false;
        boolean neg = false;
        if (b[s] == '-') { neg = true; s++; } else if (b[s] == '+') s++;
        long m = 0;
        int sig = 0, frac = 0, digits = 0;
        boolean afterDot = false;
        int i = s;
        for (; i < e; i++) {
            int c = b[i];
            if (c >= '0' && c <= '9') {
                digits++;
                if (afterDot) frac++;
                if (m == 0 && c == '0') continue;
                if (sig >= 15) return false;
                m = m * 10 + (c - '0');
                sig++;
            } else if (c == dot && !afterDot) {
                afterDot = true;
            } else break;
        }
        if (digits == 0) return false;
        int ex = 0;
        if (i < e) {
            int c = b[i];
            if (c != 'e' && c != 'E') return false;
            i++;
            boolean eneg = false;
            if (i < e && (b[i] == '-' || b[i] == '+')) { eneg = b[i] == '-'; i++; }
            if (i == e) return false;
            for (; i < e; i++) {
                int d = b[i];
                if (d < '0' || d > '9' || ex > 10000) return false;
                ex = ex * 10 + (d - '0');
            }
            if (eneg) ex = -ex;
        }
        // the digits read as one integer m (leading zeros dropped) times 10^(ex - frac)
        int scale = ex - frac;
        double v;
        if (m == 0) v = 0;
        else if (scale >= 0 && scale <= 22) v = m * POW10[scale];
        else if (scale < 0 && scale >= -22) v = m / POW10[-scale];
        else return false;
        out.value = neg ? -v : v;
        out.resExp = scale;
        return true;
    }

    private static double slow(String source, Lines L, LogFormat f, int s, int e, boolean dc, int c, String[] names, char sep) {
        String cell = new String(L.buf, s, e - s, java.nio.charset.StandardCharsets.ISO_8859_1).strip();
        if (cell.isEmpty() || cell.equalsIgnoreCase("nan")) return Double.NaN;
        if (cell.equalsIgnoreCase("inf") || cell.equalsIgnoreCase("+inf") || cell.equalsIgnoreCase("infinity")) return Double.POSITIVE_INFINITY;
        if (cell.equalsIgnoreCase("-inf") || cell.equalsIgnoreCase("-infinity")) return Double.NEGATIVE_INFINITY;
        String t = dc ? cell.replace(',', '.') : cell;
        if (t.length() >= 2 && t.charAt(0) == '"' && t.charAt(t.length() - 1) == '"') t = t.substring(1, t.length() - 1).strip();
        boolean ok = !t.isEmpty() && t.chars().allMatch(ch -> (ch >= '0' && ch <= '9') || ch == '.' || ch == '-' || ch == '+' || ch == 'e' || ch == 'E');
        if (ok) {
            try {
                return Double.parseDouble(t);
            } catch (NumberFormatException ignored) {
                // fall through to the message
            }
        }
        String shown = decodeQuietly(L.buf, s, e, f);
        String hint;
        if (!dc && cell.matches("[-+]?\\d*,\\d+([eE][-+]?\\d+)?")) hint = "decimal comma? pass LogFormat.detect()" + (sep == ',' ? ".separator(';')" : "") + ".decimalComma()";
        else if (dc && cell.matches("[-+]?\\d*\\.\\d+([eE][-+]?\\d+)?")) hint = "decimal point in a decimal-comma file: pass LogFormat.detect().decimalPoint() or repair the cell";
        else if (cell.indexOf(';') >= 0) hint = "semicolon-separated? pass LogFormat.detect().separator(';')";
        else if (cell.indexOf('\t') >= 0) hint = "tab-separated? pass LogFormat.detect().separator('\\t')";
        else hint = "repair the cell, or leave it empty / NaN to mark a missing value";
        throw new IllegalArgumentException(String.format(Locale.ROOT, "%s: line %d, column '%s' (field %d): '%s' is not a number; %s",
                source, L.lineNo, names[c], c + 1, shown, hint));
    }

    private static String decodeQuietly(byte[] b, int s, int e, LogFormat f) {
        String t = new String(b, s, Math.min(e - s, 60), f.charset()).strip();
        return e - s > 60 ? t + "..." : t;
    }
}
