package dev.contour.print;

import dev.contour.algebra.Expression;
import dev.contour.algebra.LinearFactors;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import dev.contour.term.Term;
import dev.contour.term.Terms;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/** LaTeX rendering: {@code \frac}, braced powers, Greek letters by name, {@code \,} between factors. */
public final class LatexPrinter {
    /** A variable's name as LaTeX that compiles whatever its characters (subscripts braced, underscores escaped). */
    public static String name(String variable) {
        return Names.latex(variable);
    }

    private LatexPrinter() { }

    /**
     * {@code \text{...}} around plain text, with the characters LaTeX treats specially in text
     * ({@code \ { } _ # % & $ ^ ~}) escaped, so the result compiles whatever the text holds.
     */
    public static String text(String plain) {
        StringBuilder b = new StringBuilder("\\text{");
        for (int i = 0; i < plain.length(); i++) {
            char c = plain.charAt(i);
            switch (c) {
                case '\\' -> b.append("\\textbackslash{}");
                case '{', '}', '_', '#', '%', '&', '$' -> b.append('\\').append(c);
                case '^' -> b.append("\\textasciicircum{}");
                case '~' -> b.append("\\textasciitilde{}");
                case '\n' -> b.append(' ');
                default -> b.append(c);
            }
        }
        return b.append('}').toString();
    }

    public static String rational(Rational r) {
        if (r.isInteger()) {
            return r.toString();
        }
        return (r.signum() < 0 ? "-" : "") + "\\frac{" + r.numerator().abs() + "}{" + r.denominator() + "}";
    }

    public static String polynomial(Polynomial p) {
        if (p.isZero()) {
            return "0";
        }
        StringBuilder out = new StringBuilder();
        for (Polynomial.Term t : p.terms()) {
            dev.contour.Cancellation.check();
            boolean negative = t.coefficient().signum() < 0;
            out.append(out.length() == 0 ? (negative ? "-" : "") : (negative ? " - " : " + "));
            out.append(unsignedTerm(t.coefficient().abs(), t.exponents()));
        }
        return out.toString();
    }

    private static String unsignedTerm(Rational c, Map<String, Integer> exponents) {
        List<String> parts = new ArrayList<>();
        if (!c.isOne() || exponents.isEmpty()) {
            parts.add(rational(c));
        }
        new TreeMap<>(exponents).forEach((v, e) -> parts.add(power(Names.latex(v), e)));
        return String.join("\\,", parts);
    }

    private static String power(String base, int e) {
        return e == 1 ? base : base + "^{" + e + "}";
    }

    public static String monomial(Monomial m) {
        if (m.isOne()) {
            return "1";
        }
        List<String> parts = new ArrayList<>();
        m.exponents().forEach((v, e) -> parts.add(power(Names.latex(v), e)));
        return String.join("\\,", parts);
    }

    public static String rationalFunction(RationalFunction f, boolean factored) {
        return expression(Expression.of(f), factored);
    }

    public static String expression(Expression e, boolean factored) {
        if (e.isZero()) {
            return "0";
        }
        StringBuilder out = new StringBuilder();
        for (Map.Entry<Monomial, RationalFunction> t : e.terms().entrySet()) {
            dev.contour.Cancellation.check();
            PlainPrinter.Signed s = term(t.getKey(), t.getValue(), factored);
            out.append(out.length() == 0 ? (s.negative() ? "-" : "") : (s.negative() ? " - " : " + "));
            out.append(s.text());
        }
        return out.toString();
    }

