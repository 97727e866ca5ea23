package org.spectralsieve.spectra;

/** An imported spectrum of this kind already has the name; names are unique per kind. */
public final class SpectrumNameTakenException extends RuntimeException {

    private final SpectrumKind kind;
    private final String name;

    public SpectrumNameTakenException(SpectrumKind kind, String name) {
        super("an imported " + kind.label() + " named '" + name + "' already exists");
        this.kind = kind;
        this.name = name;
    }

    public SpectrumKind kind() {
        return kind;
    }

    public String name() {
        return name;
    }
}
