package dev.contour.eval;

import dev.contour.Cancellation;
import dev.contour.ContourException;
import dev.contour.ProgressLine;
import dev.contour.Span;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import dev.contour.lang.Expr;
import dev.contour.lang.IndexSet;
import dev.contour.lang.ScriptParser;
import dev.contour.lang.Stmt;
import dev.contour.term.Term;
import dev.contour.term.Terms;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Collections;
import java.util.Deque;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;

/**
 * Runs Contour scripts. One interpreter is one session: definitions persist across
 * {@link #run} calls (the REPL feeds it one input at a time).
 */
public final class Interpreter {
    private final InterpreterOptions options;
    private final BuiltinRegistry registry;
    private final Display display;
    private final Map<String, Value> globals = new LinkedHashMap<>();
    /** Declared variables: name to whether it is collected. */
    private final Map<String, Boolean> variables = new HashMap<>();
    /** The statement that declared each unknown family: running it again (in a loop) declares it afresh. */
    private final Map<String, Stmt.Unknown> unknownDeclaredBy = new HashMap<>();
    private SessionLog log = new SessionLog();
    private final Set<Path> used = new HashSet<>();
    /** The SHA-256 of each library file's text as {@code use} read it, in the order read. */
    private final Map<Path, String> libraryDigests = new LinkedHashMap<>();
    /** The files being run or loaded right now, outermost first: a {@code use} of one of them is a cycle. */
    private final List<Path> loading = new ArrayList<>();
    private Deque<Map<String, Value>> frames = new ArrayDeque<>();
    /** The loop variables in force, outermost first, shown beside output from inside loops. */
    private final List<String> loopContext = new ArrayList<>();
    private Path directory;
    private int fileDepth;
    private int callDepth;
    /** The budget of the top-level statement running now (null between statements). */
    private StatementBudget budget;
    private long loopIterations;
    private int passed;
    private int failed;
    private ShowWatcher showWatcher;

    /** Receives each value a {@code show} statement prints: its label (with loop context) and the value as plain text and as LaTeX. */
    public interface ShowWatcher {
        void shown(String label, String plainValue, String latexValue);
    }

    /** Receives every statement of the script when a whole-run printer (a report) listens; null otherwise. */
    private java.util.function.Consumer<StatementEvent> listener;

    public Interpreter(InterpreterOptions options) {
        this(options, BuiltinRegistry.standard());
    }

    /** What rule statements borrow from this session: evaluation in scope, file lookup, the output format. */
    private final RuleContext ruleContext = new RuleContext() {
        @Override
        public Value evaluate(Expr e) {
            return eval(e);
        }

        @Override
        public Path resolve(String file, Span span) {
            return Interpreter.this.resolve(file, span);
        }

        @Override
        public OutputFormat format() {
            return options.format();
        }
    };

    public Interpreter(InterpreterOptions options, BuiltinRegistry registry) {
        this.options = options;
        this.registry = registry;
        this.display = new Display(options.format());
    }

    /**
     * Reports every statement of the scripts this session runs to {@code l} (null stops it): what a
     * derivation report is printed from. Libraries' own statements are not reported.
     */
    public void listen(java.util.function.Consumer<StatementEvent> l) {
        this.listener = l;
    }

    /** The built-ins this session can call; register more at any time. */
    public BuiltinRegistry builtins() {
        return registry;
    }

    public InterpreterOptions options() {
        return options;
    }

    /**
     * Runs a script (or one REPL input) in this session.
     *
     * @param fileName used in error locations; {@code use} resolves relative to its folder
     * @throws ContourException with a span on bad input
     */
    public RunResult run(String sourceText, String fileName) {
        return Cancellation.under(budget(), () -> runStatements(sourceText, fileName));
    }

    /**
     * The stop token for one run: the caller's (so an interrupt or an outer budget reaches every
     * loop below) with this session's time limit on top, if it has one.
     */
    private Cancellation.Token budget() {
        Cancellation.Token token = Cancellation.current();
        return options.limits().timed()
                ? token.withDeadline(System.nanoTime() + options.limits().timeLimit().toNanos(),
                        "the script ran past its time limit of " + options.limits().timeLimit().toMillis() + " ms")
                : token;
    }

    private RunResult runStatements(String sourceText, String fileName) {
        int passedBefore = passed;
        int failedBefore = failed;
        loopIterations = 0;
        Path savedDirectory = directory;
        Deque<Map<String, Value>> savedFrames = frames;
        Path self = fileOf(fileName);
        if (self != null) {
            loading.add(self);
        }
        try {
            directory = directoryOf(fileName);
            List<Stmt> statements = ScriptParser.parseScript(sourceText, fileName);
            frames = new ArrayDeque<>();
            for (Stmt s : statements) {
                try {
                    executeWithinBudget(s);
                    record(s, sourceText);
                } catch (StackOverflowError e) {
                    throw new ContourException("this statement nests too deeply to evaluate (a very long chain of"
                            + " operations: a sum over a range builds long sums without nesting)", s.span());
                } catch (OutOfMemoryError e) {
                    // The statement's intermediate values are unreachable once we are here.
                    throw new ContourException("out of memory: this statement's expressions outgrew the Java heap ("
                            + Runtime.getRuntime().maxMemory() / (1024 * 1024) + " MiB); a larger heap can be given with"
                            + " CONTOUR_JAVA_OPTS=-Xmx...", s.span());
                }
            }
        } catch (StackOverflowError e) {
            throw new ContourException("the script nests too deeply to evaluate");
        } finally {
            directory = savedDirectory;
            frames = savedFrames;
            callDepth = 0;
            if (self != null) {
                loading.remove(loading.size() - 1);
            }
        }
        return new RunResult(passed - passedBefore, failed - failedBefore);
    }

    /**
     * Logs a top-level statement that defines something, as its text, for {@link #definitionsAsScript}:
     * the statement rather than its value, so a saved session re-runs as fast as it ran.
     */
    private void record(Stmt s, String sourceText) {
        if (s instanceof Stmt.Vars v) {
            log.add(SessionLog.Kind.VARS, null, "vars " + String.join(", ", v.names()) + (v.collected() ? " collected" : ""));
        } else if (s instanceof Stmt.Let l) {
            log.add(SessionLog.Kind.LET, l.name(), l.source());
        } else if (s instanceof Stmt.Def d) {
            log.add(SessionLog.Kind.OTHER, d.name(), d.source());
        } else if (s instanceof Stmt.Unknown u) {
            log.add(SessionLog.Kind.OTHER, u.name(), u.source());
        } else if (s instanceof Stmt.Use u) {
            log.add(SessionLog.Kind.USE, null, "use \"" + u.path().replace("\\", "\\\\").replace("\"", "\\\"") + "\"");
        } else if (s instanceof Stmt.For || s instanceof Stmt.Rule) {
            log.add(SessionLog.Kind.OTHER, null, textOf(s.span(), sourceText));
        }
        // show, check and derive define nothing
    }

