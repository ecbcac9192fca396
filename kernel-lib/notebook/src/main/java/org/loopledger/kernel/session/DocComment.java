package org.loopledger.kernel.session;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * A Javadoc comment as a reader sees it: the description, then the block tags ({@code @param}, {@code @return},
 * {@code @throws}), with inline tags ({@code {@code}}, {@code {@link}}, {@code {@value}}) and the few HTML tags the
 * library's comments use (paragraphs, sub- and superscripts, lists, emphasis, entities) turned into plain text or
 * Markdown. Small on purpose: it reads the library's own comments, not every form the Javadoc tool accepts.
 */
record DocComment(String description, List<Tag> params, String returns, List<Tag> throwsTags) {
    /** A block tag with a name ({@code @param lowHz the lower edge}). */
    record Tag(String name, String text) {}

    private static final Pattern NAME = Pattern.compile("<?[A-Za-z_$][\\w$]*>?");
    private static final Pattern BLOCK_TAG = Pattern.compile("(?m)^\\s*@(param|return|returns|throws|exception|see|since|author|deprecated|implNote|apiNote|implSpec)\\b");

    /** Parses the raw comment ({@code /** ... *}{@code /}, delimiters included or not). */
    static DocComment parse(String raw) {
        String body = raw.strip();
        if (body.startsWith("/**")) body = body.substring(3);
        if (body.endsWith("*/")) body = body.substring(0, body.length() - 2);
        StringBuilder lines = new StringBuilder();
        for (String line : body.split("\n", -1)) {
            String l = line.strip();
            if (l.startsWith("*")) l = l.substring(1);
            if (l.startsWith(" ")) l = l.substring(1);
            lines.append(l).append('\n');
        }
        String text = lines.toString();
        Matcher m = BLOCK_TAG.matcher(text);
        List<int[]> starts = new ArrayList<>();
        while (m.find()) starts.add(new int[] {m.start(), m.end()});
        String description = starts.isEmpty() ? text : text.substring(0, starts.get(0)[0]);
        List<Tag> params = new ArrayList<>(), throwsTags = new ArrayList<>();
        String returns = "";
        for (int i = 0; i < starts.size(); i++) {
            String kind = text.substring(starts.get(i)[0], starts.get(i)[1]).strip().substring(1);
            String rest = text.substring(starts.get(i)[1], i + 1 < starts.size() ? starts.get(i + 1)[0] : text.length()).strip();
            switch (kind) {
                case "param", "throws", "exception" -> {
                    String[] nameAndText = rest.split("\\s+", 2);
                    Matcher id = NAME.matcher(nameAndText[0]);
                    String name = id.lookingAt() ? id.group() : nameAndText[0]; // "@param fMinHz, fMaxHz ...": javac takes the identifier
                    Tag t = new Tag(name, nameAndText.length > 1 ? nameAndText[1] : "");
                    (kind.equals("param") ? params : throwsTags).add(t);
                }
                case "return", "returns" -> returns = rest;
                default -> { }
            }
        }
        return new DocComment(description.strip(), List.copyOf(params), returns, List.copyOf(throwsTags));
    }

    /** The text of the {@code @param} tag for {@code name}, empty when there is none. */
    String param(String name) {
        for (Tag t : params) if (t.name().equals(name)) return t.text();
        return "";
    }

    boolean isEmpty() { return description.isEmpty() && params.isEmpty() && returns.isEmpty() && throwsTags.isEmpty(); }

    /** Plain text: the description in paragraphs, then Parameters, Returns and Throws. */
    String plainText() {
        StringBuilder b = new StringBuilder(toText(description, false));
        if (!params.isEmpty()) {
            b.append(b.length() > 0 ? "\n\n" : "").append("Parameters:");
            for (Tag t : params) b.append("\n  ").append(t.name()).append(" - ").append(toText(t.text(), false));
        }
        if (!returns.isEmpty()) b.append(b.length() > 0 ? "\n\n" : "").append("Returns: ").append(toText(returns, false));
        if (!throwsTags.isEmpty()) {
            b.append(b.length() > 0 ? "\n\n" : "").append("Throws:");
            for (Tag t : throwsTags) b.append("\n  ").append(t.name()).append(" - ").append(toText(t.text(), false));
        }
        return b.toString();
    }

    /** Markdown: the same, code in backticks, parameters as a list. */
    String markdown() {
        StringBuilder b = new StringBuilder(toText(description, true));
        if (!params.isEmpty()) {
            b.append(b.length() > 0 ? "\n\n" : "").append("**Parameters**\n");
            for (Tag t : params) b.append("\n- `").append(t.name()).append("`: ").append(toText(t.text(), true));
        }
        if (!returns.isEmpty()) b.append(b.length() > 0 ? "\n\n" : "").append("**Returns** ").append(toText(returns, true));
        if (!throwsTags.isEmpty()) {
            b.append(b.length() > 0 ? "\n\n" : "").append("**Throws**\n");
            for (Tag t : throwsTags) b.append("\n- `").append(t.name()).append("`: ").append(toText(t.text(), true));
        }
        return b.toString();
    }

