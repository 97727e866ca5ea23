package org.spectralsieve.presets;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.spectralsieve.library.db.Tables.ACCOUNT;
import static org.spectralsieve.library.db.Tables.AUDIT_ENTRY;
import static org.spectralsieve.library.db.Tables.REQUIREMENT_PRESET;

import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.util.List;
import org.jooq.DSLContext;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.spectralsieve.audit.ActingUser;
import org.spectralsieve.library.MigratedDatabase;
import org.spectralsieve.requirement.RequirementParser;

/** The stored presets without Spring: names, ownership scopes, retiring, ids, audit entries, all-or-nothing imports. */
class PresetStoreTest {

    private static final PresetDraft.TextReader PARSE = RequirementParser::parse;

    private DSLContext db;
    private PresetStore store;

    DSLContext freshDatabase() {
        return MigratedDatabase.freshH2();
    }

    @BeforeEach
    void library() {
        db = freshDatabase();
        store = new PresetStore(db, ActingUser.named("wren"));
    }

    private static PresetDraft draft(String name, String text) {
        return new PresetDraft(name, text, "Fernhollow bench, illustrative").checked("", PARSE);
    }

    private long account(String name) {
        return db.insertInto(ACCOUNT).set(ACCOUNT.NAME, name).set(ACCOUNT.ROLE, "viewer")
                .set(ACCOUNT.PASSWORD_HASH, "not-a-real-hash").set(ACCOUNT.CREATED_AT, OffsetDateTime.now(ZoneOffset.UTC))
                .returning(ACCOUNT.ID).fetchOne().getId();
    }

    @Test
    void aRetiredPresetLeavesTheListKeepsItsRowAndItsIdIsNeverGivenAgain() {
        SavedPreset first = store.create(null, draft("Larkspur window", "passes over 85% from 380 to 410 nm"));
        SavedPreset retired = store.retire(first.id());
        SavedPreset second = store.create(null, draft("Larkspur window", "passes over 80% at 365 nm"));

        assertThat(retired.retiredAt()).isNotNull();
        assertThat(second.id()).isGreaterThan(first.id());
        assertThat(store.visibleTo(PresetCaller.LOCAL)).extracting(SavedPreset::id).containsExactly(second.id());
        assertThat(store.live(first.id())).isEmpty();
        assertThat(db.fetchCount(REQUIREMENT_PRESET)).as("nothing hard-deleted").isEqualTo(2);
    }

    @Test
    void aLiveNameIsUniquePerOwnerIgnoringCaseButFreeForAnotherOwner() {
        long wren = account("wren");
        long juniper = account("juniper");
        store.create(wren, draft("Bench window", "passes over 80% at 365 nm"));

        assertThatThrownBy(() -> store.create(wren, draft("bench WINDOW", "passes over 90% at 365 nm")))
                .isInstanceOf(PresetNameTakenException.class)
                .satisfies(e -> assertThat(((PresetNameTakenException) e).field()).isEqualTo("name"));
        SavedPreset other = store.create(juniper, draft("Bench window", "passes over 90% at 365 nm"));
        SavedPreset shared = store.create(null, draft("Bench window", "passes over 70% at 365 nm"));

        assertThat(other.ownerAccountId()).isEqualTo(juniper);
        assertThat(shared.shared()).isTrue();
        assertThat(store.visibleTo(PresetCaller.account(wren, false))).extracting(SavedPreset::ownerAccountId)
                .containsExactlyInAnyOrder(null, wren);
    }

    @Test
    void anEditKeepsTheValuesBeforeAndAfterInTheAuditTrail() {
        SavedPreset p = store.create(null, draft("Vat film", "passes over 90% from 365 to 405 nm"));
        SavedPreset edited = store.edit(p.id(), draft("Vat film - new stock", "passes over 92% from 365 to 405 nm"));

        assertThat(edited.id()).isEqualTo(p.id());
        assertThat(edited.text()).isEqualTo("passes over 92% from 365 to 405 nm");
        var entry = db.selectFrom(AUDIT_ENTRY).where(AUDIT_ENTRY.SUBJECT_KIND.eq(PresetStore.SUBJECT))
                .and(AUDIT_ENTRY.ACTION.eq("edit")).fetchOne();
        assertThat(entry.getActor()).isEqualTo("wren");
        assertThat(entry.getSubjectId()).isEqualTo(p.id());
        assertThat(entry.getBeforeJson()).contains("90%").contains("\"Vat film\"");
        assertThat(entry.getAfterJson()).contains("92%").contains("Vat film - new stock");
    }

    @Test
    void anEditToANameAnotherLivePresetHoldsIsRefusedAndChangesNothing() {
        store.create(null, draft("Lid", "blocks under 1% from 300 to 500 nm"));
        SavedPreset p = store.create(null, draft("Window", "passes over 80% at 365 nm"));

        assertThatThrownBy(() -> store.edit(p.id(), draft("LID", "passes over 80% at 365 nm")))
                .isInstanceOf(PresetNameTakenException.class);
        assertThat(store.live(p.id()).orElseThrow().name()).isEqualTo("Window");
    }

    @Test
    void anImportWithAClashStoresNothingAndNamesTheEntry() {
        store.create(null, draft("Window", "passes over 80% at 365 nm"));
        List<PresetDraft> file = List.of(draft("Lid", "blocks under 1% from 300 to 500 nm"),
                draft("Sleeve", "passes over 80% at 254 nm"), draft("window", "passes over 85% at 365 nm"));

        assertThatThrownBy(() -> store.createAll(null, file, "presets"))
                .isInstanceOf(PresetNameTakenException.class)
                .satisfies(e -> assertThat(((PresetNameTakenException) e).field()).isEqualTo("presets[2].name"));
        assertThat(store.ownedBy(null)).extracting(SavedPreset::name).containsExactly("Window");
        assertThat(db.fetchCount(AUDIT_ENTRY, AUDIT_ENTRY.ACTION.eq("import"))).as("no entry for a rolled-back import").isZero();
    }

    @Test
    void theDatabaseItselfRefusesASecondLiveNameOfOneOwner() {
        // the constraint holds against a writer that skipped the store's own check (another node, a race)
        store.create(null, draft("Window", "passes over 80% at 365 nm"));
        OffsetDateTime now = OffsetDateTime.now(ZoneOffset.UTC);
        assertThatThrownBy(() -> db.insertInto(REQUIREMENT_PRESET).set(REQUIREMENT_PRESET.NAME, "WINDOW")
                .set(REQUIREMENT_PRESET.LIVE_NAME, "window").set(REQUIREMENT_PRESET.REQUIREMENT_TEXT, "passes over 1% at 365 nm")
                .set(REQUIREMENT_PRESET.OWNER_KEY, 0L).set(REQUIREMENT_PRESET.CREATED_AT, now)
                .set(REQUIREMENT_PRESET.UPDATED_AT, now).execute())
                .satisfies(e -> assertThat(PresetStore.uniqueViolation(e)).isTrue());
    }
}
