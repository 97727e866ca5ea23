package org.spectralsieve.seedmodel;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;

/** Small factories that keep the catalogue entries one readable statement each. */
final class Stock {

    private Stock() {
    }

    /** A bulk stock sheet modelled at each of the given stock thicknesses. */
    static MaterialSpec bulk(String slug, String name, MaterialClass materialClass, String description,
                             List<String> tags, IndexSpec index, Absorption body, double... thicknessesMm) {
        List<SampleSpec> samples = new ArrayList<>();
        for (double mm : thicknessesMm) {
            samples.add(SampleSpec.bulk(mm, body, lot(slug, mm)));
        }
        return new MaterialSpec(slug, name, materialClass, description, tags, Scaling.BULK, index, samples);
    }

    /** A fixed construction; each sample is one stack of layers. */
    static MaterialSpec fixed(String slug, String name, MaterialClass materialClass, String description,
                              List<String> tags, IndexSpec index, List<SampleSpec> samples) {
        List<SampleSpec> labelled = samples.stream().map(s -> s.withLot(lot(slug, s.thicknessMm()))).toList();
        return new MaterialSpec(slug, name, materialClass, description, tags, Scaling.FIXED, index, labelled);
    }

    static SampleSpec stack(Layer... layers) {
        List<Layer> list = List.of(layers);
        return new SampleSpec(list, Geometry.REGULAR, "unlabelled", 0.001, 190);
    }

    /** Invented lot label: workshop prefix, slug initials, thickness in µm. */
    static String lot(String slug, double mm) {
        StringBuilder initials = new StringBuilder();
        for (String word : slug.split("-")) {
            initials.append(Character.toUpperCase(word.charAt(0)));
        }
        long micrometres = BigDecimal.valueOf(mm).movePointRight(3).longValue();
        return "FH-" + initials + "-" + micrometres;
    }

    /** Applies {@code change} to every sample of a material (geometry, floor, grid start). */
    static MaterialSpec withSamples(MaterialSpec m, java.util.function.UnaryOperator<SampleSpec> change) {
        return new MaterialSpec(m.slug(), m.name(), m.materialClass(), m.description(), m.tags(), m.scaling(),
                m.index(), m.samples().stream().map(change).toList());
    }
}
