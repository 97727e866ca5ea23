package org.spectralsieve.optics;

import org.spectralsieve.testsupport.ReadsSharedFolder;
import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.Test;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.weighting.Figure;
import org.spectralsieve.weighting.LuminousTransmittance;

/**
 * The rescaling rule on real measured spectra (../shared/reference-data/measured-transmittance-…,
 * SOURCES.md §8; skipped with a message when absent). Thicknesses are those the files state. Indices at
 * about 589 nm are handbook values from memory (PMMA 1.49, polycarbonate 1.585, soda-lime glass 1.52,
 * LDPE 1.51, cellulose acetate 1.48); PET 1.65 is the demo library's stated index for polyester film.
 */
@ReadsSharedFolder
class MeasuredCeilingReadingsTest {

    private static final double[] FACTORS = {0.05, 0.5, 1 - 1e-7, 1, 1 + 1e-7, 1.5, 3, 4, 10, 100, 8000};

    @ParameterizedTest(name = "{0}")
    @CsvSource({
        "pet-film-125um.txt,                   0.125, 1.65",
        "acrylic-clear-3mm.csv,                3,     1.49",
        "acrylic-uv-absorbing-3mm.csv,         3,     1.49",
        "polycarbonate-sheet-3mm.csv,          3,     1.585",
        "glass-dish-cover.csv,                 3,     1.52",
        "longpass-filter-glass-295nm-2mm.csv,  2,     1.52",
        "ldpe-film-50um.txt,                   0.05,  1.51",
        "acetate-film-115um.txt,               0.115, 1.48",
        "acetate-film-480um.txt,               0.48,  1.48"})
    void everyMeasuredFileRescalesToItselfContinuouslyAndNeverRises(String file, double d0, double n) {
        Curve measured = MeasuredFiles.curve(file);
        ConstantIndex index = new ConstantIndex(n);

        Curve same = ThicknessRescaler.rescale(measured, d0, d0, index);
        for (int i = 0; i < measured.size(); i++) {
            // identity at the measured thickness, also for readings above the ceiling (a reading above 1 is 1)
            assertThat(same.transmittance(i)).as(file + " at " + measured.wavelengthNm(i) + " nm")
                    .isCloseTo(Math.min(1, measured.transmittance(i)), within(1e-12));
            assertThat(same.belowDetection(i)).isEqualTo(measured.belowDetection(i));
        }
        Curve previous = null;
        for (double factor : FACTORS) {
            Curve now = ThicknessRescaler.rescale(measured, d0, d0 * factor, index);
            Curve nudged = ThicknessRescaler.rescale(measured, d0, d0 * factor * (1 + 1e-9), index);
            for (int i = 0; i < measured.size(); i++) {
                String at = file + " ×" + factor + " at " + measured.wavelengthNm(i) + " nm";
                assertThat(Math.abs(nudged.transmittance(i) - now.transmittance(i))).as(at).isLessThan(1e-7);
                if (previous != null) {
                    assertThat(now.transmittance(i)).as(at).isLessThanOrEqualTo(previous.transmittance(i));
                    assertThat(!previous.belowDetection(i) || now.belowDetection(i)).as(at).isTrue();
                }
            }
            previous = now;
        }
    }

    @Test
    void petFilmReadsAboveItsLosslessCeilingThroughTheVisible() {
        // why the file is the example: SOURCES.md §8 gives T550 = 92.1 % against 2n/(n² + 1) = 88.65 %
        Curve pet = MeasuredFiles.curve("pet-film-125um.txt");
        double ceiling = Slab.losslessTransmittance(Fresnel.reflectanceInAir(1.65));
        long above = java.util.stream.IntStream.range(0, pet.size())
                .filter(i -> pet.wavelengthNm(i) >= 400 && pet.wavelengthNm(i) <= 700)
                .filter(i -> pet.transmittance(i) > ceiling).count();
        assertThat(pet.transmittanceAt(550).orElseThrow()).isCloseTo(0.921, within(0.0005));
        assertThat(above).isGreaterThan(250);
    }

