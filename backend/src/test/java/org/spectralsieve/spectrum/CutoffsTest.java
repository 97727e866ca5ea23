package org.spectralsieve.spectrum;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

/**
 * Synthetic long-pass edges whose crossing point is known in closed form: with absorbance interpolated
 * linearly, the 1 % crossing between T = 0.1 (A = 1) and T = 0.001 (A = 3) lies exactly half way
 * (definition A = −log10 T, ANSI Z80.3-2001 §3.2; our interpolation rule).
 */
class CutoffsTest {

    private static final double[] NM = {380, 390, 400, 410, 420};

    @Test
    void cutoffOfEdgeIsInterpolatedInAbsorbance() {
        Curve edge = Curve.of(NM, new double[] {0.0001, 0.001, 0.1, 0.8, 0.9}, 0);
        assertThat(Cutoffs.cutoffNm(edge, 0.01).orElseThrow()).isCloseTo(395.0, within(1e-9));
        // 50 %: between 0.1 at 400 and 0.8 at 410, A(0.5) fraction from the 410 side
        double f = (Math.log10(0.8) - Math.log10(0.5)) / (Math.log10(0.8) - Math.log10(0.1));
        assertThat(Cutoffs.cutoffNm(edge, 0.5).orElseThrow()).isCloseTo(410 - 10 * f, within(1e-9));
    }

    @Test
    void curveThatNeverFallsUnderTheLevelHasNoCutoff() {
        Curve clear = Curve.of(NM, new double[] {0.5, 0.6, 0.7, 0.8, 0.9}, 0);
        assertThat(Cutoffs.cutoffNm(clear, 0.1)).isEmpty();
    }

    @Test
    void curveAlreadyUnderTheLevelAtItsLongEndHasNoCutoff() {
        Curve dark = Curve.of(NM, new double[] {0.5, 0.4, 0.3, 0.2, 0.05}, 0);
        assertThat(Cutoffs.cutoffNm(dark, 0.1)).isEmpty();
    }

    @Test
    void firstCrossingFromTheLongEndWins() {
        // a notch at 400 nm and the edge at 380: walking from the red, the notch comes first
        Curve notch = Curve.of(NM, new double[] {0.001, 0.5, 0.001, 0.5, 0.5}, 0);
        assertThat(Cutoffs.cutoffNm(notch, 0.01).orElseThrow()).isBetween(400.0, 410.0);
    }

    @Test
    void belowDetectionPointCountsAsUnderLevelWhenItsBoundIsUnderIt() {
        // limit 0.001 < level 0.01: the bound (0.001) is used for the interpolation → 395 nm as above
        Curve edge = Curve.of(NM, new double[] {0.0, 0.0002, 0.1, 0.8, 0.9},
                new boolean[] {true, true, false, false, false}, new double[] {0.001, 0.001, 0.001, 0.001, 0.001});
        assertThat(Cutoffs.cutoffNm(edge, 0.01).orElseThrow()).isCloseTo(395.0, within(1e-9));
    }

    @Test
    void belowDetectionPointWhoseBoundReachesTheLevelLeavesCutoffUndetermined() {
        // limit 0.02 >= level 0.01: the instrument cannot tell whether T fell under 1 %
        Curve edge = Curve.of(NM, new double[] {0.005, 0.005, 0.1, 0.8, 0.9}, 0.02);
        assertThat(Cutoffs.cutoffNm(edge, 0.01)).isEmpty();
        assertThat(Cutoffs.cutoffNm(edge, 0.05)).isPresent();
    }
}
