package org.spectralsieve.spectra;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;
import org.jooq.DSLContext;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.spectralsieve.audit.ActingUser;
import org.spectralsieve.audit.AuditTrail;
import org.spectralsieve.audit.AuditTrail.Query;
import org.spectralsieve.audit.AuditTrail.Stored;
import org.spectralsieve.library.MigratedDatabase;
import tools.jackson.databind.json.JsonMapper;

/** Importing, retiring (the API's delete) and restoring an emitter or response record one audit entry each. */
class SpectrumAuditTest {

    private DSLContext db;
    private ReferenceSpectrumRepository repository;
    private AuditTrail trail;

    @BeforeEach
    void freshLibrary() {
        db = MigratedDatabase.freshH2();
        repository = new ReferenceSpectrumRepository(db, ActingUser.named("wren"));
        trail = new AuditTrail(db);
    }

    private List<Stored> all() {
        return trail.page(new Query(null, 100, null, null));
    }

    @Test
    void importRetireAndRestoreEachWriteOneEntryWithTheSpectrumsValues() {
        ReferenceSpectrum stored = repository.insert(Spectra.random(SpectrumKind.EMITTER, "workshop-lamp", 20, 7));
        repository.retire(SpectrumKind.EMITTER, "workshop-lamp");
        repository.restore(SpectrumKind.EMITTER, "workshop-lamp", null);

        List<Stored> entries = all();
        assertThat(entries).extracting(Stored::action).containsExactly("restore", "retire", "import");
        assertThat(entries).allMatch(e -> e.subjectKind().equals("emitter") && e.subjectId() == stored.id()
                && e.actor().equals("wren") && e.materialId() == null);
        JsonMapper json = JsonMapper.builder().build();
        assertThat(entries.get(2).beforeJson()).isNull();
        assertThat(json.readTree(entries.get(2).afterJson()).path("name").asString()).isEqualTo("workshop-lamp");
        assertThat(json.readTree(entries.get(2).afterJson()).path("points").asInt()).isEqualTo(20);
        assertThat(json.readTree(entries.get(1).afterJson()).path("retiredAt").isNull()).isFalse();
        assertThat(json.readTree(entries.get(0).beforeJson()).path("retiredAt").isNull()).isFalse();
        assertThat(json.readTree(entries.get(0).afterJson()).path("retiredAt").isNull()).isTrue();
    }

    @Test
    void aRefusedImportOrAnEmptyRetireWritesNothing() {
        repository.insert(Spectra.random(SpectrumKind.RESPONSE, "leaf-response", 10, 1));

        assertThatThrownBy(() -> repository.insert(Spectra.random(SpectrumKind.RESPONSE, "leaf-response", 10, 2)))
                .isInstanceOf(SpectrumNameTakenException.class);
        assertThat(repository.retire(SpectrumKind.EMITTER, "no-such-lamp")).isEmpty();

        assertThat(all()).hasSize(1);
    }
}
