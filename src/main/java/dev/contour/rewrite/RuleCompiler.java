package dev.contour.rewrite;

import dev.contour.ContourException;
import dev.contour.Span;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Rational;
import dev.contour.lang.Expr;
import dev.contour.lang.Stmt;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

/**
 * Turns a {@code rule} statement into a {@link Rule}, validating it at load time: kebab-case name,
 * no bare-variable left side, no left side the canonical form can never contain, every right-side
 * and guard variable bound on the left, guards from the registry. Errors carry the span of the
 * offending part.
 */
final class RuleCompiler {
    private static final java.util.regex.Pattern KEBAB = java.util.regex.Pattern.compile("[a-z][a-z0-9]*(-[a-z0-9]+)*");

    /** Largest number a rule may write as a power of a number, in bits. */
    private static final long MAX_LITERAL_BITS = 1_000_000;

    private final String ruleName;

    private RuleCompiler(String ruleName) {
        this.ruleName = ruleName;
    }

    static Rule compile(Stmt.Rule r) {
        if (!KEBAB.matcher(r.name()).matches()) {
            throw new ContourException("rule name '" + r.name() + "' is not kebab-case (lower-case words joined by '-', as in gamma-shift-up)",
                    r.span());
        }
        RuleCompiler c = new RuleCompiler(r.name());
        Expr lhs = r.left();
        if (lhs instanceof Expr.PatternVariable v) {
            throw c.error("the left side is the bare variable @" + v.name() + ", which would match every term", lhs.span());
        }
        Pattern left = c.pattern(lhs, true);
        if (!left.hasCall()) {
            throw c.error("the left side has no function call: rational values are already folded in the canonical form, "
                    + "so it can never match", lhs.span());
        }
        Set<String> bound = left.variables();
        c.requireBound(r.right(), bound, "right side");
        Pattern right = c.pattern(r.right(), false);
        List<Guard> guards = new ArrayList<>();
        for (Expr g : r.guards()) {
            guards.add(c.guard(g, bound));
        }
        return new Rule(r.name(), left, right, guards, r.span());
    }

    private ContourException error(String message, Span span) {
        return new ContourException("rule '" + ruleName + "': " + message, span);
    }

    private Guard guard(Expr g, Set<String> bound) {
        String list = String.join(", ", Guard.names());
        if (!(g instanceof Expr.Call call) || !(call.callee() instanceof Expr.Name name)) {
            throw error("a guard is one of " + list + " applied to pattern expressions, as in integer(@n)", g.span());
        }
        String renamed = Guard.replacementOf(name.name()).orElse(null);
        if (renamed != null) {
            throw error("the guard '" + name.name() + "' is now called '" + renamed + "': write " + renamed
                    + "(...) instead", name.span());
        }
        Guard.Test test = Guard.lookup(name.name()).orElseThrow(() ->
                error("unknown guard '" + name.name() + "' (the guards are " + list + ")", name.span()));
        int want = test.takesVariable() ? 2 : 1;
        if (call.arguments().size() != want) {
            throw error("guard " + test.name() + " takes " + want + (want == 1 ? " argument" : " arguments"), call.span());
        }
        for (Expr.Argument a : call.arguments()) {
            if (a.kind() != Expr.ArgumentKind.POSITIONAL) {
                throw error("guard arguments are positional", a.span());
            }
        }
        Expr first = call.arguments().get(0).value();
        requireBound(first, bound, "guard");
        String variable = null;
        if (test.takesVariable()) {
            Expr v = call.arguments().get(1).value();
            if (!(v instanceof Expr.Name n)) {
                throw error("the second argument of " + test.name() + " is a variable name, as in without_variable(@x, s)", v.span());
            }
            variable = n.name();
        }
        return new Guard(test, pattern(first, false), variable, g.span());
    }

    /** Every pattern variable in {@code e} must be bound on the left. */
    private void requireBound(Expr e, Set<String> bound, String where) {
        List<Expr.PatternVariable> found = new ArrayList<>();
        variables(e, found);
        for (Expr.PatternVariable v : found) {
            if (!bound.contains(v.name())) {
                throw error("@" + v.name() + " in the " + where + " is not bound on the left side", v.span());
            }
        }
    }

