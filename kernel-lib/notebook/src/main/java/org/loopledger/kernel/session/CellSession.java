package org.loopledger.kernel.session;

import jdk.jshell.Diag;
import jdk.jshell.ExpressionSnippet;
import jdk.jshell.JShell;
import jdk.jshell.Snippet;
import jdk.jshell.SnippetEvent;
import jdk.jshell.SourceCodeAnalysis;
import jdk.jshell.VarSnippet;
import org.loopledger.display.MimeBundle;
import org.loopledger.kernel.session.agent.AgentConnection;
import org.loopledger.kernel.session.agent.AgentLauncher;

import java.io.InputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ConcurrentHashMap;

/**
 * Runs notebook cells in JShell: the evaluation engine shared by the Jupyter kernel and the headless
 * runner, with no messaging inside.
 *
 * <p>Cells run in a separate agent JVM ({@link AgentLauncher}), so {@code System.exit} or an exhausted
 * heap in a cell ends only that JVM; the session notices, starts a fresh one, and says so on stderr.
 * Values become MIME bundles inside the agent; only JSON crosses the boundary.
 *
 * <p>Not thread-safe except {@link #interrupt()}, which any thread may call while a cell runs.
 */
public final class CellSession implements AutoCloseable {
    private final SessionOptions options;
    /** The library's doc comments for inspection, shared by every session of the process (parsed on first use). */
    private static final SourceDocs SOURCE_DOCS = new SourceDocs(CellSession.class.getClassLoader());
    private final Map<String, Tracebacks.Origin> origins = new ConcurrentHashMap<>();
    private volatile OutputListener listener = OutputListener.IGNORE;
    private volatile boolean interruptRequested;
    private volatile boolean executing;
    /** The standard input of the running cell; a new one per cell, so that a wait of an earlier cell never outlives it. */
    private volatile InputTurn input = InputTurn.closed();

    /** One cell's standard input; {@code over} ends every wait on it (interrupt, end of the cell, close). */
    private static final class InputTurn {
        final StandardInput source;
        volatile boolean over;

        InputTurn(StandardInput source) {
            this.source = source;
        }

        static InputTurn closed() {
            InputTurn t = new InputTurn(NO_STANDARD_INPUT);
            t.over = true;
            return t;
        }
    }
    private JShell shell;
    /** JShell's store of compiled classes, where the classes of dropped snippets are forgotten ({@link CompiledClassCache}). */
    private CompiledClassCache compiledClasses;
    private AgentConnection agent;
    /** The bundle of the last snippet's value when the agent rendered it as it ran ({@link AgentConnection#renderNext}). */
    private volatile MimeBundle prerendered;
    /** Temporary variables dropped from JShell whose values the agent has not yet been told to release. */
    private final List<String> droppedTemporaries = new ArrayList<>();
    private volatile Thread warmUpThread;
    private volatile boolean warmUpStopped;
    /** Warm-up snippets run so far. */
    private volatile int warmUpDone;

    private CellSession(SessionOptions options) {
        this.options = options;
    }

    /**
     * Starts the agent JVM and loads the preloaded imports; if asked, warms the compiler in the background
     * ({@link #stopWarmUp()}).
     */
    public static CellSession start(SessionOptions options) {
        CellSession s = new CellSession(options);
        s.boot();
        if (options.warmUp()) s.startWarmUp();
        return s;
    }

    /** What a cell reading {@code System.in} is told when nobody can type (was a silent end of input). */
    static final String NO_STDIN_MESSAGE = "standard input is not available to this cell: the front-end does not allow it "
            + "(allow_stdin is false; loopledger run and verify have no keyboard either): put the value in the cell, e.g. double gain = 1.5;";

    /** Reads of a cell run without a keyboard. */
    public static final StandardInput NO_STANDARD_INPUT = StandardInput.unavailable(NO_STDIN_MESSAGE);

