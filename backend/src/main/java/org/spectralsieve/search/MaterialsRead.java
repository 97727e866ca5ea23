package org.spectralsieve.search;

import java.util.ArrayList;
import java.util.Collection;
import java.util.Comparator;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.Material;

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
 * one comes back in. Every other material is the very record the previous snapshot read.
 *
 * <p>Both ways give the same order (name, then id, compared in Java), so a partial rebuild lays the store's
 * rows out exactly as a whole one does.
 */
final class MaterialsRead {

    /** The order of the store's rows: by name, then id (the order the listing query asks the database for). */
    static final Comparator<Material> ORDER = Comparator.comparing(Material::name).thenComparingLong(Material::id);

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
     * for every change from {@code previousGeneration} to {@code generation} (then read everything).
     *
     * @param previous           the previous snapshot's materials, in {@link #ORDER}
     * @param previousGeneration the change counter the previous snapshot was read at
     * @param generation         the counter read now, before any table
     */
    static Optional<List<Material>> after(JooqLibraryRepository library, List<Material> previous,
                                          long previousGeneration, long generation) {
        return library.materialsChanged(previousGeneration, generation)
                .map(changed -> changed.isEmpty() ? previous : merged(previous, changed, library.findMaterialsInUse(changed)));
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
