package org.spectralsieve.cli;

import java.util.List;
import org.spectralsieve.requirement.RequirementSyntaxException;

/** A requirement that does not parse, shown as the parser's message and a caret under the position. */
final class RequirementErrorReport {

    private static final String INDENT = "  ";

    private RequirementErrorReport() {
    }

    static List<String> lines(String text, RequirementSyntaxException e) {
        // a tab or newline would shift the caret off its character, so each control character shows as one space
        String shown = text.replaceAll("\\p{Cntrl}", " ");
        int caretAt = Math.max(0, Math.min(e.position(), shown.length()));
        return List.of(
                "requirement not understood " + e.getMessage(),
                INDENT + shown,
                INDENT + " ".repeat(caretAt) + "^");
    }
}
