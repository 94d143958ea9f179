package dev.contour.numeric;

import dev.contour.Cancellation;
import dev.contour.ContourException;
import dev.contour.ProgressLine;
import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicLong;
import java.util.function.LongFunction;
import java.util.function.Supplier;
import org.apfloat.Apcomplex;
import org.apfloat.Apfloat;
import org.apfloat.ApfloatMath;
import org.apfloat.ApfloatRuntimeException;
import org.apfloat.Apint;

/**
 * Numerical Mellin-Barnes integrals: one- and two-variable inverse Mellin transforms
 * (1/2 pi i) int f(s) ds and (1/2 pi i)^2 int int f(s, t) ds dt along straight vertical contours.
 *
 * <p>Method: the trapezoidal rule in Im s on the contour. For an integrand analytic in a strip of
 * half-width d about the contour the error falls like exp(-2 pi d / h) (common practice; see
 * Trefethen and Weideman, SIAM Rev. 56 (2014) 385). Steps are exact decimals (so the grid of s + t
 * repeats values of s and t, and memoised Gamma factors are reused, see {@link GridMemo}): 0.8, 0.4,
 * 0.2, then steps chosen from the fitted error model to reach the requested digits (shrinking by at
 * most a factor 2.5 per level). A line of the
 * grid is summed outward from its peak until the integrand has stayed below 10^-(digits+4) of its
 * largest value for one unit of Im s; the neglected tail is estimated by geometric extrapolation.
 *
 * <p>Error estimate: the difference between consecutive levels measures the error of the coarser
 * one; the slope of log(error) against 1/h from the two previous differences, taken at 85% to allow
 * for a slowing convergence, extrapolates it to the last level; the claim is ten times that, never
 * below the neglected tail or the rounding floor of the working precision. A result is returned only
 * after at least three levels with decreasing differences.
 */
public final class MellinBarnes {
    private MellinBarnes() { }

    /** Guard digits of the working precision beyond the requested digits. */
    public static final int GUARD_DIGITS = 10;
    private static final BigDecimal FIRST_STEP = new BigDecimal("0.8");
    private static final int MAX_LEVELS = 24;
    private static final double QUIET_LENGTH = 1.0;
    private static final int CUT_EXTRA_DIGITS = 4;
    private static final double SAFETY_DIGITS = 1;
    private static final double SLOPE_TRUST = 0.85;
    private static final double MAX_STEP_RATIO = 2.5;

    /** The precision (significant digits) at which integrands are evaluated for {@code digits}. */
    public static long workingPrecision(int digits) {
        return digits + GUARD_DIGITS;
    }

    /** (1/2 pi i) int f(s) ds along Re s = Re c, with the default limits. */
    public static NumericResult integrate1(Integrand1 f, Apcomplex c, int digits) {
        return integrate1(f, c, digits, IntegrationLimits.defaults());
    }

    /** (1/2 pi i) int f(s) ds along Re s = Re c to {@code digits} significant digits. */
    public static NumericResult integrate1(Integrand1 f, Apcomplex c, int digits, IntegrationLimits limits) {
        Run run = new Run(digits, limits, "Re s = " + Magnitudes.format(c.real(), 10));
        Apfloat cs = run.exact(c.real());
        return run.execute(h -> {
            Walk line = run.walk(k -> {
                Apcomplex s = new Apcomplex(cs, h.multiply(new Apint(k)));
                return run.call(() -> f.at(s), () -> "s = " + Magnitudes.format(s, 12));
            }, 0, h, "s", new MaxRef(run.globalMax));
            return run.weigh(line, h.divide(run.twoPi));
        });
    }

    /** (1/2 pi i)^2 int int f(s, t) ds dt along Re s = Re cs, Re t = Re ct, with the default limits. */
    public static NumericResult integrate2(Integrand2 f, Apcomplex cs, Apcomplex ct, int digits) {
        return integrate2(f, cs, ct, digits, IntegrationLimits.defaults());
    }

