package org.spectralsieve.spectrum;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;

/**
 * Curves that share their wavelength and detection-limit arrays stay equal to themselves in every value and
 * hold less heap; the pool keeps to its bound. Sizes: HotSpot's array layout with compressed references
 * (16-byte header, 8 bytes a double, 1 a boolean), from memory.
 */
class SharedCurveArraysTest {

    private static final double[] NM = {300, 350, 400, 450, 500};

    @Test
    void aSharingCurveEqualsTheOriginalAndItsUncertaintyIsKept() {
        SharedCurveArrays pool = new SharedCurveArrays(1 << 20);
        Curve original = Curve.of(NM, new double[] {0.0005, 0.2, 0.5, 0.8, 0.9}, 1e-3)
                .withAbsorbanceUncertainty(new double[] {0.01, 0.02, Double.NaN, 0.01, 0.01});
        Curve shared = original.sharingArraysWith(pool);
        assertThat(shared).isEqualTo(original);
        assertThat(shared.belowDetection(0)).isTrue();
        assertThat(shared.absorbanceUncertainty(1)).isEqualTo(0.02);
        assertThat(shared.transmittanceAt(375).orElseThrow()).isEqualTo(original.transmittanceAt(375).orElseThrow());
    }

    @Test
    void twoCurvesOnOneGridKeepOneGridAndOneSetOfLimits() {
        SharedCurveArrays pool = new SharedCurveArrays(1 << 20);
        Curve a = Curve.of(NM, new double[] {0.1, 0.2, 0.3, 0.4, 0.5}, 1e-3).sharingArraysWith(pool);
        Curve b = Curve.of(NM, new double[] {0.5, 0.6, 0.7, 0.8, 0.9}, 1e-3).sharingArraysWith(pool);
        assertThat(pool.size()).isEqualTo(2); // the grid and the limits, once
        assertThat(pool.heapBytes()).isEqualTo(2 * (16 + 8 * NM.length));
        // own: object 32, transmittances 16 + 40, flags 16 + 5
        assertThat(a.heapBytesBeside(pool)).isEqualTo(32 + 56 + 21);
        assertThat(b.heapBytesBeside(pool)).isEqualTo(32 + 56 + 21);
    }

    @Test
    void aFullPoolLeavesCurvesTheirOwnArrays() {
        SharedCurveArrays pool = new SharedCurveArrays(16 + 8 * NM.length); // room for one array
        Curve a = Curve.of(NM, new double[] {0.1, 0.2, 0.3, 0.4, 0.5}, 1e-3).sharingArraysWith(pool);
        assertThat(pool.size()).isEqualTo(1);
        assertThat(a.heapBytesBeside(pool)).isEqualTo(32 + 56 + 21 + 56); // its own limits counted
        assertThatThrownBy(() -> new SharedCurveArrays(-1)).isInstanceOf(IllegalArgumentException.class);
    }
}
