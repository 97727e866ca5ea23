package org.spectralsieve.requirement;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.stream.IntStream;
import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.Slab;
import org.spectralsieve.spectrum.Curve;

/**
 * Requirements judged for light at an angle: the figure is the slant-path slab of the rescaled part, parts that are not
 * homogeneous absorbers are not judged at an angle, and the thickness solved at an angle is the one that holds there.
 * The expected numbers are formed here from the slab formula (Smith, Modern Optical Engineering, eq. 10.5), Snell's
 * law and Fresnel's sin/tan forms (Hecht, Optics, eqs. 4.42–4.43), not through the code's oblique path.
 */
class ObliqueEvaluationTest {

    private static final double N = 1.49;
    private static final double[] NM = IntStream.rangeClosed(0, 40).mapToDouble(i -> 300 + 5 * i).toArray();
    /** An illustrative absorbing sheet: T rising from 10 % at 300 nm to 90 % at 500 nm, measured at 2 mm. */
    private static final Curve SHEET = Curve.of(NM, IntStream.rangeClosed(0, 40).mapToDouble(i -> 0.1 + 0.02 * i).toArray(),
            1e-4);

    private static Candidate bulk() {
        return new Candidate(1, 10, "illustrative absorbing sheet", SHEET, 2, true, new ConstantIndex(N));
    }

    private static double expected(double t0, double fromMm, double toMm, double deg) {
        double r0 = Math.pow((N - 1) / (N + 1), 2);
        double k = Math.pow(Slab.internalFromTransmittance(t0, r0), toMm / fromMm);
        double theta = Math.toRadians(deg);
        double refracted = Math.asin(Math.sin(theta) / N);
        double s = Math.pow(Math.sin(theta - refracted) / Math.sin(theta + refracted), 2);
        double p = Math.pow(Math.tan(theta - refracted) / Math.tan(theta + refracted), 2);
        double slant = Math.pow(k, 1 / Math.cos(refracted));
        return (Slab.transmittance(slant, s) + Slab.transmittance(slant, p)) / 2;
    }

    @Test
    void aSheetRescaledAndTiltedReadsTheSlantPathSlab() {
        // 400 nm: T = 0.5 at 2 mm; asked at 4 mm and 30° incidence
        Requirement r = RequirementParser.parse("passes over 20% at 400 nm, at 4 mm, at 30° incidence");
        SampleEvaluation e = SampleEvaluator.evaluate(bulk(), r);
        assertThat(e.clauses().get(0).value()).isCloseTo(expected(0.5, 2, 4, 30), within(1e-12));
        SampleEvaluation square = SampleEvaluator.evaluate(bulk(), RequirementParser.parse("passes over 20% at 400 nm, at 4 mm"));
        assertThat(e.clauses().get(0).value()).isLessThan(square.clauses().get(0).value());
    }

    @Test
    void saidNormalIncidenceIsTheUsualJudgementExactly() {
        SampleEvaluation said = SampleEvaluator.evaluate(bulk(),
                RequirementParser.parse("passes over 40% at 400 nm, thickness 1 to 6 mm, at normal incidence"));
        SampleEvaluation unsaid = SampleEvaluator.evaluate(bulk(), RequirementParser.parse("passes over 40% at 400 nm, thickness 1 to 6 mm"));
        assertThat(said).isEqualTo(unsaid);
    }

    @Test
    void aThicknessSolvedAtAnAngleHoldsAtItsEndAndIsThinnerThanSquareOn() {
        String clause = "passes over 40% at 400 nm, thickness 1 to 6 mm";
        SampleEvaluation tilted = SampleEvaluator.evaluate(bulk(), RequirementParser.parse(clause + ", at 60° incidence"));
        SampleEvaluation square = SampleEvaluator.evaluate(bulk(), RequirementParser.parse(clause));
        assertThat(tilted.verdict()).isEqualTo(Verdict.MEETS);
        double hi = tilted.feasibleMm().hiMm();
        assertThat(hi).isLessThan(square.feasibleMm().hiMm());
        // at the interval's end the tilted sheet passes just 40 %
        assertThat(expected(0.5, 2, hi, 60)).isCloseTo(0.4, within(1e-6));
        assertThat(SampleEvaluator.evaluate(bulk(), RequirementParser.parse("passes over 40% at 400 nm, at " + hi * 0.99
                + " mm, at 60° incidence")).verdict()).isEqualTo(Verdict.MEETS);
        assertThat(SampleEvaluator.evaluate(bulk(), RequirementParser.parse("passes over 40% at 400 nm, at " + hi * 1.01
                + " mm, at 60° incidence")).verdict()).isEqualTo(Verdict.MISSES);
    }

