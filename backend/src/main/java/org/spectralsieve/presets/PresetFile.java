package org.spectralsieve.presets;

import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.spectralsieve.library.FieldException;
import tools.jackson.databind.JsonNode;

/**
 * The presets file, a small JSON format of our own, for moving presets between libraries and people:
 *
 * <pre>{"format": "spectral-sieve-presets", "version": 1, "exportedAt": "2026-12-05T18:00:00Z",
 *  "presets": [{"name": "…", "text": "…", "note": "…"}]}</pre>
 *
 * Reading is strict: the format and version must be these, every entry is checked as a new preset would be
 * ({@link PresetDraft#checked}) and any unknown key is refused, so a mistake in a file is named, never skipped.
 */
public final class PresetFile {

    public static final String FORMAT = "spectral-sieve-presets";
    public static final int VERSION = 1;
    /** Most entries one file may hold. */
    public static final int MAX_ENTRIES = 200;

    private static final Set<String> TOP_KEYS = Set.of("format", "version", "exportedAt", "presets");
    private static final Set<String> ENTRY_KEYS = Set.of("name", "text", "note");

    private PresetFile() {
    }

    /** The file for these presets, as plain values for any JSON writer. */
    public static Map<String, Object> write(List<SavedPreset> presets, Instant at) {
        Map<String, Object> file = new LinkedHashMap<>();
        file.put("format", FORMAT);
        file.put("version", VERSION);
        file.put("exportedAt", at.toString());
        List<Map<String, Object>> entries = new ArrayList<>();
        for (SavedPreset p : presets) {
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("name", p.name());
            e.put("text", p.text());
            e.put("note", p.note());
            entries.add(e);
        }
        file.put("presets", entries);
        return file;
    }

    /**
     * The checked drafts of a file, in its order; a fault throws {@link FieldException} or {@link PresetTextException}
     * naming the field ({@code format}, {@code presets[3].text}, …).
     */
    public static List<PresetDraft> read(JsonNode file, PresetDraft.TextReader reader) {
        if (file == null || !file.isObject()) {
            throw new FieldException("format", "the file must be a JSON object with \"format\": \"" + FORMAT + "\"");
        }
        for (String key : file.propertyNames()) {
            if (!TOP_KEYS.contains(key)) {
                throw new FieldException(key, "is not part of a presets file (" + String.join(", ", TOP_KEYS) + ")");
            }
        }
        if (!FORMAT.equals(file.path("format").asString(""))) {
            throw new FieldException("format", "must be \"" + FORMAT + "\", got " + file.path("format"));
        }
        JsonNode version = file.path("version");
        if (!version.isIntegralNumber() || !version.canConvertToInt() || version.intValue() != VERSION) {
            throw new FieldException("version", "must be " + VERSION + " (the only version this program reads), got "
                    + version);
        }
        JsonNode entries = file.path("presets");
        if (!entries.isArray()) {
            throw new FieldException("presets", "must be a list of presets");
        }
        if (entries.size() > MAX_ENTRIES) {
            throw new FieldException("presets", "holds " + entries.size() + " entries; a file may hold at most "
                    + MAX_ENTRIES);
        }
        List<PresetDraft> drafts = new ArrayList<>();
        for (int i = 0; i < entries.size(); i++) {
            JsonNode e = entries.get(i);
            String prefix = "presets[" + i + "].";
            if (!e.isObject()) {
                throw new FieldException("presets[" + i + "]", "must be an object with name, text and note");
            }
            for (String key : e.propertyNames()) {
                if (!ENTRY_KEYS.contains(key)) {
                    throw new FieldException(prefix + key, "is not part of a preset (name, text, note)");
                }
            }
            drafts.add(new PresetDraft(string(e, prefix, "name"), string(e, prefix, "text"), string(e, prefix, "note"))
                    .checked(prefix, reader));
        }
        return drafts;
    }

    private static String string(JsonNode entry, String prefix, String field) {
        JsonNode v = entry.get(field);
        if (v == null || v.isNull()) {
            return null;
        }
        if (!v.isString()) {
            throw new FieldException(prefix + field, "must be text, got " + v.getNodeType());
        }
        return v.asString();
    }
}
