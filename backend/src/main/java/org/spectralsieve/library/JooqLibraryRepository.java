package org.spectralsieve.library;

import static org.spectralsieve.library.db.Tables.CURVE;
import static org.spectralsieve.library.db.Tables.MATERIAL;
import static org.spectralsieve.library.db.Tables.SAMPLE;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.jooq.Condition;
import org.jooq.DSLContext;
import org.jooq.Record;
import org.jooq.impl.DSL;
import org.spectralsieve.library.db.tables.records.CurveRecord;
import org.spectralsieve.library.db.tables.records.MaterialRecord;
import org.spectralsieve.library.db.tables.records.SampleRecord;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.RefractiveIndex;
import org.spectralsieve.optics.SellmeierIndex;
import org.spectralsieve.optics.TabulatedIndex;
import org.spectralsieve.spectrum.Curve;

/**
 * The library in the database. All SQL goes through jOOQ; callers only ever see the library's own
 * records and core types, never generated jOOQ records.
 */
public class JooqLibraryRepository {

    private final DSLContext db;

    public JooqLibraryRepository(DSLContext db) {
        this.db = db;
    }

    public long countMaterials() {
        return db.fetchCount(MATERIAL);
    }

    /** Materials, optionally of one class and matching a free-text filter over name, description and tags. */
    public List<Material> findMaterials(String materialClass, String text) {
        Condition where = DSL.trueCondition();
        if (materialClass != null && !materialClass.isBlank()) {
            where = where.and(MATERIAL.MATERIAL_CLASS.eq(materialClass.trim().toLowerCase(Locale.ROOT)));
        }
        if (text != null && !text.isBlank()) {
            for (String word : text.trim().split("\\s+")) {
                where = where.and(MATERIAL.NAME.containsIgnoreCase(word)
                        .or(MATERIAL.DESCRIPTION.containsIgnoreCase(word))
                        .or(MATERIAL.TAGS.containsIgnoreCase(word))
                        .or(MATERIAL.MATERIAL_CLASS.containsIgnoreCase(word)));
            }
        }
        List<MaterialRecord> materials = db.selectFrom(MATERIAL).where(where).orderBy(MATERIAL.NAME, MATERIAL.ID).fetch();
        Map<Long, List<SampleInfo>> samples = samplesOf(materials.stream().map(MaterialRecord::getId).toList());
        return materials.stream().map(m -> toMaterial(m, samples.getOrDefault(m.getId(), List.of()))).toList();
    }

    public Optional<Material> findMaterial(long id) {
        return db.selectFrom(MATERIAL).where(MATERIAL.ID.eq(id)).fetchOptional()
                .map(m -> toMaterial(m, samplesOf(List.of(id)).getOrDefault(id, List.of())));
    }

    public Optional<Long> findMaterialIdBySlug(String slug) {
        return db.select(MATERIAL.ID).from(MATERIAL).where(MATERIAL.SLUG.eq(slug)).fetchOptional(MATERIAL.ID);
    }

    public Optional<SampleInfo> findSample(long id) {
        return db.selectFrom(SAMPLE).where(SAMPLE.ID.eq(id)).fetchOptional().map(JooqLibraryRepository::toSample);
    }

    public Optional<Curve> findCurve(long sampleId) {
        return db.select(CURVE.asterisk(), SAMPLE.DETECTION_LIMIT).from(CURVE).join(SAMPLE).on(SAMPLE.ID.eq(CURVE.SAMPLE_ID))
                .where(CURVE.SAMPLE_ID.eq(sampleId)).fetchOptional()
                .map(JooqLibraryRepository::toCurve);
    }

    /** Every stored curve by sample id, for building derived stores. */
    public Map<Long, Curve> findAllCurves() {
        Map<Long, Curve> curves = new LinkedHashMap<>();
        db.select(CURVE.asterisk(), SAMPLE.DETECTION_LIMIT).from(CURVE).join(SAMPLE).on(SAMPLE.ID.eq(CURVE.SAMPLE_ID))
                .orderBy(CURVE.SAMPLE_ID).fetch()
                .forEach(r -> curves.put(r.get(CURVE.SAMPLE_ID), toCurve(r)));
        return curves;
    }

    public long insertMaterial(NewMaterial material) {
        MaterialRecord row = db.newRecord(MATERIAL);
        row.setSlug(material.slug());
        row.setName(material.name());
        row.setMaterialClass(material.materialClass().label());
        row.setDescription(material.description());
        row.setTags(String.join(",", material.tags()));
        row.setScaling(material.scaling().label());
        writeIndex(row, material.refractiveIndex());
        row.store();
        return row.getId();
    }

