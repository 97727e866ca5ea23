package org.spectralsieve.presets;

/** A live preset of the same owner already has this name (ignoring case); answered 409, naming the field. */
public final class PresetNameTakenException extends RuntimeException {

    private final String field;
    private final String name;

    public PresetNameTakenException(String field, String name, String whose) {
        super(field + ": " + whose + " already hold a preset named '" + name + "'; choose another name, or delete"
                + " (retire) that one first");
        this.field = field;
        this.name = name;
    }

    public String field() {
        return field;
    }

    public String name() {
        return name;
    }
}