    /** JShell's own input, unused: the agent's System.in goes over its input connection. */
    private static final InputStream JSHELL_INPUT = InputStream.nullInputStream();

    private void boot() {
        AgentLauncher launcher = new AgentLauncher(options.classPath(), options.agentVmOptions(),
                new DisplayFrameSink(b -> listener.output(new CellOutput.Display(b))), new DisplayFrameSink(b -> prerendered = b), this::readLine);
        PrintStream out = new PrintStream(new Utf8StreamSink(t -> listener.output(new CellOutput.Stream(CellOutput.Stream.STDOUT, t))), true, StandardCharsets.UTF_8);
        PrintStream err = new PrintStream(new Utf8StreamSink(t -> listener.output(new CellOutput.Stream(CellOutput.Stream.STDERR, t))), true, StandardCharsets.UTF_8);
        // the class path is set on the file manager once, not passed as --class-path: as an option it reached every
        // javac run JShell makes (3-4 per snippet), and each one emptied the file manager's index of the class path,
        // which the next run rebuilt over every folder of the launcher's jar (about 4 % of a trivial cell's time)
        List<java.io.File> classPath = java.util.Arrays.stream(options.classPath().split(java.io.File.pathSeparator))
                .filter(e -> !e.isEmpty()).map(java.io.File::new).toList();
        shell = JShell.builder()
                .executionEngine(launcher, Map.of())
                .fileManager(fm -> {
                    try {
                        fm.setLocation(javax.tools.StandardLocation.CLASS_PATH, classPath);
                    } catch (java.io.IOException e) {
                        throw new java.io.UncheckedIOException("the class path for compiling cells is not usable: " + options.classPath(), e);
                    }
                    return fm;
                })
                .in(JSHELL_INPUT)
                .out(out)
                .err(err)
                .build();
        agent = launcher.connection();
        compiledClasses = CompiledClassCache.of(shell);
        for (String imp : Preload.imports(CellSession.class.getClassLoader())) {
            for (SnippetEvent e : shell.eval(imp)) {
                if (e.status() == Snippet.Status.REJECTED) shell.drop(e.snippet());
            }
        }
    }

    /**
     * Throw-away snippets for the warm-up, one of each kind a notebook cell is made of: expressions of numbers,
     * strings, library and collection calls, a lambda, statements and a loop, a variable, a method and a class (each
     * declared again with the same signature every round, so JShell keeps one class for each). Nothing prints or
     * displays.
     */
    static final List<String> WARM_UP_SNIPPETS = List.of("1+1", "int ll$warm = 2;", "double ll$f(double x) { return x * ll$warm; }",
            "ll$f(1.5)", "String.valueOf(ll$f(2)) + \" rad/s\"", "new ArrayList<Integer>().size()", "Math.sqrt(2.0) * Math.PI",
            "ll$warm = 3;", "for (int ll$i = 0; ll$i < 3; ll$i++) { ll$warm += ll$i; }",
            "List.of(1.0, 2.0).stream().mapToDouble(ll$d -> ll$d * ll$warm).sum()", "class Ll$Warm { double v() { return ll$warm; } }",
            "new Ll$Warm().v()", "Units.class.getSimpleName()", "double[] ll$a = {1, 2, 3};", "ll$a.length");

    /**
     * How many warm-up snippets at most. Measured on the 2-core build machine (kernel flags, {@code 1+1} in-process):
     * 18-21 ms in a fresh session's first 40 cells, 9-13 ms after 100-200 cells, 9 ms after 200-400; the warm-up
     * ends about 9 s after the start (the first snippets are the slowest), using one core meanwhile.
     */
    static final int WARM_UP_BUDGET = 300;

    /**
     * How long the session must be left alone after the start before the warm-up compiles anything. A client that
     * sends a cell at once (Run All, {@code loopledger run}, a benchmark) then never waits for a warm-up snippet: right
     * after the start those are the slowest of all (100-250 ms, the compiler still interpreted).
     */
    static final long WARM_UP_DELAY_MS = 400;
    private final Object warmUpLock = new Object();

