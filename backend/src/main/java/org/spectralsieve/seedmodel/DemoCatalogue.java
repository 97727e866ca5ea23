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

    /**
     * The modelled curves of demo samples in other states (aged, printed), each naming a catalogue material and one
     * of its samples by thickness (docs/material-states.md).
     *
     * @throws IllegalStateException when a state names no catalogue sample
     */
    public static List<StateSpec> states() {
        List<StateSpec> all = new ArrayList<>();
        all.addAll(PlasticStock.states());
        all.addAll(FilmStock.states());
        for (StateSpec s : all) {
            sampleOf(s);
        }
        return List.copyOf(all);
    }

    /** The catalogue material and sample a state curve belongs to. */
    static java.util.Map.Entry<MaterialSpec, SampleSpec> sampleOf(StateSpec state) {
        for (MaterialSpec m : materials()) {
            if (m.slug().equals(state.materialSlug())) {
                for (SampleSpec s : m.samples()) {
                    if (s.thicknessMm() == state.sampleThicknessMm()) {
                        return java.util.Map.entry(m, s);
                    }
                }
            }
        }
        throw new IllegalStateException("state " + state.fileTag() + " names no sample " + state.materialSlug() + " at "
                + state.sampleThicknessMm() + " mm");
    }

    /** The state curves of one catalogue sample, in catalogue order. */
    public static List<StateSpec> statesOf(MaterialSpec material, SampleSpec sample) {
        return states().stream().filter(s -> s.materialSlug().equals(material.slug())
                && s.sampleThicknessMm() == sample.thicknessMm()).toList();
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
