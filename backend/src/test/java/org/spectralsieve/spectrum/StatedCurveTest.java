package org.spectralsieve.spectrum;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

/**
 * Outputs state nothing beneath OD 12 (T = 1e-12): our own rule, the floor the margins use; a weaker
 * bound is still true (T < 1e-236 implies T < 1e-12).
 */
class StatedCurveTest {

    private static final double[] NM = {300, 310, 320, 330};

    @Test
    void transmittancesBeneathOd12BecomeTheBoundOneE12() {
        Curve rescaled = Curve.of(NM, new double[] {1e-240, 0, 2e-12, 0.5},
                new boolean[] {true, false, false, false}, new double[] {1.8e-236, 1.8e-236, 1.8e-236, 1.8e-236});

        Curve stated = StatedCurve.of(rescaled);

        assertThat(stated.transmittances()).containsExactly(1e-12, 1e-12, 2e-12, 0.5);
        assertThat(stated.belowDetectionFlags()).containsExactly(true, true, false, false);
        assertThat(stated.detectionLimits()).containsOnly(1e-12);
        assertThat(stated.maxDetectionLimit()).isEqualTo(1e-12);
    }

    @Test
    void aCurveWithNothingBeneathOd12IsLeftAsItIs() {
        Curve measured = Curve.of(NM, new double[] {0.0005, 0.002, 0.3, 0.9}, 0.001);

        assertThat(StatedCurve.of(measured)).isSameAs(measured);
    }

    @Test
    void aDetectionLimitNotRecordedStaysZeroOnPointsAboveTheFloor() {
        Curve none = Curve.of(NM, new double[] {0.1, 0.2, 0.3, 0.9}, 0);

        assertThat(StatedCurve.of(none).maxDetectionLimit()).isZero();
    }

    @Test
    void aDetectionLimitThatUnderflowedToZeroOnAFlaggedPointIsRaisedToTheFloor() {
        Curve underflowed = Curve.of(NM, new double[] {0.01, 0.2, 0.3, 0.9}, new boolean[] {true, false, false, false},
                new double[] {0, 0, 0, 0});

        Curve stated = StatedCurve.of(underflowed);

        assertThat(stated.detectionLimit(0)).isEqualTo(1e-12);
        assertThat(stated.detectionLimit(1)).isZero();
    }
}
