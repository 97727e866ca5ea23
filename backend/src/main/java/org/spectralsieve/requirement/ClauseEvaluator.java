package org.spectralsieve.requirement;

import java.util.List;
import java.util.Objects;
import java.util.OptionalDouble;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.Cutoffs;

/**
 * The exact (reference) judgement of one clause on one curve. Nothing is extrapolated and a reading at
 * or below the detection limit is used only as an upper bound on T.
 *
 * <h2>Transmittance clauses</h2>
 * <ul>
 *   <li>Readings: every stored point strictly inside the band plus the two band ends, the ends
 *       interpolated in absorbance ({@link Curve#transmittanceAt}).</li>
 *   <li>EVERY_POINT: the worst point decides — the band minimum for a pass, the maximum for a block.
 *       Each reading gets its own verdict; the clause misses if any reading misses, else is unverified if
 *       any is, else meets. Value, margin and explanation are those of the worst reading among those
 *       carrying the clause's verdict (so a missed clause reports the reading that proves the miss).</li>
 *   <li>MEAN: the trapezoid mean of T over the same readings (straight lines in T between them, the usual
 *       way band averages are taken; the band ends themselves come from absorbance interpolation). If any
 *       reading is bounded, the mean of the bounds is an upper bound on the mean.</li>
 *   <li>Bounds: a bounded reading u (true T <= u) proves a block when u <= threshold; it disproves a pass
 *       when u < threshold; otherwise the clause is unverified — a bound never proves that light
 *       passes, and a block threshold under the detection limit cannot be shown.</li>
 *   <li>Range: a MEAN band, or a point, not wholly inside the measured range is unverified (value and
 *       margin NaN). An EVERY_POINT band reaching partly outside is unverified unless its measured part
 *       already proves a miss, in which case it misses: a miss proven by data is not an extrapolation.</li>
 * </ul>
 *
 * <h2>Margins</h2>
 * PASS log10(T / threshold), BLOCK log10(threshold / T), in decades, positive when met. <b>When the
 * deciding value is a bound the margin is computed from the bound</b> and {@link ClauseResult#valueIsBound}
 * is set: for a block it is a lower bound on the true margin, for a pass an upper bound. Clauses with no
 * reading at all (outside the range, undetermined cutoff) have margin NaN.
 *
 * <h2>Cutoff clauses</h2>
 * Value = {@link Cutoffs#cutoffNm}, the UV absorption edge (the rising edge of the curve's first pass
 * band from the short-wavelength side; for a band-pass curve not its red or infrared edge); meets when it
 * lies in the window, misses when it lies outside or the curve has no cutoff while covering the window. Margin = min(log10(T(hi)/level), log10(level/T(lo))) at
 * the window edges (positive when the edge falls through the level inside the window), clamped to the
 * side of zero the verdict gives — only a non-monotone curve (a second crossing) needs the clamp. A
 * window not wholly inside the measured range, or a walk stopped by an undetermined below-detection
 * point, is unverified with margin NaN.
 *
 * <h2>Confidence</h2>
 * Transmittance clauses also get a confidence ({@link ClauseConfidence}): the probability that the true
 * value meets the threshold under a Gaussian error in absorbance; empty where it cannot be said. A clause
 * asking "with N% confidence" meets only when the confidence reaches N % ({@link #demanded}).
 *
 * <h2>Weighted and critical-wavelength clauses</h2>
 * See {@link FigureClauses}: the same verdict rules on an integrated figure.
 */
public final class ClauseEvaluator {

    private ClauseEvaluator() {
    }

    public static ClauseResult evaluate(Clause clause, Curve curve) {
        Objects.requireNonNull(clause, "clause");
        Objects.requireNonNull(curve, "curve");
        CurveView view = new CurveView(curve);
        if (clause instanceof TransmittanceClause t) {
            return transmittance(t, view);
        }
        if (clause instanceof WeightedClause w) {
            return FigureClauses.weighted(w, curve);
        }
        if (clause instanceof CriticalWavelengthClause c) {
            return FigureClauses.critical(c, curve);
        }
        if (clause instanceof RelativeClause r && !r.readsStates()) {
            return RelativeClauses.evaluate(r, view);
        }
        if (clause.readsStates()) {
            // another state's curve belongs to the sample, not to this curve: StateJudge reads it
            throw new IllegalArgumentException("'" + clause.text() + "' reads a curve in another state; judge it on"
                    + " the sample (SampleEvaluator)");
        }
        return cutoff((CutoffClause) clause, view);
    }

