package org.spectralsieve.search.text;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.charset.StandardCharsets;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.UUID;
import java.util.concurrent.atomic.AtomicInteger;
import org.flywaydb.core.Flyway;
import org.h2.jdbcx.JdbcDataSource;
import org.jooq.SQLDialect;
import org.jooq.impl.DSL;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.spectralsieve.ingest.Checksums;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.JooqLibraryRevisions;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.NewMaterial;
import org.spectralsieve.library.NewSample;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.library.SourceFile;
import org.spectralsieve.library.StatedThicknesses;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.spectrum.Curve;

/**
 * Words and facets over a small fixed library (illustrative stock of the invented Fernhollow Print & Cure
 * Workshop), stored through the repository's import path on a fresh in-memory database. Every expected
 * hit and count below is worked out by hand from the four materials in {@link #storeCorpus()}.
 */
class LibraryTextSearchTest {

    private JooqLibraryRepository library;
    private JooqLibraryRepository otherProcess;
    private JooqLibraryRevisions revisions;
    private final AtomicInteger builds = new AtomicInteger();
    private LibraryTextSearch search;
    private final Map<String, Long> ids = new LinkedHashMap<>();
    private int files;

    @BeforeEach
    void storeCorpus() {
        JdbcDataSource dataSource = new JdbcDataSource();
        dataSource.setURL("jdbc:h2:mem:" + UUID.randomUUID() + ";DB_CLOSE_DELAY=-1");
        Flyway.configure().dataSource(dataSource).load().migrate();
        library = new JooqLibraryRepository(DSL.using(dataSource, SQLDialect.H2));
        otherProcess = new JooqLibraryRepository(DSL.using(dataSource, SQLDialect.H2));
        revisions = new JooqLibraryRevisions(DSL.using(dataSource, SQLDialect.H2));
        search = new LibraryTextSearch(library, generation -> builds.incrementAndGet());

        long acrylic = store(library, null, material("Fernhollow clear acrylic sheet", "plastic sheet",
                        "Cast acrylic for exposure-unit windows", List.of("cast", "glazing"), List.of(3.0, 6.0, 10.0)),
                sample(3, Geometry.REGULAR, Provenance.MEASURED, "bench spectrometer", "L-2291", "")).materialId();
        store(library, acrylic, null, sample(6, Geometry.REGULAR, Provenance.DATASHEET, "", "", "from the stock sheet"));
        ids.put("acrylic", acrylic);
        ids.put("polycarbonate", store(library, null, material("Fernhollow UV-blocking polycarbonate", "plastic sheet",
                        "Polycarbonate glazing for the finishing bench", List.of(), List.of()),
                sample(4, Geometry.TOTAL, Provenance.MEASURED, "sphere spectrometer", "", "")).materialId());
        ids.put("film", store(library, null, material("Fernhollow polyester film", "film",
                        "Clear polyester (PET) film for masks", List.of("mask"), List.of()),
                sample(0.1, Geometry.REGULAR, Provenance.MEASURED, "bench spectrometer", "", "slight haze")).materialId());
        ids.put("glass", store(library, null, material("Fernhollow float glass", "window glass",
                        "Soda-lime float glass", List.of(), List.of()),
                sample(4, Geometry.REGULAR, Provenance.MODELLED, "", "", "")).materialId());
    }

    private static NewMaterial material(String name, String materialClass, String description, List<String> tags,
                                        List<Double> stock) {
        return new NewMaterial(JooqLibraryRepository.slugFor(name), name, MaterialClass.of(materialClass), description,
                tags, Scaling.BULK, new ConstantIndex(1.5), new StatedThicknesses(stock, Double.NaN, Double.NaN));
    }

    private NewSample sample(double mm, Geometry geometry, Provenance provenance, String instrument, String lot,
                             String notes) {
        files++;
        byte[] bytes = ("wavelength_nm,T\n300,0.3\n400,0.8\n# file " + files + "\n").getBytes(StandardCharsets.UTF_8);
        Curve curve = Curve.of(new double[] {300, 400}, new double[] {0.3, 0.8}, 1e-3);
        return new NewSample(mm, geometry, provenance, instrument, null, lot, notes, 1e-3, curve,
                "file" + files + ".csv", Checksums.sha256(bytes));
    }

    private org.spectralsieve.library.StoredImport store(JooqLibraryRepository into, Long materialId, NewMaterial m,
                                                          NewSample s) {
        byte[] bytes = ("wavelength_nm,T\n300,0.3\n400,0.8\n# file " + files + "\n").getBytes(StandardCharsets.UTF_8);
        SourceFile file = new SourceFile(s.sourceFileName(), "text/csv", "delimited", bytes, Checksums.sha256(bytes));
        return into.storeImport(materialId, m, s, file);
    }

    private List<String> names(LibraryAnswer answer) {
        return answer.hits().stream().map(LibraryAnswer.Hit::name).toList();
    }

