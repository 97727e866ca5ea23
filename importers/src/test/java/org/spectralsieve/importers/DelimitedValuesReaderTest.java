package org.spectralsieve.importers;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;
import static org.assertj.core.api.Assertions.within;

import java.io.StringReader;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Relative spectra (source power, response weights) read from delimited text. Inputs are small
 * illustrative files of the invented Fernhollow Print &amp; Cure Workshop's bench lamp and resist; the
 * numbers are made up.
 */
class DelimitedValuesReaderTest {

    private static final String SOURCE = "bench-lamp.csv";
    private final DelimitedValuesReader reader = new DelimitedValuesReader();

    private SpectrumValues read(String text) throws ImportException {
        return read(text, SpectrumValuesOptions.defaults());
    }

    private SpectrumValues read(String text, SpectrumValuesOptions options) throws ImportException {
        return reader.read(SOURCE, new StringReader(text), options);
    }

    private ImportException refused(String text, SpectrumValuesOptions options) {
        return catchThrowableOfType(ImportException.class, () -> read(text, options));
    }

    private ImportException refused(String text) {
        return refused(text, SpectrumValuesOptions.defaults());
    }

    @Test
    void valueColumnOfAnyNameIsReadExactlyAsWritten() throws ImportException {
        SpectrumValues s = read("# instrument: bench spectrometer\nwavelength_nm,relative power\n360,0.25\n365,1\n370,0.125\n");

        assertThat(s.wavelengthsNm()).containsExactly(360.0, 365.0, 370.0);
        assertThat(s.values()).containsExactly(0.25, 1.0, 0.125);
        assertThat(s.valueColumn()).isEqualTo("relative power");
        assertThat(s.xUnit()).isEqualTo(XUnit.NANOMETRE);
        assertThat(s.metadata()).containsEntry("instrument", "bench spectrometer");
        assertThat(s.warnings()).isEmpty();
    }

    /** A relative spectrum is not a transmittance: values far above 1.5 stay as written (no %T guess). */
    @Test
    void largeValuesAreNotReadAsPercent() throws ImportException {
        SpectrumValues s = read("wavelength,counts\n400,1200\n401,64000\n");

        assertThat(s.values()).containsExactly(1200.0, 64000.0);
    }

    /**
     * A photoinitiator's absorbance is its weight: 2.0 stays 2.0. Read as a transmittance it would have
     * become 10^-2 = 0.01 (A = −log10 T, IUPAC Gold Book A00028); that must not happen here.
     */
    @Test
    void anAbsorbanceColumnIsNotConvertedToTransmittance() throws ImportException {
        SpectrumValues s = read("wavelength_nm,absorbance\n350,2.0\n400,0.5\n");

        assertThat(s.values()).containsExactly(2.0, 0.5);
        assertThat(s.warnings()).anySatisfy(w -> assertThat(w).contains("absorbance is not converted"));
    }

    /** 1 µm = 1000 nm (SI Brochure, 9th ed., prefixes): the header's unit converts the wavelengths. */
    @Test
    void wavelengthUnitComesFromTheHeader() throws ImportException {
        SpectrumValues s = read("Wavelength (µm);Irradiance\n0,3;0,5\n0,4;1,5\n");

        assertThat(s.xUnit()).isEqualTo(XUnit.MICROMETRE);
        assertThat(s.wavelengthsNm()[0]).isCloseTo(300.0, within(1e-9));
        assertThat(s.wavelengthsNm()[1]).isCloseTo(400.0, within(1e-9));
        assertThat(s.values()).containsExactly(0.5, 1.5);
    }

    @Test
    void theXUnitOptionReadsAHeaderlessFileInMicrometres() throws ImportException {
        SpectrumValues s = read("0.3 0.5\n0.4 1.5\n", SpectrumValuesOptions.defaults().xUnit(XUnit.MICROMETRE));

        assertThat(s.wavelengthsNm()[1]).isCloseTo(400.0, within(1e-9));
        assertThat(s.valueColumn()).isEqualTo("column 2");
    }

    @Test
    void aHeaderlessFileIsWavelengthInNanometresThenValue() throws ImportException {
        SpectrumValues s = read("300\t0.5\n310\t0.75\n");

        assertThat(s.wavelengthsNm()).containsExactly(300.0, 310.0);
        assertThat(s.values()).containsExactly(0.5, 0.75);
    }

    @Test
    void descendingWavelengthsAreReversedWithANote() throws ImportException {
        SpectrumValues s = read("nm,weight\n420,0.1\n410,0.2\n400,0.4\n");

        assertThat(s.wavelengthsNm()).containsExactly(400.0, 410.0, 420.0);
        assertThat(s.values()).containsExactly(0.4, 0.2, 0.1);
        assertThat(s.warnings()).anySatisfy(w -> assertThat(w).contains("reversed"));
    }

