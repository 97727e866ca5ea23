package org.spectralsieve.similarity;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.function.DoubleUnaryOperator;
import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.ThicknessRescaler;
import org.spectralsieve.spectrum.Curve;

/**
 * Hand-worked cases of the signature and both metrics. Beer–Lambert (internal absorbance proportional to the
 * thickness) is the textbook law the per-mm shape rests on (e.g. W. J. Smith, Modern Optical Engineering, the
 * chapter on absorption filters); each expected value below follows from it by hand, as worked in the comments.
 */
class CurveSignatureAndDistanceTest {

    private static final double FLOOR = 1e-4;

    /** An edge near 380 nm: A = 2·(1 − tanh((λ − 380)/15))/2 per mm, plus a faint slope in the visible. */
    private static final DoubleUnaryOperator EDGE_PER_MM = nm -> (1 - Math.tanh((nm - 380) / 15)) + 0.01 * (700 - nm) / 300;

    private static Curve curveOfAbsorbance(DoubleUnaryOperator absorbance, double from, double to) {
        int n = (int) Math.round(to - from) + 1;
        double[] nm = new double[n];
        double[] t = new double[n];
        for (int i = 0; i < n; i++) {
            nm[i] = from + i;
            t[i] = Math.max(FLOOR, Math.pow(10, -absorbance.applyAsDouble(nm[i])));
        }
        return Curve.of(nm, t, FLOOR);
    }

    private static Curve sheet(double mm) {
        return curveOfAbsorbance(nm -> mm * EDGE_PER_MM.applyAsDouble(nm), 200, 700);
    }

    @Test
    void twiceTheThicknessOfTheSameAbsorberIsAtDistanceZeroByBothMetrics() {
        // A(2 mm) = 2·A(1 mm) point by point, so A per mm is identical where both are resolved
        CurveSignature one = CurveSignature.of(sheet(1), 1, true);
        CurveSignature two = CurveSignature.of(sheet(2), 2, true);
        assertThat(SimilarCurves.distance(one, two, ShapeMetric.CORRELATION)).isCloseTo(0, within(1e-3));
        assertThat(SimilarCurves.distance(one, two, ShapeMetric.CENTRED_EUCLIDEAN)).isCloseTo(0, within(0.02));
    }

    @Test
    void aSheetRescaledWithItsSurfacesIsAtDistanceNearZero() {
        // through the real path: strip both Fresnel surfaces (n = 1.5, R = 0.04), Beer–Lambert 2 → 5 mm, put them back;
        // the surface loss differs per mm at the two thicknesses, a near-constant offset the centring removes
        Curve measured = sheet(2);
        Curve rescaled = ThicknessRescaler.rescale(measured, 2, 5, new ConstantIndex(1.5));
        CurveSignature a = CurveSignature.of(measured, 2, true);
        CurveSignature b = CurveSignature.of(rescaled, 5, true);
        CurveSignature other = CurveSignature.of(curveOfAbsorbance(nm -> 2 * EDGE_PER_MM.applyAsDouble(nm + 30), 200, 700), 2, true);
        for (ShapeMetric metric : ShapeMetric.values()) {
            double self = SimilarCurves.distance(a, b, metric);
            double shifted = SimilarCurves.distance(a, other, metric);
            assertThat(self).as(metric.name()).isLessThan(shifted / 10);
        }
    }

    @Test
    void aConstantAbsorbanceOffsetDoesNotChangeEitherDistance() {
        // reflection loss: −2·log10(1 − 0.04) ≈ 0.035 added at every wavelength (Fresnel at n = 1.5)
        CurveSignature query = CurveSignature.of(curveOfAbsorbance(nm -> 1.5 * EDGE_PER_MM.applyAsDouble(nm), 250, 700), 1.5, true);
        CurveSignature offset = CurveSignature.of(
                curveOfAbsorbance(nm -> 1.5 * EDGE_PER_MM.applyAsDouble(nm) + 0.035, 250, 700), 1.5, true);
        CurveSignature candidate = CurveSignature.of(curveOfAbsorbance(nm -> EDGE_PER_MM.applyAsDouble(nm + 10), 250, 700), 1, true);
        for (ShapeMetric metric : ShapeMetric.values()) {
            assertThat(SimilarCurves.distance(offset, candidate, metric)).as(metric.name())
                    .isCloseTo(SimilarCurves.distance(query, candidate, metric), within(1e-3));
        }
    }

