package org.spectralsieve.optics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

/**
 * Light at an angle: Fresnel's s and p reflectances, Brewster's angle, the longer path inside a slab, and the
 * effective transmittance under a spread beam. Check values are computed here from the other textbook form of
 * Fresnel's equations (Hecht, Optics, eqs. 4.42–4.43: R_s = sin²(θi − θt)/sin²(θi + θt),
 * R_p = tan²(θi − θt)/tan²(θi + θt)), not from the code's form.
 */
class ObliqueIncidenceTest {

    @Test
    void brewstersAngleForGlassOfIndexOnePointFiveIs56Point31DegreesWithNoPReflection() {
        // tan θB = n: 56.31° for n = 1.5 (Hecht, Optics, §4.6.3; the textbook value)
        double brewster = ObliqueIncidence.brewsterRad(1.5);
        assertThat(Math.toDegrees(brewster)).isCloseTo(56.31, within(0.005));
        assertThat(ObliqueIncidence.surface(1.5, brewster).rp()).isLessThan(1e-30);
        assertThat(ObliqueIncidence.surface(1.5, brewster).rs()).isCloseTo(FresnelByAngles.rs(1.5, brewster), within(1e-15));
    }

    @Test
    void at45DegreesGlassReflectsAboutNinePercentOfSAndUnderOnePercentOfP() {
        // Rs ≈ 0.092 and Rp ≈ 0.0085 for n = 1.5 at 45° (the figures, from the textbook curves); the exact
        // numbers from the sin/tan forms: 0.092013 and 0.008466
        ObliqueIncidence.Surface s = ObliqueIncidence.surface(1.5, Math.toRadians(45));
        assertThat(s.rs()).isCloseTo(FresnelByAngles.rs(1.5, Math.toRadians(45)), within(1e-15)).isCloseTo(0.092013, within(1e-6));
        assertThat(s.rp()).isCloseTo(FresnelByAngles.rp(1.5, Math.toRadians(45)), within(1e-15)).isCloseTo(0.008466, within(1e-6));
        assertThat(s.unpolarised()).isCloseTo((0.092013 + 0.008466) / 2, within(1e-6));
    }

    @Test
    void bothFormsAgreeAtEveryAngleAndIndex() {
        for (double n : new double[] {1.33, 1.46, 1.49, 1.52, 1.59, 2.4}) {
            for (int deg = 1; deg < 90; deg++) {
                double theta = Math.toRadians(deg);
                ObliqueIncidence.Surface s = ObliqueIncidence.surface(n, theta);
                assertThat(s.rs()).as(n + " at " + deg + "°").isCloseTo(FresnelByAngles.rs(n, theta), within(1e-12));
                assertThat(s.rp()).as(n + " at " + deg + "°").isCloseTo(FresnelByAngles.rp(n, theta), within(1e-12));
            }
        }
    }

    @Test
    void atNormalIncidenceEverythingIsTodaysResultBitForBit() {
        for (double n : new double[] {1.0, 1.33, 1.458, 1.49, 1.5, 1.586, 2.4}) {
            ObliqueIncidence.Surface s = ObliqueIncidence.surface(n, 0);
            assertThat(s.rs()).isEqualTo(Fresnel.reflectanceInAir(n));
            assertThat(s.rp()).isEqualTo(Fresnel.reflectanceInAir(n));
            for (double k : new double[] {0, 1e-9, 0.01, 0.37, 0.9, 1}) {
                assertThat(ObliqueIncidence.slabTransmittance(k, n, 0))
                        .isEqualTo(Slab.transmittance(k, Fresnel.reflectanceInAir(n)));
            }
        }
    }

