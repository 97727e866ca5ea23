package org.spectralsieve.requirement;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.spectralsieve.optics.RefractiveIndex;
import org.spectralsieve.spectrum.Curve;

/**
 * Thickness as a design variable for a bulk sample: which thicknesses within [min, max] make every
 * clause hold, and which one to recommend.
 *
 * <p>Each clause becomes monotone conditions on d ({@link ThicknessConstraint}): a pass reading bounds d
 * from above, a block reading from below; a cutoff clause is a pass condition at the window's long end
 * (T(hi) >= level) and a block condition at its short end (T(lo) <= level). At a stored wavelength the
 * bound is closed-form: K* = slab inversion of the threshold (Smith, Modern Optical Engineering, eq. 10.5
 * solved for K), K(d) = K0^(d/d0) (Beer–Lambert), so a pass needs d <= d0·ln(K*) / ln(K0) and a block
 * d >= d0·ln(K*) / ln(K0). Band ends between stored points and band means are solved by a bracketing
 * search ({@link CrossingFinder}: bisection's worst case, superlinear on a smooth margin) to
 * {@link #TOLERANCE_MM}, keeping the holding side. A band is the intersection over its readings.
 *
 * <p>Recommendation: the worst margin is min(D(d), I(d)) with D the smallest falling (pass) margin and I
 * the smallest rising (block) margin, so it peaks where D = I; found by the same bracketing search on D − I to
 * {@link #TOLERANCE_MM}, at min when only pass conditions exist, at max when only block conditions exist.
 * Taken over the feasible interval when there is one, else over [min, max] (the best achievable). Clauses
 * that cannot be read at all (outside the measured range) do not vary with d and are left out of the
 * recommendation; if nothing varies, the measured thickness clamped into [min, max] is recommended.
 *
 * <p>Detection limits: a below-detection point is rescaled as the bound it is (rescaling is increasing
 * in T, so bounds stay bounds). A block proven by a bound at d stays proven for every thicker d; so a
 * block condition solved from a bound gives a sufficient lower limit — thinner may also work, the data
 * just cannot show it. A pass judged on a bound is never provable, so any clause with one makes the
 * feasible interval empty, though its bound margin still guides the recommendation.
 *
 * <p>Clear readings (at or near the lossless ceiling, {@link org.spectralsieve.optics.SlabReading}) keep
 * their measured T at every thickness but become upper bounds beyond their far thickness, where the
 * absorption the data cannot resolve is no longer negligible: a pass needing such a reading holds only up to
 * that thickness ({@link ThicknessConstraint#provableUpToMm}); blocks are unaffected (a bound proves them).
 * The same rule as the rescaled curve, so a thickness inside a reported interval meets when judged on it.
 */
public final class ThicknessSolver {

    /** Thicknesses from the bracketing search are within this of the true crossing (mm), on the holding side. */
    public static final double TOLERANCE_MM = 1e-7;

    private ThicknessSolver() {
    }

    /**
     * @param feasibleMm where every clause is proven to hold, null when nowhere
     * @param recommendedMm the thickness maximising the worst margin (inside {@code feasibleMm} when given)
     */
    public record Solution(ThicknessInterval feasibleMm, double recommendedMm) {
    }

    public static Solution solve(List<Clause> clauses, Curve measured, double measuredMm, RefractiveIndex index,
                                 double minMm, double maxMm) {
        Objects.requireNonNull(measured, "measured");
        Objects.requireNonNull(index, "index");
        if (!(measuredMm > 0) || !Double.isFinite(measuredMm)) {
            throw new IllegalArgumentException("measuredMm must be a finite thickness > 0 mm, was " + measuredMm);
        }
        if (!(minMm > 0) || !Double.isFinite(maxMm) || !(maxMm >= minMm)) {
            throw new IllegalArgumentException("thickness range must be positive and ordered, got " + minMm + " to "
                    + maxMm + " mm");
        }
        return solve(clauses, new RescaledModel(measured, measuredMm, index), minMm, maxMm);
    }

