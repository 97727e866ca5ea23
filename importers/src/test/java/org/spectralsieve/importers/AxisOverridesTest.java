package org.spectralsieve.importers;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.StringReader;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;
import org.spectralsieve.importers.jcamp.JcampOptions;
import org.spectralsieve.importers.jcamp.JcampReader;

/**
 * The user corrects what a file gets wrong: the wavelength unit, the value and wavelength columns, the
 * y kind and the decimal mark. Generated files (illustrative values); unit factors 1 µm = 1000 nm and
 * λ[nm] = 10⁷ / ν̃[cm⁻¹] are SI definitions.
 */
class AxisOverridesTest {

    private final DelimitedTextReader reader = new DelimitedTextReader();

    private ParsedSpectrum read(String text, ReadOptions options) throws ImportException {
        return reader.read("made.csv", new StringReader(text), options);
    }

    @Test
    void aForcedXUnitReadsMicrometresLabelledAsNanometres() throws ImportException {
        String file = "wavelength_nm,transmittance\n0.30,0.10\n0.35,0.50\n0.40,0.90\n";

        ParsedSpectrum s = read(file, ReadOptions.defaults().xUnit(XUnit.MICROMETRE));

        assertThat(s.wavelengthsNm()).containsExactly(300.0, 350.0, 400.0);
        assertThat(s.xUnit()).isEqualTo(XUnit.MICROMETRE);
        assertThat(s.warnings()).anyMatch(w -> w.contains("read in MICROMETRE") && w.contains("suggests NANOMETRE"));
    }

    @Test
    void aForcedXUnitAcceptsAHeaderUnitTheReaderDoesNotKnow() throws ImportException {
        String file = "wavelength (nmm),transmittance\n300,0.10\n400,0.90\n";

        assertThatThrownBy(() -> read(file, ReadOptions.defaults())).isInstanceOf(ImportException.class)
                .hasMessageContaining("line 1").hasMessageContaining("set the x unit");
        ParsedSpectrum s = read(file, ReadOptions.defaults().xUnit(XUnit.NANOMETRE));
        assertThat(s.wavelengthsNm()).containsExactly(300.0, 400.0);
    }

    @Test
    void chosenColumnsReadAFileWhoseHeaderNamesNoWavelength() throws ImportException {
        // a detector export: pixel, an unnamed wavelength column, a value column named after the sample
        String file = "pixel;lambda_cal;sample 7\n0;400.5;91.2\n1;350.0;55.0\n2;300.25;12.5\n";

        assertThatThrownBy(() -> read(file, ReadOptions.defaults())).isInstanceOf(ImportException.class);
        ParsedSpectrum s = read(file, ReadOptions.defaults().columns(OptionalInt.of(2), OptionalInt.of(3)));

        assertThat(s.wavelengthsNm()).containsExactly(300.25, 350.0, 400.5);
        assertThat(s.values()).containsExactly(12.5, 55.0, 91.2);
        assertThat(s.yKind()).isEqualTo(YKind.TRANSMITTANCE_PERCENT);
        assertThat(s.warnings()).anyMatch(w -> w.contains("wavelength = column 2 ('lambda_cal')")
                && w.contains("values = column 3 ('sample 7')"));
    }

    @Test
    void aChosenValueColumnReplacesTheFirstOneTheHeaderNames() throws ImportException {
        String file = "wavelength,transmittance,absorbance\n300,0.10,1.0\n400,0.90,0.0457\n";

        ParsedSpectrum s = read(file, ReadOptions.defaults().columns(OptionalInt.empty(), OptionalInt.of(3)));

        assertThat(s.yKind()).isEqualTo(YKind.ABSORBANCE);
        assertThat(s.values()).containsExactly(1.0, 0.0457);
    }

    @Test
    void chosenColumnsWorkWithoutAHeader() throws ImportException {
        String file = "0.10,300\n0.90,400\n";

        ParsedSpectrum s = read(file, ReadOptions.defaults().columns(OptionalInt.of(2), OptionalInt.of(1)));

        assertThat(s.wavelengthsNm()).containsExactly(300.0, 400.0);
        assertThat(s.values()).containsExactly(0.10, 0.90);
    }

    @Test
    void aColumnBeyondTheFileIsRefusedNamingTheOption() {
        String file = "wavelength,transmittance\n300,0.10\n400,0.90\n";

        assertThatThrownBy(() -> read(file, ReadOptions.defaults().columns(OptionalInt.empty(), OptionalInt.of(5))))
                .isInstanceOf(ImportException.class).hasMessageContaining("yColumn is 5")
                .hasMessageContaining("only 2 columns");
    }

    @Test
    void aForcedYKindReadsPercentUnderAFractionHeader() throws ImportException {
        // values 0.5–1.2 under "transmittance" look like fractions; the user knows they are percent
        String file = "wavelength,transmittance\n300,0.5\n400,1.2\n";

        ParsedSpectrum s = read(file, ReadOptions.defaults().withYKind(YKind.TRANSMITTANCE_PERCENT));

        assertThat(s.transmittanceFractions()).containsExactly(0.005, 0.012);
        assertThat(s.warnings()).anyMatch(w -> w.contains("set to TRANSMITTANCE_PERCENT by the read options"));
    }

    @Test
    void aForcedDecimalCommaReadsAFileTheDataCannotTellAbout() throws ImportException {
        // blank-separated "300,5 0,25": a comma could be a delimiter or a decimal mark
        String file = "wavelength transmittance\n300,5 0,25\n400,5 0,75\n";

        ParsedSpectrum s = read(file, ReadOptions.defaults().decimalMark(DecimalMark.COMMA));

        assertThat(s.wavelengthsNm()).containsExactly(300.5, 400.5);
        assertThat(s.values()).containsExactly(0.25, 0.75);
    }

    @Test
    void aForcedXUnitOverridesJcampXunits() throws ImportException {
        String file = """
                ##TITLE=made
                ##JCAMP-DX=4.24
                ##DATA TYPE=UV/VIS SPECTRUM
                ##XUNITS=1/CM
                ##YUNITS=ABSORBANCE
                ##XYPOINTS=(XY..XY)
                300,1.0
                400,0.5
                ##END=
                """;
        JcampReader jcamp = new JcampReader();

        ParsedSpectrum plain = jcamp.read("made.jdx", new StringReader(file));
        ParsedSpectrum forced = jcamp.read("made.jdx", new StringReader(file),
                new JcampOptions(ReadOptions.defaults().xUnit(XUnit.NANOMETRE), OptionalInt.empty()));

        assertThat(plain.wavelengthsNm()[0]).isEqualTo(1e7 / 400); // λ = 10⁷/ν̃, reversed into increasing order
        assertThat(plain.warnings()).anyMatch(w -> w.contains("contradicts") && w.contains("xUnit=nm")
                && w.contains("UV/VIS SPECTRUM"));
        assertThat(forced.wavelengthsNm()).containsExactly(300.0, 400.0);
        assertThat(forced.warnings()).anyMatch(w -> w.contains("XUNITS=1/CM overridden"));
    }
}
