package org.spectralsieve.importers;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;
import static org.assertj.core.api.Assertions.within;

import java.io.StringReader;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** Hand-made illustrative files (an invented workshop's film offcuts); the numbers are made up. */
class DelimitedFormatsTest {

    private final DelimitedTextReader reader = new DelimitedTextReader();

    private ParsedSpectrum read(String text, ReadOptions options) throws ImportException {
        return reader.read("offcut.txt", new StringReader(text.replace("\\n", "\n").replace("\\t", "\t")), options);
    }

    // Unit conversions: 1 µm = 1000 nm, 1 Å = 0.1 nm (SI Brochure, 9th ed. Table 7; 8th ed. Table 8, from memory);
    // λ[nm] = 10^7 / ν̃[cm⁻¹] (definition of wavenumber, 1 cm = 10^7 nm).
    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', quoteCharacter = '"', value = {
            // case                        | file text                                                       | first nm | first y | kind                  | unit
            "comma, point, nm, %T           | wavelength (nm),T (%)\\n365.5,12.3\\n405,80                      | 365.5 | 12.3  | TRANSMITTANCE_PERCENT  | NANOMETRE",
            "semicolon, point, %T           | nm;%T\\n365.5;12.3\\n405;80                                      | 365.5 | 12.3  | TRANSMITTANCE_PERCENT  | NANOMETRE",
            "semicolon, decimal comma       | Wavelength [nm];Transmittance (%)\\n365,5;12,3\\n405,0;80,0       | 365.5 | 12.3  | TRANSMITTANCE_PERCENT  | NANOMETRE",
            "tab, decimal comma, Abs        | nm\\tAbs\\n365,5\\t1,5\\n405\\t0,25                               | 365.5 | 1.5   | ABSORBANCE             | NANOMETRE",
            "blanks, decimal comma, A       | w.length A\\n365,5 1,5\\n405 0,25                                 | 365.5 | 1.5   | ABSORBANCE             | NANOMETRE",
            "mixed tab/space, µm, fraction  | µm\\tT (fraction)\\n0.3655  0.123\\n0.405\\t0.8                    | 365.5 | 0.123 | TRANSMITTANCE_FRACTION | MICROMETRE",
            "blank header with units        | Wavelength [nm] Transmittance (%)\\n365.5 12.3\\n405 80            | 365.5 | 12.3  | TRANSMITTANCE_PERCENT  | NANOMETRE",
            "comma, Å, OD                   | Wavelength (Å),OD\\n3655,2\\n4050,1                               | 365.5 | 2     | ABSORBANCE             | ANGSTROM",
            "no header, blanks, percent     | 365.5   12.3\\n405   80                                          | 365.5 | 12.3  | TRANSMITTANCE_PERCENT  | NANOMETRE",
            "no header, semicolon, comma    | 365,5;0,123\\n405;0,8                                             | 365.5 | 0.123 | TRANSMITTANCE_FRACTION | NANOMETRE",
            "cm-1 ascending is reversed     | wavenumber (cm-1),transmittance\\n20000,0.5\\n25000,0.1            | 400.0 | 0.1   | TRANSMITTANCE_FRACTION | WAVENUMBER_PER_CM",
            "1/cm as a bare header          | 1/cm,%T\\n25000,10\\n20000,50                                     | 400.0 | 10    | TRANSMITTANCE_PERCENT  | WAVENUMBER_PER_CM"})
    void delimiterDecimalUnitAndKindAreDetected(String name, String text, double firstNm, double firstY, YKind kind,
            XUnit unit) throws ImportException {
        ParsedSpectrum s = read(text, ReadOptions.defaults());

        assertThat(s.wavelengthsNm()[0]).as(name).isCloseTo(firstNm, within(1e-9));
        assertThat(s.values()[0]).as(name).isEqualTo(firstY);
        assertThat(s.yKind()).as(name).isEqualTo(kind);
        assertThat(s.xUnit()).as(name).isEqualTo(unit);
    }

    @Test
    void uniformWavenumberGridBecomesNonUniformWavelengthsWithoutInventedPoints() throws ImportException {
        // 10^7/25000 = 400 nm, 10^7/20000 = 500 nm, 10^7/15000 = 666.67 nm: steps of 100 nm then 166.67 nm
        ParsedSpectrum s = read("cm-1,A\n15000,0.1\n20000,0.2\n25000,0.3\n", ReadOptions.defaults());

        assertThat(s.wavelengthsNm()).containsExactly(400.0, 500.0, 1e7 / 15000);
        assertThat(s.values()).containsExactly(0.3, 0.2, 0.1);
        assertThat(s.warnings()).anyMatch(w -> w.contains("reversed into increasing order"));
    }

    @Test
    void descendingNanometreFileIsReversedWithANote() throws ImportException {
        ParsedSpectrum s = read("nm,T\n700,0.9\n600,0.8\n500,0.7\n", ReadOptions.defaults());

        assertThat(s.wavelengthsNm()).containsExactly(500, 600, 700);
        assertThat(s.values()).containsExactly(0.7, 0.8, 0.9);
        assertThat(s.warnings()).singleElement().asString().contains("from 700.0 to 500.0 nm", "reversed");
    }

    @Test
    void decimalMarkCanBeForcedWhenTheDataCannotTell() throws ImportException {
        // "1,5 2,5" could only be blank-separated with decimal commas; forcing POINT makes it a refusal instead
        ImportException e = catchThrowableOfType(ImportException.class,
                () -> read("nm T\n365,5 1,5\n405 2\n", ReadOptions.defaults().decimalMark(DecimalMark.POINT)));
        ParsedSpectrum s = read("nm;T\n365;0,5\n405;0,75\n", ReadOptions.defaults().decimalMark(DecimalMark.COMMA));

        assertThat(e.line()).isEqualTo(2);
        assertThat(e.problem()).contains("not a number: '365,5'");
        assertThat(s.values()).containsExactly(0.5, 0.75);
        assertThat(s.metadata()).containsEntry("decimal_mark", "comma");
    }

    @Test
    void instrumentPreambleBeforeTheHeaderIsSkippedAndItsKeyValueLinesKept() throws ImportException {
        ParsedSpectrum s = read("""
                Illustrative bench rig export
                Operator: invented workshop
                Integration time;100
                Wavelength (nm),Abs
                365,1.2
                405,0.4
                """, ReadOptions.defaults());

        assertThat(s.metadata()).containsExactly(Map.entry("operator", "invented workshop"),
                Map.entry("integration time", "100"));
        assertThat(s.warnings()).anyMatch(w -> w.startsWith("lines 1–3 before the table read as preamble (2 kept"));
        assertThat(s.yKind()).isEqualTo(YKind.ABSORBANCE);
    }

    @Test
    void fractionLabelWithPercentValuesIsReadAsPercentAndTheContradictionNamed() throws ImportException {
        ParsedSpectrum s = read("nm,T (fraction)\n365,12\n405,80\n", ReadOptions.defaults());

        assertThat(s.yKind()).isEqualTo(YKind.TRANSMITTANCE_PERCENT);
        assertThat(s.warnings()).singleElement().asString().contains("labelled as a fraction", "contradicts", "80.0");
    }

    @Test
    void duplicateWavelengthsAreRefusedUnlessMergingIsAsked() throws ImportException {
        String text = "nm,T\n365,0.2\n405,0.4\n405,0.6\n450,0.8\n";

        ImportException e = catchThrowableOfType(ImportException.class, () -> read(text, ReadOptions.defaults()));
        ParsedSpectrum merged = read(text, ReadOptions.defaults().mergeDuplicates(true));

        assertThat(e.line()).isEqualTo(4);
        assertThat(e.problem()).startsWith("duplicate wavelength: line 4 (405.0 nm) repeats line 3 (405.0 nm)");
        assertThat(merged.wavelengthsNm()).containsExactly(365, 405, 450);
        assertThat(merged.values()[1]).isCloseTo(0.5, within(1e-15));
        assertThat(merged.warnings()).anyMatch(w -> w.contains("1 rows with a repeated wavelength merged"));
    }

    @Test
    void nonMonotonicWavelengthsAreRefusedNamingEveryTurningLine() {
        ImportException e = catchThrowableOfType(ImportException.class,
                () -> read("nm,T\n300,0.1\n310,0.1\n305,0.1\n301,0.1\n320,0.1\n", ReadOptions.defaults()));

        assertThat(e.line()).isEqualTo(4);
        assertThat(e.problem()).contains("line 4 (305.0 nm after 310.0 nm)", "line 6 (320.0 nm after 301.0 nm)");
    }

    @Test
    void sharedWavelengthReplicatesAverageAndSeparate() throws ImportException {
        String text = "wavelength,T.1,T.2\n365,0.2,0.4\n405,0.6,0.8\n";

        ParsedSpectrum first = read(text, ReadOptions.defaults());
        ParsedSpectrum mean = read(text, ReadOptions.defaults().replicates(Replicates.MEAN));
        var separate = reader.readAll("offcut.txt", new StringReader(text),
                ReadOptions.defaults().replicates(Replicates.SEPARATE));

        assertThat(first.values()).containsExactly(0.2, 0.6);
        assertThat(first.warnings()).anyMatch(w -> w.contains("not read: [wavelength/T.2]"));
        assertThat(mean.values()).containsExactly(0.30000000000000004, 0.7);
        assertThat(mean.metadata()).containsEntry("replicates", "mean of 2: T.1, T.2");
        assertThat(separate).extracting(p -> p.values()[0]).containsExactly(0.2, 0.4);
    }

    @Test
    void wavelengthUnitTheReaderCannotConvertIsRefusedAtTheHeader() {
        ImportException e = catchThrowableOfType(ImportException.class,
                () -> read("Wavelength (Hz),T\n1,0.5\n2,0.5\n", ReadOptions.defaults()));

        assertThat(e.line()).isEqualTo(1);
        assertThat(e.field()).isEqualTo("Wavelength (Hz)");
        assertThat(e.problem()).contains("unknown wavelength unit 'hz'");
    }
}
