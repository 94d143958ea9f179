package dev.contour.cft;

import dev.contour.ContourException;
import dev.contour.algebra.LinearFactors;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import dev.contour.mellin.GammaPower;
import dev.contour.mellin.MellinMeasure;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;

/**
 * The small-U expansion of a Mellin-Barnes integral
 * {@code int ds/2 dt/2 / (2 pi i)^2 U^(a s + b) V^(c t + d) M(s, t) Gamma(s, t)} (the normalisation of
 * {@code position_value}), exact in each coefficient.
 *
 * <p>The s-contour Re s = cs is closed on the right (U small, a > 0): every pole of the measure or of
 * the amplitude at a fixed s0 > cs contributes minus its residue. A pole of order K gives
 * {@code U^(a s0 + b) (log U)^k}, k < K; this class computes the top power k = K - 1, whose coefficient
 * is the leading Laurent coefficient of the integrand times a^(K-1)/(K-1)! and needs no derivative of
 * the t-dependent Gamma functions (the lower powers need digamma integrals and are reported as not
 * computed). The remaining t-integral is expanded in (1 - V) exactly by {@link BarnesIntegral}.
 * A pole whose position depends on t and lies right of the contour would give powers of U that are
 * not fixed numbers: refused.
 */
public final class SmallUExpansion {
    private SmallUExpansion() { }

    /**
     * One coefficient: {@code U^power (log U)^log} times {@code sum_n series[n] (1 - V)^n}; when
     * {@code series} is null the coefficient was not computed and {@code note} says why.
     */
    public record Term(Rational power, int log, List<Rational> series, String note) {
        public Term {
            series = series == null ? null : List.copyOf(series);
        }

        public boolean computed() {
            return series != null;
        }
    }

    /** The terms by increasing power of U, then decreasing power of log U. */
    public record Result(List<Term> terms, Rational contourS, Rational contourT, Rational through, int order, boolean byChannel) {
        public Result {
            terms = List.copyOf(terms);
        }

        public Result(List<Term> terms, Rational contourS, Rational contourT, Rational through, int order) {
            this(terms, contourS, contourT, through, order, false);
        }
    }

    /** The largest number of poles visited, so that a huge {@code through} fails with a message. */
    public static final int MAX_POLES = 10_000;

    public static Result expand(MellinMeasure m, RationalFunction amplitude, Rational cs, Rational ct, Rational through, int order) {
        return expand(m, amplitude, cs, ct, through, order, false);
    }

