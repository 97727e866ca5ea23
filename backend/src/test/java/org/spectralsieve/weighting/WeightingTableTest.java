package org.spectralsieve.weighting;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.StringReader;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class WeightingTableTest {

    private static WeightingTable read(String text) throws Exception {
        return WeightingTable.read("t.txt", new StringReader(text));
    }

    @Test
    void shippedTablesNameTheirSource() {
        assertThat(WeightingTable.resource("actinic-uv-hazard.txt").source()).contains("ACGIH");
        assertThat(WeightingTable.resource("blue-light-hazard.txt").source()).contains("IEC 62471");
        assertThat(WeightingTable.resource("actinic-uv-hazard.txt").interpolation())
                .isEqualTo(WeightingTable.Interpolation.LOG10);
    }

    @ParameterizedTest
    @CsvSource(delimiter = '|', value = {
        "# source: x\\n300 1\\n300 2\\n | t.txt:3: field wavelength_nm 300.0 is not greater",
        "# source: x\\n300 1\\n310 0\\n | t.txt:3: field value is 0.0",
        "# source: x\\n300 1\\n310 1,5\\n | t.txt:3: field value '1,5' is not a finite number",
        "# source: x\\n300 1 2\\n | t.txt:2: expected 2 fields",
        "300 1\\n310 2\\n | t.txt:1: no '# source:' line"})
    void badTableIsRefusedWithFileAndLine(String text, String message) {
        assertThatThrownBy(() -> read(text.replace("\\n", "\n")))
                .isInstanceOf(WeightingTableException.class)
                .hasMessageStartingWith(message);
    }

    @Test
    void linearTableReadsStraightLinesBetweenRows() throws Exception {
        WeightingTable t = read("# source: x\n# interpolation: linear\n300 1\n310 0.1\n");
        assertThat(t.interpolation()).isEqualTo(WeightingTable.Interpolation.LINEAR);
        assertThat(t.valueAt(305)).isCloseTo(0.55, org.assertj.core.api.Assertions.within(1e-15));
        assertThat(t.valueAt(310)).isEqualTo(0.1);
    }

    @Test
    void sourceContinuesOnIndentedCommentLines() throws Exception {
        WeightingTable t = read("# source: first part\n#    second part\n# columns: a b\n300 1\n310 2\n");
        assertThat(t.source()).isEqualTo("first part second part");
        assertThat(t.interpolation()).isEqualTo(WeightingTable.Interpolation.LOG10);
    }

    @ParameterizedTest
    @CsvSource(delimiter = '|', value = {
        "# source: x\\n# interpolation: cubic\\n300 1\\n | t.txt:2: field interpolation 'cubic' is not one of",
        "# source: x\\n# interpolation: linear\\n# interpolation: log10\\n | t.txt:3: second '# interpolation:'"})
    void badInterpolationIsRefusedWithFileAndLine(String text, String message) {
        assertThatThrownBy(() -> read(text.replace("\\n", "\n")))
                .isInstanceOf(WeightingTableException.class)
                .hasMessageStartingWith(message);
    }

    @Test
    void tableIsZeroOutsideItsRows() throws Exception {
        WeightingTable t = read("# source: x\n300 1\n310 0.1\n");
        assertThat(t.valueAt(299.9)).isZero();
        assertThat(t.valueAt(310.1)).isZero();
        assertThat(t.valueAt(305)).isCloseTo(Math.sqrt(0.1), org.assertj.core.api.Assertions.within(1e-12));
    }
}
