package org.spectralsieve.backup;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.jooq.DSLContext;
import org.jooq.impl.DSL;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestInstance;
import org.junit.jupiter.api.io.TempDir;
import org.spectralsieve.accounts.Account;
import org.spectralsieve.accounts.AccountAdministration;
import org.spectralsieve.accounts.Role;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.ingest.ImportFiles;
import org.spectralsieve.ingest.ImportOptions;
import org.spectralsieve.ingest.ImportResult;
import org.spectralsieve.ingest.ImportService;
import org.spectralsieve.ingest.ImportTarget;
import org.spectralsieve.ingest.SampleFields;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.library.db.Tables;
import org.spectralsieve.spectra.SpectrumImportOptions;
import org.spectralsieve.spectra.SpectrumImportService;
import org.spectralsieve.spectra.SpectrumKind;
import org.springframework.context.ConfigurableApplicationContext;
import org.springframework.security.crypto.password.PasswordEncoder;

/** Backup of an H2 library restored into another H2 library, and the archives and targets a restore refuses. */
@TestInstance(TestInstance.Lifecycle.PER_CLASS)
class BackupRestoreTest {

    @TempDir
    Path folder;

    /** One empty library for every refusal: each test also checks it is still empty afterwards. */
    private ConfigurableApplicationContext empty;

    @BeforeAll
    void startEmptyLibrary() {
        empty = LibraryApp.h2("refusals", false);
    }

    @AfterAll
    void stopEmptyLibrary() {
        empty.close();
    }

    @Test
    void anH2LibraryRestoredIntoH2IsRowForRowAndBitForBitTheSameAndAnswersTheSame() throws Exception {
        SourceLibrary source = SourceLibrary.get();
        try (ConfigurableApplicationContext target = LibraryApp.h2("target", false)) {
            LibraryRestore.Summary summary = target.getBean(LibraryRestore.class).restore(source.archive);

            assertThat(summary.curves()).isPositive();
            RestoredLibrary.assertSameAs(source.context, target);
            assertNewRowsGetUnusedIds(target, source.context.getBean(DSLContext.class));
        }
    }

    @Test
    void aCurvesMeasurementUncertaintyIsRestoredBitForBit() throws Exception {
        SourceLibrary source = SourceLibrary.get();
        var sourceDb = source.context.getBean(DSLContext.class);
        var withUncertainty = sourceDb.select(org.spectralsieve.library.db.Tables.CURVE.SAMPLE_ID,
                        org.spectralsieve.library.db.Tables.CURVE.ABSORBANCE_UNCERTAINTY)
                .from(org.spectralsieve.library.db.Tables.CURVE)
                .where(org.spectralsieve.library.db.Tables.CURVE.ABSORBANCE_UNCERTAINTY.isNotNull()).fetch();
        assertThat(withUncertainty).isNotEmpty(); // the source library imported one with a stated ±0.5 %T
        try (ConfigurableApplicationContext target = LibraryApp.h2("target-uncertainty", false)) {
            target.getBean(LibraryRestore.class).restore(source.archive);

            var targetDb = target.getBean(DSLContext.class);
            for (var row : withUncertainty) {
                byte[] restored = targetDb.select(org.spectralsieve.library.db.Tables.CURVE.ABSORBANCE_UNCERTAINTY)
                        .from(org.spectralsieve.library.db.Tables.CURVE)
                        .where(org.spectralsieve.library.db.Tables.CURVE.SAMPLE_ID.eq(row.value1()))
                        .fetchOne(org.spectralsieve.library.db.Tables.CURVE.ABSORBANCE_UNCERTAINTY);
                assertThat(restored).isEqualTo(row.value2());
            }
        }
    }

