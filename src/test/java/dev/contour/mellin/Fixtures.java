package dev.contour.mellin;

import dev.contour.algebra.Expression;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;

/** Small builders shared by the mellin tests. */
final class Fixtures {
    private Fixtures() { }

    static Expression s() { return Expression.variable("s"); }
    static Expression t() { return Expression.variable("t"); }
    static Expression p() { return Expression.variable("p"); }
    static Expression sigma() { return Expression.collectedVariable("sigma"); }
    static Expression tau() { return Expression.collectedVariable("tau"); }
    static Expression c(long n) { return Expression.constant(n); }
    static Expression c(long n, long d) { return Expression.constant(Rational.of(n, d)); }
    static Polynomial ps() { return Polynomial.variable("s"); }
    static Polynomial pt() { return Polynomial.variable("t"); }
    static Polynomial pc(long n) { return Polynomial.constant(n); }
    static Polynomial symbolicP() { return Polynomial.variable("p"); }

    /** {@code 1 / x} for an expression free of collected variables. */
    static Expression inv(Expression x) {
        return Expression.ONE.divide(x);
    }

    /** The Pochhammer symbol written out as a product, independent of GammaRatio. */
    static Expression poch(Expression x, int n) {
        Expression r = Expression.ONE;
        for (int i = 0; i < n; i++) {
            r = r.multiply(x.add(c(i)));
        }
        return r;
    }

    static RationalFunction rf(Expression e) {
        return e.asRationalFunction();
    }
}
