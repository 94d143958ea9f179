package dev.contour.lang;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.lang.gen.ContourLexer;
import dev.contour.lang.gen.ContourParser;
import dev.contour.lang.gen.ContourParser.*;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import org.antlr.v4.runtime.CharStreams;
import org.antlr.v4.runtime.CommonTokenStream;
import org.antlr.v4.runtime.ParserRuleContext;
import org.antlr.v4.runtime.Token;
import org.antlr.v4.runtime.atn.PredictionMode;
import org.antlr.v4.runtime.misc.Interval;
import org.antlr.v4.runtime.tree.TerminalNode;

/**
 * The parse adapter: the only code that touches the generated parser. It turns source text into
 * immutable AST records with spans, and fails loudly on a grammar alternative it does not handle.
 */
public final class ScriptParser {
    private final String file;

    private ScriptParser(String file) {
        this.file = file == null ? "<input>" : file;
    }

    /** Parses a whole script; syntax errors are located {@link ContourException}s. */
    public static List<Stmt> parseScript(String text, String file) {
        ScriptParser adapter = new ScriptParser(file);
        ScriptContext tree = adapter.twoStage(SourceFiles.withoutByteOrderMark(text), ContourParser::script);
        List<Stmt> out = new ArrayList<>();
        for (StatementContext s : tree.statement()) {
            adapter.statement(s, out);
        }
        return List.copyOf(out);
    }

    /** Parses one expression (the whole text must be one expression). */
    public static Expr parseExpression(String text, String file) {
        ScriptParser adapter = new ScriptParser(file);
        return adapter.expr(adapter.twoStage(text, ContourParser::singleExpression).expr());
    }

    /** Parses one statement (the whole text must be one statement; an empty one gives an empty list). */
    public static List<Stmt> parseStatement(String text, String file) {
        ScriptParser adapter = new ScriptParser(file);
        List<Stmt> out = new ArrayList<>();
        adapter.statement(adapter.twoStage(text, ContourParser::singleStatement).statement(), out);
        return List.copyOf(out);
    }

    /**
     * Fast SLL prediction first; only when it fails, full LL (which SLL can wrongly reject), so
     * the reported error is the true one.
     */
    private <T> T twoStage(String text, java.util.function.Function<ContourParser, T> entry) {
        try {
            try {
                return entry.apply(parser(text, PredictionMode.SLL));
            } catch (ContourException sllFailure) {
                return entry.apply(parser(text, PredictionMode.LL));
            }
        } catch (StackOverflowError e) {
            throw new ContourException("the input nests too deeply to parse", new Span(file, 1, 1, 1));
        }
    }

    private ContourParser parser(String text, PredictionMode mode) {
        ContourLexer lexer = new ContourLexer(CharStreams.fromString(text, file));
        lexer.removeErrorListeners();
        ContourParser parser = new ContourParser(new CommonTokenStream(lexer));
        parser.removeErrorListeners();
        parser.setErrorHandler(new SyntaxErrorStrategy(file));
        parser.getInterpreter().setPredictionMode(mode);
        return parser;
    }

    // ---------------------------------------------------------------- statements

