package dev.contour.rewrite;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.eval.OutputFormat;
import dev.contour.eval.RuleContext;
import dev.contour.eval.RuleReport;
import dev.contour.eval.RuleSink;
import dev.contour.lang.Expr;
import dev.contour.lang.Stmt;
import dev.contour.print.JsonPrinter;
import dev.contour.term.Term;
import java.util.List;

/**
 * One session's rewriting: collects the rules its scripts state (directly or through {@code use}),
 * and runs {@code derive} and {@code check ... by rules}.
 */
final class SessionRules implements RuleSink {
    private RuleSet rules = RuleSet.EMPTY;

    @Override
    public void accept(Stmt.Rule rule) {
        rules = rules.plus(RuleSet.of(List.of(RuleLibrary.compile(rule))));
    }

    @Override
    public Object state() {
        return rules; // immutable: later rules build a new set
    }

    @Override
    public void restore(Object state) {
        rules = state instanceof RuleSet r ? r : RuleSet.EMPTY;
    }

    @Override
    public RuleReport derive(Stmt.Derive d, RuleContext context) {
        RuleSet use = rulesFor(d.ruleFiles(), d.span(), context);
        Rewriter.Result r = run(d.value(), use, Limits.of(d.limits()), context, d.span());
        String text = context.format() == OutputFormat.JSON ? Proofs.derivationJson(d.label(), r)
                : comment(context, Proofs.derivation(d.label(), r));
        return new RuleReport(true, text, text);
    }

    @Override
    public RuleReport prove(Stmt.CheckByRules c, RuleContext context) {
        RuleSet use = rulesFor(c.ruleFiles(), c.span(), context);
        Limits limits = Limits.of(c.limits());
        Rewriter.Result left = run(c.left(), use, limits, context, c.span());
        Rewriter.Result right = run(c.right(), use, limits, context, c.span());
        Proofs.Difference d = Proofs.firstDifference(left.term(), right.term());
        boolean holds = d == null;
        String head = "check " + c.label() + " by rules";
        String steps = Proofs.count(left.steps()) + " + " + Proofs.count(right.steps());
        if (context.format() == OutputFormat.JSON) {
            String json = "{\"check\":" + JsonPrinter.string(c.label()) + ",\"line\":" + c.span().line() + ",\"ok\":" + holds
                    + ",\"byRules\":true,\"leftSteps\":" + left.steps() + ",\"rightSteps\":" + right.steps()
                    + (holds ? ",\"normalForm\":" + JsonPrinter.string(Proofs.text(left.term()))
                    : ",\"position\":" + JsonPrinter.string(Proofs.position(d.position()))
                    + ",\"left\":" + JsonPrinter.string(Proofs.text(d.left()))
                    + ",\"right\":" + JsonPrinter.string(Proofs.text(d.right()))) + "}\n";
            return new RuleReport(holds, json, json);
        }
        String summary = holds ? head + "  ok (" + steps + ")\n"
                : head + "  FAILED (the normal forms differ at " + Proofs.position(d.position()) + ": "
                + Proofs.text(d.left()) + " vs " + Proofs.text(d.right()) + ")\n";
        StringBuilder detail = new StringBuilder(holds ? head + "  ok\n" : head + "  FAILED (line " + c.span().line() + ")\n");
        detail.append("  left, ").append(Proofs.count(left.steps())).append(":\n").append(Proofs.steps(left, "  "));
        detail.append("  right, ").append(Proofs.count(right.steps())).append(":\n").append(Proofs.steps(right, "  "));
        if (holds) {
            detail.append("  both sides reach ").append(Proofs.text(left.term())).append('\n');
        } else {
            detail.append("  the normal forms differ at ").append(Proofs.position(d.position())).append(":\n")
                    .append("      left   ").append(Proofs.text(d.left())).append('\n')
                    .append("      right  ").append(Proofs.text(d.right())).append('\n');
        }
        return new RuleReport(holds, comment(context, summary), comment(context, detail.toString()));
    }

    private static Rewriter.Result run(Expr e, RuleSet use, Limits limits, RuleContext context, Span span) {
        Rewriter.Result r;
        try {
            Term start = InertTerms.of(e, context, use.functions());
            r = Rewriter.normalize(start, use, limits);
        } catch (ContourException x) {
            throw x.at(span);
        }
        if (!r.saturated()) {
            throw new ContourException(r.stopMessage(), span);
        }
        return r;
    }

    /** The named libraries, or the session's rules when none is named. */
    private RuleSet rulesFor(List<String> files, Span span, RuleContext context) {
        if (files.isEmpty()) {
            if (rules.isEmpty()) {
                throw new ContourException("no rules to rewrite with: load a library with 'use \"gamma.ctr\"' or name one with "
                        + "'using \"gamma.ctr\"'", span);
            }
            return rules;
        }
        RuleSet out = RuleSet.EMPTY;
        for (String f : files) {
            out = out.plus(RuleLibrary.load(context.resolve(f, span)));
        }
        return out;
    }

    /** LaTeX output keeps derivations as comments, so the file still typesets. */
    private static String comment(RuleContext context, String text) {
        if (context.format() != OutputFormat.LATEX) {
            return text;
        }
        return text.lines().map(l -> "% " + l).reduce("", (a, b) -> a + b + "\n");
    }
}
