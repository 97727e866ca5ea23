package org.spectralsieve.presets;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.Set;
import java.util.regex.Pattern;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The built-in presets, read once from {@value #RESOURCE} on the classpath. A fault in that file is a fault of the
 * build, so reading it fails loudly rather than serving a partial catalogue.
 */
public final class PresetCatalogue {

    public static final String RESOURCE = "presets/catalogue.json";
    static final Pattern SLUG = Pattern.compile("[a-z0-9]+(-[a-z0-9]+)*");

    private static final PresetCatalogue BUILT_IN = read(RESOURCE);

    private final List<CataloguePreset> presets;

    private PresetCatalogue(List<CataloguePreset> presets) {
        this.presets = List.copyOf(presets);
    }

    public static PresetCatalogue builtIn() {
        return BUILT_IN;
    }

    /** In the file's order (grouped by trade there). */
    public List<CataloguePreset> presets() {
        return presets;
    }

    /** By name, ignoring case. */
    public Optional<CataloguePreset> find(String name) {
        return presets.stream().filter(p -> p.name().equalsIgnoreCase(name.strip())).findFirst();
    }

    public boolean holds(String name) {
        return find(name).isPresent();
    }

    static PresetCatalogue read(String resource) {
        try (InputStream in = PresetCatalogue.class.getClassLoader().getResourceAsStream(resource)) {
            if (in == null) {
                throw new IllegalStateException("the preset catalogue " + resource + " is missing from the classpath");
            }
            JsonNode root = JsonMapper.builder().build().readTree(in);
            List<CataloguePreset> presets = new ArrayList<>();
            Set<String> names = new HashSet<>();
            for (JsonNode p : root.path("presets")) {
                List<String> tags = new ArrayList<>();
                p.path("source").path("tags").forEach(t -> tags.add(t.asString()));
                CataloguePreset preset = new CataloguePreset(text(p, "name"), text(p, "title"), text(p, "text"),
                        text(p, "reason"), tags, p.path("source").path("kind").asString(""), text(p, "job"),
                        p.path("safety").asBoolean(false));
                if (!SLUG.matcher(preset.name()).matches() || !names.add(preset.name().toLowerCase(Locale.ROOT))) {
                    throw new IllegalStateException(resource + ": name '" + preset.name() + "' is not a unique slug");
                }
                if (preset.sourceKind().isBlank()) {
                    throw new IllegalStateException(resource + ": preset '" + preset.name() + "' names no source kind");
                }
                presets.add(preset);
            }
            return new PresetCatalogue(presets);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private static String text(JsonNode preset, String field) {
        String value = preset.path(field).asString("").strip();
        if (value.isEmpty()) {
            throw new IllegalStateException(RESOURCE + ": a preset lacks '" + field + "': " + preset);
        }
        return value;
    }
}
