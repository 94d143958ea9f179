package dev.contour.numeric;

import dev.contour.Cancellation;
import dev.contour.ContourException;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import org.apfloat.Apcomplex;
import org.apfloat.ApcomplexMath;
import org.apfloat.Apfloat;
import org.apfloat.ApfloatMath;
import org.apfloat.ApfloatRuntimeException;
import org.apfloat.Apint;

/**
 * Exponential, logarithm, powers, Gamma, log-Gamma, Pochhammer symbols and polylogarithms of complex
 * apfloat numbers, for building integrands.
 *
 * <p>Precision: inside an integration every function works at the integration's working precision
 * (and is memoised over the grid, see {@link GridMemo}); outside one it works at the precision of its
 * argument, which must then be finite. Arguments are taken as exact decimal numbers.
 *
 * <p>Why not apfloat's own exp, log and gamma: at 20-40 digits they cost milliseconds per call
 * (apfloat is tuned for very high precision), and a two-variable integral needs tens of thousands
 * of values. Here exp is a reduced Taylor series with repeated squaring, log is Halley's iteration on
 * exp from a double-precision start, and Gamma is Stirling's series after an upward shift; each
 * costs tens of multiplications. Tests compare them with apfloat's versions.
 */
public final class ComplexFunctions {
    private ComplexFunctions() { }

    private static final Map<Long, Constants> CONSTANTS = new ConcurrentHashMap<>();

    // ---------------------------------------------------------------- public, precision-implicit

    /** e^z. */
    public static Apcomplex exp(Apcomplex z) {
        GridMemo memo = GridMemo.current();
        if (memo == null) {
            return exp(z, precisionOf(z));
        }
        return memo.get(GridMemo.Op.EXP, z, null, () -> exp(z, memo.precision()));
    }

    /** The principal logarithm (imaginary part in (-pi, pi]); zero is an error. */
    public static Apcomplex log(Apcomplex z) {
        GridMemo memo = GridMemo.current();
        if (memo == null) {
            return log(z, precisionOf(z));
        }
        return memo.get(GridMemo.Op.LOG, z, null, () -> log(z, memo.precision()));
    }

    /** base^exponent = exp(exponent * log(base)) on the principal branch; 0^e is 0 for Re e > 0. */
    public static Apcomplex power(Apcomplex base, Apcomplex exponent) {
        GridMemo memo = GridMemo.current();
        if (memo == null) {
            return power(base, exponent, Math.min(precisionOf(base), precisionOf(exponent)));
        }
        return memo.get(GridMemo.Op.POWER, base, exponent, () -> power(base, exponent, memo.precision()));
    }

    /** The Gamma function; its poles (non-positive integers, to the argument's precision) are an error. */
    public static Apcomplex gamma(Apcomplex z) {
        GridMemo memo = GridMemo.current();
        if (memo == null) {
            return gamma(z, precisionOf(z));
        }
        return memo.get(GridMemo.Op.GAMMA, z, null, () -> gamma(z, memo.precision()));
    }

    /** The principal branch of log Gamma (real on the positive axis, cut along the negative axis). */
    public static Apcomplex logGamma(Apcomplex z) {
        GridMemo memo = GridMemo.current();
        if (memo == null) {
            return logGamma(z, precisionOf(z));
        }
        return memo.get(GridMemo.Op.LOG_GAMMA, z, null, () -> logGamma(z, memo.precision()));
    }

    /** The Pochhammer symbol (a)_n = a(a+1)...(a+n-1); for n < 0, 1/((a-1)(a-2)...(a+n)). */
    public static Apcomplex pochhammer(Apcomplex a, long n) {
        GridMemo memo = GridMemo.current();
        long p = memo == null ? precisionOf(a) : memo.precision();
        return pochhammer(a, n, p);
    }

    /** The Pochhammer symbol (a)_x = Gamma(a + x)/Gamma(a) for complex x. */
    public static Apcomplex pochhammer(Apcomplex a, Apcomplex x) {
        if (x.isInteger() && Math.abs(x.real().doubleValue()) < 100_000) {
            return pochhammer(a, x.real().longValue());
        }
        return gamma(a.add(x)).divide(gamma(a));
    }

    /**
     * The polylogarithm Li_n(z) of integer order n, principal branch: our own for n = 1 and n = 2
     * (off the cut), apfloat's (slow: seconds at 30 digits) otherwise.
     */
    public static Apcomplex polylog(int n, Apcomplex z) {
        GridMemo memo = GridMemo.current();
        return polylog(n, z, memo == null ? precisionOf(z) : memo.precision());
    }

