package dev.contour.print;

import dev.contour.algebra.Expression;
import dev.contour.algebra.LinearFactors;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.RationalFunction;
import dev.contour.term.Term;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * JSON rendering of canonical values: one object per collected monomial with its numerator terms
 * (coefficient as a {@code "p/q"} string and an exponent map) and denominator factors (the factor's
 * terms and its exponent). Keys come in a fixed order, so output is reproducible.
 */
public final class JsonPrinter {
    private JsonPrinter() { }

    public static String expression(Expression e) {
        List<String> terms = new ArrayList<>();
        for (Map.Entry<Monomial, RationalFunction> t : e.terms().entrySet()) {
            RationalFunction c = t.getValue();
            List<String> den = new ArrayList<>();
            for (LinearFactors.Factor f : c.denominatorFactors()) {
                den.add("{\"factor\":" + polynomial(f.base()) + ",\"exponent\":" + f.multiplicity() + "}");
            }
            terms.add("{\"monomial\":" + exponents(t.getKey().exponents()) + ",\"numerator\":" + polynomial(c.numerator())
                    + ",\"denominator\":[" + String.join(",", den) + "]}");
        }
        return "{\"kind\":\"expression\",\"terms\":[" + String.join(",", terms) + "]}";
    }

    /** A polynomial as its list of terms. */
    public static String polynomial(Polynomial p) {
        List<String> terms = new ArrayList<>();
        for (Polynomial.Term t : p.terms()) {
            terms.add("{\"coefficient\":" + string(t.coefficient().toString()) + ",\"exponents\":" + exponents(t.exponents()) + "}");
        }
        return "[" + String.join(",", terms) + "]";
    }

    private static String exponents(Map<String, Integer> exps) {
        List<String> parts = new ArrayList<>();
        new TreeMap<>(exps).forEach((v, e) -> parts.add(string(v) + ":" + e));
        return "{" + String.join(",", parts) + "}";
    }

    /** A symbolic term: its plain text and its tree. */
    public static String term(Term t) {
        return "{\"kind\":\"term\",\"text\":" + string(PlainPrinter.term(t, false)) + ",\"tree\":" + tree(t) + "}";
    }

    private static String tree(Term t) {
        if (t instanceof Term.Leaf l) {
            return expression(l.value());
        }
        if (t instanceof Term.Apply a) {
            return "{\"apply\":" + string(a.function()) + ",\"arguments\":[" + String.join(",", a.arguments().stream().map(JsonPrinter::tree).toList()) + "]}";
        }
        if (t instanceof Term.Sum s) {
            return "{\"sum\":[" + String.join(",", s.terms().stream().map(JsonPrinter::tree).toList()) + "]}";
        }
        if (t instanceof Term.Product p) {
            return "{\"product\":[" + String.join(",", p.factors().stream().map(JsonPrinter::tree).toList()) + "]}";
        }
        Term.Power w = (Term.Power) t;
        return "{\"power\":" + tree(w.base()) + ",\"exponent\":" + w.exponent() + "}";
    }

    /** A JSON string literal. */
    public static String string(String s) {
        StringBuilder out = new StringBuilder("\"");
        for (char c : s.toCharArray()) {
            switch (c) {
                case '"' -> out.append("\\\"");
                case '\\' -> out.append("\\\\");
                case '\n' -> out.append("\\n");
                case '\t' -> out.append("\\t");
                case '\r' -> out.append("\\r");
                default -> {
                    if (c < 0x20) {
                        out.append(String.format("\\u%04x", (int) c));
                    } else {
                        out.append(c);
                    }
                }
            }
        }
        return out.append('"').toString();
    }
}
