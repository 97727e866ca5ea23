package org.spectralsieve.search;

import static org.assertj.core.api.Assertions.assertThat;
import static org.spectralsieve.library.db.Tables.CURVE;
import static org.spectralsieve.library.db.Tables.MATERIAL;
import static org.spectralsieve.library.db.Tables.SAMPLE;

import java.util.List;
import org.jooq.DSLContext;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.NewMaterial;
import org.spectralsieve.library.NewSample;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.MigratedDatabase;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.library.db.tables.records.CurveRecord;
import org.spectralsieve.library.db.tables.records.MaterialRecord;
import org.spectralsieve.library.db.tables.records.SampleRecord;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.RequirementParser;
import org.spectralsieve.requirement.Standing;
import org.spectralsieve.seed.DemoLibraryLoader;
import org.spectralsieve.spectrum.Curve;
import org.spectralsieve.spectrum.WavelengthGrid;
import org.springframework.core.io.DefaultResourceLoader;

/**
 * A sample whose stored record fails today's checks (an index refused on reading, a thickness outside the
 * physical range: {@code SampleRescaling.unusable}) is held by the store at a storable thickness with the assumed
 * index n = 1.5, never rescaled. The search's answer must still be the exact judgement's: no screen may prove such
 * a sample missed where the exact judgement says otherwise. Two kinds of row are at stake:
 * <ul>
 *   <li>an index refused on reading: behind a layer the stack cannot be formed, the row is "could not be
 *       computed" (not judged: it ranks after every miss, so a proven miss never hides it);</li>
 *   <li>a thickness outside the range with a valid index: behind a layer the exact judgement stacks the
 *       measured curve with the material's own index, which the store does not hold.</li>
 * </ul>
 * The bad rows are written straight into the tables, past every check, as an older database or another tool
 * could have left them. Compared with {@link ExactReference} (every admitted sample judged exactly).
 */
class UnusableRecordIsNeverHiddenTest {

    /**
     * Each misses by far on a UV-dark, visibly clear curve: passes in the UV, blocks in the visible. All but the
     * last are judged exactly with the screens' proven misses held back (a layer, a weighted clause); plain
     * requirements at a thickness are picked by the store's own ranking, not by these screens.
     */
    private static final List<String> REQUIREMENTS = List.of(
            "passes over 80% at 365 nm, behind 4 mm clear float glass",
            "blocks under 1% at 600 nm, behind 4 mm clear float glass",
            "passes over 80% of led 365, behind 4 mm clear float glass",
            "passes over 80% at 365 nm and blocks under 1% at 600 nm, behind 4 mm clear float glass",
            "passes over 80% of led 365, at 3 mm",
            "passes over 80% of led 365, thickness 1 to 6 mm",
            "blocks under 1% of led 395, thickness 1 to 6 mm",
            "passes over 80% at 365 nm and luminous over 10%, at 3 mm",
            "passes over 80% at 365 nm and luminous over 10%, thickness 1 to 6 mm",
            "blocks under 1% at 600 nm and luminous over 10%, thickness 0.5 to 3 mm",
            "passes over 80% at 365 nm");

    private static JooqLibraryRepository library;
    private static long unusableIndexSample;
    private static long unusableIndexCoating;

    @BeforeAll
    static void libraryWithBadRows() {
        DSLContext db = MigratedDatabase.freshH2();
        library = new JooqLibraryRepository(db);
        new DemoLibraryLoader(library, db, new DefaultResourceLoader(), "classpath:seed-materials/").load();
        long template = uvDarkVisiblyClearSample();
        unusableIndexSample = sample(db, material(db, "Bad row huge index sheet", "bulk", 1e16), 3.0, template);
        unusableIndexCoating = sample(db, material(db, "Bad row huge index coating", "fixed", 1e308), 3.0, template);
        long oddThickness = material(db, "Bad row odd thickness sheet", "bulk", 1.49);
        sample(db, oddThickness, 1e308, template);
        sample(db, oddThickness, 1e-300, template);
    }

    @Test
    void everySearchEqualsJudgingEverySampleAndShowsTheUnusableRows() {
        List<Material> materials = library.findMaterials(null, null);
        SearchService service = new SearchService(library);
        int shown = 0;
        for (String text : REQUIREMENTS) {
            Requirement requirement = RequirementParser.parse(text);
            for (int limit : new int[] {1, 3, 10, 60}) {
                Shortlist answer = service.search(requirement, limit);
                List<RankedRow> expected = ExactReference.judgeEverySample(library, requirement, answer.layer(), materials, limit);
                assertThat(answer.rows()).as(text + " (limit " + limit + ")").containsExactlyElementsOf(expected);
                shown += (int) expected.stream().filter(r -> r.evaluation().standing() == Standing.NOT_JUDGED
                        && (r.evaluation().sampleId() == unusableIndexSample || r.evaluation().sampleId() == unusableIndexCoating)
                        && r.evaluation().clauses().get(0).explanation().contains("could not be computed")).count();
            }
        }
        // not vacuous: behind the layer both unusable-index samples are "could not be computed" rows (not judged,
        // ranked after every miss, so shown only when the list is long enough: at limit 60, four requirements)
        assertThat(shown).isEqualTo(8);
    }

