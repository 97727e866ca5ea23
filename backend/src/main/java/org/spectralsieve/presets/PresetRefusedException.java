package org.spectralsieve.presets;

/**
 * A change to a preset the caller may see but not change: a built-in one (read-only), or a shared one for anyone
 * but an admin in server mode.
 *
 * @see PresetCaller
 */
public final class PresetRefusedException extends RuntimeException {

    private final String requiredRole;

    public PresetRefusedException(String message, String requiredRole) {
        super(message);
        this.requiredRole = requiredRole;
    }

    /** {@code admin}, or null when no role would do (the catalogue). */
    public String requiredRole() {
        return requiredRole;
    }
}