    @Test
    void stateCurvesComeBackWithTheirStateCurveFileAndRetirementAndNewOnesTakeUnusedIds() throws Exception {
        SourceLibrary source = SourceLibrary.get();
        var from = source.context.getBean(org.spectralsieve.library.JooqLibraryRepository.class);
        var sourceDb = source.context.getBean(DSLContext.class);
        var table = org.spectralsieve.library.db.Tables.SAMPLE_STATE_CURVE;
        List<Long> sampleIds = sourceDb.selectDistinct(table.SAMPLE_ID).from(table).orderBy(table.SAMPLE_ID)
                .fetch(table.SAMPLE_ID);
        assertThat(sourceDb.fetchCount(table, table.RETIRED_AT.isNotNull())).isPositive(); // one retired, one with a file
        assertThat(sourceDb.fetchCount(table, table.SOURCE_FILE_NAME.eq("workshop-sheet-aged.csv"))).isEqualTo(1);
        try (ConfigurableApplicationContext target = LibraryApp.h2("target-states", false)) {
            target.getBean(LibraryRestore.class).restore(source.archive);

            var to = target.getBean(org.spectralsieve.library.JooqLibraryRepository.class);
            long highest = 0;
            for (long sampleId : sampleIds) {
                var before = from.findStoredStateCurves(sampleId, true);
                var after = to.findStoredStateCurves(sampleId, true);
                assertThat(after).hasSameSizeAs(before);
                for (int i = 0; i < before.size(); i++) {
                    var b = before.get(i);
                    var a = after.get(i);
                    assertThat(a.id()).isEqualTo(b.id());
                    assertThat(a.stateCurve().state()).isEqualTo(b.stateCurve().state());
                    assertThat(a.retiredAt()).isEqualTo(b.retiredAt());
                    assertThat(a.stateCurve().curve().transmittances()).isEqualTo(b.stateCurve().curve().transmittances());
                    assertThat(a.stateCurve().curve().belowDetectionFlags())
                            .isEqualTo(b.stateCurve().curve().belowDetectionFlags());
                    assertThat(to.findStateCurveSourceFile(a.id())).isEqualTo(from.findStateCurveSourceFile(b.id()));
                    highest = Math.max(highest, b.id());
                }
            }
            long fresh = to.storeStateCurve(sampleIds.get(0), new org.spectralsieve.library.NewStateCurve(
                    org.spectralsieve.states.MaterialState.printed(new org.spectralsieve.states.Printing(100, Double.NaN)),
                    org.spectralsieve.spectrum.Curve.of(new double[] {350, 400}, new double[] {0.001, 0.002}, 0.0001),
                    Double.NaN, 0.0001, "", null, "modelled", "b".repeat(64)));
            assertThat(fresh).isGreaterThan(highest);
        }
    }