    /**
     * As above; with {@code byChannel} every pole of the amplitude whose linear form runs parallel to a
     * Gamma argument of the measure takes that Gamma function's side, in s and in t, instead of the side
     * of the straight contour it happens to fall on. This is the Mellin prescription when no straight
     * contour separates the channels (reduced amplitudes of four equal weights p >= 3: s, t, utilde < 2
     * cannot hold with s + t + utilde = 4p - 4): an s-channel pole is picked up on closing, a pole
     * of the crossed channel (its form moves with s the other way) is not, and in the remaining t-integral
     * the amplitude is split into partial fractions whose poles keep their own channel's side. The contour
     * still decides which poles of the s-dependent Gamma functions are picked up.
     */
    public static Result expand(MellinMeasure m, RationalFunction amplitude, Rational cs, Rational ct, Rational through, int order,
                                boolean byChannel) {
        String s = m.s();
        String t = m.t();
        if (order < 0) {
            throw new ContourException("the order of the (1 - V) series must be at least 0, got " + order);
        }
        if (m.uScale().signum() <= 0) {
            throw new ContourException("the kernel's power of U must grow with s (U^(a s + b) with a > 0) to close the s-contour on the right");
        }
        Set<String> allowed = Set.of(s, t);
        for (String v : amplitude.variables()) {
            if (!allowed.contains(v)) {
                throw new ContourException("the amplitude depends on '" + v + "'; it may depend only on " + s + " and " + t
                        + " (take a coefficient in sigma, tau and fix parameters first)");
            }
        }
        for (Polynomial x : List.of(m.uOffset(), m.vOffset())) {
            if (!x.isConstant()) {
                throw new ContourException("the kernel exponents must be numbers apart from " + s + " and " + t + ", got " + x);
            }
        }
        TreeMap<Rational, Boolean> poles = new TreeMap<>();
        for (GammaPower g : m.factors()) {
            Polynomial arg = g.argument();
            for (String v : arg.variables()) {
                if (!allowed.contains(v)) {
                    throw new ContourException("the Gamma argument " + arg + " depends on '" + v + "'; fix parameters such as p first");
                }
            }
            Rational beta = coefficient(arg, s);
            Rational gamma = coefficient(arg, t);
            Rational alpha = constantTerm(arg);
            if (beta.isZero()) {
                continue;
            }
            if (!gamma.isZero()) {
                if (byChannel && beta.signum() > 0) {
                    continue;
                }
                // Poles at s = (-k - alpha - gamma t)/beta: their real parts on Re t = ct.
                Rational first = alpha.negate().subtract(gamma.multiply(ct)).divide(beta);
                if (g.exponent() > 0 && (beta.signum() < 0 || first.compareTo(cs) >= 0)) {
                    throw new ContourException("the poles of Gamma(" + arg + ") move with " + t + " and lie right of Re " + s + " = " + cs
                            + ": closing the " + s + "-contour there gives powers of U that are not fixed numbers");
                }
                continue;
            }
            if (g.exponent() < 0) {
                continue;
            }
            // Poles at s_k = (-k - alpha)/beta.
            for (int k = 0; ; k++) {
                Rational sk = Rational.of(-k).subtract(alpha).divide(beta);
                Rational power = m.uScale().multiply(sk).add(m.uOffset().constantValue());
                if (beta.signum() < 0 && power.compareTo(through) > 0) {
                    break;
                }
                if (beta.signum() > 0 && sk.compareTo(cs) <= 0) {
                    break;
                }
                if (sk.compareTo(cs) == 0) {
                    throw new ContourException("the contour Re " + s + " = " + cs + " runs through a pole of Gamma(" + arg + ")");
                }
                if (sk.compareTo(cs) > 0 && power.compareTo(through) <= 0) {
                    poles.put(sk, Boolean.TRUE);
                }
                if (k > MAX_POLES) {
                    throw new ContourException("more than " + MAX_POLES + " poles below U^" + through + "; lower 'through'");
                }
            }
        }
        if (!amplitude.isZero()) {
            LinearFactors.Split split = LinearFactors.split(amplitude.denominator());
            if (split.cofactor().variables().contains(s)) {
                throw new ContourException("the amplitude's denominator has a factor " + split.cofactor()
                        + " that is not linear; its poles in " + s + " are not handled");
            }
            for (LinearFactors.Factor f : split.factors()) {
                Rational a = coefficient(f.base(), s);
                Rational b = coefficient(f.base(), t);
                Rational c = constantTerm(f.base());
                if (a.isZero()) {
                    continue;
                }
                Integer side = byChannel ? channelSide(m, f.base(), s) : null;
                if (side != null && side < 0) {
                    continue;
                }
                if (side != null && side > 0) {
                    if (!b.isZero()) {
                        throw new ContourException("the amplitude's pole " + f.base() + " = 0 moves with " + t + " and lies right in "
                                + s + " by its channel: closing there gives powers of U that are not fixed numbers");
                    }
                    Rational fixed = c.negate().divide(a);
                    if (m.uScale().multiply(fixed).add(m.uOffset().constantValue()).compareTo(through) <= 0) {
                        poles.put(fixed, Boolean.TRUE);
                    }
                    continue;
                }
                Rational at = c.negate().subtract(b.multiply(ct)).divide(a);
                if (at.compareTo(cs) == 0) {
                    throw new ContourException("the contour Re " + s + " = " + cs + " runs through the amplitude's pole " + f.base() + " = 0");
                }
                if (at.compareTo(cs) < 0) {
                    continue;
                }
                if (!b.isZero()) {
                    throw new ContourException("the amplitude's pole " + f.base() + " = 0 moves with " + t + " and lies right of Re "
                            + s + " = " + cs + ": closing there gives powers of U that are not fixed numbers");
                }
                Rational power = m.uScale().multiply(at).add(m.uOffset().constantValue());
                if (power.compareTo(through) <= 0) {
                    poles.put(at, Boolean.TRUE);
                }
            }
        }
        List<Term> terms = new ArrayList<>();
        for (Rational s0 : poles.keySet()) {
            terms.addAll(atPole(m, amplitude, s0, ct, order, byChannel));
        }
        return new Result(terms, cs, ct, through, order, byChannel);
    }

