package org.spectralsieve.ingest;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.testsupport.ReadsSharedFolder;
import org.spectralsieve.testsupport.SharedFolder;

/**
 * The noise, floor and over-range rules at their edges, on generated files (an invented workshop's bench
 * readings, illustrative) and on a measured file with readings changed: what {@link OutOfRangeReadingsTest} and
 * {@link InstrumentFloorTest} leave out. The limits (−1 %T noise, 105 %T drift, five points make a floor) are
 * the project's stated choices (common practice, no source; docs/importing.md); percent to fraction is
 * %T / 100 and absorbance is A = −log10 T (IUPAC Gold Book A00028).
 */
class ReadingLimitsMutationTest {

    private final FileImport reader = new FileImport(ImportProperties.defaults().maxPoints());

    private FilePreview read(String text) throws Exception {
        return reader.read("capture.csv", text.getBytes(StandardCharsets.UTF_8), ImportOptions.defaults());
    }

    @Test
    void minusOnePercentIsStillNoiseAndAReadingJustBeyondItRefusesTheFile() throws Exception {
        FilePreview atLimit = read("wavelength_nm,transmittance_percent\n240,-1\n250,0.5\n300,40\n");

        assertThat(atLimit.curve().belowDetection(0)).isTrue();
        assertThat(atLimit.curve().transmittance(0)).as("bounded by the noise the file shows, 1 %T").isEqualTo(0.01);
        assertThatThrownBy(() -> read("wavelength_nm,transmittance_percent\n240,-1.01\n250,0.5\n300,40\n"))
                .isInstanceOf(IngestException.class).hasMessageContaining("1 readings below -1 %T")
                .hasMessageContaining("at 240 nm");
    }

    @Test
    void exactly105PercentIsReferenceDriftAndJustAboveItIsUnreliable() throws Exception {
        FilePreview atLimit = read("wavelength_nm,transmittance_percent\n400,90\n500,105\n600,95\n");
        FilePreview beyond = read("wavelength_nm,transmittance_percent\n400,90\n500,105.01\n600,95\n");

        assertThat(atLimit.warnings()).singleElement().satisfies(w -> assertThat(w).contains("reference drift")
                .contains("at 500 nm"));
        assertThat(beyond.warnings()).singleElement().satisfies(w -> assertThat(w).contains("unreliable")
                .contains("at 500 nm"));
        assertThat(beyond.curve().transmittance(1)).as("kept as read below the ceiling").isEqualTo(1.0501);
    }

    /**
     * A diode array's deep UV in absorbance: A scatters around zero and below it. A = −0.01 is T = 10^0.01
     * = 1.0233 (drift); A = −0.73 is T = 10^0.73 = 5.37, stored at the curve's 1.5 ceiling and flagged.
     */
    @Test
    void negativeAbsorbanceIsTransmittanceAboveOneKeptAndFlaggedNotRefused() throws Exception {
        FilePreview p = read("wavelength_nm,absorbance\n190,-0.73\n200,-0.01\n220,0.4\n300,0.05\n");
        Curve c = p.curve();

        assertThat(c.size()).isEqualTo(4);
        assertThat(c.transmittance(1)).isCloseTo(1.0233, within(0.0001));
        assertThat(c.transmittance(0)).isEqualTo(Curve.MAX_TRANSMITTANCE);
        assertThat(p.warnings()).anySatisfy(w -> assertThat(w).contains("1 readings above 100 %T").contains("at 200 nm"));
        assertThat(p.warnings()).anySatisfy(w -> assertThat(w).contains("1 readings above 105 %T")
                .contains("highest 537 %T").contains("at 190 nm").contains("unreliable"));
    }

    /** A clamp at 0.01 %T from 190 to 250 nm with two noise readings below zero inside it. */
    @Test
    void negativeNoiseInsideAClampedFloorDoesNotHideTheFloor() throws Exception {
        StringBuilder csv = new StringBuilder("wavelength_nm,transmittance_percent\n");
        for (int nm = 190; nm <= 300; nm++) {
            double percent = nm == 230 || nm == 235 ? -0.004 : nm <= 250 ? 0.01 : (nm - 250) * 1.8;
            csv.append(nm).append(',').append(String.format(Locale.ROOT, "%.4f", percent)).append('\n');
        }

        FilePreview p = read(csv.toString());
        Curve c = p.curve();

        assertThat(p.detectionLimit()).isCloseTo(1e-4, within(1e-12));
        for (int i = 0; i <= 250 - 190; i++) {
            assertThat(c.belowDetection(i)).as("point at %s nm", c.wavelengthNm(i)).isTrue();
            // the floor, 0.01 %T, is the larger of the floor and the 0.004 %T noise: T at most 1e-4 everywhere
            assertThat(c.transmittance(i)).isCloseTo(1e-4, within(1e-12));
        }
        assertThat(c.belowDetection(300 - 190)).isFalse();
        assertThat(p.warnings()).anySatisfy(w -> assertThat(w).contains("instrument floor").contains("59 points"));
        assertThat(p.warnings()).anySatisfy(w -> assertThat(w).contains("2 readings below 0 %T"));
    }

    /**
     * The measured 3 mm polycarbonate sheet (reference-data, SOURCES.md §8: floor 0.01 %T up to 357 nm, T400 =
     * 53.09 %) with three floor readings at 250–252 nm changed to −0.005 %T, as a noisier capture of the same
     * sheet would read: imported whole, with or without a detection limit given, the floor still its limit.
     */
    @Test
    @ReadsSharedFolder
    void theMeasuredPolycarbonateSheetWithThreeNegativeReadingsKeepsEveryPointAndItsFloor() throws Exception {
        Path sheet = SharedFolder.referenceFileNamed("polycarbonate-sheet-3mm.csv");
        String noisy = withReadings(Files.readAllLines(sheet), List.of("250", "251", "252"), "-0.005");

        for (String text : List.of(noisy, "# detection_limit: 0.01%\n" + noisy)) {
            FilePreview p = reader.read("polycarbonate-noisy.csv", text.getBytes(StandardCharsets.UTF_8),
                    ImportOptions.defaults());
            Curve c = p.curve();

            assertThat(c.size()).isEqualTo(911);
            assertThat(c.belowDetection(250 - 190)).isTrue();
            assertThat(c.belowDetection(300 - 190)).as("T300 = 0.01 %, the floor").isTrue();
            assertThat(c.belowDetection(400 - 190)).isFalse();
            assertThat(c.transmittance(400 - 190)).isCloseTo(0.5309, within(0.00005));
            assertThat(p.detectionLimit()).isCloseTo(1e-4, within(1e-9));
            assertThat(p.warnings()).anySatisfy(w -> assertThat(w).contains("3 readings below 0 %T")
                    .contains("between 250 and 252 nm"));
            assertThat(p.warnings()).anySatisfy(w -> assertThat(w).contains("instrument floor"));
        }
    }

    /** The file's lines with the second field of the rows at those wavelengths replaced. */
    private static String withReadings(List<String> lines, List<String> wavelengths, String value) {
        List<String> out = new ArrayList<>();
        int changed = 0;
        for (String line : lines) {
            String[] f = line.split(",", -1);
            if (f.length >= 2 && wavelengths.contains(f[0].strip())) {
                f[1] = value;
                changed++;
            }
            out.add(String.join(",", f));
        }
        assertThat(changed).as("rows changed").isEqualTo(wavelengths.size());
        return String.join("\n", out) + "\n";
    }
}
