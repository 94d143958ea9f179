package dev.contour.solve;

import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * coefficient * prod forms[i]^exps[i] * cofactor over a positional variable space: one term of a
 * Mellin amplitude kept in factored form (immutable).
 *
 * <p>Mellin amplitudes are sums of such terms: Pochhammer symbols and pole factors are linear
 * forms, so residues and expansions reduce to evaluating linear forms. The cofactor holds any
 * numerator part without linear factors (null means 1); it is a polynomial in the space's names.
 * Forms are monic ({@link LinearForm#monic()}), pairwise distinct, non-constant, with non-zero
 * exponents.
 */
final class FactoredTerm {
    final Rational coefficient;
    final LinearForm[] forms;
    final int[] exps;
    final Polynomial cofactor;

    private FactoredTerm(Rational coefficient, LinearForm[] forms, int[] exps, Polynomial cofactor) {
        this.coefficient = coefficient;
        this.forms = forms;
        this.exps = exps;
        this.cofactor = cofactor;
    }

    /** Builds a term, merging equal lines, folding constant forms and scales into the coefficient. Null for 0. */
    static FactoredTerm of(Rational c, List<LinearForm> forms, List<Integer> exps, Polynomial cofactor) {
        if (c.isZero() || cofactor != null && cofactor.isZero()) {
            return null;
        }
        if (cofactor != null && cofactor.isConstant()) {
            c = c.multiply(cofactor.constantValue());
            cofactor = null;
        }
        List<LinearForm> fs = new ArrayList<>(forms.size());
        List<Integer> es = new ArrayList<>(forms.size());
        for (int i = 0; i < forms.size(); i++) {
            LinearForm f = forms.get(i);
            int e = exps.get(i);
            if (e == 0) {
                continue;
            }
            if (f.isConstant()) {
                if (f.constant.isZero()) {
                    if (e > 0) {
                        return null;
                    }
                    throw new dev.contour.ContourException("division by zero in a factored term");
                }
                c = c.multiply(f.constant.pow(e));
                continue;
            }
            LinearForm m = f.monic();
            if (m != f) {
                c = c.multiply(f.coefficient(f.pivot()).pow(e));
            }
            int at = fs.indexOf(m);
            if (at >= 0) {
                int sum = es.get(at) + e;
                if (sum == 0) {
                    fs.remove(at);
                    es.remove(at);
                } else {
                    es.set(at, sum);
                }
            } else {
                fs.add(m);
                es.add(e);
            }
        }
        return new FactoredTerm(c, fs.toArray(new LinearForm[0]), es.stream().mapToInt(Integer::intValue).toArray(),
                cofactor);
    }

    /**
     * The product with another term (forms on equal lines merge). Null for 0. Both terms are
     * canonical (monic, distinct, non-constant forms; non-zero coefficients), so only equal forms
     * need merging: the result is the one {@link #of} gives for the concatenated lists, without
     * re-normalising every form.
     */
    FactoredTerm times(FactoredTerm o) {
        int n = forms.length;
        LinearForm[] fs = Arrays.copyOf(forms, n + o.forms.length);
        int[] es = Arrays.copyOf(exps, n + o.forms.length);
        for (int j = 0; j < o.forms.length; j++) {
            LinearForm f = o.forms[j];
            int at = -1;
            for (int i = 0; i < n; i++) {
                if (fs[i].equals(f)) {
                    at = i;
                    break;
                }
            }
            if (at < 0) {
                fs[n] = f;
                es[n++] = o.exps[j];
                continue;
            }
            int sum = es[at] + o.exps[j];
            if (sum != 0) {
                es[at] = sum;
                continue;
            }
            System.arraycopy(fs, at + 1, fs, at, n - at - 1);
            System.arraycopy(es, at + 1, es, at, n - at - 1);
            n--;
        }
        Polynomial cof = cofactor == null ? o.cofactor : o.cofactor == null ? cofactor : cofactor.multiply(o.cofactor);
        return new FactoredTerm(coefficient.multiply(o.coefficient), Arrays.copyOf(fs, n), Arrays.copyOf(es, n), cof);
    }

    /**
     * The term with its variables shifted, v -> v + amounts (positional, for the forms; by name,
     * for the cofactor): forms keep their slopes and move their constants.
     */
    FactoredTerm translated(Rational[] amounts, java.util.Map<String, Polynomial> byName) {
        List<LinearForm> fs = new ArrayList<>(forms.length);
        List<Integer> es = new ArrayList<>(forms.length);
        for (int i = 0; i < forms.length; i++) {
            fs.add(forms[i].translate(amounts));
            es.add(exps[i]);
        }
        Polynomial cof = cofactor == null || byName.isEmpty() ? cofactor : cofactor.substitute(byName);
        return of(coefficient, fs, es, cof);
    }

    int size() {
        return forms.length;
    }

    /** Total degree of numerator minus denominator, counting the cofactor. */
    int degree() {
        int d = cofactor == null ? 0 : cofactor.totalDegree();
        for (int e : exps) {
            d += e;
        }
        return d;
    }

    @Override
    public String toString() {
        return coefficient + " * " + Arrays.toString(forms) + "^" + Arrays.toString(exps) + (cofactor == null ? "" : " * (" + cofactor + ")");
    }
}
