package org.spectralsieve.library;

import java.util.List;

/**
 * What storing several curves of one file (the blocks of a JCAMP-DX file) did, in one transaction.
 *
 * @param samples one entry per curve, in the order given
 * @param newMaterial true when the material was created by this import
 */
public record StoredBlocks(long materialId, String materialSlug, boolean newMaterial, List<Stored> samples) {

    public StoredBlocks {
        samples = List.copyOf(samples);
    }

    /**
     * @param duplicate true when the material already held this curve of this file at this thickness: nothing
     *                  was written and {@code sampleId} is the existing sample
     */
    public record Stored(long sampleId, boolean duplicate) {
    }

    public boolean allDuplicates() {
        return samples.stream().allMatch(Stored::duplicate);
    }
}
