package org.spectralsieve.spectrum;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

class CurveUncertaintyTest {

    private static final double[] NM = {300, 310, 320};

    private static Curve curve() {
        return Curve.of(NM, new double[] {0.1, 0.5, 0.9}, 0);
    }

    @Test
    void aCurveBuiltWithoutUncertaintyKnowsNone() {
        assertThat(curve().hasUncertainty()).isFalse();
        assertThat(curve().absorbanceUncertainty(1)).isNaN();
        assertThat(curve().absorbanceUncertaintyAt(310)).isEmpty();
    }

    @Test
    void uncertaintyBetweenPointsIsTheLinearBlendOfTheNeighbours() {
        // hand-worked: a quarter of the way from 0.02 to 0.06 is 0.03
        Curve c = curve().withAbsorbanceUncertainty(new double[] {0.02, 0.06, 0.01});
        assertThat(c.absorbanceUncertaintyAt(302.5).getAsDouble()).isCloseTo(0.03, within(1e-12));
        assertThat(c.resampleAt(new double[] {302.5, 315}).absorbanceUncertainty(1)).isCloseTo(0.035, within(1e-12));
    }

    @Test
    void anUnknownNeighbourLeavesTheInterpolatedUncertaintyUnknown() {
        Curve c = curve().withAbsorbanceUncertainty(new double[] {0.02, Double.NaN, 0.01});
        assertThat(c.absorbanceUncertaintyAt(305)).isEmpty();
        assertThat(c.absorbanceUncertaintyAt(300).getAsDouble()).isEqualTo(0.02);
    }

    @Test
    void onlyUnknownValuesMeanNoUncertainty() {
        Curve c = curve().withAbsorbanceUncertainty(new double[] {Double.NaN, Double.NaN, Double.NaN});
        assertThat(c.hasUncertainty()).isFalse();
        assertThat(c).isEqualTo(curve());
    }

    @Test
    void aNegativeOrInfiniteUncertaintyIsRefusedNamingItsWavelength() {
        assertThatThrownBy(() -> curve().withAbsorbanceUncertainty(new double[] {0.01, -0.01, 0.01}))
                .isInstanceOf(CurveException.class).hasMessageContaining("310.0 nm");
        assertThatThrownBy(() -> curve().withAbsorbanceUncertainty(new double[] {0.01, 0.01, Double.POSITIVE_INFINITY}))
                .isInstanceOf(CurveException.class);
    }

    @Test
    void statingACurveKeepsItsUncertainty() {
        Curve deep = Curve.of(NM, new double[] {1e-20, 0.5, 0.9}, 0)
                .withAbsorbanceUncertainty(new double[] {0.2, 0.01, 0.01});
        assertThat(StatedCurve.of(deep).absorbanceUncertainty(0)).isEqualTo(0.2);
    }
}