    /** The terms a pole at s = s0 contributes, top log power first. */
    private static List<Term> atPole(MellinMeasure m, RationalFunction amplitude, Rational s0, Rational ct, int order, boolean byChannel) {
        String s = m.s();
        String t = m.t();
        Rational power = m.uScale().multiply(s0).add(m.uOffset().constantValue());
        int order0 = 0;
        Rational leading = Rational.ONE;
        List<GammaPower> tGammas = new ArrayList<>();
        String where = "the residue at " + s + " = " + s0;
        for (GammaPower g : m.factors()) {
            Polynomial arg = g.argument();
            Rational beta = coefficient(arg, s);
            Rational gamma = coefficient(arg, t);
            Rational x0 = constantTerm(arg).add(beta.multiply(s0));
            if (!gamma.isZero()) {
                tGammas.add(new GammaPower(arg.substitute(Map.of(s, Polynomial.constant(s0))), g.exponent()));
                continue;
            }
            if (x0.isInteger() && x0.signum() <= 0 && !beta.isZero()) {
                // Gamma(-n + beta e) = (-1)^n / (n! beta e) (1 + O(e)).
                int n = -x0.intValueExact();
                Rational c = Rational.of(n % 2 == 0 ? 1 : -1).divide(ExactGamma.factorial(n).multiply(beta));
                leading = leading.multiply(c.pow(g.exponent()));
                order0 += g.exponent();
            } else {
                leading = leading.multiply(ExactGamma.of(x0, where).pow(g.exponent()));
            }
        }
        // The amplitude: (s - s0)^mult M at s = s0.
        Polynomial sMinus = Polynomial.variable(s).subtract(Polynomial.constant(s0));
        int mult = 0;
        Polynomial den = amplitude.denominator();
        while (true) {
            var q = den.tryDivide(sMinus);
            if (q.isEmpty()) {
                break;
            }
            den = q.get();
            mult++;
        }
        order0 += mult;
        if (order0 <= 0) {
            return List.of();
        }
        RationalFunction atS = amplitude.multiply(RationalFunction.of(sMinus.pow(mult)));
        RationalFunction r = atS.evaluatePartially(Map.of(s, s0));
        int top = order0 - 1;
        Rational prefactor = leading.multiply(m.uScale().pow(top)).divide(ExactGamma.factorial(top))
                .multiply(Rational.of(-1, 2));
        List<Term> out = new ArrayList<>();
        List<Rational> series = byChannel ? byChannel(m, tGammas, atS, s0, ct, order, where)
                : tIntegral(m, tGammas, r, ct, order, where, null);
        List<Rational> scaled = new ArrayList<>();
        series.forEach(x -> scaled.add(x.multiply(prefactor)));
        out.add(new Term(power, top, scaled, null));
        for (int k = top - 1; k >= 0; k--) {
            out.add(new Term(power, k, null, "a pole of order " + order0 + " at " + s + " = " + s0
                    + ": this power of log U needs digamma integrals in " + t + ", not computed"));
        }
        return out;
    }

