package org.spectralsieve.requirement;

import java.util.List;
import java.util.OptionalDouble;

/**
 * How sure a transmittance clause's verdict is: the probability that the TRUE value meets the threshold,
 * given the curve's stated measurement uncertainty (docs/confidence.md).
 *
 * <h2>Error model</h2>
 * The measured absorbance A = −log10 T at each reading is the true absorbance plus a Gaussian error with
 * the stored standard deviation σ_A ({@link Reading#sigmaA}). Absorbance is the scale on which a
 * spectrometer's noise is closest to symmetric (a dark-corrected ratio of two noisy signals, small
 * relative errors) and on which Beer–Lambert rescaling is linear, so a σ_A stays a σ_A when a sample is
 * scaled; in T the same error is skewed and bounded at 0.
 *
 * <h2>One reading</h2>
 * "T ≥ t" is "A ≤ A_t" with A_t = −log10 t, so P = Φ((A_t − A)/σ_A); "T ≤ t" is the complement,
 * Φ((A − A_t)/σ_A). σ_A = 0 gives 1 or 0 by the reading itself.
 *
 * <h2>A band judged at every point</h2>
 * The clause holds when every reading holds. The errors of neighbouring points are correlated by an unknown
 * amount (shared baseline, smoothing, interpolated band ends), so the confidence given is the Bonferroni
 * lower bound 1 − Σ(1 − P_i), floored at 0, which holds whatever that correlation is. It equals P for a
 * single point, is only pulled down by readings near the threshold, and never claims more than the data give.
 *
 * <h2>A band mean</h2>
 * The mean is the trapezoid mean Σ w_i T_i of the same readings ({@link CurveView#trapezoidMean}). Each
 * reading's σ in T is taken to first order, σ_T = T·ln10·σ_A, and the errors as fully correlated, so
 * σ_mean = Σ w_i σ_T,i: by the triangle inequality no other correlation gives a larger σ, so the confidence
 * is never more extreme than the data allow. The mean is taken as Gaussian in T (a sum of many terms), and
 * P = Φ((mean − t)/σ_mean) for a pass, the complement for a block.
 *
 * <h2>Unknown</h2>
 * Empty, never invented, when any reading used lacks a σ_A (the curve carries none there), when any is a
 * bound from a detection limit (the true T lies anywhere under it: no Gaussian around a value applies), and
 * for the clauses this class is not asked about (cutoffs, weighted figures, a critical wavelength: their
 * figures are not linear in the readings' absorbance; see docs/confidence.md).
 */
final class ClauseConfidence {

    private static final double LN10 = Math.log(10);

    private ClauseConfidence() {
    }

    /** Every reading must hold: the Bonferroni lower bound on the probability that all do. */
    static OptionalDouble everyPoint(Direction direction, List<Reading> readings, double threshold) {
        if (readings.isEmpty() || !readings.stream().allMatch(Reading::hasUncertainty)) {
            return OptionalDouble.empty();
        }
        double missing = 0;
        for (Reading r : readings) {
            missing += 1 - atReading(direction, r.value(), r.sigmaA(), threshold);
        }
        return OptionalDouble.of(Math.max(0, 1 - missing));
    }

    /** The probability that one reading's true T meets the threshold. */
    static double atReading(Direction direction, double t, double sigmaA, double threshold) {
        double a = CurveView.absorbance(t);
        double aThreshold = CurveView.absorbance(threshold);
        double below = aThreshold - a; // > 0 when the reading passes
        return probability(direction == Direction.PASS ? below : -below, sigmaA);
    }

    /** The band mean's confidence: fully correlated errors, first-order σ in T, Gaussian in T. */
    static OptionalDouble mean(Direction direction, List<Reading> readings, double threshold) {
        if (readings.size() < 2 || !readings.stream().allMatch(Reading::hasUncertainty)) {
            return OptionalDouble.empty();
        }
        double mean = CurveView.trapezoidMean(readings);
        double sigmaMean = sigmaOfMean(readings);
        double over = mean - threshold; // > 0 when the mean passes
        return OptionalDouble.of(probability(direction == Direction.PASS ? over : -over, sigmaMean));
    }

    /** Σ w_i·T_i·ln10·σ_A,i with the trapezoid weights of {@link CurveView#trapezoidMean}. */
    static double sigmaOfMean(List<Reading> readings) {
        double sum = 0;
        for (int i = 1; i < readings.size(); i++) {
            Reading a = readings.get(i - 1);
            Reading b = readings.get(i);
            sum += 0.5 * (sigmaT(a) + sigmaT(b)) * (b.nm() - a.nm());
        }
        double width = readings.get(readings.size() - 1).nm() - readings.get(0).nm();
        return sum / width;
    }

    private static double sigmaT(Reading r) {
        return r.value() * LN10 * r.sigmaA();
    }

    /** P(the true figure lies on the holding side) for a figure {@code by} on that side, with standard deviation σ. */
    private static double probability(double by, double sigma) {
        if (sigma == 0) {
            return by >= 0 ? 1 : 0;
        }
        return StandardNormal.cdf(by / sigma);
    }
}
