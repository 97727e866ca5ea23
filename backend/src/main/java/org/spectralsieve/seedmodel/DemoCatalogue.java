package org.spectralsieve.seedmodel;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

/**
 * The demo library: the shared stock shelf of an invented workshop. Every name, lot and curve is invented
 * and modelled; nothing here describes a real product.
 */
public final class DemoCatalogue {

    public static final String SCENARIO = "Fernhollow Print & Cure Workshop: the shared stock shelf of a small "
            + "invented workshop that builds UV-curing rigs, exposes screen-printing stencils and encloses resin "
            + "printers. Stock names, lots and curves are invented.";

    public static final String NOTICE = "modelled, illustrative — not for design decisions";

    public static final String INSTRUMENT = "modelled (seed generator)";

    private DemoCatalogue() {
    }

    /** All materials in catalogue order; slugs are unique. */
    public static List<MaterialSpec> materials() {
        List<MaterialSpec> all = new ArrayList<>();
        all.addAll(GlassStock.materials());
        all.addAll(PlasticStock.materials());
        all.addAll(FilmStock.materials());
        all.addAll(LayeredStock.materials());
        Set<String> slugs = new HashSet<>();
        for (MaterialSpec m : all) {
            if (!slugs.add(m.slug())) {
                throw new IllegalStateException("duplicate material slug " + m.slug());
            }
        }
        return List.copyOf(all);
    }
}
