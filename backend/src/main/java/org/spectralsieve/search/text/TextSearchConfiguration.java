package org.spectralsieve.search.text;

import java.nio.file.Path;
import org.spectralsieve.library.JooqLibraryRepository;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

@Configuration
public class TextSearchConfiguration {

    /** {@code sieve.index.dir}: the folder of the text index; empty keeps it in memory (docs/index-on-disk.md). */
    @Bean(destroyMethod = "close")
    LibraryTextSearch libraryTextSearch(JooqLibraryRepository library, @Value("${sieve.index.dir:}") String folder) {
        return newTextSearch(library, folder);
    }

    /** The text index in {@code folder}/text, or in memory when {@code folder} is blank; the caller closes it. */
    public static LibraryTextSearch newTextSearch(JooqLibraryRepository library, String folder) {
        return new LibraryTextSearch(library, folder.isBlank() ? null : Path.of(folder.strip()).resolve("text"));
    }
}
