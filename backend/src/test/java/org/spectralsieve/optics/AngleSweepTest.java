package org.spectralsieve.optics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.spectralsieve.spectrum.Curve;

/**
 * T against the angle of incidence at one wavelength. Check values for one slab come from the textbook's other
 * form of Fresnel's equations (Hecht, Optics, eqs. 4.42–4.43, R_s = sin²(θi − θt)/sin²(θi + θt),
 * R_p = tan²(θi − θt)/tan²(θi + θt)) and the slab formula (Smith, Modern Optical Engineering, eq. 10.5), not from
 * the code under test.
 */
class AngleSweepTest {

    private static final double[] NM = {300, 350, 400, 450};
    private static final RefractiveIndex GLASS = new ConstantIndex(1.5);

    /** Smith eq. 10.5 with both faces reflecting r. */
    private static double slab(double k, double r) {
        return (1 - r) * (1 - r) * k / (1 - r * r * k * k);
    }

    private static LightPath absorbingSheet(double t) {
        return LightPath.of(Layer.bulk(Curve.of(NM, new double[] {t, t, t, t}, 0.0001), 3, 3, GLASS));
    }

    @Test
    void anAbsorbingSlabFollowsTheTextbookFormulaAtEveryAngleForEachPolarisation() {
        AngleSweep.Result sweep = AngleSweep.at(absorbingSheet(0.5), 350);
        double r = Math.pow(0.5 / 2.5, 2); // ((n − 1)/(n + 1))² at normal incidence
        // K from T = 0.5: the positive root of r²T·K² + (1 − r)²K − T = 0
        double k = (-(1 - r) * (1 - r) + Math.sqrt(Math.pow(1 - r, 4) + 4 * r * r * 0.25)) / (2 * r * r * 0.5);
        assertThat(sweep.anglesDeg()).hasSize(90);
        for (int deg = 0; deg < 90; deg++) {
            double theta = Math.toRadians(deg);
            double cosT = Math.sqrt(1 - Math.pow(Math.sin(theta) / 1.5, 2));
            double inside = Math.pow(k, 1 / cosT);
            double ts = deg == 0 ? slab(k, r) : slab(inside, FresnelByAngles.rs(1.5, theta));
            double tp = deg == 0 ? slab(k, r) : slab(inside, FresnelByAngles.rp(1.5, theta));
            assertThat(sweep.anglesDeg()[deg]).isEqualTo(deg);
            assertThat(sweep.s()[deg]).as("s at " + deg + "°").isCloseTo(ts, within(1e-12));
            assertThat(sweep.p()[deg]).as("p at " + deg + "°").isCloseTo(tp, within(1e-12));
            assertThat(sweep.unpolarised()[deg]).as("unpolarised at " + deg + "°").isCloseTo((ts + tp) / 2, within(1e-12));
        }
        assertThat(sweep.unpolarised()[0]).isCloseTo(0.5, within(1e-12));
    }

    @Test
    void atNormalIncidenceTheSweepGivesThePathsOwnCurveAtThatWavelength() {
        Curve measured = Curve.of(NM, new double[] {0.01, 0.3, 0.8, 0.9}, 0.0001);
        LightPath path = LightPath.of(Layer.bulk(measured, 3, 5, GLASS),
                Layer.fixed(Curve.of(NM, new double[] {0.7, 0.85, 0.9, 0.91}, 0.0001), new ConstantIndex(1.52)));
        for (double nm : new double[] {300, 365, 450}) {
            AngleSweep.Result sweep = AngleSweep.at(path, nm);
            assertThat(sweep.unpolarised()[0]).as(nm + " nm")
                    .isEqualTo(path.transmittance().transmittanceAt(nm).getAsDouble());
            assertThat(sweep.wavelengthNm()).isEqualTo(nm);
        }
    }

    @Test
    void theMeanOfSAndPIsTheObliquePathsNumberAlsoForAStackWithAClearPart() {
        // the clear part (0.93 ≥ the n = 1.5 ceiling 0.923 − 0.005) keeps its reading through an effective R'
        LightPath path = LightPath.of(Layer.bulk(Curve.of(NM, new double[] {0.2, 0.4, 0.6, 0.8}, 0.0001), 2, 4, GLASS),
                Layer.fixed(Curve.of(NM, new double[] {0.93, 0.93, 0.93, 0.93}, 0.0001), GLASS));
        AngleSweep.Result sweep = AngleSweep.at(path, 400);
        for (int deg = 0; deg < 90; deg++) {
            assertThat((sweep.s()[deg] + sweep.p()[deg]) / 2).as(deg + "°")
                    .isCloseTo(sweep.unpolarised()[deg], within(1e-12));
        }
        // the path under a collimated beam at 30°, computed on its own wavelengths, at 400 nm
        double at30 = path.transmittance(Illumination.atIncidence(30)).transmittanceAt(400).getAsDouble();
        assertThat(sweep.unpolarised()[30]).isCloseTo(at30, within(1e-12));
    }

