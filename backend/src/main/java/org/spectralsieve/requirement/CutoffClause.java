package org.spectralsieve.requirement;

import java.util.Objects;

/**
 * "cutoff between 380 and 395 nm": the wavelength where T falls through {@code levelT} (walking from the
 * long-wavelength side, see {@code spectrum.Cutoffs}) must lie in the window. Level 0.5 unless the user
 * chose 1 % or 10 %.
 */
public record CutoffClause(double levelT, Band window, String text) implements Clause {

    public CutoffClause {
        Objects.requireNonNull(window, "window");
        if (!(levelT > 0 && levelT < 1)) {
            throw new IllegalArgumentException("cutoff level must be a transmittance strictly between 0 and 100 %, got " + levelT);
        }
        if (window.isPoint()) {
            throw new IllegalArgumentException("a cutoff window needs two different wavelengths");
        }
        text = Objects.requireNonNullElse(text, "");
    }
}
