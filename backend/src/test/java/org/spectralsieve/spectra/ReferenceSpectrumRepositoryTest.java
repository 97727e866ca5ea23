package org.spectralsieve.spectra;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.spectralsieve.library.db.Tables.REFERENCE_SPECTRUM;

import org.jooq.DSLContext;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.spectralsieve.library.MigratedDatabase;
import org.spectralsieve.library.PackedArrays;
import org.spectralsieve.library.SourceFile;

/** The repository of imported spectra on a freshly migrated H2 database, without Spring. */
class ReferenceSpectrumRepositoryTest {

    private DSLContext db;
    private ReferenceSpectrumRepository repository;

    @BeforeEach
    void migrateFreshDatabase() {
        db = MigratedDatabase.freshH2();
        repository = new ReferenceSpectrumRepository(db);
    }

    @Test
    void fiveThousandPointSpectrumAndItsFileRoundTripBitExact() {
        NewReferenceSpectrum s = Spectra.random(SpectrumKind.EMITTER, "bench-lamp", 5000, 20261202);

        ReferenceSpectrum stored = repository.insert(s);
        ReferenceSpectrum back = repository.find(SpectrumKind.EMITTER, "bench-lamp").orElseThrow();

        double[] nm = s.values().wavelengthsNm();
        double[] v = s.values().values();
        for (int i = 0; i < nm.length; i++) {
            assertThat(Double.doubleToRawLongBits(back.wavelengthsNm()[i])).isEqualTo(Double.doubleToRawLongBits(nm[i]));
            assertThat(Double.doubleToRawLongBits(back.values()[i])).isEqualTo(Double.doubleToRawLongBits(v[i]));
        }
        assertThat(back).isEqualTo(stored);
        assertThat(back.kind()).isEqualTo(SpectrumKind.EMITTER);
        assertThat(back.description()).isEqualTo("illustrative bench-lamp");
        assertThat(back.provenanceNote()).isEqualTo("made up for a test");
        assertThat(back.valueColumn()).isEqualTo("power");
        assertThat(back.createdAt()).isNotNull();
        SourceFile file = repository.findSourceFile(SpectrumKind.EMITTER, "bench-lamp").orElseThrow();
        assertThat(file).isEqualTo(s.file());
        // the packed column is exactly 8 little-endian bytes per point, as curves are stored
        byte[] packed = db.select(REFERENCE_SPECTRUM.RELATIVE_VALUES).from(REFERENCE_SPECTRUM).fetchOne(REFERENCE_SPECTRUM.RELATIVE_VALUES);
        assertThat(packed).isEqualTo(PackedArrays.pack(v));
    }

    @Test
    void aNameIsUniquePerKindOnly() {
        repository.insert(Spectra.random(SpectrumKind.EMITTER, "shop-lamp", 10, 1));

        assertThatThrownBy(() -> repository.insert(Spectra.random(SpectrumKind.EMITTER, "shop-lamp", 10, 2)))
                .isInstanceOf(SpectrumNameTakenException.class).hasMessageContaining("'shop-lamp'");
        repository.insert(Spectra.random(SpectrumKind.RESPONSE, "shop-lamp", 10, 3));

        assertThat(repository.count()).isEqualTo(2);
        assertThat(repository.findAll()).extracting(ReferenceSpectrum::kind)
                .containsExactly(SpectrumKind.EMITTER, SpectrumKind.RESPONSE);
    }

    @Test
    void theUniqueConstraintCatchesARaceTheCheckMisses() {
        // a repository whose existence check is blind, as if another import committed in between
        ReferenceSpectrumRepository blind = new ReferenceSpectrumRepository(db) {
            @Override
            protected long insertRow(DSLContext t, NewReferenceSpectrum s) {
                if (s.description().equals("second")) {
                    super.insertRow(t, Spectra.random(s.kind(), s.name(), 5, 9)); // the rival, same name
                }
                return super.insertRow(t, s);
            }
        };
        NewReferenceSpectrum s = Spectra.random(SpectrumKind.RESPONSE, "resist-a", 5, 4);
        NewReferenceSpectrum second = new NewReferenceSpectrum(s.kind(), s.name(), "second", "", s.values(), s.file());

        assertThatThrownBy(() -> blind.insert(second)).isInstanceOf(SpectrumNameTakenException.class);
        assertThat(repository.count()).isZero(); // the rival rolled back with it
    }

    @Test
    void aFailedInsertLeavesNoRow() {
        ReferenceSpectrumRepository failing = new ReferenceSpectrumRepository(db) {
            @Override
            protected long insertRow(DSLContext t, NewReferenceSpectrum s) {
                super.insertRow(t, s);
                throw new IllegalStateException("disk full (simulated)");
            }
        };

        assertThatThrownBy(() -> failing.insert(Spectra.random(SpectrumKind.EMITTER, "lost-lamp", 100, 5)))
                .hasMessageContaining("simulated");
        assertThat(repository.count()).isZero();
    }

    @Test
    void retiringHidesOnlyTheNamedSpectrumOfThatKindAndKeepsItsRow() {
        repository.insert(Spectra.random(SpectrumKind.EMITTER, "lamp-a", 10, 6));
        repository.insert(Spectra.random(SpectrumKind.RESPONSE, "lamp-a", 10, 7));

        assertThat(repository.retire(SpectrumKind.EMITTER, "lamp-a")).isPresent();
        assertThat(repository.retire(SpectrumKind.EMITTER, "lamp-a")).isEmpty();

        assertThat(repository.find(SpectrumKind.EMITTER, "lamp-a")).isEmpty();
        assertThat(repository.find(SpectrumKind.RESPONSE, "lamp-a")).isPresent();
        assertThat(repository.count()).as("nothing deleted").isEqualTo(2);
        assertThat(repository.findRetired(SpectrumKind.EMITTER)).extracting(ReferenceSpectrumRepository.Retired::name)
                .containsExactly("lamp-a");
    }

    @Test
    void theTableRefusesAnUnknownKindAndAnUpperCaseName() {
        assertThatThrownBy(() -> rawInsert("lamp", "ok-name")).hasMessageContaining("REFERENCE_SPECTRUM_KIND_KNOWN");
        assertThatThrownBy(() -> rawInsert("emitter", "Upper")).hasMessageContaining("REFERENCE_SPECTRUM_NAME_LOWER");
        assertThat(repository.count()).isZero();
    }

    private void rawInsert(String kind, String name) {
        db.insertInto(REFERENCE_SPECTRUM).set(REFERENCE_SPECTRUM.KIND, kind).set(REFERENCE_SPECTRUM.NAME, name)
                .set(REFERENCE_SPECTRUM.POINT_COUNT, 2).set(REFERENCE_SPECTRUM.WAVELENGTHS_NM, new byte[16])
                .set(REFERENCE_SPECTRUM.RELATIVE_VALUES, new byte[16]).set(REFERENCE_SPECTRUM.SOURCE_FILE_NAME, "x.csv")
                .set(REFERENCE_SPECTRUM.SOURCE_FORMAT, "delimited").set(REFERENCE_SPECTRUM.SOURCE_BYTES, new byte[1])
                .set(REFERENCE_SPECTRUM.SOURCE_SHA256, "0".repeat(64)).execute();
    }
}
