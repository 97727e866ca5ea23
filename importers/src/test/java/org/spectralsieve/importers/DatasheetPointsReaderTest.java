package org.spectralsieve.importers;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;

import org.junit.jupiter.api.Test;

/** Points are illustrative, "read off" an invented filter's graph. */
class DatasheetPointsReaderTest {

    private final DatasheetPointsReader reader = new DatasheetPointsReader();

    @Test
    void sparseLogAxisPointsAreStoredAsGivenWithDatasheetProvenance() throws ImportException {
        ParsedSpectrum s = reader.read("filter-graph.csv", "# axis: log\nwavelength_nm,OD\n350,4\n380,2.5\n400,0.1\n");

        assertThat(s.wavelengthsNm()).containsExactly(350, 380, 400);
        assertThat(s.values()).containsExactly(4, 2.5, 0.1);
        assertThat(s.yKind()).isEqualTo(YKind.ABSORBANCE);
        assertThat(s.metadata()).containsEntry("provenance", "datasheet").containsEntry("axis", "log")
                .containsEntry("interpolation", "absorbance");
    }

    @Test
    void zeroTransmittanceCannotComeFromALogAxis() {
        ImportException e = catchThrowableOfType(ImportException.class,
                () -> reader.read("g.csv", "# axis: log\nnm,%T\n350,0\n400,50\n"));

        assertThat(e.field()).isEqualTo("point 1");
        assertThat(e.problem()).contains("350.0 nm", "log axis");
    }

    @Test
    void aSinglePointIsNotACurve() {
        ImportException e = catchThrowableOfType(ImportException.class, () -> reader.read("g.csv", "nm,%T\n350,10\n"));

        assertThat(e.problem()).contains("at least 2");
    }
}
