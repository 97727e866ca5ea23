package org.spectralsieve.backup;

import java.util.function.Supplier;
import org.flywaydb.core.Flyway;
import org.flywaydb.core.api.MigrationInfo;
import org.jooq.DSLContext;
import org.spectralsieve.audit.ActingUser;
import org.spectralsieve.SpectralSieveApplication;
import org.spectralsieve.search.SearchService;
import org.spectralsieve.spectra.ImportedSpectrumLookup;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/** Wires backup and restore to the database, its migration version and the in-memory copies a restore replaces. */
@Configuration
class BackupConfiguration {

    @Bean
    LibraryBackup libraryBackup(DSLContext db, Flyway flyway) {
        return new LibraryBackup(db, schemaVersion(flyway), application());
    }

    /** After a restore the search store and the imported spectra are read again from the database. */
    @Bean
    LibraryRestore libraryRestore(DSLContext db, Flyway flyway, SearchService search, ImportedSpectrumLookup spectra,
                                  ActingUser actor) {
        return new LibraryRestore(db, schemaVersion(flyway), () -> {
            search.invalidate();
            spectra.refresh();
        }, actor);
    }

    /** The version of the last migration applied: an archive goes back only into a database at the same one. */
    static Supplier<String> schemaVersion(Flyway flyway) {
        return () -> {
            MigrationInfo current = flyway.info().current();
            return current == null || current.getVersion() == null ? "none" : current.getVersion().getVersion();
        };
    }

    private static String application() {
        String version = SpectralSieveApplication.class.getPackage().getImplementationVersion();
        return "Spectral Sieve " + (version == null ? "(development build)" : version);
    }
}
