/**
 * The audit trail: who changed what in the library, when, with the values before and after (docs/audit.md).
 *
 * <p>Invariants: an entry is written by {@link org.spectralsieve.audit.AuditTrail#record} inside the transaction of
 * the change it describes, so every committed change has exactly one entry and a refused or rolled-back change has
 * none; entries are only ever inserted; their ids come from an identity and are never handed out twice (a restore
 * from a backup moves it past the archive's highest id). {@link org.spectralsieve.audit.ActingUser} is plain Java, so
 * the library's write paths name the actor without knowing whether a web request or the command line asks.
 */
package org.spectralsieve.audit;