    /**
     * Compiles throw-away snippets while nobody waits, so that the first cells a user types run fast: the JVM that
     * compiles cells is slow until its JIT has seen javac at work, and no JIT state survives a start. The warm-up runs
     * on its own thread after the start, but only once the session has been left alone for {@value #WARM_UP_DELAY_MS}
     * ms, and stops for good between two snippets as soon as the session is first needed ({@link #stopWarmUp()}): a
     * cell waits for at most the one snippet being compiled. A client that sends a cell at once (Run All,
     * {@code loopledger run}, a benchmark) never starts it. At most {@value #WARM_UP_BUDGET} snippets.
     *
     * <p>It does not resume after a cell: a version that did took a core for seconds after the first cell, which
     * slowed whatever started next on a 2-core machine (ipykernel's cold start in {@code bench kernel} doubled when it
     * started right after ours), and a user at work gains little from it.
     */
    private void startWarmUp() {
        Thread t = new Thread(() -> {
            java.util.Set<String> before = null;
            try {
                long until = System.nanoTime() + WARM_UP_DELAY_MS * 1_000_000L;
                synchronized (warmUpLock) {
                    long left;
                    while (!warmUpStopped && (left = until - System.nanoTime()) > 0) warmUpLock.wait(Math.max(1, left / 1_000_000L));
                }
                if (warmUpStopped) return;
                before = shell.snippets().map(Snippet::id).collect(java.util.stream.Collectors.toSet());
                // the path of a cell: split, compile, run in the agent, render the value there, drop what is transient
                for (int i = 0; warmUpDone < WARM_UP_BUDGET && !warmUpStopped; i++) {
                    runSnippets(WARM_UP_SNIPPETS.get(i % WARM_UP_SNIPPETS.size()), "warm-up", OutputListener.IGNORE);
                    warmUpDone++;
                }
            } catch (Exception | Error e) {
                // warm-up only
            } finally {
                if (before != null) {
                    // what the warm-up declared (no cell runs meanwhile, so every new snippet is the warm-up's)
                    java.util.Set<String> earlier = before;
                    try {
                        shell.snippets().filter(sn -> !earlier.contains(sn.id()) && shell.status(sn).isActive()).toList().forEach(this::drop);
                        agent.forgetLast(releasing());
                    } catch (Exception | Error e) {
                        // warm-up only
                    }
                }
            }
        }, "loopledger-warm-up");
        t.setDaemon(true);
        warmUpThread = t;
        t.start();
    }

    /**
     * Ends the background warm-up (after the snippet it is compiling) and waits for it; harmless when none
     * runs. Everything that uses the JShell session calls this first, since JShell is not thread-safe.
     */
    public void stopWarmUp() {
        warmUpStopped = true;
        synchronized (warmUpLock) {
            warmUpLock.notifyAll();
        }
        Thread t = warmUpThread;
        if (t == null || t == Thread.currentThread()) return;
        boolean interrupted = false;
        while (t.isAlive()) {
            try {
                t.join();
            } catch (InterruptedException e) {
                interrupted = true;
            }
        }
        warmUpThread = null;
        if (interrupted) Thread.currentThread().interrupt();
    }

    /** A line for the agent's System.in, from the running cell's input (on the launcher's input thread). */
    private String readLine() throws java.io.IOException {
        InputTurn turn = input;
        if (turn.over) return NO_STANDARD_INPUT.readLine(() -> true);
        return turn.source.readLine(() -> turn.over);
    }

    /**
     * Runs one cell without a keyboard: reads of {@code System.in} fail with a message naming the fix.
     *
     * @param code      the cell source, possibly several snippets
     * @param cellLabel how tracebacks name this cell later, e.g. {@code cell [3]}
     * @param sink      receives each output as it happens, on JShell's threads or the caller's
     */
    public CellResult execute(String code, String cellLabel, OutputListener sink) {
        return execute(code, cellLabel, sink, NO_STANDARD_INPUT);
    }

