package org.spectralsieve.spectrum;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

/**
 * Synthetic long-pass and band-pass edges whose crossing point is known in closed form: with absorbance interpolated
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
    void aBandAsHighAsTheRestIsTheFirstPassBandEvenWhenNarrow() {
        // a narrow band at 390 nm reaching the curve's 50 %, then a notch, then clear: the band is the first
        // rise out of the absorbing UV, so its rising edge is the cutoff and the notch is its end
        Curve notch = Curve.of(NM, new double[] {0.001, 0.5, 0.001, 0.5, 0.5}, 0);
        assertThat(Cutoffs.cutoffNm(notch, 0.01).orElseThrow()).isBetween(380.0, 390.0);
        assertThat(Cutoffs.passBandEndNm(notch, 0.01).orElseThrow()).isBetween(390.0, 400.0);
    }

    /**
     * A band-pass curve built so that absorbance is exactly linear between grid points: A(λ) = 0.1 + |λ − 360|/20
     * from 280 to 440 nm (a pass band peaking at 360 nm, T = 10^-0.1 = 79 %), then an infrared leak at 90 %.
     * At 50 % (A = log10 2) the two crossings are at 360 ∓ 20·(log10 2 − 0.1) nm, in closed form
     * (A = −log10 T, ANSI Z80.3-2001 §3.2; absorbance interpolation, our rule).
     */
    private static Curve bandPassWithInfraredLeak() {
        double[] nm = new double[22];
        double[] t = new double[22];
        for (int i = 0; i < 17; i++) {
            nm[i] = 280 + 10 * i;
            t[i] = Math.pow(10, -(0.1 + Math.abs(nm[i] - 360) / 20));
        }
        double[] leak = {0.0001, 0.01, 0.5, 0.9, 0.9};
        for (int i = 0; i < 5; i++) {
            nm[17 + i] = 450 + 10 * i;
            t[17 + i] = leak[i];
        }
        return Curve.of(nm, t, 0);
    }

    @Test
    void bandPassCutoffIsTheUvAbsorptionEdgeNotTheInfraredEdge() {
        Curve band = bandPassWithInfraredLeak();
        double half = 20 * (Math.log10(2) - 0.1);

        Cutoffs.Edges edges = Cutoffs.edges(band, 0.5);

        assertThat(edges.absorptionEdgeNm().orElseThrow()).isCloseTo(360 - half, within(1e-9));
        assertThat(edges.passBandEndNm().orElseThrow()).isCloseTo(360 + half, within(1e-9));
        assertThat(edges.bandPass()).isTrue();
        // the infrared leak opens at 470 nm: walking from the long end would have called that the cutoff
        assertThat(Cutoffs.cutoffNm(band, 0.5).orElseThrow()).isLessThan(400);
    }

    @Test
    void longPassCurveHasAnAbsorptionEdgeAndNoPassBandEnd() {
        Curve edge = Curve.of(NM, new double[] {0.0001, 0.001, 0.1, 0.8, 0.9}, 0);
        Cutoffs.Edges edges = Cutoffs.edges(edge, 0.01);
        assertThat(edges.absorptionEdgeNm().orElseThrow()).isCloseTo(395.0, within(1e-9));
        assertThat(edges.passBandEndNm()).isEmpty();
        assertThat(edges.bandPass()).isFalse();
    }

    @Test
    void bandAlreadyOpenAtTheShortEndIsPassedOver() {
        // a deep-UV window (a UV absorber film on quartz): open at the short end, absorbing, then clear;
        // the cutoff is where the clear band rises (1 % between 0.001 at 410 and 0.1 at 420: half way, 415 nm)
        Curve window = Curve.of(new double[] {380, 390, 400, 410, 420, 430},
                new double[] {0.8, 0.8, 0.001, 0.001, 0.1, 0.9}, 0);
        assertThat(Cutoffs.cutoffNm(window, 0.01).orElseThrow()).isCloseTo(415.0, within(1e-9));
        assertThat(Cutoffs.passBandEndNm(window, 0.01)).isEmpty();
    }

    @Test
    void weakWindowUnderTheAnchorIsNotTakenForTheBand() {
        // a 15 % window at 390 nm in front of the real edge: at the 10 % level the cutoff is the real edge's
        // (between 0.05 at 420 and 0.6 at 430), because the band is anchored where T reaches 50 %
        Curve curve = Curve.of(new double[] {380, 390, 400, 410, 420, 430, 440},
                new double[] {0.001, 0.15, 0.05, 0.12, 0.05, 0.6, 0.9}, 0);
        assertThat(Cutoffs.cutoffNm(curve, 0.1).orElseThrow()).isBetween(420.0, 430.0);
    }

    @Test
    void whyNoCutoffNamesEachCase() {
        assertThat(Cutoffs.whyNoCutoff(Curve.of(NM, new double[] {0.5, 0.6, 0.7, 0.8, 0.9}, 0), 0.1))
                .isEqualTo(Cutoffs.NoEdge.ALWAYS_OVER);
        assertThat(Cutoffs.whyNoCutoff(Curve.of(NM, new double[] {0.5, 0.4, 0.3, 0.2, 0.05}, 0), 0.1))
                .isEqualTo(Cutoffs.NoEdge.NEVER_RISES);
        assertThat(Cutoffs.whyNoCutoff(Curve.of(NM, new double[] {0.005, 0.005, 0.1, 0.8, 0.9}, 0.02), 0.01))
                .isEqualTo(Cutoffs.NoEdge.UNDETERMINED);
        assertThat(Cutoffs.whyNoCutoff(Curve.of(NM, new double[] {0.0001, 0.001, 0.1, 0.8, 0.9}, 0), 0.01)).isNull();
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
