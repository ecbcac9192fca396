package org.loopledger.kernel.session;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.net.URI;
import java.net.URISyntaxException;
import java.net.URL;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ConcurrentHashMap;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;

/**
 * The Javadoc of the library's own classes for Shift-Tab inspection. JShell finds doc comments only in the JDK's
 * {@code src.zip}; the build ships the library's sources as resources under {@value #ROOT} (see kernel-lib's pom),
 * and this class reads the doc comment of the type, method, constructor or field that a JShell signature names
 * ({@code LoadCases FrfFromLogs.load(java.util.Map<String,java.nio.file.Path> labelToFile)},
 * {@code org.loopledger.tune.PlantCase}). A record's component accessors and canonical constructor take the
 * record's {@code @param} lines. Files are parsed on first use and kept.
 */
final class SourceDocs {
    static final String ROOT = "loopledger-sources";
    private static final String PACKAGE_PREFIX = "org.loopledger.";

    /** One documented declaration of a source file. */
    record Declaration(String owner, String name, Kind kind, List<String> parameterTypes, DocComment doc) {}

    enum Kind { TYPE, RECORD, METHOD, FIELD }

    private final ClassLoader loader;
    private volatile Map<String, List<String>> filesBySimpleName;
    private final Map<String, List<Declaration>> parsed = new ConcurrentHashMap<>();

    SourceDocs(ClassLoader loader) { this.loader = loader; }

    /** The doc of what {@code signature} (as JShell's source analysis writes it) names; empty when unknown or undocumented. */
    Optional<DocComment> find(String signature) {
        Target t = Target.of(signature);
        if (t == null) return Optional.empty();
        for (String file : files(t.type)) {
            List<Declaration> decls = declarations(file);
            String owner = t.type.substring(t.type.lastIndexOf('.') + 1);
            Optional<DocComment> d = match(decls, owner, t);
            if (d.isPresent()) return d;
        }
        return Optional.empty();
    }

    private static Optional<DocComment> match(List<Declaration> decls, String owner, Target t) {
        Declaration type = null;
        for (Declaration d : decls) if ((d.kind == Kind.TYPE || d.kind == Kind.RECORD) && d.name.equals(owner)) type = d;
        if (t.member == null && t.parameters != null) { // a constructor: its own doc, else a record's (canonical), else the type's
            Optional<DocComment> own = match(decls, owner, new Target(t.type, owner, t.parameters));
            if (own.isPresent()) return own;
        }
        if (t.member == null) return type == null ? Optional.empty() : Optional.of(type.doc);
        Declaration byName = null;
        for (Declaration d : decls) {
            if (!d.owner.equals(owner) || !d.name.equals(t.member)) continue;
            // no parameters: a field or an enum constant (which may carry arguments)
            if (t.parameters == null ? d.kind != Kind.TYPE && d.kind != Kind.RECORD : d.kind == Kind.METHOD && d.parameterTypes.equals(t.parameters)) {
                return Optional.of(d.doc);
            }
            if (byName == null && t.parameters != null && d.kind == Kind.METHOD && d.parameterTypes.size() == t.parameters.size()) byName = d;
        }
        if (byName != null) return Optional.of(byName.doc);
        if (type != null && type.kind == Kind.RECORD && t.parameters != null && t.parameters.isEmpty()) {
            String component = type.doc.param(t.member);
            if (!component.isEmpty()) return Optional.of(new DocComment(component, List.of(), "", List.of()));
        }
        return Optional.empty();
    }