    /**
     * A transmittance clause on a view, which may be one on points formed only when read
     * ({@link CurveView#CurveView(org.spectralsieve.spectrum.PointReadings)}): the result
     * {@link #evaluate} gives on the built curve.
     */
    static ClauseResult transmittance(TransmittanceClause clause, CurveView view) {
        return demanded(clause, clause.aggregate() == Aggregate.MEAN ? mean(clause, view) : everyPoint(clause, view),
                view);
    }

    private static ClauseResult everyPoint(TransmittanceClause clause, CurveView view) {
        Band band = clause.band();
        List<Reading> readings = view.readings(band);
        boolean covered = view.covers(band);
        if (readings.isEmpty()) {
            return ClauseResult.unjudgeable(clause, clause.thresholdT(), outside(band, view, false));
        }
        Verdict verdict = Verdict.MEETS;
        for (Reading r : readings) {
            verdict = Margins.combine(verdict, Margins.verdict(clause.direction(), r, clause.thresholdT()));
        }
        if (!covered && verdict != Verdict.MISSES) {
            return ClauseResult.unjudgeable(clause, clause.thresholdT(), outside(band, view, true));
        }
        Reading worst = null;
        double worstMargin = Double.POSITIVE_INFINITY;
        for (Reading r : readings) {
            if (Margins.verdict(clause.direction(), r, clause.thresholdT()) != verdict) {
                continue;
            }
            double m = Margins.of(clause.direction(), r.judged(), clause.thresholdT());
            if (worst == null || m < worstMargin) {
                worst = r;
                worstMargin = m;
            }
        }
        String subject = band.isPoint()
                ? "T at " + Wording.nm(worst.nm())
                : (clause.direction() == Direction.PASS ? "lowest" : "highest") + " T in "
                        + Wording.band(band) + " (at " + Wording.nm(worst.nm()) + ")";
        String text = explain(subject, clause.direction(), worst.bounded(), worst.judged(), clause.thresholdT(),
                verdict);
        if (!covered) {
            text += "; the band reaches outside the measured range " + view.rangeText();
        }
        // a band partly outside the range has unread points: how sure "all hold" is cannot be said
        OptionalDouble confidence = covered
                ? ClauseConfidence.everyPoint(clause.direction(), readings, clause.thresholdT())
                : OptionalDouble.empty();
        return new ClauseResult(clause, worst.judged(), clause.thresholdT(), worstMargin, verdict, text,
                worst.bounded(), confidence);
    }

    private static ClauseResult mean(TransmittanceClause clause, CurveView view) {
        Band band = clause.band();
        if (!view.covers(band)) {
            return ClauseResult.unjudgeable(clause, clause.thresholdT(),
                    outside(band, view, view.overlaps(band)));
        }
        List<Reading> readings = view.readings(band);
        double mean = CurveView.trapezoidMean(readings);
        boolean bounded = readings.stream().anyMatch(Reading::bounded);
        Reading asOne = new Reading(band.fromNm(), mean, bounded, mean);
        Verdict verdict = Margins.verdict(clause.direction(), asOne, clause.thresholdT());
        double margin = Margins.of(clause.direction(), mean, clause.thresholdT());
        String text = explain("mean T over " + Wording.band(band), clause.direction(), bounded, mean,
                clause.thresholdT(), verdict);
        return new ClauseResult(clause, mean, clause.thresholdT(), margin, verdict, text, bounded,
                ClauseConfidence.mean(clause.direction(), readings, clause.thresholdT()));
    }

    /**
     * A clause asking "with N% confidence" meets only when its confidence reaches N %. A met clause whose
     * confidence is lower, or unknown, is UNVERIFIED with the reason: the reading does meet, but not as
     * surely as asked, which is neither a proof nor a proven miss. Misses and unverified results stand: a
     * value that misses has a confidence under 50 %, below every allowed demand.
     */
    static ClauseResult demanded(TransmittanceClause clause, ClauseResult result, CurveView view) {
        if (clause.confidenceDemand().isEmpty() || result.verdict() != Verdict.MEETS) {
            return result;
        }
        double demand = clause.confidenceDemand().getAsDouble();
        String asked = Wording.confidence(demand) + " confidence asked";
        String text;
        Verdict verdict;
        if (result.confidence().isEmpty()) {
            verdict = Verdict.UNVERIFIED;
            boolean onBound = view.readings(clause.band()).stream().anyMatch(Reading::bounded);
            text = result.explanation() + "; " + asked + ", but " + (onBound
                    ? "a reading is only a detection-limit bound, which has no stated uncertainty"
                    : "the curve carries no measurement uncertainty here") + ", so the confidence is unknown";
        } else if (result.confidence().getAsDouble() < demand) {
            verdict = Verdict.UNVERIFIED;
            text = result.explanation() + "; meets on the measured value, but only "
                    + Wording.confidence(result.confidence().getAsDouble()) + " confident of it (" + asked + ")";
        } else {
            verdict = Verdict.MEETS;
            text = result.explanation() + "; " + Wording.confidence(result.confidence().getAsDouble())
                    + " confident (" + asked + ")";
        }
        return new ClauseResult(clause, result.value(), result.threshold(), result.marginDecades(), verdict, text,
                result.valueIsBound(), result.confidence());
    }