    /**
     * Accounts travel with the library (docs/backup.md): restored into an empty database, the archive's accounts,
     * tokens and audit entries come back with their ids and the account's password still signs in; restored into a
     * server that already has its own admin (server mode, where the first admin exists before any restore), that
     * server's accounts stand, the archive's are left out, and the archive's audit entries follow the server's own
     * in their order, ids moved up by the server's highest.
     */
    @Test
    void accountsTravelWithTheArchiveAndAServerWithItsOwnAdminKeepsItsOwnAndAppendsTheArchivesAuditEntries()
            throws Exception {
        Path archive = folder.resolve("with-accounts.zip");
        try (ConfigurableApplicationContext source = LibraryApp.h2("with-accounts", false)) {
            AccountAdministration accounts = source.getBean(AccountAdministration.class);
            Account wren = accounts.createAccount("wren", Role.EDITOR, "larkspur-lane-bench-7");
            accounts.createToken(wren, "fernhollow plate script");
            try (OutputStream out = Files.newOutputStream(archive)) {
                source.getBean(LibraryBackup.class).write(out);
            }
        }

        try (ConfigurableApplicationContext fresh = LibraryApp.h2("accounts-fresh", false)) {
            fresh.getBean(LibraryRestore.class).restore(archive);
            DSLContext db = fresh.getBean(DSLContext.class);
            assertThat(db.select(Tables.ACCOUNT.NAME).from(Tables.ACCOUNT).fetch(Tables.ACCOUNT.NAME)).containsExactly("wren");
            assertThat(db.fetchCount(Tables.API_TOKEN)).isEqualTo(1);
            String hash = db.select(Tables.ACCOUNT.PASSWORD_HASH).from(Tables.ACCOUNT).fetchOne(Tables.ACCOUNT.PASSWORD_HASH);
            assertThat(fresh.getBean(PasswordEncoder.class).matches("larkspur-lane-bench-7", hash)).isTrue();
            // account-create (1), token-create (2), then the restore's own (3)
            assertThat(db.select(Tables.AUDIT_ENTRY.ID, Tables.AUDIT_ENTRY.ACTION).from(Tables.AUDIT_ENTRY)
                    .orderBy(Tables.AUDIT_ENTRY.ID).fetch().map(r -> r.value1() + " " + r.value2()))
                    .containsExactly("1 account-create", "2 token-create", "3 restore-backup");
        }

        try (ConfigurableApplicationContext server = LibraryApp.h2("accounts-own-admin", false)) {
            server.getBean(AccountAdministration.class).createAccount("juniper-admin", Role.ADMIN, "fernhollow-ledger-42");
            server.getBean(LibraryRestore.class).restore(archive);
            DSLContext db = server.getBean(DSLContext.class);
            assertThat(db.select(Tables.ACCOUNT.NAME).from(Tables.ACCOUNT).fetch(Tables.ACCOUNT.NAME))
                    .containsExactly("juniper-admin");
            assertThat(db.fetchCount(Tables.API_TOKEN)).isZero();
            assertThat(db.select(Tables.AUDIT_ENTRY.ID, Tables.AUDIT_ENTRY.ACTION).from(Tables.AUDIT_ENTRY)
                    .orderBy(Tables.AUDIT_ENTRY.ID).fetch().map(r -> r.value1() + " " + r.value2()))
                    .containsExactly("1 account-create", "2 account-create", "3 token-create", "4 restore-backup");
            assertThat(db.select(Tables.AUDIT_ENTRY.SUMMARY).from(Tables.AUDIT_ENTRY).where(Tables.AUDIT_ENTRY.ID.eq(4L))
                    .fetchOne(Tables.AUDIT_ENTRY.SUMMARY)).contains("own accounts kept").contains("ids moved up by 1");
            // the next change gets an id past all of them
            server.getBean(AccountAdministration.class).createAccount("hazel", Role.VIEWER, "fernhollow-ledger-43");
            assertThat(db.select(DSL.max(Tables.AUDIT_ENTRY.ID)).from(Tables.AUDIT_ENTRY).fetchOne(0, Long.class)).isEqualTo(5L);
        }
    }

    /** Ids are never handed out again: the next sample and spectrum get ids above every restored id. */
    static void assertNewRowsGetUnusedIds(ConfigurableApplicationContext target, DSLContext source) throws ImportException {
        ImportResult added = target.getBean(ImportService.class).store("after-restore.csv",
                ImportFiles.csvWithThickness(2).getBytes(StandardCharsets.UTF_8), ImportOptions.defaults(),
                new ImportTarget.NewMaterial("Illustrative sheet added after a restore", MaterialClass.of("plastic sheet"),
                        Scaling.BULK, null, ""), SampleFields.thickness(2));
        long spectrum = target.getBean(SpectrumImportService.class).importSpectrum(SpectrumKind.EMITTER,
                "after-restore-lamp", "", "", "lamp.csv",
                "wavelength_nm,power\n360,0\n365,1\n370,0\n".getBytes(StandardCharsets.UTF_8),
                SpectrumImportOptions.defaults()).spectrum().id();

        assertThat(added.materialId()).isGreaterThan(RestoredLibrary.highestId(source, Tables.MATERIAL)).isPositive();
        assertThat(added.sampleId()).isGreaterThan(RestoredLibrary.highestId(source, Tables.SAMPLE));
        assertThat(spectrum).isGreaterThan(RestoredLibrary.highestId(source, Tables.REFERENCE_SPECTRUM));
    }