    /**
     * {@code factor.apply(x)}, remembered under {@code tag} for the rest of the running integration
     * (outside one, simply computed). For a factor of the integrand that depends on one variable
     * only, such as U^s Gamma(-s)^2, so that a two-variable grid computes it once per grid line. The
     * tag must identify the function (equal tags, equal functions).
     */
    public static Apcomplex remember(Object tag, Apcomplex x, java.util.function.UnaryOperator<Apcomplex> factor) {
        GridMemo memo = GridMemo.current();
        if (memo == null) {
            return factor.apply(x);
        }
        return memo.get(GridMemo.Op.USER, tag, x, null, () -> factor.apply(x));
    }

    // ---------------------------------------------------------------- explicit precision

    static long precisionOf(Apcomplex z) {
        long p = z.precision();
        if (p == Apcomplex.INFINITE) {
            throw new ContourException("an exact argument (" + z + ") needs a precision: give it one, "
                    + "or use SpecialFunctions with a number of digits");
        }
        return p;
    }

    /** e^z to p significant digits. */
    static Apcomplex exp(Apcomplex z, long p) {
        long g = p + 8;
        double re = z.real().doubleValue();
        double im = z.imag().doubleValue();
        if (Math.abs(re) > 1e15 || Math.abs(im) > 1e15) {
            throw new ContourException("exponential of an argument too large to evaluate: " + z);
        }
        Constants c = constants(g);
        long n = Math.round(re);
        long m = Math.round(im / (2 * Math.PI));
        Apcomplex w = z.precision(g).subtract(new Apint(n));
        if (m != 0) {
            w = w.subtract(new Apcomplex(Apfloat.ZERO, c.twoPi.multiply(new Apint(m))));
        }
        // |w| <= 3.2; halving k times makes the Taylor series short, squaring k times undoes it.
        int k = (int) Math.round(Math.sqrt(g)) + 2;
        Apcomplex x = w.divide(new Apint(1L << k));
        Apcomplex sum = Apcomplex.ONE.precision(g + 2);
        Apcomplex term = sum;
        for (int j = 1; j < 10_000; j++) {
            term = term.multiply(x).multiply(c.reciprocal(j));
            if (term.isZero()) {
                break;
            }
            sum = sum.add(term);
            if (term.scale() < -(g + 2)) {
                break;
            }
        }
        for (int i = 0; i < k; i++) {
            sum = sum.multiply(sum);
        }
        if (n != 0) {
            sum = sum.multiply(ApfloatMath.pow(c.e, n));
        }
        return sum.precision(p);
    }

    /** The principal logarithm to p digits of absolute accuracy relative to max(1, |log z|). */
    static Apcomplex log(Apcomplex z, long p) {
        if (z.isZero()) {
            throw new ContourException("logarithm of zero");
        }
        long g = p + 8;
        Constants c = constants(g);
        long scale = z.scale();
        Apcomplex y = z;
        Apfloat shift = Apfloat.ZERO;
        if (Math.abs(scale) > 200) {
            y = ApcomplexMath.scale(z, -scale);
            shift = c.ln10.multiply(new Apint(scale));
        }
        y = y.precision(g);
        double a = y.real().doubleValue();
        double b = y.imag().doubleValue();
        Apcomplex w = new Apcomplex(new Apfloat(Math.log(Math.hypot(a, b)), g), new Apfloat(Math.atan2(b, a), g));
        // Halley's iteration on exp(w) = y, w += 2 (y - e^w) / (y + e^w), triples the 15 digits of
        // the double start at each step (common practice): one exponential up to 45 digits.
        for (long digits = 15; digits < g + 2; digits *= 3) {
            Apcomplex e = exp(w, g);
            w = w.add(new Apint(2).multiply(y.subtract(e)).divide(y.add(e)));
        }
        return w.add(shift).precision(p + Math.max(0, w.add(shift).scale()));
    }

    static Apcomplex power(Apcomplex base, Apcomplex exponent, long p) {
        if (base.isZero()) {
            if (exponent.real().signum() > 0) {
                return Apcomplex.ZERO;
            }
            throw new ContourException("0 raised to a power with non-positive real part (" + exponent + ")");
        }
        if (exponent.isInteger() && Math.abs(exponent.real().doubleValue()) < 1 << 20) {
            return ApcomplexMath.pow(base.precision(p + 8), exponent.real().longValue()).precision(p);
        }
        double size = Math.abs(Magnitudes.log10Abs(base)) * 2.31 + Math.PI;
        long g = p + 4 + (long) Math.ceil(Math.log10(1 + size * Math.pow(10, Magnitudes.log10Abs(exponent))));
        return exp(exponent.precision(g).multiply(log(base, g)), p);
    }

