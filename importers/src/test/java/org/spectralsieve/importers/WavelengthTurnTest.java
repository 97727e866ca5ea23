package org.spectralsieve.importers;

import static org.assertj.core.api.Assertions.catchThrowableOfType;
import static org.assertj.core.api.Assertions.assertThat;

import java.io.StringReader;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.spectralsieve.testsupport.ReadsSharedFolder;
import org.spectralsieve.testsupport.SharedFolder;

/**
 * A wavelength axis that changes direction (a bad calibration fit can fold a pixel-to-wavelength map
 * back on itself) is reported as such, with the line and both wavelengths, even when the header has
 * no column the reader takes as a value; generated files, illustrative values.
 */
class WavelengthTurnTest {

    private static final String TURNING_WITHOUT_VALUE_COLUMN = """
            Pixel,Wavelength,Intensity
            0,354.5,0.0196
            1,354.0,0.0188
            2,353.5,0.0179
            3,360.0,0.0182
            4,365.0,0.0177
            """;

    @Test
    void aWavelengthColumnThatGoesBackIsRefusedNamingTheLineAndBothWavelengths() {
        ImportException e = catchThrowableOfType(ImportException.class,
                () -> new DelimitedTextReader().read("fold.csv", new StringReader(TURNING_WITHOUT_VALUE_COLUMN)));

        assertThat(e.line()).isEqualTo(5); // header is line 1; 360.0 is on line 5
        assertThat(e.problem()).contains("goes up again from 353.5 nm to 360.0 nm at line 5")
                .doesNotContain("no value column");
    }

    @Test
    void aWavelengthColumnThatRisesThenFallsSaysItGoesBack() {
        String text = """
                Pixel,Wavelength,Intensity
                0,300.0,0.5
                1,301.0,0.5
                2,302.0,0.5
                3,251.2,0.5
                """;
        ImportException e = catchThrowableOfType(ImportException.class,
                () -> new DelimitedTextReader().read("fold.csv", new StringReader(text)));

        assertThat(e.problem()).contains("goes back from 302.0 nm to 251.2 nm at line 5");
    }

    @Test
    void aMonotonicAxisWithoutAValueColumnStillSaysThereIsNoValueColumn() {
        String text = """
                Pixel,Wavelength,Intensity
                0,300.0,0.5
                1,301.0,0.5
                2,302.0,0.5
                """;
        ImportException e = catchThrowableOfType(ImportException.class,
                () -> new DelimitedTextReader().read("flat.csv", new StringReader(text)));

        assertThat(e.problem()).contains("no value column");
    }

    @Test
    @ReadsSharedFolder
    void theRealCaptureWithABadCalibrationIsReportedAsTurningNotAsLackingAValueColumn() {
        // resolved outside the lambda: a skip thrown inside it would be caught as the wrong exception
        Path badCalibration = SharedFolder.referenceFile("diy-spectrometer/Spectrum-20260309--010902.csv");

        ImportException e = catchThrowableOfType(ImportException.class,
                () -> new DelimitedTextReader().read(badCalibration, ReadOptions.defaults()));

        // SOURCES.md §9: a non-monotonic axis from a bad calibration fit; the file first turns at line 27
        // (351.614689 after 351.612659), as ReferenceFilesTest finds through the raw-counts reader
        assertThat(e.line()).isEqualTo(27);
        assertThat(e.problem()).contains("goes up again from 351.612659 nm to 351.614689 nm at line 27")
                .doesNotContain("no value column");
    }
}
