package org.spectralsieve.requirement;

import java.util.List;
import org.spectralsieve.optics.Slab;
import org.spectralsieve.optics.SlabReading;

/**
 * One monotone condition on the thickness d of a bulk sample, as a margin in decades m(d): falling with d
 * for pass-like conditions (more material, less light), rising for block-like ones. The condition holds
 * where m(d) >= 0 — an interval reaching to one end of any range.
 */
abstract class ThicknessConstraint {

    final boolean falling;
    /** False when the data can never prove the condition (a pass judged on a bound). */
    final boolean provable;

    /**
     * For a pass-like condition: the thickness beyond which a reading it needs is only an upper bound (an
     * extrapolated absorption the data cannot resolve, {@link SlabReading#farMm}), so it cannot be proven
     * there whatever the margin; +∞ when there is none. Block-like conditions are proven by bounds too.
     */
    final double provableUpToMm;

    ThicknessConstraint(boolean falling, boolean provable) {
        this(falling, provable, Double.POSITIVE_INFINITY);
    }

    ThicknessConstraint(boolean falling, boolean provable, double provableUpToMm) {
        this.falling = falling;
        this.provable = provable;
        this.provableUpToMm = falling ? provableUpToMm : Double.POSITIVE_INFINITY;
    }

    abstract double marginAt(double d);

    /** [min, max] cut to where a pass-like condition can be proven; null when nowhere. */
    final double[] provableWithin(double min, double max) {
        double top = Math.min(max, provableUpToMm);
        return top < min ? null : new double[] {min, top};
    }

    /**
     * The sub-interval of [min, max] where the condition holds, as {lo, hi}, or null when nowhere. By a
     * bracketing search on the monotone margin to {@link ThicknessSolver#TOLERANCE_MM}, returning the end on
     * the holding side so the reported interval never contains a thickness that fails.
     */
    double[] holdsWithin(double min, double max) {
        double[] provableRange = provableWithin(min, max);
        if (provableRange == null) {
            return null;
        }
        return holdsWithinByBracketing(provableRange[0], provableRange[1]);
    }

    /**
     * The crossing by {@link CrossingFinder} (bisection's worst case, fewer trials on a smooth margin): the
     * side of a trial thickness is {@code marginAt(d) >= 0} as before (a NaN margin fails), and the end kept
     * is the one on the holding side, with room from the crossing ({@link CrossingFinder.Keep}).
     */
    private double[] holdsWithinByBracketing(double min, double max) {
        if (falling) {
            double atMin = marginAt(min);
            if (atMin < 0) {
                return null;
            }
            double atMax = marginAt(max);
            if (atMax >= 0) {
                return new double[] {min, max};
            }
            CrossingFinder.Bracket b = CrossingFinder.narrow(this::marginAt, m -> m >= 0, min, atMin, max, atMax,
                    ThicknessSolver.TOLERANCE_MM, CrossingFinder.Keep.LEFT);
            return new double[] {min, b.left()};
        }
        double atMax = marginAt(max);
        if (atMax < 0) {
            return null;
        }
        double atMin = marginAt(min);
        if (atMin >= 0) {
            return new double[] {min, max};
        }
        CrossingFinder.Bracket b = CrossingFinder.narrow(this::marginAt, m -> !(m >= 0), min, atMin, max, atMax,
                ThicknessSolver.TOLERANCE_MM, CrossingFinder.Keep.RIGHT);
        return new double[] {b.right(), max};
    }

    /** T at one wavelength against a threshold. */
    static final class AtWavelength extends ThicknessConstraint {

        private final RescaledModel model;
        private final double nm;
        private final Direction direction;
        private final double threshold;

        AtWavelength(RescaledModel model, double nm, Direction direction, double threshold) {
            this(model, nm, direction, threshold, model.farMmAt(nm));
        }

        /** @param provableUpToMm for a pass: beyond it a reading the clause needs is only a bound */
        AtWavelength(RescaledModel model, double nm, Direction direction, double threshold, double provableUpToMm) {
            super(direction == Direction.PASS, direction == Direction.BLOCK || !model.measuredBoundAt(nm),
                    provableUpToMm);
            this.model = model;
            this.nm = nm;
            this.direction = direction;
            this.threshold = threshold;
        }

