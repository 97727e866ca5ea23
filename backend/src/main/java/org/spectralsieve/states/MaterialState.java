package org.spectralsieve.states;

import java.util.Objects;

/**
 * The condition one curve was measured in: {@code exposure} is set exactly for {@link StateKind#AGED},
 * {@code printing} exactly for {@link StateKind#PRINTED}.
 */
public record MaterialState(StateKind kind, Exposure exposure, Printing printing) {

    public static final MaterialState AS_SUPPLIED = new MaterialState(StateKind.AS_SUPPLIED, null, null);

    public MaterialState {
        Objects.requireNonNull(kind, "kind");
        if ((kind == StateKind.AGED) != (exposure != null)) {
            throw new IllegalArgumentException(kind == StateKind.AGED
                    ? "an aged curve states its exposure (hours under a source, or a dose at a wavelength)"
                    : "only an aged curve has an exposure");
        }
        if ((kind == StateKind.PRINTED) != (printing != null)) {
            throw new IllegalArgumentException(kind == StateKind.PRINTED
                    ? "a printed curve states its ink load or density" : "only a printed curve has a printing");
        }
    }

    public static MaterialState aged(Exposure exposure) {
        return new MaterialState(StateKind.AGED, Objects.requireNonNull(exposure, "exposure"), null);
    }

    public static MaterialState printed(Printing printing) {
        return new MaterialState(StateKind.PRINTED, null, Objects.requireNonNull(printing, "printing"));
    }

    /** "as supplied", "aged 2000 h under lamp bank A", "printed black, 100 % ink". */
    public String describe() {
        return switch (kind) {
            case AS_SUPPLIED -> "as supplied";
            case AGED -> "aged " + exposure.describe();
            case PRINTED -> "printed black, " + printing.describe();
        };
    }
}
