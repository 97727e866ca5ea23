package org.spectralsieve.requirement;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Optional;

/**
 * Judges one material's samples against a requirement, each sample only where it is the best evidence.
 *
 * <p>Which sample speaks for a thickness d: the one measured nearest to d, by thickness ratio (|ln(d/d₀)|),
 * so a measurement at the asked thickness ({@link NominalThickness}) always wins over rescaling another
 * sample. Each distinct measured thickness thus owns a span of the thickness axis, bounded by the
 * geometric means of its neighbours ({@link #spans}); samples measured at the same thickness share it, and
 * the ranking keeps the best of them, as it does across the samples of any material.
 * <ul>
 *   <li>as measured: every sample;</li>
 *   <li>one asked thickness: the samples whose span holds it;</li>
 *   <li>a range (bulk): the samples whose span meets the range inside the made thicknesses, each solved
 *       only over that part; the material's feasible interval is the union of the pieces that touch, and
 *       its stock advice is gathered over all of them;</li>
 *   <li>a range (coated or laminated parts, never rescaled): the samples measured inside it, else the
 *       nearest ones (unverified, with the reason).</li>
 * </ul>
 * Samples without a recorded thickness take part only when the material has no other.
 */
public final class MaterialJudge {

    /** Pieces of feasible interval closer than this (mm) are one interval: the solver's root-finding tolerance, twice. */
    private static final double TOUCHING_MM = 2 * ThicknessSolver.TOLERANCE_MM;

    private MaterialJudge() {
    }

    /** The evaluations of the samples that speak for the requirement's thickness; all from one material. */
    public static List<MaterialEvaluation> evaluate(List<Candidate> samples, Requirement requirement,
                                                    Optional<StackLayer> layer) {
        return evaluate(samples, requirement, layer, SampleJudge.EXACT);
    }

    /** {@link #evaluate(List, Requirement, Optional)} with each chosen sample judged by {@code judge}. */
    public static List<MaterialEvaluation> evaluate(List<Candidate> samples, Requirement requirement,
                                                    Optional<StackLayer> layer, SampleJudge judge) {
        List<MaterialEvaluation> out = new ArrayList<>();
        for (Judged j : choose(samples, requirement.thickness())) {
            out.add(MaterialEvaluation.of(j.candidate(), judge.evaluate(j.candidate(), requirement, layer, j.span())));
        }
        if (requirement.thickness().kind() != ThicknessSpec.Kind.RANGE || out.size() < 2) {
            return out;
        }
        return merged(out);
    }

    /**
     * The row {@link #evaluate} forms for one of the material's samples, alone: empty when that sample is not
     * judged for the requirement's thickness. Only where a sample's row does not depend on the others' rows
     * (as measured and at one thickness; a solved range shares the material's feasible interval and stock
     * advice among its rows); which samples are judged, and over what span, still depends on all of them.
     */
    public static List<MaterialEvaluation> evaluateOne(List<Candidate> samples, Requirement requirement,
                                                       Optional<StackLayer> layer, long sampleId) {
        return evaluateOne(samples, requirement, layer, sampleId, SampleJudge.EXACT);
    }

    /** {@link #evaluateOne(List, Requirement, Optional, long)} with the sample judged by {@code judge}. */
    public static List<MaterialEvaluation> evaluateOne(List<Candidate> samples, Requirement requirement,
                                                       Optional<StackLayer> layer, long sampleId, SampleJudge judge) {
        if (requirement.thickness().kind() == ThicknessSpec.Kind.RANGE) {
            throw new IllegalArgumentException("a solved range judges a material's samples together");
        }
        for (Judged j : choose(samples, requirement.thickness())) {
            if (j.candidate().sampleId() == sampleId) {
                return List.of(MaterialEvaluation.of(j.candidate(),
                        judge.evaluate(j.candidate(), requirement, layer, j.span())));
            }
        }
        return List.of();
    }

    /** A sample to judge and the thicknesses it speaks for. */
    public record Judged(Candidate candidate, ThicknessInterval span) {
    }

