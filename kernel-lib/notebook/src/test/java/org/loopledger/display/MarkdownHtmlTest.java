package org.loopledger.display;

import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

import static org.junit.jupiter.api.Assertions.*;

/**
 * Markdown to safe HTML. References: the CommonMark spec 0.31 (link destinations, code spans, fences),
 * the WHATWG URL standard (a parser removes tabs and newlines anywhere in a URL and leading C0 controls
 * and spaces, so "java&#9;script:" is javascript:), OWASP's XSS prevention cheat sheet (common practice:
 * allow-list URL schemes), Pandoc's tex_math_dollars rule for inline math, and the GFM spec (tables).
 */
class MarkdownHtmlTest {

    private static List<String> attr(String html, String css, String attr) {
        Document d = Jsoup.parseBodyFragment(html);
        List<String> r = new ArrayList<>();
        d.select(css).forEach(e -> r.add(e.attr(attr)));
        return r;
    }

    @Test
    void displaysMarkdownStoresNoScriptOrDataLinks() {
        String html = Displays.markdown("[a](javascript:alert(1)) [b](JAVASCRIPT:alert(2)) [c](<java\tscript:alert(3)>) "
                + "[d](data:text/html;base64,PHNjcmlwdD4=) [e](vbscript:x) [f](https://example.org/x) [g](#sec) [h](notes/a.md) [i](mailto:a@b.c)")
                .toMimeBundle().get(MimeBundle.TEXT_HTML).orElseThrow();
        assertFalse(html.toLowerCase().contains("script:"), html);
        assertFalse(html.contains("data:text"), html);
        assertEquals(List.of("https://example.org/x", "#sec", "notes/a.md", "mailto:a@b.c"), attr(html, "a", "href"));
        for (String t : List.of("a", "b", "c", "d", "e")) assertTrue(Jsoup.parse(html).text().contains(t), "link text kept: " + t);
    }

    @Test
    void remoteImagesBecomeLinkTextAndDataImagesAreChecked() {
        String png = "iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8DwHwAFBQIAX8jx0gAAAABJRU5ErkJggg==";
        String html = Displays.markdown("![beacon](https://tracker.example/p.gif) ![dot](data:image/png;base64," + png + ") "
                + "![fake](data:image/png;base64,PHN2Zz4=) ![page](data:text/html;base64,PHNjcmlwdD4=) ![local](fig.png)").html();
        assertEquals(List.of("data:image/png;base64," + png, "fig.png"), attr(html, "img", "src"), html);
        assertEquals(List.of("https://tracker.example/p.gif"), attr(html, "a", "href"), "remote image as a link, not fetched");
        String text = Jsoup.parse(html).text();
        assertTrue(text.contains("[image: beacon]") && text.contains("[image: fake]") && text.contains("[image: page]"), text);
    }

    @Test
    void theRecordFlavourEmbedsOnlyWhatItsImageSourceGives() {
        MarkdownHtml md = MarkdownHtml.forRecord(dest -> dest.equals("attachment:a.png")
                ? Optional.of("data:image/gif;base64,R0lGODlhAQABAAAAACw=") : Optional.empty());
        String html = md.render("![a](attachment:a.png) ![b](fig.png)");
        assertEquals(List.of("data:image/gif;base64,R0lGODlhAQABAAAAACw="), attr(html, "img", "src"));
        assertTrue(Jsoup.parse(html).text().contains("[image: b]"));
    }