    /** What a signature names: a type (qualified or simple), and a member with its parameter types (simple names), if any. */
    private record Target(String type, String member, List<String> parameters) {
        static Target of(String signature) {
            String s = signature.strip();
            int paren = s.indexOf('(');
            String head = paren < 0 ? s : s.substring(0, paren);
            List<String> params = paren < 0 ? null : parameterTypes(s.substring(paren + 1, s.lastIndexOf(')') < paren ? s.length() : s.lastIndexOf(')')), true);
            head = stripGenerics(head).strip();
            int space = head.lastIndexOf(' ');
            String name = space < 0 ? head : head.substring(space + 1);
            String[] parts = name.split("\\.");
            int lastType = -1;
            for (int i = 0; i < parts.length; i++) if (!parts[i].isEmpty() && Character.isUpperCase(parts[i].charAt(0))) lastType = i;
            if (lastType < 0) return null;
            if (lastType > 0 && paren < 0 && parts[lastType].equals(parts[lastType].toUpperCase(java.util.Locale.ROOT))
                    && Character.isUpperCase(parts[lastType - 1].charAt(0))) lastType--; // a CONSTANT of its type
            String qualifiedType = String.join(".", java.util.Arrays.copyOfRange(parts, 0, lastType + 1));
            boolean qualified = lastType > 0 && Character.isLowerCase(parts[0].charAt(0));
            if (qualified && !qualifiedType.startsWith(PACKAGE_PREFIX)) return null;
            String member = lastType == parts.length - 1 ? null : parts[lastType + 1];
            return new Target(qualifiedType, member, params);
        }
    }

    /** Parameter types as simple erased names ({@code java.util.Map<String,Path> m} → {@code Map}; varargs as arrays). */
    static List<String> parameterTypes(String list, boolean withNames) {
        List<String> result = new ArrayList<>();
        String cleaned = stripGenerics(list).replaceAll("@\\w+(\\([^)]*\\))?\\s*", "").replace("final ", "");
        if (cleaned.isBlank()) return result;
        for (String p : cleaned.split(",")) {
            String q = p.strip().replace("...", "[] ");
            if (withNames || q.contains(" ")) {
                int sp = q.lastIndexOf(' ');
                String type = sp < 0 ? q : q.substring(0, sp).strip();
                String tail = sp < 0 ? "" : q.substring(sp + 1);
                if (tail.endsWith("[]")) type += "[]"; // double x[]
                q = type;
            }
            q = q.replace(" ", "");
            int dot = q.lastIndexOf('.', q.contains("[") ? q.indexOf('[') : q.length());
            result.add(dot < 0 ? q : q.substring(dot + 1));
        }
        return result;
    }

    private static String stripGenerics(String s) {
        StringBuilder b = new StringBuilder();
        int depth = 0;
        for (char c : s.toCharArray()) {
            if (c == '<') depth++;
            else if (c == '>') depth = Math.max(0, depth - 1);
            else if (depth == 0) b.append(c);
        }
        return b.toString();
    }

    /** Source files that may hold {@code type}: its own file when qualified, else every file of that simple name (and the outer file of a nested type). */
    private List<String> files(String type) {
        String[] parts = type.split("\\.");
        if (Character.isLowerCase(parts[0].charAt(0))) {
            List<String> r = new ArrayList<>();
            StringBuilder path = new StringBuilder(ROOT);
            for (int i = 0; i < parts.length; i++) {
                path.append('/').append(parts[i]);
                if (Character.isUpperCase(parts[i].charAt(0))) { r.add(path + ".java"); break; }
            }
            return r;
        }
        return index().getOrDefault(parts[0], List.of());
    }

    private Map<String, List<String>> index() {
        Map<String, List<String>> idx = filesBySimpleName;
        if (idx != null) return idx;
        Map<String, List<String>> m = new HashMap<>();
        try {
            URL url = loader.getResource(ROOT + "/org/loopledger");
            if (url != null) {
                URI uri = url.toURI();
                if ("jar".equals(uri.getScheme())) {
                    java.net.JarURLConnection c = (java.net.JarURLConnection) url.openConnection();
                    c.setUseCaches(false);
                    try (java.util.jar.JarFile jar = c.getJarFile()) {
                        jar.stream().map(java.util.jar.JarEntry::getName).filter(e -> e.startsWith(ROOT + "/") && e.endsWith(".java"))
                                .forEach(e -> add(m, e));
                    }
                } else {
                    Path dir = Path.of(uri).getParent().getParent();
                    walk(dir, m);
                }
            }
        } catch (IOException | URISyntaxException | RuntimeException e) {
            // no sources shipped (a stripped jar): inspection shows signatures only
        }
        m.replaceAll((k, v) -> List.copyOf(v));
        filesBySimpleName = Collections.unmodifiableMap(m);
        return filesBySimpleName;
    }

