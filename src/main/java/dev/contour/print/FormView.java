package dev.contour.print;

import dev.contour.ContourException;
import dev.contour.algebra.Expression;
import dev.contour.algebra.LinearFactors;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.PolynomialGcd;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * Amplitudes printed as physicists write them: every linear factor that is a multiple of a named
 * form is written through that form ({@code (utilde - 2)}, not {@code -(s + t - 6)}, when
 * {@code utilde = 8 - s - t}), numerators split into such factors, and optionally the factor
 * common to all coefficients of the collected variables pulled out in front
 * ({@code Theta*(1 + sigma + tau)/(s*t*u)} rather than three fractions). Only the printing
 * changes: the pieces multiply back to the same exact value ({@link #common} and {@link #inner}
 * give them for tests).
 */
public final class FormView {
    private FormView() { }

    /** A name for a linear form, such as {@code utilde = 8 - s - t}; the plain variables s and t are forms of themselves. */
    public record Form(String name, Polynomial value) {
        public Form {
            if (value.totalDegree() != 1) {
                throw new ContourException("a named form must be linear, got " + name + " = " + value);
            }
        }
    }

    /** One factor as printed: its text in plain and LaTeX, whether it needs brackets under a power, and its power. */
    private record Piece(String plain, String latex, boolean atomic, int power) { }

    /** A rational function as sign and scalar times factors over factors. */
    private record Parts(Rational scalar, List<Piece> numerator, List<Piece> denominator) { }

    /**
     * The factor common to every coefficient of {@code e}: the gcd of the numerators over the lcm
     * of the denominators, with the rational content of what is left taken out too.
     */
    public static RationalFunction common(Expression e) {
        Polynomial g = null;
        Map<Polynomial, Integer> lcm = new LinkedHashMap<>();
        for (RationalFunction c : e.terms().values()) {
            g = g == null ? c.numerator() : PolynomialGcd.gcd(g, c.numerator());
            for (LinearFactors.Factor d : c.denominatorFactors()) {
                lcm.merge(d.base(), d.multiplicity(), Math::max);
            }
        }
        if (g == null) {
            return RationalFunction.ONE;
        }
        RationalFunction common = RationalFunction.of(g.primitivePart());
        for (Map.Entry<Polynomial, Integer> d : lcm.entrySet()) {
            for (int k = 0; k < d.getValue(); k++) {
                common = common.divide(RationalFunction.of(d.getKey()));
            }
        }
        // the rational content of the quotients, so the bracket has integer coefficients without a common divisor
        Rational content = null;
        RationalFunction first = null;
        for (RationalFunction c : e.terms().values()) {
            RationalFunction q = c.divide(common);
            first = first == null ? q : first;
            Polynomial n = q.numerator();
            Rational k = n.content().abs();
            content = content == null ? k : gcd(content, k);
        }
        if (content != null && !content.isZero()) {
            int sign = first.numerator().leadingCoefficient().signum();
            common = common.multiply(sign < 0 ? content.negate() : content);
        }
        return common;
    }

    /** What is left in the bracket: {@code e / common(e)}, a polynomial in every variable when {@code e} is rational. */
    public static Expression inner(Expression e) {
        return e.multiply(RationalFunction.ONE.divide(common(e)));
    }

    private static Rational gcd(Rational a, Rational b) {
        // gcd of rationals: gcd of numerators over lcm of denominators
        java.math.BigInteger n = a.numerator().gcd(b.numerator());
        java.math.BigInteger d = a.denominator().divide(a.denominator().gcd(b.denominator())).multiply(b.denominator());
        return Rational.of(n, d);
    }

    /** Plain text of {@code e}, factors through {@code forms}, the common factor in front when {@code whole}. */
    public static String plain(Expression e, List<Form> forms, boolean whole) {
        if (whole && e.terms().size() > 1) {
            RationalFunction c = common(e);
            return join(fraction(parts(c, forms), false), "(" + sum(inner(e), forms, false) + ")", false);
        }
        return sum(e, forms, false);
    }

    /** LaTeX of {@code e}, as {@link #plain}. */
    public static String latex(Expression e, List<Form> forms, boolean whole) {
        if (whole && e.terms().size() > 1) {
            RationalFunction c = common(e);
            return join(fraction(parts(c, forms), true), "\\left(" + sum(inner(e), forms, true) + "\\right)", true);
        }
        return sum(e, forms, true);
    }

    private static String join(String common, String bracket, boolean latex) {
        if (common.equals("1")) {
            return bracket;
        }
        if (common.equals("-1")) {
            return "-" + bracket;
        }
        return common + (latex ? "\\," : "*") + bracket;
    }

    private static String sum(Expression e, List<Form> forms, boolean latex) {
        if (e.isZero()) {
            return "0";
        }
        StringBuilder out = new StringBuilder();
        // highest degree in the collected variables first, as the other printers do
        for (Map.Entry<Monomial, RationalFunction> t : e.terms().entrySet()) {
            Parts p = parts(t.getValue(), forms);
            String mono = t.getKey().isOne() ? "" : latex ? LatexPrinter.monomial(t.getKey()) : PlainPrinter.monomial(t.getKey());
            boolean negative = p.scalar().signum() < 0;
            Parts positive = new Parts(p.scalar().abs(), p.numerator(), p.denominator());
            String text = fraction(positive, latex);
            if (!mono.isEmpty()) {
                text = text.equals("1") ? mono : withMonomial(positive, mono, latex);
            }
            out.append(out.length() == 0 ? (negative ? "-" : "") : (negative ? " - " : " + ")).append(text);
        }
        return out.toString();
    }

    /** The monomial joins the numerator: {@code (s - 2)*sigma/(t - 4)}. */
    private static String withMonomial(Parts p, String mono, boolean latex) {
        List<Piece> num = new ArrayList<>(p.numerator());
        num.add(new Piece(mono, mono, true, 1));
        return fraction(new Parts(p.scalar(), num, p.denominator()), latex);
    }

    private static String fraction(Parts p, boolean latex) {
        Rational c = p.scalar();
        String sign = c.signum() < 0 ? "-" : "";
        List<String> top = new ArrayList<>();
        if (!c.numerator().abs().equals(java.math.BigInteger.ONE) || p.numerator().isEmpty()) {
            top.add(c.numerator().abs().toString());
        }
        boolean many = p.numerator().size() + top.size() > 1;
        for (Piece x : p.numerator()) {
            top.add(piece(x, many || !latex, latex));
        }
        List<String> bottom = new ArrayList<>();
        if (!c.denominator().equals(java.math.BigInteger.ONE)) {
            bottom.add(c.denominator().toString());
        }
        boolean manyBelow = p.denominator().size() + bottom.size() > 1;
        for (Piece x : p.denominator()) {
            bottom.add(piece(x, manyBelow || !latex, latex));
        }
        String joint = latex ? "\\," : "*";
        String numerator = String.join(joint, top);
        if (bottom.isEmpty()) {
            return sign + numerator;
        }
        String denominator = String.join(joint, bottom);
        if (latex) {
            return sign + "\\frac{" + numerator + "}{" + denominator + "}";
        }
        return sign + numerator + "/" + (bottom.size() > 1 ? "(" + denominator + ")" : denominator);
    }

    private static String piece(Piece x, boolean bracket, boolean latex) {
        String open = latex ? "\\left(" : "(";
        String close = latex ? "\\right)" : ")";
        String base = x.atomic() || !bracket && x.power() == 1 ? (latex ? x.latex() : x.plain()) : open + (latex ? x.latex() : x.plain()) + close;
        if (x.power() == 1) {
            return base;
        }
        String b = x.atomic() ? (latex ? x.latex() : x.plain()) : open + (latex ? x.latex() : x.plain()) + close;
        return latex ? b + "^{" + x.power() + "}" : b + "^" + x.power();
    }

    /** The function split into a scalar and factors, each linear factor written through a form where one fits. */
    private static Parts parts(RationalFunction f, List<Form> forms) {
        Rational scalar = Rational.ONE;
        List<Piece> num = new ArrayList<>();
        Polynomial n = f.numerator();
        if (n.isZero()) {
            return new Parts(Rational.ZERO, List.of(), List.of());
        }
        if (n.isConstant()) {
            scalar = n.constantValue();
        } else {
            Rational content = n.content();
            Polynomial primitive = n.primitivePart();
            scalar = scalar.multiply(content);
            LinearFactors.Split split = LinearFactors.split(primitive);
            scalar = scalar.multiply(split.unit());
            for (LinearFactors.Factor x : split.factors()) {
                scalar = scalar.multiply(place(x, forms, num));
            }
            if (!split.cofactor().isConstant()) {
                num.add(new Piece(PlainPrinter.polynomial(split.cofactor()), LatexPrinter.polynomial(split.cofactor()),
                        split.cofactor().termCount() == 1, 1));
            } else {
                scalar = scalar.multiply(split.cofactor().constantValue());
            }
        }
        List<Piece> den = new ArrayList<>();
        for (LinearFactors.Factor d : f.denominatorFactors()) {
            if (d.base().isConstant()) {
                scalar = scalar.divide(d.base().constantValue().pow(d.multiplicity()));
            } else {
                scalar = scalar.divide(place(d, forms, den));
            }
        }
        return new Parts(scalar, order(num), order(den));
    }

    /**
     * Adds the factor to {@code out}, through a form when {@code base = lambda*(form - k)}; returns
     * lambda^multiplicity (one when no form fits), the number the factor's scalar absorbs.
     */
    private static Rational place(LinearFactors.Factor x, List<Form> forms, List<Piece> out) {
        Polynomial base = x.base();
        if (base.totalDegree() == 1) {
            for (Form form : forms) {
                Rational lambda = proportion(base, form.value(), forms);
                if (lambda != null) {
                    // base = lambda*form + (base0 - lambda*form0) = lambda*(form - k), k = form0 - base0/lambda
                    Polynomial k = constantPart(form.value(), forms).subtract(constantPart(base, forms).multiply(lambda.inverse()));
                    String plain = k.isZero() ? form.name() : form.name() + signed(k, false);
                    String latex = k.isZero() ? Names.latex(form.name()) : Names.latex(form.name()) + signed(k, true);
                    out.add(new Piece(plain, latex, k.isZero(), x.multiplicity()));
                    return lambda.pow(x.multiplicity());
                }
            }
        }
        out.add(new Piece(PlainPrinter.polynomial(base), LatexPrinter.polynomial(base), base.termCount() == 1, x.multiplicity()));
        return Rational.ONE;
    }

    private static String signed(Polynomial k, boolean latex) {
        Polynomial negated = k.negate();
        String text = latex ? LatexPrinter.polynomial(negated) : PlainPrinter.polynomial(negated);
        return text.startsWith("-") ? " - " + text.substring(1) : " + " + text;
    }

    /** The variables the forms are linear in (those of forms that are not just a name for themselves). */
    private static java.util.Set<String> mellin(List<Form> forms) {
        java.util.Set<String> vars = new java.util.TreeSet<>();
        for (Form f : forms) {
            if (f.value().equals(Polynomial.variable(f.name()))) {
                vars.add(f.name());
            }
        }
        return vars;
    }

    private static Polynomial constantPart(Polynomial p, List<Form> forms) {
        Map<String, Polynomial> zero = new TreeMap<>();
        for (String v : mellin(forms)) {
            zero.put(v, Polynomial.ZERO);
        }
        return p.substitute(zero);
    }

    /** lambda with {@code base - base0 = lambda*(form - form0)} in the Mellin variables, or null. */
    private static Rational proportion(Polynomial base, Polynomial form, List<Form> forms) {
        Polynomial b1 = base.subtract(constantPart(base, forms));
        Polynomial f1 = form.subtract(constantPart(form, forms));
        if (b1.isZero() || f1.isZero() || !b1.variables().equals(f1.variables())) {
            return null;
        }
        String v = f1.variables().first();
        Polynomial cb = b1.coefficient(v, 1);
        Polynomial cf = f1.coefficient(v, 1);
        if (!cb.isConstant() || !cf.isConstant()) {
            return null;
        }
        Rational lambda = cb.constantValue().divide(cf.constantValue());
        return b1.equals(f1.multiply(lambda)) ? lambda : null;
    }

    private static List<Piece> order(List<Piece> pieces) {
        List<Piece> sorted = new ArrayList<>(pieces);
        // atomic factors (s, t, sigma) first, then by text: s*t*(utilde - 2), (s - 2)*(t - 4)
        sorted.sort(java.util.Comparator.comparing((Piece p) -> !p.atomic()).thenComparing(p -> p.plain().length() > 12)
                .thenComparing(Piece::plain));
        return sorted;
    }
}
