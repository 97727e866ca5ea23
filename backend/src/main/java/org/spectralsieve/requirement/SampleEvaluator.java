package org.spectralsieve.requirement;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import org.spectralsieve.optics.ThicknessRescaler;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.CurveException;

/**
 * Judges one candidate sample against a requirement, handling what the requirement says about thickness
 * (rules in docs/thickness.md):
 * <ul>
 *   <li>AS_MEASURED: the measured curve.</li>
 *   <li>FIXED d: a sample measured at d ({@link NominalThickness}: 4.005 mm is "4 mm") is judged as
 *       measured; a non-bulk part (coating, laminate) measured elsewhere is UNVERIFIED ("coated/laminated
 *       part, measured only at …; not rescalable"), never rescaled and never called a miss; a bulk sample
 *       is rescaled to d ({@link ThicknessRescaler}) only when the material is made at d
 *       ({@link MadeThicknesses}), else UNVERIFIED ("made only 0.025–0.125 mm thick, not 6 mm").</li>
 *   <li>RANGE: a bulk sample goes through {@link ThicknessSolver} over the asked range cut to the made
 *       thicknesses and to the sample's span (the thicknesses it is the nearest measurement for, see
 *       {@link MaterialJudge}), and is judged at the recommended thickness, or at the best stock size when
 *       only stock sizes exist; stock sizes inside are judged for {@link StockAdvice}. The feasible
 *       interval is kept only if that judgement meets (a guard for non-monotone curves, where the cutoff
 *       edge test and the cutoff walk could disagree), and, for requirements solved on the whole path
 *       (weighted clauses, a fixed layer), only if both its ends meet too. A non-bulk part is judged as
 *       measured when its thickness lies in the range, else UNVERIFIED.</li>
 * </ul>
 * With a fixed layer ({@link StackLayer}) every clause is judged on the stack of the candidate (at the
 * thickness above) and the layer ({@link CandidatePath}); where their measured ranges do not overlap,
 * every clause is UNVERIFIED with the reason. Rows that cannot be judged at the asked thickness use
 * {@link ClauseResult#unjudgeable}, so the ranking can group them after the useful rows.
 *
 * <p>A diffuse or scattering sample ({@link Candidate#notRescaledReason()}) is held at its measured thickness
 * like a fixed layer, with its own reason; a see-through clause on total transmittance is UNVERIFIED unless
 * the requirement accepts it ({@link SeeThrough}).
 *
 * <p>A sample without a recorded thickness is judged as measured in AS_MEASURED and UNVERIFIED otherwise.
 * The clause verdicts always come from {@link ClauseEvaluator} on the curve actually judged.
 */
public final class SampleEvaluator {

    /** Two thicknesses closer than this (mm) are numerically the same (a fixed layer's own rescaling); parts are matched by {@link NominalThickness}. */
    public static final double SAME_THICKNESS_MM = 1e-9;

    private SampleEvaluator() {
    }

    /** A requirement without a fixed layer. */
    public static SampleEvaluation evaluate(Candidate candidate, Requirement requirement) {
        return evaluate(candidate, requirement, Optional.empty());
    }

    /**
     * @param layer the requirement's fixed layer, resolved to a sample; required exactly when the
     *              requirement names one
     */
    public static SampleEvaluation evaluate(Candidate candidate, Requirement requirement, Optional<StackLayer> layer) {
        return evaluate(candidate, requirement, layer, WHOLE_AXIS);
    }

    /** Every thickness: the span of a sample that is its material's only one. */
    public static final ThicknessInterval WHOLE_AXIS = new ThicknessInterval(Double.MIN_VALUE, Double.MAX_VALUE);

