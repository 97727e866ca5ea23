package org.spectralsieve.importers;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.catchThrowableOfType;

import java.io.StringReader;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

/** Inputs are small illustrative files for an invented sheet stock; the numbers are made up. */
class DelimitedTextReaderTest {

    private final DelimitedTextReader reader = new DelimitedTextReader();

    private ParsedSpectrum read(String text) throws ImportException {
        return reader.read("acrylic-3mm.csv", new StringReader(text));
    }

    private ParsedSpectrum read(String text, ReadOptions options) throws ImportException {
        return reader.read("acrylic-3mm.csv", new StringReader(text), options);
    }

    @ParameterizedTest
    @ValueSource(strings = {",", ";", "\t", " ", "   ", " \t "})
    void eachDelimiterSplitsHeaderAndRows(String delimiter) throws ImportException {
        String text = String.join("\n", "wavelength_nm" + delimiter + "transmittance",
                "300" + delimiter + "0.25", "310" + delimiter + "<0.001", "");

        ParsedSpectrum s = read(text);

        assertThat(s.wavelengthsNm()).containsExactly(300.0, 310.0);
        assertThat(s.values()).containsExactly(0.25, 0.001);
        assertThat(s.upperBounds()).containsExactly(false, true);
    }

    @ParameterizedTest
    @CsvSource(delimiter = '|', value = {
            "wavelength_nm,transmittance        | TRANSMITTANCE_FRACTION | NANOMETRE",
            "Wavelength,Transmittance_Percent   | TRANSMITTANCE_PERCENT  | NANOMETRE",
            "nm,%T                              | TRANSMITTANCE_PERCENT  | NANOMETRE",
            "lambda,T%                          | TRANSMITTANCE_PERCENT  | NANOMETRE",
            "Wavelength (nm),Transmittance(%)   | TRANSMITTANCE_PERCENT  | NANOMETRE",
            "wavelength,absorbance              | ABSORBANCE             | NANOMETRE",
            "wavelength,OD                      | ABSORBANCE             | NANOMETRE",
            "wavelength,optical density         | ABSORBANCE             | NANOMETRE",
            "wavelength_um,transmittance        | TRANSMITTANCE_FRACTION | MICROMETRE",
            "µm,transmittance                   | TRANSMITTANCE_FRACTION | MICROMETRE",
            "angstrom,transmittance             | TRANSMITTANCE_FRACTION | ANGSTROM"})
    void headerNamesDecideKindAndUnit(String header, YKind kind, XUnit unit) throws ImportException {
        ParsedSpectrum s = read(header + "\n1,0.5\n2,0.6\n");

        assertThat(s.yKind()).isEqualTo(kind);
        assertThat(s.xUnit()).isEqualTo(unit);
        assertThat(s.warnings()).isEmpty();
    }

    // 1 µm = 1000 nm (SI prefixes, SI Brochure 9th ed., Table 7); 1 Å = 0.1 nm (SI Brochure 8th ed., Table 8; from memory)
    @Test
    void micrometreColumnIsConvertedToNanometres() throws ImportException {
        ParsedSpectrum s = read("wavelength_um,transmittance\n0.365,0.5\n0.405,0.6\n");

        assertThat(s.wavelengthsNm()).containsExactly(365.0, 405.0);
    }

    @Test
    void angstromColumnIsConvertedToNanometres() throws ImportException {
        ParsedSpectrum s = read("angstrom,absorbance\n3650,1\n4050,2\n");

        assertThat(s.wavelengthsNm()).containsExactly(365.0, 405.0);
    }

    // Absorbance A = −log10 T (ANSI Z80.3-2001 §3.2, REFERENCE.md §6): A = 2 → T = 0.01.
    @Test
    void absorbanceColumnConvertsToFractions() throws ImportException {
        ParsedSpectrum s = read("wavelength,absorbance\n365,2\n405,0\n");

        assertThat(s.transmittanceFractions()).containsExactly(0.01, 1.0);
    }

    @Test
    void percentColumnConvertsToFractions() throws ImportException {
        ParsedSpectrum s = read("wavelength,%T\n365,50\n405,91\n");

        assertThat(s.transmittanceFractions()).containsExactly(0.5, 0.91);
    }