    static Apcomplex gamma(Apcomplex z, long p) {
        checkNotPole(z, p);
        long g = p + guardDigits(z);
        Shifted s = shiftUp(z, g);
        return exp(stirling(s.x, s.c), g).divide(s.product).precision(p);
    }

    static Apcomplex logGamma(Apcomplex z, long p) {
        checkNotPole(z, p);
        long g = p + guardDigits(z);
        Shifted s = shiftUp(z, g);
        Apcomplex lg = stirling(s.x, s.c);
        if (s.count == 0) {
            return lg.precision(p + Math.max(0, lg.scale()));
        }
        // log of the product equals the sum of the logs of its factors up to a multiple of 2 pi i;
        // the sum of the factors' arguments (in doubles) fixes that multiple.
        Apcomplex logP = log(s.product, g);
        double args = 0;
        double zr = z.real().doubleValue();
        double zi = z.imag().doubleValue();
        for (long k = 0; k < s.count; k++) {
            if ((k & 255) == 0) {
                Cancellation.check();
            }
            args += Math.atan2(zi, zr + k);
        }
        long turns = Math.round((args - logP.imag().doubleValue()) / (2 * Math.PI));
        Apcomplex result = lg.subtract(logP).subtract(new Apcomplex(Apfloat.ZERO, s.c.twoPi.multiply(new Apint(turns))));
        return result.precision(p + Math.max(0, result.scale()));
    }

    static Apcomplex pochhammer(Apcomplex a, long n, long p) {
        Apcomplex x = a.precision(p + 5);
        Apcomplex product = Apcomplex.ONE;
        if (n >= 0) {
            for (long k = 0; k < n; k++) {
                if ((k & 255) == 0) {
                    Cancellation.check();
                }
                product = product.multiply(x.add(new Apint(k)));
            }
            return product.precision(p);
        }
        for (long k = 1; k <= -n; k++) {
            if ((k & 255) == 0) {
                Cancellation.check();
            }
            product = product.multiply(x.subtract(new Apint(k)));
        }
        if (product.isZero()) {
            throw new PoleException("Pochhammer symbol (" + a + ")_" + n + " has a pole", a);
        }
        return Apcomplex.ONE.divide(product).precision(p);
    }

    static Apcomplex polylog(int n, Apcomplex z, long p) {
        boolean onCut = z.imag().signum() == 0 && z.real().compareTo(Apcomplex.ONE.real()) > 0;
        if (n == 2 && !onCut) {
            return dilog(z, p);
        }
        if (n == 1 && !z.equals(Apcomplex.ONE)) {
            return log(Apcomplex.ONE.subtract(z.precision(p + 5)), p + 5).negate().precision(p);
        }
        if (n <= 1 && z.equals(Apcomplex.ONE)) {
            throw new PoleException("the polylogarithm of order " + n + " is singular at z = 1", z);
        }
        try {
            return ApcomplexMath.polylog(new Apcomplex(new Apint(n)), z.precision(p)).precision(p);
        } catch (ArithmeticException | ApfloatRuntimeException e) {
            throw new ContourException("polylogarithm of order " + n + " at " + z + " failed: " + e.getMessage());
        }
    }

    /**
     * The dilogarithm off the cut (1, infinity): inversion z -> 1/z for |z| > 1 and reflection
     * z -> 1 - z for Re z > 1/2 (DLMF 25.12.4 and 25.12.6, equation numbers from memory) bring z to
     * |z| <= 1, Re z <= 1/2, where the series in u = -log(1 - z), sum B_n u^(n+1)/(n+1)!, has
     * |u| < 1.8 < 2 pi and gains about a digit per term (common practice). apfloat's general polylog
     * is much slower at these precisions; tests compare the two.
     */
    static Apcomplex dilog(Apcomplex z, long p) {
        long g = p + 6;
        Constants c = constants(g);
        Apcomplex zz = z.precision(g);
        if (zz.isZero()) {
            return Apcomplex.ZERO;
        }
        Apfloat zeta2 = c.pi.multiply(c.pi).divide(new Apint(6));
        if (zz.equals(Apcomplex.ONE)) {
            return zeta2.precision(p);
        }
        Apcomplex one = Apcomplex.ONE;
        Apcomplex result;
        if (ApcomplexMath.norm(zz).compareTo(one.real()) > 0) {
            Apcomplex l = log(zz.negate(), g);
            result = dilogInDisc(one.divide(zz), g, c).add(zeta2).add(l.multiply(l).divide(new Apint(2))).negate();
        } else {
            result = dilogInDisc(zz, g, c);
        }
        return result.precision(p);
    }

