package org.spectralsieve.importers.jcamp;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;
import static org.assertj.core.api.Assertions.within;

import java.io.StringReader;
import org.junit.jupiter.api.Test;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.importers.SpectrumValues;
import org.spectralsieve.importers.SpectrumValuesOptions;
import org.spectralsieve.importers.XUnit;

/** JCAMP-DX blocks read as relative values (illustrative, made-up numbers). */
class JcampValuesReadTest {

    private static SpectrumValues read(String text, SpectrumValuesOptions options) throws ImportException {
        return new JcampReader().readValues(Jdx.SOURCE, new StringReader(text), options);
    }

    /**
     * An absorbance block read as weights keeps its numbers: 1.5 stays 1.5, where a transmittance read
     * gives 10^-1.5 (A = −log10 T, IUPAC Gold Book A00028). Data lines start at line 9 of the text.
     */
    @Test
    void absorbanceOrdinatesAreKeptAsWeights() throws ImportException {
        String text = Jdx.xydata(300, 320, 3, "300 1.5 0.75 0.25");

        SpectrumValues s = read(text, SpectrumValuesOptions.defaults());

        assertThat(s.wavelengthsNm()).containsExactly(300.0, 310.0, 320.0);
        assertThat(s.values()).containsExactly(1.5, 0.75, 0.25);
        assertThat(s.valueColumn()).isEqualTo("##XYDATA");
        assertThat(s.warnings()).anySatisfy(w -> assertThat(w).contains("absorbance is not converted"));
        assertThat(Jdx.read(text).transmittanceFractions()[0]).isCloseTo(Math.pow(10, -1.5), within(1e-15));
    }

    @Test
    void anyYUnitsAreAcceptedAndKeptInMetadata() throws ImportException {
        String text = Jdx.text("##XUNITS= NANOMETERS", "##YUNITS= RELATIVE IRRADIANCE", "##XYPOINTS= (XY..XY)",
                "400, 10", "410, 30", "420, 5");

        SpectrumValues s = read(text, SpectrumValuesOptions.defaults());

        assertThat(s.values()).containsExactly(10.0, 30.0, 5.0);
        assertThat(s.metadata()).containsEntry("yunits", "RELATIVE IRRADIANCE");
    }

    @Test
    void missingXUnitsAreTakenFromTheOptions() throws ImportException {
        String text = Jdx.text("##YUNITS= ARBITRARY UNITS", "##XYPOINTS= (XY..XY)", "0.40, 10", "0.41, 30");

        SpectrumValues s = read(text, SpectrumValuesOptions.defaults().xUnit(XUnit.MICROMETRE));

        assertThat(s.wavelengthsNm()[1]).isCloseTo(410.0, within(1e-9)); // 1 µm = 1000 nm (SI)
        ImportException e = catchThrowableOfType(ImportException.class, () -> read(text, SpectrumValuesOptions.defaults()));
        assertThat(e.field()).isEqualTo("##XUNITS");
    }

    @Test
    void aNegativeOrdinateIsRefusedNamingItsLine() {
        String text = Jdx.text("##XUNITS= NANOMETERS", "##YUNITS= COUNTS", "##XYPOINTS= (XY..XY)",
                "400, 10", "410, -3", "420, 5");

        ImportException e = catchThrowableOfType(ImportException.class, () -> read(text, SpectrumValuesOptions.defaults()));

        assertThat(e.line()).isEqualTo(7);
        assertThat(e.field()).isEqualTo("##XYPOINTS");
        assertThat(e.problem()).contains("negative value -3.0");
    }

    @Test
    void descendingBlocksAreReversedKeepingTheirLines() {
        String text = Jdx.text("##XUNITS= NANOMETERS", "##YUNITS= COUNTS", "##XYPOINTS= (XY..XY)",
                "420, 5", "410, 0", "400, -1");

        ImportException e = catchThrowableOfType(ImportException.class, () -> read(text, SpectrumValuesOptions.defaults()));

        assertThat(e.line()).isEqualTo(8); // 400 nm is the first point after reversal, written on line 8
    }

    @Test
    void allZeroOrdinatesAreRefused() {
        String text = Jdx.text("##XUNITS= NANOMETERS", "##YUNITS= COUNTS", "##XYPOINTS= (XY..XY)", "400, 0", "410, 0");

        ImportException e = catchThrowableOfType(ImportException.class, () -> read(text, SpectrumValuesOptions.defaults()));

        assertThat(e.problem()).contains("every value is 0");
    }
}
