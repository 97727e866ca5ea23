package org.spectralsieve.ingest;

import java.util.List;
import org.spectralsieve.library.SampleInfo;

/**
 * A stored import: the sample (new, or the existing one when {@code duplicate}), its material, and
 * what was read.
 */
public record ImportResult(long materialId, String materialSlug, boolean newMaterial, SampleInfo sample,
                           boolean duplicate, FilePreview preview, List<String> warnings) {

    public ImportResult {
        warnings = List.copyOf(warnings);
    }

    public long sampleId() {
        return sample.id();
    }
}
