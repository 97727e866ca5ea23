package org.spectralsieve.ingest;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;
import static org.assertj.core.api.Assertions.within;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.testsupport.ReadsSharedFolder;
import org.spectralsieve.testsupport.SharedFolder;

/**
 * The "values far above 100" shape check looks only at value columns: a pixel number before the wavelength,
 * the second wavelength column of replicate pairs, or a column the user chose as the axis holds wavelengths or
 * indices, not readings, and must not make a real capture look like an emission spectrum.
 */
class AxisColumnsShapeCheckTest {

    private final FileImport files = new FileImport(ImportProperties.defaults().maxPoints());

    private FilePreview read(String text, ImportOptions options) throws ImportException {
        return files.read("bench.csv", text.getBytes(StandardCharsets.UTF_8), options);
    }

    @Test
    void aPixelColumnBeforeTheWavelengthIsNotTakenForValues() throws ImportException {
        FilePreview p = read("pixel,wavelength,T\n0,300,0.1\n1,310,0.2\n2,320,0.3\n3,330,0.4\n",
                ImportOptions.defaults());

        assertThat(p.pointCount()).isEqualTo(4);
    }

    @Test
    void theSecondWavelengthColumnOfReplicatePairsIsNotTakenForValues() throws ImportException {
        String file = "w.length.1\ttransmittance.1\tw.length.2\ttransmittance.2\n"
                + "300\t40\t300\t41\n310\t50\t310\t51\n320\t60\t320\t61\n";

        FilePreview p = read(file, ImportOptions.defaults());

        assertThat(p.curve().transmittance(1)).isEqualTo(0.5);
    }

    @Test
    void chosenColumnsDecideWhichColumnIsChecked() throws ImportException {
        // column 1 an unnamed index running to 1000, column 2 the wavelength, column 3 the values
        String file = "n,cal,r\n998,300,0.1\n999,310,0.2\n1000,320,0.3\n";

        FilePreview p = read(file, ImportOptions.defaults().withAxes(Optional.empty(), OptionalInt.of(2),
                OptionalInt.of(3)));

        assertThat(p.curve().wavelengthsNm()).containsExactly(300.0, 310.0, 320.0);
    }

    @Test
    void aChosenValueColumnFarAbove100IsStillRefused() {
        String file = "wavelength,power\n300,800\n310,900\n320,950\n";

        ImportException e = catchThrowableOfType(ImportException.class, () -> read(file,
                ImportOptions.defaults().withAxes(Optional.empty(), OptionalInt.empty(), OptionalInt.of(2))));

        assertThat(e.problem()).contains("values reach 950");
    }

    @Test
    @ReadsSharedFolder
    void theMeasuredReplicatePairFileReadsWithSourcesValues() throws Exception {
        Path f = SharedFolder.measuredSheet("ldpe-film-50um.txt");

        FilePreview p = files.read(f.getFileName().toString(), Files.readAllBytes(f), ImportOptions.defaults());

        // SOURCES.md §8 ldpe-film-50um.txt: pair 1 T300 = 85.6 %, T400 = 89.4 % (190–800 nm at 1 nm)
        assertThat(p.curve().transmittance(300 - 190)).isCloseTo(0.856, within(0.0005));
        assertThat(p.curve().transmittance(400 - 190)).isCloseTo(0.894, within(0.0005));
    }

    @Test
    @ReadsSharedFolder
    void theRealFoldedCaptureIsReportedAsAFoldedAxisNotAsAnEmissionSpectrum() throws Exception {
        // SOURCES.md §9 Spectrum-20260309--010902.csv: Pixel,Wavelength,Intensity with a non-monotonic wavelength axis
        Path f = SharedFolder.referenceFile("diy-spectrometer/Spectrum-20260309--010902.csv");

        ImportException e = catchThrowableOfType(ImportException.class,
                () -> files.read(f.getFileName().toString(), Files.readAllBytes(f), ImportOptions.defaults()));

        assertThat(e.problem()).contains("the wavelength column goes").doesNotContain("values reach");
    }
}