    private static Map<String, Long> counts(LibraryAnswer answer, String dimension) {
        Map<String, Long> out = new LinkedHashMap<>();
        answer.facets().get(dimension).forEach(c -> out.put(c.value(), c.count()));
        return out;
    }

    private static LibraryQuery chosen(Set<String> classes, Set<Provenance> provenances) {
        return new LibraryQuery("", classes, Set.of(), provenances, Set.of(), 20);
    }

    @Test
    void aHalfTypedWordFindsTheWordItBegins() {
        assertThat(names(search.search(LibraryQuery.words("acryl", 20)))).containsExactly("Fernhollow clear acrylic sheet");
        assertThat(names(search.search(LibraryQuery.words("polycarb", 20))))
                .containsExactly("Fernhollow UV-blocking polycarbonate");
        assertThat(names(search.search(LibraryQuery.words("polyest fil", 20)))).containsExactly("Fernhollow polyester film");
    }

    @Test
    void anInflectedWordFindsItsStem() {
        // "sheets" is stemmed to "sheet": in the acrylic's name (ranked first) and both sheets' class;
        // "windows" → "window" is in the acrylic's description and the glass's class
        assertThat(names(search.search(LibraryQuery.words("sheets", 20))))
                .containsExactly("Fernhollow clear acrylic sheet", "Fernhollow UV-blocking polycarbonate");
        assertThat(names(search.search(LibraryQuery.words("windows", 20))))
                .containsExactlyInAnyOrder("Fernhollow clear acrylic sheet", "Fernhollow float glass");
    }

    @Test
    void everyWordMustMatchSomewhereIncludingSampleFields() {
        assertThat(names(search.search(LibraryQuery.words("bench", 20))))
                .containsExactlyInAnyOrder("Fernhollow clear acrylic sheet", "Fernhollow polyester film",
                        "Fernhollow UV-blocking polycarbonate"); // instrument twice, description once
        assertThat(names(search.search(LibraryQuery.words("bench spectrometer haze", 20))))
                .containsExactly("Fernhollow polyester film");
        assertThat(names(search.search(LibraryQuery.words("2291", 20)))).containsExactly("Fernhollow clear acrylic sheet");
        assertThat(names(search.search(LibraryQuery.words("datasheet", 20)))).containsExactly("Fernhollow clear acrylic sheet");
        assertThat(names(search.search(LibraryQuery.words("10 mm", 20)))).containsExactly("Fernhollow clear acrylic sheet");
        assertThat(search.search(LibraryQuery.words("quartz", 20)).hits()).isEmpty();
    }

    @Test
    void aTagOutweighsTheSameWordInADescription() {
        assertThat(names(search.search(LibraryQuery.words("glazing", 20))))
                .containsExactly("Fernhollow clear acrylic sheet", "Fernhollow UV-blocking polycarbonate");
    }

    @Test
    void noWordsListsEveryMaterialByNameWithEveryFacetCounted() {
        LibraryAnswer all = search.search(LibraryQuery.words("", 20));

        assertThat(all.total()).isEqualTo(4);
        assertThat(names(all)).containsExactly("Fernhollow clear acrylic sheet", "Fernhollow float glass",
                "Fernhollow polyester film", "Fernhollow UV-blocking polycarbonate");
        assertThat(counts(all, "class")).containsExactlyInAnyOrderEntriesOf(
                Map.of("plastic sheet", 2L, "film", 1L, "window glass", 1L));
        assertThat(counts(all, "geometry")).containsExactlyInAnyOrderEntriesOf(Map.of("regular", 3L, "total", 1L));
        assertThat(counts(all, "provenance")).containsExactlyInAnyOrderEntriesOf(
                Map.of("measured", 3L, "datasheet", 1L, "modelled", 1L));
        // acrylic 3, 6, 10 mm; polycarbonate 4; film 0.1; glass 4 — each material counted once per band
        assertThat(counts(all, "thickness")).containsExactlyInAnyOrderEntriesOf(
                Map.of("under 1 mm", 1L, "3-6 mm", 3L, "6 mm and over", 1L));
    }

    @Test
    void aChosenClassKeepsItsSiblingsCountedSideways() {
        LibraryAnswer sheets = search.search(chosen(Set.of("plastic sheet"), Set.of()));

        assertThat(names(sheets)).containsExactly("Fernhollow clear acrylic sheet", "Fernhollow UV-blocking polycarbonate");
        assertThat(sheets.total()).isEqualTo(2);
        // the class dimension ignores its own choice: choosing film as well would add 1
        assertThat(counts(sheets, "class")).containsExactlyInAnyOrderEntriesOf(
                Map.of("plastic sheet", 2L, "film", 1L, "window glass", 1L));
        // the other dimensions count only the two sheets
        assertThat(counts(sheets, "geometry")).containsExactlyInAnyOrderEntriesOf(Map.of("regular", 1L, "total", 1L));
        assertThat(counts(sheets, "provenance")).containsExactlyInAnyOrderEntriesOf(
                Map.of("measured", 2L, "datasheet", 1L));
    }