    /** The text a statement's span covers (spans count code points, as the parser does). */
    private static String textOf(Span span, String text) {
        int at = 0;
        for (int line = 1; line < span.line(); line++) {
            at = text.indexOf('\n', at) + 1;
        }
        int start = text.offsetByCodePoints(at, span.column() - 1);
        return text.substring(start, text.offsetByCodePoints(start, span.length()));
    }

    /**
     * Runs one top-level statement under its budget of time and memory (printing included); when a
     * budget runs out, whatever the work was doing, the error names the budget and how to raise it.
     */
    private void executeWithinBudget(Stmt s) {
        EvaluationLimits l = options.limits();
        long memoryBytes = l.statementMemoryMiB() <= 0 ? 0 : l.statementMemoryMiB() * 1024 * 1024;
        StatementBudget outer = budget;
        if (outer != null) {
            execute(s); // inside a statement already (a library read by 'use'): its budget covers this
            return;
        }
        try (StatementBudget b = StatementBudget.start(l.statementTime(), memoryBytes)) {
            budget = b;
            try {
                execute(s);
            } catch (RuntimeException | OutOfMemoryError e) {
                ContourException over = overBudget(b, s.span());
                if (over != null) {
                    throw over;
                }
                throw e;
            }
        } finally {
            budget = null;
        }
    }

    /** The error for a statement stopped by its budget, or null when no budget ran out. */
    private static ContourException overBudget(StatementBudget b, Span span) {
        if (b.tripped() == StatementBudget.Reason.TIME) {
            long seconds = Math.max(1, b.timeAllowed().toSeconds());
            if (b.timeSource() != null) {
                return new ContourException("this statement ran past its limit of " + seconds + " second"
                        + (seconds == 1 ? "" : "s") + " (" + b.timeSource() + ", which also bounds evaluating the argument and"
                        + " printing the result, with a grace of a quarter of it or at least a second); raise it there", span);
            }
            return new ContourException("this statement ran past its time budget of " + seconds + " seconds; raise it with"
                    + " --time-budget SECONDS (0 for no limit)", span);
        }
        if (b.tripped() == StatementBudget.Reason.MEMORY) {
            return new ContourException("this statement used more than its memory budget of " + b.memoryLimitBytes() / (1024 * 1024)
                    + " MiB; raise it with --memory-budget MIB (at most the Java heap: CONTOUR_JAVA_OPTS=-Xmx...)", span);
        }
        return null;
    }

    /** Evaluates one expression in this session, without printing. */
    public Value evaluate(String expressionText, String fileName) {
        try {
            return Cancellation.under(budget(), () -> eval(ScriptParser.parseExpression(expressionText, fileName)));
        } catch (StackOverflowError e) {
            throw new ContourException("the expression nests too deeply to evaluate");
        } finally {
            callDepth = 0;
        }
    }

    /** Lets {@code watcher} see every shown value from now on (a sweep records them by label); null stops it. */
    public void watchShows(ShowWatcher watcher) {
        this.showWatcher = watcher;
    }

    /**
     * The integer tuples of an index set written as in {@code sum} and {@code unknown}: the text is
     * {@code sum BINDERS [with CONSTRAINTS] : 0}, evaluated in this session's scope; tuples come in
     * lexicographic order of the indices as written.
     */
    public List<long[]> indexTuples(String sumText, String fileName) {
        Expr e = ScriptParser.parseExpression(sumText, fileName);
        if (!(e instanceof Expr.Sum sum)) {
            throw new ContourException("not an index set", e.span());
        }
        return enumerate(sum.indices());
    }

    /** Every name a script can use here: definitions, variables, unknown families and built-ins. */
    public Set<String> namesInScope() {
        Set<String> names = new TreeSet<>(globals.keySet());
        names.addAll(registry.names());
        return Collections.unmodifiableSet(names);
    }

    /** The value bound to a name in this session, or null. */
    public Value lookup(String name) {
        Value v = globals.get(name);
        return v != null ? v : registry.lookup(name).orElse(null);
    }

    /**
     * What a session has defined at one moment: names, variables, unknown families, libraries
     * loaded, rules and the definitions log. Values are immutable, so a snapshot is a set of
     * shallow copies, cheap whatever the size of the values.
     */
    public static final class Snapshot {
        private final Map<String, Value> globals;
        private final Map<String, Boolean> variables;
        private final Map<String, Stmt.Unknown> unknownDeclaredBy;
        private final SessionLog log;
        private final Set<Path> used;
        private final Object rules;
        private final int passed;
        private final int failed;

        private Snapshot(Interpreter i) {
            globals = new LinkedHashMap<>(i.globals);
            variables = new HashMap<>(i.variables);
            unknownDeclaredBy = new HashMap<>(i.unknownDeclaredBy);
            log = i.log.copy();
            used = new HashSet<>(i.used);
            rules = i.registry.hasRuleSink() ? i.registry.ruleSink(null).state() : null;
            passed = i.passed;
            failed = i.failed;
        }
    }

    /** The session's definitions now, to {@link #restore} after an input that was stopped half way. */
    public Snapshot snapshot() {
        return new Snapshot(this);
    }

    /**
     * Makes this session's definitions those of the snapshot (taken from this interpreter or from
     * another one with the same built-ins), dropping whatever was defined since.
     */
    public void restore(Snapshot s) {
        globals.clear();
        globals.putAll(s.globals);
        variables.clear();
        variables.putAll(s.variables);
        unknownDeclaredBy.clear();
        unknownDeclaredBy.putAll(s.unknownDeclaredBy);
        log = s.log.copy();
        used.clear();
        used.addAll(s.used);
        if (registry.hasRuleSink()) {
            registry.ruleSink(null).restore(s.rules);
        }
        passed = s.passed;
        failed = s.failed;
        frames = new ArrayDeque<>();
        loopContext.clear();
        fileDepth = 0;
        callDepth = 0;
        loading.clear();
    }

    /** This session's definitions as script text that rebuilds them (for saving a REPL session). */
    public String definitionsAsScript() {
        return log.asScript();
    }

