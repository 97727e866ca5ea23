package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.Illumination;
import org.spectralsieve.optics.Layer;
import org.spectralsieve.optics.LightPath;
import org.spectralsieve.spectrum.Curve;

/** The {@code light} parameter and the bound on a figure at an angle's work. */
class SampleAtAngleTest {

    private static Curve flat(int points, double fromNm) {
        double[] nm = new double[points];
        double[] t = new double[points];
        for (int i = 0; i < points; i++) {
            nm[i] = fromNm + i * 0.01;
            t[i] = 0.8;
        }
        return Curve.of(nm, t, 0.0001);
    }

    @Test
    void aPathOverTheBoundIsRefusedNamingLightAndOneAtItIsComputed() {
        ConstantIndex glass = new ConstantIndex(1.5);
        // two parts on the same 25,000 wavelengths: 50,000 points counted once per part, the bound itself
        LightPath atBound = LightPath.of(Layer.bulk(flat(25_000, 300), 3, 3, glass), Layer.fixed(flat(25_000, 300), glass));
        SampleAtAngle.requireBounded(atBound);
        LightPath over = LightPath.of(Layer.bulk(flat(SampleAtAngle.MAX_POINTS_AT_ANGLE + 1, 300), 3, 3, glass));
        assertThatThrownBy(() -> SampleAtAngle.requireBounded(over))
                .isInstanceOfSatisfying(NotAtAngleException.class, e -> assertThat(e.parameter()).isEqualTo("light"))
                .hasMessageContaining(String.valueOf(SampleAtAngle.MAX_POINTS_AT_ANGLE + 1))
                .hasMessageContaining("normal incidence");
    }

    @Test
    void theLightParameterReadsTheRequirementsWordsAndABadOneNamesLight() {
        assertThat(SampleAtAngle.light(null)).isEqualTo(Illumination.NORMAL);
        assertThat(SampleAtAngle.light("normal")).isEqualTo(Illumination.NORMAL);
        assertThat(SampleAtAngle.light("at 30° incidence")).isEqualTo(Illumination.atIncidence(30));
        assertThat(SampleAtAngle.light("under an LED with 120° beam angle")).isEqualTo(Illumination.led(120));
        assertThatThrownBy(() -> SampleAtAngle.light("from the side"))
                .isInstanceOfSatisfying(BadParameterException.class, e -> assertThat(e.parameter()).isEqualTo("light"));
        assertThatThrownBy(() -> SampleAtAngle.light("x".repeat(100_000)))
                .isInstanceOfSatisfying(BadParameterException.class, e -> assertThat(e.parameter()).isEqualTo("light"));
    }
}