    /**
     * (1/2 pi i)^2 int int f(s, t) ds dt along Re s = Re cs, Re t = Re ct to {@code digits}
     * significant digits. The rows Im t > 0 and Im t < 0 are summed on two threads.
     */
    public static NumericResult integrate2(Integrand2 f, Apcomplex cs, Apcomplex ct, int digits, IntegrationLimits limits) {
        Run run = new Run(digits, limits, "Re s = " + Magnitudes.format(cs.real(), 10)
                + ", Re t = " + Magnitudes.format(ct.real(), 10));
        Apfloat rs = run.exact(cs.real());
        Apfloat rt = run.exact(ct.real());
        return run.execute(h -> {
            Apfloat w = h.divide(run.twoPi);
            Walk rows = run.walkRows((k2, center, ref) -> {
                Apcomplex t = new Apcomplex(rt, h.multiply(new Apint(k2)));
                return run.walk(k1 -> {
                    Apcomplex s = new Apcomplex(rs, h.multiply(new Apint(k1)));
                    return run.call(() -> f.at(s, t),
                            () -> "s = " + Magnitudes.format(s, 12) + ", t = " + Magnitudes.format(t, 12));
                }, center, h, "s", ref);
            }, h);
            return run.weigh(rows, w.multiply(w));
        });
    }

    /**
     * The straight contour Re s = c that separates the poles of Gamma(a_i + s) (to the left, at
     * s = -a_i - n) from those of Gamma(b_j - s) (to the right, at s = b_j + n): the midpoint of the
     * gap. ContourException when no straight line separates them.
     */
    public static Apfloat separatingContour(List<Apcomplex> leftGammaShifts, List<Apcomplex> rightGammaShifts) {
        double lo = Double.NEGATIVE_INFINITY;
        double hi = Double.POSITIVE_INFINITY;
        for (Apcomplex a : leftGammaShifts) {
            lo = Math.max(lo, -a.real().doubleValue());
        }
        for (Apcomplex b : rightGammaShifts) {
            hi = Math.min(hi, b.real().doubleValue());
        }
        if (!(lo < hi)) {
            throw new ContourException(String.format(
                    "no straight contour separates the poles: the rightmost left pole has Re s = %.6g, "
                            + "the leftmost right pole Re s = %.6g", lo, hi));
        }
        double c = Double.isInfinite(lo) ? (Double.isInfinite(hi) ? 0 : hi - 0.5)
                : Double.isInfinite(hi) ? lo + 0.5 : (lo + hi) / 2;
        return new Apfloat(BigDecimal.valueOf(c).round(new MathContext(12)));
    }

    // ------------------------------------------------------------------------------- internals

    /** Sum, largest magnitude and its index along one line of the grid (or over rows), and the tail. */
    private static final class Walk {
        Apcomplex sum = Apcomplex.ZERO;
        double maxLog = Double.NEGATIVE_INFINITY;
        long argmax;
        final LogSum abs = new LogSum();
        final LogSum tail = new LogSum();

        void addAll(Walk o) {
            sum = sum.add(o.sum);
            abs.add(o.abs.log10());
            tail.add(o.tail.log10());
            if (o.maxLog > maxLog) {
                maxLog = o.maxLog;
                argmax = o.argmax;
            }
        }
    }

    /** The largest log10 |f| seen by one chain of walks (each thread has its own: results stay reproducible). */
    private static final class MaxRef {
        double value;

        MaxRef(double value) {
            this.value = value;
        }
    }

    /** A sum of positive magnitudes kept as a base-10 logarithm (no double overflow). */
    private static final class LogSum {
        private double ref = Double.NEGATIVE_INFINITY;
        private double scaled;

        void add(double log10) {
            if (log10 == Double.NEGATIVE_INFINITY || Double.isNaN(log10)) {
                return;
            }
            if (log10 > ref) {
                scaled = scaled * Math.pow(10, ref - log10) + 1;
                ref = log10;
            } else {
                scaled += Math.pow(10, log10 - ref);
            }
        }

        double log10() {
            return scaled == 0 ? Double.NEGATIVE_INFINITY : ref + Math.log10(scaled);
        }
    }

    /** The neglected tail after a run of negligible values, extrapolated geometrically (log10). */
    private static double tailAfter(double firstQuiet, double lastQuiet, int count, double quietSum) {
        if (count >= 2) {
            double ratio = Math.pow(10, (lastQuiet - firstQuiet) / (count - 1));
            if (ratio < 0.9) {
                return lastQuiet + Math.log10(ratio / (1 - ratio));
            }
        }
        return quietSum + 1;
    }

