/**
 * Undo without loss (docs/undo.md): retiring and restoring samples and materials, and correcting their
 * metadata as new revisions while every earlier revision stays readable. Nothing here deletes a row, and
 * the curve is never changed: it is the measurement; a revision changes how it is interpreted. Each change
 * is one transaction ({@link org.spectralsieve.library.JooqLibraryRevisions}), followed by the same
 * invalidation an import triggers, so the next search, listing or figure uses the current revision.
 */
package org.spectralsieve.curation;
