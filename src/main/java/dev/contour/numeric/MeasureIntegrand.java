package dev.contour.numeric;

import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;
import dev.contour.mellin.GammaPower;
import dev.contour.mellin.MellinMeasure;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import org.apfloat.Apcomplex;
import org.apfloat.ApcomplexMath;
import org.apfloat.Apfloat;
import org.apfloat.Apint;

/**
 * The integrand {@code U^(a s + b) V^(c t + d) M(s, t) prod Gamma(l_i(s, t))^n_i} of any measure,
 * compiled for a tensor grid of straight contours (the script path of {@code position_value}).
 *
 * <p>What makes it fast is what {@link BoxFunction} does by hand: Gamma factors with equal
 * arguments are merged (Gamma(x)^2 is one Gamma evaluation squared); the factors of s alone and the
 * s-part of the power kernel, exp(s a log U), form one product remembered per grid line of s, and
 * likewise for t; a factor of a mixed linear form a s + b t + c is remembered by the value of its
 * argument, which on the grid s = cs + i h k1, t = ct + i h k2 depends only on the integer
 * combination of k1 and k2 and so repeats along diagonals. Memo keys are exact: the imaginary part
 * of the argument is kept as the exact decimal P1 Im s + P2 Im t over a common denominator Q of the
 * coefficients, and divided by Q only when a value is computed. The memos live with this object, one
 * integration.
 */
final class MeasureIntegrand implements Integrand1, Integrand2 {
    /** A Gamma factor of the linear form a s + b t + c to an integer power. */
    private static final class Factor {
        final Rational a;
        final Rational b;
        final int exponent;
        final Apfloat c;
        final Apint p1;
        final Apint p2;
        final Apfloat aValue;
        final Apfloat bValue;
        final Apint q;
        final Map<Apfloat, Apcomplex> memo = new ConcurrentHashMap<>(); // by P1 Im s + P2 Im t (Re s, Re t are fixed)

        Factor(Rational a, Rational b, Rational c, int exponent, long wp) {
            this.a = a;
            this.b = b;
            this.exponent = exponent;
            this.c = PointEvaluation.rational(c, wp + 5);
            BigInteger den = lcm(a.denominator(), b.denominator());
            this.p1 = new Apint(a.numerator().multiply(den.divide(a.denominator())));
            this.p2 = new Apint(b.numerator().multiply(den.divide(b.denominator())));
            this.aValue = PointEvaluation.rational(a, wp + 5);
            this.bValue = PointEvaluation.rational(b, wp + 5);
            this.q = new Apint(den);
        }
    }

    private final String s;
    private final String t;
    private final long wp;
    private final RationalFunction amplitude;
    private final Apcomplex amplitudeConstant;
    private final Apcomplex constant;
    private final Apcomplex kernelS;
    private final Apcomplex kernelT;
    private final List<Factor> onlyS = new ArrayList<>();
    private final List<Factor> onlyT = new ArrayList<>();
    private final List<Factor> mixed = new ArrayList<>();
    private final Map<Apcomplex, Apcomplex> lineS = new ConcurrentHashMap<>();
    private final Map<Apcomplex, Apcomplex> lineT = new ConcurrentHashMap<>();

    /**
     * The integrand of {@code amplitude} against {@code m} at U = u (and V = v; null for the
     * one-variable integral), with Gamma values at {@code wp} significant digits.
     */
    MeasureIntegrand(MellinMeasure m, RationalFunction amplitude, Apcomplex u, Apcomplex v, long wp) {
        this.s = m.s();
        this.t = v == null ? null : m.t();
        this.wp = wp;
        this.amplitude = amplitude;
        long g = wp + 5;
        this.amplitudeConstant = amplitude.isConstant()
                ? PointEvaluation.rationalFunctionAt(amplitude, Map.of(), g) : null;
        // Equal arguments merge: Gamma(x)^2 Gamma(x)^-1 is Gamma(x).
        Map<Polynomial, Integer> powers = new LinkedHashMap<>();
        for (GammaPower f : m.factors()) {
            powers.merge(f.argument(), f.exponent(), Integer::sum);
        }
        Apcomplex fixed = Apcomplex.ONE;
        for (Map.Entry<Polynomial, Integer> e : powers.entrySet()) {
            if (e.getValue() == 0) {
                continue;
            }
            Polynomial arg = e.getKey();
            Rational a = coefficient(arg, s);
            Rational b = t == null ? Rational.ZERO : coefficient(arg, t);
            Rational c = arg.evaluate(zeros(arg));
            Factor f = new Factor(a, b, c, e.getValue(), wp);
            if (a.signum() == 0 && b.signum() == 0) {
                fixed = fixed.multiply(ApcomplexMath.pow(ComplexFunctions.gamma(f.c, g), f.exponent));
            } else if (b.signum() == 0) {
                onlyS.add(f);
            } else if (a.signum() == 0) {
                onlyT.add(f);
            } else {
                mixed.add(f);
            }
        }
        // U^(us s + uo) V^(vs t + vo) = exp(s us log U) exp(t vs log V) U^uo V^vo.
        Polynomial ue = m.uExponent();
        Apcomplex logU = ComplexFunctions.log(u.precision(g), g);
        Rational us = coefficient(ue, s);
        this.kernelS = logU.multiply(PointEvaluation.rational(us, g));
        Apcomplex offsets = logU.multiply(PointEvaluation.rational(ue.evaluate(zeros(ue)), g));
        if (v != null) {
            Polynomial ve = m.vExponent();
            Apcomplex logV = ComplexFunctions.log(v.precision(g), g);
            this.kernelT = logV.multiply(PointEvaluation.rational(coefficient(ve, t), g));
            offsets = offsets.add(logV.multiply(PointEvaluation.rational(ve.evaluate(zeros(ve)), g)));
        } else {
            this.kernelT = Apcomplex.ZERO;
        }
        this.constant = fixed.multiply(ComplexFunctions.exp(offsets, g));
    }

