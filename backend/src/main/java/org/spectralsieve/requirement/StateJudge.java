package org.spectralsieve.requirement;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.spectralsieve.optics.Illumination;
import org.spectralsieve.optics.Layer;
import org.spectralsieve.optics.LightPath;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.states.Exposure;
import org.spectralsieve.states.StateCurve;
import org.spectralsieve.states.StateKind;

/**
 * Judges the clauses that read a sample's curves in other states (aged, printed black; {@link Clause#readsStates}),
 * beside the clauses on its own curve (docs/material-states.md).
 *
 * <ul>
 *   <li>The sample's own clauses are judged as always ({@link SampleEvaluator}), which fixes the row's thickness;
 *       the state clauses are then judged at that thickness. A state curve is never rescaled (ageing is not uniform
 *       through the depth, ink is a layer): it belongs to the sample as measured (a printed film is a little thicker
 *       than its base, by the ink), so a row judged at another thickness than the sample's measured one gets the
 *       state clause unverified, with why. Nor is it combined with a fixed layer in front.</li>
 *   <li>No curve in the asked state: unverified, never a guess.</li>
 *   <li>Printed black: the heaviest print stored (highest ink load, then highest stated density), named.</li>
 *   <li>After an exposure: the aged curves on the same scale (hours under one source, or doses at one wavelength),
 *       with the as-supplied curve as exposure 0. A curve at exactly the asked exposure is judged. An exposure
 *       between two curves is <b>not interpolated</b>: ageing is taken to change T steadily with exposure (it falls,
 *       fastest near the cut-off; PRACTICE.md §1, common practice), so at every wavelength T lies between the two
 *       curves and the clause meets when it meets on both, misses when it misses on both, and is unverified
 *       otherwise. Past the last curve: unverified, not extrapolated. Several sources: each series that reaches the
 *       asked exposure is judged and the worst answer stands.</li>
 * </ul>
 * The feasible thickness interval is not kept when a state clause is present: state curves speak for their own
 * thickness only. For the same reason a thickness range that holds the sample's measured thickness (where its state
 * curves were measured) is judged at that thickness.
 */
final class StateJudge {

    private StateJudge() {
    }

    static SampleEvaluation evaluate(Candidate candidate, Requirement requirement, Optional<StackLayer> layer,
                                     ThicknessInterval span) {
        List<Clause> own = requirement.clauses().stream().filter(c -> !c.readsStates()).toList();
        Map<Clause, ClauseResult> judged = new LinkedHashMap<>();
        double d;
        if (!own.isEmpty()) {
            Requirement ownOnly = new Requirement(own, ownThickness(candidate, requirement.thickness()),
                    requirement.materialClass(),
                    requirement.geometry(), requirement.layer(), requirement.text(), requirement.light());
            SampleEvaluation base = SampleEvaluator.evaluate(candidate, ownOnly, layer, span);
            for (ClauseResult r : base.clauses()) {
                judged.putIfAbsent(r.clause(), r);
            }
            d = base.thicknessMm();
        } else {
            d = candidate.thicknessMm();
        }
        // a sample without curves in other states is answered "none stored", whatever the thickness; one with them is
        // judged only where the requirement admits its measured thickness (the only one its state curves speak for)
        String notHere = candidate.states().isEmpty() ? null : thicknessProblem(candidate, requirement.thickness());
        List<ClauseResult> results = new ArrayList<>(requirement.clauses().size());
        for (Clause clause : requirement.clauses()) {
            if (!clause.readsStates()) {
                results.add(judged.get(clause));
            } else if (layer.isPresent()) {
                results.add(ClauseResult.unjudgeable(clause, SampleEvaluator.threshold(clause),
                        "a curve in another state is judged on its own, not combined with a part in front"));
            } else if (notHere != null) {
                results.add(ClauseResult.unjudgeable(clause, SampleEvaluator.threshold(clause), notHere));
            } else {
                results.add(judge(clause, candidate, d, requirement.light()));
            }
        }
        return SampleEvaluation.of(candidate.sampleId(), d, null, results);
    }

