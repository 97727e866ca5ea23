package org.spectralsieve.ingest;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Mutation-style checks of the noise-region rule on generated curves: a clean curve has none; noise like a real
 * diode array's deep UV, injected into it, is found with its range; what only looks rough is not taken for noise.
 */
class NoiseRegionTest {

    private static final double[] NM = NoisyCurves.wavelengths();

    @Test
    void aCleanCurveHasNoNoiseRegion() {
        assertThat(NoiseRegion.find(NM, NoisyCurves.cleanTransmittance())).isEmpty();
    }

    @Test
    void aCleanCurveWithOrdinaryPhotometricNoiseHasNoNoiseRegion() {
        // 0.3 %T of noise: the "few tenths of a percent" of a working spectrometer (common practice, no source)
        double[] t = NoisyCurves.withPhotometricNoise(NoisyCurves.cleanTransmittance(), 0.003, 11);

        assertThat(NoiseRegion.find(NM, t)).isEmpty();
    }

    @Test
    void deepUvAbsorbanceNoiseInjectedIntoACleanCurveIsFoundAtTheShortEndWithItsRange() {
        double[] t = NoisyCurves.withAbsorbanceNoise(NoisyCurves.cleanTransmittance(), 190, 229, 7);

        List<NoiseRegion> found = NoiseRegion.find(NM, t);

        assertThat(found).hasSize(1);
        NoiseRegion r = found.get(0);
        assertThat(r.end()).isEqualTo(NoiseRegion.End.SHORT);
        assertThat(r.fromNm()).isEqualTo(190.0);
        // a reading's scatter is judged with its neighbours, so the region may reach half a window past the noise
        assertThat(r.toNm()).isBetween(229.0, 229.0 + NoiseRegion.WINDOW / 2);
        assertThat(r.aboveOne()).as("negative absorbance read as T above 100 %").isPositive();
        assertThat(r.reason()).contains("above 100 %T", "noise, not the sample");
    }

    @Test
    void noiseInjectedAtTheLongEndIsFoundThere() {
        double[] t = NoisyCurves.withAbsorbanceNoise(NoisyCurves.cleanTransmittance(), 761, 800, 3);

        List<NoiseRegion> found = NoiseRegion.find(NM, t);

        assertThat(found).singleElement().satisfies(r -> {
            assertThat(r.end()).isEqualTo(NoiseRegion.End.LONG);
            assertThat(r.toNm()).isEqualTo(800.0);
            assertThat(r.fromNm()).isBetween(761.0 - NoiseRegion.WINDOW / 2, 761.0);
        });
    }

    @Test
    void noiseInTheMiddleOfTheCurveIsNotAnEndRegion() {
        double[] t = NoisyCurves.withAbsorbanceNoise(NoisyCurves.cleanTransmittance(), 500, 540, 5);

        assertThat(NoiseRegion.find(NM, t)).isEmpty();
    }

    @Test
    void aBlockersStopBandScatteringAroundZeroIsEvidenceNotANoiseRegion() {
        double[] t = NoisyCurves.cleanTransmittance();
        double[] noisy = NoisyCurves.withPhotometricNoise(t, 0.0005, 13); // ±0.05 %T around 0 in the stop band

        List<NoiseRegion> found = NoiseRegion.find(NM, noisy);

        assertThat(found).isEmpty();
    }

    @Test
    void scatterThatStaysWithinZeroToOneHundredPercentIsNotTakenForNoise() {
        double[] t = NoisyCurves.cleanTransmittance();
        java.util.Random random = new java.util.Random(17);
        for (int i = 0; i < 40; i++) {
            t[i] = 0.2 + 0.6 * random.nextDouble(); // rough, but every reading is a possible transmittance
        }

        assertThat(NoiseRegion.find(NM, t)).isEmpty();
    }

    @Test
    void aCurveThatIsNoiseForMoreThanHalfItsPointsHasNoRegionToCompareWith() {
        double[] t = NoisyCurves.withAbsorbanceNoise(NoisyCurves.cleanTransmittance(), 190, 520, 19);

        assertThat(NoiseRegion.find(NM, t)).isEmpty();
    }

    @Test
    void aFewNoisyPointsAtTheEndAreNotARegion() {
        double[] t = NoisyCurves.withAbsorbanceNoise(NoisyCurves.cleanTransmittance(), 190, 191, 23);

        assertThat(NoiseRegion.find(NM, t)).isEmpty();
    }
}