    /**
     * Runs one cell; outputs reach {@code sink} as they happen and are also returned.
     *
     * @param code      the cell source, possibly several snippets
     * @param cellLabel how tracebacks name this cell later, e.g. {@code cell [3]}
     * @param sink      receives each output as it happens, on JShell's threads or the caller's
     * @param stdin     answers the cell's reads of {@code System.in}, one line at a time; asked on another
     *                  thread, and told to give up when the cell is interrupted or the session closes
     */
    public CellResult execute(String code, String cellLabel, OutputListener sink, StandardInput stdin) {
        stopWarmUp();
        CellResult.Collector collector = new CellResult.Collector(sink);
        listener = collector;
        interruptRequested = false;
        InputTurn turn = new InputTurn(stdin);
        input = turn;
        executing = true;
        try {
            runSnippets(code, cellLabel, collector);
        } catch (IllegalStateException | jdk.jshell.spi.ExecutionControl.ExecutionControlException dead) {
            recoverFromDeadAgent(collector, dead);
        } catch (RuntimeException | Error e) {
            if (!agentAlive()) {
                recoverFromDeadAgent(collector, e);
            } else {
                collector.output(new CellOutput.Error("InternalError", "the kernel failed on this cell: " + e,
                        List.of("InternalError: " + e, "The session is still running; please report this cell.")));
            }
        } finally {
            executing = false;
            turn.over = true;
            input = InputTurn.closed();
        }
        return collector.result();
    }

    private void runSnippets(String code, String label, OutputListener out) throws jdk.jshell.spi.ExecutionControl.ExecutionControlException {
        List<CellSnippet> pieces = CellSnippet.split(shell.sourceCodeAnalysis(), code);
        List<StatementBatches.Unit> units = StatementBatches.group(pieces);
        boolean[] shown = {false};
        for (int i = 0; i < units.size(); i++) {
            StatementBatches.Unit unit = units.get(i);
            boolean last = i == units.size() - 1;
            Step step = evalOne(unit.snippet(), last, label, out, shown, unit.grouped());
            if (step == Step.GROUP_REJECTED) {
                // a compile error inside the group: run its pieces one by one, as an ungrouped cell would
                for (CellSnippet part : unit.parts()) {
                    step = evalOne(part, false, label, out, shown, false);
                    if (step != Step.NEXT) break;
                }
            }
            if (step == Step.STOP) return;
        }
        if (!shown[0]) agent.forgetLast(releasing());
    }

    /** The dropped temporaries to release with the next command to the agent (the list is then emptied). */
    private List<String> releasing() {
        List<String> names = List.copyOf(droppedTemporaries);
        droppedTemporaries.clear();
        return names;
    }

    private enum Step { NEXT, STOP, GROUP_REJECTED }