    /**
     * A thickness range that holds the sample's measured thickness is judged there, where its state curves were
     * measured, rather than at the thickness the own clauses alone would recommend (where the state clauses could
     * only be unverified); any other thickness statement stands.
     */
    private static ThicknessSpec ownThickness(Candidate candidate, ThicknessSpec spec) {
        return spec.kind() == ThicknessSpec.Kind.RANGE && candidate.thicknessKnown() && !candidate.states().isEmpty()
                && NominalThickness.within(candidate.thicknessMm(), spec.minMm(), spec.maxMm())
                ? ThicknessSpec.at(candidate.thicknessMm()) : spec;
    }

    /**
     * State curves speak for the sample's measured thickness only: why the requirement's thickness does not admit it,
     * or null when it does (or leaves thickness as measured).
     */
    private static String thicknessProblem(Candidate candidate, ThicknessSpec spec) {
        double d0 = candidate.thicknessMm();
        if (spec.kind() == ThicknessSpec.Kind.AS_MEASURED) {
            return null;
        }
        if (!candidate.thicknessKnown()) {
            return "the thickness of the measured sample is not recorded, so it cannot be judged at another thickness";
        }
        boolean admitted = spec.kind() == ThicknessSpec.Kind.FIXED ? NominalThickness.same(d0, spec.minMm())
                : NominalThickness.within(d0, spec.minMm(), spec.maxMm());
        return admitted ? null : "the sample was measured at " + Wording.mm(d0) + "; curves in other states are not"
                + " rescaled (ageing is not uniform through the depth, ink is a layer), so they say nothing at "
                + (spec.kind() == ThicknessSpec.Kind.FIXED ? Wording.mm(spec.minMm())
                : Wording.mmSpan(spec.minMm(), spec.maxMm()));
    }

    /**
     * One state-reading clause on the candidate judged at thickness d, with its state curves seen under the light
     * ({@link #underLight}).
     */
    static ClauseResult judge(Clause clause, Candidate candidate, double d, Illumination light) {
        if (clause instanceof StateClause s) {
            return onState(clause, s.state(), candidate, d,
                    curve -> ClauseEvaluator.evaluate(s.inner(), underLight(curve, candidate, light)));
        }
        RelativeClause r = (RelativeClause) clause;
        if (r.ownWavelength()) {
            return onState(clause, r.state(), candidate, d,
                    curve -> RelativeClauses.evaluate(r, new CurveView(underLight(curve, candidate, light))));
        }
        // two states at the same wavelength: the reference state's single curve, the numerator's as asked
        List<Picked> references = pick(r.referenceState(), candidate, d);
        Picked reference = references.get(0);
        if (reference.reason != null) {
            return ClauseResult.unjudgeable(clause, r.fraction(), reference.reason);
        }
        if (references.size() != 1 || reference.curves.size() != 1) {
            // an aged reference between two curves has no single curve to divide by: say so
            return ClauseResult.unjudgeable(clause, r.fraction(), "the reference " + r.referenceState().words()
                    + " has no curve at exactly that exposure, and a ratio is not taken between two curves");
        }
        Labelled ref = reference.curves.get(0);
        Curve refSeen = underLight(ref.curve, candidate, light);
        return onState(clause, r.state(), candidate, d, curve -> RelativeClauses.evaluate(r,
                new CurveView(underLight(curve, candidate, light)), new CurveView(refSeen)), " against " + ref.label);
    }

    /**
     * A state curve (measured at the sample's thickness, never rescaled) as the light sees it: itself at normal
     * incidence, else the one-part oblique path of it ({@link LightPath#transmittance(Illumination)}). The state
     * is taken as the same homogeneous slab, absorbing more or less: a printed layer's own angle dependence is not
     * modelled (docs/oblique-incidence.md).
     */
    static Curve underLight(Curve curve, Candidate candidate, Illumination light) {
        if (light.normal()) {
            return curve;
        }
        return LightPath.of(Layer.fixed(curve, candidate.index() != null ? candidate.index()
                : CandidatePath.DEFAULT_INDEX)).transmittance(light);
    }