    /**
     * {@link #solve(List, Curve, double, RefractiveIndex, double, double)} for a bulk candidate alone, on its
     * path's readings ({@link CandidatePath#readings}: formed when read and shared with the curves it is
     * judged on); the same checks in the same order.
     */
    static Solution solvePlain(List<Clause> clauses, CandidatePath path, double minMm, double maxMm) {
        Objects.requireNonNull(path.candidate().measured(), "measured");
        Objects.requireNonNull(path.candidate().index(), "index");
        double measuredMm = path.candidate().thicknessMm();
        if (!(measuredMm > 0) || !Double.isFinite(measuredMm)) {
            throw new IllegalArgumentException("measuredMm must be a finite thickness > 0 mm, was " + measuredMm);
        }
        if (!(minMm > 0) || !Double.isFinite(maxMm) || !(maxMm >= minMm)) {
            throw new IllegalArgumentException("thickness range must be positive and ordered, got " + minMm + " to "
                    + maxMm + " mm");
        }
        return solve(clauses, path.readings(), minMm, maxMm);
    }

    private static Solution solve(List<Clause> clauses, RescaledModel model, double minMm, double maxMm) {
        double measuredMm = model.measuredMm();
        CurveView view = new CurveView(model.curve());
        List<ThicknessConstraint> constraints = new ArrayList<>();
        boolean provable = true;
        for (Clause clause : clauses) {
            provable &= addConstraints(clause, model, view, constraints);
        }
        return solve(constraints, provable, minMm, maxMm, measuredMm);
    }

    /**
     * The same for a requirement with weighted clauses or a fixed layer: plain clauses on the candidate
     * alone keep their closed-form conditions; every other clause, and every clause judged through a
     * stack, becomes one condition on the whole path at d, solved by the bracketing search to {@link #TOLERANCE_MM}.
     * Those are monotone too: every T of the path falls as the candidate thickens (the stack's T rises with
     * each part's T), hence so do a band's worst point, its mean and any weighted figure; a cutoff again
     * splits into its two edges. The critical wavelength is not monotone in general (it follows the shape
     * of the absorbance, not its level), but with absorbance linear in d (Beer–Lambert, surfaces fixed) its
     * condition is linear in d, so it is taken as monotone in the direction its margins at min and max show;
     * the caller checks the interval's ends on the real curves.
     */
    static Solution solve(List<Clause> clauses, CandidatePath path, double minMm, double maxMm) {
        Candidate candidate = path.candidate();
        if (!(minMm > 0) || !Double.isFinite(maxMm) || !(maxMm >= minMm)) {
            throw new IllegalArgumentException("thickness range must be positive and ordered, got " + minMm + " to "
                    + maxMm + " mm");
        }
        // the closed form is the normal-incidence slab: at an angle every clause is solved on the oblique path
        RescaledModel model = path.stacked() || path.oblique() ? null : path.readings();
        CurveView view = new CurveView(candidate.measured());
        // coverage and below-detection flags of the path do not depend on the candidate's thickness
        // at an angle on points formed when read: a full oblique curve costs every point's angles
        CurveView pathView = path.oblique() ? new CurveView(path.asMeasuredPoints()) : new CurveView(path.asMeasured());
        List<ThicknessConstraint> constraints = new ArrayList<>();
        boolean provable = true;
        for (Clause clause : clauses) {
            provable &= model != null && clause.plain()
                    ? addConstraints(clause, model, view, constraints)
                    : PathConstraints.add(clause, path, pathView, minMm, maxMm, constraints);
        }
        return solve(constraints, provable, minMm, maxMm, candidate.thicknessMm());
    }