    private static void add(Map<String, List<String>> m, String resource) {
        String simple = resource.substring(resource.lastIndexOf('/') + 1).replace(".java", "");
        m.computeIfAbsent(simple, k -> new ArrayList<>()).add(resource);
    }

    private static void walk(Path root, Map<String, List<String>> m) throws IOException {
        try (Stream<Path> s = Files.walk(root)) {
            s.filter(p -> p.toString().endsWith(".java")).forEach(p -> add(m, ROOT + "/" + root.relativize(p).toString().replace('\\', '/')));
        }
    }

    private List<Declaration> declarations(String resource) {
        return parsed.computeIfAbsent(resource, r -> {
            try (InputStream in = loader.getResourceAsStream(r)) {
                return in == null ? List.of() : parseSource(new String(in.readAllBytes(), StandardCharsets.UTF_8));
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        });
    }

    private static final Pattern TYPE_DECL = Pattern.compile("\\b(class|interface|enum|record)\\s+([A-Za-z_$][\\w$]*)");
    private static final Pattern MEMBER_NAME = Pattern.compile("([A-Za-z_$][\\w$]*)\\s*$");

    /**
     * The documented declarations of one source file, each with its enclosing type. A small scanner: comments, strings,
     * character literals and text blocks are skipped; a declaration's header runs from its doc comment to the first
     * {@code {}, {@code ;} or {@code =} outside parentheses; braces track the enclosing types.
     */
    static List<Declaration> parseSource(String src) {
        List<Declaration> out = new ArrayList<>();
        List<String[]> typeStack = new ArrayList<>(); // {name, depth}
        StringBuilder header = new StringBuilder(); // code since the last ; { } (for type names) or since the doc comment
        String pendingDoc = null;
        int depth = 0, parens = 0, n = src.length();
        for (int i = 0; i < n; i++) {
            char c = src.charAt(i);
            if (c == '/' && i + 1 < n && src.charAt(i + 1) == '*') {
                int end = src.indexOf("*/", i + 2);
                end = end < 0 ? n : end + 2;
                if (i + 2 < n && src.charAt(i + 2) == '*' && !(i + 3 < n && src.charAt(i + 3) == '/')) {
                    if (pendingDoc != null && !header.toString().isBlank()) { // an enum constant before it: "/** a */ A, /** b */ B"
                        Declaration d = declaration(header.toString().replaceAll(",\\s*$", ""), typeStack.isEmpty() ? "" : typeStack.get(typeStack.size() - 1)[0],
                                DocComment.parse(pendingDoc));
                        if (d != null) out.add(d);
                    }
                    pendingDoc = src.substring(i, end);
                    header.setLength(0);
                    parens = 0;
                }
                i = end - 1;
                continue;
            }
            if (c == '/' && i + 1 < n && src.charAt(i + 1) == '/') {
                int end = src.indexOf('\n', i);
                i = end < 0 ? n : end;
                header.append(' ');
                continue;
            }
            if (c == '"' || c == '\'') {
                int j = skipLiteral(src, i);
                header.append("\"\"");
                i = j - 1;
                continue;
            }
            if (c == '(') parens++;
            if (c == ')') parens = Math.max(0, parens - 1);
            boolean end = parens == 0 && (c == '{' || c == ';' || c == '=' || c == '}');
            if (!end) { header.append(c); continue; }
            String h = header.toString();
            if (pendingDoc != null && (c != '}' || !h.isBlank())) { // '}' ends the last enum constant of "A, B }"
                Declaration d = declaration(h, typeStack.isEmpty() ? "" : typeStack.get(typeStack.size() - 1)[0], DocComment.parse(pendingDoc));
                if (d != null) out.add(d);
            }
            String docOfDeclarators = pendingDoc;
            pendingDoc = null;
            if (c == '{') {
                depth++;
                Matcher m = TYPE_DECL.matcher(stripAnnotations(h));
                if (m.find() && !h.contains("new ")) typeStack.add(new String[] {m.group(2), String.valueOf(depth)});
            } else if (c == '}') {
                if (!typeStack.isEmpty() && typeStack.get(typeStack.size() - 1)[1].equals(String.valueOf(depth))) typeStack.remove(typeStack.size() - 1);
                depth = Math.max(0, depth - 1);
            } else if (c == '=') {
                // skip the initializer up to its ';' at this nesting
                int p = 0, b = 0;
                for (i = i + 1; i < n; i++) {
                    char x = src.charAt(i);
                    if (x == '"' || x == '\'') { i = skipLiteral(src, i) - 1; continue; }
                    if (x == '(' ) p++;
                    else if (x == ')') p--;
                    else if (x == '{') b++;
                    else if (x == '}') { if (b == 0) { i--; break; } b--; }
                    else if (x == ';' && p == 0 && b == 0) break;
                    else if (x == ',' && p == 0 && b == 0 && !inGenerics(src, i)) { pendingDoc = docOfDeclarators; break; } // "A = 1, B = 2;" share the doc
                }
            }
            header.setLength(0);
        }
        return out;
    }

    private static Declaration declaration(String header, String owner, DocComment doc) {
        String h = stripAnnotations(header).strip();
        if (h.isEmpty()) return null;
        int paren = h.indexOf('(');
        Matcher type = TYPE_DECL.matcher(h);
        if (type.find() && (paren < 0 || type.start() < paren)) {
            return new Declaration(owner, type.group(2), type.group(1).equals("record") ? Kind.RECORD : Kind.TYPE, List.of(), doc);
        }
        if (paren >= 0) {
            Matcher name = MEMBER_NAME.matcher(stripGenerics(h.substring(0, paren)));
            if (!name.find()) return null;
            int close = h.lastIndexOf(')');
            List<String> params = parameterTypes(h.substring(paren + 1, close < paren ? h.length() : close), true);
            String member = name.group(1);
            return new Declaration(owner, member, Kind.METHOD, params, doc); // a constructor is a method named as its type
        }
        String decl = stripGenerics(h).split(",")[0].strip();
        Matcher name = MEMBER_NAME.matcher(decl);
        return name.find() ? new Declaration(owner, name.group(1), Kind.FIELD, List.of(), doc) : null;
    }

    /** Whether the comma at {@code i} sits inside angle brackets ({@code new HashMap<String, Long>()}), judged on its line. */
    private static boolean inGenerics(String src, int i) {
        int depth = 0;
        for (int j = src.lastIndexOf('\n', i) + 1; j < i; j++) {
            if (src.charAt(j) == '<') depth++;
            else if (src.charAt(j) == '>') depth--;
        }
        return depth > 0;
    }

    private static String stripAnnotations(String h) {
        return h.replaceAll("@(?!interface)[\\w.]+(\\s*\\([^)]*\\))?", " ");
    }

    private static int skipLiteral(String src, int i) {
        int n = src.length();
        if (src.startsWith("\"\"\"", i)) {
            int end = src.indexOf("\"\"\"", i + 3);
            return end < 0 ? n : end + 3;
        }
        char q = src.charAt(i);
        for (int j = i + 1; j < n; j++) {
            char x = src.charAt(j);
            if (x == '\\') j++;
            else if (x == q || x == '\n') return j + 1;
        }
        return n;
    }
}
