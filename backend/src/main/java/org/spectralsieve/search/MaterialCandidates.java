package org.spectralsieve.search;

import static org.spectralsieve.search.Admission.admits;
import static org.spectralsieve.search.SearchService.made;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashSet;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import org.spectralsieve.states.StateCurve;
import java.util.Set;
import java.util.function.LongFunction;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.library.SampleRescaling;
import org.spectralsieve.library.UnusableRecordException;
import org.spectralsieve.requirement.Candidate;
import org.spectralsieve.requirement.FixedLayer;
import org.spectralsieve.requirement.MadeThicknesses;
import org.spectralsieve.requirement.MaterialEvaluation;
import org.spectralsieve.requirement.MaterialJudge;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.SampleEvaluator;
import org.spectralsieve.requirement.SampleJudge;
import org.spectralsieve.requirement.StackLayer;
import org.spectralsieve.requirement.ThicknessSpec;
import org.spectralsieve.spectrum.Curve;

/**
 * A material's admitted samples made ready for the exact judgement ({@link MaterialJudge}): each sample's decoded
 * curve (from the snapshot's cache, else read and cached), its rescaling and the thicknesses the material is made in,
 * a row saying why for each sample that could not become a candidate, and the judgement itself, through the memo of
 * recent judgements when the service keeps one ({@link JudgementMemo}); and a requirement's fixed layer, the part in
 * front, resolved to a library sample and its curve the same way ({@link #resolveLayer}).
 */
final class MaterialCandidates {

    /** Where a curve the snapshot's cache does not hold is read from: the database, or a fixed snapshot's source. */
    private final LongFunction<Optional<Curve>> readCurve;
    /**
     * Whether a sample prepared alone is found before the others are checked, and a material's made thicknesses are
     * the snapshot's, formed once ({@link #madeOf}); {@code -Dsieve.search.prepared-once=false} forms them per sample
     * and checks every sample, the way before, only so the load benchmark can time both ways (the same candidates).
     */
    private final boolean preparedOnce = !"false".equals(System.getProperty("sieve.search.prepared-once"));
    /**
     * Recent exact judgements of one sample, handed out again for the same arguments ({@link JudgementMemo},
     * docs/judgement-memo.md); null judges every sample afresh ({@code -Dsieve.search.judgement-memo=false} or
     * {@link SearchService#withoutJudgementMemo}), only so a benchmark and tests can compare both ways (the answers are the same).
     */
    volatile JudgementMemo memo = JudgementMemo.enabledByDefault()
            ? new JudgementMemo(JudgementMemo.entriesByDefault()) : null;

    /**
     * Where a sample's curves in other states (aged, printed) are read from, only for a requirement that names a state
     * ({@link Requirement#namesStates}); none by default (a snapshot formed without a database).
     */
    volatile LongFunction<List<StateCurve>> readStates = sampleId -> List.of();

    MaterialCandidates(LongFunction<Optional<Curve>> readCurve) {
        this.readCurve = Objects.requireNonNull(readCurve, "readCurve");
    }

    /**
     * The material's admitted samples, judged exactly on their stored curves (not the store's quantized
     * copy), each where it is the nearest measurement ({@link MaterialJudge}).
     *
     * @param diffuseLayer the requirement's fixed layer was measured in total geometry, so the light of every
     *                     path includes scatter
     */
    List<MaterialEvaluation> judge(Snapshot s, Material material, Requirement requirement,
                                           Optional<StackLayer> layer, boolean diffuseLayer) {
        return prepare(s, material, requirement, diffuseLayer).judge(requirement, layer);
    }

    /**
     * A material's admitted samples made ready for {@link MaterialJudge}: the candidates, and a row saying why
     * for each sample that could not become one.
     */
    record Prepared(Material material, List<Candidate> candidates, List<MaterialEvaluation> failed,
                            SampleJudge sampleJudge) {

        List<MaterialEvaluation> judge(Requirement requirement, Optional<StackLayer> layer) {
            List<MaterialEvaluation> out = new ArrayList<>(failed);
            if (!candidates.isEmpty()) {
                try {
                    out.addAll(MaterialJudge.evaluate(candidates, requirement, layer, sampleJudge));
                } catch (RuntimeException e) {
                    // the material's samples are judged together: when that fails, each says why, the search goes on
                    candidates.forEach(c -> out.add(notComputable(material, c.sampleId(), c.thicknessMm(), requirement, e)));
                }
            }
            return out;
        }

        /**
         * The row of one sample as {@link #judge} forms it, alone (never for a solved range): its failure row when
         * it could not become a candidate; every row says why when the material's judgement fails, so this one does.
         */
        List<MaterialEvaluation> judgeOne(Requirement requirement, Optional<StackLayer> layer, long sampleId) {
            for (MaterialEvaluation f : failed) {
                if (f.evaluation().sampleId() == sampleId) {
                    return List.of(f);
                }
            }
            try {
                return MaterialJudge.evaluateOne(candidates, requirement, layer, sampleId, sampleJudge);
            } catch (RuntimeException e) {
                return candidates.stream().filter(c -> c.sampleId() == sampleId)
                        .map(c -> notComputable(material, c.sampleId(), c.thicknessMm(), requirement, e)).toList();
            }
        }

        /** The samples {@link MaterialJudge} judges for the requirement's thickness (empty when that fails). */
        Set<Long> judgedSamples(ThicknessSpec spec) {
            Set<Long> out = new HashSet<>();
            try {
                MaterialJudge.choose(candidates, spec).forEach(j -> out.add(j.candidate().sampleId()));
            } catch (RuntimeException e) {
                return Set.of(); // judge() then fails the same way: every row says why, none meets
            }
            return out;
        }
    }

