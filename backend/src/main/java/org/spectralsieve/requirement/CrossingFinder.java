package org.spectralsieve.requirement;

import java.util.concurrent.atomic.LongAdder;
import java.util.function.DoubleUnaryOperator;

/**
 * Narrows a bracket [a, b] around the point where a monotone condition on the thickness switches side, to a
 * given width, never losing the bracket: the end that was on a's side stays on a's side, so the caller can
 * report the end that holds. The side of a trial point is decided only by {@code side.left(f(x))}, exactly
 * as plain bisection decides it, so a NaN, an infinity or a flat stretch of f is handled as bisection handles
 * it; the values of f only choose where to try next.
 *
 * <p>Where to try: the ITP method (interpolate, truncate, project; I. F. D. Oliveira and R. H. C. Takahashi,
 * "An Enhancement of the Bisection Method Average Performance Preserving Minmax Optimality", ACM Trans. Math.
 * Softw. 47(1), 2020, algorithm 1). Each step takes the regula-falsi point of the bracket's end values, moves
 * it by δ = κ1·(b − a)^κ2 toward the midpoint (so the far end moves too and the bracket closes from both
 * sides), then projects it into the ball of radius r_j = ε·2^(n½ + n0 − j) − (b − a)/2 around the midpoint.
 * The projection alone is what bounds the number of steps by n½ + n0 (the paper's theorem: whatever point the
 * first two stages propose), n½ being bisection's count for the same bracket and width. One change to the
 * interpolation, inside that bound: the end values are those of the Illinois variant of regula falsi (an end
 * kept twice in a row has its value halved; M. Dowell and P. Jarratt, "A modified regula falsi method for
 * computing the root of an equation", BIT 11, 1971), because with the paper's plain regula falsi a nearly
 * linear margin whose crossing is near one end of the range keeps that end for many steps — the truncation
 * always pushes toward the midpoint, so the trials all land on the far side — and took up to 21 trials where
 * bisection takes 27 (CrossingFinderPropertyTest; with Illinois at most 12). On a smooth margin the steps
 * converge superlinearly; on a kink, a plateau or a non-finite value the step falls back toward the midpoint
 * and the bound still holds. A step whose interpolation is not a finite point strictly inside the bracket
 * takes the midpoint.
 *
 * <p>{@code -Dsieve.solve.roots=bisection} (read once) makes every step the midpoint, bisection as before; a
 * benchmark switches it with {@link #useBisection} to time both side by side. Both keep the same contract, but
 * not the same last bits: the two reported ends lie within the width of the same crossing.
 */
public final class CrossingFinder {

    /**
     * n0 of the paper: the steps allowed beyond bisection's count, the room the interpolation may use. A
     * reported end ({@link Keep}) costs at most two more: the bracket narrowed to half the width, and the end
     * placed with room; so at most bisection's count + 3 trials, far fewer on a smooth margin.
     */
    static final int SLACK_STEPS = 1;
    /**
     * κ1 times the starting bracket's width (κ1 scaled to the bracket so the rule does not depend on units):
     * the truncation δ starts at a fifth of the bracket and shrinks with its square. κ1 = 0.2/(b0 − a0) and
     * κ2 = 2 are the common choice (from memory of the paper's and libraries' defaults; any κ1 > 0 and
     * κ2 in [1, 1 + φ) = [1, 2.618…), φ the golden ratio, keeps the bound, only the average speed moves).
     */
    private static final double TRUNCATION_SCALE = 0.2;

    private static volatile boolean bisectionOnly = "bisection".equals(System.getProperty("sieve.solve.roots"));
    private static final LongAdder STEPS = new LongAdder();

    private CrossingFinder() {
    }

    /** For benchmarks: true makes every step the midpoint (bisection), false (the default) the ITP step. */
    public static void useBisection(boolean bisection) {
        bisectionOnly = bisection;
    }

    /** Whether steps are plain bisection. */
    public static boolean bisection() {
        return bisectionOnly;
    }

    /** Trial points evaluated by every finder since the last {@link #resetSteps} (a benchmark's debug line). */
    public static long steps() {
        return STEPS.sum();
    }

    public static void resetSteps() {
        STEPS.reset();
    }

    /** Which side of the crossing a value of f says its point is on. */
    @FunctionalInterface
    interface Side {
        boolean left(double value);
    }

    /** The final bracket: {@code left} is on the left side, {@code right} is not, and right − left ≤ the width. */
    record Bracket(double left, double right, int steps) {
    }

    /**
     * Which end the caller reports. Bisection's last bracket is never narrower than half the width, so the end
     * it reports lies on average a quarter of the width from the crossing; ITP's bracket can close to a few ulps
     * around it, where two computations of the same margin (the solver's model, and the rescaled curve the
     * caller judges its answer on) may disagree in the last bit about which side a thickness is on. So for a
     * reported end the finder narrows to half the width and then tries the point three quarters of the width
     * back from the far end: if it is on the kept side (it is, the margin being monotone) it is the end, between
     * a quarter and three quarters of the width from the crossing.
     */
    enum Keep {
        LEFT, RIGHT,
        /** Both ends are used (the recommendation picks the better one): no room sought. */
        EITHER
    }

