package org.spectralsieve.ingest;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;

import org.junit.jupiter.api.Test;
import org.spectralsieve.library.StatedThicknesses;

/** The thicknesses a new material exists in, as a manifest cell or a form field states them. */
class MadeThicknessOptionsTest {

    @Test
    void filmSizesAreReadInMicrometresAndStoredInMillimetres() {
        StatedThicknesses t = OptionText.thicknesses("stock", "25 50, 125 um", "made_range", "25-125 µm");
        assertThat(t.stockMm()).containsExactly(0.025, 0.05, 0.125);
        assertThat(t.minMm()).isEqualTo(0.025);
        assertThat(t.maxMm()).isEqualTo(0.125);
    }

    @Test
    void sheetSizesAreReadInMillimetresWithAnyUsualSeparator() {
        StatedThicknesses t = OptionText.thicknesses("stock", "2;3;6 mm", "made_range", "1 to 12");
        assertThat(t.stockMm()).containsExactly(2.0, 3.0, 6.0);
        assertThat(t.minMm()).isEqualTo(1);
        assertThat(t.maxMm()).isEqualTo(12);
    }

    @Test
    void nothingStatedLeavesTheAssumedRuleToTheSearch() {
        assertThat(OptionText.thicknesses("stock", "", "made_range", null).stated()).isFalse();
    }

    @Test
    void aStockSizeOutsideTheMadeRangeIsRefusedNamingTheField() {
        ImportRequestException e = catchThrowableOfType(ImportRequestException.class,
                () -> OptionText.thicknesses("stock", "2 30", "made_range", "1 to 12"));
        assertThat(e.getMessage()).contains("30.0 mm lies outside the made range");
        assertThat(e.field()).isEqualTo("made_range");
    }

    @Test
    void aRangeThatIsNotARangeIsRefusedNamingTheField() {
        ImportRequestException e = catchThrowableOfType(ImportRequestException.class,
                () -> OptionText.thicknesses("stock", "", "made_range", "about 3"));
        assertThat(e.field()).isEqualTo("made_range");
    }
}
