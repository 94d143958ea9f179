package dev.contour.solve;

import dev.contour.ContourException;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Monomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import java.util.TreeMap;

/**
 * How many different functions a family of solutions describes. An expression with a family
 * applied is affine in the free unknowns, {@code E0 + sum_f f * E_f}; an ansatz whose terms obey
 * exact linear relations (such as the functions {@code 1/((s-a)(t-b)(u-c))} with {@code s + t + u}
 * fixed) has directions {@code E_f} that are linearly dependent, so some free unknowns only
 * re-express the same function.
 *
 * <p>Exact: the directions are evaluated at random rational points, which can only underestimate
 * their rank; every relation the evaluations suggest is then verified exactly with the algebra. When
 * all are verified the rank is exact; otherwise more points are taken (never a guess).
 */
public final class FunctionRelations {
    /** The result: the free unknowns whose directions form a basis (in the family's order), and the verified relations. */
    public record Result(List<String> free, List<String> basis, List<Expression> basisFunctions,
                         List<Map<String, Rational>> relations) {
        public Result {
            free = List.copyOf(free);
            basis = List.copyOf(basis);
            basisFunctions = List.copyOf(basisFunctions);
            relations = List.copyOf(relations);
        }

        /** The number of linearly independent functions the free unknowns move through. */
        public int dimension() {
            return basis.size();
        }
    }

    private static final int MAX_ROUNDS = 8;

    private FunctionRelations() { }

    /** The directions of {@code e} (already with the solution applied) along each free unknown. */
    public static Result of(Expression e, List<String> free) {
        List<Expression> directions = directions(e, free);
        List<String> inner = new ArrayList<>(e.innerVariables());
        SplittableRandom random = new SplittableRandom(0x5eedL);
        List<Rational[]> rows = new ArrayList<>();
        int n = free.size();
        for (int round = 0; round < MAX_ROUNDS; round++) {
            int want = n + 4 + round * (n + 4);
            while (rows.size() < want) {
                Map<String, Rational> point = randomPoint(inner, random);
                List<Rational[]> more = rowsAt(directions, point);
                if (more == null) {
                    continue; // a pole of some coefficient: another point
                }
                if (more.isEmpty()) {
                    break; // every direction is zero
                }
                rows.addAll(more);
            }
            Echelon ech = Echelon.of(rows, n);
            List<Map<String, Rational>> relations = new ArrayList<>();
            boolean verified = true;
            for (Rational[] k : ech.kernel()) {
                Expression sum = Expression.ZERO;
                Map<String, Rational> rel = new TreeMap<>();
                for (int f = 0; f < n; f++) {
                    if (!k[f].isZero()) {
                        sum = sum.add(directions.get(f).multiply(RationalFunction.constant(k[f])));
                        rel.put(free.get(f), k[f]);
                    }
                }
                if (!sum.isZero()) {
                    verified = false;
                    break;
                }
                relations.add(rel);
            }
            if (verified) {
                List<String> basis = new ArrayList<>();
                List<Expression> functions = new ArrayList<>();
                for (int f : ech.pivots()) {
                    basis.add(free.get(f));
                    functions.add(directions.get(f));
                }
                return new Result(free, basis, functions, relations);
            }
        }
        throw new ContourException("could not separate the " + n + " free directions with " + rows.size()
                + " sample values: the function count stays undecided");
    }

    /** E_f: the part of e proportional to the free unknown f (e is affine in them). */
    static List<Expression> directions(Expression e, List<String> free) {
        Map<String, Integer> index = new HashMap<>();
        for (int f = 0; f < free.size(); f++) {
            index.put(free.get(f), f);
        }
        List<Map<Monomial, RationalFunction>> parts = new ArrayList<>();
        free.forEach(f -> parts.add(new HashMap<>()));
        for (Map.Entry<Monomial, RationalFunction> t : e.terms().entrySet()) {
            Map<String, Integer> exps = new TreeMap<>(t.getKey().exponents());
            String hit = null;
            for (Map.Entry<String, Integer> x : exps.entrySet()) {
                if (index.containsKey(x.getKey())) {
                    if (hit != null || x.getValue() != 1) {
                        throw new ContourException("the expression is not affine in the free unknowns ("
                                + t.getKey() + ")");
                    }
                    hit = x.getKey();
                }
            }
            if (hit != null) {
                exps.remove(hit);
                parts.get(index.get(hit)).merge(Monomial.of(exps), t.getValue(), RationalFunction::add);
            }
        }
        List<Expression> out = new ArrayList<>();
        for (Map<Monomial, RationalFunction> p : parts) {
            out.add(Expression.of(p));
        }
        return out;
    }

    private static Map<String, Rational> randomPoint(List<String> inner, SplittableRandom random) {
        Map<String, Rational> p = new HashMap<>();
        for (String v : inner) {
            p.put(v, Rational.of(random.nextLong(-1000, 1000), random.nextLong(1, 97)));
        }
        return p;
    }

    /** One row per collected monomial: the directions' coefficients at the point; null at a pole. */
    private static List<Rational[]> rowsAt(List<Expression> directions, Map<String, Rational> point) {
        Map<Monomial, Rational[]> rows = new TreeMap<>();
        int n = directions.size();
        try {
            for (int f = 0; f < n; f++) {
                for (Map.Entry<Monomial, RationalFunction> t : directions.get(f).terms().entrySet()) {
                    Rational[] row = rows.computeIfAbsent(t.getKey(), m -> zeros(n));
                    row[f] = t.getValue().evaluate(point);
                }
            }
        } catch (ContourException pole) {
            return null;
        }
        return new ArrayList<>(rows.values());
    }

    private static Rational[] zeros(int n) {
        Rational[] r = new Rational[n];
        java.util.Arrays.fill(r, Rational.ZERO);
        return r;
    }

    /** Reduced row echelon form over Q of sample rows: pivot columns and a kernel basis. */
    private record Echelon(List<Integer> pivots, List<Rational[]> kernel) {
        static Echelon of(List<Rational[]> sample, int n) {
            List<Rational[]> rows = new ArrayList<>();
            for (Rational[] r : sample) {
                rows.add(r.clone());
            }
            List<Integer> pivots = new ArrayList<>();
            int r = 0;
            for (int c = 0; c < n && r < rows.size(); c++) {
                int p = -1;
                for (int i = r; i < rows.size(); i++) {
                    if (!rows.get(i)[c].isZero()) {
                        p = i;
                        break;
                    }
                }
                if (p < 0) {
                    continue;
                }
                java.util.Collections.swap(rows, r, p);
                Rational[] piv = rows.get(r);
                Rational inv = piv[c].inverse();
                for (int j = c; j < n; j++) {
                    piv[j] = piv[j].multiply(inv);
                }
                for (int i = 0; i < rows.size(); i++) {
                    Rational[] row = rows.get(i);
                    if (i != r && !row[c].isZero()) {
                        Rational m = row[c];
                        for (int j = c; j < n; j++) {
                            if (!piv[j].isZero()) {
                                row[j] = row[j].subtract(m.multiply(piv[j]));
                            }
                        }
                    }
                }
                pivots.add(c);
                r++;
            }
            List<Rational[]> kernel = new ArrayList<>();
            for (int c = 0; c < n; c++) {
                if (pivots.contains(c)) {
                    continue;
                }
                Rational[] k = zeros(n);
                k[c] = Rational.ONE;
                for (int i = 0; i < pivots.size(); i++) {
                    k[pivots.get(i)] = rows.get(i)[c].negate();
                }
                kernel.add(k);
            }
            return new Echelon(pivots, kernel);
        }
    }
}