    private void statement(StatementContext c, List<Stmt> out) {
        Span span = span(c);
        if (c instanceof VarsStatementContext v) {
            out.add(new Stmt.Vars(names(v.IDENT()), v.COLLECTED() != null, span));
        } else if (c instanceof LetStatementContext l) {
            out.add(new Stmt.Let(l.IDENT().getText(), expr(l.expr()), source(c), span));
        } else if (c instanceof DefStatementContext d) {
            List<String> params = names(d.IDENT().subList(1, d.IDENT().size()));
            out.add(new Stmt.Def(d.IDENT(0).getText(), params, expr(d.expr()), source(c), span));
        } else if (c instanceof UnknownStatementContext u) {
            IndexSet set = indexSet(u.binder(), u.constraints(), span(u));
            out.add(new Stmt.Unknown(u.IDENT().getText(), set, source(c), span));
        } else if (c instanceof UseStatementContext u) {
            out.add(new Stmt.Use(unquote(u.STRING().getSymbol()), span));
        } else if (c instanceof ShowStatementContext s) {
            List<Stmt.ShowOption> options = new ArrayList<>();
            for (ShowOptionContext o : s.showOption()) {
                options.add(showOption(o));
            }
            out.add(new Stmt.Show(expr(s.expr()), source(s.expr()), options, span));
        } else if (c instanceof CheckStatementContext k) {
            out.add(new Stmt.Check(expr(k.expr(0)), expr(k.expr(1)),
                    source(k.expr(0)) + " == " + source(k.expr(1)), span));
        } else if (c instanceof ForStatementContext f) {
            List<Stmt> body = new ArrayList<>();
            for (StatementContext s : f.block().statement()) {
                statement(s, body);
            }
            out.add(new Stmt.For(f.IDENT().getText(), arith(f.arith()), body, span));
        } else if (c instanceof RuleStatementContext r) {
            List<Expr> guards = new ArrayList<>();
            for (int i = 2; i < r.expr().size(); i++) {
                guards.add(expr(r.expr(i)));
            }
            String name = String.join("-", r.ruleName().ruleWord().stream().map(ParserRuleContext::getText).toList());
            out.add(new Stmt.Rule(name, expr(r.expr(0)), expr(r.expr(1)), guards, span));
        } else if (c instanceof DeriveStatementContext d) {
            out.add(new Stmt.Derive(expr(d.expr()), source(d.expr()), ruleFiles(d.usingClause()),
                    rewriteLimits(d.withinClause()), span));
        } else if (c instanceof CheckByRulesStatementContext k) {
            out.add(new Stmt.CheckByRules(expr(k.expr(0)), expr(k.expr(1)), source(k.expr(0)) + " == " + source(k.expr(1)),
                    ruleFiles(k.usingClause()), rewriteLimits(k.withinClause()), span));
        } else if (!(c instanceof EmptyStatementContext)) {
            throw unhandled(c);
        }
    }

    private static List<String> ruleFiles(UsingClauseContext u) {
        return u == null ? List.of() : u.STRING().stream().map(t -> unquote(t.getSymbol())).toList();
    }

    private List<Stmt.RewriteLimit> rewriteLimits(WithinClauseContext w) {
        List<Stmt.RewriteLimit> out = new ArrayList<>();
        if (w != null) {
            for (RewriteLimitContext l : w.rewriteLimit()) {
                Expr.Number n = number(l.NUMBER().getText(), span(l));
                if (!n.denominator().equals(BigInteger.ONE) || n.numerator().bitLength() > 62) {
                    throw new ContourException("a limit is a whole number", span(l.NUMBER().getSymbol()));
                }
                out.add(new Stmt.RewriteLimit(n.numerator().longValue(), l.IDENT().getText(), span(l)));
            }
        }
        return out;
    }

    private Stmt.ShowOption showOption(ShowOptionContext o) {
        if (o instanceof CollectedOptionContext c) {
            return new Stmt.CollectedBy(names(c.IDENT()));
        }
        if (o instanceof FactoredOptionContext) {
            return new Stmt.Factored();
        }
        if (o instanceof FactoredWholeOptionContext w) {
            if (!w.IDENT().getText().equals("whole")) {
                throw new ContourException("after 'factored' only 'whole' may follow (the common factor pulled out), not '"
                        + w.IDENT().getText() + "'", span(w.IDENT().getSymbol()));
            }
            return new Stmt.FactoredWhole();
        }
        if (o instanceof FormsOptionContext f) {
            return new Stmt.InForms(arith(f.arith()), span(f));
        }
        if (o instanceof FormatOptionContext f) {
            String format = f.IDENT().getText();
            if (!List.of("plain", "latex", "json").contains(format)) {
                throw new ContourException("unknown output format '" + format + "': use plain, latex or json", span(f.IDENT().getSymbol()));
            }
            return new Stmt.As(format);
        }
        throw unhandled(o);
    }

    private IndexSet indexSet(List<BinderContext> binders, ConstraintsContext constraints, Span span) {
        List<IndexSet.Binder> bs = new ArrayList<>();
        for (BinderContext b : binders) {
            bs.add(new IndexSet.Binder(b.IDENT().getText(), b.arith() == null ? null : arith(b.arith()), span(b)));
        }
        List<IndexSet.Constraint> cs = new ArrayList<>();
        if (constraints != null) {
            for (ConstraintContext k : constraints.constraint()) {
                IndexSet.Relation rel = switch (k.op.getText()) {
                    case "=" -> IndexSet.Relation.EQUAL;
                    case ">=" -> IndexSet.Relation.AT_LEAST;
                    case "<=" -> IndexSet.Relation.AT_MOST;
                    case ">" -> IndexSet.Relation.GREATER;
                    case "<" -> IndexSet.Relation.LESS;
                    default -> throw unhandled(k);
                };
                cs.add(new IndexSet.Constraint(arith(k.arith(0)), rel, arith(k.arith(1)), span(k)));
            }
        }
        return new IndexSet(bs, cs, span);
    }