    // ================================================================ statements

    private void execute(Stmt s) {
        long started = System.nanoTime();
        executeStatement(s);
        if (listener != null && fileDepth == 0 && loopContext.isEmpty()
                && !(s instanceof Stmt.Show) && !(s instanceof Stmt.Check)) {
            listener.accept(new StatementEvent(s, "", null, "", "", null, System.nanoTime() - started));
        }
    }

    private void executeStatement(Stmt s) {
        long started = System.nanoTime();
        tick(s.span());
        if (s instanceof Stmt.Vars v) {
            for (String name : v.names()) {
                declareVariable(name, v.collected(), v.span());
            }
        } else if (s instanceof Stmt.Let l) {
            checkFreeName(l.name(), l.span(), true);
            Value value = eval(l.value());
            globals.put(l.name(), value);
        } else if (s instanceof Stmt.Def d) {
            checkFreeName(d.name(), d.span(), true);
            java.util.Set<String> seenParameters = new java.util.HashSet<>();
            for (String p : d.parameters()) {
                if (!seenParameters.add(p)) {
                    throw new ContourException("the parameter '" + p + "' of " + d.name() + " is named twice", d.span());
                }
            }
            Map<String, Value> captured = new HashMap<>();
            frames.descendingIterator().forEachRemaining(captured::putAll); // inner frames win
            globals.put(d.name(), new FunctionValue(d.name(), d.parameters(), d.body(), d.source(), captured));
        } else if (s instanceof Stmt.Unknown u) {
            declareUnknowns(u);
        } else if (s instanceof Stmt.Use u) {
            use(u);
        } else if (s instanceof Stmt.Show sh) {
            Value v = eval(sh.value());
            for (Stmt.ShowOption o : sh.options()) {
                if (o instanceof Stmt.CollectedBy c) {
                    requireDeclared(c.variables(), v, sh.span());
                }
            }
            List<dev.contour.print.FormView.Form> forms = null;
            for (Stmt.ShowOption o : sh.options()) {
                if (o instanceof Stmt.InForms in) {
                    forms = forms(eval(in.forms()), in.span());
                }
            }
            if (!options.checksOnly()) {
                options.out().print(display.show(sh, v, context(), forms));
            }
            if (listener != null && fileDepth == 0) {
                String latex = new Display(OutputFormat.LATEX).show(sh, v, context(), forms);
                latex = latex.startsWith("% ") ? latex.substring(latex.indexOf('\n') + 1) : latex;
                listener.accept(new StatementEvent(s, context(), v, new Display(OutputFormat.PLAIN).show(sh, v, context(), forms),
                        latex, null, System.nanoTime() - started));
            }
            if (showWatcher != null) {
                showWatcher.shown(context() + sh.label(), Display.plain(v, false), Display.latex(v, false));
            }
        } else if (s instanceof Stmt.Check c) {
            Value left = eval(c.left());
            Value right = eval(c.right());
            CheckOutcome outcome = CheckOutcome.compare(left, right, c.span(), options.limits());
            if (outcome.holds()) {
                passed++;
            } else {
                failed++;
            }
            options.out().print(display.check(c, outcome, options.checksOnly(), context()));
            if (listener != null && fileDepth == 0) {
                listener.accept(new StatementEvent(s, context(), null, new Display(OutputFormat.PLAIN).check(c, outcome, false, context()),
                        "", outcome.holds(), System.nanoTime() - started));
            }
        } else if (s instanceof Stmt.For f) {
            Value range = eval(f.range());
            List<Value> members = members(range, f.range().span(), "a 'for' loop");
            Map<String, Value> frame = new HashMap<>();
            frames.push(frame);
            loopContext.add("");
            // a loop over long work (solves, say) says where it is: in place on a terminal, as occasional lines in a log
            ProgressLine progress = ProgressLine.standardError();
            int done = 0;
            try {
                for (Value m : members) {
                    String current = f.variable() + " = " + Display.plain(m, false);
                    String count = " (" + ++done + " of " + members.size() + ")";
                    progress.update(() -> "for " + current + count);
                    loopContext.set(loopContext.size() - 1, current);
                    if (++loopIterations > options.limits().maxLoopIterations()) {
                        throw new ContourException("more than " + options.limits().maxLoopIterations()
                                + " loop iterations in one run", f.span());
                    }
                    frame.put(f.variable(), m);
                    for (Stmt body : f.body()) {
                        execute(body);
                    }
                }
            } finally {
                progress.close();
                frames.pop();
                loopContext.remove(loopContext.size() - 1);
            }
        } else if (s instanceof Stmt.Rule r) {
            registry.ruleSink(r.span()).accept(r);
        } else if (s instanceof Stmt.Derive d) {
            narrowToWithinClause(d.limits());
            RuleReport report = registry.ruleSink(d.span()).derive(d, ruleContext);
            if (!options.checksOnly()) {
                options.out().print(report.detail());
            }
        } else if (s instanceof Stmt.CheckByRules c) {
            narrowToWithinClause(c.limits());
            RuleReport report = registry.ruleSink(c.span()).prove(c, ruleContext);
            if (report.holds()) {
                passed++;
            } else {
                failed++;
            }
            options.out().print(options.checksOnly() ? report.summary() : report.detail());
        } else {
            throw new IllegalStateException("interpreter: unhandled statement " + s.getClass().getSimpleName());
        }
    }

    /** The named forms of {@code show ... in X}: a measure's, or pairs {name, linear form} such as {{u, -s - t}}. */
    private List<dev.contour.print.FormView.Form> forms(Value v, Span span) {
        if (v instanceof FormsValue f) {
            return f.forms();
        }
        if (v instanceof ListValue l) {
            List<Value> pairs = l.items().size() == 2 && !(l.items().get(0) instanceof ListValue) ? List.of(l) : l.items();
            List<dev.contour.print.FormView.Form> out = new ArrayList<>();
            java.util.Set<String> plainVariables = new java.util.TreeSet<>();
            for (Value p : pairs) {
                if (!(p instanceof ListValue pair) || pair.items().size() != 2 || !(pair.items().get(0) instanceof ExprValue name)
                        || !(pair.items().get(1) instanceof ExprValue form) || !name.value().isRational()
                        || name.value().innerVariables().size() != 1 || !form.value().isRational()
                        || !form.value().asRationalFunction().isPolynomial()
                        || form.value().asRationalFunction().numerator().totalDegree() != 1) {
                    throw new ContourException("'in' takes a measure or pairs {name, linear form} such as {u, -s - t}", span);
                }
                String n = name.value().innerVariables().first();
                dev.contour.algebra.Polynomial value = form.value().asRationalFunction().numerator();
                plainVariables.addAll(value.variables());
                out.add(new dev.contour.print.FormView.Form(n, value));
            }
            for (String x : plainVariables) {
                out.add(0, new dev.contour.print.FormView.Form(x, dev.contour.algebra.Polynomial.variable(x)));
            }
            return out;
        }
        throw new ContourException("'in' takes a measure (its s, t and eliminated variable) or pairs {name, linear form}, not "
                + Values.describe(v), span);
    }