    private Step evalOne(CellSnippet snip, boolean last, String label, OutputListener out, boolean[] shown, boolean group)
            throws jdk.jshell.spi.ExecutionControl.ExecutionControlException {
        if (interruptRequested) {
            out.output(interrupted());
            return Step.STOP;
        }
        if (last) {
            prerendered = null;
            agent.renderNext(true); // the cell's value then comes with the snippet's answer
        }
        List<SnippetEvent> events = shell.eval(snip.source());
        if (!agentAlive()) throw new IllegalStateException("agent JVM ended");
        MimeBundle rendered = prerendered;
        prerendered = null;
        if (last && rendered == null) agent.renderNext(false);
        Optional<CellOutput.Error> failure = Optional.empty();
        SnippetEvent main = null;
        for (SnippetEvent e : events) {
            if (e.causeSnippet() == null) {
                main = e;
                origins.put(e.snippet().id(), new Tracebacks.Origin(label, snip.firstLine()));
            }
            if (e.status() == Snippet.Status.OVERWRITTEN) drop(e.snippet());
        }
        if (main == null) return Step.NEXT;
        if (main.status() == Snippet.Status.REJECTED) {
            List<Diag> diags = shell.diagnostics(main.snippet()).toList();
            shell.drop(main.snippet());
            if (group) return Step.GROUP_REJECTED;
            failure = Optional.of(Tracebacks.compileError(snip, diags));
        } else if (main.exception() != null) {
            failure = Optional.of(Tracebacks.runtimeError(main.exception(), origins, label));
        } else if (interruptRequested) {
            failure = Optional.of(interrupted());
        } else if (main.status() == Snippet.Status.RECOVERABLE_DEFINED || main.status() == Snippet.Status.RECOVERABLE_NOT_DEFINED) {
            List<String> unresolved = shell.unresolvedDependencies((jdk.jshell.DeclarationSnippet) main.snippet()).toList();
            out.output(new CellOutput.Stream(CellOutput.Stream.STDERR, "note: line " + (snip.firstLine() + 1) + " is defined but cannot be used until "
                    + String.join(", ", unresolved) + " " + (unresolved.size() == 1 ? "is" : "are") + " declared\n"));
        }
        if (failure.isPresent()) {
            out.output(failure.get());
            agent.forgetLast(releasing());
            return Step.STOP;
        }
        if (last && isExpression(main.snippet()) && SinkResults.hides(main.snippet())) {
            forgetIfTransient(main.snippet());
            agent.forgetLast(releasing()); // e.g. the PrintStream of a closing printf: its text is already in the output
        } else if (last && isExpression(main.snippet()) && rendered != null) {
            forgetIfTransient(main.snippet());
            if (!droppedTemporaries.isEmpty()) agent.forgetLast(releasing());
            out.output(new CellOutput.Result(rendered));
            shown[0] = true;
        } else if (last && isExpression(main.snippet())) {
            forgetIfTransient(main.snippet());
            String json = agent.renderLast(releasing());
            if (json != null) {
                out.output(new CellOutput.Result(MimeBundle.fromJson(json)));
                shown[0] = true;
            }
        } else {
            forgetIfTransient(main.snippet());
        }
        return Step.NEXT;
    }

    /**
     * Drops a snippet that declares nothing a user named once it has run: a statement, an assignment or
     * variable-value expression, or the temporary variable ({@code $1}, {@code $2}, ...) JShell makes of an
     * expression's value. Every snippet JShell keeps makes each later compilation slower (each later wrapper
     * imports every kept variable), and the kernel never shows the temporary's name. A dropped temporary's value
     * is released in the agent with the next render or forget command.
     */
    private void forgetIfTransient(Snippet s) {
        boolean temporary = s instanceof VarSnippet && s.subKind() == Snippet.SubKind.TEMP_VAR_EXPRESSION_SUBKIND;
        if (s.kind() == Snippet.Kind.STATEMENT || s.kind() == Snippet.Kind.EXPRESSION || temporary) {
            try {
                drop(s);
                if (temporary) droppedTemporaries.add(((VarSnippet) s).name());
            } catch (IllegalArgumentException | IllegalStateException e) {
                // already gone
            }
        }
    }

    /** Drops a snippet from JShell and its class from the compiler's view. */
    private void drop(Snippet s) {
        shell.drop(s);
        compiledClasses.forget(s);
    }

    /**
     * Whether the classes of dropped snippets are forgotten in this JVM: false when it was started without
     * {@link SessionOptions#HOST_FLAGS}' opening of JShell's package, and then cells get slower as the session grows.
     */
    public boolean forgetsDroppedClasses() {
        return compiledClasses.available();
    }

    /** Warm-up snippets run so far; for tests. */
    int warmUpSnippetsRun() {
        return warmUpDone;
    }

    /** How many class files of earlier snippets the compiler sees, or -1 when unknown; for tests. */
    int compiledClassCount() {
        return compiledClasses.size();
    }

