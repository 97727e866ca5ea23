package org.spectralsieve.spectrum;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;

class WavelengthGridTest {

    // Grid arithmetic is our own definition (no external source needed: counting points).
    @Test
    void gridWithFractionalStepEndsExactlyOnItsUpperBound() {
        WavelengthGrid grid = new WavelengthGrid(280, 400, 0.1);
        assertThat(grid.size()).isEqualTo(1201);
        assertThat(grid.at(1200)).isEqualTo(400.0);
        assertThat(grid.points()[0]).isEqualTo(280.0);
    }

    @Test
    void gridWhoseStepMissesTheUpperBoundStopsShortOfIt() {
        WavelengthGrid grid = new WavelengthGrid(300, 310, 3);
        assertThat(grid.points()).containsExactly(300, 303, 306, 309);
    }

    @Test
    void invalidGridsAreRejectedNamingTheParameter() {
        assertThatThrownBy(() -> new WavelengthGrid(400, 300, 1)).isInstanceOf(CurveException.class)
                .hasMessageContaining("fromNm (400.0 nm)");
        assertThatThrownBy(() -> new WavelengthGrid(300, 400, 0)).hasMessageContaining("stepNm (0.0 nm)");
        assertThatThrownBy(() -> new WavelengthGrid(300, Double.NaN, 1)).hasMessageContaining("toNm");
        assertThatThrownBy(() -> new WavelengthGrid(200, 1200, 0.0001)).hasMessageContaining("1000000 points");
    }
}
