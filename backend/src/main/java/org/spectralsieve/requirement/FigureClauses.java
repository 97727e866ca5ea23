package org.spectralsieve.requirement;

import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.weighting.Figure;
import org.spectralsieve.weighting.WeightedFigures;

/**
 * The exact judgement of clauses on integrated figures, on one curve, with the rules of
 * {@link ClauseEvaluator}: figures are computed on the curve with bounded points at their upper bounds
 * ({@link JudgedCurves}), a bounded figure proves a block when low enough and never proves a pass, and a
 * figure the curve cannot give (range not covered) is unverified with margin NaN.
 *
 * <h2>Weighted clauses</h2>
 * Value: the effective transmittance of {@link Weighting}; margin in decades as for any transmittance,
 * PASS log10(T / threshold), BLOCK log10(threshold / T).
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

    static ClauseResult weighted(WeightedClause clause, Curve curve) {
        String subject = clause.weighting().describe();
        Figure figure = clause.weighting().figure(JudgedCurves.upperBounds(curve));
        if (!figure.available()) {
            return ClauseResult.unjudgeable(clause, clause.thresholdT(), subject + " is not available: " + figure.note());
        }
        double value = figure.value().getAsDouble();
        boolean bounded = figure.bound() == Figure.Bound.AT_MOST;
        Verdict verdict = Margins.verdict(clause.direction(), new Reading(Double.NaN, value, bounded, value),
                clause.thresholdT());
        double margin = Margins.of(clause.direction(), value, clause.thresholdT());
        String text = ClauseEvaluator.explain(subject, clause.direction(), bounded, value, clause.thresholdT(), verdict);
        if (figure.note().contains("leaving out")) {
            text += " (" + figure.note().substring(figure.note().indexOf("taken over")) + ")";
        }
        return new ClauseResult(clause, value, clause.thresholdT(), margin, verdict, text, bounded);
    }

    /** The weighted figure's margin in decades on a curve, NaN when not available: what the thickness solver bisects. */
    static double weightedMargin(WeightedClause clause, Curve curve) {
        Figure figure = clause.weighting().figure(JudgedCurves.upperBounds(curve));
        return figure.available() ? Margins.of(clause.direction(), figure.value().getAsDouble(), clause.thresholdT())
                : Double.NaN;
    }

    /** Whether the weighted figure on this curve could ever be proven: available, and not a bound for a pass. */
    static boolean weightedProvable(WeightedClause clause, Curve curve) {
        Figure figure = clause.weighting().figure(JudgedCurves.upperBounds(curve));
        return figure.available() && (clause.direction() == Direction.BLOCK || figure.bound() != Figure.Bound.AT_MOST);
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