    @Test
    void aSheetWithoutARecordedThicknessIsStillJudgedAsMeasuredAtAnAngle() {
        Candidate unknown = new Candidate(5, 50, "illustrative sheet, thickness not recorded", SHEET, Double.NaN, true,
                new ConstantIndex(N));
        SampleEvaluation e = SampleEvaluator.evaluate(unknown, RequirementParser.parse("passes over 20% at 400 nm, at 30° incidence"));
        assertThat(e.verdict()).isEqualTo(Verdict.MEETS);
        assertThat(e.clauses().get(0).value()).isCloseTo(expected(0.5, 2, 2, 30), within(1e-12));
    }

    @Test
    void aCoatedPartIsNotJudgedAtAnAngle() {
        Candidate coated = new Candidate(2, 20, "illustrative coated window", SHEET, 2, false, new ConstantIndex(N));
        SampleEvaluation e = SampleEvaluator.evaluate(coated, RequirementParser.parse("passes over 20% at 400 nm, at 30° incidence"));
        assertThat(e.verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(e.clauses().get(0).explanation()).contains("coating's spectrum shifts with angle").contains("30° incidence");
        // square on, the same part is judged as measured
        assertThat(SampleEvaluator.evaluate(coated, RequirementParser.parse("passes over 20% at 400 nm")).verdict())
                .isEqualTo(Verdict.MEETS);
    }

    @Test
    void aScatteringPartIsNotJudgedAtAnAngle() {
        Candidate opal = new Candidate(3, 30, "illustrative opal sheet", SHEET, 2, false, new ConstantIndex(N), true,
                "diffuse sample (total transmittance): scatter is not absorption, so it is not rescaled");
        SampleEvaluation e = SampleEvaluator.evaluate(opal, RequirementParser.parse("passes over 20% at 400 nm, over a 60° beam"));
        assertThat(e.verdict()).isEqualTo(Verdict.UNVERIFIED);
        assertThat(e.clauses().get(0).explanation()).contains("scattered light does not follow").contains("60° beam");
    }

    @Test
    void aWideBeamCostsMoreThanAModerateAngle() {
        double at20 = SampleEvaluator.evaluate(bulk(), RequirementParser.parse("passes over 20% at 400 nm, at 20° incidence"))
                .clauses().get(0).value();
        double lambertian = SampleEvaluator.evaluate(bulk(), RequirementParser.parse("passes over 20% at 400 nm,"
                + " under a Lambertian source")).clauses().get(0).value();
        assertThat(at20).isCloseTo(expected(0.5, 2, 2, 20), within(1e-12));
        assertThat(lambertian).isLessThan(at20);
    }

    @Test
    void thePointsFormedWhenReadAreTheObliqueCurvesNumbers() {
        // a clause reads the oblique path's points one by one; the built curve (cutoffs, critical wavelength) must
        // say the same at every point, bound flags and limits included, for every light and thickness
        Curve dim = Curve.of(NM, IntStream.rangeClosed(0, 40).mapToDouble(i -> i < 5 ? 1e-5 : 0.01 + 0.022 * i).toArray(),
                below(5),
                IntStream.rangeClosed(0, 40).mapToDouble(i -> 1e-3).toArray());
        Candidate sheet = new Candidate(4, 40, "illustrative dim sheet", dim, 2, true, new ConstantIndex(N));
        for (org.spectralsieve.optics.Illumination light : new org.spectralsieve.optics.Illumination[] {
                org.spectralsieve.optics.Illumination.atIncidence(50), org.spectralsieve.optics.Illumination.beam(120),
                org.spectralsieve.optics.Illumination.led(40)}) {
            for (double d : new double[] {0.5, 2, 7}) {
                CandidatePath path = new CandidatePath(sheet, java.util.Optional.empty(), light);
                org.spectralsieve.spectrum.PointReadings points = path.pointsAt(d);
                Curve built = new CandidatePath(sheet, java.util.Optional.empty(), light).at(d);
                assertThat(points.size()).isEqualTo(built.size());
                for (int i = points.size() - 1; i >= 0; i--) {
                    assertThat(points.transmittance(i)).as(light + " " + d + " " + i).isEqualTo(built.transmittance(i));
                    assertThat(points.detectionLimit(i)).isEqualTo(built.detectionLimit(i));
                    assertThat(points.belowDetection(i)).isEqualTo(built.belowDetection(i));
                }
            }
        }
    }

    private static boolean[] below(int first) {
        boolean[] out = new boolean[NM.length];
        for (int i = 0; i < first; i++) {
            out[i] = true;
        }
        return out;
    }
}