    /** Li2 for |z| <= 1 (then the reflection keeps |1 - z| < 1 when Re z > 1/2). */
    private static Apcomplex dilogInDisc(Apcomplex z, long g, Constants c) {
        Apcomplex one = Apcomplex.ONE;
        if (z.real().doubleValue() > 0.5) {
            Apcomplex w = one.subtract(z);
            Apfloat zeta2 = c.pi.multiply(c.pi).divide(new Apint(6));
            return zeta2.subtract(log(z, g).multiply(log(w, g))).subtract(dilogSeries(w, g, c));
        }
        return dilogSeries(z, g, c);
    }

    private static Apcomplex dilogSeries(Apcomplex z, long g, Constants c) {
        Apcomplex u = log(Apcomplex.ONE.subtract(z), g).negate();
        Apcomplex u2 = u.multiply(u);
        Apfloat[] b = c.dilogCoefficients();
        Apcomplex acc = Apcomplex.ZERO;
        for (int k = b.length - 1; k >= 1; k--) {
            acc = acc.multiply(u2).add(b[k]);
        }
        // u - u^2/4 + u * sum_{k>=1} B_2k u^(2k) / (2k+1)!
        return u.subtract(u2.divide(new Apint(4))).add(u.multiply(acc.multiply(u2)));
    }

    // ---------------------------------------------------------------- Gamma internals

    /** Whether z is a non-positive integer as far as its precision (and p) can tell. */
    static boolean isNearPole(Apcomplex z, long p) {
        double re = z.real().doubleValue();
        if (re > 0.5) {
            return false;
        }
        long n = Math.round(re);
        Apcomplex d = z.subtract(new Apint(n));
        if (d.isZero()) {
            return true;
        }
        long known = Math.min(p, z.precision());
        double ulp = z.scale() - (double) known;
        return Magnitudes.log10Abs(d) <= ulp + 3;
    }

    private static void checkNotPole(Apcomplex z, long p) {
        if (isNearPole(z, p)) {
            throw new PoleException("Gamma has a pole at " + Math.round(z.real().doubleValue())
                    + " (argument " + Magnitudes.format(z, 12) + ")", z);
        }
    }

    /** Digits lost in exp(log Gamma): log Gamma grows like |z| log |z|. */
    private static long guardDigits(Apcomplex z) {
        double az = Math.pow(10, Math.min(300, Magnitudes.log10Abs(z)));
        return 6 + (long) Math.ceil(Math.log10(1 + az * Math.log(2 + az)));
    }

    private record Shifted(Apcomplex x, Apcomplex product, long count, Constants c) { }

    /** x = z + m with Re x >= R where Stirling's series is accurate, and z(z+1)...(z+m-1). */
    private static Shifted shiftUp(Apcomplex z, long g) {
        Constants c = constants(g);
        Apcomplex zz = z.precision(g);
        double re = z.real().doubleValue();
        long m = re < c.radius ? (long) Math.ceil(c.radius - re) : 0;
        Apcomplex product = Apcomplex.ONE;
        for (long k = 0; k < m; k++) {
            if ((k & 255) == 0) {
                Cancellation.check();
            }
            product = product.multiply(zz.add(new Apint(k)));
        }
        return new Shifted(zz.add(new Apint(m)), product, m, c);
    }

    /** Stirling's series for log Gamma(x), Re x >= radius (DLMF 5.11.1; common practice). */
    private static Apcomplex stirling(Apcomplex x, Constants c) {
        Apcomplex inv = Apcomplex.ONE.divide(x);
        Apcomplex y = inv.multiply(inv);
        Apcomplex acc = c.stirling[c.stirling.length - 1];
        for (int k = c.stirling.length - 2; k >= 0; k--) {
            acc = acc.multiply(y).add(c.stirling[k]);
        }
        return x.subtract(c.half).multiply(log(x, c.precision)).subtract(x).add(c.halfLog2Pi).add(acc.multiply(inv));
    }

