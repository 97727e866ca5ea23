package org.spectralsieve.seed;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import org.jooq.DSLContext;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.MigratedDatabase;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.library.StoredStateCurve;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.Cutoffs;
import org.spectralsieve.states.StateKind;
import org.springframework.core.io.DefaultResourceLoader;

/**
 * The demo library's modelled states, loaded as a first start loads them, change in the direction the trade describes
 * (PRACTICE.md §1 "Solarization / yellowing", §2 "What this means for presets"; common practice, the curves are
 * modelled and illustrative).
 */
class DemoStatesTest {

    private static JooqLibraryRepository library;

    @BeforeAll
    static void loadTheDemoLibrary() {
        DSLContext db = MigratedDatabase.freshH2();
        library = new JooqLibraryRepository(db);
        new DemoLibraryLoader(library, db, new DefaultResourceLoader(), "classpath:seed-materials/").load();
    }

    @Test
    void agedLampCoverLosesMostNearItsCutOffWhichMovesLongerWhileTheVisibleBarelyChanges() {
        SampleInfo cover = sample("uvt-acrylic", 6);
        StoredStateCurve aged = only(cover, StateKind.AGED);
        Curve before = library.findCurve(cover.id()).orElseThrow();
        Curve after = aged.stateCurve().curve();

        assertThat(aged.stateCurve().state().exposure().hours()).isEqualTo(2000);
        assertThat(aged.stateCurve().state().describe()).contains("2000 h under").contains("lamp bank");
        assertThat(aged.notes()).contains("illustrative");
        double lossAt310 = 1 - t(after, 310) / t(before, 310);
        double lossAt400 = 1 - t(after, 400) / t(before, 400);
        double lossAt550 = 1 - t(after, 550) / t(before, 550);
        assertThat(lossAt310).isGreaterThan(0.2).isGreaterThan(3 * lossAt400);
        assertThat(Math.abs(lossAt550)).isLessThan(0.01);
        double edgeBefore = Cutoffs.edges(before, 0.5).absorptionEdgeNm().orElseThrow();
        double edgeAfter = Cutoffs.edges(after, 0.5).absorptionEdgeNm().orElseThrow();
        assertThat(edgeAfter).isGreaterThan(edgeBefore + 10);
    }

    @Test
    void printedMaskFilmIsDenserThanOd35Across350To420nmOverItsClearBaseAndLeavesSomeRed() {
        SampleInfo film = sample("inkjet-film-clear", 0.12);
        Curve base = library.findCurve(film.id()).orElseThrow();
        List<StoredStateCurve> printed = library.findStoredStateCurves(film.id(), false).stream()
                .filter(s -> s.stateCurve().state().kind() == StateKind.PRINTED).toList();
        assertThat(printed).hasSize(2);
        StoredStateCurve full = printed.stream().filter(s -> s.stateCurve().state().printing().inkLoadPercent() == 100)
                .findFirst().orElseThrow();
        StoredStateCurve light = printed.stream().filter(s -> s.stateCurve().state().printing().inkLoadPercent() == 50)
                .findFirst().orElseThrow();

        for (int nm = 350; nm <= 420; nm++) {
            double od = -Math.log10(t(full.stateCurve().curve(), nm));
            assertThat(od).as(nm + " nm").isGreaterThan(3.5);
            assertThat(t(base, nm)).as(nm + " nm, clear base").isGreaterThan(0.75);
            assertThat(t(light.stateCurve().curve(), nm)).as(nm + " nm, lighter print")
                    .isGreaterThan(t(full.stateCurve().curve(), nm));
        }
        assertThat(t(full.stateCurve().curve(), 650)).isGreaterThan(0.01);
        assertThat(full.stateCurve().state().describe()).isEqualTo("printed black, 100 % ink, density 4.0");
    }

    @Test
    void foggedVatFilmPassesLessThanNewAcrossTheBand() {
        SampleInfo vat = sample("fep-film", 0.127);
        StoredStateCurve fogged = only(vat, StateKind.AGED);
        Curve fresh = library.findCurve(vat.id()).orElseThrow();

        for (int nm = 300; nm <= 800; nm += 10) {
            assertThat(t(fogged.stateCurve().curve(), nm)).as(nm + " nm").isLessThan(t(fresh, nm));
        }
        assertThat(t(fogged.stateCurve().curve(), 405)).isLessThan(t(fresh, 405) - 0.1);
        assertThat(fogged.stateCurve().state().exposure().source()).contains("405 nm");
    }

    @Test
    void samplesWithoutModelledStatesHaveNone() {
        assertThat(library.findStateCurves(sample("uvt-acrylic", 3).id())).isEmpty();
    }

    private static SampleInfo sample(String slug, double mm) {
        long materialId = library.findMaterialIdBySlug(slug).orElseThrow();
        return library.findMaterial(materialId).orElseThrow().samples().stream().filter(s -> s.thicknessMm() == mm)
                .findFirst().orElseThrow();
    }

    private static StoredStateCurve only(SampleInfo sample, StateKind kind) {
        List<StoredStateCurve> states = library.findStoredStateCurves(sample.id(), false);
        assertThat(states).hasSize(1);
        assertThat(states.get(0).stateCurve().state().kind()).isEqualTo(kind);
        return states.get(0);
    }

    private static double t(Curve c, double nm) {
        return c.transmittanceAt(nm).orElseThrow();
    }
}
