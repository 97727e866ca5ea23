package org.spectralsieve.library;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.spectralsieve.library.LibraryGenerationTest.file;
import static org.spectralsieve.library.LibraryGenerationTest.material;
import static org.spectralsieve.library.LibraryGenerationTest.sample;

import java.nio.file.Path;
import java.util.List;
import org.flywaydb.core.Flyway;
import org.h2.jdbcx.JdbcDataSource;
import org.jooq.DSLContext;
import org.jooq.SQLDialect;
import org.jooq.impl.DSL;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spectralsieve.audit.ActingUser;
import org.spectralsieve.audit.AuditTrail;
import org.spectralsieve.audit.AuditTrail.Query;
import org.spectralsieve.audit.AuditTrail.Stored;

/**
 * Audit ids keep growing across a restart of an H2 file database: the entries written before are all there, and those
 * written after get larger ids, also after a write that rolled back just before the database closed (docs/audit.md;
 * the kill itself is the crash test's, {@code -Pcrash}).
 */
class AuditIdsAfterRestartTest {

    @TempDir
    Path folder;

    private DSLContext open() {
        JdbcDataSource ds = new JdbcDataSource();
        // closed when its last connection closes (each query here opens and closes one), as when the process stops: the
        // next open reads the file again
        ds.setURL("jdbc:h2:file:" + folder.resolve("library") + ";DB_CLOSE_DELAY=0");
        ds.setUser("sa");
        Flyway.configure().dataSource(ds).load().migrate();
        return DSL.using(ds, SQLDialect.H2);
    }

    private static List<Stored> all(DSLContext db) {
        return new AuditTrail(db).page(new Query(null, AuditTrail.MAX_PAGE, null, null));
    }

    @Test
    void idsWrittenAfterReopeningAreAboveEveryIdBeforeAndNoneIsLost() {
        DSLContext first = open();
        JooqLibraryRepository library = new JooqLibraryRepository(first, ActingUser.named("wren"));
        long materialId = library.insertMaterial(material("before-restart"));
        SourceFile f = file("wavelength_nm,T\n300,0.3\n400,0.8\n");
        library.insertSample(materialId, sample(2, f), f);
        JooqLibraryRepository failing = new JooqLibraryRepository(first, ActingUser.named("wren")) {
            @Override
            protected void insertSourceFile(DSLContext t, long sampleId, SourceFile file) {
                throw new IllegalStateException("refused late");
            }
        };
        SourceFile g = file("wavelength_nm,T\n300,0.2\n400,0.7\n");
        assertThatThrownBy(() -> failing.storeImport(materialId, null, sample(3, g), g));
        List<Stored> before = all(first);

        DSLContext second = open();
        new JooqLibraryRevisions(second, ActingUser.named("juniper-admin")).setRetired(JooqLibraryRevisions.Kind.MATERIAL,
                materialId, true);
        List<Stored> after = all(second);

        assertThat(before).hasSize(2);
        assertThat(after).hasSize(3);
        assertThat(after.subList(1, 3)).containsExactlyElementsOf(before);
        assertThat(after.get(0).id()).isGreaterThan(before.get(0).id());
        assertThat(after.get(0).actor()).isEqualTo("juniper-admin");
    }
}