    private static void variables(Expr e, List<Expr.PatternVariable> out) {
        if (e instanceof Expr.PatternVariable v) {
            out.add(v);
        } else if (e instanceof Expr.Binary b) {
            variables(b.left(), out);
            variables(b.right(), out);
        } else if (e instanceof Expr.Negate n) {
            variables(n.operand(), out);
        } else if (e instanceof Expr.Factorial f) {
            variables(f.operand(), out);
        } else if (e instanceof Expr.Call c) {
            c.arguments().forEach(a -> variables(a.value(), out));
        }
    }

    // ------------------------------------------------------------------ patterns

    /** The pattern of {@code e}; on the left side, also rejects shapes the canonical form never has. */
    private Pattern pattern(Expr e, boolean left) {
        if (e instanceof Expr.Number n) {
            return new Pattern.Literal(Expression.constant(Rational.of(n.numerator(), n.denominator())));
        }
        if (e instanceof Expr.PatternVariable v) {
            return new Pattern.Variable(v.name());
        }
        if (e instanceof Expr.Negate n) {
            return negate(pattern(n.operand(), left));
        }
        if (e instanceof Expr.Factorial f) {
            return new Pattern.Call("factorial", List.of(pattern(f.operand(), left)));
        }
        if (e instanceof Expr.Call c) {
            if (!(c.callee() instanceof Expr.Name name)) {
                throw error("only named functions can be called in a rule", c.callee().span());
            }
            List<Pattern> args = new ArrayList<>();
            for (Expr.Argument a : c.arguments()) {
                if (a.kind() != Expr.ArgumentKind.POSITIONAL) {
                    throw error("arguments in rules are positional", a.span());
                }
                args.add(pattern(a.value(), left));
            }
            return new Pattern.Call(name.name(), args);
        }
        if (e instanceof Expr.Binary b) {
            return binary(b, left);
        }
        if (e instanceof Expr.Name n) {
            throw error("'" + n.name() + "' is a plain name; rules mention only pattern variables (@" + n.name()
                    + "), numbers and function calls", n.span());
        }
        throw error("this kind of expression cannot appear in a rule", e.span());
    }

    private Pattern binary(Expr.Binary b, boolean left) {
        switch (b.operator()) {
            case ADD, SUBTRACT -> {
                if (isNumber(b.left()) && isNumber(b.right())) {
                    throw error("the numbers in '" + text(b) + "' never stand apart in the canonical form, which adds them; "
                            + "write their sum", b.span());
                }
                List<Pattern> parts = new ArrayList<>();
                addParts(pattern(b.left(), left), parts);
                Pattern r = pattern(b.right(), left);
                addParts(b.operator() == Expr.Operator.ADD ? r : negate(r), parts);
                if (left) {
                    checkSum(parts, b.span());
                }
                return new Pattern.Sum(parts);
            }
            case MULTIPLY, DIVIDE -> {
                List<Pattern> factors = new ArrayList<>();
                addFactors(pattern(b.left(), left), factors);
                Pattern r = pattern(b.right(), left);
                addFactors(b.operator() == Expr.Operator.MULTIPLY ? r : invert(r, b.right().span()), factors);
                return product(factors, left, b.span());
            }
            default -> {
                int e = exponent(b.right());
                Pattern base = pattern(b.left(), left);
                return power(base, e, left, b.span());
            }
        }
    }

    private static boolean isNumber(Expr e) {
        return e instanceof Expr.Number || e instanceof Expr.Negate n && n.operand() instanceof Expr.Number;
    }

    private static String text(Expr.Binary b) {
        return numberText(b.left()) + " " + b.operator().symbol() + " " + numberText(b.right());
    }

    private static String numberText(Expr e) {
        if (e instanceof Expr.Negate n) {
            return "-" + numberText(n.operand());
        }
        Expr.Number n = (Expr.Number) e;
        return n.denominator().equals(java.math.BigInteger.ONE) ? n.numerator().toString() : n.numerator() + "/" + n.denominator();
    }

    private int exponent(Expr e) {
        boolean negative = false;
        Expr x = e;
        if (x instanceof Expr.Negate n) {
            negative = true;
            x = n.operand();
        }
        if (!(x instanceof Expr.Number n) || !n.denominator().equals(java.math.BigInteger.ONE) || n.numerator().bitLength() > 20) {
            throw error("exponents in rules are integers written as numbers", e.span());
        }
        int v = n.numerator().intValueExact();
        return negative ? -v : v;
    }

