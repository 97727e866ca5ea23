package org.spectralsieve.requirement;

import java.util.List;
import org.spectralsieve.spectrum.PointReadings;
import java.util.function.DoubleUnaryOperator;

/**
 * Clauses as conditions on the candidate's thickness d, read on the whole light path at d
 * ({@link CandidatePath#at}); see {@link ThicknessSolver#solve(List, CandidatePath, double, double)} for why
 * each is monotone. Wavelengths, coverage and below-detection flags are those of the path as measured:
 * rescaling keeps a curve's wavelengths and flags, and the stack's grid and flags come from its parts —
 * except that a reading of the candidate becomes a bound beyond its far thickness
 * ({@link CandidatePath#farMmOnPath}), where a pass on it can no longer be proven. Weighted figures see
 * that flag on the rescaled path itself (their lower end counts such a point as 0).
 */
final class PathConstraints {

    private PathConstraints() {
    }

    /** Adds the clause's conditions; false when the clause can never be proven whatever the thickness. */
    static boolean add(Clause clause, CandidatePath path, CurveView asMeasured, double minMm, double maxMm,
                       List<ThicknessConstraint> out) {
        if (clause instanceof TransmittanceClause t) {
            return transmittance(t, path, asMeasured, out);
        }
        if (clause instanceof CutoffClause c) {
            if (!asMeasured.covers(c.window())) {
                return false;
            }
            out.add(point(path, c.window().toNm(), Direction.PASS, c.levelT(), asMeasured,
                    Math.min(path.farMmOnPath(c.window().toNm()), path.farMmOnPathFrom(c.window().fromNm()))));
            out.add(point(path, c.window().fromNm(), Direction.BLOCK, c.levelT(), asMeasured));
            return true;
        }
        if (clause instanceof WeightedClause w) {
            boolean explained = path.earlier();
            // only whether the figure exists is read here: its note is not (an unexplained figure has the same value
            // and availability, Weighting#figureForMargin), unless the rule before is asked for (MarginReuse)
            PointReadings measured = path.oblique() ? path.asMeasuredPoints() : asMeasured.curve();
            if (Double.isNaN(FigureClauses.weightedMargin(w, measured, explained || !MarginReuse.enabled()))) {
                return false;
            }
            // provable either way: a pass on the figure's lower end, a block on its upper end
            out.add(new OnPath(w.direction() == Direction.PASS, true,
                    d -> FigureClauses.weightedMargin(w, path.pointsAt(d), explained)));
            return true;
        }
        if (clause instanceof RelativeClause r) {
            return relative(r, path, asMeasured, minMm, maxMm, out);
        }
        CriticalWavelengthClause c = (CriticalWavelengthClause) clause;
        DoubleUnaryOperator margin = d -> FigureClauses.criticalMargin(c, JudgedCurves.upperBounds(path.at(d)));
        double atMin = margin.applyAsDouble(minMm);
        double atMax = margin.applyAsDouble(maxMm);
        if (Double.isNaN(atMin) || Double.isNaN(atMax)) {
            return false;
        }
        boolean provable = FigureClauses.criticalProvable(path.oblique() ? path.asMeasured() : asMeasured.curve());
        out.add(new OnPath(atMax <= atMin, provable, margin));
        return provable;
    }

    /**
     * A ratio of T at two wavelengths of a bulk slab: the internal part is exp(-(α1 - α2)·d), monotone in d, and the
     * surface terms change little; so, as for λc, the direction is the one its margins at both ends show, and the
     * solver narrows the crossing by bracketing (ITP, {@link CrossingFinder}); SampleEvaluator keeps an interval
     * only when both its ends and the recommendation meet on the real curves. Provable unless a reading it needs is
     * a bound of the wrong kind (a reference at its detection limit, or a numerator there for "over").
     */
    private static boolean relative(RelativeClause r, CandidatePath path, CurveView asMeasured, double minMm,
                                    double maxMm, List<ThicknessConstraint> out) {
        DoubleUnaryOperator margin = d -> RelativeClauses.evaluate(r, view(path, d)).marginDecades();
        double atMin = margin.applyAsDouble(minMm);
        double atMax = margin.applyAsDouble(maxMm);
        if (Double.isNaN(atMin) || Double.isNaN(atMax)) {
            return false;
        }
        boolean referenceBounded = asMeasured.covers(r.referenceNm()) && asMeasured.at(r.referenceNm()).bounded();
        boolean numeratorBounded = asMeasured.readings(r.band()).stream().anyMatch(Reading::bounded);
        boolean provable = !referenceBounded && (r.direction() == Direction.BLOCK || !numeratorBounded);
        out.add(new OnPath(atMax <= atMin, provable, margin));
        return provable;
    }