    @Test
    void absorbanceTwiceTheCandidatesMeansTwiceItsThickness() {
        // query A = 2·A_candidate + 0.035 everywhere: slope 2, offset ignored, so 2 × 3 mm = 6 mm
        DoubleUnaryOperator gentle = nm -> 0.2 + 0.3 * Math.exp(-(nm - 450) * (nm - 450) / 2000.0);
        CurveSignature candidate = CurveSignature.of(curveOfAbsorbance(gentle, 200, 700), 3, true);
        CurveSignature query = CurveSignature.of(
                curveOfAbsorbance(nm -> 2 * gentle.applyAsDouble(nm) + 0.035, 200, 700), 4, true);
        SimilarHit hit = SimilarCurves.rank(query, List.of(new SimilarCurves.Candidate("c", candidate)),
                ShapeMetric.CORRELATION, 1).get(0);
        assertThat(hit.matchingThicknessMm().orElseThrow()).isCloseTo(6, within(1e-3));
    }

    @Test
    void aFixedConstructionHasNoMatchingThickness() {
        CurveSignature query = CurveSignature.of(sheet(2), 2, true);
        CurveSignature laminate = CurveSignature.of(sheet(3), 6, false);
        SimilarHit hit = SimilarCurves.rank(query, List.of(new SimilarCurves.Candidate("laminate", laminate)),
                ShapeMetric.CORRELATION, 1).get(0);
        assertThat(hit.matchingThicknessMm()).isEmpty();
    }

    @Test
    void readingsAtTheFloorAreClippedAndDownWeightedAndPointsOutsideTheRangeAreMissing() {
        CurveSignature s = CurveSignature.of(curveOfAbsorbance(nm -> 4 * EDGE_PER_MM.applyAsDouble(nm), 250, 700), 4, true);
        int at200 = 0;
        int at250 = 10;
        int at700 = CurveSignature.DIMENSION - 1;
        assertThat(s.weight(at200)).isZero();
        assertThat(s.shape(at200)).isNaN();
        // at 250 nm A = 4·(1 − tanh(−8.67) + 0.015) ≈ 8 > 4 (the floor): clipped at A = 4, i.e. 1 per mm
        assertThat(s.weight(at250)).isEqualTo(CurveSignature.BOUND_WEIGHT);
        assertThat(s.absorbance(at250)).isCloseTo(4, within(1e-9));
        assertThat(s.shape(at250)).isCloseTo(1, within(1e-9));
        assertThat(s.weight(at700)).isEqualTo(1);
        assertThat(s.pointsCovered()).isEqualTo(CurveSignature.DIMENSION - 10);
    }

    @Test
    void theBandDifferingMostIsWhereOneCurveHasAnExtraAbsorptionBand() {
        // a Gaussian band centred at 550 nm (σ ≈ 7 nm) added to one copy: the 25 nm window must hold 550 nm
        CurveSignature plain = CurveSignature.of(sheet(1), 1, true);
        CurveSignature banded = CurveSignature.of(curveOfAbsorbance(
                nm -> EDGE_PER_MM.applyAsDouble(nm) + 0.3 * Math.exp(-(nm - 550) * (nm - 550) / 100.0), 200, 700), 1, true);
        for (ShapeMetric metric : ShapeMetric.values()) {
            SimilarHit hit = SimilarCurves.rank(plain, List.of(new SimilarCurves.Candidate("b", banded)), metric, 1).get(0);
            assertThat(hit.differingMost().fromNm()).as(metric.name()).isLessThanOrEqualTo(550);
            assertThat(hit.differingMost().toNm()).as(metric.name()).isGreaterThanOrEqualTo(550);
            assertThat(hit.differingMost().toNm() - hit.differingMost().fromNm()).isEqualTo(SimilarCurves.BAND_NM);
        }
    }

    @Test
    void aCandidateSharingTooFewGridPointsIsLeftOut() {
        CurveSignature uv = CurveSignature.of(curveOfAbsorbance(EDGE_PER_MM, 200, 260), 1, true);
        CurveSignature visible = CurveSignature.of(curveOfAbsorbance(EDGE_PER_MM, 240, 700), 1, true);
        // 240–260 nm: 5 common grid points, below the minimum of 10
        assertThat(SimilarCurves.rank(uv, List.of(new SimilarCurves.Candidate("v", visible)), ShapeMetric.CORRELATION, 5))
                .isEmpty();
        assertThat(SimilarCurves.distance(uv, visible, ShapeMetric.CORRELATION)).isNaN();
    }

