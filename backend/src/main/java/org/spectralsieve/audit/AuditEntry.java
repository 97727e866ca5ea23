package org.spectralsieve.audit;

import java.util.Objects;

/**
 * One change, as the edge that made it describes it to {@link AuditTrail#record}. {@code before} and {@code after}
 * are plain values (records, maps, lists, strings, numbers) that the trail writes as JSON; null where they do not apply
 * (an import has nothing before it).
 *
 * @param actor       who made it ({@link ActingUser#name()})
 * @param action      what was done: one of the {@code ACTION_} names below, or an account action
 * @param subjectKind what it was done to: one of the {@code SUBJECT_} names below, or {@code account}
 * @param subjectId   the subject's id; null when it has none (a whole library)
 * @param materialId  the material concerned (the subject itself, or a sample's material); null when none
 * @param summary     one line for a person, at most {@value #MAX_SUMMARY} characters (a longer one is cut)
 */
public record AuditEntry(String actor, String action, String subjectKind, Long subjectId, Long materialId,
                         String summary, Object before, Object after) {

    public static final String ACTION_IMPORT = "import";
    public static final String ACTION_CORRECT = "correct";
    public static final String ACTION_RETIRE = "retire";
    public static final String ACTION_RESTORE = "restore";
    public static final String ACTION_RESTORE_BACKUP = "restore-backup";

    public static final String SUBJECT_SAMPLE = "sample";
    public static final String SUBJECT_MATERIAL = "material";
    public static final String SUBJECT_LIBRARY = "library";
    public static final String SUBJECT_ACCOUNT = "account";
    /** A sample's curve in another state (aged, printed): {@code sample_state_curve}, docs/material-states.md. */
    public static final String SUBJECT_STATE_CURVE = "state-curve";

    static final int MAX_ACTOR = 200;
    static final int MAX_NAME = 40;
    static final int MAX_SUMMARY = 1000;

    public AuditEntry {
        actor = checkedText(Objects.requireNonNull(actor, "actor"), "actor", MAX_ACTOR);
        action = checkedText(Objects.requireNonNull(action, "action"), "action", MAX_NAME);
        subjectKind = checkedText(Objects.requireNonNull(subjectKind, "subjectKind"), "subjectKind", MAX_NAME);
        summary = Objects.requireNonNullElse(summary, "");
        if (summary.length() > MAX_SUMMARY) {
            // a summary is for reading, not a record: the values themselves are in before and after, never cut
            summary = summary.substring(0, MAX_SUMMARY - 1) + "…";
        }
    }

    /** The same change, made by {@code actor}. */
    public static AuditEntry by(ActingUser actor, String action, String subjectKind, Long subjectId, Long materialId,
                                String summary, Object before, Object after) {
        return new AuditEntry(actor.name(), action, subjectKind, subjectId, materialId, summary, before, after);
    }

    static String checkedText(String text, String what, int max) {
        String s = text.strip();
        if (s.isEmpty() || s.length() > max) {
            throw new IllegalArgumentException(what + " must be 1 to " + max + " characters, got '" + text + "'");
        }
        return s;
    }
}