    static String explain(String subject, Direction direction, boolean bounded, double t, double threshold,
                                  Verdict verdict) {
        String need = Wording.need(direction, threshold);
        if (!bounded) {
            return subject + " is " + Wording.transmittance(t) + ", needs " + need;
        }
        // a detection limit rescaled to a thick part can fall to 1e-236 or to 0: say what can be said
        String head = Wording.statable(t)
                ? subject + " is below the detection limit of " + Wording.percent(t)
                : subject + " is below a detection limit that is itself " + Wording.BEYOND_OD_12;
        if (verdict == Verdict.MEETS) {
            return head + ", so it is " + need;
        }
        if (verdict == Verdict.MISSES) {
            return head + ", so it cannot be " + need;
        }
        return direction == Direction.BLOCK
                ? head + ": cannot show " + need + " (the clause asks for less than the detection limit can show)"
                : head + ": a bound cannot show " + need;
    }

    private static String outside(Band band, CurveView view, boolean partly) {
        String what = band.isPoint() ? Wording.band(band) : "band " + Wording.band(band);
        return what + " lies " + (partly ? "partly " : "") + "outside the measured range " + view.rangeText();
    }

    private static ClauseResult cutoff(CutoffClause clause, CurveView view) {
        Band window = clause.window();
        double level = clause.levelT();
        String need = "needs a cutoff (T = " + Wording.percent(level) + ") in " + Wording.band(window);
        if (!view.covers(window)) {
            boolean partly = view.overlaps(window);
            return ClauseResult.unjudgeable(clause, level, "window " + Wording.band(window) + " lies "
                    + (partly ? "partly " : "") + "outside the measured range " + view.rangeText());
        }
        Curve curve = view.curve();
        OptionalDouble found = Cutoffs.cutoffNm(curve, level);
        double edgeMargin = Math.min(
                Margins.of(Direction.PASS, view.at(window.toNm()).judged(), level),
                Margins.of(Direction.BLOCK, view.at(window.fromNm()).judged(), level));
        if (found.isEmpty()) {
            String why = whyNoCutoff(curve, level);
            if (why == null) {
                return ClauseResult.unjudgeable(clause, level, "the curve falls under its detection limit before"
                        + " reaching " + Wording.percent(level) + ", so the cutoff cannot be placed; " + need);
            }
            return new ClauseResult(clause, Double.NaN, level, Math.min(edgeMargin, 0), Verdict.MISSES,
                    why + "; " + need);
        }
        double nm = found.getAsDouble();
        boolean inside = nm >= window.fromNm() && nm <= window.toNm();
        double margin = inside ? Math.max(edgeMargin, 0) : Math.min(edgeMargin, 0);
        return new ClauseResult(clause, nm, level, margin, inside ? Verdict.MEETS : Verdict.MISSES,
                "cutoff (T = " + Wording.percent(level) + ") at " + Wording.nm(nm) + ", " + need);
    }

    /**
     * Why {@link Cutoffs#cutoffNm} found nothing, for a curve covering the window; null when the walk
     * stopped at an undetermined below-detection point.
     */
    private static String whyNoCutoff(Curve curve, double level) {
        String range = Wording.span(curve.minWavelengthNm(), curve.maxWavelengthNm());
        return switch (Cutoffs.whyNoCutoff(curve, level)) {
            case ALWAYS_OVER -> "T stays at or over " + Wording.percent(level) + " across the measured range " + range;
            case NEVER_RISES -> "T does not rise through " + Wording.percent(level) + " out of an absorbing region"
                    + " within the measured range " + range;
            case UNDETERMINED -> null;
        };
    }
}
