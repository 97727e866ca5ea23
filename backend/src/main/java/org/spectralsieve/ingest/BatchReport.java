package org.spectralsieve.ingest;

import java.util.List;

/**
 * What a batch did, one entry per manifest row in manifest order.
 *
 * @param source       the folder or zip name
 * @param files        one report per manifest row
 * @param notInManifest files in the upload that no row names (not imported)
 */
public record BatchReport(String source, List<FileReport> files, List<String> notInManifest) {

    public BatchReport {
        files = List.copyOf(files);
        notInManifest = List.copyOf(notInManifest);
    }

    public enum Outcome { STORED, DUPLICATE, REFUSED }

    /**
     * @param line       the row's line in manifest.csv (the header is line 1)
     * @param sampleId   the stored (or, for a duplicate, the existing) sample; null when refused
     * @param message    why the row was refused; null otherwise
     * @param sampleIds  every sample the row stored or found (several for a JCAMP-DX file imported block by
     *                   block); empty when refused
     */
    public record FileReport(int line, String file, Outcome outcome, Long materialId, String material, Long sampleId,
                             String message, List<String> warnings, List<Long> sampleIds) {
        public FileReport {
            warnings = List.copyOf(warnings);
            sampleIds = sampleIds == null ? (sampleId == null ? List.of() : List.of(sampleId)) : List.copyOf(sampleIds);
        }

        public FileReport(int line, String file, Outcome outcome, Long materialId, String material, Long sampleId,
                          String message, List<String> warnings) {
            this(line, file, outcome, materialId, material, sampleId, message, warnings, null);
        }
    }

    public long count(Outcome outcome) {
        return files.stream().filter(f -> f.outcome() == outcome).count();
    }

    /** True when no row was refused: every file is stored now, this time or before. */
    public boolean allStored() {
        return count(Outcome.REFUSED) == 0;
    }
}
