package org.loopledger.display;

/**
 * The notebook-facing helpers, imported statically in every kernel session:
 * {@code display(a, b, ...)}, {@code markdown("...")} and {@code html("...")}.
 */
public final class Displays {
    private Displays() {}

    /** Shows each value now, as its own output, in order (one {@code display_data} message each in a kernel). */
    public static void display(Object... values) {
        if (values == null) values = new Object[] {null};
        for (Object v : values) {
            MimeBundle b = Bundles.of(v);
            if (!DisplayChannel.send(b)) {
                System.out.println(b.plainText());
            }
        }
    }

    /** Markdown text shown as text/markdown (and as HTML, raw HTML escaped, for clients without Markdown). */
    public static Markdown markdown(String text) {
        return Markdown.of(text);
    }

    /** Trusted HTML written by the caller, shown as text/html. */
    public static Html html(String html) {
        return Html.of(html);
    }
}
