package org.spectralsieve.spectra;

/** No built-in or imported spectrum of this kind has the name; the API answers 404. */
public final class UnknownSpectrumException extends RuntimeException {

    private final SpectrumKind kind;
    private final String name;

    public UnknownSpectrumException(SpectrumKind kind, String name, String detail) {
        super("no " + kind.label() + " named '" + name + "'" + (detail.isEmpty() ? "" : "; " + detail));
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
