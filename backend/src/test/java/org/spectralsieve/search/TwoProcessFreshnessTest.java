package org.spectralsieve.search;

import static org.assertj.core.api.Assertions.assertThat;

import com.zaxxer.hikari.HikariDataSource;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.flywaydb.core.Flyway;
import org.jooq.DSLContext;
import org.jooq.SQLDialect;
import org.jooq.impl.DSL;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.spectralsieve.ingest.Checksums;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.NewMaterial;
import org.spectralsieve.library.NewSample;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.library.SourceFile;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.spectra.ImportedSpectrumLookup;
import org.spectralsieve.spectra.ReferenceSpectrumRepository;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.weighting.SpectrumLookup;

/**
 * Two processes on one H2 file database in mixed mode ({@code AUTO_SERVER=TRUE}: the first process to open
 * the file serves it to the others over TCP): this JVM holds the search store and the imported-spectrum
 * lookup, warmed up, while the command line in a separate JVM imports a sheet and an emitter. The next
 * search and the next lookup here show them, with no call between the two processes.
 */
class TwoProcessFreshnessTest {

    @Test
    void aCommandLineImportIntoTheSharedFileIsInTheServersNextSearch(@TempDir Path dir) throws Exception {
        String url = "jdbc:h2:file:" + dir.resolve("library").toAbsolutePath() + ";AUTO_SERVER=TRUE";
        try (HikariDataSource pool = new HikariDataSource()) {
            pool.setJdbcUrl(url);
            pool.setUsername("sa");
            pool.setMaximumPoolSize(4);
            Flyway.configure().dataSource(pool).load().migrate();
            DSLContext db = DSL.using(pool, SQLDialect.H2);
            JooqLibraryRepository library = new JooqLibraryRepository(db);
            storeFirstSheet(library); // not empty: the command then leaves the demo library out
            SearchService search = new SearchService(library);
            ImportedSpectrumLookup lookup = new ImportedSpectrumLookup(new ReferenceSpectrumRepository(db),
                    SpectrumLookup.builtIn());
            var requirement = RequirementParser.parse("passes over 10% at 350 nm, class probe sheet");
            assertThat(search.search(requirement, 10).rows()).isEmpty(); // the store is built and kept
            assertThat(lookup.emitter("probe-lamp")).isEmpty();

            SieveProcess.run(dir, Map.of(), "import", SieveProcess.importFolder(dir, "Illustrative probe sheet",
                    "probe sheet").toString(), "--db-url", url).succeeded();
            SieveProcess.run(dir, Map.of(), "import-spectrum", "--kind", "emitter", "--name", "probe-lamp",
                    SieveProcess.emitterFile(dir).toString(), "--db-url", url).succeeded();

            List<String> names = search.search(requirement, 10).rows().stream().map(RankedRow::materialName).toList();
            assertThat(names).containsExactly("Illustrative probe sheet");
            assertThat(search.materialClasses()).contains("probe sheet");
            assertThat(lookup.emitter("probe-lamp")).isPresent();
            assertThat(library.generation()).as("one raise per committed write: the first sheet, the imported sheet"
                    + " (material, sample, curve and file in one transaction), the emitter").isEqualTo(3);
        }
    }

    private static void storeFirstSheet(JooqLibraryRepository library) {
        byte[] bytes = "wavelength_nm,T\n300,0.2\n400,0.7\n".getBytes(StandardCharsets.UTF_8);
        SourceFile file = new SourceFile("first.csv", "text/csv", "delimited", bytes, Checksums.sha256(bytes));
        Curve curve = Curve.of(new double[] {300, 400}, new double[] {0.2, 0.7}, 1e-3);
        library.storeImport(null, new NewMaterial("first-sheet", "Illustrative first sheet", MaterialClass.of("plastic sheet"),
                        "", List.of(), Scaling.BULK, new ConstantIndex(1.49)),
                new NewSample(2, Geometry.REGULAR, Provenance.MEASURED, "", null, "", "", 1e-3, curve, file.fileName(),
                        file.sha256()), file);
    }
}
