package org.spectralsieve.importers;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.io.StringReader;
import java.time.LocalDate;
import java.util.LinkedHashMap;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.spectralsieve.importers.jcamp.JcampReader;
import org.spectralsieve.testsupport.ReadsSharedFolder;
import org.spectralsieve.testsupport.SharedFolder;

/**
 * Thickness, instrument and date read from metadata lines. Length units by SI definition (1 mm = 1000 µm =
 * 0.1 cm); the JCAMP-DX forms (##DATE YY/MM/DD in version 4.24, ##LONGDATE YYYY/MM/DD, ##PATH LENGTH in cm)
 * are from the JCAMP-DX specifications, quoted from memory.
 */
class SampleMetadataTest {

    private static SampleMetadata of(String... keysAndValues) {
        Map<String, String> m = new LinkedHashMap<>();
        for (int i = 0; i < keysAndValues.length; i += 2) {
            m.put(keysAndValues[i], keysAndValues[i + 1]);
        }
        return SampleMetadata.of(m);
    }

    @ParameterizedTest
    @CsvSource(delimiter = '|', textBlock = """
            thickness       | 3.0 mm  | 3.0
            thickness       | 3,0 mm  | 3.0
            thickness       | 125 µm  | 0.125
            thickness       | 125 um  | 0.125
            thickness       | 0.3 cm  | 3.0
            thickness_mm    | 2       | 2.0
            thickness_um    | 50      | 0.05
            Sample Thickness| 6 mm    | 6.0
            path length     | 0.05    | 0.5
            """)
    void aThicknessWithItsUnitIsReadInMillimetres(String key, String value, double mm) {
        SampleMetadata.Thickness t = of(key, value).thickness().orElseThrow();

        assertThat(t.usable()).isTrue();
        assertThat(t.mm()).isCloseTo(mm, within(1e-12));
    }

    @Test
    void aBareNumberUnderThicknessIsKeptButNotGuessed() {
        SampleMetadata m = of("thickness", "3.0");

        assertThat(m.thickness().orElseThrow().usable()).isFalse();
        assertThat(m.thickness().orElseThrow().asWritten()).isEqualTo("3.0");
        assertThat(m.notes()).singleElement().asString().contains("thickness: 3.0").contains("no unit");
    }

    @Test
    void theInstrumentComesFromAnInstrumentOrSpectrometerLine() {
        assertThat(of("instrument", "bench unit").instrument()).contains("bench unit");
        assertThat(of("spectrometer/data system", "double-beam unit").instrument()).contains("double-beam unit");
    }

    @ParameterizedTest
    @CsvSource(delimiter = '|', textBlock = """
            2026-03-09              | 2026-03-09
            2026-03-13 13:07:15     | 2026-03-13
            2016/11/22              | 2016-11-22
            28/8/2023               | 2023-08-28
            13/2/1997               | 1997-02-13
            91/06/18                | 1991-06-18
            20 Mar 2009 10:21:02    | 2009-03-20
            March 20, 2009          | 2009-03-20
            """)
    void datesInUnambiguousFormsAreRead(String text, String iso) {
        assertThat(SampleMetadata.date(text)).isEqualTo(LocalDate.parse(iso));
    }

    @Test
    void anAmbiguousDateIsNotGuessed() {
        assertThatThrownBy(() -> SampleMetadata.date("03/04/2026")).hasMessageContaining("cannot be told apart");
        assertThatThrownBy(() -> SampleMetadata.date("05/06/07")).hasMessageContaining("two-digit year");
        assertThatThrownBy(() -> SampleMetadata.date("2026-02-30")).hasMessageContaining("not a date in the calendar");
    }

    @Test
    void theDelimitedReaderReturnsTheFilesThicknessLine() throws ImportException {
        String file = "# thickness: 3.0 mm\n# instrument: bench unit\n# date: 2026-03-09\nwavelength,T\n300,0.2\n400,0.6\n";

        SampleMetadata m = new DelimitedTextReader().read("bench.csv", new StringReader(file)).sampleMetadata();

        assertThat(m.thickness().orElseThrow().mm()).isEqualTo(3.0);
        assertThat(m.instrument()).contains("bench unit");
        assertThat(m.date()).contains(LocalDate.of(2026, 3, 9));
    }

    @Test
    @ReadsSharedFolder
    void realJcampFilesGiveTheirSpectrometerAndDate() throws ImportException {
        // SOURCES.md §1 blckpac1.jdx: ##DATE= 96/11/04 (YY/MM/DD), a SPECTROMETER/DATA SYSTEM line
        SampleMetadata m = new JcampReader().read(SharedFolder.referenceFile("jcamp-lancashire/blckpac1.jdx"))
                .sampleMetadata();

        assertThat(m.date()).contains(LocalDate.of(1996, 11, 4));
        assertThat(m.instrument()).isPresent();
    }
}