    @Test
    void decimalCommaIsDetected() throws ImportException {
        SpectrumValues s = read("wavelength;sensitivity\n365,5;0,25\n366,5;0,5\n");

        assertThat(s.wavelengthsNm()).containsExactly(365.5, 366.5);
        assertThat(s.values()).containsExactly(0.25, 0.5);
    }

    @Test
    void severalValueColumnsAreRefusedUntilOneIsChosen() {
        ImportException e = refused("wavelength,extraterrestrial,global,direct\n300,1,2,3\n301,1,2,3\n");

        assertThat(e.line()).isEqualTo(1);
        assertThat(e.getMessage()).contains("3 columns could hold the values").contains("3: global");
    }

    @ParameterizedTest
    @ValueSource(strings = {"global", "GLOBAL", " Global ", "3"})
    void theValueColumnIsChosenByNameOrNumber(String column) throws ImportException {
        SpectrumValues s = read("wavelength,extraterrestrial,global,direct\n300,1,2,3\n301,4,5,6\n",
                SpectrumValuesOptions.defaults().valueColumn(column));

        assertThat(s.values()).containsExactly(2.0, 5.0);
        assertThat(s.valueColumn()).isEqualTo("global");
        assertThat(s.warnings()).anySatisfy(w -> assertThat(w).contains("not read: [extraterrestrial, direct]"));
    }

    @Test
    void anUnknownValueColumnIsRefusedListingTheHeader() {
        ImportException e = refused("wavelength,global\n300,1\n301,2\n",
                SpectrumValuesOptions.defaults().valueColumn("diffuse"));

        assertThat(e.getMessage()).contains("'diffuse'").contains("[wavelength, global]");
    }

    @Test
    void theWavelengthColumnCannotBeTheValueColumn() {
        ImportException e = refused("wavelength,global\n300,1\n301,2\n", SpectrumValuesOptions.defaults().valueColumn("1"));

        assertThat(e.getMessage()).contains("column 1 is the wavelength");
    }

    @Test
    void aNegativeValueIsRefusedNamingLineAndField() {
        ImportException e = refused("wavelength_nm,power\n300,0.1\n301,-0.002\n302,0.3\n");

        assertThat(e.line()).isEqualTo(3);
        assertThat(e.field()).isEqualTo("power");
        assertThat(e.getMessage()).startsWith("bench-lamp.csv line 3, field 'power': negative value -0.002");
    }

    @Test
    void allZeroValuesAreRefused() {
        ImportException e = refused("wavelength_nm,power\n300,0\n301,0.0\n");

        assertThat(e.field()).isEqualTo("power");
        assertThat(e.problem()).contains("every value is 0");
    }

    @Test
    void aBadNumberNamesLineAndField() {
        ImportException e = refused("wavelength_nm,power\n300,0.1\n301,bright\n");

        assertThat(e.line()).isEqualTo(3);
        assertThat(e.field()).isEqualTo("power");
        assertThat(e.problem()).contains("not a number: 'bright'");
    }

    @Test
    void anUpperBoundIsRefused() {
        ImportException e = refused("wavelength_nm,power\n300,0.1\n301,<0.01\n");

        assertThat(e.line()).isEqualTo(3);
        assertThat(e.problem()).contains("upper bound");
    }

    @Test
    void wavelengthsThatTurnAreRefused() {
        ImportException e = refused("wavelength_nm,power\n300,0.1\n310,0.2\n305,0.3\n");

        assertThat(e.line()).isEqualTo(4);
        assertThat(e.problem()).contains("not monotonic");
    }

    @Test
    void oneRowIsTooFew() {
        ImportException e = refused("wavelength_nm,power\n300,0.1\n");

        assertThat(e.line()).isEqualTo(2);
        assertThat(e.problem()).contains("at least 2");
    }

    @Test
    void anEmptyFileIsRefused() {
        assertThat(refused("").problem()).isEqualTo("empty file");
        assertThat(refused("\n  \n").problem()).isEqualTo("empty file");
    }

    @Test
    void repeatedWavelengthsAreRefusedOrMergedAsAsked() throws ImportException {
        String text = "wavelength_nm,power\n300,0.1\n300,0.3\n301,0.5\n";
        assertThat(refused(text).problem()).contains("duplicate wavelength");

        SpectrumValues merged = read(text, SpectrumValuesOptions.defaults().mergeDuplicates(true));
        assertThat(merged.values()[0]).isCloseTo(0.2, within(1e-15));
    }

    @Test
    void aHeaderOfWavelengthsOnlyIsRefused() {
        assertThat(refused("nm,um\n300,0.3\n400,0.4\n").problem()).contains("every column of [nm, um] is a wavelength");
    }

    @Test
    void aHeaderWithoutWavelengthColumnIsRefused() {
        ImportException e = refused("channel,power\n1,0.1\n2,0.2\n");

        assertThat(e.line()).isEqualTo(1);
        assertThat(e.problem()).contains("no wavelength column");
    }
}
