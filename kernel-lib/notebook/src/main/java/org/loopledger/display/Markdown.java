package org.loopledger.display;

/**
 * Markdown text (CommonMark with GFM tables). Shown as text/markdown, with text/html from
 * {@link MarkdownHtml#forNotebook()}: raw HTML in the source escaped, links only to http(s), mailto,
 * fragments and relative paths (a {@code javascript:} or {@code data:} link keeps only its text), remote
 * images as link text (never fetched), and {@code $...$} math left as TeX for the client's MathJax. The
 * source itself is the text/plain.
 */
public record Markdown(String source) implements Displayable {
    private static final MarkdownHtml HTML = MarkdownHtml.forNotebook();

    public Markdown {
        if (source == null) throw new IllegalArgumentException("markdown source must not be null; pass \"\" for nothing");
    }

    public static Markdown of(String source) {
        return new Markdown(source);
    }

    /** The HTML rendering (see the class comment for what is kept). */
    public String html() {
        return HTML.render(source);
    }

    @Override
    public MimeBundle toMimeBundle() {
        return MimeBundle.builder(source).put(MimeBundle.TEXT_MARKDOWN, source).put(MimeBundle.TEXT_HTML, html()).build();
    }
}