    /** The samples judged for a thickness specification, with their spans. */
    public static List<Judged> choose(List<Candidate> samples, ThicknessSpec spec) {
        double[] thicknesses = samples.stream().mapToDouble(Candidate::thicknessMm).toArray();
        boolean bulk = !samples.isEmpty() && samples.get(0).bulk();
        MadeThicknesses made = samples.isEmpty() ? MadeThicknesses.UNLIMITED : samples.get(0).made();
        ThicknessInterval[] spans = spans(thicknesses, bulk, made, spec);
        List<Judged> out = new ArrayList<>();
        for (int i = 0; i < spans.length; i++) {
            if (spans[i] != null) {
                out.add(new Judged(samples.get(i), spans[i]));
            }
        }
        return out;
    }

    /**
     * The same choice on bare numbers, for engines without candidates (the store): for the samples of one
     * material measured at {@code thicknessMm} (NaN: not recorded), the span each is judged over, null for
     * a sample that is not judged.
     */
    public static ThicknessInterval[] spans(double[] thicknessMm, boolean bulk, MadeThicknesses made, ThicknessSpec spec) {
        int n = thicknessMm.length;
        ThicknessInterval[] out = new ThicknessInterval[n];
        // loops, not streams: the store asks this for every material a million-curve scan reads (a stream
        // pipeline per call was a tenth of a thickness-solved scan's samples in a profile)
        double[] known = new double[n];
        int knownCount = 0;
        for (double d : thicknessMm) {
            if (!Double.isNaN(d)) {
                known[knownCount++] = d;
            }
        }
        known = knownCount == n ? known : java.util.Arrays.copyOf(known, knownCount);
        if (spec.kind() == ThicknessSpec.Kind.AS_MEASURED || known.length == 0) {
            java.util.Arrays.fill(out, SampleEvaluator.WHOLE_AXIS);
            return out;
        }
        boolean any = false;
        for (int i = 0; i < n; i++) {
            double d0 = thicknessMm[i];
            if (Double.isNaN(d0)) {
                continue;
            }
            ThicknessInterval span = span(d0, known);
            boolean speaks = spec.kind() == ThicknessSpec.Kind.FIXED ? span.contains(spec.minMm())
                    : bulk ? meetsMade(made, span, spec) : NominalThickness.within(d0, spec.minMm(), spec.maxMm());
            if (speaks) {
                out[i] = span;
                any = true;
            }
        }
        if (!any && spec.kind() == ThicknessSpec.Kind.RANGE) {
            // nothing can be judged inside the range: the nearest samples say why
            double nearest = Double.POSITIVE_INFINITY;
            for (double d : known) {
                nearest = Math.min(nearest, ratioDistance(d, spec));
            }
            for (int i = 0; i < n; i++) {
                if (!Double.isNaN(thicknessMm[i]) && ratioDistance(thicknessMm[i], spec) == nearest) {
                    out[i] = SampleEvaluator.WHOLE_AXIS;
                }
            }
        }
        return out;
    }

    /** Whether the sample's span meets the range inside the thicknesses the material is made in. */
    private static boolean meetsMade(MadeThicknesses made, ThicknessInterval span, ThicknessSpec spec) {
        ThicknessInterval inMade = made.within(spec.minMm(), spec.maxMm());
        if (inMade == null) {
            return false;
        }
        double lo = Math.max(inMade.loMm(), span.loMm());
        double hi = Math.min(inMade.hiMm(), span.hiMm());
        return lo <= hi && (made.continuous() || !made.stockWithin(lo, hi).isEmpty());
    }

    /** |ln| of how far d lies outside the range, as a thickness ratio (0 inside). */
    private static double ratioDistance(double d, ThicknessSpec spec) {
        return d < spec.minMm() ? Math.log(spec.minMm() / d) : d > spec.maxMm() ? Math.log(d / spec.maxMm()) : 0;
    }

