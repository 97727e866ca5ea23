package org.spectralsieve.optics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static org.spectralsieve.optics.FresnelByAngles.cosRefracted;
import static org.spectralsieve.optics.FresnelByAngles.rp;
import static org.spectralsieve.optics.FresnelByAngles.rs;

import org.junit.jupiter.api.Test;
import org.spectralsieve.spectrum.Curve;

/**
 * A light path at an angle ({@link ObliquePath} through {@link LightPath#transmittance(Illumination)}): checked against
 * the same physics done another way — per-polarisation slab elements chained with {@link OpticalElement#followedBy},
 * Fresnel from the sin/tan forms (Hecht, Optics, eqs. 4.42–4.43), and the beam integrals by a midpoint rule in θ with
 * 200,000 steps — and against published values where there are some.
 */
class ObliquePathTest {

    private static final ConstantIndex GLASS = new ConstantIndex(1.5);
    private static final double[] NM = {300, 365, 405, 500};

    private static Curve flat(double t) {
        return Curve.of(NM, new double[] {t, t, t, t}, 1e-4);
    }

    @Test
    void aClearGlassPlateAt45DegreesPassesTheMeanOfItsTwoPolarisations() {
        // n = 1.5 at 45°: Rs = 0.092013, Rp = 0.008466 (sin/tan forms); a lossless plate passes (1 − R)/(1 + R) per
        // polarisation (Smith, Modern Optical Engineering, eq. 10.6): about (0.8315 + 0.9832)/2 = 0.9073
        double lossless = 2 * 1.5 / (1.5 * 1.5 + 1);
        double theta = Math.toRadians(45);
        double expected = ((1 - rs(1.5, theta)) / (1 + rs(1.5, theta)) + (1 - rp(1.5, theta)) / (1 + rp(1.5, theta))) / 2;
        Curve at45 = LightPath.of(Layer.fixed(flat(lossless), GLASS)).transmittance(Illumination.atIncidence(45));
        for (int i = 0; i < NM.length; i++) {
            assertThat(at45.transmittance(i)).isCloseTo(expected, within(1e-12)).isCloseTo(0.9073, within(1e-4));
        }
        // the tabulated lossless n = 1.5 slab (Fresnel per Born & Wolf §1.5.2 and Hecht §4.6, incoherent slab per
        // polarisation): 0.907344 at 45° and 0.848128 at 60°, to the table's six digits
        assertThat(at45.transmittance(1)).isCloseTo(0.907344, within(1e-6));
        Curve at60 = LightPath.of(Layer.fixed(flat(lossless), GLASS)).transmittance(Illumination.atIncidence(60));
        assertThat(at60.transmittance(1)).isCloseTo(0.848128, within(1e-6));
    }

    @Test
    void anAbsorbingPlateAtAnAngleLosesMoreOnTheLongerSlantPath() {
        double t0 = 0.5;
        double r = Math.pow(0.5 / 2.5, 2);
        double k = Slab.internalFromTransmittance(t0, r);
        for (int deg : new int[] {10, 30, 60, 80}) {
            double theta = Math.toRadians(deg);
            double kSlant = Math.pow(k, 1 / cosRefracted(1.5, theta));
            double expected = (Slab.transmittance(kSlant, rs(1.5, theta)) + Slab.transmittance(kSlant, rp(1.5, theta))) / 2;
            Curve seen = LightPath.of(Layer.fixed(flat(t0), GLASS)).transmittance(Illumination.atIncidence(deg));
            assertThat(seen.transmittance(1)).as(deg + "°").isCloseTo(expected, within(1e-12)).isLessThan(t0);
        }
    }

