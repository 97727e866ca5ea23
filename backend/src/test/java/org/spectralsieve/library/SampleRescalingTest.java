package org.spectralsieve.library;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.spectralsieve.optics.ConstantIndex;

/**
 * The one rule for which samples Beer–Lambert may rescale. Thickness conversion "fails for filled,
 * coloured-by-pigment or diffuse materials, where multiple scattering breaks the simple exponential model"
 * (PRACTICE.md, [S47]); vat FEP "fogs with use" ([S40]), a haze, not an absorption.
 */
class SampleRescalingTest {

    private static Material material(Scaling scaling, List<String> tags, SampleInfo sample) {
        return new Material(1, "illustrative", "Illustrative sheet", MaterialClass.of("plastic sheet"), "", tags, scaling,
                new ConstantIndex(1.5), List.of(sample));
    }

    private static SampleInfo sample(Geometry geometry) {
        return new SampleInfo(1, 1, 3, geometry, Provenance.MODELLED, "", null, "", "", 0);
    }

    @Test
    void aRegularSampleOfABulkMaterialIsRescalable() {
        SampleInfo s = sample(Geometry.REGULAR);
        SampleRescaling r = SampleRescaling.of(material(Scaling.BULK, List.of("acrylic"), s), s);
        assertThat(r.rescalable()).isTrue();
        assertThat(r.reason()).isNull();
    }

    @Test
    void aTotalGeometrySampleIsNotRescaledBecauseScatterIsNotAbsorption() {
        SampleInfo s = sample(Geometry.TOTAL);
        SampleRescaling r = SampleRescaling.of(material(Scaling.BULK, List.of(), s), s);
        assertThat(r.rescalable()).isFalse();
        assertThat(r.reason()).isEqualTo(SampleRescaling.DIFFUSE);
    }

    @Test
    void aFoggedRegularSampleIsNotRescaledAndTheTagIsNamed() {
        SampleInfo s = sample(Geometry.REGULAR);
        SampleRescaling r = SampleRescaling.of(material(Scaling.BULK, List.of("FEP", "Fogged"), s), s);
        assertThat(r.rescalable()).isFalse();
        assertThat(r.reason()).contains("tagged 'Fogged'").contains("scatter is not absorption");
    }

    @Test
    void aFixedLayerIsNotRescaledAndKeepsItsUsualWording() {
        SampleInfo s = sample(Geometry.REGULAR);
        SampleRescaling r = SampleRescaling.of(material(Scaling.FIXED, List.of(), s), s);
        assertThat(r.rescalable()).isFalse();
        assertThat(r.reason()).isNull();
    }
}
