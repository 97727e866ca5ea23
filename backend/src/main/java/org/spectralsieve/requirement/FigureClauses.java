package org.spectralsieve.requirement;

import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.PointReadings;
import org.spectralsieve.weighting.BelowDetectionAs;
import org.spectralsieve.weighting.Figure;
import org.spectralsieve.weighting.FigureText;
import org.spectralsieve.weighting.WeightedFigures;

/**
 * The exact judgement of clauses on integrated figures, on one curve, with the rules of
 * {@link ClauseEvaluator}: figures are computed on the curve with bounded points at their upper bounds
 * ({@link JudgedCurves}), a bounded figure proves a block when low enough and never proves a pass, and a
 * figure the curve cannot give (range not covered) is unverified with margin NaN.
 *
 * <h2>Weighted clauses</h2>
 * Value: the effective transmittance of {@link Weighting}; margin in decades as for any transmittance,
 * PASS log10(T / threshold), BLOCK log10(threshold / T). Where weighted points lie below the detection
 * limit the true figure lies between two figures: with those points at their upper bounds (U) and at 0
 * (L), since the figure rises with every T. A pass is met when L reaches the threshold (proven by the
 * measured points alone: no bound ever proves a pass) and missed when U falls short; a block is met
 * when U is low enough and missed when L is already too high; otherwise unverified. The value and margin
 * are L's for a met pass and a missed block, U's otherwise (flagged as a bound). The explanation states
 * both ends as the figures answer does ({@link FigureText#ends}), never one sign alone, so the search and
 * the figures section cannot read "at least 79.6 %" and "≤ 79.6 %" for the same stack.
 *
 * <h2>Critical wavelength</h2>
 * Value: λc in nm ({@link WeightedFigures#criticalWavelength}). λc ≥ L exactly when the absorbance beyond
 * L holds at least 10 % of the absorbance over 290–400 nm, so the margin is log10(share / 0.1) for "at
 * least" and its negative for "at most" (decades of that share, not of light; zero at the threshold, so
 * it ranks and combines like the other margins). The share uses λc's own arithmetic: A = −log10 T at
 * every nm from 290 to 400 (negative A as 0), running trapezoid sum, linear inside the last interval.
 * Bounds: at a bounded point the true absorbance is at least the judged one. More absorbance below L
 * lowers the share, more above L raises it; so "at least L" is proven met only without bounded points
 * below L and proven missed only without bounded points above L ("at most" the other way round), and is
 * otherwise unverified.
 */
final class FigureClauses {

    private static final int FROM = (int) CriticalWavelengthClause.FROM_NM;
    private static final int TO = (int) CriticalWavelengthClause.TO_NM;
    private static final double TAIL_SHARE = 1 - WeightedFigures.CRITICAL_FRACTION;

    private FigureClauses() {
    }

    /** The figure's two ends on a curve: equal when no weighted point is below detection. */
    record Span(double lower, double upper, boolean bounded, String note) {

        /** The proven side for the verdict: L for a pass (what must be reached), U for a block (what must stay low). */
        double provenFor(Direction direction) {
            return direction == Direction.PASS ? lower : upper;
        }
    }

    /** Null when the curve cannot give the figure; {@code why} then receives the reason. */
    static Span span(WeightedClause clause, PointReadings curve, StringBuilder why) {
        return span(clause, curve, why, true);
    }

    /** @param explained false for a margin alone: the span's note may be left empty, its numbers are the same */
    private static Span span(WeightedClause clause, PointReadings curve, StringBuilder why, boolean explained) {
        Weighting weighting = clause.weighting();
        // read on the bounded ends without building them (the same numbers as on JudgedCurves' curves)
        Figure upper = explained ? weighting.figure(curve, BelowDetectionAs.LIMIT)
                : weighting.figureForMargin(curve, BelowDetectionAs.LIMIT);
        if (!upper.available()) {
            if (why != null) {
                why.append(upper.note());
            }
            return null;
        }
        boolean bounded = upper.bound() == Figure.Bound.AT_MOST;
        double u = upper.value().getAsDouble();
        double l = !bounded ? u : (explained ? weighting.figure(curve, BelowDetectionAs.ZERO)
                : weighting.figureForMargin(curve, BelowDetectionAs.ZERO)).value().orElse(0);
        return new Span(Math.min(l, u), u, bounded, upper.note());
    }

    /**
     * A bounded figure by both its ends, as the figures answer states it ({@link FigureText#ends}): "79.6 %"
     * when they print alike, "at most U" when the lower end is 0, else "between L and U"; then what the ends are.
     */
    private static String ends(Span span) {
        return FigureText.ends(span.lower(), span.upper()) + " (points below the detection limit taken at 0 and"
                + " at their limit)";
    }