    @Test
    void aStackAtAnAngleChainsEachPolarisationAcrossTheAirGap() {
        Curve front = flat(0.6);
        Curve back = flat(0.85);
        ConstantIndex plastic = new ConstantIndex(1.59);
        double theta = Math.toRadians(40);
        double expected = 0;
        for (boolean s : new boolean[] {true, false}) {
            OpticalElement a = element(0.6, 1.5, theta, s);
            OpticalElement b = element(0.85, 1.59, theta, s);
            expected += a.followedBy(b).transmittance() / 2;
        }
        Curve seen = LightPath.of(Layer.fixed(front, GLASS), Layer.fixed(back, plastic))
                .transmittance(Illumination.atIncidence(40));
        assertThat(seen.transmittance(2)).isCloseTo(expected, within(1e-12));
    }

    /** A part read as SlabReading reads it at normal incidence, then tilted: the test's own route. */
    private static OpticalElement element(double t, double n, double theta, boolean s) {
        double rNormal = Math.pow((n - 1) / (n + 1), 2);
        SlabReading reading = SlabReading.of(t, rNormal);
        double excess = reading.reflectance() - rNormal;
        double r = (s ? rs(n, theta) : rp(n, theta)) + excess;
        return OpticalElement.slab(Math.pow(reading.internal(), 1 / cosRefracted(n, theta)), r);
    }

    @Test
    void normalIncidenceIsTheNormalPathNumberForNumber() {
        LightPath path = LightPath.of(Layer.bulk(flat(0.42), 3, 5, GLASS), Layer.fixed(flat(0.9), GLASS));
        assertThat(path.transmittance(Illumination.NORMAL)).isEqualTo(path.transmittance());
    }

    @Test
    void aLambertianSourceThroughALosslessGlassPlateMatchesAnIndependentIntegral() {
        // T_eff = ∫ T(θ) 2 sin θ cos θ dθ over 0..90°, midpoint rule with 200,000 steps (a different rule in a
        // different variable from the code's Gauss–Legendre in cos θ): 0.850938 for n = 1.5
        double lossless = 2 * 1.5 / (1.5 * 1.5 + 1);
        int steps = 200_000;
        double reference = 0;
        double surfaceR = 0;
        for (int i = 0; i < steps; i++) {
            double theta = (i + 0.5) * (Math.PI / 2) / steps;
            double w = 2 * Math.sin(theta) * Math.cos(theta) * (Math.PI / 2) / steps;
            double s = rs(1.5, theta);
            double p = rp(1.5, theta);
            reference += w * ((1 - s) / (1 + s) + (1 - p) / (1 + p)) / 2;
            surfaceR += w * (s + p) / 2;
        }
        // the surface's own diffuse reflectance for n = 1.5 is the familiar 0.092 (the external diffuse reflectance
        // used in the Saunderson correction; from memory): the reference integral is the right one
        assertThat(surfaceR).isCloseTo(0.092, within(0.0005));
        Curve seen = LightPath.of(Layer.fixed(flat(lossless), GLASS)).transmittance(Illumination.lambertian());
        assertThat(seen.transmittance(0)).isCloseTo(reference, within(1e-6)).isCloseTo(0.850938, within(1e-6));

        ObliquePath prepared = LightPath.of(Layer.fixed(flat(lossless), GLASS)).prepare(Illumination.lambertian());
        double[] error = prepared.integrationError(new Curve[] {flat(lossless).resampleAt(prepared.wavelengthsNm())});
        assertThat(error[0]).isLessThan(1e-6);
    }

    @Test
    void aNarrowLedIsAlmostNormalIncidenceAndAWideOneLosesMore() {
        Curve plate = flat(0.7);
        LightPath path = LightPath.of(Layer.fixed(plate, GLASS));
        double normal = path.transmittance().transmittance(1);
        double narrow = path.transmittance(Illumination.led(10)).transmittance(1);
        double wide = path.transmittance(Illumination.led(120)).transmittance(1);
        double lambertian = path.transmittance(Illumination.lambertian()).transmittance(1);
        // ±5° at half intensity: the slant path is at most a few tenths of a percent longer near the axis
        assertThat(narrow).isLessThan(normal).isCloseTo(normal, within(1e-3));
        assertThat(wide).isLessThan(narrow).isCloseTo(lambertian, within(1e-9)); // 120° beam angle is cos¹ θ
    }

