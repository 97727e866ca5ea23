package org.spectralsieve.importers;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;

import java.io.StringReader;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.spectralsieve.importers.jcamp.JcampReader;
import org.spectralsieve.importers.jcamp.JcampWriter;

/**
 * The project's own files keep a curve's absorbance standard deviations: the CSV as a column, JCAMP-DX in a
 * private label, both read back bit for bit, unknown points (NaN) included. Values are illustrative.
 */
class UncertaintyRoundTripTest {

    private static final double[] NM = {300, 310, 320, 330};
    private static final double[] T = {0.0005, 0.12, 0.5, 0.9};
    private static final boolean[] BELOW = {true, false, false, false};
    private static final double[] SD = {Double.NaN, 0.0123456789, 0.004, 0.0021};

    @Test
    void theCurveCsvWritesAnAbsorbanceSdColumnThatReadsBackExactly() throws ImportException {
        String csv = DelimitedTextWriter.write(Map.of("thickness_mm", "3.0"), NM, T, BELOW, SD);

        ParsedSpectrum back = new DelimitedTextReader().read("fernhollow-3mm.csv", new StringReader(csv));

        assertThat(csv).contains("wavelength_nm,transmittance,absorbance_sd\n").contains("300.0,<5.0E-4,\n");
        assertThat(back.values()).containsExactly(T);
        assertThat(back.upperBounds()).containsExactly(BELOW);
        assertThat(back.standardDeviationKind()).isEqualTo(YKind.ABSORBANCE);
        assertThat(back.standardDeviations()).containsExactly(SD);
        assertThat(back.warnings()).isEmpty();
    }

    @Test
    void aCurveWithoutUncertaintyWritesTheTwoColumnFileAsBefore() {
        String csv = DelimitedTextWriter.write(Map.of(), NM, T, BELOW, (double[]) null);

        assertThat(csv).contains("wavelength_nm,transmittance\n").doesNotContain("absorbance_sd");
    }

    @Test
    void anSdColumnNamedInAbsorbanceIsReadInAbsorbanceWhateverTheValues() throws ImportException {
        String text = "wavelength,transmittance (%),sd (A)\n300,40,0.01\n310,50,0.02\n";

        ParsedSpectrum s = new DelimitedTextReader().read("fernhollow.csv", new StringReader(text));

        assertThat(s.yKind()).isEqualTo(YKind.TRANSMITTANCE_PERCENT);
        assertThat(s.standardDeviationKind()).isEqualTo(YKind.ABSORBANCE);
    }

    @Test
    void jcampDxCarriesTheStandardDeviationsInAPrivateLabel() throws ImportException {
        String jdx = JcampWriter.write(Map.of("TITLE", "Fernhollow sheet (illustrative)"), NM, T, BELOW, SD);

        ParsedSpectrum back = new JcampReader().read("fernhollow.jdx", new StringReader(jdx));

        assertThat(jdx).contains("##$SIEVE ABSORBANCE SD=").contains("? 0.0123456789 0.004 0.0021");
        assertThat(back.values()).containsExactly(T);
        assertThat(back.standardDeviationKind()).isEqualTo(YKind.ABSORBANCE);
        assertThat(back.standardDeviations()).containsExactly(SD);
        assertThat(back.metadata()).doesNotContainKey("$sieve absorbance sd");
    }

    @Test
    void aJcampSdLabelWithTooFewValuesIsRefusedNamingTheLabel() {
        String jdx = JcampWriter.write(Map.of(), NM, T, BELOW, SD).replace("? 0.0123456789", "?");

        ImportException e = catchThrowableOfType(ImportException.class,
                () -> new JcampReader().read("fernhollow.jdx", new StringReader(jdx)));

        assertThat(e.getMessage()).contains("SIEVE ABSORBANCE SD").contains("3 values for 4 points");
    }
}