    @Test
    void quotedHeaderNamesAndFieldsAreUnquoted() throws ImportException {
        ParsedSpectrum s = read("\"Wavelength (nm)\";\"Transmittance (%)\"\n\"300\";\"7.5\"\n400;91\n");

        assertThat(s.yKind()).isEqualTo(YKind.TRANSMITTANCE_PERCENT);
        assertThat(s.values()).containsExactly(7.5, 91.0);
    }

    @Test
    void commentsOfKeyValueFormBecomeMetadataInOrder() throws ImportException {
        ParsedSpectrum s = read("""
                # Spectral Sieve curve v1
                # Thickness_mm: 3
                # geometry = regular
                # provenance: modelled
                # detection_limit: 0.001
                # a plain remark without a key
                # note: illustrative: invented workshop stock
                wavelength_nm,transmittance
                300.0,<0.001
                400.0,0.9
                """);

        assertThat(s.metadata()).containsExactly(Map.entry("thickness_mm", "3"), Map.entry("geometry", "regular"),
                Map.entry("provenance", "modelled"), Map.entry("detection_limit", "0.001"),
                Map.entry("note", "illustrative: invented workshop stock"));
        assertThat(s.warnings()).isEmpty();
    }

    @Test
    void repeatedMetadataKeyKeepsTheLaterValueWithAWarning() throws ImportException {
        ParsedSpectrum s = read("# thickness_mm: 3\n# thickness_mm: 4\nnm,transmittance\n1,0.1\n2,0.2\n");

        assertThat(s.metadata()).containsEntry("thickness_mm", "4");
        assertThat(s.warnings()).singleElement().asString().contains("line 2", "thickness_mm");
    }

    @Test
    void blankLinesAndWindowsLineEndingsAreIgnored() throws ImportException {
        ParsedSpectrum s = read("\uFEFF\r\nwavelength,transmittance\r\n\r\n300,0.1\r\n   \r\n400,0.2\r\n");

        assertThat(s.wavelengthsNm()).containsExactly(300.0, 400.0);
    }

    @Test
    void withoutHeaderAFractionRangeIsGuessedAsFractionWithAWarning() throws ImportException {
        ParsedSpectrum s = read("300,0.1\n400,0.9\n");

        assertThat(s.yKind()).isEqualTo(YKind.TRANSMITTANCE_FRACTION);
        assertThat(s.warnings()).singleElement().asString().contains("guessed", "TRANSMITTANCE_FRACTION");
    }

    @Test
    void withoutHeaderValuesAboveOnePointFiveAreGuessedAsPercentWithAWarning() throws ImportException {
        ParsedSpectrum s = read("300 7.2\n400 91.0\n");

        assertThat(s.yKind()).isEqualTo(YKind.TRANSMITTANCE_PERCENT);
        assertThat(s.warnings()).singleElement().asString().contains("guessed", "TRANSMITTANCE_PERCENT");
    }

    @Test
    void percentLookingValuesUnderABareTransmittanceHeaderAreReadAsPercentWithAWarning() throws ImportException {
        ParsedSpectrum s = read("wavelength,transmittance\n300,7.2\n400,91.0\n");

        assertThat(s.yKind()).isEqualTo(YKind.TRANSMITTANCE_PERCENT);
        assertThat(s.warnings()).singleElement().asString().contains("'transmittance'", "91.0", "looks like percent");
    }

    @Test
    void readOptionsForceTheYKind() throws ImportException {
        ParsedSpectrum s = read("wavelength,absorbance\n300,7.2\n400,91.0\n",
                ReadOptions.defaults().withYKind(YKind.TRANSMITTANCE_PERCENT));

        assertThat(s.yKind()).isEqualTo(YKind.TRANSMITTANCE_PERCENT);
        assertThat(s.transmittanceFractions()[1]).isEqualTo(0.91);
        assertThat(s.warnings()).singleElement().asString().contains("read options");
    }

    @Test
    void unrecognisedExtraColumnsAreIgnoredWithAWarning() throws ImportException {
        ParsedSpectrum s = read("Wavelength,Transmittance,Temperature\n300,0.1,21\n400,0.2,22\n");

        assertThat(s.values()).containsExactly(0.1, 0.2);
        assertThat(s.warnings()).singleElement().asString().contains("Temperature");
    }