    /** Inline tags and HTML to text; paragraphs ({@code <p>}, blank lines) kept, other line breaks joined. */
    static String toText(String javadoc, boolean markdown) {
        String s = inlineTags(javadoc, markdown);
        s = s.replaceAll("(?i)<pre>\\s*", "\n\n").replaceAll("(?i)\\s*</pre>", "\n\n");
        s = s.replaceAll("(?i)\\s*<p>\\s*", "\n\n").replaceAll("(?i)</p>", "");
        s = s.replaceAll("(?i)\\s*<li>\\s*", "\n- ").replaceAll("(?i)</?(ul|ol)>", "\n").replaceAll("(?i)</li>", "");
        s = s.replaceAll("(?i)<sub>(.*?)</sub>", "_$1").replaceAll("(?i)<sup>(.*?)</sup>", "^$1");
        s = s.replaceAll("(?i)</?(b|strong)>", markdown ? "**" : "").replaceAll("(?i)</?(i|em)>", markdown ? "*" : "");
        s = s.replaceAll("(?i)<br\\s*/?>", "\n");
        s = s.replaceAll("<[a-zA-Z/][^>]*>", "");
        s = s.replace("&lt;", "<").replace("&gt;", ">").replace("&nbsp;", " ").replace("&#64;", "@").replace("&amp;", "&");
        StringBuilder out = new StringBuilder();
        for (String para : s.split("\n\\s*\n")) {
            String p = para.lines().map(String::strip).filter(l -> !l.isEmpty()).reduce((a, c) -> c.startsWith("- ") || a.isEmpty() ? a + "\n" + c : a + " " + c).orElse("");
            if (p.isEmpty()) continue;
            if (out.length() > 0) out.append("\n\n");
            out.append(p.strip());
        }
        return out.toString();
    }

    private static String inlineTags(String s, boolean markdown) {
        StringBuilder b = new StringBuilder();
        int i = 0;
        while (i < s.length()) {
            int open = s.indexOf("{@", i);
            if (open < 0) { b.append(s, i, s.length()); break; }
            b.append(s, i, open);
            int depth = 0, end = open;
            for (; end < s.length(); end++) {
                char c = s.charAt(end);
                if (c == '{') depth++;
                else if (c == '}' && --depth == 0) break;
            }
            if (end >= s.length()) { b.append(s, open, s.length()); break; }
            String inner = s.substring(open + 2, end);
            String[] kv = inner.split("\\s+", 2);
            String tag = kv[0].toLowerCase(Locale.ROOT), arg = kv.length > 1 ? kv[1].strip() : "";
            switch (tag) {
                case "code", "literal" -> b.append(markdown && tag.equals("code") ? "`" + arg + "`" : arg);
                case "link", "linkplain" -> {
                    String[] refLabel = splitReference(arg);
                    String label = refLabel[1].isEmpty() ? referenceText(refLabel[0]) : refLabel[1];
                    b.append(markdown && refLabel[1].isEmpty() ? "`" + label + "`" : label);
                }
                case "value" -> b.append(arg.isEmpty() ? "" : referenceText(arg));
                case "inheritdoc" -> { }
                default -> b.append(arg);
            }
            i = end + 1;
        }
        return b.toString();
    }

    /** A reference ({@code Type#member(args)}) and the label after it. */
    private static String[] splitReference(String arg) {
        int depth = 0;
        for (int i = 0; i < arg.length(); i++) {
            char c = arg.charAt(i);
            if (c == '(') depth++;
            else if (c == ')') depth--;
            else if (Character.isWhitespace(c) && depth == 0) return new String[] {arg.substring(0, i), arg.substring(i + 1).strip()};
        }
        return new String[] {arg, ""};
    }

    /** {@code a.b.Type#member(double, int)} as {@code Type.member(double, int)}; {@code #member} as {@code member}. */
    private static String referenceText(String ref) {
        String r = ref.startsWith("#") ? ref.substring(1) : ref.replace('#', '.');
        int paren = r.indexOf('(');
        String head = paren < 0 ? r : r.substring(0, paren), tail = paren < 0 ? "" : r.substring(paren);
        String[] parts = head.split("\\.");
        int keep = parts.length;
        for (int i = 0; i < parts.length; i++) if (!parts[i].isEmpty() && Character.isUpperCase(parts[i].charAt(0))) { keep = parts.length - i; break; }
        StringBuilder sb = new StringBuilder();
        for (int i = parts.length - keep; i < parts.length; i++) sb.append(sb.length() > 0 ? "." : "").append(parts[i]);
        return sb + tail;
    }
}
