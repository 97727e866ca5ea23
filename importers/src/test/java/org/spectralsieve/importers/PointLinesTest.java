package org.spectralsieve.importers;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;

import java.io.StringReader;
import org.junit.jupiter.api.Test;
import org.spectralsieve.importers.jcamp.JcampReader;

/** Readers keep the file line of every point, so later refusals can name a line instead of an index. Generated files. */
class PointLinesTest {

    @Test
    void delimitedPointsKeepTheirLinesAfterBeingPutInWavelengthOrder() throws ImportException {
        String file = "# descending capture\nwavelength,T\n400,0.9\n350,0.5\n300,0.1\n";

        ParsedSpectrum s = new DelimitedTextReader().read("bench.csv", new StringReader(file));

        assertThat(s.wavelengthsNm()).containsExactly(300.0, 350.0, 400.0);
        assertThat(s.lines()).containsExactly(5, 4, 3);
    }

    @Test
    void jcampPointsKeepTheirLines() throws ImportException {
        String file = "##TITLE=t\n##JCAMP-DX=4.24\n##XUNITS=NANOMETERS\n##YUNITS=TRANSMITTANCE\n"
                + "##XYPOINTS=(XY..XY)\n300,0.1\n350,0.5\n400,0.9\n##END=\n";

        ParsedSpectrum s = new JcampReader().read("t.jdx", new StringReader(file));

        assertThat(s.lines()).containsExactly(6, 7, 8);
    }

    @Test
    void aJcampValueOverflowingUnderItsYFactorIsNamedByItsLine() {
        String file = "##TITLE=t\n##JCAMP-DX=4.24\n##XUNITS=NANOMETERS\n##YUNITS=TRANSMITTANCE\n##YFACTOR=1e308\n"
                + "##XYPOINTS=(XY..XY)\n300,0.5\n350,10\n400,0.9\n##END=\n";

        ImportException e = catchThrowableOfType(ImportException.class,
                () -> new JcampReader().read("t.jdx", new StringReader(file)));

        assertThat(e.line()).isEqualTo(8);
        assertThat(e.problem()).contains("out of range").doesNotContain("index");
    }
}