    @FunctionalInterface
    private interface Level {
        Apcomplex sum(Apfloat h);
    }

    @FunctionalInterface
    private interface Row {
        Walk walk(long k2, long center, MaxRef ref);
    }

    /** The state of one integration: precision, budgets, progress, memo and the refinement levels. */
    private static final class Run {
        final int digits;
        final long wp;
        final IntegrationLimits limits;
        final String contour;
        final Apfloat twoPi;
        final ProgressLine progress;
        final GridMemo memo;
        final AtomicLong evaluations = new AtomicLong();
        double cutDigits;
        double globalMax = Double.NEGATIVE_INFINITY;
        double absLog;
        double tailLog;
        volatile BigDecimal step = FIRST_STEP;
        volatile double bestLog10Error = Double.POSITIVE_INFINITY;
        volatile Apcomplex best;
        private ExecutorService pool;
        private volatile boolean finished;
        /** The caller's stop token, checked at every evaluation on either thread. */
        private final Cancellation.Token stop = Cancellation.current();

        Run(int digits, IntegrationLimits limits, String contour) {
            if (digits < 1 || digits > 1000) {
                throw new ContourException("digits must be between 1 and 1000, got " + digits);
            }
            this.digits = digits;
            this.wp = workingPrecision(digits);
            this.limits = limits;
            this.contour = contour;
            this.cutDigits = digits + CUT_EXTRA_DIGITS;
            this.twoPi = ApfloatMath.pi(wp).multiply(new Apint(2));
            this.progress = ProgressLine.on(limits.progress());
            this.memo = new GridMemo(wp);
        }

        Apfloat exact(Apfloat x) {
            return x.precision(wp);
        }

        Apcomplex weigh(Walk w, Apfloat weight) {
            double lw = Magnitudes.log10Abs(weight);
            absLog = w.abs.log10() + lw;
            tailLog = w.tail.log10() + lw;
            globalMax = Math.max(globalMax, w.maxLog);
            return w.sum.multiply(weight);
        }

        NumericResult execute(Level levelSum) {
            try {
                return memo.run(() -> refine(levelSum));
            } finally {
                finished = true; // stops the other thread at its next evaluation if this one failed
                progress.close();
                if (pool != null) {
                    pool.shutdownNow();
                }
            }
        }

        private NumericResult refine(Level levelSum) {
            List<Double> steps = new ArrayList<>();
            List<Apcomplex> sums = new ArrayList<>();
            List<Double> diffs = new ArrayList<>(); // diffs[j] = log10 |T_{j+1} - T_j|, about log10 E(h_j)
            BigDecimal h = FIRST_STEP;
            for (int j = 0; j < MAX_LEVELS; j++) {
                step = h;
                Apcomplex t = levelSum.sum(new Apfloat(h).precision(wp));
                steps.add(h.doubleValue());
                sums.add(t);
                double value = Magnitudes.log10Abs(t);
                // Half a unit in the last requested place at any scale of the value (also after an exact
                // factor of at most 1 is applied): the rounded digits are then within one unit.
                double target = value - digits + Math.log10(0.5);
                if (j == 0) {
                    h = h.divide(BigDecimal.valueOf(2));
                    continue;
                }
                diffs.add(Magnitudes.log10Abs(t.subtract(sums.get(j - 1))));
                double estimate = diffs.get(j - 1);
                double slope = Double.NaN; // trusted decrease of log10 error per unit of 1/h
                if (j >= 2) {
                    slope = SLOPE_TRUST * (diffs.get(j - 2) - diffs.get(j - 1))
                            / (1 / steps.get(j - 1) - 1 / steps.get(j - 2));
                    if (slope > 0) {
                        estimate = diffs.get(j - 1) - slope * (1 / steps.get(j) - 1 / steps.get(j - 1)) + SAFETY_DIGITS;
                    }
                }
                double model = estimate;
                estimate = Math.max(estimate, Math.max(absLog - wp + 1, tailLog + SAFETY_DIGITS));
                if (Boolean.getBoolean("contour.debug")) {
                    System.err.printf("%nlevel %d h=%s T=%s diff=%.2f slope=%.3f model=%.2f tail=%.2f est=%.2f "
                            + "target=%.2f evals=%d memo=%d%n", j, h, Magnitudes.format(t, 25), diffs.get(j - 1),
                            slope, model, tailLog, estimate, target, evaluations.get(), memo.size());
                }
                if (estimate < bestLog10Error) {
                    bestLog10Error = estimate;
                    best = t;
                }
                if (j >= 2 && slope > 0 && estimate <= target) {
                    return NumericResult.of(t, estimate, (int) (wp - 3));
                }
                if (tailLog + SAFETY_DIGITS > target - 0.3) {
                    cutDigits += Math.ceil(tailLog + SAFETY_DIGITS - target) + 1; // the cut, not the step, limits
                }
                if (j < 2 || !(slope > 0)) {
                    h = h.divide(BigDecimal.valueOf(2));
                    continue;
                }
                // Aim half a digit past the target from the model's error at this level, at least two
                // digits past this level (so the next difference measures this level's error), and
                // shrink the step by at most a factor 2.5: a longer jump from a badly calibrated model
                // tends to need another level nearly as costly as itself.
                double here = model - SAFETY_DIGITS;
                double gain = Math.max(here - (target - SAFETY_DIGITS - 0.5), 2);
                double next = Math.max(steps.get(j) / MAX_STEP_RATIO, 1 / (1 / steps.get(j) + gain / slope));
                h = new BigDecimal(next).round(new MathContext(2, RoundingMode.DOWN));
            }
            throw notReached("within " + MAX_LEVELS + " refinement levels");
        }

