package org.loopledger.display;

import java.util.Arrays;

/** Plain text forms of values (strings and characters quoted with Java escapes, arrays listed). */
final class PlainText {
    private static final int MAX_CHARS = 100_000;

    private PlainText() {}

    static String of(Object value) {
        String s;
        if (value == null) s = "null";
        else if (value instanceof String str) s = quote(str, '"');
        else if (value instanceof Character c) s = quote(String.valueOf(c), '\'');
        else if (value instanceof Object[] a) s = Arrays.deepToString(a);
        else if (value instanceof double[] a) s = Arrays.toString(a);
        else if (value instanceof int[] a) s = Arrays.toString(a);
        else if (value instanceof long[] a) s = Arrays.toString(a);
        else if (value instanceof float[] a) s = Arrays.toString(a);
        else if (value instanceof boolean[] a) s = Arrays.toString(a);
        else if (value instanceof byte[] a) s = Arrays.toString(a);
        else if (value instanceof short[] a) s = Arrays.toString(a);
        else if (value instanceof char[] a) s = Arrays.toString(a);
        else s = String.valueOf(value);
        return s.length() > MAX_CHARS ? s.substring(0, MAX_CHARS) + "... (" + s.length() + " characters in all)" : s;
    }

    static String quote(String s, char q) {
        StringBuilder b = new StringBuilder(s.length() + 2).append(q);
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '\n' -> b.append("\\n");
                case '\t' -> b.append("\\t");
                case '\r' -> b.append("\\r");
                case '\\' -> b.append("\\\\");
                default -> {
                    if (c == q) b.append('\\').append(c);
                    else if (c < 0x20 || c == 0x7f) b.append(String.format("\\u%04x", (int) c));
                    else b.append(c);
                }
            }
        }
        return b.append(q).toString();
    }
}
