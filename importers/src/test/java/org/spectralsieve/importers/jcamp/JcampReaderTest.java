package org.spectralsieve.importers.jcamp;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.importers.ParsedSpectrum;
import org.spectralsieve.importers.XUnit;
import org.spectralsieve.importers.YKind;

/** Header handling of the reader on small illustrative files (JCAMP-DX 4.24 and 5.01 label rules). */
class JcampReaderTest {

    @Test
    void labelSpellingVariantsAreTheSameLabel() throws ImportException {
        // JCAMP-DX 4.24 (McDonald & Wilks 1988): label names compare without spaces, dashes, slashes,
        // underscores and case; XFACTOR scales the line X, YFACTOR the ordinates
        ParsedSpectrum s = Jdx.read(Jdx.text("## x units = NANOMETERS", "##Y-UNITS= ABSORBANCE", "##X_FACTOR= 0.5",
                "##yfactor= 0.001 $$ milli-absorbance", "##FIRST X= 300", "##Last_X= 301.5", "##N POINTS= 4",
                "##XY DATA= (X++(Y..Y))", "600 100 200", "602 300 400"));

        assertThat(s.wavelengthsNm()).containsExactly(300.0, 300.5, 301.0, 301.5);
        assertThat(s.values()).containsExactly(0.1, 0.2, 0.3, 0.4);
    }

    @ParameterizedTest(name = "XUNITS={0}")
    @CsvSource(delimiter = '|', textBlock = """
            NANOMETERS      | 400   | 400.0        | NANOMETRE
            nm              | 400   | 400.0        | NANOMETRE
            MICROMETERS     | 0.4   | 400.0        | MICROMETRE
            MICRONS         | 0.4   | 400.0        | MICROMETRE
            ANGSTROMS       | 4000  | 400.0        | ANGSTROM
            1/CM            | 25000 | 400.0        | WAVENUMBER_PER_CM
            wavelength [nm] | 400   | 400.0        | NANOMETRE
            """)
    void xUnitsConvertToNanometres(String unit, double fileX, double nm, XUnit expected) throws ImportException {
        // λ/nm = 1000 · λ/µm = λ/Å / 10 = 10⁷ / (ν̃/cm⁻¹) (definitions of the units)
        double second = unit.equals("1/CM") ? 20000 : fileX * 1.25;
        ParsedSpectrum s = Jdx.read(Jdx.text("##XUNITS= " + unit, "##YUNITS= ABSORBANCE", "##XYPOINTS= (XY..XY)",
                fileX + ", 0.5", second + ", 0.6"));

        assertThat(s.xUnit()).isEqualTo(expected);
        assertThat(s.wavelengthsNm()[0]).isCloseTo(nm, within(1e-9));
    }

    @ParameterizedTest(name = "YUNITS={0}")
    @CsvSource(delimiter = '|', textBlock = """
            TRANSMITTANCE            | TRANSMITTANCE_FRACTION
            %T                       | TRANSMITTANCE_PERCENT
            PERCENT TRANSMITTANCE    | TRANSMITTANCE_PERCENT
            Transmittance (%)        | TRANSMITTANCE_PERCENT
            ABSORBANCE               | ABSORBANCE
            A                        | ABSORBANCE
            """)
    void yUnitsNameTheKind(String unit, YKind expected) throws ImportException {
        ParsedSpectrum s = Jdx.read(Jdx.text("##XUNITS= NANOMETERS", "##YUNITS= " + unit, "##XYPOINTS= (XY..XY)",
                "400 0.5", "401 0.6"));

        assertThat(s.yKind()).isEqualTo(expected);
    }

    @Test
    void aForcedKindReadsAnUnknownUnit() throws ImportException {
        ParsedSpectrum s = Jdx.read(Jdx.text("##XUNITS= NANOMETERS", "##YUNITS= COUNTS", "##XYPOINTS= (XY..XY)",
                "400 50", "401 60"), JcampOptions.defaults().withYKind(YKind.TRANSMITTANCE_PERCENT));

        assertThat(s.yKind()).isEqualTo(YKind.TRANSMITTANCE_PERCENT);
        assertThat(s.transmittanceFractions()).containsExactly(0.5, 0.6);
    }