    /** The sweep reads only the stored points around the wavelength: the same numbers as the whole path's curve. */
    @Test
    void aLongCurveGivesTheWholePathsNumbersAtTheWavelength() {
        int n = 401;
        double[] nm = new double[n];
        double[] t = new double[n];
        double[] sigma = new double[n];
        for (int i = 0; i < n; i++) {
            nm[i] = 250 + i * 0.75;
            t[i] = 0.02 + 0.88 / (1 + Math.exp(-(nm[i] - 330) / 12)); // an absorption edge near 330 nm
            sigma[i] = 0.002;
        }
        Curve sheet = Curve.of(nm, t, 0.0001).withAbsorbanceUncertainty(sigma);
        Curve cover = Curve.of(new double[] {240, 333.3, 420, 600}, new double[] {0.8, 0.85, 0.9, 0.91}, 0.0001);
        // an index that changes with wavelength, so each point's surfaces differ
        LightPath path = LightPath.of(Layer.bulk(sheet, 3, 4.5, SellmeierIndex.PMMA), Layer.fixed(cover, GLASS));
        for (double at : new double[] {300.2, 333.3, 365, 549.25}) {
            AngleSweep.Result sweep = AngleSweep.at(path, at);
            assertThat(sweep.unpolarised()[0]).isEqualTo(path.transmittance().transmittanceAt(at).getAsDouble());
            assertThat(sweep.unpolarised()[40]).as(at + " nm at 40°").isCloseTo(
                    path.transmittance(Illumination.atIncidence(40)).transmittanceAt(at).getAsDouble(), within(1e-12));
            assertThat(sweep.references().get(2).transmittance()).as(at + " nm, Lambertian").isCloseTo(
                    path.transmittance(Illumination.lambertian()).transmittanceAt(at).getAsDouble(), within(1e-12));
        }
    }

    @Test
    void transmittanceFallsTowardsGrazingAndPPeaksAtBrewstersAngle() {
        AngleSweep.Result sweep = AngleSweep.at(absorbingSheet(0.91), 400);
        for (int deg = 1; deg < 90; deg++) {
            assertThat(sweep.unpolarised()[deg]).as(deg + "°").isLessThanOrEqualTo(sweep.unpolarised()[deg - 1]);
        }
        assertThat(sweep.unpolarised()[89]).isLessThan(sweep.unpolarised()[0] / 3);
        // tan θB = n: 56.31° for n = 1.5 (Hecht, Optics, §4.6.3)
        assertThat(sweep.brewsterDeg()).isCloseTo(Math.toDegrees(Math.atan(1.5)), within(1e-12))
                .isCloseTo(56.31, within(0.005));
        assertThat(sweep.index()).isEqualTo(1.5);
        // p light loses nothing at the surfaces there, so it passes more than at normal incidence
        assertThat(sweep.p()[56]).isGreaterThan(sweep.p()[0]);
        assertThat(sweep.s()[56]).isLessThan(sweep.s()[0]);
    }

    @Test
    void referenceSourcesLieBetweenTheirAnglesAndA120DegreeLedIsLambertian() {
        AngleSweep.Result sweep = AngleSweep.at(absorbingSheet(0.6), 350);
        assertThat(sweep.references()).extracting(r -> r.light().kind())
                .containsExactly(Illumination.Kind.CONE, Illumination.Kind.LED, Illumination.Kind.LAMBERTIAN);
        double[] t = sweep.unpolarised();
        AngleSweep.Reference beam = sweep.references().get(0);
        // a uniform ±30° beam averages T over 0–30°, where T falls: between T(30°) and T(0°)
        assertThat(beam.transmittance()).isBetween(t[30], t[0]);
        AngleSweep.Reference led = sweep.references().get(1);
        AngleSweep.Reference lambertian = sweep.references().get(2);
        assertThat(lambertian.transmittance()).isBetween(t[89], t[0]).isLessThan(beam.transmittance());
        // half intensity at ±60° gives cos^1 θ: the Lambertian (BeamSpread's definition of m)
        assertThat(led.transmittance()).isCloseTo(lambertian.transmittance(), within(1e-9));
        for (AngleSweep.Reference r : sweep.references()) {
            assertThat(r.errorBound()).as(r.light().describe()).isBetween(0.0, 1e-4);
            assertThat(r.upperBound()).isFalse();
        }
    }

    @Test
    void aPointBelowDetectionIsAnUpperBoundAtEveryAngle() {
        Curve measured = Curve.of(NM, new double[] {0.00005, 0.00005, 0.5, 0.8},
                new boolean[] {true, true, false, false}, new double[] {0.0001, 0.0001, 0.0001, 0.0001});
        AngleSweep.Result sweep = AngleSweep.at(LightPath.of(Layer.bulk(measured, 3, 3, GLASS)), 320);
        for (boolean bound : sweep.upperBound()) {
            assertThat(bound).isTrue();
        }
        assertThat(sweep.references()).allMatch(AngleSweep.Reference::upperBound);
        assertThat(AngleSweep.at(LightPath.of(Layer.bulk(measured, 3, 3, GLASS)), 450).upperBound()[0]).isFalse();
    }

    @Test
    void aWavelengthOutsideTheMeasuredRangeIsRefused() {
        assertThat(AngleSweep.rangeNm(absorbingSheet(0.5))).containsExactly(300, 450);
        assertThatThrownBy(() -> AngleSweep.at(absorbingSheet(0.5), 299.9))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("outside the measured range");
        assertThatThrownBy(() -> AngleSweep.at(absorbingSheet(0.5), Double.NaN))
                .isInstanceOf(IllegalArgumentException.class);
        assertThat(AngleSweep.at(absorbingSheet(0.5), 450).unpolarised()[0]).isCloseTo(0.5, within(1e-12));
    }
}