    /** A derivation's 'within N seconds' bounds the whole statement, normalising and printing included. */
    private void narrowToWithinClause(List<Stmt.RewriteLimit> limits) {
        if (budget == null) {
            return;
        }
        for (Stmt.RewriteLimit w : limits) {
            if (w.unit().equals("seconds") || w.unit().equals("second")) {
                budget.narrow(java.time.Duration.ofSeconds(Math.min(w.amount(), 86_400)),
                        "'within " + w.amount() + " " + w.unit() + "' at " + w.span());
            }
        }
    }

    private String context() {
        return loopContext.isEmpty() ? "" : "[" + String.join(", ", loopContext) + "] ";
    }

    /** Every name to collect by is a declared variable (or one of the value's own), else an error with a suggestion. */
    private void requireDeclared(List<String> names, Value v, Span span) {
        java.util.Set<String> own = new java.util.HashSet<>();
        if (v instanceof ExprValue e) {
            own.addAll(e.value().innerVariables());
            own.addAll(e.value().collectedVariables());
        }
        for (String n : names) {
            if (!variables.containsKey(n) && !own.contains(n)) {
                String near = Suggestions.nearest(n, variables.keySet());
                throw new ContourException("'" + n + "' is not a declared variable, so nothing can be collected by it"
                        + (near == null ? "" : "; did you mean '" + near + "'?"), span);
            }
        }
    }

    private void declareVariable(String name, boolean collected, Span span) {
        Boolean existing = variables.get(name);
        if (existing != null) {
            if (existing != collected) {
                throw new ContourException("'" + name + "' is already declared as " + (existing ? "a collected" : "an inner")
                        + " variable", span);
            }
            return;
        }
        checkFreeName(name, span, false);
        variables.put(name, collected);
        globals.put(name, new ExprValue(collected ? Expression.collectedVariable(name) : Expression.variable(name)));
    }

    /** Rejects names that would hide a variable, a built-in or an unknown family. */
    private void checkFreeName(String name, Span span, boolean rebindable) {
        if (registry.lookup(name).isPresent()) {
            throw new ContourException("'" + name + "' is a built-in function; pick another name", span);
        }
        if (variables.containsKey(name)) {
            throw new ContourException("'" + name + "' is already a variable; pick another name", span);
        }
        Value existing = globals.get(name);
        if (existing instanceof UnknownFamilyValue) {
            throw new ContourException("'" + name + "' is already an unknown family; pick another name", span);
        }
        if (existing != null && !rebindable) {
            throw new ContourException("'" + name + "' is already defined; pick another name", span);
        }
    }

    private void declareUnknowns(Stmt.Unknown u) {
        // the same statement run again (the next iteration of a loop) declares its family afresh,
        // so a sweep can size its unknowns by the loop variable
        if (!(globals.get(u.name()) instanceof UnknownFamilyValue && unknownDeclaredBy.get(u.name()) == u)) {
            checkFreeName(u.name(), u.span(), false);
        }
        unknownDeclaredBy.put(u.name(), u);
        List<long[]> tuples = enumerate(u.indices());
        List<List<Integer>> members = new ArrayList<>();
        for (long[] t : tuples) {
            List<Integer> m = new ArrayList<>();
            for (long x : t) {
                m.add(Math.toIntExact(x));
            }
            members.add(m);
        }
        String description = u.name() + "[" + String.join(", ", u.indices().names()) + "]"
                + (u.source().contains(" with ") ? " with " + u.source().substring(u.source().indexOf(" with ") + 6) : "");
        globals.put(u.name(), new UnknownFamilyValue(u.name(), u.indices().names(), members, description));
    }

    private void use(Stmt.Use u) {
        Path file = resolve(u.path(), u.span());
        Path key = file.toAbsolutePath().normalize();
        int open = loading.indexOf(key);
        if (open >= 0) {
            List<String> chain = new ArrayList<>();
            for (Path p : loading.subList(open, loading.size())) {
                chain.add(String.valueOf(p.getFileName()));
            }
            chain.add(String.valueOf(key.getFileName()));
            throw new ContourException("'use' cycle: " + (chain.size() == 2 ? chain.get(0) + " uses itself"
                    : String.join(" uses ", chain.subList(0, 2)) + chain.subList(2, chain.size()).stream()
                            .map(n -> ", which uses " + n).reduce("", String::concat))
                    + " (a file cannot load a file that is still loading it; move what both need into a third file)", u.span());
        }
        if (!used.add(key)) {
            return; // each library loads once per session
        }
        String text;
        try {
            text = dev.contour.lang.SourceFiles.read(file);
        } catch (ContourException e) {
            throw new ContourException(e.getMessage() + " (read by 'use' at " + u.span() + ")", e.span());
        } catch (IOException e) {
            throw new ContourException("cannot read '" + file + "': " + e.getMessage(), u.span());
        }
        libraryDigests.put(key, sha256(text));
        Path savedDirectory = directory;
        Deque<Map<String, Value>> savedFrames = frames;
        fileDepth++;
        loading.add(key);
        try {
            directory = file.toAbsolutePath().getParent();
            frames = new ArrayDeque<>();
            for (Stmt s : ScriptParser.parseScript(text, file.toString())) {
                execute(s);
            }
        } finally {
            fileDepth--;
            directory = savedDirectory;
            frames = savedFrames;
            loading.remove(loading.size() - 1);
        }
    }

    /**
     * Every library file this session loaded with {@code use}, each with the SHA-256 (hex) of the
     * text it read: a sweep records them, so a record made with a library that changed since is
     * never mistaken for a current one.
     */
    public Map<Path, String> libraryDigests() {
        return java.util.Collections.unmodifiableMap(new LinkedHashMap<>(libraryDigests));
    }

