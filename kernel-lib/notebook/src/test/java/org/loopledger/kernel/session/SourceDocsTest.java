package org.loopledger.kernel.session;

import com.sun.source.doctree.DocCommentTree;
import com.sun.source.doctree.DocTree;
import com.sun.source.doctree.ParamTree;
import com.sun.source.tree.ClassTree;
import com.sun.source.tree.CompilationUnitTree;
import com.sun.source.tree.MethodTree;
import com.sun.source.tree.Tree;
import com.sun.source.tree.VariableTree;
import com.sun.source.util.DocTrees;
import com.sun.source.util.JavacTask;
import com.sun.source.util.TreePathScanner;
import org.junit.jupiter.api.Test;

import javax.tools.JavaCompiler;
import javax.tools.JavaFileObject;
import javax.tools.StandardJavaFileManager;
import javax.tools.ToolProvider;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.List;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.*;

/**
 * The small doc-comment reader of the kernel's inspection against javac's own parser (the JDK's compiler tree API,
 * {@code com.sun.source.util.DocTrees}), on every source file of the library: each declaration javac finds a doc
 * comment for is found by {@link SourceDocs#parseSource} with the same enclosing type, name and parameter types, the
 * same description text and the same {@code @param} names.
 */
class SourceDocsTest {
    record Expected(String file, String owner, String name, boolean method, List<String> params, String doc, List<String> paramNames) {}

    /** The sources the jar ships for Shift-Tab: the core and notebook modules' {@code org/loopledger} trees. */
    static List<Path> sources() {
        for (Path p = Path.of("").toAbsolutePath(); p != null; p = p.getParent()) {
            Path core = p.resolve("kernel-lib/core/src/main/java/org/loopledger"), notebook = p.resolve("kernel-lib/notebook/src/main/java/org/loopledger");
            if (Files.isDirectory(core) && Files.isDirectory(notebook)) return List.of(core, notebook);
        }
        throw new IllegalStateException("library sources (kernel-lib/core and kernel-lib/notebook) not found from " + Path.of("").toAbsolutePath());
    }

    static List<Expected> javacDocs(List<Path> files) throws Exception {
        JavaCompiler javac = ToolProvider.getSystemJavaCompiler();
        List<Expected> out = new ArrayList<>();
        try (StandardJavaFileManager fm = javac.getStandardFileManager(null, null, StandardCharsets.UTF_8)) {
            JavacTask task = (JavacTask) javac.getTask(null, fm, d -> { }, List.of("-proc:none", "--release", "17"), null,
                    fm.getJavaFileObjectsFromPaths(files));
            DocTrees trees = DocTrees.instance(task);
            for (CompilationUnitTree unit : task.parse()) {
                String file = Path.of(unit.getSourceFile().toUri()).getFileName().toString();
                new TreePathScanner<Void, Void>() {
                    final Deque<String> owners = new ArrayDeque<>();

                    @Override public Void visitClass(ClassTree t, Void v) {
                        record(t.getSimpleName().toString(), false, List.of());
                        owners.push(t.getSimpleName().toString());
                        super.visitClass(t, v);
                        owners.pop();
                        return null;
                    }

                    @Override public Void visitMethod(MethodTree t, Void v) {
                        String name = t.getName().contentEquals("<init>") ? owners.peek() : t.getName().toString();
                        List<String> params = new ArrayList<>();
                        for (VariableTree p : t.getParameters()) params.add(SourceDocs.parameterTypes(p.getType().toString(), false).get(0));
                        record(name, true, params);
                        return null; // bodies hold no API docs
                    }

                    @Override public Void visitVariable(VariableTree t, Void v) {
                        record(t.getName().toString(), false, List.of());
                        return null;
                    }

                    void record(String name, boolean method, List<String> params) {
                        String raw = trees.getDocComment(getCurrentPath());
                        if (raw == null) return;
                        DocCommentTree dc = trees.getDocCommentTree(getCurrentPath());
                        List<String> names = new ArrayList<>();
                        for (DocTree b : dc.getBlockTags()) if (b instanceof ParamTree p) names.add(p.getName().toString());
                        out.add(new Expected(file, owners.isEmpty() ? "" : owners.peek(), name, method, params, raw, names));
                    }
                }.scan(unit, null);
            }
        }
        return out;
    }

    @Test
    void everyDocCommentJavacFindsIsFoundWithItsDeclaration() throws Exception {
        List<Path> files = new ArrayList<>();
        for (Path root : sources()) {
            try (Stream<Path> s = Files.walk(root)) {
                files.addAll(s.filter(p -> p.toString().endsWith(".java")).sorted().toList());
            }
        }
        List<Expected> expected = javacDocs(files);
        assertTrue(expected.size() > 1000, "javac found " + expected.size() + " doc comments");
        List<String> problems = new ArrayList<>();
        java.util.Map<String, List<SourceDocs.Declaration>> parsed = new java.util.HashMap<>();
        for (Path f : files) parsed.put(f.getFileName().toString(), SourceDocs.parseSource(Files.readString(f)));
        for (Expected e : expected) {
            List<SourceDocs.Declaration> candidates = parsed.get(e.file()).stream()
                    .filter(d -> d.owner().equals(e.owner()) && d.name().equals(e.name()))
                    .filter(d -> !e.method() || d.kind() == SourceDocs.Kind.METHOD && d.parameterTypes().equals(e.params()))
                    .toList();
            String where = e.file() + ": " + e.owner() + "." + e.name() + (e.method() ? e.params().toString() : "");
            if (candidates.isEmpty()) { problems.add("not found: " + where); continue; }
            DocComment mine = candidates.get(0).doc(), javacs = DocComment.parse(e.doc());
            if (!DocComment.toText(mine.description(), false).equals(DocComment.toText(javacs.description(), false))) {
                problems.add("description differs: " + where);
            }
            List<String> names = mine.params().stream().map(DocComment.Tag::name).toList();
            if (!names.equals(e.paramNames())) problems.add("@param " + names + " but javac " + e.paramNames() + ": " + where);
        }
        assertTrue(problems.isEmpty(), problems.size() + " of " + expected.size() + " doc comments:\n" + String.join("\n", problems.subList(0, Math.min(40, problems.size()))));
    }
}
