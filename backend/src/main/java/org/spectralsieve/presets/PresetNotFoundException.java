package org.spectralsieve.presets;

/**
 * No preset the caller may see has this name or id. Someone else's private preset is answered exactly so, which
 * tells nothing of whether it exists.
 */
public final class PresetNotFoundException extends RuntimeException {

    private final String key;

    public PresetNotFoundException(String key) {
        super("no preset '" + key + "' among the catalogue, the shared presets and your own");
        this.key = key;
    }

    public String key() {
        return key;
    }
}