    @Test
    void aLibraryThatHoldsRowsIsRefusedAndKeepsItsRows() {
        SourceLibrary source = SourceLibrary.get();
        DSLContext db = source.context.getBean(DSLContext.class);
        long before = RestoredLibrary.count(db);

        assertThatThrownBy(() -> source.context.getBean(LibraryRestore.class).restore(source.archive))
                .isInstanceOf(LibraryNotEmptyException.class)
                .hasMessageContaining("not empty").hasMessageContaining("material");
        assertThat(RestoredLibrary.count(db)).isEqualTo(before);
    }

    @Test
    void aChangedCurveIsRefusedByItsEntrysChecksumBeforeAnythingIsWritten() throws Exception {
        // one bit of one stored value changed, the entry's length and the manifest left as they were
        Path tampered = Archives.altered(SourceLibrary.get().archive, folder.resolve("tampered.zip"), "curve",
                RowEdits::flipFirstTransmittanceByte, false);

        {
            ConfigurableApplicationContext target = empty;
            assertThatThrownBy(() -> target.getBean(LibraryRestore.class).restore(tampered))
                    .isInstanceOfSatisfying(ArchiveRefusedException.class,
                            e -> assertThat(e.entry()).endsWith("-curve.jsonl"))
                    .hasMessageContaining("SHA-256").hasMessageContaining("-curve.jsonl");
            assertThat(RestoredLibrary.count(target.getBean(DSLContext.class))).isZero();
        }
    }

    @Test
    void anEntryLongerThanItsManifestStatesIsRefusedWhenItRunsPast() throws Exception {
        // a digit added to one value: the entry no longer has the size the manifest states
        Path longer = Archives.altered(SourceLibrary.get().archive, folder.resolve("longer.zip"), "sample",
                text -> text.replaceFirst("\"id\":(\\d)", "\"id\":9$1"), false);

        {
            ConfigurableApplicationContext target = empty;
            assertThatThrownBy(() -> target.getBean(LibraryRestore.class).restore(longer))
                    .isInstanceOfSatisfying(ArchiveRefusedException.class,
                            e -> assertThat(e.entry()).endsWith("-sample.jsonl"))
                    .hasMessageContaining("bytes the manifest states");
            assertThat(RestoredLibrary.count(target.getBean(DSLContext.class))).isZero();
        }
    }

    @Test
    void aCurveChangedWithItsEntryChecksumIsRefusedByTheCurveChecksum() throws Exception {
        // a flipped byte in a packed array, the entry's SHA-256 recomputed: only the curve's own checksum can tell
        Path forged = Archives.altered(SourceLibrary.get().archive, folder.resolve("forged.zip"), "curve",
                RowEdits::flipFirstTransmittanceByte, true);

        {
            ConfigurableApplicationContext target = empty;
            assertThatThrownBy(() -> target.getBean(LibraryRestore.class).restore(forged))
                    .isInstanceOfSatisfying(ArchiveRefusedException.class, e -> {
                        assertThat(e.entry()).endsWith("-curve.jsonl");
                        assertThat(e.line()).isEqualTo(1);
                    })
                    .hasMessageContaining("does not match its checksums");
            assertThat(RestoredLibrary.count(target.getBean(DSLContext.class))).isZero();
        }
    }