    // ---------------------------------------------------------------- constants per precision

    private static final class Constants {
        final long precision;
        final Apfloat pi;
        final Apfloat twoPi;
        final Apfloat e;
        final Apfloat ln10;
        final Apfloat halfLog2Pi;
        final Apfloat half;
        final Apfloat[] reciprocals;
        final double radius;
        final Apfloat[] stirling;

        Constants(long g) {
            precision = g;
            long cp = g + 25;
            pi = ApfloatMath.pi(cp);
            twoPi = pi.multiply(new Apint(2));
            e = ApfloatMath.e(cp);
            ln10 = ApfloatMath.log(new Apfloat(10, cp));
            halfLog2Pi = ApfloatMath.log(twoPi).divide(new Apint(2));
            half = new Apfloat("0.5", cp);
            reciprocals = new Apfloat[64];
            for (int j = 1; j < reciprocals.length; j++) {
                reciprocals[j] = new Apfloat(1, cp).divide(new Apint(j));
            }
            radius = Math.max(10, g);
            int terms = stirlingTerms(g, radius);
            stirling = new Apfloat[terms];
            for (int k = 1; k <= terms; k++) {
                if ((k & 255) == 0) {
                    Cancellation.check();
                }
                BernoulliNumbers.Fraction b = BernoulliNumbers.get(2 * k);
                Apfloat num = new Apfloat(b.numerator(), cp);
                Apfloat den = new Apfloat(b.denominator().multiply(
                        java.math.BigInteger.valueOf(2L * k * (2L * k - 1))), cp);
                stirling[k - 1] = num.divide(den);
            }
        }

        /**
         * Terms of Stirling's series needed for 10^-g at |x| >= radius, Re x > 0: the remainder is
         * at most the first omitted term times sec^(2K)(ph x / 2) <= 2^K (DLMF 5.11(ii), the bound
         * recalled from memory and taken with one more factor 2 for safety).
         */
        private volatile Apfloat[] dilogCoefficients;

        /** B_2k / (2k+1)! for k = 1..K (index 0 unused), enough for |u| < 1.8 at this precision. */
        Apfloat[] dilogCoefficients() {
            Apfloat[] b = dilogCoefficients;
            if (b == null) {
                // |B_2k| / (2k+1)! ~ 2 / (2 pi)^(2k) / (2k+1); terms fall by (1.8 / 2 pi)^2 = 0.082.
                int terms = (int) Math.ceil((precision + 2) / -Math.log10(0.082)) + 2;
                b = new Apfloat[terms + 1];
                java.math.BigInteger factorial = java.math.BigInteger.ONE;
                for (int k = 1; k <= terms; k++) {
                    if ((k & 255) == 0) {
                        Cancellation.check();
                    }
                    factorial = factorial.multiply(java.math.BigInteger.valueOf((2L * k) * (2L * k + 1)));
                    BernoulliNumbers.Fraction bk = BernoulliNumbers.get(2 * k);
                    b[k] = new Apfloat(bk.numerator(), precision + 25)
                            .divide(new Apfloat(bk.denominator().multiply(factorial), precision + 25));
                }
                dilogCoefficients = b;
            }
            return b;
        }

        /** 1/j at this precision (multiplying by it is much cheaper than dividing by j). */
        Apfloat reciprocal(int j) {
            if (j < reciprocals.length) {
                return reciprocals[j];
            }
            return Apcomplex.ONE.divide(new Apfloat(j, precision + 25)).real();
        }

        private static int stirlingTerms(long g, double radius) {
            for (int k = 1; ; k++) {
                if ((k & 255) == 0) {
                    Cancellation.check();
                }
                int n = 2 * k + 2; // the first omitted term uses B_{2k+2}
                double log10B = Math.log10(2 * 1.65) + log10Factorial(n) - n * Math.log10(2 * Math.PI);
                double bound = log10B - Math.log10((double) n * (n - 1)) - (n - 1) * Math.log10(radius)
                        + (k + 1) * Math.log10(2);
                if (bound < -(g + 1)) {
                    return k;
                }
            }
        }

        private static double log10Factorial(int n) {
            double s = 0;
            for (int i = 2; i <= n; i++) {
                s += Math.log10(i);
            }
            return s;
        }
    }

    private static Constants constants(long g) {
        // Rounded up to a multiple of 10 digits, so that varying guard digits share one instance.
        return CONSTANTS.computeIfAbsent((g + 9) / 10 * 10, Constants::new);
    }
}
