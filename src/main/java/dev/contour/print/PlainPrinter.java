package dev.contour.print;

import dev.contour.algebra.Expression;
import dev.contour.algebra.LinearFactors;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import dev.contour.term.Term;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * Plain-text rendering in the language's own syntax, so that printing and parsing again gives the
 * same value. Terms come in the canonical order; parentheses only where precedence needs them.
 */
public final class PlainPrinter {
    private PlainPrinter() { }

    public static String rational(Rational r) {
        return r.toString();
    }

    /** Expanded, leading term first: {@code 3*s^2*t - 1/2*t + 4}. */
    public static String polynomial(Polynomial p) {
        if (p.isZero()) {
            return "0";
        }
        StringBuilder out = new StringBuilder();
        for (Polynomial.Term t : p.terms()) {
            dev.contour.Cancellation.check();
            Rational c = t.coefficient();
            boolean negative = c.signum() < 0;
            if (out.length() == 0) {
                out.append(negative ? "-" : "");
            } else {
                out.append(negative ? " - " : " + ");
            }
            out.append(unsignedTerm(c.abs(), t.exponents()));
        }
        return out.toString();
    }

    private static String unsignedTerm(Rational c, Map<String, Integer> exponents) {
        List<String> parts = new ArrayList<>();
        if (!c.isOne() || exponents.isEmpty()) {
            parts.add(c.toString());
        }
        new TreeMap<>(exponents).forEach((v, e) -> parts.add(power(v, e)));
        return String.join("*", parts);
    }

    private static String power(String base, int e) {
        return e == 1 ? base : base + "^" + e;
    }

    public static String rationalFunction(RationalFunction f, boolean factored) {
        return expression(Expression.of(f), factored);
    }

    /** {@code sigma^2*tau^-1}; {@code 1} for the empty monomial. */
    public static String monomial(Monomial m) {
        if (m.isOne()) {
            return "1";
        }
        List<String> parts = new ArrayList<>();
        m.exponents().forEach((v, e) -> parts.add(power(v, e)));
        return String.join("*", parts);
    }

    /** The whole expression on one line. */
    public static String expression(Expression e, boolean factored) {
        if (e.isZero()) {
            return "0";
        }
        StringBuilder out = new StringBuilder();
        for (Map.Entry<Monomial, RationalFunction> t : e.terms().entrySet()) {
            dev.contour.Cancellation.check();
            Signed s = term(t.getKey(), t.getValue(), factored);
            if (out.length() == 0) {
                out.append(s.negative ? "-" : "");
            } else {
                out.append(s.negative ? " - " : " + ");
            }
            out.append(s.text);
        }
        return out.toString();
    }

    /** A text with its sign pulled out. */
    record Signed(boolean negative, String text) { }

    /** One collected monomial times its coefficient, e.g. {@code -(s - 4)*sigma^2/(16*(s - 2))}. */
    static Signed term(Monomial m, RationalFunction c, boolean factored) {
        List<String> numerator = new ArrayList<>();
        String denominator = "";
        boolean negative;
        if (c.isPolynomial() && !factored) {
            Polynomial p = c.numerator();
            if (p.termCount() == 1) {
                Polynomial.Term only = p.terms().get(0);
                negative = only.coefficient().signum() < 0;
                boolean bare = only.coefficient().abs().isOne() && !m.isOne();
                if (!bare) {
                    numerator.add(unsignedTerm(only.coefficient().abs(), only.exponents()));
                } else if (!only.exponents().isEmpty()) {
                    numerator.add(unsignedTerm(Rational.ONE, only.exponents()));
                }
            } else {
                negative = false;
                numerator.add(m.isOne() ? polynomial(p) : "(" + polynomial(p) + ")");
            }
        } else {
            FractionParts parts = FractionParts.of(c, factored);
            negative = parts.sign() < 0;
            boolean needScalar = !parts.numeratorScalar().equals(BigInteger.ONE)
                    || (parts.numerator().isEmpty() && m.isOne());
            if (needScalar) {
                numerator.add(parts.numeratorScalar().toString());
            }
            for (LinearFactors.Factor f : parts.numerator()) {
                numerator.add(factor(f));
            }
            List<String> den = new ArrayList<>();
            if (!parts.denominatorScalar().equals(BigInteger.ONE)) {
                den.add(parts.denominatorScalar().toString());
            }
            for (LinearFactors.Factor f : parts.denominator()) {
                den.add(factor(f));
            }
            if (!den.isEmpty()) {
                String joined = String.join("*", den);
                denominator = "/" + (den.size() == 1 && !hasTopLevelProduct(den.get(0)) ? joined : "(" + joined + ")");
            }
        }
        if (!m.isOne()) {
            numerator.add(monomial(m));
        }
        if (numerator.isEmpty()) {
            numerator.add("1");
        }
        return new Signed(negative, String.join("*", numerator) + denominator);
    }