    /** SHA-256 of a text's UTF-8 bytes, in lower-case hex. */
    public static String sha256(String text) {
        try {
            return java.util.HexFormat.of().formatHex(java.security.MessageDigest.getInstance("SHA-256")
                    .digest(text.getBytes(java.nio.charset.StandardCharsets.UTF_8)));
        } catch (java.security.NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is part of every Java runtime", e);
        }
    }

    /** The digest {@link #libraryDigests} would record for this file if a session loaded it now. */
    public static String libraryDigest(Path file) throws IOException {
        return sha256(dev.contour.lang.SourceFiles.read(file));
    }

    private Path resolve(String name, Span span) {
        List<Path> tried = new ArrayList<>();
        Path given = Path.of(name);
        if (given.isAbsolute()) {
            tried.add(given);
        } else {
            if (directory != null) {
                tried.add(directory.resolve(name));
            }
            tried.add(options.rulesDirectory().resolve(name));
            if (name.startsWith("rules/")) {
                tried.add(options.rulesDirectory().resolve(name.substring(6)));
            }
            for (Path library : InterpreterOptions.libraryDirectories()) {
                tried.add(library.resolve(name));
            }
        }
        for (Path p : tried) {
            if (Files.isRegularFile(p)) {
                return p;
            }
        }
        throw new ContourException("cannot find '" + name + "' (looked in " + String.join(", ",
                tried.stream().map(p -> p.getParent() == null ? "." : p.getParent().toString()).distinct().toList()) + ")", span);
    }

    /** The script's own file, when the name is a file on disk (not {@code <repl>} or a test's label). */
    private static Path fileOf(String fileName) {
        if (fileName == null) {
            return null;
        }
        try {
            Path p = Path.of(fileName).toAbsolutePath().normalize();
            return Files.isRegularFile(p) ? p : null;
        } catch (RuntimeException e) {
            return null;
        }
    }

    private static Path directoryOf(String fileName) {
        if (fileName == null) {
            return null;
        }
        try {
            Path p = Path.of(fileName).toAbsolutePath();
            return Files.isRegularFile(p) ? p.getParent() : Path.of("").toAbsolutePath();
        } catch (RuntimeException e) {
            return Path.of("").toAbsolutePath();
        }
    }

    // ================================================================ expressions

    Value eval(Expr e) {
        try {
            return evalUnlocated(e);
        } catch (ContourException x) {
            throw x.at(e.span());
        } catch (ArithmeticException x) {
            // Exact arithmetic checks its machine-word counters (exponents, multiplicities, sizes):
            // an overflow there is a value too large to represent, reported where it arose.
            throw new ContourException("integer overflow: a power, multiplicity or count beyond " + Integer.MAX_VALUE
                    + " while evaluating this", e.span());
        }
    }

    private Value evalUnlocated(Expr e) {
        if (e instanceof Expr.Number n) {
            // Small integer literals (2 in 2*k, evaluated once per term of a sum) share one value.
            if (n.denominator().equals(java.math.BigInteger.ONE) && n.numerator().bitLength() < 31) {
                return Values.of(n.numerator().intValue());
            }
            return new ExprValue(Expression.constant(Rational.of(n.numerator(), n.denominator())));
        }
        if (e instanceof Expr.Name n) {
            return name(n);
        }
        if (e instanceof Expr.Binary b) {
            if (b.operator() == Expr.Operator.DIVIDE && isProduct(b.right())) {
                return divideByFactors(eval(b.left()), b);
            }
            if (isAdditive(b) && isAdditive(b.left())) {
                return additiveChain(b);
            }
            if (isMultiplicative(b) && isMultiplicative(b.left())) {
                return multiplicativeChain(b);
            }
            return Arithmetic.binary(b.operator(), eval(b.left()), eval(b.right()), b.span(), options.limits());
        }
        if (e instanceof Expr.Negate n) {
            return Arithmetic.negate(eval(n.operand()), n.span());
        }
        if (e instanceof Expr.Call c) {
            return call(c);
        }
        if (e instanceof Expr.Index i) {
            return index(i);
        }
        if (e instanceof Expr.Factorial f) {
            return CoreBuiltins.symbolic(Terms.FACTORIAL, List.of(eval(f.operand())), f.span());
        }
        if (e instanceof Expr.Sum s) {
            return sum(s);
        }
        if (e instanceof Expr.At a) {
            return at(a);
        }
        if (e instanceof Expr.With w) {
            return with(w);
        }
        if (e instanceof Expr.Range r) {
            return range(r);
        }
        if (e instanceof Expr.ListOf l) {
            List<Value> items = new ArrayList<>();
            for (Expr x : l.items()) {
                Value v = eval(x);
                if (v instanceof RangeValue r) {
                    items.addAll(members(r, x.span(), "a list"));
                } else {
                    items.add(v);
                }
                if (items.size() > options.limits().maxSetSize()) {
                    throw new ContourException("the list has more than " + options.limits().maxSetSize() + " items", l.span());
                }
            }
            return new ListValue(items);
        }
        if (e instanceof Expr.Text t) {
            return new StringValue(t.value());
        }
        if (e instanceof Expr.Solve s) {
            return solve(s);
        }
        if (e instanceof Expr.PatternVariable v) {
            throw new ContourException("pattern variables such as '@" + v.name() + "' belong in rules", v.span());
        }
        throw new IllegalStateException("interpreter: unhandled expression " + e.getClass().getSimpleName());
    }

    private static boolean isAdditive(Expr e) {
        return e instanceof Expr.Binary b && (b.operator() == Expr.Operator.ADD || b.operator() == Expr.Operator.SUBTRACT);
    }

    /**
     * A chain {@code x0 +- x1 +- x2 ...} (index arithmetic such as {@code s - 2*p + 2 + 2*k}),
     * evaluated and combined left to right as always, except that numbers met after an expression
     * are held back and added in one step, so the symbolic part takes one addition instead of one
     * per number. Exact addition is associative and values are canonical, so every value (and every
     * error, met at the same step with the same left operand) is that of the plain evaluation.
     */
    private Value additiveChain(Expr.Binary chain) {
        List<Expr.Binary> nodes = new ArrayList<>();
        Expr e = chain;
        while (isAdditive(e)) {
            nodes.add((Expr.Binary) e);
            e = ((Expr.Binary) e).left();
        }
        Collections.reverse(nodes); // innermost first: the order of evaluation and of combination
        Value acc = eval(e);
        Rational pending = Rational.ZERO;
        for (Expr.Binary node : nodes) {
            Value v = eval(node.right());
            boolean minus = node.operator() == Expr.Operator.SUBTRACT;
            if (acc instanceof ExprValue && v instanceof ExprValue x && x.value().isConstant()) {
                pending = minus ? pending.subtract(x.value().constantValue()) : pending.add(x.value().constantValue());
                continue;
            }
            acc = flush(acc, pending);
            pending = Rational.ZERO;
            try {
                acc = Arithmetic.binary(node.operator(), acc, v, node.span(), options.limits());
            } catch (ContourException x) {
                throw x.at(node.span());
            }
        }
        return flush(acc, pending);
    }

