package dev.contour.mellin;

import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import org.apfloat.Apcomplex;
import org.apfloat.ApcomplexMath;
import org.apfloat.Apfloat;

import java.util.Map;

/** Evaluation of exact rational functions at complex points with apfloat, for numeric cross-checks in tests. */
final class Numeric {
    private Numeric() { }

    static Apcomplex evaluate(RationalFunction f, Map<String, Apcomplex> point, long precision) {
        return evaluate(f.numerator(), point, precision).divide(evaluate(f.denominator(), point, precision));
    }

    static Apcomplex evaluate(Polynomial p, Map<String, Apcomplex> point, long precision) {
        Apcomplex sum = new Apcomplex(new Apfloat(0, precision));
        for (Polynomial.Term term : p.terms()) {
            Apcomplex x = constant(term.coefficient(), precision);
            for (Map.Entry<String, Integer> e : term.exponents().entrySet()) {
                x = x.multiply(ApcomplexMath.pow(point.get(e.getKey()), e.getValue()));
            }
            sum = sum.add(x);
        }
        return sum;
    }

    private static Apcomplex constant(Rational c, long precision) {
        return new Apcomplex(new Apfloat(c.numerator(), precision).divide(new Apfloat(c.denominator(), precision)));
    }
}