    private static PlainPrinter.Signed term(Monomial m, RationalFunction c, boolean factored) {
        String mono = m.isOne() ? "" : monomial(m);
        if (c.isPolynomial() && !factored) {
            Polynomial p = c.numerator();
            if (p.termCount() == 1) {
                Polynomial.Term only = p.terms().get(0);
                boolean bare = only.coefficient().abs().isOne() && !m.isOne();
                String coefficient = bare ? (only.exponents().isEmpty() ? "" : unsignedTerm(Rational.ONE, only.exponents()))
                        : unsignedTerm(only.coefficient().abs(), only.exponents());
                return new PlainPrinter.Signed(only.coefficient().signum() < 0, join(coefficient, mono));
            }
            String poly = polynomial(p);
            return new PlainPrinter.Signed(false, m.isOne() ? poly : join("\\left(" + poly + "\\right)", mono));
        }
        FractionParts parts = FractionParts.of(c, factored);
        List<String> num = new ArrayList<>();
        if (!parts.numeratorScalar().equals(BigInteger.ONE)) {
            num.add(parts.numeratorScalar().toString());
        }
        for (LinearFactors.Factor f : parts.numerator()) {
            num.add(factor(f, parts.numerator().size() > 1 || !num.isEmpty() || !mono.isEmpty() || f.multiplicity() > 1));
        }
        if (!mono.isEmpty()) {
            num.add(mono);
        }
        List<String> den = new ArrayList<>();
        if (!parts.denominatorScalar().equals(BigInteger.ONE)) {
            den.add(parts.denominatorScalar().toString());
        }
        for (LinearFactors.Factor f : parts.denominator()) {
            den.add(factor(f, parts.denominator().size() > 1 || !den.isEmpty() || f.multiplicity() > 1));
        }
        String top = num.isEmpty() ? "1" : String.join("\\,", num);
        String text = den.isEmpty() ? top : "\\frac{" + top + "}{" + String.join("\\,", den) + "}";
        return new PlainPrinter.Signed(parts.sign() < 0, text);
    }

    private static String join(String a, String b) {
        if (a.isEmpty()) {
            return b.isEmpty() ? "1" : b;
        }
        return b.isEmpty() ? a : a + "\\," + b;
    }

    private static String factor(LinearFactors.Factor f, boolean parenthesise) {
        Polynomial p = f.base();
        String text = polynomial(p);
        boolean atomic = p.termCount() == 1;
        String base = atomic || !parenthesise ? text : "\\left(" + text + "\\right)";
        boolean bare = p.isConstant() || PlainPrinter.isVariable(p);
        return f.multiplicity() == 1 ? base : (bare ? text : "\\left(" + text + "\\right)") + "^{" + f.multiplicity() + "}";
    }

    public static String term(Term t, boolean factored) {
        if (t instanceof Term.Leaf l) {
            return expression(l.value(), factored);
        }
        if (t instanceof Term.Apply a) {
            List<String> args = a.arguments().stream().map(x -> term(x, factored)).toList();
            return switch (a.function()) {
                case Terms.GAMMA -> "\\Gamma\\left(" + args.get(0) + "\\right)";
                case Terms.POCH -> "\\left(" + args.get(0) + "\\right)_{" + args.get(1) + "}";
                case Terms.FACTORIAL -> "\\left(" + args.get(0) + "\\right)!";
                case Terms.BINOM -> "\\binom{" + args.get(0) + "}{" + args.get(1) + "}";
                default -> Names.upright(a.function()) + "\\left(" + String.join(", ", args) + "\\right)";
            };
        }
        if (t instanceof Term.Sum s) {
            StringBuilder out = new StringBuilder();
            for (Term x : s.terms()) {
                String text = term(x, factored);
                boolean negative = text.startsWith("-");
                out.append(out.length() == 0 ? text : (negative ? " - " + text.substring(1) : " + " + text));
            }
            return out.toString();
        }
        if (t instanceof Term.Product p) {
            List<String> num = new ArrayList<>();
            List<String> den = new ArrayList<>();
            for (Term x : p.factors()) {
                if (x instanceof Term.Power w && w.exponent() < 0) {
                    den.add(powerText(w.base(), -w.exponent(), factored));
                } else {
                    String text = x instanceof Term.Power w ? powerText(w.base(), w.exponent(), factored) : term(x, factored);
                    boolean group = x instanceof Term.Sum || (x instanceof Term.Leaf l && l.value().terms().size() > 1);
                    num.add(group ? "\\left(" + text + "\\right)" : text);
                }
            }
            String top = num.isEmpty() ? "1" : String.join("\\,", num);
            return den.isEmpty() ? top : "\\frac{" + top + "}{" + String.join("\\,", den) + "}";
        }
        Term.Power w = (Term.Power) t;
        return w.exponent() < 0 ? "\\frac{1}{" + powerText(w.base(), -w.exponent(), factored) + "}"
                : powerText(w.base(), w.exponent(), factored);
    }

    private static String powerText(Term base, int e, boolean factored) {
        String b = base instanceof Term.Apply ? term(base, factored) : "\\left(" + term(base, factored) + "\\right)";
        return e == 1 ? b : b + "^{" + e + "}";
    }
}