    private static Solution solve(List<ThicknessConstraint> constraints, boolean provable, double minMm, double maxMm,
                                  double measuredMm) {
        double lo = minMm;
        double hi = maxMm;
        boolean feasible = provable;
        for (ThicknessConstraint c : constraints) {
            if (!feasible) {
                break;
            }
            double[] holds = c.provable ? c.holdsWithin(minMm, maxMm) : null;
            if (holds == null) {
                feasible = false;
            } else {
                lo = Math.max(lo, holds[0]);
                hi = Math.min(hi, holds[1]);
                feasible = lo <= hi;
            }
        }
        if (feasible) {
            return new Solution(new ThicknessInterval(lo, hi), recommend(constraints, lo, hi, measuredMm));
        }
        return new Solution(null, recommend(constraints, minMm, maxMm, measuredMm));
    }

    /** Adds the clause's conditions; false when the clause can never be proven whatever the thickness. */
    private static boolean addConstraints(Clause clause, RescaledModel model, CurveView view,
                                          List<ThicknessConstraint> out) {
        if (clause instanceof TransmittanceClause t) {
            boolean covered = view.covers(t.band());
            List<Reading> readings = view.readings(t.band());
            if (t.aggregate() == Aggregate.MEAN) {
                if (covered) {
                    out.add(new ThicknessConstraint.BandMean(model, readings, t.direction(), t.thresholdT()));
                }
            } else {
                // the covered part of a partly covered band can still prove a miss, so it guides the choice
                for (Reading r : readings) {
                    out.add(new ThicknessConstraint.AtWavelength(model, r.nm(), t.direction(), t.thresholdT()));
                }
            }
            return covered;
        }
        CutoffClause c = (CutoffClause) clause;
        if (!view.covers(c.window())) {
            return false;
        }
        // the UV edge is read walking up from the short side: a clear point inside the window that is only a
        // bound at d leaves the crossing undetermined, so the pass edge is provable only up to the least far
        // thickness inside the window
        out.add(new ThicknessConstraint.AtWavelength(model, c.window().toNm(), Direction.PASS, c.levelT(),
                model.farMmBetween(c.window().fromNm(), c.window().toNm())));
        out.add(new ThicknessConstraint.AtWavelength(model, c.window().fromNm(), Direction.BLOCK, c.levelT()));
        return true;
    }

    private static double recommend(List<ThicknessConstraint> constraints, double lo, double hi, double measuredMm) {
        List<ThicknessConstraint> falling = constraints.stream().filter(c -> c.falling).toList();
        List<ThicknessConstraint> rising = constraints.stream().filter(c -> !c.falling).toList();
        if (falling.isEmpty() && rising.isEmpty()) {
            return Math.min(hi, Math.max(lo, measuredMm));
        }
        if (rising.isEmpty()) {
            return lo;
        }
        if (falling.isEmpty()) {
            return hi;
        }
        double atLo = gap(falling, rising, lo);
        if (atLo <= 0) {
            return lo;
        }
        double atHi = gap(falling, rising, hi);
        if (atHi >= 0) {
            return hi;
        }
        // the side of a trial thickness is gap > 0 as before (a NaN gap is on the far side)
        CrossingFinder.Bracket bracket = CrossingFinder.narrow(d -> gap(falling, rising, d), g -> g > 0, lo, atLo,
                hi, atHi, TOLERANCE_MM, CrossingFinder.Keep.EITHER);
        double a = bracket.left();
        double b = bracket.right();
        // of the two ends of the final bracket, the one with the larger worst margin
        return worst(constraints, a) >= worst(constraints, b) ? a : b;
    }

    /** D(d) − I(d): positive while the pass side still has more room than the block side. */
    private static double gap(List<ThicknessConstraint> falling, List<ThicknessConstraint> rising, double d) {
        return worst(falling, d) - worst(rising, d);
    }

    private static double worst(List<ThicknessConstraint> constraints, double d) {
        double m = Double.POSITIVE_INFINITY;
        for (ThicknessConstraint c : constraints) {
            m = Math.min(m, c.marginAt(d));
        }
        return m;
    }
}