    /** Stores a sample and its curve together: either both rows exist afterwards or neither does. */
    public long insertSample(long materialId, NewSample sample) {
        return db.transactionResult(tx -> {
            DSLContext t = tx.dsl();
            SampleRecord row = t.newRecord(SAMPLE);
            row.setMaterialId(materialId);
            row.setThicknessMm(sample.thicknessMm());
            row.setGeometry(sample.geometry().label());
            row.setProvenance(sample.provenance().label());
            row.setInstrument(sample.instrument());
            row.setMeasuredOn(sample.measuredOn());
            row.setLot(sample.lot());
            row.setNotes(sample.notes());
            row.setDetectionLimit(sample.detectionLimit());
            row.store();

            Curve curve = sample.curve();
            CurveRecord curveRow = t.newRecord(CURVE);
            curveRow.setSampleId(row.getId());
            curveRow.setPointCount(curve.size());
            curveRow.setWavelengthsNm(PackedArrays.pack(curve.wavelengthsNm()));
            curveRow.setTransmittance(PackedArrays.pack(curve.transmittances()));
            curveRow.setBelowDetection(PackedArrays.pack(curve.belowDetectionFlags()));
            curveRow.setDetectionLimits(perPointLimitsIfNeeded(curve, sample.detectionLimit()));
            curveRow.setSourceFileName(sample.sourceFileName());
            curveRow.setSourceSha256(sample.sourceSha256());
            curveRow.store();
            return row.getId();
        });
    }

    private static byte[] perPointLimitsIfNeeded(Curve curve, double sampleLimit) {
        double[] limits = curve.detectionLimits();
        boolean uniform = Arrays.stream(limits).allMatch(l -> l == sampleLimit);
        return uniform ? null : PackedArrays.pack(limits);
    }

    private Map<Long, List<SampleInfo>> samplesOf(List<Long> materialIds) {
        Map<Long, List<SampleInfo>> byMaterial = new LinkedHashMap<>();
        if (materialIds.isEmpty()) {
            return byMaterial;
        }
        db.selectFrom(SAMPLE).where(SAMPLE.MATERIAL_ID.in(materialIds))
                .orderBy(SAMPLE.THICKNESS_MM, SAMPLE.ID).fetch()
                .forEach(s -> byMaterial.computeIfAbsent(s.getMaterialId(), k -> new ArrayList<>()).add(toSample(s)));
        return byMaterial;
    }

    private static Material toMaterial(MaterialRecord m, List<SampleInfo> samples) {
        List<String> tags = m.getTags().isBlank() ? List.of() : List.of(m.getTags().split(","));
        return new Material(m.getId(), m.getSlug(), m.getName(), MaterialClass.of(m.getMaterialClass()),
                m.getDescription(), tags, Scaling.parse(m.getScaling()), readIndex(m), samples);
    }

    static SampleInfo toSample(SampleRecord s) {
        return new SampleInfo(s.getId(), s.getMaterialId(), s.getThicknessMm(), Geometry.parse(s.getGeometry()),
                Provenance.parse(s.getProvenance()), s.getInstrument(), s.getMeasuredOn(), s.getLot(), s.getNotes(),
                s.getDetectionLimit());
    }

    /** Reads a curve row joined with its sample's detection limit (used where no per-point limits are stored). */
    static Curve toCurve(Record r) {
        CurveRecord c = r.into(CURVE);
        int n = c.getPointCount();
        double[] nm = PackedArrays.unpackDoubles(c.getWavelengthsNm(), n, "curve.wavelengths_nm");
        double[] t = PackedArrays.unpackDoubles(c.getTransmittance(), n, "curve.transmittance");
        boolean[] below = PackedArrays.unpackFlags(c.getBelowDetection(), n, "curve.below_detection");
        double[] limits;
        if (c.getDetectionLimits() != null) {
            limits = PackedArrays.unpackDoubles(c.getDetectionLimits(), n, "curve.detection_limits");
        } else {
            limits = new double[n];
            Arrays.fill(limits, r.get(SAMPLE.DETECTION_LIMIT));
        }
        return Curve.of(nm, t, below, limits);
    }

    private static void writeIndex(MaterialRecord row, RefractiveIndex index) {
        // Java 17: no pattern switch yet, so an instanceof chain over the sealed hierarchy
        if (index instanceof ConstantIndex c) {
            row.setIndexKind("constant");
            row.setIndexN(c.n());
        } else if (index instanceof SellmeierIndex s) {
            row.setIndexKind("sellmeier");
            row.setIndexB(NumberLists.format(s.b()));
            row.setIndexC(NumberLists.format(s.cMicronsSquared()));
            row.setIndexValidFromNm(s.validFromNm());
            row.setIndexValidToNm(s.validToNm());
        } else if (index instanceof TabulatedIndex t) {
            row.setIndexKind("table");
            row.setIndexTableNm(NumberLists.format(t.wavelengthsNm()));
            row.setIndexTableN(NumberLists.format(t.n()));
        } else {
            throw new IllegalArgumentException("unsupported refractive-index model " + index);
        }
    }

    private static RefractiveIndex readIndex(MaterialRecord m) {
        return switch (m.getIndexKind()) {
            case "constant" -> new ConstantIndex(m.getIndexN());
            case "sellmeier" -> new SellmeierIndex(NumberLists.parse(m.getIndexB(), "material.index_b"),
                    NumberLists.parse(m.getIndexC(), "material.index_c"), m.getIndexValidFromNm(), m.getIndexValidToNm());
            case "table" -> new TabulatedIndex(NumberLists.parse(m.getIndexTableNm(), "material.index_table_nm"),
                    NumberLists.parse(m.getIndexTableN(), "material.index_table_n"));
            default -> throw new IllegalStateException("material " + m.getId() + " has unknown index kind " + m.getIndexKind());
        };
    }
}