    /** An expression plus held-back numbers (a number has no names, so this cannot fail). */
    private static Value flush(Value acc, Rational pending) {
        if (pending.isZero()) {
            return acc;
        }
        Expression a = ((ExprValue) acc).value();
        return new ExprValue(a.isConstant() ? Values.constant(a.constantValue().add(pending)) : a.add(Values.constant(pending)));
    }

    private static boolean isMultiplicative(Expr e) {
        return e instanceof Expr.Binary b && (b.operator() == Expr.Operator.MULTIPLY || b.operator() == Expr.Operator.DIVIDE);
    }

    /**
     * A chain {@code x0 * x1 / x2 * ...} evaluated left to right with a loop instead of one level
     * of recursion per factor, so a product of any length does not deepen the stack; each step is
     * the one the plain evaluation takes (the same values, the same error locations).
     */
    private Value multiplicativeChain(Expr.Binary chain) {
        List<Expr.Binary> nodes = new ArrayList<>();
        Expr e = chain;
        while (isMultiplicative(e)) {
            nodes.add((Expr.Binary) e);
            e = ((Expr.Binary) e).left();
        }
        Collections.reverse(nodes);
        Value acc = eval(e);
        for (Expr.Binary node : nodes) {
            try {
                if (node.operator() == Expr.Operator.DIVIDE && isProduct(node.right())) {
                    acc = divideByFactors(acc, node);
                } else {
                    acc = Arithmetic.binary(node.operator(), acc, eval(node.right()), node.span(), options.limits());
                }
            } catch (ContourException x) {
                throw x.at(node.span());
            }
        }
        return acc;
    }

    private static boolean isProduct(Expr e) {
        return e instanceof Expr.Binary b && b.operator() == Expr.Operator.MULTIPLY;
    }

    /**
     * {@code a / (f1 * f2 * ...)} divides by one factor at a time: the same exact value, but each
     * step divides by a small (often linear) factor the canonical form keeps as it is, instead of
     * multiplying the factors out and having to factor the product again.
     */
    private Value divideByFactors(Value dividend, Expr.Binary division) {
        List<Expr> factors = new ArrayList<>();
        flattenProduct(division.right(), factors);
        List<Value> values = new ArrayList<>();
        for (Expr f : factors) {
            values.add(eval(f));
        }
        Value result = dividend;
        if (dividend instanceof ExprValue d) {
            RationalFunction inverse = inverseOfFactors(values, d.value());
            if (inverse != null) {
                return new ExprValue(d.value().multiply(inverse));
            }
        }
        if (values.stream().allMatch(v -> v instanceof ExprValue)) {
            for (Value v : values) {
                result = Arithmetic.binary(Expr.Operator.DIVIDE, result, v, division.span(), options.limits());
            }
            return result;
        }
        Value divisor = values.get(0);
        for (int i = 1; i < values.size(); i++) {
            divisor = Arithmetic.binary(Expr.Operator.MULTIPLY, divisor, values.get(i), division.right().span(), options.limits());
        }
        return Arithmetic.binary(Expr.Operator.DIVIDE, result, divisor, division.span(), options.limits());
    }

    /**
     * 1/(f1 * f2 * ...) as one factored function when every factor is a non-zero value free of
     * collected variables and of the dividend's collected names (so no expansion rule applies);
     * else null. The dividend is then scaled once instead of once per factor.
     */
    private static RationalFunction inverseOfFactors(List<Value> factors, Expression dividend) {
        RationalFunction inverse = RationalFunction.ONE;
        // A large dividend's set of names is worth building (and is kept); a small one is scanned.
        java.util.function.Predicate<String> collected = dividend.terms().size() > 8
                ? dividend.collectedVariables()::contains : dividend::collects;
        for (Value v : factors) {
            if (!(v instanceof ExprValue e) || !e.value().isRational() || e.value().isZero()) {
                return null;
            }
            RationalFunction f = e.value().asRationalFunction();
            if (f.mentionsAny(collected)) {
                return null;
            }
            inverse = inverse.divide(f);
        }
        return inverse;
    }

    /** The factors of a product in order, walking its left spine with a loop (a long product must not recurse). */
    private static void flattenProduct(Expr e, List<Expr> out) {
        List<Expr> rights = new ArrayList<>();
        while (isProduct(e)) {
            rights.add(((Expr.Binary) e).right());
            e = ((Expr.Binary) e).left();
        }
        out.add(e);
        for (int i = rights.size() - 1; i >= 0; i--) {
            Expr r = rights.get(i);
            if (isProduct(r)) {
                flattenProduct(r, out); // a parenthesised product on the right: one level per pair of brackets
            } else {
                out.add(r);
            }
        }
    }

    private Value name(Expr.Name n) {
        for (Map<String, Value> frame : frames) {
            Value v = frame.get(n.name());
            if (v != null) {
                return v;
            }
        }
        Value v = globals.get(n.name());
        if (v != null) {
            return v;
        }
        Builtin b = registry.lookup(n.name()).orElse(null);
        if (b != null) {
            return b;
        }
        Set<String> candidates = new TreeSet<>(namesInScope());
        for (Map<String, Value> frame : frames) {
            candidates.addAll(frame.keySet());
        }
        String near = Suggestions.nearest(n.name(), candidates);
        throw new ContourException("unknown name '" + n.name() + "'" + (near == null ? "" : "; did you mean '" + near + "'?")
                + (near == null && n.name().length() <= 3 ? " (declare variables with 'vars " + n.name() + "')" : ""), n.span());
    }

