package org.spectralsieve.weighting;

import java.util.List;
import java.util.Locale;
import java.util.Optional;

/** The named emitters a user can pick without importing a spectrum. */
public final class EmitterCatalogue {

    /**
     * UV LEDs of 10-15 nm FWHM are common practice (no source); 12 nm is taken for all four. The mercury
     * line strengths (254 nm dominant, the others a few per cent) are illustrative, not a measured lamp.
     */
    private static final List<Emitter> ALL = List.of(
            Emitter.led("led-365", 365, 12),
            Emitter.led("led-385", 385, 12),
            Emitter.led("led-395", 395, 12),
            Emitter.led("led-405", 405, 12),
            Emitter.mercury("mercury-low-pressure", 1.0, 0.02, 0.03, 0.04),
            Emitter.uvaTube(),
            Emitter.illuminantA(),
            Emitter.d65(),
            Emitter.flat());

    private EmitterCatalogue() {
    }

    public static List<Emitter> all() {
        return ALL;
    }

    /** Looks an emitter up by name, ignoring case. */
    public static Optional<Emitter> named(String name) {
        String key = name == null ? "" : name.strip().toLowerCase(Locale.ROOT);
        return ALL.stream().filter(e -> e.name().equals(key)).findFirst();
    }
}