    private static boolean transmittance(TransmittanceClause t, CandidatePath path, CurveView asMeasured,
                                         List<ThicknessConstraint> out) {
        List<Reading> readings = asMeasured.readings(t.band());
        boolean covered = asMeasured.covers(t.band());
        boolean pass = t.direction() == Direction.PASS;
        boolean provable = !pass || readings.stream().noneMatch(Reading::bounded);
        double[] nms = readings.stream().mapToDouble(Reading::nm).toArray();
        double far = java.util.Arrays.stream(nms).map(path::farMmOnPath).min().orElse(Double.POSITIVE_INFINITY);
        if (t.aggregate() == Aggregate.MEAN) {
            if (covered) {
                out.add(new OnPath(pass, provable, far, d -> {
                    List<Reading> now = view(path, d).readings(t.band());
                    return Margins.of(t.direction(), CurveView.trapezoidMean(now), t.thresholdT());
                }));
            }
            return covered;
        }
        // the covered part of a partly covered band can still prove a miss, so it guides the choice
        if (nms.length > 0) {
            out.add(new OnPath(pass, provable, far, d -> {
                CurveView view = view(path, d);
                double worst = Double.POSITIVE_INFINITY;
                for (double nm : nms) {
                    worst = Math.min(worst, Margins.of(t.direction(), view.at(nm).judged(), t.thresholdT()));
                }
                return worst;
            }));
        }
        return covered;
    }

    private static ThicknessConstraint point(CandidatePath path, double nm, Direction direction, double threshold,
                                             CurveView asMeasured) {
        return point(path, nm, direction, threshold, asMeasured, path.farMmOnPath(nm));
    }

    private static ThicknessConstraint point(CandidatePath path, double nm, Direction direction, double threshold,
                                             CurveView asMeasured, double provableUpToMm) {
        boolean provable = direction == Direction.BLOCK || !asMeasured.at(nm).bounded();
        return new OnPath(direction == Direction.PASS, provable, provableUpToMm,
                d -> Margins.of(direction, view(path, d).at(nm).judged(), threshold));
    }

    /**
     * A condition whose margin is read on the path at d; each thickness's margin once per solve
     * ({@link RecentMargins}) unless {@link MarginReuse} is off.
     */
    static final class OnPath extends ThicknessConstraint {

        private final DoubleUnaryOperator margin;
        /** Null when every ask computes (the rule before, {@link MarginReuse}). */
        private final RecentMargins recent;

        OnPath(boolean falling, boolean provable, DoubleUnaryOperator margin) {
            this(falling, provable, Double.POSITIVE_INFINITY, margin);
        }

        OnPath(boolean falling, boolean provable, double provableUpToMm, DoubleUnaryOperator margin) {
            super(falling, provable, provableUpToMm);
            this.margin = margin;
            this.recent = MarginReuse.enabled() ? new RecentMargins(margin) : null;
        }

        @Override
        double marginAt(double d) {
            return recent != null ? recent.at(d) : margin.applyAsDouble(d);
        }
    }

    /** The path at d as a clause reads it: at an angle on its points formed when read, else its curve. */
    private static CurveView view(CandidatePath path, double d) {
        return path.oblique() ? new CurveView(path.pointsAt(d)) : new CurveView(path.at(d));
    }
}
