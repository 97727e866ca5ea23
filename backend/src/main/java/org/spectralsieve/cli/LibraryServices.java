package org.spectralsieve.cli;

import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.SampleCurves;
import org.spectralsieve.search.SearchService;
import org.spectralsieve.search.text.LibraryTextSearch;
import org.spectralsieve.weighting.SpectrumLookup;

/**
 * The library's services a read-only command uses ({@code materials}, {@code search}, {@code figures}), from
 * either wiring: the Spring context the server also runs ({@link SpringLibraryServices}) or the plain-Java
 * wiring of the same classes ({@link PlainLibraryServices}); {@link LibraryContext#open} chooses.
 * Closing it closes the database and the text index.
 */
interface LibraryServices extends AutoCloseable {

    JooqLibraryRepository repository();

    SearchService search();

    LibraryTextSearch textSearch();

    /** The built-in emitters and responses, then the imported spectra. */
    SpectrumLookup spectra();

    SampleCurves sampleCurves();

    /** Which wiring answered: {@code spring} or {@code plain} (for tests and the benchmark's check). */
    String wiring();

    @Override
    void close();
}