    /**
     * Narrows [a, b] to width at most {@code width}.
     *
     * @param fa f(a), on the left side; @param fb f(b), not on it (the caller has evaluated both ends)
     */
    static Bracket narrow(DoubleUnaryOperator f, Side side, double a, double fa, double b, double fb, double width,
                          Keep keep) {
        return bisectionOnly ? bisect(f, side, a, b, width) : itp(f, side, a, fa, b, fb, width, keep);
    }

    /** Plain bisection: the rule before, kept for the switch and as the reference in tests. */
    static Bracket bisect(DoubleUnaryOperator f, Side side, double a, double b, double width) {
        int steps = 0;
        while (b - a > width) {
            double mid = 0.5 * (a + b);
            steps++;
            if (side.left(f.applyAsDouble(mid))) {
                a = mid;
            } else {
                b = mid;
            }
        }
        STEPS.add(steps);
        return new Bracket(a, b, steps);
    }

    /** Bisection's step count for a bracket of width w narrowed to {@code width}: n½ of the paper, counted. */
    static int bisectionSteps(double w, double width) {
        int n = 0;
        for (double left = w; left > width; left *= 0.5) {
            n++;
        }
        return n;
    }

    /**
     * The most trials {@link #itp} takes on a bracket of width w: bisection's count for the width it narrows
     * to, plus {@link #SLACK_STEPS}, plus the trial placing a reported end.
     */
    static int mostTrials(double w, double width, Keep keep) {
        return keep == Keep.EITHER
                ? bisectionSteps(w, width) + SLACK_STEPS
                : bisectionSteps(w, 0.5 * width) + SLACK_STEPS + 1;
    }

    static Bracket itp(DoubleUnaryOperator f, Side side, double a, double fa, double b, double fb, double width,
                       Keep keep) {
        double from = a;
        double to = b;
        // a reported end is placed after the bracket is down to half the width (see Keep)
        double target = keep == Keep.EITHER ? width : 0.5 * width;
        int maxSteps = bisectionSteps(b - a, target) + SLACK_STEPS;
        // the paper's ε, less a few ulps per step: its bound is for exact arithmetic, and a projection that
        // spends the whole budget can end an ulp over the width after rounding, which would cost a step more
        double epsilon = 0.5 * target - 2.0 * (maxSteps + 1) * Math.ulp(Math.max(Math.abs(a), Math.abs(b)));
        if (!(epsilon >= 0.25 * target)) {
            return bisect(f, side, a, b, width); // thicknesses so large the width is near an ulp: no room to interpolate
        }
        double kappa1 = TRUNCATION_SCALE / (b - a);
        int steps = 0;
        boolean keptA = false;
        boolean keptB = false;
        while (b - a > target) {
            double mid = 0.5 * (a + b);
            double half = 0.5 * (b - a);
            double radius = Math.max(0, epsilon * Math.scalb(1.0, maxSteps - steps) - half);
            double x = step(a, fa, b, fb, mid, radius, kappa1 * (b - a) * (b - a));
            if (!(x > a && x < b)) {
                x = mid; // rounding, or no usable interpolation: the midpoint always shrinks the bracket
            }
            double fx = f.applyAsDouble(x);
            steps++;
            if (side.left(fx)) {
                a = x;
                fa = fx;
                fb = keptB ? 0.5 * fb : fb; // b kept twice: Illinois
                keptB = true;
                keptA = false;
            } else {
                b = x;
                fb = fx;
                fa = keptA ? 0.5 * fa : fa;
                keptA = true;
                keptB = false;
            }
        }
        if (keep != Keep.EITHER) {
            // the crossing is within half the width of either end: three quarters of the width back from the far
            // end is at least a quarter of the width from it and at most three quarters
            double x = keep == Keep.LEFT ? b - 0.75 * width : a + 0.75 * width;
            if (x >= from && x <= to) {
                steps++;
                boolean left = side.left(f.applyAsDouble(x));
                if (keep == Keep.LEFT && left) {
                    a = x;
                } else if (keep == Keep.RIGHT && !left) {
                    b = x;
                }
            }
        }
        STEPS.add(steps);
        return new Bracket(a, b, steps);
    }

    /** One ITP trial point: regula falsi, truncated by δ toward the midpoint, projected within r of it. */
    private static double step(double a, double fa, double b, double fb, double mid, double radius, double delta) {
        double falsi = (fb * a - fa * b) / (fb - fa);
        if (!Double.isFinite(falsi)) {
            return mid; // an end value not finite, or equal ends: nothing to interpolate
        }
        double toward = Math.signum(mid - falsi);
        double truncated = delta <= Math.abs(mid - falsi) ? falsi + toward * delta : mid;
        return Math.abs(truncated - mid) <= radius ? truncated : mid - toward * radius;
    }
}
