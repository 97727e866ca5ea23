package org.spectralsieve.presets;

import org.jooq.DSLContext;
import org.spectralsieve.audit.ActingUser;
import org.spectralsieve.search.SearchService;
import org.spectralsieve.search.WordedSearch;
import org.spectralsieve.search.text.LibraryTextSearch;
import org.spectralsieve.weighting.SpectrumLookup;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/** Wires the presets: a preset's text is read exactly as the search reads it (spectra, classes, words before clauses). */
@Configuration
public class PresetConfiguration {

    @Bean
    PresetLibrary presetLibrary(DSLContext db, ActingUser actor, SearchService search, SpectrumLookup spectra,
                                LibraryTextSearch text) {
        WordedSearch worded = new WordedSearch(search, text);
        return new PresetLibrary(PresetCatalogue.builtIn(), new PresetStore(db, actor),
                t -> worded.read(t, spectra, search.materialClasses()));
    }
}
