package org.spectralsieve.requirement;

import java.util.Objects;

/**
 * "critical wavelength over 370 nm": Diffey's λc (where the absorbance integrated from 290 nm reaches
 * 90 % of its integral over 290–400 nm, see {@code weighting.WeightedFigures#criticalWavelength}) must lie at
 * or above (or at or below) {@code nm}. λc always lies within 290–400 nm, so the threshold must too.
 */
public record CriticalWavelengthClause(Comparison comparison, double nm, String text) implements Clause {

    public static final double FROM_NM = 290;
    public static final double TO_NM = 400;

    public CriticalWavelengthClause {
        Objects.requireNonNull(comparison, "comparison");
        if (!(nm >= FROM_NM && nm <= TO_NM)) {
            throw new IllegalArgumentException("a critical wavelength lies within 290-400 nm, got " + nm + " nm");
        }
        text = Objects.requireNonNullElse(text, "");
    }
}
