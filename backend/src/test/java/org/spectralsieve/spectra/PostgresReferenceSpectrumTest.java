package org.spectralsieve.spectra;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.spectralsieve.library.db.Tables.REFERENCE_SPECTRUM;

import java.nio.charset.StandardCharsets;
import org.jooq.DSLContext;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.condition.EnabledIfEnvironmentVariable;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.ingest.ImportRequestException;
import org.spectralsieve.library.TestPostgres;
import org.spectralsieve.weighting.Emitter;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.test.context.ActiveProfiles;
import org.springframework.test.context.DynamicPropertyRegistry;
import org.springframework.test.context.DynamicPropertySource;

/**
 * The table of imported spectra on PostgreSQL, with the jOOQ code generated from H2 (names rendered
 * unquoted). Runs where {@code SIEVE_TEST_POSTGRES_URL} names a database (CI starts a fresh one); skipped
 * elsewhere. Names carry a per-run suffix, so a database kept between runs does not fail it.
 */
@EnabledIfEnvironmentVariable(named = "SIEVE_TEST_POSTGRES_URL", matches = ".+",
        disabledReason = "no PostgreSQL for tests: set SIEVE_TEST_POSTGRES_URL (and SIEVE_TEST_POSTGRES_USER/_PASSWORD)")
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.NONE)
@ActiveProfiles("postgres")
class PostgresReferenceSpectrumTest {

    private static final String RUN = Long.toString(System.nanoTime(), 36);

    @DynamicPropertySource
    static void database(DynamicPropertyRegistry registry) {
        TestPostgres.register(registry);
    }

    @Autowired
    ReferenceSpectrumRepository repository;
    @Autowired
    SpectrumImportService imports;
    @Autowired
    ImportedSpectrumLookup lookup;
    @Autowired
    DSLContext db;

    @Test
    void spectrumAndFileRoundTripBitExactOnPostgres() {
        NewReferenceSpectrum s = Spectra.random(SpectrumKind.RESPONSE, "pg-resist-" + RUN, 5000, 11);

        repository.insert(s);
        ReferenceSpectrum back = repository.find(SpectrumKind.RESPONSE, s.name()).orElseThrow();

        double[] nm = s.values().wavelengthsNm();
        double[] v = s.values().values();
        for (int i = 0; i < nm.length; i++) {
            assertThat(Double.doubleToRawLongBits(back.wavelengthsNm()[i])).isEqualTo(Double.doubleToRawLongBits(nm[i]));
            assertThat(Double.doubleToRawLongBits(back.values()[i])).isEqualTo(Double.doubleToRawLongBits(v[i]));
        }
        assertThat(back.createdAt()).isNotNull();
        assertThat(repository.findSourceFile(SpectrumKind.RESPONSE, s.name()).orElseThrow()).isEqualTo(s.file());
        assertThat(repository.retire(SpectrumKind.RESPONSE, s.name())).isPresent();
        assertThat(repository.find(SpectrumKind.RESPONSE, s.name())).isEmpty();
    }

    @Test
    void constraintsHoldOnPostgres() {
        String name = "pg-lamp-" + RUN;
        repository.insert(Spectra.random(SpectrumKind.EMITTER, name, 10, 12));

        assertThatThrownBy(() -> repository.insert(Spectra.random(SpectrumKind.EMITTER, name, 10, 13)))
                .isInstanceOf(SpectrumNameTakenException.class);
        repository.insert(Spectra.random(SpectrumKind.RESPONSE, name, 10, 14)); // unique per kind only
        assertThatThrownBy(() -> db.insertInto(REFERENCE_SPECTRUM).set(REFERENCE_SPECTRUM.KIND, "lamp")
                .set(REFERENCE_SPECTRUM.NAME, "pg-bad-" + RUN).set(REFERENCE_SPECTRUM.POINT_COUNT, 2)
                .set(REFERENCE_SPECTRUM.WAVELENGTHS_NM, new byte[16]).set(REFERENCE_SPECTRUM.RELATIVE_VALUES, new byte[16])
                .set(REFERENCE_SPECTRUM.SOURCE_FILE_NAME, "x.csv").set(REFERENCE_SPECTRUM.SOURCE_FORMAT, "delimited")
                .set(REFERENCE_SPECTRUM.SOURCE_BYTES, new byte[1]).set(REFERENCE_SPECTRUM.SOURCE_SHA256, "0".repeat(64))
                .execute()).hasMessageContaining("reference_spectrum_kind_known");
    }

    @Test
    void anImportIsUsableByNameAndATakenNameStoresNothing() throws ImportException {
        String name = "pg-led-" + RUN;
        byte[] csv = "wavelength_nm,power\n360,0\n365,1\n370,0\n".getBytes(StandardCharsets.UTF_8);

        imports.importSpectrum(SpectrumKind.EMITTER, name, "illustrative", "", "pg-led.csv", csv,
                SpectrumImportOptions.defaults());
        Emitter led = lookup.emitter(name).orElseThrow();
        int rows = repository.count();

        assertThat(led.powerAt(367.5)).isEqualTo(0.5); // straight line from (365, 1) to (370, 0)
        assertThatThrownBy(() -> imports.importSpectrum(SpectrumKind.EMITTER, name, "", "", "again.csv", csv,
                SpectrumImportOptions.defaults())).isInstanceOf(ImportRequestException.class);
        assertThat(repository.count()).isEqualTo(rows);
        imports.delete(SpectrumKind.EMITTER, name);
        assertThat(lookup.emitters()).extracting(Emitter::name).doesNotContain(name);
    }

    @Test
    void aRetiredSpectrumGivesUpItsNameAndIsRestoredOnlyWhileTheNameIsFreeOnPostgres() {
        // docs/undo.md: the name is unique among the spectra in use only (V6 changes the unique constraint)
        String name = "pg-undo-lamp-" + RUN;
        repository.insert(Spectra.random(SpectrumKind.EMITTER, name, 10, 21));
        long first = repository.retire(SpectrumKind.EMITTER, name).orElseThrow();
        repository.insert(Spectra.random(SpectrumKind.EMITTER, name, 10, 22));

        assertThatThrownBy(() -> repository.restore(SpectrumKind.EMITTER, name, first))
                .isInstanceOf(SpectrumNameTakenException.class);
        repository.retire(SpectrumKind.EMITTER, name);
        assertThat(repository.restore(SpectrumKind.EMITTER, name, first).orElseThrow().id()).isEqualTo(first);
    }
}
