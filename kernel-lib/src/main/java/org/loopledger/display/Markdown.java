package org.loopledger.display;

import org.commonmark.parser.Parser;
import org.commonmark.renderer.html.HtmlRenderer;

/**
 * Markdown text (CommonMark). Shown as text/markdown, with text/html from commonmark-java in which raw
 * HTML in the source is escaped rather than passed through, and the source itself as text/plain.
 */
public record Markdown(String source) implements Displayable {
    private static final Parser PARSER = Parser.builder().build();
    private static final HtmlRenderer HTML = HtmlRenderer.builder().escapeHtml(true).build();

    public Markdown {
        if (source == null) throw new IllegalArgumentException("markdown source must not be null; pass \"\" for nothing");
    }

    public static Markdown of(String source) {
        return new Markdown(source);
    }

    /** The HTML rendering, raw HTML escaped. */
    public String html() {
        return HTML.render(PARSER.parse(source));
    }

    @Override
    public MimeBundle toMimeBundle() {
        return MimeBundle.builder(source).put(MimeBundle.TEXT_MARKDOWN, source).put(MimeBundle.TEXT_HTML, html()).build();
    }
}