        /** Sums f(k) for k = center, center +- 1, ... until the tail is negligible in both directions. */
        Walk walk(LongFunction<Apcomplex> f, long center, Apfloat h, String variable, MaxRef ref) {
            Walk w = new Walk();
            double stepSize = h.doubleValue();
            int quietNeeded = Math.max(3, (int) Math.ceil(QUIET_LENGTH / stepSize));
            for (int dir = 1; dir >= -1; dir -= 2) {
                long k = dir > 0 ? center : center - 1;
                int quiet = 0;
                double firstQuiet = 0;
                double lastQuiet = 0;
                LogSum quietSum = new LogSum();
                while (quiet < quietNeeded) {
                    double y = k * stepSize;
                    Apcomplex v = f.apply(k);
                    double lg = Magnitudes.log10Abs(v);
                    if (Math.abs(y) > limits.maxImaginary()) {
                        throw new ContourException(String.format(
                                "the integrand does not decay along the contour %s: |f| = 1e%.1f at Im %s = %.4g, "
                                        + "and it must fall below 1e%.1f (10^-%.0f of its largest value) before |Im %s| = %.4g",
                                contour, lg, variable, y, ref.value - cutDigits, cutDigits, variable, limits.maxImaginary()));
                    }
                    w.sum = w.sum.add(v);
                    w.abs.add(lg);
                    ref.value = Math.max(ref.value, lg);
                    if (lg > w.maxLog) {
                        w.maxLog = lg;
                        w.argmax = k;
                    }
                    if (lg < ref.value - cutDigits) {
                        if (quiet == 0) {
                            firstQuiet = lg;
                            quietSum = new LogSum();
                        }
                        quiet++;
                        lastQuiet = lg;
                        quietSum.add(lg);
                    } else {
                        quiet = 0;
                    }
                    k += dir;
                }
                w.tail.add(tailAfter(firstQuiet, lastQuiet, quiet, quietSum.log10()));
            }
            return w;
        }

        /** Sums rows k2 = 0, then k2 > 0 and k2 < 0 on two threads, each row starting where the previous peaked. */
        Walk walkRows(Row row, Apfloat h) {
            double stepSize = h.doubleValue();
            int quietNeeded = Math.max(3, (int) Math.ceil(QUIET_LENGTH / stepSize));
            MaxRef ref0 = new MaxRef(globalMax);
            Walk first = row.walk(0, 0, ref0);
            Supplier<Walk> up = () -> chain(row, 1, first.argmax, new MaxRef(ref0.value), quietNeeded, stepSize);
            Supplier<Walk> down = () -> chain(row, -1, first.argmax, new MaxRef(ref0.value), quietNeeded, stepSize);
            Walk total = new Walk();
            total.addAll(first);
            Future<Walk> upper = pool().submit(() -> memo.run(up));
            Walk lower = down.get();
            try {
                total.addAll(upper.get());
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new Cancellation.Stop("interrupted", null);
            } catch (ExecutionException e) {
                if (e.getCause() instanceof RuntimeException r) {
                    throw r;
                }
                throw new ContourException("integration failed: " + e.getCause());
            }
            total.addAll(lower);
            return total;
        }

