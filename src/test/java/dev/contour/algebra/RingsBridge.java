package dev.contour.algebra;

import cc.redberry.rings.Rings;
import cc.redberry.rings.bigint.BigInteger;
import cc.redberry.rings.poly.multivar.MonomialOrder;
import cc.redberry.rings.poly.multivar.MultivariatePolynomial;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/** Term-by-term conversion between our polynomials and the reference library's, over fixed variables. */
final class RingsBridge {
    private final List<String> vars;

    RingsBridge(List<String> vars) {
        this.vars = List.copyOf(vars);
    }

    /** The primitive integer form of p as a polynomial over Z in the reference library. */
    MultivariatePolynomial<BigInteger> toRings(Polynomial p) {
        Polynomial q = p.primitivePart();
        List<cc.redberry.rings.poly.multivar.Monomial<BigInteger>> ms = new ArrayList<>();
        for (Polynomial.Term t : q.terms()) {
            int[] e = new int[vars.size()];
            t.exponents().forEach((v, x) -> e[vars.indexOf(v)] = x);
            ms.add(new cc.redberry.rings.poly.multivar.Monomial<>(e, new BigInteger(t.coefficient().numerator().toString())));
        }
        return MultivariatePolynomial.create(vars.size(), Rings.Z, MonomialOrder.GREVLEX, ms);
    }

    Polynomial fromRings(MultivariatePolynomial<BigInteger> p) {
        Polynomial out = Polynomial.ZERO;
        for (cc.redberry.rings.poly.multivar.Monomial<BigInteger> m : p) {
            Map<String, Integer> e = new HashMap<>();
            for (int i = 0; i < vars.size(); i++) {
                e.put(vars.get(i), m.exponents[i]);
            }
            out = out.add(Polynomial.monomial(Rational.of(new java.math.BigInteger(m.coefficient.toString())), e));
        }
        return out;
    }
}
