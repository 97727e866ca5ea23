package org.spectralsieve.search.derived;

/**
 * What an index's last commit is worth against the database now.
 *
 * @param verdict what to do
 * @param why     said in the log line of a rebuild: missing, unreadable, another library, another schema,
 *                newer than the database
 */
public record IndexJudgement(Verdict verdict, String why) {

    public enum Verdict {
        /** Built at the database's generation, from this database, with this schema: answer from it. */
        FRESH,
        /** From this database and schema but at an older generation: bring it up to date (the change log) or rebuild. */
        BEHIND,
        /** Nothing in it can be trusted: rebuild from the database. */
        REBUILD
    }
}