    /**
     * The t-integral of the residue {@code a(s0, t)} with every pole on its channel's side: a(s, t) is split
     * at generic s into partial fractions in t, one simple pole per linear factor (its coefficient a
     * function of s, evaluated at s0 afterwards, so two factors that meet at s0 stay apart), plus a
     * polynomial in t; each part is integrated with its own side.
     */
    private static List<Rational> byChannel(MellinMeasure m, List<GammaPower> gammas, RationalFunction a, Rational s0, Rational ct,
                                            int order, String where) {
        String s = m.s();
        String t = m.t();
        Map<String, Rational> at = Map.of(s, s0);
        RationalFunction r = a.evaluatePartially(at);
        LinearFactors.Split split = LinearFactors.split(a.denominator());
        if (split.cofactor().variables().contains(t)) {
            throw new ContourException(where + ": the amplitude's denominator has a factor " + split.cofactor()
                    + " that is not linear in " + t);
        }
        List<Rational> total = null;
        RationalFunction rest = r;
        for (LinearFactors.Factor f : split.factors()) {
            Rational b = coefficient(f.base(), t);
            if (b.isZero()) {
                continue;
            }
            Integer side = channelSide(m, f.base(), t);
            if (side == null || side == 0) {
                throw new ContourException(where + ": no Gamma function of the measure runs parallel to the amplitude's pole "
                        + f.base() + " = 0, so its channel does not fix its side");
            }
            if (f.multiplicity() > 1) {
                throw new ContourException(where + ": the amplitude's pole " + f.base() + " = 0 has order " + f.multiplicity()
                        + "; with poles placed by channel only simple poles are handled");
            }
            // Residue coefficient c(s) = (f a)(s, t*(s)), t*(s) the root of f.
            Polynomial root = f.base().subtract(Polynomial.variable(t).multiply(b)).multiply(b.inverse().negate());
            RationalFunction c = a.multiply(RationalFunction.of(f.base())).substituteLinear(Map.of(t, root));
            if (c.denominator().evaluate(at).isZero()) {
                throw new ContourException(where + ": the amplitude's pole " + f.base() + " = 0 meets another of its poles at "
                        + s + " = " + s0 + " within one term (the t-contour is pinched)");
            }
            Polynomial fAt = f.base().substitute(Map.of(s, Polynomial.constant(s0)));
            RationalFunction piece = c.evaluatePartially(at).divide(RationalFunction.of(fAt));
            rest = rest.subtract(piece);
            total = add(total, tIntegral(m, gammas, piece, ct, order, where, side > 0));
        }
        if (!rest.isPolynomial()) {
            throw new ContourException(where + ": the partial fractions in " + t + " left " + rest + ", not a polynomial");
        }
        return add(total, tIntegral(m, gammas, rest, ct, order, where, Boolean.TRUE));
    }

    private static List<Rational> add(List<Rational> x, List<Rational> y) {
        if (x == null) {
            return y;
        }
        List<Rational> out = new ArrayList<>();
        for (int i = 0; i < x.size(); i++) {
            out.add(x.get(i).add(y.get(i)));
        }
        return out;
    }

    /**
     * The side in {@code v} of a pole factor's channel: +1 right, -1 left, 0 when a parallel Gamma function
     * does not depend on v; null when no Gamma argument of the measure runs parallel to it, or two do with
     * opposite sides.
     */
    private static Integer channelSide(MellinMeasure m, Polynomial factor, String v) {
        Rational a = coefficient(factor, m.s());
        Rational b = coefficient(factor, m.t());
        Integer side = null;
        for (GammaPower g : m.factors()) {
            if (g.exponent() <= 0) {
                continue;
            }
            Rational beta = coefficient(g.argument(), m.s());
            Rational gamma = coefficient(g.argument(), m.t());
            if ((beta.isZero() && gamma.isZero()) || !a.multiply(gamma).equals(b.multiply(beta))) {
                continue;
            }
            Rational slope = v.equals(m.s()) ? beta : gamma;
            int here = -slope.signum();
            if (side != null && side != here) {
                return null;
            }
            side = here;
        }
        return side;
    }