    @Test
    void twoValuesOfOneFacetAreAlternatives() {
        LibraryAnswer either = search.search(chosen(Set.of("plastic sheet", "film"), Set.of()));

        assertThat(either.total()).isEqualTo(3);
        assertThat(names(either)).doesNotContain("Fernhollow float glass");
        assertThat(counts(either, "class")).containsEntry("window glass", 1L);
    }

    @Test
    void choicesInTwoFacetsMustBothHoldAndEachIsCountedWithoutItself() {
        LibraryAnswer answer = search.search(chosen(Set.of("plastic sheet"), Set.of(Provenance.DATASHEET)));

        assertThat(names(answer)).containsExactly("Fernhollow clear acrylic sheet");
        // class counted under provenance=datasheet only; provenance counted under class=plastic sheet only
        assertThat(counts(answer, "class")).containsExactlyInAnyOrderEntriesOf(Map.of("plastic sheet", 1L));
        assertThat(counts(answer, "provenance")).containsExactlyInAnyOrderEntriesOf(
                Map.of("measured", 2L, "datasheet", 1L));
        // the hit lists only the sample that is datasheet: the 6 mm one, not the measured 3 mm
        assertThat(answer.hits().get(0).samples()).hasSize(1);
        long sixMm = library.findMaterial(ids.get("acrylic")).orElseThrow().samples().stream()
                .filter(s -> s.thicknessMm() == 6).findFirst().orElseThrow().id();
        assertThat(answer.hits().get(0).samples()).containsExactly(sixMm);
    }

    @Test
    void wordsAndFacetsTogether() {
        LibraryAnswer answer = search.search(new LibraryQuery("fernhollow", Set.of(), Set.of(Geometry.TOTAL), Set.of(),
                Set.of(), 20));

        assertThat(names(answer)).containsExactly("Fernhollow UV-blocking polycarbonate");
        assertThat(counts(answer, "geometry")).containsExactlyInAnyOrderEntriesOf(Map.of("regular", 3L, "total", 1L));
    }

    @Test
    void theLimitCutsTheHitsButNotTheTotal() {
        LibraryAnswer two = search.search(LibraryQuery.words("fernhollow", 2));

        assertThat(two.hits()).hasSize(2);
        assertThat(two.total()).isEqualTo(4);
    }

    @Test
    void aMaterialStoredByAnotherProcessIsFoundByTheNextQueryAndARetiredOneIsNot() {
        assertThat(names(search.search(LibraryQuery.words("acryl", 20)))).containsExactly("Fernhollow clear acrylic sheet");

        long mirror = store(otherProcess, null, material("Fernhollow acrylic mirror blank", "plastic sheet", "", List.of(),
                List.of()), sample(2, Geometry.REGULAR, Provenance.MEASURED, "", "", "")).materialId();
        assertThat(names(search.search(LibraryQuery.words("acryl", 20))))
                .containsExactlyInAnyOrder("Fernhollow clear acrylic sheet", "Fernhollow acrylic mirror blank");
        assertThat(counts(search.search(LibraryQuery.words("", 20)), "thickness")).containsEntry("1-3 mm", 1L);

        revisions.setRetired(JooqLibraryRevisions.Kind.MATERIAL, ids.get("acrylic"), true);
        assertThat(names(search.search(LibraryQuery.words("acryl", 20)))).containsExactly("Fernhollow acrylic mirror blank");

        revisions.setRetired(JooqLibraryRevisions.Kind.MATERIAL, mirror, true);
        assertThat(search.search(LibraryQuery.words("acryl", 20)).hits()).isEmpty();
    }

    @Test
    void anUnchangedLibraryIsIndexedOnceAndEachChangeOnceMore() {
        search.search(LibraryQuery.words("acryl", 20));
        search.search(LibraryQuery.words("glass", 20));
        assertThat(builds).hasValue(1);

        revisions.setRetired(JooqLibraryRevisions.Kind.MATERIAL, ids.get("glass"), true);
        assertThat(names(search.search(LibraryQuery.words("glass", 20)))).isEmpty();
        search.search(LibraryQuery.words("glass", 20));
        assertThat(builds).hasValue(2);
    }

    @Test
    void anEmptyLibraryAnswersNothingWithoutFailing() {
        ids.values().forEach(id -> revisions.setRetired(JooqLibraryRevisions.Kind.MATERIAL, id, true));

        LibraryAnswer none = search.search(LibraryQuery.words("acryl", 20));
        assertThat(none.total()).isZero();
        assertThat(none.hits()).isEmpty();
    }

    @Test
    void anOverlongQueryOrALimitOutOfBoundsIsRefused() {
        assertThatThrownBy(() -> LibraryQuery.words("a".repeat(LibraryQuery.MAX_WORDS_LENGTH + 1), 20))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("characters");
        assertThatThrownBy(() -> LibraryQuery.words("acryl", 0)).hasMessageContaining("limit");
        assertThatThrownBy(() -> LibraryQuery.words("acryl", LibraryQuery.MAX_LIMIT + 1)).hasMessageContaining("limit");
    }
}
