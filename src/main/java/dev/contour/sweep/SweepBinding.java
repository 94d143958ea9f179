package dev.contour.sweep;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;
import dev.contour.lang.ScriptParser;
import dev.contour.lang.Stmt;
import dev.contour.lang.gen.ContourLexer;
import java.io.OutputStream;
import java.io.PrintStream;
import java.nio.file.Path;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.antlr.v4.runtime.CharStreams;
import org.antlr.v4.runtime.Token;

/** What a sweep asks of the language: the tuples of an index set, and which names a script uses. */
final class SweepBinding {
    /** The file name index-set errors are reported under. */
    static final String INDEX_SET_FILE = "sweep index set";

    private SweepBinding() { }

    /** The text the index set is read from: {@code sum OVER [with WHERE] : 0}, as in a script. */
    static String indexSetText(String over, String where) {
        return "sum " + over + (where.isEmpty() ? "" : " with " + where) + " : 0";
    }

    /** The tuples of {@code NAME in RANGE, ... with CONSTRAINTS}; errors are located in {@link #indexSetText}. */
    static List<long[]> tuples(String over, String where, Path rules) {
        PrintStream quiet = new PrintStream(OutputStream.nullOutputStream());
        Interpreter interpreter = new Interpreter(new InterpreterOptions(quiet, null, false, rules, false));
        return interpreter.indexTuples(indexSetText(over, where), INDEX_SET_FILE);
    }

    /** The names bound by the index set, in order (the same reading as {@link #tuples}). */
    static List<String> names(String over, String where) {
        var e = ScriptParser.parseExpression(indexSetText(over, where), INDEX_SET_FILE);
        if (!(e instanceof dev.contour.lang.Expr.Sum sum)) {
            throw new ContourException("not an index set", e.span());
        }
        return sum.indices().names();
    }

    /**
     * Refuses a swept name the script never mentions, or one the script binds itself at top level
     * (its own value would silently replace the tuple's).
     */
    static void checkScriptUses(String text, String file, List<String> names) {
        List<Stmt> statements = ScriptParser.parseScript(text, file); // a syntax error is reported here, located
        Set<String> mentioned = new HashSet<>();
        ContourLexer lexer = new ContourLexer(CharStreams.fromString(text, file));
        lexer.removeErrorListeners();
        for (Token t = lexer.nextToken(); t.getType() != Token.EOF; t = lexer.nextToken()) {
            if (t.getType() == ContourLexer.IDENT) {
                mentioned.add(t.getText());
            }
        }
        for (String n : names) {
            if (!mentioned.contains(n)) {
                throw new ContourException("the script " + file + " never uses '" + n
                        + "', so sweeping over it would repeat the same run (check the name in --over)", null);
            }
        }
        for (Stmt s : statements) {
            String bound = s instanceof Stmt.Let l ? l.name() : null;
            if (s instanceof Stmt.Vars v) {
                for (String n : v.names()) {
                    if (names.contains(n)) {
                        bound = n;
                    }
                }
            }
            if (bound != null && names.contains(bound)) {
                Span at = s.span();
                throw new ContourException("the script binds '" + bound + "' itself; the sweep binds it for each tuple"
                        + " (remove this statement or sweep over another name)", at);
            }
        }
    }
}
