package org.spectralsieve.library;

/**
 * What storing an imported file did.
 *
 * @param duplicate true when the same file (checksum) was already stored for the same material at the
 *                  same thickness: nothing was written and {@code sampleId} is the existing sample
 * @param newMaterial true when the material was created by this import
 */
public record StoredImport(long materialId, String materialSlug, long sampleId, boolean duplicate,
                           boolean newMaterial) {
}
