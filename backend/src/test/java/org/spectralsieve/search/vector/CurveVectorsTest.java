package org.spectralsieve.search.vector;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.spectralsieve.similarity.CurveSignature;
import org.spectralsieve.spectrum.Curve;

class CurveVectorsTest {

    /**
     * Beer–Lambert: the internal absorbance is proportional to the thickness, so A per mm of one bulk material is
     * the same at 2 and at 5 mm except for the surface loss, a constant in A (two surfaces at n = 1.5 pass about
     * 0.92 by Fresnel's equations), which per mm is a constant that the centring removes: the two vectors
     * coincide. A darker dye of another shape does not.
     */
    @Test
    void aBulkMaterialAtAnotherThicknessHasTheSameVectorAndAnotherShapeDoesNot() {
        float[] thin = CurveVectors.of(CurveSignature.of(sheet(2, 330), 2, true));
        float[] thick = CurveVectors.of(CurveSignature.of(sheet(5, 330), 5, true));
        float[] other = CurveVectors.of(CurveSignature.of(sheet(2, 380), 2, true));
        assertThat(dot(thin, thin)).isCloseTo(1, within(1e-5));
        assertThat(dot(thin, thick)).isCloseTo(1, within(1e-5));
        assertThat(dot(thin, other)).isLessThan(0.99);
        assertThat(thin).hasSize(CurveVectors.DIMENSION);
    }

    /** T = 0.92 · 10^(−a(λ)·t), a(λ) an exponential edge at {@code edgeNm} (0.1/mm there, at most 0.3/mm): T stays over 2 %. */
    private static Curve sheet(double mm, double edgeNm) {
        int n = 101;
        double[] nm = new double[n];
        double[] t = new double[n];
        for (int i = 0; i < n; i++) {
            nm[i] = 200 + 5 * i;
            double perMm = Math.min(0.1 * Math.exp((edgeNm - nm[i]) / 40), 0.3) + 0.002; // levels off at 0.3/mm
            t[i] = 0.92 * Math.pow(10, -perMm * mm);
        }
        return Curve.of(nm, t, 1e-4);
    }

    private static double dot(float[] a, float[] b) {
        double s = 0;
        for (int i = 0; i < a.length; i++) {
            s += a[i] * b[i];
        }
        return s;
    }
}