    private static boolean isExpression(Snippet s) {
        return s instanceof ExpressionSnippet
                || s instanceof VarSnippet && s.subKind() == Snippet.SubKind.TEMP_VAR_EXPRESSION_SUBKIND;
    }

    private static CellOutput.Error interrupted() {
        return new CellOutput.Error("Interrupted", "the cell was stopped by an interrupt",
                List.of("Interrupted: the cell was stopped by an interrupt; variables it had assigned keep their values"));
    }

    private boolean agentAlive() {
        return agent != null && agent.alive();
    }

    private void recoverFromDeadAgent(OutputListener out, Throwable why) {
        String message = "The Java session running the cells ended (System.exit, an exhausted heap or a crash). "
                + "A fresh session has been started: variables, methods and imports of earlier cells are gone; run them again.";
        restartQuietly();
        out.output(new CellOutput.Stream(CellOutput.Stream.STDERR, message + "\n"));
        out.output(new CellOutput.Error("SessionRestarted", "the Java session ended and was restarted",
                List.of("SessionRestarted: " + message, "    (cause: " + why.getMessage() + ")")));
    }

    private void restartQuietly() {
        try {
            shell.close();
        } catch (RuntimeException e) {
            // already closed
        }
        origins.clear();
        droppedTemporaries.clear();
        boot();
    }

    /**
     * Stops the running cell, even in a tight loop; harmless when none runs. Thread-safe. An interrupt
     * that arrives while the cell is still being compiled would find nothing to stop, so the stop is
     * repeated every 50 ms until the cell has ended.
     */
    public void interrupt() {
        interruptRequested = true;
        input.over = true;
        stopOnce();
        if (!executing) return;
        Thread retry = new Thread(() -> {
            while (executing && interruptRequested) {
                try {
                    Thread.sleep(50);
                } catch (InterruptedException e) {
                    return;
                }
                if (executing && interruptRequested) stopOnce();
            }
        }, "loopledger-interrupt");
        retry.setDaemon(true);
        retry.start();
    }

    private void stopOnce() {
        JShell s = shell;
        if (s != null) {
            try {
                s.stop();
            } catch (IllegalStateException e) {
                // session closed meanwhile
            }
        }
    }

    /**
     * The datasets read by this session's cells (see {@link org.loopledger.provenance.Provenance#datasetsJson()}),
     * asked of the agent over its command stream rather than through a snippet's standard output, which
     * a cell may have redirected. Call between cells.
     *
     * @throws IllegalStateException when the agent cannot answer
     */
    public String provenanceJson() {
        try {
            return agent.provenanceJson();
        } catch (jdk.jshell.spi.ExecutionControl.ExecutionControlException e) {
            throw new IllegalStateException("the session could not report the datasets it read: " + e.getMessage(), e);
        }
    }

    /**
     * Ends the agent JVM at once, for a cell that ignores {@link #interrupt()}; the running
     * {@link #execute} then returns with an error and a fresh session starts. Thread-safe.
     */
    public void killAgent() {
        AgentConnection a = agent;
        if (a != null) a.kill();
    }

    /** Ends the agent JVM and starts a new session with the preloaded imports. */
    public void restart() {
        stopWarmUp();
        restartQuietly();
    }

    /** Whether a console should run the code now, as for Jupyter's {@code is_complete_request}. */
    public Completeness isComplete(String code) {
        stopWarmUp();
        SourceCodeAnalysis analysis = shell.sourceCodeAnalysis();
        String rest = code;
        while (true) {
            if (rest.isBlank()) return Completeness.COMPLETE;
            SourceCodeAnalysis.CompletionInfo info = analysis.analyzeCompletion(rest);
            switch (info.completeness()) {
                case EMPTY:
                    return Completeness.COMPLETE;
                case COMPLETE:
                case COMPLETE_WITH_SEMI:
                    if (info.remaining().length() >= rest.length()) return Completeness.INVALID;
                    rest = info.remaining();
                    break;
                case DEFINITELY_INCOMPLETE:
                case CONSIDERED_INCOMPLETE:
                    return Completeness.incomplete(indentFor(rest));
                default:
                    return Completeness.INVALID;
            }
        }
    }

