package org.spectralsieve.presets;

import java.time.Instant;
import org.spectralsieve.weighting.SafetyCaution;

/**
 * A preset as the API, the command line and the page show it, whatever its origin.
 *
 * @param origin  {@code catalogue}, {@code shared} or {@code mine}
 * @param id      a stored preset's id; null for the catalogue
 * @param key     what a link and {@code GET /api/presets/{key}} take: the catalogue's name, a stored preset's id
 * @param caution {@link SafetyCaution#TEXT} for safety presets, else null
 */
public record PresetView(String origin, Long id, String key, String name, String title, String text, String reason,
                         String source, String job, boolean safety, String caution, String note, Instant createdAt,
                         Instant updatedAt) {

    public static final String CATALOGUE = "catalogue";
    public static final String SHARED = "shared";
    public static final String MINE = "mine";

    static PresetView of(CataloguePreset p) {
        return new PresetView(CATALOGUE, null, p.name(), p.name(), p.title(), p.text(), p.reason(), p.source(), p.job(),
                p.safety(), p.safety() ? SafetyCaution.TEXT : null, null, null, null);
    }

    static PresetView of(SavedPreset p, String origin) {
        return new PresetView(origin, p.id(), String.valueOf(p.id()), p.name(), p.name(), p.text(), null, null, null,
                false, null, p.note(), p.createdAt(), p.updatedAt());
    }

    /** The page address that opens this preset, runs its search and shows its text: {@code /?preset=KEY}. */
    public String link() {
        return "/?preset=" + java.net.URLEncoder.encode(key, java.nio.charset.StandardCharsets.UTF_8);
    }
}
