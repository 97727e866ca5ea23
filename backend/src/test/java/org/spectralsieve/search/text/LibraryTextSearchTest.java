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
    private final Map<String, byte[]> fileBytes = new LinkedHashMap<>();

    @BeforeEach
    void storeCorpus() {
        JdbcDataSource dataSource = new JdbcDataSource();
        dataSource.setURL("jdbc:h2:mem:" + UUID.randomUUID() + ";DB_CLOSE_DELAY=-1");
        Flyway.configure().dataSource(dataSource).load().migrate();
        library = new JooqLibraryRepository(DSL.using(dataSource, SQLDialect.H2));
        otherProcess = new JooqLibraryRepository(DSL.using(dataSource, SQLDialect.H2));
        revisions = new JooqLibraryRevisions(DSL.using(dataSource, SQLDialect.H2));
        search = new LibraryTextSearch(library, generation -> builds.incrementAndGet());

        // each sample's curve (wavelengths, then T) is chosen so that its spectral summary can be worked out
        // by hand: the 50 % crossing, T at 254 / 365 / 405 nm, and whether 380-780 nm is covered for τv
        long acrylic = store(library, null, material("Fernhollow clear acrylic sheet", "plastic sheet",
                        "Cast acrylic for exposure-unit windows", List.of("cast", "glazing"), List.of(3.0, 6.0, 10.0)),
                sample(3, Geometry.REGULAR, Provenance.MEASURED, "bench spectrometer", "L-2291", "",
                        ACRYLIC_3_MM_NM, ACRYLIC_3_MM_T)).materialId();
        store(library, acrylic, null, sample(6, Geometry.REGULAR, Provenance.DATASHEET, "", "", "from the stock sheet",
                ACRYLIC_6_MM_NM, ACRYLIC_6_MM_T));
        ids.put("acrylic", acrylic);
        ids.put("polycarbonate", store(library, null, material("Fernhollow UV-blocking polycarbonate", "plastic sheet",
                        "Polycarbonate glazing for the finishing bench", List.of(), List.of()),
                sample(4, Geometry.TOTAL, Provenance.MEASURED, "sphere spectrometer", "", "",
                        POLYCARBONATE_NM, POLYCARBONATE_T)).materialId());
        ids.put("film", store(library, null, material("Fernhollow polyester film", "film",
                        "Clear polyester (PET) film for masks", List.of("mask"), List.of()),
                sample(0.1, Geometry.REGULAR, Provenance.MEASURED, "bench spectrometer", "", "slight haze",
                        FILM_NM, FILM_T)).materialId());
        ids.put("glass", store(library, null, material("Fernhollow float glass", "window glass",
                        "Soda-lime float glass", List.of(), List.of()),
                sample(4, Geometry.REGULAR, Provenance.MODELLED, "", "", "", GLASS_NM, GLASS_T)).materialId());
    }

    /*
     * The corpus's curves (detection limit 0.1 %) and what they give; "50 %" is where T crosses 50 %,
     * interpolated in absorbance between the two points around it (spectrum.Cutoffs):
     * acrylic 3 mm: 50 % between 340 (20 %) and 360 nm (60 %), 356.7 nm → 340-380; T(254) 0.26 % → blocks;
     *   T(365) > 60 % → passes; 405 → passes; τv ≈ 92 % → 80 % and over.
     * acrylic 6 mm: 50 % between 380 (45 %) and 400 nm (85 %), 383.3 nm → 380-420; starts at 300 → 254 not
     *   covered; T(365) 24.5 % → partly; 405 → passes; τv ≈ 90 % → 80 % and over.
     * polycarbonate 4 mm: below detection (0.05 %) up to 380 nm, 60 % at 400 → 50 % at 399.4 nm → 380-420;
     *   254 and 365 below detection under a 0.1 % limit → blocks; 405 → passes; τv ≈ 88 % → 80 % and over.
     * film 0.1 mm: 50 % between 340 (40 %) and 360 nm (80 %), 346.4 nm → 340-380; 254 not covered; 365 and
     *   405 pass; ends at 700 nm → τv not covered.
     * glass 4 mm: 50 % between 310 (30 %) and 330 nm (80 %), 320.4 nm → 300-340; 254 not covered; 365 and 405
     *   pass; T ≥ 80 % over 380-780 nm → 80 % and over.
     */
    private static final double[] ACRYLIC_3_MM_NM = {250, 300, 340, 360, 400, 800};
    private static final double[] ACRYLIC_3_MM_T = {0.002, 0.05, 0.2, 0.6, 0.92, 0.92};
    private static final double[] ACRYLIC_6_MM_NM = {300, 340, 360, 380, 400, 800};
    private static final double[] ACRYLIC_6_MM_T = {0.003, 0.04, 0.2, 0.45, 0.85, 0.9};
    private static final double[] POLYCARBONATE_NM = {250, 380, 400, 420, 800};
    private static final double[] POLYCARBONATE_T = {0.0005, 0.0005, 0.6, 0.85, 0.88};
    private static final double[] FILM_NM = {300, 320, 340, 360, 700};
    private static final double[] FILM_T = {0.002, 0.01, 0.4, 0.8, 0.88};
    private static final double[] GLASS_NM = {290, 310, 330, 800};
    private static final double[] GLASS_T = {0.01, 0.3, 0.8, 0.9};

    private static NewMaterial material(String name, String materialClass, String description, List<String> tags,
                                        List<Double> stock) {
        return new NewMaterial(JooqLibraryRepository.slugFor(name), name, MaterialClass.of(materialClass), description,
                tags, Scaling.BULK, new ConstantIndex(1.5), new StatedThicknesses(stock, Double.NaN, Double.NaN));
    }

    private NewSample sample(double mm, Geometry geometry, Provenance provenance, String instrument, String lot,
                             String notes) {
        return sample(mm, geometry, provenance, instrument, lot, notes, new double[] {300, 400}, new double[] {0.3, 0.8});
    }

    private NewSample sample(double mm, Geometry geometry, Provenance provenance, String instrument, String lot,
                             String notes, double[] nm, double[] t) {
        files++;
        StringBuilder csv = new StringBuilder("wavelength_nm,T\n");
        for (int i = 0; i < nm.length; i++) {
            csv.append(nm[i]).append(',').append(t[i]).append('\n');
        }
        byte[] bytes = csv.append("# file ").append(files).append('\n').toString().getBytes(StandardCharsets.UTF_8);
        fileBytes.put("file" + files + ".csv", bytes);
        return new NewSample(mm, geometry, provenance, instrument, null, lot, notes, 1e-3, Curve.of(nm, t, 1e-3),
                "file" + files + ".csv", Checksums.sha256(bytes));
    }

    private org.spectralsieve.library.StoredImport store(JooqLibraryRepository into, Long materialId, NewMaterial m,
                                                          NewSample s) {
        byte[] bytes = fileBytes.get(s.sourceFileName());
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

    private static LibraryQuery spectral(String dimension, String... values) {
        return new LibraryQuery("", Set.of(), Set.of(), Set.of(), Set.of(), Map.of(dimension, Set.of(values)), 20);
    }

    @Test
    void spectralSummariesAreFacetsCountedOncePerMaterialEvenWhenItsSamplesDiffer() {
        LibraryAnswer all = search.search(LibraryQuery.words("", 20));

        // worked out by hand in the corpus comment; the acrylic's two samples differ, so it counts in two values
        assertThat(counts(all, "edge")).containsExactlyInAnyOrderEntriesOf(
                Map.of("300-340 nm", 1L, "340-380 nm", 2L, "380-420 nm", 2L));
        assertThat(counts(all, "luminous")).containsExactlyInAnyOrderEntriesOf(
                Map.of("80 % and over", 3L, "not covered", 1L));
        assertThat(counts(all, "at254")).containsExactlyInAnyOrderEntriesOf(Map.of("blocks", 2L, "not covered", 3L));
        assertThat(counts(all, "at365")).containsExactlyInAnyOrderEntriesOf(
                Map.of("passes", 3L, "partly", 1L, "blocks", 1L));
        assertThat(counts(all, "at405")).containsExactlyInAnyOrderEntriesOf(Map.of("passes", 4L));
    }

    @Test
    void aCurveThatDoesNotReach254nmIsNotCoveredThereNeverBlocking() {
        assertThat(names(search.search(spectral("at254", "blocks"))))
                .containsExactly("Fernhollow clear acrylic sheet", "Fernhollow UV-blocking polycarbonate");
        assertThat(names(search.search(spectral("at254", "not covered"))))
                .containsExactly("Fernhollow clear acrylic sheet", "Fernhollow float glass", "Fernhollow polyester film");
    }

    @Test
    void aChosenEdgeBandNarrowsTheOtherFacetsAndListsOnlyTheSamplesInIt() {
        LibraryAnswer violet = search.search(spectral("edge", "380-420 nm"));

        assertThat(names(violet)).containsExactly("Fernhollow clear acrylic sheet", "Fernhollow UV-blocking polycarbonate");
        // sideways: the edge dimension is counted as if nothing were chosen in it
        assertThat(counts(violet, "edge")).containsEntry("300-340 nm", 1L).containsEntry("340-380 nm", 2L);
        // the other dimensions count the two materials: acrylic partly and passes, polycarbonate blocks at 365 nm
        assertThat(counts(violet, "at365")).containsExactlyInAnyOrderEntriesOf(
                Map.of("passes", 1L, "partly", 1L, "blocks", 1L));
        long sixMm = library.findMaterial(ids.get("acrylic")).orElseThrow().samples().stream()
                .filter(s -> s.thicknessMm() == 6).findFirst().orElseThrow().id();
        assertThat(violet.hits().get(0).samples()).containsExactly(sixMm); // the 3 mm sample's edge is at 357 nm
    }

    @Test
    void spectralChoicesInTwoDimensionsMustBothHold() {
        LibraryQuery passesBoth = new LibraryQuery("", Set.of(), Set.of(), Set.of(), Set.of(),
                Map.of("at365", Set.of("passes"), "luminous", Set.of("80 % and over")), 20);

        // the film passes 365 nm but its curve stops at 700 nm: its τv is not covered
        assertThat(names(search.search(passesBoth)))
                .containsExactly("Fernhollow clear acrylic sheet", "Fernhollow float glass");
    }

    @Test
    void edgesBelowTheRangeDarkSheetsAndOrangeLidsFallInTheirOwnValues() {
        // a quartz sleeve over 50 % from 200 nm (edge below its range, which starts under 300 nm), a grey
        // sheet at 3 % everywhere (never rises through 50 %), an orange lid below detection up to 540 nm
        store(library, null, material("Fernhollow quartz sleeve", "optical glass", "", List.of(), List.of()),
                sample(2, Geometry.REGULAR, Provenance.DATASHEET, "", "", "", new double[] {200, 250, 800},
                        new double[] {0.7, 0.9, 0.93}));
        store(library, null, material("Fernhollow grey viewing sheet", "plastic sheet", "", List.of(), List.of()),
                sample(3, Geometry.REGULAR, Provenance.MEASURED, "", "", "", new double[] {300, 800},
                        new double[] {0.03, 0.03}));
        store(library, null, material("Fernhollow orange printer lid", "plastic sheet", "", List.of(), List.of()),
                sample(3, Geometry.REGULAR, Provenance.MEASURED, "", "", "", new double[] {300, 540, 560, 800},
                        new double[] {0.0005, 0.0005, 0.85, 0.88}));

        LibraryAnswer all = search.search(LibraryQuery.words("", 20));

        assertThat(counts(all, "edge")).containsExactlyInAnyOrderEntriesOf(Map.of("under 300 nm", 1L, "300-340 nm", 1L,
                "340-380 nm", 2L, "380-420 nm", 2L, "420 nm and over", 1L, "no edge in range", 1L));
        // τv is a weighted mean (ISO 8980-3): 3 % flat → under 10 %; the lid passes ≈ 86 % of only the light
        // from 560 nm on, 48 % of the D65·V weight on the CIE 5 nm tables (summed by hand), so τv ≈ 42 %
        assertThat(counts(all, "luminous")).containsExactlyInAnyOrderEntriesOf(
                Map.of("80 % and over", 4L, "10-50 %", 1L, "under 10 %", 1L, "not covered", 1L));
        assertThat(counts(all, "at254")).containsExactlyInAnyOrderEntriesOf(
                Map.of("passes", 1L, "blocks", 2L, "not covered", 5L));
        assertThat(counts(all, "at365")).containsExactlyInAnyOrderEntriesOf(
                Map.of("passes", 4L, "partly", 2L, "blocks", 2L));
        assertThat(counts(all, "at405")).containsExactlyInAnyOrderEntriesOf(
                Map.of("passes", 5L, "partly", 1L, "blocks", 1L));
    }

    @Test
    void anUnknownSpectralValueIsRefusedNamingTheValuesThereAre() {
        assertThatThrownBy(() -> spectral("at365", "opaque")).isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("at365 'opaque'").hasMessageContaining("passes");
    }
}
