package org.spectralsieve.requirement;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import org.spectralsieve.optics.ThicknessRescaler;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.CurveException;

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
 *       curves, where the cutoff edge test and the cutoff walk could disagree), and, for requirements
 *       solved on the whole path (weighted clauses, a fixed layer), only if both its ends meet too. A
 *       layer is judged as measured when its thickness lies in the range, else UNVERIFIED.</li>
 * </ul>
 * With a fixed layer ({@link StackLayer}) every clause is judged on the stack of the candidate (at the
 * thickness above) and the layer ({@link CandidatePath}); where their measured ranges do not overlap,
 * every clause is UNVERIFIED with the reason.
 *
 * <p>A diffuse or scattering sample ({@link Candidate#notRescaledReason()}) is held at its measured thickness
 * like a fixed layer, with its own reason; a see-through clause on total transmittance is UNVERIFIED unless
 * the requirement accepts it ({@link SeeThrough}).
 *
 * <p>A sample without a recorded thickness is judged as measured in AS_MEASURED and UNVERIFIED otherwise.
 * The clause verdicts always come from {@link ClauseEvaluator} on the curve actually judged.
 */
public final class SampleEvaluator {

    /** Two thicknesses closer than this (mm) are the same thickness; rescaling by 1 changes nothing real. */
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
        Objects.requireNonNull(candidate, "candidate");
        Objects.requireNonNull(requirement, "requirement");
        Objects.requireNonNull(layer, "layer");
        if (requirement.layer().isPresent() != layer.isPresent()) {
            throw new IllegalArgumentException(requirement.layer().isPresent()
                    ? "the requirement names a fixed layer ('" + requirement.layer().get().text() + "'); resolve it to a sample first"
                    : "a resolved layer was given for a requirement without one");
        }
        CandidatePath path = new CandidatePath(candidate, layer);
        try {
            return seenThrough(candidate, requirement, evaluate(path, requirement));
        } catch (CurveException e) {
            if (!path.stacked()) {
                throw e;
            }
            // a stack is only known where both parts were measured: their ranges do not overlap
            return unverified(candidate.sampleId(), candidate.thicknessMm(), requirement.clauses(),
                    "no light path: " + e.getMessage());
        }
    }

    private static SampleEvaluation evaluate(CandidatePath path, Requirement requirement) {
        Candidate candidate = path.candidate();
        ThicknessSpec spec = requirement.thickness();
        List<Clause> clauses = requirement.clauses();
        double d0 = candidate.thicknessMm();
        if (spec.kind() == ThicknessSpec.Kind.AS_MEASURED) {
            return judged(candidate.sampleId(), d0, null, clauses, path.asMeasured());
        }
        if (!candidate.thicknessKnown()) {
            return unverified(candidate.sampleId(), d0, clauses,
                    "the thickness of the measured sample is not recorded, so it cannot be judged at another thickness");
        }
        if (spec.kind() == ThicknessSpec.Kind.FIXED) {
            return fixed(path, clauses, spec.minMm());
        }
        return range(path, requirement, spec.minMm(), spec.maxMm());
    }

    private static SampleEvaluation fixed(CandidatePath path, List<Clause> clauses, double asked) {
        Candidate candidate = path.candidate();
        double d0 = candidate.thicknessMm();
        if (Math.abs(asked - d0) <= SAME_THICKNESS_MM) {
            return judged(candidate.sampleId(), d0, null, clauses, path.asMeasured());
        }
        if (!candidate.bulk()) {
            return unverified(candidate.sampleId(), d0, clauses, candidate.notRescaledReason() != null
                    ? candidate.notRescaledReason() + " (measured at " + Wording.mm(d0) + ", asked " + Wording.mm(asked) + ")"
                    : "fixed layer measured at " + Wording.mm(d0) + " cannot be rescaled to " + Wording.mm(asked));
        }
        return judged(candidate.sampleId(), asked, null, clauses, path.at(asked));
    }

    private static SampleEvaluation range(CandidatePath path, Requirement requirement, double min, double max) {
        Candidate candidate = path.candidate();
        List<Clause> clauses = requirement.clauses();
        double d0 = candidate.thicknessMm();
        if (!candidate.bulk()) {
            if (d0 >= min - SAME_THICKNESS_MM && d0 <= max + SAME_THICKNESS_MM) {
                return judged(candidate.sampleId(), d0, null, clauses, path.asMeasured());
            }
            return unverified(candidate.sampleId(), d0, clauses, candidate.notRescaledReason() != null
                    ? candidate.notRescaledReason() + " (measured at " + Wording.mm(d0) + ", outside "
                            + Wording.mmSpan(min, max) + ")"
                    : "fixed layer measured at " + Wording.mm(d0) + " lies outside " + Wording.mmSpan(min, max)
                            + " and cannot be rescaled");
        }
        boolean onPath = !requirement.plain();
        ThicknessSolver.Solution solution = onPath
                ? ThicknessSolver.solve(clauses, path, min, max)
                : ThicknessSolver.solve(clauses, candidate.measured(), d0, candidate.index(), min, max);
        double d = solution.recommendedMm();
        SampleEvaluation evaluation = judged(candidate.sampleId(), d, solution.feasibleMm(), clauses, path.at(d));
        ThicknessInterval feasible = evaluation.feasibleMm();
        boolean keep = feasible == null || evaluation.verdict() == Verdict.MEETS
                && (!onPath || meets(clauses, path.at(feasible.loMm())) && meets(clauses, path.at(feasible.hiMm())));
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

    private static boolean meets(List<Clause> clauses, Curve curve) {
        for (Clause clause : clauses) {
            if (ClauseEvaluator.evaluate(clause, curve).verdict() != Verdict.MEETS) {
                return false;
            }
        }
        return true;
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
        return ((CutoffClause) clause).levelT();
    }
}