    @Test
    void petLuminousTransmittanceDoesNotJumpJustPastTheMeasuredThickness() {
        // today's fault: τv 92.1 % at 0.125 mm and 88.65 % at 0.1250001 mm; SOURCES.md §8 τv(D65) = 0.9212
        Curve pet = MeasuredFiles.curve("pet-film-125um.txt");
        ConstantIndex n = new ConstantIndex(1.65);

        double atMeasured = tauV(ThicknessRescaler.rescale(pet, 0.125, 0.125, n));
        double justThicker = tauV(ThicknessRescaler.rescale(pet, 0.125, 0.1250001, n));

        assertThat(atMeasured).isCloseTo(tauV(pet), within(1e-12));
        assertThat(atMeasured).isCloseTo(0.921, within(0.002)); // 5 nm shipped tables against the 1 nm value
        assertThat(Math.abs(justThicker - atMeasured)).isLessThan(1e-6);
    }

    @Test
    void petFilmAMetreThickIsNeverStatedAsPassingItsFilmReading() {
        // today's fault: 1000 mm of PET "passes 88.65 % from 385 to 700 nm"
        Curve pet = MeasuredFiles.curve("pet-film-125um.txt");
        Curve metre = ThicknessRescaler.rescale(pet, 0.125, 1000, new ConstantIndex(1.65));

        for (int i = 0; i < metre.size(); i++) {
            double nm = metre.wavelengthNm(i);
            if (nm >= 385 && nm <= 700) {
                // either an upper bound (an absorption the data cannot resolve, extrapolated 8000 times)
                // or a resolved absorption that leaves next to nothing
                assertThat(metre.belowDetection(i) || metre.transmittance(i) < 0.01).as(nm + " nm").isTrue();
            }
        }
        Figure tauV = LuminousTransmittance.of(metre);
        assertThat(tauV.bound()).isNotEqualTo(Figure.Bound.VALUE);
    }

    @Test
    void petBehindGlassPassesAtLeastTheProductOfTheTwoMeasuredParts() {
        // today's fault: PET behind glass gets τv 0.799, below the product of the measured parts (0.823);
        // two parts in air: T1·T2 ≤ T ≤ T1·T2/(1 − R1·R2) with R ≤ 1 − T (Modern Optical Engineering eq. 10.5, energy)
        Curve pet = MeasuredFiles.curve("pet-film-125um.txt");
        Curve glass = MeasuredFiles.curve("glass-dish-cover.csv");
        for (double d : new double[] {0.125, 0.25, 0.5}) {
            Curve alone = ThicknessRescaler.rescale(pet, 0.125, d, new ConstantIndex(1.65));
            Curve stack = new ThicknessSweep(pet, 0.125, new ConstantIndex(1.65),
                    List.of(Layer.fixed(glass, new ConstantIndex(1.52)))).path(d);
            for (int i = 0; i < stack.size(); i++) {
                double nm = stack.wavelengthNm(i);
                double t1 = alone.transmittanceAt(nm).orElseThrow();
                double t2 = Math.min(1, glass.transmittanceAt(nm).orElseThrow());
                double t = stack.transmittance(i);
                assertThat(t).as(d + " mm at " + nm + " nm").isGreaterThanOrEqualTo(t1 * t2 * (1 - 1e-9));
                assertThat(t).as(d + " mm at " + nm + " nm")
                        .isLessThanOrEqualTo(t1 * t2 / (1 - (1 - t1) * (1 - t2)) * (1 + 1e-9));
            }
        }
    }

    @Test
    void theReadingUncertaintyCoversTheInstrumentsHundredPercentLine() {
        // the blank (empty beam, SOURCES.md §8) over 200–1000 nm, where the diode array is not at its ends:
        // within ±0.08 %T of 100 %, so the chosen u = 0.5 %T (common practice) is on the safe side of it
        Curve blank = MeasuredFiles.curve("instrument-blank.csv");
        for (int i = 0; i < blank.size(); i++) {
            if (blank.wavelengthNm(i) < 200 || blank.wavelengthNm(i) > 1000) {
                continue;
            }
            assertThat(Math.abs(blank.transmittance(i) - 1)).as(blank.wavelengthNm(i) + " nm")
                    .isLessThanOrEqualTo(SlabReading.READING_UNCERTAINTY);
        }
    }

    private static double tauV(Curve curve) {
        return LuminousTransmittance.of(curve).value().orElseThrow();
    }
}