    /**
     * The thicknesses for which a sample measured at {@code d0} is the nearest by ratio among
     * {@code measured}: from the geometric mean with the next thinner measured thickness to that with the
     * next thicker one (the whole axis at the ends). Closed at both ends: at a boundary both samples are judged.
     */
    public static ThicknessInterval span(double d0, double[] measured) {
        // the nearest measured thickness strictly below and strictly above d0, in Double.compare's order (what a
        // sorted set's lower/higher gave): one pass, no set per sample (the store asks this for every curve)
        boolean anyBelow = false;
        boolean anyAbove = false;
        double below = 0;
        double above = 0;
        for (double d : measured) {
            if (Double.compare(d, d0) < 0 && (!anyBelow || Double.compare(d, below) > 0)) {
                below = d;
                anyBelow = true;
            } else if (Double.compare(d, d0) > 0 && (!anyAbove || Double.compare(d, above) < 0)) {
                above = d;
                anyAbove = true;
            }
        }
        double lo = anyBelow ? Math.sqrt(below * d0) : Double.MIN_VALUE;
        double hi = anyAbove ? Math.sqrt(above * d0) : Double.MAX_VALUE;
        return new ThicknessInterval(lo, hi);
    }

    /**
     * Every evaluation gets the material's whole feasible interval around its own, and the gathered stock advice:
     * what {@link #evaluate} does over a range. Public for a caller that judges only some of the chosen samples
     * and has proven the others add no piece of interval and no stock size (docs/search-under-load.md).
     */
    public static List<MaterialEvaluation> merged(List<MaterialEvaluation> evaluations) {
        List<ThicknessInterval> pieces = evaluations.stream().map(e -> e.evaluation().feasibleMm())
                .filter(java.util.Objects::nonNull).sorted(Comparator.comparingDouble(ThicknessInterval::loMm)).toList();
        List<ThicknessInterval> joined = new ArrayList<>();
        for (ThicknessInterval piece : pieces) {
            ThicknessInterval last = joined.isEmpty() ? null : joined.get(joined.size() - 1);
            if (last != null && piece.loMm() <= last.hiMm() + TOUCHING_MM) {
                joined.set(joined.size() - 1, new ThicknessInterval(last.loMm(), Math.max(last.hiMm(), piece.hiMm())));
            } else {
                joined.add(piece);
            }
        }
        List<StockAdvice.StockFit> fits = new ArrayList<>();
        for (MaterialEvaluation e : evaluations) {
            StockAdvice a = e.evaluation().stockAdvice();
            fits.addAll(a.inside());
            if (a.closestMiss() != null) {
                fits.add(a.closestMiss());
            }
        }
        List<MaterialEvaluation> out = new ArrayList<>();
        // the advice depends on the row only through its interval: formed once per interval, not once per sample (a
        // material grown to hundreds of samples would otherwise gather every stock fit once per sample)
        java.util.Map<java.util.Optional<ThicknessInterval>, StockAdvice> adviceByWhole = new java.util.HashMap<>();
        for (MaterialEvaluation e : evaluations) {
            ThicknessInterval own = e.evaluation().feasibleMm();
            ThicknessInterval whole = own == null ? null : joined.stream()
                    .filter(j -> j.loMm() <= own.loMm() && j.hiMm() >= own.hiMm()).findFirst().orElse(own);
            StockAdvice advice = adviceByWhole.computeIfAbsent(java.util.Optional.ofNullable(whole), w -> {
                ThicknessInterval nearest = whole != null ? whole : joined.isEmpty() ? null : joined.get(0);
                // the pieces other samples give: a stock size met on one of them lies outside this row's interval
                List<ThicknessInterval> elsewhere = joined.stream().filter(j -> !j.equals(whole)).toList();
                return SampleEvaluator.advise(fits, nearest).withElsewhere(elsewhere);
            });
            out.add(new MaterialEvaluation(e.materialId(), e.materialName(),
                    e.evaluation().withThicknessAdvice(whole, advice)));
        }
        return out;
    }
}
