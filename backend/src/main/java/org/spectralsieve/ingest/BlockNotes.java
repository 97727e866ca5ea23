package org.spectralsieve.ingest;

import java.util.ArrayList;
import java.util.List;

/** How samples stored from the blocks of one JCAMP-DX file are told apart, and their warnings put together. */
final class BlockNotes {

    /** Titles are free text in the file; a sample's notes keep this much of one. */
    static final int MAX_TITLE = 300;

    private BlockNotes() {
    }

    /**
     * The sample fields with notes that start with the block's number and title, when the file holds more
     * than one spectrum (a single one needs no telling apart); the user's own notes follow on the next line.
     */
    static SampleFields withBlockNote(SampleFields f, FilePreview p) {
        if (p.blocks().size() < 2) {
            return f;
        }
        FileBlock b = p.block().orElseThrow(() -> new IllegalStateException("a block preview without its block"));
        String title = b.title().replaceAll("\\p{Cntrl}", " ").strip();
        if (title.length() > MAX_TITLE) {
            title = title.substring(0, MAX_TITLE) + "…";
        }
        String note = "JCAMP-DX block " + b.number() + " of the " + p.blocks().size() + " spectra in " + p.fileName()
                + (title.isEmpty() ? " (untitled)" : ": '" + title + "'");
        String notes = f.notes() == null || f.notes().isBlank() ? note : note + "\n" + f.notes();
        return new SampleFields(f.thicknessMm(), f.geometry(), f.provenance(), f.instrument(), f.measuredOn(), f.lot(),
                notes);
    }

    /**
     * One list of warnings for several blocks: a warning every block has (the file's text encoding, the blocks
     * list) once as it is, the others prefixed with the block they concern.
     */
    static List<String> mergeWarnings(List<FilePreview> previews, List<List<String>> perBlock) {
        List<String> merged = new ArrayList<>();
        for (String w : perBlock.get(0)) {
            if (perBlock.stream().allMatch(l -> l.contains(w)) && !merged.contains(w)) {
                merged.add(w);
            }
        }
        for (int i = 0; i < perBlock.size(); i++) {
            String prefix = previews.size() < 2 ? "" : previews.get(i).block().map(FileBlock::label).orElse("") + ": ";
            for (String w : perBlock.get(i)) {
                if (!merged.contains(w)) {
                    merged.add(prefix + w);
                }
            }
        }
        return merged;
    }
}