    @Test
    void rowCapRefusesOneRowTooMany() {
        ImportException e = catchThrowableOfType(ImportException.class,
                () -> new DelimitedTextReader(3).read("big.csv", new StringReader("nm,od\n1,0\n2,0\n3,0\n4,0\n")));

        assertThat(e.line()).isEqualTo(5);
        assertThat(e.getMessage()).startsWith("big.csv line 5: more than 3 data rows");
    }

    @Test
    void defaultRowCapIsOneMillion() {
        assertThat(DelimitedTextReader.MAX_ROWS).isEqualTo(1_000_000);
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', quoteCharacter = '"', value = {
            // case                | file text (\n = newline)                          | line | field           | message
            "non-numeric value     | wavelength_nm,transmittance\\n300,0.1\\n310,abc  | 3    | transmittance   | acrylic-3mm.csv line 3, field 'transmittance': not a number: 'abc'",
            "NaN                   | wavelength_nm,transmittance\\n300,NaN\\n310,0.1  | 2    | transmittance   | acrylic-3mm.csv line 2, field 'transmittance': not a finite number: 'NaN'",
            "Infinity in x         | wavelength_nm,transmittance\\nInfinity,0.1      | 2    | wavelength_nm   | acrylic-3mm.csv line 2, field 'wavelength_nm': not a finite number: 'Infinity'",
            "overflow              | wavelength_nm,transmittance\\n300,1e999         | 2    | transmittance   | acrylic-3mm.csv line 2, field 'transmittance': not a finite number: '1e999'",
            "empty field           | wavelength_nm,transmittance\\n300,\\n310,0.1     | 2    | transmittance   | acrylic-3mm.csv line 2, field 'transmittance': empty",
            "missing column        | wavelength_nm,transmittance\\n300,0.1\\n310      | 3    | transmittance   | acrylic-3mm.csv line 3, field 'transmittance': missing: expected 2 columns separated by ',', found 1",
            "extra column          | wavelength_nm,transmittance\\n300,0.1,7         | 2    | column 3        | acrylic-3mm.csv line 2, field 'column 3': unexpected: expected 2 columns separated by ',', found 3",
            "x turns back          | # c\\nnm,transmittance\\n405,0.1\\n\\n406,0.2\\n404,0.3 | 6 | nm       | acrylic-3mm.csv line 6, field 'nm': wavelengths are not monotonic: the order changes direction at line 6 (404.0 nm after 406.0 nm)",
            "duplicate x           | nm,transmittance\\n405,0.1\\n405,0.2             | 3    | nm              | acrylic-3mm.csv line 3, field 'nm': duplicate wavelength: line 3 (405.0 nm) repeats line 2 (405.0 nm)",
            "no wavelength column  | colour,transmittance\\n1,0.1                    | 1    | colour          | acrylic-3mm.csv line 1, field 'colour': no wavelength column in header [colour, transmittance]; expected one of [wavelength_nm, wavelength, nm,",
            "no value column       | wavelength,V\\n1,0.1                            | 1    |                 | acrylic-3mm.csv line 1: no value column in header [wavelength, V]; expected one of [transmittance, transmittance_percent,",
            "single row            | nm,transmittance\\n405,0.1                      | 2    |                 | acrylic-3mm.csv line 2: only 1 data row",
            "no data rows          | # thickness_mm: 3\\nwavelength_nm,transmittance  | 0    |                 | acrylic-3mm.csv: no data rows",
            "empty file            | \\n  \\n                                         | 0    |                 | acrylic-3mm.csv: empty file",
    })
    void malformedInputIsRefusedNamingFileLineAndField(String name, String text, int line, String field,
            String message) {
        ImportException e = catchThrowableOfType(ImportException.class, () -> read(text.replace("\\n", "\n")));

        assertThat(e).as(name).isNotNull();
        assertThat(e.getMessage()).startsWith(message);
        assertThat(e.sourceName()).isEqualTo("acrylic-3mm.csv");
        assertThat(e.line()).isEqualTo(line);
        assertThat(e.field()).isEqualTo(field);
    }

    @Test
    void aCompletelyEmptyReaderIsAnEmptyFile() {
        assertThatThrownBy(() -> read("")).isInstanceOf(ImportException.class)
                .hasMessage("acrylic-3mm.csv: empty file");
    }
}
