package org.spectralsieve.presets;

import java.util.List;

/**
 * One built-in preset.
 *
 * @param name       stable slug, used in links and on the command line ({@code led-395-window})
 * @param title      a short heading for a person
 * @param text       the requirement in the requirement language
 * @param reason     one line saying why the job asks for this, in our own words
 * @param sourceTags PRACTICE.md source tags ({@code S41}); empty where the trade's practice has no source
 * @param sourceKind what kind of source the tags are (standard, paper, guideline, data sheet, …), or
 *                   {@value #NO_SOURCE}; never a maker's or brand's name
 * @param job        the trade or job it serves
 * @param safety     true for eyewear, viewing windows and enclosures: shown with {@code SafetyCaution.TEXT}
 */
public record CataloguePreset(String name, String title, String text, String reason, List<String> sourceTags,
                              String sourceKind, String job, boolean safety) {

    public static final String NO_SOURCE = "common practice, no source";

    public CataloguePreset {
        sourceTags = List.copyOf(sourceTags);
    }

    /** {@code [S1][S2] trade magazine article}, or {@value #NO_SOURCE}. */
    public String source() {
        if (sourceTags.isEmpty()) {
            return sourceKind;
        }
        StringBuilder s = new StringBuilder();
        sourceTags.forEach(t -> s.append('[').append(t).append(']'));
        return s.append(' ').append(sourceKind).toString();
    }
}