    private static String indentFor(String code) {
        int depth = 0;
        for (char c : code.toCharArray()) {
            if (c == '{' || c == '(') depth++;
            else if ((c == '}' || c == ')') && depth > 0) depth--;
        }
        return "    ".repeat(Math.max(depth, 0));
    }

    /** Completions at {@code cursor} (UTF-16 offset) from JShell's source analysis. */
    public Completions complete(String code, int cursor) {
        stopWarmUp();
        int[] anchor = new int[1];
        int at = Math.max(0, Math.min(cursor, code.length()));
        List<SourceCodeAnalysis.Suggestion> suggestions = shell.sourceCodeAnalysis().completionSuggestions(code, at, anchor);
        LinkedHashSet<String> matches = new LinkedHashSet<>();
        suggestions.stream().filter(SourceCodeAnalysis.Suggestion::matchesType).forEach(s -> matches.add(s.continuation()));
        suggestions.forEach(s -> matches.add(s.continuation()));
        return new Completions(new ArrayList<>(matches), anchor[0], at);
    }

    /** Signatures and Javadoc of what is at {@code cursor} as plain text, or empty when nothing is known there. */
    public Optional<String> inspect(String code, int cursor) {
        return inspection(code, cursor).map(Inspection::plainText);
    }

    /** What Shift-Tab shows: every signature JShell knows at the cursor, with its Javadoc as plain text and as Markdown. */
    public record Inspection(String plainText, String markdown) {}

    /**
     * Signatures at {@code cursor} (UTF-16 offset) from JShell's source analysis, each with its Javadoc: JShell's own
     * (the JDK, when its sources are installed) or, for the library's classes, the doc comment from the sources shipped
     * in the jar ({@link SourceDocs}). Empty when nothing is known there.
     */
    public Optional<Inspection> inspection(String code, int cursor) {
        stopWarmUp();
        int at = Math.max(0, Math.min(cursor, code.length()));
        // JShell documents only the snippet it is given: drop the complete snippets before the cursor's (a cell of several lines)
        int start = 0;
        while (start < at) {
            SourceCodeAnalysis.CompletionInfo ci = shell.sourceCodeAnalysis().analyzeCompletion(code.substring(start, at));
            if (!ci.completeness().isComplete() || ci.remaining().isEmpty()) break;
            int consumed = (at - start) - ci.remaining().length();
            if (consumed <= 0) break;
            start += consumed;
        }
        while (start < at && Character.isWhitespace(code.charAt(start))) start++;
        List<SourceCodeAnalysis.Documentation> docs = shell.sourceCodeAnalysis().documentation(code.substring(start), at - start, true);
        if (docs.isEmpty()) return Optional.empty();
        StringBuilder plain = new StringBuilder(), md = new StringBuilder();
        for (SourceCodeAnalysis.Documentation d : docs) {
            if (plain.length() > 0) {
                plain.append("\n\n");
                md.append("\n\n---\n\n");
            }
            plain.append(d.signature());
            md.append("```java\n").append(d.signature()).append("\n```");
            if (d.javadoc() != null && !d.javadoc().isBlank()) {
                plain.append("\n").append(d.javadoc().strip());
                md.append("\n\n").append(d.javadoc().strip());
                continue;
            }
            Optional<DocComment> doc = SOURCE_DOCS.find(d.signature());
            if (doc.isPresent() && !doc.get().isEmpty()) {
                plain.append("\n\n").append(doc.get().plainText());
                md.append("\n\n").append(doc.get().markdown());
            }
        }
        return Optional.of(new Inspection(plain.toString(), md.toString()));
    }

    @Override
    public void close() {
        input.over = true;
        stopWarmUp();
        try {
            shell.close();
        } catch (RuntimeException e) {
            // closing anyway
        }
    }
}
