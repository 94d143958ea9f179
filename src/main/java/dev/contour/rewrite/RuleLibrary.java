package dev.contour.rewrite;

import dev.contour.ContourException;
import dev.contour.eval.InterpreterOptions;
import dev.contour.lang.ScriptParser;
import dev.contour.lang.Stmt;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/** Loads rule files ({@code rules/*.ctr}): the script grammar, {@code rule} statements only. */
public final class RuleLibrary {
    /** The bundled libraries that bring Gamma functions and Pochhammer symbols to normal form, in order. */
    public static final List<String> BUNDLED = List.of("gamma.ctr", "pochhammer.ctr");

    private RuleLibrary() { }

    /** The rules of one file, validated, in the file's order; errors name file:line:col. */
    public static RuleSet load(Path file) {
        String text;
        try {
            text = dev.contour.lang.SourceFiles.read(file);
        } catch (IOException e) {
            throw new ContourException("cannot read rule file '" + file + "': " + e.getMessage());
        }
        return parse(text, file.toString());
    }

    /** The rules in {@code text}, which is labelled {@code fileName} in spans. */
    public static RuleSet parse(String text, String fileName) {
        List<Rule> rules = new ArrayList<>();
        for (Stmt s : ScriptParser.parseScript(text, fileName)) {
            if (!(s instanceof Stmt.Rule r)) {
                throw new ContourException("a rule file holds only 'rule' statements", s.span());
            }
            rules.add(RuleCompiler.compile(r));
        }
        return RuleSet.of(rules);
    }

    /** One rule statement, validated. */
    public static Rule compile(Stmt.Rule statement) {
        return RuleCompiler.compile(statement);
    }

    /** The bundled Gamma and Pochhammer rules from {@code directory}. */
    public static RuleSet bundled(Path directory) {
        RuleSet all = RuleSet.EMPTY;
        for (String name : BUNDLED) {
            all = all.plus(load(directory.resolve(name)));
        }
        return all;
    }

    /** The bundled rules from the project's {@code rules/} (see {@link InterpreterOptions#defaultRulesDirectory}). */
    public static RuleSet bundled() {
        return bundled(InterpreterOptions.defaultRulesDirectory());
    }
}
