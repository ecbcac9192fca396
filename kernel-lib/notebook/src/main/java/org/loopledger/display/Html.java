package org.loopledger.display;

/** HTML the caller wrote and trusts; text/plain is the HTML with tags removed. */
public record Html(String html) implements Displayable {
    public Html {
        if (html == null) throw new IllegalArgumentException("html must not be null; pass \"\" for nothing");
    }

    public static Html of(String html) {
        return new Html(html);
    }

    @Override
    public MimeBundle toMimeBundle() {
        String text = html.replaceAll("<[^>]*>", "").replace("&lt;", "<").replace("&gt;", ">").replace("&amp;", "&").strip();
        return MimeBundle.builder(text).put(MimeBundle.TEXT_HTML, html).build();
    }
}