    @Test
    void theSlantPathInsideLowersTheInternalTransmittance() {
        // n = 1.5 at 30°: sin θt = 0.5 / 1.5, cos θt = √(1 − 1/9) = 0.942809; K = 0.5^(1/0.942809) = 0.479413
        double theta = Math.toRadians(30);
        double cosT = Math.sqrt(1 - 1.0 / 9);
        double k = Math.pow(0.5, 1 / cosT);
        assertThat(k).isCloseTo(0.479413, within(1e-6));
        double rs = FresnelByAngles.rs(1.5, theta);
        double rp = FresnelByAngles.rp(1.5, theta);
        double expected = (Slab.transmittance(k, rs) + Slab.transmittance(k, rp)) / 2;
        assertThat(ObliqueIncidence.slabTransmittance(0.5, 1.5, theta)).isCloseTo(expected, within(1e-14));
        assertThat(ObliqueIncidence.slabTransmittance(0.5, 1.5, theta))
                .isLessThan(ObliqueIncidence.slabTransmittance(0.5, 1.5, 0));
    }

    /**
     * A Lambertian source through a lossless n = 1.5 slab, checked against an integral done here another way: the
     * trapezoid rule in θ (not in cos θ), 200,000 steps, with T(θ) from the sin/tan forms and the lossless slab
     * (1 − R)/(1 + R) per polarisation.
     */
    @Test
    void aLambertianSourceThroughALosslessSlabMatchesAnIndependentIntegral() {
        int steps = 200_000;
        double h = (Math.PI / 2) / steps;
        double num = 0;
        double den = 0;
        for (int i = 0; i <= steps; i++) {
            double theta = Math.min(i * h, Math.PI / 2 - 1e-12);
            double w = (i == 0 || i == steps ? 0.5 : 1) * Math.cos(theta) * Math.sin(theta);
            double rs = i == 0 ? Fresnel.reflectanceInAir(1.5) : FresnelByAngles.rs(1.5, theta);
            double rp = i == 0 ? Fresnel.reflectanceInAir(1.5) : FresnelByAngles.rp(1.5, theta);
            double t = ((1 - rs) / (1 + rs) + (1 - rp) / (1 + rp)) / 2;
            num += w * t;
            den += w;
        }
        double independent = num / den;

        BeamSpread.Result r = BeamSpread.lambertian().effective(theta -> ObliqueIncidence.slabTransmittance(1, 1.5, theta));

        assertThat(r.transmittance()).isCloseTo(independent, within(1e-6));
        assertThat(r.errorBound()).isLessThan(1e-5);
        // far below the 92.3 % at normal incidence: grazing light is mostly reflected
        assertThat(r.transmittance()).isLessThan(Slab.losslessTransmittance(Fresnel.reflectanceInAir(1.5)) - 0.03);
    }

    @Test
    void aBeamOf120DegreesIsTheLambertianAndNarrowerBeamsComeCloserToNormalIncidence() {
        // half intensity at 60°: cos^m 60° = ½ gives m = 1
        assertThat(BeamSpread.led(Math.toRadians(60)).exponent()).isCloseTo(1, within(1e-12));
        java.util.function.DoubleUnaryOperator window = theta -> ObliqueIncidence.slabTransmittance(0.8, 1.49, theta);
        double lambertian = BeamSpread.lambertian().effective(window).transmittance();
        double wide = BeamSpread.led(Math.toRadians(60)).effective(window).transmittance();
        double narrow = BeamSpread.led(Math.toRadians(15)).effective(window).transmittance();
        double normal = window.applyAsDouble(0);
        assertThat(wide).isCloseTo(lambertian, within(1e-12));
        assertThat(narrow).isGreaterThan(wide).isLessThan(normal);
        assertThat(normal - narrow).isLessThan(0.01);
        assertThat(BeamSpread.collimated(Math.toRadians(30)).effective(window).transmittance())
                .isEqualTo(window.applyAsDouble(Math.toRadians(30)));
        // a narrow uniform cone: nearly normal incidence
        assertThat(BeamSpread.cone(Math.toRadians(2)).effective(window).transmittance()).isCloseTo(normal, within(1e-4));
    }
}
