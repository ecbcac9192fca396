package org.loopledger.display;

import org.commonmark.Extension;
import org.commonmark.ext.gfm.tables.TablesExtension;
import org.commonmark.node.AbstractVisitor;
import org.commonmark.node.Code;
import org.commonmark.node.CustomNode;
import org.commonmark.node.FencedCodeBlock;
import org.commonmark.node.HardLineBreak;
import org.commonmark.node.HtmlBlock;
import org.commonmark.node.HtmlInline;
import org.commonmark.node.Image;
import org.commonmark.node.IndentedCodeBlock;
import org.commonmark.node.Link;
import org.commonmark.node.LinkReferenceDefinition;
import org.commonmark.node.Node;
import org.commonmark.node.SoftLineBreak;
import org.commonmark.node.Text;
import org.commonmark.parser.Parser;
import org.commonmark.renderer.NodeRenderer;
import org.commonmark.renderer.html.HtmlNodeRendererContext;
import org.commonmark.renderer.html.HtmlRenderer;
import org.commonmark.renderer.html.HtmlWriter;
import org.commonmark.renderer.html.UrlSanitizer;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Markdown (CommonMark with GFM tables, and {@code $...$} / {@code $$...$$} math as in Jupyter) to HTML
 * that is safe to show: raw HTML is escaped, links keep only {@code http:}, {@code https:}, {@code mailto:},
 * fragments and relative paths (a {@code javascript:} or {@code data:} link becomes its text), and images
 * are shown only when they can be embedded as a {@code data:} URI; any other image becomes link text, so
 * opening the HTML never fetches anything from a server (a remote image would be a tracking beacon).
 *
 * <p>Math is taken out of the source before CommonMark sees it, as Jupyter does, so that {@code _}, {@code *}
 * and backslashes inside a formula are not read as Markdown. Code spans and fenced code keep their dollars.
 *
 * <p>Two flavours: {@link #forNotebook()} (the {@code text/html} of a Markdown display, where Jupyter's
 * MathJax typesets the formula source and relative images load from the notebook's folder) and
 * {@link #forRecord(Images)} (the tuning record: math typeset as SVG pictures, images only as data URIs).
 */
public final class MarkdownHtml {
    /** Where a record finds the picture behind an image destination. */
    @FunctionalInterface
    public interface Images {
        /** The image as a {@code data:} URI, or empty to show the image as link text. */
        Optional<String> dataUri(String destination);
    }

    /** Inline data URIs of embeddable images only. */
    public static final Images DATA_URIS_ONLY = dest -> dest.regionMatches(true, 0, "data:", 0, 5) ? ImageData.fromDataUri(dest) : Optional.empty();

    private static final char OPEN = '\uE000', CLOSE = '\uE001';
    /** Longest inline formula looked for: keeps the scan linear in the text's length whatever its dollars. */
    static final int MAX_INLINE_MATH = 2000;
    private static final Pattern TOKEN = Pattern.compile(OPEN + "(\\d+)" + CLOSE);
    private static final Pattern SCHEME = Pattern.compile("^([A-Za-z][A-Za-z0-9+.-]*):");
    private static final Set<String> LINK_SCHEMES = Set.of("http", "https", "mailto");
    private static final List<Extension> EXTENSIONS = List.of(TablesExtension.create());
    private static final Parser PARSER = Parser.builder().extensions(EXTENSIONS).build();

    private final Images images;
    private final boolean relativeImages;
    private final boolean typesetMath;
    private final HtmlRenderer renderer;

    private MarkdownHtml(Images images, boolean relativeImages, boolean typesetMath) {
        this.images = images;
        this.relativeImages = relativeImages;
        this.typesetMath = typesetMath;
        this.renderer = HtmlRenderer.builder().extensions(EXTENSIONS).escapeHtml(true).sanitizeUrls(true).urlSanitizer(new Sanitizer())
                .nodeRendererFactory(MathRenderer::new).build();
    }

    /** For the {@code text/html} of a Markdown display in a notebook: math left as TeX for MathJax, relative images kept. */
    public static MarkdownHtml forNotebook() {
        return new MarkdownHtml(DATA_URIS_ONLY, true, false);
    }

    /** For the tuning record: math typeset as SVG, images only as data URIs from {@code images}. */
    public static MarkdownHtml forRecord(Images images) {
        return new MarkdownHtml(images, false, true);
    }

    /** Parses Markdown into a CommonMark document in which math is held as {@link Formula} nodes. */
    public Node parse(String source) {
        List<String> math = new ArrayList<>();
        String text = extractMath(source.replace(OPEN, '\uFFFD').replace(CLOSE, '\uFFFD'), math);
        Node doc = PARSER.parse(text);
        if (!math.isEmpty()) insertMath(doc, math);
        return doc;
    }

    /** Markdown to safe HTML. */
    public String render(String source) {
        return render(parse(source));
    }

    /** A parsed node (a document or a part of one) to safe HTML; applies the link and image rules to the node. */
    public String render(Node node) {
        applyLinkAndImageRules(node);
        return renderer.render(node);
    }

    /** The text of a node as a reader would read it aloud: text, code and math source; breaks as spaces. */
    public static String plainText(Node node) {
        StringBuilder b = new StringBuilder();
        node.accept(new AbstractVisitor() {
            @Override public void visit(Text t) { b.append(t.getLiteral()); }
            @Override public void visit(Code c) { b.append(c.getLiteral()); }
            @Override public void visit(SoftLineBreak s) { b.append(' '); }
            @Override public void visit(HardLineBreak h) { b.append(' '); }
            @Override public void visit(CustomNode n) {
                if (n instanceof Formula m) b.append(m.source()); else visitChildren(n);
            }
        });
        return b.toString().strip();
    }

    /** A formula taken out of the Markdown: its TeX (without delimiters), whether it is display math, and its source. */
    public static final class Formula extends CustomNode {
        private final String tex;
        private final boolean display;
        private final String source;

        Formula(String source) {
            this.source = source;
            this.display = source.startsWith("$$");
            int d = display ? 2 : 1;
            this.tex = source.substring(d, source.length() - d).strip();
        }

        public String tex() { return tex; }

        public boolean display() { return display; }

        /** The formula as written, with its dollars. */
        public String source() { return source; }
    }

    // ---- math extraction (as Jupyter's remove_math: before Markdown, so TeX is not read as emphasis or escapes)

    static String extractMath(String src, List<String> math) {
        boolean[] fenced = fencedCode(src);
        StringBuilder out = new StringBuilder(src.length());
        int i = 0, n = src.length();
        while (i < n) {
            char c = src.charAt(i);
            if (fenced[i]) {
                out.append(c);
                i++;
            } else if (c == '\\' && i + 1 < n) {
                out.append(c).append(src.charAt(i + 1));
                i += 2;
            } else if (c == '`') {
                int run = run(src, i, '`');
                int close = closingBackticks(src, i + run, run, fenced);
                int end = close < 0 ? i + run : close + run;
                out.append(src, i, end);
                i = end;
            } else if (c == '$' && i + 1 < n && src.charAt(i + 1) == '$') {
                int close = src.indexOf("$$", i + 2);
                if (close > i + 2 && !src.substring(i + 2, close).isBlank() && !anyFenced(fenced, i, close)) {
                    token(out, math, src.substring(i, close + 2));
                    i = close + 2;
                } else {
                    out.append("$$");
                    i += 2;
                }
            } else if (c == '$') {
                int close = closingDollar(src, i, fenced);
                if (close > 0) {
                    token(out, math, src.substring(i, close + 1));
                    i = close + 1;
                } else {
                    out.append(c);
                    i++;
                }
            } else {
                out.append(c);
                i++;
            }
        }
        return out.toString();
    }

    private static void token(StringBuilder out, List<String> math, String formula) {
        out.append(OPEN).append(math.size()).append(CLOSE);
        math.add(formula);
    }

    /**
     * The closing {@code $} of inline math opened at {@code open}, by Pandoc's rule (which keeps prices such as
     * "$5 and $10" as text): no space after the opening dollar, none before the closing one, no digit after it,
     * and no blank line in between; at most {@value #MAX_INLINE_MATH} characters on. -1 when there is none.
     */
    private static int closingDollar(String s, int open, boolean[] fenced) {
        int n = s.length();
        if (open + 1 >= n || Character.isWhitespace(s.charAt(open + 1))) return -1;
        int limit = Math.min(n, open + 1 + MAX_INLINE_MATH);
        for (int j = open + 1; j < limit; j++) {
            char c = s.charAt(j);
            if (fenced[j]) return -1;
            if (c == '\\') {
                j++;
                continue;
            }
            if (c == '\n') {
                int k = j + 1;
                while (k < n && (s.charAt(k) == ' ' || s.charAt(k) == '\t')) k++;
                if (k >= n || s.charAt(k) == '\n') return -1;
            }
            if (c == '$') {
                if (Character.isWhitespace(s.charAt(j - 1))) continue;
                if (j + 1 < n && Character.isDigit(s.charAt(j + 1))) continue;
                return j;
            }
        }
        return -1;
    }

    private static int run(String s, int i, char c) {
        int j = i;
        while (j < s.length() && s.charAt(j) == c) j++;
        return j - i;
    }

    /** Start of the next run of exactly {@code len} backticks at or after {@code from}, or -1. */
    private static int closingBackticks(String s, int from, int len, boolean[] fenced) {
        int j = from;
        while (j < s.length()) {
            if (fenced[j]) return -1;
            if (s.charAt(j) == '`') {
                int r = run(s, j, '`');
                if (r == len) return j;
                j += r;
            } else {
                j++;
            }
        }
        return -1;
    }

    private static boolean anyFenced(boolean[] fenced, int from, int to) {
        for (int k = from; k < to; k++) if (fenced[k]) return true;
        return false;
    }

    /** Marks the characters of fenced code blocks (``` or ~~~ fences, CommonMark 0.31 section 4.5). */
    private static boolean[] fencedCode(String s) {
        boolean[] f = new boolean[s.length()];
        Pattern fence = Pattern.compile("^ {0,3}(`{3,}|~{3,})");
        int pos = 0;
        String openFence = null;
        for (String line : s.split("\n", -1)) {
            int end = Math.min(s.length(), pos + line.length() + 1);
            Matcher m = fence.matcher(line);
            if (openFence == null) {
                if (m.find() && !(m.group(1).charAt(0) == '`' && line.substring(m.end()).contains("`"))) {
                    openFence = m.group(1);
                    for (int k = pos; k < end; k++) f[k] = true;
                }
            } else {
                for (int k = pos; k < end; k++) f[k] = true;
                if (m.find() && m.group(1).charAt(0) == openFence.charAt(0) && m.group(1).length() >= openFence.length() && line.substring(m.end()).isBlank()) {
                    openFence = null;
                }
            }
            pos = end;
        }
        return f;
    }

    /** Replaces the math tokens in text by Math nodes, and restores them verbatim wherever else they ended up. */
    private static void insertMath(Node doc, List<String> math) {
        List<Text> texts = new ArrayList<>();
        doc.accept(new AbstractVisitor() {
            @Override public void visit(Text t) { texts.add(t); }
            @Override public void visit(Code c) { c.setLiteral(restore(c.getLiteral(), math)); }
            @Override public void visit(FencedCodeBlock c) { c.setLiteral(restore(c.getLiteral(), math)); }
            @Override public void visit(IndentedCodeBlock c) { c.setLiteral(restore(c.getLiteral(), math)); }
            @Override public void visit(HtmlInline h) { h.setLiteral(restore(h.getLiteral(), math)); }
            @Override public void visit(HtmlBlock h) { h.setLiteral(restore(h.getLiteral(), math)); }
            @Override public void visit(Link l) {
                l.setDestination(restore(l.getDestination(), math));
                if (l.getTitle() != null) l.setTitle(restore(l.getTitle(), math));
                visitChildren(l);
            }
            @Override public void visit(Image i) {
                i.setDestination(restore(i.getDestination(), math));
                if (i.getTitle() != null) i.setTitle(restore(i.getTitle(), math));
                visitChildren(i);
            }
            @Override public void visit(LinkReferenceDefinition d) {
                d.setDestination(restore(d.getDestination(), math));
                if (d.getTitle() != null) d.setTitle(restore(d.getTitle(), math));
            }
        });
        for (Text t : texts) {
            String s = t.getLiteral();
            Matcher m = TOKEN.matcher(s);
            int last = 0;
            boolean any = false;
            while (m.find()) {
                any = true;
                if (m.start() > last) t.insertBefore(new Text(s.substring(last, m.start())));
                t.insertBefore(new Formula(math.get(Integer.parseInt(m.group(1)))));
                last = m.end();
            }
            if (!any) continue;
            if (last < s.length()) t.insertBefore(new Text(s.substring(last)));
            t.unlink();
        }
    }

    private static String restore(String s, List<String> math) {
        if (s == null || s.indexOf(OPEN) < 0) return s;
        Matcher m = TOKEN.matcher(s);
        StringBuilder b = new StringBuilder();
        while (m.find()) m.appendReplacement(b, Matcher.quoteReplacement(math.get(Integer.parseInt(m.group(1)))));
        m.appendTail(b);
        return b.toString();
    }

    // ---- links and images

    /** Whether a link may point at {@code destination}: http(s), mailto, a fragment or a relative path. */
    public static boolean linkAllowed(String destination) {
        if (destination == null) return false;
        // Browsers drop ASCII whitespace and control characters inside URLs ("java\tscript:" is javascript:).
        String d = destination.replaceAll("[\\x00-\\x20\\x7f]", "");
        Matcher m = SCHEME.matcher(d);
        return !m.find() || LINK_SCHEMES.contains(m.group(1).toLowerCase(Locale.ROOT));
    }

    /** A relative reference: no scheme and not protocol-relative ({@code //host/...}). */
    public static boolean isRelative(String destination) {
        String d = destination.replaceAll("[\\x00-\\x20\\x7f]", "");
        return !d.isEmpty() && !SCHEME.matcher(d).find() && !d.startsWith("//") && !d.startsWith("\\\\") && !d.startsWith("/\\") && !d.startsWith("\\/");
    }

    private void applyLinkAndImageRules(Node root) {
        List<Link> links = new ArrayList<>();
        List<Image> imgs = new ArrayList<>();
        root.accept(new AbstractVisitor() {
            @Override public void visit(Link l) { links.add(l); visitChildren(l); }
            @Override public void visit(Image i) { imgs.add(i); visitChildren(i); }
        });
        for (Image img : imgs) {
            String dest = img.getDestination();
            Optional<String> uri = dest.regionMatches(true, 0, "data:", 0, 5) ? ImageData.fromDataUri(dest) : images.dataUri(dest);
            if (uri.isPresent()) {
                img.setDestination(uri.get());
                continue;
            }
            if (relativeImages && isRelative(dest)) continue;
            String alt = plainText(img);
            Text label = new Text("[image: " + (alt.isEmpty() ? dest : alt) + "]");
            Node replacement = label;
            if (linkAllowed(dest) && !dest.isBlank() && !dest.regionMatches(true, 0, "data:", 0, 5)) {
                replacement = new Link(dest, img.getTitle());
                replacement.appendChild(label);
            }
            img.insertBefore(replacement);
            img.unlink();
        }
        for (Link l : links) {
            if (linkAllowed(l.getDestination())) continue;
            Node child = l.getFirstChild();
            while (child != null) {
                Node next = child.getNext();
                l.insertBefore(child);
                child = next;
            }
            l.unlink();
        }
    }

    /** Second line of defence behind {@link #applyLinkAndImageRules}: the same rules at the moment of writing. */
    private final class Sanitizer implements UrlSanitizer {
        @Override public String sanitizeLinkUrl(String url) { return linkAllowed(url) ? url : ""; }

        @Override public String sanitizeImageUrl(String url) {
            if (ImageData.looksLikeImageDataUri(url)) return url;
            return relativeImages && isRelative(url) ? url : "";
        }
    }

    // ---- math rendering

    private final class MathRenderer implements NodeRenderer {
        private final HtmlWriter html;

        MathRenderer(HtmlNodeRendererContext context) { this.html = context.getWriter(); }

        @Override public Set<Class<? extends Node>> getNodeTypes() { return Set.of(Formula.class); }

        @Override public void render(Node node) {
            Formula m = (Formula) node;
            if (typesetMath) html.raw(formulaHtml(m.tex(), m.display(), m.source())); else html.text(m.source());
        }
    }

    /**
     * A formula typeset as an inline SVG picture ({@code <img class="ll-math">}, its TeX source as alt text), or,
     * where jlatexmath cannot typeset it, its source as code with the reason. Display math sits in a
     * {@code <span class="ll-math-display">} that a style sheet can centre.
     *
     * @param source the formula as written (for the alt text), e.g. with its dollars
     */
    public static String formulaHtml(String tex, boolean display, String source) {
        StringBuilder h = new StringBuilder();
        if (display) h.append("<span class=\"ll-math-display\">");
        try {
            LatexSvg.Picture p = LatexSvg.render(tex, display);
            h.append("<img class=\"ll-math\" alt=\"").append(HtmlEscape.escape(source)).append("\" width=\"").append(p.widthPx())
                    .append("\" height=\"").append(p.heightPx()).append("\" style=\"vertical-align:-").append(p.depthPx()).append("px\" src=\"")
                    .append(p.dataUri()).append("\">");
        } catch (IllegalArgumentException e) {
            h.append("<code class=\"ll-math-error\">").append(HtmlEscape.escape(source)).append("</code> (").append(HtmlEscape.escape(e.getMessage())).append(')');
        }
        if (display) h.append("</span>");
        return h.toString();
    }
}