    @Test
    void mathIsTakenOutBeforeMarkdownAndCodeKeepsItsDollars() {
        // Pandoc's rule: "$20,000 and $30,000" is not math; TeX underscores and backslashes are not Markdown.
        String src = "Costs $20,000 and $30,000.\n\nGain $K_p = \\omega_c^2 \\cdot J_{total}$ and `$not_math$`.\n\n```\n$also_not$\n```\n\n$$x_1 * y_1 * z$$\n";
        String notebook = MarkdownHtml.forNotebook().render(src);
        assertTrue(notebook.contains("$K_p = \\omega_c^2 \\cdot J_{total}$"), "TeX kept whole for MathJax: " + notebook);
        assertTrue(notebook.contains("$x_1 * y_1 * z$$") || notebook.contains("$$x_1 * y_1 * z$$"), notebook);
        assertTrue(notebook.contains("<code>$not_math$</code>") && notebook.contains("$also_not$\n</code>"), notebook);
        assertTrue(notebook.contains("Costs $20,000 and $30,000."), notebook);
        assertFalse(notebook.contains("<em>"), "no emphasis made of TeX: " + notebook);

        String record = MarkdownHtml.forRecord(MarkdownHtml.DATA_URIS_ONLY).render(src);
        Document d = Jsoup.parseBodyFragment(record);
        assertEquals(List.of("$K_p = \\omega_c^2 \\cdot J_{total}$", "$$x_1 * y_1 * z$$"), d.select("img.ll-math").eachAttr("alt"));
        assertTrue(d.select("img.ll-math").eachAttr("src").stream().allMatch(s -> s.startsWith("data:image/svg+xml;base64,")));
        assertEquals(1, d.select("span.ll-math-display").size());
        assertTrue(d.text().contains("Costs $20,000 and $30,000."), d.text());
        assertTrue(d.select("code").eachText().containsAll(List.of("$not_math$", "$also_not$")));
    }

    @Test
    void formulasThatCannotBeTypesetShowTheirSourceAndWhy() {
        String html = MarkdownHtml.forRecord(MarkdownHtml.DATA_URIS_ONLY).render("bad $\\notacommand x$ formula");
        Document d = Jsoup.parseBodyFragment(html);
        assertEquals(0, d.select("img").size());
        assertEquals("$\\notacommand x$", d.select("code.ll-math-error").text());
        assertTrue(d.text().contains("LaTeX not typeset"), d.text());
    }

    @Test
    void latexPicturesAreSvgPathsWithoutFontsOrScript() {
        LatexSvg.Picture p = LatexSvg.render("\\frac{s + 1}{s^{2} + 3 s + 2}", true);
        assertTrue(p.svg().startsWith("<svg") && p.svg().contains("<path"), p.svg().substring(0, 200));
        assertFalse(p.svg().contains("<text") || p.svg().contains("font-family") || p.svg().contains("<script"));
        assertTrue(p.widthPx() > p.heightPx() && p.heightPx() > 20, p.widthPx() + "x" + p.heightPx());
        assertEquals(p, LatexSvg.render("\\frac{s + 1}{s^{2} + 3 s + 2}", true), "deterministic");
    }

    @Test
    void gfmTablesRender() {
        String html = MarkdownHtml.forNotebook().render("| a | b |\n|---|--:|\n| 1 | 2 |\n");
        Document d = Jsoup.parseBodyFragment(html);
        assertEquals(List.of("a", "b"), d.select("th").eachText());
        assertEquals(List.of("1", "2"), d.select("td").eachText());
    }

    @Test
    void imagesAreRecognisedByTheirBytes() {
        assertEquals(Optional.of("image/png"), ImageData.base64("iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8DwHwAFBQIAX8jx0gAAAABJRU5ErkJggg==").flatMap(ImageData::sniff));
        assertEquals(Optional.empty(), ImageData.fromBundle("image/png", "PHN2Zz4="), "SVG bytes declared as PNG are refused");
        assertEquals(Optional.empty(), ImageData.fromBundle("image/png", "not base64 !"));
        assertTrue(ImageData.fromBundle("image/svg+xml", "<svg xmlns='http://www.w3.org/2000/svg'/>").orElseThrow().startsWith("data:image/svg+xml;base64,"));
        assertEquals(Optional.empty(), ImageData.fromBundle("image/svg+xml", "<html><script>x</script></html>"));
        assertEquals(Optional.empty(), ImageData.fromBundle("text/html", "PHN2Zz4="));
    }
}