    private static void addParts(Pattern p, List<Pattern> out) {
        if (p instanceof Pattern.Sum s) {
            out.addAll(s.parts());
        } else {
            out.add(p);
        }
    }

    private static void addFactors(Pattern p, List<Pattern> out) {
        if (p instanceof Pattern.Product q) {
            out.addAll(q.factors());
        } else {
            out.add(p);
        }
    }

    private void checkSum(List<Pattern> parts, Span span) {
        int literals = 0;
        for (int i = 0; i < parts.size(); i++) {
            Pattern p = parts.get(i);
            if (p instanceof Pattern.Literal l) {
                literals++;
                if (l.value().isZero()) {
                    throw error("a zero summand never occurs in the canonical form", span);
                }
            }
            if (parts.subList(0, i).contains(p)) {
                throw error("a sum with two equal parts never occurs in the canonical form, which collects them", span);
            }
            if (!(p instanceof Pattern.Literal)) {
                for (Pattern q : parts.subList(0, i)) {
                    if (!(q instanceof Pattern.Literal) && withoutCoefficient(q).equals(withoutCoefficient(p))) {
                        throw error("the summands " + describe(q) + " and " + describe(p) + " differ only by a number, so they never "
                                + "stand apart in the canonical form, which collects them into one; write the collected sum", span);
                    }
                }
            }
        }
        if (literals > 1) {
            throw error("a sum with two numbers never occurs in the canonical form, which adds them; write their sum", span);
        }
    }

    /** Numbers multiply out; on the left, repeated factors and products of sums with calls are rejected. */
    private Pattern product(List<Pattern> factors, boolean left, Span span) {
        Expression coefficient = Expression.ONE;
        List<Pattern> rest = new ArrayList<>();
        for (Pattern f : factors) {
            if (f instanceof Pattern.Literal l) {
                coefficient = coefficient.multiply(l.value());
            } else {
                rest.add(f);
            }
        }
        if (coefficient.isZero()) {
            throw error("a product with the factor 0 is 0", span);
        }
        if (rest.isEmpty()) {
            return new Pattern.Literal(coefficient);
        }
        if (!coefficient.equals(Expression.ONE)) {
            rest.add(0, new Pattern.Literal(coefficient));
        }
        if (left) {
            Set<Pattern> seen = new HashSet<>();
            List<Pattern> bases = new ArrayList<>();
            for (Pattern f : rest) {
                if (!seen.add(f)) {
                    throw error("a product with two equal factors never occurs in the canonical form, which writes a power", span);
                }
                Pattern base = f instanceof Pattern.Power w ? w.base() : f;
                if (bases.contains(base)) {
                    Pattern other = rest.stream().filter(g -> g != f && (g instanceof Pattern.Power w ? w.base() : g).equals(base))
                            .findFirst().orElse(f);
                    boolean opposite = Integer.signum(exponentOf(f)) != Integer.signum(exponentOf(other));
                    throw error(opposite
                            ? "the factor " + describe(base) + " is both in the numerator and in the denominator, which never occurs in "
                            + "the canonical form: it cancels them"
                            : "the factor " + describe(base) + " appears twice with different powers, which never occurs in the "
                            + "canonical form: it adds the exponents", span);
                }
                bases.add(base);
                if (f instanceof Pattern.Sum s && s.hasCall()) {
                    throw error("a product of a sum with calls in it never occurs in the canonical form, which multiplies it out", span);
                }
            }
        }
        return rest.size() == 1 ? rest.get(0) : new Pattern.Product(rest);
    }

    private static int exponentOf(Pattern f) {
        return f instanceof Pattern.Power w ? w.exponent() : 1;
    }

    /** A summand without its numeric coefficient: {@code 3*Gamma(@x)} and {@code -Gamma(@x)} are both {@code Gamma(@x)}. */
    private static Pattern withoutCoefficient(Pattern p) {
        if (p instanceof Pattern.Product q && q.factors().get(0) instanceof Pattern.Literal) {
            List<Pattern> fs = q.factors().subList(1, q.factors().size());
            return fs.size() == 1 ? fs.get(0) : new Pattern.Product(fs);
        }
        return p;
    }