    /**
     * A sample stored at a thickness outside the physical range, of a material with a valid but high index
     * (n = 4, the most a stored index may be): it cannot be rescaled, but as measured behind a layer the exact
     * judgement stacks it with its own index, and the stack's inter-reflections (T₁T₂/(1 − ρ₁ρ₂), ρ₁ about 0.4)
     * lift it about 0.01 decades above what the n = 1.5 the store holds for it would give. A threshold between
     * the two: the exact judgement meets, so the screen must not prove it missed and hold it back behind a
     * sheet that meets by less. Flat curves (illustrative, invented stock), so the figure is the stack's value.
     */
    @Test
    void aSampleOfAnUnusableThicknessBehindALayerIsJudgedWithItsOwnIndexNotHiddenByTheScreen() {
        DSLContext db = MigratedDatabase.freshH2();
        JooqLibraryRepository own = new JooqLibraryRepository(db);
        flat(own, "Flat clear test plate", "window glass", 1.5, 2.0, 0.9);
        // just under a store code's transmittance (OD 0.70), so the store's rounding up adds little to it
        double dark = Math.pow(10, -0.7001);
        long dense = flat(own, "Dense index test sheet", "plastic sheet", 4.0, 2.0, dark);
        db.update(SAMPLE).set(SAMPLE.THICKNESS_MM, 1e308).where(SAMPLE.ID.eq(dense)).execute();
        flat(own, "Grey test sheet", "plastic sheet", 1.5, 2.0, dark * 1.02);
        List<Material> materials = own.findMaterials(null, null);
        Requirement probe = RequirementParser.parse("passes over 1% of led 395, behind 2 mm flat clear test plate, class plastic sheet");
        Shortlist probed = new SearchService(own).search(probe, 10);
        double grey = figure(ExactReference.judgeEverySample(own, probe, probed.layer(), materials, 10), "Grey test sheet");
        double denseFigure = figure(ExactReference.judgeEverySample(own, probe, probed.layer(), materials, 10), "Dense index test sheet");
        assertThat(denseFigure).as("the dense sheet's stack is brighter than the grey one's").isGreaterThan(grey);

        // meets by 0.001 decades for the grey sheet, by more for the dense one
        Requirement requirement = RequirementParser.parse(String.format(java.util.Locale.ROOT,
                "passes over %.6f%% of led 395, behind 2 mm flat clear test plate, class plastic sheet", 100 * grey / Math.pow(10, 0.001)));
        Shortlist answer = new SearchService(own).search(requirement, 1);
        List<RankedRow> expected = ExactReference.judgeEverySample(own, requirement, answer.layer(), materials, 1);
        assertThat(expected).extracting(RankedRow::materialName).containsExactly("Dense index test sheet");
        assertThat(answer.rows()).containsExactlyElementsOf(expected);
    }

    private static double figure(List<RankedRow> rows, String material) {
        return rows.stream().filter(r -> r.materialName().equals(material)).findFirst().orElseThrow()
                .evaluation().clauses().get(0).value();
    }

    /** A bulk sheet of one flat transmittance, 250–800 nm every 2 nm; returns its sample's id. */
    private static long flat(JooqLibraryRepository into, String name, String materialClass, double n, double mm, double t) {
        long material = into.insertMaterial(new NewMaterial(name.toLowerCase().replace(' ', '-'), name,
                MaterialClass.of(materialClass), "illustrative, invented", List.of(), Scaling.BULK, new ConstantIndex(n)));
        double[] nm = new WavelengthGrid(250, 800, 2).points();
        double[] values = new double[nm.length];
        java.util.Arrays.fill(values, t);
        return into.insertSample(material, new NewSample(mm, Geometry.REGULAR, Provenance.MODELLED, "", null, "",
                "illustrative", 0.001, Curve.of(nm, values, 0.001), name + ".csv",
                String.format(java.util.Locale.ROOT, "%064x", name.hashCode() & 0xffffffffL)));
    }

    /** A demo sample dark at 365 nm and clear at 600 nm (a UV-blocking sheet). */
    private static long uvDarkVisiblyClearSample() {
        for (Material m : library.findMaterials(null, null)) {
            for (SampleInfo s : m.samples()) {
                Curve c = library.findCurve(s.id()).orElseThrow();
                if (c.minWavelengthNm() <= 300 && c.maxWavelengthNm() >= 700 && nearest(c, 365) < 0.01 && nearest(c, 395) < 0.05
                        && nearest(c, 600) > 0.6) {
                    return s.id();
                }
            }
        }
        throw new AssertionError("the demo library has no UV-dark, visibly clear sample");
    }

    private static double nearest(Curve c, double nm) {
        int best = 0;
        for (int i = 0; i < c.size(); i++) {
            best = Math.abs(c.wavelengthNm(i) - nm) < Math.abs(c.wavelengthNm(best) - nm) ? i : best;
        }
        return c.transmittance(best);
    }

    private static long material(DSLContext db, String name, String scaling, double n) {
        MaterialRecord m = db.newRecord(MATERIAL);
        m.setSlug(name.toLowerCase().replaceAll("[^a-z0-9]+", "-"));
        m.setName(name);
        m.setMaterialClass("plastic sheet");
        m.setScaling(scaling);
        m.setIndexKind("constant");
        m.setIndexN(n);
        m.store();
        return m.getId();
    }

    private static long sample(DSLContext db, long materialId, double thicknessMm, long templateSample) {
        SampleRecord template = db.selectFrom(SAMPLE).where(SAMPLE.ID.eq(templateSample)).fetchOne();
        SampleRecord s = db.newRecord(SAMPLE);
        s.setMaterialId(materialId);
        s.setThicknessMm(thicknessMm);
        s.setGeometry("regular");
        s.setProvenance("measured");
        s.setDetectionLimit(template.getDetectionLimit());
        s.store();
        CurveRecord c = db.selectFrom(CURVE).where(CURVE.SAMPLE_ID.eq(templateSample)).fetchOne().copy();
        c.setSampleId(s.getId());
        db.executeInsert(c);
        return s.getId();
    }
}
