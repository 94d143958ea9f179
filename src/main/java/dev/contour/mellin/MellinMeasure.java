package dev.contour.mellin;

import dev.contour.ContourException;
import dev.contour.algebra.Expression;
import dev.contour.algebra.Polynomial;
import dev.contour.algebra.Rational;
import dev.contour.algebra.RationalFunction;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * A Mellin measure: a product of Gamma functions of linear forms in the Mellin variables s, t
 * together with the power kernel {@code U^(uScale*s + uOffset) V^(vScale*t + vOffset)}.
 *
 * <p>A third variable (u) may appear in the Gamma arguments; it is eliminated at construction
 * through the declared constraint {@code s + t + u = sum}, so the stored factors mention only s, t
 * and parameters (such as a symbolic weight p). Offsets and the constraint may involve parameters;
 * the coefficients of s and t in every argument must be numbers. A measure without a constraint
 * has {@code u} and {@code sum} null.
 */
public record MellinMeasure(String s, String t, String u, Polynomial sum, List<GammaPower> factors,
                            Rational uScale, Polynomial uOffset, Rational vScale, Polynomial vOffset) {
    public MellinMeasure {
        if ((u == null) != (sum == null)) {
            throw new ContourException("a constraint needs both the eliminated variable and the sum");
        }
        if (s.equals(t) || s.equals(u) || t.equals(u)) {
            throw new ContourException("Mellin variables must be distinct, got " + s + ", " + t + ", " + u);
        }
        if (uScale.isZero() || vScale.isZero()) {
            throw new ContourException("the kernel U^(a s + b) V^(c t + d) needs a != 0 and c != 0");
        }
        for (Polynomial x : sum == null ? List.of(uOffset, vOffset) : List.of(sum, uOffset, vOffset)) {
            if (x.variables().contains(s) || x.variables().contains(t) || (u != null && x.variables().contains(u))) {
                throw new ContourException("constraint and kernel offsets must not mention " + s + ", " + t + " or " + u
                        + ", got " + x);
            }
        }
        Map<String, Polynomial> elim = u == null ? Map.of()
                : Map.of(u, sum.subtract(Polynomial.variable(s)).subtract(Polynomial.variable(t)));
        List<GammaPower> kept = new ArrayList<>();
        for (GammaPower g : factors) {
            Polynomial a = elim.isEmpty() ? g.argument() : g.argument().substitute(elim);
            if (a.totalDegree() > 1) {
                throw new ContourException("Gamma argument must be linear in " + s + ", " + t + ", got " + g);
            }
            kept.add(new GammaPower(a, g.exponent()));
        }
        factors = List.copyOf(kept);
    }

    /** The eliminated variable as a polynomial: {@code sum - s - t}. */
    public Polynomial eliminated() {
        if (u == null) {
            throw new ContourException("this measure declares no constraint s + t + u = sum");
        }
        return sum.subtract(Polynomial.variable(s)).subtract(Polynomial.variable(t));
    }

    /**
     * {@code f} as a function of s and t alone: the eliminated variable, where f mentions it, replaced
     * by {@code sum - s - t} (see {@link Elimination}); f itself without a constraint.
     */
    public Expression resolve(Expression f) {
        return u == null ? f : elimination().resolve(f);
    }

    /** The eliminated variable and its value; null without a constraint. */
    public Elimination elimination() {
        return u == null ? null : new Elimination(u, eliminated());
    }

    /** The forms s, t, u along which this measure's amplitudes have their poles. */
    public List<NamedForm> poleForms() {
        if (u == null) {
            return List.of(NamedForm.of(s), NamedForm.of(t));
        }
        return List.of(NamedForm.of(s), NamedForm.of(t), new NamedForm(u, eliminated()));
    }

    /** The Mellin variables, s first. */
    public List<String> variables() {
        return List.of(s, t);
    }

    /** The factors at shifted arguments, {@code Gamma(s + shift_s, t + shift_t)}. */
    public List<GammaPower> factorsAt(Shift shift) {
        if (shift.isNone()) {
            return factors;
        }
        Map<String, Polynomial> sub = shift.substitution();
        List<GammaPower> out = new ArrayList<>();
        factors.forEach(g -> out.add(new GammaPower(g.argument().substitute(sub), g.exponent())));
        return out;
    }

    /** The rational function {@code Gamma_this(shifted) / Gamma_other(s, t)}; a ContourException when it is not rational. */
    public RationalFunction ratioTo(MellinMeasure other, Shift shift) {
        return GammaRatio.reduce(factorsAt(shift), other.factors);
    }

    /** The exponent of U in the kernel, {@code uScale*s + uOffset}. */
    public Polynomial uExponent() {
        return Polynomial.variable(s).multiply(uScale).add(uOffset);
    }

    /** The exponent of V in the kernel, {@code vScale*t + vOffset}. */
    public Polynomial vExponent() {
        return Polynomial.variable(t).multiply(vScale).add(vOffset);
    }
}
