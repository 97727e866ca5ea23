package org.spectralsieve.requirement;

import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * What the light path must do: spectral clauses (all must hold), what is said about thickness, and
 * filters on which samples count. {@code materialClass} is a class label as stored ("plastic sheet");
 * {@code geometry} is "regular" or "total".
 */
public record Requirement(List<Clause> clauses, ThicknessSpec thickness, Optional<String> materialClass,
                          Optional<String> geometry, String text) {

    public Requirement {
        clauses = List.copyOf(clauses);
        if (clauses.isEmpty()) {
            throw new IllegalArgumentException("a requirement needs at least one spectral clause");
        }
        Objects.requireNonNull(thickness, "thickness");
        Objects.requireNonNull(materialClass, "materialClass");
        Objects.requireNonNull(geometry, "geometry");
        text = Objects.requireNonNullElse(text, "");
    }
}