    // ---------------------------------------------------------------- expressions

    private Expr expr(ExprContext c) {
        Span span = span(c);
        if (c instanceof ArithExprContext a) {
            return arith(a.arith());
        }
        if (c instanceof AtExprContext a) {
            List<Expr.Assignment> assignments = new ArrayList<>();
            for (AssignmentContext x : a.substitution().assignment()) {
                assignments.add(new Expr.Assignment(target(x.target()), arith(x.arith()), span(x)));
            }
            return new Expr.At(expr(a.expr()), assignments, span);
        }
        if (c instanceof WithExprContext w) {
            boolean normalized = w.target() != null;
            return new Expr.With(expr(w.expr()), arith(w.arith(0)),
                    normalized ? target(w.target()) : null, normalized ? arith(w.arith(1)) : null, span);
        }
        if (c instanceof SumExprContext s) {
            return new Expr.Sum(indexSet(s.binder(), s.constraints(), span), expr(s.expr()), span);
        }
        if (c instanceof SolveExprContext s) {
            List<Expr.Condition> conditions = new ArrayList<>();
            for (ConditionContext k : s.condition()) {
                conditions.add(new Expr.Condition(expr(k.expr(0)), k.expr().size() > 1 ? expr(k.expr(1)) : null, span(k)));
            }
            return new Expr.Solve(conditions, names(s.IDENT()), span);
        }
        throw unhandled(c);
    }

    private Expr.Target target(TargetContext t) {
        List<Expr> indices = new ArrayList<>();
        for (ArithContext a : t.arith()) {
            indices.add(arith(a));
        }
        return new Expr.Target(t.IDENT().getText(), indices, span(t));
    }

    private Expr arith(ArithContext c) {
        Span span = span(c);
        if (c instanceof PrimaryArithContext p) {
            return primary(p.primary());
        }
        if (c instanceof CallArithContext k) {
            List<Expr.Argument> args = new ArrayList<>();
            for (ArgumentContext a : k.argument()) {
                args.add(argument(a));
            }
            return new Expr.Call(arith(k.arith()), args, span);
        }
        if (c instanceof IndexArithContext k) {
            List<Expr> indices = new ArrayList<>();
            for (int i = 1; i < k.arith().size(); i++) {
                indices.add(arith(k.arith(i)));
            }
            return new Expr.Index(arith(k.arith(0)), indices, span);
        }
        if (c instanceof FactorialArithContext f) {
            return new Expr.Factorial(arith(f.arith()), span);
        }
        if (c instanceof PowerArithContext p) {
            return new Expr.Binary(Expr.Operator.POWER, arith(p.arith(0)), arith(p.arith(1)), span);
        }
        if (c instanceof UnaryArithContext u) {
            Expr operand = arith(u.arith());
            return u.op.getText().equals("-") ? new Expr.Negate(operand, span) : operand;
        }
        if (c instanceof ProductArithContext || c instanceof SumArithContext) {
            return chain(c);
        }
        if (c instanceof RangeArithContext r) {
            return new Expr.Range(arith(r.arith(0)), arith(r.arith(1)), r.arith().size() > 2 ? arith(r.arith(2)) : null, span);
        }
        throw unhandled(c);
    }

    /**
     * A run of sums (or of products) such as {@code s + s + ... + s}: the parse tree nests once per
     * operator down its left side, so it is walked with a loop, not by recursion, and a flat sum of
     * any length builds without deepening the stack. The tree built is the same left-nested one.
     */
    private Expr chain(ArithContext top) {
        Class<?> kind = top.getClass();
        List<ArithContext> spine = new ArrayList<>();
        ArithContext c = top;
        while (c.getClass() == kind) {
            spine.add(c);
            c = c.getRuleContext(ArithContext.class, 0);
        }
        Expr acc = arith(c);
        for (int i = spine.size() - 1; i >= 0; i--) {
            ArithContext node = spine.get(i);
            Expr right = arith(node.getRuleContext(ArithContext.class, 1));
            Expr.Operator op;
            if (node instanceof ProductArithContext p) {
                op = p.op.getText().equals("*") ? Expr.Operator.MULTIPLY : Expr.Operator.DIVIDE;
            } else {
                op = ((SumArithContext) node).op.getText().equals("+") ? Expr.Operator.ADD : Expr.Operator.SUBTRACT;
            }
            acc = new Expr.Binary(op, acc, right, span(node));
        }
        return acc;
    }

