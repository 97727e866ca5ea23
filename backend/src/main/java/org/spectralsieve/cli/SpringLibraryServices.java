package org.spectralsieve.cli;

import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.SampleCurves;
import org.spectralsieve.search.SearchService;
import org.spectralsieve.search.text.LibraryTextSearch;
import org.spectralsieve.weighting.SpectrumLookup;
import org.springframework.context.ConfigurableApplicationContext;

/** The services as beans of the application's Spring context (the server's wiring, without the web server). */
record SpringLibraryServices(ConfigurableApplicationContext context) implements LibraryServices {

    @Override
    public JooqLibraryRepository repository() {
        return context.getBean(JooqLibraryRepository.class);
    }

    @Override
    public SearchService search() {
        return context.getBean(SearchService.class);
    }

    @Override
    public LibraryTextSearch textSearch() {
        return context.getBean(LibraryTextSearch.class);
    }

    @Override
    public SpectrumLookup spectra() {
        return context.getBean(SpectrumLookup.class);
    }

    @Override
    public SampleCurves sampleCurves() {
        return context.getBean(SampleCurves.class);
    }

    @Override
    public String wiring() {
        return "spring";
    }

    @Override
    public void close() {
        context.close();
    }
}