    private static Rational coefficient(Polynomial p, String variable) {
        Polynomial c = p.coefficient(variable, 1);
        return c.isZero() ? Rational.ZERO : c.constantValue();
    }

    private static Map<String, Rational> zeros(Polynomial p) {
        Map<String, Rational> z = new HashMap<>();
        for (String v : p.variables()) {
            z.put(v, Rational.ZERO);
        }
        return z;
    }

    private static BigInteger lcm(BigInteger x, BigInteger y) {
        return x.divide(x.gcd(y)).multiply(y);
    }

    /** Gamma(x)^n at the working precision: one Gamma evaluation whatever n. */
    private Apcomplex gammaPower(Apcomplex x, int n) {
        Apcomplex g = ComplexFunctions.gamma(x, wp);
        return n == 1 ? g : ApcomplexMath.pow(g, n);
    }

    /** The factor's argument a s + b t + c, from the exact key P1 Im s + P2 Im t. */
    private Apcomplex argument(Factor f, Apcomplex sv, Apcomplex tv, Apfloat key) {
        Apfloat re = f.c;
        if (f.a.signum() != 0) {
            re = re.add(f.aValue.multiply(sv.real()));
        }
        if (f.b.signum() != 0) {
            re = re.add(f.bValue.multiply(tv.real()));
        }
        Apfloat im = key.precision(wp + 5).divide(f.q);
        return new Apcomplex(re.precision(wp + 5), im);
    }

    private static Apfloat key(Factor f, Apcomplex sv, Apcomplex tv) {
        Apfloat k = Apfloat.ZERO;
        if (f.p1.signum() != 0) {
            k = f.p1.equals(Apint.ONE) ? sv.imag() : sv.imag().multiply(f.p1);
        }
        if (f.p2.signum() != 0 && tv != null) {
            Apfloat y = f.p2.equals(Apint.ONE) ? tv.imag() : tv.imag().multiply(f.p2);
            k = k.signum() == 0 ? y : k.add(y);
        }
        return k;
    }

    /** exp(x kernel) times the factors of one variable, remembered per grid line. */
    private Apcomplex line(Map<Apcomplex, Apcomplex> memo, List<Factor> factors, Apcomplex kernel, Apcomplex x, boolean isS) {
        Apcomplex known = memo.get(x);
        if (known != null) {
            return known;
        }
        Apcomplex value = kernel.isZero() ? Apcomplex.ONE : ComplexFunctions.exp(x.multiply(kernel), wp);
        for (Factor f : factors) {
            Apfloat k = isS ? key(f, x, null) : key(f, Apcomplex.ZERO, x);
            value = value.multiply(gammaPower(isS ? argument(f, x, Apcomplex.ZERO, k) : argument(f, Apcomplex.ZERO, x, k), f.exponent));
        }
        memo.putIfAbsent(x, value);
        return value;
    }

    private Apcomplex amplitudeAt(Map<String, Apcomplex> point) {
        return amplitudeConstant != null ? amplitudeConstant : PointEvaluation.rationalFunctionAt(amplitude, point, wp + 5);
    }

    @Override
    public Apcomplex at(Apcomplex sv) {
        return line(lineS, onlyS, kernelS, sv, true).multiply(constant)
                .multiply(amplitudeAt(amplitudeConstant != null ? Map.of() : Map.of(s, sv)));
    }

    @Override
    public Apcomplex at(Apcomplex sv, Apcomplex tv) {
        Apcomplex value = line(lineS, onlyS, kernelS, sv, true).multiply(line(lineT, onlyT, kernelT, tv, false));
        for (Factor f : mixed) {
            Apfloat k = key(f, sv, tv);
            Apcomplex known = f.memo.get(k);
            if (known == null) {
                known = gammaPower(argument(f, sv, tv, k), f.exponent);
                f.memo.putIfAbsent(k, known);
            }
            value = value.multiply(known);
        }
        return value.multiply(constant).multiply(amplitudeAt(amplitudeConstant != null ? Map.of() : Map.of(s, sv, t, tv)));
    }
}