    private Value call(Expr.Call c) {
        Value callee = eval(c.callee());
        tick(c.span());
        if (callee instanceof FunctionValue f) {
            return callUser(f, c);
        }
        if (!(callee instanceof CallableValue callable)) {
            throw new ContourException(Values.describe(callee) + " cannot be called", c.callee().span());
        }
        List<Arguments.Argument> args = new ArrayList<>();
        for (Expr.Argument a : c.arguments()) {
            args.add(new Arguments.Argument(a.kind(), a.name(), eval(a.value()), a.span()));
        }
        String name = callee instanceof Builtin b ? b.name() : c.callee() instanceof Expr.Name n ? n.name() : "the call";
        if (callee instanceof Builtin b && b.takesVariableNames()) {
            for (Arguments.Argument a : args) {
                if (a.name() != null && a.kind() == Expr.ArgumentKind.NAMED && !variables.containsKey(a.name())
                        && !b.namedArguments().contains(a.name())) {
                    throw new ContourException(name + ": '" + a.name() + "' is not a declared variable"
                            + " (declare it with 'vars " + a.name() + "')", a.span());
                }
            }
        }
        try {
            return callable.call(new Arguments(name, args), c.span());
        } catch (ContourException x) {
            throw x.at(c.span());
        }
    }

    private Value callUser(FunctionValue f, Expr.Call c) {
        if (c.arguments().size() != f.parameters().size()) {
            throw new ContourException(f.name() + " takes " + f.parameters().size() + " argument"
                    + (f.parameters().size() == 1 ? "" : "s") + ", not " + c.arguments().size(), c.span());
        }
        Map<String, Value> frame = new HashMap<>();
        for (int i = 0; i < f.parameters().size(); i++) {
            Expr.Argument a = c.arguments().get(i);
            if (a.kind() != Expr.ArgumentKind.POSITIONAL) {
                throw new ContourException(f.name() + " takes positional arguments only", a.span());
            }
            frame.put(f.parameters().get(i), eval(a.value()));
        }
        if (++callDepth > options.limits().maxCallDepth()) {
            throw new ContourException("calls nest more than " + options.limits().maxCallDepth()
                    + " deep (is '" + f.name() + "' recursive?)", c.span());
        }
        Deque<Map<String, Value>> saved = frames;
        frames = new ArrayDeque<>();
        if (!f.captured().isEmpty()) {
            frames.push(f.captured());
        }
        frames.push(frame);
        try {
            return eval(f.body());
        } catch (CallerError e) {
            // a library's complaint about its input belongs at the call the user wrote
            throw e.relocated(c.span());
        } finally {
            frames = saved;
            callDepth--;
        }
    }

    private Value index(Expr.Index i) {
        Value base = eval(i.base());
        if (!(base instanceof UnknownFamilyValue family)) {
            throw new ContourException("only unknown families can be indexed, and this is " + Values.describe(base), i.base().span());
        }
        List<Integer> indices = new ArrayList<>();
        for (Expr x : i.indices()) {
            indices.add(Values.integer(eval(x), x.span(), "an index"));
        }
        return new ExprValue(family.member(indices, i.span()));
    }

    private Value range(Expr.Range r) {
        long from = Values.integer(eval(r.from()), r.from().span(), "the start of a range");
        long to = Values.integer(eval(r.to()), r.to().span(), "the end of a range");
        long step = r.step() == null ? 1 : Values.integer(eval(r.step()), r.step().span(), "the step of a range");
        if (step == 0) {
            throw new ContourException("a range's step cannot be 0", r.step().span());
        }
        return new RangeValue(from, to, step);
    }

    /** The members of a range or list, for loops and index domains. */
    private List<Value> members(Value v, Span span, String where) {
        if (v instanceof RangeValue r) {
            if (r.size() > options.limits().maxSetSize()) {
                throw new ContourException("the range has " + r.size() + " members, past the limit of "
                        + options.limits().maxSetSize(), span);
            }
            List<Value> out = new ArrayList<>();
            for (long m : r.members()) {
                if ((out.size() & 1023) == 0) {
                    tick(span);
                }
                out.add(Values.of(m));
            }
            return out;
        }
        if (v instanceof ListValue l) {
            return l.items();
        }
        throw new ContourException(where + " needs a range or a list, not " + Values.describe(v), span);
    }

    private Value sum(Expr.Sum s) {
        List<long[]> tuples = enumerate(s.indices());
        List<String> names = s.indices().names();
        Map<String, Value> frame = new HashMap<>();
        frames.push(frame);
        try {
            Accumulator acc = new Accumulator(s.span(), options.limits());
            for (long[] t : tuples) {
                tick(s.span());
                for (int i = 0; i < names.size(); i++) {
                    frame.put(names.get(i), Values.of(t[i]));
                }
                acc.add(eval(s.body()));
            }
            return acc.result();
        } finally {
            frames.pop();
        }
    }

    /** The tuples of an index set, evaluating domains and constraint sides in the current scope. */
    private List<long[]> enumerate(IndexSet set) {
        List<List<Long>> domains = new ArrayList<>();
        for (IndexSet.Binder b : set.binders()) {
            if (b.range() == null) {
                domains.add(null);
                continue;
            }
            List<Long> d = new ArrayList<>();
            for (Value m : members(eval(b.range()), b.range().span(), "an index domain")) {
                d.add((long) Values.integer(m, b.range().span(), "an index value"));
            }
            domains.add(d.stream().distinct().sorted().toList());
        }
        List<IndexSetEnumeration.Probe[]> sides = new ArrayList<>();
        List<String> names = set.names();
        for (IndexSet.Constraint c : set.constraints()) {
            sides.add(new IndexSetEnumeration.Probe[] {probe(c.left(), names), probe(c.right(), names)});
        }
        try {
            return new IndexSetEnumeration(set, domains, sides, options.limits().maxSetSize()).enumerate();
        } catch (ContourException e) {
            throw e.at(set.span());
        }
    }

    private IndexSetEnumeration.Probe probe(Expr side, List<String> names) {
        return point -> {
            Map<String, Value> frame = new HashMap<>();
            for (int i = 0; i < names.size(); i++) {
                frame.put(names.get(i), Values.of(point[i]));
            }
            frames.push(frame);
            try {
                Value v = eval(side);
                if (!(v instanceof ExprValue x) || !x.value().isConstant()) {
                    throw new ContourException("index constraints may involve only numbers and the indices, not "
                            + Values.describe(v), side.span());
                }
                return x.value().constantValue();
            } finally {
                frames.pop();
            }
        };
    }

