package org.spectralsieve.ingest;

import java.util.List;
import org.spectralsieve.library.SampleInfo;

/**
 * A stored import: the sample (new, or the existing one when {@code duplicate}), its material, and
 * what was read. An import from a JCAMP-DX file with several spectra also lists, in {@code blocks}, each
 * sample it stored or found with the block it came from; {@code sample} and {@code preview} are then the
 * first block's, and {@code duplicate} is true only when every block was already stored.
 */
public record ImportResult(long materialId, String materialSlug, boolean newMaterial, SampleInfo sample,
                           boolean duplicate, FilePreview preview, List<String> warnings, List<BlockSample> blocks) {

    public ImportResult {
        warnings = List.copyOf(warnings);
        blocks = blocks == null ? List.of() : List.copyOf(blocks);
    }

    /** The result of a file without blocks. */
    public ImportResult(long materialId, String materialSlug, boolean newMaterial, SampleInfo sample, boolean duplicate,
                        FilePreview preview, List<String> warnings) {
        this(materialId, materialSlug, newMaterial, sample, duplicate, preview, warnings, List.of());
    }

    /**
     * One sample of a JCAMP-DX import and the block it holds.
     *
     * @param block     the block number as the preview lists it
     * @param duplicate true when this block of this file was already stored for the material at this thickness
     */
    public record BlockSample(int block, String title, SampleInfo sample, boolean duplicate, int pointCount) {
    }

    public long sampleId() {
        return sample.id();
    }

    /** Every sample this import stored or found: one, or one per block. */
    public List<Long> sampleIds() {
        return blocks.isEmpty() ? List.of(sample.id()) : blocks.stream().map(b -> b.sample().id()).toList();
    }
}