        private Walk chain(Row row, int dir, long center, MaxRef ref, int quietNeeded, double stepSize) {
            Walk total = new Walk();
            long k = dir;
            int quiet = 0;
            double firstQuiet = 0;
            double lastQuiet = 0;
            LogSum quietSum = new LogSum();
            while (quiet < quietNeeded) {
                double y = k * stepSize;
                Walk r = row.walk(k, center, ref);
                if (Math.abs(y) > limits.maxImaginary()) {
                    throw new ContourException(String.format(
                            "the integrand does not decay along the contour %s: |f| = 1e%.1f at Im t = %.4g, "
                                    + "and it must fall below 1e%.1f before |Im t| = %.4g",
                            contour, r.maxLog, y, ref.value - cutDigits, limits.maxImaginary()));
                }
                total.addAll(r);
                center = r.argmax;
                double rowAbs = r.abs.log10();
                if (r.maxLog < ref.value - cutDigits) {
                    if (quiet == 0) {
                        firstQuiet = rowAbs;
                        quietSum = new LogSum();
                    }
                    quiet++;
                    lastQuiet = rowAbs;
                    quietSum.add(rowAbs);
                } else {
                    quiet = 0;
                }
                k += dir;
            }
            total.tail.add(tailAfter(firstQuiet, lastQuiet, quiet, quietSum.log10()));
            return total;
        }

        private synchronized ExecutorService pool() {
            if (pool == null) {
                pool = Executors.newSingleThreadExecutor(r -> {
                    Thread t = new Thread(r, "contour-mellin-barnes");
                    t.setDaemon(true);
                    return t;
                });
            }
            return pool;
        }

        /** One integrand evaluation, with budgets, progress and errors located at the point. */
        Apcomplex call(Supplier<Apcomplex> body, Supplier<String> where) {
            if (finished) {
                throw new ContourException("integration abandoned");
            }
            stop.check();
            long n = evaluations.incrementAndGet();
            if (n > limits.maxEvaluations()) {
                throw notReached("within " + limits.maxEvaluations() + " integrand evaluations");
            }
            if ((n & 63) == 0) {
                if (progress.elapsedNanos() > limits.timeLimit().toNanos()) {
                    throw notReached("within the time limit of "
                            + java.math.BigDecimal.valueOf(limits.timeLimit().toMillis(), 3).stripTrailingZeros().toPlainString() + " s");
                }
                synchronized (progress) {
                    progress.update(() -> String.format("mellin-barnes %s: step %s, %,d evaluations%s",
                            contour, step.toPlainString(), n,
                            best == null ? "" : String.format(", error ~1e%.0f", bestLog10Error)));
                }
            }
            Apcomplex v;
            try {
                v = body.get();
            } catch (PoleException e) {
                throw new ContourException("the contour " + contour + " passes through a pole of the integrand at "
                        + where.get() + ": " + e.getMessage());
            } catch (ContourException e) {
                throw new ContourException("the integrand failed at " + where.get() + ": " + e.getMessage());
            } catch (ArithmeticException | ApfloatRuntimeException e) {
                throw new ContourException("the integrand is not finite at " + where.get()
                        + " (does the contour " + contour + " pass through a pole?): " + e.getMessage());
            }
            if (v == null) {
                throw new ContourException("the integrand returned no value at " + where.get());
            }
            return v;
        }

        ContourException notReached(String how) {
            Apcomplex b = best;
            if (b == null) {
                return new ContourException(String.format("%d digits not reached %s along %s: no error estimate yet "
                        + "(0 digits reached after %,d evaluations)", digits, how, contour, evaluations.get()));
            }
            int reached = (int) Math.max(0, Math.floor(Magnitudes.log10Abs(b) - bestLog10Error));
            return new ContourException(String.format("%d digits not reached %s along %s: reached about %d digits "
                    + "(value %s, error estimate 1e%.1f, %,d evaluations)", digits, how, contour, reached,
                    Magnitudes.format(b, Math.max(reached, 3)), bestLog10Error, evaluations.get()));
        }
    }
}