    /** {@code int dt/2/(2 pi i) V^(c t + d) r(t) prod Gamma(...)} as a series in (1 - V); {@code side} as in BarnesIntegral. */
    private static List<Rational> tIntegral(MellinMeasure m, List<GammaPower> gammas, RationalFunction r, Rational ct, int order, String where,
                                            Boolean side) {
        String t = m.t();
        if (r.isZero()) {
            List<Rational> zeros = new ArrayList<>();
            for (int n = 0; n <= order; n++) {
                zeros.add(Rational.ZERO);
            }
            return zeros;
        }
        Rational kappa = null;
        for (GammaPower g : gammas) {
            Rational gamma = coefficient(g.argument(), t).abs();
            if (g.exponent() < 0) {
                throw new ContourException(where + ": the Gamma function " + g + " in the denominator leaves an integral that is not of Barnes form");
            }
            if (kappa != null && !kappa.equals(gamma)) {
                throw new ContourException(where + ": the Gamma arguments have different slopes in " + t
                        + "; the integral is not of Barnes form");
            }
            kappa = gamma;
        }
        if (kappa == null) {
            throw new ContourException(where + ": no Gamma function depends on " + t + "; the " + t + "-integral does not converge");
        }
        // x = kappa t; Gamma(alpha + gamma t) = Gamma(alpha +- x).
        List<Rational> lefts = new ArrayList<>();
        List<Rational> rights = new ArrayList<>();
        for (GammaPower g : gammas) {
            Rational gamma = coefficient(g.argument(), t);
            Rational alpha = constantTerm(g.argument());
            for (int i = 0; i < g.exponent(); i++) {
                (gamma.signum() > 0 ? lefts : rights).add(alpha);
            }
        }
        // r(t) = numerator / (unit * prod (a t + b)^m); in x: a t + b = (a/kappa)(x - root).
        RationalFunction rx = r.substitute(Map.of(t, RationalFunction.of(Polynomial.variable(t).multiply(kappa.inverse()))));
        Polynomial num = rx.numerator();
        LinearFactors.Split split = LinearFactors.split(rx.denominator());
        if (!split.cofactor().isConstant()) {
            throw new ContourException(where + ": the amplitude's denominator has a factor " + split.cofactor()
                    + " that does not split into linear factors in " + t);
        }
        Rational scale = split.unit().multiply(split.cofactor().constantValue()).inverse();
        List<BarnesIntegral.PoleFactor> poles = new ArrayList<>();
        for (LinearFactors.Factor f : split.factors()) {
            Rational a = coefficient(f.base(), t);
            Rational b = constantTerm(f.base());
            scale = scale.divide(a.pow(f.multiplicity()));
            poles.add(new BarnesIntegral.PoleFactor(b.negate().divide(a), f.multiplicity()));
        }
        List<Rational> coeffs = new ArrayList<>();
        for (int k = 0; k <= num.degree(t); k++) {
            Polynomial c = num.coefficient(t, k);
            coeffs.add(c.isZero() ? Rational.ZERO : c.constantValue());
        }
        Rational lambda = m.vScale().divide(kappa);
        Rational mu = m.vOffset().constantValue();
        // dt/2 = dx/(2 kappa).
        scale = scale.divide(kappa.multiply(Rational.of(2)));
        List<Rational> raw;
        try {
            raw = BarnesIntegral.expand(lefts, rights, new UnivariatePolynomial(coeffs), poles, kappa.multiply(ct), side, lambda, mu, order);
        } catch (ContourException e) {
            throw new ContourException(where + " (x = " + kappa + "*" + t + "): " + e.getMessage());
        }
        List<Rational> out = new ArrayList<>();
        for (Rational x : raw) {
            out.add(x.multiply(scale));
        }
        return out;
    }

    private static Rational coefficient(Polynomial p, String v) {
        Polynomial c = p.coefficient(v, 1);
        if (!c.isConstant() && !c.isZero()) {
            throw new ContourException("expected a number as the coefficient of " + v + " in " + p + ", got " + c);
        }
        return c.isZero() ? Rational.ZERO : c.constantValue();
    }

    private static Rational constantTerm(Polynomial p) {
        Map<String, Rational> zero = new java.util.HashMap<>();
        p.variables().forEach(v -> zero.put(v, Rational.ZERO));
        return p.evaluate(zero);
    }
}
