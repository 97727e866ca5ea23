package org.spectralsieve.spectra;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.UUID;
import org.flywaydb.core.Flyway;
import org.h2.jdbcx.JdbcDataSource;
import org.jooq.SQLDialect;
import org.jooq.impl.DSL;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.spectralsieve.weighting.Emitter;
import org.spectralsieve.weighting.EmitterCatalogue;
import org.spectralsieve.weighting.Response;
import org.spectralsieve.weighting.SpectrumLookup;

/** Built-ins first, imported ones after them, from a freshly migrated H2 database. */
class ImportedSpectrumLookupTest {

    private JdbcDataSource dataSource;
    private ReferenceSpectrumRepository repository;
    private ImportedSpectrumLookup lookup;

    @BeforeEach
    void migrateFreshDatabase() {
        dataSource = new JdbcDataSource();
        dataSource.setURL("jdbc:h2:mem:" + UUID.randomUUID() + ";DB_CLOSE_DELAY=-1");
        Flyway.configure().dataSource(dataSource).load().migrate();
        repository = new ReferenceSpectrumRepository(DSL.using(dataSource, SQLDialect.H2));
        lookup = new ImportedSpectrumLookup(repository, SpectrumLookup.builtIn());
    }

    @Test
    void importedSpectraFollowTheBuiltInOnes() {
        repository.insert(Spectra.of(SpectrumKind.EMITTER, "shop-led", new double[] {360, 365, 370}, new double[] {0, 1, 0}));
        repository.insert(Spectra.of(SpectrumKind.RESPONSE, "resist-b", new double[] {300, 400}, new double[] {1, 0.5}));
        lookup.refresh();

        int builtInEmitters = EmitterCatalogue.all().size();
        assertThat(lookup.emitters()).hasSize(builtInEmitters + 1);
        assertThat(lookup.emitters().subList(0, builtInEmitters)).isEqualTo(EmitterCatalogue.all());
        Emitter led = lookup.emitter("SHOP-LED ").orElseThrow();
        assertThat(led.powerAt(362.5)).isEqualTo(0.5); // straight line between (360, 0) and (365, 1)
        assertThat(led.description()).contains("imported from shop-led.csv, column 'power'");
        Response resist = lookup.response("resist-b").orElseThrow();
        assertThat(resist.weightAt(350)).isEqualTo(0.75);
        assertThat(lookup.responses().get(lookup.responses().size() - 1).name()).isEqualTo("resist-b");
    }

    @Test
    void aSpectrumStoredOrRetiredBehindTheLookupsBackIsSeenOnItsNextUse() {
        assertThat(lookup.emitters()).extracting(Emitter::name).doesNotContain("late-lamp");
        // stored through another repository on the same database, as another process would: no refresh() call
        ReferenceSpectrumRepository elsewhere = new ReferenceSpectrumRepository(DSL.using(dataSource, SQLDialect.H2));
        elsewhere.insert(Spectra.of(SpectrumKind.EMITTER, "late-lamp", new double[] {400, 500}, new double[] {1, 1}));

        assertThat(lookup.emitters()).extracting(Emitter::name).contains("late-lamp");
        assertThat(lookup.emitter("late-lamp")).isPresent();

        elsewhere.retire(SpectrumKind.EMITTER, "late-lamp");

        assertThat(lookup.emitter("late-lamp")).isEmpty();
    }

    @Test
    void anUnchangedLibraryIsNotReadAgain() {
        repository.insert(Spectra.of(SpectrumKind.RESPONSE, "resist-c", new double[] {300, 400}, new double[] {1, 0.5}));
        Response first = lookup.response("resist-c").orElseThrow();

        // the same converted object: the rows were not read and converted again
        assertThat(lookup.response("resist-c").orElseThrow()).isSameAs(first);
        assertThat(lookup.responses()).contains(first);
    }

    @Test
    void anImportedSpectrumNamedLikeABuiltInIsLeftOut() {
        // only possible when a later release adds a built-in of a name already imported
        repository.insert(Spectra.of(SpectrumKind.RESPONSE, "erythema", new double[] {300, 400}, new double[] {1, 1}));
        lookup.refresh();

        assertThat(lookup.responses()).filteredOn(r -> r.name().equals("erythema")).hasSize(1);
        assertThat(lookup.response("erythema").orElseThrow()).isSameAs(Response.erythema());
    }

    @Test
    void builtInNamesCoverBothKinds() {
        assertThat(lookup.isBuiltInName("Led-365")).isTrue();
        assertThat(lookup.isBuiltInName("erythema")).isTrue();
        assertThat(lookup.isBuiltInName("shop-lamp")).isFalse();
        assertThat(lookup.isBuiltIn(SpectrumKind.RESPONSE, "led-365")).isFalse();
    }
}