    @Test
    void aFileThatIsNoArchiveOrHasNoManifestIsRefused() throws Exception {
        Path text = Files.writeString(folder.resolve("notes.zip"), "not a zip");
        Path noManifest = folder.resolve("no-manifest.zip");
        var entries = Archives.read(SourceLibrary.get().archive);
        entries.remove(ArchiveManifest.ENTRY);
        Archives.write(entries, noManifest);

        {
            ConfigurableApplicationContext target = empty;
            LibraryRestore restore = target.getBean(LibraryRestore.class);
            assertThatThrownBy(() -> restore.restore(text)).isInstanceOf(ArchiveRefusedException.class)
                    .hasMessageContaining("zip");
            assertThatThrownBy(() -> restore.restore(noManifest)).isInstanceOfSatisfying(ArchiveRefusedException.class,
                    e -> assertThat(e.entry()).isEqualTo("manifest.json"));
            assertThat(RestoredLibrary.count(target.getBean(DSLContext.class))).isZero();
        }
    }

    @Test
    void aRestoreTheDatabaseRefusesMidwayLeavesTheLibraryEmptyAndAGoodArchiveStillGoesIn() throws Exception {
        // the last table's first row breaks a CHECK constraint (an unknown spectrum kind) after every other
        // table is written; the archive vouches for it, so only the database can refuse it
        Path broken = Archives.altered(SourceLibrary.get().archive, folder.resolve("broken.zip"), "reference_spectrum",
                text -> text.replaceFirst("\"kind\":\"emitter\"", "\"kind\":\"lamp\""), true);

        try (ConfigurableApplicationContext target = LibraryApp.h2("midway", false)) {
            DSLContext db = target.getBean(DSLContext.class);
            LibraryRestore restore = target.getBean(LibraryRestore.class);
            assertThatThrownBy(() -> restore.restore(broken))
                    .isInstanceOfSatisfying(RestoreFailedException.class,
                            e -> assertThat(e.entry()).endsWith("-reference_spectrum.jsonl"))
                    .hasMessageContaining("nothing was restored");
            assertThat(RestoredLibrary.count(db)).isZero();

            restore.restore(SourceLibrary.get().archive);
            RestoredLibrary.assertSameAs(SourceLibrary.get().context, target);
        }
    }

    @Test
    void anArchiveFromAnotherSchemaVersionIsRefusedNamingBothVersions() throws Exception {
        var entries = Archives.read(SourceLibrary.get().archive);
        var manifest = (tools.jackson.databind.node.ObjectNode) Archives.manifest(entries);
        manifest.put("schemaVersion", "999");
        entries.put(ArchiveManifest.ENTRY, RowCodec.JSON.writeValueAsBytes(manifest));
        Path newer = folder.resolve("newer.zip");
        Archives.write(entries, newer);

        {
            ConfigurableApplicationContext target = empty;
            assertThatThrownBy(() -> target.getBean(LibraryRestore.class).restore(newer))
                    .isInstanceOf(ArchiveRefusedException.class).hasMessageContaining("999");
            assertThat(RestoredLibrary.count(target.getBean(DSLContext.class))).isZero();
        }
    }

    @Test
    void theManifestCountsEveryTableAndListsEveryCurve() throws IOException {
        SourceLibrary source = SourceLibrary.get();
        DSLContext db = source.context.getBean(DSLContext.class);
        var manifest = Archives.manifest(Archives.read(source.archive));

        assertThat(manifest.path("formatVersion").asInt()).isEqualTo(ArchiveManifest.FORMAT_VERSION);
        assertThat(manifest.path("tables").size()).isEqualTo(LibraryTables.inDependencyOrder().size());
        for (var t : manifest.path("tables")) {
            var table = LibraryTables.inDependencyOrder().stream()
                    .filter(x -> LibraryTables.name(x).equals(t.path("table").asString())).findFirst().orElseThrow();
            assertThat(t.path("rows").asLong()).as(t.path("table").asString()).isEqualTo(db.fetchCount(table));
        }
        assertThat(manifest.path("curves").size()).isEqualTo(db.fetchCount(org.spectralsieve.library.db.Tables.CURVE));
    }
}
