package org.spectralsieve.presets;

/**
 * Who asks, as far as presets care. In the embedded tool (no accounts) the single local user owns the shared
 * presets (owner NULL): they see and change them as their own. In server mode an account sees the shared presets
 * and its own, changes its own, and changes shared ones only as an admin.
 *
 * @param accountId the signed-in account; null in the embedded tool
 */
public record PresetCaller(Long accountId, boolean admin) {

    public static final PresetCaller LOCAL = new PresetCaller(null, true);

    public static PresetCaller account(long id, boolean admin) {
        return new PresetCaller(id, admin);
    }

    public boolean embedded() {
        return accountId == null;
    }

    /** Whether the caller may see this stored preset at all (else it is answered as not found). */
    public boolean sees(SavedPreset p) {
        return p.shared() || (accountId != null && accountId.equals(p.ownerAccountId()));
    }

    /** {@code mine}, or {@code shared} for presets that belong to everyone in server mode. */
    public String origin(SavedPreset p) {
        return p.shared() && !embedded() ? "shared" : "mine";
    }

    /** Refuses a change the caller may not make to a preset it sees. */
    public void mayChange(SavedPreset p) {
        if (p.shared() && !admin) {
            throw new PresetRefusedException("preset '" + p.name() + "' is shared with everyone; only an admin"
                    + " changes shared presets (save a copy as your own instead)", "admin");
        }
    }

    /** The owner a new preset gets: the caller's account, or everyone (embedded; or an admin asking for shared). */
    public Long ownerOfNew(boolean shared) {
        if (embedded()) {
            return null;
        }
        if (shared) {
            if (!admin) {
                throw new PresetRefusedException("only an admin saves presets shared with everyone", "admin");
            }
            return null;
        }
        return accountId;
    }
}