    /** A pattern written out for a message. */
    static String describe(Pattern p) {
        if (p instanceof Pattern.Variable v) {
            return "@" + v.name();
        }
        if (p instanceof Pattern.Literal l) {
            return l.value().constantValue().toString();
        }
        if (p instanceof Pattern.Call c) {
            return c.function() + "(" + String.join(", ", c.arguments().stream().map(RuleCompiler::describe).toList()) + ")";
        }
        if (p instanceof Pattern.Sum s) {
            return "(" + String.join(" + ", s.parts().stream().map(RuleCompiler::describe).toList()) + ")";
        }
        if (p instanceof Pattern.Product q) {
            return String.join("*", q.factors().stream().map(RuleCompiler::describe).toList());
        }
        Pattern.Power w = (Pattern.Power) p;
        return describe(w.base()) + "^" + w.exponent();
    }

    private Pattern power(Pattern base, int e, boolean left, Span span) {
        if (e == 1) {
            return base;
        }
        if (e == 0) {
            if (left) {
                throw error("a power with exponent 0 never occurs in the canonical form, where it is 1", span);
            }
            return new Pattern.Literal(Expression.ONE);
        }
        if (base instanceof Pattern.Literal l) {
            if (l.value().isZero() && e < 0) {
                throw error("division by zero", span);
            }
            Rational r = l.value().constantValue();
            long bits = (long) Math.max(r.numerator().bitLength(), r.denominator().bitLength()) * Math.abs((long) e);
            if (r.abs().compareTo(Rational.ONE) != 0 && !r.isZero() && bits > MAX_LITERAL_BITS) {
                throw error("the number " + l.value() + "^" + e + " is too large (more than " + MAX_LITERAL_BITS + " bits)", span);
            }
            return new Pattern.Literal(l.value().pow(e));
        }
        if (base instanceof Pattern.Power w) {
            long product = (long) w.exponent() * e;
            if (product != (int) product) {
                throw error("the exponent " + w.exponent() + "*" + e + " is too large (exponents are at most "
                        + Integer.MAX_VALUE + ")", span);
            }
            return power(w.base(), (int) product, left, span);
        }
        if (base instanceof Pattern.Product q) {
            List<Pattern> out = new ArrayList<>();
            for (Pattern f : q.factors()) {
                out.add(power(f, e, left, span));
            }
            return product(out, left, span);
        }
        if (left && e > 0 && base instanceof Pattern.Sum) {
            throw error("a positive power of a sum never occurs in the canonical form, which expands it", span);
        }
        return new Pattern.Power(base, e);
    }

    private static Pattern negate(Pattern p) {
        if (p instanceof Pattern.Literal l) {
            return new Pattern.Literal(l.value().negate());
        }
        if (p instanceof Pattern.Sum s) {
            return new Pattern.Sum(s.parts().stream().map(RuleCompiler::negate).toList());
        }
        if (p instanceof Pattern.Product q && q.factors().get(0) instanceof Pattern.Literal l) {
            List<Pattern> fs = new ArrayList<>(q.factors());
            Expression c = l.value().negate();
            if (c.equals(Expression.ONE)) {
                fs.remove(0);
                return fs.size() == 1 ? fs.get(0) : new Pattern.Product(fs);
            }
            fs.set(0, new Pattern.Literal(c));
            return new Pattern.Product(fs);
        }
        List<Pattern> fs = new ArrayList<>();
        fs.add(new Pattern.Literal(Expression.constant(-1)));
        addFactors(p, fs);
        return new Pattern.Product(fs);
    }

    private Pattern invert(Pattern p, Span span) {
        if (p instanceof Pattern.Literal l) {
            if (l.value().isZero()) {
                throw error("division by zero", span);
            }
            return new Pattern.Literal(Expression.ONE.divide(l.value()));
        }
        if (p instanceof Pattern.Product q) {
            return new Pattern.Product(q.factors().stream().map(f -> invert(f, span)).toList());
        }
        if (p instanceof Pattern.Power w) {
            return w.exponent() == -1 ? w.base() : new Pattern.Power(w.base(), -w.exponent());
        }
        return new Pattern.Power(p, -1);
    }
}