    @Test
    void aPointBelowDetectionStaysABoundAndItsLimitIsTiltedToo() {
        Curve dark = Curve.of(NM, new double[] {0.00001, 0.2, 0.3, 0.4}, new boolean[] {true, false, false, false},
                new double[] {0.001, 0.001, 0.001, 0.001});
        Curve seen = LightPath.of(Layer.fixed(dark, GLASS)).transmittance(Illumination.beam(60));
        assertThat(seen.belowDetection(0)).isTrue();
        assertThat(seen.belowDetection(1)).isFalse();
        // the path's limit is the limit seen through the tilted part: below the normal-incidence limit
        assertThat(seen.detectionLimit(0)).isLessThan(0.001).isGreaterThan(0.0005);
    }

    @Test
    void aClearBulkPartRescaledFarAtAnAngleBecomesABoundSoonerThanAtNormalIncidence() {
        // a clear reading (at the lossless ceiling) hides an absorption up to its reading uncertainty; along the
        // slant path that hidden absorption grows by 1/cos θt, so the rescaled reading turns into a bound sooner
        double lossless = 2 * 1.5 / (1.5 * 1.5 + 1);
        SlabReading reading = SlabReading.of(lossless, Math.pow(0.5 / 2.5, 2));
        double far = reading.farMm(1);
        double justInside = far * 0.95;
        Layer part = Layer.bulk(flat(lossless), 1, justInside, GLASS);
        assertThat(LightPath.of(part).transmittance().belowDetection(1)).isFalse();
        assertThat(LightPath.of(part).transmittance(Illumination.lambertian()).belowDetection(1)).isTrue();
    }

    @Test
    void aReadingAboveTheLosslessCeilingStaysAValidTransmittanceAtBrewstersAngle() {
        // 0.95 is above a glass plate's ceiling of 0.923 (noise or a low index guess): its unplaced surface loss is
        // negative, and at Brewster's angle R_p plus it would be below 0 without the floor
        Curve bright = flat(0.95);
        double brewster = Math.toDegrees(ObliqueIncidence.brewsterRad(1.5));
        Curve seen = LightPath.of(Layer.fixed(bright, GLASS)).transmittance(Illumination.atIncidence(brewster));
        double excess = (1 - 0.95) / (1 + 0.95) - 0.04; // R' − R of the clear reading (SlabReading), negative here
        double sOnly = Slab.transmittance(1, rs(1.5, Math.toRadians(brewster)) + excess);
        double pHeldAtZero = Slab.transmittance(1, 0);
        assertThat(seen.transmittance(1)).isCloseTo((sOnly + pHeldAtZero) / 2, within(1e-9)).isLessThan(0.95);
    }

    @Test
    void aLongCurveGivesTheSameNumbersWithoutKeepingItsAngleTables() {
        int n = ObliquePath.KEPT_TABLES_UP_TO + 1;
        double[] nm = new double[n];
        double[] t = new double[n];
        for (int i = 0; i < n; i++) {
            nm[i] = 250 + i * 0.1;
            t[i] = 0.2 + 0.6 * i / n;
        }
        Curve longCurve = Curve.of(nm, t, 1e-4);
        Curve shortCurve = Curve.of(java.util.Arrays.copyOfRange(nm, 0, 100), java.util.Arrays.copyOfRange(t, 0, 100), 1e-4);
        Curve longSeen = LightPath.of(Layer.fixed(longCurve, GLASS)).transmittance(Illumination.lambertian());
        Curve shortSeen = LightPath.of(Layer.fixed(shortCurve, GLASS)).transmittance(Illumination.lambertian());
        for (int i = 1; i < 99; i++) {
            assertThat(longSeen.transmittance(i)).isEqualTo(shortSeen.transmittance(i));
            assertThat(longSeen.detectionLimit(i)).isEqualTo(shortSeen.detectionLimit(i));
        }
    }
}