    private Value at(Expr.At a) {
        Value target = eval(a.target());
        Map<String, Expression> values = new LinkedHashMap<>();
        boolean linear = true;
        for (Expr.Assignment x : a.assignments()) {
            String name = targetName(x.target());
            Value v = eval(x.value());
            if (!(v instanceof ExprValue ev)) {
                throw new ContourException("only rational expressions can be substituted, not " + Values.describe(v), x.value().span());
            }
            if (values.put(name, ev.value()) != null) {
                throw new ContourException("'" + name + "' is substituted twice", x.span());
            }
            linear &= Boolean.FALSE.equals(variables.get(name)) && isLinearInner(ev.value());
        }
        try {
            if (target instanceof ExprValue e) {
                if (linear) {
                    Map<String, dev.contour.algebra.Polynomial> polys = new LinkedHashMap<>();
                    values.forEach((k, v) -> polys.put(k, v.asRationalFunction().numerator()));
                    return new ExprValue(e.value().substituteLinear(polys));
                }
                return new ExprValue(e.value().substitute(values));
            }
            if (target instanceof TermValue t) {
                return Arithmetic.fromTerm(Terms.substitute(t.value(), values));
            }
            if (target instanceof SubstitutableValue sv) {
                return sv.substitute(values, a.span());
            }
        } catch (ContourException x) {
            throw x.at(a.span());
        }
        throw new ContourException("cannot substitute into " + Values.describe(target), a.target().span());
    }

    private static boolean isLinearInner(Expression e) {
        if (!e.isRational() || !e.collectedVariables().isEmpty()) {
            return false;
        }
        var f = e.asRationalFunction();
        return f.isPolynomial() && f.numerator().totalDegree() <= 1;
    }

    /** The variable name a substitution target stands for. */
    private String targetName(Expr.Target t) {
        Value v = name(new Expr.Name(t.name(), t.span()));
        if (t.indices().isEmpty()) {
            if (!variables.containsKey(t.name())) {
                throw new ContourException("'" + t.name() + "' is not a variable, so it cannot be substituted", t.span());
            }
            return t.name();
        }
        if (!(v instanceof UnknownFamilyValue family)) {
            throw new ContourException("'" + t.name() + "' is not an unknown family", t.span());
        }
        List<Integer> indices = new ArrayList<>();
        for (Expr x : t.indices()) {
            indices.add(Values.integer(eval(x), x.span(), "an index"));
        }
        family.member(indices, t.span());
        return UnknownFamilyValue.memberName(t.name(), indices);
    }

    private Value with(Expr.With w) {
        Value target = eval(w.target());
        Value binding = eval(w.solution());
        if (!(binding instanceof BindingValue b)) {
            throw new ContourException("'with' needs a solution, not " + Values.describe(binding), w.solution().span());
        }
        if (w.normalizedTarget() != null) {
            String member = targetName(w.normalizedTarget());
            b = b.normalizedFor(target, Expression.collectedVariable(member), eval(w.normalizedValue()), w.normalizedTarget().span());
        }
        return b.applyTo(target, w.span());
    }

    private Value solve(Expr.Solve s) {
        List<Solver.Condition> conditions = new ArrayList<>();
        for (Expr.Condition c : s.conditions()) {
            conditions.add(new Solver.Condition(eval(c.left()), c.right() == null ? null : eval(c.right()), c.span()));
        }
        List<UnknownFamilyValue> unknowns = new ArrayList<>();
        for (String u : s.unknowns()) {
            Value v = name(new Expr.Name(u, s.span()));
            if (!(v instanceof UnknownFamilyValue f)) {
                throw new ContourException("'" + u + "' is not an unknown family", s.span());
            }
            unknowns.add(f);
        }
        return registry.solver(s.span()).solve(conditions, unknowns, s.span());
    }

    private void tick(Span span) {
        // An interrupt (the REPL's Ctrl-C) or a passed time limit stops the run here and in every long loop below.
        try {
            Cancellation.check();
        } catch (Cancellation.Stop stop) {
            throw stop.at(span);
        }
    }

    /**
     * The running sum of one monomial's coefficients, kept as a stack of partial sums of
     * power-of-two sizes (a binary counter): adding term n merges only as many partial sums as n has
     * trailing one bits, so N terms cost N log N term copies, where adding each to one growing sum
     * cost N^2 (32,640 terms s^i*t^j took minutes).
     */
    private static final class PartialSums {
        private final List<RationalFunction> sums = new ArrayList<>();
        private final List<Integer> sizes = new ArrayList<>();

        void push(RationalFunction c) {
            sums.add(c);
            sizes.add(1);
            int top = sums.size() - 1;
            while (top > 0 && sizes.get(top) >= sizes.get(top - 1)) {
                dev.contour.Cancellation.check();
                sums.set(top - 1, sums.get(top - 1).add(sums.remove(top)));
                sizes.set(top - 1, sizes.get(top - 1) + sizes.remove(top));
                top--;
            }
        }

        RationalFunction total() {
            RationalFunction t = RationalFunction.ZERO;
            for (int i = sums.size() - 1; i >= 0; i--) {
                t = sums.get(i).add(t);
            }
            return t;
        }
    }

    /** Sums values: expressions merge coefficient maps in place; anything else adds pairwise. */
    private static final class Accumulator {
        private final Span span;
        private final EvaluationLimits limits;
        /** In the order first met, which Expression.of sorts cheaply (sums run through their monomials in long ascending runs). */
        private final Map<dev.contour.algebra.Monomial, PartialSums> terms = new LinkedHashMap<>();
        private final List<Term> symbolic = new ArrayList<>();
        private Value other;

        Accumulator(Span span, EvaluationLimits limits) {
            this.span = span;
            this.limits = limits;
        }

        void add(Value v) {
            if (v instanceof ExprValue e) {
                e.value().terms().forEach((m, c) -> terms.computeIfAbsent(m, x -> new PartialSums()).push(c));
            } else if (v instanceof TermValue t) {
                symbolic.add(t.value());
            } else {
                other = other == null ? v : Arithmetic.binary(Expr.Operator.ADD, other, v, span, limits);
            }
        }

        Value result() {
            Map<dev.contour.algebra.Monomial, RationalFunction> sums = new LinkedHashMap<>();
            terms.forEach((m, partial) -> {
                RationalFunction c = partial.total();
                if (!c.isZero()) {
                    sums.put(m, c);
                }
            });
            Value rational = new ExprValue(Expression.of(sums));
            Value result = rational;
            if (!symbolic.isEmpty()) {
                List<Term> all = new ArrayList<>(symbolic);
                all.add(Terms.of(((ExprValue) rational).value()));
                result = Arithmetic.fromTerm(new Term.Sum(all));
            }
            return other == null ? result : Arithmetic.binary(Expr.Operator.ADD, other, result, span, limits);
        }
    }
}