    private static ClauseResult onState(Clause clause, StateAsked state, Candidate candidate, double d,
                                        java.util.function.Function<Curve, ClauseResult> rule) {
        return onState(clause, state, candidate, d, rule, "");
    }

    private static ClauseResult onState(Clause clause, StateAsked state, Candidate candidate, double d,
                                        java.util.function.Function<Curve, ClauseResult> rule, String against) {
        List<Picked> series = pick(state, candidate, d);
        if (series.get(0).reason != null) {
            return ClauseResult.unjudgeable(clause, SampleEvaluator.threshold(clause), series.get(0).reason);
        }
        ClauseResult worst = null;
        List<String> texts = new ArrayList<>();
        for (Picked picked : series) {
            List<ClauseResult> each = new ArrayList<>();
            for (Labelled l : picked.curves) {
                ClauseResult r = rule.apply(l.curve);
                each.add(new ClauseResult(clause, r.value(), r.threshold(), r.marginDecades(), r.verdict(),
                        l.label + against + ": " + r.explanation(), r.valueIsBound()));
            }
            ClauseResult answer = each.size() == 1 ? each.get(0) : bracketed(clause, each, picked.note);
            texts.add(answer.explanation());
            if (worst == null || answer.verdict().ordinal() > worst.verdict().ordinal()
                    || answer.verdict() == worst.verdict() && answer.marginDecades() < worst.marginDecades()) {
                worst = answer;
            }
        }
        // several sources, each series answering: the worst answer stands, every series is named
        return series.size() == 1 ? worst : new ClauseResult(clause, worst.value(), worst.threshold(),
                worst.marginDecades(), worst.verdict(), String.join(" | ", texts), worst.valueIsBound());
    }

    /**
     * The two curves around an asked exposure: meets on both → meets (the smaller margin), misses on both → misses
     * (the margin nearer zero: the truth lies between), else unverified.
     */
    private static ClauseResult bracketed(Clause clause, List<ClauseResult> pair, String note) {
        ClauseResult a = pair.get(0);
        ClauseResult b = pair.get(1);
        String text = note + ": " + a.explanation() + "; " + b.explanation();
        if (a.verdict() == b.verdict() && a.verdict() != Verdict.UNVERIFIED) {
            ClauseResult closer = a.verdict() == Verdict.MEETS
                    ? a.marginDecades() <= b.marginDecades() ? a : b
                    : a.marginDecades() >= b.marginDecades() ? a : b;
            return new ClauseResult(clause, closer.value(), closer.threshold(), closer.marginDecades(),
                    closer.verdict(), text, closer.valueIsBound());
        }
        ClauseResult later = b;
        return new ClauseResult(clause, later.value(), later.threshold(),
                Math.min(a.marginDecades(), b.marginDecades()), Verdict.UNVERIFIED,
                text + " (the two curves disagree, so the asked exposure is not shown either way)", later.valueIsBound());
    }

    /** A curve with the words that name it in an explanation. */
    private record Labelled(String label, Curve curve) {
    }

    /** The curves a state names (one, or the two around an exposure), or why there are none usable. */
    private record Picked(List<Labelled> curves, String note, String reason) {
        static Picked none(String reason) {
            return new Picked(List.of(), "", reason);
        }

        static Picked one(String label, Curve curve) {
            return new Picked(List.of(new Labelled(label, curve)), "", null);
        }
    }