    /**
     * @param span the thicknesses this sample speaks for among its material's samples ({@link MaterialJudge});
     *             thickness solving stays inside it
     */
    public static SampleEvaluation evaluate(Candidate candidate, Requirement requirement, Optional<StackLayer> layer,
                                            ThicknessInterval span) {
        Objects.requireNonNull(candidate, "candidate");
        Objects.requireNonNull(span, "span");
        Objects.requireNonNull(requirement, "requirement");
        Objects.requireNonNull(layer, "layer");
        if (requirement.layer().isPresent() != layer.isPresent()) {
            throw new IllegalArgumentException(requirement.layer().isPresent()
                    ? "the requirement names a fixed layer ('" + requirement.layer().get().text() + "'); resolve it to a sample first"
                    : "a resolved layer was given for a requirement without one");
        }
        if (requirement.namesStates()) {
            return StateJudge.evaluate(candidate, requirement, layer, span);
        }
        if (requirement.oblique() && !candidate.bulk()) {
            return unverified(candidate.sampleId(), candidate.thicknessMm(), requirement.clauses(),
                    notAtAngle(candidate, requirement.light()));
        }
        try {
            CandidatePath path = new CandidatePath(candidate, layer, requirement.light());
            try {
                return seenThrough(candidate, requirement, evaluate(path, requirement, span));
            } catch (CurveException e) {
                if (!path.stacked()) {
                    throw e;
                }
                // a stack is only known where both parts were measured: their ranges do not overlap
                return unverified(candidate.sampleId(), candidate.thicknessMm(), requirement.clauses(),
                        "no light path: " + e.getMessage());
            }
        } catch (RuntimeException e) {
            // one sample whose stored numbers defeat the computation (an index of 10¹⁶ stored before it was
            // checked) must not take the whole search with it: its row says why and the others are judged
            return notComputable(candidate.sampleId(), candidate.thicknessMm(), requirement.clauses(), e);
        }
    }

    /** Begins the reason of every row whose computation failed (docs/validation.md). */
    public static final String NOT_COMPUTABLE = "could not be computed: ";

    /**
     * The row of a sample whose judgement failed: every clause UNVERIFIED with the failure's message, so
     * that it ranks with the rows that cannot be judged and the search goes on.
     */
    public static SampleEvaluation notComputable(long sampleId, double thicknessMm, List<Clause> clauses, Throwable failure) {
        String message = failure.getMessage() == null ? failure.getClass().getSimpleName() : failure.getMessage();
        return unverified(sampleId, thicknessMm, clauses,
                message.startsWith(NOT_COMPUTABLE) ? message : NOT_COMPUTABLE + message);
    }

    private static SampleEvaluation evaluate(CandidatePath path, Requirement requirement, ThicknessInterval span) {
        Candidate candidate = path.candidate();
        ThicknessSpec spec = requirement.thickness();
        List<Clause> clauses = requirement.clauses();
        double d0 = candidate.thicknessMm();
        if (spec.kind() == ThicknessSpec.Kind.AS_MEASURED) {
            return (path.stacked() || path.oblique()) && !path.earlier() ? judgedAsMeasured(candidate.sampleId(), d0, clauses, path)
                    : judged(candidate.sampleId(), d0, null, clauses, path.asMeasured());
        }
        if (!candidate.thicknessKnown()) {
            return unverified(candidate.sampleId(), d0, clauses,
                    "the thickness of the measured sample is not recorded, so it cannot be judged at another thickness");
        }
        if (spec.kind() == ThicknessSpec.Kind.FIXED) {
            return fixed(path, clauses, spec.minMm());
        }
        return range(path, requirement, spec.minMm(), spec.maxMm(), span);
    }

    /**
     * One asked thickness: a sample measured at it ({@link NominalThickness}) is judged as measured; a
     * coated or laminated part measured elsewhere, or a thickness the material is not made in, is
     * unverified with the reason; otherwise the bulk sample is rescaled to the asked thickness.
     */
    private static SampleEvaluation fixed(CandidatePath path, List<Clause> clauses, double asked) {
        Candidate candidate = path.candidate();
        double d0 = candidate.thicknessMm();
        if (NominalThickness.same(d0, asked)) {
            return path.oblique() && !path.earlier() ? judgedAsMeasured(candidate.sampleId(), d0, clauses, path)
                    : judged(candidate.sampleId(), d0, null, clauses, path.asMeasured());
        }
        if (!candidate.bulk()) {
            return unverified(candidate.sampleId(), d0, clauses, notRescalable(candidate) + " to " + Wording.mm(asked));
        }
        if (!candidate.made().makes(asked)) {
            return unverified(candidate.sampleId(), asked, clauses,
                    candidate.made().limitText() + ", not " + Wording.mm(asked));
        }
        return judgedAt(candidate.sampleId(), asked, null, clauses, path, asked);
    }