    @Test
    void descendingWavelengthsAreReversedWithTheirUpperBounds() throws ImportException {
        ParsedSpectrum s = Jdx.read(Jdx.text("##XUNITS= NANOMETERS", "##YUNITS= TRANSMITTANCE",
                "##$SIEVE BELOW DETECTION= 0", "##XYPOINTS= (XY..XY)", "410 0.001", "405 0.2", "400 0.3"));

        assertThat(s.wavelengthsNm()).containsExactly(400.0, 405.0, 410.0);
        assertThat(s.values()).containsExactly(0.3, 0.2, 0.001);
        assertThat(s.upperBounds()).containsExactly(false, false, true);
    }

    @Test
    void metadataKeepsEveryHeaderLabelUnderItsLowerCasedName() throws ImportException {
        ParsedSpectrum s = Jdx.read(Jdx.text("##ORIGIN= an invented workshop", "##OWNER= nobody (illustrative)",
                "##DATE= 2024/06/01", "##SAMPLE DESCRIPTION= made-up film", "continued on a second line",
                "##PATH LENGTH= 0.125 mm", "##XUNITS= NANOMETERS", "##YUNITS= TRANSMITTANCE",
                "##XYPOINTS= (XY..XY)", "400 0.5", "401 0.6"));

        assertThat(s.metadata()).containsEntry("title", "illustrative curve")
                .containsEntry("origin", "an invented workshop").containsEntry("owner", "nobody (illustrative)")
                .containsEntry("date", "2024/06/01")
                .containsEntry("sample description", "made-up film\ncontinued on a second line")
                .containsEntry("path length", "0.125 mm").doesNotContainKey("xypoints");
    }

    @Test
    void nestedLinkBlocksAreListedAndTheFirstSpectrumIsRead() throws ImportException {
        String link = "##TITLE= illustrative link\n##JCAMP-DX= 5.01\n##DATA TYPE= LINK\n##BLOCKS= 2\n"
                + Jdx.text("##XUNITS= NANOMETERS", "##YUNITS= ABSORBANCE", "##XYPOINTS= (XY..XY)", "400 1", "401 2")
                + Jdx.text("##XUNITS= NANOMETERS", "##YUNITS= ABSORBANCE", "##XYPOINTS= (XY..XY)", "500 3", "501 4")
                + "##END=\n";

        var blocks = new JcampReader().blocks(Jdx.SOURCE, new java.io.StringReader(link));
        ParsedSpectrum second = Jdx.read(link, JcampOptions.defaults().withBlock(2));

        assertThat(blocks).hasSize(3);
        assertThat(blocks.get(0).hasData()).isFalse();
        assertThat(blocks.get(2).startLine()).isEqualTo(13);
        assertThat(Jdx.read(link).wavelengthsNm()).containsExactly(400.0, 401.0);
        assertThat(second.wavelengthsNm()).containsExactly(500.0, 501.0);
    }

    @Test
    void labelShapedCommentLinesAreSkipped() throws ImportException {
        ParsedSpectrum s = Jdx.read(Jdx.text("##$$ written by hand", "##XUNITS= NANOMETERS", "##YUNITS= ABSORBANCE",
                "##XYPOINTS= (XY..XY)", "400 1", "##$$ between pairs", "401 2"));

        assertThat(s.size()).isEqualTo(2);
    }

    @Test
    void deltaXPlacesPointsWhenLastXIsMissing() throws ImportException {
        ParsedSpectrum s = Jdx.read(Jdx.text("##XUNITS= NANOMETERS", "##YUNITS= ABSORBANCE", "##FIRSTX= 400",
                "##DELTAX= 2", "##XYDATA= (X++(Y..Y))", "400 1 2 3"));

        assertThat(s.wavelengthsNm()).containsExactly(400.0, 402.0, 404.0);
    }
}