    @Test
    void thePalerOfTwoSameShapedStocksIsFartherByCentredEuclideanOnly() {
        // same shape, half the absorption per mm: correlation cannot tell them apart, the centred Euclidean can
        CurveSignature stock = CurveSignature.of(sheet(1), 1, true);
        CurveSignature pale = CurveSignature.of(curveOfAbsorbance(nm -> 0.5 * EDGE_PER_MM.applyAsDouble(nm), 200, 700), 1, true);
        assertThat(SimilarCurves.distance(stock, pale, ShapeMetric.CORRELATION)).isCloseTo(0, within(1e-3));
        assertThat(SimilarCurves.distance(stock, pale, ShapeMetric.CENTRED_EUCLIDEAN)).isGreaterThan(0.1);
    }
    @Test
    void euclideanDistanceOfZScoredCurvesIsTheCorrelationDistanceInDisguise() {
        // with the same points and weights, |zx − zy|² / n = 2(1 − r): worked by expanding the square of
        // standardised vectors (each has mean 0 and mean square 1); so a z-scored Euclidean ranks as correlation does
        CurveSignature a = CurveSignature.of(sheet(1), 1, true);
        CurveSignature b = CurveSignature.of(curveOfAbsorbance(nm -> EDGE_PER_MM.applyAsDouble(nm + 12), 200, 700), 1, true);
        double[] x = new double[CurveSignature.DIMENSION];
        double[] y = new double[CurveSignature.DIMENSION];
        double[] w = new double[CurveSignature.DIMENSION];
        for (int i = 0; i < x.length; i++) {
            w[i] = a.weight(i) * b.weight(i);
            x[i] = w[i] > 0 ? a.shape(i) : 0;
            y[i] = w[i] > 0 ? b.shape(i) : 0;
        }
        double[] zx = zScored(x, w);
        double[] zy = zScored(y, w);
        double squared = 0;
        double total = 0;
        for (int i = 0; i < x.length; i++) {
            squared += w[i] * (zx[i] - zy[i]) * (zx[i] - zy[i]);
            total += w[i];
        }
        double r = 1 - SimilarCurves.distance(a, b, ShapeMetric.CORRELATION);
        assertThat(squared / total).isCloseTo(2 * (1 - r), within(1e-9));
    }

    private static double[] zScored(double[] v, double[] w) {
        double sum = 0;
        double total = 0;
        for (int i = 0; i < v.length; i++) {
            sum += w[i] * v[i];
            total += w[i];
        }
        double mean = sum / total;
        double square = 0;
        for (int i = 0; i < v.length; i++) {
            square += w[i] * (v[i] - mean) * (v[i] - mean);
        }
        double sd = Math.sqrt(square / total);
        double[] z = new double[v.length];
        for (int i = 0; i < v.length; i++) {
            z[i] = (v[i] - mean) / sd;
        }
        return z;
    }
    @Test
    void aCandidateFlatterThanTheRepeatabilityNamesNoThickness() {
        // A = 0.035 + 0.004·(λ − 200)/500: a spread of about 0.001, ten times under the 0.01 minimum
        CurveSignature clear = CurveSignature.of(curveOfAbsorbance(nm -> 0.035 + 0.004 * (nm - 200) / 500, 200, 700), 1, true);
        CurveSignature query = CurveSignature.of(curveOfAbsorbance(nm -> 0.035 + 0.008 * (nm - 200) / 500, 200, 700), 2, true);
        SimilarHit hit = SimilarCurves.rank(query, List.of(new SimilarCurves.Candidate("clear", clear)),
                ShapeMetric.CORRELATION, 1).get(0);
        assertThat(hit.matchingThicknessMm()).isEmpty();
    }
    @Test
    void aHitSaysOnHowManyResolvedPointsItRests() {
        // 4 mm of the edge: A = 4·EDGE_PER_MM exceeds the floor's A = 4 up to about 380 nm (1 − tanh(0) = 1 per mm),
        // so the grid points from 200 to 380 nm are bounds and only those above are resolved in both
        CurveSignature thick = CurveSignature.of(sheet(4), 4, true);
        SimilarHit hit = SimilarCurves.rank(thick, List.of(new SimilarCurves.Candidate("same", thick)),
                ShapeMetric.CORRELATION, 1).get(0);
        assertThat(hit.pointsCompared()).isEqualTo(CurveSignature.DIMENSION);
        int resolvedByHand = 0;
        for (int i = 0; i < CurveSignature.DIMENSION; i++) {
            if (4 * EDGE_PER_MM.applyAsDouble(CurveSignature.wavelengthNm(i)) < 4) {
                resolvedByHand++;
            }
        }
        assertThat(hit.resolvedPointsCompared()).isEqualTo(resolvedByHand).isBetween(60, 65);
    }
}