    /**
     * Why a part that is not a homogeneous absorber is not judged at an angle: scatter is not absorption, so the
     * slant path's Beer–Lambert does not hold; a coating's spectrum shifts with angle (interference) in a way a
     * normal-incidence curve cannot show.
     */
    static String notAtAngle(Candidate candidate, org.spectralsieve.optics.Illumination light) {
        return whyNotAtAngle(candidate.notRescaledReason()) + "; not judged for " + light.describe();
    }

    /**
     * The reason a part that is not bulk has no figure at an angle, for the search rows and the figures alike.
     *
     * @param notRescaledReason the diffuse or scattering sample's reason, or null for a coated or laminated part
     */
    public static String whyNotAtAngle(String notRescaledReason) {
        return notRescaledReason != null
                ? notRescaledReason + ": scattered light does not follow the slant path's Beer–Lambert law"
                : "coated/laminated part: a coating's spectrum shifts with angle, which its normal-incidence curve"
                        + " cannot show";
    }

    /** Why a non-bulk candidate stays at its measured thickness: a diffuse sample's reason, or a coated part. */
    static String notRescalable(Candidate candidate) {
        String measured = Wording.mm(candidate.thicknessMm());
        return candidate.notRescaledReason() != null
                ? candidate.notRescaledReason() + "; measured at " + measured + ", not rescalable"
                : "coated/laminated part, measured only at " + measured + "; not rescalable";
    }

    private static SampleEvaluation range(CandidatePath path, Requirement requirement, double min, double max,
                                          ThicknessInterval span) {
        Candidate candidate = path.candidate();
        List<Clause> clauses = requirement.clauses();
        double d0 = candidate.thicknessMm();
        if (!candidate.bulk()) {
            if (NominalThickness.within(d0, min, max)) {
                return judged(candidate.sampleId(), d0, null, clauses, path.asMeasured());
            }
            return unverified(candidate.sampleId(), d0, clauses, notRescalable(candidate) + " to " + Wording.mmSpan(min, max));
        }
        MadeThicknesses made = candidate.made();
        ThicknessInterval inMade = made.within(min, max);
        if (inMade == null) {
            return unverified(candidate.sampleId(), d0, clauses,
                    made.limitText() + ", none of " + Wording.mmSpan(min, max));
        }
        double lo = Math.max(inMade.loMm(), span.loMm());
        double hi = Math.min(inMade.hiMm(), span.hiMm());
        if (lo > hi || !made.continuous() && made.stockWithin(lo, hi).isEmpty()) {
            return unverified(candidate.sampleId(), d0, clauses,
                    "the material's other samples lie nearer to " + Wording.mmSpan(min, max));
        }
        SampleEvaluation solved = solved(path, requirement, lo, hi);
        List<StockAdvice.StockFit> fits = new ArrayList<>();
        for (double stock : made.stockWithin(lo, hi)) {
            SampleEvaluation e = judgedAt(candidate.sampleId(), stock, null, clauses, path, stock);
            fits.add(new StockAdvice.StockFit(stock, e.verdict(), e.worstMarginDecades()));
        }
        StockAdvice advice = advise(fits, solved.feasibleMm());
        if (made.continuous()) {
            return solved.withThicknessAdvice(solved.feasibleMm(), advice);
        }
        // only the stock sizes exist: the row is the best of them, the interval stays as information
        double best = fits.stream().min(STOCK_ORDER).orElseThrow().thicknessMm();
        return judgedAt(candidate.sampleId(), best, null, clauses, path, best)
                .withThicknessAdvice(solved.feasibleMm(), advice);
    }

    /** Stock sizes in ranking order: meets first, then larger worst margin, NaN last, then thinner. */
    static final java.util.Comparator<StockAdvice.StockFit> STOCK_ORDER = (a, b) -> {
        int byRank = RankingOrder.compare(standing(a.verdict()), a.worstMarginDecades(), "", 0,
                standing(b.verdict()), b.worstMarginDecades(), "", 0);
        return byRank != 0 ? byRank : Double.compare(a.thicknessMm(), b.thicknessMm());
    };