    private Expr.Argument argument(ArgumentContext a) {
        Span span = span(a);
        if (a instanceof NamedArgumentContext n) {
            return new Expr.Argument(Expr.ArgumentKind.NAMED, n.argumentName().getText(), expr(n.expr()), span);
        }
        if (a instanceof DomainArgumentContext d) {
            return new Expr.Argument(Expr.ArgumentKind.DOMAIN, d.IDENT().getText(), arith(d.arith()), span);
        }
        if (a instanceof PlainArgumentContext p) {
            return new Expr.Argument(Expr.ArgumentKind.POSITIONAL, null, expr(p.expr()), span);
        }
        throw unhandled(a);
    }

    private Expr primary(PrimaryContext c) {
        Span span = span(c);
        if (c instanceof NumberPrimaryContext n) {
            return number(n.NUMBER().getText(), span);
        }
        if (c instanceof NamePrimaryContext n) {
            return new Expr.Name(n.IDENT().getText(), span);
        }
        if (c instanceof PatternPrimaryContext v) {
            return new Expr.PatternVariable(v.PATTERN_VAR().getText().substring(1), span);
        }
        if (c instanceof StringPrimaryContext s) {
            return new Expr.Text(unquote(s.STRING().getSymbol()), span);
        }
        if (c instanceof ParenPrimaryContext p) {
            return expr(p.expr());
        }
        if (c instanceof ListPrimaryContext l) {
            List<Expr> items = new ArrayList<>();
            for (ExprContext e : l.expr()) {
                items.add(expr(e));
            }
            return new Expr.ListOf(items, span);
        }
        throw unhandled(c);
    }

    // ---------------------------------------------------------------- helpers

    private static Expr.Number number(String text, Span span) {
        int dot = text.indexOf('.');
        if (dot < 0) {
            return new Expr.Number(new BigInteger(text), BigInteger.ONE, span);
        }
        String digits = text.substring(0, dot) + text.substring(dot + 1);
        return new Expr.Number(new BigInteger(digits), BigInteger.TEN.pow(text.length() - dot - 1), span);
    }

    private static String unquote(Token t) {
        String raw = t.getText();
        StringBuilder out = new StringBuilder();
        for (int i = 1; i < raw.length() - 1; i++) {
            char ch = raw.charAt(i);
            if (ch == '\\') {
                char next = raw.charAt(++i);
                out.append(switch (next) {
                    case 'n' -> '\n';
                    case 't' -> '\t';
                    default -> next;
                });
            } else {
                out.append(ch);
            }
        }
        return out.toString();
    }

    private static List<String> names(List<TerminalNode> nodes) {
        return nodes.stream().map(TerminalNode::getText).toList();
    }

    /** The node's source text with runs of white space (and comments) folded to one space. */
    private static String source(ParserRuleContext c) {
        Token start = c.getStart();
        Token stop = c.getStop();
        if (stop == null || stop.getStopIndex() < start.getStartIndex()) {
            return "";
        }
        String raw = start.getInputStream().getText(Interval.of(start.getStartIndex(), stop.getStopIndex()));
        StringBuilder out = new StringBuilder(raw.length());
        boolean space = false;
        boolean inString = false;
        for (int i = 0; i < raw.length(); i++) {
            char ch = raw.charAt(i);
            if (!inString && ch == '#') {
                while (i + 1 < raw.length() && raw.charAt(i + 1) != '\n') {
                    i++;
                }
                space = true;
            } else if (!inString && Character.isWhitespace(ch)) {
                space = true;
            } else {
                if (space && out.length() > 0) {
                    out.append(' ');
                }
                space = false;
                if (inString && ch == '\\' && i + 1 < raw.length()) {
                    out.append(ch).append(raw.charAt(++i));
                    continue;
                }
                if (ch == '"') {
                    inString = !inString;
                }
                out.append(ch);
            }
        }
        return out.toString();
    }

    private Span span(ParserRuleContext c) {
        Token start = c.getStart();
        Token stop = c.getStop();
        int length = stop == null ? 1 : stop.getStopIndex() - start.getStartIndex() + 1;
        return new Span(file, start.getLine(), start.getCharPositionInLine() + 1, length);
    }

    private Span span(Token t) {
        return new Span(file, t.getLine(), t.getCharPositionInLine() + 1, t.getStopIndex() - t.getStartIndex() + 1);
    }

    private static IllegalStateException unhandled(ParserRuleContext c) {
        return new IllegalStateException("parse adapter: unhandled grammar alternative " + c.getClass().getSimpleName()
                + " for '" + c.getText() + "'");
    }

}