    /** Whether text has a '*' or '/' outside parentheses (then it needs them after a '/'). */
    private static boolean hasTopLevelProduct(String text) {
        int depth = 0;
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            if (c == '(') {
                depth++;
            } else if (c == ')') {
                depth--;
            } else if (depth == 0 && (c == '*' || c == '/')) {
                return true;
            }
        }
        return false;
    }

    /** A factor to a power, parenthesised unless it is a bare variable or number. */
    private static String factor(LinearFactors.Factor f) {
        Polynomial p = f.base();
        String text = polynomial(p);
        boolean powerProduct = p.termCount() == 1 && p.terms().get(0).coefficient().isOne();
        boolean atomic = p.isConstant() || (powerProduct && (f.multiplicity() == 1 || isVariable(p)));
        String base = atomic ? text : "(" + text + ")";
        return f.multiplicity() == 1 ? base : base + "^" + f.multiplicity();
    }

    static boolean isVariable(Polynomial p) {
        return p.termCount() == 1 && p.totalDegree() == 1 && p.terms().get(0).coefficient().isOne();
    }

    /** A symbolic term, using the language's own function names. */
    public static String term(Term t, boolean factored) {
        if (t instanceof Term.Leaf l) {
            return expression(l.value(), factored);
        }
        if (t instanceof Term.Apply a) {
            List<String> args = a.arguments().stream().map(x -> term(x, factored)).toList();
            return a.function() + "(" + String.join(", ", args) + ")";
        }
        if (t instanceof Term.Sum s) {
            StringBuilder out = new StringBuilder();
            for (Term x : s.terms()) {
                String text = term(x, factored);
                boolean negative = text.startsWith("-");
                if (out.length() == 0) {
                    out.append(text);
                } else {
                    out.append(negative ? " - " : " + ").append(negative ? text.substring(1) : text);
                }
            }
            return out.toString();
        }
        if (t instanceof Term.Product p) {
            List<String> num = new ArrayList<>();
            List<String> den = new ArrayList<>();
            String sign = "";
            for (Term x : p.factors()) {
                if (x instanceof Term.Power w && w.exponent() < 0) {
                    den.add(powerText(w.base(), -w.exponent(), factored));
                } else if (x instanceof Term.Leaf l && isNegativeNumber(l.value())) {
                    sign = "-";
                    Expression abs = l.value().negate();
                    if (!abs.equals(Expression.ONE)) {
                        num.add(atom(new Term.Leaf(abs), factored));
                    }
                } else {
                    num.add(atom(x, factored));
                }
            }
            String top = num.isEmpty() ? "1" : String.join("*", num);
            String bottom = den.isEmpty() ? "" : "/" + (den.size() == 1 ? den.get(0) : "(" + String.join("*", den) + ")");
            return sign + top + bottom;
        }
        Term.Power w = (Term.Power) t;
        if (w.exponent() < 0) {
            return "1/" + powerText(w.base(), -w.exponent(), factored);
        }
        return powerText(w.base(), w.exponent(), factored);
    }

    private static boolean isNegativeNumber(Expression e) {
        return e.isConstant() && e.constantValue().signum() < 0;
    }

    private static String powerText(Term base, int e, boolean factored) {
        String b = base instanceof Term.Apply ? term(base, factored) : "(" + term(base, factored) + ")";
        return e == 1 ? b : b + "^" + e;
    }

    private static String atom(Term t, boolean factored) {
        if (t instanceof Term.Apply) {
            return term(t, factored);
        }
        if (t instanceof Term.Power w) {
            return powerText(w.base(), w.exponent(), factored);
        }
        String text = term(t, factored);
        boolean simple = text.matches("[A-Za-z0-9_\\[\\],^*/]+");
        return simple ? text : "(" + text + ")";
    }
}