    /** A stock size's group: judged at a size the material is made in, so never "not judged". */
    private static Standing standing(Verdict verdict) {
        return switch (verdict) {
            case MEETS -> Standing.MEETS;
            case UNVERIFIED -> Standing.UNVERIFIED;
            case MISSES -> Standing.MISSES;
        };
    }

    /**
     * The stock sizes proven to meet, best margin first; when none, the one that comes closest and how far
     * it lies from the feasible interval.
     */
    static StockAdvice advise(List<StockAdvice.StockFit> judged, ThicknessInterval feasible) {
        // a stock size on the boundary of two samples' spans is judged by both: keep its better judgement
        java.util.Map<Double, StockAdvice.StockFit> best = new java.util.TreeMap<>();
        for (StockAdvice.StockFit f : judged) {
            best.merge(f.thicknessMm(), f, (a, b) -> STOCK_ORDER.compare(a, b) <= 0 ? a : b);
        }
        List<StockAdvice.StockFit> fits = List.copyOf(best.values());
        List<StockAdvice.StockFit> inside = fits.stream().filter(f -> f.verdict() == Verdict.MEETS)
                .sorted(STOCK_ORDER).toList();
        if (!inside.isEmpty() || fits.isEmpty()) {
            return new StockAdvice(inside, null, Double.NaN);
        }
        StockAdvice.StockFit closest = fits.stream().min(STOCK_ORDER).orElseThrow();
        return new StockAdvice(List.of(), closest, distance(closest.thicknessMm(), feasible));
    }

    /** How far d lies outside the interval (0 inside), NaN without an interval. */
    static double distance(double d, ThicknessInterval interval) {
        if (interval == null) {
            return Double.NaN;
        }
        return Math.max(0, Math.max(interval.loMm() - d, d - interval.hiMm()));
    }

    private static SampleEvaluation solved(CandidatePath path, Requirement requirement, double min, double max) {
        Candidate candidate = path.candidate();
        List<Clause> clauses = requirement.clauses();
        double d0 = candidate.thicknessMm();
        boolean onPath = !requirement.plain();
        ThicknessSolver.Solution solution = onPath
                ? ThicknessSolver.solve(clauses, path, min, max)
                : path.earlier() ? ThicknessSolver.solve(clauses, candidate.measured(), d0, candidate.index(), min, max)
                : ThicknessSolver.solvePlain(clauses, path, min, max);
        double d = solution.recommendedMm();
        SampleEvaluation evaluation = judgedAt(candidate.sampleId(), d, solution.feasibleMm(), clauses, path, d);
        ThicknessInterval feasible = evaluation.feasibleMm();
        boolean keep = feasible == null || evaluation.verdict() == Verdict.MEETS
                && (!onPath || meets(clauses, path, feasible.loMm()) && meets(clauses, path, feasible.hiMm()));
        if (!keep) {
            return SampleEvaluation.of(candidate.sampleId(), d, null, evaluation.clauses());
        }
        return evaluation;
    }

    /**
     * A see-through clause judged on total transmittance is UNVERIFIED unless the requirement accepts total
     * transmittance ({@link SeeThrough}); the figure stays in the explanation, with no margin to rank by.
     */
    private static SampleEvaluation seenThrough(Candidate candidate, Requirement requirement, SampleEvaluation judged) {
        if (!candidate.totalTransmittance() || requirement.acceptsTotalTransmittance()) {
            return judged;
        }
        List<ClauseResult> results = new ArrayList<>(judged.clauses().size());
        boolean changed = false;
        for (ClauseResult r : judged.clauses()) {
            if (SeeThrough.needsRegular(r.clause()) && r.verdict() != Verdict.UNVERIFIED) {
                results.add(new ClauseResult(r.clause(), r.value(), r.threshold(), Double.NaN, Verdict.UNVERIFIED,
                        SeeThrough.REASON + " (on total transmittance: " + r.explanation() + ")", r.valueIsBound()));
                changed = true;
            } else {
                results.add(r);
            }
        }
        // no thickness is proven feasible while a clause is unverified
        return changed ? SampleEvaluation.of(judged.sampleId(), judged.thicknessMm(), null, results) : judged;
    }

    private static boolean meets(List<Clause> clauses, CandidatePath path, double d) {
        for (Clause clause : clauses) {
            if (evaluateAt(clause, path, d).verdict() != Verdict.MEETS) {
                return false;
            }
        }
        return true;
    }

