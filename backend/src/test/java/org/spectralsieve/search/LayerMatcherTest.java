package org.spectralsieve.search;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.requirement.FixedLayer;

/** The rule that turns a fixed layer's words into one library sample, on materials named as in the illustrative demo library. */
class LayerMatcherTest {

    private static long nextSample = 100;

    private static Material material(long id, String slug, String name, Scaling scaling, double... thicknesses) {
        List<SampleInfo> samples = new ArrayList<>();
        for (double mm : thicknesses) {
            samples.add(new SampleInfo(nextSample++, id, mm, Geometry.REGULAR, Provenance.MODELLED, "", null, "", "", 0.001));
        }
        return new Material(id, slug, name, MaterialClass.of("window glass"), "", List.of(), scaling,
                new ConstantIndex(1.52), samples);
    }

    private static final List<Material> LIBRARY = List.of(
            material(1, "clear-float-glass", "Clear float glass, glazier offcuts", Scaling.BULK, 2, 4, 6),
            material(2, "weathered-float-glass", "Clear float glass, ex-skylight (sun-weathered)", Scaling.BULK, 3),
            material(3, "low-iron-float-glass", "Low-iron float glass, exposure-table stock", Scaling.BULK, 4, 6),
            material(4, "uv-coated-float-glass", "Clear float glass with UV-blocking lacquer", Scaling.FIXED, 4.005),
            material(5, "uv-fused-silica", "UV-grade synthetic fused silica windows", Scaling.BULK, 1, 3, 6),
            material(6, "fused-quartz-standard", "Fused quartz plate, standard (non-UV) grade", Scaling.BULK, 2, 3));

    private static FixedLayer layer(double mm, String words) {
        return new FixedLayer(FixedLayer.Placement.BEHIND, mm, words, "behind " + mm + " mm " + words);
    }

    @Test
    void aSlugOrTheWholeNameNamesItsMaterial() {
        assertThat(LayerMatcher.material("clear-float-glass", LIBRARY).id()).isEqualTo(1);
        assertThat(LayerMatcher.material("weathered float glass", LIBRARY).id()).isEqualTo(2); // spaces read as hyphens
        assertThat(LayerMatcher.material("low iron float glass exposure table stock", LIBRARY).id()).isEqualTo(3);
    }

    @Test
    void wordsNameTheMaterialWithTheFewestExtraWords() {
        // "clear float glass": the slug clear-float-glass has no extra word, every other candidate has some
        assertThat(LayerMatcher.material("clear float glass", LIBRARY).id()).isEqualTo(1);
        assertThat(LayerMatcher.material("fused silica", LIBRARY).id()).isEqualTo(5);
        assertThat(LayerMatcher.material("low-iron", LIBRARY).id()).isEqualTo(3);
    }

    @Test
    void aTieGoesToTheOrdinaryStockWhenOnlyItsExtraWordSaysSo() {
        // "float glass": clear-float-glass and weathered-float-glass both have one extra slug word; "clear"
        // only names the ordinary kind, "weathered" a variant (common practice, no source)
        assertThat(LayerMatcher.material("float glass", LIBRARY).id()).isEqualTo(1);
    }

    @Test
    void aTieIsAmbiguousAndListsTheChoices() {
        // "glass": clear-float-glass and weathered-float-glass both have two extra slug words, and "float"
        // is not a word of the ordinary kind, so neither is preferred
        LayerResolutionException e = catchThrowableOfType(LayerResolutionException.class,
                () -> LayerMatcher.material("glass", LIBRARY));
        assertThat(e.reason()).isEqualTo(LayerResolutionException.Reason.AMBIGUOUS);
        assertThat(e.choices()).extracting(LayerResolutionException.Choice::slug)
                .containsExactly("clear-float-glass", "weathered-float-glass");
        assertThat(e.getMessage()).contains("write the slug");
    }

    @Test
    void unknownWordsSuggestTheClosestMaterials() {
        LayerResolutionException e = catchThrowableOfType(LayerResolutionException.class,
                () -> LayerMatcher.material("flaot glass", LIBRARY));
        assertThat(e.reason()).isEqualTo(LayerResolutionException.Reason.UNKNOWN);
        assertThat(e.choices().get(0).slug()).isEqualTo("clear-float-glass");
        assertThat(e.choices()).hasSizeLessThanOrEqualTo(5);
        LayerResolutionException none = catchThrowableOfType(LayerResolutionException.class,
                () -> LayerMatcher.material("purple unicorn", LIBRARY));
        assertThat(none.choices()).isEmpty();
    }

    @Test
    void aBulkMaterialUsesTheSampleClosestInThicknessByRatio() {
        // 5 mm: |ln(5/6)| = 0.182 < |ln(5/4)| = 0.223, so the 6 mm sample is rescaled
        assertThat(LayerMatcher.resolve(layer(5, "clear-float-glass"), LIBRARY).sample().thicknessMm()).isEqualTo(6);
        assertThat(LayerMatcher.resolve(layer(4, "clear-float-glass"), LIBRARY).sample().thicknessMm()).isEqualTo(4);
        assertThat(LayerMatcher.resolve(layer(2.5, "clear-float-glass"), LIBRARY).sample().thicknessMm()).isEqualTo(2);
    }

    @Test
    void aFixedMaterialIsUsedOnlyNearItsMeasuredThickness() {
        // a coated part is named by its nominal thickness: 4.005 mm is "4 mm" (NominalThickness: within 2 % or 0.002 mm)
        assertThat(LayerMatcher.resolve(layer(4, "uv-coated-float-glass"), LIBRARY).sample().thicknessMm()).isEqualTo(4.005);
        LayerResolutionException e = catchThrowableOfType(LayerResolutionException.class,
                () -> LayerMatcher.resolve(layer(3, "uv-coated-float-glass"), LIBRARY));
        assertThat(e.reason()).isEqualTo(LayerResolutionException.Reason.THICKNESS);
        assertThat(e.getMessage()).contains("4.005").contains("fixed part");
    }
}
