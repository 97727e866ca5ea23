package org.spectralsieve.search;

import java.util.ArrayList;
import java.util.Collection;
import java.util.Comparator;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.LibraryChanges;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.SampleInfo;

/**
 * The materials (with their samples) a rebuild of the search store starts from: all of them read from the
 * database, or — when the change log names every material changed since the previous snapshot — the
 * previous snapshot's materials with only the changed ones read again (docs/search-under-load.md).
 *
 * <p>Why the partial read is sound: every write of a material or of one of its samples raises the change
 * counter naming that material in the same transaction ({@code LibraryGeneration.bump(tx, materialId)},
 * docs/freshness.md), and {@link JooqLibraryRepository#materialsChanged} answers only when the log accounts
 * for every generation in between (else the caller reads everything). A changed material that is retired
 * now is not returned by {@link JooqLibraryRepository#findMaterialsInUse} and so drops out; a restored or new
 * one comes back in. A changed material whose every change named one sample keeps the previous record with only
 * those samples read again ({@link #withSamples}). Every other material is the very record the previous snapshot
 * read, which {@link SnapshotReader#read} relies on to carry it as a whole.
 *
 * <p>Both ways give the same order (name, then id, compared in Java), so a partial rebuild lays the store's
 * rows out exactly as a whole one does.
 */
final class MaterialsRead {

    /** The order of the store's rows: by name, then id (the order the listing query asks the database for). */
    static final Comparator<Material> ORDER = Comparator.comparing(Material::name).thenComparingLong(Material::id);

    /** The order of a material's samples as the database lists them ({@code ORDER BY thickness_mm, id}). */
    static final Comparator<SampleInfo> SAMPLE_ORDER = Comparator.comparingDouble(SampleInfo::thicknessMm)
            .thenComparingLong(SampleInfo::id);

    private MaterialsRead() {
    }

    /** Every material in use, read from the database. */
    static List<Material> everything(JooqLibraryRepository library) {
        List<Material> all = new ArrayList<>(library.findMaterials(null, null));
        all.sort(ORDER);
        return List.copyOf(all);
    }

    /**
     * The previous materials with the changed ones read again, or empty when the change log cannot account
     * for every change from {@code previousGeneration} to {@code generation} (then read everything). A material
     * whose changes each named one sample ({@link LibraryChanges.Changes#samplesOnly}) is not read again: only
     * those samples are, and they replace their earlier records in the previous material ({@link #withSamples});
     * any other changed material is read again whole.
     *
     * @param previous           the previous snapshot's materials, in {@link #ORDER}
     * @param previousGeneration the change counter the previous snapshot was read at
     * @param generation         the counter read now, before any table
     * @param namedSamplesOnly   false reads every changed material whole, the way before (to measure both ways)
     */
    static Optional<List<Material>> after(JooqLibraryRepository library, List<Material> previous,
                                          long previousGeneration, long generation, boolean namedSamplesOnly) {
        if (!namedSamplesOnly) {
            return library.materialsChanged(previousGeneration, generation)
                    .map(changed -> changed.isEmpty() ? previous
                            : merged(previous, changed, library.findMaterialsInUse(changed)));
        }
        return library.changesSince(previousGeneration, generation)
                .map(changes -> changes.isEmpty() ? previous : merged(library, previous, changes));
    }

    /** {@code previous} with each changed material read again whole or, where the log allows, only its named samples. */
    private static List<Material> merged(JooqLibraryRepository library, List<Material> previous,
                                         LibraryChanges.Changes changes) {
        Map<Long, Material> previousById = new HashMap<>();
        for (Material m : previous) {
            if (changes.samplesOnly().containsKey(m.id())) {
                previousById.put(m.id(), m);
            }
        }
        Set<Long> whole = new HashSet<>(changes.wholeMaterials());
        Set<Long> namedIds = new HashSet<>();
        changes.samplesOnly().forEach((materialId, sampleIds) -> {
            if (previousById.containsKey(materialId)) {
                namedIds.addAll(sampleIds);
            } else {
                whole.add(materialId); // not in the previous snapshot (retired then): nothing to add its samples to
            }
        });
        Map<Long, SampleInfo> named = library.findSamples(namedIds);
        List<Material> reread = new ArrayList<>();
        for (Map.Entry<Long, Material> e : previousById.entrySet()) {
            Optional<Material> updated = withSamples(e.getValue(), changes.samplesOnly().get(e.getKey()), named);
            if (updated.isPresent()) {
                reread.add(updated.get());
            } else {
                whole.add(e.getKey());
            }
        }
        reread.addAll(library.findMaterialsInUse(whole));
        return merged(previous, changes.materials(), reread);
    }

    /**
     * {@code material} with the samples {@code sampleIds} as read now: each one's earlier record replaced, left out
     * when it is retired now, added when it is new; in the order the database lists a material's samples (thickness,
     * then id). Empty when a named sample is not found or belongs to another material (not a write the log names a
     * sample for: then the caller reads the material whole).
     *
     * <p>Why this equals reading the material again: the change log names a sample only for a write that changed
     * that sample's rows and nothing else of the material's ({@code LibraryGeneration.bumpConcerningSample}), so the
     * material's own row and its other samples are the records the previous snapshot read.
     */
    static Optional<Material> withSamples(Material material, Set<Long> sampleIds, Map<Long, SampleInfo> named) {
        List<SampleInfo> samples = new ArrayList<>(material.samples().size() + sampleIds.size());
        for (SampleInfo s : material.samples()) {
            if (!sampleIds.contains(s.id())) {
                samples.add(s);
            }
        }
        for (long id : sampleIds) {
            SampleInfo now = named.get(id);
            if (now == null || now.materialId() != material.id()) {
                return Optional.empty();
            }
            if (!now.retired()) {
                samples.add(now);
            }
        }
        samples.sort(SAMPLE_ORDER);
        return Optional.of(new Material(material.id(), material.slug(), material.name(), material.materialClass(),
                material.description(), material.tags(), material.scaling(), material.refractiveIndex(), samples,
                material.thicknesses(), material.revision(), material.retiredAt()));
    }

    /** {@code previous} without the changed materials, plus those of them still in use as read now, in {@link #ORDER}. */
    static List<Material> merged(List<Material> previous, Set<Long> changed, Collection<Material> reread) {
        List<Material> out = new ArrayList<>(previous.size() + reread.size());
        for (Material m : previous) {
            if (!changed.contains(m.id())) {
                out.add(m);
            }
        }
        out.addAll(reread);
        out.sort(ORDER);
        return List.copyOf(out);
    }
}