    /** One pick per series of curves that answers (several only for aged curves under several sources). */
    private static List<Picked> pick(StateAsked state, Candidate candidate, double d) {
        String asSupplied = "as supplied";
        if (state.kind() == StateKind.AS_SUPPLIED) {
            if (candidate.thicknessKnown() && !Double.isNaN(d) && !NominalThickness.same(candidate.thicknessMm(), d)) {
                return List.of(Picked.none("compared with a curve in another state, the as-supplied curve is taken as"
                        + " measured at " + Wording.mm(candidate.thicknessMm()) + ", not rescaled to " + Wording.mm(d)));
            }
            return List.of(Picked.one(asSupplied, candidate.measured()));
        }
        // a state curve belongs to the specimen as measured (a printed film is a little thicker than its base, by
        // the ink): it speaks for the row only when the row stands at the sample's own measured thickness
        if (candidate.thicknessKnown() && !Double.isNaN(d) && !NominalThickness.same(candidate.thicknessMm(), d)) {
            return List.of(Picked.none("curves in other states are not rescaled (ageing is not uniform through the"
                    + " depth, ink is a layer): they belong to the sample as measured at "
                    + Wording.mm(candidate.thicknessMm()) + " and say nothing at " + Wording.mm(d)));
        }
        List<StateCurve> usable = candidate.states().stream().filter(s -> s.state().kind() == state.kind()).toList();
        if (state.kind() == StateKind.PRINTED) {
            String none = "no printed-black curve is stored for this sample";
            return List.of(usable.stream().max(HEAVIEST_PRINT)
                    .map(s -> Picked.one(s.state().describe(), s.curve()))
                    .orElseGet(() -> Picked.none(none)));
        }
        return aged(state, candidate, usable);
    }

    /** Ink load first, then stated density; an unstated number counts as the least. */
    private static final Comparator<StateCurve> HEAVIEST_PRINT = Comparator
            .comparingDouble((StateCurve s) -> orLeast(s.state().printing().inkLoadPercent()))
            .thenComparingDouble(s -> orLeast(s.state().printing().statedDensity()))
            .thenComparingLong(StateCurve::id);

    private static double orLeast(double v) {
        return Double.isNaN(v) ? Double.NEGATIVE_INFINITY : v;
    }

    private static List<Picked> aged(StateAsked state, Candidate candidate, List<StateCurve> usable) {
        Map<String, List<StateCurve>> series = new LinkedHashMap<>();
        for (StateCurve s : usable) {
            Exposure e = s.state().exposure();
            if (state.sameScale(e)) {
                String key = e.inHours() ? "h|" + e.source().toLowerCase(java.util.Locale.ROOT) : "d|" + e.doseNm();
                series.computeIfAbsent(key, k -> new ArrayList<>()).add(s);
            }
        }
        if (series.isEmpty()) {
            return List.of(Picked.none("no aged curve " + (state.inHours()
                    ? "in hours of exposure" : "after a dose at " + Wording.nm(state.doseNm()))
                    + " is stored for this sample"));
        }
        double asked = state.amount();
        List<Picked> answers = new ArrayList<>();
        String beyond = null;
        for (List<StateCurve> curves : series.values()) {
            curves.sort(Comparator.comparingDouble((StateCurve s) -> s.state().exposure().amount())
                    .thenComparingLong(StateCurve::id));
            StateCurve exact = null;
            StateCurve before = null;
            StateCurve after = null;
            for (StateCurve s : curves) {
                double amount = s.state().exposure().amount();
                if (amount == asked) {
                    exact = s;
                } else if (amount < asked) {
                    before = s;
                } else if (after == null) {
                    after = s;
                }
            }
            if (exact != null) {
                answers.add(Picked.one(exact.state().describe(), exact.curve()));
            } else if (after != null) {
                String lower = before == null ? "as supplied" : before.state().describe();
                Curve lowerCurve = before == null ? candidate.measured() : before.curve();
                answers.add(new Picked(List.of(new Labelled(lower, lowerCurve),
                        new Labelled(after.state().describe(), after.curve())),
                        state.words() + " lies between the curves " + lower + " and " + after.state().describe()
                                + " (not interpolated: T is taken to change steadily with exposure, so it lies between"
                                + " them)", null));
            } else {
                beyond = "the longest exposure stored is " + curves.get(curves.size() - 1).state().describe()
                        + "; " + state.words() + " lies beyond it and is not extrapolated";
            }
        }
        return answers.isEmpty() ? List.of(Picked.none(beyond)) : answers;
    }
}
