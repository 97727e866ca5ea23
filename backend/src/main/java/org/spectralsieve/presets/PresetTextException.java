package org.spectralsieve.presets;

import org.spectralsieve.requirement.RequirementSyntaxException;

/** A preset's requirement text the language does not read: the field it came in, and the parser's own account. */
public final class PresetTextException extends RuntimeException {

    private final String field;
    private final RequirementSyntaxException syntax;

    public PresetTextException(String field, RequirementSyntaxException syntax) {
        super(field + ": " + syntax.getMessage(), syntax);
        this.field = field;
        this.syntax = syntax;
    }

    public String field() {
        return field;
    }

    public RequirementSyntaxException syntax() {
        return syntax;
    }
}
