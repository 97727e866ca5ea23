package org.spectralsieve.weighting;

import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * Where emitter and response names are resolved: the built-in catalogues, plus, at the edges, spectra the
 * user imported. Requirement clauses, the figures endpoint and the command line all resolve names through
 * one of these, so an imported spectrum is usable wherever a built-in one is.
 */
public interface SpectrumLookup {

    /** Every emitter, built-in ones first. */
    List<Emitter> emitters();

    /** Every response, built-in ones first. */
    List<Response> responses();

    /**
     * Looks an emitter up by name, ignoring case and surrounding blanks; a name not in the list may still
     * describe one ({@link EmitterCatalogue#parametric}: {@code led-370-20}, {@code blackbody-3000k}, …).
     */
    default Optional<Emitter> emitter(String name) {
        String key = key(name);
        Optional<Emitter> listed = emitters().stream().filter(e -> e.name().toLowerCase(Locale.ROOT).equals(key))
                .findFirst();
        return listed.isPresent() ? listed : EmitterCatalogue.parametric(key);
    }

    /** Looks a response up by name, ignoring case and surrounding blanks. */
    default Optional<Response> response(String name) {
        String key = key(name);
        return responses().stream().filter(r -> r.name().toLowerCase(Locale.ROOT).equals(key)).findFirst();
    }

    /** Only the built-in catalogues. */
    static SpectrumLookup builtIn() {
        return new SpectrumLookup() {
            @Override
            public List<Emitter> emitters() {
                return EmitterCatalogue.all();
            }

            @Override
            public List<Response> responses() {
                return Response.catalogue();
            }
        };
    }

    private static String key(String name) {
        return name == null ? "" : name.strip().toLowerCase(Locale.ROOT);
    }
}
