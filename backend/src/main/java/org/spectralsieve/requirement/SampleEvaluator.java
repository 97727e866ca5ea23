package org.spectralsieve.requirement;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.spectralsieve.optics.ThicknessRescaler;
import org.spectralsieve.spectrum.Curve;

/**
 * Judges one candidate sample against a requirement, handling what the requirement says about thickness:
 * <ul>
 *   <li>AS_MEASURED: the measured curve.</li>
 *   <li>FIXED d: a bulk sample rescaled to d ({@link ThicknessRescaler}); a non-bulk layer (coating,
 *       laminate) only when measured at d (within {@link #SAME_THICKNESS_MM}) — otherwise every clause is
 *       UNVERIFIED with the reason, never rescaled and never called a miss: the layer might meet at d, the
 *       data just do not say.</li>
 *   <li>RANGE: a bulk sample goes through {@link ThicknessSolver} and is judged at the recommended
 *       thickness; the feasible interval is kept only if that judgement meets (a guard for non-monotone
 *       curves, where the cutoff edge test and the cutoff walk could disagree). A layer is judged as
 *       measured when its thickness lies in the range, else UNVERIFIED.</li>
 * </ul>
 * A sample without a recorded thickness is judged as measured in AS_MEASURED and UNVERIFIED otherwise.
 * The clause verdicts always come from {@link ClauseEvaluator} on the curve actually judged.
 */
public final class SampleEvaluator {

    /** Two thicknesses closer than this (mm) are the same thickness; rescaling by 1 changes nothing real. */
    public static final double SAME_THICKNESS_MM = 1e-9;

    private SampleEvaluator() {
    }

    public static SampleEvaluation evaluate(Candidate candidate, Requirement requirement) {
        Objects.requireNonNull(candidate, "candidate");
        Objects.requireNonNull(requirement, "requirement");
        ThicknessSpec spec = requirement.thickness();
        List<Clause> clauses = requirement.clauses();
        double d0 = candidate.thicknessMm();
        if (spec.kind() == ThicknessSpec.Kind.AS_MEASURED) {
            return judged(candidate.sampleId(), d0, null, clauses, candidate.measured());
        }
        if (!candidate.thicknessKnown()) {
            return unverified(candidate.sampleId(), d0, clauses,
                    "the thickness of the measured sample is not recorded, so it cannot be judged at another thickness");
        }
        if (spec.kind() == ThicknessSpec.Kind.FIXED) {
            return fixed(candidate, clauses, spec.minMm());
        }
        return range(candidate, clauses, spec.minMm(), spec.maxMm());
    }

    private static SampleEvaluation fixed(Candidate candidate, List<Clause> clauses, double asked) {
        double d0 = candidate.thicknessMm();
        if (Math.abs(asked - d0) <= SAME_THICKNESS_MM) {
            return judged(candidate.sampleId(), d0, null, clauses, candidate.measured());
        }
        if (!candidate.bulk()) {
            return unverified(candidate.sampleId(), d0, clauses, "fixed layer measured at " + Wording.mm(d0)
                    + " cannot be rescaled to " + Wording.mm(asked));
        }
        Curve rescaled = ThicknessRescaler.rescale(candidate.measured(), d0, asked, candidate.index());
        return judged(candidate.sampleId(), asked, null, clauses, rescaled);
    }

    private static SampleEvaluation range(Candidate candidate, List<Clause> clauses, double min, double max) {
        double d0 = candidate.thicknessMm();
        if (!candidate.bulk()) {
            if (d0 >= min - SAME_THICKNESS_MM && d0 <= max + SAME_THICKNESS_MM) {
                return judged(candidate.sampleId(), d0, null, clauses, candidate.measured());
            }
            return unverified(candidate.sampleId(), d0, clauses, "fixed layer measured at " + Wording.mm(d0)
                    + " lies outside " + Wording.mmSpan(min, max)
                    + " and cannot be rescaled");
        }
        ThicknessSolver.Solution solution = ThicknessSolver.solve(clauses, candidate.measured(), d0,
                candidate.index(), min, max);
        double d = solution.recommendedMm();
        Curve rescaled = ThicknessRescaler.rescale(candidate.measured(), d0, d, candidate.index());
        SampleEvaluation evaluation = judged(candidate.sampleId(), d, solution.feasibleMm(), clauses, rescaled);
        if (evaluation.verdict() != Verdict.MEETS && evaluation.feasibleMm() != null) {
            return SampleEvaluation.of(candidate.sampleId(), d, null, evaluation.clauses());
        }
        return evaluation;
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
            double threshold = clause instanceof TransmittanceClause t ? t.thresholdT() : ((CutoffClause) clause).levelT();
            results.add(ClauseResult.unjudgeable(clause, threshold, why));
        }
        return SampleEvaluation.of(sampleId, thicknessMm, null, results);
    }
}
