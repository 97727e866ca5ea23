package org.spectralsieve.cli;

import java.util.Locale;
import java.util.Map;
import org.spectralsieve.ingest.ImportRequestException;
import org.spectralsieve.library.JooqLibraryRevisions;
import org.spectralsieve.spectra.SpectrumKind;

/**
 * What the undo commands ({@code retire}, {@code restore}, {@code correct}, {@code revisions}) act on, as the
 * first word names it, and how their refusals read on the command line (docs/undo.md).
 */
enum Curated {
    SAMPLE, MATERIAL, EMITTER, RESPONSE,
    /** A sample's curve in another state (docs/material-states.md): retired and restored, never corrected. */
    STATE_CURVE;

    static final String WORDS = "sample, material, emitter or response";

    /** The command-line option for each field a correction names, for messages that point at what to change. */
    private static final Map<String, String> OPTIONS = Map.ofEntries(Map.entry("thicknessMm", "--thickness-mm"),
            Map.entry("geometry", "--geometry"), Map.entry("instrument", "--instrument"),
            Map.entry("measuredOn", "--measured-on"), Map.entry("lot", "--lot"), Map.entry("notes", "--notes"),
            Map.entry("detectionLimit", "--detection-limit"), Map.entry("reason", "--reason"),
            Map.entry("indexN", "--index-n"), Map.entry("stockThicknesses", "--stock"),
            Map.entry("madeRange", "--made-range"), Map.entry("name", "NAME"));

    static Curated parse(String word) {
        try {
            return valueOf(word.strip().toUpperCase(Locale.ROOT).replace('-', '_'));
        } catch (IllegalArgumentException e) {
            throw new CliFailure(SieveCli.USAGE, "'" + word + "' is not one of " + WORDS
                    + " (retire and restore also take state-curve)");
        }
    }

    boolean spectrum() {
        return this == EMITTER || this == RESPONSE;
    }

    SpectrumKind spectrumKind() {
        return this == EMITTER ? SpectrumKind.EMITTER : SpectrumKind.RESPONSE;
    }

    JooqLibraryRevisions.Kind libraryKind() {
        if (spectrum() || this == STATE_CURVE) {
            throw new IllegalStateException(this + " is not a library record");
        }
        return this == SAMPLE ? JooqLibraryRevisions.Kind.SAMPLE : JooqLibraryRevisions.Kind.MATERIAL;
    }

    long id(String text) {
        try {
            return Long.parseLong(text.strip());
        } catch (NumberFormatException e) {
            throw new CliFailure(SieveCli.USAGE, name().toLowerCase(Locale.ROOT).replace('_', ' ') + " id '" + text
                    + "' is not a whole number");
        }
    }

    /** A refused value, naming the option to change rather than the HTTP field. */
    static CliFailure refused(String what, ImportRequestException e) {
        String option = OPTIONS.getOrDefault(e.field(), e.field());
        String message = e.getMessage().replaceFirst("^'" + java.util.regex.Pattern.quote(e.field()) + "': ", "");
        return new CliFailure(SieveCli.FAILED, what + ": " + option + ": " + message);
    }
}
