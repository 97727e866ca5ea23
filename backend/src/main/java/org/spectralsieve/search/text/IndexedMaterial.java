package org.spectralsieve.search.text;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.spectrum.Curve;

/**
 * What one material's document is built from ({@link LibraryIndexSchema#document}): the material with its
 * samples in use, and the spectral summary of each sample whose curve could be read, by sample id. A
 * sample whose curve is unreadable (the repository logs it and leaves it out) has no summary, so it adds
 * no spectral facet value rather than a guessed one.
 */
public record IndexedMaterial(Material material, Map<Long, SpectralSummary> summaries) {

    public IndexedMaterial {
        Objects.requireNonNull(material, "material");
        summaries = Map.copyOf(summaries);
    }

    /** Each material with the summaries of its samples' curves (sample id → curve, as the repository reads them). */
    public static List<IndexedMaterial> of(List<Material> materials, Map<Long, Curve> curves) {
        return materials.stream().map(m -> of(m, curves)).toList();
    }

    static IndexedMaterial of(Material material, Map<Long, Curve> curves) {
        Map<Long, SpectralSummary> out = new LinkedHashMap<>();
        for (SampleInfo sample : material.samples()) {
            Curve curve = curves.get(sample.id());
            if (curve != null) {
                out.put(sample.id(), SpectralSummary.of(curve));
            }
        }
        return new IndexedMaterial(material, out);
    }

    /** The summary of one of the material's samples, or null when its curve could not be read. */
    SpectralSummary summary(long sampleId) {
        return summaries.get(sampleId);
    }
}
