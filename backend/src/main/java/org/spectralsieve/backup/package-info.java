/**
 * Backup and restore of the whole library as one zip archive (see docs/backup.md): every table of the
 * generated schema as JSON lines, parents first, with a manifest of checksums; restored only into an
 * empty library, checked in full before anything is written, in one transaction.
 */
package org.spectralsieve.backup;