        @Override
        double marginAt(double d) {
            return Margins.of(direction, model.judgedAt(nm, d), threshold);
        }

        /**
         * At a stored wavelength the root is closed-form; between stored points, a bracketing search. Either way a
         * pass holds only up to the reading's far thickness ({@link #provableUpToMm}).
         */
        @Override
        double[] holdsWithin(double min, double max) {
            int i = model.indexOf(nm);
            if (i < 0) {
                return super.holdsWithin(min, max);
            }
            double[] provableRange = provableWithin(min, max);
            if (provableRange == null) {
                return null;
            }
            return closedForm(i, provableRange[0], provableRange[1]);
        }

        private double[] closedForm(int i, double min, double max) {
            SlabReading reading = model.judged(i);
            double r = reading.reflectance();
            double k0 = reading.internal();
            double d0 = model.measuredMm();
            // T of a reading without absorption, as the rescaled curve computes it (its own T at every d)
            double clear = Slab.transmittance(1, r);
            if (direction == Direction.PASS) {
                if (k0 >= 1) {
                    return clear >= threshold ? new double[] {min, max} : null;
                }
                double kStar = Slab.internalFromTransmittance(threshold, r);
                if (k0 <= 0 || kStar >= 1) {
                    return null;
                }
                // K0^(d/d0) >= K*  <=>  d <= d0 ln K* / ln K0  (ln K0 < 0)
                double dMax = settle(d0 * Math.log(kStar) / Math.log(k0), -1);
                return dMax < min ? null : new double[] {min, Math.min(dMax, max)};
            }
            if (k0 <= 0) {
                return new double[] {min, max};
            }
            if (k0 >= 1) {
                return clear <= threshold ? new double[] {min, max} : null;
            }
            double kStar = Slab.internalFromTransmittance(threshold, r);
            if (kStar >= 1) {
                return new double[] {min, max};
            }
            // K0^(d/d0) <= K*  <=>  d >= d0 ln K* / ln K0
            double dMin = settle(d0 * Math.log(kStar) / Math.log(k0), +1);
            return dMin > max ? null : new double[] {Math.max(min, dMin), max};
        }

        /**
         * The closed-form root may land a rounding step on the failing side; nudge it (at most a few parts
         * in 10¹²) toward the holding side so the interval end itself holds when judged on the rescaled curve.
         */
        private double settle(double root, int towardHolding) {
            double d = root;
            for (int i = 0; i < 16 && d > 0 && Double.isFinite(d) && marginAt(d) < 0; i++) {
                d += towardHolding * Math.max(Math.ulp(d), Math.abs(d) * 1e-13);
            }
            return d;
        }
    }

    /** Trapezoid mean of T over a covered band against a threshold; the mean of non-increasing T(d) is non-increasing. */
    static final class BandMean extends ThicknessConstraint {

        private final RescaledModel model;
        private final double[] nms;
        private final Direction direction;
        private final double threshold;

        BandMean(RescaledModel model, List<Reading> readings, Direction direction, double threshold) {
            super(direction == Direction.PASS,
                    direction == Direction.BLOCK || readings.stream().noneMatch(Reading::bounded),
                    readings.stream().mapToDouble(r -> model.farMmAt(r.nm())).min().orElse(Double.POSITIVE_INFINITY));
            this.model = model;
            this.nms = readings.stream().mapToDouble(Reading::nm).toArray();
            this.direction = direction;
            this.threshold = threshold;
        }

        @Override
        double marginAt(double d) {
            double area = 0;
            double previous = model.judgedAt(nms[0], d);
            for (int i = 1; i < nms.length; i++) {
                double t = model.judgedAt(nms[i], d);
                area += 0.5 * (previous + t) * (nms[i] - nms[i - 1]);
                previous = t;
            }
            return Margins.of(direction, area / (nms[nms.length - 1] - nms[0]), threshold);
        }
    }
}
