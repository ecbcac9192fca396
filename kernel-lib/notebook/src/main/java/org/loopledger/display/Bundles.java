package org.loopledger.display;

import java.io.PrintWriter;
import java.io.StringWriter;

/** Conversions of any value to a MIME bundle, as the kernel's agent and the notebook runner use them. */
public final class Bundles {
    private Bundles() {}

    /** The MIME bundle of any value; a renderer that fails yields plain text and a note on stderr. */
    public static MimeBundle of(Object value) {
        try {
            return RendererRegistry.global().render(value).orElseGet(() -> MimeBundle.ofText(plainText(value)));
        } catch (Throwable t) {
            return failed(value, t);
        }
    }

    /** {@link #of} as JSON. */
    public static String json(Object value) {
        return of(value).toJson();
    }

    /** A plain-text bundle (JSON) for a value whose rendering threw {@code t}. */
    public static String failedJson(Object value, Throwable t) {
        return failed(value, t).toJson();
    }

    private static MimeBundle failed(Object value, Throwable t) {
        String text;
        try {
            text = plainText(value);
        } catch (Throwable again) {
            text = value == null ? "null" : value.getClass().getName();
        }
        StringWriter trace = new StringWriter();
        t.printStackTrace(new PrintWriter(trace));
        System.err.println("display: rendering " + (value == null ? "null" : value.getClass().getName())
                + " failed, showing plain text instead. Cause: " + trace);
        return MimeBundle.ofText(text);
    }

    /** Plain text of a value, as JShell shows it: strings quoted with Java escapes, arrays listed, else toString. */
    public static String plainText(Object value) {
        return PlainText.of(value);
    }
}