    /**
     * The clauses judged on a stack as measured: weighted figures and bands on its points formed when read
     * ({@link CandidatePath#asMeasuredPoints}), the way {@link #evaluateAt} reads a rescaled candidate's points, so
     * the results are those {@link ClauseEvaluator} gives on the built curve; other clauses on the built curve.
     */
    private static SampleEvaluation judgedAsMeasured(long sampleId, double thicknessMm, List<Clause> clauses,
                                                     CandidatePath path) {
        List<ClauseResult> results = new ArrayList<>(clauses.size());
        for (Clause clause : clauses) {
            if (clause instanceof WeightedClause w) {
                results.add(FigureClauses.weighted(w, path.asMeasuredPoints()));
            } else if (clause instanceof TransmittanceClause t) {
                results.add(ClauseEvaluator.transmittance(t, new CurveView(path.asMeasuredPoints())));
            } else {
                results.add(ClauseEvaluator.evaluate(clause, path.asMeasured()));
            }
        }
        return SampleEvaluation.of(sampleId, thicknessMm, null, results);
    }

    /** The clauses judged on the path at thickness d ({@link #evaluateAt}). */
    private static SampleEvaluation judgedAt(long sampleId, double thicknessMm, ThicknessInterval feasible,
                                             List<Clause> clauses, CandidatePath path, double d) {
        if (path.earlier()) {
            return judged(sampleId, thicknessMm, feasible, clauses, path.at(d));
        }
        List<ClauseResult> results = new ArrayList<>(clauses.size());
        for (Clause clause : clauses) {
            results.add(evaluateAt(clause, path, d));
        }
        return SampleEvaluation.of(sampleId, thicknessMm, feasible, results);
    }

    /**
     * One clause on the path at thickness d. A weighted clause reads its figure on the path's points at d
     * ({@link CandidatePath#pointsAt}: for a bulk candidate alone, only the points the figure reads, mostly
     * already formed while solving), and a transmittance clause reads its band there ({@link CurveView} on those
     * points): they are the points of {@link CandidatePath#at}, so the result is the one {@link ClauseEvaluator}
     * gives on the built curve. Cutoff and critical-wavelength clauses, which walk the curve, use the built curve.
     */
    private static ClauseResult evaluateAt(Clause clause, CandidatePath path, double d) {
        if (!path.earlier() && clause instanceof WeightedClause w) {
            return FigureClauses.weighted(w, path.pointsAt(d));
        }
        if (!path.earlier() && clause instanceof TransmittanceClause t) {
            return ClauseEvaluator.transmittance(t, new CurveView(path.pointsAt(d)));
        }
        return ClauseEvaluator.evaluate(clause, path.at(d));
    }

    private static SampleEvaluation judged(long sampleId, double thicknessMm, ThicknessInterval feasible,
                                           List<Clause> clauses, Curve curve) {
        List<ClauseResult> results = new ArrayList<>(clauses.size());
        for (Clause clause : clauses) {
            results.add(ClauseEvaluator.evaluate(clause, curve));
        }
        return SampleEvaluation.of(sampleId, thicknessMm, feasible, results);
    }

    private static SampleEvaluation unverified(long sampleId, double thicknessMm, List<Clause> clauses, String why) {
        List<ClauseResult> results = new ArrayList<>(clauses.size());
        for (Clause clause : clauses) {
            results.add(ClauseResult.unjudgeable(clause, threshold(clause), why));
        }
        return SampleEvaluation.of(sampleId, thicknessMm, null, results);
    }

    /** The threshold a clause's result reports: a transmittance, a cutoff level, or a wavelength in nm. */
    static double threshold(Clause clause) {
        if (clause instanceof TransmittanceClause t) {
            return t.thresholdT();
        }
        if (clause instanceof WeightedClause w) {
            return w.thresholdT();
        }
        if (clause instanceof CriticalWavelengthClause c) {
            return c.nm();
        }
        if (clause instanceof RelativeClause r) {
            return r.fraction();
        }
        if (clause instanceof StateClause s) {
            return threshold(s.inner());
        }
        return ((CutoffClause) clause).levelT();
    }
}
