package org.loopledger.kernel.session;

import com.sun.source.tree.BlockTree;
import com.sun.source.tree.ClassTree;
import com.sun.source.tree.CompilationUnitTree;
import com.sun.source.tree.MethodTree;
import com.sun.source.tree.StatementTree;
import com.sun.source.tree.Tree;
import com.sun.source.util.JavacTask;

import javax.tools.Diagnostic;
import javax.tools.JavaCompiler;
import javax.tools.JavaFileObject;
import javax.tools.SimpleJavaFileObject;
import javax.tools.ToolProvider;
import java.net.URI;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

/**
 * Groups runs of plain statements of a long cell into block statements, so that a cell of thousands of
 * statements compiles as a few JShell snippets instead of thousands.
 *
 * <p>Why: JShell compiles every snippet as a class of its own (tens of milliseconds each), and the cost of
 * each compilation grows with the number of snippets the session holds, so a 3,000-statement cell took
 * over 300 s. A block {@code { s1 s2 ... }} is one snippet and behaves as its statements run in order.
 *
 * <p>What is grouped: pieces that javac parses (syntax only, all pieces of the cell in one parser run) as
 * exactly one statement that declares nothing: no variable, class, method or import, so everything the
 * cell declares still lives on in the session. The cell's last piece stays alone (its value is the
 * cell's result). Grouping happens only in cells of at least {@value #MIN_PIECES} pieces, so short cells
 * run exactly as before. A group keeps each piece on its own cell line (padded with line breaks), so
 * tracebacks name the right line. If JShell rejects a group (a compile error in one of its statements)
 * the caller runs its pieces one by one, which reproduces the ungrouped behaviour exactly: the pieces
 * before the faulty one run, and the error names the faulty one. One difference remains: a non-void
 * expression statement inside a group ({@code list.add(x);}) leaves no {@code $n} variable behind.
 */
final class StatementBatches {
    static final int MIN_PIECES = 8;
    /** Bounds a group so its wrapper method stays far below the JVM's 64 KiB bytecode limit. */
    static final int MAX_GROUP_PIECES = 200;
    static final int MAX_GROUP_CHARS = 20_000;

    /** One unit to evaluate: a single piece ({@code parts} empty) or a group made of {@code parts}. */
    record Unit(CellSnippet snippet, List<CellSnippet> parts) {
        boolean grouped() {
            return !parts.isEmpty();
        }
    }

    private StatementBatches() {}

    static List<Unit> group(List<CellSnippet> pieces) {
        List<Unit> units = new ArrayList<>();
        if (pieces.size() < MIN_PIECES) {
            pieces.forEach(p -> units.add(new Unit(p, List.of())));
            return units;
        }
        boolean[] plain = plainStatements(pieces);
        List<CellSnippet> run = new ArrayList<>();
        int chars = 0;
        for (int i = 0; i < pieces.size(); i++) {
            CellSnippet p = pieces.get(i);
            boolean groupable = plain[i] && i < pieces.size() - 1;
            if (!groupable || run.size() >= MAX_GROUP_PIECES || chars + p.source().length() > MAX_GROUP_CHARS) {
                flush(run, units);
                chars = 0;
            }
            if (groupable) {
                run.add(p);
                chars += p.source().length();
            } else {
                units.add(new Unit(p, List.of()));
            }
        }
        flush(run, units);
        return units;
    }

    private static void flush(List<CellSnippet> run, List<Unit> units) {
        if (run.size() == 1) units.add(new Unit(run.get(0), List.of()));
        if (run.size() > 1) units.add(new Unit(block(run), List.copyOf(run)));
        run.clear();
    }

    /** {@code { p1 p2 ... }} with each piece starting on its own cell line relative to the first. */
    static CellSnippet block(List<CellSnippet> run) {
        StringBuilder b = new StringBuilder("{ ");
        int line = run.get(0).firstLine();
        for (CellSnippet p : run) {
            if (p.firstLine() > line) {
                b.append("\n".repeat(p.firstLine() - line));
                line = p.firstLine();
            } else if (b.length() > 2) {
                b.append(' ');
            }
            b.append(p.source());
            line += (int) p.source().chars().filter(c -> c == '\n').count();
        }
        b.append("\n}");
        return new CellSnippet(b.toString(), run.get(0).firstLine(), jdk.jshell.SourceCodeAnalysis.Completeness.COMPLETE);
    }

    /** For each piece, whether javac parses it as exactly one statement that declares nothing. */
    static boolean[] plainStatements(List<CellSnippet> pieces) {
        boolean[] plain = new boolean[pieces.size()];
        JavaCompiler javac = ToolProvider.getSystemJavaCompiler();
        if (javac == null) return plain;
        List<JavaFileObject> units = new ArrayList<>();
        for (int i = 0; i < pieces.size(); i++) units.add(new Piece(i, pieces.get(i).source()));
        Set<URI> faulty = new HashSet<>();
        try {
            JavacTask task = (JavacTask) javac.getTask(null, null, d -> {
                if (d.getKind() == Diagnostic.Kind.ERROR && d.getSource() != null) faulty.add(d.getSource().toUri());
            }, List.of("-proc:none"), null, units);
            int i = 0;
            for (CompilationUnitTree unit : task.parse()) {
                plain[i] = !faulty.contains(unit.getSourceFile().toUri()) && isOnePlainStatement(unit);
                i++;
            }
        } catch (RuntimeException | java.io.IOException e) {
            return new boolean[pieces.size()]; // no grouping: the cell runs piece by piece as before
        }
        return plain;
    }

    private static boolean isOnePlainStatement(CompilationUnitTree unit) {
        if (unit.getTypeDecls().size() != 1 || !(unit.getTypeDecls().get(0) instanceof ClassTree c)) return false;
        if (c.getMembers().size() != 1 || !(c.getMembers().get(0) instanceof MethodTree m)) return false;
        BlockTree body = m.getBody();
        if (body == null || body.getStatements().size() != 1) return false;
        StatementTree s = body.getStatements().get(0);
        Tree.Kind k = s.getKind();
        return k != Tree.Kind.VARIABLE && k != Tree.Kind.CLASS && k != Tree.Kind.INTERFACE && k != Tree.Kind.ENUM
                && k != Tree.Kind.RECORD && k != Tree.Kind.ANNOTATION_TYPE && k != Tree.Kind.EMPTY_STATEMENT;
    }

    /** A piece wrapped as the body of a method, for parsing only. */
    private static final class Piece extends SimpleJavaFileObject {
        private final String text;

        Piece(int i, String source) {
            super(URI.create("string:///LoopledgerPiece" + i + ".java"), Kind.SOURCE);
            this.text = "class LoopledgerPiece" + i + " { void run() {\n" + source + "\n} }";
        }

        @Override
        public CharSequence getCharContent(boolean ignoreEncodingErrors) {
            return text;
        }
    }
}