    Prepared prepare(Snapshot s, Material material, Requirement requirement, boolean diffuseLayer) {
        return prepare(s, material, requirement, diffuseLayer, BoundedJudgement.WHOLE_MATERIAL);
    }

    /**
     * @param only {@link BoundedJudgement#WHOLE_MATERIAL}, or the one sample to prepare (as measured a sample's row
     *             needs no other sample's curve; the thicknesses the material is made in still come from all)
     */
    Prepared prepare(Snapshot s, Material material, Requirement requirement, boolean diffuseLayer, long only) {
        MadeThicknesses made = preparedOnce ? madeOf(s, material) : made(material);
        List<Candidate> candidates = new ArrayList<>();
        List<MaterialEvaluation> failed = new ArrayList<>();
        for (SampleInfo sample : material.samples()) {
            if (preparedOnce ? (only == BoundedJudgement.WHOLE_MATERIAL || sample.id() == only) && admits(requirement, material, sample)
                    : admits(requirement, material, sample) && (only == BoundedJudgement.WHOLE_MATERIAL || sample.id() == only)) {
                try {
                    Curve curve = curve(s, sample.id()).orElseThrow(
                            () -> new IllegalStateException("the sample has no readable curve"));
                    SampleRescaling rescaling = SampleRescaling.of(material, sample);
                    Candidate candidate = new Candidate(sample.id(), material.id(), material.name(), curve,
                            sample.thicknessMm(), rescaling.rescalable(), material.refractiveIndex(), made,
                            sample.geometry() == Geometry.TOTAL || diffuseLayer, rescaling.reason());
                    candidates.add(requirement.namesStates()
                            ? candidate.withStates(readStates.apply(sample.id())) : candidate);
                } catch (RuntimeException e) {
                    failed.add(notComputable(material, sample.id(), sample.thicknessMm(), requirement, e));
                }
            }
        }
        return new Prepared(material, candidates, failed, memo != null ? memo : SampleJudge.EXACT);
    }

    /**
     * The sample's decoded curve: from the snapshot's cache, else read from the database (and cached, the
     * least recently judged making room). The cache is the snapshot's own, so a curve changed since is
     * never served: the changed library has a new snapshot.
     */
    Optional<Curve> curve(Snapshot s, long sampleId) {
        Curve cached = s.curves().get(sampleId);
        if (cached != null) {
            return Optional.of(cached);
        }
        Optional<Curve> read = readCurve.apply(sampleId);
        read.ifPresent(c -> s.curves().put(sampleId, c));
        return read;
    }

    /** An unverified row for a stored sample whose judgement failed, with the reason (docs/validation.md). */
    private static MaterialEvaluation notComputable(Material material, long sampleId, double thicknessMm,
                                                    Requirement requirement, RuntimeException e) {
        return new MaterialEvaluation(material.id(), material.name(), SampleEvaluator.notComputable(sampleId,
                Double.isFinite(thicknessMm) && thicknessMm > 0 ? thicknessMm : Double.NaN, requirement.clauses(), e));
    }

    /**
     * The material's made thicknesses as the snapshot formed them once, when {@code material} is the snapshot's own
     * object (immutable: the same object gives the same {@link #made}); else formed now. A search prepares each sample
     * of a grown material alone, and forming them for every one went over all its samples each time.
     */
    static MadeThicknesses madeOf(Snapshot s, Material material) {
        MadeThicknesses kept = s.made().get(material.id());
        return kept != null && s.materials().get(material.id()) == material ? kept : made(material);
    }

    /** The fixed layer's material and sample from the library, the curve as the layer will be used. */
    StackLayer resolveLayer(FixedLayer layer, Snapshot s) {
        List<Material> materials = s.materials().values().stream().sorted(Comparator.comparingLong(Material::id)).toList();
        LayerMatcher.Match match = LayerMatcher.resolve(layer, materials);
        Material m = match.material();
        SampleInfo sample = match.sample();
        Optional<String> unusable = SampleRescaling.unusable(m, sample);
        if (unusable.isPresent()) {
            throw new UnusableRecordException("the part in front, sample " + sample.id() + " of '" + m.name() + "', "
                    + unusable.get());
        }
        Curve curve = curve(s, sample.id()).orElseThrow(() -> new UnusableRecordException(
                "the part in front, sample " + sample.id() + " of '" + m.name() + "', has no readable curve"));
        return StackLayer.of(layer, m.id(), m.name(), m.slug(), sample.id(), curve, sample.thicknessMm(),
                SampleRescaling.of(m, sample).rescalable(), m.refractiveIndex());
    }
}
