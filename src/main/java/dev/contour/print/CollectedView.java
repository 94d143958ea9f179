package dev.contour.print;

import dev.contour.ContourException;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.RationalFunction;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * An expression grouped by powers of chosen variables: one row per power product, with the
 * coefficient of that product (an expression in everything else).
 *
 * <p>Chosen collected variables split the stored monomials; chosen inner variables are read off
 * the numerators, which needs them to be absent from every denominator.
 */
public final class CollectedView {
    /** One row: exponents of the chosen variables (in the order chosen) and the coefficient. */
    public record Row(List<Integer> exponents, Expression coefficient) { }

    private CollectedView() { }

    public static List<Row> of(Expression e, List<String> variables) {
        Set<String> collected = e.collectedVariables();
        List<String> inner = variables.stream().filter(v -> !collected.contains(v)).toList();
        Map<List<Integer>, Map<Monomial, RationalFunction>> groups = new HashMap<>();
        for (Map.Entry<Monomial, RationalFunction> t : e.terms().entrySet()) {
            Monomial m = t.getKey();
            Map<String, Integer> rest = new HashMap<>(m.exponents());
            List<Integer> exps = new ArrayList<>();
            for (String v : variables) {
                exps.add(collected.contains(v) ? m.exponent(v) : 0);
                rest.remove(v);
            }
            Monomial restMonomial = Monomial.of(rest);
            RationalFunction c = t.getValue();
            if (inner.isEmpty()) {
                addTo(groups, exps, restMonomial, c);
                continue;
            }
            for (String v : inner) {
                if (c.denominator().degree(v) > 0) {
                    throw new ContourException("cannot collect by '" + v + "': it appears in a denominator");
                }
            }
            Polynomial den = c.denominator();
            for (Map.Entry<List<Integer>, Polynomial> part : c.numerator().coefficients(inner).entrySet()) {
                List<Integer> full = new ArrayList<>(exps);
                int k = 0;
                for (int i = 0; i < variables.size(); i++) {
                    if (!collected.contains(variables.get(i))) {
                        full.set(i, part.getKey().get(k++));
                    }
                }
                addTo(groups, full, restMonomial, RationalFunction.of(part.getValue(), den));
            }
        }
        List<Row> rows = new ArrayList<>();
        groups.forEach((exps, terms) -> {
            Expression coefficient = Expression.of(terms);
            if (!coefficient.isZero()) {
                rows.add(new Row(List.copyOf(exps), coefficient));
            }
        });
        rows.sort(Comparator.comparing(Row::exponents, CollectedView::descending));
        return rows;
    }

    /** Higher total degree first, then larger exponents of earlier variables first. */
    private static int descending(List<Integer> a, List<Integer> b) {
        int da = a.stream().mapToInt(Integer::intValue).sum();
        int db = b.stream().mapToInt(Integer::intValue).sum();
        if (da != db) {
            return Integer.compare(db, da);
        }
        for (int i = 0; i < a.size(); i++) {
            if (!a.get(i).equals(b.get(i))) {
                return Integer.compare(b.get(i), a.get(i));
            }
        }
        return 0;
    }

    private static void addTo(Map<List<Integer>, Map<Monomial, RationalFunction>> groups, List<Integer> exps,
                              Monomial m, RationalFunction c) {
        groups.computeIfAbsent(exps, k -> new LinkedHashMap<>()).merge(m, c, RationalFunction::add);
    }

    /** The exponents as a map from chosen variable to exponent, zero exponents left out. */
    public static Map<String, Integer> asMap(List<String> variables, List<Integer> exponents) {
        Map<String, Integer> out = new LinkedHashMap<>();
        for (int i = 0; i < variables.size(); i++) {
            if (exponents.get(i) != 0) {
                out.put(variables.get(i), exponents.get(i));
            }
        }
        return out;
    }
}