    static ClauseResult weighted(WeightedClause clause, PointReadings curve) {
        String subject = clause.weighting().describe();
        StringBuilder why = new StringBuilder();
        Span span = span(clause, curve, why);
        double threshold = clause.thresholdT();
        if (span == null) {
            return ClauseResult.unjudgeable(clause, threshold, subject + " is not available: " + why);
        }
        Direction direction = clause.direction();
        String need = Wording.need(direction, threshold);
        Verdict verdict;
        double value;
        String text;
        if (!span.bounded()) {
            value = span.upper();
            verdict = Margins.holds(direction, value, threshold) ? Verdict.MEETS : Verdict.MISSES;
            text = subject + " is " + Wording.transmittance(value) + ", needs " + need;
        } else if (Margins.holds(direction, span.provenFor(direction), threshold)) {
            value = span.provenFor(direction);
            verdict = Verdict.MEETS;
            text = subject + " is " + ends(span) + ", so it is " + need;
        } else if (!Margins.holds(direction, span.provenFor(direction == Direction.PASS ? Direction.BLOCK : Direction.PASS),
                threshold)) {
            value = span.provenFor(direction == Direction.PASS ? Direction.BLOCK : Direction.PASS);
            verdict = Verdict.MISSES;
            text = subject + " is " + ends(span) + ", so it cannot be " + need;
        } else {
            value = span.upper();
            verdict = Verdict.UNVERIFIED;
            text = subject + " lies between " + Wording.percent(span.lower()) + " and " + Wording.transmittance(span.upper())
                    + " (points below the detection limit): cannot show " + need;
        }
        double margin = Margins.of(direction, value, threshold);
        if (span.note().contains("; leaving out")) {
            text += " (" + span.note().substring(span.note().indexOf("; leaving out") + 2) + ")";
        }
        // an upper bound is reported as such; a met pass and a missed block stand on the lower end, a proven number
        boolean valueIsBound = span.bounded() && value == span.upper() && value != span.lower();
        return new ClauseResult(clause, value, threshold, margin, verdict, text, valueIsBound);
    }

    /**
     * The margin the thickness solver searches for its crossing, NaN when the figure is not available: a pass on L (where a
     * proof of the pass must come from), a block on U; both fall or rise with thickness like the figure.
     */
    static double weightedMargin(WeightedClause clause, PointReadings curve) {
        return weightedMargin(clause, curve, true);
    }

    /** @param explained false: the figures' notes are not written (the earlier way wrote them; the margin is the same) */
    static double weightedMargin(WeightedClause clause, PointReadings curve, boolean explained) {
        Span span = span(clause, curve, null, explained);
        return span == null ? Double.NaN : Margins.of(clause.direction(), span.provenFor(clause.direction()),
                clause.thresholdT());
    }

    static ClauseResult critical(CriticalWavelengthClause clause, Curve curve) {
        boolean atLeast = clause.comparison() == Comparison.AT_LEAST;
        String need = "needs " + (atLeast ? "at least " : "at most ") + Wording.nm(clause.nm());
        Curve judged = JudgedCurves.upperBounds(curve);
        Figure figure = WeightedFigures.criticalWavelength(judged);
        if (!figure.available()) {
            return ClauseResult.unjudgeable(clause, clause.nm(), "critical wavelength is not available: "
                    + figure.note() + "; " + need);
        }
        double lambda = figure.value().getAsDouble();
        boolean holds = atLeast ? lambda >= clause.nm() : lambda <= clause.nm();
        double margin = criticalMargin(clause, judged);
        margin = holds ? Math.max(margin, 0) : Math.min(margin, 0);
        boolean below = boundedBetween(curve, FROM, Math.ceil(clause.nm()));
        boolean above = boundedBetween(curve, Math.floor(clause.nm()), TO);
        // more true absorbance below L pulls λc down, above L pushes it up
        boolean hurts = atLeast ? below : above;
        boolean helps = atLeast ? above : below;
        Verdict verdict = holds ? (hurts ? Verdict.UNVERIFIED : Verdict.MEETS) : (helps ? Verdict.UNVERIFIED : Verdict.MISSES);
        String text = "critical wavelength λc is " + Wording.nm(lambda) + ", " + need;
        if (verdict == Verdict.UNVERIFIED) {
            text += "; points below the detection limit (true absorbance higher than read) "
                    + (holds ? "could pull it " + (atLeast ? "below" : "above") : "could push it " + (atLeast ? "above" : "below"))
                    + " the threshold";
        }
        return new ClauseResult(clause, lambda, clause.nm(), margin, verdict, text, below || above);
    }

    /**
     * log10(share / 0.1) for "at least", its negative for "at most", the share being that of ∫A beyond the
     * threshold; NaN when the curve does not cover 290–400 nm or has no absorbance there.
     */
    static double criticalMargin(CriticalWavelengthClause clause, Curve judged) {
        if (!judged.covers(FROM) || !judged.covers(TO)) {
            return Double.NaN;
        }
        int n = TO - FROM;
        double[] running = new double[n + 1];
        double previous = absorbance(judged, FROM);
        for (int i = 1; i <= n; i++) {
            double a = absorbance(judged, FROM + i);
            running[i] = running[i - 1] + (previous + a) / 2;
            previous = a;
        }
        if (!(running[n] > 0)) {
            return Double.NaN;
        }
        double x = clause.nm() - FROM;
        int i = Math.min((int) Math.floor(x), n - 1);
        double upToThreshold = running[i] + (x - i) * (running[i + 1] - running[i]);
        double share = Math.max(1 - upToThreshold / running[n], Curve.ABSORBANCE_FLOOR_T);
        double m = Math.log10(share / TAIL_SHARE);
        return clause.comparison() == Comparison.AT_LEAST ? m : -m;
    }

    /** Whether the critical-wavelength clause could ever be proven on curves with these flags: no bounded point in 290–400 nm. */
    static boolean criticalProvable(Curve curve) {
        return curve.covers(FROM) && curve.covers(TO) && !boundedBetween(curve, FROM, TO);
    }

    private static boolean boundedBetween(Curve curve, double fromNm, double toNm) {
        for (int nm = (int) fromNm; nm <= toNm; nm++) {
            if (curve.belowDetectionAt(nm)) {
                return true;
            }
        }
        return false;
    }

    /** As {@link WeightedFigures#criticalWavelength} reads it: A = −log10 T, T floored, negative A as 0. */
    private static double absorbance(Curve curve, double nm) {
        double t = curve.transmittanceAt(nm).orElseThrow();
        return Math.max(0, -Math.log10(Math.max(t, Curve.ABSORBANCE_FLOOR_T)));
    }
}
